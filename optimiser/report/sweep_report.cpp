// SPDX-License-Identifier: MIT
#include "optimiser/report/sweep_report.h"

#include <fmt/format.h>
#include <fmt/ostream.h>

#include <cmath>

#include "optimiser/report/design_report.h"
#include "optimiser/report/number_format.h"

namespace stowage::report {

namespace {

const DesignSummary* winner_or_null(const PointOutcome& p) {
  return p.feasible() ? &p.winner() : nullptr;
}

std::string winner_name(const PointOutcome& p) {
  return p.feasible() ? p.winner().profile_id : std::string("none meets the limit");
}

std::string design_text(const DesignSummary& d) {
  return fmt::format("DoD {:.2f}, {} x {} cells, {} kWh", d.dod_setpoint, d.strings_parallel,
                     d.cells_series, format_fixed(d.nameplate_kwh, 1));
}

void write_summary_json(JsonWriter& json, const DesignSummary& d, const PointOutcome& point) {
  json.begin_object();
  json.field("profile", d.profile_id);
  json.key("rank");
  bool ranked = false;
  for (std::size_t r = 0; r < point.ranking.size(); ++r) {
    if (point.ranking[r].profile_id == d.profile_id) {
      json.value(static_cast<long>(r + 1));
      ranked = true;
    }
  }
  if (!ranked) json.null();
  json.field("dod_setpoint", d.dod_setpoint);
  json.field("cells_series", d.cells_series);
  json.field("strings_parallel", d.strings_parallel);
  json.field("nameplate_kwh", d.nameplate_kwh);
  json.field("npc", d.npc);
  json.field("lcos_per_kwh", d.lcos_per_kwh);
  json.field("investment", d.investment);
  json.field("meets_unserved_limit", d.meets_unserved_limit);
  json.end_object();
}

// ",<winner>,<npc>,<lcos>,<dod>,<strings>,<kWh>" then ",<npc of each profile>".
void write_point_csv_tail(std::ostream& out, const StudyCase& study, const PointOutcome& p) {
  const DesignSummary* w = winner_or_null(p);
  if (w) {
    out << ',' << csv_text(w->profile_id) << ',' << format_machine(w->npc) << ','
        << format_machine(w->lcos_per_kwh) << ',' << format_machine(w->dod_setpoint) << ','
        << w->strings_parallel << ',' << format_machine(w->nameplate_kwh);
  } else {
    out << ",,,,,,";
  }
  for (std::size_t i = 0; i < study.profiles.size(); ++i) {
    out << ',';
    if (i < p.by_profile.size() && p.by_profile[i]) out << format_machine(p.by_profile[i]->npc);
  }
  out << '\n';
}

std::string csv_point_header(const StudyCase& study) {
  std::string h =
      ",winner,winner_npc,winner_lcos_per_kwh,winner_dod_setpoint,"
      "winner_strings_parallel,winner_nameplate_kwh";
  for (const ChemistryProfile& p : study.profiles) h += ",npc_" + p.id;
  return h + "\n";
}

void print_base_line(std::ostream& out, const StudyCase& study, const PointOutcome& base) {
  if (!base.feasible()) {
    out << "Base case: no design meets the unserved-energy limit.\n";
    return;
  }
  const DesignSummary& w = base.winner();
  fmt::print(out, "Base case: {} wins ({}), NPC {} {}, LCOS {} {}/kWh\n", w.profile_id,
             design_text(w), format_amount(w.npc), study.economics.currency,
             format_fixed(w.lcos_per_kwh, 4), study.economics.currency);
}

std::string winner_mark(const PointOutcome& p, const PointOutcome& base) {
  const bool differs = p.feasible() != base.feasible() ||
                       (p.feasible() && p.winner().profile_id != base.winner().profile_id);
  return differs ? " *" : "";
}

}  // namespace

std::string variation_value_text(const Variation& v, double value) {
  return format_general(value, 6) + (v.unit.empty() ? "" : " " + v.unit);
}

std::string point_mode_text(bool hold_designs) {
  return hold_designs ? "the base case's designs held fixed" : "designs re-optimised at each point";
}

std::string format_run_progress(std::size_t done, std::size_t total, double seconds,
                                const std::string& unit) {
  const double rate = seconds > 0 ? static_cast<double>(done) / seconds : 0;
  std::string left = "?";
  if (rate > 0) left = format_fixed(static_cast<double>(total - done) / rate, 0) + " s";
  return fmt::format("{} / {} {}, {} per s, about {} left", done, total, unit,
                     format_general(rate, 3), left);
}

void write_variation_json(JsonWriter& json, const Variation& v) {
  json.begin_object();
  json.field("path", v.path);
  json.field("label", v.label);
  json.field("unit", v.unit);
  json.field("source", v.source);
  json.field("low", v.low);
  json.field("base", v.base);
  json.field("high", v.high);
  json.key("points").begin_array();
  for (double x : v.points) json.value(x);
  json.end_array();
  json.end_object();
}

void write_point_json(JsonWriter& json, const std::vector<Setting>& settings,
                      const PointOutcome& point) {
  json.begin_object();
  json.key("settings").begin_array();
  for (const Setting& s : settings) {
    json.begin_object().field("path", s.path).field("value", s.value).end_object();
  }
  json.end_array();
  json.key("winner");
  if (point.feasible()) {
    json.value(point.winner().profile_id);
  } else {
    json.null();
  }
  json.key("status");
  if (point.status) {
    json.value(to_string(*point.status));
  } else {
    json.null();
  }
  json.key("designs").begin_array();
  for (const std::optional<DesignSummary>& d : point.by_profile) {
    if (d) write_summary_json(json, *d, point);
  }
  json.end_array();
  json.end_object();
}

void write_tornado_text(std::ostream& out, const StudyCase& study, const TornadoResult& r) {
  print_study_header(out, study,
                     "tornado sweep, one input at a time, " + point_mode_text(r.hold_designs));
  out << '\n';
  print_base_line(out, study, r.base);
  const std::string& cur = study.economics.currency;
  fmt::print(out,
             "\nInputs by swing of the winner's NPC, largest first (each end with every other "
             "input at its base value)\n");
  fmt::print(out, "{:<6} {:>24}  {:<24} {:>14} {:>14}\n", "end", "value", "winner", "NPC " + cur,
             "LCOS " + cur + "/kWh");
  std::vector<std::string> changes;
  for (const TornadoBar& b : r.bars) {
    fmt::print(out, "{} (base {}): swing {} {}{}\n", b.variation.label,
               variation_value_text(b.variation, b.variation.base), format_amount(b.swing_npc), cur,
               b.variation.source.empty() ? "" : "; range: " + b.variation.source);
    for (int end = 0; end < 2; ++end) {
      const PointOutcome& p = end == 0 ? b.low : b.high;
      const double value = end == 0 ? b.variation.low : b.variation.high;
      const DesignSummary* w = winner_or_null(p);
      const std::string mark = winner_mark(p, r.base);
      fmt::print(out, "{:<6} {:>24}  {:<24} {:>14} {:>14}\n", end == 0 ? "low" : "high",
                 variation_value_text(b.variation, value), winner_name(p) + mark,
                 w ? format_amount(w->npc) : "n/a", w ? format_fixed(w->lcos_per_kwh, 4) : "n/a");
      if (!mark.empty()) {
        changes.push_back(fmt::format("{} at {} ({})", winner_name(p), b.variation.label,
                                      variation_value_text(b.variation, value)));
      }
    }
  }
  out << '\n';
  if (!r.base.feasible()) {
    out << "Verdict: the base case has no winner to test.\n";
  } else if (changes.empty()) {
    fmt::print(out, "Verdict: {} stays the winner at every end tested.\n",
               r.base.winner().profile_id);
  } else {
    out << "* the winner differs from the base case's. Verdict: the recommendation of "
        << r.base.winner().profile_id << " does not survive every end; the winner becomes:\n";
    for (const std::string& c : changes) out << "  " << c << '\n';
  }
  out << '\n';
  print_safety_notice(out);
}

void write_tornado_json(std::ostream& out, const StudyCase& study, const TornadoResult& r) {
  JsonWriter json;
  json.begin_object();
  write_study_json(json, study);
  json.field("analysis", "tornado");
  json.field("hold_designs", r.hold_designs);
  json.key("base");
  write_point_json(json, {}, r.base);
  json.key("bars").begin_array();
  for (const TornadoBar& b : r.bars) {
    json.begin_object();
    json.key("variation");
    write_variation_json(json, b.variation);
    json.field("swing_npc", b.swing_npc);
    json.field("winner_changes", b.winner_changes);
    json.key("low");
    write_point_json(json, {{b.variation.path, b.variation.low}}, b.low);
    json.key("high");
    write_point_json(json, {{b.variation.path, b.variation.high}}, b.high);
    json.end_object();
  }
  json.end_array();
  json.end_object();
  out << json.str() << '\n';
}

void write_tornado_csv(std::ostream& out, const StudyCase& study, const TornadoResult& r) {
  out << "path,label,unit,end,value,swing_npc,winner_changes" << csv_point_header(study);
  out << ",,,base,,,";
  write_point_csv_tail(out, study, r.base);
  for (const TornadoBar& b : r.bars) {
    for (int end = 0; end < 2; ++end) {
      out << csv_text(b.variation.path) << ',' << csv_text(b.variation.label) << ','
          << csv_text(b.variation.unit) << ',' << (end == 0 ? "low" : "high") << ','
          << format_machine(end == 0 ? b.variation.low : b.variation.high) << ','
          << format_machine(b.swing_npc) << ',' << (b.winner_changes ? "true" : "false");
      write_point_csv_tail(out, study, end == 0 ? b.low : b.high);
    }
  }
}

void write_grid_text(std::ostream& out, const StudyCase& study, const GridResult& g) {
  std::string what = fmt::format("{}-D grid, ", g.axes.size()) + point_mode_text(g.hold_designs);
  print_study_header(out, study, what);
  out << '\n';
  print_base_line(out, study, g.base);
  const std::string& cur = study.economics.currency;
  for (std::size_t a = 0; a < g.axes.size(); ++a) {
    fmt::print(out, "Axis {}: {} ({} values{})\n", a + 1, g.axes[a].label, g.values[a].size(),
               g.axes[a].unit.empty() ? "" : ", " + g.axes[a].unit);
  }
  const std::size_t columns = g.values.size() > 1 ? g.values[1].size() : 1;
  out << '\n';
  std::string head = fmt::format("{:>14}", "axis 1");
  if (g.axes.size() > 1) head += fmt::format(" {:>14}", "axis 2");
  fmt::print(out, "{}  {:<22} {:>14} {:>12}  {}\n", head, "winner", "NPC " + cur, "LCOS " + cur,
             "design");
  bool any_change = false;
  for (std::size_t k = 0; k < g.points.size(); ++k) {
    const PointOutcome& p = g.points[k];
    any_change = any_change || !winner_mark(p, g.base).empty();
    std::string row = fmt::format("{:>14}", format_general(g.values[0][k / columns], 6));
    if (g.axes.size() > 1)
      row += fmt::format(" {:>14}", format_general(g.values[1][k % columns], 6));
    const DesignSummary* w = winner_or_null(p);
    fmt::print(out, "{}  {:<22} {:>14} {:>12}  {}\n", row, winner_name(p) + winner_mark(p, g.base),
               w ? format_amount(w->npc) : "n/a", w ? format_fixed(w->lcos_per_kwh, 4) : "n/a",
               w ? design_text(*w) : "");
  }
  if (any_change) out << "* the winner differs from the base case's\n";
  if (g.axes.size() > 1) {
    fmt::print(out, "\nWinner map: rows {} (down), columns {} (across)\n", g.axes[0].label,
               g.axes[1].label);
    std::string legend;
    for (std::size_t i = 0; i < study.profiles.size(); ++i) {
      legend += fmt::format("{}{} = {}", i == 0 ? "" : ", ", static_cast<char>('A' + i % 26),
                            study.profiles[i].id);
    }
    fmt::print(out, "{:>14} ", "");
    for (double x : g.values[1]) fmt::print(out, " {:>8}", format_general(x, 5));
    out << '\n';
    for (std::size_t i = 0; i < g.values[0].size(); ++i) {
      fmt::print(out, "{:>14} ", format_general(g.values[0][i], 6));
      for (std::size_t j = 0; j < columns; ++j) {
        const PointOutcome& p = g.at(i, j);
        std::string cell = "-";
        if (p.feasible()) {
          const auto at = study.find_profile(p.winner().profile_id);
          if (at) cell = std::string(1, static_cast<char>('A' + *at % 26));
        }
        fmt::print(out, " {:>8}", cell);
      }
      out << '\n';
    }
    out << legend << "; - = no design meets the limit\n";
  }
  out << '\n';
  print_safety_notice(out);
}

void write_grid_json(std::ostream& out, const StudyCase& study, const GridResult& g) {
  JsonWriter json;
  json.begin_object();
  write_study_json(json, study);
  json.field("analysis", "grid");
  json.field("hold_designs", g.hold_designs);
  json.key("axes").begin_array();
  for (std::size_t a = 0; a < g.axes.size(); ++a) {
    json.begin_object();
    json.key("variation");
    write_variation_json(json, g.axes[a]);
    json.key("values").begin_array();
    for (double x : g.values[a]) json.value(x);
    json.end_array();
    json.end_object();
  }
  json.end_array();
  json.key("base");
  write_point_json(json, {}, g.base);
  json.key("points").begin_array();
  const std::size_t columns = g.values.size() > 1 ? g.values[1].size() : 1;
  for (std::size_t k = 0; k < g.points.size(); ++k) {
    std::vector<Setting> s{{g.axes[0].path, g.values[0][k / columns]}};
    if (g.axes.size() > 1) s.push_back({g.axes[1].path, g.values[1][k % columns]});
    write_point_json(json, s, g.points[k]);
  }
  json.end_array();
  json.end_object();
  out << json.str() << '\n';
}

void write_grid_csv(std::ostream& out, const StudyCase& study, const GridResult& g) {
  out << csv_text(g.axes[0].path);
  if (g.axes.size() > 1) out << ',' << csv_text(g.axes[1].path);
  out << csv_point_header(study);
  const std::size_t columns = g.values.size() > 1 ? g.values[1].size() : 1;
  for (std::size_t k = 0; k < g.points.size(); ++k) {
    out << format_machine(g.values[0][k / columns]);
    if (g.axes.size() > 1) out << ',' << format_machine(g.values[1][k % columns]);
    write_point_csv_tail(out, study, g.points[k]);
  }
}

}  // namespace stowage::report
