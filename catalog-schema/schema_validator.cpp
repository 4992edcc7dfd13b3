// SPDX-License-Identifier: MIT
#include "catalog-schema/schema_validator.h"

#include <algorithm>
#include <cctype>
#include <map>
#include <memory>
#include <mutex>
#include <regex>
#include <set>
#include <sstream>
#include <stdexcept>

#include "catalog-schema/decimal_text.h"
#include "catalog-schema/embedded_schemas.h"
#include "catalog-schema/input_limits.h"

namespace stowage {
namespace {

const std::set<std::string>& supported_keywords() {
  static const std::set<std::string> keywords = {"type",
                                                 "properties",
                                                 "required",
                                                 "additionalProperties",
                                                 "enum",
                                                 "minimum",
                                                 "maximum",
                                                 "exclusiveMinimum",
                                                 "exclusiveMaximum",
                                                 "minLength",
                                                 "minItems",
                                                 "maxItems",
                                                 "items",
                                                 "pattern",
                                                 "oneOf",
                                                 "$ref",
                                                 "$defs",
                                                 "$schema",
                                                 "$id",
                                                 "$comment",
                                                 "title",
                                                 "description",
                                                 "default",
                                                 "examples",
                                                 "errorMessage",
                                                 "patternErrorMessage",
                                                 "renamedKeys"};
  return keywords;
}

std::string format_number(double x) {
  std::ostringstream out;
  out.imbue(std::locale::classic());
  out.precision(12);
  out << x;
  return out.str();
}

std::string type_phrase(const std::string& type) {
  if (type == "object") return "a mapping (key: value lines)";
  if (type == "array") return "a list";
  if (type == "string") return "text";
  if (type == "number") return "a number";
  if (type == "integer") return "a whole number";
  if (type == "boolean") return "true or false";
  return "nothing";
}

bool has_type(const YAML::Node& value, const std::string& type) {
  if (type == "object") return value.IsMap();
  if (type == "array") return value.IsSequence();
  if (!value.IsScalar() && !value.IsNull()) return false;
  const ScalarKind kind = scalar_kind(value);
  if (type == "string") return kind == ScalarKind::Text;
  if (type == "boolean") return kind == ScalarKind::Boolean;
  if (type == "null") return kind == ScalarKind::Null;
  if (type == "number") return kind == ScalarKind::Integer || kind == ScalarKind::Number;
  if (type == "integer") {
    if (kind == ScalarKind::Integer) return true;
    if (kind != ScalarKind::Number) return false;
    const double x = *scalar_number(value);
    return x == std::floor(x);
  }
  return false;
}

std::vector<std::string> type_list(const YAML::Node& type) {
  std::vector<std::string> types;
  if (type.IsScalar()) {
    types.push_back(type.Scalar());
  } else {
    for (const YAML::Node& t : type) types.push_back(t.Scalar());
  }
  return types;
}

std::string join_words(const std::vector<std::string>& words, const std::string& last_sep) {
  std::string out;
  for (std::size_t i = 0; i < words.size(); ++i) {
    if (i > 0) out += (i + 1 == words.size()) ? last_sep : ", ";
    out += words[i];
  }
  return out;
}

// Optimal string alignment distance (Damerau 1964; Levenshtein with the swap of two adjacent
// characters counted as one edit, each substring edited once), case ignored: "lpf" is one
// edit from "lfp", as a typist sees it, where plain Levenshtein counts two.
std::size_t edit_distance(const std::string& a, const std::string& b) {
  const auto same = [&](std::size_t i, std::size_t j) {  // 1-based positions
    return std::tolower(static_cast<unsigned char>(a[i - 1])) ==
           std::tolower(static_cast<unsigned char>(b[j - 1]));
  };
  // Rows i-2, i-1 and i of the (a.size()+1) x (b.size()+1) table.
  std::vector<std::size_t> before(b.size() + 1), above(b.size() + 1), row(b.size() + 1);
  for (std::size_t j = 0; j <= b.size(); ++j) row[j] = j;
  for (std::size_t i = 1; i <= a.size(); ++i) {
    before.swap(above);
    above.swap(row);
    row[0] = i;
    for (std::size_t j = 1; j <= b.size(); ++j) {
      row[j] = std::min({above[j] + 1, row[j - 1] + 1, above[j - 1] + (same(i, j) ? 0 : 1)});
      if (i > 1 && j > 1 && same(i, j - 1) && same(i - 1, j)) {
        row[j] = std::min(row[j], before[j - 2] + 1);
      }
    }
  }
  return row[b.size()];
}

// Marks are compared to report violations in document order.
bool earlier(const InputError& a, const InputError& b) {
  if (a.line() != b.line()) return a.line() < b.line();
  return a.column() < b.column();
}

// The node to point at for a value: its own position, or its key's when it is empty.
const YAML::Node& position_of(const YAML::Node& value, const YAML::Node& anchor) {
  if (value.IsNull() || value.Mark().line < 0) return anchor;
  return value;
}

// True when every branch of a oneOf only lists required keys: then the failure can be worded
// as "exactly one of these keys" and located at the key given twice or at the mapping.
bool required_only_branches(const YAML::Node& branches) {
  for (const YAML::Node& branch : branches) {
    if (!branch.IsMap() || branch.size() != 1 || !branch["required"]) return false;
  }
  return true;
}

}  // namespace

std::string closest_match(const std::string& word, const std::vector<std::string>& allowed) {
  std::string best;
  std::size_t best_distance = 1 + word.size() / 4;
  for (const std::string& candidate : allowed) {
    const std::size_t d = edit_distance(word, candidate);
    if (d <= best_distance && (best.empty() || d < edit_distance(word, best))) {
      best = candidate;
      best_distance = d;
    }
  }
  return best;
}

SchemaValidator::SchemaValidator(std::string_view schema_text) {
  try {
    schema_ = YAML::Load(std::string(schema_text));
  } catch (const YAML::Exception& e) {
    throw std::invalid_argument("schema does not parse: " + e.msg);
  }
  if (!schema_.IsMap()) throw std::invalid_argument("schema is not an object");
  verify_schema(schema_, "#");
}

const SchemaValidator& SchemaValidator::embedded(std::string_view name) {
  static std::mutex mutex;
  static std::map<std::string, std::unique_ptr<SchemaValidator>, std::less<>> cache;
  std::lock_guard<std::mutex> lock(mutex);
  auto it = cache.find(name);
  if (it == cache.end()) {
    const std::string_view text = embedded_schema(name);
    if (text.empty()) throw std::out_of_range("no embedded schema named " + std::string(name));
    it = cache.emplace(std::string(name), std::make_unique<SchemaValidator>(text)).first;
  }
  return *it->second;
}

void SchemaValidator::verify_schema(const YAML::Node& schema, const std::string& where) const {
  if (!schema.IsMap()) throw std::invalid_argument("schema at " + where + " is not an object");
  for (auto it = schema.begin(); it != schema.end(); ++it) {
    const std::string key = it->first.Scalar();
    if (!supported_keywords().count(key)) {
      throw std::invalid_argument("schema at " + where + " uses unsupported keyword " + key);
    }
  }
  if (schema["$ref"]) resolve(schema);  // throws when unresolvable
  if (schema["pattern"]) {
    try {
      std::regex check(schema["pattern"].Scalar(), std::regex::ECMAScript);
    } catch (const std::regex_error&) {
      throw std::invalid_argument("schema at " + where + " has a bad pattern");
    }
  }
  if (schema["properties"]) {
    for (auto it = schema["properties"].begin(); it != schema["properties"].end(); ++it) {
      verify_schema(it->second, where + "/properties/" + it->first.Scalar());
    }
  }
  if (schema["$defs"]) {
    for (auto it = schema["$defs"].begin(); it != schema["$defs"].end(); ++it) {
      verify_schema(it->second, where + "/$defs/" + it->first.Scalar());
    }
  }
  if (schema["items"]) verify_schema(schema["items"], where + "/items");
  if (schema["additionalProperties"] && schema["additionalProperties"].IsMap()) {
    verify_schema(schema["additionalProperties"], where + "/additionalProperties");
  }
  if (schema["oneOf"]) {
    std::size_t i = 0;
    for (const YAML::Node& branch : schema["oneOf"]) {
      verify_schema(branch, where + "/oneOf/" + std::to_string(i++));
    }
  }
}

YAML::Node SchemaValidator::resolve(const YAML::Node& schema) const {
  if (!schema["$ref"]) return schema;
  const std::string ref = schema["$ref"].Scalar();
  const std::string prefix = "#/$defs/";
  if (ref.compare(0, prefix.size(), prefix) != 0) {
    throw std::invalid_argument("unsupported $ref " + ref);
  }
  const YAML::Node defs = schema_["$defs"];
  if (!defs || !defs.IsMap()) throw std::invalid_argument("unresolved $ref " + ref);
  const YAML::Node target = defs[ref.substr(prefix.size())];
  if (!target || !target.IsMap()) throw std::invalid_argument("unresolved $ref " + ref);
  return target;
}

std::vector<InputError> SchemaValidator::check(const YamlDocument& document) const {
  std::vector<InputError> out;
  if (document.root().IsNull() && schema_["required"]) {
    // An empty file: say which top-level key it needs rather than "expected a mapping".
    for (const YAML::Node& key : schema_["required"]) {
      out.push_back(
          document.error_at(document.root(), key.Scalar(),
                            "the file is empty; it must start with '" + key.Scalar() + ":'"));
    }
    return out;
  }
  check_node(schema_, document.root(), document.root(), "", document, out);
  std::stable_sort(out.begin(), out.end(), earlier);
  return out;
}

void SchemaValidator::enforce(const YamlDocument& document) const {
  std::vector<InputError> errors = check(document);
  if (!errors.empty()) throw errors.front();
}

void SchemaValidator::check_node(const YAML::Node& schema_in, const YAML::Node& value,
                                 const YAML::Node& anchor, const std::string& path,
                                 const YamlDocument& document, std::vector<InputError>& out) const {
  // Keywords beside a $ref apply together with the referenced schema (draft 2020-12).
  if (schema_in["$ref"]) {
    const std::size_t before = out.size();
    check_node(resolve(schema_in), value, anchor, path, document, out);
    if (out.size() != before) return;
  }
  const YAML::Node& schema = schema_in;
  const YAML::Node& where = position_of(value, anchor);

  if (schema["type"]) {
    const std::vector<std::string> types = type_list(schema["type"]);
    bool ok = false;
    for (const std::string& t : types) ok = ok || has_type(value, t);
    if (!ok) {
      const bool numeric = std::find(types.begin(), types.end(), "number") != types.end() ||
                           std::find(types.begin(), types.end(), "integer") != types.end();
      if (numeric && value.IsScalar() && scalar_kind(value) == ScalarKind::NonFiniteNumber) {
        out.push_back(document.error_at(
            where, path, "must be a finite number, found " + printable_input(value.Scalar())));
        return;
      }
      std::vector<std::string> phrases;
      for (const std::string& t : types) phrases.push_back(type_phrase(t));
      std::string message =
          "expected " + join_words(phrases, " or ") + ", found " + describe_node(value);
      if (std::find(types.begin(), types.end(), "integer") != types.end() && scalar_number(value)) {
        message = "expected a whole number, found " + printable_input(value.Scalar());
      } else if (value.IsScalar() && scalar_kind(value) == ScalarKind::Text && numeric &&
                 value.Tag() == "!") {
        message += " (remove the quotes to give a number)";
      }
      out.push_back(document.error_at(where, path, message));
      return;
    }
  }

  if (schema["enum"]) {
    std::vector<std::string> allowed;
    bool found = false;
    for (const YAML::Node& option : schema["enum"]) {
      allowed.push_back(option.Scalar());
      if (value.IsScalar() && value.Scalar() == option.Scalar()) found = true;
    }
    if (!found) {
      std::string message =
          describe_node(value) + " is not allowed; use one of: " + join_words(allowed, ", ");
      if (value.IsScalar()) {
        const std::string hint = closest_match(value.Scalar(), allowed);
        if (!hint.empty()) message += " (did you mean '" + hint + "'?)";
      }
      out.push_back(document.error_at(where, path, message));
      return;
    }
  }

  if (const std::optional<double> x = (value.IsScalar() ? scalar_number(value) : std::nullopt)) {
    struct Bound {
      const char* keyword;
      const char* relation;
      bool (*holds)(double, double);
    };
    static const Bound bounds[] = {
        {"minimum", ">=", [](double v, double b) { return v >= b; }},
        {"exclusiveMinimum", ">", [](double v, double b) { return v > b; }},
        {"maximum", "<=", [](double v, double b) { return v <= b; }},
        {"exclusiveMaximum", "<", [](double v, double b) { return v < b; }},
    };
    for (const Bound& bound : bounds) {
      if (!schema[bound.keyword]) continue;
      const double limit = *scalar_number(schema[bound.keyword]);
      if (!bound.holds(*x, limit)) {
        out.push_back(document.error_at(where, path,
                                        std::string("must be ") + bound.relation + " " +
                                            format_number(limit) + ", found " +
                                            printable_input(value.Scalar())));
        return;
      }
    }
    if (std::fabs(*x) > kMaxInputMagnitude) {
      out.push_back(document.error_at(
          where, path,
          "is beyond the plausible range of any input of the formats (magnitude at most " +
              format_number(kMaxInputMagnitude) + ", see docs/input-format.md), found " +
              printable_input(value.Scalar())));
      return;
    }
  }

  if (value.IsScalar() && scalar_kind(value) == ScalarKind::Text) {
    const std::string& text = value.Scalar();
    // A quoted YAML scalar can spell any control character ("\e[2J"); text fields reach
    // reports and the terminal, so none may hold one but the line break of a YAML block
    // scalar (a tab neither: it shows as spaces).
    for (std::size_t i = 0; i < text.size(); ++i) {
      const unsigned char c = static_cast<unsigned char>(text[i]);
      const bool c1 = c == 0xC2 && i + 1 < text.size() &&
                      static_cast<unsigned char>(text[i + 1]) >= 0x80 &&
                      static_cast<unsigned char>(text[i + 1]) < 0xA0;
      if ((c < 0x20 && c != '\n') || c == 0x7F || c1) {
        out.push_back(document.error_at(where, path,
                                        "must not hold control characters, found " +
                                            printable_input(text.substr(i, c1 ? 2 : 1)) + " in '" +
                                            printable_input(text) + "'"));
        return;
      }
    }
    if (schema["minLength"]) {
      std::size_t length = 0;  // code points, counting UTF-8 lead bytes
      for (const char c : text) length += (static_cast<unsigned char>(c) & 0xC0) != 0x80;
      if (length < schema["minLength"].as<std::size_t>()) {
        out.push_back(document.error_at(where, path, "must not be empty"));
        return;
      }
    }
    if (schema["pattern"]) {
      if (text.size() > kMaxPatternText) {
        out.push_back(document.error_at(
            where, path,
            "is too long (" + std::to_string(text.size()) + " characters) for this field"));
        return;
      }
      const std::regex re(schema["pattern"].Scalar(), std::regex::ECMAScript);
      if (!std::regex_search(text, re)) {
        std::string message = "'" + printable_input(text) + "' is not in the expected form";
        if (schema["patternErrorMessage"]) {
          message += ": " + schema["patternErrorMessage"].Scalar();
        } else {
          message += " " + schema["pattern"].Scalar();
        }
        out.push_back(document.error_at(where, path, message));
        return;
      }
    }
  }

  if (value.IsSequence()) {
    if (schema["minItems"] && value.size() < schema["minItems"].as<std::size_t>()) {
      const std::size_t n = schema["minItems"].as<std::size_t>();
      out.push_back(document.error_at(where, path,
                                      "needs at least " + std::to_string(n) +
                                          (n == 1 ? " entry" : " entries") + ", found " +
                                          std::to_string(value.size())));
    }
    if (schema["maxItems"] && value.size() > schema["maxItems"].as<std::size_t>()) {
      out.push_back(document.error_at(where, path,
                                      "allows at most " + schema["maxItems"].Scalar() +
                                          " entries, found " + std::to_string(value.size())));
    }
    if (schema["items"]) {
      for (std::size_t i = 0; i < value.size(); ++i) {
        check_node(schema["items"], value[i], where, join_index(path, i), document, out);
      }
    }
  }

  if (value.IsMap()) check_object(schema, value, path, document, out);
  if (schema["oneOf"]) check_one_of(schema, value, where, path, document, out);
}

void SchemaValidator::check_object(const YAML::Node& schema, const YAML::Node& value,
                                   const std::string& path, const YamlDocument& document,
                                   std::vector<InputError>& out) const {
  const YAML::Node properties = schema["properties"];
  std::vector<std::string> allowed;
  if (properties) {
    for (auto it = properties.begin(); it != properties.end(); ++it) {
      allowed.push_back(it->first.Scalar());
    }
  }
  const YAML::Node additional = schema["additionalProperties"];
  const bool closed = additional && additional.IsScalar() && additional.Scalar() == "false";

  std::map<std::string, int> seen_at_line;
  std::set<std::string> suggested;
  for (auto it = value.begin(); it != value.end(); ++it) {
    const YAML::Node key_node = it->first;  // a copy: the iterator hands out a temporary pair
    if (!key_node.IsScalar()) {
      out.push_back(document.error_at(key_node, path, "a key must be a plain name"));
      continue;
    }
    const std::string key = key_node.Scalar();
    const std::string field = join_key(path, key);
    const auto first = seen_at_line.emplace(key, key_node.Mark().line + 1);
    if (!first.second) {
      out.push_back(document.error_at(key_node, field,
                                      "duplicate key '" + printable_input(key) +
                                          "' (first given on line " +
                                          std::to_string(first.first->second) + ")"));
      continue;
    }
    if (properties && properties[key]) {
      check_node(properties[key], it->second, key_node, field, document, out);
    } else if (schema["renamedKeys"] && schema["renamedKeys"][key]) {
      out.push_back(document.error_at(key_node, field,
                                      "the key '" + key + "' is now called '" +
                                          schema["renamedKeys"][key].Scalar() +
                                          "'; rename it (the contents stay the same)"));
    } else if (closed) {
      std::string message = "unknown key '" + printable_input(key) + "'";
      const std::string hint = closest_match(key, allowed);
      if (!hint.empty() && !value[hint]) {
        message += " (did you mean '" + hint + "'?)";
        suggested.insert(hint);
      } else if (!allowed.empty()) {
        message += "; allowed here: " + join_words(allowed, ", ");
      }
      out.push_back(document.error_at(key_node, field, message));
    } else if (additional && additional.IsMap()) {
      check_node(additional, it->second, key_node, field, document, out);
    }
  }

  if (schema["required"]) {
    for (const YAML::Node& name : schema["required"]) {
      const std::string key = name.Scalar();
      // A misspelt key already produced "did you mean"; a second message would only repeat it.
      if (value[key] || suggested.count(key)) continue;
      out.push_back(
          document.error_at(value, join_key(path, key), "required key '" + key + "' is missing"));
    }
  }
}

void SchemaValidator::check_one_of(const YAML::Node& schema, const YAML::Node& value,
                                   const YAML::Node& anchor, const std::string& path,
                                   const YamlDocument& document,
                                   std::vector<InputError>& out) const {
  const YAML::Node branches = schema["oneOf"];
  const std::string custom = schema["errorMessage"] ? schema["errorMessage"].Scalar() : "";

  if (value.IsMap() && required_only_branches(branches)) {
    // Which branches are satisfied, and the key node of the last satisfied one in the file.
    std::vector<std::string> names;
    std::size_t satisfied = 0;
    YAML::Node last_key;
    std::string last_name;
    for (const YAML::Node& branch : branches) {
      bool all = true;
      std::vector<std::string> keys;
      for (const YAML::Node& k : branch["required"]) {
        keys.push_back(k.Scalar());
        all = all && value[k.Scalar()];
      }
      names.push_back(join_words(keys, " and "));
      if (!all) continue;
      ++satisfied;
      for (auto it = value.begin(); it != value.end(); ++it) {
        if (it->first.Scalar() != keys.back()) continue;
        if (!last_key || it->first.Mark().line > last_key.Mark().line) {
          last_key.reset(it->first);  // reset, not =: operator= writes into the document
          last_name = keys.back();
        }
      }
    }
    if (satisfied == 1) return;
    const std::string message =
        custom.empty() ? "give exactly one of " + join_words(names, " or ") : custom;
    if (satisfied == 0) {
      out.push_back(document.error_at(anchor, path, message + "; none is given"));
    } else {
      out.push_back(document.error_at(last_key, join_key(path, last_name),
                                      message + "; more than one is given"));
    }
    return;
  }

  std::size_t matches = 0;
  for (const YAML::Node& branch : branches) {
    std::vector<InputError> scratch;
    check_node(branch, value, anchor, path, document, scratch);
    matches += scratch.empty();
  }
  if (matches != 1) {
    out.push_back(document.error_at(
        anchor, path,
        custom.empty() ? "must match exactly one of the " + std::to_string(branches.size()) +
                             " allowed forms, matches " + std::to_string(matches)
                       : custom));
  }
}

}  // namespace stowage
