// SPDX-License-Identifier: MIT
// `stowage check STUDY`: load and validate every file of a study and say what is wrong.
#include <fmt/format.h>
#include <fmt/ostream.h>

#include <iostream>

#include "model/sizing.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"

namespace stowage::cli {

void register_check(CLI::App& app, int& exit_code) {
  auto* cmd = app.add_subcommand(
      "check",
      "Validate a study, its site, hourly series and profiles; report every problem's "
      "file, line and field");
  auto path = std::make_shared<std::string>();
  cmd->add_option("study", *path, "Study file (YAML)")->required();
  cmd->callback([path, &exit_code]() {
    exit_code = run_guarded([&]() {
      const Study study = load_study_for_cli(*path);
      const SiteConditions& site = study.site;
      fmt::print(std::cout, "{}: valid\n", *path);
      fmt::print(std::cout, "  study     {}\n", study.title);
      fmt::print(std::cout,
                 "  site      {}: {:g} V bus, {} kWh demand a year, {:g} days autonomy\n",
                 site.name, site.bus_voltage_v, format_amount(site.annual_demand_kwh()),
                 site.autonomy_days);
      fmt::print(std::cout, "  economics {} years at {:.1f} % real, {}\n",
                 study.economics.project_years, 100 * study.economics.real_discount_rate,
                 study.economics.currency);
      fmt::print(std::cout, "  profiles  {}\n", study.profiles.size());
      for (const auto& p : study.profiles) {
        const auto sizing = size_for_autonomy(p, site, p.dod.default_setpoint);
        fmt::print(std::cout,
                   "    {:<28} {:<24} round trip {:.1f} %, DoD {:.2f}..{:.2f}, autonomy needs {} "
                   "string{} at DoD {:.2f}\n",
                   p.id, p.family, 100 * p.round_trip_efficiency(), p.dod.min, p.dod.max,
                   sizing.strings_parallel, sizing.strings_parallel == 1 ? "" : "s",
                   p.dod.default_setpoint);
      }
      fmt::print(std::cout, "  designs   {}\n",
                 study.designs.empty() ? std::string("none listed: each profile at its default "
                                                     "DoD, sized for autonomy")
                                       : std::to_string(study.designs.size()));
      return static_cast<int>(kExitOk);
    });
  });
}

}  // namespace stowage::cli
