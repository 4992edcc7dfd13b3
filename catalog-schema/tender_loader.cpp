// SPDX-License-Identifier: MIT
#include "catalog-schema/tender_loader.h"

#include <cmath>
#include <fstream>

#include "catalog-schema/decimal_text.h"
#include "catalog-schema/input_file.h"
#include "catalog-schema/input_limits.h"
#include "catalog-schema/profile_loader.h"
#include "catalog-schema/referenced_input.h"
#include "catalog-schema/schema_validator.h"
#include "catalog-schema/site_loader.h"
#include "catalog-schema/yaml_document.h"
#include "model/bank.h"
#include "model/invalid_value.h"

namespace stowage {

namespace {

double number(const YAML::Node& node) { return *scalar_number(node); }

std::string indexed(const std::string& base, std::size_t i) {
  return base + "[" + std::to_string(i) + "]";
}

// The retention curve: years rising, capacities not rising, none below the floor.
void read_retention(const YamlDocument& doc, const YAML::Node& w, WarrantyTerms& terms) {
  const YAML::Node list = w["retention"];
  if (!list) return;
  for (std::size_t i = 0; i < list.size(); ++i) {
    const RetentionPoint point{number(list[i]["year"]), number(list[i]["capacity"])};
    const std::string field = indexed("bid.warranty.retention", i);
    if (!terms.retention.empty() && !(point.year > terms.retention.back().year)) {
      throw doc.error_at(list[i]["year"], field + ".year",
                         "the years of the retention curve must rise, found " +
                             number_text(point.year) + " after " +
                             number_text(terms.retention.back().year));
    }
    if (!terms.retention.empty() && point.capacity > terms.retention.back().capacity) {
      throw doc.error_at(list[i]["capacity"], field + ".capacity",
                         "a warranted capacity cannot rise with age, found " +
                             number_text(point.capacity) + " after " +
                             number_text(terms.retention.back().capacity));
    }
    if (point.capacity < terms.capacity_floor) {
      throw doc.error_at(list[i]["capacity"], field + ".capacity",
                         "lies below the warranty's capacity_floor " +
                             number_text(terms.capacity_floor) + ", found " +
                             number_text(point.capacity));
    }
    terms.retention.push_back(point);
  }
}

void read_capacity_remedy(const YamlDocument& doc, const YAML::Node& w, WarrantyTerms& terms) {
  if (const YAML::Node remedy = w["capacity_remedy"]) {
    terms.capacity_remedy =
        remedy.Scalar() == "top_up" ? CapacityRemedy::TopUp : CapacityRemedy::LiquidatedDamages;
  }
  const bool damages = terms.capacity_remedy == CapacityRemedy::LiquidatedDamages;
  if (damages != static_cast<bool>(w["liquidated_damages_per_kwh"])) {
    throw doc.error_at(w, "bid.warranty",
                       damages ? "capacity_remedy liquidated_damages needs "
                                 "liquidated_damages_per_kwh"
                               : "liquidated_damages_per_kwh is given but capacity_remedy is "
                                 "not liquidated_damages");
  }
  if (damages) terms.liquidated_damages_per_kwh = number(w["liquidated_damages_per_kwh"]);
}

Bid read_bid(std::istream& in, const std::string& path, const TenderCase& tender) {
  const YamlDocument doc = parse_yaml(in, path);
  SchemaValidator::embedded("bid").enforce(doc);
  const YAML::Node b = doc.root()["bid"];
  Bid bid;
  bid.path = path;
  bid.label = b["label"].Scalar();
  bid.profile_path = resolve_relative(parent_directory(path), b["profile"].Scalar());
  std::ifstream profile_in = open_referenced(doc, b["profile"], "bid.profile", bid.profile_path,
                                             "profile file", kMaxYamlFileBytes);
  LoadedProfile loaded = load_profile_details(profile_in, bid.profile_path);
  if (loaded.currency != tender.economics.currency) {
    throw doc.error_at(b["profile"], "bid.profile",
                       "the profile's prices are in " + loaded.currency + ", the tender's in " +
                           tender.economics.currency +
                           "; the bid's own prices replace the profile's, but both must be in "
                           "one currency");
  }
  bid.profile = std::move(loaded.profile);
  bid.strings_parallel = static_cast<int>(number(b["offer"]["strings_parallel"]));  // schema
  bid.dod_setpoint = number(b["offer"]["dod_setpoint"]);
  const DodRange& range = bid.profile.dod;
  if (bid.dod_setpoint < range.min || bid.dod_setpoint > range.max) {
    throw doc.error_at(b["offer"]["dod_setpoint"], "bid.offer.dod_setpoint",
                       "must lie within the profile's dod range [" + number_text(range.min) + ", " +
                           number_text(range.max) + "], found " + number_text(bid.dod_setpoint));
  }
  const YAML::Node prices = b["prices"];
  bid.capex = number(prices["capex"]);
  if (prices["installation"]) bid.installation = number(prices["installation"]);
  if (prices["annual_service"]) bid.annual_service = number(prices["annual_service"]);
  ProfileCosts& costs = bid.profile.costs;
  const double nameplate =
      bank_geometry(bid.profile, tender.site.bus_voltage_v, bid.strings_parallel).nameplate_kwh;
  costs.capital_per_kwh = bid.capex / nameplate;
  costs.capital_per_string = 0;
  costs.installation_fixed = bid.installation;
  costs.fixed_om_per_kwh_year = bid.annual_service / nameplate;
  costs.replacement_share = prices["replacement_share"] ? number(prices["replacement_share"]) : 1;
  costs.price_decline_per_year = 0;
  if (prices["end_of_life_per_kwh"]) {
    costs.end_of_life_per_kwh = number(prices["end_of_life_per_kwh"]);
    costs.replacement_end_of_life_per_kwh.reset();
  }
  const YAML::Node w = b["warranty"];
  bid.warranty.years = number(w["years"]);
  if (w["throughput_mwh"]) bid.warranty.throughput_mwh = number(w["throughput_mwh"]);
  if (w["equivalent_full_cycles"]) {
    bid.warranty.equivalent_full_cycles = number(w["equivalent_full_cycles"]);
  }
  bid.warranty.capacity_floor = number(w["capacity_floor"]);
  read_retention(doc, w, bid.warranty);
  read_capacity_remedy(doc, w, bid.warranty);
  if (w["availability"]) {
    bid.warranty.availability = number(w["availability"]);
    if (!tender.site.backup_price_per_kwh) {
      throw doc.error_at(w["availability"], "bid.warranty.availability",
                         "an availability guarantee is evaluated by buying the duty of the hours "
                         "out of service as back-up energy, but the tender's site gives no "
                         "back-up price");
    }
  }
  if (b["technical_scores"]) {
    for (const auto& item : b["technical_scores"]) {
      bid.technical_scores[item.first.Scalar()] = number(item.second);
    }
  }
  for (const auto& [criterion, weight] : tender.scoring.criteria) {
    (void)weight;
    if (!bid.technical_scores.count(criterion)) {
      throw doc.error_at(b["technical_scores"] ? b["technical_scores"] : b, "bid.technical_scores",
                         "gives no score for the tender's criterion '" + criterion + "'");
    }
  }
  for (const auto& [criterion, score] : bid.technical_scores) {
    (void)score;
    if (!tender.scoring.criteria.count(criterion)) {
      throw doc.error_at(b["technical_scores"][criterion], "bid.technical_scores." + criterion,
                         "the tender's scoring weighs no criterion of this name");
    }
  }
  return bid;
}

}  // namespace

TenderCase load_tender_file(const std::string& path) {
  std::ifstream in = open_input_or_throw(path, "tender", kMaxYamlFileBytes);
  const YamlDocument doc = parse_yaml(in, path);
  SchemaValidator::embedded("tender").enforce(doc);
  const YAML::Node t = doc.root()["tender"];
  const std::string base = parent_directory(path);
  TenderCase tender;
  tender.path = path;
  tender.title = t["title"].Scalar();
  tender.economics = read_economics(doc, t["economics"], "tender.economics");
  {
    const std::string site_path = resolve_relative(base, t["site"].Scalar());
    std::ifstream site_in =
        open_referenced(doc, t["site"], "tender.site", site_path, "site file", kMaxYamlFileBytes);
    LoadedSite site = load_site_details(site_in, site_path, parent_directory(site_path));
    tender.site = std::move(site.site);
    tender.site_path = site_path;
    tender.hourly_path = site.hourly_path;
  }
  if (const YAML::Node r = t["requirements"]) {
    if (r["min_usable_kwh"]) tender.requirements.min_usable_kwh = number(r["min_usable_kwh"]);
    if (r["min_power_kw"]) tender.requirements.min_power_kw = number(r["min_power_kw"]);
  }
  if (const YAML::Node s = t["scoring"]) {
    tender.scoring.price_weight = number(s["price_weight"]);
    if (s["near_tie_points"]) tender.scoring.near_tie_points = number(s["near_tie_points"]);
    if (s["near_tie_npc_share"]) {
      tender.scoring.near_tie_npc_share = number(s["near_tie_npc_share"]);
    }
    double sum = tender.scoring.price_weight;
    if (s["criteria"]) {
      for (const auto& item : s["criteria"]) {
        tender.scoring.criteria[item.first.Scalar()] = number(item.second);
        sum += number(item.second);
      }
    }
    if (std::fabs(sum - 1.0) > 1e-9) {
      throw doc.error_at(
          s, "tender.scoring",
          "the price weight and the criteria weights must sum to 1, found " + number_text(sum));
    }
  }
  const YAML::Node list = t["bids"];
  for (std::size_t i = 0; i < list.size(); ++i) {
    const std::string bid_path = resolve_relative(base, list[i].Scalar());
    std::ifstream bid_in = open_referenced(doc, list[i], indexed("tender.bids", i), bid_path,
                                           "bid file", kMaxYamlFileBytes);
    Bid bid = read_bid(bid_in, bid_path, tender);
    for (const Bid& earlier : tender.bids) {
      if (earlier.label == bid.label) {
        throw doc.error_at(list[i], indexed("tender.bids", i),
                           "bid label '" + bid.label + "' is also the label of " + earlier.path);
      }
    }
    tender.bids.push_back(std::move(bid));
  }
  tender.variations = read_tender_variations(doc, tender);
  for (std::size_t i = 0; i < tender.variations.size(); ++i) {
    if (!tender.variations[i].distribution) {
      // A tender only samples its variations (there is no sweep of a tender), so an entry
      // without a distribution would silently do nothing.
      throw doc.error_at(t["variations"][i], indexed("tender.variations", i) + ".distribution",
                         "is required in a tender: its variations are drawn to see how sure "
                         "the ranking is, and an entry without a distribution is never drawn");
    }
  }
  return tender;
}

}  // namespace stowage
