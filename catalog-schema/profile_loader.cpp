// SPDX-License-Identifier: MIT
#include "catalog-schema/profile_loader.h"

#include <algorithm>
#include <iostream>
#include <numeric>
#include <sstream>
#include <utility>
#include <vector>

#include "catalog-schema/decimal_text.h"
#include "catalog-schema/input_error.h"
#include "catalog-schema/input_file.h"
#include "catalog-schema/input_limits.h"
#include "catalog-schema/schema_validator.h"
#include "catalog-schema/yaml_document.h"
#include "model/invalid_value.h"

namespace stowage {
namespace {

WarningSink& warning_sink() {
  static WarningSink sink;
  return sink;
}

void emit_warning(const std::string& text) {
  if (warning_sink())
    warning_sink()(text);
  else
    std::cerr << "warning: " << text << "\n";
}

// Tabulated cycle lives are rounded; a throughput dip smaller than this is not worth a warning.
constexpr double kThroughputDipTolerance = 0.01;

// Warns at each point whose lifetime throughput N x D is lower than that of a deeper point.
void warn_shallow_throughput(const YamlDocument& doc, const YAML::Node& list,
                             const std::vector<CycleLifePoint>& points,
                             std::vector<std::string>& warnings) {
  const std::string path = "profile.ageing.cycle_life";
  for (std::size_t i = 0; i < points.size(); ++i) {
    // The deepest point deeper than i with the largest throughput.
    std::size_t best = i;
    for (std::size_t j = 0; j < points.size(); ++j) {
      if (points[j].dod > points[i].dod &&
          points[j].dod * points[j].cycles > points[best].dod * points[best].cycles)
        best = j;
    }
    const double shallow = points[i].dod * points[i].cycles;
    const double deep = points[best].dod * points[best].cycles;
    if (best == i || !(shallow < deep * (1.0 - kThroughputDipTolerance))) continue;
    const InputError at = doc.error_at(
        list[i]["cycles"], join_index(path, i) + ".cycles",
        "lifetime throughput falls toward shallow DoD: " + number_text(points[i].cycles) +
            " cycles at DoD " + number_text(points[i].dod) + " give " + number_text(shallow) +
            " full cycles (cycles x DoD), fewer than the " + number_text(deep) + " at DoD " +
            number_text(points[best].dod) + ". Shallow cycles would wear the bank more per kWh " +
            "than deep ones, which published cycle-life data do not show; the model would then " +
            "favour deep DoD setpoints and overstate the wear of lightly cycled banks. Check the " +
            "curve against its source");
    warnings.push_back(at.what());
  }
}

// Reading after the schema has checked types: a present key is of the declared type.
double number(const YAML::Node& node) { return *scalar_number(node); }

template <typename T>
void read_optional(const YAML::Node& map, const char* key, T& target) {
  if (map[key]) target = number(map[key]);
}

SourcePosition position_of(const YamlDocument& doc, const std::string& field) {
  const InputError located = doc.error_at_path(field, "");
  return SourcePosition{located.file(), located.line(), located.column()};
}

void check_cell(const YamlDocument& doc, const YAML::Node& cell) {
  const double charge_v = number(cell["mean_charge_v"]);
  const double discharge_v = number(cell["mean_discharge_v"]);
  if (!(charge_v > discharge_v)) {
    throw doc.error_at(cell["mean_charge_v"], "profile.cell.mean_charge_v",
                       "must be above mean_discharge_v (" + number_text(discharge_v) +
                           " V): charging takes a higher voltage than discharging");
  }
}

void check_dod(const YamlDocument& doc, const YAML::Node& dod) {
  const double lo = number(dod["min"]), hi = number(dod["max"]), setpoint = number(dod["default"]);
  if (lo > hi) {
    throw doc.error_at(
        dod["min"], "profile.dod.min",
        "must not exceed dod.max (" + number_text(hi) + "), found " + number_text(lo));
  }
  if (setpoint < lo || setpoint > hi) {
    throw doc.error_at(dod["default"], "profile.dod.default",
                       "must lie within [dod.min, dod.max] = [" + number_text(lo) + ", " +
                           number_text(hi) + "], found " + number_text(setpoint));
  }
}

// Points in file order; the rule is on the points sorted by DoD, the message names the point
// as written.
std::vector<CycleLifePoint> read_cycle_life(const YamlDocument& doc, const YAML::Node& list) {
  const std::string path = "profile.ageing.cycle_life";
  std::vector<CycleLifePoint> points;
  for (std::size_t i = 0; i < list.size(); ++i) {
    points.push_back({number(list[i]["dod"]), number(list[i]["cycles"])});
  }
  std::vector<std::size_t> order(points.size());
  std::iota(order.begin(), order.end(), 0);
  std::stable_sort(order.begin(), order.end(),
                   [&](std::size_t a, std::size_t b) { return points[a].dod < points[b].dod; });
  for (std::size_t k = 1; k < order.size(); ++k) {
    const std::size_t lo = order[k - 1], hi = order[k];
    // Report at whichever of the two points comes later in the file.
    const std::size_t at = std::max(lo, hi), other = std::min(lo, hi);
    if (points[hi].dod == points[lo].dod) {
      throw doc.error_at(list[at]["dod"], join_index(path, at) + ".dod",
                         "DoD " + number_text(points[at].dod) + " appears twice (also in entry " +
                             std::to_string(other) + "); each point needs its own DoD");
    }
    if (!(points[hi].cycles < points[lo].cycles)) {
      const bool deeper = at == hi;  // is the reported point the deeper one of the pair?
      throw doc.error_at(list[at]["cycles"], join_index(path, at) + ".cycles",
                         "cycle life must fall as DoD grows: " + number_text(points[at].cycles) +
                             " cycles at DoD " + number_text(points[at].dod) +
                             (deeper ? " is not fewer than " : " is not more than ") +
                             number_text(points[other].cycles) + " cycles at the " +
                             (deeper ? "shallower" : "deeper") + " DoD " +
                             number_text(points[other].dod) + " (entry " + std::to_string(other) +
                             ")");
    }
  }
  return points;
}

TemperatureSpec read_temperature(const YamlDocument& doc, const YAML::Node& t) {
  const std::string path = "profile.temperature";
  TemperatureSpec spec;
  spec.reference_temp_c = number(t["reference_c"]);
  const YAML::Node rows = t["capacity_factor"];
  for (std::size_t i = 0; i < rows.size(); ++i) {
    const CapacityFactorPoint row{number(rows[i]["temp_c"]), number(rows[i]["factor"])};
    if (!spec.capacity_factor.empty() && !(row.temp_c > spec.capacity_factor.back().temp_c)) {
      throw doc.error_at(rows[i]["temp_c"], join_index(path + ".capacity_factor", i) + ".temp_c",
                         "temperatures must increase from row to row: " + number_text(row.temp_c) +
                             " follows " + number_text(spec.capacity_factor.back().temp_c));
    }
    spec.capacity_factor.push_back(row);
  }
  // The schema's oneOf guarantees exactly one of the two laws.
  if (t["life_halving_interval_k"]) {
    spec.law = AgeingLaw::Halving;
    spec.halving_interval_k = number(t["life_halving_interval_k"]);
  } else {
    spec.law = AgeingLaw::Arrhenius;
    spec.activation_energy_j_per_mol = number(t["activation_energy_j_per_mol"]);
  }
  if (const YAML::Node cal = t["calendar_law"]) {
    if (cal["life_halving_interval_k"]) {
      spec.calendar_law = AgeingLaw::Halving;
      spec.calendar_halving_interval_k = number(cal["life_halving_interval_k"]);
    } else {
      spec.calendar_law = AgeingLaw::Arrhenius;
      spec.calendar_activation_energy_j_per_mol = number(cal["activation_energy_j_per_mol"]);
    }
  }
  for (const char* range : {"operating_c", "charging_c"}) {
    const double lo = number(t[range]["min"]), hi = number(t[range]["max"]);
    if (!(lo < hi)) {
      throw doc.error_at(t[range]["min"], path + "." + range + ".min",
                         "must be below " + std::string(range) + ".max (" + number_text(hi) +
                             "), found " + number_text(lo));
    }
  }
  spec.operating_min_c = number(t["operating_c"]["min"]);
  spec.operating_max_c = number(t["operating_c"]["max"]);
  spec.charge_min_c = number(t["charging_c"]["min"]);
  spec.charge_max_c = number(t["charging_c"]["max"]);
  return spec;
}

std::map<std::string, ValueConfidence> read_confidence(const YamlDocument& doc,
                                                       const YAML::Node& map) {
  std::map<std::string, ValueConfidence> labels;
  if (!map) return labels;
  for (auto it = map.begin(); it != map.end(); ++it) {
    const std::string key = it->first.Scalar();
    bool exact = false;
    doc.locate("profile." + key, &exact);
    if (!exact || key == "sources" || key.compare(0, 8, "sources.") == 0 || key == "confidence" ||
        key.compare(0, 11, "confidence.") == 0) {
      throw doc.error_at(it->first, "profile.confidence." + key,
                         "names no field of this profile; keys are field paths such as "
                         "cell.nominal_v or ageing.cycle_life");
    }
    // The schema's enum guarantees one of the three words.
    const std::string word = it->second.Scalar();
    labels.emplace(key, word == "sourced"       ? ValueConfidence::Sourced
                        : word == "from-memory" ? ValueConfidence::FromMemory
                                                : ValueConfidence::Illustrative);
  }
  return labels;
}

std::map<std::string, std::string> read_sources(const YamlDocument& doc, const YAML::Node& map) {
  std::map<std::string, std::string> sources;
  if (!map) return sources;
  for (auto it = map.begin(); it != map.end(); ++it) {
    const std::string key = it->first.Scalar();
    bool exact = false;
    doc.locate("profile." + key, &exact);
    if (!exact || key == "sources" || key.compare(0, 8, "sources.") == 0) {
      throw doc.error_at(it->first, "profile.sources." + key,
                         "names no field of this profile; keys are field paths such as "
                         "cell.nominal_v or ageing.cycle_life");
    }
    if (it->second.Scalar().empty()) {
      throw doc.error_at(it->first, "profile.sources." + key, "the source text is empty");
    }
    sources.emplace(key, it->second.Scalar());
  }
  return sources;
}

LoadedProfile build_profile(const YamlDocument& doc) {
  const YAML::Node p = doc.root()["profile"];
  LoadedProfile loaded;
  loaded.path = doc.source();
  ChemistryProfile& profile = loaded.profile;
  profile.id = p["id"].Scalar();
  profile.family = p["family"].Scalar();
  if (p["description"]) profile.description = p["description"].Scalar();

  const YAML::Node cell = p["cell"];
  check_cell(doc, cell);
  profile.cell_nominal_v = number(cell["nominal_v"]);
  profile.cell_capacity_ah = plausible_number(doc, cell["capacity_ah"], "profile.cell.capacity_ah",
                                              kMaxCellCapacityAh, " Ah");
  read_optional(cell, "capacity_rate_hours", profile.capacity_rate_hours);
  profile.mean_charge_v = number(cell["mean_charge_v"]);
  profile.mean_discharge_v = number(cell["mean_discharge_v"]);
  profile.coulombic_efficiency = number(cell["coulombic_efficiency"]);
  profile.max_charge_c_rate = number(cell["max_charge_c_rate"]);
  profile.max_discharge_c_rate = number(cell["max_discharge_c_rate"]);
  read_optional(cell, "peukert_exponent", profile.peukert_exponent);
  read_optional(cell, "self_discharge_per_month", profile.self_discharge_per_month);
  read_optional(cell, "absorption_soc", profile.absorption_soc);
  read_optional(cell, "mass_kg", profile.cell_mass_kg);
  read_optional(cell, "volume_l", profile.cell_volume_l);

  const YAML::Node dod = p["dod"];
  check_dod(doc, dod);
  profile.dod = DodRange{number(dod["min"]), number(dod["max"]), number(dod["default"])};

  const YAML::Node ageing = p["ageing"];
  std::vector<CycleLifePoint> points = read_cycle_life(doc, ageing["cycle_life"]);
  warn_shallow_throughput(doc, ageing["cycle_life"], points, loaded.warnings);
  try {
    profile.cycle_life = CycleLifeCurve(std::move(points));
  } catch (const InvalidValue& e) {
    throw e.nested_in("ageing.cycle_life");
  }
  profile.calendar_life_years = number(ageing["calendar_life_years"]);
  read_optional(ageing, "max_service_years", profile.max_service_years);
  read_optional(ageing, "end_of_life_capacity", profile.eol_capacity_fraction);
  if (const YAML::Node pc = ageing["partial_charge"]) {
    PartialChargeStress stress;
    read_optional(pc, "full_charge_soc", stress.full_charge_soc);
    stress.max_days_without_full_charge = number(pc["grace_days"]);
    stress.damage_per_extra_day = number(pc["damage_per_extra_day"]);
    profile.partial_charge = stress;
  }
  if (const YAML::Node soc = ageing["calendar_soc_stress"]) {
    profile.calendar_soc_stress =
        CalendarSocStress{number(soc["soc_exponent"]), number(soc["reference_soc"])};
  }

  if (const YAML::Node aux = p["auxiliary"]) {
    read_optional(aux, "standing_kw_per_kwh", profile.auxiliary.standing_kw_per_kwh);
    read_optional(aux, "pump_kw_per_kw", profile.auxiliary.pump_kw_per_kw);
  }

  TemperatureSpec spec = read_temperature(doc, p["temperature"]);
  if (const YAML::Node c = p["temperature"]["heat_capacity_kj_per_k_per_kwh"])
    profile.heat_capacity_kj_per_k_per_kwh = number(c);
  try {
    profile.temperature = TemperatureBehaviour(std::move(spec));
  } catch (const InvalidValue& e) {
    throw e.nested_in("temperature");
  }

  const YAML::Node costs = p["costs"];
  loaded.currency = costs["currency"].Scalar();
  profile.costs.capital_per_kwh = number(costs["capital_per_kwh"]);
  read_optional(costs, "capital_per_string", profile.costs.capital_per_string);
  read_optional(costs, "installation_fixed", profile.costs.installation_fixed);
  read_optional(costs, "fixed_om_per_kwh_year", profile.costs.fixed_om_per_kwh_year);
  read_optional(costs, "variable_om_per_mwh", profile.costs.variable_om_per_mwh);
  read_optional(costs, "replacement_share", profile.costs.replacement_share);
  read_optional(costs, "price_decline_per_year", profile.costs.price_decline_per_year);
  read_optional(costs, "end_of_life_per_kwh", profile.costs.end_of_life_per_kwh);
  read_optional(costs, "replacement_end_of_life_per_kwh",
                profile.costs.replacement_end_of_life_per_kwh);

  loaded.sources = read_sources(doc, p["sources"]);
  loaded.confidence = read_confidence(doc, p["confidence"]);
  loaded.id_at = position_of(doc, "profile.id");
  loaded.currency_at = position_of(doc, "profile.costs.currency");

  profile.validate();
  for (const std::string& w : loaded.warnings) emit_warning(w);
  return loaded;
}

}  // namespace

LoadedProfile load_profile_details(std::istream& in, const std::string& source_name) {
  const YamlDocument doc = parse_yaml(in, source_name);
  SchemaValidator::embedded("profile").enforce(doc);
  try {
    return build_profile(doc);
  } catch (const InvalidValue& e) {
    // The model refused a value the checks above let through: name it as the file spells it.
    throw doc.error_at_path(e.field().empty() ? "profile" : "profile." + e.field(), e.rule());
  } catch (const YAML::Exception& e) {
    throw doc.error_at_path("profile", "cannot read the profile: " + e.msg);
  }
}

LoadedProfile load_profile_details_file(const std::string& path) {
  std::ifstream in = open_input_or_throw(path, "profile", kMaxYamlFileBytes);
  return load_profile_details(in, path);
}

ChemistryProfile load_profile(std::istream& in, const std::string& source_name) {
  return load_profile_details(in, source_name).profile;
}

ChemistryProfile load_profile_file(const std::string& path) {
  return load_profile_details_file(path).profile;
}

const char* confidence_name(ValueConfidence c) {
  switch (c) {
    case ValueConfidence::Sourced:
      return "sourced";
    case ValueConfidence::FromMemory:
      return "from-memory";
    case ValueConfidence::Illustrative:
      return "illustrative";
  }
  return "illustrative";
}

std::optional<ValueConfidence> confidence_of(const LoadedProfile& loaded,
                                             const std::string& field) {
  // The longest key that equals the field or names an enclosing field.
  if (auto it = loaded.confidence.find(field); it != loaded.confidence.end()) return it->second;
  for (std::size_t i = field.size(); i-- > 0;) {
    if (field[i] != '.' && field[i] != '[') continue;
    if (auto it = loaded.confidence.find(field.substr(0, i)); it != loaded.confidence.end())
      return it->second;
  }
  return std::nullopt;
}

WarningSink set_warning_sink(WarningSink sink) {
  WarningSink previous = std::move(warning_sink());
  warning_sink() = std::move(sink);
  return previous;
}

bool source_covers(const std::map<std::string, std::string>& sources, const std::string& field) {
  if (sources.count(field)) return true;
  for (std::size_t i = 0; i < field.size(); ++i) {
    if ((field[i] == '.' || field[i] == '[') && sources.count(field.substr(0, i))) return true;
  }
  return false;
}

}  // namespace stowage
