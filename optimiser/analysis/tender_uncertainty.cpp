// SPDX-License-Identifier: MIT
#include "optimiser/analysis/tender_uncertainty.h"

#include <cmath>

#include "catalog-schema/parameter_paths.h"
#include "model/contract.h"
#include "model/invalid_value.h"

namespace stowage {

namespace {

double binomial_se(double p, std::size_t n) {
  return std::sqrt(p * (1 - p) / static_cast<double>(n));
}

TenderSample sample_of(const TenderCase& tender, const std::vector<Variation>& drawn,
                       const std::vector<std::vector<double>>& draws, std::size_t k) {
  TenderSample s;
  TenderCase changed = tender;
  for (std::size_t j = 0; j < drawn.size(); ++j) {
    const double x = draws[j][k];
    s.values.push_back(x);
    apply_parameter(changed, drawn[j].path, x);
  }
  const TenderResult r = evaluate_tender(changed);
  for (const BidResult& b : r.bids) {
    s.npc.push_back(b.npc);
    s.lcos.push_back(b.lcos_per_kwh);
    s.compliant.push_back(b.compliant());
    s.total_score.push_back(b.compliant() ? b.total_score : 0.0);
    s.rank.push_back(b.rank);
  }
  return s;
}

}  // namespace

NearTieCall near_tie_rule(const std::vector<TenderSample>& samples, std::size_t leader,
                          std::size_t runner_up) {
  if (samples.empty()) throw ContractViolation("samples", "needs at least one sample");
  NearTieCall call;
  call.called = true;
  call.leader = leader;
  call.runner_up = runner_up;
  std::size_t at_least_as_good = 0;
  std::vector<double> margins;
  for (const TenderSample& s : samples) {
    const bool l = s.compliant.at(leader), r = s.compliant.at(runner_up);
    if (r && (!l || s.total_score[runner_up] >= s.total_score[leader])) ++at_least_as_good;
    if (l && r) margins.push_back(s.total_score[leader] - s.total_score[runner_up]);
  }
  const std::size_t n = samples.size();
  call.runner_up_share = static_cast<double>(at_least_as_good) / static_cast<double>(n);
  call.runner_up_share_se = binomial_se(call.runner_up_share, n);
  call.margin_samples = margins.size();
  if (!margins.empty()) {
    call.margin_p10 = percentile(margins, 0.10);
    call.margin_p50 = percentile(margins, 0.50);
    call.margin_p90 = percentile(margins, 0.90);
  }
  call.near_tie =
      call.runner_up_share + kNearTieStandardErrors * call.runner_up_share_se >= kNearTieShare;
  return call;
}

TenderUncertainty run_tender_uncertainty(const TenderCase& tender, const TenderResult& base,
                                         const TenderUncertaintyOptions& options) {
  if (options.samples < 2) throw ContractViolation("samples", "must be at least 2");
  TenderUncertainty out;
  out.drawn = drawn_variations(tender.variations, "tender.variations");
  out.samples = options.samples;
  out.seed = options.seed;
  out.records.resize(options.samples);
  const std::vector<std::vector<double>> draws =
      draw_inputs(out.drawn, options.seed, options.samples, false);
  parallel_for(
      options.samples, options.threads,
      [&](std::size_t k) { out.records[k] = sample_of(tender, out.drawn, draws, k); },
      options.progress);

  const std::size_t n = options.samples;
  std::size_t no_winner = 0;
  for (const TenderSample& s : out.records) {
    bool any = false;
    for (int rank : s.rank) any = any || rank == 1;
    if (!any) ++no_winner;
  }
  out.no_winner_probability = static_cast<double>(no_winner) / static_cast<double>(n);
  for (std::size_t i = 0; i < tender.bids.size(); ++i) {
    BidUncertainty b;
    b.label = tender.bids[i].label;
    std::vector<double> npc, lcos;
    std::size_t compliant = 0, wins = 0;
    for (const TenderSample& s : out.records) {
      npc.push_back(s.npc[i]);
      lcos.push_back(s.lcos[i]);
      compliant += s.compliant[i] ? 1 : 0;
      wins += s.rank[i] == 1 ? 1 : 0;
    }
    b.npc = sample_statistics(npc);
    b.lcos = sample_statistics(lcos);
    b.compliant_share = static_cast<double>(compliant) / static_cast<double>(n);
    b.win_probability = static_cast<double>(wins) / static_cast<double>(n);
    b.win_probability_se = binomial_se(b.win_probability, n);
    out.bids.push_back(b);
  }
  if (base.order.size() >= 2) out.tie = near_tie_rule(out.records, base.order[0], base.order[1]);
  return out;
}

}  // namespace stowage
