// SPDX-License-Identifier: MIT
#include "catalog-schema/parameter_paths.h"

#include <algorithm>
#include <cmath>
#include <functional>
#include <limits>
#include <optional>

#include "catalog-schema/decimal_text.h"
#include "catalog-schema/schema_validator.h"
#include "model/invalid_value.h"

namespace stowage {

namespace {

enum class Scope { Profile, Case };

using Getter = std::function<std::optional<double>(const StudyCase&, std::size_t profile)>;
using Setter = std::function<void(StudyCase&, std::size_t profile, double value)>;

struct Entry {
  Scope scope;
  std::string key;   // after "profiles.<id>." for Scope::Profile, the whole path otherwise
  std::string unit;  // "{cur}" stands for the study's currency
  double min, max;
  bool min_inclusive, max_inclusive;
  bool whole_number;
  ParameterEffect effect;
  Getter get;
  Setter set;
};

constexpr double kHuge = 1e12;

// A profile price: Set on ProfileCosts::*member.
Entry cost(const char* key, const char* unit, double ProfileCosts::*member, double min,
           bool min_inclusive, double max = kHuge, bool max_inclusive = true) {
  return {Scope::Profile,
          std::string("costs.") + key,
          unit,
          min,
          max,
          min_inclusive,
          max_inclusive,
          false,
          ParameterEffect::Set,
          [member](const StudyCase& s, std::size_t p) -> std::optional<double> {
            return s.profiles[p].costs.*member;
          },
          [member](StudyCase& s, std::size_t p, double v) { s.profiles[p].costs.*member = v; }};
}

void scale_series(std::vector<double>& series, double factor) {
  for (double& x : series) x *= factor;
}

std::optional<double> constant_price(const SiteConditions& site) {
  if (site.charge_price_per_kwh.empty()) return std::nullopt;
  const double first = site.charge_price_per_kwh.front();
  for (double x : site.charge_price_per_kwh) {
    if (x != first) return std::nullopt;
  }
  return first;
}

const std::vector<Entry>& entries() {
  static const std::vector<Entry> table = [] {
    std::vector<Entry> t;
    const auto P = Scope::Profile;
    const auto C = Scope::Case;
    const auto Set = ParameterEffect::Set;
    t.push_back(cost("capital_per_kwh", "{cur}/kWh", &ProfileCosts::capital_per_kwh, 0, false));
    t.push_back(cost("capital_per_string", "{cur}", &ProfileCosts::capital_per_string, 0, true));
    t.push_back(cost("installation_fixed", "{cur}", &ProfileCosts::installation_fixed, 0, true));
    t.push_back(cost("fixed_om_per_kwh_year", "{cur}/kWh/year",
                     &ProfileCosts::fixed_om_per_kwh_year, 0, true));
    t.push_back(
        cost("variable_om_per_mwh", "{cur}/MWh", &ProfileCosts::variable_om_per_mwh, 0, true));
    t.push_back(
        cost("replacement_share", "fraction", &ProfileCosts::replacement_share, 0, false, 10));
    t.push_back(cost("price_decline_per_year", "fraction per year",
                     &ProfileCosts::price_decline_per_year, 0, true, 1, false));
    t.push_back(
        cost("end_of_life_per_kwh", "{cur}/kWh", &ProfileCosts::end_of_life_per_kwh, -kHuge, true));
    t.push_back({P, "costs.replacement_end_of_life_per_kwh", "{cur}/kWh", -kHuge, kHuge, true, true,
                 false, Set,
                 [](const StudyCase& s, std::size_t p) {
                   const ProfileCosts& c = s.profiles[p].costs;
                   return std::optional<double>(
                       c.replacement_end_of_life_per_kwh.value_or(c.end_of_life_per_kwh));
                 },
                 [](StudyCase& s, std::size_t p, double v) {
                   s.profiles[p].costs.replacement_end_of_life_per_kwh = v;
                 }});
    t.push_back(
        {P, "cell.coulombic_efficiency", "fraction", 0, 1, false, true, false, Set,
         [](const StudyCase& s, std::size_t p) {
           return std::optional<double>(s.profiles[p].coulombic_efficiency);
         },
         [](StudyCase& s, std::size_t p, double v) { s.profiles[p].coulombic_efficiency = v; }});
    t.push_back(
        {P, "ageing.calendar_life_years", "years", 0, 1000, false, true, false, Set,
         [](const StudyCase& s, std::size_t p) {
           return std::optional<double>(s.profiles[p].calendar_life_years);
         },
         [](StudyCase& s, std::size_t p, double v) { s.profiles[p].calendar_life_years = v; }});
    t.push_back({P, "ageing.cycle_life_scale", "factor", 0, 100, false, true, false,
                 ParameterEffect::Scale,
                 [](const StudyCase&, std::size_t) { return std::optional<double>(1.0); },
                 [](StudyCase& s, std::size_t p, double v) {
                   std::vector<CycleLifePoint> points = s.profiles[p].cycle_life.points();
                   for (CycleLifePoint& point : points) point.cycles *= v;
                   try {
                     s.profiles[p].cycle_life = CycleLifeCurve(std::move(points));
                   } catch (const InvalidValue& e) {
                     throw e.nested_in("profiles." + s.profiles[p].id + ".ageing.cycle_life");
                   }
                 }});
    t.push_back({P, "temperature.charging_c.min", "degC", -100, 100, true, true, false, Set,
                 [](const StudyCase& s, std::size_t p) {
                   return std::optional<double>(s.profiles[p].temperature.spec().charge_min_c);
                 },
                 [](StudyCase& s, std::size_t p, double v) {
                   TemperatureSpec spec = s.profiles[p].temperature.spec();
                   spec.charge_min_c = v;
                   try {
                     s.profiles[p].temperature = TemperatureBehaviour(spec);
                   } catch (const InvalidValue& e) {
                     throw e.nested_in("profiles." + s.profiles[p].id + ".temperature");
                   }
                 }});
    t.push_back({C, "site.backup.price_per_kwh", "{cur}/kWh", 0, kHuge, true, true, false, Set,
                 [](const StudyCase& s, std::size_t) { return s.site.backup_price_per_kwh; },
                 [](StudyCase& s, std::size_t, double v) { s.site.backup_price_per_kwh = v; }});
    t.push_back({C, "site.charging_price.per_kwh", "{cur}/kWh", 0, kHuge, true, true, false, Set,
                 [](const StudyCase& s, std::size_t) { return constant_price(s.site); },
                 [](StudyCase& s, std::size_t, double v) {
                   std::fill(s.site.charge_price_per_kwh.begin(), s.site.charge_price_per_kwh.end(),
                             v);
                 }});
    t.push_back({C, "site.unserved_penalty_per_kwh", "{cur}/kWh", 0, kHuge, true, true, false, Set,
                 [](const StudyCase& s, std::size_t) {
                   return std::optional<double>(s.site.unserved_penalty_per_kwh);
                 },
                 [](StudyCase& s, std::size_t, double v) { s.site.unserved_penalty_per_kwh = v; }});
    t.push_back({C, "site.autonomy_days", "days", 0, 365, true, true, false, Set,
                 [](const StudyCase& s, std::size_t) {
                   return std::optional<double>(s.site.autonomy_days);
                 },
                 [](StudyCase& s, std::size_t, double v) { s.site.autonomy_days = v; }});
    t.push_back({C, "site.charger_efficiency", "fraction", 0, 1, false, true, false, Set,
                 [](const StudyCase& s, std::size_t) {
                   return std::optional<double>(s.site.charger_efficiency);
                 },
                 [](StudyCase& s, std::size_t, double v) { s.site.charger_efficiency = v; }});
    t.push_back({C, "site.inverter_efficiency", "fraction", 0, 1, false, true, false, Set,
                 [](const StudyCase& s, std::size_t) {
                   return std::optional<double>(s.site.inverter_efficiency);
                 },
                 [](StudyCase& s, std::size_t, double v) { s.site.inverter_efficiency = v; }});
    t.push_back({C, "site.hourly.temp_c_offset", "degC", -50, 50, true, true, false,
                 ParameterEffect::Offset,
                 [](const StudyCase&, std::size_t) { return std::optional<double>(0.0); },
                 [](StudyCase& s, std::size_t, double v) {
                   for (double& x : s.site.temp_c) x += v;
                 }});
    t.push_back({C, "site.hourly.load_kw_scale", "factor", 0, 100, true, true, false,
                 ParameterEffect::Scale,
                 [](const StudyCase&, std::size_t) { return std::optional<double>(1.0); },
                 [](StudyCase& s, std::size_t, double v) { scale_series(s.site.load_kw, v); }});
    t.push_back({C, "site.hourly.source_kw_scale", "factor", 0, 100, true, true, false,
                 ParameterEffect::Scale,
                 [](const StudyCase&, std::size_t) { return std::optional<double>(1.0); },
                 [](StudyCase& s, std::size_t, double v) { scale_series(s.site.source_kw, v); }});
    t.push_back({C, "economics.real_discount_rate", "fraction per year", 0, 1, true, false, false,
                 Set,
                 [](const StudyCase& s, std::size_t) {
                   return std::optional<double>(s.economics.real_discount_rate);
                 },
                 [](StudyCase& s, std::size_t, double v) { s.economics.real_discount_rate = v; }});
    t.push_back({C, "economics.project_years", "years", 1, 100, true, true, true, Set,
                 [](const StudyCase& s, std::size_t) {
                   return std::optional<double>(s.economics.project_years);
                 },
                 [](StudyCase& s, std::size_t, double v) {
                   s.economics.project_years = static_cast<int>(v);
                 }});
    t.push_back({C, "design_space.budget", "{cur}", 0, kHuge, false, true, false, Set,
                 [](const StudyCase& s, std::size_t) { return s.search.budget; },
                 [](StudyCase& s, std::size_t, double v) { s.search.budget = v; }});
    t.push_back({C, "design_space.max_strings_parallel", "strings", 1, 10000, true, true, true, Set,
                 [](const StudyCase& s, std::size_t) {
                   return std::optional<double>(s.search.max_strings_parallel);
                 },
                 [](StudyCase& s, std::size_t, double v) {
                   s.search.max_strings_parallel = static_cast<int>(v);
                 }});
    return t;
  }();
  return table;
}

std::string unit_in(const Entry& e, const StudyCase& s) {
  std::string unit = e.unit;
  const std::size_t at = unit.find("{cur}");
  if (at != std::string::npos) unit.replace(at, 5, s.economics.currency);
  return unit;
}

ParameterInfo describe(const Entry& e, const StudyCase& s, std::size_t profile,
                       const std::string& path) {
  ParameterInfo info;
  info.path = path;
  info.unit = unit_in(e, s);
  info.min = e.min;
  info.max = e.max;
  info.min_inclusive = e.min_inclusive;
  info.max_inclusive = e.max_inclusive;
  info.whole_number = e.whole_number;
  info.effect = e.effect;
  info.prices_only = e.scope == Scope::Profile ? e.key.rfind("costs.", 0) == 0
                                               : e.key == "economics.real_discount_rate" ||
                                                     e.key == "site.backup.price_per_kwh" ||
                                                     e.key == "site.charging_price.per_kwh" ||
                                                     e.key == "site.unserved_penalty_per_kwh";
  const std::optional<double> v = e.get(s, profile);
  info.present = v.has_value();
  info.base = v.value_or(std::numeric_limits<double>::quiet_NaN());
  return info;
}

struct Match {
  const Entry* entry = nullptr;
  std::size_t profile = 0;
};

std::optional<Match> match(const StudyCase& s, std::string_view path) {
  for (const Entry& e : entries()) {
    if (e.scope == Scope::Case) {
      if (path == e.key) return Match{&e, 0};
      continue;
    }
    for (std::size_t p = 0; p < s.profiles.size(); ++p) {
      if (path == "profiles." + s.profiles[p].id + "." + e.key) return Match{&e, p};
    }
  }
  return std::nullopt;
}

std::string range_text(const ParameterInfo& info) {
  auto bound = [](double x) {
    if (x >= kHuge) return std::string("inf");
    if (x <= -kHuge) return std::string("-inf");
    return number_text(x);
  };
  return std::string(info.min_inclusive ? "[" : "(") + bound(info.min) + ", " + bound(info.max) +
         (info.max_inclusive ? "]" : ")");
}

}  // namespace

std::vector<ParameterInfo> parameter_paths(const StudyCase& study) {
  std::vector<ParameterInfo> out;
  for (std::size_t p = 0; p < study.profiles.size(); ++p) {
    for (const Entry& e : entries()) {
      if (e.scope != Scope::Profile) continue;
      out.push_back(describe(e, study, p, "profiles." + study.profiles[p].id + "." + e.key));
    }
  }
  for (const Entry& e : entries()) {
    if (e.scope == Scope::Case) out.push_back(describe(e, study, 0, e.key));
  }
  return out;
}

ParameterInfo find_parameter(const StudyCase& study, std::string_view path) {
  const std::optional<Match> m = match(study, path);
  if (!m) {
    std::vector<std::string> all;
    for (const ParameterInfo& info : parameter_paths(study)) all.push_back(info.path);
    std::string rule = "is not a parameter path of this study";
    const std::string hint = closest_match(std::string(path), all);
    if (!hint.empty()) rule += " (did you mean '" + hint + "'?)";
    rule += "; docs/input-format.md lists the paths";
    throw InvalidValue(std::string(path), rule);
  }
  return describe(*m->entry, study, m->profile, std::string(path));
}

void apply_parameter(StudyCase& study, std::string_view path, double value) {
  const ParameterInfo info = find_parameter(study, path);
  const std::string name(path);
  const bool above_min = info.min_inclusive ? value >= info.min : value > info.min;
  const bool below_max = info.max_inclusive ? value <= info.max : value < info.max;
  if (!std::isfinite(value) || !above_min || !below_max) {
    throw InvalidValue(name, "must lie in " + range_text(info) + " " + info.unit + ", found " +
                                 number_text(value));
  }
  if (info.whole_number && value != std::floor(value)) {
    throw InvalidValue(name, "must be a whole number, found " + number_text(value));
  }
  if (!info.present && name != "design_space.budget") {
    throw InvalidValue(name,
                       "is not set in this study (or varies hour by hour), so it has no "
                       "single value to vary");
  }
  const Match m = *match(study, path);
  StudyCase changed = study;
  try {
    m.entry->set(changed, m.profile, value);
    if (m.entry->scope == Scope::Profile) {
      try {
        changed.profiles[m.profile].validate();
      } catch (const InvalidValue& e) {
        throw e.nested_in("profiles." + changed.profiles[m.profile].id);
      }
    } else {
      try {
        changed.site.validate();
      } catch (const InvalidValue& e) {
        throw e.nested_in("site");
      }
      try {
        changed.economics.validate();
      } catch (const InvalidValue& e) {
        throw e.nested_in("economics");
      }
    }
  } catch (const InvalidValue& e) {
    throw InvalidValue(e.field(),
                       e.rule() + " (after setting " + name + " to " + number_text(value) + ")");
  }
  study = std::move(changed);
}

namespace {

// The profile entries a tender lets vary per bid (parameter_paths.h says why the rest do not).
constexpr std::string_view kBidKeys[] = {"ageing.calendar_life_years", "ageing.cycle_life_scale",
                                         "cell.coulombic_efficiency",  "temperature.charging_c.min",
                                         "costs.variable_om_per_mwh",  "costs.end_of_life_per_kwh"};

bool tender_case_key(std::string_view key) {
  return key.rfind("site.", 0) == 0 || key.rfind("economics.", 0) == 0;
}

// The tender as a study the entries can act on: its site and economics, one profile per bid
// with the bid's label as id (labels are unique, profile ids need not be).
StudyCase study_view(const TenderCase& tender) {
  StudyCase s;
  s.title = tender.title;
  s.site = tender.site;
  s.economics = tender.economics;
  for (const Bid& b : tender.bids) {
    s.profiles.push_back(b.profile);
    s.profiles.back().id = b.label;
  }
  return s;
}

// The study path of the view that a tender path names, or nothing when it names none.
std::optional<std::string> view_path(const TenderCase& tender, std::string_view path) {
  for (const Bid& b : tender.bids) {
    const std::string prefix = "bids." + b.label + ".";
    if (path.rfind(prefix, 0) != 0) continue;
    const std::string_view key = path.substr(prefix.size());
    for (std::string_view allowed : kBidKeys) {
      if (key == allowed) return "profiles." + b.label + "." + std::string(key);
    }
  }
  for (const Entry& e : entries()) {
    if (e.scope == Scope::Case && tender_case_key(e.key) && path == e.key) return e.key;
  }
  return std::nullopt;
}

// A field of the view ("profiles.<label>...") spelt as the tender's ("bids.<label>...").
std::string tender_field(const TenderCase& tender, const std::string& field) {
  for (const Bid& b : tender.bids) {
    const std::string prefix = "profiles." + b.label;
    if (field.rfind(prefix, 0) == 0 &&
        (field.size() == prefix.size() || field[prefix.size()] == '.')) {
      return "bids." + b.label + field.substr(prefix.size());
    }
  }
  return field;
}

std::string tender_text(const TenderCase& tender, std::string text) {
  for (const Bid& b : tender.bids) {
    const std::string from = "profiles." + b.label + ".", to = "bids." + b.label + ".";
    for (std::size_t at = text.find(from); at != std::string::npos;
         at = text.find(from, at + to.size())) {
      text.replace(at, from.size(), to);
    }
  }
  return text;
}

}  // namespace

std::vector<ParameterInfo> parameter_paths(const TenderCase& tender) {
  const StudyCase view = study_view(tender);
  std::vector<ParameterInfo> out;
  for (const Bid& b : tender.bids) {
    for (std::string_view key : kBidKeys) {
      ParameterInfo info = find_parameter(view, "profiles." + b.label + "." + std::string(key));
      info.path = "bids." + b.label + "." + std::string(key);
      out.push_back(std::move(info));
    }
  }
  for (const Entry& e : entries()) {
    if (e.scope == Scope::Case && tender_case_key(e.key)) {
      out.push_back(describe(e, view, 0, e.key));
    }
  }
  return out;
}

ParameterInfo find_parameter(const TenderCase& tender, std::string_view path) {
  const std::optional<std::string> mapped = view_path(tender, path);
  if (!mapped) {
    for (const Bid& b : tender.bids) {
      const std::string prefix = "bids." + b.label + ".";
      if (path.rfind(prefix, 0) != 0) continue;
      for (const Entry& e : entries()) {
        if (e.scope == Scope::Profile && path.substr(prefix.size()) == e.key) {
          throw InvalidValue(std::string(path),
                             "is fixed by the bid (its offered price, or a cost a bid does not "
                             "vary), so a tender does not vary it; docs/tender.md lists the "
                             "paths a tender varies");
        }
      }
    }
    std::vector<std::string> all;
    for (const ParameterInfo& info : parameter_paths(tender)) all.push_back(info.path);
    std::string rule = "is not a parameter path of this tender";
    const std::string hint = closest_match(std::string(path), all);
    if (!hint.empty()) rule += " (did you mean '" + hint + "'?)";
    rule += "; docs/tender.md lists the paths";
    throw InvalidValue(std::string(path), rule);
  }
  ParameterInfo info = find_parameter(study_view(tender), *mapped);
  info.path = std::string(path);
  return info;
}

void apply_parameter(TenderCase& tender, std::string_view path, double value) {
  find_parameter(tender, path);  // refuses a path that is not the tender's
  StudyCase view = study_view(tender);
  try {
    apply_parameter(view, *view_path(tender, path), value);
  } catch (const InvalidValue& e) {
    throw InvalidValue(tender_field(tender, e.field()), tender_text(tender, e.rule()));
  }
  tender.site = std::move(view.site);
  tender.economics = view.economics;
  for (std::size_t i = 0; i < tender.bids.size(); ++i) {
    const std::string id = tender.bids[i].profile.id;
    tender.bids[i].profile = std::move(view.profiles[i]);
    tender.bids[i].profile.id = id;
  }
}

}  // namespace stowage
