// SPDX-License-Identifier: MIT
// Profile files: a complete and a minimal profile load to the right values; each broken rule
// gives an InputError at the right line and field.
#include "catalog-schema/profile_loader.h"

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

const char* const kName = "bad-profile.yaml";

std::string full_profile() { return read_text(fixture_path("lfp-test.yaml")); }

LoadedProfile load_text(const std::string& text) {
  std::istringstream in(text);
  return load_profile_details(in, kName);
}

// Loads `text` expecting an InputError at the line of `line_needle` and the given field;
// returns the message.
std::string profile_error(const std::string& text, const std::string& line_needle,
                          const std::string& field) {
  return expect_input_error([&] { load_text(text); }, kName, line_of(text, line_needle), field)
      .message();
}

TEST_CASE("a cycle-life curve whose throughput falls toward shallow DoD loads with a warning",
          "[catalog][profile]") {
  // Lifetime throughput in full cycles, cycles x DoD: 15000 x 0.2 = 3000 against 6000 x 0.8 =
  // 4800 would have shallow cycles wear more per kWh than deep ones, which no published curve
  // shows (constant Ah-throughput bound, common practice; docs/method.md 5). The loader warns at
  // the shallow point and still loads.
  std::vector<std::string> seen;
  const WarningSink previous =
      set_warning_sink([&](const std::string& text) { seen.push_back(text); });
  const std::string base = full_profile();
  const std::size_t from = base.find("    cycle_life:");
  const std::size_t to = base.find("    calendar_life_years:");
  REQUIRE(from != std::string::npos);
  REQUIRE(to != std::string::npos);
  const std::string text = base.substr(0, from) +
                           "    cycle_life:\n"
                           "      - {dod: 0.2, cycles: 15000}\n"
                           "      - {dod: 0.8, cycles: 6000}\n"
                           "      - {dod: 1.0, cycles: 4000}\n" +
                           base.substr(to);
  const LoadedProfile loaded = load_text(text);
  REQUIRE(loaded.warnings.size() == 1);
  CHECK(seen == loaded.warnings);
  const std::string& w = loaded.warnings[0];
  CHECK_THAT(w, Catch::StartsWith(std::string(kName) + ":" +
                                  std::to_string(line_of(text, "cycles: 15000")) + ":"));
  CHECK_THAT(w, Catch::Contains("profile.ageing.cycle_life[0].cycles"));
  CHECK_THAT(w, Catch::Contains("3000 full cycles"));
  CHECK_THAT(w, Catch::Contains("4800 at DoD 0.8"));
  CHECK_THAT(w, Catch::Contains("more per kWh"));
  // Constant throughput (4800 / DoD) is the bound itself: no warning.
  seen.clear();
  const std::string flat = replace_once(text, "cycles: 15000", "cycles: 24000");
  CHECK(load_text(flat).warnings.empty());
  CHECK(seen.empty());
  set_warning_sink(previous);
}

TEST_CASE("an absorption stage with a full-charge SOC of 1 is refused at that field",
          "[catalog][profile][bad]") {
  // A tapered charge approaches full charge only asymptotically (docs/method.md 4, step 3), so
  // a full charge at SOC 1 would never count and every day would add partial-charge damage.
  std::string text = read_text(fixture_path("lead-test.yaml"));
  text = replace_once(text, "    max_charge_c_rate: 0.2\n",
                      "    max_charge_c_rate: 0.2\n    absorption_soc: 0.8\n");
  text = replace_once(text, "      grace_days: 10\n",
                      "      full_charge_soc: 1.0\n      grace_days: 10\n");
  const std::string message =
      profile_error(text, "full_charge_soc: 1.0", "profile.ageing.partial_charge.full_charge_soc");
  CHECK_THAT(message, Catch::Contains("asymptotically"));
}

TEST_CASE("confidence labels cover fields and take only the three words", "[catalog][profile]") {
  const std::string text = full_profile() +
                           "  confidence:\n"
                           "    cell: from-memory\n"
                           "    cell.nominal_v: sourced\n"
                           "    costs: illustrative\n";
  const LoadedProfile loaded = load_text(text);
  CHECK(confidence_of(loaded, "cell.nominal_v") == ValueConfidence::Sourced);
  CHECK(confidence_of(loaded, "cell.capacity_ah") == ValueConfidence::FromMemory);
  CHECK(confidence_of(loaded, "costs.capital_per_kwh") == ValueConfidence::Illustrative);
  CHECK_FALSE(confidence_of(loaded, "ageing.calendar_life_years"));
  CHECK(std::string(confidence_name(ValueConfidence::FromMemory)) == "from-memory");
  profile_error(replace_once(text, "costs: illustrative", "costs: guessed"), "costs: guessed",
                "profile.confidence.costs");
  profile_error(replace_once(text, "cell.nominal_v: sourced", "cell.nominal_volts: sourced"),
                "cell.nominal_volts: sourced", "profile.confidence.cell.nominal_volts");
}

TEST_CASE("a profile may give calendar ageing its own law and an SOC stress",
          "[catalog][profile]") {
  std::string text = replace_once(full_profile(), "    activation_energy_j_per_mol: 50000\n",
                                  "    activation_energy_j_per_mol: 50000\n"
                                  "    calendar_law: {life_halving_interval_k: 8}\n");
  text = replace_once(text, "    calendar_life_years: 15\n",
                      "    calendar_life_years: 15\n"
                      "    calendar_soc_stress: {soc_exponent: 1.04, reference_soc: 0.5}\n");
  text = replace_once(text, "    self_discharge_per_month: 0.03\n",
                      "    self_discharge_per_month: 0.03\n    absorption_soc: 0.9\n");
  const ChemistryProfile p = load_text(text).profile;
  REQUIRE(p.temperature.spec().calendar_law);
  CHECK(*p.temperature.spec().calendar_law == AgeingLaw::Halving);
  CHECK(p.temperature.spec().calendar_halving_interval_k == 8);
  REQUIRE(p.calendar_soc_stress);
  CHECK(p.calendar_soc_stress->soc_exponent == 1.04);
  CHECK(p.calendar_soc_stress->reference_soc == 0.5);
  REQUIRE(p.absorption_soc);
  CHECK(*p.absorption_soc == 0.9);
  // Both laws in the calendar block is a mistake the schema names.
  const std::string both = replace_once(text, "calendar_law: {life_halving_interval_k: 8}",
                                        "calendar_law: {life_halving_interval_k: 8, "
                                        "activation_energy_j_per_mol: 40000}");
  const std::string message = profile_error(
      both, "calendar_law:", "profile.temperature.calendar_law.life_halving_interval_k");
  CHECK(message.find("exactly one") != std::string::npos);
}

TEST_CASE("a complete profile loads every field into the model", "[catalog][profile]") {
  const LoadedProfile loaded = load_profile_details_file(fixture_path("lfp-test.yaml"));
  const ChemistryProfile& p = loaded.profile;
  CHECK(loaded.path == fixture_path("lfp-test.yaml"));
  CHECK(loaded.currency == "EUR");
  CHECK(p.id == "lfp-test");
  CHECK(p.family == "lithium-iron-phosphate");
  CHECK(p.description == "Test LiFePO4 cell, all fields given");
  CHECK(p.cell_nominal_v == 3.2);
  CHECK(p.cell_capacity_ah == 100);
  CHECK(p.capacity_rate_hours == 5);
  CHECK(p.mean_charge_v == 3.35);
  CHECK(p.mean_discharge_v == 3.2);
  CHECK(p.coulombic_efficiency == 0.99);
  CHECK(p.max_charge_c_rate == 0.5);
  CHECK(p.max_discharge_c_rate == 1.0);
  CHECK(p.peukert_exponent == 1.03);
  CHECK(p.self_discharge_per_month == 0.03);
  REQUIRE(p.cell_mass_kg);
  CHECK(*p.cell_mass_kg == 2.0);
  REQUIRE(p.cell_volume_l);
  CHECK(*p.cell_volume_l == 1.0);
  CHECK(p.dod.min == 0.2);
  CHECK(p.dod.max == 0.9);
  CHECK(p.dod.default_setpoint == 0.8);
  // Written out of order in the file; the curve holds them sorted by DoD.
  REQUIRE(p.cycle_life.points().size() == 3);
  CHECK(p.cycle_life.points()[0].dod == 0.2);
  CHECK(p.cycle_life.points()[1].cycles == 6000);
  CHECK(p.cycle_life.cycles_to_end_of_life(0.8) == Approx(3500));
  CHECK(p.calendar_life_years == 15);
  REQUIRE(p.max_service_years);
  CHECK(*p.max_service_years == 20);
  CHECK(p.eol_capacity_fraction == 0.7);
  CHECK_FALSE(p.partial_charge);
  const TemperatureSpec& t = p.temperature.spec();
  CHECK(t.reference_temp_c == 25);
  REQUIRE(t.capacity_factor.size() == 2);
  CHECK(t.capacity_factor[0].temp_c == -20);
  CHECK(t.capacity_factor[0].factor == 0.6);
  CHECK(t.law == AgeingLaw::Arrhenius);
  CHECK(t.activation_energy_j_per_mol == 50000);
  CHECK(t.operating_min_c == -20);
  CHECK(t.operating_max_c == 55);
  CHECK(t.charge_min_c == 0);
  CHECK(t.charge_max_c == 45);
  CHECK(p.costs.capital_per_kwh == 400);
  CHECK(p.costs.capital_per_string == 200);
  CHECK(p.costs.installation_fixed == 1500);
  CHECK(p.costs.fixed_om_per_kwh_year == 2);
  CHECK(p.costs.variable_om_per_mwh == 1.5);
  CHECK(p.costs.replacement_share == 0.9);
  CHECK(p.costs.price_decline_per_year == 0.03);
  CHECK(p.costs.end_of_life_per_kwh == -5);
  REQUIRE(p.costs.replacement_end_of_life_per_kwh);
  CHECK(*p.costs.replacement_end_of_life_per_kwh == 3);
  CHECK(loaded.sources.size() == 4);
  CHECK(loaded.sources.at("cell") == "common practice");
  // Positions kept for cross-file errors: id on line 5, currency on line 39 of the fixture.
  CHECK(loaded.id_at.line == 5);
  CHECK(loaded.currency_at.line == 39);
  CHECK(loaded.currency_at.column == 15);
}

TEST_CASE("a minimal profile gets the documented defaults", "[catalog][profile]") {
  const ChemistryProfile p = load_profile_file(fixture_path("lead-test.yaml"));
  CHECK(p.description.empty());
  CHECK(p.capacity_rate_hours == 10);
  CHECK(p.peukert_exponent == 1);
  CHECK(p.self_discharge_per_month == 0);
  CHECK_FALSE(p.cell_mass_kg);
  CHECK_FALSE(p.cell_volume_l);
  CHECK_FALSE(p.max_service_years);
  CHECK(p.eol_capacity_fraction == 0.8);
  REQUIRE(p.partial_charge);
  CHECK(p.partial_charge->full_charge_soc == 0.98);
  CHECK(p.partial_charge->max_days_without_full_charge == 10);
  CHECK(p.partial_charge->damage_per_extra_day == 0.0005);
  CHECK(p.temperature.spec().law == AgeingLaw::Halving);
  CHECK(p.temperature.spec().halving_interval_k == 10);
  // Life halves per 10 K above the 20 degC reference (the European convention of the brief).
  CHECK(p.temperature.ageing_acceleration(30) == Approx(2.0));
  CHECK(p.costs.capital_per_string == 0);
  CHECK(p.costs.installation_fixed == 0);
  CHECK(p.costs.fixed_om_per_kwh_year == 0);
  CHECK(p.costs.variable_om_per_mwh == 0);
  CHECK(p.costs.replacement_share == 1);
  CHECK(p.costs.price_decline_per_year == 0);
  CHECK(p.costs.end_of_life_per_kwh == 0);
  CHECK_FALSE(p.costs.replacement_end_of_life_per_kwh);  // end_of_life_per_kwh applies
}

TEST_CASE("a missing required field is named with its full path", "[catalog][profile][bad]") {
  const std::string text = replace_once(full_profile(), "    capacity_ah: 100\n", "");
  const std::string message = profile_error(text, "nominal_v", "profile.cell.capacity_ah");
  CHECK_THAT(message, Catch::Contains("required key 'capacity_ah' is missing"));
}

TEST_CASE("a value of the wrong type is refused", "[catalog][profile][bad]") {
  SECTION("text for a number") {
    const std::string text = replace_once(full_profile(), "nominal_v: 3.2", "nominal_v: high");
    CHECK_THAT(profile_error(text, "nominal_v", "profile.cell.nominal_v"),
               Catch::Contains("expected a number, found the text 'high'"));
  }
  SECTION("a quoted number is text, with a hint") {
    const std::string text = replace_once(full_profile(), "nominal_v: 3.2", "nominal_v: \"3.2\"");
    CHECK_THAT(profile_error(text, "nominal_v", "profile.cell.nominal_v"),
               Catch::Contains("remove the quotes"));
  }
  SECTION("a list for a mapping") {
    const std::string text = replace_once(
        full_profile(), "  dod: {min: 0.2, max: 0.9, default: 0.8}", "  dod: [0.2, 0.9, 0.8]");
    CHECK_THAT(profile_error(text, "dod:", "profile.dod"), Catch::Contains("expected a mapping"));
  }
  SECTION("not-a-number is not a finite number") {
    const std::string text = replace_once(full_profile(), "capacity_ah: 100", "capacity_ah: .nan");
    CHECK_THAT(profile_error(text, "capacity_ah", "profile.cell.capacity_ah"),
               Catch::Contains("finite"));
  }
}

TEST_CASE("the end-of-life cost at a replacement may differ from the project's end",
          "[catalog][profile]") {
  // Test values: a salvage credit for the whole bank, a disposal cost for what a replacement
  // removes (the flow-battery case: stacks out, electrolyte kept).
  const std::string salvage = replace_once(full_profile(), "replacement_end_of_life_per_kwh: 3",
                                           "replacement_end_of_life_per_kwh: -2.5");
  const ChemistryProfile p = load_text(salvage).profile;
  CHECK(p.costs.end_of_life_per_kwh == -5);
  REQUIRE(p.costs.replacement_end_of_life_per_kwh);
  CHECK(*p.costs.replacement_end_of_life_per_kwh == -2.5);  // negative = salvage, allowed

  const std::string quoted = replace_once(full_profile(), "replacement_end_of_life_per_kwh: 3",
                                          "replacement_end_of_life_per_kwh: \"3\"");
  CHECK_THAT(profile_error(quoted, "replacement_end_of_life_per_kwh",
                           "profile.costs.replacement_end_of_life_per_kwh"),
             Catch::Contains("remove the quotes"));
  const std::string nan = replace_once(full_profile(), "replacement_end_of_life_per_kwh: 3",
                                       "replacement_end_of_life_per_kwh: .nan");
  CHECK_THAT(profile_error(nan, "replacement_end_of_life_per_kwh",
                           "profile.costs.replacement_end_of_life_per_kwh"),
             Catch::Contains("finite"));
}

TEST_CASE("auxiliary loads are read, and a load of 1 kW per kWh or more is refused",
          "[catalog][profile]") {
  // Test values, not data: 0.002 kW of standing load per kWh, pumps at 4 % of throughput.
  const std::string text =
      replace_once(full_profile(), "  sources:\n",
                   "  auxiliary: {standing_kw_per_kwh: 0.002, pump_kw_per_kw: 0.04}\n  sources:\n");
  const ChemistryProfile p = load_text(text).profile;
  CHECK(p.auxiliary.standing_kw_per_kwh == 0.002);
  CHECK(p.auxiliary.pump_kw_per_kw == 0.04);
  // eta_RT (1 - a_p) / (1 + a_p), by hand from the fixture's round trip.
  CHECK(p.round_trip_with_pumps() == Approx(p.round_trip_efficiency() * 0.96 / 1.04));

  const std::string whole = replace_once(text, "pump_kw_per_kw: 0.04", "pump_kw_per_kw: 1");
  profile_error(whole, "pump_kw_per_kw", "profile.auxiliary.pump_kw_per_kw");
  const std::string unknown =
      replace_once(text, "pump_kw_per_kw: 0.04", "pump_kw_per_kw: 0.04, fans_kw: 1");
  profile_error(unknown, "fans_kw", "profile.auxiliary.fans_kw");
}

TEST_CASE("a negative capacity is refused", "[catalog][profile][bad]") {
  const std::string text = replace_once(full_profile(), "capacity_ah: 100", "capacity_ah: -100");
  CHECK_THAT(profile_error(text, "capacity_ah", "profile.cell.capacity_ah"),
             Catch::Contains("must be > 0, found -100"));
}

TEST_CASE("cycle-life points must fall as DoD grows", "[catalog][profile][bad]") {
  SECTION("more cycles at a deeper DoD") {
    const std::string text =
        replace_once(full_profile(), "{dod: 0.5, cycles: 6000}", "{dod: 0.5, cycles: 2000}");
    // Sorted: 0.2 -> 9000, 0.5 -> 2000, 0.8 -> 3500; the 0.8 point (entry 0) is out of line
    // with the 0.5 point (entry 2), reported at the later one in the file.
    const std::string message =
        profile_error(text, "{dod: 0.5", "profile.ageing.cycle_life[2].cycles");
    CHECK_THAT(message, Catch::Contains("must fall as DoD grows"));
    CHECK_THAT(message, Catch::Contains("entry 0"));
  }
  SECTION("the same DoD twice") {
    const std::string text =
        replace_once(full_profile(), "{dod: 0.5, cycles: 6000}", "{dod: 0.8, cycles: 6000}");
    CHECK_THAT(profile_error(text, "{dod: 0.8, cycles: 6000}", "profile.ageing.cycle_life[2].dod"),
               Catch::Contains("appears twice"));
  }
  SECTION("a single point is not a curve") {
    std::string text = replace_once(full_profile(), "      - {dod: 0.2, cycles: 9000}\n", "");
    text = replace_once(text, "      - {dod: 0.5, cycles: 6000}\n", "");
    CHECK_THAT(profile_error(text, "{dod: 0.8", "profile.ageing.cycle_life"),
               Catch::Contains("at least 2 entries"));
  }
}

TEST_CASE("DoD values must lie in (0, 1]", "[catalog][profile][bad]") {
  SECTION("above 1") {
    const std::string text = replace_once(full_profile(), "max: 0.9, default", "max: 1.2, default");
    CHECK_THAT(profile_error(text, "dod: {", "profile.dod.max"),
               Catch::Contains("must be <= 1, found 1.2"));
  }
  SECTION("zero") {
    const std::string text =
        replace_once(full_profile(), "{min: 0.2, max: 0.9", "{min: 0, max: 0.9");
    CHECK_THAT(profile_error(text, "dod: {", "profile.dod.min"), Catch::Contains("must be > 0"));
  }
  SECTION("cycle-life DoD") {
    const std::string text = replace_once(full_profile(), "{dod: 0.2, cycles", "{dod: 1.5, cycles");
    CHECK_THAT(profile_error(text, "{dod: 1.5", "profile.ageing.cycle_life[1].dod"),
               Catch::Contains("must be <= 1"));
  }
}

TEST_CASE("the default DoD must lie within [min, max]", "[catalog][profile][bad]") {
  const std::string text = replace_once(full_profile(), "default: 0.8}", "default: 0.95}");
  CHECK_THAT(profile_error(text, "dod: {", "profile.dod.default"), Catch::Contains("[0.2, 0.9]"));
  const std::string swapped = replace_once(full_profile(), "{min: 0.2, max: 0.9, default: 0.8}",
                                           "{min: 0.9, max: 0.2, default: 0.5}");
  CHECK_THAT(profile_error(swapped, "dod: {", "profile.dod.min"),
             Catch::Contains("must not exceed dod.max"));
}

TEST_CASE("exactly one of halving interval and activation energy", "[catalog][profile][bad]") {
  SECTION("both") {
    const std::string text =
        replace_once(full_profile(), "    activation_energy_j_per_mol: 50000\n",
                     "    activation_energy_j_per_mol: 50000\n    life_halving_interval_k: 10\n");
    CHECK_THAT(profile_error(text, "life_halving_interval_k",
                             "profile.temperature.life_halving_interval_k"),
               Catch::Contains("exactly one of life_halving_interval_k and "
                               "activation_energy_j_per_mol; more than one"));
  }
  SECTION("neither") {
    const std::string text =
        replace_once(full_profile(), "    activation_energy_j_per_mol: 50000\n", "");
    CHECK_THAT(profile_error(text, "reference_c", "profile.temperature"),
               Catch::Contains("none is given"));
  }
}

TEST_CASE("an unknown key is refused with a suggestion", "[catalog][profile][bad]") {
  const std::string text = replace_once(full_profile(), "capacity_ah: 100", "capacty_ah: 100");
  // Only the typo is reported, not also "capacity_ah is missing".
  CHECK(profile_error(text, "capacty_ah", "profile.cell.capacty_ah") ==
        "unknown key 'capacty_ah' (did you mean 'capacity_ah'?)");
  const std::string far =
      replace_once(full_profile(), "capacity_ah: 100", "capacity_ah: 100\n    colour: blue");
  CHECK_THAT(profile_error(far, "colour", "profile.cell.colour"),
             Catch::Contains("allowed here: nominal_v, capacity_ah"));
}

TEST_CASE("a profile's family is an open label: a chemistry of the user's own is accepted",
          "[catalog][profile]") {
  // Issue 8, item 7: no guess at one of the shipped families is needed.
  const std::string own =
      replace_once(full_profile(), "family: lithium-iron-phosphate", "family: lead-carbon");
  const ChemistryProfile p = load_text(own).profile;
  CHECK(p.family == "lead-carbon");
  // The label changes no value the model reads: the profile loads to the same numbers.
  const ChemistryProfile shipped = load_text(full_profile()).profile;
  CHECK(shipped.family == "lithium-iron-phosphate");
  CHECK(shipped.round_trip_efficiency() == p.round_trip_efficiency());
  CHECK(shipped.costs.capital_per_kwh == p.costs.capital_per_kwh);
  // Still a label: lower-case letters, digits and '-'.
  const std::string spaced =
      replace_once(full_profile(), "family: lithium-iron-phosphate", "family: Lead Carbon");
  CHECK_THAT(profile_error(spaced, "family", "profile.family"), Catch::Contains("lower-case"));
}

TEST_CASE("enumerations and patterns are enforced with hints", "[catalog][profile][bad]") {
  const std::string confidence = full_profile() + "  confidence:\n    cell.nominal_v: sourcd\n";
  CHECK_THAT(
      profile_error(confidence, "cell.nominal_v: sourcd", "profile.confidence.cell.nominal_v"),
      Catch::Contains("did you mean 'sourced'?"));
  const std::string id = replace_once(full_profile(), "id: lfp-test", "id: LFP Test");
  CHECK_THAT(profile_error(id, "id:", "profile.id"), Catch::Contains("lower-case"));
  const std::string currency = replace_once(full_profile(), "currency: EUR", "currency: euro");
  CHECK_THAT(profile_error(currency, "currency", "profile.costs.currency"),
             Catch::Contains("three-letter"));
}

TEST_CASE("values that relate to each other are checked", "[catalog][profile][bad]") {
  SECTION("charge voltage above discharge voltage") {
    const std::string text =
        replace_once(full_profile(), "mean_charge_v: 3.35", "mean_charge_v: 3.1");
    CHECK_THAT(profile_error(text, "mean_charge_v", "profile.cell.mean_charge_v"),
               Catch::Contains("must be above mean_discharge_v"));
  }
  SECTION("capacity-factor temperatures increase") {
    const std::string text =
        replace_once(full_profile(), "{temp_c: 25, factor: 1.0}", "{temp_c: -20, factor: 1.0}");
    CHECK_THAT(profile_error(text, "{temp_c: -20, factor: 1.0}",
                             "profile.temperature.capacity_factor[1].temp_c"),
               Catch::Contains("must increase"));
  }
  SECTION("operating range min below max") {
    const std::string text = replace_once(full_profile(), "operating_c: {min: -20, max: 55}",
                                          "operating_c: {min: 55, max: -20}");
    CHECK_THAT(profile_error(text, "operating_c", "profile.temperature.operating_c.min"),
               Catch::Contains("must be below operating_c.max"));
  }
  SECTION("a sources key names a field that exists") {
    const std::string text =
        replace_once(full_profile(), "    dod.min: test value", "    dod.minimum: test value");
    CHECK_THAT(profile_error(text, "dod.minimum", "profile.sources.dod.minimum"),
               Catch::Contains("names no field of this profile"));
  }
}

TEST_CASE("a rule only the model checks is still located in the file", "[catalog][profile][bad]") {
  // Below absolute zero: the schema only asks for a number, TemperatureBehaviour refuses it.
  const std::string text = replace_once(full_profile(), "reference_c: 25", "reference_c: -300");
  CHECK_THAT(profile_error(text, "reference_c", "profile.temperature.reference_c"),
             Catch::Contains("absolute zero"));
}

TEST_CASE("a key given twice is refused", "[catalog][profile][bad]") {
  const std::string text = replace_once(full_profile(), "    capacity_ah: 100\n",
                                        "    capacity_ah: 100\n    capacity_ah: 120\n");
  CHECK_THAT(profile_error(text, "capacity_ah: 120", "profile.cell.capacity_ah"),
             Catch::Contains("duplicate key 'capacity_ah' (first given on line 10)"));
}

TEST_CASE("a YAML syntax error names the line and the block", "[catalog][profile][bad]") {
  const std::string text =
      replace_once(full_profile(), "charging_c: {min: 0, max: 45}", "charging_c: {min: 0, max: 45");
  try {
    load_text(text);
    FAIL("no error");
  } catch (const InputError& e) {
    INFO(e.what());
    CHECK(e.file() == kName);
    CHECK_THAT(e.message(), Catch::StartsWith("YAML syntax error"));
    // yaml-cpp notices the unclosed flow mapping on the line or the next one.
    CHECK(e.line() >= line_of(text, "charging_c"));
    CHECK(e.line() <= line_of(text, "charging_c") + 1);
    CHECK_THAT(e.field(), Catch::StartsWith("profile.temperature"));
  }
}

TEST_CASE("empty or misshapen documents are refused, not crashed on", "[catalog][profile][bad]") {
  expect_input_error(
      [] {
        std::istringstream in("");
        load_profile(in, kName);
      },
      kName, 1, "profile");
  expect_input_error(
      [] {
        std::istringstream in("- 1\n- 2\n");
        load_profile(in, kName);
      },
      kName, 1, "(top level)");
  expect_input_error(
      [] {
        std::istringstream in("profile: 3\n");
        load_profile(in, kName);
      },
      kName, 1, "profile");
}

TEST_CASE("an unreadable profile file is an InputError naming the path",
          "[catalog][profile][bad]") {
  const std::string missing = fixture_path("no-such-profile.yaml");
  const InputError e =
      expect_input_error([&] { load_profile_file(missing); }, missing, 1, "profile");
  CHECK_THAT(e.message(), Catch::Contains("No such file"));
  const std::string directory = fixture_path("");
  CHECK_THROWS_AS(load_profile_file(directory), InputError);
}

TEST_CASE("source coverage counts enclosing keys", "[catalog][profile]") {
  const std::map<std::string, std::string> sources = {
      {"ageing.cycle_life", "x"}, {"costs", "y"}, {"cell.nominal_v", "z"}};
  CHECK(source_covers(sources, "ageing.cycle_life[3].cycles"));
  CHECK(source_covers(sources, "costs.capital_per_kwh"));
  CHECK(source_covers(sources, "cell.nominal_v"));
  CHECK_FALSE(source_covers(sources, "cell.nominal_v_extra"));
  CHECK_FALSE(source_covers(sources, "cell.capacity_ah"));
  CHECK_FALSE(source_covers(sources, "ageing.calendar_life_years"));
}

}  // namespace
}  // namespace stowage
