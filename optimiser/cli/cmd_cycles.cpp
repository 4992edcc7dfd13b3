// SPDX-License-Identifier: MIT
// `stowage cycles SERIES.csv [--profile FILE]`: rainflow count of a logged SOC series, and with
// a profile the damage it did and the life left at that duty.
#include <fmt/format.h>
#include <fmt/ostream.h>

#include <iostream>
#include <memory>
#include <optional>

#include "catalog-schema/profile_loader.h"
#include "catalog-schema/soc_series.h"
#include "model/duty_cycles.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/cli/json_writer.h"
#include "stowage_version.h"

namespace stowage::cli {

namespace {

struct CyclesArgs {
  std::string series_path;
  std::string profile_path;
  double hours_per_row = 1.0;
  int bins = 10;
  OutputFormat format = OutputFormat::Text;
};

void print_text(const CyclesArgs& args, const SocSeries& series, const DutyCycleSummary& s,
                const std::optional<ChemistryProfile>& profile,
                const std::optional<DutyDamage>& damage) {
  auto& out = std::cout;
  fmt::print(out, "stowage {}: cycle count of {}\n", STOWAGE_VERSION_STRING, args.series_path);
  fmt::print(out, "{} samples, {:g} h apart ({:.1f} days)\n", series.soc_fraction.size(),
             args.hours_per_row,
             static_cast<double>(series.soc_fraction.size() - 1) * args.hours_per_row / 24.0);
  fmt::print(out, "Rainflow count (ASTM E1049-85), by depth of discharge\n");
  fmt::print(out, "  {:>14}{:>12}\n", "depth", "cycles");
  for (const auto& b : s.histogram)
    fmt::print(out, "  {:>5.0f} - {:>3.0f} %{:>12.1f}\n", 100 * b.depth_from, 100 * b.depth_to,
               b.count);
  fmt::print(out, "Equivalent full cycles: {:.2f}\n", s.equivalent_full_cycles);
  if (profile && damage) {
    fmt::print(out, "\nAgainst profile {} (end of life at {:.0f} % capacity)\n", profile->id,
               100 * profile->eol_capacity_fraction);
    fmt::print(out, "  cycle damage      {:.5f}{}\n", damage->cycle,
               series.temp_c.empty() ? " (at the reference temperature: no temp_c column)" : "");
    fmt::print(out, "  calendar damage   {:.5f}\n", damage->calendar);
    fmt::print(out, "  life consumed     {:.2f} %\n", 100 * damage->total());
    if (damage->total() >= 1.0)
      fmt::print(out, "  The series alone used up the bank's life at this duty.\n");
    else
      fmt::print(out,
                 "  At this duty, assuming the bank was new when the log starts: {:.1f} more "
                 "years, {:.0f} more equivalent full cycles\n",
                 damage->remaining_life_years, damage->remaining_equivalent_full_cycles);
  }
}

void print_json(const SocSeries& series, const DutyCycleSummary& s,
                const std::optional<DutyDamage>& damage, const CyclesArgs& args) {
  JsonWriter json;
  json.begin_object();
  json.field("stowage_version", STOWAGE_VERSION_STRING);
  json.field("samples", static_cast<long>(series.soc_fraction.size()));
  json.field("hours_per_sample", args.hours_per_row);
  json.key("cycles").begin_array();
  for (const auto& c : s.cycles) {
    json.begin_object();
    json.field("depth", c.depth).field("mean", c.mean).field("count", c.count);
    json.end_object();
  }
  json.end_array();
  json.key("histogram").begin_array();
  for (const auto& b : s.histogram) {
    json.begin_object();
    json.field("depth_from", b.depth_from).field("depth_to", b.depth_to).field("count", b.count);
    json.end_object();
  }
  json.end_array();
  json.field("equivalent_full_cycles", s.equivalent_full_cycles);
  if (damage) {
    json.field("damage", damage->cycle);
    json.field("calendar_damage", damage->calendar);
    json.field("life_consumed", damage->total());
    json.field("remaining_life_years", damage->remaining_life_years);
    json.field("remaining_equivalent_full_cycles", damage->remaining_equivalent_full_cycles);
  }
  json.end_object();
  std::cout << json.str() << "\n";
}

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
      if (args->format == OutputFormat::Json)
        print_json(series, summary, damage, *args);
      else
        print_text(*args, series, summary, profile, damage);
      return static_cast<int>(kExitOk);
    });
  });
}

}  // namespace stowage::cli
