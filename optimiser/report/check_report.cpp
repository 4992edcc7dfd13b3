// SPDX-License-Identifier: MIT
#include "optimiser/report/check_report.h"

#include <fmt/format.h>
#include <fmt/ostream.h>

#include "model/sizing.h"
#include "optimiser/report/design_report.h"
#include "optimiser/report/json_writer.h"
#include "optimiser/report/messages.h"
#include "optimiser/report/number_format.h"

namespace stowage::report {

void write_check_text(std::ostream& out, const std::string& study_path, const StudyCase& study) {
  const SiteConditions& site = study.site;
  fmt::print(out, "{}: valid\n", study_path);
  fmt::print(out, "  study     {}\n", study.title);
  fmt::print(out, "  site      {}: {:g} V bus, {} kWh demand a year, {:g} days autonomy\n",
             site.name, site.bus_voltage_v, format_amount(site.annual_demand_kwh()),
             site.autonomy_days);
  fmt::print(out, "  economics {} years at {:.1f} % real, {}\n", study.economics.project_years,
             100 * study.economics.real_discount_rate, study.economics.currency);
  for (const ExchangeRate& r : study.exchange_rates)
    fmt::print(out, "  exchange  {}\n", exchange_rate_text(r, study.economics.currency));
  fmt::print(out, "  profiles  {}\n", study.profiles.size());
  for (const auto& p : study.profiles) {
    const auto sizing = size_for_autonomy(p, site, p.dod.default_setpoint);
    fmt::print(out,
               "    {:<28} {:<24} round trip {:.1f} %, DoD {:.2f}..{:.2f}, autonomy needs {} "
               "string{} at DoD {:.2f}\n",
               p.id, p.family, 100 * p.round_trip_efficiency(), p.dod.min, p.dod.max,
               sizing.strings_parallel, sizing.strings_parallel == 1 ? "" : "s",
               p.dod.default_setpoint);
    if (p.auxiliary.any())
      fmt::print(out,
                 "    {:<28} auxiliaries: standing {:g} kW per kWh nameplate, pumps {:g} kW per "
                 "kW moved; round trip with pumps {:.1f} % (standing load not included)\n",
                 "", p.auxiliary.standing_kw_per_kwh, p.auxiliary.pump_kw_per_kw,
                 100 * p.round_trip_with_pumps());
  }
  fmt::print(out, "  designs   {}\n",
             study.designs.empty()
                 ? std::string("none listed: each profile at its default DoD, sized for autonomy")
                 : std::to_string(study.designs.size()));
}

void write_check_problems_text(std::ostream& err, const std::string& study_path,
                               const std::vector<InputError>& problems) {
  for (const InputError& e : problems) write_failure(err, Failure::BadInput, e.what());
  fmt::print(err, "stowage: {} problem{} found in {}\n", problems.size(),
             problems.size() == 1 ? "" : "s", escape_controls(study_path));
}

void write_check_notes_text(std::ostream& err, const std::vector<InputNote>& notes) {
  for (const InputNote& note : notes) fmt::print(err, "stowage: {}\n", note.text());
}

namespace {

void write_located(JsonWriter& json, const std::string& file, int line, int column,
                   const std::string& field, const std::string& message) {
  json.begin_object()
      .field("file", escape_controls(file))
      .field("line", line)
      .field("column", column)
      .field("field", escape_controls(field))
      .field("message", escape_controls(message))
      .end_object();
}

void write_summary_json(JsonWriter& json, const StudyCase& study) {
  const SiteConditions& site = study.site;
  json.begin_object().field("title", escape_controls(study.title));
  json.key("site")
      .begin_object()
      .field("name", escape_controls(site.name))
      .field("bus_voltage_v", site.bus_voltage_v)
      .field("annual_demand_kwh", site.annual_demand_kwh())
      .field("autonomy_days", site.autonomy_days)
      .end_object();
  json.key("economics")
      .begin_object()
      .field("project_years", study.economics.project_years)
      .field("real_discount_rate", study.economics.real_discount_rate)
      .field("currency", escape_controls(study.economics.currency));
  if (!study.exchange_rates.empty()) {
    json.key("exchange_rates").begin_array();
    for (const ExchangeRate& r : study.exchange_rates) {
      json.begin_object().field("currency", r.currency).field("rate", r.rate);
      json.key("profiles").begin_array();
      for (const std::string& id : r.profile_ids) json.value(escape_controls(id));
      json.end_array().end_object();
    }
    json.end_array();
  }
  json.end_object();
  json.key("profiles").begin_array();
  for (const auto& p : study.profiles) {
    const auto sizing = size_for_autonomy(p, site, p.dod.default_setpoint);
    json.begin_object()
        .field("id", escape_controls(p.id))
        .field("family", escape_controls(p.family))
        .field("round_trip_efficiency", p.round_trip_efficiency())
        .field("dod_min", p.dod.min)
        .field("dod_default", p.dod.default_setpoint)
        .field("dod_max", p.dod.max)
        .field("strings_for_autonomy", sizing.strings_parallel)
        .end_object();
  }
  json.end_array();
  json.field("designs_listed", static_cast<int>(study.designs.size())).end_object();
}

}  // namespace

void write_check_json(std::ostream& out, const std::string& study_path, const StudyCase* study,
                      const std::vector<InputError>& problems,
                      const std::vector<InputNote>& notes) {
  JsonWriter json;
  json.begin_object()
      .field("study", escape_controls(study_path))
      .field("valid", problems.empty() && study != nullptr);
  json.key("problems").begin_array();
  for (const InputError& e : problems) {
    write_located(json, e.file(), e.line(), e.column(), e.field(), e.message());
  }
  json.end_array();
  json.key("notes").begin_array();
  for (const InputNote& n : notes)
    write_located(json, n.file, n.line, n.column, n.field, n.message);
  json.end_array();
  json.key("summary");
  if (problems.empty() && study != nullptr) {
    write_summary_json(json, *study);
  } else {
    json.null();
  }
  json.end_object();
  out << json.str() << "\n";
}

}  // namespace stowage::report
