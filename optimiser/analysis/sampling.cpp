// SPDX-License-Identifier: MIT
#include "optimiser/analysis/sampling.h"

#include <algorithm>
#include <cmath>
#include <limits>
#include <numeric>

#include "model/contract.h"

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
