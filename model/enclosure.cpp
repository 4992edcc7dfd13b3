// SPDX-License-Identifier: MIT
#include "model/enclosure.h"

#include <algorithm>
#include <cmath>

#include "model/invalid_value.h"

namespace stowage {

namespace {
constexpr double kSecondsPerHour = 3600.0;

void require(bool ok, const std::string& field, const std::string& what) {
  if (!ok) throw InvalidValue(field, what);
}

// The hour's decay factor a = exp(-G 3600 / C) and the conductance in kW/K.
struct Step {
  double g_kw_per_k;
  double a;
};
Step step_of(const Enclosure& e, double capacity_kj_per_k) {
  const double g = e.conductance_w_per_k / 1000.0;
  return Step{g, std::exp(-g * kSecondsPerHour / capacity_kj_per_k)};
}
}  // namespace

double EnclosureCooling::cop_at(double ambient_c) const {
  return std::max(cop_min, cop + cop_per_k * (ambient_c - cop_reference_ambient_c));
}

void Enclosure::validate() const {
  auto finite_at_least = [](double v, double lo) { return std::isfinite(v) && v >= lo; };
  auto positive = [](double v) { return std::isfinite(v) && v > 0; };
  require(finite_at_least(thermal_mass_kj_per_k, 0), "enclosure.thermal_mass_kj_per_k",
          "must be a finite number >= 0");
  require(positive(conductance_w_per_k), "enclosure.conductance_w_per_k",
          "must be a finite number > 0");
  require(finite_at_least(solar_aperture_m2, 0), "enclosure.solar_aperture_m2",
          "must be a finite number >= 0");
  require(finite_at_least(standing_kw, 0), "enclosure.standing_kw", "must be a finite number >= 0");
  require(finite_at_least(capital, 0), "enclosure.capital", "must be a finite number >= 0");
  require(finite_at_least(om_per_year, 0), "enclosure.om_per_year", "must be a finite number >= 0");
  if (heating) {
    require(std::isfinite(heating->to_c), "enclosure.heating.to_c", "must be a finite number");
    require(positive(heating->capacity_kw), "enclosure.heating.capacity_kw",
            "must be a finite number > 0");
    require(positive(heating->efficiency), "enclosure.heating.efficiency",
            "must be a finite number > 0");
  }
  if (cooling) {
    require(std::isfinite(cooling->to_c), "enclosure.cooling.to_c", "must be a finite number");
    require(positive(cooling->capacity_kw), "enclosure.cooling.capacity_kw",
            "must be a finite number > 0");
    require(positive(cooling->cop), "enclosure.cooling.cop", "must be a finite number > 0");
    require(std::isfinite(cooling->cop_reference_ambient_c),
            "enclosure.cooling.cop_reference_ambient_c", "must be a finite number");
    require(std::isfinite(cooling->cop_per_k), "enclosure.cooling.cop_per_k",
            "must be a finite number");
    require(positive(cooling->cop_min), "enclosure.cooling.cop_min", "must be a finite number > 0");
  }
  if (heating && cooling)
    require(heating->to_c < cooling->to_c, "enclosure.cooling.to_c",
            "must be above enclosure.heating.to_c");
}

ThermalHour thermal_hour(const Enclosure& e, double capacity_kj_per_k, double start_c,
                         double ambient_c, double gain_kw, bool allow_heating) {
  const Step s = step_of(e, capacity_kj_per_k);
  const double t_eq = ambient_c + gain_kw / s.g_kw_per_k;
  ThermalHour h;
  h.end_c = t_eq + (start_c - t_eq) * s.a;            // free-running
  const double per_kwh = (1.0 - s.a) / s.g_kw_per_k;  // K at the hour's end per kWh of heat
  if (e.heating && allow_heating && h.end_c < e.heating->to_c) {
    h.heat_kwh = std::min(e.heating->capacity_kw, (e.heating->to_c - h.end_c) / per_kwh);
    h.electricity_kwh = h.heat_kwh / e.heating->efficiency;
  } else if (e.cooling && h.end_c > e.cooling->to_c) {
    h.cool_kwh = std::min(e.cooling->capacity_kw, (h.end_c - e.cooling->to_c) / per_kwh);
    h.electricity_kwh = h.cool_kwh / e.cooling->cop_at(ambient_c);
  }
  return h;
}

double settle_hour(const Enclosure& e, double capacity_kj_per_k, const ThermalHour& h,
                   double share) {
  const Step s = step_of(e, capacity_kj_per_k);
  return h.end_c + share * (h.heat_kwh - h.cool_kwh) * (1.0 - s.a) / s.g_kw_per_k;
}

}  // namespace stowage
