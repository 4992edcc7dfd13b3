// SPDX-License-Identifier: MIT
// Temperatures no battery space sees are refused as unit or data mistakes, naming line and
// column.
#include <catch2/catch.hpp>
#include <sstream>
#include <string>

#include "catalog-schema/hourly_csv.h"
#include "catalog-schema/input_error.h"
#include "catalog-schema/soc_series.h"

using namespace stowage;

TEST_CASE("an hourly temperature in kelvin is refused at its line", "[catalog][csv]") {
  // 298.15 is 25 degC written in kelvin; the range check stops it before the model sees it.
  std::stringstream csv;
  csv << "load_kw,source_kw,temp_c\n1,0,298.15\n";
  try {
    read_hourly_csv(csv, "k.csv");
    FAIL("expected an InputError");
  } catch (const InputError& e) {
    CHECK(e.line() == 2);
    CHECK(e.field() == "temp_c");
    CHECK_THAT(e.message(), Catch::Contains("kelvin"));
  }
}

TEST_CASE("a logged temperature in Fahrenheit heat is refused", "[catalog][soc]") {
  std::stringstream csv;
  csv << "soc,temp_c\n0.5,20\n0.6,104\n";
  try {
    read_soc_series(csv, "f.csv");
    FAIL("expected an InputError");
  } catch (const InputError& e) {
    CHECK(e.line() == 3);
    CHECK(e.field() == "temp_c");
  }
}
