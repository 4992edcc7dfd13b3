// SPDX-License-Identifier: MIT
#include "optimiser/report/uncertainty_report.h"

#include <fmt/format.h>
#include <fmt/ostream.h>

#include <string>

#include "optimiser/report/design_report.h"
#include "optimiser/report/json_writer.h"
#include "optimiser/report/number_format.h"
#include "optimiser/report/sweep_report.h"

namespace stowage::report {

namespace {

void write_statistics_json(JsonWriter& json, const SampleStatistics& s) {
  json.begin_object();
  json.field("mean", s.mean);
  json.field("standard_error", s.standard_error);
  json.field("p10", s.p10);
  json.field("p50", s.p50);
  json.field("p90", s.p90);
  json.end_object();
}

std::string percent(double p) { return format_fixed(100 * p, 1) + " %"; }

}  // namespace

void write_drawn_json(JsonWriter& json, const std::vector<Variation>& drawn) {
  json.key("drawn").begin_array();
  for (const Variation& v : drawn) {
    json.begin_object();
    json.field("path", v.path);
    json.field("label", v.label);
    json.field("unit", v.unit);
    json.field("distribution", to_string(v.distribution->kind));
    json.field("lower", v.distribution->lower);
    json.field("upper", v.distribution->upper);
    json.key("rank_correlations").begin_array();
    for (const RankCorrelation& c : v.rank_correlations) {
      json.begin_object().field("with", c.with).field("rho", c.rho).end_object();
    }
    json.end_array();
    json.end_object();
  }
  json.end_array();
}

std::string distribution_text(const Variation& v) {
  const Distribution& d = *v.distribution;
  const auto val = [&](double x) { return variation_value_text(v, x); };
  switch (d.kind) {
    case DistributionKind::Uniform:
      return fmt::format("uniform on {} .. {}", val(d.lower), val(d.upper));
    case DistributionKind::Triangular:
      return fmt::format("triangular on {} .. {}, mode {}", val(d.lower), val(d.upper),
                         val(d.mode));
    case DistributionKind::Normal:
      return fmt::format("normal, mean {}, sd {}, truncated to {} .. {}", val(d.mean),
                         format_general(d.sd), format_general(d.lower), format_general(d.upper));
    case DistributionKind::Lognormal:
      return fmt::format("lognormal, median {}, log sd {}, truncated to {} .. {}", val(d.median),
                         format_general(d.log_sd), format_general(d.lower),
                         format_general(d.upper));
    case DistributionKind::Discrete: {
      std::string s = "discrete:";
      for (std::size_t i = 0; i < d.values.size(); ++i) {
        s += fmt::format(" {} (p {})", format_general(d.values[i]),
                         format_fixed(d.probabilities[i], 3));
      }
      return s;
    }
  }
  return "?";
}

void write_uncertainty_text(std::ostream& out, const StudyCase& study, const UncertaintyResult& r) {
  const std::string what = fmt::format("uncertainty, {} samples ({}), seed {}, {}", r.samples,
                                       r.latin_hypercube ? "Latin hypercube" : "Monte Carlo",
                                       r.seed, point_mode_text(!r.reoptimise));
  print_study_header(out, study, what);
  bool correlated = false;
  for (const Variation& v : r.drawn) correlated = correlated || !v.rank_correlations.empty();
  out << (correlated ? "\nDrawn inputs (rank-correlated where listed, by the Iman-Conover method; "
                       "the other inputs at their study values)\n"
                     : "\nDrawn inputs (independent of each other; the other inputs at their "
                       "study values)\n");
  for (std::size_t i = 0; i < r.drawn.size(); ++i) {
    const Variation& v = r.drawn[i];
    fmt::print(out, "  {}: {}{}\n", v.label, distribution_text(v),
               v.source.empty() ? "" : "; range: " + v.source);
    for (const RankCorrelation& c : v.rank_correlations) {
      for (std::size_t j = 0; j < i; ++j) {  // each pair once, under its second input
        if (r.drawn[j].path == c.with) {
          fmt::print(out, "    rank correlation with {}: {}\n", r.drawn[j].label,
                     format_fixed(c.rho, 2));
        }
      }
    }
  }
  const std::string& cur = study.economics.currency;
  fmt::print(out, "\n{:<24} {:>16} {:>12} {:>12} {:>12} {:>18} {:>10} {:>14} {:>6}\n", "profile",
             "P(cheapest)", "NPC P10", "NPC P50", "NPC P90", "NPC mean +- se", "LCOS P50",
             "exp. regret", "fails");
  for (const ProfileUncertainty& p : r.profiles) {
    fmt::print(out, "{:<24} {:>16} {:>12} {:>12} {:>12} {:>18} {:>10} {:>14} {:>6}\n", p.profile_id,
               format_fixed(100 * p.win_probability, 1) + " +- " +
                   format_fixed(100 * p.win_probability_se, 1) + " %",
               format_amount(p.npc.p10), format_amount(p.npc.p50), format_amount(p.npc.p90),
               format_amount(p.npc.mean) + " +- " + format_amount(p.npc.standard_error),
               format_fixed(p.lcos.p50, 4), format_amount(p.expected_regret), p.fails_limit);
  }
  fmt::print(out,
             "NPC and regret in {}, LCOS in {}/kWh; regret: the profile's NPC less the sample's "
             "cheapest, averaged; fails: samples breaking the unserved-energy limit.\n",
             cur, cur);
  if (r.no_winner_probability > 0) {
    fmt::print(out, "No design meets the unserved-energy limit in {} of the samples.\n",
               percent(r.no_winner_probability));
  }
  if (!r.convergence.empty() && !r.base_winner.empty()) {
    fmt::print(out, "\nConvergence: probability that {} (the base winner) is cheapest\n",
               r.base_winner);
    for (const ConvergencePoint& c : r.convergence) {
      fmt::print(out, "  after {:>8} samples: {} +- {} (standard error)\n", c.samples,
                 percent(c.win_probability), percent(c.standard_error));
    }
  }
  out << '\n';
  for (const ProfileUncertainty& p : r.profiles) {
    if (p.profile_id != r.base_winner) continue;
    fmt::print(out, "Verdict: the base winner {} is cheapest in {} of the samples.\n", p.profile_id,
               percent(p.win_probability));
  }
  if (r.base_winner.empty()) out << "Verdict: the base case has no winner to test.\n";
  out << '\n';
  print_safety_notice(out);
}

void write_uncertainty_json(std::ostream& out, const StudyCase& study, const UncertaintyResult& r) {
  JsonWriter json;
  json.begin_object();
  write_study_json(json, study);
  json.field("analysis", "uncertainty");
  json.field("samples", static_cast<long>(r.samples));
  json.field("seed", std::to_string(r.seed));
  json.field("latin_hypercube", r.latin_hypercube);
  json.field("reoptimise", r.reoptimise);
  json.key("base_winner");
  if (r.base_winner.empty()) {
    json.null();
  } else {
    json.value(r.base_winner);
  }
  write_drawn_json(json, r.drawn);
  json.key("profiles").begin_array();
  for (const ProfileUncertainty& p : r.profiles) {
    json.begin_object();
    json.field("profile", p.profile_id);
    json.field("samples", static_cast<long>(p.samples));
    json.field("win_probability", p.win_probability);
    json.field("win_probability_se", p.win_probability_se);
    json.key("npc");
    write_statistics_json(json, p.npc);
    json.key("lcos_per_kwh");
    write_statistics_json(json, p.lcos);
    json.field("expected_regret", p.expected_regret);
    json.field("fails_limit", static_cast<long>(p.fails_limit));
    json.end_object();
  }
  json.end_array();
  json.field("no_winner_probability", r.no_winner_probability);
  json.key("convergence").begin_array();
  for (const ConvergencePoint& c : r.convergence) {
    json.begin_object()
        .field("samples", static_cast<long>(c.samples))
        .field("win_probability", c.win_probability)
        .field("standard_error", c.standard_error)
        .end_object();
  }
  json.end_array();
  json.end_object();
  out << json.str() << '\n';
}

void write_uncertainty_summary_csv(std::ostream& out, const UncertaintyResult& r) {
  out << "profile,samples,win_probability,win_probability_se,npc_mean,npc_standard_error,"
         "npc_p10,npc_p50,npc_p90,lcos_mean,lcos_p10,lcos_p50,lcos_p90,expected_regret,"
         "fails_limit\n";
  for (const ProfileUncertainty& p : r.profiles) {
    out << p.profile_id << ',' << p.samples << ',' << format_machine(p.win_probability) << ','
        << format_machine(p.win_probability_se) << ',' << format_machine(p.npc.mean) << ','
        << format_machine(p.npc.standard_error) << ',' << format_machine(p.npc.p10) << ','
        << format_machine(p.npc.p50) << ',' << format_machine(p.npc.p90) << ','
        << format_machine(p.lcos.mean) << ',' << format_machine(p.lcos.p10) << ','
        << format_machine(p.lcos.p50) << ',' << format_machine(p.lcos.p90) << ','
        << format_machine(p.expected_regret) << ',' << p.fails_limit << '\n';
  }
}

void write_uncertainty_samples_csv(std::ostream& out, const UncertaintyResult& r) {
  out << "sample";
  for (const Variation& v : r.drawn) out << ',' << v.path;
  out << ",winner";
  for (const ProfileUncertainty& p : r.profiles) out << ",npc_" << p.profile_id;
  out << '\n';
  for (std::size_t k = 0; k < r.values.size(); ++k) {
    out << k;
    for (double x : r.values[k]) out << ',' << format_machine(x, 17);
    out << ',' << r.winners[k];
    for (double x : r.npc[k]) out << ',' << format_machine(x);
    out << '\n';
  }
}

}  // namespace stowage::report
