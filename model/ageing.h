// SPDX-License-Identifier: MIT
// Ageing of one year of operation, as Palmgren-Miner damage (end of life at damage 1).
//
//   cycle damage    = sum over rainflow cycles of the SOC trace (ASTM E1049-85) of
//                     count x a_cycle / N(depth), N from the cycle-life curve, a_cycle the
//                     temperature acceleration a(T_h) of the hours in which the cycle moved
//                     charge, weighted by the SOC travel of each hour (rainflow.h, leg
//                     attribution: continuous in the trace, plateaus carry no weight);
//   calendar damage = sum over hours of a_cal(T_h) x m(s_h) / (calendar_life_years x 8760),
//                     a_cal the calendar law's acceleration (the cycling law unless the profile
//                     gives calendar ageing its own), m the optional SOC stress of the hour's
//                     mean SOC (s_h + s_(h+1)) / 2 (1 without one);
//   partial-charge  = excess days without full charge x damage_per_extra_day.
// Capacity fades linearly with accumulated damage D from 1 to eol_capacity_fraction:
//   health = 1 - (1 - eol_capacity_fraction) x D.
#pragma once

#include <vector>

#include "model/chemistry_profile.h"
#include "model/rainflow.h"

namespace stowage {

struct YearDamage {
  double cycle = 0;
  double calendar = 0;
  double partial_charge = 0;
  double total() const { return cycle + calendar + partial_charge; }
};

// Per-hour temperature acceleration of a profile at a site, computed once per (profile, site)
// and shared by every year and design.
struct AccelerationSeries {
  std::vector<double> per_hour;           // a(T_h) of cycle ageing, 8760 values
  std::vector<double> calendar_per_hour;  // a_cal(T_h) of calendar ageing, 8760 values
  // sum calendar_per_hour / (calendar_life_years x 8760): the year's calendar damage at the
  // reference SOC (the whole of it when the profile has no SOC stress).
  double calendar_damage_per_year = 0;
  // The same sum over each 730-hour month of the year, 12 values.
  std::vector<double> calendar_damage_per_month;
};
AccelerationSeries acceleration_series(const ChemistryProfile& profile,
                                       const std::vector<double>& temp_c);
// Sets the hours [first, end) of `a` (one whole 730-hour month: first a multiple of 730) from
// the temperatures temp_c[first .. end), and that month's calendar_damage_per_month, as
// acceleration_series() would for them; calendar_damage_per_year is left as it was. For a
// battery temperature that the dispatch computes month by month (enclosure.h).
void refresh_acceleration_month(const ChemistryProfile& profile, const double* temp_c,
                                std::size_t first, std::size_t end, AccelerationSeries& a);

// Cycle damage of one bank's SOC history within a year as the history grows (month by month):
// the rainflow cycles closed so far are booked as they close, and provisional() adds the
// residue's half cycles, so at the end of the history it equals the cycle damage year_damage()
// gives for the whole trace. Trace index h is the state at the start of hour h of the year (the
// weight of step h is the acceleration of hour h); the trace buffer must outlive the history.
class CycleDamageMeter {
 public:
  // A new history starting at soc_trace[first]; the profile and series must outlive it.
  void start(const ChemistryProfile& profile, const AccelerationSeries& acceleration,
             const double* soc_trace, std::size_t first);
  // The trace now holds the points up to (not including) index end.
  void extend(std::size_t end);
  // Damage of the cycles closed so far plus the residue counted as half cycles.
  double provisional();
  // The history's final cycle damage (as provisional()); ends the history.
  double close();

 private:
  double depth_damage(const CycleLifeCurve& curve, double depth);

  const ChemistryProfile* profile_ = nullptr;
  RainflowStream stream_;
  double last_depth_ = -1, last_damage_ = 0;  // damage_per_cycle of the latest depth
  double closed_ = 0;
};

// Calendar damage of the hours [first, end) of a year with the SOC trace `soc_trace` (index h:
// the state at the start of hour h): the calendar term of the header, over those hours.
double calendar_damage(const ChemistryProfile& profile, const AccelerationSeries& acceleration,
                       const double* soc_trace, std::size_t first, std::size_t end);

// `soc_trace` has 8761 points (start of year and after each hour, as from dispatch_year).
YearDamage year_damage(const ChemistryProfile& profile, const AccelerationSeries& acceleration,
                       const std::vector<double>& soc_trace, double partial_charge_excess_days,
                       RainflowScratch& scratch);

double health_from_damage(const ChemistryProfile& profile, double damage);

}  // namespace stowage
