// SPDX-License-Identifier: MIT
// DesignSpace: every (profile, DoD setpoint) pair the optimiser may choose, with the range of
// strings in parallel that meets the study's hard requirements, a rigorous lower bound on the
// net present cost of any design, and the diagnosis when no design can meet them.
//
// For profile p at setpoint d (d from dod_ladder(search, p)) a bank of n strings is admissible
// when all of these hold (n integer, cells in series fixed by the bus voltage):
//   autonomy (IEEE Std 1013 approach, model/sizing.h):
//       design_usable_kwh(p, site, d, n) >= size_for_autonomy(p, site, d).required_usable_kwh
//   peak discharge (C-rate at the terminals):
//       n x max_discharge_c_rate x cell_capacity_ah x cells_series x mean_discharge_v / 1000
//         >= max over hours of (load - source) / inverter_efficiency            [kW]
//     i.e. the rated capacity delivered at the profile's C-rate limit and its mean discharge
//     voltage covers the largest hourly draw at the terminals;
//   1 <= n <= search.max_strings_parallel;
//   year-0 investment I0(n) <= search.budget                                 (when set);
//   n x cells_series x cell_mass_kg  <= search.max_mass_kg                    (when set);
//   n x cells_series x cell_volume_l <= search.max_volume_l                   (when set).
// Autonomy and C-rate bound n from below, the others from above, so the admissible strings of
// a pair form one interval [min_strings, max_strings] (empty when min > max).
// The charge C-rate is NOT a feasibility constraint: a bank too small to take the whole surplus
// just curtails it, which the exact simulator prices (lost energy, more back-up). It enters
// the optimisation as a dispatch limit only.
// The unserved-energy limit (site.unserved_limit_fraction) depends on the dispatch and is
// checked on each exactly evaluated design (DesignResult::meets_unserved_limit), not here.
// A profile that lacks cell_mass_kg (cell_volume_l) cannot prove it meets max_mass_kg
// (max_volume_l), so all its pairs are inadmissible and the reason is recorded.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "catalog-schema/study_case.h"

namespace stowage {

// What caps the strings of a pair from above.
enum class StringCap { MaxStrings, Budget, Mass, Volume, MissingMass, MissingVolume };

struct DesignChoice {
  std::size_t profile_index = 0;  // into Study::profiles
  double dod_setpoint = 0;
  int autonomy_strings = 1;  // least n meeting the autonomy rule
  int c_rate_strings = 1;    // least n meeting the peak discharge
  int min_strings = 1;       // max(autonomy_strings, c_rate_strings, 1)
  int max_strings = 0;       // least of the caps; may be < 1
  StringCap cap = StringCap::MaxStrings;
  double required_usable_kwh = 0;  // autonomy requirement at the terminals

  bool admissible() const { return min_strings <= max_strings; }
  int strings_count() const { return admissible() ? max_strings - min_strings + 1 : 0; }
};

// A design named in a diagnosis: where the best available figure is reached.
struct DesignRef {
  std::size_t profile_index = 0;
  double dod_setpoint = 0;
  int strings = 0;
  StringCap cap = StringCap::MaxStrings;  // what capped its strings
};

enum class Requirement {
  DodLadder,        // no profile allows a setpoint of the ladder
  MaxStrings,       // max_strings_parallel below one string
  Budget,           // the budget buys no bank (needed: cheapest one-string bank)
  Mass,             // the mass cap is below the lightest string (kg)
  Volume,           // the volume cap is below the smallest string (l)
  MissingCellData,  // a mass or volume cap, and profiles without the cell figure
  AutonomyAndPeak,  // banks with enough energy lack power and the other way round
  Autonomy,         // usable kWh at the terminals: needed vs the most any allowed bank gives
  PeakDischarge,    // kW at the terminals within the discharge C-rate
  UnservedLimit,    // fraction of demand unserved in the worst year: limit vs least reached
};

// One requirement no design meets, with the numbers that show by how much (data only; the
// report layer words it).
struct UnmetRequirement {
  Requirement requirement = Requirement::Autonomy;
  double needed = 0;
  double best_available = 0;
  std::optional<DesignRef> best_at;  // the design reaching best_available, when one does
  bool missing_mass = false;         // MissingCellData: a mass cap (else a volume cap)
};

// Why a profile is left out or has no design in the ranking.
struct ProfileNote {
  enum class Kind {
    NoCellMass,    // a mass cap is set and the profile gives no cell mass
    NoCellVolume,  // a volume cap is set and the profile gives no cell volume
    NoDesignMeetsUnservedLimit,
    LadderOutsideDodRange,  // no ladder setpoint lies within the profile's DoD range
    CapsBelowNeed,          // autonomy or the peak draw needs more strings than allowed
  };
  std::size_t profile_index = 0;
  Kind kind = Kind::CapsBelowNeed;
  bool autonomy_needs_more = false, peak_needs_more = false;  // CapsBelowNeed
  int cap_strings = 0;                                        // CapsBelowNeed
  StringCap cap = StringCap::MaxStrings;                      // CapsBelowNeed
};

struct DesignSpace {
  std::vector<DesignChoice> choices;      // every (profile, ladder setpoint) pair
  double peak_discharge_terminal_kw = 0;  // max (load - source)^+ / inverter_efficiency
  std::vector<ProfileNote> notes;         // profiles excluded by a missing cell mass or volume

  std::size_t admissible_designs() const;  // sum of strings_count()
  std::size_t admissible_choices() const;
  // Why no admissible pair exists; empty when some pair is admissible.
  std::vector<UnmetRequirement> diagnose(const StudyCase& study) const;
};

DesignSpace build_design_space(const StudyCase& study);

// max over hours of (load - source serving it directly)^+ / inverter_efficiency, kW at the
// bank terminals: the peak discharge requirement.
double peak_discharge_terminal_kw(const SiteConditions& site);

// Whether one design meets the two hard requirements above (autonomy and peak discharge), by
// the very rule that bounds the design space from below: a design passes exactly when its
// strings are at least the least admissible n of its (profile, setpoint) pair. `evaluate`
// uses it to mark the designs `optimise` would reject.
struct RequirementCheck {
  double required_usable_kwh = 0;  // autonomy requirement at the terminals (sizing.h)
  double usable_kwh = 0;           // design_usable_kwh of the design
  int autonomy_strings = 1;        // least n meeting autonomy
  double peak_kw = 0;              // peak_discharge_terminal_kw
  double power_kw = 0;             // strings x string_discharge_power_kw
  int peak_strings = 1;            // least n meeting the peak discharge
  bool meets_autonomy = true, meets_peak = true;
  bool meets_all() const { return meets_autonomy && meets_peak; }
};
RequirementCheck check_requirements(const ChemistryProfile& profile, const SiteConditions& site,
                                    double dod_setpoint, int strings);

// Per-string figures of a profile on the study's bus.
double string_nameplate_kwh(const ChemistryProfile& profile, double bus_voltage_v);
double string_discharge_power_kw(const ChemistryProfile& profile, double bus_voltage_v);
// Year-0 investment I0(n) = capital_per_kwh x nameplate + capital_per_string x n + install.
double bank_investment(const ChemistryProfile& profile, double bus_voltage_v, int strings);

// A lower bound on DesignResult::npc of any design of `profile` with `strings` strings,
// whatever the setpoint and dispatch, priced by model/costs.h (the simulator's own formulas):
//   the year-0 investment I0;
//   + fixed O&M (exact: proportional to nameplate every year);
//   - the largest residual credit the conventions of model/lifecycle.h allow (a bank with all
//     its life left, valued at the replacement price of year N, P(N), credited at N);
//   + the last bank's end of life: a cost at its latest possible date, N + max(1, the longest
//     life left: 1 / calendar damage per year or max_service_years), 0 when neither is known;
//     a salvage credit (< 0) at its earliest, N + 1;
//   + the replacements that calendar ageing or max_service_years alone force: each bank lasts
//     at most Y whole years whenever in a year it went in (replacements are made at month ends,
//     docs/method.md 6), so the k-th replacement is booked in some year y <= kY (counted while
//     kY < N) and costs at least min over y in [1, kY] of (P(y) + end of life at a replacement)
//     x P/F(y).
// Every other item (variable O&M, charging, back-up, penalty, cycle wear) is >= 0 and left
// out. When a replacement in any year 1..N could have a negative net cost (a salvage above the
// price of a new bank) more replacements lower the NPC without limit: the bound is then
// -infinity.
// `calendar_damage_per_year`: the site's exact calendar damage
// (AccelerationSeries::calendar_damage_per_year); 0 when unknown (a weaker bound).
double npc_lower_bound(const ChemistryProfile& profile, const Study& study, int strings,
                       double calendar_damage_per_year = 0);

}  // namespace stowage
