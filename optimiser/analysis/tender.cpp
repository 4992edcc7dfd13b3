// SPDX-License-Identifier: MIT
#include "optimiser/analysis/tender.h"

#include <algorithm>
#include <cmath>
#include <limits>

#include "model/ageing.h"
#include "model/invalid_value.h"
#include "optimiser/design_space.h"

namespace stowage {

namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();

// When a cumulative sum of yearly amounts first reaches `cap`, interpolated within that year.
double time_to_reach(double cap, const std::vector<double>& per_year) {
  double sum = 0;
  for (std::size_t y = 0; y < per_year.size(); ++y) {
    if (per_year[y] > 0 && sum + per_year[y] >= cap) {
      return static_cast<double>(y) + (cap - sum) / per_year[y];
    }
    sum += per_year[y];
  }
  return kInf;
}

// The years until the chemistry model first retires the bank.
double modelled_life(const DesignResult& r) {
  // The end of the month of the first replacement, in project years.
  if (!r.replacement_years.empty())
    return r.replacement_years.front() - 1 + r.replacement_months.front() / 12.0;
  const YearRecord& last = r.years.back();
  return last.damage_end > 0 ? last.year / last.damage_end : kInf;
}

bool within(int year_end, double warranty_end_years) {
  return year_end <= warranty_end_years + 1e-9;
}

// The supplier pays a replacement for wear within the warranty; the buyer pays the rest.
void apply_replacement_warranty(BidResult& b) {
  DesignResult& r = b.design;
  CostBreakdown& pv = r.present_value;
  for (YearRecord& rec : r.years) {
    if (!rec.replaced()) continue;
    const bool worn = rec.replaced_worn_out;
    const bool covered = worn && within(rec.year, b.warranty.years);
    (covered ? b.supplier_paid_years : b.buyer_paid_years).push_back(rec.year);
    if (!covered) continue;
    b.supplier_replacements_pv += (rec.replacement + rec.end_of_life) * rec.discount_factor;
    pv.replacements -= rec.replacement * rec.discount_factor;
    pv.end_of_life -= rec.end_of_life * rec.discount_factor;
    rec.replacement = 0;
    rec.end_of_life = 0;
  }
}

// The share 1 - A out of service: its delivered energy bought as back-up, its charging and
// variable O&M saved.
void apply_availability(BidResult& b, double availability, double backup_price_per_kwh) {
  DesignResult& r = b.design;
  CostBreakdown& pv = r.present_value;
  const double out = 1.0 - availability;
  const double before = pv.total();
  for (YearRecord& rec : r.years) {
    const double backup = out * rec.dispatch.delivered_kwh * backup_price_per_kwh;
    const double charging = out * rec.charging, variable_om = out * rec.variable_om;
    rec.backup += backup;
    rec.charging -= charging;
    rec.variable_om -= variable_om;
    pv.backup += backup * rec.discount_factor;
    pv.charging -= charging * rec.discount_factor;
    pv.variable_om -= variable_om * rec.discount_factor;
  }
  r.discounted_delivered_kwh *= availability;
  b.availability_pv = pv.total() - before;
}

std::vector<double> health_at_year_ends(const DesignResult& r, const ChemistryProfile& profile) {
  std::vector<double> health;
  for (const YearRecord& rec : r.years)
    health.push_back(health_from_damage(profile, rec.damage_peak));
  return health;
}

void check_requirements(BidResult& b, const Bid& bid, const ChemistryProfile& profile,
                        const TenderCase& tender) {
  const DesignResult& r = b.design;
  const bool top_up = bid.warranty.capacity_remedy == CapacityRemedy::TopUp;
  b.least_usable_kwh = kInf;
  int worst_year = 0;
  for (const YearRecord& rec : r.years) {
    double health = health_from_damage(profile, rec.damage_peak);
    if (top_up && within(rec.year, b.warranty.years)) {
      health = std::max(health, warranted_capacity(bid.warranty, rec.year));
    }
    const double usable = r.bank.nameplate_kwh * bid.dod_setpoint * health;
    if (usable < b.least_usable_kwh) {
      b.least_usable_kwh = usable;
      worst_year = rec.year;
    }
  }
  b.power_kw = string_discharge_power_kw(profile, tender.site.bus_voltage_v) * bid.strings_parallel;
  const TenderRequirements& req = tender.requirements;
  if (req.min_usable_kwh && b.least_usable_kwh < *req.min_usable_kwh) {
    b.shortfalls.push_back(
        {Shortfall::Kind::UsableEnergy, *req.min_usable_kwh, b.least_usable_kwh, worst_year});
  }
  if (req.min_power_kw && b.power_kw < *req.min_power_kw) {
    b.shortfalls.push_back({Shortfall::Kind::Power, *req.min_power_kw, b.power_kw, 0});
  }
}

BidResult evaluate_bid(const Bid& bid, const TenderCase& tender) {
  BidResult b;
  b.label = bid.label;
  b.family = bid.profile.family;
  const ChemistryProfile profile = profile_retiring_at(bid.profile, bid.warranty.capacity_floor);
  LifecycleEvaluator evaluator(profile, tender.site, tender.economics);
  b.design = evaluator.evaluate(bid.dod_setpoint, bid.strings_parallel);
  std::vector<double> discharged;
  for (const YearRecord& rec : b.design.years) {
    discharged.push_back(rec.dispatch.discharged_terminal_kwh);
  }
  const double nameplate = b.design.bank.nameplate_kwh;
  b.warranty = warranty_end(bid.warranty, discharged, nameplate);
  b.modelled_life_years = modelled_life(b.design);
  b.warranty_exceeds_model = b.warranty.years > b.modelled_life_years + 1e-9;
  apply_replacement_warranty(b);
  if (bid.warranty.availability) {
    apply_availability(b, *bid.warranty.availability, *tender.site.backup_price_per_kwh);
  }
  b.capacity_claims = capacity_claims(bid.warranty, b.warranty.years, nameplate,
                                      health_at_year_ends(b.design, profile));
  for (const CapacityClaim& c : b.capacity_claims) {
    b.top_up_kwh += c.top_up_kwh;
    b.liquidated_damages_pv -= c.liquidated_damages * b.design.years[c.year - 1].discount_factor;
  }
  DesignResult& r = b.design;
  r.settle_totals();
  b.npc = r.npc + b.liquidated_damages_pv;
  b.npc_without_warranty = b.npc + b.supplier_replacements_pv - b.liquidated_damages_pv;
  const auto per_delivered_kwh = [&](double storage_cost) {
    return r.discounted_delivered_kwh > 0
               ? (storage_cost + b.liquidated_damages_pv) / r.discounted_delivered_kwh
               : kInf;
  };
  b.lcos_per_kwh = per_delivered_kwh(r.present_value.storage_total());
  b.lcos_schmidt_per_kwh = per_delivered_kwh(r.storage_cost_schmidt());
  check_requirements(b, bid, profile, tender);
  return b;
}

}  // namespace

ChemistryProfile profile_retiring_at(const ChemistryProfile& profile, double capacity) {
  const double scale = (1.0 - capacity) / (1.0 - profile.eol_capacity_fraction);
  ChemistryProfile out = profile;
  std::vector<CycleLifePoint> points = profile.cycle_life.points();
  for (CycleLifePoint& p : points) p.cycles *= scale;
  out.cycle_life = CycleLifeCurve(points);
  out.calendar_life_years *= scale;
  if (out.partial_charge) out.partial_charge->damage_per_extra_day /= scale;
  out.eol_capacity_fraction = capacity;
  out.validate();
  return out;
}

double warranted_capacity(const WarrantyTerms& terms, double year) {
  if (terms.retention.empty()) return terms.capacity_floor;
  double y0 = 0, c0 = 1;
  for (const RetentionPoint& p : terms.retention) {
    if (year <= p.year) return c0 + (p.capacity - c0) * (year - y0) / (p.year - y0);
    y0 = p.year;
    c0 = p.capacity;
  }
  return c0;
}

std::vector<CapacityClaim> capacity_claims(const WarrantyTerms& terms, double warranty_end_years,
                                           double nameplate_kwh,
                                           const std::vector<double>& health_end) {
  std::vector<CapacityClaim> claims;
  double added_kwh = 0;
  for (std::size_t i = 0; i < health_end.size(); ++i) {
    const int year = static_cast<int>(i) + 1;
    if (!within(year, warranty_end_years)) break;
    CapacityClaim c;
    c.year = year;
    c.warranted_kwh = nameplate_kwh * warranted_capacity(terms, year);
    c.modelled_kwh = nameplate_kwh * health_end[i];
    c.shortfall_kwh = c.warranted_kwh - c.modelled_kwh;
    if (!(c.shortfall_kwh > 1e-9 * nameplate_kwh)) continue;
    if (terms.capacity_remedy == CapacityRemedy::TopUp) {
      c.top_up_kwh = std::max(0.0, c.shortfall_kwh - added_kwh);
      added_kwh += c.top_up_kwh;
    } else if (terms.capacity_remedy == CapacityRemedy::LiquidatedDamages) {
      c.liquidated_damages = terms.liquidated_damages_per_kwh * c.shortfall_kwh;
    }
    claims.push_back(c);
  }
  return claims;
}

WarrantyEnd warranty_end(const WarrantyTerms& terms,
                         const std::vector<double>& discharged_kwh_per_year, double nameplate_kwh) {
  WarrantyEnd end{terms.years, WarrantyEnd::Cause::Years};
  if (terms.throughput_mwh) {
    const double t = time_to_reach(*terms.throughput_mwh * 1000.0, discharged_kwh_per_year);
    if (t < end.years) end = {t, WarrantyEnd::Cause::Throughput};
  }
  if (terms.equivalent_full_cycles) {
    const double t =
        time_to_reach(*terms.equivalent_full_cycles * nameplate_kwh, discharged_kwh_per_year);
    if (t < end.years) end = {t, WarrantyEnd::Cause::Cycles};
  }
  return end;
}

TenderResult evaluate_tender(const TenderCase& tender) {
  TenderResult result;
  for (const Bid& bid : tender.bids) result.bids.push_back(evaluate_bid(bid, tender));
  double least_npc = kInf;
  for (const BidResult& b : result.bids) {
    if (b.compliant()) least_npc = std::min(least_npc, b.npc);
  }
  for (std::size_t i = 0; i < result.bids.size(); ++i) {
    BidResult& b = result.bids[i];
    if (!b.compliant()) continue;
    if (!(b.npc > 0)) {
      throw InvalidValue("tender.scoring",
                         "the price score (lowest NPC / bid NPC) needs positive NPCs; bid " +
                             b.label + " has an NPC of " + std::to_string(b.npc));
    }
    b.price_score = 100.0 * least_npc / b.npc;
    b.technical_score = 0;
    for (const auto& [criterion, weight] : tender.scoring.criteria) {
      b.technical_score += weight * tender.bids[i].technical_scores.at(criterion);
    }
    b.total_score = tender.scoring.price_weight * b.price_score + b.technical_score;
    result.order.push_back(i);
  }
  std::stable_sort(result.order.begin(), result.order.end(), [&](std::size_t a, std::size_t b) {
    return result.bids[a].total_score > result.bids[b].total_score;
  });
  for (std::size_t k = 0; k < result.order.size(); ++k) {
    result.bids[result.order[k]].rank = static_cast<int>(k + 1);
  }
  if (result.order.size() >= 2) {
    const BidResult& a = result.bids[result.order[0]];
    const BidResult& b = result.bids[result.order[1]];
    result.near_tie = a.total_score - b.total_score <= tender.scoring.near_tie_points ||
                      std::fabs(a.npc - b.npc) <= tender.scoring.near_tie_npc_share * a.npc;
  }
  return result;
}

}  // namespace stowage
