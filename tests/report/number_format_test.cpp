// SPDX-License-Identifier: MIT
// The one number formatter and the one list of cost lines.
#include "optimiser/report/number_format.h"

#include <catch2/catch.hpp>
#include <set>
#include <string>

#include "optimiser/report/cost_lines.h"

using namespace stowage;
using namespace stowage::report;

TEST_CASE("amounts carry thousands separators and never print minus zero", "[report][format]") {
  // Thousands grouped by three with a comma: common practice in English-language reports.
  CHECK(format_amount(1234567.8) == "1,234,568");
  CHECK(format_amount(999.4) == "999");
  CHECK(format_amount(-1234.5, 1) == "-1,234.5");
  CHECK(format_amount(-0.4) == "0");
  CHECK(format_amount(1.0 / 0.0) == "n/a");
  CHECK(format_signed_amount(-2500) == "-2,500");
  CHECK(format_signed_amount(2500) == "+2,500");
  CHECK(format_fixed(0.955, 1) == "1.0");
  CHECK(format_general(0.05) == "0.05");
  CHECK(format_machine(1.0 / 3.0, 10) == "0.3333333333");
  CHECK(format_machine(0.0 / 0.0).empty());
}

TEST_CASE("every cost line has one key and one label, and the lines add up to the NPC",
          "[report][cost-lines]") {
  std::set<std::string> keys, labels;
  CostBreakdown b;
  double value = 1;
  for (const CostLine& line : cost_lines()) {
    keys.insert(line.key);
    labels.insert(line.label);
    b.*line.member = value;
    value *= 2;  // distinct powers of two: a line counted twice or missed changes the sum
  }
  CHECK(keys.size() == cost_lines().size());
  CHECK(labels.size() == cost_lines().size());
  CHECK(b.total() == value - 1);
}
