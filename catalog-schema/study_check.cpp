// SPDX-License-Identifier: MIT
#include "catalog-schema/study_check.h"

#include <algorithm>
#include <fstream>
#include <iterator>
#include <sstream>

#include "catalog-schema/hourly_csv.h"
#include "catalog-schema/input_file.h"
#include "catalog-schema/input_limits.h"
#include "catalog-schema/profile_loader.h"
#include "catalog-schema/schema_validator.h"
#include "catalog-schema/site_loader.h"
#include "catalog-schema/soc_series.h"
#include "catalog-schema/yaml_document.h"

namespace stowage {
namespace {

using Problems = std::vector<InputError>;

// Pass 2 loads each profile on its own; its warnings wait for pass 3, so they appear once.
class MutedWarnings {
 public:
  MutedWarnings() : previous_(set_warning_sink([](const std::string&) {})) {}
  ~MutedWarnings() { set_warning_sink(std::move(previous_)); }
  MutedWarnings(const MutedWarnings&) = delete;
  MutedWarnings& operator=(const MutedWarnings&) = delete;

 private:
  WarningSink previous_;
};

std::string read_all(std::ifstream& in) {
  return std::string(std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>());
}

bool has_problem_at(const Problems& problems, const std::string& field) {
  return std::any_of(problems.begin(), problems.end(),
                     [&](const InputError& e) { return e.field() == field; });
}

// The syntax and schema of one YAML text: the parsed document, or nullopt after a syntax
// error; every schema violation is added to `out`.
std::optional<YamlDocument> structure(const std::string& text, const std::string& name,
                                      const char* schema, Problems& out) {
  try {
    std::istringstream in(text);
    YamlDocument doc = parse_yaml(in, name);
    const Problems violations = SchemaValidator::embedded(schema).check(doc);
    out.insert(out.end(), violations.begin(), violations.end());
    return doc;
  } catch (const InputError& e) {
    out.push_back(e);
    return std::nullopt;
  }
}

// The text of the file named at `node` of `doc`, or nullopt with the problem at that key, in
// the words of open_referenced().
std::optional<std::string> referenced_text(const YamlDocument& doc, const YAML::Node& node,
                                           const std::string& field, const std::string& path,
                                           const std::string& what, std::uintmax_t max_bytes,
                                           Problems& out) {
  std::ifstream in;
  std::string reason;
  if (!open_input(path, in, reason, max_bytes)) {
    out.push_back(doc.error_at(node, field, what + ": " + reason));
    return std::nullopt;
  }
  return read_all(in);
}

// Runs a loader over `text` and adds its first error, if any, to `out`.
template <typename Load>
void first_error_of(const std::string& text, Problems& out, Load load) {
  try {
    std::istringstream in(text);
    load(in);
  } catch (const InputError& e) {
    out.push_back(e);
  }
}

void check_hourly(const YamlDocument& site, const std::string& site_dir, Problems& out) {
  const YAML::Node hourly = site.root()["site"]["hourly"];
  if (!hourly || !hourly.IsScalar()) return;
  const std::string path = resolve_relative(site_dir, hourly.Scalar());
  const std::optional<std::string> text =
      referenced_text(site, hourly, "site.hourly", path, "hourly CSV", kMaxCsvFileBytes, out);
  if (text) first_error_of(*text, out, [&](std::istream& in) { read_hourly_csv(in, path); });
}

void check_site(const YamlDocument& study, const YAML::Node& node, const std::string& base_dir,
                Problems& out) {
  const std::string path = resolve_relative(base_dir, node.Scalar());
  const std::optional<std::string> text =
      referenced_text(study, node, "study.site", path, "site file", kMaxYamlFileBytes, out);
  if (!text) return;
  Problems found;
  const std::optional<YamlDocument> site = structure(*text, path, "site", found);
  if (site && found.empty()) {
    // Sound structure: the site loader's own rules, the hourly CSV among them.
    first_error_of(*text, found,
                   [&](std::istream& in) { load_site_details(in, path, parent_directory(path)); });
  } else if (site && !has_problem_at(found, "site.hourly")) {
    check_hourly(*site, parent_directory(path), found);
  }
  out.insert(out.end(), found.begin(), found.end());
}

void check_profile(const YamlDocument& study, const YAML::Node& node, const std::string& field,
                   const std::string& base_dir, Problems& out) {
  const std::string path = resolve_relative(base_dir, node.Scalar());
  const std::optional<std::string> text =
      referenced_text(study, node, field, path, "profile file", kMaxYamlFileBytes, out);
  if (!text) return;
  Problems found;
  if (structure(*text, path, "profile", found) && found.empty()) {
    const MutedWarnings muted;
    first_error_of(*text, found, [&](std::istream& in) { load_profile_details(in, path); });
  }
  out.insert(out.end(), found.begin(), found.end());
}

void check_soc_log(const YamlDocument& study, const YAML::Node& node, const std::string& base_dir,
                   Problems& out) {
  const std::string path = resolve_relative(base_dir, node.Scalar());
  const std::optional<std::string> text =
      referenced_text(study, node, "study.soc_log", path, "SOC log", kMaxCsvFileBytes, out);
  if (text) first_error_of(*text, out, [&](std::istream& in) { read_soc_series(in, path); });
}

// Pass 2: each file the study names whose key is a file name (a key the schema refused, such
// as a number where a path belongs, was reported in pass 1 and is not opened).
void check_referenced(const YamlDocument& study, const std::string& base_dir, Problems& out) {
  const YAML::Node s = study.root()["study"];
  if (!s || !s.IsMap()) return;
  const Problems pass1 = out;
  const auto names_file = [&](const YAML::Node& node, const std::string& field) {
    return node && node.IsScalar() && !has_problem_at(pass1, field);
  };
  if (names_file(s["site"], "study.site")) check_site(study, s["site"], base_dir, out);
  const YAML::Node profiles = s["profiles"];
  if (profiles && profiles.IsSequence() && !has_problem_at(pass1, "study.profiles")) {
    for (std::size_t i = 0; i < profiles.size() && i < kMaxProfiles; ++i) {
      const std::string field = join_index("study.profiles", i);
      if (names_file(profiles[i], field)) check_profile(study, profiles[i], field, base_dir, out);
    }
  }
  if (names_file(s["soc_log"], "study.soc_log")) check_soc_log(study, s["soc_log"], base_dir, out);
}

}  // namespace

StudyCheck check_study_file(const std::string& path) {
  StudyCheck result;
  std::ifstream in;
  std::string reason;
  if (!open_input(path, in, reason, kMaxYamlFileBytes)) {
    result.problems.push_back(InputError::unreadable(path, "study", reason));
    return result;
  }
  const std::string text = read_all(in);
  const std::string base_dir = parent_directory(path);
  const std::optional<YamlDocument> study = structure(text, path, "study", result.problems);
  if (!study) return result;
  check_referenced(*study, base_dir, result.problems);
  if (!result.problems.empty()) return result;
  try {
    std::istringstream again(text);
    result.study = load_study_details(again, path, base_dir);
  } catch (const InputErrors& e) {
    result.problems = e.all();
  } catch (const InputError& e) {
    result.problems.push_back(e);
  }
  return result;
}

}  // namespace stowage
