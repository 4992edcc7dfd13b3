// SPDX-License-Identifier: MIT
#include "catalog-schema/study_loader.h"

#include <algorithm>
#include <cmath>
#include <fstream>
#include <optional>
#include <sstream>

#include "catalog-schema/decimal_text.h"
#include "catalog-schema/input_error.h"
#include "catalog-schema/input_file.h"
#include "catalog-schema/input_limits.h"
#include "catalog-schema/referenced_input.h"
#include "catalog-schema/schema_validator.h"
#include "catalog-schema/yaml_document.h"
#include "model/bank.h"
#include "model/invalid_value.h"
#include "model/sizing.h"

namespace stowage {
namespace {

double number(const YAML::Node& node) { return *scalar_number(node); }

std::string where(const SourcePosition& p) {
  return p.file + ":" + std::to_string(p.line) + ":" + std::to_string(p.column);
}

// The errors of the rules across files, collected so one run reports them all: each rule runs
// on what has loaded, and a rule that needs a value an earlier rule refused is skipped (a
// profile that cannot make the bus is not sized; a ladder past its limit is not built).
struct Build {
  Build(const YamlDocument& d, std::string dir) : doc(d), base_dir(std::move(dir)) {}

  const YamlDocument& doc;
  std::string base_dir;
  LoadedStudy loaded;
  std::vector<InputError> errors;
  bool economics_read = false;
  bool site_read = false;
  bool profiles_read = true;            // every file of study.profiles loaded
  std::vector<std::size_t> profile_at;  // per loaded profile: its index in study.profiles
  std::vector<bool> sizable;            // per loaded profile: it makes the site's bus
  std::vector<std::size_t> design_at;   // per accepted design: its index in study.designs
  bool ladder_read = true;              // design_space.dod_ladder passed its rules
  std::vector<YAML::Node> rate_keys;    // per exchange rate: its key, for notes

  // Runs `rule`; its InputError (or each of an InputErrors) joins `errors`. False on error.
  template <typename Rule>
  bool check(Rule rule) {
    try {
      rule();
      return true;
    } catch (const InputErrors& e) {
      errors.insert(errors.end(), e.all().begin(), e.all().end());
    } catch (const InputError& e) {
      errors.push_back(e);
    }
    return false;
  }
};

// The one conversion of a profile's prices into the study's currency: every money field of
// ProfileCosts times `rate` (study-currency units per unit of the profile's currency);
// replacement_share and price_decline_per_year are ratios and stay as they are.
void convert_prices(ProfileCosts& c, double rate) {
  // A new field in ProfileCosts must be judged here: money (converted) or ratio (kept).
  static_assert(sizeof(ProfileCosts) == 8 * sizeof(double) + sizeof(std::optional<double>),
                "ProfileCosts changed: decide whether the new field is converted");
  c.capital_per_kwh *= rate;
  c.capital_per_string *= rate;
  c.installation_fixed *= rate;
  c.fixed_om_per_kwh_year *= rate;
  c.variable_om_per_mwh *= rate;
  c.end_of_life_per_kwh *= rate;
  if (c.replacement_end_of_life_per_kwh) *c.replacement_end_of_life_per_kwh *= rate;
}

// study.economics.exchange_rates: each key a currency code other than the study's own.
void read_exchange_rates(Build& b) {
  const YAML::Node rates = b.doc.root()["study"]["economics"]["exchange_rates"];
  if (!rates) return;
  const std::string& own = b.loaded.study.economics.currency;
  for (auto it = rates.begin(); it != rates.end(); ++it) {
    const std::string code = it->first.Scalar();
    const std::string field = "study.economics.exchange_rates." + printable_input(code);
    bool valid = code.size() == 3;
    for (char c : code) valid = valid && c >= 'A' && c <= 'Z';
    if (!valid) {
      b.errors.push_back(b.doc.error_at(
          it->first, field, "use a three-letter currency code in capitals (e.g. USD) as the key"));
    } else if (b.economics_read && code == own) {
      b.errors.push_back(b.doc.error_at(
          it->first, field,
          "is the study's own currency; leave it out (its prices need no conversion)"));
    } else {
      b.loaded.study.exchange_rates.push_back({code, number(it->second), {}});
      b.rate_keys.push_back(it->first);
    }
  }
}

// One profile's rules against the study: a unique id, the study's currency, the site's bus.
// The profile joins the study unless its id is taken; it is sized only if it makes the bus.
void read_profile(Build& b, const YAML::Node& node, std::size_t i) {
  const YamlDocument& doc = b.doc;
  LoadedStudy& loaded = b.loaded;
  const std::string field = join_index("study.profiles", i);
  const std::string path = resolve_relative(b.base_dir, node.Scalar());
  std::optional<LoadedProfile> read;
  if (!b.check([&] {
        std::ifstream in =
            open_referenced(doc, node, field, path, "profile file", kMaxYamlFileBytes);
        read = load_profile_details(in, path);
      })) {
    b.profiles_read = false;
    return;
  }
  LoadedProfile& profile = *read;
  for (std::size_t j = 0; j < loaded.profiles.size(); ++j) {
    if (loaded.profiles[j].profile.id == profile.profile.id) {
      b.errors.push_back(doc.error_at(
          node, field,
          "profile id '" + profile.profile.id + "' (" + where(profile.id_at) +
              ") is already used by study.profiles[" + std::to_string(b.profile_at[j]) + "] (" +
              where(loaded.profiles[j].id_at) + "); ids must be unique within a study"));
      return;
    }
  }
  if (b.economics_read && profile.currency != loaded.study.economics.currency) {
    std::vector<ExchangeRate>& rates = loaded.study.exchange_rates;
    const auto rate = std::find_if(rates.begin(), rates.end(), [&](const ExchangeRate& r) {
      return r.currency == profile.currency;
    });
    if (rate != rates.end()) {
      convert_prices(profile.profile.costs, rate->rate);
      rate->profile_ids.push_back(profile.profile.id);
    } else {
      const std::string& own = loaded.study.economics.currency;
      const InputError currency_at =
          doc.error_at(doc.root()["study"]["economics"]["currency"], "", "");
      b.errors.emplace_back(
          profile.currency_at.file, profile.currency_at.line, profile.currency_at.column,
          "profile.costs.currency",
          "prices in " + profile.currency + " but the study is in " + own +
              " (study.economics.currency at " + currency_at.file() + ":" +
              std::to_string(currency_at.line()) + ":" + std::to_string(currency_at.column()) +
              ") and study.economics.exchange_rates gives no rate for " + profile.currency +
              "; add one (" + profile.currency + ": R means 1 " + profile.currency + " = R " + own +
              "), convert the profile's prices or change the study's currency");
    }
  }
  bool makes_bus = b.site_read;
  if (b.site_read) {
    const double bus_v = loaded.study.site.bus_voltage_v;
    // Checked on the double before cells_in_series() rounds it into an int.
    const double cells_needed = bus_v / profile.profile.cell_nominal_v;
    if (!(cells_needed <= static_cast<double>(kMaxCellsInSeries))) {
      makes_bus = false;
      b.errors.push_back(doc.error_at(
          node, field,
          "cells of " + number_text(profile.profile.cell_nominal_v) + " V would need " +
              number_text(std::round(cells_needed)) + " in series for the site's " +
              number_text(bus_v) + " V bus, more than the plausibility limit of " +
              std::to_string(kMaxCellsInSeries) +
              " (see docs/input-format.md); check profile.cell.nominal_v (" + profile.path + ")"));
    } else if (const double mismatch = bus_voltage_mismatch(profile.profile, bus_v);
               mismatch > kMaxBusVoltageMismatch) {
      makes_bus = false;
      const ChemistryProfile& p = profile.profile;
      const int cells = cells_in_series(p, bus_v);
      b.errors.push_back(
          doc.error_at(node, field,
                       "cells of " + number_text(p.cell_nominal_v) + " V cannot make the site's " +
                           number_text(bus_v) + " V bus: the nearest series string, " +
                           std::to_string(cells) + " cell" + (cells == 1 ? "" : "s") + ", gives " +
                           number_text(cells * p.cell_nominal_v) + " V, " +
                           number_text(std::round(mismatch * 1000) / 10) + " % off (at most " +
                           number_text(kMaxBusVoltageMismatch * 100) + " %)"));
    }
  }
  loaded.profile_paths.push_back(path);
  loaded.study.profiles.push_back(profile.profile);
  loaded.profiles.push_back(std::move(profile));
  b.profile_at.push_back(i);
  b.sizable.push_back(makes_bus);
}

void read_profiles(Build& b) {
  const YAML::Node list = b.doc.root()["study"]["profiles"];
  if (list.size() > kMaxProfiles) {
    b.profiles_read = false;
    b.errors.push_back(b.doc.error_at(
        list, "study.profiles",
        "lists " + std::to_string(list.size()) + " profiles, more than the plausibility limit of " +
            std::to_string(kMaxProfiles) + " (see docs/input-format.md)"));
    return;
  }
  for (std::size_t i = 0; i < list.size(); ++i) read_profile(b, list[i], i);
}

// One entry of study.designs; throws InputError for its first problem.
void read_design(const YamlDocument& doc, const YAML::Node& d, std::size_t i,
                 const std::vector<std::string>& ids, LoadedStudy& loaded) {
  const std::string base = join_index("study.designs", i);
  DesignSpec design;
  design.profile_id = d["profile"].Scalar();
  const std::optional<std::size_t> index = loaded.study.find_profile(design.profile_id);
  if (!index) {
    std::string message =
        "no loaded profile has the id '" + printable_input(design.profile_id) + "'";
    const std::string hint = closest_match(design.profile_id, ids);
    if (!hint.empty()) message += " (did you mean '" + hint + "'?)";
    std::string all;
    for (const std::string& id : ids) all += (all.empty() ? "" : ", ") + id;
    message += "; the study's profiles are: " + all;
    throw doc.error_at(d["profile"], base + ".profile", message);
  }
  const ChemistryProfile* profile = &loaded.study.profiles[*index];
  if (d["dod_setpoint"]) {
    const double setpoint = number(d["dod_setpoint"]);
    if (setpoint < profile->dod.min || setpoint > profile->dod.max) {
      throw doc.error_at(d["dod_setpoint"], base + ".dod_setpoint",
                         "must lie within profile " + profile->id + "'s dod range [" +
                             number_text(profile->dod.min) + ", " + number_text(profile->dod.max) +
                             "], found " + number_text(setpoint));
    }
    design.dod_setpoint = setpoint;
  }
  if (d["strings_parallel"]) {
    design.strings_parallel =
        plausible_count(doc, d["strings_parallel"], base + ".strings_parallel", kMaxStringsParallel,
                        " strings in parallel");
  }
  loaded.study.designs.push_back(design);
}

// Each design is checked on its own and every design's error is collected. Without every
// profile loaded a design's profile id cannot be judged, so the designs wait for that.
void read_designs(Build& b) {
  const YAML::Node list = b.doc.root()["study"]["designs"];
  if (!list || !b.profiles_read) return;
  if (list.size() > kMaxDesigns) {
    b.errors.push_back(b.doc.error_at(
        list, "study.designs",
        "lists " + std::to_string(list.size()) + " designs, more than the plausibility limit of " +
            std::to_string(kMaxDesigns) + " (see docs/input-format.md)"));
    return;
  }
  std::vector<std::string> ids;
  for (const ChemistryProfile& p : b.loaded.study.profiles) ids.push_back(p.id);
  for (std::size_t i = 0; i < list.size(); ++i) {
    if (b.check([&] { read_design(b.doc, list[i], i, ids, b.loaded); })) b.design_at.push_back(i);
  }
}

void read_search(Build& b) {
  const YamlDocument& doc = b.doc;
  LoadedStudy& loaded = b.loaded;
  const YAML::Node s = doc.root()["study"]["design_space"];
  if (!s) return;
  SearchSettings& search = loaded.study.search;
  if (const YAML::Node ladder = s["dod_ladder"]) {
    search.dod_from = number(ladder["from"]);
    search.dod_to = number(ladder["to"]);
    search.dod_step = number(ladder["step"]);
    // The optimiser builds and simulates every setpoint: bound their number before it does.
    const double setpoints = std::floor((search.dod_to - search.dod_from) / search.dod_step + 1e-9);
    if (search.dod_from > search.dod_to) {
      b.ladder_read = false;
      b.errors.push_back(doc.error_at(ladder["from"], "study.design_space.dod_ladder.from",
                                      "must not exceed dod_ladder.to (" +
                                          number_text(search.dod_to) + "), found " +
                                          number_text(search.dod_from)));
    } else if (!(setpoints + 1 <= static_cast<double>(kMaxDodLadderSetpoints))) {
      b.ladder_read = false;
      b.errors.push_back(doc.error_at(
          ladder["step"], "study.design_space.dod_ladder.step",
          "gives " + number_text(setpoints + 1) + " setpoints from " +
              number_text(search.dod_from) + " to " + number_text(search.dod_to) +
              ", more than the plausibility limit of " + std::to_string(kMaxDodLadderSetpoints) +
              " (see docs/input-format.md); use a step of at least " +
              number_text((search.dod_to - search.dod_from) /
                          static_cast<double>(kMaxDodLadderSetpoints - 1))));
    }
  }
  if (s["max_strings_parallel"]) {
    b.check([&] {
      search.max_strings_parallel =
          plausible_count(doc, s["max_strings_parallel"], "study.design_space.max_strings_parallel",
                          kMaxStringsParallel, " strings in parallel");
    });
  }
  if (s["budget"]) search.budget = number(s["budget"]);
  // A mass or volume limit can only be checked when every profile gives the per-cell figure;
  // each profile without it is one error.
  const auto require_per_cell = [&](const char* key, const char* cell_field, auto has_value) {
    for (std::size_t i = 0; i < loaded.profiles.size(); ++i) {
      if (!has_value(loaded.profiles[i].profile)) {
        b.errors.push_back(doc.error_at(s[key], std::string("study.design_space.") + key,
                                        "needs " + std::string(cell_field) +
                                            " in every profile, but " + loaded.profile_paths[i] +
                                            " (profile " + loaded.profiles[i].profile.id +
                                            ") has none"));
      }
    }
  };
  if (s["max_mass_kg"]) {
    require_per_cell("max_mass_kg", "cell.mass_kg",
                     [](const ChemistryProfile& p) { return p.cell_mass_kg.has_value(); });
    search.max_mass_kg = number(s["max_mass_kg"]);
  }
  if (s["max_volume_l"]) {
    require_per_cell("max_volume_l", "cell.volume_l",
                     [](const ChemistryProfile& p) { return p.cell_volume_l.has_value(); });
    search.max_volume_l = number(s["max_volume_l"]);
  }
}

// Sizing for autonomy runs only when a study is evaluated, optimised or summarised by check;
// it is run here for every DoD those use, so a site and profile it refuses (an autonomy of
// months on a tiny cell) are refused by `check` with the place to look, not later without one.
// A sized bank is held to the same limit as a given strings_parallel. Each profile and design
// that makes the bus is sized, and every failure is reported.
void check_sizing(Build& b) {
  if (!b.site_read) return;
  const YamlDocument& doc = b.doc;
  const LoadedStudy& loaded = b.loaded;
  const StudyCase& study = loaded.study;
  const auto size = [&](std::size_t k, double dod, const YAML::Node& node, const std::string& field,
                        bool used) -> bool {
    const ChemistryProfile& p = study.profiles[k];
    const std::string what = "sizing profile " + p.id + " for " +
                             number_text(study.site.autonomy_days) + " days of autonomy at DoD " +
                             number_text(dod);
    const std::string hint = "; check site.autonomy_days and design_margin (" + loaded.site_path +
                             "), load_kw (" + loaded.hourly_path + ") and cell.capacity_ah (" +
                             loaded.profile_paths[k] + ")";
    int strings = 0;
    try {
      strings = size_for_autonomy(p, study.site, dod).strings_parallel;
    } catch (const InvalidValue& e) {
      b.errors.push_back(doc.error_at(node, field, what + " fails: " + e.rule() + hint));
      return false;
    }
    if (used && strings > kMaxStringsParallel) {
      b.errors.push_back(
          doc.error_at(node, field,
                       what + " needs " + std::to_string(strings) +
                           " strings in parallel, more than the plausibility limit of " +
                           std::to_string(kMaxStringsParallel) + hint));
      return false;
    }
    return true;
  };
  const YAML::Node s = doc.root()["study"];
  for (std::size_t k = 0; k < study.profiles.size(); ++k) {
    if (!b.sizable[k]) continue;
    const ChemistryProfile& p = study.profiles[k];
    const YAML::Node node = s["profiles"][b.profile_at[k]];
    const std::string field = join_index("study.profiles", b.profile_at[k]);
    const bool sized =
        size(k, p.dod.default_setpoint, node, field, !s["designs"] || s["designs"].size() == 0);
    // The optimiser sizes at every ladder setpoint; the shallowest needs the most strings (and
    // fails too when the default did: one error per profile is enough).
    if (!sized || !b.ladder_read) continue;
    const std::vector<double> ladder = dod_ladder(study.search, p);
    if (!ladder.empty()) size(k, ladder.front(), node, field, false);
  }
  for (std::size_t i = 0; i < study.designs.size(); ++i) {
    const DesignSpec& d = study.designs[i];
    if (d.strings_parallel) continue;
    const std::size_t k = *study.find_profile(d.profile_id);
    if (!b.sizable[k]) continue;
    const ChemistryProfile& p = study.profiles[k];
    size(k, d.dod_setpoint.value_or(p.dod.default_setpoint), s["designs"][b.design_at[i]],
         join_index("study.designs", b.design_at[i]), true);
  }
}

LoadedStudy build_study(const YamlDocument& doc, const std::string& base_dir) {
  const YAML::Node s = doc.root()["study"];
  Build b(doc, base_dir);
  LoadedStudy& loaded = b.loaded;
  loaded.path = doc.source();
  {
    const InputError at = doc.error_at(doc.root().begin()->first, "", "");
    loaded.study_at = {at.file(), at.line(), at.column()};
  }
  loaded.study.title = s["title"].Scalar();
  b.economics_read = b.check(
      [&] { loaded.study.economics = read_economics(doc, s["economics"], "study.economics"); });
  read_exchange_rates(b);

  loaded.site_path = resolve_relative(base_dir, s["site"].Scalar());
  b.site_read = b.check([&] {
    std::ifstream in = open_referenced(doc, s["site"], "study.site", loaded.site_path, "site file",
                                       kMaxYamlFileBytes);
    LoadedSite site = load_site_details(in, loaded.site_path, parent_directory(loaded.site_path));
    loaded.hourly_path = site.hourly_path;
    loaded.notes = std::move(site.notes);
    loaded.study.site = std::move(site.site);
  });
  read_profiles(b);
  // A rate no profile needs is kept (it is shown) but noted: a misspelt code would hide here.
  for (std::size_t i = 0; i < loaded.study.exchange_rates.size(); ++i) {
    const ExchangeRate& r = loaded.study.exchange_rates[i];
    if (!r.profile_ids.empty() || !b.profiles_read) continue;
    const InputError at = doc.error_at(b.rate_keys[i], "", "");
    loaded.notes.push_back({at.file(), at.line(), at.column(),
                            "study.economics.exchange_rates." + r.currency,
                            "no profile prices in " + r.currency + "; the rate is not used"});
  }
  read_designs(b);
  read_search(b);
  if (b.profiles_read) check_sizing(b);
  if (s["soc_log"]) {
    b.check([&] {
      loaded.soc_log_path = resolve_relative(base_dir, s["soc_log"].Scalar());
      std::ifstream in = open_referenced(doc, s["soc_log"], "study.soc_log", loaded.soc_log_path,
                                         "SOC log", kMaxCsvFileBytes);
      loaded.soc_log = read_soc_series(in, loaded.soc_log_path);
      loaded.notes.insert(loaded.notes.end(), loaded.soc_log->notes.begin(),
                          loaded.soc_log->notes.end());
    });
  }
  // A variation is applied to a copy of the study, so it needs every value it could touch.
  if (b.economics_read && b.site_read && b.profiles_read && b.ladder_read) {
    b.check([&] { loaded.variations = read_variations(doc, loaded.study); });
  }
  if (b.errors.size() == 1) throw b.errors.front();
  if (!b.errors.empty()) throw InputErrors(std::move(b.errors));
  return std::move(b.loaded);
}

}  // namespace

const SocSeries& study_soc_log(const LoadedStudy& loaded) {
  if (!loaded.soc_log) {
    throw InputError(loaded.study_at.file, loaded.study_at.line, loaded.study_at.column,
                     "study.soc_log",
                     "the study names no SOC log; add `soc_log: FILE.csv` under `study`, or give "
                     "the log to `stowage cycles` directly (stowage cycles FILE.csv)");
  }
  return *loaded.soc_log;
}

const ChemistryProfile& study_profile(const LoadedStudy& loaded, const std::string& id,
                                      const std::string& field) {
  if (const std::optional<std::size_t> k = loaded.study.find_profile(id))
    return loaded.study.profiles[*k];
  std::vector<std::string> ids;
  std::string all;
  for (const ChemistryProfile& p : loaded.study.profiles) {
    ids.push_back(p.id);
    all += (all.empty() ? "" : ", ") + p.id;
  }
  std::string message =
      "the study " + loaded.path + " has no profile with the id '" + printable_input(id) + "'";
  const std::string hint = closest_match(id, ids);
  if (!hint.empty()) message += " (did you mean '" + hint + "'?)";
  throw InvalidValue(field, message + "; its profiles are: " + all);
}

LoadedStudy load_study_details(std::istream& in, const std::string& source_name,
                               const std::string& base_dir) {
  const YamlDocument doc = parse_yaml(in, source_name);
  SchemaValidator::embedded("study").enforce(doc);
  try {
    return build_study(doc, base_dir);
  } catch (const YAML::Exception& e) {
    throw doc.error_at_path("study", "cannot read the study: " + e.msg);
  }
}

LoadedStudy load_study_details_file(const std::string& path) {
  std::ifstream in = open_input_or_throw(path, "study", kMaxYamlFileBytes);
  return load_study_details(in, path, parent_directory(path));
}

StudyCase load_study(std::istream& in, const std::string& source_name,
                     const std::string& base_dir) {
  return load_study_details(in, source_name, base_dir).study;
}

StudyCase load_study_file(const std::string& path) { return load_study_details_file(path).study; }

}  // namespace stowage
