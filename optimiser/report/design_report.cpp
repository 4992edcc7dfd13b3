// SPDX-License-Identifier: MIT
#include "optimiser/report/design_report.h"

#include <fmt/format.h>
#include <fmt/ostream.h>

#include <algorithm>
#include <cmath>
#include <sstream>
#include <string>

#include "optimiser/report/cost_lines.h"
#include "optimiser/report/number_format.h"
#include "optimiser/report/report_document.h"
#include "stowage_version.h"

namespace stowage::report {

namespace {

std::string years_text(const std::vector<int>& years, const char* separator) {
  std::string out;
  for (std::size_t i = 0; i < years.size(); ++i) {
    if (i) out += separator;
    out += std::to_string(years[i]);
  }
  return out;
}

std::string csv_number(double v) { return format_machine(v, 10); }

}  // namespace

const char* no_lcos_statement() {
  return "no LCOS: the design delivers no energy to the load over the project, so there is no "
         "cost per kWh delivered (its net present cost still counts)";
}

std::string lcos_cell(const DesignResult& d, double lcos_per_kwh) {
  return d.delivers_energy() ? format_fixed(lcos_per_kwh, 4) : std::string("none");
}

void write_design_json(JsonWriter& json, const DesignResult& d, const RequirementCheck* check) {
  json.begin_object();
  json.field("profile", d.profile_id);
  json.field("dod_setpoint", d.dod_setpoint);
  json.field("cells_series", d.bank.cells_series);
  json.field("strings_parallel", d.bank.strings_parallel);
  json.field("nameplate_kwh", d.bank.nameplate_kwh);
  if (d.delivers_energy()) {
    json.field("lcos_per_kwh", d.lcos_per_kwh);
    json.field("lcos_schmidt_per_kwh", d.lcos_schmidt_per_kwh);
  } else {
    json.field("lcos_statement", no_lcos_statement());
  }
  json.field("npc", d.npc);
  json.field("currency", d.currency);
  json.key("replacement_years").begin_array();
  for (int y : d.replacement_years) json.value(y);
  json.end_array();
  json.key("replacement_months").begin_array();
  for (int m : d.replacement_months) json.value(m);
  json.end_array();
  json.field("discharged_kwh_per_year", d.mean_discharged_kwh_per_year());
  json.field("discharged_kwh_first_year", d.discharged_kwh_first_year());
  json.field("delivered_kwh_first_year", d.years.front().dispatch.delivered_kwh);
  json.field("unserved_kwh_first_year", d.unserved_kwh_first_year());
  json.field("backup_kwh_first_year", d.backup_kwh_first_year());
  json.field("equivalent_full_cycles_first_year", d.equivalent_full_cycles_first_year());
  json.field("investment", d.investment);
  json.field("unserved_fraction_max", d.unserved_fraction_max);
  json.field("meets_unserved_limit", d.meets_unserved_limit);
  const YearDispatch& first = d.years.front().dispatch;
  json.field("auxiliary_kwh_first_year", first.auxiliary_kwh);
  json.field("auxiliary_source_kwh_first_year", first.auxiliary_source_kwh);
  json.field("auxiliary_bank_kwh_first_year", first.auxiliary_bank_kwh);
  json.field("auxiliary_unmet_kwh_first_year", first.auxiliary_unmet_kwh);
  json.field("temperature_idle_hours_first_year", first.temperature_idle_hours());
  json.field("charge_blocked_by_temperature_hours_first_year",
             first.charge_blocked_by_temperature_hours);
  json.field("discharge_blocked_by_temperature_hours_first_year",
             first.discharge_blocked_by_temperature_hours);
  if (!d.enclosure_id.empty()) {
    json.key("enclosure").begin_object();
    json.field("name", d.enclosure_id);
    json.field("capital", d.enclosure_capital);
    json.field("heating_heat_kwh_first_year", first.heating_heat_kwh);
    json.field("heating_hours_first_year", first.heating_hours);
    json.field("cooling_heat_kwh_first_year", first.cooling_heat_kwh);
    json.field("bank_loss_heat_kwh_first_year", first.bank_loss_heat_kwh);
    json.field("conditioning_kwh_first_year", first.conditioning_kwh);
    json.field("conditioning_source_kwh_first_year", first.conditioning_source_kwh);
    json.field("conditioning_bank_kwh_first_year", first.conditioning_bank_kwh);
    json.field("conditioning_backup_kwh_first_year", first.conditioning_backup_kwh);
    json.field("conditioning_unmet_kwh_first_year", first.conditioning_unmet_kwh);
    json.end_object();
  }
  if (check) {
    json.field("meets_requirements", check->meets_all());
    json.key("requirements").begin_object();
    json.field("meets_autonomy", check->meets_autonomy);
    json.field("required_usable_kwh", check->required_usable_kwh);
    json.field("usable_kwh", check->usable_kwh);
    json.field("autonomy_strings", check->autonomy_strings);
    json.field("meets_peak_discharge", check->meets_peak);
    json.field("peak_discharge_kw", check->peak_kw);
    json.field("discharge_power_kw", check->power_kw);
    json.field("peak_strings", check->peak_strings);
    json.end_object();
  }
  json.key("breakdown").begin_object();
  for (const CostLine& item : cost_lines()) json.field(item.key, d.present_value.*item.member);
  json.end_object();
  json.end_object();
}

void print_design_table(std::ostream& out, const DesignResult& d, const RequirementCheck* check) {
  const auto& first = d.years.front().dispatch;
  fmt::print(out, "{} at DoD {:.2f}: {} string{} x {} cells, {} kWh nameplate at {:g} V\n",
             d.profile_id, d.dod_setpoint, d.bank.strings_parallel,
             d.bank.strings_parallel == 1 ? "" : "s", d.bank.cells_series,
             format_amount(d.bank.nameplate_kwh, 1), d.bank.nominal_voltage_v);
  fmt::print(out,
             "  first year    discharged {} kWh, back-up {} kWh, unserved {} kWh, "
             "curtailed {} kWh, {:.0f} equivalent full cycles\n",
             format_amount(first.discharged_terminal_kwh), format_amount(first.backup_kwh),
             format_amount(first.unserved_kwh, 1), format_amount(first.curtailed_kwh),
             first.equivalent_full_cycles);
  if (first.auxiliary_kwh > 0)
    fmt::print(out,
               "  auxiliaries   {} kWh in the first year: {} kWh from the source, {} kWh from "
               "the bank, {} kWh unmet (bank at its floor)\n",
               format_amount(first.auxiliary_kwh, 1), format_amount(first.auxiliary_source_kwh, 1),
               format_amount(first.auxiliary_bank_kwh, 1),
               format_amount(first.auxiliary_unmet_kwh, 1));
  if (!d.enclosure_id.empty())
    fmt::print(out,
               "  enclosure     {}: first year {} kWh of heat in {:.0f} h, {} kWh of heat "
               "removed; conditioning electricity {} kWh ({} kWh from the source, {} kWh from "
               "the bank, {} kWh from back-up, {} kWh unmet)\n",
               d.enclosure_id, format_amount(first.heating_heat_kwh, 1), first.heating_hours,
               format_amount(first.cooling_heat_kwh, 1), format_amount(first.conditioning_kwh, 1),
               format_amount(first.conditioning_source_kwh, 1),
               format_amount(first.conditioning_bank_kwh, 1),
               format_amount(first.conditioning_backup_kwh, 1),
               format_amount(first.conditioning_unmet_kwh, 1));
  const auto& y1 = d.years.front();
  fmt::print(
      out,
      "  ageing        year-1 damage: cycling {:.3f}, calendar {:.3f}, partial charge {:.3f}\n",
      y1.damage_cycle, y1.damage_calendar, y1.damage_partial_charge);
  if (first.temperature_idle_hours() > 0)
    fmt::print(out,
               "  temperature   idle {:.0f} h in the first year because of its temperature limits "
               "({:.0f} h of surplus it could not take, {:.0f} h of deficit it could not serve)\n",
               first.temperature_idle_hours(), first.charge_blocked_by_temperature_hours,
               first.discharge_blocked_by_temperature_hours);
  if (check && !check->meets_autonomy)
    fmt::print(out,
               "  FAILS         autonomy: {} kWh usable needed at the terminals, this bank gives "
               "{} kWh (at least {} strings); optimise would reject it\n",
               format_amount(check->required_usable_kwh, 1), format_amount(check->usable_kwh, 1),
               check->autonomy_strings);
  if (check && !check->meets_peak)
    fmt::print(out,
               "  FAILS         peak discharge: {} kW needed at the terminals, this bank gives "
               "{} kW within its C-rate (at least {} strings); optimise would reject it\n",
               format_amount(check->peak_kw, 1), format_amount(check->power_kw, 1),
               check->peak_strings);
  fmt::print(out, "  replacements  {}\n",
             d.replacement_years.empty()
                 ? std::string("none within the project")
                 : "at the end of " + replacement_times(d.replacement_years, d.replacement_months));
  if (!d.meets_unserved_limit)
    fmt::print(
        out, "  WARNING       unserved energy reaches {:.3f} % of demand, above the site's limit\n",
        100 * d.unserved_fraction_max);
  fmt::print(out, "  present value ({}), by LCOS term\n", d.currency);
  const char* last_term = nullptr;
  for (const CostLine& item : cost_lines()) {
    const double v = d.present_value.*item.member;
    if (v == 0) continue;
    const bool new_term = last_term == nullptr || std::string(last_term) != item.term;
    fmt::print(out, "    {:<20}{:<32}{:>14}\n", new_term ? item.term : "", item.label,
               format_amount(v));
    last_term = item.term;
  }
  fmt::print(out, "    {:<52}{:>14}\n", "net present cost", format_amount(d.npc));
  if (!d.delivers_energy()) {
    fmt::print(out, "  LCOS          {}\n", no_lcos_statement());
    return;
  }
  fmt::print(out,
             "  LCOS          {:.4f} {}/kWh delivered (storage costs net of the residual value / "
             "discounted energy delivered after the inverter)\n",
             d.lcos_per_kwh, d.currency);
  fmt::print(out,
             "  LCOS Schmidt  {:.4f} {}/kWh delivered (Schmidt et al. 2019 conventions: no "
             "residual value, last end of life at year N + 1)\n",
             d.lcos_schmidt_per_kwh, d.currency);
}

namespace {

// "[6,12]": a list as JSON writes it, quoted for CSV (it holds commas); "[]" when empty.
std::string csv_year_list(const std::vector<int>& years) {
  if (years.empty()) return "[]";
  return "\"[" + years_text(years, ",") + "]\"";
}

const char* csv_bool(bool flag) { return flag ? "true" : "false"; }

}  // namespace

std::string csv_text(const std::string& text) {
  if (text.find_first_of(",\"\r\n") == std::string::npos) return text;
  std::string out = "\"";
  for (char c : text) out += c == '"' ? std::string("\"\"") : std::string(1, c);
  return out + "\"";
}

void write_designs_csv(std::ostream& out, const std::vector<DesignResult>& designs,
                       const std::vector<RequirementCheck>* checks, const CsvRunColumns& run) {
  const std::string run_cells = ',' + csv_text(run.study) + ',' + csv_text(run.method);
  out << "rank,profile,dod_setpoint,cells_series,strings_parallel,nameplate_kwh,lcos_per_kwh,"
         "lcos_schmidt_per_kwh,npc,npc_difference_to_best,currency,investment,replacement_years,"
         "discharged_kwh_per_year,discharged_kwh_first_year,delivered_kwh_first_year,"
         "unserved_kwh_first_year,backup_kwh_first_year,equivalent_full_cycles_first_year,"
         "unserved_fraction_max,meets_unserved_limit";
  for (const CostLine& item : cost_lines()) out << ",pv_" << item.key;
  out << ",delivers_energy,charge_blocked_by_temperature_hours_first_year,"
         "discharge_blocked_by_temperature_hours_first_year,meets_autonomy,meets_peak_discharge,"
         "study,method";
  out << "\n";
  // Rank: the place by NPC among these rows (ties keep their order), as the text ranking.
  std::vector<std::size_t> order(designs.size());
  for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
  std::stable_sort(order.begin(), order.end(),
                   [&](std::size_t a, std::size_t b) { return designs[a].npc < designs[b].npc; });
  std::vector<int> rank(designs.size());
  for (std::size_t k = 0; k < order.size(); ++k) rank[order[k]] = static_cast<int>(k + 1);
  const double best_npc = order.empty() ? 0.0 : designs[order.front()].npc;
  for (std::size_t i = 0; i < designs.size(); ++i) {
    const DesignResult& d = designs[i];
    out << rank[i] << ',' << d.profile_id << ',' << csv_number(d.dod_setpoint) << ','
        << d.bank.cells_series << ',' << d.bank.strings_parallel << ','
        << csv_number(d.bank.nameplate_kwh) << ',' << csv_number(d.lcos_per_kwh) << ','
        << csv_number(d.lcos_schmidt_per_kwh) << ',' << csv_number(d.npc) << ','
        << csv_number(d.npc - best_npc) << ',' << d.currency << ',' << csv_number(d.investment)
        << ',' << csv_year_list(d.replacement_years) << ','
        << csv_number(d.mean_discharged_kwh_per_year()) << ','
        << csv_number(d.discharged_kwh_first_year()) << ','
        << csv_number(d.years.front().dispatch.delivered_kwh) << ','
        << csv_number(d.unserved_kwh_first_year()) << ',' << csv_number(d.backup_kwh_first_year())
        << ',' << csv_number(d.equivalent_full_cycles_first_year()) << ','
        << csv_number(d.unserved_fraction_max) << ',' << csv_bool(d.meets_unserved_limit);
    for (const CostLine& item : cost_lines())
      out << ',' << csv_number(d.present_value.*item.member);
    const YearDispatch& first = d.years.front().dispatch;
    out << ',' << csv_bool(d.delivers_energy()) << ','
        << csv_number(first.charge_blocked_by_temperature_hours) << ','
        << csv_number(first.discharge_blocked_by_temperature_hours) << ',';
    if (checks)
      out << csv_bool((*checks)[i].meets_autonomy) << ',' << csv_bool((*checks)[i].meets_peak);
    else
      out << ',';
    out << run_cells << "\n";
  }
}

void write_cash_flows_csv(std::ostream& out, const std::vector<DesignResult>& designs,
                          const CsvRunColumns& run) {
  const std::string run_cells = ',' + csv_text(run.study) + ',' + csv_text(run.method);
  out << "profile,dod_setpoint,strings_parallel,year,row,discount_time_years,health_start,"
         "damage_cycle,damage_calendar,damage_partial_charge,damage_end,replacements,"
         "discharged_kwh,charge_source_kwh,backup_kwh,unserved_kwh,curtailed_kwh,investment,"
         "replacement,fixed_om,variable_om,charging,backup,unserved_penalty,end_of_life,"
         "residual_value,total,discount_factor,present_value,auxiliary_kwh,auxiliary_source_kwh,"
         "auxiliary_bank_kwh,auxiliary_unmet_kwh,damage_peak,replacement_months,study,method\n";
  for (const auto& d : designs) {
    const std::string id = d.profile_id + ',' + csv_number(d.dod_setpoint) + ',' +
                           std::to_string(d.bank.strings_parallel);
    // Year 0: the investment.
    out << id << ",0,investment,0,,,,,,,,,,,," << csv_number(d.investment) << ",,,,,,,,,"
        << csv_number(d.investment) << ",1," << csv_number(d.investment) << ",,,,,," << run_cells
        << "\n";
    for (const auto& y : d.years) {
      out << id << ',' << y.year << ",operation," << y.year << ',' << csv_number(y.health_start)
          << ',' << csv_number(y.damage_cycle) << ',' << csv_number(y.damage_calendar) << ','
          << csv_number(y.damage_partial_charge) << ',' << csv_number(y.damage_end) << ','
          << y.replacements << ',' << csv_number(y.dispatch.discharged_terminal_kwh) << ','
          << csv_number(y.dispatch.charge_source_kwh) << ',' << csv_number(y.dispatch.backup_kwh)
          << ',' << csv_number(y.dispatch.unserved_kwh) << ','
          << csv_number(y.dispatch.curtailed_kwh) << ",0," << csv_number(y.replacement) << ','
          << csv_number(y.fixed_om) << ',' << csv_number(y.variable_om) << ','
          << csv_number(y.charging) << ',' << csv_number(y.backup) << ','
          << csv_number(y.unserved_penalty) << ',' << csv_number(y.end_of_life) << ','
          << csv_number(y.residual_value) << ',' << csv_number(y.total()) << ','
          << csv_number(y.discount_factor) << ',' << csv_number(y.total() * y.discount_factor)
          << ',' << csv_number(y.dispatch.auxiliary_kwh) << ','
          << csv_number(y.dispatch.auxiliary_source_kwh) << ','
          << csv_number(y.dispatch.auxiliary_bank_kwh) << ','
          << csv_number(y.dispatch.auxiliary_unmet_kwh) << ',' << csv_number(y.damage_peak) << ','
          << csv_year_list(y.replacement_months) << run_cells << "\n";
    }
    // The last bank's end of life, discounted at N + 1 or later when that bank has life left
    // (docs/method.md): `year` is the whole year it falls in, the exact time has its column.
    const double t_final = d.final_end_of_life_year;
    const double df_last = d.final_discount_factor;
    out << id << ',' << static_cast<long>(std::ceil(t_final - 1e-9)) << ",end_of_life,"
        << csv_number(t_final) << ",,,,,,,,,,,,0,0,0,0,0,0,0," << csv_number(d.final_end_of_life)
        << ",0," << csv_number(d.final_end_of_life) << ',' << csv_number(df_last) << ','
        << csv_number(d.final_end_of_life * df_last) << ",,,,,," << run_cells << "\n";
  }
}

std::string exchange_rate_text(const ExchangeRate& rate, const std::string& study_currency) {
  std::string text =
      "1 " + rate.currency + " = " + format_general(rate.rate, 10) + " " + study_currency;
  if (rate.profile_ids.empty())
    return text + ", not used (no profile prices in " + rate.currency + ")";
  text += rate.profile_ids.size() == 1 ? ", applied to the prices of profile "
                                       : ", applied to the prices of profiles ";
  for (std::size_t i = 0; i < rate.profile_ids.size(); ++i)
    text += (i == 0 ? "" : ", ") + rate.profile_ids[i];
  return text;
}

void write_study_json(JsonWriter& json, const StudyCase& study) {
  json.field("stowage_version", STOWAGE_VERSION_STRING);
  json.field("study", study.title);
  json.field("site", study.site.name);
  json.field("project_years", study.economics.project_years);
  json.field("real_discount_rate", study.economics.real_discount_rate);
  json.field("currency", study.economics.currency);
  if (!study.exchange_rates.empty()) {
    json.key("exchange_rates").begin_array();
    for (const ExchangeRate& r : study.exchange_rates) {
      json.begin_object().field("currency", r.currency).field("rate", r.rate);
      json.key("profiles").begin_array();
      for (const std::string& id : r.profile_ids) json.value(id);
      json.end_array().end_object();
    }
    json.end_array();
  }
}

void print_study_header(std::ostream& out, const StudyCase& study, const std::string& what) {
  fmt::print(out, "stowage {}: {}\n", STOWAGE_VERSION_STRING, what);
  fmt::print(out, "Study: {}\nSite:  {} ({:g} V bus, {} kWh demand a year)\n", study.title,
             study.site.name, study.site.bus_voltage_v,
             format_amount(study.site.annual_demand_kwh()));
  fmt::print(out, "Economics: {} years, {:.1f} % real discount rate, {}\n",
             study.economics.project_years, 100 * study.economics.real_discount_rate,
             study.economics.currency);
  for (const ExchangeRate& r : study.exchange_rates)
    fmt::print(out, "Exchange rate: {}\n", exchange_rate_text(r, study.economics.currency));
}

void print_safety_notice(std::ostream& out) {
  out << "Caution: this is a planning estimate from generic profiles and synthetic or measured\n"
         "series, not a design certificate. Battery banks can hurt people: lead-acid banks give\n"
         "off hydrogen while charging and need ventilation (IEC 62485-2), lithium banks can go\n"
         "into thermal runaway (fire codes such as NFPA 855 where adopted), DC arcs, acid or\n"
         "electrolyte and the weight of a bank injure. Follow local codes, the manufacturer's\n"
         "instructions and licensed practice for any installation.\n";
}

}  // namespace stowage::report
