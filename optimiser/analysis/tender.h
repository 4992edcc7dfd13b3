// SPDX-License-Identifier: MIT
// Tender evaluation: every bid on the same duty (the tender's site) through the exact
// simulator, its ageing from its chemistry profile, its warranty applied as a limit and a
// cash-flow rule rather than as extra ageing, checked against the tender's requirements, and
// scored. docs/tender.md gives the rules; in brief:
//
// Retirement at the warranted floor: the chemistry profile's ageing is re-expressed at
//   end of life = capacity_floor f. Fade is linear in Miner damage (model/ageing.h), so the
//   profile's damage D to its own end of life e reaches f at D = (1 - f) / (1 - e); with cycle
//   lives and calendar life scaled by s = (1 - f) / (1 - e) and partial-charge damage by 1 / s
//   the bank's health year by year is unchanged and the simulator retires it at f. No ageing is
//   added for the warranty.
// Warranty end (whichever comes first): T = min(years, t_E, t_C), where t_E is when the
//   cumulative energy discharged at the terminals reaches throughput_mwh, and t_C when the
//   cumulative equivalent full cycles (discharged kWh / nameplate kWh, our convention) reach
//   equivalent_full_cycles, both interpolated linearly within the year they are reached; a cap
//   that is not given or not reached within the evaluation does not end the warranty.
// Supplier-paid replacement: a replacement at the end of year y <= T of a bank worn to the
//   floor (damage 1) is the supplier's: it and the end-of-life flow of the bank removed leave
//   the buyer's cash flows. Replacements after T, or for age (max_service_years), the buyer
//   pays. The warranty covers the installation: throughput counts from year 1 over all banks.
// Retention curve: warranted capacity r(t) linear from r(0) = 1 through the table, the last
//   value after it; the capacity floor throughout when there is no table. At each year-end
//   y <= T the shortfall is S_y = nameplate x max(0, r(y) - h_y), h_y the modelled health of
//   the bank in service before a replacement at that year-end. Top-up: the supplier adds
//   max(0, S_y - modules added so far) kWh (modules added are taken to hold their nameplate
//   within the warranty; the dispatch still runs on the modelled health, so the buyer's energy
//   cost is not lowered by a top-up: a conservative simplification), and usable energy counts
//   max(h_y, r(y)) until T. Liquidated damages: the supplier pays rate x S_y at each year-end
//   y <= T, a credit in the buyer's cash flows, discounted at the end of year y.
// Availability guarantee A: the bank is counted out of service a share 1 - A of every year,
//   spread over the year: that share of the energy it delivers is bought at the back-up price,
//   and that share of its charging energy and variable O&M is saved.
// Modelled life: the years until the chemistry model first retires the bank (interpolated
//   from its damage when it outlives the evaluation). A warranty that promises more (T above the
//   modelled life) is a claim to question in clarification, and so is a retention curve above
//   the modelled health at a year-end within the warranty.
// Compliance: usable energy nameplate x DoD setpoint x health at the end of every year (before
//   a replacement at that year's end; health from the chemistry's damage, at the reference
//   temperature) >= min_usable_kwh, and strings x string discharge power >= min_power_kw. A bid
//   that misses either is listed with the shortfall, not resized, and is not scored.
// Score: price score 100 x (least NPC of the compliant bids) / (the bid's NPC), needing
//   positive NPCs; total = price_weight x price score + sum of weight x technical score. The
//   two best totals within near_tie_points, or their NPCs within near_tie_npc_share of the
//   best's, are a near tie.
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

// The profile re-expressed so that it reaches end of life at `capacity` (see above).
ChemistryProfile profile_retiring_at(const ChemistryProfile& profile, double capacity);

// r(t) of the warranty's retention curve, fraction of nameplate.
double warranted_capacity(const WarrantyTerms& terms, double year);

// One year-end within the warranty below the retention curve.
struct CapacityClaim {
  int year = 0;
  double warranted_kwh = 0, modelled_kwh = 0;  // nameplate x r(y), nameplate x h_y
  double shortfall_kwh = 0;                    // S_y > 0
  double top_up_kwh = 0;                       // modules the supplier adds (TopUp)
  double liquidated_damages = 0;               // currency, undiscounted (LiquidatedDamages)
};

// The year-ends y = 1, 2, ... <= warranty_end_years at which the modelled health
// (health_end[y - 1]) lies below the retention curve, with the remedy the terms give.
std::vector<CapacityClaim> capacity_claims(const WarrantyTerms& terms, double warranty_end_years,
                                           double nameplate_kwh,
                                           const std::vector<double>& health_end);

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
  DesignResult design;                  // the buyer's cash flows: supplier-paid flows removed
  double npc_without_warranty = 0;      // npc without the supplier's warranty payments
  double supplier_replacements_pv = 0;  // replacements and end of life the supplier pays
  WarrantyEnd warranty;
  std::vector<int> supplier_paid_years, buyer_paid_years;
  double modelled_life_years = 0;  // until the model first retires the bank, at the floor
  bool warranty_exceeds_model = false;
  std::vector<CapacityClaim> capacity_claims;  // year-ends below the retention curve
  double top_up_kwh = 0;                       // sum of the supplier's top-ups
  double liquidated_damages_pv = 0;            // <= 0: a credit to the buyer
  double availability_pv = 0;                  // the buyer's cost of the hours out of service
  double npc = 0;                              // the buyer's: design.npc + liquidated_damages_pv
  double lcos_per_kwh = 0;  // (storage costs + liquidated damages) / delivered energy
  // The same under Schmidt et al.'s conventions (model/lifecycle.h): (storage_cost_schmidt()
  // + liquidated damages) / delivered energy, no residual value.
  double lcos_schmidt_per_kwh = 0;
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
  bool near_tie = false;           // the two best within the tender's near-tie margins
};

// Throws InvalidValue("tender.scoring", ...) when a compliant bid's NPC is not positive.
TenderResult evaluate_tender(const TenderCase& tender);

}  // namespace stowage
