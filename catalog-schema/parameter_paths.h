// SPDX-License-Identifier: MIT
// Parameter paths: the names of the numeric inputs a user may vary (in a sweep, a break-even
// search or a Monte Carlo run), spelt like the keys of the input files, each with its unit,
// its valid range and a setter that applies a value to a validated StudyCase and validates
// the result again. This file is the only place that maps a name to an input.
//
// Paths (profile paths exist once per profile of the case, <id> its profile id):
//   profiles.<id>.costs.capital_per_kwh ... end_of_life_per_kwh   the profile's prices
//   profiles.<id>.cell.coulombic_efficiency                        fraction
//   profiles.<id>.ageing.calendar_life_years                       years
//   profiles.<id>.ageing.cycle_life_scale        Scale: every cycles value x factor (1: as given)
//   profiles.<id>.temperature.charging_c.min     the coldest charging temperature, degC
//   site.backup.price_per_kwh, site.charging_price.per_kwh, site.unserved_penalty_per_kwh,
//   site.autonomy_days, site.charger_efficiency, site.inverter_efficiency
//   site.hourly.temp_c_offset                    Offset: degC added to every hour's temperature
//   site.hourly.load_kw_scale, site.hourly.source_kw_scale   Scale: every hour x factor
//   economics.real_discount_rate, economics.project_years (a whole number)
//   search.budget, search.max_strings_parallel (a whole number)
// An Offset or Scale acts on the case it is applied to: apply it once to a copy of the base
// case (its base value is 0 or 1). Values outside the range are refused with InvalidValue
// naming the path; so is a value the re-validation refuses (for example a charging minimum
// above the charging maximum), with the path of the rule it breaks.
//
// A tender (tender_loader.h) has its own set, the same entries addressed per bid
// (docs/tender.md, "Variations"):
//   bids.<label>.ageing.calendar_life_years, bids.<label>.ageing.cycle_life_scale,
//   bids.<label>.cell.coulombic_efficiency, bids.<label>.temperature.charging_c.min,
//   bids.<label>.costs.variable_om_per_mwh, bids.<label>.costs.end_of_life_per_kwh
//     the chemistry of the bid's profile and the two costs its price lines may leave open
//   site.* and economics.*                       as in a study
// The bid's own prices (capex, installation, annual service, replacement share: the
// profile's capital, installation, fixed O&M and replacement entries) are the offer, fixed by
// the bid, and are not tender paths; nor are price_decline_per_year (0 for a bid) and
// design_space.* (a tender has no search).
#pragma once

#include <string>
#include <string_view>
#include <vector>

#include "catalog-schema/study_case.h"
#include "catalog-schema/tender_loader.h"

namespace stowage {

enum class ParameterEffect { Set, Offset, Scale };

struct ParameterInfo {
  std::string path;
  std::string unit;         // "EUR/kWh", "fraction", "degC", "years", "factor", ...
  double min = 0, max = 0;  // valid range
  bool min_inclusive = true, max_inclusive = true;
  bool whole_number = false;
  ParameterEffect effect = ParameterEffect::Set;
  double base = 0;      // the value in the case (Set), 0 (Offset) or 1 (Scale)
  bool present = true;  // false: an optional input the case does not set (no back-up, say)
  // True when the input only prices what a design does: changing it leaves every hour of the
  // dispatch, the ageing and the replacement timing as they were (model/repricing.h), so a
  // held design can be re-priced instead of simulated again. These are the profile prices
  // (profiles.<id>.costs.*), economics.real_discount_rate, site.backup.price_per_kwh (the
  // dispatch only asks whether there is back-up, never its price), site.charging_price.per_kwh
  // (the dispatch charges whenever there is surplus, whatever it costs; the path exists only
  // for a flat price, so the year's cost is that price x the source energy drawn) and
  // site.unserved_penalty_per_kwh. Not: economics.project_years (the number of years
  // simulated), nor any efficiency, weather, load, autonomy or chemistry input.
  bool prices_only = false;
};

// Every path of the case, in a stable order.
std::vector<ParameterInfo> parameter_paths(const StudyCase& study);
// The path's description in this case; throws InvalidValue(path, ...) for an unknown path,
// with a suggestion for a near miss.
ParameterInfo find_parameter(const StudyCase& study, std::string_view path);
// Sets the input named by `path` to `value` (Set), adds it (Offset) or multiplies by it
// (Scale), then validates the changed part again. Throws InvalidValue naming the path;
// the case is left unchanged when it throws.
void apply_parameter(StudyCase& study, std::string_view path, double value);

// The same for a tender's paths (above): every path in a stable order (bids in tender order,
// then site and economics), one path's description, and the setter, which re-validates the
// changed bid profile, site or economics and names the tender path in its InvalidValue.
std::vector<ParameterInfo> parameter_paths(const TenderCase& tender);
ParameterInfo find_parameter(const TenderCase& tender, std::string_view path);
void apply_parameter(TenderCase& tender, std::string_view path, double value);

}  // namespace stowage
