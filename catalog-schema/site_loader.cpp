// SPDX-License-Identifier: MIT
#include "catalog-schema/site_loader.h"

#include <algorithm>
#include <fstream>

#include "catalog-schema/hourly_csv.h"
#include "catalog-schema/input_error.h"
#include "catalog-schema/input_file.h"
#include "catalog-schema/input_limits.h"
#include "catalog-schema/schema_validator.h"
#include "catalog-schema/yaml_document.h"
#include "model/invalid_value.h"

namespace stowage {
namespace {

double number(const YAML::Node& node) { return *scalar_number(node); }

std::string join_names(const std::map<std::string, std::vector<double>>& prices) {
  std::string out;
  for (const auto& entry : prices) out += (out.empty() ? "" : ", ") + entry.first;
  return out.empty() ? "none" : out;
}

// The `enclosure` block (model/enclosure.h); the schema has checked its keys and types.
Enclosure read_enclosure(const YAML::Node& e) {
  Enclosure out;
  out.id = e["name"].Scalar();
  out.conductance_w_per_k = number(e["conductance_w_per_k"]);
  if (e["thermal_mass_kj_per_k"]) out.thermal_mass_kj_per_k = number(e["thermal_mass_kj_per_k"]);
  if (e["solar_aperture_m2"]) out.solar_aperture_m2 = number(e["solar_aperture_m2"]);
  if (e["standing_kw"]) out.standing_kw = number(e["standing_kw"]);
  if (e["capital"]) out.capital = number(e["capital"]);
  if (e["om_per_year"]) out.om_per_year = number(e["om_per_year"]);
  if (const YAML::Node h = e["heating"]) {
    EnclosureHeating heating;
    heating.to_c = number(h["to_c"]);
    heating.capacity_kw = number(h["capacity_kw"]);
    if (h["efficiency"]) heating.efficiency = number(h["efficiency"]);
    if (h["charge_only"]) heating.charge_only = h["charge_only"].as<bool>();
    out.heating = heating;
  }
  if (const YAML::Node c = e["cooling"]) {
    EnclosureCooling cooling;
    cooling.to_c = number(c["to_c"]);
    cooling.capacity_kw = number(c["capacity_kw"]);
    cooling.cop = number(c["cop"]);
    if (c["cop_reference_ambient_c"])
      cooling.cop_reference_ambient_c = number(c["cop_reference_ambient_c"]);
    if (c["cop_per_k"]) cooling.cop_per_k = number(c["cop_per_k"]);
    if (c["cop_min"]) cooling.cop_min = number(c["cop_min"]);
    out.cooling = cooling;
  }
  return out;
}

LoadedSite build_site(const YamlDocument& doc, const std::string& base_dir) {
  const YAML::Node s = doc.root()["site"];
  LoadedSite loaded;
  loaded.path = doc.source();
  SiteConditions& site = loaded.site;
  site.name = s["name"].Scalar();
  site.bus_voltage_v =
      plausible_number(doc, s["bus_voltage_v"], "site.bus_voltage_v", kMaxBusVoltageV, " V");
  site.autonomy_days =
      plausible_number(doc, s["autonomy_days"], "site.autonomy_days", kMaxAutonomyDays, " days");
  if (s["design_margin"]) {
    site.design_margin =
        plausible_number(doc, s["design_margin"], "site.design_margin", kMaxDesignMargin);
  }
  site.charger_efficiency = number(s["charger_efficiency"]);
  site.inverter_efficiency = number(s["inverter_efficiency"]);
  if (s["source_to_load_efficiency"]) {
    site.source_to_load_efficiency = number(s["source_to_load_efficiency"]);
  }
  if (const YAML::Node backup = s["backup"]) {
    site.backup_price_per_kwh = number(backup["price_per_kwh"]);
  }
  if (const YAML::Node unserved = s["unserved"]) {
    site.unserved_limit_fraction = number(unserved["limit_fraction"]);
    if (unserved["penalty_per_kwh"]) {
      site.unserved_penalty_per_kwh = number(unserved["penalty_per_kwh"]);
    }
  }

  loaded.hourly_path = resolve_relative(base_dir, s["hourly"].Scalar());
  std::ifstream csv;
  std::string reason;
  if (!open_input(loaded.hourly_path, csv, reason, kMaxCsvFileBytes)) {
    throw doc.error_at(s["hourly"], "site.hourly", "hourly CSV: " + reason);
  }
  HourlySeries hourly = read_hourly_csv(csv, loaded.hourly_path);
  loaded.notes = std::move(hourly.notes);
  site.load_kw = std::move(hourly.load_kw);
  site.source_kw = std::move(hourly.source_kw);
  site.temp_c = std::move(hourly.temp_c);
  site.ambient_c = std::move(hourly.ambient_c);
  site.irradiance_w_m2 = std::move(hourly.irradiance_w_m2);
  if (const YAML::Node e = s["enclosure"]) {
    if (site.ambient_c.empty())
      throw doc.error_at(e, "site.enclosure",
                         "an enclosure needs the outdoor air temperature: add an ambient_c column "
                         "to the hourly CSV " +
                             loaded.hourly_path);
    site.enclosure = read_enclosure(e);
  } else if (site.temp_c.empty()) {
    throw doc.error_at(s["hourly"], "site.hourly",
                       "the hourly CSV " + loaded.hourly_path +
                           " gives ambient_c but no temp_c: add a temp_c column (the battery-space "
                           "temperature) or an enclosure block that computes it");
  }

  const YAML::Node price = s["charging_price"];
  if (price["per_kwh"]) {
    site.charge_price_per_kwh.assign(site.load_kw.size(), number(price["per_kwh"]));
  } else {
    const std::string column = price["column"].Scalar();
    const auto found = hourly.prices.find(column);
    if (found == hourly.prices.end()) {
      throw doc.error_at(price["column"], "site.charging_price.column",
                         "the hourly CSV " + loaded.hourly_path + " has no column '" + column +
                             "' (its price columns: " + join_names(hourly.prices) + ")");
    }
    site.charge_price_per_kwh = std::move(found->second);
    loaded.price_column = column;
  }

  try {
    if (site.enclosure) {
      site.enclosure->validate();
      set_enclosure_reference_temperature(site);
    }
    site.validate();
  } catch (const InvalidValue& e) {
    // The series were checked row by row while reading; a series rule failing here is still
    // reported against the key that names the CSV.
    const std::string& f = e.field();
    const bool series = f.rfind("load_kw", 0) == 0 || f.rfind("source_kw", 0) == 0 ||
                        f.rfind("temp_c", 0) == 0 || f.rfind("charging_price", 0) == 0 ||
                        f.rfind("ambient_c", 0) == 0 || f.rfind("irradiance_w_m2", 0) == 0;
    throw doc.error_at_path(series ? "site.hourly" : "site." + f,
                            series ? f + ": " + e.rule() : e.rule());
  }
  return loaded;
}

}  // namespace

LoadedSite load_site_details(std::istream& in, const std::string& source_name,
                             const std::string& base_dir) {
  const YamlDocument doc = parse_yaml(in, source_name);
  SchemaValidator::embedded("site").enforce(doc);
  try {
    return build_site(doc, base_dir);
  } catch (const YAML::Exception& e) {
    throw doc.error_at_path("site", "cannot read the site: " + e.msg);
  }
}

LoadedSite load_site_details_file(const std::string& path) {
  std::ifstream in = open_input_or_throw(path, "site", kMaxYamlFileBytes);
  return load_site_details(in, path, parent_directory(path));
}

SiteConditions load_site(std::istream& in, const std::string& source_name,
                         const std::string& base_dir) {
  return load_site_details(in, source_name, base_dir).site;
}

SiteConditions load_site_file(const std::string& path) { return load_site_details_file(path).site; }

}  // namespace stowage
