// SPDX-License-Identifier: MIT
#include "catalog-schema/decimal_text.h"

#include <catch2/catch.hpp>
#include <clocale>
#include <cmath>
#include <cstdlib>
#include <limits>
#include <random>
#include <string>

using stowage::decimal_value;

TEST_CASE("a decimal text reads as the C library's strtod reads it, bit for bit",
          "[catalog][decimal]") {
  // strtod under the "C" locale (ISO C 7.22.1.3) rounds a decimal to the nearest double; the
  // loader must give the same double for every number it reads.
  std::setlocale(LC_NUMERIC, "C");
  std::mt19937_64 rng(20261204);
  std::uniform_int_distribution<int> digits(0, 9), length(1, 20), exponent(-40, 40);
  for (int n = 0; n < 20000; ++n) {
    std::string text = (rng() % 3 == 0) ? "-" : (rng() % 5 == 0 ? "+" : "");
    const int whole = length(rng), fraction = length(rng) - 1;
    for (int i = 0; i < whole; ++i) text += static_cast<char>('0' + digits(rng));
    if (fraction > 0) {
      text += '.';
      for (int i = 0; i < fraction; ++i) text += static_cast<char>('0' + digits(rng));
    }
    if (rng() % 4 == 0) text += "e" + std::to_string(exponent(rng));
    INFO(text);
    REQUIRE(stowage::is_decimal_text(text));
    CHECK(decimal_value(text) == std::strtod(text.c_str(), nullptr));
  }
}

TEST_CASE("a decimal beyond the range of double reads as infinity, one below it as strtod's",
          "[catalog][decimal]") {
  CHECK(decimal_value("1e400") == std::numeric_limits<double>::infinity());
  CHECK(decimal_value("-1e400") == -std::numeric_limits<double>::infinity());
  CHECK(decimal_value("+1e400") == std::numeric_limits<double>::infinity());
  // Underflow: the nearest double, as strtod gives it (0 or a subnormal), never a failure.
  CHECK(decimal_value("1e-400") == std::strtod("1e-400", nullptr));
  CHECK(decimal_value("4e-320") == std::strtod("4e-320", nullptr));
  CHECK(decimal_value("0.1") == 0.1);
  CHECK(decimal_value("+2.5") == 2.5);
}
