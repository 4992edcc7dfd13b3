// SPDX-License-Identifier: MIT
// StorageMilp: the mixed-integer linear model that estimates the net present cost of bank
// designs, built in code on GLPK's C API (no model files at run time). docs/optimiser.md gives
// the derivation; in brief, for a set of choices c = (profile, DoD setpoint d):
//
// Variables  y_c in {0,1} (choice built), n_c integer in [0, max_strings_c] (strings),
//            z_c >= 0 (present cost of renewing the bank as it wears), and for each hour t of
//            the representative days: ch_ct, dis_ct >= 0 (terminal kWh in / out),
//            soc_ct >= 0 (kWh above the DoD floor, valued at the discharge voltage).
// Constraints
//   sum_c y_c = 1;   min_strings_c y_c <= n_c <= max_strings_c y_c
//   soc_c,next(t) = sigma soc_ct + eta ch_ct - dis_ct     (cyclic within each block; sigma the
//                    hourly self-discharge keep, eta the round-trip efficiency)
//   soc_ct <= d E_ct n_c,  ch_ct <= C_ch,ct n_c,  dis_ct <= C_dis,ct n_c
//     (E_ct: kWh per unit SOC of one string at mid-life health (1 + eol)/2 and the hour's
//      capacity factor; C: C-rate limits at the terminals, 0 outside the temperature limits)
//   ch_ct <= charger_eff x surplus_t;  dis_ct <= deficit_t / inverter_eff
//   sum_t w_t inverter_eff dis_ct >= sum_t w_t deficit_t - limit x sum_t w_t load_t
//     (only without back-up and with an unserved limit)
//   z_c >= alpha_k R_c(n_c, y_c) + beta_k [rho1_c (W_c + cal_c n_c) + rho0_c cal_c y_c]
//     for tangents k of g(r) = CRF(i', 1/r) x P/A(i', N), the present cost per unit renewal
//     price of a bank worn at rate r per year (convex, outer-approximated by tangents), with
//     R_c = rho1_c n_c + rho0_c y_c the renewal price, i' the discount rate net of the price
//     decline, W_c = sum_t w_t a_t dis_ct / (N(d) d E_ct) the cycle damage (string-years per
//     year; a_t the temperature acceleration), cal_c the calendar damage per year.
// Objective (present value, the estimate of DesignResult::npc less a constant)
//   sum_c [ I0_c(n_c, y_c) - R_c + z_c + eol_c n_c P/F(N+1) + P/A(N) ( fixed O&M n_c
//           + sum_t w_t (price_t ch_ct / charger_eff + var_om dis_ct
//                        - backup_or_penalty inverter_eff dis_ct) ) ]
//   + constant P/A(N) sum_t w_t backup_or_penalty deficit_t  (kept outside GLPK, so an exported
//     model's optimum equals GLPK's objective value).
// One choice gives a sub-model with one integer variable; all admissible choices together give
// the monolithic model of the design space (what --export-model writes).
#pragma once

#include <cstddef>
#include <memory>
#include <string>
#include <vector>

#include "model/ageing.h"
#include "model/study.h"
#include "optimiser/representative_days.h"

namespace stowage {

struct MilpChoice {
  const ChemistryProfile* profile = nullptr;
  const AccelerationSeries* acceleration = nullptr;  // of `profile` at the study's site
  double dod_setpoint = 0.5;
  int min_strings = 1;
  int max_strings = 1;  // >= min_strings
};

struct MilpOptions {
  double relative_gap = 1e-7;  // GLPK mip_gap, [0, 1)
  double time_limit_s = 600;   // > 0
  void validate() const;       // throws ContractViolation naming the field
};

enum class SolveOutcome {
  Optimal,     // solved to the gap tolerance
  TimeLimit,   // stopped by the time limit with a feasible solution (not proven)
  Infeasible,  // the model has no solution
  NoSolution,  // stopped by the time limit before any feasible solution
  Error,       // GLPK failed; `message` says how
};
const char* to_string(SolveOutcome outcome);

// What one solve gave. The estimate fields mean something only when solution_usable().
struct SolveReport {
  SolveOutcome outcome = SolveOutcome::Error;
  std::string message;
  double glpk_objective = 0;       // GLPK's objective (no constant): what CBC/HiGHS reproduce
  double estimate_npc = 0;         // glpk_objective + constant: model estimate of the NPC
  double estimate_storage_pv = 0;  // estimate_npc less back-up and penalty
  double estimate_discharged_kwh_per_year = 0;
  double estimate_lcos_per_kwh = 0;  // storage PV / (P/A(N) x discharged per year); 0 if none
  std::size_t choice = 0;            // index into the choices
  int strings = 0;
  double seconds = 0;

  bool solution_usable() const {
    return outcome == SolveOutcome::Optimal || outcome == SolveOutcome::TimeLimit;
  }
};

class StorageMilp {
 public:
  // Builds the model; `study`, the choices' profiles and accelerations must outlive it.
  // Throws ContractViolation when `choices` is empty or a choice has min > max or min < 1.
  // `unserved_limit` false leaves out the unserved-limit row (to price a given bank that
  // misses the limit on the representative days).
  StorageMilp(const Study& study, std::vector<MilpChoice> choices, const RepresentativeDays& days,
              bool unserved_limit = true);
  ~StorageMilp();
  StorageMilp(const StorageMilp&) = delete;
  StorageMilp& operator=(const StorageMilp&) = delete;

  // A model with one choice (a sub-model) is solved exactly through its LP relaxation and the
  // two integers around its n (the LP value is convex in n); several choices go to GLPK's
  // branch and bound (glp_intopt with its presolver).
  SolveReport solve(const MilpOptions& options);

  // Moves choice `choice` to another setpoint and strings range of the same profile, keeping
  // the rest of the model (and GLPK's basis, for a warm start). Throws ContractViolation.
  void set_setpoint(std::size_t choice, double dod_setpoint, int min_strings, int max_strings);

  // Writes the model in free MPS (GLPK's GLP_MPS_FILE); throws std::runtime_error naming the
  // path on failure.
  void write_mps(const std::string& path) const;
  // Writes the model in CPLEX LP format.
  void write_lp(const std::string& path) const;

  int rows() const;
  int columns() const;
  int integer_columns() const;
  double objective_constant() const;

  struct Impl;  // GLPK problem and the bookkeeping to read and modify it

 private:
  std::unique_ptr<Impl> impl_;
};

// g(r): present cost per unit renewal price of a bank that wears at rate r (1/years of life)
// over an N-year project at the replacement discount rate i' (see above); exposed for tests.
double renewal_cost_factor(double rate_per_year, double discount_rate, int years);
double renewal_cost_factor_slope(double rate_per_year, double discount_rate, int years);

}  // namespace stowage
