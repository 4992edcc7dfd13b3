// SPDX-License-Identifier: MIT
#include "optimiser/report/robustness_document.h"

#include <algorithm>
#include <cmath>
#include <map>
#include <memory>
#include <utility>
#include <vector>

#include "optimiser/report/breakeven_report.h"
#include "optimiser/report/number_format.h"
#include "optimiser/report/robustness_charts.h"
#include "optimiser/report/study_hash.h"
#include "optimiser/report/study_report.h"
#include "optimiser/report/sweep_report.h"
#include "optimiser/report/uncertainty_report.h"
#include "stowage_version.h"

namespace stowage::report {

namespace {

std::string percent(double fraction) { return format_fixed(100 * fraction, 1) + " %"; }

// A number of the JSON at `key`, or "-" untagged when it is not finite (the JSON has null).
ReportCell number_cell(const std::string& text, const std::string& key, double value) {
  return std::isfinite(value) ? tagged(text, key, value) : plain("-");
}
ReportCell amount_cell(double value, const std::string& key) {
  return number_cell(std::isfinite(value) ? format_amount(value) : "", key, value);
}

// The index of a profile's design in a point's JSON "designs" list (write_point_json lists
// the profiles that have a design, in study order).
std::size_t design_index(const PointOutcome& p, const std::string& profile_id) {
  std::size_t index = 0;
  for (const std::optional<DesignSummary>& d : p.by_profile) {
    if (!d) continue;
    if (d->profile_id == profile_id) return index;
    ++index;
  }
  return index;
}

ReportDocument new_document(const LoadedStudy& loaded, const std::string& what,
                            const std::string& generated_at) {
  const StudyCase& study = loaded.study;
  ReportDocument doc;
  doc.title = (study.title.empty() ? "Battery bank study" : study.title) + ": " + what;
  doc.subtitle = "How robust the lifecycle-cost answer for " + study.site.name + " is (" +
                 std::to_string(study.economics.project_years) + " years at a " +
                 format_general(100 * study.economics.real_discount_rate, 4) +
                 " % real discount rate, in " + study.economics.currency + ").";
  doc.generated_line = "Generated " + generated_at + " by stowage " + STOWAGE_VERSION_STRING;
  return doc;
}

// The base case's winner as a table, its numbers tagged under `prefix` ("base").
ReportTable base_table(const StudyCase& study, const PointOutcome& base,
                       const std::string& prefix) {
  const std::string& cur = study.economics.currency;
  const DesignSummary& w = base.winner();
  const std::string k =
      prefix + ".designs[" + std::to_string(design_index(base, w.profile_id)) + "]";
  ReportTable t;
  t.caption = "Winner of the base case (every input at its study value)";
  t.header = {"quantity", "value"};
  t.numeric = {false, true};
  t.rows.push_back({plain("profile"), tagged_text(w.profile_id, prefix + ".winner")});
  t.rows.push_back({plain("DoD setpoint (fraction)"),
                    tagged(format_fixed(w.dod_setpoint, 2), k + ".dod_setpoint", w.dod_setpoint)});
  t.rows.push_back(
      {plain("strings in parallel"),
       tagged(std::to_string(w.strings_parallel), k + ".strings_parallel", w.strings_parallel)});
  t.rows.push_back(
      {plain("nameplate energy (kWh)"),
       tagged(format_amount(w.nameplate_kwh, 1), k + ".nameplate_kwh", w.nameplate_kwh)});
  t.rows.push_back(
      {plain("net present cost (" + cur + ")"), tagged(format_amount(w.npc), k + ".npc", w.npc)});
  t.rows.push_back({plain("LCOS (" + cur + " per kWh delivered)"),
                    tagged(format_fixed(w.lcos_per_kwh, 4), k + ".lcos_per_kwh", w.lcos_per_kwh)});
  return t;
}

std::string planning_note() {
  return "This is a planning estimate. Read the safety cautions at the end of this report before "
         "acting on it.";
}

// How this analysis works, then the study report's method summary.
ReportSection analysis_method_section(const std::string& title, std::vector<std::string> items) {
  ReportSection s;
  s.id = "analysis-method";
  s.title = title;
  s.paragraph(
      "docs/robustness.md gives the method of every robustness analysis in full; "
      "docs/usage.md the JSON and CSV fields of the data files beside this report. Besides "
      "the input files above, the report depends on the run's own settings, all stated in it: "
      "the inputs moved and their ranges or distributions, the number of samples and the seed, "
      "the grid values or the scan, and whether designs were re-optimised or held.");
  s.bullets(std::move(items));
  return s;
}

void finish_document(ReportDocument& doc, const LoadedStudy& loaded, ReportSection method,
                     std::vector<std::string> limits) {
  doc.sections.push_back(reproduce_section(hash_study_inputs(loaded), "Study"));
  doc.sections.push_back(std::move(method));
  doc.sections.push_back(study_method_section(false));
  ReportSection own;
  own.id = "analysis-limits";
  own.title = "Limits of this analysis";
  own.bullets(std::move(limits));
  doc.sections.push_back(std::move(own));
  doc.sections.push_back(study_limits_section());
  doc.sections.push_back(safety_section());
}

std::string mode_sentence(bool hold_designs) {
  return hold_designs ? "The base case's best design of each profile is held fixed and evaluated "
                        "exactly at every point (its geometry unchanged)."
                      : "Every point is optimised again, so the design may change with the input.";
}

std::string source_text(const Variation& v) { return v.source.empty() ? "not stated" : v.source; }

// ---- sweep: tornado -----------------------------------------------------------------------

ReportSection tornado_decision(const StudyCase& study, const TornadoResult& t) {
  ReportSection s;
  s.id = "decision";
  s.title = "Decision";
  if (!t.base.feasible()) {
    s.paragraph(
        "No design meets the study's requirements in the base case, so there is no "
        "recommendation whose robustness could be tested. Run stowage optimise on the study "
        "to see what stands in the way.");
    s.paragraph(planning_note());
    return s;
  }
  const std::string& winner = t.base.winner().profile_id;
  std::vector<std::string> changes;
  for (const TornadoBar& b : t.bars) {
    if (b.winner_changes) changes.push_back(b.variation.label);
  }
  s.paragraph("Base case: " + winner + " wins with a net present cost of " +
              format_amount(t.base.winner().npc) + " " + study.economics.currency + ". " +
              (changes.empty()
                   ? winner + " stays the winner at both ends of every one of the " +
                         std::to_string(t.bars.size()) + " inputs varied."
                   : "Another profile wins at an end of " + std::to_string(changes.size()) +
                         " of the " + std::to_string(t.bars.size()) +
                         " inputs varied; see the "
                         "sensitivity section."));
  s.table(base_table(study, t.base, "base"));
  if (!changes.empty()) {
    std::string joined;
    for (std::size_t i = 0; i < changes.size(); ++i) joined += (i ? ", " : "") + changes[i];
    s.notice("The recommendation of " + winner + " depends on: " + joined +
             ". Firm these inputs before deciding.");
  }
  s.paragraph(planning_note());
  return s;
}

// ---- sweep: grid --------------------------------------------------------------------------

std::string point_key(std::size_t k) { return "points[" + std::to_string(k) + "]"; }

ReportSection grid_decision(const StudyCase& study, const GridResult& g) {
  ReportSection s;
  s.id = "decision";
  s.title = "Decision";
  std::map<std::string, std::size_t> wins;
  std::size_t none = 0;
  for (const PointOutcome& p : g.points) {
    if (p.feasible()) {
      ++wins[p.winner().profile_id];
    } else {
      ++none;
    }
  }
  std::string axes = g.axes[0].label;
  if (g.axes.size() > 1) axes += " and " + g.axes[1].label;
  std::string counts;
  for (const ChemistryProfile& p : study.profiles) {
    const auto it = wins.find(p.id);
    if (it == wins.end()) continue;
    counts += (counts.empty() ? "" : ", ") + p.id + " at " + std::to_string(it->second) + " points";
  }
  if (none > 0)
    counts +=
        (counts.empty() ? "" : ", ") + std::string("none at ") + std::to_string(none) + " points";
  if (g.base.feasible()) {
    s.paragraph("Base case: " + g.base.winner().profile_id + " wins with a net present cost of " +
                format_amount(g.base.winner().npc) + " " + study.economics.currency + ".");
    s.table(base_table(study, g.base, "base"));
  } else {
    s.paragraph("No design meets the study's requirements in the base case.");
  }
  s.paragraph("Over the " + std::to_string(g.points.size()) + " points of the grid over " + axes +
              ", the winner is " + (counts.empty() ? "none" : counts) + ".");
  if (g.base.feasible() && wins.size() == 1 && none == 0 &&
      wins.begin()->first == g.base.winner().profile_id) {
    s.paragraph(g.base.winner().profile_id + " wins at every point of the grid.");
  } else if (g.base.feasible()) {
    s.notice("The winner changes within the grid: the recommendation of " +
             g.base.winner().profile_id + " holds only in part of the range of " + axes + ".");
  }
  s.paragraph(planning_note());
  return s;
}

ReportSection grid_section(const StudyCase& study, const GridResult& g) {
  const std::string& cur = study.economics.currency;
  ReportSection s;
  s.id = "sweep";
  s.title = g.axes.size() == 1 ? "Sweep of one input" : "Sweep of two inputs";
  std::string what = "Each point sets ";
  what += g.axes.size() == 1 ? "the input to one value of its grid"
                             : "the two inputs to one combination of their grid values";
  s.paragraph(what + ", every other input at its study value. " + mode_sentence(g.hold_designs) +
              " The numbers are those of sweep.json.");
  ReportTable axes;
  axes.caption = "Inputs varied";
  axes.header = {"input", "parameter path", "values", "base", "range from"};
  axes.numeric = {false, false, false, true, false};
  for (std::size_t a = 0; a < g.axes.size(); ++a) {
    std::string values;
    for (double x : g.values[a]) values += (values.empty() ? "" : ", ") + format_general(x, 6);
    const Variation& v = g.axes[a];
    axes.rows.push_back({plain(v.label), plain(v.path), plain(values + " " + v.unit),
                         tagged(format_general(v.base, 6),
                                "axes[" + std::to_string(a) + "].variation.base", v.base),
                         plain(source_text(v))});
  }
  s.table(axes);
  ReportTable t;
  t.caption = "Winner and net present cost of each profile at every point (" + cur + ")";
  for (const Variation& v : g.axes) {
    t.header.push_back(v.label + (v.unit.empty() ? "" : " (" + v.unit + ")"));
    t.numeric.push_back(true);
  }
  for (const std::string& h : std::vector<std::string>{"winner", "winner's DoD", "winner's strings",
                                                       "winner's LCOS (" + cur + "/kWh)"}) {
    t.header.push_back(h);
    t.numeric.push_back(h != "winner");
  }
  for (const ChemistryProfile& p : study.profiles) {
    t.header.push_back("NPC " + p.id);
    t.numeric.push_back(true);
  }
  const std::size_t columns = g.values.size() > 1 ? g.values[1].size() : 1;
  for (std::size_t k = 0; k < g.points.size(); ++k) {
    const PointOutcome& p = g.points[k];
    const std::string key = point_key(k);
    std::vector<ReportCell> row;
    row.push_back(tagged(format_general(g.values[0][k / columns], 6), key + ".settings[0].value",
                         g.values[0][k / columns]));
    if (g.axes.size() > 1)
      row.push_back(tagged(format_general(g.values[1][k % columns], 6), key + ".settings[1].value",
                           g.values[1][k % columns]));
    if (p.feasible()) {
      const DesignSummary& w = p.winner();
      const std::string d = key + ".designs[" + std::to_string(design_index(p, w.profile_id)) + "]";
      row.push_back(tagged_text(w.profile_id, key + ".winner"));
      row.push_back(tagged(format_fixed(w.dod_setpoint, 2), d + ".dod_setpoint", w.dod_setpoint));
      row.push_back(
          tagged(std::to_string(w.strings_parallel), d + ".strings_parallel", w.strings_parallel));
      row.push_back(tagged(format_fixed(w.lcos_per_kwh, 4), d + ".lcos_per_kwh", w.lcos_per_kwh));
    } else {
      row.push_back(plain("none meets the limits"));
      row.push_back(plain("-"));
      row.push_back(plain("-"));
      row.push_back(plain("-"));
    }
    for (std::size_t i = 0; i < study.profiles.size(); ++i) {
      if (i < p.by_profile.size() && p.by_profile[i]) {
        const std::string d =
            key + ".designs[" + std::to_string(design_index(p, p.by_profile[i]->profile_id)) + "]";
        row.push_back(amount_cell(p.by_profile[i]->npc, d + ".npc"));
      } else {
        row.push_back(plain("-"));
      }
    }
    t.rows.push_back(std::move(row));
  }
  s.table(t);
  bool any = false;
  for (const PointOutcome& p : g.points) any = any || p.feasible();
  if (any) {
    if (g.axes.size() == 1) {
      s.figure(sweep_line_chart(study, g));
    } else {
      s.figure(winner_map_chart(study, g));
      ReportTable map;
      map.caption = "Winner at every point: rows " + g.axes[0].label + ", columns " +
                    g.axes[1].label + " (letters as in the key)";
      map.header = {g.axes[0].label + " \\ " + g.axes[1].label};
      map.numeric = {true};
      for (double x : g.values[1]) {
        map.header.push_back(format_general(x, 6));
        map.numeric.push_back(false);
      }
      for (std::size_t i = 0; i < g.values[0].size(); ++i) {
        std::vector<ReportCell> row{plain(format_general(g.values[0][i], 6))};
        for (std::size_t j = 0; j < g.values[1].size(); ++j) {
          const PointOutcome& p = g.at(i, j);
          row.push_back(plain(
              p.feasible() ? profile_letter(*study.find_profile(p.winner().profile_id)) : "-"));
        }
        map.rows.push_back(std::move(row));
      }
      s.table(map);
      std::vector<std::string> key;
      for (std::size_t k = 0; k < study.profiles.size(); ++k)
        key.push_back(profile_letter(k) + ": " + study.profiles[k].id);
      key.push_back("-: no design meets the limits");
      s.bullets(key);
    }
  }
  return s;
}

// ---- uncertainty --------------------------------------------------------------------------

std::string profile_key(std::size_t i) { return "profiles[" + std::to_string(i) + "]"; }

std::string sampling_text(const UncertaintyResult& r) {
  return std::to_string(r.samples) + " samples (" +
         (r.latin_hypercube ? "Latin hypercube" : "Monte Carlo") + ", seed " +
         std::to_string(r.seed) + ")";
}

ReportSection uncertainty_decision(const StudyCase& study, const UncertaintyResult& r) {
  ReportSection s;
  s.id = "decision";
  s.title = "Decision";
  const std::string& cur = study.economics.currency;
  const ProfileUncertainty* base = nullptr;
  for (const ProfileUncertainty& p : r.profiles) {
    if (p.profile_id == r.base_winner) base = &p;
  }
  if (!base) {
    s.paragraph(
        "The base case has no design meeting the study's requirements, so there is no "
        "recommendation to test; the samples below show how often each profile would win.");
  } else {
    s.paragraph("The base case's winner, " + base->profile_id + ", is the cheapest design in " +
                percent(base->win_probability) + " (standard error " +
                percent(base->win_probability_se) + ") of " + sampling_text(r) +
                " of the study's uncertain inputs. " +
                (base->win_probability >= 0.9
                     ? "The recommendation holds over most of the input uncertainty."
                     : "Other profiles win in a material share of the samples: the "
                       "recommendation rests on the inputs drawn, see below."));
  }
  ReportTable t;
  t.caption = "Probability of being cheapest and spread of the net present cost (" + cur + ")";
  t.header = {"profile", "P(cheapest)", "standard error", "NPC P10", "NPC P50", "NPC P90"};
  t.numeric = {false, true, true, true, true, true};
  for (std::size_t i = 0; i < r.profiles.size(); ++i) {
    const ProfileUncertainty& p = r.profiles[i];
    const std::string k = profile_key(i);
    t.rows.push_back(
        {tagged_text(p.profile_id, k + ".profile"),
         tagged(percent(p.win_probability), k + ".win_probability", p.win_probability),
         tagged(percent(p.win_probability_se), k + ".win_probability_se", p.win_probability_se),
         amount_cell(p.npc.p10, k + ".npc.p10"), amount_cell(p.npc.p50, k + ".npc.p50"),
         amount_cell(p.npc.p90, k + ".npc.p90")});
  }
  if (!t.rows.empty()) s.table(t);
  if (r.no_winner_probability > 0) {
    s.notice("No design meets the unserved-energy limit in " + percent(r.no_winner_probability) +
             " of the samples.");
  }
  s.paragraph(planning_note());
  return s;
}

// True when some drawn inputs are rank-correlated (their draws re-ordered by Iman-Conover).
bool has_rank_correlations(const UncertaintyResult& r) {
  return std::any_of(r.drawn.begin(), r.drawn.end(),
                     [](const Variation& v) { return !v.rank_correlations.empty(); });
}

ReportSection uncertainty_section(const StudyCase& study, const UncertaintyResult& r) {
  const std::string& cur = study.economics.currency;
  ReportSection s;
  s.id = "uncertainty";
  s.title = "Uncertainty of the ranking";
  s.paragraph("Each of " + sampling_text(r) + " draws every input below from its distribution, " +
              (has_rank_correlations(r)
                   ? std::string("with the rank correlations the study states between them, ")
                   : std::string("independently of the others, ")) +
              "every other input at its study value. " +
              (r.reoptimise ? std::string("Every sample is optimised again.")
                            : std::string("The base case's best design of each profile is "
                                          "evaluated exactly in every sample.")) +
              " The numbers are those of uncertainty.json; samples.csv holds every sample.");
  ReportTable drawn;
  drawn.caption = "Inputs drawn";
  drawn.header = {"input", "parameter path", "distribution", "range from"};
  drawn.numeric = {false, false, false, false};
  for (std::size_t i = 0; i < r.drawn.size(); ++i) {
    const Variation& v = r.drawn[i];
    drawn.rows.push_back({tagged_text(v.label, "drawn[" + std::to_string(i) + "].label"),
                          tagged_text(v.path, "drawn[" + std::to_string(i) + "].path"),
                          plain(distribution_text(v)), plain(source_text(v))});
  }
  if (!drawn.rows.empty()) s.table(drawn);
  ReportTable t;
  t.caption = "Per profile over the samples (NPC and regret in " + cur + ", LCOS in " + cur +
              " per kWh delivered)";
  t.header = {
      "profile",  "samples",  "NPC mean",  "NPC standard error", "LCOS P10",
      "LCOS P50", "LCOS P90", "LCOS mean", "expected regret",    "samples breaking the limit"};
  t.numeric = {false, true, true, true, true, true, true, true, true, true};
  for (std::size_t i = 0; i < r.profiles.size(); ++i) {
    const ProfileUncertainty& p = r.profiles[i];
    const std::string k = profile_key(i);
    const auto lcos = [&](double v, const std::string& key) {
      return number_cell(std::isfinite(v) ? format_fixed(v, 4) : "", k + ".lcos_per_kwh." + key, v);
    };
    t.rows.push_back(
        {plain(p.profile_id),
         tagged(std::to_string(p.samples), k + ".samples", static_cast<double>(p.samples)),
         amount_cell(p.npc.mean, k + ".npc.mean"),
         amount_cell(p.npc.standard_error, k + ".npc.standard_error"), lcos(p.lcos.p10, "p10"),
         lcos(p.lcos.p50, "p50"), lcos(p.lcos.p90, "p90"), lcos(p.lcos.mean, "mean"),
         amount_cell(p.expected_regret, k + ".expected_regret"),
         tagged(std::to_string(p.fails_limit), k + ".fails_limit",
                static_cast<double>(p.fails_limit))});
  }
  if (t.rows.empty()) {
    s.paragraph(
        "No profile has a design in the base case, so there was no design to evaluate in the "
        "samples.");
  } else {
    s.table(t);
    s.paragraph(
        "Expected regret: the profile's net present cost less the cheapest of the sample, "
        "averaged over the samples in which it meets the unserved-energy limit.");
  }
  bool any_npc = false, any_lcos = false;
  for (const ProfileUncertainty& p : r.profiles) {
    any_npc = any_npc || std::isfinite(p.npc.p50);
    any_lcos = any_lcos || std::isfinite(p.lcos.p50);
  }
  if (any_npc) s.figure(uncertainty_spread_chart(r, SpreadQuantity::Npc, cur));
  if (any_npc) s.figure(npc_ecdf_chart(r, cur));
  if (any_lcos) s.figure(uncertainty_spread_chart(r, SpreadQuantity::Lcos, cur));
  if (!r.profiles.empty()) s.figure(win_probability_chart(r));
  if (!r.convergence.empty() && !r.base_winner.empty()) {
    ReportTable c;
    c.caption = "Convergence: probability that " + r.base_winner +
                " (the base winner) is cheapest after the first N samples";
    c.header = {"samples", "P(cheapest)", "standard error"};
    c.numeric = {true, true, true};
    for (std::size_t i = 0; i < r.convergence.size(); ++i) {
      const ConvergencePoint& p = r.convergence[i];
      const std::string k = "convergence[" + std::to_string(i) + "]";
      c.rows.push_back(
          {tagged(std::to_string(p.samples), k + ".samples", static_cast<double>(p.samples)),
           tagged(percent(p.win_probability), k + ".win_probability", p.win_probability),
           tagged(percent(p.standard_error), k + ".standard_error", p.standard_error)});
    }
    s.table(c);
  }
  return s;
}

// ---- break-even ---------------------------------------------------------------------------

std::string be_value(const BreakevenResult& r, double x) {
  return format_general(x, 7) + (r.unit.empty() ? "" : " " + r.unit);
}

// The winner below and above the crossing: the profile on its winning side, the cheapest
// rival at the bracket's end on the other.
std::pair<std::string, std::string> sides(const BreakevenResult& r) {
  const std::string below = r.profile_wins_at_from ? r.profile_id : r.at_low.rival_id;
  const std::string above = r.profile_wins_at_from ? r.at_high.rival_id : r.profile_id;
  return {below.empty() ? "no design" : below, above.empty() ? "no design" : above};
}

ReportSection breakeven_decision(const StudyCase& study, const BreakevenResult& r) {
  ReportSection s;
  s.id = "decision";
  s.title = "Decision";
  const std::string& cur = study.economics.currency;
  ReportTable t;
  t.caption = "Break-even of " + r.profile_id + " against the cheapest other profile";
  t.header = {"quantity", "value"};
  t.numeric = {false, true};
  t.rows.push_back({plain("input"), tagged_text(r.path, "path")});
  t.rows.push_back({plain("profile whose tie is sought"), tagged_text(r.profile_id, "profile")});
  t.rows.push_back({plain("range searched, from (" + r.unit + ")"),
                    tagged(format_general(r.from, 7), "from", r.from)});
  t.rows.push_back(
      {plain("range searched, to (" + r.unit + ")"), tagged(format_general(r.to, 7), "to", r.to)});
  if (r.crossing) {
    const auto [below, above] = sides(r);
    s.paragraph("Break-even: " + r.profile_id + " ties the cheapest other profile at " + r.path +
                " = " + be_value(r, r.value) + ". Below it " + below + " is cheaper, above it " +
                above + ".");
    t.rows.push_back({plain("break-even value (" + r.unit + ")"),
                      tagged(format_general(r.value, 7), "value", r.value)});
    t.rows.push_back({plain("final bracket, low end (" + r.unit + ")"),
                      tagged(format_general(r.bracket_low, 7), "bracket_low", r.bracket_low)});
    t.rows.push_back({plain("final bracket, high end (" + r.unit + ")"),
                      tagged(format_general(r.bracket_high, 7), "bracket_high", r.bracket_high)});
    t.rows.push_back({plain("cheaper below the break-even"), plain(below)});
    t.rows.push_back({plain("cheaper above the break-even"), plain(above)});
    t.rows.push_back(
        {plain("NPC of " + r.profile_id + " at the bracket's low end (" + cur + ")"),
         plain(std::isfinite(r.at_low.profile_npc) ? format_amount(r.at_low.profile_npc) : "-")});
    t.rows.push_back(
        {plain("NPC of the cheapest other at the bracket's low end (" + cur + ")"),
         plain(std::isfinite(r.at_low.rival_npc) ? format_amount(r.at_low.rival_npc) : "-")});
    s.table(t);
    if (r.step) {
      s.notice(
          "The gap jumps across the final bracket (by more than 0.1 % of the winner's net "
          "present cost): the profiles swap places at a step, such as a replacement moving by a "
          "year or a design change, not at a smooth tie; the value is where the step lies.");
    }
  } else {
    const std::string throughout =
        r.profile_wins_at_from ? r.profile_id : "the cheapest other profile";
    s.paragraph("No crossing between " + be_value(r, r.from) + " and " + be_value(r, r.to) + ": " +
                throughout +
                " is cheaper over the whole range searched (a crossing and its "
                "return between two scanned values can be missed; a finer scan finds them).");
    s.table(t);
  }
  s.paragraph(planning_note());
  return s;
}

ReportSection breakeven_section(const StudyCase& study, const BreakevenResult& r) {
  const std::string& cur = study.economics.currency;
  ReportSection s;
  s.id = "breakeven";
  s.title = "Break-even search";
  s.paragraph("The gap is " + r.profile_id +
              "'s net present cost less the cheapest other profile's (negative: " + r.profile_id +
              " is cheaper). It is evaluated at " + std::to_string(r.scan.size()) +
              " values across the range, then the first bracket where it changes sign is halved " +
              std::to_string(r.bisection.size()) + " times. " + mode_sentence(r.hold_designs) +
              " The numbers are those of breakeven.json.");
  const auto probe_table = [&](const std::vector<BreakevenProbe>& probes, const std::string& list,
                               const std::string& caption) {
    ReportTable t;
    t.caption = caption;
    t.header = {r.path + " (" + r.unit + ")", "NPC " + r.profile_id + " (" + cur + ")",
                "cheapest other", "its NPC (" + cur + ")", "gap (" + cur + ")"};
    t.numeric = {true, true, false, true, true};
    for (std::size_t i = 0; i < probes.size(); ++i) {
      const BreakevenProbe& p = probes[i];
      const std::string k = list + "[" + std::to_string(i) + "]";
      t.rows.push_back({tagged(format_general(p.value, 7), k + ".value", p.value),
                        amount_cell(p.profile_npc, k + ".profile_npc"),
                        p.rival_id.empty() ? plain("none") : tagged_text(p.rival_id, k + ".rival"),
                        amount_cell(p.rival_npc, k + ".rival_npc"),
                        std::isinf(p.gap)
                            ? plain(p.gap > 0 ? "cannot win" : "no rival")
                            : number_cell(format_signed_amount(p.gap), k + ".gap", p.gap)});
    }
    return t;
  };
  s.table(probe_table(r.scan, "scan", "Scan of the range"));
  if (!r.bisection.empty())
    s.table(
        probe_table(r.bisection, "bisection", "Bisection of the bracket, in the order evaluated"));
  bool finite = false;
  for (const auto* list : {&r.scan, &r.bisection}) {
    for (const BreakevenProbe& p : *list)
      finite = finite || std::isfinite(p.profile_npc) || std::isfinite(p.rival_npc);
  }
  if (finite) s.figure(breakeven_chart(r, cur));
  return s;
}

}  // namespace

// ---- documents ----------------------------------------------------------------------------

ReportDocument build_tornado_report(const LoadedStudy& loaded, const TornadoResult& result,
                                    const std::string& generated_at) {
  const StudyCase& study = loaded.study;
  ReportDocument doc = new_document(loaded, "sensitivity sweep", generated_at);
  doc.sections.push_back(tornado_decision(study, result));
  if (result.base.feasible())
    doc.sections.push_back(sensitivity_section(study, result, "sweep.json"));
  finish_document(
      doc, loaded,
      analysis_method_section(
          "How the sweep works",
          {"One input at a time: each input the study names under variations (or --vary) is "
           "set to its low and then its high end, every other input at its study value.",
           mode_sentence(result.hold_designs),
           "Inputs are sorted by the swing of the winner's net present cost between the two "
           "ends, largest first; an asterisk marks an end where another profile wins."}),
      {"One input moves at a time: the effect of two inputs moving together is not shown "
       "(a grid of two, stowage sweep --grid, shows it).",
       "The low and high ends are those of the study's variations; their sources are in the "
       "sensitivity table."});
  return doc;
}

ReportDocument build_grid_report(const LoadedStudy& loaded, const GridResult& result,
                                 const std::string& generated_at) {
  const StudyCase& study = loaded.study;
  ReportDocument doc = new_document(
      loaded, result.axes.size() == 1 ? "sweep of one input" : "sweep of two inputs", generated_at);
  doc.sections.push_back(grid_decision(study, result));
  doc.sections.push_back(grid_section(study, result));
  finish_document(
      doc, loaded,
      analysis_method_section(
          "How the sweep works",
          {"A grid: each varied input takes its listed points or evenly spaced values from its "
           "low to its high end; every combination is a point, every other input at its study "
           "value.",
           mode_sentence(result.hold_designs),
           "The winner at a point is the cheapest design by net present cost of those meeting "
           "the unserved-energy limit (ties: profile order)."}),
      {"Between two grid values the winner is not known; a finer grid (--steps) shows more.",
       "The ranges are those of the study's variations or --vary; their sources are in the "
       "inputs table."});
  return doc;
}

ReportDocument build_uncertainty_report(const LoadedStudy& loaded, const UncertaintyResult& result,
                                        const std::string& generated_at) {
  const StudyCase& study = loaded.study;
  ReportDocument doc = new_document(loaded, "uncertainty of the ranking", generated_at);
  const bool correlated = has_rank_correlations(result);
  doc.sections.push_back(uncertainty_decision(study, result));
  doc.sections.push_back(uncertainty_section(study, result));
  finish_document(
      doc, loaded,
      analysis_method_section(
          "How the samples are drawn",
          {std::string(result.latin_hypercube
                           ? "Latin hypercube: each input's range of probability is cut into "
                             "as many strata as samples, one draw in each."
                           : "Monte Carlo: every input is drawn at random from its "
                             "distribution.") +
               (correlated
                    ? " The stated rank correlations are imposed by re-ordering each input's "
                      "draws (Iman and Conover 1982), which needs all samples at once: the "
                      "draws depend on the seed and the number of samples, and are the same "
                      "on any number of threads and shards."
                    : " The draws depend only on the seed and the sample number, so the same "
                      "seed gives the same samples on any number of threads."),
           "Percentiles P10, P50 and P90 are those of the samples; the standard error of a "
           "probability p over N samples is sqrt(p(1-p)/N) (binomial).",
           "Win probability: the share of samples in which the profile's design is the "
           "cheapest meeting the unserved-energy limit (ties: profile order)."}),
      {correlated ? "Only the stated rank correlations link the inputs; every other pair is "
                    "drawn independently."
                  : "Inputs are drawn independently: no correlation between them is modelled.",
       "The distributions are those the study states; their sources are in the inputs table.",
       std::to_string(result.samples) + " samples: a share of a few per cent or less rests on "
                                        "few samples; the standard errors say how few."});
  return doc;
}

ReportDocument build_breakeven_report(const LoadedStudy& loaded, const BreakevenResult& result,
                                      const std::string& generated_at) {
  const StudyCase& study = loaded.study;
  ReportDocument doc = new_document(loaded, "break-even of one input", generated_at);
  doc.sections.push_back(breakeven_decision(study, result));
  doc.sections.push_back(breakeven_section(study, result));
  finish_document(
      doc, loaded,
      analysis_method_section(
          "How the break-even is found",
          {"The gap between the profile's net present cost and the cheapest other profile's is "
           "evaluated at both ends of the range and at evenly spaced values between them.",
           "The first neighbouring pair whose gaps differ in sign brackets the crossing; the "
           "bracket is halved until it is no wider than the tolerance, and the value reported "
           "is where the straight line through the bracket's ends crosses zero.",
           mode_sentence(result.hold_designs)}),
      {"Only the first crossing from the low end is sought; a crossing and its return between "
       "two scanned values can be missed (more --scan-points find them).",
       "Every other input stays at its study value."});
  return doc;
}

// ---- files --------------------------------------------------------------------------------

void add_tornado_report_files(OutputSet& set, const LoadedStudy& loaded,
                              const TornadoResult& result, const std::string& generated_at) {
  add_document_files(set, std::make_shared<const ReportDocument>(
                              build_tornado_report(loaded, result, generated_at)));
  const StudyCase* study = &loaded.study;
  const TornadoResult* r = &result;
  set.add("sweep.json", [study, r](std::ostream& out) { write_tornado_json(out, *study, *r); });
  set.add("tornado.csv", [study, r](std::ostream& out) { write_tornado_csv(out, *study, *r); });
}

void add_grid_report_files(OutputSet& set, const LoadedStudy& loaded, const GridResult& result,
                           const std::string& generated_at) {
  add_document_files(
      set, std::make_shared<const ReportDocument>(build_grid_report(loaded, result, generated_at)));
  const StudyCase* study = &loaded.study;
  const GridResult* r = &result;
  set.add("sweep.json", [study, r](std::ostream& out) { write_grid_json(out, *study, *r); });
  set.add("grid.csv", [study, r](std::ostream& out) { write_grid_csv(out, *study, *r); });
}

void add_uncertainty_report_files(OutputSet& set, const LoadedStudy& loaded,
                                  const UncertaintyResult& result,
                                  const std::string& generated_at) {
  add_document_files(set, std::make_shared<const ReportDocument>(
                              build_uncertainty_report(loaded, result, generated_at)));
  const StudyCase* study = &loaded.study;
  const UncertaintyResult* r = &result;
  set.add("uncertainty.json",
          [study, r](std::ostream& out) { write_uncertainty_json(out, *study, *r); });
  set.add("summary.csv", [r](std::ostream& out) { write_uncertainty_summary_csv(out, *r); });
  set.add("samples.csv", [r](std::ostream& out) { write_uncertainty_samples_csv(out, *r); });
}

void add_breakeven_report_files(OutputSet& set, const LoadedStudy& loaded,
                                const BreakevenResult& result, const std::string& generated_at) {
  add_document_files(set, std::make_shared<const ReportDocument>(
                              build_breakeven_report(loaded, result, generated_at)));
  const StudyCase* study = &loaded.study;
  const BreakevenResult* r = &result;
  set.add("breakeven.json",
          [study, r](std::ostream& out) { write_breakeven_json(out, *study, *r); });
  set.add("probes.csv", [r](std::ostream& out) { write_breakeven_csv(out, *r); });
}

}  // namespace stowage::report
