// SPDX-License-Identifier: MIT
#include "optimiser/storage_milp.h"

#include <glpk.h>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <limits>
#include <stdexcept>

#include "model/bank.h"
#include "model/contract.h"
#include "model/costs.h"
#include "model/economics.h"
#include "optimiser/design_space.h"

namespace stowage {

void MilpOptions::validate() const {
  if (!(relative_gap >= 0 && relative_gap < 1)) {
    throw ContractViolation("relative_gap", "must be in [0, 1)");
  }
  if (!(time_limit_s > 0)) throw ContractViolation("time_limit_s", "must be > 0");
}

const char* to_string(SolveOutcome outcome) {
  switch (outcome) {
    case SolveOutcome::Optimal:
      return "optimal";
    case SolveOutcome::TimeLimit:
      return "time limit (feasible, not proven)";
    case SolveOutcome::Infeasible:
      return "infeasible";
    case SolveOutcome::NoSolution:
      return "time limit (no solution)";
    case SolveOutcome::Error:
      return "error";
  }
  return "?";
}

double renewal_cost_factor(double rate_per_year, double discount_rate, int years) {
  if (rate_per_year <= 0) rate_per_year = 1e-12;
  if (discount_rate < 1e-12) return rate_per_year * years;
  const double lambda = std::log1p(discount_rate);
  const double crf = discount_rate / -std::expm1(-lambda / rate_per_year);
  return crf * series_present_worth_factor(discount_rate, years);
}

double renewal_cost_factor_slope(double rate_per_year, double discount_rate, int years) {
  if (discount_rate < 1e-12) return years;
  const double r = std::max(rate_per_year, 1e-12);
  const double lambda = std::log1p(discount_rate);
  const double e = std::exp(-lambda / r);
  const double one_minus = -std::expm1(-lambda / r);
  const double d_crf = discount_rate * lambda * e / (r * r * one_minus * one_minus);
  return d_crf * series_present_worth_factor(discount_rate, years);
}

namespace {

// Bank lives (years) at which g(r) is touched by a tangent: dense where designs usually live.
constexpr double kTangentLives[] = {0.25, 0.5, 0.75, 1,  1.5, 2,  2.5, 3,  4,  5,  6,  7,  8,
                                    9,    10,  12,   14, 16,  18, 20,  25, 30, 40, 60, 100};

std::string name(const char* stem, std::size_t c, int t = -1) {
  std::string s = std::string(stem) + "_" + std::to_string(c);
  if (t >= 0) s += "_" + std::to_string(t);
  return s;
}

}  // namespace

struct StorageMilp::Impl {
  glp_prob* lp = nullptr;
  std::vector<MilpChoice> choices;
  std::vector<int> col_y, col_n, col_z, col_hours;  // col_hours: first of 3 x H hour columns
  int hours = 0;
  double constant = 0;
  std::vector<double> hour_weight, hour_deficit;
  double unmet_price = 0;  // back-up price, or the penalty when there is no back-up
  double inverter_eff = 1;
  double pa = 1;  // P/A(i, N)
  // What set_setpoint() needs to rewrite the rows that depend on the setpoint.
  struct ChoiceRows {
    int n_min = 0, n_max = 0;
    std::vector<int> soc_rows, soc_cols;  // per hour
    std::vector<double> e_soc;            // per hour, kWh per unit SOC of one string
    std::vector<int> wear_rows;
    std::vector<double> wear_slope, wear_n, wear_y;  // per wear row: beta_k, n and y coefficients
    std::vector<int> dis_cols;                       // hours where discharge is possible
    std::vector<double> dis_wear;                    // w a_t / e_soc at those hours
    double rho1 = 0;
  };
  std::vector<ChoiceRows> rows;

  ~Impl() {
    if (lp) glp_delete_prob(lp);
  }
};

StorageMilp::StorageMilp(const Study& study, std::vector<MilpChoice> choices,
                         const RepresentativeDays& days, bool unserved_limit)
    : impl_(std::make_unique<Impl>()) {
  if (choices.empty()) throw ContractViolation("choices", "at least one choice is needed");
  for (std::size_t c = 0; c < choices.size(); ++c) {
    if (choices[c].min_strings < 1 || choices[c].min_strings > choices[c].max_strings) {
      throw ContractViolation("choices[" + std::to_string(c) + "]",
                              "needs 1 <= min_strings <= max_strings");
    }
  }
  Impl& m = *impl_;
  m.choices = std::move(choices);
  const SiteConditions& site = study.site;
  const Economics& econ = study.economics;
  const int n_years = econ.project_years;
  const double i = econ.real_discount_rate;
  m.pa = series_present_worth_factor(i, n_years);
  m.inverter_eff = site.inverter_efficiency;
  const bool has_backup = site.backup_price_per_kwh.has_value();
  m.unmet_price = has_backup ? *site.backup_price_per_kwh : site.unserved_penalty_per_kwh;

  // The hours of the representative blocks, with their weights and the block each wraps in.
  std::vector<int> hour_of, next_of;
  for (const RepresentativeBlock& b : days.blocks) {
    const int first = static_cast<int>(hour_of.size());
    for (int k = 0; k < b.hours; ++k) {
      hour_of.push_back(b.first_hour + k);
      m.hour_weight.push_back(b.weight);
      next_of.push_back(k + 1 < b.hours ? first + k + 1 : first);
    }
  }
  m.hours = static_cast<int>(hour_of.size());
  const int H = m.hours;
  std::vector<double> surplus(H), price(H);
  m.hour_deficit.resize(H);
  double weighted_deficit = 0, weighted_load = 0;
  for (int t = 0; t < H; ++t) {
    const int h = hour_of[t];
    const HourBalance b = hour_balance(site, static_cast<std::size_t>(h));
    surplus[t] = b.surplus_kwh;
    m.hour_deficit[t] = b.deficit_kwh;
    price[t] = site.charge_price_per_kwh[h];
    weighted_deficit += m.hour_weight[t] * m.hour_deficit[t];
    weighted_load += m.hour_weight[t] * site.load_kw[h];
  }
  m.constant = m.pa * m.unmet_price * weighted_deficit;

  glp_prob* lp = glp_create_prob();
  m.lp = lp;
  glp_set_prob_name(lp, "stowage_design");
  glp_set_obj_name(lp, "npc");
  glp_set_obj_dir(lp, GLP_MIN);

  const std::size_t C = m.choices.size();
  std::vector<int> ia{0}, ja{0};
  std::vector<double> ar{0.0};
  auto coef = [&](int row, int col, double v) {
    if (v == 0) return;
    ia.push_back(row);
    ja.push_back(col);
    ar.push_back(v);
  };
  auto add_row = [&](const std::string& row_name, int type, double lb, double ub) {
    const int r = glp_add_rows(lp, 1);
    glp_set_row_name(lp, r, row_name.c_str());
    glp_set_row_bnds(lp, r, type, lb, ub);
    return r;
  };

  // Columns.
  for (std::size_t c = 0; c < C; ++c) {
    const MilpChoice& ch = m.choices[c];
    const int y = glp_add_cols(lp, 3);
    m.col_y.push_back(y);
    m.col_n.push_back(y + 1);
    m.col_z.push_back(y + 2);
    glp_set_col_name(lp, y, name("y", c).c_str());
    glp_set_col_kind(lp, y, GLP_BV);
    glp_set_col_name(lp, y + 1, name("n", c).c_str());
    glp_set_col_kind(lp, y + 1, GLP_IV);
    glp_set_col_bnds(lp, y + 1, GLP_DB, 0, ch.max_strings);
    glp_set_col_name(lp, y + 2, name("z", c).c_str());
    glp_set_col_bnds(lp, y + 2, GLP_LO, 0, 0);
    const int first = glp_add_cols(lp, 3 * H);
    m.col_hours.push_back(first);
    for (int t = 0; t < H; ++t) {
      glp_set_col_name(lp, first + 3 * t, name("ch", c, t).c_str());
      glp_set_col_name(lp, first + 3 * t + 1, name("dis", c, t).c_str());
      glp_set_col_name(lp, first + 3 * t + 2, name("soc", c, t).c_str());
      glp_set_col_bnds(lp, first + 3 * t + 2, GLP_LO, 0, 0);
    }
  }

  const int pick = add_row("choose_one", GLP_FX, 1, 1);
  const bool unserved_row = unserved_limit && !has_backup &&
                            site.unserved_limit_fraction.has_value() &&
                            weighted_deficit - *site.unserved_limit_fraction * weighted_load > 0;
  const int unserved =
      unserved_row ? add_row("unserved_limit", GLP_LO,
                             weighted_deficit - *site.unserved_limit_fraction * weighted_load, 0)
                   : 0;
  const double pf_end = present_worth_factor(i, n_years + 1);

  m.rows.resize(C);
  for (std::size_t c = 0; c < C; ++c) {
    const MilpChoice& ch = m.choices[c];
    Impl::ChoiceRows& cr = m.rows[c];
    const ChemistryProfile& p = *ch.profile;
    const int y = m.col_y[c], n = m.col_n[c], z = m.col_z[c], first = m.col_hours[c];
    const int cells = cells_in_series(p, site.bus_voltage_v);
    const double e_string = string_nameplate_kwh(p, site.bus_voltage_v);
    const DesignCosts costs(p.costs, e_string);
    const AffineInStrings investment = costs.investment_in_strings();
    // Renewal price R = rho1 n + rho0: a new bank at the year-0 price plus the end of life of
    // the one it replaces; the price decline enters through the discount rate i'.
    const double share = costs.replacement_price_factor(0);
    const double rho1 = share * investment.per_string + costs.replacement_end_of_life(e_string);
    const double rho0 = share * investment.fixed;
    const double i_repl = (1 + i) / (1 - p.costs.price_decline_per_year) - 1;
    const double cal = ch.acceleration->calendar_damage_per_year;
    const double mid_health = 0.5 * (1 + p.eol_capacity_fraction);
    const double keep = std::pow(1 - p.self_discharge_per_month, 1 / kHoursPerMonth);
    const double eta = p.round_trip_efficiency();
    const double cycles = p.cycle_life.cycles_to_end_of_life(ch.dod_setpoint);

    coef(pick, y, 1);
    const int lo = add_row(name("n_min", c), GLP_LO, 0, 0);
    coef(lo, n, 1);
    coef(lo, y, -ch.min_strings);
    const int hi = add_row(name("n_max", c), GLP_UP, 0, 0);
    coef(hi, n, 1);
    coef(hi, y, -ch.max_strings);
    cr.n_min = lo;
    cr.n_max = hi;
    cr.rho1 = rho1;

    glp_set_obj_coef(lp, y, investment.fixed - rho0);
    glp_set_obj_coef(lp, n,
                     investment.per_string - rho1 + m.pa * costs.fixed_om_per_year(e_string) +
                         costs.final_end_of_life(e_string) * pf_end);
    glp_set_obj_coef(lp, z, 1);

    // Wear rows, one per tangent, plus the service-age floor; their dispatch terms are added
    // in the hour loop below.
    std::vector<int> wear_rows;
    std::vector<double> wear_slope;
    for (double life : kTangentLives) {
      const double r = 1 / life;
      const double slope = renewal_cost_factor_slope(r, i_repl, n_years);
      const double alpha = renewal_cost_factor(r, i_repl, n_years) - slope * r;
      const int row = add_row(name("wear", c, static_cast<int>(wear_rows.size())), GLP_LO, 0, 0);
      coef(row, z, 1);
      coef(row, n, -(alpha * rho1 + slope * rho1 * cal));
      coef(row, y, -(alpha * rho0 + slope * rho0 * cal));
      wear_rows.push_back(row);
      wear_slope.push_back(slope);
      cr.wear_n.push_back(-(alpha * rho1 + slope * rho1 * cal));
      cr.wear_y.push_back(-(alpha * rho0 + slope * rho0 * cal));
    }
    if (p.max_service_years) {
      const double g = renewal_cost_factor(1 / *p.max_service_years, i_repl, n_years);
      const int row = add_row(name("service_age", c), GLP_LO, 0, 0);
      coef(row, z, 1);
      coef(row, n, -g * rho1);
      coef(row, y, -g * rho0);
    }

    for (int t = 0; t < H; ++t) {
      const int h = hour_of[t];
      const double temp = site.temp_c[h];
      const double q_ah = p.cell_capacity_ah * mid_health * p.temperature.capacity_factor(temp);
      const double e_soc = q_ah * cells * p.mean_discharge_v / 1000.0;  // kWh per unit SOC
      const double charge_cap = p.temperature.can_charge(temp)
                                    ? p.max_charge_c_rate * q_ah * cells * p.mean_charge_v / 1000.0
                                    : 0.0;
      const double discharge_cap =
          p.temperature.can_discharge(temp) ? p.max_discharge_c_rate * e_soc : 0.0;
      const int col_ch = first + 3 * t, col_dis = col_ch + 1, col_soc = col_ch + 2;
      const double w = m.hour_weight[t];

      const double ch_ub = charge_cap > 0 ? site.charger_efficiency * surplus[t] : 0.0;
      glp_set_col_bnds(lp, col_ch, ch_ub > 0 ? GLP_DB : GLP_FX, 0, ch_ub);
      const double dis_ub = discharge_cap > 0 ? m.hour_deficit[t] / site.inverter_efficiency : 0.0;
      glp_set_col_bnds(lp, col_dis, dis_ub > 0 ? GLP_DB : GLP_FX, 0, dis_ub);

      glp_set_obj_coef(lp, col_ch, m.pa * w * price[t] / site.charger_efficiency);
      glp_set_obj_coef(
          lp, col_dis,
          m.pa * w * (costs.variable_om(1.0) - m.unmet_price * site.inverter_efficiency));

      // soc[next] - keep soc[t] - eta ch[t] + dis[t] = 0
      const int bal = add_row(name("balance", c, t), GLP_FX, 0, 0);
      const int next = first + 3 * next_of[t] + 2;
      if (next == col_soc) {
        coef(bal, col_soc, 1 - keep);  // a one-hour block: the state returns onto itself
      } else {
        coef(bal, next, 1);
        coef(bal, col_soc, -keep);
      }
      coef(bal, col_ch, -eta);
      coef(bal, col_dis, 1);

      const int soc_row = add_row(name("soc_max", c, t), GLP_UP, 0, 0);
      coef(soc_row, col_soc, 1);
      coef(soc_row, n, -ch.dod_setpoint * e_soc);
      cr.soc_rows.push_back(soc_row);
      cr.soc_cols.push_back(col_soc);
      cr.e_soc.push_back(e_soc);
      if (ch_ub > 0) {
        const int r = add_row(name("ch_max", c, t), GLP_UP, 0, 0);
        coef(r, col_ch, 1);
        coef(r, n, -charge_cap);
      }
      if (dis_ub > 0) {
        const int r = add_row(name("dis_max", c, t), GLP_UP, 0, 0);
        coef(r, col_dis, 1);
        coef(r, n, -discharge_cap);
        const double wear_per_kwh =
            w * ch.acceleration->per_hour[h] / (cycles * ch.dod_setpoint * e_soc);
        for (std::size_t k = 0; k < wear_rows.size(); ++k) {
          coef(wear_rows[k], col_dis, -wear_slope[k] * rho1 * wear_per_kwh);
        }
        if (unserved_row) coef(unserved, col_dis, w * site.inverter_efficiency);
        cr.dis_cols.push_back(col_dis);
        cr.dis_wear.push_back(w * ch.acceleration->per_hour[h] / e_soc);
      }
    }
    cr.wear_rows = wear_rows;
    cr.wear_slope = wear_slope;
  }
  glp_load_matrix(lp, static_cast<int>(ia.size()) - 1, ia.data(), ja.data(), ar.data());
}

StorageMilp::~StorageMilp() = default;

int StorageMilp::rows() const { return glp_get_num_rows(impl_->lp); }
int StorageMilp::columns() const { return glp_get_num_cols(impl_->lp); }
int StorageMilp::integer_columns() const { return glp_get_num_int(impl_->lp); }
double StorageMilp::objective_constant() const { return impl_->constant; }

namespace {

// Fills the estimate fields of `report` from a solution read through `value(column)`.
template <typename Value>
void read_solution(const StorageMilp::Impl& m, SolveReport& report, double objective, Value value) {
  report.glpk_objective = objective;
  report.estimate_npc = objective + m.constant;
  double best_y = -1;
  for (std::size_t c = 0; c < m.choices.size(); ++c) {
    const double y = value(m.col_y[c]);
    if (y > best_y) {
      best_y = y;
      report.choice = c;
    }
  }
  report.strings = static_cast<int>(std::lround(value(m.col_n[report.choice])));
  double discharged = 0, unmet = 0;
  for (int t = 0; t < m.hours; ++t) {
    double given = 0;
    for (std::size_t c = 0; c < m.choices.size(); ++c) given += value(m.col_hours[c] + 3 * t + 1);
    discharged += m.hour_weight[t] * given;
    unmet += m.hour_weight[t] * std::max(0.0, m.hour_deficit[t] - m.inverter_eff * given);
  }
  report.estimate_discharged_kwh_per_year = discharged;
  report.estimate_storage_pv = report.estimate_npc - m.pa * m.unmet_price * unmet;
  report.estimate_lcos_per_kwh =
      discharged > 0 ? report.estimate_storage_pv / (m.pa * discharged) : 0.0;
}

// Simplex from the current basis; falls back to an advanced starting basis when the current
// one cannot be factorised. Returns true when an optimal basic solution was found;
// `infeasible` tells a proven empty feasible set from a failure.
bool simplex(glp_prob* lp, int method, int time_limit_ms, bool& infeasible, bool& timed_out) {
  glp_smcp parm;
  glp_init_smcp(&parm);
  parm.msg_lev = GLP_MSG_OFF;
  parm.meth = method;
  parm.tm_lim = time_limit_ms;
  int rc = glp_simplex(lp, &parm);
  if (rc == GLP_EBADB || rc == GLP_ESING || rc == GLP_ECOND) {
    glp_adv_basis(lp, 0);
    parm.meth = GLP_PRIMAL;
    rc = glp_simplex(lp, &parm);
  }
  infeasible = rc == 0 && (glp_get_status(lp) == GLP_NOFEAS || glp_get_prim_stat(lp) == GLP_NOFEAS);
  timed_out = rc == GLP_ETMLIM;
  return rc == 0 && glp_get_status(lp) == GLP_OPT;
}

}  // namespace

void StorageMilp::set_setpoint(std::size_t choice, double dod_setpoint, int min_strings,
                               int max_strings) {
  Impl& m = *impl_;
  if (choice >= m.choices.size()) throw ContractViolation("choice", "out of range");
  require_dod_setpoint(dod_setpoint);
  if (min_strings < 1 || min_strings > max_strings) {
    throw ContractViolation("min_strings", "needs 1 <= min_strings <= max_strings");
  }
  MilpChoice& ch = m.choices[choice];
  ch.dod_setpoint = dod_setpoint;
  ch.min_strings = min_strings;
  ch.max_strings = max_strings;
  const Impl::ChoiceRows& cr = m.rows[choice];
  const int n = m.col_n[choice], y = m.col_y[choice], z = m.col_z[choice];
  glp_set_col_bnds(m.lp, n, GLP_DB, 0, max_strings);
  {
    const int ind[] = {0, n, y};
    const double lo[] = {0, 1.0, -static_cast<double>(min_strings)};
    const double hi[] = {0, 1.0, -static_cast<double>(max_strings)};
    glp_set_mat_row(m.lp, cr.n_min, 2, ind, lo);
    glp_set_mat_row(m.lp, cr.n_max, 2, ind, hi);
  }
  for (std::size_t t = 0; t < cr.soc_rows.size(); ++t) {
    const int ind[] = {0, cr.soc_cols[t], n};
    const double val[] = {0, 1.0, -dod_setpoint * cr.e_soc[t]};
    glp_set_mat_row(m.lp, cr.soc_rows[t], 2, ind, val);
  }
  const double cycles = ch.profile->cycle_life.cycles_to_end_of_life(dod_setpoint);
  std::vector<int> ind(4 + cr.dis_cols.size());
  std::vector<double> val(ind.size());
  for (std::size_t k = 0; k < cr.wear_rows.size(); ++k) {
    int len = 0;
    ind[++len] = z;
    val[len] = 1;
    ind[++len] = n;
    val[len] = cr.wear_n[k];
    if (cr.wear_y[k] != 0) {
      ind[++len] = y;
      val[len] = cr.wear_y[k];
    }
    for (std::size_t j = 0; j < cr.dis_cols.size(); ++j) {
      const double v = -cr.wear_slope[k] * cr.rho1 * cr.dis_wear[j] / (cycles * dod_setpoint);
      if (v == 0) continue;
      ind[++len] = cr.dis_cols[j];
      val[len] = v;
    }
    glp_set_mat_row(m.lp, cr.wear_rows[k], len, ind.data(), val.data());
  }
}

SolveReport StorageMilp::solve(const MilpOptions& options) {
  options.validate();
  Impl& m = *impl_;
  SolveReport report;
  const auto start = std::chrono::steady_clock::now();
  const int time_limit_ms = static_cast<int>(std::min(options.time_limit_s * 1000.0, 2.0e9));
  glp_term_out(GLP_OFF);
  auto finish = [&](SolveOutcome outcome, std::string message) {
    glp_term_out(GLP_ON);
    report.outcome = outcome;
    report.message = std::move(message);
    report.seconds =
        std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
    return report;
  };

  if (m.choices.size() == 1) {
    // One integer variable n: the LP optimum as a function of a fixed n is convex (parametric
    // right-hand side), so the integer optimum is at the floor or the ceiling of the LP
    // relaxation's n. Three warm-started LPs solve the sub-model exactly, much faster than
    // GLPK's general branch and bound.
    const int n_col = m.col_n[0];
    const MilpChoice& ch = m.choices[0];
    bool infeasible = false, timed_out = false;
    if (!simplex(m.lp, GLP_PRIMAL, time_limit_ms, infeasible, timed_out)) {
      if (infeasible) return finish(SolveOutcome::Infeasible, "the model has no feasible solution");
      return finish(timed_out ? SolveOutcome::NoSolution : SolveOutcome::Error,
                    timed_out ? "stopped at the time limit" : "the LP relaxation failed");
    }
    const double n_lp = glp_get_col_prim(m.lp, n_col);
    const double nearest = std::round(n_lp);
    if (std::fabs(n_lp - nearest) > 1e-7) {
      double best_value = std::numeric_limits<double>::infinity();
      int best_n = 0;
      for (int v : {static_cast<int>(std::floor(n_lp)), static_cast<int>(std::ceil(n_lp))}) {
        if (v < ch.min_strings || v > ch.max_strings) continue;
        glp_set_col_bnds(m.lp, n_col, GLP_FX, v, v);
        if (simplex(m.lp, GLP_DUALP, time_limit_ms, infeasible, timed_out) &&
            glp_get_obj_val(m.lp) < best_value) {
          best_value = glp_get_obj_val(m.lp);
          best_n = v;
        }
      }
      if (best_n == 0) {
        glp_set_col_bnds(m.lp, n_col, GLP_DB, 0, ch.max_strings);
        return finish(timed_out ? SolveOutcome::NoSolution : SolveOutcome::Infeasible,
                      "no integer number of strings is feasible in the model");
      }
      glp_set_col_bnds(m.lp, n_col, GLP_FX, best_n, best_n);
      simplex(m.lp, GLP_DUALP, time_limit_ms, infeasible, timed_out);
      read_solution(m, report, glp_get_obj_val(m.lp),
                    [&](int j) { return glp_get_col_prim(m.lp, j); });
      glp_set_col_bnds(m.lp, n_col, GLP_DB, 0, ch.max_strings);
    } else {
      read_solution(m, report, glp_get_obj_val(m.lp),
                    [&](int j) { return glp_get_col_prim(m.lp, j); });
    }
    return finish(SolveOutcome::Optimal, "optimal (LP relaxation and its neighbouring integers)");
  }

  glp_iocp parm;
  glp_init_iocp(&parm);
  parm.msg_lev = GLP_MSG_OFF;
  parm.presolve = GLP_ON;
  parm.mip_gap = options.relative_gap;
  parm.tm_lim = time_limit_ms;
  const int rc = glp_intopt(m.lp, &parm);
  const int status = glp_mip_status(m.lp);
  if (rc == GLP_ENOPFS || status == GLP_NOFEAS) {
    return finish(SolveOutcome::Infeasible, "the model has no feasible solution");
  }
  SolveOutcome outcome = SolveOutcome::Optimal;
  std::string message = "optimal within the relative gap";
  if (rc == GLP_ETMLIM) {
    if (status != GLP_FEAS && status != GLP_OPT) {
      return finish(SolveOutcome::NoSolution, "GLPK stopped at the time limit");
    }
    outcome = SolveOutcome::TimeLimit;
    message = "GLPK stopped at the time limit";
  } else if (rc != 0 && rc != GLP_EMIPGAP) {
    return finish(SolveOutcome::Error, "glp_intopt failed with code " + std::to_string(rc));
  } else if (status != GLP_OPT && status != GLP_FEAS) {
    return finish(SolveOutcome::Error,
                  "GLPK returned no solution (status " + std::to_string(status) + ")");
  }
  read_solution(m, report, glp_mip_obj_val(m.lp), [&](int j) { return glp_mip_col_val(m.lp, j); });
  return finish(outcome, message);
}

void StorageMilp::write_mps(const std::string& path) const {
  glp_term_out(GLP_OFF);
  const int rc = glp_write_mps(impl_->lp, GLP_MPS_FILE, nullptr, path.c_str());
  glp_term_out(GLP_ON);
  if (rc != 0) throw std::runtime_error(path + ": cannot write the model (free MPS)");
}

void StorageMilp::write_lp(const std::string& path) const {
  glp_term_out(GLP_OFF);
  const int rc = glp_write_lp(impl_->lp, nullptr, path.c_str());
  glp_term_out(GLP_ON);
  if (rc != 0) throw std::runtime_error(path + ": cannot write the model (CPLEX LP)");
}

}  // namespace stowage
