// SPDX-License-Identifier: MIT
// Charge acceptance of a bank over one hour of charging, with an optional constant-voltage
// (absorption) stage.
//
// Bulk stage: the bank takes the offered current I_offer (the surplus through the charger,
// limited by max_charge_c_rate x rated capacity), up to the headroom (1 - s) Q / eta_C.
// Absorption stage (profile option `absorption_soc`, s_abs): above s_abs the charger holds the
// absorption voltage and the current the cells accept falls in proportion to the charge still
// missing,
//   I_acc(s) = I_max (1 - s) / (1 - s_abs),        I_max = max_charge_c_rate x rated Ah,
// so that at constant voltage the current decays exponentially in time (first-order charge
// acceptance, the usual description of the constant-voltage stage of lead-acid charging, from
// memory) with the time constant tau = (1 - s_abs) Q / (eta_C I_max), and the bank approaches
// full charge only asymptotically: from s_abs it takes tau ln((1 - s_abs) / (1 - s)) hours at
// the absorption voltage to reach s. The current drawn is min(I_offer, I_acc(s)): while the
// offer is below the acceptance the bank stays in bulk, then it tapers.
// Within the hour the SOC follows ds/dt = eta_C I / Q exactly (closed form, no sub-steps).
// Units: Ah, A, hours; SOC a fraction of Q (the charge held when full, Ah). Domain: soc in
// [0, 1], q_ah > 0, eta_coulomb in (0, 1], offer_amps >= 0, max_charge_amps > 0, absorption_soc
// in (0, 1). Returns terminal charge in Ah over the hour, >= 0; never more than the headroom.
#pragma once

#include <algorithm>
#include <cmath>
#include <optional>

namespace stowage {

inline double accepted_charge_ah(double soc, double q_ah, double eta_coulomb, double offer_amps,
                                 double max_charge_amps, std::optional<double> absorption_soc) {
  const double headroom_ah = std::max(0.0, (1.0 - soc) * q_ah / eta_coulomb);
  if (!(offer_amps > 0)) return 0.0;
  if (!absorption_soc) return std::min(offer_amps, headroom_ah);

  // Acceptance per unit of missing SOC, A = I_max / (1 - s_abs); the offer meets it at s_x.
  const double a_per_soc = max_charge_amps / (1.0 - *absorption_soc);
  const double offer = std::min(offer_amps, max_charge_amps);
  const double s_cross = 1.0 - offer / a_per_soc;
  double s = soc, hours_left = 1.0, ah = 0.0;
  if (s < s_cross) {
    const double bulk_hours = (s_cross - s) * q_ah / (eta_coulomb * offer);
    if (bulk_hours >= 1.0) return std::min(offer, headroom_ah);
    ah += offer * bulk_hours;
    hours_left -= bulk_hours;
    s = s_cross;
  }
  // Constant voltage: 1 - s(t) = (1 - s) exp(-eta_C A t / Q).
  const double missing_end = (1.0 - s) * std::exp(-eta_coulomb * a_per_soc * hours_left / q_ah);
  ah += ((1.0 - missing_end) - s) * q_ah / eta_coulomb;
  return std::min(ah, headroom_ah);
}

}  // namespace stowage
