// SPDX-License-Identifier: MIT
// TemperatureBehaviour: how a chemistry's available capacity and ageing rate depend on the
// battery-space temperature.
//
// Available capacity: a table of (temp_c, factor), factor = available / rated capacity, linear
// between rows and held constant beyond the first and last row.
// Ageing: the rate at which cycle ageing (and, unless the profile gives calendar ageing its own
// law, calendar ageing too) proceeds, relative to the reference temperature, either
//   Arrhenius:  a(T) = exp[(Ea / R) (1/T_ref - 1/T)], T in kelvin, R = 8.314462618 J/(mol K)
//   halving:    a(T) = 2^((T - T_ref) / dT_half)   (life halves every dT_half kelvin)
// so life at T = life at T_ref / a(T). Calendar ageing may follow a second law of either form
// (separate mechanisms: e.g. the activation energy of a cycling study need not hold for
// storage); unset, it follows the cycling law. By convention a(T) is floored at 1: no life credit
// is taken for temperatures below the reference (cold slows corrosion but promotes other damage,
// e.g. lithium plating); see docs/method.md.
// Limits: discharge only within [operating_min_c, operating_max_c]; charge only within
// [charge_min_c, charge_max_c].
#pragma once

#include <optional>
#include <vector>

namespace stowage {

struct CapacityFactorPoint {
  double temp_c = 0;
  double factor = 0;  // available capacity / rated capacity, > 0
};

enum class AgeingLaw { Arrhenius, Halving };

struct TemperatureSpec {
  double reference_temp_c = 25.0;
  std::vector<CapacityFactorPoint> capacity_factor;  // at least one row, strictly increasing temp
  AgeingLaw law = AgeingLaw::Halving;
  double activation_energy_j_per_mol = 0;  // used when law == Arrhenius, > 0
  double halving_interval_k = 10.0;        // used when law == Halving, > 0
  // Calendar ageing's own law; unset: the cycling law above.
  std::optional<AgeingLaw> calendar_law = std::nullopt;
  double calendar_activation_energy_j_per_mol = 0;  // used when calendar_law == Arrhenius, > 0
  double calendar_halving_interval_k = 10.0;        // used when calendar_law == Halving, > 0
  double operating_min_c = -20, operating_max_c = 50;
  double charge_min_c = -20, charge_max_c = 50;
};

class TemperatureBehaviour {
 public:
  static constexpr double kGasConstant = 8.314462618;  // J/(mol K), CODATA 2018
  static constexpr double kZeroCelsiusK = 273.15;

  // Throws InvalidValue naming the field (e.g. "capacity_factor[1].temp_c").
  explicit TemperatureBehaviour(TemperatureSpec spec);

  double capacity_factor(double temp_c) const;
  // Ageing-rate multiplier of cycle ageing relative to the reference temperature, >= 1.
  double ageing_acceleration(double temp_c) const;
  // Same law without the floor at 1, for reporting and checks.
  double raw_acceleration(double temp_c) const;
  // Ageing-rate multiplier of calendar ageing, >= 1: the calendar law, else the cycling law.
  double calendar_acceleration(double temp_c) const;
  // life_ref_years / ageing_acceleration(temp_c).
  double life_at(double life_ref_years, double temp_c) const;
  bool can_discharge(double temp_c) const;
  bool can_charge(double temp_c) const;
  const TemperatureSpec& spec() const { return spec_; }

 private:
  TemperatureSpec spec_;
};

}  // namespace stowage
