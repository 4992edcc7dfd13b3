// SPDX-License-Identifier: MIT
#include "model/lifecycle.h"

#include <algorithm>
#include <cmath>
#include <limits>
#include <utility>

#include "model/contract.h"
#include "model/costs.h"

namespace stowage {

namespace {
// Damage within this of 1 counts as end of life: hourly sums of a year's calendar damage
// carry rounding of the order of 1e-13.
constexpr double kEndOfLifeTolerance = 1e-9;
// Guards the integer count of banks replaced in one year against absurd inputs.
constexpr double kMaxReplacementsPerYear = 1e6;
constexpr int kMonthsPerYear = 12;
}  // namespace

double life_used(const ChemistryProfile& profile, double damage, double age_years) {
  double used = std::min(1.0, damage);
  if (profile.max_service_years) used = std::max(used, age_years / *profile.max_service_years);
  return used;
}

void price_year(YearRecord& rec, const DesignCosts& costs, double investment, double nameplate_kwh,
                const SiteConditions& site, const Economics& economics,
                const ChemistryProfile& profile, double last_bank_age_years) {
  rec.fixed_om = costs.fixed_om_per_year(nameplate_kwh);
  rec.variable_om = costs.variable_om(rec.dispatch.discharged_terminal_kwh);
  rec.charging = rec.dispatch.charge_cost;
  rec.backup =
      site.backup_price_per_kwh ? rec.dispatch.backup_kwh * *site.backup_price_per_kwh : 0.0;
  rec.unserved_penalty = rec.dispatch.unserved_kwh * site.unserved_penalty_per_kwh;
  rec.enclosure_om = site.enclosure ? site.enclosure->om_per_year : 0.0;
  rec.conditioning =
      rec.dispatch.conditioning_cost +
      (site.backup_price_per_kwh ? rec.dispatch.conditioning_backup_kwh * *site.backup_price_per_kwh
                                 : 0.0);
  // Replacements are booked in their year at that year's price (docs/method.md 6).
  rec.replacement = rec.replacements * costs.replacement_price(investment, rec.year);
  rec.end_of_life = rec.replacements * costs.replacement_end_of_life(nameplate_kwh);
  rec.residual_value = 0;
  if (rec.year == economics.project_years) {
    const double remaining = 1.0 - life_used(profile, rec.damage_end, last_bank_age_years);
    if (remaining > 0)
      rec.residual_value = costs.residual_value(investment, economics.project_years, remaining);
  }
  rec.discount_factor = present_worth_factor(economics.real_discount_rate, rec.year);
}

void add_discounted(const YearRecord& rec, DesignResult& r) {
  const double df = rec.discount_factor;
  CostBreakdown& pv = r.present_value;
  pv.replacements += rec.replacement * df;
  pv.fixed_om += rec.fixed_om * df;
  pv.variable_om += rec.variable_om * df;
  pv.charging += rec.charging * df;
  pv.backup += rec.backup * df;
  pv.unserved_penalty += rec.unserved_penalty * df;
  pv.end_of_life += rec.end_of_life * df;
  pv.residual_value += rec.residual_value * df;
  pv.enclosure += rec.enclosure_om * df;
  pv.conditioning += rec.conditioning * df;
  r.discounted_delivered_kwh += rec.dispatch.delivered_kwh * df;
}

double DesignResult::mean_discharged_kwh_per_year() const {
  if (years.empty()) return 0;
  double sum = 0;
  for (const auto& y : years) sum += y.dispatch.discharged_terminal_kwh;
  return sum / static_cast<double>(years.size());
}

double DesignResult::storage_cost_schmidt() const {
  const CostBreakdown& pv = present_value;
  return pv.storage_total() - pv.residual_value - final_end_of_life * final_discount_factor +
         final_end_of_life * project_end_discount_factor;
}

void DesignResult::settle_totals() {
  constexpr double kNone = std::numeric_limits<double>::infinity();
  npc = present_value.total();
  lcos_per_kwh =
      delivers_energy() ? present_value.storage_total() / discounted_delivered_kwh : kNone;
  lcos_schmidt_per_kwh =
      delivers_energy() ? storage_cost_schmidt() / discounted_delivered_kwh : kNone;
}

LifecycleEvaluator::LifecycleEvaluator(const ChemistryProfile& profile, const SiteConditions& site,
                                       const Economics& economics)
    : profile_(&profile),
      site_(&site),
      economics_(&economics),
      acceleration_(acceleration_series(profile, site.temp_c)),
      factors_(hourly_factors(profile, site)) {
  if (site.enclosure) {
    if (!profile.heat_capacity_kj_per_k_per_kwh)
      throw ContractViolation(
          "profiles." + profile.id + ".temperature.heat_capacity_kj_per_k_per_kwh",
          "must be given for a bank in an enclosure");
    working_ = acceleration_;
    temp_trace_.resize(static_cast<std::size_t>(kHoursPerYear));
  }
}

void LifecycleEvaluator::operate_year(DispatchInputs& in, bool last_year, DesignResult& r,
                                      YearRecord& rec, DispatchState& state, Bank& bank) {
  const ChemistryProfile& p = *profile_;
  const std::size_t month_hours = static_cast<std::size_t>(kHoursPerMonth);
  const double damage_per_extra_day = p.partial_charge ? p.partial_charge->damage_per_extra_day : 0;
  double* trace = soc_trace_.data();
  // The damage the bank in service had when its history within this year began, and that
  // history's calendar and partial-charge damage so far.
  double base = bank.damage, calendar = 0, partial = 0;
  const bool thermal = site_->enclosure.has_value();
  const AccelerationSeries& acceleration = thermal ? working_ : acceleration_;
  trace[0] = state.soc;
  meter_.start(p, acceleration, trace, 0);
  auto book_history = [&](double cycle) {
    rec.damage_cycle += cycle;
    rec.damage_calendar += calendar;
    rec.damage_partial_charge += partial;
  };
  for (int month = 1; month <= kMonthsPerYear; ++month) {
    const std::size_t first = static_cast<std::size_t>(month - 1) * month_hours;
    const std::size_t end = first + month_hours;
    in.health = health_from_damage(p, bank.damage);
    const YearDispatch m = dispatch_hours(in, state, trace, first, end);
    if (thermal) refresh_acceleration_month(p, temp_trace_.data(), first, end, working_);
    rec.dispatch.add(m);
    meter_.extend(end + 1);
    calendar += calendar_damage(p, acceleration, trace, first, end);
    partial += m.partial_charge_excess_days * damage_per_extra_day;
    bank.age_hours += kHoursPerMonth;
    const double cycle = meter_.provisional();
    bank.damage = base + cycle + calendar + partial;
    rec.damage_peak = std::max(rec.damage_peak, bank.damage);

    const bool worn_out = bank.damage >= 1.0 - kEndOfLifeTolerance;
    const bool too_old =
        p.max_service_years &&
        bank.age_hours >= *p.max_service_years * kHoursPerYear - kEndOfLifeTolerance;
    const bool project_ends = last_year && month == kMonthsPerYear;
    if (!(worn_out || too_old) || project_ends) continue;
    // Replaced at the end of this month. A bank that wears out several times over in one month
    // (damage 2.4, say) was replaced twice during it; the wear of the bank that went in last is
    // carried into the new one.
    book_history(meter_.close());
    const double whole = std::floor(bank.damage + kEndOfLifeTolerance);
    const int banks = worn_out ? static_cast<int>(std::min(whole, kMaxReplacementsPerYear)) : 1;
    rec.replacements += banks;
    rec.replaced_worn_out = rec.replaced_worn_out || worn_out;
    for (int i = 0; i < banks; ++i) {
      r.replacement_years.push_back(rec.year);
      r.replacement_months.push_back(month);
      rec.replacement_months.push_back(month);
    }
    bank.damage = worn_out ? std::max(0.0, bank.damage - banks) : 0.0;
    bank.age_hours = 0;
    const double temp_now = state.temp_c;  // the new bank sits in the same enclosure
    state = DispatchState{};
    state.temp_c = temp_now;
    base = bank.damage;
    calendar = partial = 0;
    trace[end] = state.soc;
    meter_.start(p, acceleration, trace, end);
  }
  book_history(meter_.close());
}

DesignResult LifecycleEvaluator::evaluate(double dod_setpoint, int strings_parallel,
                                          std::vector<double>* first_year_soc) {
  constexpr double kNoLimit = std::numeric_limits<double>::infinity();
  return std::move(
      *evaluate_unless_above(dod_setpoint, strings_parallel, kNoLimit, first_year_soc).result);
}

LifecycleEvaluator::Bounded LifecycleEvaluator::evaluate_unless_above(
    double dod_setpoint, int strings_parallel, double npc_limit,
    std::vector<double>* first_year_soc) {
  require_dod_setpoint(dod_setpoint);
  const ChemistryProfile& p = *profile_;
  const SiteConditions& site = *site_;
  const Economics& econ = *economics_;
  const DesignCosts costs(p.costs, bank_geometry(p, site.bus_voltage_v, 1).nameplate_kwh);

  DesignResult r;
  r.profile_id = p.id;
  r.dod_setpoint = dod_setpoint;
  r.bank = bank_geometry(p, site.bus_voltage_v, strings_parallel);
  r.currency = econ.currency;
  const double nameplate = r.bank.nameplate_kwh;
  r.investment = costs.investment(nameplate, strings_parallel);
  const double end_of_life_cost = costs.final_end_of_life(nameplate);
  const double replacement_end_of_life_cost = costs.replacement_end_of_life(nameplate);
  const double demand = site.annual_demand_kwh();

  DispatchInputs in;
  in.profile = &p;
  in.site = &site;
  in.bank = r.bank;
  in.dod_setpoint = dod_setpoint;
  in.factors = &factors_;
  if (site.enclosure) {
    in.temp_trace = temp_trace_.data();
    r.enclosure_id = site.enclosure->id;
    r.enclosure_capital = site.enclosure->capital;
  }

  DispatchState state;
  state.temp_c = site.temp_c.front();            // with an enclosure: its reference start
  Bank bank;                                     // the bank in service
  double final_year = econ.project_years + 1.0;  // when the last bank's end-of-life flow falls
  CostBreakdown& pv = r.present_value;
  pv.investment = r.investment;
  pv.enclosure = r.enclosure_capital;
  r.years.reserve(static_cast<std::size_t>(econ.project_years));
  soc_trace_.resize(static_cast<std::size_t>(kHoursPerYear) + 1);

  // Early stop (lifecycle.h): the credits still to come, and whether a replacement can be one.
  // The price path is monotone, so its least over the replacement years 1 .. N is at an end.
  const double least_replacement_price =
      std::min(costs.replacement_price(r.investment, 1.0),
               costs.replacement_price(r.investment, econ.project_years));
  const bool may_stop = npc_limit < std::numeric_limits<double>::infinity() &&
                        least_replacement_price + replacement_end_of_life_cost >= 0;
  const double credits_to_come =
      costs.replacement_price(r.investment, econ.project_years) *
          present_worth_factor(econ.real_discount_rate, econ.project_years) +
      std::max(0.0, -end_of_life_cost) *
          present_worth_factor(econ.real_discount_rate, econ.project_years + 1.0);
  const double stop_margin = 1e-9 * std::max(1.0, std::fabs(npc_limit));

  for (int year = 1; year <= econ.project_years; ++year) {
    YearRecord rec;
    rec.year = year;
    rec.health_start = health_from_damage(p, bank.damage);
    operate_year(in, year == econ.project_years, r, rec, state, bank);
    if (year == 1 && first_year_soc != nullptr) *first_year_soc = soc_trace_;
    rec.dispatch.demand_kwh = factors_.demand_kwh;
    rec.dispatch.source_to_load_kwh = factors_.source_to_load_kwh;
    rec.damage_end = bank.damage;

    const double age_years = bank.age_hours / kHoursPerYear;
    price_year(rec, costs, r.investment, nameplate, site, econ, p, age_years);
    if (year == econ.project_years) {
      const double used = life_used(p, bank.damage, age_years);
      const double remaining = 1.0 - used;
      // The bank goes on serving: it reaches its end of life when its remaining life, at the
      // wear rate it has shown, runs out.
      if (remaining > 0 && used > 0)
        final_year = econ.project_years + std::max(1.0, remaining * age_years / used);
      r.last_bank_age_years = age_years;
    }
    add_discounted(rec, r);
    if (demand > 0)
      r.unserved_fraction_max =
          std::max(r.unserved_fraction_max, rec.dispatch.unserved_kwh / demand);
    r.years.push_back(rec);
    if (may_stop && year < econ.project_years) {
      const double npc_lower_bound = pv.total() - credits_to_come;
      if (npc_lower_bound - npc_limit > stop_margin)
        return Bounded{std::nullopt, npc_lower_bound, year};
    }
  }

  // End of life of the last bank: one year after the last operating year when it is worn out
  // with the project (Schmidt et al. 2019), later when it has life left (see above).
  r.final_end_of_life = end_of_life_cost;
  r.final_end_of_life_year = final_year;
  r.final_discount_factor = present_worth_factor(econ.real_discount_rate, final_year);
  pv.end_of_life += end_of_life_cost * r.final_discount_factor;
  r.project_end_discount_factor =
      present_worth_factor(econ.real_discount_rate, econ.project_years + 1.0);

  r.settle_totals();
  r.meets_unserved_limit = !site.unserved_limit_fraction ||
                           r.unserved_fraction_max <= *site.unserved_limit_fraction + 1e-12;
  const double npc = r.npc;
  return Bounded{std::move(r), npc, econ.project_years};
}

}  // namespace stowage
