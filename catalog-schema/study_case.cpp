// SPDX-License-Identifier: MIT
#include "catalog-schema/study_case.h"

#include <cmath>

namespace stowage {

std::vector<double> dod_ladder(const SearchSettings& search, const ChemistryProfile& profile) {
  std::vector<double> out;
  const double tol = 1e-9;
  const long steps =
      std::lround(std::floor((search.dod_to - search.dod_from) / search.dod_step + tol));
  for (long i = 0; i <= steps; ++i) {
    double d = search.dod_from + static_cast<double>(i) * search.dod_step;
    d = std::round(d * 1e9) /
        1e9;  // land on the decimal the user meant (0.35, not 0.35000000000000003)
    if (d > 1.0) d = 1.0;
    if (d + tol >= profile.dod.min && d - tol <= profile.dod.max) out.push_back(d);
  }
  return out;
}

}  // namespace stowage
