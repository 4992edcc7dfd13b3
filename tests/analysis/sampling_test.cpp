// SPDX-License-Identifier: MIT
// The sampling primitives: reproducible uniforms, the inverse CDFs, Latin hypercube strata and
// the percentile definition, against closed forms and standard normal table values.
#include "optimiser/analysis/sampling.h"

#include <algorithm>
#include <catch2/catch.hpp>
#include <cmath>
#include <set>

#include "model/contract.h"
#include "model/invalid_value.h"

using namespace stowage;

TEST_CASE("the normal quantile inverts the normal CDF", "[analysis][sampling]") {
  // Standard normal table values (Abramowitz & Stegun 1964, chapter 26), to 1e-9.
  CHECK(normal_quantile(0.975) == Approx(1.959963984540054).margin(1e-9));
  CHECK(normal_quantile(0.9) == Approx(1.2815515655446004).margin(1e-9));
  CHECK(normal_quantile(0.75) == Approx(0.6744897501960817).margin(1e-9));
  CHECK(normal_quantile(0.5) == Approx(0).margin(1e-12));
  CHECK(normal_quantile(0.025) == Approx(-1.959963984540054).margin(1e-9));
  for (double p : {1e-12, 1e-6, 0.01, 0.3, 0.5, 0.7, 0.99, 1 - 1e-9}) {
    INFO(p);
    CHECK(normal_cdf(normal_quantile(p)) == Approx(p).epsilon(1e-9));
  }
  CHECK_THROWS_AS(normal_quantile(0), ContractViolation);
  CHECK_THROWS_AS(normal_quantile(1), ContractViolation);
}

TEST_CASE("the inverse CDFs give the closed-form quantiles", "[analysis][sampling]") {
  Distribution uniform;
  uniform.kind = DistributionKind::Uniform;
  uniform.lower = 100;
  uniform.upper = 300;
  CHECK(distribution_quantile(uniform, 0.25) == Approx(150));  // closed form

  Distribution tri;
  tri.kind = DistributionKind::Triangular;
  tri.lower = 0;
  tri.upper = 4;
  tri.mode = 1;
  // Closed form: F(x) = x^2 / ((b - a)(c - a)) below the mode: F(1) = 1/4.
  CHECK(distribution_quantile(tri, 0.25) == Approx(1));
  // Above the mode 1 - F(x) = (b - x)^2 / ((b - a)(b - c)): F(2) = 1 - 4/12.
  CHECK(distribution_quantile(tri, 1 - 4.0 / 12) == Approx(2));

  // A normal truncated to [mean, inf) is a half-normal: median mean + sd Phi^-1(0.75)
  // (closed form; Phi^-1(0.75) from the table above).
  Distribution half;
  half.kind = DistributionKind::Normal;
  half.mean = 10;
  half.sd = 2;
  half.lower = 10;
  half.upper = 1e12;
  CHECK(distribution_quantile(half, 0.5) == Approx(10 + 2 * 0.6744897501960817).epsilon(1e-9));
  // Untruncated in practice: the 97.5 % point is mean + 1.96 sd.
  half.lower = -1e12;
  CHECK(distribution_quantile(half, 0.975) == Approx(10 + 2 * 1.959963984540054).epsilon(1e-9));

  Distribution logn;
  logn.kind = DistributionKind::Lognormal;
  logn.median = 50;
  logn.log_sd = 0.3;
  logn.lower = 0;
  logn.lower_open = true;
  logn.upper = 1e12;
  // Closed form: the quantile is median x exp(log_sd Phi^-1(u)).
  CHECK(distribution_quantile(logn, 0.5) == Approx(50).epsilon(1e-9));
  CHECK(distribution_quantile(logn, 0.9) ==
        Approx(50 * std::exp(0.3 * 1.2815515655446004)).epsilon(1e-9));

  Distribution discrete;
  discrete.kind = DistributionKind::Discrete;
  discrete.values = {-4, 0, 4};
  discrete.probabilities = {0.25, 0.5, 0.25};
  CHECK(distribution_quantile(discrete, 0.2) == -4);
  CHECK(distribution_quantile(discrete, 0.5) == 0);
  CHECK(distribution_quantile(discrete, 0.76) == 4);

  // An open end is never returned.
  Distribution open = uniform;
  open.lower = 0;
  open.lower_open = true;
  CHECK(distribution_quantile(open, 1e-300) > 0);
}

TEST_CASE("sample uniforms depend only on seed, sample and input", "[analysis][sampling]") {
  CHECK(sample_uniform(7, 3, 1) == sample_uniform(7, 3, 1));
  CHECK(sample_uniform(7, 3, 1) != sample_uniform(7, 3, 2));
  CHECK(sample_uniform(7, 3, 1) != sample_uniform(7, 4, 1));
  CHECK(sample_uniform(7, 3, 1) != sample_uniform(8, 3, 1));
  // 20,000 draws: mean 1/2 and variance 1/12 (closed form for U(0, 1)) within 5 standard
  // errors (the mean's: sqrt(1/12/n)).
  const int n = 20000;
  double sum = 0, squares = 0;
  for (int k = 0; k < n; ++k) {
    const double u = sample_uniform(42, k, 0);
    REQUIRE(u > 0);
    REQUIRE(u < 1);
    sum += u;
    squares += u * u;
  }
  const double mean = sum / n;
  CHECK(mean == Approx(0.5).margin(5 * std::sqrt(1.0 / 12 / n)));
  CHECK(squares / n - mean * mean == Approx(1.0 / 12).margin(0.003));
}

TEST_CASE("Latin hypercube strata are a permutation", "[analysis][sampling]") {
  const std::vector<std::size_t> s = latin_strata(5, 0, 1000);
  CHECK(std::set<std::size_t>(s.begin(), s.end()).size() == 1000);
  CHECK(*std::max_element(s.begin(), s.end()) == 999);
  CHECK(latin_strata(5, 0, 1000) == s);
  CHECK(latin_strata(5, 1, 1000) != s);
}

TEST_CASE("percentiles interpolate between order statistics", "[analysis][sampling]") {
  // Hyndman & Fan definition 7, worked by hand: h = (n - 1) p.
  const std::vector<double> x{5, 1, 4, 2, 3};  // sorted 1..5
  CHECK(percentile(x, 0.5) == 3);
  CHECK(percentile(x, 0.1) == Approx(1.4));  // h = 0.4
  CHECK(percentile(x, 0.9) == Approx(4.6));  // h = 3.6
  CHECK(percentile(x, 0) == 1);
  CHECK(percentile(x, 1) == 5);
  const SampleStatistics s = sample_statistics(x);
  CHECK(s.mean == 3);
  // Sample sd sqrt(2.5), standard error sqrt(2.5 / 5) (closed form).
  CHECK(s.standard_error == Approx(std::sqrt(0.5)));
}

namespace {

Variation drawn_input(const std::string& path, DistributionKind kind, double lower, double upper) {
  Variation v;
  v.path = v.label = path;
  v.low = lower;
  v.high = upper;
  Distribution d;
  d.kind = kind;
  d.lower = lower;
  d.upper = upper;
  d.mode = 0.5 * (lower + upper);
  v.distribution = d;
  return v;
}

void correlate(std::vector<Variation>& v, std::size_t a, std::size_t b, double rho) {
  v[a].rank_correlations.push_back({v[b].path, rho});
  v[b].rank_correlations.push_back({v[a].path, rho});
}

std::vector<double> sorted(std::vector<double> x) {
  std::sort(x.begin(), x.end());
  return x;
}

std::vector<Variation> three_inputs() {
  return {drawn_input("a", DistributionKind::Uniform, 100, 300),
          drawn_input("b", DistributionKind::Triangular, 0, 4),
          drawn_input("c", DistributionKind::Uniform, -5, 5)};
}

}  // namespace

TEST_CASE("Spearman's rank correlation matches scipy.stats.spearmanr, ties included",
          "[analysis][sampling][correlation]") {
  // Reference values from scipy.stats.spearmanr (SciPy 1.10.1), which ranks ties by their
  // average as here.
  const std::vector<double> x{1, 2, 3, 4, 5, 6, 7, 8};
  const std::vector<double> y{2, 1, 4, 3, 7, 8, 6, 5};
  CHECK(spearman_rank_correlation(x, y) == Approx(0.7380952380952381).epsilon(1e-12));
  const std::vector<double> t{1, 2, 2, 3, 5, 5, 5, 4};
  CHECK(spearman_rank_correlation(x, t) == Approx(0.8224729320348959).epsilon(1e-12));
  CHECK(spearman_rank_correlation(x, {8, 7, 6, 5, 4, 3, 2, 1}) == Approx(-1));  // closed form
  CHECK(std::isnan(spearman_rank_correlation(x, {1, 1, 1, 1, 1, 1, 1, 1})));
}

TEST_CASE("Iman-Conover meets the target rank correlations for 1000 samples",
          "[analysis][sampling][correlation]") {
  std::vector<Variation> v = three_inputs();
  correlate(v, 0, 1, 0.6);
  correlate(v, 0, 2, -0.3);
  for (bool latin : {false, true}) {
    INFO("latin hypercube " << latin);
    const auto x = draw_inputs(v, 11, 1000, latin);
    // Iman & Conover (1982), tables 2-4: for N = 100..1000 the achieved rank correlations lie
    // within a few hundredths of the target; sampling error of a correlation is about
    // 1/sqrt(N) = 0.03, hence 0.05.
    CHECK(spearman_rank_correlation(x[0], x[1]) == Approx(0.6).margin(0.05));
    CHECK(spearman_rank_correlation(x[0], x[2]) == Approx(-0.3).margin(0.05));
    CHECK(spearman_rank_correlation(x[1], x[2]) == Approx(0.0).margin(0.08));
  }
}

TEST_CASE("Iman-Conover only re-orders each input's draws", "[analysis][sampling][correlation]") {
  const std::vector<Variation> independent = three_inputs();
  std::vector<Variation> v = three_inputs();
  correlate(v, 0, 1, 0.8);
  for (bool latin : {false, true}) {
    INFO("latin hypercube " << latin);
    const auto plain = draw_inputs(independent, 3, 500, latin);
    const auto x = draw_inputs(v, 3, 500, latin);
    // The same marginal draws, in another order.
    CHECK(sorted(x[0]) == sorted(plain[0]));
    CHECK(sorted(x[1]) == sorted(plain[1]));
    CHECK(x[0] != plain[0]);
    // An input in no correlation keeps its order.
    CHECK(x[2] == plain[2]);
  }
}

TEST_CASE("without rank correlations the draws are the independent ones",
          "[analysis][sampling][correlation]") {
  std::vector<Variation> v = three_inputs();
  correlate(v, 0, 1, 0.0);  // a zero pair is no correlation
  const auto x = draw_inputs(v, 17, 50, false);
  for (std::size_t j = 0; j < v.size(); ++j) {
    for (std::size_t k = 0; k < 50; ++k) {
      CHECK(x[j][k] == distribution_quantile(*v[j].distribution, sample_uniform(17, k, j)));
    }
  }
  const std::vector<std::size_t> strata = latin_strata(17, 1, 50);
  const auto l = draw_inputs(v, 17, 50, true);
  for (std::size_t k = 0; k < 50; ++k) {
    const double u = (static_cast<double>(strata[k]) + sample_uniform(17, k, 1)) / 50;
    CHECK(l[1][k] == distribution_quantile(*v[1].distribution, u));
  }
}

TEST_CASE("Iman-Conover is deterministic and refuses too few samples",
          "[analysis][sampling][correlation]") {
  std::vector<Variation> v = three_inputs();
  correlate(v, 0, 1, 0.5);
  correlate(v, 1, 2, 0.5);
  CHECK(draw_inputs(v, 9, 200, true) == draw_inputs(v, 9, 200, true));
  CHECK(draw_inputs(v, 9, 200, true) != draw_inputs(v, 10, 200, true));
  // Two samples cannot carry three correlated inputs: the scores' correlation is singular.
  CHECK_THROWS_AS(draw_inputs(v, 9, 2, false), InvalidValue);
}
