// SPDX-License-Identifier: MIT
// Monte Carlo against a case with a known answer: with designs held, sodium-ion's NPC is
// linear in its capital price (see breakeven_test.cpp), so with the price uniform on
// [200, 400] EUR/kWh its NPC is uniform too: percentiles, mean, the probability it beats LFP
// (whose NPC does not move) and the expected regrets follow in closed form. Checked within the
// sampling error; the results must not depend on the thread count.
#include "optimiser/analysis/uncertainty.h"

#include <catch2/catch.hpp>
#include <cmath>

#include "analysis_fixtures.h"
#include "catalog-schema/parameter_paths.h"
#include "model/contract.h"
#include "model/invalid_value.h"

using namespace stowage;

namespace {

const std::string kPrice = "profiles.sodium-ion.costs.capital_per_kwh";
constexpr double kLow = 200, kHigh = 400;

Variation uniform_price(const StudyCase& study) {
  Variation v;
  v.path = v.label = kPrice;
  v.unit = find_parameter(study, kPrice).unit;
  v.low = kLow;
  v.high = kHigh;
  v.base = 300;
  Distribution d;
  d.kind = DistributionKind::Uniform;
  d.lower = kLow;
  d.upper = kHigh;
  v.distribution = d;
  return v;
}

struct Line {
  double a = 0, b = 0;  // sodium-ion NPC = a + b x
  double lfp = 0;       // LFP's NPC
  double at(double x) const { return a + b * x; }
};

Line exact_line(const StudyCase& study) {
  const OptimiseResult base = optimise(study);
  const DesignResult* sodium = nullptr;
  Line line;
  for (const DesignResult& d : base.ranking) {
    if (d.profile_id == "sodium-ion") sodium = &d;
    if (d.profile_id == "lfp") line.lfp = d.npc;
  }
  REQUIRE(sodium);
  const auto npc_at = [&](double x) {
    StudyCase copy = study;
    apply_parameter(copy, kPrice, x);
    const std::size_t p = *copy.find_profile("sodium-ion");
    LifecycleEvaluator evaluator(copy.profiles[p], copy.site, copy.economics);
    return evaluator.evaluate(sodium->dod_setpoint, sodium->bank.strings_parallel).npc;
  };
  line.b = (npc_at(kHigh) - npc_at(kLow)) / (kHigh - kLow);
  line.a = npc_at(kLow) - line.b * kLow;
  return line;
}

const ProfileUncertainty& of(const UncertaintyResult& r, const std::string& id) {
  for (const ProfileUncertainty& p : r.profiles) {
    if (p.profile_id == id) return p;
  }
  FAIL("no profile " << id);
  throw;
}

}  // namespace

TEST_CASE("Monte Carlo percentiles of a uniformly priced design match the closed form",
          "[analysis][uncertainty]") {
  const StudyCase study = testing::three_profile_study();
  const Line line = exact_line(study);
  UncertaintyOptions options;
  options.samples = 400;
  options.seed = 11;
  options.threads = 2;
  const UncertaintyResult r = run_uncertainty(study, {uniform_price(study)}, options);
  const ProfileUncertainty& sodium = of(r, "sodium-ion");
  const double n = static_cast<double>(options.samples);
  for (double p : {0.1, 0.5, 0.9}) {
    // Closed form: the p-quantile of a + b U(200, 400); its sampling standard error is
    // b (400 - 200) sqrt(p (1 - p) / n) (asymptotic order-statistic variance).
    const double expected = line.at(kLow + p * (kHigh - kLow));
    const double se = line.b * (kHigh - kLow) * std::sqrt(p * (1 - p) / n);
    const double got = p == 0.1 ? sodium.npc.p10 : p == 0.5 ? sodium.npc.p50 : sodium.npc.p90;
    INFO("p " << p);
    CHECK(got == Approx(expected).margin(4 * se));
  }
  // Mean a + b 300, standard deviation b 200 / sqrt(12) (closed form).
  const double sd = line.b * (kHigh - kLow) / std::sqrt(12.0);
  CHECK(sodium.npc.mean == Approx(line.at(300)).margin(4 * sd / std::sqrt(n)));
  CHECK(sodium.npc.standard_error == Approx(sd / std::sqrt(n)).epsilon(0.15));
  // P(sodium-ion cheapest) = (c - 200) / 200 with c the price where it ties LFP (closed form),
  // within 4 binomial standard errors.
  const double c = (line.lfp - line.a) / line.b;
  REQUIRE(c > kLow);
  REQUIRE(c < kHigh);
  const double p_win = (c - kLow) / (kHigh - kLow);
  CHECK(sodium.win_probability == Approx(p_win).margin(4 * std::sqrt(p_win * (1 - p_win) / n)));
  CHECK(sodium.win_probability_se ==
        Approx(std::sqrt(sodium.win_probability * (1 - sodium.win_probability) / n)));
  // Expected regret of LFP: E[(lfp - a - b x)+] = b (c - 200)^2 / (2 x 200) (closed form);
  // margin 4 sqrt(E[R^2] / n) with E[R^2] = b^2 (c - 200)^3 / (3 x 200).
  const ProfileUncertainty& lfp = of(r, "lfp");
  const double regret = line.b * (c - kLow) * (c - kLow) / (2 * (kHigh - kLow));
  const double second = line.b * line.b * std::pow(c - kLow, 3) / (3 * (kHigh - kLow));
  CHECK(lfp.expected_regret == Approx(regret).margin(4 * std::sqrt(second / n)));
  // LFP's NPC does not move: every percentile is its base NPC.
  CHECK(lfp.npc.p10 == line.lfp);
  CHECK(lfp.npc.p90 == line.lfp);

  double total = r.no_winner_probability;
  for (const ProfileUncertainty& p : r.profiles) total += p.win_probability;
  CHECK(total == Approx(1).margin(1e-12));
  REQUIRE_FALSE(r.convergence.empty());
  CHECK(r.convergence.back().samples == options.samples);
}

TEST_CASE("a Latin hypercube puts each percentile within one stratum of the closed form",
          "[analysis][uncertainty]") {
  const StudyCase study = testing::three_profile_study();
  const Line line = exact_line(study);
  UncertaintyOptions options;
  options.samples = 200;
  options.seed = 3;
  options.latin_hypercube = true;
  options.threads = 2;
  const UncertaintyResult r = run_uncertainty(study, {uniform_price(study)}, options);
  const ProfileUncertainty& sodium = of(r, "sodium-ion");
  // One draw per stratum of width 200 / n: the sorted draws sit in their strata, so each
  // interpolated percentile is within two stratum widths of the closed form.
  const double stratum = line.b * (kHigh - kLow) / static_cast<double>(options.samples);
  CHECK(sodium.npc.p10 == Approx(line.at(kLow + 0.1 * (kHigh - kLow))).margin(2 * stratum));
  CHECK(sodium.npc.p50 == Approx(line.at(kLow + 0.5 * (kHigh - kLow))).margin(2 * stratum));
  CHECK(sodium.npc.p90 == Approx(line.at(kLow + 0.9 * (kHigh - kLow))).margin(2 * stratum));
}

TEST_CASE("uncertainty results are identical for any thread count", "[analysis][uncertainty]") {
  const StudyCase study = testing::three_profile_study();
  Variation offset;
  offset.path = offset.label = "site.hourly.temp_c_offset";
  offset.low = -5;
  offset.high = 5;
  Distribution d;
  d.kind = DistributionKind::Normal;
  d.mean = 0;
  d.sd = 2;
  d.lower = -50;
  d.upper = 50;
  offset.distribution = d;
  UncertaintyOptions options;
  options.samples = 24;
  options.seed = 99;
  options.threads = 1;
  const UncertaintyResult one = run_uncertainty(study, {uniform_price(study), offset}, options);
  options.threads = 2;
  const UncertaintyResult two = run_uncertainty(study, {uniform_price(study), offset}, options);
  options.threads = 5;
  const UncertaintyResult five = run_uncertainty(study, {uniform_price(study), offset}, options);
  CHECK(one.values == two.values);
  CHECK(one.npc == two.npc);
  CHECK(one.winners == two.winners);
  CHECK(one.values == five.values);
  CHECK(one.npc == five.npc);
  options.seed = 100;
  const UncertaintyResult other = run_uncertainty(study, {uniform_price(study), offset}, options);
  CHECK(other.values != one.values);
  // Nothing to draw is bad input.
  Variation plain = offset;
  plain.distribution.reset();
  CHECK_THROWS_AS(run_uncertainty(study, {plain}, options), InvalidValue);
}

TEST_CASE("samples evaluated in slices summarise to the unsliced result",
          "[analysis][uncertainty]") {
  // The split that shards rely on: any partition of the samples, joined in sample order,
  // must give exactly the one-go result (each sample depends only on seed and index).
  const StudyCase study = testing::three_profile_study();
  UncertaintyOptions options;
  options.samples = 16;
  options.seed = 7;
  options.latin_hypercube = true;
  options.threads = 2;
  const std::vector<Variation> vars{uniform_price(study)};
  const UncertaintyResult whole = run_uncertainty(study, vars, options);
  const UncertaintySampler sampler(study, vars, options);
  std::vector<SampleRecord> records = sampler.samples(0, 5);
  for (SampleRecord& r : sampler.samples(5, 16)) records.push_back(std::move(r));
  const UncertaintyResult joined = summarise_uncertainty(sampler.run(), records);
  CHECK(joined.values == whole.values);
  CHECK(joined.npc == whole.npc);
  CHECK(joined.winners == whole.winners);
  REQUIRE(joined.profiles.size() == whole.profiles.size());
  for (std::size_t i = 0; i < whole.profiles.size(); ++i) {
    CHECK(joined.profiles[i].npc.p50 == whole.profiles[i].npc.p50);
    CHECK(joined.profiles[i].win_probability == whole.profiles[i].win_probability);
    CHECK(joined.profiles[i].expected_regret == whole.profiles[i].expected_regret);
  }
  CHECK_THROWS_AS(sampler.samples(10, 17), ContractViolation);
}

TEST_CASE("rank-correlated samples are identical for any thread count and any slicing",
          "[analysis][uncertainty][correlation]") {
  // The Iman-Conover reordering needs all samples: every sampler draws the whole matrix, so
  // threads and slices (shards) see the same draws.
  const StudyCase study = testing::three_profile_study();
  Variation price = uniform_price(study);
  Variation offset;
  offset.path = offset.label = "site.hourly.temp_c_offset";
  offset.low = -5;
  offset.high = 5;
  Distribution d;
  d.kind = DistributionKind::Uniform;
  d.lower = -5;
  d.upper = 5;
  offset.distribution = d;
  price.rank_correlations = {{offset.path, 0.7}};
  offset.rank_correlations = {{price.path, 0.7}};
  const std::vector<Variation> vars{price, offset};
  UncertaintyOptions options;
  options.samples = 20;
  options.seed = 5;
  options.threads = 1;
  const UncertaintyResult one = run_uncertainty(study, vars, options);
  options.threads = 2;
  const UncertaintyResult two = run_uncertainty(study, vars, options);
  CHECK(one.values == two.values);
  CHECK(one.npc == two.npc);
  const UncertaintySampler sampler(study, vars, options);
  std::vector<SampleRecord> records = sampler.samples(0, 7);
  for (SampleRecord& r : sampler.samples(7, 20)) records.push_back(std::move(r));
  const UncertaintyResult joined = summarise_uncertainty(sampler.run(), records);
  CHECK(joined.values == one.values);
  CHECK(joined.npc == one.npc);
  // The correlation is in the drawn values: the draws differ from the independent run's, and
  // rank together (a strong target on 20 samples; Iman & Conover 1982 table values reach
  // the target within about 0.1 at such sizes, from memory).
  Variation plain_offset = offset;
  plain_offset.rank_correlations.clear();
  const UncertaintyResult independent =
      run_uncertainty(study, {uniform_price(study), plain_offset}, options);
  CHECK(independent.values != one.values);
  std::vector<double> a, b;
  for (const std::vector<double>& row : one.values) {
    a.push_back(row[0]);
    b.push_back(row[1]);
  }
  CHECK(spearman_rank_correlation(a, b) == Approx(0.7).margin(0.2));
}
