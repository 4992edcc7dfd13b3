// SPDX-License-Identifier: MIT
#include "optimiser/analysis/uncertainty.h"

#include <cmath>
#include <limits>

#include "model/contract.h"
#include "model/invalid_value.h"
#include "optimiser/analysis/parallel.h"
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

struct SampleRecord {
  std::vector<double> values;
  PointOutcome outcome;
};

double binomial_se(double p, std::size_t n) {
  return n == 0 ? kNaN : std::sqrt(p * (1 - p) / static_cast<double>(n));
}

}  // namespace

UncertaintyResult run_uncertainty(const StudyCase& study, const std::vector<Variation>& variations,
                                  const UncertaintyOptions& options) {
  if (options.samples < 2) throw ContractViolation("samples", "must be at least 2");
  UncertaintyResult result;
  for (const Variation& v : variations) {
    if (v.distribution) result.drawn.push_back(v);
  }
  if (result.drawn.empty()) {
    throw InvalidValue("variations",
                       "no variation has a distribution, so there is nothing to draw; add a "
                       "distribution to an entry of study.variations");
  }
  const std::size_t n = options.samples;
  result.samples = n;
  result.seed = options.seed;
  result.latin_hypercube = options.latin_hypercube;
  result.reoptimise = options.reoptimise;
  const PreparedRun run = prepare_run(study, !options.reoptimise, options.optimise);
  if (run.base.feasible()) result.base_winner = run.base.winner().profile_id;

  std::vector<std::vector<std::size_t>> strata;
  if (options.latin_hypercube) {
    for (std::size_t j = 0; j < result.drawn.size(); ++j) {
      strata.push_back(latin_strata(options.seed, j, n));
    }
  }
  std::vector<SampleRecord> records(n);
  parallel_for(n, options.threads, [&](std::size_t k) {
    SampleRecord& r = records[k];
    std::vector<Setting> settings;
    for (std::size_t j = 0; j < result.drawn.size(); ++j) {
      double u = sample_uniform(options.seed, k, j);
      if (options.latin_hypercube) u = (static_cast<double>(strata[j][k]) + u) / n;
      const double x = distribution_quantile(*result.drawn[j].distribution, u);
      r.values.push_back(x);
      settings.push_back({result.drawn[j].path, x});
    }
    r.outcome = evaluate_point(with_settings(study, settings), run.point);
  });

  // Profiles in study order that have a design in some sample.
  std::vector<std::size_t> profile_index;
  for (std::size_t p = 0; p < study.profiles.size(); ++p) {
    for (const SampleRecord& r : records) {
      if (r.outcome.by_profile[p]) {
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
    const PointOutcome& o = records[k].outcome;
    result.values.push_back(records[k].values);
    std::vector<double> row;
    const std::string winner = o.feasible() ? o.winner().profile_id : std::string();
    result.winners.push_back(winner);
    if (winner.empty()) ++no_winner;
    if (!result.base_winner.empty() && winner == result.base_winner) ++base_wins;
    base_wins_by[k] = base_wins;
    for (std::size_t i = 0; i < profile_index.size(); ++i) {
      const std::optional<DesignSummary>& d = o.by_profile[profile_index[i]];
      ProfileUncertainty& pu = result.profiles[i];
      pu.profile_id = study.profiles[profile_index[i]].id;
      if (!d) {
        row.push_back(kNaN);
        continue;
      }
      row.push_back(d->npc);
      tally[i].npc.push_back(d->npc);
      tally[i].lcos.push_back(d->lcos_per_kwh);
      if (!d->meets_unserved_limit) {
        ++pu.fails_limit;
      } else if (!winner.empty()) {
        tally[i].regret_sum += d->npc - o.winner().npc;
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

}  // namespace stowage
