// SPDX-License-Identifier: MIT
// Synthetic studies for tests and benchmarks: an invented off-grid PV site and chemistry
// profiles with random but valid parameters, reproducible from a seed (std::mt19937_64 with
// explicit formulas, so the same seed gives the same study on every platform).
//
// Site (one typical year, 8760 h): load = base x (1 + winter share x cos(2 pi (day - 15)/365))
// with an evening peak (18-22 h, x peak_factor); PV = peak_kw x max(0, sin(pi (hour - 6)/12))
// on 06-18 h, x (0.75 + 0.25 cos(2 pi (day - 172)/365)) seasonally, x a daily clearness drawn
// uniformly in [0.15, 1]; battery temperature = mean + amplitude x sin(2 pi (day - 105)/365)
// + 3 sin(2 pi (hour - 9)/24). 48 V bus, 95 % charger and inverter efficiency.
// Profiles: cell voltage from {1.2, 2.0, 3.2, 3.6} V, a power-law cycle-life curve
// N = N100 DoD^-k tabulated at DoD 0.1, 0.2, ..., 1.0, calendar life, halving-law ageing,
// a cold capacity table, and prices; all drawn from documented ranges in synthetic_study.cpp.
// These are NOT real products: they exist to exercise the optimiser over varied shapes.
#pragma once

#include <cstdint>

#include "catalog-schema/study_case.h"

namespace stowage {

struct SyntheticStudySpec {
  std::uint64_t seed = 1;
  int profiles = 3;
  int project_years = 10;
  int max_strings = 16;
  double dod_from = 0.20, dod_to = 1.00, dod_step = 0.10;
  bool backup = true;           // back-up at a random price; otherwise an unserved limit
  bool full_dod_range = false;  // every profile allows DoD 0.20..1.00 (the whole ladder)
  double daily_load_kwh = 12;   // mean
  double autonomy_days = 1.5;
};

// Returns a validated study (throws InvalidValue if the generator ever breaks a rule).
StudyCase make_synthetic_study(const SyntheticStudySpec& spec);

}  // namespace stowage
