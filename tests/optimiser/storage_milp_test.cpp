// SPDX-License-Identifier: MIT
// The mixed-integer model: its wear linearisation against compound-interest sums, the
// decomposition against GLPK's branch and bound on the monolithic model, and the exported model
// against two independent solvers (COIN-OR CBC and HiGHS via SciPy).
#include "optimiser/storage_milp.h"

#include <unistd.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <memory>
#include <string>

#include "model/lifecycle.h"
#include "optimiser/design_space.h"
#include "optimiser/optimise.h"
#include "optimiser/representative_days.h"
#include "support/synthetic_study.h"
#include "test_paths.h"

using namespace stowage;

TEST_CASE("the renewal factor is exact for lives that divide the project",
          "[optimiser][milp][wear]") {
  // Reference: present worth of single sums, P/F = (1+i)^-n (compound-interest tables). A bank
  // of life L = N/k bought at t = 0 and renewed at L, 2L, ..., (k-1)L costs, per unit price,
  // 1 + sum_j (1+i)^(-jL); the model writes it as I0 - R + R g(1/L) with R = I0, so
  // g(1/L) = 1 + sum_j (1+i)^(-jL).
  for (double i : {0.03, 0.06, 0.1}) {
    for (int n_years : {12, 20}) {
      for (int k : {1, 2, 3, 4}) {
        const double life = static_cast<double>(n_years) / k;
        double chain = 1;
        for (int j = 1; j < k; ++j) chain += std::pow(1 + i, -j * life);
        INFO("i " << i << " N " << n_years << " k " << k);
        CHECK(renewal_cost_factor(1 / life, i, n_years) == Approx(chain).epsilon(1e-12));
      }
    }
  }
  // With no discounting the factor is the number of banks consumed, N / L.
  CHECK(renewal_cost_factor(0.25, 0.0, 20) == Approx(5.0));
}

TEST_CASE("the tangents of the renewal factor stay below it (outer approximation)",
          "[optimiser][milp][wear]") {
  const double i = 0.06;
  const int n_years = 20;
  for (double r0 : {0.05, 0.1, 0.3, 1.0}) {
    const double g0 = renewal_cost_factor(r0, i, n_years);
    const double s0 = renewal_cost_factor_slope(r0, i, n_years);
    // Slope against a central difference.
    const double h = 1e-6;
    CHECK(s0 == Approx((renewal_cost_factor(r0 + h, i, n_years) -
                        renewal_cost_factor(r0 - h, i, n_years)) /
                       (2 * h))
                    .epsilon(1e-5));
    for (double r = 0.01; r < 4; r *= 1.3) {
      CHECK(g0 + s0 * (r - r0) <= renewal_cost_factor(r, i, n_years) + 1e-12);
    }
  }
}

TEST_CASE("representative blocks stand for the 365 days of the year", "[optimiser][days]") {
  SyntheticStudySpec spec;
  spec.seed = 4;
  const StudyCase study = make_synthetic_study(spec);
  for (int k : {1, 2, 3}) {
    const RepresentativeDays days = select_representative_days(study.site, k);
    REQUIRE(days.blocks.size() == 12);
    double represented = 0;
    for (const RepresentativeBlock& b : days.blocks) {
      represented += b.weight * b.hours / 24.0;
      CHECK(b.first_hour % 24 == 0);
      CHECK(b.hours == 24 * k);
      // Block inside its month (months of 730 h, model/site.h): midpoints of first and last day.
      CHECK(static_cast<int>((b.first_hour + 12) / kHoursPerMonth) == b.month);
      CHECK(std::min(11, static_cast<int>((b.first_hour + b.hours - 12) / kHoursPerMonth)) ==
            b.month);
    }
    CHECK(represented == Approx(365.0));
  }
  CHECK_THROWS(select_representative_days(study.site, 0));
}

namespace {

StudyCase small_study() {
  SyntheticStudySpec spec;
  spec.seed = 3;
  spec.profiles = 2;
  spec.dod_step = 0.2;
  spec.max_strings = 12;
  return make_synthetic_study(spec);
}

}  // namespace

TEST_CASE("the decomposed sub-models reach the monolithic model's optimum", "[optimiser][milp]") {
  // Reference: GLPK's branch and bound (glp_intopt) on the monolithic model, against the
  // sub-models solved by LP relaxation and neighbouring integers.
  const StudyCase study = small_study();
  const std::string path =
      (std::filesystem::temp_directory_path() / "stowage_decomposition_check.mps").string();
  const double monolithic = export_design_space_model(study, path, 1, true);
  std::remove(path.c_str());
  REQUIRE(std::isfinite(monolithic));

  const DesignSpace space = build_design_space(study);
  const RepresentativeDays days = select_representative_days(study.site, 1);
  double best = 1e300;
  int solved = 0;
  for (const DesignChoice& c : space.choices) {
    if (!c.admissible()) continue;
    const ChemistryProfile& p = study.profiles[c.profile_index];
    LifecycleEvaluator evaluator(p, study.site, study.economics);
    StorageMilp model(
        study, {{&p, &evaluator.acceleration(), c.dod_setpoint, c.min_strings, c.max_strings}},
        days);
    const SolveReport r = model.solve(MilpOptions{});
    REQUIRE(r.outcome == SolveOutcome::Optimal);
    CHECK(r.strings >= c.min_strings);
    CHECK(r.strings <= c.max_strings);
    best = std::min(best, r.glpk_objective);
    ++solved;
  }
  REQUIRE(solved > 2);
  CHECK(best == Approx(monolithic).epsilon(1e-7));
}

TEST_CASE("moving a sub-model to another setpoint equals building it afresh", "[optimiser][milp]") {
  const StudyCase study = small_study();
  const ChemistryProfile& p = study.profiles[0];
  LifecycleEvaluator evaluator(p, study.site, study.economics);
  const RepresentativeDays days = select_representative_days(study.site, 1);
  const std::vector<double> ladder = dod_ladder(study.search, p);
  REQUIRE(ladder.size() >= 2);
  StorageMilp moved(study, {{&p, &evaluator.acceleration(), ladder.front(), 3, 12}}, days);
  moved.solve(MilpOptions{});
  moved.set_setpoint(0, ladder.back(), 2, 10);
  const SolveReport a = moved.solve(MilpOptions{});
  StorageMilp fresh(study, {{&p, &evaluator.acceleration(), ladder.back(), 2, 10}}, days);
  const SolveReport b = fresh.solve(MilpOptions{});
  CHECK(a.glpk_objective == Approx(b.glpk_objective).epsilon(1e-9));
  CHECK(a.strings == b.strings);
}

TEST_CASE("CBC and HiGHS reach GLPK's optimum of the exported model",
          "[optimiser][milp][external]") {
  // Independent solvers: COIN-OR CBC (the cbc binary) and HiGHS through SciPy's
  // scipy.optimize.milp; tests/optimiser/check_exported_model.py parses the free MPS for SciPy.
  const StudyCase study = small_study();
  // Named by process, so suites running side by side (other build trees) do not share files.
  const auto dir = std::filesystem::temp_directory_path();
  const std::string stem = "stowage_export_check_" + std::to_string(::getpid());
  const std::string mps = (dir / (stem + ".mps")).string();
  const std::string lp = (dir / (stem + ".lp")).string();
  const double glpk = export_design_space_model(study, mps, 1, true);
  export_design_space_model(study, lp, 1, false);
  REQUIRE(std::isfinite(glpk));
  char objective[64];
  std::snprintf(objective, sizeof objective, "%.12g", glpk);
  const std::string command = std::string("/usr/bin/python3 ") + STOWAGE_SOURCE_DIR +
                              "/tests/optimiser/check_exported_model.py " + objective + " " + mps +
                              " " + lp;
  const int rc = std::system(command.c_str());
  std::remove(mps.c_str());
  std::remove(lp.c_str());
  CHECK(rc == 0);
}
