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

std::string cap_name(StringCap cap) {
  switch (cap) {
    case StringCap::MaxStrings:
      return "max_strings_parallel";
    case StringCap::Budget:
      return "budget";
    case StringCap::Mass:
      return "max_mass_kg";
    case StringCap::Volume:
      return "max_volume_l";
    case StringCap::MissingMass:
      return "max_mass_kg (profile gives no cell_mass_kg)";
    case StringCap::MissingVolume:
      return "max_volume_l (profile gives no cell_volume_l)";
  }
  return "?";
}

std::string requirement_key(const UnmetRequirement& u) {
  switch (u.requirement) {
    case Requirement::DodLadder:
      return "dod ladder";
    case Requirement::MaxStrings:
      return "max_strings_parallel";
    case Requirement::Budget:
      return "budget";
    case Requirement::Mass:
      return "max_mass_kg";
    case Requirement::Volume:
      return "max_volume_l";
    case Requirement::MissingCellData:
      return u.missing_mass ? "max_mass_kg" : "max_volume_l";
    case Requirement::AutonomyAndPeak:
      return "autonomy and peak discharge";
    case Requirement::Autonomy:
      return "autonomy";
    case Requirement::PeakDischarge:
      return "peak discharge";
    case Requirement::UnservedLimit:
      return "unserved energy limit";
  }
  return "?";
}

namespace {

std::string g4(double x) { return format_general(x, 4); }

std::string design_text(const DesignRef& d, const StudyCase& study, bool with_dod) {
  std::string text = study.profiles[d.profile_index].id;
  if (with_dod) text += " at DoD " + format_general(d.dod_setpoint, 3);
  return text + " with " + std::to_string(d.strings) + " strings (capped by " + cap_name(d.cap) +
         ")";
}

std::string note_body(const ProfileNote& n, const StudyCase& study) {
  const std::string& id = study.profiles[n.profile_index].id;
  switch (n.kind) {
    case ProfileNote::Kind::NoCellMass:
      return "profile " + id +
             " gives no cell_mass_kg, so it cannot be shown to meet max_mass_kg and is left out";
    case ProfileNote::Kind::NoCellVolume:
      return "profile " + id +
             " gives no cell_volume_l, so it cannot be shown to meet max_volume_l and is left "
             "out";
    case ProfileNote::Kind::NoDesignMeetsUnservedLimit:
      return "profile " + id + ": no design searched meets the unserved-energy limit";
    case ProfileNote::Kind::LadderOutsideDodRange:
      return "profile " + id + ": its allowed DoD range holds no setpoint of the ladder";
    case ProfileNote::Kind::CapsBelowNeed: {
      std::string why = "profile " + id + ": no admissible design: ";
      if (n.autonomy_needs_more) why += "the autonomy needs more strings ";
      if (n.peak_needs_more) {
        why +=
            std::string(n.autonomy_needs_more ? "and " : "") + "the peak draw needs more strings ";
      }
      return why + "than the " + std::to_string(n.cap_strings) + " allowed by " + cap_name(n.cap) +
             " at every setpoint";
    }
  }
  return "?";
}

}  // namespace

std::string describe_note(const ProfileNote& note, const StudyCase& study) {
  return note_body(note, study);
}

std::string describe_unmet(const UnmetRequirement& u, const StudyCase& study) {
  const SearchSettings& search = study.search;
  switch (u.requirement) {
    case Requirement::DodLadder:
      return "no profile allows any DoD setpoint of the search ladder (" + g4(search.dod_from) +
             " to " + g4(search.dod_to) + " in steps of " + g4(search.dod_step) + ")";
    case Requirement::MaxStrings:
      return "max_strings_parallel is below one string";
    case Requirement::Budget:
      return "the budget of " + g4(u.best_available) +
             " buys no bank: the cheapest one-string bank costs " + g4(u.needed);
    case Requirement::Mass:
      return "max_mass_kg " + g4(u.best_available) + " is below the lightest string (" +
             g4(u.needed) + " kg)";
    case Requirement::Volume:
      return "max_volume_l " + g4(u.best_available) + " is below the smallest string (" +
             g4(u.needed) + " l)";
    case Requirement::MissingCellData: {
      std::string text;
      for (std::size_t p = 0; p < study.profiles.size(); ++p) {
        const ChemistryProfile& profile = study.profiles[p];
        const bool lacks = u.missing_mass ? !profile.cell_mass_kg : !profile.cell_volume_l;
        if (!lacks) continue;
        const ProfileNote note{
            p, u.missing_mass ? ProfileNote::Kind::NoCellMass : ProfileNote::Kind::NoCellVolume};
        text += (text.empty() ? "" : "; ") + note_body(note, study);
      }
      return text;
    }
    case Requirement::AutonomyAndPeak:
      return "no allowed bank meets both the autonomy energy (" + g4(u.needed) +
             " kWh usable) and the peak draw: the banks with enough energy lack power and the "
             "other way round";
    case Requirement::Autonomy:
      return "autonomy of " + g4(study.site.autonomy_days) + " days needs " + g4(u.needed) +
             " kWh usable at the terminals (coldest month, end of life, within the DoD "
             "setpoint); the most any allowed bank gives is " +
             g4(u.best_available) + " kWh" +
             (u.best_at ? " (" + design_text(*u.best_at, study, true) + ")" : std::string()) +
             ", short by " + g4(u.needed - u.best_available) + " kWh";
    case Requirement::PeakDischarge:
      return "the peak draw needs " + g4(u.needed) +
             " kW at the bank terminals within the discharge C-rate; the most any allowed bank "
             "gives is " +
             g4(u.best_available) + " kW" +
             (u.best_at ? " (" + design_text(*u.best_at, study, false) + ")" : std::string()) +
             ", short by " + g4(u.needed - u.best_available) + " kW";
    case Requirement::UnservedLimit:
      return "no admissible design keeps unserved energy within " + format_general(u.needed * 100) +
             " % of demand in every year; the least reached is " +
             format_general(u.best_available * 100) + " %" +
             (u.best_at ? " (" + study.profiles[u.best_at->profile_index].id + " at DoD " +
                              format_fixed(u.best_at->dod_setpoint, 2) + " with " +
                              std::to_string(u.best_at->strings) + " strings)"
                        : std::string());
  }
  return "?";
}

namespace {

// The facts behind the answer: what was tried, what was left out and how it was settled.
void print_design_space(std::ostream& out, const StudyCase& study, const OptimiseResult& r) {
  fmt::print(out,
             "  design space  {} profiles, DoD ladder {:g} to {:g} step {:g}, 1 to {} strings; "
             "{} admissible designs\n",
             study.profiles.size(), study.search.dod_from, study.search.dod_to,
             study.search.dod_step, study.search.max_strings_parallel, r.admissible_designs);
  for (const ProfileNote& note : r.notes) {
    fmt::print(out, "  left out      {}\n", describe_note(note, study));
  }
}

std::string confidence_text(const OptimiseResult& r) {
  switch (r.status) {
    case Optimality::Proven:
      return "proven optimal: every other design was evaluated exactly or is ruled out by the "
             "cost bound";
    case Optimality::VerifiedByEstimate:
      return fmt::format(
          "verified by estimate, not proven: {} designs were passed over on the model's "
          "estimate rather than ruled out by the cost bound; run without --skip-proof to settle "
          "them",
          r.designs_unsettled);
    case Optimality::TimeLimited:
      return "NOT PROVEN OPTIMAL: the time limit was reached; this is the best found so far";
  }
  return "?";
}

// The decision first: what to build, what it costs, by how much it wins and how sure that is.
void print_decision(std::ostream& out, const StudyCase& study, const OptimiseResult& r) {
  const DesignResult& best = r.best();
  const std::string& cur = study.economics.currency;
  fmt::print(out, "DECISION  {} at DoD {:.2f} with {} string{} ({} kWh nameplate)\n",
             best.profile_id, best.dod_setpoint, best.bank.strings_parallel,
             best.bank.strings_parallel == 1 ? "" : "s", format_amount(best.bank.nameplate_kwh, 1));
  fmt::print(out, "  cost          {} {} net present cost of serving the site; LCOS {}{}\n",
             format_amount(best.npc), cur, lcos_cell(best, best.lcos_per_kwh),
             best.delivers_energy() ? " " + cur + "/kWh" : std::string());
  if (r.ranking.size() > 1) {
    const DesignResult& next = r.ranking[1];
    const double margin = next.npc - best.npc;
    fmt::print(out, "  margin        {} {} ({:.1f} % of its cost) below the next profile, {}{}\n",
               format_amount(margin), cur, best.npc != 0 ? 100 * margin / std::fabs(best.npc) : 0.0,
               next.profile_id,
               r.method != SearchMethod::Exhaustive
                   ? " (its design is the best met on the way, so its own best may be closer)"
                   : "");
  } else {
    out << "  margin        no other profile has an admissible design\n";
  }
  fmt::print(out, "  confidence    {}\n", confidence_text(r));
}

void print_alternatives(std::ostream& out, const StudyCase& study, const OptimiseResult& r) {
  const DesignResult& best = r.best();
  const std::string& cur = study.economics.currency;
  out << "Every profile's cheapest design found, cheapest first\n";
  fmt::print(out, "{:>4}  {:<28}{:>5}{:>9}{:>11}{:>13}{:>13}{:>14}{:>16}\n", "rank", "profile",
             "DoD", "strings", "kWh", "LCOS " + cur, "Schmidt " + cur, "NPC " + cur,
             "above choice");
  for (std::size_t i = 0; i < r.ranking.size(); ++i) {
    const DesignResult& d = r.ranking[i];
    fmt::print(out, "{:>4}  {:<28}{:>5.2f}{:>9}{:>11}{:>13}{:>13}{:>14}{:>16}\n", i + 1,
               d.profile_id, d.dod_setpoint, d.bank.strings_parallel,
               format_amount(d.bank.nameplate_kwh, 1), lcos_cell(d, d.lcos_per_kwh),
               lcos_cell(d, d.lcos_schmidt_per_kwh), format_amount(d.npc),
               i == 0 ? std::string("(the choice)") : format_signed_amount(d.npc - best.npc));
  }
  if (r.ranking.size() < 2) return;
  fmt::print(out,
             "\nWhere each alternative's money goes otherwise than the choice's (present value, "
             "{}; + spends more, largest first):\n",
             cur);
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

void print_how_found(std::ostream& out, const StudyCase& study, const OptimiseResult& r) {
  const DesignResult& best = r.best();
  const std::string& cur = study.economics.currency;
  out << "How the answer was found\n";
  print_design_space(out, study, r);
  if (r.method == SearchMethod::Milp) {
    fmt::print(out,
               "  method        milp: {} sub-models solved, {} (profile, DoD) pairs pruned by the "
               "cost bound and {} by the calibrated model estimate; {} of {} designs evaluated "
               "exactly ({} of them to prove the answer) in {:.2f} s\n",
               r.submodels_solved, r.pairs_pruned_by_bound, r.pairs_pruned_by_estimate,
               r.designs_evaluated_exactly, r.admissible_designs, r.designs_evaluated_for_proof,
               r.solve_seconds);
  } else {
    fmt::print(out, "  method        {}: {} of {} designs evaluated exactly in {:.2f} s\n",
               to_string(r.method), r.designs_evaluated_exactly, r.admissible_designs,
               r.solve_seconds);
  }
  if (r.designs_stopped_early > 0) {
    fmt::print(out,
               "                {} of them stopped early, once their cost so far, less the most "
               "they could still earn back, passed their profile's best\n",
               r.designs_stopped_early);
  }
  if (std::isfinite(r.model_estimate_npc)) {
    const std::string lcos = std::isfinite(r.model_estimate_per_kwh)
                                 ? fmt::format("{:.4f} {}/kWh", r.model_estimate_per_kwh, cur)
                                 : std::string("n/a (no discharge planned)");
    fmt::print(out,
               "  model check   Model estimate of this design: NPC {} {}, LCOS {}; exact NPC {} "
               "{}, LCOS {} {}/kWh (gap {:+.2f} % of the exact NPC)\n",
               format_amount(r.model_estimate_npc), cur, lcos, format_amount(best.npc), cur,
               lcos_cell(best, best.lcos_per_kwh), cur, 100 * r.gap);
  }
}

}  // namespace

std::string low_confidence_sentence(const ConfidenceCheck& check, const std::string& currency) {
  if (check.inputs.empty())
    return "every input of " + check.profile_id +
           " that a variation could move is labelled sourced in its profile";
  const LowConfidenceInput& top = check.inputs.front();
  const std::string what = top.path + " (" + confidence_name(top.confidence) + ", +-" +
                           format_general(100 * top.spread, 3) + " %)";
  if (check.exceeds_margin())
    return "CAUTION: the lead of " + format_amount(check.margin) + " " + currency +
           " is smaller than the " + format_amount(top.npc_rise) + " " + currency +
           " the winner's NPC rises by when " + what +
           " moves within its spread; check that value before deciding";
  return "no single low-confidence input of " + check.profile_id +
         " moved within its spread costs it its lead (largest: " + what + ", +" +
         format_amount(top.npc_rise) + " " + currency + ")";
}

void write_optimise_text(std::ostream& out, const StudyCase& study, const OptimiseResult& r,
                         const ConfidenceCheck* confidence) {
  print_study_header(out, study,
                     std::string("design optimisation (method ") + to_string(r.method) + ")");
  out << "\n";
  if (!r.feasible()) {
    if (r.time_limit_reached) {
      fmt::print(out, "No feasible design found before the time limit ({:.1f} s).\n",
                 r.solve_seconds);
    } else {
      out << "No feasible design: no design meets every requirement.\n";
    }
    for (const UnmetRequirement& u : r.unmet)
      fmt::print(out, "  {}: {}\n", requirement_key(u), describe_unmet(u, study));
    print_design_space(out, study, r);
    out << "\n";
    print_safety_notice(out);
    return;
  }
  print_decision(out, study, r);
  if (confidence)
    fmt::print(out, "  inputs        {}\n",
               low_confidence_sentence(*confidence, study.economics.currency));
  out << "\nThe chosen design\n";
  print_design_table(out, r.best());
  out << "\n";
  print_alternatives(out, study, r);
  out << "\n";
  print_how_found(out, study, r);
  out << "\n";
  print_safety_notice(out);
}

void write_optimise_json(std::ostream& out, const StudyCase& study, const OptimiseResult& r,
                         const ConfidenceCheck* confidence) {
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
  json.key("low_confidence");
  if (confidence) {
    json.begin_object();
    json.field("profile", confidence->profile_id);
    json.field("margin", confidence->margin);  // null without a runner-up
    json.field("exceeds_margin", confidence->exceeds_margin());
    json.key("inputs").begin_array();
    for (const LowConfidenceInput& in : confidence->inputs) {
      json.begin_object();
      json.field("path", in.path);
      json.field("confidence", confidence_name(in.confidence));
      json.field("spread", in.spread);
      json.field("npc_rise", in.npc_rise);
      json.end_object();
    }
    json.end_array();
    json.end_object();
  } else {
    json.null();
  }
  json.field("model_estimate_npc", r.model_estimate_npc);
  json.field("model_estimate_per_kwh", r.model_estimate_per_kwh);
  json.field("gap", r.gap);
  json.field("solve_seconds", r.solve_seconds);
  json.field("designs_evaluated_exactly", static_cast<long>(r.designs_evaluated_exactly));
  json.field("designs_evaluated_for_proof", static_cast<long>(r.designs_evaluated_for_proof));
  json.field("designs_stopped_early", static_cast<long>(r.designs_stopped_early));
  json.field("years_simulated", static_cast<long>(r.years_simulated));
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
        .field("requirement", requirement_key(u))
        .field("detail", describe_unmet(u, study))
        .field("needed", u.needed)
        .field("best_available", u.best_available)
        .end_object();
  }
  json.end_array();
  json.key("notes").begin_array();
  for (const ProfileNote& n : r.notes) json.value(describe_note(n, study));
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
