// SPDX-License-Identifier: MIT
// The plausibility limits: docs/input-format.md lists the values input_limits.h holds, and each
// limit is enforced at its boundary (the limit itself passes, one step past it is refused with
// file, line and field).
#include "catalog-schema/input_limits.h"

#include <catch2/catch.hpp>
#include <sstream>

#include "catalog-schema/decimal_text.h"
#include "catalog-schema/input_file.h"
#include "catalog-schema/site_loader.h"
#include "catalog-schema/study_loader.h"
#include "catalog_test_support.h"

namespace stowage {
namespace {

using testing::expect_input_error;
using testing::fixture_path;
using testing::read_text;
using testing::replace_once;

TEST_CASE("the limits table of docs/input-format.md holds the values of input_limits.h",
          "[catalog][limits][docs]") {
  const std::string docs = read_text(testing::source_path("docs/input-format.md"));
  const auto row = [&](const std::string& what, const std::string& limit) {
    INFO(what);
    CHECK(docs.find("| " + what + " | " + limit + " |") != std::string::npos);
  };
  row("strings in parallel", std::to_string(kMaxStringsParallel));
  row("DoD ladder setpoints", std::to_string(kMaxDodLadderSetpoints));
  row("bus voltage", number_text(kMaxBusVoltageV) + " V");
  row("cells in series", std::to_string(kMaxCellsInSeries));
  row("cell capacity", number_text(kMaxCellCapacityAh) + " Ah");
  row("autonomy", number_text(kMaxAutonomyDays) + " days");
  row("design margin", number_text(kMaxDesignMargin));
  row("load and source power", number_text(kMaxPowerKw) + " kW");
  row("any number in a YAML input", number_text(kMaxInputMagnitude) + " in magnitude");
  row("YAML file size", size_text(kMaxYamlFileBytes));
  row("YAML nesting depth", std::to_string(kMaxYamlNestingDepth) + " levels");
  row("CSV file size", size_text(kMaxCsvFileBytes));
  row("CSV line length", size_text(kMaxCsvLineBytes));
  row("CSV columns", std::to_string(kMaxCsvColumns));
  row("profiles in a study", std::to_string(kMaxProfiles));
  row("designs in a study", std::to_string(kMaxDesigns));
  row("SOC series rows", std::to_string(kMaxSocRows));
}

// The fixture study with `from` replaced by `to`, loaded from the fixture directory.
LoadedStudy study_with(const std::string& from, const std::string& to) {
  std::istringstream in(replace_once(read_text(fixture_path("study.yaml")), from, to));
  return load_study_details(in, "study.yaml",
                            testing::source_path("tests/catalog-schema/fixtures"));
}

TEST_CASE("strings in parallel are checked as numbers before they become an int",
          "[catalog][limits]") {
  const std::string designs = read_text(fixture_path("study.yaml"));
  REQUIRE(designs.find("strings_parallel: 2") != std::string::npos);
  CHECK(study_with("strings_parallel: 2", "strings_parallel: 1000").study.designs.size() >= 1);
  for (const char* bad : {"1001", "4294967298", "2147483648", "99999999999"}) {
    INFO(bad);
    const InputError e = expect_input_error(
        [&] { study_with("strings_parallel: 2", std::string("strings_parallel: ") + bad); },
        "study.yaml", testing::line_of(designs, "strings_parallel: 2"),
        "study.designs[0].strings_parallel");
    CHECK_THAT(e.message(), Catch::Contains("must be at most 1000") && Catch::Contains(bad));
  }
}

TEST_CASE("the DoD ladder may have 101 setpoints and no more", "[catalog][limits]") {
  const std::string text = read_text(fixture_path("study.yaml"));
  const std::string ladder = "dod_ladder: {from: 0.3, to: 0.9, step: 0.1}";
  REQUIRE(text.find(ladder) != std::string::npos);
  // 0.25 .. 0.75 in steps of 0.005 is 101 setpoints; to 0.755 it is 102.
  CHECK(
      study_with(ladder, "dod_ladder: {from: 0.25, to: 0.75, step: 0.005}").study.search.dod_step ==
      0.005);
  const InputError e = expect_input_error(
      [&] { study_with(ladder, "dod_ladder: {from: 0.25, to: 0.755, step: 0.005}"); }, "study.yaml",
      testing::line_of(text, ladder), "study.design_space.dod_ladder.step");
  CHECK_THAT(e.message(), Catch::Contains("gives 102 setpoints"));
}

TEST_CASE("a site at the limits loads, one past them is refused at the field",
          "[catalog][limits]") {
  const std::string site = read_text(fixture_path("site.yaml"));
  const std::string dir = testing::source_path("tests/catalog-schema/fixtures");
  const auto load = [&](const std::string& from, const std::string& to) {
    std::istringstream in(replace_once(site, from, to));
    return load_site(in, "site.yaml", dir);
  };
  CHECK(load("autonomy_days: 3", "autonomy_days: 365").autonomy_days == 365);
  CHECK(load("design_margin: 1.1", "design_margin: 10").design_margin == 10);
  CHECK(load("bus_voltage_v: 48", "bus_voltage_v: 1500").bus_voltage_v == 1500);
  expect_input_error([&] { load("autonomy_days: 3", "autonomy_days: 365.5"); }, "site.yaml",
                     testing::line_of(site, "autonomy_days"), "site.autonomy_days");
  expect_input_error([&] { load("design_margin: 1.1", "design_margin: 10.01"); }, "site.yaml",
                     testing::line_of(site, "design_margin"), "site.design_margin");
  expect_input_error([&] { load("bus_voltage_v: 48", "bus_voltage_v: 1501"); }, "site.yaml",
                     testing::line_of(site, "bus_voltage_v"), "site.bus_voltage_v");
}

TEST_CASE("the study's notes carry the columns the hourly CSV ignored", "[catalog][limits]") {
  testing::TempDir dir;
  std::string csv = read_text(fixture_path("hourly.csv"));
  csv = replace_once(csv, "load_kw,source_kw,temp_c", "load_kw,source_kw,temp_c,logger_status");
  std::string rows;
  std::istringstream lines(csv);
  std::string line;
  int header_line = 0, n = 0;
  while (std::getline(lines, line)) {
    ++n;
    const bool data = !line.empty() && line[0] != '#' && line.find("load_kw") == std::string::npos;
    if (line.find("logger_status") != std::string::npos) header_line = n;
    rows += line + (data ? ",0" : "") + "\n";
  }
  dir.write("hourly.csv", rows);
  dir.write("site.yaml", read_text(fixture_path("site.yaml")));
  dir.write("lfp-test.yaml", read_text(fixture_path("lfp-test.yaml")));
  dir.write("lead-test.yaml", read_text(fixture_path("lead-test.yaml")));
  const std::string study = dir.write("study.yaml", read_text(fixture_path("study.yaml")));
  const LoadedStudy loaded = load_study_details_file(study);
  REQUIRE(loaded.notes.size() == 1);
  CHECK(loaded.notes[0].file == dir.path() + "/hourly.csv");
  CHECK(loaded.notes[0].line == header_line);
  CHECK(loaded.notes[0].field == "logger_status");
}

}  // namespace
}  // namespace stowage
