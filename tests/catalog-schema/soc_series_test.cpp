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
  CHECK_THAT(soc_error("time,soc\na,0.5\nb,1.2\nc,0.3\n", 3, "soc"),
             Catch::Contains("must be within [0, 1], found 1.2"));
  // A percent value in a fraction column gets the hint to rename the column.
  CHECK_THAT(soc_error("soc\n0.5\n85\n", 3, "soc"), Catch::Contains("name the column soc_pct"));
  CHECK_THAT(soc_error("soc_pct\n50\n-3\n", 3, "soc_pct"),
             Catch::Contains("must be within [0, 100]"));
  CHECK_THAT(soc_error("soc,temp_c\n0.5,20\n0.6,nan\n", 3, "temp_c"), Catch::Contains("finite"));
}

TEST_CASE("the SOC columns must be given once and named with their unit", "[catalog][soc][bad]") {
  CHECK_THAT(soc_error("soc,soc_pct\n0.5,50\n0.6,60\n", 1, "soc_pct"), Catch::Contains("not both"));
  CHECK_THAT(soc_error("time,temp_c\na,1\nb,2\n", 1, "soc"),
             Catch::Contains("no state-of-charge column"));
  CHECK_THAT(soc_error("soc_percent\n50\n60\n", 1, "soc_percent"),
             Catch::Contains("name it soc (values 0 to 1) or soc_pct"));
  CHECK_THAT(soc_error("soc,temp_f\n0.5,70\n0.6,71\n", 1, "temp_f"),
             Catch::Contains("name it temp_c"));
  CHECK_THAT(soc_error("soc,voltage\n0.5,50\n0.6,51\n", 1, "voltage"),
             Catch::Contains("unknown column"));
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
