// SPDX-License-Identifier: MIT
#include "optimiser/report/breakeven_report.h"

#include <fmt/format.h>
#include <fmt/ostream.h>

#include <cmath>
#include <string>

#include "optimiser/report/design_report.h"
#include "optimiser/report/json_writer.h"
#include "optimiser/report/number_format.h"
#include "optimiser/report/sweep_report.h"

namespace stowage::report {

namespace {

std::string value_text(const BreakevenResult& r, double x) {
  return format_general(x, 7) + (r.unit.empty() ? "" : " " + r.unit);
}

std::string gap_text(double gap) {
  if (std::isinf(gap)) return gap > 0 ? "cannot win" : "no rival";
  return format_signed_amount(gap);
}

void write_probe_json(JsonWriter& json, const BreakevenProbe& p) {
  json.begin_object();
  json.field("value", p.value);
  json.field("profile_npc", p.profile_npc);
  json.key("rival");
  if (p.rival_id.empty()) {
    json.null();
  } else {
    json.value(p.rival_id);
  }
  json.field("rival_npc", p.rival_npc);
  json.field("gap", p.gap);
  json.end_object();
}

}  // namespace

void write_breakeven_text(std::ostream& out, const StudyCase& study, const BreakevenResult& r) {
  print_study_header(out, study, "break-even search, " + point_mode_text(r.hold_designs));
  const std::string& cur = study.economics.currency;
  fmt::print(out, "\nInput: {} between {} and {}\n", r.path, value_text(r, r.from),
             value_text(r, r.to));
  fmt::print(out,
             "Question: at what value does {}'s best design cost as much (NPC) as the "
             "cheapest other profile's?\n",
             r.profile_id);
  fmt::print(out, "\nScan ({} values; gap = {} NPC - cheapest rival NPC, negative: {} wins)\n",
             r.scan.size(), r.profile_id, r.profile_id);
  fmt::print(out, "{:>18} {:>14} {:<22} {:>14} {:>14}\n", "value", r.profile_id.substr(0, 14),
             "cheapest rival", "rival NPC", "gap " + cur);
  for (const BreakevenProbe& p : r.scan) {
    fmt::print(out, "{:>18} {:>14} {:<22} {:>14} {:>14}\n", value_text(r, p.value),
               format_amount(p.profile_npc), p.rival_id.empty() ? "none" : p.rival_id,
               format_amount(p.rival_npc), gap_text(p.gap));
  }
  out << '\n';
  if (!r.crossing) {
    fmt::print(out,
               "No crossing between {} and {}: {} is {} throughout the scan. A crossing and its "
               "return between two scanned values can be missed; --scan-points scans finer.\n",
               value_text(r, r.from), value_text(r, r.to), r.profile_id,
               r.profile_wins_at_from ? "the cheapest" : "never the cheapest");
  } else {
    const std::string rival = r.at_low.rival_id.empty() ? r.at_high.rival_id : r.at_low.rival_id;
    fmt::print(out, "Break-even: {} ties {} at {} = {} (bracket {} .. {}, {} evaluations",
               r.profile_id, rival.empty() ? "the rest" : rival, r.path, value_text(r, r.value),
               format_general(r.bracket_low, 7), format_general(r.bracket_high, 7),
               r.scan.size() + r.bisection.size());
    if (r.whole_number) {
      out << "; whole values only).\n";
    } else {
      fmt::print(out, "; tolerance {}).\n", format_general(r.tolerance, 3));
    }
    fmt::print(out, "{} is cheaper {} it.\n", r.profile_id,
               r.profile_wins_at_from ? "below" : "above");
    if (r.step) {
      out << "Note: the gap jumps across the final bracket (by more than 0.1 % of the winner's "
             "NPC): the profiles swap places at a step (a replacement moving by a year or a "
             "design change), not at a smooth tie; the value is where the step lies.\n";
    }
  }
  out << '\n';
  print_safety_notice(out);
}

void write_breakeven_json(std::ostream& out, const StudyCase& study, const BreakevenResult& r) {
  JsonWriter json;
  json.begin_object();
  write_study_json(json, study);
  json.field("analysis", "breakeven");
  json.field("path", r.path);
  json.field("unit", r.unit);
  json.field("profile", r.profile_id);
  json.field("from", r.from);
  json.field("to", r.to);
  json.field("tolerance", r.tolerance);
  json.field("whole_number", r.whole_number);
  json.field("hold_designs", r.hold_designs);
  json.field("crossing", r.crossing);
  json.key("value");
  if (r.crossing) {
    json.value(r.value);
  } else {
    json.null();
  }
  json.key("bracket_low");
  if (r.crossing) {
    json.value(r.bracket_low);
  } else {
    json.null();
  }
  json.key("bracket_high");
  if (r.crossing) {
    json.value(r.bracket_high);
  } else {
    json.null();
  }
  json.field("step", r.step);
  json.field("profile_wins_at_from", r.profile_wins_at_from);
  json.key("scan").begin_array();
  for (const BreakevenProbe& p : r.scan) write_probe_json(json, p);
  json.end_array();
  json.key("bisection").begin_array();
  for (const BreakevenProbe& p : r.bisection) write_probe_json(json, p);
  json.end_array();
  json.end_object();
  out << json.str() << '\n';
}

void write_breakeven_csv(std::ostream& out, const BreakevenResult& r) {
  out << "phase,value,profile,profile_npc,rival,rival_npc,gap\n";
  const auto row = [&](const char* phase, const BreakevenProbe& p) {
    out << phase << ',' << format_machine(p.value) << ',' << r.profile_id << ','
        << format_machine(p.profile_npc) << ',' << p.rival_id << ',' << format_machine(p.rival_npc)
        << ',' << (std::isinf(p.gap) ? (p.gap > 0 ? "inf" : "-inf") : format_machine(p.gap))
        << '\n';
  };
  for (const BreakevenProbe& p : r.scan) row("scan", p);
  for (const BreakevenProbe& p : r.bisection) row("bisection", p);
}

}  // namespace stowage::report
