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
  if (!r.replacement_years.empty()) return r.replacement_years.front();
  const YearRecord& last = r.years.back();
  return last.damage_end > 0 ? last.year / last.damage_end : kInf;
}

void apply_warranty(BidResult& b, const Bid& bid) {
  DesignResult& r = b.design;
  CostBreakdown& pv = r.present_value;
  const bool retires_at_floor =
      bid.profile.eol_capacity_fraction <= bid.warranty.capacity_floor + 1e-12;
  for (YearRecord& rec : r.years) {
    if (!rec.replaced_at_end) continue;
    const bool covered = retires_at_floor && rec.year <= b.warranty.years + 1e-9;
    (covered ? b.supplier_paid_years : b.buyer_paid_years).push_back(rec.year);
    if (!covered) continue;
    pv.replacements -= rec.replacement * rec.discount_factor;
    pv.end_of_life -= rec.end_of_life * rec.discount_factor;
    rec.replacement = 0;
    rec.end_of_life = 0;
  }
  r.settle_totals();
}

void check_requirements(BidResult& b, const Bid& bid, const TenderCase& tender) {
  const DesignResult& r = b.design;
  b.least_usable_kwh = kInf;
  int worst_year = 0;
  for (const YearRecord& rec : r.years) {
    const double health = health_from_damage(bid.profile, std::min(rec.damage_end, 1.0));
    const double usable = r.bank.nameplate_kwh * bid.dod_setpoint * health;
    if (usable < b.least_usable_kwh) {
      b.least_usable_kwh = usable;
      worst_year = rec.year;
    }
  }
  b.power_kw =
      string_discharge_power_kw(bid.profile, tender.site.bus_voltage_v) * bid.strings_parallel;
  const TenderRequirements& req = tender.requirements;
  if (req.min_usable_kwh && b.least_usable_kwh < *req.min_usable_kwh) {
    b.shortfalls.push_back(
        {Shortfall::Kind::UsableEnergy, *req.min_usable_kwh, b.least_usable_kwh, worst_year});
  }
  if (req.min_power_kw && b.power_kw < *req.min_power_kw) {
    b.shortfalls.push_back({Shortfall::Kind::Power, *req.min_power_kw, b.power_kw, 0});
  }
}

}  // namespace

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
  for (const Bid& bid : tender.bids) {
    BidResult b;
    b.label = bid.label;
    b.family = bid.profile.family;
    LifecycleEvaluator evaluator(bid.profile, tender.site, tender.economics);
    b.design = evaluator.evaluate(bid.dod_setpoint, bid.strings_parallel);
    b.npc_without_warranty = b.design.npc;
    std::vector<double> discharged;
    for (const YearRecord& rec : b.design.years) {
      discharged.push_back(rec.dispatch.discharged_terminal_kwh);
    }
    b.warranty = warranty_end(bid.warranty, discharged, b.design.bank.nameplate_kwh);
    b.modelled_life_years = modelled_life(b.design);
    b.warranty_exceeds_model = b.warranty.years > b.modelled_life_years + 1e-9;
    apply_warranty(b, bid);
    check_requirements(b, bid, tender);
    result.bids.push_back(std::move(b));
  }
  double least_npc = kInf;
  for (const BidResult& b : result.bids) {
    if (b.compliant()) least_npc = std::min(least_npc, b.design.npc);
  }
  for (std::size_t i = 0; i < result.bids.size(); ++i) {
    BidResult& b = result.bids[i];
    if (!b.compliant()) continue;
    if (!(b.design.npc > 0)) {
      throw InvalidValue("tender.scoring",
                         "the price score (lowest NPC / bid NPC) needs positive NPCs; bid " +
                             b.label + " has an NPC of " + std::to_string(b.design.npc));
    }
    b.price_score = 100.0 * least_npc / b.design.npc;
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
    result.near_tie = a.total_score - b.total_score < 1.0 ||
                      std::fabs(a.design.npc - b.design.npc) < 0.01 * a.design.npc;
  }
  return result;
}

}  // namespace stowage
