// SPDX-License-Identifier: MIT
// Tender evaluation: every bid on the same duty (the tender's site) through the exact
// simulator, its ageing from its chemistry profile, its warranty applied as a limit and a
// cash-flow rule rather than as extra ageing, checked against the tender's requirements, and
// scored. docs/tender.md gives the rules; in brief:
//
// Warranty end (whichever comes first): T = min(years, t_E, t_C), where t_E is when the
//   cumulative energy discharged at the terminals reaches throughput_mwh, and t_C when the
//   cumulative equivalent full cycles (discharged kWh / nameplate kWh, our convention) reach
//   equivalent_full_cycles, both interpolated linearly within the year they are reached; a cap
//   that is not given or not reached within the evaluation does not end the warranty.
// Supplier-paid replacement: a replacement at the end of year y with y <= T, of a bank whose
//   chemistry's end of life (eol_capacity_fraction) is at or below the warranted capacity
//   floor, is the supplier's: it and the end-of-life flow of the bank removed leave the buyer's
//   cash flows. Replacements after T, or of a bank retired above the floor, the buyer pays.
//   The warranty covers the installation: throughput counts from year 1 over all banks.
// Modelled life: the years until the chemistry model first retires the bank (interpolated
//   from its damage when it outlives the evaluation). A warranty that promises more (T above the
//   modelled life) is a claim to question in clarification: the model expects a claim on it.
// Compliance: usable energy nameplate x DoD setpoint x health at the end of every year (before
//   a replacement at that year's end; health from the chemistry's damage, at the reference
//   temperature) >= min_usable_kwh, and strings x string discharge power >= min_power_kw. A bid
//   that misses either is listed with the shortfall, not resized, and is not scored.
// Score: price score 100 x (least NPC of the compliant bids) / (the bid's NPC), needing
//   positive NPCs; total = price_weight x price score + sum of weight x technical score.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "catalog-schema/tender_loader.h"
#include "model/lifecycle.h"

namespace stowage {

struct WarrantyEnd {
  enum class Cause { Years, Throughput, Cycles };
  double years = 0;  // T, from the start of operation
  Cause cause = Cause::Years;
};

// T for yearly discharged terminal energy (index 0 = year 1) of a bank with this nameplate.
WarrantyEnd warranty_end(const WarrantyTerms& terms,
                         const std::vector<double>& discharged_kwh_per_year, double nameplate_kwh);

struct Shortfall {
  enum class Kind { UsableEnergy, Power };
  Kind kind = Kind::UsableEnergy;
  double required = 0, offered = 0;  // kWh or kW
  int year = 0;                      // UsableEnergy: the year-end of the least usable energy
};

struct BidResult {
  std::string label;
  std::string family;
  DesignResult design;              // the buyer's cash flows: supplier-paid flows removed
  double npc_without_warranty = 0;  // the same bid if the buyer paid every replacement
  WarrantyEnd warranty;
  std::vector<int> supplier_paid_years, buyer_paid_years;
  double modelled_life_years = 0;  // until the model first retires the bank
  bool warranty_exceeds_model = false;
  double least_usable_kwh = 0;  // over the year-ends
  double power_kw = 0;
  std::vector<Shortfall> shortfalls;  // empty: compliant
  bool compliant() const { return shortfalls.empty(); }
  double price_score = 0, technical_score = 0, total_score = 0;  // compliant bids only
  int rank = 0;                                                  // 1 = best; 0: not ranked
};

struct TenderResult {
  std::vector<BidResult> bids;     // in the tender's order
  std::vector<std::size_t> order;  // compliant bids by total score, best first
  bool near_tie = false;           // the two best totals within 1 point, or their NPCs within 1 %
};

// Throws InvalidValue("tender.scoring", ...) when a compliant bid's NPC is not positive.
TenderResult evaluate_tender(const TenderCase& tender);

}  // namespace stowage
