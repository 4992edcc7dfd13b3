// SPDX-License-Identifier: MIT
#include "catalog-schema/variations_loader.h"

#include <Eigen/Cholesky>
#include <Eigen/Core>
#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <functional>
#include <limits>

#include "catalog-schema/decimal_text.h"
#include "catalog-schema/parameter_paths.h"
#include "model/invalid_value.h"

namespace stowage {

const char* to_string(DistributionKind kind) {
  switch (kind) {
    case DistributionKind::Uniform:
      return "uniform";
    case DistributionKind::Triangular:
      return "triangular";
    case DistributionKind::Normal:
      return "normal";
    case DistributionKind::Lognormal:
      return "lognormal";
    case DistributionKind::Discrete:
      return "discrete";
  }
  return "?";
}

namespace {

double number(const YAML::Node& node) { return *scalar_number(node); }

std::string not_set(const std::string& whole) {
  return "is not set in this " + whole + " (or varies hour by hour), so it has no single value " +
         "to vary; set it in the " + whole + " first";
}

// Why `value` cannot be applied to the case at `path`, or "" when it can. Applying to a copy
// runs exactly the checks a sweep point would run, cross-field rules included.
template <typename Case>
std::string refusal(const Case& whole, const std::string& path, double value) {
  Case copy = whole;
  try {
    apply_parameter(copy, path, value);
  } catch (const InvalidValue& e) {
    return e.field() == path ? e.rule() : e.field() + ": " + e.rule();
  }
  return "";
}

// What a reader needs of the case a block belongs to: a study or a tender, each with its own
// parameter paths (parameter_paths.h).
struct PathSpace {
  std::string whole;  // "study" or "tender": the name of the file's top-level key
  std::function<ParameterInfo(const std::string&)> find;
  std::function<std::string(const std::string&, double)> refusal;
};

template <typename Case>
PathSpace path_space(const Case& whole, const std::string& name) {
  return {name, [&whole](const std::string& path) { return find_parameter(whole, path); },
          [&whole](const std::string& path, double value) { return refusal(whole, path, value); }};
}

DistributionKind kind_from(const std::string& text) {
  if (text == "triangular") return DistributionKind::Triangular;
  if (text == "normal") return DistributionKind::Normal;
  if (text == "lognormal") return DistributionKind::Lognormal;
  if (text == "discrete") return DistributionKind::Discrete;
  return DistributionKind::Uniform;  // the schema admits nothing else
}

class Reader {
 public:
  Reader(const YamlDocument& doc, PathSpace space) : doc_(doc), space_(std::move(space)) {}

  Variation read(const YAML::Node& node, const std::string& field) {
    Variation v;
    const YAML::Node path_node = node["path"];
    v.path = path_node.Scalar();
    ParameterInfo info;
    try {
      info = space_.find(v.path);
    } catch (const InvalidValue& e) {
      throw doc_.error_at(path_node, field + ".path", "'" + v.path + "' " + e.rule());
    }
    if (!info.present) {
      throw doc_.error_at(path_node, field + ".path", "'" + v.path + "' " + not_set(space_.whole));
    }
    v.unit = info.unit;
    v.whole_number = info.whole_number;
    v.label = node["label"] ? node["label"].Scalar() : v.path;
    if (node["source"]) v.source = node["source"].Scalar();
    if (const YAML::Node unit = node["unit"]) {
      if (unit.Scalar() != info.unit) {
        throw doc_.error_at(unit, field + ".unit",
                            "the values of " + v.path + " are in " + info.unit + ", not " +
                                unit.Scalar() + "; convert them");
      }
    }
    const int forms =
        (node["low"] || node["high"] ? 1 : 0) + (node["values"] ? 1 : 0) + (node["range"] ? 1 : 0);
    if (forms != 1) {
      throw doc_.error_at(node, field,
                          forms == 0 ? "give low and high, values, or range"
                                     : "give only one of low/high, values and range");
    }
    if (node["low"] || node["high"]) {
      for (const char* key : {"low", "high"}) {
        if (!node[key]) throw doc_.error_at(node, field + "." + key, "is required with low/high");
      }
      v.low = checked(node["low"], field + ".low", v);
      v.high = checked(node["high"], field + ".high", v);
      if (!(v.low < v.high)) {
        throw doc_.error_at(
            node["high"], field + ".high",
            "must exceed low (" + number_text(v.low) + "), found " + number_text(v.high));
      }
    } else if (const YAML::Node values = node["values"]) {
      for (std::size_t i = 0; i < values.size(); ++i) {
        v.points.push_back(checked(values[i], join_index(field + ".values", i), v));
      }
      std::vector<double> sorted = v.points;
      std::sort(sorted.begin(), sorted.end());
      if (std::adjacent_find(sorted.begin(), sorted.end()) != sorted.end()) {
        throw doc_.error_at(values, field + ".values", "lists a value twice");
      }
      v.low = sorted.front();
      v.high = sorted.back();
    } else {
      const YAML::Node range = node["range"];
      const double from = checked(range["from"], field + ".range.from", v);
      const double to = checked(range["to"], field + ".range.to", v);
      const int steps = static_cast<int>(std::lround(number(range["steps"])));
      if (!(from < to)) {
        throw doc_.error_at(
            range["to"], field + ".range.to",
            "must exceed from (" + number_text(from) + "), found " + number_text(to));
      }
      for (int i = 0; i < steps; ++i) {
        const double x = i + 1 == steps ? to : from + (to - from) * i / (steps - 1);
        if (v.whole_number && x != std::floor(x)) {
          throw doc_.error_at(range["steps"], field + ".range.steps",
                              v.path + " takes whole numbers, but " + std::to_string(steps) +
                                  " steps from " + number_text(from) + " to " + number_text(to) +
                                  " give " + number_text(x));
        }
        v.points.push_back(x);
      }
      v.low = from;
      v.high = to;
    }
    if (const YAML::Node base = node["base"]) {
      v.base = checked(base, field + ".base", v);
    } else {
      v.base = info.base;
    }
    if (v.base < v.low || v.base > v.high) {
      const YAML::Node at = node["base"] ? node["base"] : node;
      throw doc_.error_at(at, field + ".base",
                          "base " + number_text(v.base) +
                              (node["base"] ? "" : " (the " + space_.whole + "'s value)") +
                              " must lie within [" + number_text(v.low) + ", " +
                              number_text(v.high) + "]");
    }
    if (const YAML::Node d = node["distribution"]) {
      v.distribution = distribution(d, field + ".distribution", v, info, node);
    }
    const YAML::Mark mark = node.Mark();
    v.at = {doc_.source(), mark.line + 1, mark.column + 1};
    return v;
  }

 private:
  double checked(const YAML::Node& node, const std::string& field, const Variation& v) {
    const double x = number(node);
    const std::string why = space_.refusal(v.path, x);
    if (!why.empty()) throw doc_.error_at(node, field, why);
    return x;
  }

  Distribution distribution(const YAML::Node& d, const std::string& field, const Variation& v,
                            const ParameterInfo& info, const YAML::Node& variation) {
    Distribution out;
    out.kind = kind_from(d["kind"].Scalar());
    const auto refuse_key = [&](const char* key, const char* kinds) {
      if (d[key]) {
        throw doc_.error_at(
            d[key], field + "." + key,
            std::string("applies to ") + kinds + " only, not " + to_string(out.kind));
      }
    };
    if (out.kind != DistributionKind::Triangular) refuse_key("mode", "triangular");
    if (out.kind != DistributionKind::Normal) {
      refuse_key("mean", "normal");
      refuse_key("sd", "normal");
    }
    if (out.kind != DistributionKind::Lognormal) {
      refuse_key("median", "lognormal");
      refuse_key("log_sd", "lognormal");
    }
    if (out.kind != DistributionKind::Discrete) refuse_key("weights", "discrete");
    if (v.whole_number && out.kind != DistributionKind::Discrete) {
      throw doc_.error_at(d["kind"], field + ".kind",
                          v.path + " takes whole numbers: use kind: discrete with values");
    }
    const auto require = [&](const char* key) {
      if (!d[key]) {
        throw doc_.error_at(
            d, field + "." + key,
            std::string("is required for a ") + to_string(out.kind) + " distribution");
      }
      return number(d[key]);
    };
    out.lower = v.low;
    out.upper = v.high;
    switch (out.kind) {
      case DistributionKind::Uniform:
        break;
      case DistributionKind::Triangular:
        out.mode = d["mode"] ? number(d["mode"]) : v.base;
        if (out.mode < v.low || out.mode > v.high) {
          throw doc_.error_at(d["mode"] ? d["mode"] : d, field + ".mode",
                              "mode " + number_text(out.mode) + " must lie within [" +
                                  number_text(v.low) + ", " + number_text(v.high) + "]");
        }
        break;
      case DistributionKind::Normal:
      case DistributionKind::Lognormal: {
        out.lower = info.min;
        out.upper = info.max;
        out.lower_open = !info.min_inclusive;
        out.upper_open = !info.max_inclusive;
        if (out.kind == DistributionKind::Normal) {
          out.sd = require("sd");
          out.mean = d["mean"] ? checked(d["mean"], field + ".mean", v) : v.base;
        } else {
          out.log_sd = require("log_sd");
          out.median = d["median"] ? checked(d["median"], field + ".median", v) : v.base;
          if (!(out.median > 0)) {
            throw doc_.error_at(d, field + ".median",
                                "a lognormal needs a median > 0, found " + number_text(out.median) +
                                    " (the base value)");
          }
          out.lower = std::max(out.lower, 0.0);
          out.lower_open = out.lower_open || out.lower == 0;
        }
        break;
      }
      case DistributionKind::Discrete: {
        const YAML::Node values = variation["values"];
        if (!values) {
          throw doc_.error_at(d["kind"], field + ".kind",
                              "a discrete distribution draws from values: give values instead "
                              "of low/high or range");
        }
        std::vector<double> weights(values.size(), 1.0);
        if (const YAML::Node w = d["weights"]) {
          if (w.size() != values.size()) {
            throw doc_.error_at(w, field + ".weights",
                                "needs one weight per value (" + std::to_string(values.size()) +
                                    "), found " + std::to_string(w.size()));
          }
          for (std::size_t i = 0; i < w.size(); ++i) weights[i] = number(w[i]);
        }
        double total = 0;
        for (double w : weights) total += w;
        if (!(total > 0)) throw doc_.error_at(d["weights"], field + ".weights", "are all 0");
        std::vector<std::size_t> order(values.size());
        for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
        std::sort(order.begin(), order.end(),
                  [&](std::size_t a, std::size_t b) { return v.points[a] < v.points[b]; });
        for (std::size_t i : order) {
          out.values.push_back(v.points[i]);
          out.probabilities.push_back(weights[i] / total);
        }
        break;
      }
    }
    return out;
  }

  const YamlDocument& doc_;
  PathSpace space_;
};

bool parse_number(const std::string& text, double& out) {
  if (text.empty()) return false;
  char* end = nullptr;
  out = std::strtod(text.c_str(), &end);
  return end == text.c_str() + text.size() && std::isfinite(out);
}

// The rank_correlations of every entry of `list` (already read into `out`), resolved to
// paths, stored on both sides; refused as variations_loader.h lists.
void read_rank_correlations(const YamlDocument& doc, const YAML::Node& list,
                            const std::string& block, std::vector<Variation>& out) {
  const std::size_t n = out.size();
  std::vector<std::vector<double>> rho(n, std::vector<double>(n, 0.0));
  std::vector<std::vector<std::string>> given_at(n, std::vector<std::string>(n));
  bool any = false;
  for (std::size_t i = 0; i < n; ++i) {
    const YAML::Node entries = list[i]["rank_correlations"];
    if (!entries) continue;
    const std::string field = join_index(block, i) + ".rank_correlations";
    if (!out[i].distribution) {
      throw doc.error_at(entries, field,
                         "applies to an entry with a distribution only: " + out[i].path +
                             " is not drawn, so it has no rank to correlate");
    }
    for (std::size_t c = 0; c < entries.size(); ++c) {
      const std::string at = join_index(field, c);
      const YAML::Node with = entries[c]["with"];
      const std::string name = with.Scalar();
      std::size_t found = n;
      for (std::size_t j = 0; j < n; ++j) {
        if (out[j].path == name) found = j;
      }
      if (found == n) {
        for (std::size_t j = 0; j < n; ++j) {
          if (out[j].label != name) continue;
          if (found != n) {
            throw doc.error_at(with, at + ".with",
                               "'" + name + "' is the label of more than one entry of " + block +
                                   "; name the entry by its path");
          }
          found = j;
        }
      }
      if (found == n) {
        throw doc.error_at(
            with, at + ".with",
            "'" + name + "' is neither the path nor the label of an entry of " + block);
      }
      if (found == i) {
        throw doc.error_at(with, at + ".with",
                           "names its own entry; a rank correlation is between two inputs");
      }
      if (!out[found].distribution) {
        throw doc.error_at(with, at + ".with",
                           out[found].path +
                               " has no distribution, so it is not drawn and has "
                               "no rank to correlate; give it a distribution");
      }
      const double r = number(entries[c]["rho"]);
      if (given_at[i][found].rfind(field, 0) == 0) {
        throw doc.error_at(with, at + ".with",
                           "pairs " + out[i].path + " with " + out[found].path +
                               " a second time (" + given_at[i][found] + ")");
      }
      if (!given_at[i][found].empty() && rho[i][found] != r) {
        throw doc.error_at(entries[c]["rho"], at + ".rho",
                           "gives " + number_text(r) + " but " + given_at[i][found] + " gives " +
                               number_text(rho[i][found]) + " for the same pair; a rank " +
                               "correlation is symmetric, so give it once or equal on both sides");
      }
      rho[i][found] = rho[found][i] = r;
      given_at[i][found] = given_at[found][i] = at;
      any = any || r != 0;
    }
  }
  if (!any) return;
  std::vector<std::size_t> drawn;
  for (std::size_t i = 0; i < n; ++i) {
    if (out[i].distribution) drawn.push_back(i);
  }
  Eigen::MatrixXd m = Eigen::MatrixXd::Identity(static_cast<Eigen::Index>(drawn.size()),
                                                static_cast<Eigen::Index>(drawn.size()));
  for (std::size_t a = 0; a < drawn.size(); ++a) {
    for (std::size_t b = 0; b < drawn.size(); ++b) {
      if (a != b) {
        m(static_cast<Eigen::Index>(a), static_cast<Eigen::Index>(b)) = rho[drawn[a]][drawn[b]];
      }
    }
  }
  // Cholesky succeeds only for a positive-definite matrix; a positive semi-definite one (a
  // correlation of exactly +-1, or pairs that force one) fails too, as Iman-Conover needs the
  // factor to be invertible.
  const Eigen::LLT<Eigen::MatrixXd> llt(m);
  if (llt.info() != Eigen::Success) {
    throw doc.error_at(list, block,
                       "the rank correlations cannot all hold at once: their matrix over the "
                       "drawn entries is not positive definite (no Cholesky factor); weaken "
                       "one of them");
  }
  for (std::size_t i = 0; i < n; ++i) {
    for (std::size_t j = 0; j < n; ++j) {
      if (i != j && rho[i][j] != 0) out[i].rank_correlations.push_back({out[j].path, rho[i][j]});
    }
  }
}

// The `<whole>.variations` block of the document, read against the case's paths.
std::vector<Variation> read_block(const YamlDocument& doc, const PathSpace& space) {
  std::vector<Variation> out;
  const YAML::Node list = doc.root()[space.whole]["variations"];
  if (!list) return out;
  const std::string block = space.whole + ".variations";
  Reader reader(doc, space);
  // Each entry is checked on its own and every entry's error is reported (InputErrors).
  std::vector<InputError> errors;
  std::vector<std::size_t> out_at;  // per entry of out: its index in the block
  for (std::size_t i = 0; i < list.size(); ++i) {
    const std::string field = join_index(block, i);
    try {
      Variation v = reader.read(list[i], field);
      for (std::size_t j = 0; j < out.size(); ++j) {
        if (out[j].path == v.path) {
          throw doc.error_at(
              list[i]["path"], field + ".path",
              "'" + v.path + "' is already varied by " + join_index(block, out_at[j]));
        }
      }
      for (double& x : v.points) {
        if (x == 0) x = 0;  // no negative zero in reports
      }
      v.points.erase(std::unique(v.points.begin(), v.points.end()), v.points.end());
      std::sort(v.points.begin(), v.points.end());
      out.push_back(std::move(v));
      out_at.push_back(i);
    } catch (const InputError& e) {
      errors.push_back(e);
    }
  }
  if (errors.size() == 1) throw errors.front();
  if (!errors.empty()) throw InputErrors(std::move(errors));
  // The correlations name other entries, so they are read once every entry is sound.
  read_rank_correlations(doc, list, block, out);
  return out;
}

}  // namespace

std::vector<Variation> read_variations(const YamlDocument& doc, const StudyCase& study) {
  return read_block(doc, path_space(study, "study"));
}

std::vector<Variation> read_tender_variations(const YamlDocument& doc, const TenderCase& tender) {
  return read_block(doc, path_space(tender, "tender"));
}

Variation parse_vary_option(const std::string& text, const StudyCase& study) {
  const std::string field = "--vary";
  const std::size_t eq = text.find('=');
  if (eq == std::string::npos || eq == 0) {
    throw InvalidValue(field, "expected PATH=LOW:HIGH, found '" + text + "'");
  }
  Variation v;
  v.path = text.substr(0, eq);
  const std::string rest = text.substr(eq + 1);
  const std::size_t colon = rest.find(':');
  double low = 0, high = 0;
  if (colon == std::string::npos || !parse_number(rest.substr(0, colon), low) ||
      !parse_number(rest.substr(colon + 1), high)) {
    throw InvalidValue(field, "expected PATH=LOW:HIGH with two numbers, found '" + text + "'");
  }
  ParameterInfo info;
  try {
    info = find_parameter(study, v.path);
  } catch (const InvalidValue& e) {
    throw InvalidValue(field, "'" + v.path + "' " + e.rule());
  }
  if (!info.present) throw InvalidValue(field, "'" + v.path + "' " + not_set("study"));
  if (!(low < high)) {
    throw InvalidValue(field, v.path + ": LOW (" + number_text(low) + ") must be below HIGH (" +
                                  number_text(high) + ")");
  }
  for (double x : {low, high}) {
    const std::string why = refusal(study, v.path, x);
    if (!why.empty()) throw InvalidValue(field, v.path + "=" + number_text(x) + ": " + why);
  }
  v.label = v.path;
  v.unit = info.unit;
  v.whole_number = info.whole_number;
  v.low = low;
  v.high = high;
  v.base = info.base;
  if (v.base < low || v.base > high) {
    throw InvalidValue(field, v.path + ": the study's value " + number_text(v.base) +
                                  " lies outside " + number_text(low) + ":" + number_text(high));
  }
  v.at = {"--vary", 1, 1};
  return v;
}

std::vector<Variation> merge_variations(std::vector<Variation> variations,
                                        const std::vector<Variation>& extra) {
  for (const Variation& e : extra) {
    auto same = std::find_if(variations.begin(), variations.end(),
                             [&](const Variation& v) { return v.path == e.path; });
    if (same != variations.end()) {
      *same = e;
      for (Variation& v : variations) {
        auto& c = v.rank_correlations;
        c.erase(std::remove_if(c.begin(), c.end(),
                               [&](const RankCorrelation& r) { return r.with == e.path; }),
                c.end());
      }
    } else {
      variations.push_back(e);
    }
  }
  return variations;
}

}  // namespace stowage
