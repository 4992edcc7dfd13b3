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
  f.balance.resize(n);
  for (std::size_t h = 0; h < n; ++h) {
    const double t = site.temp_c[h];
    f.capacity_factor[h] = profile.temperature.capacity_factor(t);
    f.can_charge[h] = profile.temperature.can_charge(t) ? 1 : 0;
    f.can_discharge[h] = profile.temperature.can_discharge(t) ? 1 : 0;
    f.balance[h] = hour_balance(site, h);
    f.demand_kwh += site.load_kw[h];
    f.source_to_load_kwh += f.balance[h].direct_kwh;
  }
  return f;
}

double peukert_capacity_factor(double amps, double rated_amps, double exponent) {
  if (exponent == 1.0 || amps <= rated_amps) return 1.0;
  return std::pow(rated_amps / amps, exponent - 1.0);
}

namespace {

// The largest current a in [lo, hi] with room(a) >= a, where g(a) = room(a) - a is continuous
// and decreasing, g(lo) > 0 > g(hi): regula falsi with the Illinois modification (Dowell &
// Jarratt 1971), which keeps the bracket and converges superlinearly, stopped when the bracket
// is within a few ulps. Returns the bracket's feasible end, so the bank never gives more than
// the room it has.
template <typename Room>
double largest_feasible_current(Room&& room, double lo, double hi) {
  double g_lo = room(lo) - lo, g_hi = room(hi) - hi;
  int kept = 0;  // which end stayed put last time: -1 lo, +1 hi
  for (int i = 0; i < 200 && hi - lo > 4e-16 * hi; ++i) {
    double x = hi - g_hi * (hi - lo) / (g_hi - g_lo);
    if (!(x > lo && x < hi)) x = 0.5 * (lo + hi);
    const double g = room(x) - x;
    if (g >= 0) {
      lo = x;
      g_lo = g;
      if (kept == 1) g_hi *= 0.5;
      kept = 1;
    } else {
      hi = x;
      g_hi = g;
      if (kept == -1) g_lo *= 0.5;
      kept = -1;
    }
  }
  return lo;
}

}  // namespace

void YearDispatch::add(const YearDispatch& o) {
  demand_kwh += o.demand_kwh;
  source_to_load_kwh += o.source_to_load_kwh;
  charge_source_kwh += o.charge_source_kwh;
  charge_cost += o.charge_cost;
  charged_terminal_kwh += o.charged_terminal_kwh;
  discharged_terminal_kwh += o.discharged_terminal_kwh;
  delivered_kwh += o.delivered_kwh;
  backup_kwh += o.backup_kwh;
  unserved_kwh += o.unserved_kwh;
  curtailed_kwh += o.curtailed_kwh;
  equivalent_full_cycles += o.equivalent_full_cycles;
  partial_charge_excess_days += o.partial_charge_excess_days;
  charge_blocked_by_temperature_hours += o.charge_blocked_by_temperature_hours;
  discharge_blocked_by_temperature_hours += o.discharge_blocked_by_temperature_hours;
  auxiliary_kwh += o.auxiliary_kwh;
  auxiliary_source_kwh += o.auxiliary_source_kwh;
  auxiliary_bank_kwh += o.auxiliary_bank_kwh;
  auxiliary_unmet_kwh += o.auxiliary_unmet_kwh;
  conditioning_kwh += o.conditioning_kwh;
  conditioning_source_kwh += o.conditioning_source_kwh;
  conditioning_cost += o.conditioning_cost;
  conditioning_bank_kwh += o.conditioning_bank_kwh;
  conditioning_backup_kwh += o.conditioning_backup_kwh;
  conditioning_unmet_kwh += o.conditioning_unmet_kwh;
  heating_heat_kwh += o.heating_heat_kwh;
  cooling_heat_kwh += o.cooling_heat_kwh;
  heating_hours += o.heating_hours;
  bank_loss_heat_kwh += o.bank_loss_heat_kwh;
}

double enclosure_heat_capacity_kj_per_k(const ChemistryProfile& profile, const SiteConditions& site,
                                        double nameplate_kwh) {
  return site.enclosure->thermal_mass_kj_per_k +
         profile.heat_capacity_kj_per_k_per_kwh.value_or(0.0) * nameplate_kwh;
}

YearDispatch dispatch_year(const DispatchInputs& given, DispatchState& state,
                           std::vector<double>& soc_trace) {
  DispatchInputs in = given;
  HourlyFactors local;
  if (in.factors == nullptr) {
    local = hourly_factors(*in.profile, *in.site);
    in.factors = &local;
  }
  soc_trace.resize(static_cast<std::size_t>(kHoursPerYear) + 1);
  YearDispatch y =
      dispatch_hours(in, state, soc_trace.data(), 0, static_cast<std::size_t>(kHoursPerYear));
  y.demand_kwh = in.factors->demand_kwh;
  y.source_to_load_kwh = in.factors->source_to_load_kwh;
  return y;
}

YearDispatch dispatch_hours(const DispatchInputs& in, DispatchState& state, double* soc_trace,
                            std::size_t first, std::size_t end) {
  const ChemistryProfile& p = *in.profile;
  const SiteConditions& site = *in.site;
  HourlyFactors local;
  if (in.factors == nullptr) local = hourly_factors(p, site);
  const HourlyFactors& hf = in.factors != nullptr ? *in.factors : local;

  // Loop invariants, with the reciprocals of every divisor of the hourly steps (a product by a
  // reciprocal rounds within an ulp of the quotient; docs/method.md, dispatch step 4).
  const double rated_ah = in.bank.capacity_ah;
  const double q_ah = rated_ah * in.health;  // charge held between SOC 0 and 1
  const double inv_q_ah = 1.0 / q_ah;
  const double v_charge = in.bank.cells_series * p.mean_charge_v;
  const double v_discharge = in.bank.cells_series * p.mean_discharge_v;
  const double dod = in.dod_setpoint;
  const double keep_per_hour = std::pow(1.0 - p.self_discharge_per_month, 1.0 / kHoursPerMonth);
  const double rated_amps = rated_ah / p.capacity_rate_hours;
  const double peukert_k = p.peukert_exponent;
  const double eta_coulomb = p.coulombic_efficiency;
  const double eta_charger = site.charger_efficiency;
  const double inv_eta_charger = 1.0 / eta_charger;
  const double eta_inverter = site.inverter_efficiency;
  const double charge_amps_per_kwh = eta_charger * 1000.0 / v_charge;  // surplus -> offer
  const double kwh_per_charge_amp = v_charge / 1000.0;
  const double discharge_amps_per_kwh = 1000.0 / (eta_inverter * v_discharge);  // deficit
  const double kwh_per_discharge_amp = v_discharge / 1000.0;
  // C-rate limits are set on the rated capacity, as chargers and fuses are sized on it.
  const double max_charge_amps = p.max_charge_c_rate * rated_ah;
  const double max_discharge_amps = p.max_discharge_c_rate * rated_ah;
  const ChargeAcceptance acceptance(q_ah, eta_coulomb, max_charge_amps, p.absorption_soc);
  const double soc_per_charge_amp = eta_coulomb * inv_q_ah;
  const bool has_backup = site.backup_price_per_kwh.has_value();
  const bool track_partial = p.partial_charge.has_value();
  const double full_soc = track_partial ? p.partial_charge->full_charge_soc : 1.0;
  const double grace_hours =
      track_partial ? p.partial_charge->max_days_without_full_charge * 24.0 : 0.0;
  const HourBalance* balance = hf.balance.data();
  const double* capacity_factor = hf.capacity_factor.data();
  const unsigned char* can_charge = hf.can_charge.data();
  const unsigned char* can_discharge = hf.can_discharge.data();
  const double* charge_price = site.charge_price_per_kwh.data();
  // Auxiliary loads (step 4 of dispatch.h), kWh at the terminals.
  const bool has_aux = p.auxiliary.any();
  const double aux_standing_kwh = p.auxiliary.standing_kw_per_kwh * in.bank.nameplate_kwh;
  const double aux_pump_per_kwh = p.auxiliary.pump_kw_per_kw;
  const double aux_amps_per_kwh = 1000.0 / v_discharge;
  const double aux_floor_ah = (1.0 - dod) * q_ah;
  // Enclosure (step 5).
  const Enclosure* enclosure = site.enclosure ? &*site.enclosure : nullptr;
  const double heat_capacity =
      enclosure ? enclosure_heat_capacity_kj_per_k(p, site, in.bank.nameplate_kwh) : 0.0;
  const double v_open = 0.5 * (v_charge + v_discharge);
  const double charge_heat_per_amp = (v_charge - eta_coulomb * v_open) / 1000.0;  // kWh per A h
  const double discharge_heat_per_amp = (v_open - v_discharge) / 1000.0;
  const double stored_kwh_per_ah = v_open / 1000.0;
  double temp = state.temp_c;
  double cond_sum = 0, cond_source = 0, cond_cost = 0, cond_bank = 0, cond_backup = 0,
         cond_unmet = 0, heat_sum = 0, cool_sum = 0, heating_hours = 0, loss_heat_sum = 0;

  double* trace = soc_trace;
  double soc = state.soc;
  double hours_since_full = state.hours_since_full_charge;
  double excess_hours = 0;
  trace[first] = soc;
  // Running sums kept in registers, stored once at the end.
  double charge_source = 0, charge_cost = 0, charged_terminal = 0, discharged_terminal = 0;
  double charge_blocked_hours = 0, discharge_blocked_hours = 0;
  double delivered_sum = 0, backup = 0, unserved = 0, curtailed = 0, full_cycles = 0;
  double aux_sum = 0, aux_source = 0, aux_bank = 0, aux_unmet = 0;

  for (std::size_t h = first; h < end; ++h) {
    // The hour's temperature limits and capacity factor: fixed per hour without an enclosure,
    // from the thermal node's state with one.
    bool charge_ok, discharge_ok;
    double cf;
    if (enclosure) {
      if (in.temp_trace) in.temp_trace[h] = temp;
      charge_ok = p.temperature.can_charge(temp);
      discharge_ok = p.temperature.can_discharge(temp);
      cf = p.temperature.capacity_factor(temp);
    } else {
      charge_ok = can_charge[h] != 0;
      discharge_ok = can_discharge[h] != 0;
      cf = capacity_factor[h];
    }
    const double soc_before = soc;
    soc *= keep_per_hour;
    double loss_heat = (soc_before - soc) * q_ah * stored_kwh_per_ah;
    const double surplus = balance[h].surplus_kwh;
    const double deficit = balance[h].deficit_kwh;
    double throughput = 0, spare = 0;  // terminal kWh moved; source kWh the bank did not take

    if (surplus > 0) {
      double to_terminals = 0;  // kWh
      if (charge_ok && soc < 1.0) {
        // Terminal charge the bank accepts this hour: the offer up to the headroom (given the
        // coulombic loss), tapering above the absorption threshold (charge_acceptance.h).
        const double offer_amps = std::min(surplus * charge_amps_per_kwh, max_charge_amps);
        const double amps = acceptance.accepted_ah(soc, offer_amps);
        to_terminals = amps * kwh_per_charge_amp;
        soc += amps * soc_per_charge_amp;
        if (soc > 1.0) soc = 1.0;
        loss_heat += amps * charge_heat_per_amp;
      }
      if (!charge_ok && soc < 1.0) charge_blocked_hours += 1;
      const double drawn = to_terminals * inv_eta_charger;
      charged_terminal += to_terminals;
      charge_source += drawn;
      charge_cost += drawn * charge_price[h];
      curtailed += surplus - drawn;
      throughput = to_terminals;
      spare = surplus - drawn;
    } else if (deficit > 0) {
      double delivered = 0;
      if (!discharge_ok && soc > 1.0 - dod) discharge_blocked_hours += 1;
      if (discharge_ok) {
        // The window this hour reaches down to 1 - reachable_depth (dod_window.h). Cold
        // narrows it (the charge below stays in the cells and comes back when the bank warms
        // up); heat never widens it past the setpoint. Peukert: at a current I above the rated
        // current the cells reach cut-off after C (I_r / I)^(k-1) Ah, so the window shrinks by
        // that factor. The charge is not lost: a lower current later can still draw it.
        auto room_ah = [&](double amps) {
          const double floor_soc =
              1.0 - reachable_depth(dod, cf, peukert_capacity_factor(amps, rated_amps, peukert_k));
          return (soc - std::max(0.0, floor_soc)) * q_ah;
        };
        double amps = std::min(deficit * discharge_amps_per_kwh, max_discharge_amps);
        if (room_ah(amps) < amps) {
          // room_ah(a) - a falls as a grows; find where it crosses zero.
          const double slow = room_ah(0.0);
          if (slow <= rated_amps || peukert_k == 1.0)
            amps = std::max(0.0, std::min(amps, slow));
          else
            amps = largest_feasible_current(room_ah, rated_amps, amps);
        }
        if (amps > 0) {
          const double out_kwh = amps * kwh_per_discharge_amp;
          const double depth = amps * inv_q_ah;
          soc -= depth;
          delivered = out_kwh * eta_inverter;
          discharged_terminal += out_kwh;
          delivered_sum += delivered;
          full_cycles += depth;
          throughput = out_kwh;
          loss_heat += amps * discharge_heat_per_amp;
        }
      }
      const double shortfall = deficit - delivered;
      if (shortfall > 1e-12) (has_backup ? backup : unserved) += shortfall;
    }
    // Electricity for the bank's surroundings: from the source surplus the bank did not take
    // (through the charger), then the stored charge down to the setpoint floor; returns what
    // is still unmet, kWh at the terminals. One rule for the auxiliaries and the enclosure.
    auto supply = [&](double need, bool from_bank, double& from_source_kwh, double& bank_kwh) {
      if (spare > 0 && need > 0) {
        const double want_source = need * inv_eta_charger;
        const double from_source = std::min(want_source, spare);
        from_source_kwh += from_source;
        spare -= from_source;
        curtailed -= from_source;
        need = from_source < want_source ? need - from_source * eta_charger : 0.0;
      }
      if (from_bank && need > 0) {
        const double want_ah = need * aux_amps_per_kwh;
        const double ah = std::min(want_ah, std::max(0.0, soc * q_ah - aux_floor_ah));
        soc -= ah * inv_q_ah;
        bank_kwh += ah / aux_amps_per_kwh;
        need = ah < want_ah ? (want_ah - ah) / aux_amps_per_kwh : 0.0;
      }
      return need;
    };

    if (has_aux) {
      const double need = aux_standing_kwh + aux_pump_per_kwh * throughput;
      aux_sum += need;
      double from_source = 0;
      aux_unmet += supply(need, true, from_source, aux_bank);
      aux_source += from_source;
      charge_cost += from_source * charge_price[h];
    }

    if (enclosure) {
      // Charge-only heating runs when surplus is left and the bank is not full.
      const bool charge_only = enclosure->heating && enclosure->heating->charge_only;
      const bool may_heat = !charge_only || (spare > 0 && soc < 1.0);
      const double gain = loss_heat + site.solar_gain_kw(h) + enclosure->standing_kw;
      const ThermalHour th =
          thermal_hour(*enclosure, heat_capacity, temp, site.ambient_c[h], gain, may_heat);
      // The heater's share: charge-only heating draws from the surplus alone, any other
      // conditioning from the surplus, the bank and then back-up.
      double from_source = 0, from_bank = 0;
      const bool surplus_only = charge_only && th.heat_kwh > 0;
      double conditioning_rest = supply(th.electricity_kwh, !surplus_only, from_source, from_bank);
      if (!surplus_only && has_backup) {
        cond_backup += conditioning_rest;
        conditioning_rest = 0;
      }
      const double share =
          th.electricity_kwh > 0 ? 1.0 - conditioning_rest / th.electricity_kwh : 1.0;
      double standing_rest = supply(enclosure->standing_kw, true, from_source, from_bank);
      if (has_backup) {
        cond_backup += standing_rest;
        standing_rest = 0;
      }
      temp = settle_hour(*enclosure, heat_capacity, th, share);
      heat_sum += th.heat_kwh * share;
      cool_sum += th.cool_kwh * share;
      if (th.heat_kwh * share > 0) heating_hours += 1;
      // Charge-only heat the surplus cannot pay for is not asked for: the bank stays cold.
      const double need =
          (surplus_only ? th.electricity_kwh * share : th.electricity_kwh) + enclosure->standing_kw;
      const double unmet = (surplus_only ? 0.0 : conditioning_rest) + standing_rest;
      cond_sum += need;
      cond_source += from_source;
      cond_cost += from_source * charge_price[h];
      cond_bank += from_bank;
      cond_unmet += unmet;
      loss_heat_sum += loss_heat;
    }

    if (track_partial) {
      if (soc >= full_soc) {
        hours_since_full = 0;
      } else {
        hours_since_full += 1.0;
        if (hours_since_full > grace_hours) excess_hours += 1.0;
      }
    }
    trace[h + 1] = soc;
  }

  YearDispatch y;
  y.charge_source_kwh = charge_source;
  y.charge_cost = charge_cost;
  y.charged_terminal_kwh = charged_terminal;
  y.charge_blocked_by_temperature_hours = charge_blocked_hours;
  y.discharge_blocked_by_temperature_hours = discharge_blocked_hours;
  y.discharged_terminal_kwh = discharged_terminal;
  y.delivered_kwh = delivered_sum;
  y.backup_kwh = backup;
  y.unserved_kwh = unserved;
  y.curtailed_kwh = curtailed;
  y.equivalent_full_cycles = full_cycles;
  y.auxiliary_kwh = aux_sum;
  y.auxiliary_source_kwh = aux_source;
  y.auxiliary_bank_kwh = aux_bank;
  y.auxiliary_unmet_kwh = aux_unmet;
  y.conditioning_kwh = cond_sum;
  y.conditioning_source_kwh = cond_source;
  y.conditioning_cost = cond_cost;
  y.conditioning_bank_kwh = cond_bank;
  y.conditioning_backup_kwh = cond_backup;
  y.conditioning_unmet_kwh = cond_unmet;
  y.heating_heat_kwh = heat_sum;
  y.cooling_heat_kwh = cool_sum;
  y.heating_hours = heating_hours;
  y.bank_loss_heat_kwh = loss_heat_sum;
  state.soc = soc;
  state.temp_c = temp;
  state.hours_since_full_charge = hours_since_full;
  y.partial_charge_excess_days = excess_hours / 24.0;
  return y;
}

}  // namespace stowage
