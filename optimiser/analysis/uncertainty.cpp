// SPDX-License-Identifier: MIT
#include "optimiser/analysis/uncertainty.h"

#include <cmath>
#include <limits>
#include <memory>

#include "model/contract.h"
#include "model/invalid_value.h"
#include "optimiser/analysis/sweep.h"

namespace stowage {

namespace {

constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();

struct Tally {
  std::vector<double> npc, lcos;
  std::size_t wins = 0;
  double regret_sum = 0;
  std::size_t regret_count = 0;
};

double binomial_se(double p, std::size_t n) {
  return n == 0 ? kNaN : std::sqrt(p * (1 - p) / static_cast<double>(n));
}

// The index of the sample's cheapest profile meeting the limit (ties: profile order), or
// npos: the rule of rank_point() (scenario.h) on the sample's designs.
std::size_t winner_of(const SampleRecord& r) {
  std::size_t best = std::string::npos;
  for (std::size_t p = 0; p < r.profiles.size(); ++p) {
    const ProfileDraw& d = r.profiles[p];
    if (!d.present || !d.meets_unserved_limit) continue;
    if (best == std::string::npos || d.npc < r.profiles[best].npc) best = p;
  }
  return best;
}

}  // namespace

UncertaintySampler::UncertaintySampler(const StudyCase& study,
                                       const std::vector<Variation>& variations,
                                       const UncertaintyOptions& options)
    : study_(study), options_(options) {
  if (options.samples < 2) throw ContractViolation("samples", "must be at least 2");
  run_.drawn = drawn_variations(variations, "study.variations");
  run_.samples = options.samples;
  run_.seed = options.seed;
  run_.latin_hypercube = options.latin_hypercube;
  run_.reoptimise = options.reoptimise;
  for (const ChemistryProfile& p : study.profiles) run_.profile_ids.push_back(p.id);
  const PreparedRun prepared = prepare_run(study, !options.reoptimise, options.optimise);
  point_ = prepared.point;
  std::vector<std::string> paths;
  for (const Variation& v : run_.drawn) paths.push_back(v.path);
  if (!options.reoptimise && options.reprice_when_prices_only && prices_only(study, paths)) {
    point_.priced_from =
        std::make_shared<const std::vector<DesignResult>>(simulate_held(study, point_.held));
    run_.repriced = true;
  }
  if (prepared.base.feasible()) run_.base_winner = prepared.base.winner().profile_id;
  draws_ = draw_inputs(run_.drawn, options.seed, options.samples, options.latin_hypercube);
}

SampleRecord UncertaintySampler::sample(std::size_t k) const {
  SampleRecord r;
  std::vector<Setting> settings;
  for (std::size_t j = 0; j < run_.drawn.size(); ++j) {
    const double x = draws_[j][k];
    r.values.push_back(x);
    settings.push_back({run_.drawn[j].path, x});
  }
  const PointOutcome o = evaluate_point(with_settings(study_, settings), point_);
  for (const std::optional<DesignSummary>& d : o.by_profile) {
    ProfileDraw draw;
    if (d) draw = {true, d->npc, d->lcos_per_kwh, d->meets_unserved_limit};
    r.profiles.push_back(draw);
  }
  return r;
}

std::vector<SampleRecord> UncertaintySampler::samples(std::size_t first, std::size_t last) const {
  if (first > last || last > run_.samples) throw ContractViolation("last", "past the samples");
  std::vector<SampleRecord> out(last - first);
  parallel_for(
      out.size(), options_.threads, [&](std::size_t i) { out[i] = sample(first + i); },
      options_.progress);
  return out;
}

UncertaintyResult summarise_uncertainty(const UncertaintyRun& run,
                                        const std::vector<SampleRecord>& records) {
  const std::size_t n = run.samples;
  if (records.size() != n) throw ContractViolation("records", "one per sample");
  UncertaintyResult result;
  result.drawn = run.drawn;
  result.samples = n;
  result.seed = run.seed;
  result.latin_hypercube = run.latin_hypercube;
  result.reoptimise = run.reoptimise;
  result.base_winner = run.base_winner;

  // Profiles in study order that have a design in some sample.
  std::vector<std::size_t> profile_index;
  for (std::size_t p = 0; p < run.profile_ids.size(); ++p) {
    for (const SampleRecord& r : records) {
      if (r.profiles.at(p).present) {
        profile_index.push_back(p);
        break;
      }
    }
  }
  std::size_t no_winner = 0;
  std::vector<Tally> tally(profile_index.size());
  result.profiles.resize(profile_index.size());
  std::vector<std::size_t> base_wins_by(n, 0);
  std::size_t base_wins = 0;
  for (std::size_t k = 0; k < n; ++k) {
    const SampleRecord& r = records[k];
    result.values.push_back(r.values);
    std::vector<double> row;
    const std::size_t w = winner_of(r);
    const std::string winner = w == std::string::npos ? std::string() : run.profile_ids[w];
    result.winners.push_back(winner);
    if (winner.empty()) ++no_winner;
    if (!result.base_winner.empty() && winner == result.base_winner) ++base_wins;
    base_wins_by[k] = base_wins;
    for (std::size_t i = 0; i < profile_index.size(); ++i) {
      const ProfileDraw& d = r.profiles[profile_index[i]];
      ProfileUncertainty& pu = result.profiles[i];
      pu.profile_id = run.profile_ids[profile_index[i]];
      if (!d.present) {
        row.push_back(kNaN);
        continue;
      }
      row.push_back(d.npc);
      tally[i].npc.push_back(d.npc);
      tally[i].lcos.push_back(d.lcos_per_kwh);
      if (!d.meets_unserved_limit) {
        ++pu.fails_limit;
      } else if (!winner.empty()) {
        tally[i].regret_sum += d.npc - r.profiles[w].npc;
        ++tally[i].regret_count;
        if (winner == pu.profile_id) ++tally[i].wins;
      }
    }
    result.npc.push_back(std::move(row));
  }
  for (std::size_t i = 0; i < profile_index.size(); ++i) {
    ProfileUncertainty& pu = result.profiles[i];
    const Tally& t = tally[i];
    pu.samples = t.npc.size();
    pu.npc = sample_statistics(t.npc);
    pu.lcos = sample_statistics(t.lcos);
    pu.win_probability = static_cast<double>(t.wins) / static_cast<double>(n);
    pu.win_probability_se = binomial_se(pu.win_probability, n);
    pu.expected_regret =
        t.regret_count == 0 ? kNaN : t.regret_sum / static_cast<double>(t.regret_count);
  }
  result.no_winner_probability = static_cast<double>(no_winner) / static_cast<double>(n);
  if (!result.base_winner.empty()) {
    for (std::size_t m : {n / 8, n / 4, n / 2, n}) {
      if (m < 2 || (!result.convergence.empty() && result.convergence.back().samples == m)) {
        continue;
      }
      const double p = static_cast<double>(base_wins_by[m - 1]) / static_cast<double>(m);
      result.convergence.push_back({m, p, binomial_se(p, m)});
    }
  }
  return result;
}

UncertaintyResult run_uncertainty(const StudyCase& study, const std::vector<Variation>& variations,
                                  const UncertaintyOptions& options) {
  const UncertaintySampler sampler(study, variations, options);
  return summarise_uncertainty(sampler.run(), sampler.samples(0, options.samples));
}

}  // namespace stowage
