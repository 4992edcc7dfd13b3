// SPDX-License-Identifier: MIT
#include "optimiser/report/check_report.h"

#include <fmt/format.h>
#include <fmt/ostream.h>

#include "model/sizing.h"
#include "optimiser/report/number_format.h"

namespace stowage::report {

void write_check_text(std::ostream& out, const std::string& study_path, const Study& study) {
  const SiteConditions& site = study.site;
  fmt::print(out, "{}: valid\n", study_path);
  fmt::print(out, "  study     {}\n", study.title);
  fmt::print(out, "  site      {}: {:g} V bus, {} kWh demand a year, {:g} days autonomy\n",
             site.name, site.bus_voltage_v, format_amount(site.annual_demand_kwh()),
             site.autonomy_days);
  fmt::print(out, "  economics {} years at {:.1f} % real, {}\n", study.economics.project_years,
             100 * study.economics.real_discount_rate, study.economics.currency);
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

}  // namespace stowage::report
