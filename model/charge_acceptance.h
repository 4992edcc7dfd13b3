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

// The law above for one bank: the per-bank quotients are worked out once, so the hourly dispatch
// loop divides only by the offered current. accepted_charge_ah() is the same law for one call.
class ChargeAcceptance {
 public:
  ChargeAcceptance(double q_ah, double eta_coulomb, double max_charge_amps,
                   std::optional<double> absorption_soc)
      : q_ah_(q_ah),
        eta_(eta_coulomb),
        q_over_eta_(q_ah / eta_coulomb),
        eta_over_q_(eta_coulomb / q_ah),
        max_amps_(max_charge_amps),
        has_absorption_(absorption_soc.has_value()),
        a_per_soc_(has_absorption_ ? max_charge_amps / (1.0 - *absorption_soc) : 0.0),
        full_hour_decay_(std::exp(-eta_over_q_ * a_per_soc_ * 1.0)) {}

  // Terminal charge in Ah accepted over one hour from SOC `soc` at an offered current.
  double accepted_ah(double soc, double offer_amps) const {
    const double headroom_ah = std::max(0.0, (1.0 - soc) * q_over_eta_);
    if (!(offer_amps > 0)) return 0.0;
    if (!has_absorption_) return std::min(offer_amps, headroom_ah);
    const double offer = std::min(offer_amps, max_amps_);
    const double s_cross = 1.0 - offer / a_per_soc_;
    double s = soc, hours_left = 1.0, ah = 0.0;
    if (s < s_cross) {
      const double bulk_hours = (s_cross - s) * q_over_eta_ / offer;
      if (bulk_hours >= 1.0) return std::min(offer, headroom_ah);
      ah += offer * bulk_hours;
      hours_left -= bulk_hours;
      s = s_cross;
    }
    // Constant voltage: 1 - s(t) = (1 - s) exp(-eta_C A t / Q).
    // A whole hour at constant voltage (the usual case near full) needs no new exponential.
    const double decay =
        hours_left == 1.0 ? full_hour_decay_ : std::exp(-eta_over_q_ * a_per_soc_ * hours_left);
    const double missing_end = (1.0 - s) * decay;
    ah += ((1.0 - missing_end) - s) * q_over_eta_;
    return std::min(ah, headroom_ah);
  }

  double q_ah() const { return q_ah_; }
  double eta_coulomb() const { return eta_; }

 private:
  double q_ah_, eta_, q_over_eta_, eta_over_q_, max_amps_;
  bool has_absorption_;
  double a_per_soc_;
  double full_hour_decay_;  // exp(-eta_C A / Q): one hour at constant voltage
};

inline double accepted_charge_ah(double soc, double q_ah, double eta_coulomb, double offer_amps,
                                 double max_charge_amps, std::optional<double> absorption_soc) {
  return ChargeAcceptance(q_ah, eta_coulomb, max_charge_amps, absorption_soc)
      .accepted_ah(soc, offer_amps);
}

}  // namespace stowage
