// SPDX-License-Identifier: MIT
#include "catalog-schema/yaml_document.h"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdlib>
#include <iterator>
#include <limits>
#include <regex>
#include <sstream>
#include <utility>
#include <vector>

#include "catalog-schema/decimal_text.h"
#include "catalog-schema/input_file.h"
#include "catalog-schema/input_limits.h"

namespace stowage {
namespace {

bool is_plain(const YAML::Node& node) { return node.Tag() == "?"; }

bool non_finite_text(const std::string& s) {
  static const char* const forms[] = {".inf", "+.inf", "-.inf", ".Inf", "+.Inf", "-.Inf",
                                      ".INF", "+.INF", "-.INF", ".nan", ".NaN",  ".NAN"};
  for (const char* form : forms) {
    if (s == form) return true;
  }
  return false;
}

std::string trim(const std::string& s) {
  std::size_t b = 0, e = s.size();
  while (b < e && std::isspace(static_cast<unsigned char>(s[b]))) ++b;
  while (e > b && std::isspace(static_cast<unsigned char>(s[e - 1]))) --e;
  return s.substr(b, e - b);
}

// Guesses the key path in force at `line` (0-based) of a text that does not parse, from the
// indentation of the "key:" lines above it. Good enough to name the block the error is in.
std::string guess_path(const std::string& text, int line) {
  static const std::regex key_line("^( *)(- +)?([A-Za-z0-9_.$-]+) *:( |$)");
  std::vector<std::pair<std::size_t, std::string>> stack;  // (indent, key)
  std::istringstream in(text);
  std::string row;
  for (int i = 0; i <= line && std::getline(in, row); ++i) {
    // A key is near the start of its line; only that much is matched, so a long line costs
    // the regex nothing.
    if (row.size() > kMaxPatternText) row.resize(kMaxPatternText);
    std::smatch m;
    if (!std::regex_search(row, m, key_line)) continue;
    std::size_t indent = m[1].length() + m[2].length();
    while (!stack.empty() && stack.back().first >= indent) stack.pop_back();
    stack.emplace_back(indent, m[3].str());
  }
  std::string path;
  for (const auto& entry : stack) path = join_key(path, entry.second);
  return path;
}

// For an unclosed flow collection ("{min: 0, max: 45" without "}") yaml-cpp stops at the next
// key, one or more lines later; the line the reader must fix is the last one above that opens
// more brackets than it closes. Returns that 0-based line and column, or leaves them alone.
void find_unclosed_bracket(const std::string& text, int& line, int& column) {
  std::vector<std::string> rows;
  std::istringstream in(text);
  std::string row;
  while (std::getline(in, row)) rows.push_back(row);
  for (int i = std::min(line, static_cast<int>(rows.size()) - 1); i >= 0; --i) {
    int depth = 0;
    int opened_at = -1;
    bool quoted = false;
    for (std::size_t c = 0; c < rows[i].size(); ++c) {
      const char ch = rows[i][c];
      if (ch == '"' || ch == '\'') quoted = !quoted;
      if (quoted) continue;
      if (ch == '#') break;
      if (ch == '{' || ch == '[') {
        if (depth == 0) opened_at = static_cast<int>(c);
        ++depth;
      }
      if ((ch == '}' || ch == ']') && depth > 0) --depth;
    }
    if (depth > 0) {
      line = i;
      column = opened_at;
      return;
    }
  }
}

// 1-based line and column (in characters) of byte `offset` of `text`.
std::pair<int, int> line_and_column(const std::string& text, std::size_t offset) {
  int line = 1, column = 1;
  for (std::size_t i = 0; i < offset && i < text.size(); ++i) {
    if (text[i] == '\n') {
      ++line;
      column = 1;
    } else if ((static_cast<unsigned char>(text[i]) & 0xC0) != 0x80) {
      ++column;
    }
  }
  return {line, column};
}

// Refuses text that is not UTF-8 at the first offending byte, before yaml-cpp sees it: such
// bytes would otherwise reach reports and JSON that no parser can read.
void require_utf8(const std::string& text, const std::string& source_name) {
  const std::size_t bad = invalid_utf8_at(text);
  if (bad == std::string::npos) return;
  const auto at = line_and_column(text, bad);
  std::string message = "the file is not valid UTF-8 here (byte " +
                        escape_controls(text.substr(bad, 1)) + "); save it as UTF-8";
  if (text.compare(0, 2, "\xff\xfe") == 0 || text.compare(0, 2, "\xfe\xff") == 0) {
    message = "the file is UTF-16 (it starts with a UTF-16 byte-order mark); save it as UTF-8";
  }
  throw InputError(source_name, at.first, at.second, display_path(guess_path(text, at.first - 1)),
                   message);
}

// Estimates how deep collections nest, line by line, and refuses the text at the first point
// where the estimate passes kMaxYamlNestingDepth: yaml-cpp builds every level as nodes (a few
// megabytes of "[[[[" take hundreds of megabytes) and recurses through them. Block levels are
// counted from the indentation and from compact "- - " entries, flow levels from the brackets
// outside quotes and comments. The estimate can only overcount a little (a quote inside a plain
// scalar), far below the limit for any file of the formats.
void require_shallow(const std::string& text, const std::string& source_name) {
  std::vector<std::size_t> indents;  // open block levels
  int flow = 0;
  char quote = 0;
  std::size_t line_start = 0;
  int line = 0;
  while (line_start <= text.size()) {
    std::size_t line_end = text.find('\n', line_start);
    if (line_end == std::string::npos) line_end = text.size();
    const std::string_view row(text.data() + line_start, line_end - line_start);
    std::size_t i = 0;
    int block = static_cast<int>(indents.size());
    if (flow == 0 && quote == 0) {
      while (i < row.size() && row[i] == ' ') ++i;
      const bool content = i < row.size() && row[i] != '#' && row[i] != '\r';
      if (content) {
        while (!indents.empty() && indents.back() >= i) indents.pop_back();
        indents.push_back(i);
        // "- - - x": each dash opens one more level.
        std::size_t j = i;
        while (j + 1 < row.size() && (row[j] == '-' || row[j] == '?') && row[j + 1] == ' ') {
          j += 2;
          while (j < row.size() && row[j] == ' ') ++j;
          indents.push_back(j);
        }
      }
      block = static_cast<int>(indents.size());
    }
    for (; i < row.size(); ++i) {
      const char c = row[i];
      if (quote != 0) {
        if (quote == '"' && c == '\\') {
          ++i;
        } else if (c == quote) {
          if (quote == '\'' && i + 1 < row.size() && row[i + 1] == '\'') {
            ++i;
          } else {
            quote = 0;
          }
        }
        continue;
      }
      const bool at_token = i == 0 || row[i - 1] == ' ' || row[i - 1] == '[' || row[i - 1] == '{' ||
                            row[i - 1] == ',' || row[i - 1] == ':';
      if (c == '#' && (i == 0 || row[i - 1] == ' ' || row[i - 1] == '\t')) break;
      if ((c == '"' || c == '\'') && at_token) quote = c;
      if (c == '[' || c == '{') ++flow;
      if ((c == ']' || c == '}') && flow > 0) --flow;
      if (block + flow > kMaxYamlNestingDepth) {
        throw InputError(source_name, line + 1, static_cast<int>(i) + 1,
                         display_path(guess_path(text, line)),
                         "collections nest more than " + std::to_string(kMaxYamlNestingDepth) +
                             " levels deep here; no field of the format is deeper than 5");
      }
    }
    if (block + flow > kMaxYamlNestingDepth) {
      throw InputError(source_name, line + 1, 1, display_path(guess_path(text, line)),
                       "collections nest more than " + std::to_string(kMaxYamlNestingDepth) +
                           " levels deep here; no field of the format is deeper than 5");
    }
    line_start = line_end + 1;
    ++line;
  }
}

}  // namespace

ScalarKind scalar_kind(const YAML::Node& node) {
  if (node.IsNull()) return ScalarKind::Null;
  if (!is_plain(node)) return ScalarKind::Text;
  const std::string& s = node.Scalar();
  if (s == "true" || s == "True" || s == "TRUE" || s == "false" || s == "False" || s == "FALSE")
    return ScalarKind::Boolean;
  if (is_decimal_text(s)) {
    if (!std::isfinite(decimal_value(s))) return ScalarKind::NonFiniteNumber;
    return is_integer_text(s) ? ScalarKind::Integer : ScalarKind::Number;
  }
  if (non_finite_text(s)) return ScalarKind::NonFiniteNumber;
  return ScalarKind::Text;
}

std::optional<double> scalar_number(const YAML::Node& node) {
  if (!node.IsScalar() && !node.IsNull()) return std::nullopt;
  switch (scalar_kind(node)) {
    case ScalarKind::Integer:
    case ScalarKind::Number:
      return decimal_value(node.Scalar());
    case ScalarKind::NonFiniteNumber: {
      const std::string& s = node.Scalar();
      if (s.find("nan") != std::string::npos || s.find("NaN") != std::string::npos ||
          s.find("NAN") != std::string::npos)
        return std::numeric_limits<double>::quiet_NaN();
      return s[0] == '-' ? -std::numeric_limits<double>::infinity()
                         : std::numeric_limits<double>::infinity();
    }
    default:
      return std::nullopt;
  }
}

std::string describe_node(const YAML::Node& node) {
  if (node.IsMap()) return "a mapping (key: value lines)";
  if (node.IsSequence()) return "a list";
  switch (scalar_kind(node)) {
    case ScalarKind::Null:
      return "nothing (an empty value)";
    case ScalarKind::Boolean:
      return "the truth value " + printable_input(node.Scalar());
    case ScalarKind::Integer:
    case ScalarKind::Number:
    case ScalarKind::NonFiniteNumber:
      return "the number " + printable_input(node.Scalar());
    case ScalarKind::Text:
      break;
  }
  return "the text '" + printable_input(node.Scalar(), 40) + "'";
}

std::string join_key(const std::string& parent, const std::string& key) {
  return parent.empty() ? key : parent + "." + key;
}

std::string join_index(const std::string& parent, std::size_t index) {
  return parent + "[" + std::to_string(index) + "]";
}

std::string display_path(const std::string& path) { return path.empty() ? "(top level)" : path; }

YamlDocument::YamlDocument(std::string source_name, YAML::Node root)
    : source_(std::move(source_name)), root_(std::move(root)) {}

InputError YamlDocument::error_at(const YAML::Node& node, const std::string& field,
                                  const std::string& message) const {
  int line = 1, column = 1;
  if (node.IsDefined()) {
    const YAML::Mark mark = node.Mark();
    if (mark.line >= 0 && mark.column >= 0) {
      line = mark.line + 1;
      column = mark.column + 1;
    }
  }
  return InputError(source_, line, column, display_path(field), message);
}

YAML::Node YamlDocument::locate(const std::string& path, bool* exact) const {
  if (exact) *exact = false;
  // Split "a.b[2].c" into the steps a, b, [2], c.
  std::vector<std::string> steps;
  std::string current;
  for (std::size_t i = 0; i < path.size(); ++i) {
    const char c = path[i];
    if (c == '.') {
      if (!current.empty()) steps.push_back(current);
      current.clear();
    } else if (c == '[') {
      if (!current.empty()) steps.push_back(current);
      current = "[";
    } else if (c == ']') {
      current += c;
      steps.push_back(current);
      current.clear();
    } else {
      current += c;
    }
  }
  if (!current.empty()) steps.push_back(current);

  // Nodes are rebound with reset(): yaml-cpp's operator= would overwrite the document.
  YAML::Node node;
  node.reset(root_);
  for (const std::string& step : steps) {
    const YAML::Node here = node;
    bool found = false;
    if (step.front() == '[' && here.IsSequence()) {
      const std::size_t index = std::strtoul(step.c_str() + 1, nullptr, 10);
      if (index < here.size()) {
        node.reset(here[index]);
        found = true;
      }
    } else if (here.IsMap()) {
      for (auto it = here.begin(); it != here.end(); ++it) {
        if (it->first.IsScalar() && it->first.Scalar() == step) {
          // A null value has no text of its own; its key is where the reader looks.
          node.reset(it->second.IsNull() ? it->first : it->second);
          found = true;
          break;
        }
      }
    }
    if (!found) return node;
  }
  if (exact) *exact = true;
  return node;
}

InputError YamlDocument::error_at_path(const std::string& field, const std::string& message) const {
  return error_at(locate(field), field, message);
}

YamlDocument parse_yaml(std::istream& in, const std::string& source_name) {
  // Read at most one byte past the limit: a stream (or a file that grew after it was opened)
  // is never read without end.
  std::string text;
  char buffer[8192];
  while (in && text.size() <= kMaxYamlFileBytes) {
    in.read(buffer, sizeof buffer);
    text.append(buffer, static_cast<std::size_t>(in.gcount()));
  }
  if (in.bad()) throw InputError::unreadable(source_name, "(top level)", "read error");
  if (text.size() > kMaxYamlFileBytes) {
    throw InputError::unreadable(
        source_name, "(top level)",
        "the file is larger than the " + size_text(kMaxYamlFileBytes) + " a YAML input may have");
  }
  require_utf8(text, source_name);
  require_shallow(text, source_name);
  try {
    return YamlDocument(source_name, YAML::Load(text));
  } catch (const YAML::ParserException& e) {
    int line = std::max(e.mark.line, 0), column = std::max(e.mark.column, 0);
    if (e.msg.find("flow") != std::string::npos) find_unclosed_bracket(text, line, column);
    throw InputError(source_name, line + 1, column + 1, display_path(guess_path(text, line)),
                     "YAML syntax error: " + trim(e.msg));
  } catch (const YAML::Exception& e) {
    throw InputError(source_name, 1, 1, "(top level)", "cannot read YAML: " + trim(e.msg));
  }
}

}  // namespace stowage
