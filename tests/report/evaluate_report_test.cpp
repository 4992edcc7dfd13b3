// SPDX-License-Identifier: MIT
// What `evaluate` says about designs that cannot do the site's job: a bank below the least
// admissible strings is marked, and a design that delivers nothing gets words, not an LCOS.
#include "optimiser/report/evaluate_report.h"

#include <catch2/catch.hpp>
#include <sstream>
#include <string>
#include <vector>

#include "optimiser/analysis/evaluate_all.h"
#include "optimiser/report/design_report.h"
#include "support/synthetic_study.h"

using namespace stowage;

namespace {

bool contains(const std::string& text, const std::string& part) {
  return text.find(part) != std::string::npos;
}

// CSV cells of one line (RFC 4180: a quoted field may hold commas, such as a list "[7,14]").
std::vector<std::string> split(const std::string& line) {
  std::vector<std::string> cells(1);
  bool quoted = false;
  for (char c : line) {
    if (c == '"')
      quoted = !quoted;
    else if (c == ',' && !quoted)
      cells.emplace_back();
    else
      cells.back().push_back(c);
  }
  return cells;
}

// The cell of `column` in the first data row of a CSV text.
std::string first_row_cell(const std::string& csv, const std::string& column) {
  std::istringstream in(csv);
  std::string header, row;
  std::getline(in, header);
  std::getline(in, row);
  const auto names = split(header), cells = split(row);
  REQUIRE(names.size() == cells.size());
  for (std::size_t i = 0; i < names.size(); ++i)
    if (names[i] == column) return cells[i];
  FAIL("no column " << column);
  return "";
}

// One profile, one 1-string design: 12 kWh a day for 1.5 days of autonomy needs more than a
// string of any generated profile holds (a string is at most 48 V x the largest cell).
StudyCase one_string_study() {
  SyntheticStudySpec spec;
  spec.profiles = 1;
  StudyCase s = make_synthetic_study(spec);
  DesignSpec d;
  d.profile_id = s.profiles[0].id;
  d.strings_parallel = 1;
  s.designs = {d};
  return s;
}

}  // namespace

TEST_CASE("evaluate marks a design that fails the autonomy requirement", "[report][evaluate]") {
  const StudyCase s = one_string_study();
  const auto results = evaluate_all(s);
  const auto checks = requirement_checks(s, results);
  REQUIRE(checks.size() == 1);
  // The rule itself is checked by hand in tests/optimiser/design_space_test.cpp; here the
  // report must follow it.
  REQUIRE(checks[0].usable_kwh < checks[0].required_usable_kwh);
  REQUIRE_FALSE(checks[0].meets_autonomy);
  std::ostringstream text, json, csv;
  report::write_evaluate_text(text, s, results, checks);
  CHECK(contains(text.str(), "FAILS         autonomy"));
  CHECK(contains(text.str(), "(FAILS autonomy"));
  CHECK(contains(text.str(), "1 of 1 designs fail"));
  report::write_evaluate_json(json, s, results, checks);
  CHECK(contains(json.str(), "\"meets_requirements\":false"));
  CHECK(contains(json.str(), "\"meets_autonomy\":false"));
  report::write_designs_csv(csv, results, &checks);
  CHECK(first_row_cell(csv.str(), "meets_autonomy") == "false");
  CHECK(first_row_cell(csv.str(), "delivers_energy") == "true");
}

TEST_CASE("a design that delivers no energy gets a statement instead of an LCOS",
          "[report][evaluate]") {
  StudyCase s = one_string_study();
  s.site.load_kw.assign(kHoursPerYear, 0.0);  // nothing to serve: no energy delivered
  const auto results = evaluate_all(s);
  REQUIRE_FALSE(results[0].delivers_energy());
  const auto checks = requirement_checks(s, results);
  std::ostringstream text, json, csv;
  report::write_evaluate_text(text, s, results, checks);
  CHECK(contains(text.str(), report::no_lcos_statement()));
  CHECK_FALSE(contains(text.str(), "inf"));
  report::write_evaluate_json(json, s, results, checks);
  CHECK(contains(json.str(), "\"lcos_statement\":"));
  CHECK_FALSE(contains(json.str(), "\"lcos_per_kwh\""));
  CHECK_FALSE(contains(json.str(), "null"));
  report::write_designs_csv(csv, results, &checks);
  CHECK(first_row_cell(csv.str(), "delivers_energy") == "false");
  CHECK(first_row_cell(csv.str(), "lcos_per_kwh").empty());
  CHECK(first_row_cell(csv.str(), "lcos_schmidt_per_kwh").empty());
}
