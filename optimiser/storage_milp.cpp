// SPDX-License-Identifier: MIT
#include "optimiser/storage_milp.h"

#include <glpk.h>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <stdexcept>

#include "model/bank.h"
#include "model/economics.h"
#include "model/invalid_value.h"
#include "optimiser/design_space.h"

namespace stowage {

void MilpOptions::validate() const {
  if (!(relative_gap >= 0 && relative_gap < 1)) {
    throw InvalidValue("relative_gap", "must be in [0, 1)");
  }
  if (!(time_limit_s > 0)) throw InvalidValue("time_limit_s", "must be > 0");
}

const char* to_string(SolveOutcome outcome) {
  switch (outcome) {
    case SolveOutcome::Optimal: return "optimal";
    case SolveOutcome::TimeLimit: return "time limit (feasible, not proven)";
    case SolveOutcome::Infeasible: return "infeasible";
    case SolveOutcome::NoSolution: return "time limit (no solution)";
    case SolveOutcome::Error: return "error";
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
constexpr double kTangentLives[] = {0.25, 0.5, 0.75, 1,  1.5, 2,  2.5, 3,  4,  5,  6,   7,
                                    8,    9,   10,   12, 14,  16, 18,  20, 25, 30, 40, 60, 100};

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
  double unmet_price = 0;     // back-up price, or the penalty when there is no back-up
  double inverter_eff = 1;
  double pa = 1;              // P/A(i, N)

  ~Impl() {
    if (lp) glp_delete_prob(lp);
  }
};

StorageMilp::StorageMilp(const Study& study, std::vector<MilpChoice> choices,
                         const RepresentativeDays& days)
    : impl_(std::make_unique<Impl>()) {
  if (choices.empty()) throw InvalidValue("choices", "at least one choice is needed");
  for (std::size_t c = 0; c < choices.size(); ++c) {
    if (choices[c].min_strings < 1 || choices[c].min_strings > choices[c].max_strings) {
      throw InvalidValue("choices[" + std::to_string(c) + "]",
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
    const double net = site.source_kw[h] - site.load_kw[h];
    surplus[t] = std::max(0.0, net);
    m.hour_deficit[t] = std::max(0.0, -net);
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
  const bool unserved_row = !has_backup && site.unserved_limit_fraction.has_value() &&
                            weighted_deficit - *site.unserved_limit_fraction * weighted_load > 0;
  const int unserved =
      unserved_row
          ? add_row("unserved_limit", GLP_LO,
                    weighted_deficit - *site.unserved_limit_fraction * weighted_load, 0)
          : 0;
  const double pf_end = present_worth_factor(i, n_years + 1);

  for (std::size_t c = 0; c < C; ++c) {
    const MilpChoice& ch = m.choices[c];
    const ChemistryProfile& p = *ch.profile;
    const ProfileCosts& costs = p.costs;
    const int y = m.col_y[c], n = m.col_n[c], z = m.col_z[c], first = m.col_hours[c];
    const int cells = cells_in_series(p, site.bus_voltage_v);
    const double e_string = string_nameplate_kwh(p, site.bus_voltage_v);
    const double price_string = costs.capital_per_kwh * e_string + costs.capital_per_string;
    const double rho1 = costs.replacement_share * price_string + costs.end_of_life_per_kwh * e_string;
    const double rho0 = costs.replacement_share * costs.installation_fixed;
    const double i_repl = (1 + i) / (1 - costs.price_decline_per_year) - 1;
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

    glp_set_obj_coef(lp, y, costs.installation_fixed - rho0);
    glp_set_obj_coef(lp, n,
                     price_string - rho1 + m.pa * costs.fixed_om_per_kwh_year * e_string +
                         costs.end_of_life_per_kwh * e_string * pf_end);
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
      const double charge_cap =
          p.temperature.can_charge(temp) ? p.max_charge_c_rate * q_ah * cells * p.mean_charge_v / 1000.0
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
      glp_set_obj_coef(lp, col_dis,
                       m.pa * w *
                           (costs.variable_om_per_mwh / 1000.0 -
                            m.unmet_price * site.inverter_efficiency));

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
      }
    }
  }
  glp_load_matrix(lp, static_cast<int>(ia.size()) - 1, ia.data(), ja.data(), ar.data());
}

StorageMilp::~StorageMilp() = default;

int StorageMilp::rows() const { return glp_get_num_rows(impl_->lp); }
int StorageMilp::columns() const { return glp_get_num_cols(impl_->lp); }
int StorageMilp::integer_columns() const { return glp_get_num_int(impl_->lp); }
double StorageMilp::objective_constant() const { return impl_->constant; }

SolveReport StorageMilp::solve(const MilpOptions& options) {
  options.validate();
  Impl& m = *impl_;
  SolveReport report;
  const auto start = std::chrono::steady_clock::now();
  glp_term_out(GLP_OFF);
  glp_iocp parm;
  glp_init_iocp(&parm);
  parm.msg_lev = GLP_MSG_OFF;
  parm.presolve = GLP_ON;
  parm.mip_gap = options.relative_gap;
  parm.tm_lim = static_cast<int>(std::min(options.time_limit_s * 1000.0, 2.0e9));
  const int rc = glp_intopt(m.lp, &parm);
  glp_term_out(GLP_ON);
  report.seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  const int status = glp_mip_status(m.lp);
  if (rc == GLP_ENOPFS || status == GLP_NOFEAS) {
    report.outcome = SolveOutcome::Infeasible;
    report.message = "the model has no feasible solution";
    return report;
  }
  if (rc == GLP_ETMLIM) {
    report.outcome = status == GLP_FEAS || status == GLP_OPT ? SolveOutcome::TimeLimit
                                                             : SolveOutcome::NoSolution;
    report.message = "GLPK stopped at the time limit";
    if (report.outcome == SolveOutcome::NoSolution) return report;
  } else if (rc == 0 || rc == GLP_EMIPGAP) {
    if (status != GLP_OPT && status != GLP_FEAS) {
      report.outcome = SolveOutcome::Error;
      report.message = "GLPK returned no solution (status " + std::to_string(status) + ")";
      return report;
    }
    report.outcome = SolveOutcome::Optimal;
    report.message = "optimal within the relative gap";
  } else {
    report.outcome = SolveOutcome::Error;
    report.message = "glp_intopt failed with code " + std::to_string(rc);
    return report;
  }
  report.glpk_objective = glp_mip_obj_val(m.lp);
  report.estimate_npc = report.glpk_objective + m.constant;
  double best_y = -1;
  for (std::size_t c = 0; c < m.choices.size(); ++c) {
    const double y = glp_mip_col_val(m.lp, m.col_y[c]);
    if (y > best_y) {
      best_y = y;
      report.choice = c;
    }
  }
  report.strings = static_cast<int>(std::lround(glp_mip_col_val(m.lp, m.col_n[report.choice])));
  double discharged = 0, unmet = 0;
  for (int t = 0; t < m.hours; ++t) {
    double given = 0;
    for (std::size_t c = 0; c < m.choices.size(); ++c) {
      given += glp_mip_col_val(m.lp, m.col_hours[c] + 3 * t + 1);
    }
    discharged += m.hour_weight[t] * given;
    unmet += m.hour_weight[t] * std::max(0.0, m.hour_deficit[t] - m.inverter_eff * given);
  }
  report.estimate_discharged_kwh_per_year = discharged;
  report.estimate_storage_pv = report.estimate_npc - m.pa * m.unmet_price * unmet;
  report.estimate_lcos_per_kwh =
      discharged > 0 ? report.estimate_storage_pv / (m.pa * discharged) : 0.0;
  return report;
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
