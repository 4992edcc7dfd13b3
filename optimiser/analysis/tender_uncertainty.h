// SPDX-License-Identifier: MIT
// How sure a tender's ranking is: the tender's variations that carry a distribution
// (TenderCase::variations, docs/tender.md "Variations") drawn as an uncertainty run draws
// them (uncertainty.h): sample k draws input j at distribution_quantile(d_j, u_kj),
// u_kj = sample_uniform(seed, k, j) (sampling.h), inputs independent unless the variations
// give rank correlations (then re-ordered over all N samples by Iman-Conover, draw_inputs in
// sampling.h); the draws are applied
// to a copy of the tender by its parameter paths (parameter_paths.h), in the order of the
// variations, and the whole tender is evaluated on the sample by evaluate_tender() (tender.h):
// every bid simulated, its warranty applied, checked against the requirements and scored,
// exactly as the deterministic run does. Every number of sample k depends only on (seed, k)
// (with rank correlations: on (seed, N, k)), so any thread count gives the same result.
//
// Per bid (tender order), over all N samples:
//   npc, lcos (ours): mean, standard error, P10 / P50 / P90 (sampling.h: Hyndman & Fan
//     definition 7), the bid's own figures whether or not it is compliant in the sample;
//   compliant_share: share of samples in which it meets the requirements;
//   win_probability p: share of samples in which it ranks first (best total score among the
//     compliant bids, ties in tender order, as evaluate_tender ranks), with standard error
//     sqrt(p (1 - p) / N) (binomial, closed form).
// no_winner_probability: share of samples in which no bid is compliant.
//
// Near-tie rule with variations (replaces the user's margins, which still apply without
// variations): L and R are the bids ranked first and second by the deterministic evaluation
// of the tender as given. q = share of samples in which R does at least as well as L: R is
// compliant and either L is not or R's total score >= L's; se_q = sqrt(q (1 - q) / N). The two
// are called a near tie when q + 2 se_q >= 0.10, that is when the samples cannot rule out, at
// about two standard errors, that the runner-up does at least as well as the leader in one
// sample in ten or more (our convention; near_tie_rule below). margin: P10 / P50 / P90 of
// L's total minus R's over the samples where both are compliant (empty when there are none).
#pragma once

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "catalog-schema/tender_loader.h"
#include "optimiser/analysis/parallel.h"
#include "optimiser/analysis/sampling.h"
#include "optimiser/analysis/tender.h"

namespace stowage {

struct TenderUncertaintyOptions {
  std::size_t samples = 1000;  // >= 2
  std::uint64_t seed = 1;
  int threads = 0;
  DoneCallback progress;  // after each sample (parallel.h); may be empty
};

// The threshold of the near-tie rule above: the share of samples, and the number of standard
// errors added to it.
constexpr double kNearTieShare = 0.10;
constexpr double kNearTieStandardErrors = 2.0;

struct BidUncertainty {
  std::string label;
  SampleStatistics npc, lcos;
  double compliant_share = 0;
  double win_probability = 0, win_probability_se = 0;
};

// One sample of the tender: each bid's NPC, LCOS, whether it is compliant, its total score
// (0 when not compliant) and its rank (0 when not ranked), in tender order.
struct TenderSample {
  std::vector<double> values;  // the drawn values, in the order of TenderUncertainty::drawn
  std::vector<double> npc, lcos;
  std::vector<bool> compliant;
  std::vector<double> total_score;
  std::vector<int> rank;
};

struct NearTieCall {
  bool called = false;                                    // needs a leader and a runner-up
  std::size_t leader = 0;                                 // index into the tender's bids
  std::size_t runner_up = 0;                              // index into the tender's bids
  double runner_up_share = 0;                             // q
  double runner_up_share_se = 0;                          // se_q
  std::size_t margin_samples = 0;                         // samples where both are compliant
  double margin_p10 = 0, margin_p50 = 0, margin_p90 = 0;  // points, L - R
  bool near_tie = false;
};

struct TenderUncertainty {
  std::vector<Variation> drawn;  // the variations with a distribution, in draw order
  std::size_t samples = 0;
  std::uint64_t seed = 0;
  std::vector<BidUncertainty> bids;  // tender order
  double no_winner_probability = 0;
  NearTieCall tie;
  std::vector<TenderSample> records;  // per sample, in sample order
};

// The near-tie rule above on given samples: `leader` and `runner_up` index the bids of each
// sample. Pure, so it can be checked on hand-built samples.
NearTieCall near_tie_rule(const std::vector<TenderSample>& samples, std::size_t leader,
                          std::size_t runner_up);

// Draws and evaluates the samples; `base` is evaluate_tender(tender). Throws
// InvalidValue("tender.variations", ...) when no variation has a distribution, InvalidValue
// naming the path when a drawn value is refused, what evaluate_tender throws on a sample, and
// ContractViolation for fewer than 2 samples.
TenderUncertainty run_tender_uncertainty(const TenderCase& tender, const TenderResult& base,
                                         const TenderUncertaintyOptions& options);

}  // namespace stowage
