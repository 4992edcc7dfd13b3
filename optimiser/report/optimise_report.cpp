// SPDX-License-Identifier: MIT
#include "optimiser/report/optimise_report.h"

#include <fmt/format.h>
#include <fmt/ostream.h>

#include <cmath>
#include <string>

#include "optimiser/report/cost_lines.h"
#include "optimiser/report/design_report.h"
#include "optimiser/report/json_writer.h"
#include "optimiser/report/number_format.h"

namespace stowage::report {

namespace {

void print_header(std::ostream& out, const Study& study, const OptimiseResult& r) {
  print_study_header(out, study,
                     std::string("design optimisation (method ") + to_string(r.method) + ")");
  fmt::print(out,
             "Search space: {} profiles, DoD ladder {:g} to {:g} step {:g}, 1 to {} strings; "
             "{} admissible designs\n",
             study.profiles.size(), study.search.dod_from, study.search.dod_to,
             study.search.dod_step, study.search.max_strings_parallel, r.admissible_designs);
  for (const std::string& note : r.notes) fmt::print(out, "Note: {}\n", note);
  out << "\n";
}

}  // namespace

void write_optimise_text(std::ostream& out, const Study& study, const OptimiseResult& r) {
  print_header(out, study, r);
  if (!r.feasible()) {
    if (r.time_limit_reached) {
      fmt::print(out, "No feasible design found before the time limit ({:.1f} s).\n",
                 r.solve_seconds);
    } else {
      out << "No feasible design: no design meets every requirement.\n";
    }
    for (const UnmetRequirement& u : r.unmet)
      fmt::print(out, "  {}: {}\n", u.requirement, u.detail);
    out << "\n";
    print_safety_notice(out);
    return;
  }
  const DesignResult& best = r.best();
  const std::string& cur = study.economics.currency;
  switch (r.status) {
    case Optimality::Proven:
      out << "Best design (proven optimal: every other design was evaluated exactly or is ruled "
             "out by the cost bound):\n";
      break;
    case Optimality::VerifiedByEstimate:
      fmt::print(out,
                 "Best design (verified by estimate, not proven: {} designs were passed over on "
                 "the model's estimate rather than ruled out by the cost bound; run without "
                 "--skip-proof to settle them):\n",
                 r.designs_unsettled);
      break;
    case Optimality::TimeLimited:
      out << "Best design found so far -- NOT PROVEN OPTIMAL (time limit reached):\n";
      break;
  }
  print_design_table(out, best);
  out << "\n";
  if (std::isfinite(r.model_estimate_npc)) {
    const std::string lcos = std::isfinite(r.model_estimate_per_kwh)
                                 ? fmt::format("{:.4f} {}/kWh", r.model_estimate_per_kwh, cur)
                                 : std::string("n/a (no discharge planned)");
    fmt::print(out,
               "Model estimate of this design: NPC {} {}, LCOS {}; exact NPC {} {}, LCOS "
               "{:.4f} {}/kWh (gap {:+.2f} % of the exact NPC)\n",
               format_amount(r.model_estimate_npc), cur, lcos, format_amount(best.npc), cur,
               best.lcos_per_kwh, cur, 100 * r.gap);
  }
  if (r.method == SearchMethod::Milp) {
    fmt::print(out,
               "Search: {} sub-models solved, {} (profile, DoD) pairs pruned by the cost bound "
               "and {} by the calibrated model estimate; {} of {} designs evaluated exactly "
               "({} of them to prove the answer) in {:.2f} s\n\n",
               r.submodels_solved, r.pairs_pruned_by_bound, r.pairs_pruned_by_estimate,
               r.designs_evaluated_exactly, r.admissible_designs, r.designs_evaluated_for_proof,
               r.solve_seconds);
  } else {
    fmt::print(out, "Search: {} of {} designs evaluated exactly in {:.2f} s\n\n",
               r.designs_evaluated_exactly, r.admissible_designs, r.solve_seconds);
  }

  out << "Best design of each profile, by net present cost of serving the site\n";
  fmt::print(out, "{:>4}  {:<28}{:>5}{:>9}{:>11}{:>13}{:>14}{:>14}\n", "rank", "profile", "DoD",
             "strings", "kWh", "LCOS " + cur, "NPC " + cur, "vs best");
  for (std::size_t i = 0; i < r.ranking.size(); ++i) {
    const DesignResult& d = r.ranking[i];
    fmt::print(out, "{:>4}  {:<28}{:>5.2f}{:>9}{:>11}{:>13.4f}{:>14}{:>14}\n", i + 1, d.profile_id,
               d.dod_setpoint, d.bank.strings_parallel, format_amount(d.bank.nameplate_kwh, 1),
               d.lcos_per_kwh, format_amount(d.npc),
               i == 0 ? std::string("-") : format_signed_amount(d.npc - best.npc));
  }
  if (r.ranking.size() > 1) {
    out << "\nWhy each loses against " << best.profile_id << " (present-value difference, " << cur
        << ", biggest first):\n";
    for (std::size_t i = 1; i < r.ranking.size(); ++i) {
      const DesignResult& d = r.ranking[i];
      fmt::print(out, "  {:<28}", d.profile_id);
      bool first = true;
      for (const CostDifference& item : cost_differences(d.present_value, best.present_value)) {
        fmt::print(out, "{}{} {}", first ? "" : ", ", item.line->label,
                   format_signed_amount(item.amount));
        first = false;
      }
      out << "\n";
    }
  }
  if (r.method == SearchMethod::Milp && r.ranking.size() > 1) {
    out << "(Other profiles show the best design found where the model pointed; only the "
           "winner is searched to the end.)\n";
  }
  out << "\n";
  print_safety_notice(out);
}

void write_optimise_json(std::ostream& out, const Study& study, const OptimiseResult& r) {
  JsonWriter json;
  json.begin_object();
  write_study_json(json, study);
  json.field("method", to_string(r.method));
  json.field("feasible", r.feasible());
  json.key("designs").begin_array();
  for (const DesignResult& d : r.ranking) write_design_json(json, d);
  json.end_array();
  json.key("best");
  if (r.feasible()) {
    write_design_json(json, r.best());
  } else {
    json.null();
  }
  json.key("ranking").begin_array();
  for (std::size_t i = 0; i < r.ranking.size(); ++i) {
    const DesignResult& d = r.ranking[i];
    json.begin_object();
    json.field("rank", static_cast<int>(i + 1));
    json.field("npc_difference_to_best", d.npc - r.best().npc);
    json.key("loses_on").begin_array();
    if (i > 0) {
      for (const CostDifference& item : cost_differences(d.present_value, r.best().present_value)) {
        json.begin_object()
            .field("item", item.line->key)
            .field("difference", item.amount)
            .end_object();
      }
    }
    json.end_array();
    json.key("design");
    write_design_json(json, d);
    json.end_object();
  }
  json.end_array();
  json.field("model_estimate_npc", r.model_estimate_npc);
  json.field("model_estimate_per_kwh", r.model_estimate_per_kwh);
  json.field("gap", r.gap);
  json.field("solve_seconds", r.solve_seconds);
  json.field("designs_evaluated_exactly", static_cast<long>(r.designs_evaluated_exactly));
  json.field("designs_evaluated_for_proof", static_cast<long>(r.designs_evaluated_for_proof));
  json.field("admissible_designs", static_cast<long>(r.admissible_designs));
  json.field("submodels_solved", static_cast<long>(r.submodels_solved));
  json.field("pairs_pruned_by_bound", static_cast<long>(r.pairs_pruned_by_bound));
  json.field("pairs_pruned_by_estimate", static_cast<long>(r.pairs_pruned_by_estimate));
  json.field("optimality", to_string(r.status));
  json.field("proven_optimal", r.proven_optimal());
  json.field("designs_unsettled", static_cast<long>(r.designs_unsettled));
  json.field("time_limit_reached", r.time_limit_reached);
  json.key("unmet").begin_array();
  for (const UnmetRequirement& u : r.unmet) {
    json.begin_object()
        .field("requirement", u.requirement)
        .field("detail", u.detail)
        .field("needed", u.needed)
        .field("best_available", u.best_available)
        .end_object();
  }
  json.end_array();
  json.key("notes").begin_array();
  for (const std::string& n : r.notes) json.value(n);
  json.end_array();
  json.field("notice",
             "Planning estimate only; follow local codes, the manufacturer's instructions and "
             "licensed practice.");
  json.end_object();
  out << json.str() << "\n";
}

void write_no_model_exported(std::ostream& err, const std::string& path) {
  err << "stowage: no admissible design, so no model was written to " << path << "\n";
}

std::string format_progress(const OptimiseProgress& p) {
  const std::string best = std::isfinite(p.best_npc) ? format_amount(p.best_npc) : "none yet";
  return fmt::format("  {} {}/{}, best NPC {}, {:.1f} s", p.phase, p.done, p.total, best,
                     p.seconds);
}

}  // namespace stowage::report
