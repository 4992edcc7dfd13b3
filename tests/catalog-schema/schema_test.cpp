// SPDX-License-Identifier: MIT
// The JSON Schemas: embedded as written, fully documented (every field has a description and
// appears in docs/input-format.md), defaults equal to the model's, and the validator enforces
// each supported keyword.
#include <algorithm>
#include <catch2/catch.hpp>
#include <cmath>
#include <functional>
#include <limits>
#include <sstream>

#include "catalog-schema/embedded_schemas.h"
#include "catalog-schema/profile_loader.h"
#include "catalog-schema/schema_validator.h"
#include "catalog-schema/site_loader.h"
#include "catalog-schema/yaml_document.h"
#include "catalog_test_support.h"

namespace stowage {
namespace {

using testing::fixture_path;
using testing::read_text;
using testing::source_path;

const std::vector<std::string> kSchemas = {"bid", "profile", "site", "study", "tender"};

// Calls `visit(path, schema)` for every property below `schema` (after $ref), with list
// entries written "[]".
void each_property(const SchemaValidator& validator, const YAML::Node& schema,
                   const std::string& path,
                   const std::function<void(const std::string&, const YAML::Node&)>& visit) {
  const YAML::Node s = validator.resolve(schema);
  if (const YAML::Node props = s["properties"]) {
    for (auto it = props.begin(); it != props.end(); ++it) {
      const std::string child = join_key(path, it->first.Scalar());
      visit(child, it->second);
      each_property(validator, it->second, child, visit);
    }
  }
  if (const YAML::Node items = s["items"]) each_property(validator, items, path + "[]", visit);
}

YamlDocument parse(const std::string& text) {
  std::istringstream in(text);
  return parse_yaml(in, "t.yaml");
}

std::vector<std::string> messages(const SchemaValidator& v, const std::string& text) {
  std::vector<std::string> out;
  for (const InputError& e : v.check(parse(text))) out.push_back(e.what());
  return out;
}

TEST_CASE("the embedded schemas are the files in catalog-schema/schemas", "[catalog][schema]") {
  std::vector<std::string> names;
  for (const std::string_view n : embedded_schema_names()) names.emplace_back(n);
  CHECK(names == kSchemas);
  for (const std::string& name : kSchemas) {
    const std::string file =
        read_text(source_path("catalog-schema/schemas/" + name + ".schema.json"));
    CHECK(std::string(embedded_schema(name)) == file);
    // Plain ASCII, so the embedding never splits a multi-byte character between literals.
    CHECK(std::none_of(file.begin(), file.end(),
                       [](char c) { return static_cast<unsigned char>(c) >= 0x80; }));
  }
  CHECK(embedded_schema("nonsense").empty());
  CHECK_THROWS_AS(SchemaValidator::embedded("nonsense"), std::out_of_range);
}

TEST_CASE("every schema field has a description and is in docs/input-format.md",
          "[catalog][schema][docs]") {
  const std::string docs = read_text(source_path("docs/input-format.md"));
  std::size_t fields = 0;
  for (const std::string& name : kSchemas) {
    const SchemaValidator& v = SchemaValidator::embedded(name);
    each_property(v, v.schema(), "", [&](const std::string& path, const YAML::Node& schema) {
      INFO(name << " schema, field " << path);
      ++fields;
      const bool described = schema["description"] || v.resolve(schema)["description"];
      CHECK(described);
      CHECK(docs.find("`" + path + "`") != std::string::npos);
    });
  }
  CHECK(fields > 80);
}

// Emitted as text, so two schema nodes compare by content.
std::string emitted(const YAML::Node& node) {
  YAML::Emitter out;
  out << node;
  return out.c_str();
}

TEST_CASE("a tender's variation entries are the study's, but for the example of a path",
          "[catalog][schema][tender]") {
  // The tender schema carries its own copy of the variation and distribution definitions
  // (the validator resolves only local references); this keeps the two from drifting apart.
  YAML::Node study = YAML::Clone(SchemaValidator::embedded("study").schema()["$defs"]);
  YAML::Node tender = YAML::Clone(SchemaValidator::embedded("tender").schema()["$defs"]);
  REQUIRE(tender["variation"]);
  REQUIRE(tender["distribution"]);
  CHECK(emitted(tender["distribution"]) == emitted(study["distribution"]));
  CHECK_THAT(tender["variation"]["properties"]["path"]["description"].Scalar(),
             Catch::Contains("bids."));
  YAML::Node study_path = study["variation"]["properties"]["path"];
  study_path.remove("description");
  YAML::Node tender_path = tender["variation"]["properties"]["path"];
  tender_path.remove("description");
  CHECK(emitted(tender["variation"]) == emitted(study["variation"]));
}

double schema_default(const std::string& schema_name, const std::string& path) {
  const SchemaValidator& v = SchemaValidator::embedded(schema_name);
  double value = std::numeric_limits<double>::quiet_NaN();
  each_property(v, v.schema(), "", [&](const std::string& p, const YAML::Node& schema) {
    if (p != path) return;
    const YAML::Node d = schema["default"] ? schema["default"] : v.resolve(schema)["default"];
    REQUIRE(d);
    value = *scalar_number(d);
  });
  REQUIRE(std::isfinite(value));
  return value;
}

TEST_CASE("schema defaults are the values an absent field gets", "[catalog][schema]") {
  // lead-test.yaml leaves out every optional field.
  const ChemistryProfile p = load_profile_file(fixture_path("lead-test.yaml"));
  CHECK(p.capacity_rate_hours == schema_default("profile", "profile.cell.capacity_rate_hours"));
  CHECK(p.peukert_exponent == schema_default("profile", "profile.cell.peukert_exponent"));
  CHECK(p.self_discharge_per_month ==
        schema_default("profile", "profile.cell.self_discharge_per_month"));
  CHECK(p.eol_capacity_fraction ==
        schema_default("profile", "profile.ageing.end_of_life_capacity"));
  CHECK(p.partial_charge->full_charge_soc ==
        schema_default("profile", "profile.ageing.partial_charge.full_charge_soc"));
  CHECK(p.costs.capital_per_string ==
        schema_default("profile", "profile.costs.capital_per_string"));
  CHECK(p.costs.installation_fixed ==
        schema_default("profile", "profile.costs.installation_fixed"));
  CHECK(p.costs.fixed_om_per_kwh_year ==
        schema_default("profile", "profile.costs.fixed_om_per_kwh_year"));
  CHECK(p.costs.variable_om_per_mwh ==
        schema_default("profile", "profile.costs.variable_om_per_mwh"));
  CHECK(p.costs.replacement_share == schema_default("profile", "profile.costs.replacement_share"));
  CHECK(p.costs.price_decline_per_year ==
        schema_default("profile", "profile.costs.price_decline_per_year"));
  CHECK(p.costs.end_of_life_per_kwh ==
        schema_default("profile", "profile.costs.end_of_life_per_kwh"));
  CHECK(p.auxiliary.standing_kw_per_kwh ==
        schema_default("profile", "profile.auxiliary.standing_kw_per_kwh"));
  CHECK(p.auxiliary.pump_kw_per_kw ==
        schema_default("profile", "profile.auxiliary.pump_kw_per_kw"));
  const SiteConditions defaults;
  CHECK(defaults.design_margin == schema_default("site", "site.design_margin"));
  CHECK(defaults.source_to_load_efficiency ==
        schema_default("site", "site.source_to_load_efficiency"));
  CHECK(defaults.unserved_penalty_per_kwh ==
        schema_default("site", "site.unserved.penalty_per_kwh"));
}

TEST_CASE("the validator refuses schemas it cannot enforce", "[catalog][schema]") {
  CHECK_THROWS_AS(SchemaValidator(R"({"type": "object", "anyOf": []})"), std::invalid_argument);
  CHECK_THROWS_AS(SchemaValidator(R"({"$ref": "#/$defs/none"})"), std::invalid_argument);
  CHECK_THROWS_AS(SchemaValidator(R"({"properties": {"a": {"format": "date"}}})"),
                  std::invalid_argument);
  CHECK_THROWS_AS(SchemaValidator("{not json"), std::invalid_argument);
  CHECK_NOTHROW(SchemaValidator(R"({"type": "object", "description": "x"})"));
}

TEST_CASE("the validator enforces each keyword it supports", "[catalog][schema]") {
  const SchemaValidator v(R"({
    "type": "object",
    "properties": {
      "n": {"type": "integer", "minimum": 1, "maximum": 9},
      "x": {"type": "number", "exclusiveMinimum": 0, "exclusiveMaximum": 1},
      "b": {"type": "boolean"},
      "s": {"type": "string", "minLength": 1, "pattern": "^[a-z]+$"},
      "e": {"enum": ["red", "green"]},
      "t": {"type": ["number", "null"]},
      "l": {"type": "array", "minItems": 2, "maxItems": 3, "items": {"$ref": "#/$defs/p"}},
      "m": {"type": "object", "additionalProperties": {"type": "number"}},
      "o": {"oneOf": [{"type": "number"}, {"type": "string"}]}
    },
    "required": ["n"],
    "additionalProperties": false,
    "$defs": {"p": {"type": "object", "properties": {"q": {"type": "number"}},
                    "required": ["q"], "additionalProperties": false}}
  })");
  CHECK(messages(v,
                 "n: 3\nx: 0.5\nb: true\ns: abc\ne: red\nt: ~\nl: [{q: 1}, {q: 2}]\n"
                 "m: {k: 1}\no: text\n")
            .empty());
  const auto one = [&](const std::string& text) {
    const std::vector<std::string> found = messages(v, text);
    INFO(text);
    REQUIRE(found.size() == 1);
    return found.front();
  };
  CHECK_THAT(one("n: 3.5\n"), Catch::Contains("t.yaml:1:4: n: expected a whole number"));
  CHECK_THAT(one("n: 0\n"), Catch::Contains("n: must be >= 1, found 0"));
  CHECK_THAT(one("n: 10\n"), Catch::Contains("must be <= 9"));
  CHECK(one("n: 4.0\nx: 1\n") == "t.yaml:2:4: x: must be < 1, found 1");
  CHECK_THAT(one("n: 1\nx: 0\n"), Catch::Contains("must be > 0"));
  CHECK_THAT(one("n: 1\nb: yes\n"), Catch::Contains("b: expected true or false"));
  CHECK_THAT(one("n: 1\ns: ''\n"), Catch::Contains("s: must not be empty"));
  CHECK_THAT(one("n: 1\ns: ABC\n"), Catch::Contains("not in the expected form ^[a-z]+$"));
  CHECK_THAT(one("n: 1\ne: blue\n"), Catch::Contains("use one of: red, green"));
  CHECK_THAT(one("n: 1\nt: [1]\n"), Catch::Contains("expected a number or nothing"));
  CHECK_THAT(one("n: 1\nl: [{q: 1}]\n"), Catch::Contains("l: needs at least 2 entries"));
  CHECK_THAT(one("n: 1\nl: [{q: 1}, {q: 1}, {q: 1}, {q: 1}]\n"), Catch::Contains("at most 3"));
  CHECK_THAT(one("n: 1\nl: [{q: 1}, {r: 1}]\n"), Catch::Contains("l[1].r: unknown key 'r'"));
  CHECK_THAT(one("n: 1\nm: {k: a}\n"), Catch::Contains("m.k: expected a number"));
  CHECK_THAT(one("n: 1\no: [1]\n"), Catch::Contains("o: must match exactly one of the 2"));
  CHECK_THAT(one("x: 0.5\n"), Catch::Contains("t.yaml:1:1: n: required key 'n' is missing"));
  CHECK_THAT(one("n: 1\nn: 2\n"), Catch::Contains("duplicate key 'n' (first given on line 1)"));
  CHECK_THAT(one("n:\n"), Catch::Contains("t.yaml:1:1: n: expected a whole number, found nothing"));
  // Several problems come back in document order.
  const std::vector<std::string> several = messages(v, "x: 2\nn: 0\nzz: 1\n");
  REQUIRE(several.size() == 3);
  CHECK_THAT(several[0], Catch::StartsWith("t.yaml:1:"));
  CHECK_THAT(several[1], Catch::StartsWith("t.yaml:2:"));
  CHECK_THAT(several[2], Catch::StartsWith("t.yaml:3:"));
}

TEST_CASE("near misses are suggested, far ones are not", "[catalog][schema]") {
  CHECK(closest_match("capacty_ah", {"nominal_v", "capacity_ah"}) == "capacity_ah");
  CHECK(closest_match("Nominal_V", {"nominal_v", "capacity_ah"}) == "nominal_v");
  CHECK(closest_match("colour", {"nominal_v", "capacity_ah"}).empty());
}

TEST_CASE("a swap of two adjacent letters is one edit, so 'lpf' suggests 'lfp'",
          "[catalog][schema]") {
  // Optimal string alignment distance (Damerau 1964): "lpf" -> "lfp" is the one swap p<->f;
  // plain Levenshtein counts two substitutions, above the limit 1 + 3 / 4 = 1 for three letters.
  CHECK(closest_match("lpf", {"vrla-agm", "lfp", "nicd"}) == "lfp");
  CHECK(closest_match("LPF", {"lfp"}) == "lfp");
  // One swap (pa -> ap) and one missing letter (h): distance 2, within 1 + 10 / 4 = 3.
  CHECK(closest_match("cpaacity_a", {"capacity_ah"}) == "capacity_ah");
}

TEST_CASE("YAML scalars are classified by the core schema", "[catalog][schema]") {
  const YamlDocument doc =
      parse("a: 3\nb: -2.5e3\nc: '3'\nd: .nan\ne: true\nf: ~\ng: 0x1F\nh: 1e999\n");
  const YAML::Node& r = doc.root();
  CHECK(scalar_kind(r["a"]) == ScalarKind::Integer);
  CHECK(*scalar_number(r["b"]) == -2500);
  CHECK(scalar_kind(r["c"]) == ScalarKind::Text);
  CHECK(scalar_kind(r["d"]) == ScalarKind::NonFiniteNumber);
  CHECK(scalar_kind(r["e"]) == ScalarKind::Boolean);
  CHECK(scalar_kind(r["f"]) == ScalarKind::Null);
  CHECK(scalar_kind(r["g"]) == ScalarKind::Text);  // hexadecimal is not accepted as a number
  CHECK(scalar_kind(r["h"]) == ScalarKind::NonFiniteNumber);
}

}  // namespace
}  // namespace stowage
