// SPDX-License-Identifier: MIT
// `stowage cycles SERIES.csv [--profile FILE]` or `stowage cycles --study STUDY [--profile ID]`:
// rainflow count of a logged SOC series (with --study, the study's soc_log), and with a profile
// (with --study, one of the study's, by id) the damage it did and the life left at that duty.
#include <iostream>
#include <memory>
#include <optional>

#include "catalog-schema/profile_loader.h"
#include "catalog-schema/soc_series.h"
#include "catalog-schema/study_loader.h"
#include "model/duty_cycles.h"
#include "model/invalid_value.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/report/check_report.h"
#include "optimiser/report/cycles_report.h"

namespace stowage::cli {

namespace {

struct CyclesArgs {
  std::string series_path;
  std::string profile_path;  // a profile file, or with --study a profile id of the study
  std::string study_path;
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
  auto* series_option = cmd->add_option(
      "series", args->series_path,
      "CSV with a soc (fraction) or soc_pct (percent) column, optional temp_c and time");
  auto* study_option = cmd->add_option("--study", args->study_path,
                                       "Count the log the study names (study.soc_log) instead")
                           ->type_name("STUDY")
                           ->excludes(series_option);
  series_option->excludes(study_option);
  cmd->add_option("--profile", args->profile_path,
                  "Chemistry profile (YAML) to age against; with --study, the id of one of the "
                  "study's profiles")
      ->type_name("FILE|ID");
  cmd->add_option("--hours-per-row", args->hours_per_row, "Logging interval in hours (default 1)")
      ->check(CLI::PositiveNumber);
  cmd->add_option("--bins", args->bins, "Number of depth bins in the histogram (default 10)")
      ->check(CLI::Range(1, 100));
  add_format_option(*cmd, args->format);
  cmd->callback([args, &exit_code]() {
    exit_code = run_guarded([&]() {
      if (args->study_path.empty() && args->series_path.empty())
        throw InvalidValue("series",
                           "give a SOC series CSV, or --study STUDY for the study's soc_log");
      std::optional<LoadedStudy> loaded;
      std::optional<SocSeries> from_file;
      std::optional<ChemistryProfile> profile;
      if (!args->study_path.empty()) {
        loaded = load_study_details_file(args->study_path);
        report::write_check_notes_text(std::cerr, loaded->notes);
        study_soc_log(*loaded);  // refuses a study without one
        args->series_path = loaded->soc_log_path;
        if (!args->profile_path.empty())
          profile = study_profile(*loaded, args->profile_path, "--profile");
      } else {
        from_file = read_soc_series_file(args->series_path);
        if (!args->profile_path.empty()) profile = load_profile_file(args->profile_path);
      }
      const SocSeries& series = loaded ? *loaded->soc_log : *from_file;
      // A time column gives the real spacing; --hours-per-row is for a log without one.
      if (series.hours_per_sample) args->hours_per_row = *series.hours_per_sample;
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
