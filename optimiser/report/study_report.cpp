// SPDX-License-Identifier: MIT
#include "optimiser/report/study_report.h"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdlib>
#include <ctime>
#include <filesystem>
#include <memory>
#include <numeric>
#include <sstream>
#include <utility>

#include "model/contract.h"
#include "optimiser/report/cost_lines.h"
#include "optimiser/report/design_report.h"
#include "optimiser/report/html_report.h"
#include "optimiser/report/markdown_report.h"
#include "optimiser/report/number_format.h"
#include "optimiser/report/optimise_report.h"
#include "optimiser/report/report_charts.h"
#include "optimiser/report/study_hash.h"
#include "optimiser/report/sweep_report.h"
#include "stowage_version.h"

namespace stowage::report {

namespace {

// ---- cells --------------------------------------------------------------------------------

std::string percent(double fraction, int decimals = 1) {
  return format_fixed(100 * fraction, decimals) + " %";
}

// The source text of a profile field: the entry for the field itself or the nearest
// enclosing field ("ageing.cycle_life" for "ageing.cycle_life[2].cycles").
std::string source_of(const LoadedProfile& p, const std::string& field) {
  std::string key = field;
  while (!key.empty()) {
    const auto it = p.sources.find(key);
    if (it != p.sources.end()) return it->second;
    const std::size_t cut = key.find_last_of(".[");
    if (cut == std::string::npos) break;
    key = key.substr(0, cut);
  }
  return "no source given in the profile";
}

// ---- JSON paths of a design ---------------------------------------------------------------

std::string design_key(std::size_t rank_index) {
  return rank_index == 0 ? std::string("best")
                         : "ranking[" + std::to_string(rank_index) + "].design";
}

// ---- sections -----------------------------------------------------------------------------

std::string status_text(const OptimiseResult& r) {
  switch (r.status) {
    case Optimality::Proven:
      return "Proven optimal: every one of the " + std::to_string(r.admissible_designs) +
             " admissible designs was either simulated exactly (" +
             std::to_string(r.designs_evaluated_exactly) +
             " were) or has a lower bound on its net present cost at or above the recommended "
             "design's exact value, so no design can beat it.";
    case Optimality::VerifiedByEstimate:
      return "Verified by estimate, not proven: " + std::to_string(r.designs_unsettled) +
             " admissible designs were passed over on the model's calibrated estimate rather "
             "than ruled out by the cost bound; run the search with its proof to settle them.";
    case Optimality::TimeLimited:
      return "NOT PROVEN OPTIMAL: the search stopped at its time limit, and this is the best "
             "design found so far.";
  }
  return "";
}

ReportSection decision_section(const StudyCase& study, const OptimiseResult& r,
                               const ConfidenceCheck* confidence) {
  ReportSection s;
  s.id = "decision";
  s.title = "Decision";
  const std::string& cur = study.economics.currency;
  if (!r.feasible()) {
    s.paragraph(std::string("No design meets every requirement of the study") +
                (r.time_limit_reached ? " within the time limit" : "") +
                ". What stands in the way, with the figures needed and reached:");
    std::vector<std::string> items;
    for (const UnmetRequirement& u : r.unmet)
      items.push_back(requirement_key(u) + ": " + describe_unmet(u, study));
    if (!items.empty()) s.bullets(items);
  } else {
    const DesignResult& best = r.best();
    s.paragraph(
        "Recommended: " + best.profile_id + " at a DoD setpoint of " +
        format_fixed(best.dod_setpoint, 2) + ", " + std::to_string(best.bank.strings_parallel) +
        " strings in parallel of " + std::to_string(best.bank.cells_series) + " cells in series (" +
        format_amount(best.bank.nameplate_kwh, 1) + " kWh nameplate at " +
        format_general(best.bank.nominal_voltage_v, 4) + " V), with a net present cost of " +
        format_amount(best.npc) + " " + cur + " over " +
        std::to_string(study.economics.project_years) + " years and an LCOS of " +
        format_fixed(best.lcos_per_kwh, 4) + " " + cur + " per kWh delivered.");
    if (confidence) {
      std::string sentence = low_confidence_sentence(*confidence, cur);
      sentence[0] = static_cast<char>(std::toupper(static_cast<unsigned char>(sentence[0])));
      s.paragraph(sentence +
                  ". Spreads by the profile's confidence labels: illustrative +-25 %, "
                  "from memory +-10 %, one input at a time, the design held (docs/method.md 10).");
    }
    const bool has_runner = r.ranking.size() > 1;
    ReportTable t;
    t.caption = has_runner ? "Recommended design and runner-up" : "Recommended design";
    t.header = {"quantity", "recommended"};
    t.numeric = {false, true, true};
    if (has_runner) t.header.push_back("runner-up");
    const auto add = [&](const std::string& what,
                         const std::function<ReportCell(std::size_t)>& cell) {
      std::vector<ReportCell> row{plain(what), cell(0)};
      if (has_runner) row.push_back(cell(1));
      t.rows.push_back(row);
    };
    const auto& R = r.ranking;
    add("profile",
        [&](std::size_t i) { return tagged_text(R[i].profile_id, design_key(i) + ".profile"); });
    add("DoD setpoint (fraction)", [&](std::size_t i) {
      return tagged(format_fixed(R[i].dod_setpoint, 2), design_key(i) + ".dod_setpoint",
                    R[i].dod_setpoint);
    });
    add("strings in parallel", [&](std::size_t i) {
      return tagged(std::to_string(R[i].bank.strings_parallel), design_key(i) + ".strings_parallel",
                    R[i].bank.strings_parallel);
    });
    add("cells in series", [&](std::size_t i) {
      return tagged(std::to_string(R[i].bank.cells_series), design_key(i) + ".cells_series",
                    R[i].bank.cells_series);
    });
    add("nameplate energy (kWh)", [&](std::size_t i) {
      return tagged(format_amount(R[i].bank.nameplate_kwh, 1), design_key(i) + ".nameplate_kwh",
                    R[i].bank.nameplate_kwh);
    });
    add("LCOS (" + cur + " per kWh delivered)", [&](std::size_t i) {
      return tagged(format_fixed(R[i].lcos_per_kwh, 4), design_key(i) + ".lcos_per_kwh",
                    R[i].lcos_per_kwh);
    });
    add("LCOS, Schmidt et al. 2019 conventions (" + cur + " per kWh delivered)",
        [&](std::size_t i) {
          return tagged(format_fixed(R[i].lcos_schmidt_per_kwh, 4),
                        design_key(i) + ".lcos_schmidt_per_kwh", R[i].lcos_schmidt_per_kwh);
        });
    add("net present cost (" + cur + ")", [&](std::size_t i) {
      return tagged(format_amount(R[i].npc), design_key(i) + ".npc", R[i].npc);
    });
    if (has_runner) {
      add("net present cost above the recommended (" + cur + ")", [&](std::size_t i) {
        const double diff = R[i].npc - R[0].npc;
        return i == 0 ? plain("-")
                      : tagged(format_signed_amount(diff),
                               "ranking[" + std::to_string(i) + "].npc_difference_to_best", diff);
      });
    }
    add("investment, year 0 (" + cur + ")", [&](std::size_t i) {
      return tagged(format_amount(R[i].investment), design_key(i) + ".investment", R[i].investment);
    });
    add("replacements (at the end of the month named)", [&](std::size_t i) {
      return plain(replacement_times(R[i].replacement_years, R[i].replacement_months));
    });
    add("equivalent full cycles, first year", [&](std::size_t i) {
      return tagged(format_fixed(R[i].equivalent_full_cycles_first_year(), 1),
                    design_key(i) + ".equivalent_full_cycles_first_year",
                    R[i].equivalent_full_cycles_first_year());
    });
    add("worst-year unserved energy (% of demand)",
        [&](std::size_t i) { return plain(percent(R[i].unserved_fraction_max, 3)); });
    s.table(t);
    if (has_runner) {
      const DesignResult& runner = R[1];
      const double margin = runner.npc - best.npc;
      s.paragraph("Runner-up: " + runner.profile_id + ", " + format_signed_amount(margin) + " " +
                  cur + " in net present cost (" +
                  format_fixed(100 * margin / std::fabs(best.npc), 1) +
                  " % of the recommended design's). Where the difference comes from (runner-up "
                  "minus recommended, present values, biggest first):");
      std::vector<std::string> items;
      for (const CostDifference& d : cost_differences(runner.present_value, best.present_value))
        items.push_back(std::string(d.line->label) + ": " + format_signed_amount(d.amount) + " " +
                        cur);
      if (items.empty()) items.push_back("no cost line differs by a currency unit or more");
      s.bullets(items);
    } else {
      s.paragraph(
          "There is no runner-up: only one profile has a design that meets the study's "
          "requirements.");
    }
  }
  s.paragraph(status_text(r));
  ReportTable search;
  search.caption = "How the answer was found";
  search.header = {"quantity", "value"};
  search.numeric = {false, true};
  search.rows.push_back({plain("search method"), tagged_text(to_string(r.method), "method")});
  search.rows.push_back({plain("optimality"), tagged_text(to_string(r.status), "optimality")});
  search.rows.push_back({plain("admissible designs"),
                         tagged(std::to_string(r.admissible_designs), "admissible_designs",
                                static_cast<double>(r.admissible_designs))});
  search.rows.push_back(
      {plain("designs simulated exactly"),
       tagged(std::to_string(r.designs_evaluated_exactly), "designs_evaluated_exactly",
              static_cast<double>(r.designs_evaluated_exactly))});
  search.rows.push_back(
      {plain("of them to prove the answer"),
       tagged(std::to_string(r.designs_evaluated_for_proof), "designs_evaluated_for_proof",
              static_cast<double>(r.designs_evaluated_for_proof))});
  s.table(search);
  if (!r.notes.empty()) {
    std::vector<std::string> items;
    for (const ProfileNote& n : r.notes) items.push_back(describe_note(n, study));
    s.paragraph("Profiles left out of the ranking or without a design in it:");
    s.bullets(items);
  }
  s.paragraph(
      "This is a planning estimate. Read the safety cautions at the end of this report "
      "before acting on it.");
  return s;
}

ReportSection ranking_section(const StudyCase& study, const OptimiseResult& r) {
  ReportSection s;
  s.id = "ranking";
  s.title = "Ranking of the profiles";
  const std::string& cur = study.economics.currency;
  s.paragraph(
      "The best design found for each profile, ranked by net present cost of serving "
      "the site (investment, replacements, operation, charging energy, end of life, "
      "residual value, back-up energy and unserved-energy penalty, all as present "
      "values)." +
      std::string(r.method == SearchMethod::Milp && r.ranking.size() > 1
                      ? " Only the recommended profile is searched to the end; the "
                        "others show the best design found where the model pointed."
                      : ""));
  ReportTable t;
  t.caption = "Best design of each profile";
  t.header = {"rank",
              "profile",
              "DoD",
              "strings",
              "nameplate (kWh)",
              "LCOS (" + cur + "/kWh)",
              "NPC (" + cur + ")",
              "vs recommended (" + cur + ")"};
  t.numeric = {true, false, true, true, true, true, true, true};
  for (std::size_t i = 0; i < r.ranking.size(); ++i) {
    const DesignResult& d = r.ranking[i];
    const std::string k = "ranking[" + std::to_string(i) + "]";
    t.rows.push_back(
        {tagged(std::to_string(i + 1), k + ".rank", static_cast<double>(i + 1)),
         tagged_text(d.profile_id, k + ".design.profile"),
         tagged(format_fixed(d.dod_setpoint, 2), k + ".design.dod_setpoint", d.dod_setpoint),
         tagged(std::to_string(d.bank.strings_parallel), k + ".design.strings_parallel",
                d.bank.strings_parallel),
         tagged(format_amount(d.bank.nameplate_kwh, 1), k + ".design.nameplate_kwh",
                d.bank.nameplate_kwh),
         tagged(format_fixed(d.lcos_per_kwh, 4), k + ".design.lcos_per_kwh", d.lcos_per_kwh),
         tagged(format_amount(d.npc), k + ".design.npc", d.npc),
         i == 0 ? plain("-")
                : tagged(format_signed_amount(d.npc - r.best().npc), k + ".npc_difference_to_best",
                         d.npc - r.best().npc)});
  }
  s.table(t);
  ReportTable b;
  b.caption = "Present-value cost breakdown (" + cur + ")";
  b.header = {"cost line"};
  b.numeric = {false};
  for (const DesignResult& d : r.ranking) {
    b.header.push_back(d.profile_id);
    b.numeric.push_back(true);
  }
  for (const CostLine& line : cost_lines()) {
    std::vector<ReportCell> row{plain(line.label)};
    for (std::size_t i = 0; i < r.ranking.size(); ++i) {
      const double v = r.ranking[i].present_value.*line.member;
      row.push_back(tagged(format_amount(v),
                           "ranking[" + std::to_string(i) + "].design.breakdown." + line.key, v));
    }
    b.rows.push_back(row);
  }
  std::vector<ReportCell> total{plain("net present cost")};
  for (std::size_t i = 0; i < r.ranking.size(); ++i)
    total.push_back(tagged(format_amount(r.ranking[i].npc),
                           "ranking[" + std::to_string(i) + "].design.npc", r.ranking[i].npc));
  b.rows.push_back(total);
  s.table(b);
  s.figure(breakdown_chart(r.ranking, cur));
  return s;
}

}  // namespace

ReportSection sensitivity_section(const StudyCase& study, const TornadoResult& t,
                                  const std::string& json_name) {
  ReportSection s;
  s.id = "sensitivity";
  s.title = "Sensitivity of the recommendation";
  const std::string& cur = study.economics.currency;
  s.paragraph(
      "Each input the study names under variations is set to its low and its high end "
      "in turn, every other input at its base value, and the study is " +
      std::string(t.hold_designs ? "evaluated with the base case's designs held fixed"
                                 : "optimised again") +
      " (stowage sweep; the numbers are those of " + json_name +
      "). Inputs are listed by "
      "the swing of the winner's net present cost, largest first.");
  ReportTable tab;
  tab.caption = "Winner and its net present cost at each end of each input (" + cur + ")";
  tab.header = {"input", "end", "value", "winner", "NPC (" + cur + ")", "range from"};
  tab.numeric = {false, false, true, false, true, false};
  std::vector<std::string> changes;
  for (const TornadoBar& b : t.bars) {
    for (const bool high : {false, true}) {
      const PointOutcome& p = high ? b.high : b.low;
      const double value = high ? b.variation.high : b.variation.low;
      const bool differs = p.feasible() && p.winner().profile_id != t.base.winner().profile_id;
      const std::string winner =
          p.feasible() ? p.winner().profile_id + (differs ? " *" : "") : "none meets the limits";
      tab.rows.push_back(
          {plain(high ? "" : b.variation.label), plain(high ? "high" : "low"),
           plain(variation_value_text(b.variation, value)), plain(winner),
           plain(p.feasible() ? format_amount(p.winner().npc) : "-"),
           plain(high ? "" : (b.variation.source.empty() ? "not stated" : b.variation.source))});
      if (!p.feasible() || differs) {
        changes.push_back((p.feasible() ? p.winner().profile_id : std::string("no design")) +
                          " at " + b.variation.label + " = " +
                          variation_value_text(b.variation, value));
      }
    }
  }
  s.table(tab);
  if (changes.empty()) {
    s.paragraph(t.base.winner().profile_id + " stays the winner at every end tested.");
  } else {
    s.notice("The recommendation of " + t.base.winner().profile_id +
             " does not survive every end tested (marked *): the winner becomes " +
             [&] {
               std::string joined;
               for (std::size_t i = 0; i < changes.size(); ++i)
                 joined += (i ? "; " : "") + changes[i];
               return joined;
             }() +
             ". Firm prices or measurements for these inputs should come before the decision.");
  }
  s.figure(tornado_chart(t, cur));
  return s;
}

namespace {

ReportSection recommended_section(const StudyCase& study, const OptimiseResult& r,
                                  const DesignTrace& trace) {
  const DesignResult& best = r.best();
  const ChemistryProfile& profile = study.profiles[*study.find_profile(best.profile_id)];
  ReportSection s;
  s.id = "recommended";
  s.title = "The recommended design over its life";
  const YearDispatch& y1 = best.years.front().dispatch;
  s.paragraph(
      "Energy of the first project year, from the hourly simulation the lifecycle "
      "priced (docs/method.md section 4). Replacements, each at the end of the month named: " +
      replacement_times(best.replacement_years, best.replacement_months) + ".");
  ReportTable t;
  t.caption = "First-year energy of " + best.profile_id;
  t.header = {"quantity", "kWh"};
  t.numeric = {false, true};
  t.rows.push_back({plain("demand"), plain(format_amount(y1.demand_kwh))});
  t.rows.push_back(
      {plain("served directly by the source"), plain(format_amount(y1.source_to_load_kwh))});
  t.rows.push_back(
      {plain("source energy drawn for charging"), plain(format_amount(y1.charge_source_kwh))});
  t.rows.push_back({plain("discharged at the bank terminals"),
                    tagged(format_amount(y1.discharged_terminal_kwh),
                           "best.discharged_kwh_first_year", y1.discharged_terminal_kwh)});
  t.rows.push_back(
      {plain("delivered after the inverter"),
       tagged(format_amount(y1.delivered_kwh), "best.delivered_kwh_first_year", y1.delivered_kwh)});
  t.rows.push_back({plain("back-up"), tagged(format_amount(y1.backup_kwh),
                                             "best.backup_kwh_first_year", y1.backup_kwh)});
  t.rows.push_back({plain("unserved"), tagged(format_amount(y1.unserved_kwh, 1),
                                              "best.unserved_kwh_first_year", y1.unserved_kwh)});
  t.rows.push_back({plain("curtailed source energy"), plain(format_amount(y1.curtailed_kwh))});
  if (y1.auxiliary_kwh > 0) {
    // The profile's standing and pump loads (docs/method.md 4, step 5), and where they came from.
    const std::pair<const char*, std::pair<const char*, double>> aux[] = {
        {"auxiliary loads (battery management, climate, pumps)",
         {"best.auxiliary_kwh_first_year", y1.auxiliary_kwh}},
        {"  of which from the source, before the charger",
         {"best.auxiliary_source_kwh_first_year", y1.auxiliary_source_kwh}},
        {"  of which from the bank", {"best.auxiliary_bank_kwh_first_year", y1.auxiliary_bank_kwh}},
        {"  of which unmet", {"best.auxiliary_unmet_kwh_first_year", y1.auxiliary_unmet_kwh}}};
    for (const auto& [label, value] : aux)
      t.rows.push_back(
          {plain(label), tagged(format_amount(value.second, 1), value.first, value.second)});
  }
  s.table(t);
  const double idle_hours = y1.temperature_idle_hours();
  s.paragraph(idle_hours > 0
                  ? "Its temperature limits kept the bank idle for " + format_amount(idle_hours) +
                        " hours of the first year: " +
                        format_amount(y1.charge_blocked_by_temperature_hours) +
                        " hours with surplus it could not take outside its charging range and " +
                        format_amount(y1.discharge_blocked_by_temperature_hours) +
                        " hours with demand it could not serve outside its operating range (that "
                        "surplus was curtailed, that demand went to back-up or unserved)."
                  : "Its temperature limits never kept the bank idle in the first year.");
  s.figure(soc_heat_map(best, trace));
  s.figure(rainflow_histogram(best, trace));
  s.figure(life_chart(best, profile));
  s.figure(cycle_life_chart(best, profile));
  s.figure(temperature_chart(best, trace, profile));
  return s;
}

double max_of(const std::vector<double>& v) { return *std::max_element(v.begin(), v.end()); }
double min_of(const std::vector<double>& v) { return *std::min_element(v.begin(), v.end()); }
double sum_of(const std::vector<double>& v) { return std::accumulate(v.begin(), v.end(), 0.0); }

ReportSection inputs_section(const LoadedStudy& loaded) {
  const StudyCase& study = loaded.study;
  const SiteConditions& site = study.site;
  const std::string& cur = study.economics.currency;
  ReportSection s;
  s.id = "inputs";
  s.title = "Inputs";
  s.paragraph(
      "The values the run used, with their units and where they come from. Site values "
      "are as given in the site file and its hourly series; profile values carry the "
      "source their profile file names for them.");
  const std::string site_src =
      "site file " + std::filesystem::path(loaded.site_path).lexically_normal().generic_string();
  const std::string hourly_src =
      "hourly series " +
      std::filesystem::path(loaded.hourly_path).lexically_normal().generic_string();
  ReportTable t;
  t.caption = "Site: " + site.name;
  t.header = {"quantity", "value", "unit", "source"};
  t.numeric = {false, true, false, false};
  const auto row = [&](const std::string& q, const std::string& v, const std::string& u,
                       const std::string& src) {
    t.rows.push_back({plain(q), plain(v), plain(u), plain(src)});
  };
  row("DC bus voltage", format_general(site.bus_voltage_v, 6), "V", site_src);
  row("annual demand", format_amount(site.annual_demand_kwh()), "kWh", hourly_src);
  row("peak load", format_general(max_of(site.load_kw), 4), "kW", hourly_src);
  row("annual source energy", format_amount(sum_of(site.source_kw)), "kWh", hourly_src);
  row("battery temperature, lowest hour", format_fixed(min_of(site.temp_c), 1), "\u00B0C",
      hourly_src);
  row("battery temperature, highest hour", format_fixed(max_of(site.temp_c), 1), "\u00B0C",
      hourly_src);
  row("charging energy price, mean of the hours",
      format_general(sum_of(site.charge_price_per_kwh) / kHoursPerYear, 4), cur + "/kWh", site_src);
  row("autonomy", format_general(site.autonomy_days, 4), "days", site_src);
  row("design margin on the autonomy energy", format_general(site.design_margin, 4), "factor",
      site_src);
  row("charger efficiency", format_general(site.charger_efficiency, 4), "fraction", site_src);
  row("inverter efficiency", format_general(site.inverter_efficiency, 4), "fraction", site_src);
  row("source-to-load efficiency", format_general(site.source_to_load_efficiency, 4), "fraction",
      site_src);
  row("back-up energy price",
      site.backup_price_per_kwh ? format_general(*site.backup_price_per_kwh, 4) : "no back-up",
      site.backup_price_per_kwh ? cur + "/kWh" : "", site_src);
  row("unserved-energy limit",
      site.unserved_limit_fraction ? format_general(100 * *site.unserved_limit_fraction, 4)
                                   : "none",
      site.unserved_limit_fraction ? "% of demand" : "", site_src);
  row("unserved-energy penalty", format_general(site.unserved_penalty_per_kwh, 4), cur + "/kWh",
      site_src);
  s.table(t);

  const std::string study_src =
      "study file " + std::filesystem::path(loaded.path).lexically_normal().generic_string();
  ReportTable e;
  e.caption = "Economics and search";
  e.header = {"quantity", "value", "unit", "source"};
  e.numeric = {false, true, false, false};
  e.rows.push_back({plain("project life"),
                    tagged(std::to_string(study.economics.project_years), "project_years",
                           study.economics.project_years),
                    plain("years"), plain(study_src)});
  e.rows.push_back({plain("real discount rate"),
                    tagged(format_general(study.economics.real_discount_rate, 4),
                           "real_discount_rate", study.economics.real_discount_rate),
                    plain("fraction per year"), plain(study_src)});
  e.rows.push_back({plain("currency (real, constant prices)"), tagged_text(cur, "currency"),
                    plain(""), plain(study_src)});
  for (const ExchangeRate& r : study.exchange_rates)
    e.rows.push_back({plain("exchange rate (profile prices converted once, at loading)"),
                      plain(exchange_rate_text(r, cur)), plain(""), plain(study_src)});
  const SearchSettings& sr = study.search;
  e.rows.push_back({plain("DoD ladder searched"),
                    plain(format_general(sr.dod_from, 3) + " to " + format_general(sr.dod_to, 3) +
                          " step " + format_general(sr.dod_step, 3)),
                    plain("fraction"), plain(study_src)});
  e.rows.push_back({plain("strings in parallel, at most"),
                    plain(std::to_string(sr.max_strings_parallel)), plain("strings"),
                    plain(study_src)});
  if (sr.budget)
    e.rows.push_back({plain("budget for the year-0 investment"), plain(format_amount(*sr.budget)),
                      plain(cur), plain(study_src)});
  if (sr.max_mass_kg)
    e.rows.push_back({plain("bank mass, at most"), plain(format_amount(*sr.max_mass_kg)),
                      plain("kg"), plain(study_src)});
  if (sr.max_volume_l)
    e.rows.push_back({plain("bank volume, at most"), plain(format_amount(*sr.max_volume_l)),
                      plain("l"), plain(study_src)});
  s.table(e);

  for (const LoadedProfile& lp : loaded.profiles) {
    const ChemistryProfile& p = lp.profile;
    const TemperatureSpec& ts = p.temperature.spec();
    ReportTable pt;
    pt.caption = "Profile " + p.id + " (" + p.family + ")";
    pt.header = {"field", "value", "unit", "source", "confidence"};
    pt.numeric = {false, true, false, false, false};
    const auto add = [&](const std::string& field, const std::string& value,
                         const std::string& unit) {
      const std::optional<ValueConfidence> label = confidence_of(lp, field);
      pt.rows.push_back({plain(field), plain(value), plain(unit), plain(source_of(lp, field)),
                         plain(label ? confidence_name(*label) : "not labelled")});
    };
    const auto g = [](double v) { return format_general(v, 6); };
    add("cell.nominal_v", g(p.cell_nominal_v), "V");
    add("cell.capacity_ah", g(p.cell_capacity_ah), "Ah");
    add("cell.capacity_rate_hours", g(p.capacity_rate_hours), "h");
    add("cell.mean_charge_v", g(p.mean_charge_v), "V");
    add("cell.mean_discharge_v", g(p.mean_discharge_v), "V");
    add("cell.coulombic_efficiency", g(p.coulombic_efficiency), "fraction");
    add("cell.max_charge_c_rate", g(p.max_charge_c_rate), "per hour (C)");
    add("cell.max_discharge_c_rate", g(p.max_discharge_c_rate), "per hour (C)");
    add("cell.peukert_exponent", g(p.peukert_exponent), "-");
    add("cell.self_discharge_per_month", g(p.self_discharge_per_month), "fraction per month");
    add("dod.min", g(p.dod.min), "fraction");
    add("dod.max", g(p.dod.max), "fraction");
    add("dod.default", g(p.dod.default_setpoint), "fraction");
    std::string curve;
    for (const CycleLifePoint& c : p.cycle_life.points())
      curve += (curve.empty() ? "" : "; ") + format_general(100 * c.dod, 3) +
               " %: " + format_amount(c.cycles);
    add("ageing.cycle_life", curve, "DoD: cycles");
    add("ageing.calendar_life_years", g(p.calendar_life_years), "years");
    if (p.max_service_years) add("ageing.max_service_years", g(*p.max_service_years), "years");
    add("ageing.end_of_life_capacity", g(p.eol_capacity_fraction), "fraction of rated");
    add("temperature.reference_c", g(ts.reference_temp_c), "\u00B0C");
    if (ts.law == AgeingLaw::Arrhenius)
      add("temperature.activation_energy_j_per_mol", g(ts.activation_energy_j_per_mol), "J/mol");
    else
      add("temperature.life_halving_interval_k", g(ts.halving_interval_k), "K");
    std::string factors;
    for (const CapacityFactorPoint& c : ts.capacity_factor)
      factors += (factors.empty() ? "" : "; ") + format_general(c.temp_c, 4) +
                 " \u00B0C: " + format_general(c.factor, 4);
    add("temperature.capacity_factor", factors, "\u00B0C: fraction");
    add("temperature.operating_c.min", g(ts.operating_min_c), "\u00B0C");
    add("temperature.operating_c.max", g(ts.operating_max_c), "\u00B0C");
    add("temperature.charging_c.min", g(ts.charge_min_c), "\u00B0C");
    add("temperature.charging_c.max", g(ts.charge_max_c), "\u00B0C");
    const ProfileCosts& c = p.costs;
    add("costs.capital_per_kwh", g(c.capital_per_kwh), cur + "/kWh");
    add("costs.capital_per_string", g(c.capital_per_string), cur + "/string");
    add("costs.installation_fixed", g(c.installation_fixed), cur);
    add("costs.fixed_om_per_kwh_year", g(c.fixed_om_per_kwh_year), cur + "/kWh/year");
    add("costs.variable_om_per_mwh", g(c.variable_om_per_mwh), cur + "/MWh");
    add("costs.replacement_share", g(c.replacement_share), "fraction");
    add("costs.price_decline_per_year", g(c.price_decline_per_year), "fraction per year");
    add("costs.end_of_life_per_kwh", g(c.end_of_life_per_kwh), cur + "/kWh");
    if (c.replacement_end_of_life_per_kwh)
      add("costs.replacement_end_of_life_per_kwh", g(*c.replacement_end_of_life_per_kwh),
          cur + "/kWh");
    s.table(pt);
  }
  return s;
}

}  // namespace

ReportSection reproduce_section(const StudyHash& hash, const std::string& digest_name) {
  ReportSection s;
  s.id = "reproduce";
  s.title = "Reproducing this report";
  s.paragraph(std::string("Made by stowage ") + STOWAGE_VERSION_STRING + " from the files below. " +
              digest_name +
              " digest (SHA-256 over the lines \"digest  role\" of "
              "the files in this order, docs/report.md): " +
              hash.digest +
              ". Running the same version on files with these digests gives the same report, "
              "apart from the line saying when it was generated.");
  ReportTable t;
  t.caption = "Input files (SHA-256, FIPS 180-4)";
  t.header = {"role", "file", "bytes", "SHA-256"};
  t.numeric = {false, false, true, false};
  t.wrap_anywhere = true;
  for (const InputFileHash& f : hash.files)
    t.rows.push_back(
        {plain(f.role), plain(f.path), plain(std::to_string(f.bytes)), plain(f.sha256)});
  s.table(t);
  return s;
}

ReportSection study_method_section(bool proof_status_shown) {
  ReportSection s;
  s.id = "method";
  s.title = "Method and validation";
  s.paragraph(
      "Each design is simulated hour by hour over one typical year per project year, "
      "aged, replaced and priced over the project life; docs/method.md gives every "
      "equation and its source, docs/optimiser.md the search, docs/validation.md the "
      "checks against outside values.");
  s.bullets({
      "Dispatch: the source serves the load, surplus charges the bank through the charger, "
      "deficit is drawn through the inverter within the DoD window, the C-rate limits, "
      "Peukert's law and the temperature limits; the rest goes to back-up or is unserved.",
      "Ageing: rainflow counting of the SOC trace (ASTM E1049-85), Palmgren-Miner damage "
      "against the profile's cycle-life curve, calendar ageing, both accelerated by "
      "temperature (Arrhenius or life-halving law); capacity fades linearly to the end-of-life "
      "capacity at damage 1.",
      "Costs: investment, replacements, fixed and variable O&M, charging energy, end of life "
      "and residual value (the life left at the end, at the replacement price of the last "
      "year), discounted at the real rate; LCOS per kWh delivered after the inverter, with "
      "that residual value and, separately, under the conventions of Schmidt et al. (2019), "
      "Joule 3:81-100 (no residual value, the last end of life one year after the project); "
      "net present cost adds back-up energy and the unserved-energy penalty and is what the search "
      "minimises.",
      "Search: a mixed-integer model (GLPK) points to the designs to simulate; the answer is "
      "always a design simulated exactly" +
          std::string(proof_status_shown
                          ? ", and the proof status above says whether every other design was "
                            "ruled out."
                          : "; stowage optimise on the study says whether every other design "
                            "was ruled out."),
      "Validation: the model is checked against ASTM E1049-85's rainflow example, "
      "compound-interest tables, IEEE Std 485 temperature factors, Battery University ageing "
      "anchors, closed-form LCOS cases, and the optimiser against exhaustive enumeration and "
      "independent solvers (docs/validation.md).",
  });
  return s;
}

ReportSection study_limits_section() {
  ReportSection s;
  s.id = "limits";
  s.title = "Assumptions and limits";
  s.bullets({
      "One typical year of hourly data is repeated for every project year: no load growth and "
      "no weather variation between years.",
      "Health is updated once a year; a bank that wears out within a year is replaced at that "
      "year's end.",
      "Profiles are generic descriptions of a chemistry, not a product's data; check prices, "
      "cycle life and temperature behaviour against the offers and datasheets at hand.",
      "Capacity fade is linear in Miner damage and ageing mechanisms add; real cells show "
      "knees and interactions that a profile can only approximate.",
      "Temperatures are battery-space temperatures; self-heating is not modelled, and "
      "self-discharge does not depend on temperature.",
      "Operating temperature limits do not depend on SOC: a flooded lead-acid bank deeply "
      "discharged in frost can freeze above its operating minimum.",
      "Prices and the discount rate are real (constant currency).",
  });
  return s;
}

namespace {

std::string safety_text() {
  std::ostringstream text;
  print_safety_notice(text);
  std::string out = text.str();
  std::replace(out.begin(), out.end(), '\n', ' ');
  while (!out.empty() && out.back() == ' ') out.pop_back();
  return out;
}

}  // namespace

ReportSection safety_section() {
  ReportSection s;
  s.id = "safety";
  s.title = "Safety cautions";
  s.notice(safety_text());
  return s;
}

namespace {

// ---- data files ---------------------------------------------------------------------------

void write_trace_csv(std::ostream& out, const DesignTrace& trace) {
  out << "hour,soc_end,temp_c,capacity_factor,ageing_acceleration\n";
  for (std::size_t h = 0; h < trace.temp_c.size(); ++h) {
    out << h << ',' << format_machine(trace.soc[h + 1]) << ',' << format_machine(trace.temp_c[h])
        << ',' << format_machine(trace.capacity_factor[h]) << ','
        << format_machine(trace.ageing_acceleration[h]) << '\n';
  }
}

}  // namespace

ReportDocument build_study_report(const ReportInputs& in) {
  if (!in.loaded) throw ContractViolation("ReportInputs::loaded", "must be set");
  if (!in.result) throw ContractViolation("ReportInputs::result", "must be set");
  if (in.result->feasible() && !in.trace)
    throw ContractViolation("ReportInputs::trace", "must be set for a feasible result");
  const StudyCase& study = in.loaded->study;
  const OptimiseResult& r = *in.result;
  ReportDocument doc;
  doc.title = study.title.empty() ? "Battery bank study" : study.title;
  doc.subtitle = "Lifecycle cost of battery banks at " + study.site.name + " over " +
                 std::to_string(study.economics.project_years) + " years at a " +
                 format_general(100 * study.economics.real_discount_rate, 4) +
                 " % real discount rate, in " + study.economics.currency + ".";
  doc.generated_line = "Generated " + in.generated_at + " by stowage " + STOWAGE_VERSION_STRING;
  doc.sections.push_back(decision_section(study, r, in.confidence));
  if (r.feasible()) doc.sections.push_back(ranking_section(study, r));
  if (r.feasible() && in.tornado && in.tornado->base.feasible())
    doc.sections.push_back(sensitivity_section(study, *in.tornado, "tornado.json"));
  for (const ReportSection& extra : in.analysis_sections) doc.sections.push_back(extra);
  if (r.feasible()) doc.sections.push_back(recommended_section(study, r, *in.trace));
  doc.sections.push_back(inputs_section(*in.loaded));
  doc.sections.push_back(reproduce_section(hash_study_inputs(*in.loaded), "Study"));
  doc.sections.push_back(study_method_section(true));
  doc.sections.push_back(study_limits_section());
  doc.sections.push_back(safety_section());
  return doc;
}

void add_document_files(OutputSet& set, std::shared_ptr<const ReportDocument> doc) {
  set.add("report.html", [doc](std::ostream& out) { write_report_html(out, *doc); });
  set.add("report.md", [doc](std::ostream& out) { write_report_markdown(out, *doc); });
  for (const ReportFigure* f : doc->figures()) {
    const std::string* svg = &f->svg;
    set.add(f->id + ".svg", [doc, svg](std::ostream& out) { out << *svg; });
  }
}

void add_report_files(OutputSet& set, const ReportInputs& in) {
  add_document_files(set, std::make_shared<const ReportDocument>(build_study_report(in)));
  const StudyCase* study = &in.loaded->study;
  const OptimiseResult* result = in.result;
  const ConfidenceCheck* confidence = in.confidence;
  set.add("result.json", [study, result, confidence](std::ostream& out) {
    write_optimise_json(out, *study, *result, confidence);
  });
  const CsvRunColumns run{study->title, to_string(result->method)};
  set.add("designs.csv", [result, run](std::ostream& out) {
    write_designs_csv(out, result->ranking, nullptr, run);
  });
  set.add("cash-flows.csv",
          [result, run](std::ostream& out) { write_cash_flows_csv(out, result->ranking, run); });
  if (in.tornado) {
    const TornadoResult* tornado = in.tornado;
    set.add("tornado.json",
            [study, tornado](std::ostream& out) { write_tornado_json(out, *study, *tornado); });
    set.add("tornado.csv",
            [study, tornado](std::ostream& out) { write_tornado_csv(out, *study, *tornado); });
  }
  if (in.trace) {
    const DesignTrace* trace = in.trace;
    set.add("recommended-first-year.csv",
            [trace](std::ostream& out) { write_trace_csv(out, *trace); });
  }
}

std::string report_timestamp() {
  std::time_t when = std::time(nullptr);
  if (const char* epoch = std::getenv("SOURCE_DATE_EPOCH")) {
    char* end = nullptr;
    const long long v = std::strtoll(epoch, &end, 10);
    if (end != epoch && *end == '\0' && v >= 0) when = static_cast<std::time_t>(v);
  }
  std::tm utc{};
  gmtime_r(&when, &utc);
  char buffer[32];
  std::strftime(buffer, sizeof buffer, "%Y-%m-%dT%H:%M:%SZ", &utc);
  return buffer;
}

}  // namespace stowage::report
