// SPDX-License-Identifier: MIT
#include "model/economics.h"

#include <catch2/catch.hpp>

using namespace stowage;

TEST_CASE("compound-interest factors match the interest tables", "[model][economics]") {
  // Discrete end-of-period factors as printed in engineering-economics factor tables (e.g.
  // Newnan, Eschenbach & Lavelle, appendix), values from check-values.md section 2 (CALC; the
  // 4-5 significant digits printed in the tables).
  struct Row {
    double i;
    int n;
    double pf, pa, ap;
  };
  const Row rows[] = {
      {0.05, 10, 0.61391, 7.7217, 0.12950},  {0.05, 20, 0.37689, 12.4622, 0.08024},
      {0.06, 20, 0.31180, 11.4699, 0.08718}, {0.08, 15, 0.31524, 8.5595, 0.11683},
      {0.08, 25, 0.14602, 10.6748, 0.09368}, {0.10, 20, 0.14864, 8.5136, 0.11746},
      {0.12, 20, 0.10367, 7.4694, 0.13388},
  };
  for (const auto& r : rows) {
    INFO("i = " << r.i << ", n = " << r.n);
    // Tolerance: half a unit in the last printed digit (5 decimals for P/F and A/P, 4 for P/A).
    CHECK(present_worth_factor(r.i, r.n) == Approx(r.pf).margin(5e-6));
    CHECK(series_present_worth_factor(r.i, r.n) == Approx(r.pa).margin(5e-5));
    CHECK(capital_recovery_factor(r.i, r.n) == Approx(r.ap).margin(5e-6));
  }
}

TEST_CASE("capital recovery reproduces the NumPy pmt documentation example", "[model][economics]") {
  // numpy.pmt docs: 200,000 over 15 years at 7.5 %/yr paid monthly -> 1854.0247200054619 per
  // month (check-values.md section 2, READ).
  CHECK(200000.0 * capital_recovery_factor(0.075 / 12, 180) ==
        Approx(1854.0247200054619).epsilon(1e-12));
}

TEST_CASE("a zero discount rate leaves sums undiscounted", "[model][economics]") {
  // Limit of the factors as i -> 0 (common practice).
  CHECK(series_present_worth_factor(0.0, 15) == 15.0);
  CHECK(capital_recovery_factor(0.0, 20) == Approx(0.05));
  CHECK(present_worth_factor(0.0, 7) == 1.0);
}

TEST_CASE("economics rejects a discount rate outside [0, 1)", "[model][economics]") {
  Economics e;
  e.real_discount_rate = 1.2;
  CHECK_THROWS_WITH(e.validate(), Catch::Contains("real_discount_rate"));
  e.real_discount_rate = 0.05;
  e.project_years = 0;
  CHECK_THROWS_WITH(e.validate(), Catch::Contains("project_years"));
}
