// SPDX-License-Identifier: MIT
// Logged SOC series: fraction or percent, optional temperature, at least two rows, values in
// range; errors name the line and the column.
#include "catalog-schema/soc_series.h"

#include <catch2/catch.hpp>
#include <sstream>

#include "catalog_test_support.h"

namespace stowage {
namespace {

using testing::expect_input_error;

const char* const kName = "soc.csv";

SocSeries read_text(const std::string& text) {
  std::istringstream in(text);
  return read_soc_series(in, kName);
}

std::string soc_error(const std::string& text, int line, const std::string& field) {
  return expect_input_error([&] { read_text(text); }, kName, line, field).message();
}

TEST_CASE("a fraction series with time and temperature reads as logged", "[catalog][soc]") {
  const SocSeries s = read_text(
      "# logged by the site controller\n"
      "time,soc,temp_c\n"
      "2026-01-01 00:00,0.9,12.5\n"
      "\"2026-01-01 01:00\",0.45,11\n"
      "2026-01-01 02:00,1,10\n");
  CHECK(s.soc_fraction == std::vector<double>{0.9, 0.45, 1.0});
  CHECK(s.temp_c == std::vector<double>{12.5, 11, 10});
  CHECK(s.time_hours == std::vector<double>{0, 1, 2});
  REQUIRE(s.hours_per_sample);
  CHECK(*s.hours_per_sample == Approx(1.0));
}

TEST_CASE("the time column gives the real spacing of the samples", "[catalog][soc][time]") {
  // A 15-minute log: the spacing comes from the file, not from an assumed hour.
  const SocSeries quarter = read_text(
      "time,soc\n2026-03-01T23:30,0.5\n2026-03-01T23:45,0.6\n2026-03-02T00:00,0.7\n"
      "2026-03-02T00:15,0.6\n");
  REQUIRE(quarter.hours_per_sample);
  CHECK(*quarter.hours_per_sample == Approx(0.25));
  // Hours as numbers, and date-times with seconds, a fraction and an offset: 10:00:30+01:00 is
  // 09:00:30Z (ISO 8601 offset notation; Python's datetime.fromisoformat agrees), 30 s apart.
  CHECK(*read_text("time,soc\n0,0.5\n0.5,0.6\n1,0.7\n").hours_per_sample == Approx(0.5));
  const SocSeries offset = read_text(
      "time,soc\n2026-03-01T09:00:00Z,0.5\n2026-03-01T10:00:30+01:00,0.6\n"
      "2026-03-01 09:01:00.000Z,0.7\n");
  CHECK(*offset.hours_per_sample == Approx(30.0 / 3600.0));
  // Across the end of February of a leap year (2028) and a non-leap year (2026).
  CHECK(*read_text("time,soc\n2028-02-28,0.5\n2028-02-29,0.6\n2028-03-01,0.7\n").hours_per_sample ==
        Approx(24));
  CHECK(*read_text("time,soc\n2026-02-27,0.5\n2026-02-28,0.6\n2026-03-01,0.7\n").hours_per_sample ==
        Approx(24));
  CHECK_FALSE(read_text("soc\n0.5\n0.6\n").hours_per_sample);
}

TEST_CASE("times that do not increase evenly or are not times are refused",
          "[catalog][soc][time][bad]") {
  CHECK_THAT(soc_error("time,soc\n0,0.5\n1,0.6\n1,0.7\n", 4, "time"),
             Catch::Contains("must increase") && Catch::Contains("the same as"));
  CHECK_THAT(soc_error("time,soc\n2026-03-01 02:00,0.5\n2026-03-01 01:00,0.6\n", 3, "time"),
             Catch::Contains("before the previous row"));
  CHECK_THAT(soc_error("time,soc\n0,0.5\n1,0.6\n2,0.7\n5,0.6\n", 5, "time"),
             Catch::Contains("evenly spaced") && Catch::Contains("3 h"));
  CHECK_THAT(soc_error("time,soc\nt0,0.5\nt1,0.6\n", 2, "time"), Catch::Contains("not a time"));
  CHECK_THAT(soc_error("time,soc\n2026-02-29T00:00,0.5\n2026-03-01T00:00,0.6\n", 2, "time"),
             Catch::Contains("February 2026 has no day 29"));
  CHECK_THAT(soc_error("time,soc\n2026-03-01T24:00,0.5\n2026-03-02T01:00,0.6\n", 2, "time"),
             Catch::Contains("does not exist"));
  CHECK_THAT(soc_error("time,soc\n0,0.5\n2026-03-01T01:00,0.6\n", 3, "time"),
             Catch::Contains("one form"));
}

TEST_CASE("a column the SOC reader does not use is ignored with a note", "[catalog][soc]") {
  const SocSeries s = read_text("soc,voltage_v,status\n0.5,50,ok\n0.6,51,ok\n");
  CHECK(s.soc_fraction == std::vector<double>{0.5, 0.6});
  REQUIRE(s.notes.size() == 2);
  CHECK(s.notes[0].field == "voltage_v");
  CHECK(s.notes[0].line == 1);
  CHECK(s.notes[0].column == 5);
  CHECK(s.notes[1].field == "status");
  CHECK(s.notes[0].text() ==
        "soc.csv:1:5: voltage_v: note: column ignored: a SOC series uses soc or soc_pct, temp_c "
        "and time");
}

TEST_CASE("a percent series is converted to fractions", "[catalog][soc]") {
  const SocSeries s = read_text("soc_pct\n80\n20\n100\n0\n");
  REQUIRE(s.soc_fraction.size() == 4);
  CHECK(s.soc_fraction[0] == Approx(0.8));
  CHECK(s.soc_fraction[1] == Approx(0.2));
  CHECK(s.soc_fraction[2] == 1.0);
  CHECK(s.soc_fraction[3] == 0.0);
  CHECK(s.temp_c.empty());
}

TEST_CASE("SOC values out of range are refused", "[catalog][soc][bad]") {
  CHECK_THAT(soc_error("time,soc\n0,0.5\n1,1.2\n2,0.3\n", 3, "soc"),
             Catch::Contains("must be within [0, 1], found 1.2"));
  // A percent value in a fraction column gets the hint to rename the column.
  CHECK_THAT(soc_error("soc\n0.5\n85\n", 3, "soc"), Catch::Contains("name the column soc_pct"));
  CHECK_THAT(soc_error("soc_pct\n50\n-3\n", 3, "soc_pct"),
             Catch::Contains("must be within [0, 100]"));
  CHECK_THAT(soc_error("soc,temp_c\n0.5,20\n0.6,nan\n", 3, "temp_c"), Catch::Contains("finite"));
}

TEST_CASE("the SOC columns must be given once and named with their unit", "[catalog][soc][bad]") {
  CHECK_THAT(soc_error("soc,soc_pct\n0.5,50\n0.6,60\n", 1, "soc_pct"), Catch::Contains("not both"));
  CHECK_THAT(soc_error("time,temp_c\n0,1\n1,2\n", 1, "soc"),
             Catch::Contains("no state-of-charge column"));
  CHECK_THAT(soc_error("soc_percent\n50\n60\n", 1, "soc_percent"),
             Catch::Contains("name it soc (values 0 to 1) or soc_pct"));
  CHECK_THAT(soc_error("soc,temp_f\n0.5,70\n0.6,71\n", 1, "temp_f"),
             Catch::Contains("name it temp_c"));
  CHECK_THAT(soc_error("soc,tmep_c\n0.5,50\n0.6,51\n", 1, "tmep_c"),
             Catch::Contains("did you mean 'temp_c'?"));
}

TEST_CASE("a series needs two rows", "[catalog][soc][bad]") {
  CHECK_THAT(soc_error("soc\n0.5\n", 2, "soc"), Catch::Contains("at least 2 rows"));
  CHECK_THAT(soc_error("", 1, "(header)"), Catch::Contains("no header"));
}

TEST_CASE("an unreadable SOC file is an InputError", "[catalog][soc][bad]") {
  const std::string missing = testing::fixture_path("no-such-soc.csv");
  expect_input_error([&] { read_soc_series_file(missing); }, missing, 1, "(file)");
}

}  // namespace
}  // namespace stowage
