// SPDX-License-Identifier: MIT
#include "model/dispatch.h"

#include <algorithm>
#include <cmath>

#include "model/charge_acceptance.h"
#include "model/dod_window.h"

namespace stowage {

HourlyFactors hourly_factors(const ChemistryProfile& profile, const SiteConditions& site) {
  HourlyFactors f;
  const std::size_t n = site.temp_c.size();
  f.capacity_factor.resize(n);
  f.can_charge.resize(n);
  f.can_discharge.resize(n);
  for (std::size_t h = 0; h < n; ++h) {
    const double t = site.temp_c[h];
    f.capacity_factor[h] = profile.temperature.capacity_factor(t);
    f.can_charge[h] = profile.temperature.can_charge(t) ? 1 : 0;
    f.can_discharge[h] = profile.temperature.can_discharge(t) ? 1 : 0;
  }
  return f;
}

double peukert_capacity_factor(double amps, double rated_amps, double exponent) {
  if (exponent == 1.0 || amps <= rated_amps) return 1.0;
  return std::pow(rated_amps / amps, exponent - 1.0);
}

YearDispatch dispatch_year(const DispatchInputs& in, DispatchState& state,
                           std::vector<double>& soc_trace) {
  const ChemistryProfile& p = *in.profile;
  const SiteConditions& site = *in.site;
  HourlyFactors local;
  if (in.factors == nullptr) local = hourly_factors(p, site);
  const HourlyFactors& hf = in.factors != nullptr ? *in.factors : local;

  const double rated_ah = in.bank.capacity_ah;
  const double q_ah = rated_ah * in.health;  // charge held between SOC 0 and 1
  const double v_charge = in.bank.cells_series * p.mean_charge_v;
  const double v_discharge = in.bank.cells_series * p.mean_discharge_v;
  const double dod = in.dod_setpoint;
  const double keep_per_hour = std::pow(1.0 - p.self_discharge_per_month, 1.0 / kHoursPerMonth);
  const double rated_amps = rated_ah / p.capacity_rate_hours;
  const double peukert_k = p.peukert_exponent;
  const double eta_coulomb = p.coulombic_efficiency;
  const double eta_charger = site.charger_efficiency;
  const double eta_inverter = site.inverter_efficiency;
  // C-rate limits are set on the rated capacity, as chargers and fuses are sized on it.
  const double max_charge_amps = p.max_charge_c_rate * rated_ah;
  const double max_discharge_amps = p.max_discharge_c_rate * rated_ah;
  const bool has_backup = site.backup_price_per_kwh.has_value();
  const bool track_partial = p.partial_charge.has_value();
  const double full_soc = track_partial ? p.partial_charge->full_charge_soc : 1.0;
  const double grace_hours =
      track_partial ? p.partial_charge->max_days_without_full_charge * 24.0 : 0.0;

  soc_trace.resize(static_cast<std::size_t>(kHoursPerYear) + 1);
  double soc = state.soc;
  double hours_since_full = state.hours_since_full_charge;
  double excess_hours = 0;
  soc_trace[0] = soc;
  YearDispatch y;

  for (std::size_t h = 0; h < static_cast<std::size_t>(kHoursPerYear); ++h) {
    // The window this hour reaches down to 1 - reachable_depth (dod_window.h). Cold narrows it
    // (the charge below stays in the cells and comes back when the bank warms up); heat never
    // widens it past the setpoint.
    const double capacity_factor = hf.capacity_factor[h];
    soc *= keep_per_hour;
    const HourBalance balance = hour_balance(site, h);
    const double surplus = balance.surplus_kwh;
    const double deficit = balance.deficit_kwh;
    y.demand_kwh += site.load_kw[h];
    y.source_to_load_kwh += balance.direct_kwh;

    if (surplus > 0) {
      double to_terminals = 0;  // kWh
      if (hf.can_charge[h] && soc < 1.0) {
        // Terminal charge the bank accepts this hour: the offer up to the headroom (given the
        // coulombic loss), tapering above the absorption threshold (charge_acceptance.h).
        const double offer_amps =
            std::min(surplus * eta_charger * 1000.0 / v_charge, max_charge_amps);
        const double amps = accepted_charge_ah(soc, q_ah, eta_coulomb, offer_amps, max_charge_amps,
                                               p.absorption_soc);
        to_terminals = amps * v_charge / 1000.0;
        soc += amps * eta_coulomb / q_ah;
        if (soc > 1.0) soc = 1.0;
      }
      const double drawn = to_terminals / eta_charger;
      y.charged_terminal_kwh += to_terminals;
      y.charge_source_kwh += drawn;
      y.charge_cost += drawn * site.charge_price_per_kwh[h];
      y.curtailed_kwh += surplus - drawn;
    } else if (deficit > 0) {
      double delivered = 0;
      if (hf.can_discharge[h]) {
        const double wanted_amps = deficit / eta_inverter * 1000.0 / v_discharge;
        // Peukert: at a current I above the rated current the cells reach cut-off after
        // C (I_r / I)^(k-1) Ah, so the window shrinks by that factor. The charge is not lost:
        // a lower current later can still draw it.
        auto room_ah = [&](double amps) {
          const double floor_soc =
              1.0 - reachable_depth(dod, capacity_factor,
                                    peukert_capacity_factor(amps, rated_amps, peukert_k));
          return (soc - std::max(0.0, floor_soc)) * q_ah;
        };
        double amps = std::min(wanted_amps, max_discharge_amps);
        if (room_ah(amps) < amps) {
          // room_ah(a) - a falls as a grows; find where it crosses zero.
          const double slow = room_ah(0.0);
          if (slow <= rated_amps || peukert_k == 1.0) {
            amps = std::max(0.0, std::min(amps, slow));
          } else {
            double lo = rated_amps, hi = amps;
            for (int i = 0; i < 50; ++i) {
              const double mid = 0.5 * (lo + hi);
              (room_ah(mid) >= mid ? lo : hi) = mid;
            }
            amps = lo;
          }
        }
        if (amps > 0) {
          const double out_kwh = amps * v_discharge / 1000.0;
          const double depth = amps / q_ah;
          soc -= depth;
          delivered = out_kwh * eta_inverter;
          y.discharged_terminal_kwh += out_kwh;
          y.delivered_kwh += delivered;
          y.equivalent_full_cycles += depth;
        }
      }
      const double shortfall = deficit - delivered;
      if (shortfall > 1e-12) {
        if (has_backup)
          y.backup_kwh += shortfall;
        else
          y.unserved_kwh += shortfall;
      }
    }

    if (track_partial) {
      if (soc >= full_soc) {
        hours_since_full = 0;
      } else {
        hours_since_full += 1.0;
        if (hours_since_full > grace_hours) excess_hours += 1.0;
      }
    }
    soc_trace[h + 1] = soc;
  }

  state.soc = soc;
  state.hours_since_full_charge = hours_since_full;
  y.partial_charge_excess_days = excess_hours / 24.0;
  return y;
}

}  // namespace stowage
