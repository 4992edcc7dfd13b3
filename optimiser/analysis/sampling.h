// SPDX-License-Identifier: MIT
// Sampling for uncertainty runs: reproducible uniform numbers per (seed, sample, input), the
// inverse cumulative distribution of each Distribution (catalog-schema/variations_loader.h),
// Latin hypercube strata, and the sample statistics the reports quote.
//
// Reproducibility: the uniform number of sample k, input j is a pure function of
// (seed, k, j): splitmix64 (Steele, Lea & Flood 2014, "Fast splittable pseudorandom number
// generators", OOPSLA) applied to the seed mixed with k and then with j, its top 53 bits put in
// the open interval (0, 1). No state is shared, so any thread count and any split of the
// samples gives the same numbers.
// Latin hypercube (McKay, Beckman & Conover 1979, Technometrics 21:239-245): for input j the
// N samples take the strata 0..N-1 in a permutation drawn by Fisher-Yates from a splitmix64
// stream of (seed, j); sample k's value is (stratum + u) / N.
// Inverse CDFs (u in (0, 1)):
//   uniform     lower + u (upper - lower)
//   triangular  a + sqrt(u (b - a)(c - a)) for u < (c - a)/(b - a), else
//               b - sqrt((1 - u)(b - a)(b - c))   (closed form)
//   normal      truncated to [lower, upper]: mean + sd Phi^-1(Phi(alpha) + u (Phi(beta) -
//               Phi(alpha))), alpha, beta the standardised ends; Phi from std::erfc, Phi^-1 by
//               safeguarded Newton iteration on Phi to 1e-14 (closed form: Phi' = phi)
//   lognormal   exp of the normal above in ln x, with median -> ln median, log_sd
//   discrete    the first value whose cumulative probability reaches u
// An open end of the support is never returned: a draw on it moves one ulp inside.
// Percentiles: linear interpolation between order statistics, h = (n - 1) p (Hyndman & Fan
// 1996, The American Statistician 50:361-365, definition 7).
#pragma once

#include <cstddef>
#include <cstdint>
#include <vector>

#include "catalog-schema/variations_loader.h"

namespace stowage {

std::uint64_t splitmix64(std::uint64_t x);
// The uniform number in (0, 1) of sample `k`, input `j`.
double sample_uniform(std::uint64_t seed, std::uint64_t k, std::uint64_t j);
// The stratum of each sample for input j in a Latin hypercube of n samples: a permutation of
// 0..n-1.
std::vector<std::size_t> latin_strata(std::uint64_t seed, std::uint64_t j, std::size_t n);

// Standard normal CDF and its inverse; normal_quantile requires p in (0, 1).
double normal_cdf(double x);
double normal_quantile(double p);

// The value of `d` at cumulative probability u in (0, 1); ContractViolation otherwise.
double distribution_quantile(const Distribution& d, double u);

// Percentile p in [0, 1] of the values (definition 7 above); NaN for none.
double percentile(std::vector<double> values, double p);

struct SampleStatistics {
  double mean = 0;
  double standard_error = 0;  // sample standard deviation / sqrt(n); 0 for n < 2
  double p10 = 0, p50 = 0, p90 = 0;
};
SampleStatistics sample_statistics(const std::vector<double>& values);

}  // namespace stowage
