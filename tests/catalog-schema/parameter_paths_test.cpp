// SPDX-License-Identifier: MIT
// Parameter paths: every input a sweep may vary has one name, a unit and a range, and a
// change is validated like the input file it stands for.
#include "catalog-schema/parameter_paths.h"

#include <catch2/catch.hpp>
#include <string>

#include "catalog-schema/study_loader.h"
#include "catalog-schema/tender_loader.h"
#include "model/invalid_value.h"
#include "test_paths.h"

using namespace stowage;

namespace {

StudyCase demo() {
  return load_study_file(std::string(STOWAGE_SOURCE_DIR) + "/studies/tarnbeck-saddle/study.yaml");
}

}  // namespace

TEST_CASE("each profile of a study has its own price paths, in the study's currency",
          "[catalog][paths]") {
  const StudyCase s = demo();
  const ParameterInfo info = find_parameter(s, "profiles.lfp.costs.capital_per_kwh");
  CHECK(info.unit == "EUR/kWh");
  CHECK(info.base == s.profiles[*s.find_profile("lfp")].costs.capital_per_kwh);
  CHECK_FALSE(info.min_inclusive);  // a bank costs something
  int lfp_paths = 0;
  for (const ParameterInfo& p : parameter_paths(s)) {
    if (p.path.rfind("profiles.lfp.", 0) == 0) ++lfp_paths;
  }
  CHECK(lfp_paths >= 12);
  CHECK(find_parameter(s, "site.hourly.temp_c_offset").effect == ParameterEffect::Offset);
  CHECK(find_parameter(s, "economics.project_years").whole_number);
}

TEST_CASE("an unknown path is refused with the nearest known one", "[catalog][paths]") {
  const StudyCase s = demo();
  try {
    find_parameter(s, "profiles.lpf.costs.capital_per_kwh");
    FAIL("expected InvalidValue");
  } catch (const InvalidValue& e) {
    CHECK(e.field() == "profiles.lpf.costs.capital_per_kwh");
    CHECK_THAT(e.rule(), Catch::Contains("profiles.lfp.costs.capital_per_kwh"));
  }
}

TEST_CASE("applying a value sets, offsets or scales the input it names", "[catalog][paths]") {
  StudyCase s = demo();
  const std::size_t lfp = *s.find_profile("lfp");
  apply_parameter(s, "profiles.lfp.costs.capital_per_kwh", 250);
  CHECK(s.profiles[lfp].costs.capital_per_kwh == 250);
  const double t0 = s.site.temp_c[100];
  apply_parameter(s, "site.hourly.temp_c_offset", 5);
  CHECK(s.site.temp_c[100] == Approx(t0 + 5));
  const double n80 = s.profiles[lfp].cycle_life.cycles_to_end_of_life(0.8);
  apply_parameter(s, "profiles.lfp.ageing.cycle_life_scale", 0.5);
  CHECK(s.profiles[lfp].cycle_life.cycles_to_end_of_life(0.8) == Approx(n80 / 2));
  apply_parameter(s, "economics.project_years", 15);
  CHECK(s.economics.project_years == 15);
}

TEST_CASE("a value out of range or breaking a rule is refused and changes nothing",
          "[catalog][paths]") {
  StudyCase s = demo();
  const std::size_t lfp = *s.find_profile("lfp");
  const double price = s.profiles[lfp].costs.capital_per_kwh;
  CHECK_THROWS_AS(apply_parameter(s, "profiles.lfp.costs.capital_per_kwh", -1), InvalidValue);
  CHECK_THROWS_AS(apply_parameter(s, "economics.real_discount_rate", 1.0), InvalidValue);
  CHECK_THROWS_AS(apply_parameter(s, "economics.project_years", 12.5), InvalidValue);
  CHECK(s.profiles[lfp].costs.capital_per_kwh == price);
  // Charging may not start above the top of the charging range: the profile's own rule.
  const double charge_min = s.profiles[lfp].temperature.spec().charge_min_c;
  try {
    apply_parameter(s, "profiles.lfp.temperature.charging_c.min", 90);
    FAIL("expected InvalidValue");
  } catch (const InvalidValue& e) {
    CHECK_THAT(e.field(), Catch::StartsWith("profiles.lfp."));
    CHECK_THAT(e.rule(), Catch::Contains("after setting profiles.lfp.temperature.charging_c.min"));
  }
  CHECK(s.profiles[lfp].temperature.spec().charge_min_c == charge_min);
}

namespace {

TenderCase tender_demo() {
  return load_tender_file(std::string(STOWAGE_SOURCE_DIR) +
                          "/studies/pier-nine-tender/tender.yaml");
}

}  // namespace

TEST_CASE("a tender's paths are each bid's chemistry and open costs, the site and the economics",
          "[catalog][paths][tender]") {
  const TenderCase t = tender_demo();
  const std::vector<ParameterInfo> paths = parameter_paths(t);
  std::size_t per_bid = 0, site = 0, economics = 0;
  for (const ParameterInfo& p : paths) {
    INFO(p.path);
    if (p.path.rfind("bids.Bid A.", 0) == 0) ++per_bid;
    if (p.path.rfind("site.", 0) == 0) ++site;
    if (p.path.rfind("economics.", 0) == 0) ++economics;
    CHECK(p.path.rfind("design_space.", 0) == std::string::npos);
    CHECK(p.path.find("capital_per_kwh") == std::string::npos);
    CHECK(p.path.find("fixed_om_per_kwh_year") == std::string::npos);
    CHECK(p.path.find("replacement_share") == std::string::npos);
    CHECK(find_parameter(t, p.path).path == p.path);  // every listed path is found
  }
  CHECK(per_bid == 6);  // parameter_paths.h lists six per bid
  CHECK(paths.size() == 6 * t.bids.size() + site + economics);
  CHECK(economics == 2);
  // A bid's value is its own profile's.
  const ParameterInfo life = find_parameter(t, "bids.Bid B.ageing.calendar_life_years");
  CHECK(life.base == t.bids[1].profile.calendar_life_years);
  CHECK(life.unit == "years");
}

TEST_CASE("a tender's refused value names the tender's path, not the study view's",
          "[catalog][paths][tender]") {
  TenderCase t = tender_demo();
  const double before = t.bids[0].profile.temperature.spec().charge_min_c;
  try {
    // Above the profile's charging maximum (45 degC in bid-a.yaml): the profile refuses it.
    apply_parameter(t, "bids.Bid A.temperature.charging_c.min", 50);
    FAIL("expected InvalidValue");
  } catch (const InvalidValue& e) {
    CHECK(e.field().rfind("bids.Bid A.temperature", 0) == 0);
    CHECK_THAT(e.rule(), Catch::Contains("after setting bids.Bid A.temperature.charging_c.min"));
    CHECK(e.rule().find("profiles.") == std::string::npos);
  }
  CHECK(t.bids[0].profile.temperature.spec().charge_min_c == before);  // left unchanged
  CHECK_THROWS_AS(apply_parameter(t, "bids.Bid A.costs.capital_per_kwh", 100), InvalidValue);
  CHECK_THROWS_AS(apply_parameter(t, "economics.real_discount_rate", 1.0), InvalidValue);
}
