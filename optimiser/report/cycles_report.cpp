// SPDX-License-Identifier: MIT
#include "optimiser/report/cycles_report.h"

#include <fmt/format.h>
#include <fmt/ostream.h>

#include "optimiser/report/json_writer.h"
#include "stowage_version.h"

namespace stowage::report {

void write_cycles_text(std::ostream& out, const CyclesInput& args, const SocSeries& series,
                       const DutyCycleSummary& s, const std::optional<ChemistryProfile>& profile,
                       const std::optional<DutyDamage>& damage) {
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

void write_cycles_json(std::ostream& out, const CyclesInput& args, const SocSeries& series,
                       const DutyCycleSummary& s, const std::optional<DutyDamage>& damage) {
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
  out << json.str() << "\n";
}

}  // namespace stowage::report
