// SPDX-License-Identifier: MIT
// The time column's values: hours as numbers, ISO 8601 date-times as hours since
// 1970-01-01T00:00Z; check values from Python's datetime.fromisoformat(s).timestamp() / 3600
// (proleptic Gregorian calendar, as ISO 8601 uses).
#include "catalog-schema/time_column.h"

#include <catch2/catch.hpp>

namespace stowage {
namespace {

double hours_of(const std::string& text) {
  std::string problem;
  const std::optional<TimeValue> t = parse_time(text, problem);
  INFO(text << ": " << problem);
  REQUIRE(t);
  return t->hours;
}

std::string problem_of(const std::string& text) {
  std::string problem;
  CHECK_FALSE(parse_time(text, problem));
  return problem;
}

TEST_CASE("ISO 8601 date-times become hours since 1970-01-01T00:00Z", "[catalog][time]") {
  CHECK(hours_of("2026-03-01T00:00") == 492312.0);
  CHECK(hours_of("2026-03-01 00:00:00Z") == 492312.0);
  CHECK(hours_of("2026-03-01") == 492312.0);
  CHECK(hours_of("2000-02-29T12:30") == 264396.5);
  CHECK(hours_of("1969-12-31T23:00") == -1.0);
  CHECK(hours_of("2026-03-01T10:00:30+01:00") == Approx(492321.00833333336).epsilon(1e-12));
  CHECK(hours_of("2026-03-01T00:15:00-05:30") == Approx(492317.75).epsilon(1e-12));
  CHECK(hours_of("2026-03-01T00:15:00-0530") == Approx(492317.75).epsilon(1e-12));
  CHECK(hours_of("2026-03-01T00:00:00.5") == Approx(492312.0 + 0.5 / 3600).epsilon(1e-12));
  std::string problem;
  const std::optional<TimeValue> t = parse_time("2028-02-29T23:45", problem);
  REQUIRE(t);
  CHECK(t->is_date);
  CHECK(t->month == 2);
  CHECK(t->day == 29);
  CHECK(t->clock_hours == 23.75);
}

TEST_CASE("numbers are hours as given", "[catalog][time]") {
  CHECK(hours_of("0") == 0);
  CHECK(hours_of("0.25") == 0.25);
  CHECK(hours_of("8759") == 8759);
  std::string problem;
  CHECK_FALSE(parse_time("1", problem)->is_date);
}

TEST_CASE("impossible dates and other text are not times", "[catalog][time]") {
  CHECK(problem_of("2026-02-29") == "February 2026 has no day 29");
  CHECK(problem_of("1900-02-29") == "February 1900 has no day 29");  // not a leap year
  CHECK_NOTHROW(hours_of("2000-02-29"));                             // a leap year
  CHECK(problem_of("2026-13-01") == "month 13 does not exist");
  CHECK_THAT(problem_of("2026-03-01T24:00"), Catch::Contains("does not exist"));
  CHECK_THAT(problem_of("2026-03-01T12:60"), Catch::Contains("does not exist"));
  for (const char* text : {"t0", "01/03/2026 00:00", "2026-03-01T0:00", "2026-03-01T00:00 x",
                           "2026-3-1", "", "1e999"}) {
    INFO(text);
    std::string problem;
    CHECK_FALSE(parse_time(text, problem));
    CHECK_FALSE(problem.empty());
  }
}

TEST_CASE("durations read as messages show them", "[catalog][time]") {
  CHECK(duration_text(1) == "1 h");
  CHECK(duration_text(0.25) == "15 min");
  CHECK(duration_text(2.5 / 3600) == "2.5 s");
  CHECK(duration_text(25) == "25 h");
}

}  // namespace
}  // namespace stowage
