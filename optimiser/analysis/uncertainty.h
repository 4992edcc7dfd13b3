// SPDX-License-Identifier: MIT
// Uncertainty (Monte Carlo) over the variations that carry a distribution: sample k draws each
// such input j at distribution_quantile(d_j, u_kj) with u_kj = sample_uniform(seed, k, j), or,
// with latin_hypercube, u_kj = (stratum_j(k) + sample_uniform(seed, k, j)) / N (sampling.h);
// the other variations stay at their study values. Inputs are drawn independently unless the
// variations give rank correlations, which the Iman-Conover reordering of the whole N-sample
// draw matrix meets (draw_inputs, sampling.h). Each sample applies the draws to a copy of the base
// case in the order of the variations and evaluates the base case's best design of each profile
// exactly (held designs), or, with reoptimise, re-optimises the sample (scenario.h). With held
// designs and only prices_only paths drawn, each sample re-prices the base case's simulated designs
// instead (scenario.h, model/repricing.h): the same numbers to rounding, far faster. Per profile
// (study order, those with a design):
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
// A run can be split (shards.h): an UncertaintySampler evaluates any slice of the samples and
// summarise_uncertainty() turns all of them, in sample order, into the result; run_uncertainty
// does exactly that in one go, so a merged run equals an unsharded one.
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "catalog-schema/variations_loader.h"
#include "optimiser/analysis/parallel.h"
#include "optimiser/analysis/sampling.h"
#include "optimiser/analysis/scenario.h"

namespace stowage {

struct UncertaintyOptions {
  std::size_t samples = 1000;  // >= 2
  std::uint64_t seed = 1;
  bool latin_hypercube = false;
  bool reoptimise = false;
  // Held designs, every drawn path prices_only (scenario.h): re-price the base case's
  // simulated designs instead of simulating each sample. false forces the simulation (the
  // bench times both).
  bool reprice_when_prices_only = true;
  int threads = 0;
  OptimiseOptions optimise;
  DoneCallback progress;  // after each sample (parallel.h); may be empty
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

// What every sample of a run shares, and what a summary needs besides the samples.
struct UncertaintyRun {
  std::vector<Variation> drawn;  // the variations with a distribution, in draw order
  std::size_t samples = 0;
  std::uint64_t seed = 0;
  bool latin_hypercube = false, reoptimise = false;
  std::string base_winner;               // empty when the base case has no feasible design
  std::vector<std::string> profile_ids;  // the study's, in study order
  bool repriced = false;  // the samples re-price the held designs (scenario.h), not simulate
};

// One sample: the drawn values (order of `drawn`) and each profile's design (study order).
struct ProfileDraw {
  bool present = false;  // the profile has a design in this sample
  double npc = 0, lcos_per_kwh = 0;
  bool meets_unserved_limit = true;
};
struct SampleRecord {
  std::vector<double> values;
  std::vector<ProfileDraw> profiles;
};

class UncertaintySampler {
 public:
  // Optimises the base case (held designs) and draws every input of all samples (a shard
  // draws the whole run, so its slice equals the unsharded run's). Throws as
  // run_uncertainty does.
  UncertaintySampler(const StudyCase& study, const std::vector<Variation>& variations,
                     const UncertaintyOptions& options);
  const UncertaintyRun& run() const { return run_; }
  // Samples [first, last), on options.threads threads; element i is sample first + i.
  std::vector<SampleRecord> samples(std::size_t first, std::size_t last) const;

 private:
  SampleRecord sample(std::size_t k) const;
  const StudyCase& study_;
  UncertaintyOptions options_;
  UncertaintyRun run_;
  PointOptions point_;
  std::vector<std::vector<double>> draws_;  // draws_[j][k]: input j, sample k (all samples)
};

// The result from every sample of the run, in sample order (records.size() == run.samples).
UncertaintyResult summarise_uncertainty(const UncertaintyRun& run,
                                        const std::vector<SampleRecord>& records);

// Throws InvalidValue("variations", ...) when no variation has a distribution, or when a
// drawn value is refused; ContractViolation for fewer than 2 samples.
UncertaintyResult run_uncertainty(const StudyCase& study, const std::vector<Variation>& variations,
                                  const UncertaintyOptions& options);

}  // namespace stowage
