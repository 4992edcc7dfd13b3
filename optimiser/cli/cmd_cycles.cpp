// SPDX-License-Identifier: MIT
// `stowage cycles SERIES.csv [--profile FILE]`: rainflow count of a logged SOC series, and with
// a profile the damage it did and the life left at that duty.
#include <iostream>
#include <memory>
#include <optional>

#include "catalog-schema/profile_loader.h"
#include "catalog-schema/soc_series.h"
#include "model/duty_cycles.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/report/cycles_report.h"

namespace stowage::cli {

namespace {

struct CyclesArgs {
  std::string series_path;
  std::string profile_path;
  double hours_per_row = 1.0;
  int bins = 10;
  OutputFormat format = OutputFormat::Text;
};

}  // namespace

void register_cycles(CLI::App& app, int& exit_code) {
  auto args = std::make_shared<CyclesArgs>();
  auto* cmd = app.add_subcommand(
      "cycles",
      "Count the cycles in a logged SOC series (rainflow); with --profile, the damage "
      "and the life left at that duty");
  cmd->add_option("series", args->series_path,
                  "CSV with a soc (fraction) or soc_pct (percent) column, optional temp_c")
      ->required();
  cmd->add_option("--profile", args->profile_path, "Chemistry profile (YAML) to age against")
      ->type_name("FILE");
  cmd->add_option("--hours-per-row", args->hours_per_row, "Logging interval in hours (default 1)")
      ->check(CLI::PositiveNumber);
  cmd->add_option("--bins", args->bins, "Number of depth bins in the histogram (default 10)")
      ->check(CLI::Range(1, 100));
  add_format_option(*cmd, args->format);
  cmd->callback([args, &exit_code]() {
    exit_code = run_guarded([&]() {
      const SocSeries series = read_soc_series_file(args->series_path);
      // A time column gives the real spacing; --hours-per-row is for a log without one.
      if (series.hours_per_sample) args->hours_per_row = *series.hours_per_sample;
      std::optional<ChemistryProfile> profile;
      if (!args->profile_path.empty()) profile = load_profile_file(args->profile_path);
      const DutyCycleSummary summary = summarise_cycles(series.soc_fraction, args->bins);
      std::optional<DutyDamage> damage;
      if (profile)
        damage = duty_damage(*profile, summary, series.temp_c, series.soc_fraction.size(),
                             args->hours_per_row);
      const report::CyclesInput input{args->series_path, args->hours_per_row};
      if (args->format == OutputFormat::Json)
        report::write_cycles_json(std::cout, input, series, summary, damage);
      else
        report::write_cycles_text(std::cout, input, series, summary, profile, damage);
      return static_cast<int>(kExitOk);
    });
  });
}

}  // namespace stowage::cli
