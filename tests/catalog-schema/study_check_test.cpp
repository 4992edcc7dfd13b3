// SPDX-License-Identifier: MIT
// check_study_file: every problem one run can find, in the loaders' own words, and never a
// pass for a study the loader refuses.
#include "catalog-schema/study_check.h"

#include <catch2/catch.hpp>
#include <filesystem>
#include <string>
#include <tuple>
#include <vector>

#include "catalog-schema/profile_loader.h"
#include "catalog_test_support.h"

using namespace stowage;
using stowage::testing::fixture_path;
using stowage::testing::source_path;
using stowage::testing::TempDir;

namespace {

// (file name, line, field) of each problem, in the order reported.
std::vector<std::tuple<std::string, int, std::string>> located(const StudyCheck& check) {
  std::vector<std::tuple<std::string, int, std::string>> out;
  for (const InputError& e : check.problems) {
    out.emplace_back(std::filesystem::path(e.file()).filename().string(), e.line(), e.field());
  }
  return out;
}

}  // namespace

TEST_CASE("check reports the problems of the study and of every file it names in one run",
          "[catalog][check]") {
  // tests/catalog-schema/check-many/: two unknown keys in the study, a site with a text where
  // a number belongs and a hourly CSV with a nan in row 4 (line 5), a profile file that does
  // not exist, a profile with two schema problems and one that breaks a value rule.
  const StudyCheck check =
      check_study_file(source_path("tests/catalog-schema/check-many/study.yaml"));
  CHECK_FALSE(check.study.has_value());
  using Row = std::tuple<std::string, int, std::string>;
  const std::vector<Row> want{
      {"study.yaml", 13, "study.economics.real_discount_rat"},
      {"study.yaml", 15, "study.design_spce"},
      {"site.yaml", 6, "site.autonomy_days"},
      {"hourly.csv", 5, "load_kw"},
      {"study.yaml", 8, "study.profiles[1]"},
      {"two-schema-problems.yaml", 10, "profile.cell.colour"},
      {"two-schema-problems.yaml", 11, "profile.cell.capacity_ah"},
      {"dod-default-outside.yaml", 21, "profile.dod.default"},
  };
  CHECK(located(check) == want);
  // The near misses carry their suggestion.
  REQUIRE(check.problems.size() == want.size());
  CHECK_THAT(check.problems[0].message(), Catch::Contains("did you mean 'real_discount_rate'?"));
  CHECK_THAT(check.problems[1].message(), Catch::Contains("did you mean 'design_space'?"));
}

TEST_CASE("check of a valid study returns the study the loader loads", "[catalog][check]") {
  const StudyCheck check = check_study_file(fixture_path("study.yaml"));
  CHECK(check.problems.empty());
  REQUIRE(check.study.has_value());
  const LoadedStudy direct = load_study_details_file(fixture_path("study.yaml"));
  CHECK(check.study->study.title == direct.study.title);
  CHECK(check.study->profile_paths == direct.profile_paths);
  CHECK(check.study->study.designs.size() == direct.study.designs.size());
}

TEST_CASE("check never passes a bad-input fixture and always includes the loader's error",
          "[catalog][check]") {
  const WarningSink previous = set_warning_sink([](const std::string&) {});  // not under test
  int fixtures = 0;
  for (const auto& entry :
       std::filesystem::directory_iterator(source_path("tests/catalog-schema/bad-inputs"))) {
    const std::string study = (entry.path() / "study.yaml").string();
    if (!std::filesystem::exists(study)) continue;
    ++fixtures;
    INFO(study);
    std::string loader_error;
    try {
      load_study_details_file(study);
    } catch (const InputError& e) {
      loader_error = e.what();
    }
    REQUIRE_FALSE(loader_error.empty());
    const StudyCheck check = check_study_file(study);
    CHECK_FALSE(check.study.has_value());
    bool found = false;
    for (const InputError& e : check.problems) found = found || loader_error == e.what();
    CHECK(found);
  }
  CHECK(fixtures >= 60);
  set_warning_sink(previous);
}

TEST_CASE("a key the schema refused is reported once, not also opened as a file",
          "[catalog][check]") {
  const TempDir dir;
  const std::string study = dir.write("study.yaml",
                                      "study:\n"
                                      "  title: t\n"
                                      "  site: [not, a, file]\n"
                                      "  profiles:\n"
                                      "    - " +
                                          fixture_path("lfp-test.yaml") +
                                          "\n"
                                          "    - {a: 1}\n"
                                          "  economics:\n"
                                          "    project_years: 20\n"
                                          "    real_discount_rate: 0.06\n"
                                          "    currency: EUR\n");
  const StudyCheck check = check_study_file(study);
  std::vector<std::string> fields;
  for (const InputError& e : check.problems) fields.push_back(e.field());
  CHECK(fields == std::vector<std::string>{"study.site", "study.profiles[1]"});
}

TEST_CASE("check passes each profile warning on once", "[catalog][check]") {
  // The loader warns of a cycle-life curve whose lifetime throughput (cycles x DoD) falls toward
  // shallow DoD: 15000 x 0.2 = 3000 < 6000 x 0.8 = 4800 full cycles (profile_loader.h).
  const TempDir dir;
  std::string profile = stowage::testing::read_text(fixture_path("lfp-test.yaml"));
  profile = stowage::testing::replace_once(profile,
                                           "      - {dod: 0.8, cycles: 3500}\n"
                                           "      - {dod: 0.2, cycles: 9000}\n"
                                           "      - {dod: 0.5, cycles: 6000}\n",
                                           "      - {dod: 0.2, cycles: 15000}\n"
                                           "      - {dod: 0.8, cycles: 6000}\n");
  const std::string profile_path = dir.write("dip.yaml", profile);
  std::string study = stowage::testing::read_text(fixture_path("study.yaml"));
  study = stowage::testing::replace_once(study, "site: site.yaml",
                                         "site: " + fixture_path("site.yaml"));
  study = stowage::testing::replace_once(study, "    - lfp-test.yaml\n",
                                         "    - " + profile_path + "\n");
  study = stowage::testing::replace_once(study, "    - lead-test.yaml\n",
                                         "    - " + fixture_path("lead-test.yaml") + "\n");
  const std::string study_path = dir.write("study.yaml", study);
  std::vector<std::string> warnings;
  const WarningSink previous =
      set_warning_sink([&](const std::string& text) { warnings.push_back(text); });
  const StudyCheck check = check_study_file(study_path);
  set_warning_sink(previous);
  for (const InputError& e : check.problems) INFO(e.what());
  CHECK(check.problems.empty());
  CHECK(warnings.size() == 1);
}

TEST_CASE("check reports every design's problem, not only the first", "[catalog][check]") {
  const TempDir dir;
  std::string study = stowage::testing::read_text(fixture_path("study.yaml"));
  study = stowage::testing::replace_once(study, "site: site.yaml",
                                         "site: " + fixture_path("site.yaml"));
  study = stowage::testing::replace_once(study, "    - lfp-test.yaml\n",
                                         "    - " + fixture_path("lfp-test.yaml") + "\n");
  study = stowage::testing::replace_once(study, "    - lead-test.yaml\n",
                                         "    - " + fixture_path("lead-test.yaml") + "\n");
  // Two designs with a swapped-letter id each, one with a setpoint beyond lfp-test's dod.max.
  study = stowage::testing::replace_once(
      study, "    - {profile: lfp-test, dod_setpoint: 0.7, strings_parallel: 2}\n",
      "    - {profile: lfp-tset, dod_setpoint: 0.7, strings_parallel: 2}\n"
      "    - {profile: lfp-test, dod_setpoint: 0.97}\n");
  study = stowage::testing::replace_once(study, "    - {profile: lead-test}\n",
                                         "    - {profile: laed-test}\n");
  const StudyCheck check = check_study_file(dir.write("study.yaml", study));
  std::vector<std::string> fields;
  for (const InputError& e : check.problems) fields.push_back(e.field());
  CHECK(fields == std::vector<std::string>{"study.designs[0].profile",
                                           "study.designs[1].dod_setpoint",
                                           "study.designs[2].profile"});
  REQUIRE(check.problems.size() == 3);
  CHECK_THAT(check.problems[0].message(), Catch::Contains("did you mean 'lfp-test'?"));
  CHECK_THAT(check.problems[2].message(), Catch::Contains("did you mean 'lead-test'?"));
  // The loader itself still reports the first.
  CHECK_THROWS_WITH(load_study_details_file(dir.path() + "/study.yaml"),
                    Catch::Contains("study.designs[0].profile"));
}

TEST_CASE("check reports every rule across files that a study breaks, not only the first",
          "[catalog][check]") {
  const WarningSink previous = set_warning_sink([](const std::string&) {});  // not under test
  using Row = std::tuple<std::string, int, std::string>;
  // bad-inputs/77: a duplicate profile id, a module that cannot make the 48 V bus, prices in
  // another currency and cells too small for the autonomy, each in its own profile file.
  const StudyCheck profiles = check_study_file(
      source_path("tests/catalog-schema/bad-inputs/77-cross-file-profile-problems/study.yaml"));
  CHECK_FALSE(profiles.study.has_value());
  CHECK(located(profiles) == std::vector<Row>{{"study.yaml", 9, "study.profiles[1]"},
                                              {"study.yaml", 10, "study.profiles[2]"},
                                              {"priced-in-usd.yaml", 39, "profile.costs.currency"},
                                              {"study.yaml", 11, "study.profiles[3]"}});
  // bad-inputs/78: an unknown design profile, a setpoint outside its profile's range, a limit
  // past its plausibility bound, a mass limit one profile cannot honour, two bad variations.
  const StudyCheck study = check_study_file(
      source_path("tests/catalog-schema/bad-inputs/78-cross-file-study-problems/study.yaml"));
  CHECK_FALSE(study.study.has_value());
  CHECK(located(study) ==
        std::vector<Row>{{"study.yaml", 14, "study.designs[0].profile"},
                         {"study.yaml", 15, "study.designs[1].dod_setpoint"},
                         {"study.yaml", 17, "study.design_space.max_strings_parallel"},
                         {"study.yaml", 18, "study.design_space.max_mass_kg"},
                         {"study.yaml", 20, "study.variations[0].path"},
                         {"study.yaml", 21, "study.variations[1].high"}});
  // The loader (evaluate, optimise) refuses with the first of them.
  CHECK_THROWS_WITH(load_study_details_file(source_path(
                        "tests/catalog-schema/bad-inputs/78-cross-file-study-problems/study.yaml")),
                    Catch::Contains("study.designs[0].profile"));
  set_warning_sink(previous);
}
