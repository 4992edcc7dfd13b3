// SPDX-License-Identifier: MIT
#include "model/chemistry_profile.h"

#include <cmath>

#include "model/invalid_value.h"

namespace stowage {

namespace {
void require(bool ok, const char* field, const char* rule) {
  if (!ok) throw InvalidValue(field, rule);
}
bool positive(double v) { return std::isfinite(v) && v > 0; }
bool non_negative(double v) { return std::isfinite(v) && v >= 0; }
bool fraction_open_closed(double v) { return std::isfinite(v) && v > 0 && v <= 1; }
}  // namespace

void ChemistryProfile::validate() const {
  require(!id.empty(), "id", "must not be empty");
  require(positive(cell_nominal_v), "cell.nominal_v", "must be positive");
  require(positive(cell_capacity_ah), "cell.capacity_ah", "must be positive");
  require(positive(capacity_rate_hours), "cell.capacity_rate_hours", "must be positive");
  require(fraction_open_closed(coulombic_efficiency), "cell.coulombic_efficiency",
          "must be in (0, 1]");
  require(positive(mean_discharge_v), "cell.mean_discharge_v", "must be positive");
  require(positive(mean_charge_v) && mean_charge_v > mean_discharge_v, "cell.mean_charge_v",
          "must be above cell.mean_discharge_v (charging takes a higher voltage)");
  require(positive(max_charge_c_rate), "cell.max_charge_c_rate", "must be positive");
  require(positive(max_discharge_c_rate), "cell.max_discharge_c_rate", "must be positive");
  require(std::isfinite(peukert_exponent) && peukert_exponent >= 1 && peukert_exponent <= 2,
          "cell.peukert_exponent", "must be in [1, 2]");
  require(non_negative(self_discharge_per_month) && self_discharge_per_month < 1,
          "cell.self_discharge_per_month", "must be in [0, 1)");
  require(!absorption_soc ||
              (std::isfinite(*absorption_soc) && *absorption_soc > 0 && *absorption_soc < 1),
          "cell.absorption_soc", "must be in (0, 1)");
  require(!absorption_soc || !partial_charge || partial_charge->full_charge_soc < 1,
          "ageing.partial_charge.full_charge_soc",
          "must be below 1 when cell.absorption_soc is set: a tapered charge approaches full "
          "charge only asymptotically");
  require(positive(calendar_life_years), "ageing.calendar_life_years", "must be positive");
  require(!max_service_years || positive(*max_service_years), "ageing.max_service_years",
          "must be positive");
  require(std::isfinite(eol_capacity_fraction) && eol_capacity_fraction > 0 &&
              eol_capacity_fraction < 1,
          "ageing.end_of_life_capacity", "must be in (0, 1)");
  require(non_negative(auxiliary.standing_kw_per_kwh) && auxiliary.standing_kw_per_kwh < 1,
          "auxiliary.standing_kw_per_kwh", "must be in [0, 1)");
  require(non_negative(auxiliary.pump_kw_per_kw) && auxiliary.pump_kw_per_kw < 1,
          "auxiliary.pump_kw_per_kw", "must be in [0, 1)");
  if (partial_charge) {
    require(fraction_open_closed(partial_charge->full_charge_soc),
            "ageing.partial_charge.full_charge_soc", "must be in (0, 1]");
    require(positive(partial_charge->max_days_without_full_charge),
            "ageing.partial_charge.grace_days", "must be positive");
    require(non_negative(partial_charge->damage_per_extra_day),
            "ageing.partial_charge.damage_per_extra_day", "must not be negative");
  }
  if (calendar_soc_stress) {
    require(std::isfinite(calendar_soc_stress->soc_exponent),
            "ageing.calendar_soc_stress.soc_exponent", "must be a number");
    require(std::isfinite(calendar_soc_stress->reference_soc) &&
                calendar_soc_stress->reference_soc >= 0 && calendar_soc_stress->reference_soc <= 1,
            "ageing.calendar_soc_stress.reference_soc", "must be in [0, 1]");
  }
  require(fraction_open_closed(dod.min), "dod.min", "must be in (0, 1]");
  require(fraction_open_closed(dod.max), "dod.max", "must be in (0, 1]");
  require(dod.min <= dod.max, "dod.min", "must not exceed dod.max");
  require(dod.default_setpoint >= dod.min && dod.default_setpoint <= dod.max, "dod.default",
          "must lie within [dod.min, dod.max]");
  require(positive(costs.capital_per_kwh), "costs.capital_per_kwh", "must be positive");
  require(non_negative(costs.capital_per_string), "costs.capital_per_string",
          "must not be negative");
  require(non_negative(costs.installation_fixed), "costs.installation_fixed",
          "must not be negative");
  require(non_negative(costs.fixed_om_per_kwh_year), "costs.fixed_om_per_kwh_year",
          "must not be negative");
  require(non_negative(costs.variable_om_per_mwh), "costs.variable_om_per_mwh",
          "must not be negative");
  require(positive(costs.replacement_share), "costs.replacement_share", "must be positive");
  require(non_negative(costs.price_decline_per_year) && costs.price_decline_per_year < 1,
          "costs.price_decline_per_year", "must be in [0, 1)");
  require(std::isfinite(costs.end_of_life_per_kwh), "costs.end_of_life_per_kwh",
          "must be a number");
  require(!costs.replacement_end_of_life_per_kwh ||
              std::isfinite(*costs.replacement_end_of_life_per_kwh),
          "costs.replacement_end_of_life_per_kwh", "must be a number");
  require(!cell_mass_kg || positive(*cell_mass_kg), "cell.mass_kg", "must be positive");
  require(!cell_volume_l || positive(*cell_volume_l), "cell.volume_l", "must be positive");
}

}  // namespace stowage
