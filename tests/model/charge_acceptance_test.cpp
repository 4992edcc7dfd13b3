// SPDX-License-Identifier: MIT
// Charge acceptance with a constant-voltage (absorption) stage (charge_acceptance.h): above the
// absorption SOC the accepted current falls in proportion to the missing charge, so a
// lead-acid bank reaches full charge only after hours at absorption voltage.
#include "model/charge_acceptance.h"

#include <catch2/catch.hpp>
#include <cmath>

#include "model/dispatch.h"
#include "model/invalid_value.h"
#include "model_fixtures.h"

using namespace stowage;
using namespace stowage::testing;

namespace {
// ds/dt = eta I(s) / Q with I(s) = min(offer, I_max (1 - s) / (1 - s_abs)), integrated by
// classical fourth-order Runge-Kutta in 20,000 steps: an independent check of the closed form.
double rk4_soc_after_hour(double s, double q, double eta, double offer, double i_max,
                          double s_abs) {
  auto rate = [&](double x) {
    const double acceptance = x <= s_abs ? i_max : i_max * (1 - x) / (1 - s_abs);
    return eta * std::min(offer, acceptance) / q;
  };
  const int n = 20000;
  const double dt = 1.0 / n;
  for (int i = 0; i < n; ++i) {
    const double k1 = rate(s), k2 = rate(s + 0.5 * dt * k1), k3 = rate(s + 0.5 * dt * k2),
                 k4 = rate(s + dt * k3);
    s += dt / 6 * (k1 + 2 * k2 + 2 * k3 + k4);
  }
  return s;
}

// A flooded-style bank: 24 cells of 100 Ah at 48 V, coulombic efficiency 0.9, charge at up to
// C/5, absorption from SOC 0.8.
ChemistryProfile tapered_cell() {
  ChemistryProfile p = ideal_cell(100);
  p.coulombic_efficiency = 0.9;
  p.max_charge_c_rate = 0.2;
  p.absorption_soc = 0.8;
  return p;
}

// Each day: charge from a large surplus in `charge_hours` hours from 10:00, then an evening
// load that takes the bank to its DoD 0.5 floor. Returns the year's dispatch.
YearDispatch daily_cycle(const ChemistryProfile& p, int charge_hours) {
  SiteConditions s = quiet_site(48.0, 25.0);
  every_day(s.source_kw, 10, 10 + charge_hours - 1, 50.0);
  every_day(s.load_kw, 19, 22, 5.0);
  DispatchInputs in;
  in.profile = &p;
  in.site = &s;
  in.bank = bank_geometry(p, 48.0, 1);
  in.dod_setpoint = 0.5;
  DispatchState state;
  state.soc = 0.5;
  std::vector<double> trace;
  return dispatch_year(in, state, trace);
}
}  // namespace

TEST_CASE("the absorption stage's closed form matches a numerical integration of the taper law",
          "[model][charge]") {
  // Bulk below the threshold, the crossing within the hour, and pure absorption; offers above
  // and below the acceptance. Runge-Kutta (independent integration) to 1e-9.
  const double q = 80, eta = 0.9, i_max = 20, s_abs = 0.8;
  for (double s0 : {0.3, 0.7, 0.79, 0.8, 0.9, 0.99}) {
    for (double offer : {5.0, 12.0, 20.0}) {
      INFO("soc " << s0 << ", offer " << offer << " A");
      const double ah = accepted_charge_ah(s0, q, eta, offer, i_max, s_abs);
      CHECK(s0 + ah * eta / q ==
            Approx(rk4_soc_after_hour(s0, q, eta, offer, i_max, s_abs)).epsilon(1e-9));
    }
  }
  // Without an absorption stage the offer is taken up to the headroom.
  CHECK(accepted_charge_ah(0.95, q, eta, 20, i_max, std::nullopt) ==
        Approx(0.05 * q / eta).epsilon(1e-12));
}

TEST_CASE("a tapered lead-acid bank needs hours at absorption to reach full charge",
          "[model][charge]") {
  // From SOC 0.8 at full offer: 1 - s(t) = 0.2 exp(-t / tau), tau = (1 - 0.8) Q / (eta I_max)
  // = 0.2 x 100 / (0.9 x 20) = 1.111 h (first-order acceptance at constant voltage, from
  // memory). After 1 h SOC = 1 - 0.2 e^-0.9 = 0.91869; reaching 0.98 takes tau ln 10 = 2.56 h;
  // after 3 h SOC = 1 - 0.2 e^-2.7 = 0.98656.
  const ChemistryProfile p = tapered_cell();
  double s = 0.8;
  std::vector<double> after;
  for (int hour = 0; hour < 3; ++hour) {
    s += accepted_charge_ah(s, 100, 0.9, 1000, 20, p.absorption_soc) * 0.9 / 100;
    after.push_back(s);
  }
  CHECK(after[0] == Approx(1 - 0.2 * std::exp(-0.9)).epsilon(1e-12));
  CHECK(after[1] < 0.98);
  CHECK(after[2] == Approx(1 - 0.2 * std::exp(-2.7)).epsilon(1e-12));
}

TEST_CASE("the taper turns short daily charging into partial-state-of-charge operation",
          "[model][charge]") {
  // Daily from the 0.5 floor: bulk to 0.8 takes 0.3 x 100 / (0.9 x 20) = 1.667 h, then in a
  // 4-hour charging window 2.333 h of absorption leave 1 - 0.2 e^-2.1 = 0.9755 < 0.98: the
  // bank never counts as fully charged. A 5-hour window gives 1 - 0.2 e^-3 = 0.9900. Without
  // the taper 4 hours fill the bank every day (derivation of charge_acceptance.h).
  ChemistryProfile p = tapered_cell();
  p.partial_charge = PartialChargeStress{0.98, 7, 0.001};
  const YearDispatch short_window = daily_cycle(p, 4);
  const YearDispatch long_window = daily_cycle(p, 5);
  ChemistryProfile untapered = p;
  untapered.absorption_soc.reset();
  const YearDispatch no_taper = daily_cycle(untapered, 4);
  CHECK(short_window.partial_charge_excess_days == Approx((8760 - 7 * 24) / 24.0));
  CHECK(long_window.partial_charge_excess_days == 0);
  CHECK(no_taper.partial_charge_excess_days == 0);
}

TEST_CASE("an absorption stage needs a full-charge SOC below 1", "[model][charge]") {
  ChemistryProfile p = tapered_cell();
  p.partial_charge = PartialChargeStress{1.0, 7, 0.001};
  CHECK_THROWS_AS(p.validate(), InvalidValue);
  p.partial_charge->full_charge_soc = 0.98;
  CHECK_NOTHROW(p.validate());
  p.absorption_soc = 1.0;
  CHECK_THROWS_AS(p.validate(), InvalidValue);
}
