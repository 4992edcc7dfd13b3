// SPDX-License-Identifier: MIT
// How sure a tender's ranking is: the near-tie rule on hand-built samples (a clear winner, a
// tie whose margin interval spans zero, the threshold's two sides, a leader that fails the
// requirements), and a sampled run whose variations have zero width equal to the
// deterministic evaluation exactly.
#include "optimiser/analysis/tender_uncertainty.h"

#include <catch2/catch.hpp>
#include <cmath>
#include <string>

#include "model/invalid_value.h"
#include "test_paths.h"

using namespace stowage;

namespace {

const std::string kTender =
    std::string(STOWAGE_SOURCE_DIR) + "/studies/pier-nine-tender/tender.yaml";

// A sample of two compliant bids with these total scores (bid 0 the leader).
TenderSample two_bids(double leader_total, double runner_up_total) {
  TenderSample s;
  s.npc = {1.0e6, 1.1e6};
  s.lcos = {0.2, 0.22};
  s.compliant = {true, true};
  s.total_score = {leader_total, runner_up_total};
  s.rank = leader_total >= runner_up_total ? std::vector<int>{1, 2} : std::vector<int>{2, 1};
  return s;
}

// n samples of which `runner_up_first` have the runner-up ahead by 2 points, the rest the
// leader ahead by 5.
std::vector<TenderSample> split(std::size_t n, std::size_t runner_up_first) {
  std::vector<TenderSample> samples;
  for (std::size_t k = 0; k < n; ++k) {
    samples.push_back(k < runner_up_first ? two_bids(88, 90) : two_bids(90, 85));
  }
  return samples;
}

// The normal-approximation standard error of a binomial proportion, sqrt(p (1 - p) / n)
// (common practice; e.g. the Wald interval of a proportion).
double proportion_se(double p, double n) { return std::sqrt(p * (1 - p) / n); }

Variation zero_width(const std::string& path, double value) {
  Variation v;
  v.path = path;
  v.label = path;
  v.low = v.base = v.high = value;
  Distribution d;
  d.kind = DistributionKind::Uniform;
  d.lower = d.upper = value;  // lower + u (upper - lower) = value for every u
  v.distribution = d;
  return v;
}

}  // namespace

TEST_CASE("a leader ahead in every sample is not a near tie", "[analysis][tender][ties]") {
  const NearTieCall call = near_tie_rule(split(50, 0), 0, 1);
  CHECK(call.called);
  CHECK(call.runner_up_share == 0);
  CHECK(call.runner_up_share_se == 0);
  CHECK_FALSE(call.near_tie);
  // Every margin is 90 - 85 = 5 points, so each percentile is 5.
  CHECK(call.margin_samples == 50);
  CHECK(call.margin_p10 == 5);
  CHECK(call.margin_p50 == 5);
  CHECK(call.margin_p90 == 5);
}

TEST_CASE("a runner-up ahead in three samples of ten is a near tie whose margin spans zero",
          "[analysis][tender][ties]") {
  const NearTieCall call = near_tie_rule(split(100, 30), 0, 1);
  CHECK(call.runner_up_share == Approx(0.30).epsilon(1e-15));
  // sqrt(0.3 x 0.7 / 100) = 0.0458258 (common practice, see proportion_se).
  CHECK(call.runner_up_share_se == Approx(0.04582575695).epsilon(1e-9));
  CHECK(call.runner_up_share_se == Approx(proportion_se(0.3, 100)).epsilon(1e-12));
  CHECK(call.near_tie);
  // 30 margins of -2 and 70 of +5: P10 at h = 99 x 0.1 = 9.9 lies among the -2s, P90 at
  // h = 89.1 among the +5s (Hyndman & Fan definition 7), so the interval spans zero.
  CHECK(call.margin_p10 == -2);
  CHECK(call.margin_p90 == 5);
  CHECK(call.margin_p10 < 0);
  CHECK(call.margin_p90 > 0);
}

TEST_CASE("the near-tie threshold is the share plus two standard errors reaching one in ten",
          "[analysis][tender][ties]") {
  // 5 of 100: 0.05 + 2 sqrt(0.05 x 0.95 / 100) = 0.05 + 2 x 0.021794 = 0.0936 < 0.10.
  const NearTieCall five = near_tie_rule(split(100, 5), 0, 1);
  CHECK(five.runner_up_share + 2 * five.runner_up_share_se == Approx(0.093589).epsilon(1e-5));
  CHECK_FALSE(five.near_tie);
  // 6 of 100: 0.06 + 2 sqrt(0.06 x 0.94 / 100) = 0.06 + 2 x 0.023749 = 0.1075 >= 0.10.
  const NearTieCall six = near_tie_rule(split(100, 6), 0, 1);
  CHECK(six.runner_up_share + 2 * six.runner_up_share_se == Approx(0.107497).epsilon(1e-5));
  CHECK(six.near_tie);
  // Equal totals count for the runner-up: it does at least as well.
  std::vector<TenderSample> level(10, two_bids(90, 90));
  CHECK(near_tie_rule(level, 0, 1).runner_up_share == 1);
}

TEST_CASE("a sample where the leader fails the requirements counts for a compliant runner-up",
          "[analysis][tender][ties]") {
  std::vector<TenderSample> samples = split(10, 0);
  for (std::size_t k = 0; k < 3; ++k) {
    samples[k].compliant[0] = false;
    samples[k].total_score[0] = 0;
    samples[k].rank = {0, 1};
  }
  const NearTieCall call = near_tie_rule(samples, 0, 1);
  CHECK(call.runner_up_share == Approx(0.3));
  CHECK(call.margin_samples == 7);  // the margin only where both are scored
  CHECK(call.near_tie);
}

TEST_CASE("a tender sampled over zero-width variations equals its deterministic evaluation",
          "[analysis][tender][ties]") {
  TenderCase tender = load_tender_file(kTender);
  REQUIRE(tender.bids.size() >= 2);
  tender.variations = {
      zero_width("economics.real_discount_rate", tender.economics.real_discount_rate),
      zero_width("bids." + tender.bids[0].label + ".ageing.calendar_life_years",
                 tender.bids[0].profile.calendar_life_years)};
  const TenderResult base = evaluate_tender(tender);
  REQUIRE(base.order.size() >= 2);
  TenderUncertaintyOptions options;
  options.samples = 3;
  options.threads = 1;
  const TenderUncertainty u = run_tender_uncertainty(tender, base, options);
  REQUIRE(u.records.size() == 3);
  for (const TenderSample& s : u.records) {
    for (std::size_t i = 0; i < base.bids.size(); ++i) {
      INFO("bid " << base.bids[i].label);
      CHECK(s.npc[i] == base.bids[i].npc);  // exactly: the same evaluation on the same inputs
      CHECK(s.lcos[i] == base.bids[i].lcos_per_kwh);
      CHECK(s.compliant[i] == base.bids[i].compliant());
      CHECK(s.rank[i] == base.bids[i].rank);
    }
  }
  for (std::size_t i = 0; i < base.bids.size(); ++i) {
    const BidUncertainty& b = u.bids[i];
    CHECK(b.npc.p10 == base.bids[i].npc);
    CHECK(b.npc.p50 == base.bids[i].npc);
    CHECK(b.npc.p90 == base.bids[i].npc);
    CHECK(b.lcos.p50 == base.bids[i].lcos_per_kwh);
    CHECK(b.win_probability == (base.bids[i].rank == 1 ? 1.0 : 0.0));
    CHECK(b.win_probability_se == 0);
  }
  REQUIRE(u.tie.called);
  CHECK(u.tie.leader == base.order[0]);
  CHECK(u.tie.runner_up == base.order[1]);
  const double margin = base.bids[base.order[0]].total_score - base.bids[base.order[1]].total_score;
  CHECK(u.tie.margin_p10 == margin);
  CHECK(u.tie.margin_p90 == margin);
  CHECK(u.tie.near_tie == (margin <= 0));
}

TEST_CASE("a sampled tender gives the same numbers on one thread and on two",
          "[analysis][tender][ties]") {
  TenderCase tender = load_tender_file(kTender);
  Variation rate = zero_width("economics.real_discount_rate", 0.07);
  rate.low = 0.04;
  rate.high = 0.10;
  rate.distribution->lower = 0.04;
  rate.distribution->upper = 0.10;
  tender.variations = {rate};
  const TenderResult base = evaluate_tender(tender);
  TenderUncertaintyOptions options;
  options.samples = 4;
  options.threads = 1;
  const TenderUncertainty one = run_tender_uncertainty(tender, base, options);
  options.threads = 2;
  const TenderUncertainty two = run_tender_uncertainty(tender, base, options);
  for (std::size_t k = 0; k < 4; ++k) {
    CHECK(one.records[k].values == two.records[k].values);
    CHECK(one.records[k].npc == two.records[k].npc);
  }
  // A higher discount rate lowers the present value of the later costs: the sample with the
  // highest rate has the lowest NPC of every bid (economics: present value falls with rate).
  std::size_t high = 0, low = 0;
  for (std::size_t k = 0; k < 4; ++k) {
    if (one.records[k].values[0] > one.records[high].values[0]) high = k;
    if (one.records[k].values[0] < one.records[low].values[0]) low = k;
  }
  REQUIRE(high != low);
  for (std::size_t i = 0; i < base.bids.size(); ++i) {
    CHECK(one.records[high].npc[i] < one.records[low].npc[i]);
  }
}

TEST_CASE("a tender whose variations carry no distribution has nothing to sample",
          "[analysis][tender][ties]") {
  TenderCase tender = load_tender_file(kTender);
  Variation rate = zero_width("economics.real_discount_rate", 0.07);
  rate.distribution.reset();
  tender.variations = {rate};
  const TenderResult base = evaluate_tender(tender);
  CHECK_THROWS_AS(run_tender_uncertainty(tender, base, TenderUncertaintyOptions{}), InvalidValue);
}

TEST_CASE("a tender's rank-correlated variations are drawn as an uncertainty run draws them",
          "[analysis][tender][correlation]") {
  TenderCase tender = load_tender_file(kTender);
  const auto ranged = [](const std::string& path, double low, double high) {
    Variation v = zero_width(path, low);
    v.high = high;
    v.distribution->upper = high;
    return v;
  };
  Variation rate = ranged("economics.real_discount_rate", 0.04, 0.10);
  Variation life = ranged("bids." + tender.bids[0].label + ".ageing.calendar_life_years", 12, 18);
  rate.rank_correlations = {{life.path, -0.8}};
  life.rank_correlations = {{rate.path, -0.8}};
  tender.variations = {rate, life};
  const TenderResult base = evaluate_tender(tender);
  TenderUncertaintyOptions options;
  options.samples = 30;
  options.seed = 6;
  options.threads = 2;
  const TenderUncertainty u = run_tender_uncertainty(tender, base, options);
  // The same draws as the sampling code gives for the whole run (sampling.h, draw_inputs).
  const std::vector<std::vector<double>> draws = draw_inputs(u.drawn, 6, 30, false);
  std::vector<double> a, b;
  for (std::size_t k = 0; k < 30; ++k) {
    CHECK(u.records[k].values == std::vector<double>{draws[0][k], draws[1][k]});
    a.push_back(u.records[k].values[0]);
    b.push_back(u.records[k].values[1]);
  }
  // A strong target on 30 samples: within 0.2 (sampling error about 1/sqrt(30) = 0.18, from
  // memory for a correlation this strong the error is smaller).
  CHECK(spearman_rank_correlation(a, b) == Approx(-0.8).margin(0.2));
}
