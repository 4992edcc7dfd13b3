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
// Rank correlations (Iman & Conover 1982, "A distribution-free approach to inducing rank
// correlation among input variables", Communications in Statistics - Simulation and
// Computation 11(3):311-334): the inputs that take part in a non-zero target correlation
// (Variation::rank_correlations) are drawn as above, then re-ordered together:
//   1. scores: column c holds the van der Waerden scores Phi^-1(i / (N + 1)), i = 1..N, in a
//      permutation drawn by Fisher-Yates from a splitmix64 stream of (seed, j) distinct from
//      the Latin hypercube's (j the input's index among the drawn ones);
//   2. T = the scores' sample (Pearson) correlation, T = Q Q' and the target C = P P'
//      (Cholesky, lower); the transformed scores R* = R (P Q^-1)';
//   3. input j's draws, sorted, are handed out in the rank order of column j of R* (ties in
//      R* by sample index).
// Each input keeps exactly the values it drew (only their order changes), so Monte Carlo and
// Latin hypercube marginals are untouched; the achieved Spearman correlation is close to the
// target (within sampling error, about 1/sqrt(N)). Inputs without a non-zero correlation keep
// their order, so a run without correlations draws exactly as before.
// The reordering needs all N samples at once: draw_inputs() computes the whole N-sample matrix
// from (seed, N) alone, so every thread and every shard (each computes the full matrix and
// uses its slice) sees the same draws.
// Spearman: the Pearson correlation of the ranks, ties given their average rank (Spearman
// 1904; the definition scipy.stats.spearmanr uses).
// Percentiles: linear interpolation between order statistics, h = (n - 1) p (Hyndman & Fan
// 1996, The American Statistician 50:361-365, definition 7).
#pragma once

#include <cstddef>
#include <cstdint>
#include <string>
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

// The target rank-correlation matrix of `drawn` (every entry has a distribution), in their
// order: 1 on the diagonal, Variation::rank_correlations elsewhere, 0 for pairs not given.
std::vector<std::vector<double>> rank_correlation_target(const std::vector<Variation>& drawn);

// Re-orders the columns (columns[j] = input j's N draws) that have a non-zero entry in
// `target` (K x K, symmetric, positive definite) by Iman-Conover, as above. The others are
// returned unchanged. Throws InvalidValue("samples", ...) when the scores' correlation has no
// Cholesky factor (too few samples for the number of correlated inputs).
std::vector<std::vector<double>> iman_conover(std::vector<std::vector<double>> columns,
                                              const std::vector<std::vector<double>>& target,
                                              std::uint64_t seed);

// The variations of `block` ("study.variations", "tender.variations") that carry a
// distribution, in order; throws InvalidValue at `block` when none does (nothing to draw).
std::vector<Variation> drawn_variations(const std::vector<Variation>& variations,
                                        const std::string& block);

// Every input's draws for samples 0..n-1 (columns[j][k]: input j, sample k), Monte Carlo or
// Latin hypercube, re-ordered by Iman-Conover when `drawn` has rank correlations.
std::vector<std::vector<double>> draw_inputs(const std::vector<Variation>& drawn,
                                             std::uint64_t seed, std::size_t n,
                                             bool latin_hypercube);

// Spearman rank correlation of two equally long series (>= 2 values); NaN when one is
// constant.
double spearman_rank_correlation(const std::vector<double>& a, const std::vector<double>& b);

// Percentile p in [0, 1] of the values (definition 7 above); NaN for none.
double percentile(std::vector<double> values, double p);

struct SampleStatistics {
  double mean = 0;
  double standard_error = 0;  // sample standard deviation / sqrt(n); 0 for n < 2
  double p10 = 0, p50 = 0, p90 = 0;
};
SampleStatistics sample_statistics(const std::vector<double>& values);

}  // namespace stowage
