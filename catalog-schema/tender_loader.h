// SPDX-License-Identifier: MIT
// Loading a tender file (format: docs/tender.md, schemas: schemas/tender.schema.json and
// schemas/bid.schema.json) with the site it names and its bids, each with the chemistry
// profile its ageing comes from, into validated values.
//
// A bid's prices replace its profile's: the year-0 investment is capex + installation
// (capital_per_kwh = capex / nameplate of the offered bank, capital_per_string 0,
// installation_fixed = installation), the yearly service
// contract becomes the fixed O&M (annual_service / nameplate per kWh), a replacement the buyer
// pays costs replacement_share x (capex + installation) (no price decline: a bid's price is
// its own), and end_of_life_per_kwh is the bid's when it gives one. Rules across files,
// checked here: labels are unique (error at the later tender.bids[i]); the profile's currency
// equals the tender's (error at bid.profile); the offered DoD setpoint lies within the
// profile's dod range (error at bid.offer.dod_setpoint); every technical criterion of the
// scoring has a score in every bid and no bid scores a criterion the tender does not weigh
// (error at bid.technical_scores); the weights sum to 1 (error at tender.scoring); the
// retention curve's years rise and its capacities do not, none below the floor (error at
// bid.warranty.retention[i]); liquidated_damages_per_kwh is given exactly when the capacity
// remedy is liquidated_damages (error at bid.warranty); an availability guarantee needs the
// site's back-up price, which prices the duty of the hours out of service (error at
// bid.warranty.availability).
#pragma once

#include <map>
#include <optional>
#include <string>
#include <vector>

#include "catalog-schema/input_error.h"  // what the readers throw
#include "catalog-schema/variations_loader.h"
#include "model/chemistry_profile.h"
#include "model/economics.h"
#include "model/site.h"

namespace stowage {

// A point of the warranted capacity-retention curve: at the end of `year` the bank keeps at
// least `capacity` of its nameplate.
struct RetentionPoint {
  double year = 0;      // > 0, strictly increasing along the curve
  double capacity = 1;  // fraction of nameplate, non-increasing, >= the capacity floor
};

// What the supplier does when the bank's capacity falls below the retention curve within the
// warranty (docs/tender.md): nothing beyond the replacement at the floor, add modules up to the
// curve at its own cost, or pay liquidated damages per kWh short.
enum class CapacityRemedy { None, TopUp, LiquidatedDamages };

// Warranty terms: `years` or the warranted throughput or cycles, whichever comes first.
struct WarrantyTerms {
  double years = 0;                              // > 0
  std::optional<double> throughput_mwh;          // discharged at the terminals
  std::optional<double> equivalent_full_cycles;  // discharged Ah / rated Ah
  double capacity_floor = 0.7;                   // warranted capacity, fraction of nameplate
  std::vector<RetentionPoint> retention;         // empty: the floor throughout
  CapacityRemedy capacity_remedy = CapacityRemedy::None;
  double liquidated_damages_per_kwh = 0;  // > 0 with LiquidatedDamages, per kWh short a year-end
  std::optional<double> availability;     // guaranteed share of the time in service, (0, 1]
};

struct Bid {
  std::string label;
  std::string path;          // the bid file as opened
  std::string profile_path;  // the profile file as opened
  ChemistryProfile profile;  // with the bid's prices in costs (see above)
  int strings_parallel = 1;
  double dod_setpoint = 0.8;
  double capex = 0, installation = 0, annual_service = 0;
  WarrantyTerms warranty;
  std::map<std::string, double> technical_scores;  // criterion -> 0..100
};

struct TenderRequirements {
  std::optional<double> min_usable_kwh;  // at the end of every year
  std::optional<double> min_power_kw;
};

struct TenderScoring {
  double price_weight = 1;
  std::map<std::string, double> criteria;  // name -> weight; price_weight + sum = 1
  // The two best bids are called a near tie when their totals lie within near_tie_points or
  // their NPCs within near_tie_npc_share of the best's (our convention, the user's margins).
  double near_tie_points = 1.0;
  double near_tie_npc_share = 0.01;
};

struct TenderCase {
  std::string title;
  std::string path;
  std::string site_path;    // the site file as opened
  std::string hourly_path;  // the site's hourly CSV as opened
  SiteConditions site;
  Economics economics;
  TenderRequirements requirements;
  TenderScoring scoring;
  std::vector<Bid> bids;
  // tender.variations: what an uncertainty of the ranking draws (docs/tender.md,
  // "Variations"); paths are the tender's (parameter_paths.h); every entry has a
  // distribution (error at tender.variations[i].distribution). Empty when absent.
  std::vector<Variation> variations;
};

TenderCase load_tender_file(const std::string& path);

}  // namespace stowage
