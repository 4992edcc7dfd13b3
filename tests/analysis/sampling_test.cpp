// SPDX-License-Identifier: MIT
// The sampling primitives: reproducible uniforms, the inverse CDFs, Latin hypercube strata and
// the percentile definition, against closed forms and standard normal table values.
#include "optimiser/analysis/sampling.h"

#include <catch2/catch.hpp>
#include <cmath>
#include <set>

#include "model/contract.h"

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
