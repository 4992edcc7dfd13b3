// SPDX-License-Identifier: MIT
// Uncertainty (Monte Carlo) over the variations that carry a distribution: sample k draws each
// such input j at distribution_quantile(d_j, u_kj) with u_kj = sample_uniform(seed, k, j), or,
// with latin_hypercube, u_kj = (stratum_j(k) + sample_uniform(seed, k, j)) / N (sampling.h);
// the other variations stay at their study values. Inputs are drawn independently (no rank
// correlation). Each sample applies the draws to a copy of the base case in the order of the
// variations and evaluates the base case's best design of each profile exactly (held designs),
// or, with reoptimise, re-optimises the sample (scenario.h).
// Per profile (study order, those with a design):
//   npc, lcos: mean, standard error, P10 / P50 / P90 over the samples (sampling.h);
//   win_probability: share of samples in which this profile's design is the cheapest of
//     those meeting the unserved-energy limit (ties: profile order), with standard error
//     sqrt(p (1 - p) / N) (binomial, closed form);
//   expected_regret: mean of (its NPC - the sample's cheapest NPC), only over samples where it
//     meets the limit and some design does; samples where it breaks the limit are counted
//     in fails_limit.
// no_winner_probability: share of samples where no design meets the limit, so the win
// probabilities and it sum to 1. convergence: the win probability of the base winner and its
// standard error after N/8, N/4, N/2 and N samples (whole samples, in sample order).
// Identical for any thread count: every sample's numbers depend only on (seed, k).
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "catalog-schema/variations_loader.h"
#include "optimiser/analysis/sampling.h"
#include "optimiser/analysis/scenario.h"

namespace stowage {

struct UncertaintyOptions {
  std::size_t samples = 1000;  // >= 2
  std::uint64_t seed = 1;
  bool latin_hypercube = false;
  bool reoptimise = false;
  int threads = 0;
  OptimiseOptions optimise;
};

struct ProfileUncertainty {
  std::string profile_id;
  std::size_t samples = 0;  // samples with a design of this profile
  SampleStatistics npc, lcos;
  double win_probability = 0, win_probability_se = 0;
  double expected_regret = 0;
  std::size_t fails_limit = 0;
};

struct ConvergencePoint {
  std::size_t samples = 0;
  double win_probability = 0, standard_error = 0;
};

struct UncertaintyResult {
  std::vector<Variation> drawn;  // the variations with a distribution, in draw order
  std::size_t samples = 0;
  std::uint64_t seed = 0;
  bool latin_hypercube = false, reoptimise = false;
  std::string base_winner;  // profile id of the base case's winner; empty when none
  std::vector<ProfileUncertainty> profiles;
  double no_winner_probability = 0;
  std::vector<ConvergencePoint> convergence;
  // Per sample: the drawn values (order of `drawn`) and each profile's NPC (order of
  // `profiles`; NaN when that profile has no design in the sample).
  std::vector<std::vector<double>> values;
  std::vector<std::vector<double>> npc;
  std::vector<std::string> winners;  // per sample; empty when none meets the limit
};

// Throws InvalidValue("variations", ...) when no variation has a distribution, or when a
// drawn value is refused; ContractViolation for fewer than 2 samples.
UncertaintyResult run_uncertainty(const StudyCase& study, const std::vector<Variation>& variations,
                                  const UncertaintyOptions& options);

}  // namespace stowage
