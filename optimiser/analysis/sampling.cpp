// SPDX-License-Identifier: MIT
#include "optimiser/analysis/sampling.h"

#include <Eigen/Cholesky>
#include <Eigen/Core>
#include <algorithm>
#include <cmath>
#include <limits>
#include <numeric>

#include "model/contract.h"
#include "model/invalid_value.h"

namespace stowage {

std::uint64_t splitmix64(std::uint64_t x) {
  x += 0x9E3779B97F4A7C15ULL;
  x = (x ^ (x >> 30)) * 0xBF58476D1CE4E5B9ULL;
  x = (x ^ (x >> 27)) * 0x94D049BB133111EBULL;
  return x ^ (x >> 31);
}

namespace {

double to_open_unit(std::uint64_t bits) {
  // 53 bits, centred in their cell: never 0, never 1.
  return (static_cast<double>(bits >> 11) + 0.5) * 0x1.0p-53;
}

constexpr double kSqrt2 = 1.41421356237309504880;
constexpr double kSqrt2Pi = 2.50662827463100050242;

}  // namespace

double sample_uniform(std::uint64_t seed, std::uint64_t k, std::uint64_t j) {
  std::uint64_t h = splitmix64(seed);
  h = splitmix64(h ^ splitmix64(k));
  h = splitmix64(h ^ splitmix64(~j));
  return to_open_unit(h);
}

std::vector<std::size_t> latin_strata(std::uint64_t seed, std::uint64_t j, std::size_t n) {
  std::vector<std::size_t> strata(n);
  std::iota(strata.begin(), strata.end(), std::size_t{0});
  std::uint64_t state = splitmix64(splitmix64(seed ^ 0x4C48535452415441ULL) ^ splitmix64(j));
  for (std::size_t i = n; i > 1; --i) {
    state = splitmix64(state);
    // The modulo bias is below i / 2^64: far below anything a sample statistic can show.
    const auto pick = static_cast<std::size_t>(state % i);
    std::swap(strata[i - 1], strata[pick]);
  }
  return strata;
}

double normal_cdf(double x) { return 0.5 * std::erfc(-x / kSqrt2); }

double normal_quantile(double p) {
  if (!(p > 0 && p < 1)) throw ContractViolation("p", "must lie in (0, 1)");
  // Solve in the lower half, where erfc keeps its relative precision, and mirror.
  const bool upper = p > 0.5;
  const double q = upper ? 1 - p : p;
  double lo = -40, hi = 0;
  double x = -std::sqrt(-2 * std::log(q));  // a tail-side start; the bracket keeps it safe
  x = std::max(lo, std::min(hi, x));
  for (int i = 0; i < 200; ++i) {
    const double f = normal_cdf(x) - q;
    if (f == 0) break;
    if (f < 0) {
      lo = x;
    } else {
      hi = x;
    }
    const double density = std::exp(-0.5 * x * x) / kSqrt2Pi;
    double next = density > 0 ? x - f / density : 0.5 * (lo + hi);
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (std::fabs(next - x) <= 1e-14 * std::max(1.0, std::fabs(x))) {
      x = next;
      break;
    }
    x = next;
  }
  return upper ? -x : x;
}

namespace {

double inside(const Distribution& d, double x) {
  if (x <= d.lower) x = d.lower_open ? std::nextafter(d.lower, d.upper) : d.lower;
  if (x >= d.upper) x = d.upper_open ? std::nextafter(d.upper, d.lower) : d.upper;
  return x;
}

// Truncated normal quantile on [a, b] with mean m, sd s.
double truncated_normal(double m, double s, double a, double b, double u) {
  const double fa = normal_cdf((a - m) / s);
  const double fb = normal_cdf((b - m) / s);
  double p = fa + u * (fb - fa);
  p = std::min(std::max(p, std::numeric_limits<double>::min()), 1 - 0x1.0p-53);
  return m + s * normal_quantile(p);
}

}  // namespace

double distribution_quantile(const Distribution& d, double u) {
  if (!(u > 0 && u < 1)) throw ContractViolation("u", "must lie in (0, 1)");
  switch (d.kind) {
    case DistributionKind::Uniform:
      return inside(d, d.lower + u * (d.upper - d.lower));
    case DistributionKind::Triangular: {
      const double a = d.lower, b = d.upper, c = d.mode;
      const double split = (c - a) / (b - a);
      const double x = u < split ? a + std::sqrt(u * (b - a) * (c - a))
                                 : b - std::sqrt((1 - u) * (b - a) * (b - c));
      return inside(d, x);
    }
    case DistributionKind::Normal:
      return inside(d, truncated_normal(d.mean, d.sd, d.lower, d.upper, u));
    case DistributionKind::Lognormal: {
      const double lo = d.lower > 0 ? std::log(d.lower) : -std::numeric_limits<double>::infinity();
      const double hi = std::log(d.upper);
      return inside(d, std::exp(truncated_normal(std::log(d.median), d.log_sd, lo, hi, u)));
    }
    case DistributionKind::Discrete: {
      double cumulative = 0;
      for (std::size_t i = 0; i < d.values.size(); ++i) {
        cumulative += d.probabilities[i];
        if (u <= cumulative) return d.values[i];
      }
      return d.values.back();  // rounding left the sum a hair below 1
    }
  }
  throw ContractViolation("distribution.kind", "unknown kind");
}

std::vector<std::vector<double>> rank_correlation_target(const std::vector<Variation>& drawn) {
  const std::size_t k = drawn.size();
  std::vector<std::vector<double>> c(k, std::vector<double>(k, 0.0));
  for (std::size_t a = 0; a < k; ++a) {
    c[a][a] = 1;
    for (const RankCorrelation& r : drawn[a].rank_correlations) {
      for (std::size_t b = 0; b < k; ++b) {
        if (b == a || drawn[b].path != r.with) continue;
        // Either side may carry the pair (the loader stores both); both must agree.
        if ((c[a][b] != 0 && c[a][b] != r.rho) || (c[b][a] != 0 && c[b][a] != r.rho)) {
          throw ContractViolation("rank_correlations", "the two sides of a pair disagree");
        }
        c[a][b] = c[b][a] = r.rho;
      }
    }
  }
  return c;
}

std::vector<std::vector<double>> iman_conover(std::vector<std::vector<double>> columns,
                                              const std::vector<std::vector<double>>& target,
                                              std::uint64_t seed) {
  const std::size_t k = columns.size();
  if (target.size() != k) throw ContractViolation("target", "one row per column");
  std::vector<std::size_t> chosen;
  for (std::size_t a = 0; a < k; ++a) {
    if (target[a].size() != k) throw ContractViolation("target", "must be square");
    for (std::size_t b = 0; b < k; ++b) {
      if (a != b && target[a][b] != 0) {
        chosen.push_back(a);
        break;
      }
    }
  }
  if (chosen.empty()) return columns;
  const std::size_t n = columns[chosen.front()].size();
  for (std::size_t j : chosen) {
    if (columns[j].size() != n) throw ContractViolation("columns", "equally long");
  }
  using Eigen::Index;
  const auto m = static_cast<Index>(chosen.size());
  Eigen::MatrixXd c(m, m);
  for (Index a = 0; a < m; ++a) {
    for (Index b = 0; b < m; ++b) c(a, b) = target[chosen[a]][chosen[b]];
  }
  const Eigen::LLT<Eigen::MatrixXd> target_llt(c);
  if (target_llt.info() != Eigen::Success) {
    throw ContractViolation("target", "must be positive definite (the loader checks it)");
  }
  // 1. Scores, each column in its own permutation.
  std::vector<double> scores(n);
  for (std::size_t i = 0; i < n; ++i) {
    scores[i] = normal_quantile(static_cast<double>(i + 1) / static_cast<double>(n + 1));
  }
  const std::uint64_t stream = splitmix64(seed ^ 0x494D414E434F4E56ULL);
  Eigen::MatrixXd r(static_cast<Index>(n), m);
  for (Index a = 0; a < m; ++a) {
    const std::vector<std::size_t> order = latin_strata(stream, chosen[a], n);
    for (std::size_t i = 0; i < n; ++i) r(static_cast<Index>(i), a) = scores[order[i]];
  }
  // 2. The scores' sample correlation and its factor.
  const Eigen::RowVectorXd mean = r.colwise().mean();
  const Eigen::MatrixXd centred = r.rowwise() - mean;
  Eigen::MatrixXd t = centred.transpose() * centred;
  const Eigen::VectorXd sd = t.diagonal().cwiseSqrt();
  for (Index a = 0; a < m; ++a) {
    for (Index b = 0; b < m; ++b) t(a, b) /= sd(a) * sd(b);
  }
  const Eigen::LLT<Eigen::MatrixXd> scores_llt(t);
  if (n < 2 || scores_llt.info() != Eigen::Success) {
    throw InvalidValue("samples", std::to_string(n) + " samples are too few to correlate " +
                                      std::to_string(chosen.size()) +
                                      " inputs by rank; draw more samples");
  }
  const Eigen::MatrixXd p = target_llt.matrixL();
  const Eigen::MatrixXd q = scores_llt.matrixL();
  // R* = R (P Q^-1)'; (P Q^-1)' = Q'^-1 P', one triangular solve.
  const Eigen::MatrixXd s = q.transpose().triangularView<Eigen::Upper>().solve(p.transpose());
  const Eigen::MatrixXd transformed = r * s;
  // 3. Each chosen input's sorted draws in the rank order of its transformed scores.
  for (Index a = 0; a < m; ++a) {
    std::vector<double>& x = columns[chosen[a]];
    std::vector<double> sorted = x;
    std::sort(sorted.begin(), sorted.end());
    std::vector<std::size_t> order(n);
    std::iota(order.begin(), order.end(), std::size_t{0});
    std::sort(order.begin(), order.end(), [&](std::size_t i, std::size_t j) {
      const double vi = transformed(static_cast<Index>(i), a);
      const double vj = transformed(static_cast<Index>(j), a);
      return vi < vj || (vi == vj && i < j);
    });
    for (std::size_t rank = 0; rank < n; ++rank) x[order[rank]] = sorted[rank];
  }
  return columns;
}

std::vector<Variation> drawn_variations(const std::vector<Variation>& variations,
                                        const std::string& block) {
  std::vector<Variation> drawn;
  for (const Variation& v : variations) {
    if (v.distribution) drawn.push_back(v);
  }
  if (drawn.empty()) {
    throw InvalidValue(block,
                       "no variation has a distribution, so there is nothing to draw; add a "
                       "distribution to an entry of " +
                           block);
  }
  return drawn;
}

std::vector<std::vector<double>> draw_inputs(const std::vector<Variation>& drawn,
                                             std::uint64_t seed, std::size_t n,
                                             bool latin_hypercube) {
  std::vector<std::vector<double>> columns(drawn.size(), std::vector<double>(n));
  for (std::size_t j = 0; j < drawn.size(); ++j) {
    if (!drawn[j].distribution) throw ContractViolation("drawn", "every entry has a distribution");
    std::vector<std::size_t> strata;
    if (latin_hypercube) strata = latin_strata(seed, j, n);
    for (std::size_t k = 0; k < n; ++k) {
      double u = sample_uniform(seed, k, j);
      if (latin_hypercube) u = (static_cast<double>(strata[k]) + u) / static_cast<double>(n);
      columns[j][k] = distribution_quantile(*drawn[j].distribution, u);
    }
  }
  return iman_conover(std::move(columns), rank_correlation_target(drawn), seed);
}

namespace {

// Ranks 1..n, ties their average.
std::vector<double> average_ranks(const std::vector<double>& x) {
  std::vector<std::size_t> order(x.size());
  std::iota(order.begin(), order.end(), std::size_t{0});
  std::sort(order.begin(), order.end(), [&](std::size_t i, std::size_t j) { return x[i] < x[j]; });
  std::vector<double> rank(x.size());
  for (std::size_t i = 0; i < order.size();) {
    std::size_t e = i;
    while (e + 1 < order.size() && x[order[e + 1]] == x[order[i]]) ++e;
    const double average = 0.5 * static_cast<double>(i + e) + 1;
    for (std::size_t t = i; t <= e; ++t) rank[order[t]] = average;
    i = e + 1;
  }
  return rank;
}

}  // namespace

double spearman_rank_correlation(const std::vector<double>& a, const std::vector<double>& b) {
  if (a.size() != b.size() || a.size() < 2) {
    throw ContractViolation("a, b", "two equally long series of at least 2 values");
  }
  const std::vector<double> ra = average_ranks(a), rb = average_ranks(b);
  const double mean = 0.5 * static_cast<double>(a.size() + 1);
  double sab = 0, saa = 0, sbb = 0;
  for (std::size_t i = 0; i < a.size(); ++i) {
    sab += (ra[i] - mean) * (rb[i] - mean);
    saa += (ra[i] - mean) * (ra[i] - mean);
    sbb += (rb[i] - mean) * (rb[i] - mean);
  }
  if (saa == 0 || sbb == 0) return std::numeric_limits<double>::quiet_NaN();
  return sab / std::sqrt(saa * sbb);
}

double percentile(std::vector<double> values, double p) {
  if (values.empty()) return std::numeric_limits<double>::quiet_NaN();
  std::sort(values.begin(), values.end());
  const double h = (static_cast<double>(values.size()) - 1) * p;
  const auto i = static_cast<std::size_t>(std::floor(h));
  if (i + 1 >= values.size()) return values.back();
  return values[i] + (h - static_cast<double>(i)) * (values[i + 1] - values[i]);
}

SampleStatistics sample_statistics(const std::vector<double>& values) {
  SampleStatistics s;
  const double n = static_cast<double>(values.size());
  if (values.empty()) {
    s.mean = s.standard_error = s.p10 = s.p50 = s.p90 = std::numeric_limits<double>::quiet_NaN();
    return s;
  }
  // Two passes: the mean, then squared deviations, so large offsets do not swamp the spread.
  double sum = 0;
  for (double x : values) sum += x;
  s.mean = sum / n;
  double squares = 0;
  for (double x : values) squares += (x - s.mean) * (x - s.mean);
  s.standard_error = values.size() < 2 ? 0 : std::sqrt(squares / (n - 1) / n);
  s.p10 = percentile(values, 0.10);
  s.p50 = percentile(values, 0.50);
  s.p90 = percentile(values, 0.90);
  return s;
}

}  // namespace stowage
