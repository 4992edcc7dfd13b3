// SPDX-License-Identifier: MIT
// Loading a chemistry profile file (format: docs/input-format.md, schema:
// schemas/profile.schema.json) into a validated ChemistryProfile.
//
// Order of checks: YAML syntax, then the embedded schema (structure, types, ranges, unknown
// keys), then the rules that relate values to each other: mean_charge_v > mean_discharge_v,
// dod.min <= dod.default <= dod.max, cycle-life DoDs unique and cycles strictly falling as DoD
// grows, capacity-factor temperatures strictly increasing, operating/charging min < max, every
// `sources` key naming a field present in the profile, cell.capacity_ah at most
// kMaxCellCapacityAh (input_limits.h). Finally the model's own validate() runs;
// should it refuse a value the loader let through, its field path is mapped back to the node.
// Every failure is an InputError naming the file, line, column and field path
// ("profile.ageing.cycle_life[2].cycles", paths as written in the file).
// Warnings (the profile loads, but a value deserves a second look) are collected in
// LoadedProfile::warnings in the same "FILE:LINE:COL: FIELD: message" form and passed to the
// warning sink (standard error by default). Today one warning exists: a cycle-life curve whose
// lifetime throughput (cycles x DoD, in full cycles) falls by more than 1 % from a deeper point
// to a shallower one, i.e. shallow cycles would wear more per kWh than deep ones, which the
// published curves do not show; the model then favours deep DoD setpoints and overstates the
// wear of lightly cycled banks (docs/method.md section 5).
// Confidence labels: `confidence:` maps field paths (as `sources:`) to sourced | from-memory |
// illustrative; a key covers the field it names and everything inside it, and the most
// specific key applies.
// Optional fields that are absent keep the defaults of the model structs, which equal the
// schema's "default" values (a test checks this).
#pragma once

#include <functional>
#include <istream>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "catalog-schema/input_error.h"  // what the readers throw
#include "model/chemistry_profile.h"

namespace stowage {

// Where a value was read, for errors found later by comparing files (duplicate ids, currency).
struct SourcePosition {
  std::string file;
  int line = 1;
  int column = 1;
};

// How sure a profile value is: read in a named document (a standard, handbook, paper, or a fact
// of the trade), recalled but not checked, or chosen for the demo.
enum class ValueConfidence { Sourced, FromMemory, Illustrative };
const char* confidence_name(ValueConfidence c);  // "sourced", "from-memory", "illustrative"

struct LoadedProfile {
  ChemistryProfile profile;
  std::string currency;                               // costs.currency, e.g. "EUR"
  std::map<std::string, std::string> sources;         // dotted field path -> source text
  std::map<std::string, ValueConfidence> confidence;  // dotted field path -> label
  std::vector<std::string> warnings;                  // "FILE:LINE:COL: FIELD: message"
  std::string path;                                   // the source name the profile was read under
  SourcePosition id_at;                               // position of profile.id
  SourcePosition currency_at;                         // position of profile.costs.currency
};

LoadedProfile load_profile_details(std::istream& in, const std::string& source_name);
LoadedProfile load_profile_details_file(const std::string& path);

ChemistryProfile load_profile(std::istream& in, const std::string& source_name);
ChemistryProfile load_profile_file(const std::string& path);

// True when `sources` has a key covering `field` (both relative to "profile"): the key equals
// the field, or names an enclosing field ("ageing.cycle_life" covers
// "ageing.cycle_life[3].cycles", "costs" covers "costs.capital_per_kwh").
bool source_covers(const std::map<std::string, std::string>& sources, const std::string& field);

// The label of the most specific `confidence` key covering `field`; nullopt when none does.
std::optional<ValueConfidence> confidence_of(const LoadedProfile& loaded, const std::string& field);

// Where loader warnings go; the default writes "warning: <text>" lines to standard error. Pass
// an empty function to restore the default. Returns the previous sink.
using WarningSink = std::function<void(const std::string&)>;
WarningSink set_warning_sink(WarningSink sink);

}  // namespace stowage
