// SPDX-License-Identifier: MIT
#include "model/temperature_behaviour.h"

#include <cmath>
#include <string>

#include "model/invalid_value.h"

namespace stowage {

TemperatureBehaviour::TemperatureBehaviour(TemperatureSpec spec) : spec_(std::move(spec)) {
  auto finite = [](double v) { return std::isfinite(v); };
  if (!finite(spec_.reference_temp_c) || spec_.reference_temp_c <= -kZeroCelsiusK)
    throw InvalidValue("reference_c", "must be a temperature above absolute zero");
  if (spec_.capacity_factor.empty())
    throw InvalidValue("capacity_factor", "needs at least one (temp_c, factor) row");
  for (std::size_t i = 0; i < spec_.capacity_factor.size(); ++i) {
    const auto& row = spec_.capacity_factor[i];
    const std::string at = "capacity_factor[" + std::to_string(i) + "]";
    if (!finite(row.temp_c)) throw InvalidValue(at + ".temp_c", "must be a number");
    if (!(row.factor > 0) || !finite(row.factor))
      throw InvalidValue(at + ".factor", "must be a positive number");
    if (i > 0 && !(row.temp_c > spec_.capacity_factor[i - 1].temp_c))
      throw InvalidValue(at + ".temp_c", "temperatures must increase from row to row");
  }
  if (spec_.law == AgeingLaw::Arrhenius && !(spec_.activation_energy_j_per_mol > 0))
    throw InvalidValue("activation_energy_j_per_mol", "must be positive");
  if (spec_.law == AgeingLaw::Halving && !(spec_.halving_interval_k > 0))
    throw InvalidValue("life_halving_interval_k", "must be positive");
  if (spec_.calendar_law == AgeingLaw::Arrhenius &&
      !(spec_.calendar_activation_energy_j_per_mol > 0 &&
        finite(spec_.calendar_activation_energy_j_per_mol)))
    throw InvalidValue("calendar_law.activation_energy_j_per_mol", "must be positive");
  if (spec_.calendar_law == AgeingLaw::Halving &&
      !(spec_.calendar_halving_interval_k > 0 && finite(spec_.calendar_halving_interval_k)))
    throw InvalidValue("calendar_law.life_halving_interval_k", "must be positive");
  if (!(spec_.operating_min_c < spec_.operating_max_c))
    throw InvalidValue("operating_c.min", "must be below operating_c.max");
  if (!(spec_.charge_min_c < spec_.charge_max_c))
    throw InvalidValue("charging_c.min", "must be below charging_c.max");
}

double TemperatureBehaviour::capacity_factor(double temp_c) const {
  const auto& rows = spec_.capacity_factor;
  if (temp_c <= rows.front().temp_c) return rows.front().factor;
  if (temp_c >= rows.back().temp_c) return rows.back().factor;
  std::size_t k = 1;
  while (rows[k].temp_c < temp_c) ++k;
  const auto& a = rows[k - 1];
  const auto& b = rows[k];
  return a.factor + (b.factor - a.factor) * (temp_c - a.temp_c) / (b.temp_c - a.temp_c);
}

namespace {
double law_acceleration(AgeingLaw law, double activation_energy_j_per_mol,
                        double halving_interval_k, double reference_temp_c, double temp_c) {
  if (law == AgeingLaw::Halving) return std::exp2((temp_c - reference_temp_c) / halving_interval_k);
  const double t = temp_c + TemperatureBehaviour::kZeroCelsiusK;
  const double t_ref = reference_temp_c + TemperatureBehaviour::kZeroCelsiusK;
  return std::exp(activation_energy_j_per_mol / TemperatureBehaviour::kGasConstant *
                  (1.0 / t_ref - 1.0 / t));
}
}  // namespace

double TemperatureBehaviour::raw_acceleration(double temp_c) const {
  return law_acceleration(spec_.law, spec_.activation_energy_j_per_mol, spec_.halving_interval_k,
                          spec_.reference_temp_c, temp_c);
}

double TemperatureBehaviour::calendar_acceleration(double temp_c) const {
  if (!spec_.calendar_law) return ageing_acceleration(temp_c);
  const double a =
      law_acceleration(*spec_.calendar_law, spec_.calendar_activation_energy_j_per_mol,
                       spec_.calendar_halving_interval_k, spec_.reference_temp_c, temp_c);
  return a < 1.0 ? 1.0 : a;
}

double TemperatureBehaviour::ageing_acceleration(double temp_c) const {
  const double a = raw_acceleration(temp_c);
  return a < 1.0 ? 1.0 : a;
}

double TemperatureBehaviour::life_at(double life_ref_years, double temp_c) const {
  return life_ref_years / ageing_acceleration(temp_c);
}

bool TemperatureBehaviour::can_discharge(double temp_c) const {
  return temp_c >= spec_.operating_min_c && temp_c <= spec_.operating_max_c;
}

bool TemperatureBehaviour::can_charge(double temp_c) const {
  return temp_c >= spec_.charge_min_c && temp_c <= spec_.charge_max_c && can_discharge(temp_c);
}

}  // namespace stowage
