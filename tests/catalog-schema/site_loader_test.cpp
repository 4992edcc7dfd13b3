// SPDX-License-Identifier: MIT
// Site files: values and the hourly CSV reach SiteConditions; errors in the site file name the
// site file, errors in the CSV name the CSV.
#include "catalog-schema/site_loader.h"

#include <catch2/catch.hpp>
#include <sstream>

#include "catalog_test_support.h"

namespace stowage {
namespace {

using testing::expect_input_error;
using testing::fixture_path;
using testing::line_of;
using testing::read_text;
using testing::replace_once;

const char* const kName = "bad-site.yaml";
const std::string kFixtures = testing::source_path("tests/catalog-schema/fixtures");

std::string site_text() { return read_text(fixture_path("site.yaml")); }

LoadedSite load_text(const std::string& text) {
  std::istringstream in(text);
  return load_site_details(in, kName, kFixtures);
}

TEST_CASE("a site file loads with its hourly CSV", "[catalog][site]") {
  const LoadedSite loaded = load_site_details_file(fixture_path("site.yaml"));
  const SiteConditions& s = loaded.site;
  CHECK(loaded.hourly_path == fixture_path("hourly.csv"));
  CHECK_FALSE(loaded.price_column);
  CHECK(s.name == "Loader test hut");
  CHECK(s.bus_voltage_v == 48);
  CHECK(s.autonomy_days == 3);
  CHECK(s.design_margin == 1.1);
  CHECK(s.charger_efficiency == 0.96);
  CHECK(s.inverter_efficiency == 0.93);
  CHECK(s.source_to_load_efficiency == 0.8928);
  REQUIRE(s.backup_price_per_kwh);
  CHECK(*s.backup_price_per_kwh == 0.62);
  REQUIRE(s.unserved_limit_fraction);
  CHECK(*s.unserved_limit_fraction == 0.001);
  CHECK(s.unserved_penalty_per_kwh == 2);
  REQUIRE(s.load_kw.size() == 8760);
  REQUIRE(s.charge_price_per_kwh.size() == 8760);
  CHECK(s.charge_price_per_kwh[4000] == 0.02);
  // Fixture formula: 0.6 kW all day plus 0.9 kW for 4 evening hours = 14.4 + 3.6 = 18 kWh/day.
  CHECK(s.annual_demand_kwh() == Approx(18.0 * 365));
}

TEST_CASE("optional site blocks keep the model defaults", "[catalog][site]") {
  std::string text = replace_once(site_text(), "  design_margin: 1.1\n", "");
  text = replace_once(text, "  backup:\n    price_per_kwh: 0.62\n", "");
  text = replace_once(text, "  unserved:\n    limit_fraction: 0.001\n    penalty_per_kwh: 2\n", "");
  text = replace_once(text, "  source_to_load_efficiency: 0.8928   # DC-coupled PV: 0.96 x 0.93\n",
                      "");
  const SiteConditions s = load_text(text).site;
  CHECK(s.design_margin == 1.0);
  CHECK(s.source_to_load_efficiency == 1.0);  // an AC-coupled source
  CHECK_FALSE(s.backup_price_per_kwh);
  CHECK_FALSE(s.unserved_limit_fraction);
  CHECK(s.unserved_penalty_per_kwh == 0);
}

TEST_CASE("the charging price can come from a CSV column", "[catalog][site]") {
  std::string csv = "load_kw,source_kw,temp_c,price_tou_per_kwh\n";
  for (int h = 0; h < 8760; ++h) csv += "1,2,15," + std::string(h % 24 < 7 ? "0.1" : "0.3") + "\n";
  // The CSV is read through the site's base_dir; write it there for a stream-loaded site.
  const testing::TempDir temp;
  temp.write("tou.csv", csv);
  const std::string dir = temp.path();
  std::string text = replace_once(site_text(), "hourly: hourly.csv", "hourly: tou.csv");
  text = replace_once(text, "per_kwh: 0.02", "column: price_tou_per_kwh");
  std::istringstream in(text);
  const LoadedSite loaded = load_site_details(in, kName, dir);
  REQUIRE(loaded.price_column);
  CHECK(*loaded.price_column == "price_tou_per_kwh");
  CHECK(loaded.site.charge_price_per_kwh[3] == 0.1);
  CHECK(loaded.site.charge_price_per_kwh[12] == 0.3);

  const std::string absent = replace_once(site_text(), "per_kwh: 0.02", "column: price_per_kwh");
  const InputError e = expect_input_error([&] { load_text(absent); }, kName,
                                          line_of(absent, "column:"), "site.charging_price.column");
  CHECK_THAT(e.message(), Catch::Contains("has no column 'price_per_kwh'"));
}

TEST_CASE("site errors name the site file, CSV errors the CSV", "[catalog][site][bad]") {
  SECTION("an efficiency above 1") {
    const std::string text =
        replace_once(site_text(), "charger_efficiency: 0.96", "charger_efficiency: 1.2");
    expect_input_error([&] { load_text(text); }, kName, line_of(text, "charger_efficiency"),
                       "site.charger_efficiency");
  }
  SECTION("a source-to-load efficiency outside (0, 1]") {
    for (const std::string bad : {"1.05", "0", "-0.9"}) {
      INFO("source_to_load_efficiency: " << bad);
      const std::string text = replace_once(site_text(), "source_to_load_efficiency: 0.8928",
                                            "source_to_load_efficiency: " + bad);
      const InputError e = expect_input_error([&] { load_text(text); }, kName,
                                              line_of(text, "source_to_load_efficiency"),
                                              "site.source_to_load_efficiency");
      CHECK_THAT(e.message(), Catch::Contains(bad == "1.05" ? "must be <= 1" : "must be > 0"));
    }
  }
  SECTION("both charging price forms") {
    const std::string text = replace_once(site_text(), "    per_kwh: 0.02\n",
                                          "    per_kwh: 0.02\n    column: price_per_kwh\n");
    const InputError e = expect_input_error([&] { load_text(text); }, kName,
                                            line_of(text, "column:"), "site.charging_price.column");
    CHECK_THAT(e.message(), Catch::Contains("exactly one of per_kwh and column"));
  }
  SECTION("a missing hourly CSV is reported at site.hourly") {
    const std::string text = replace_once(site_text(), "hourly: hourly.csv", "hourly: nowhere.csv");
    const InputError e = expect_input_error([&] { load_text(text); }, kName,
                                            line_of(text, "hourly:"), "site.hourly");
    CHECK_THAT(e.message(), Catch::Contains("nowhere.csv"));
    CHECK_THAT(e.message(), Catch::Contains("No such file"));
  }
  SECTION("a design margin below 1") {
    const std::string text = replace_once(site_text(), "design_margin: 1.1", "design_margin: 0.9");
    CHECK_THAT(expect_input_error([&] { load_text(text); }, kName, line_of(text, "design_margin"),
                                  "site.design_margin")
                   .message(),
               Catch::Contains("must be >= 1"));
  }
  SECTION("an unserved limit above 1") {
    const std::string text =
        replace_once(site_text(), "limit_fraction: 0.001", "limit_fraction: 2");
    expect_input_error([&] { load_text(text); }, kName, line_of(text, "limit_fraction"),
                       "site.unserved.limit_fraction");
  }
}

}  // namespace
}  // namespace stowage
