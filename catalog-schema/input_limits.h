// SPDX-License-Identifier: MIT
// Plausibility limits of the inputs, checked while loading so that `stowage check` reports them
// with file, line and field, and no later stage can run out of memory, loop for ever or cast a
// value it cannot hold. The limits are far beyond any battery bank stowage is meant for; a value
// past one is a unit mistake, a typo or a hostile file. docs/input-format.md ("Limits") lists
// them; a change here must change that table too (a test compares the two).
//
// Files: every input must be a regular file (a FIFO, a device or a directory is refused before
// it is opened, so nothing blocks in open() or reads without end) of at most kMaxYamlFileBytes
// (YAML) or kMaxCsvFileBytes (CSV); a CSV line may hold kMaxCsvLineBytes; YAML collections may
// nest kMaxYamlNestingDepth levels deep.
#pragma once

#include <yaml-cpp/yaml.h>

#include <cstddef>
#include <cstdint>
#include <string>

#include "catalog-schema/yaml_document.h"

namespace stowage {

// The largest shipped profile is under 6 kB; yaml-cpp takes up to about 400 bytes of memory per
// byte of a flat flow list, so this keeps the worst file near 100 MB.
constexpr std::uintmax_t kMaxYamlFileBytes = 256u << 10;  // 256 KiB
constexpr std::uintmax_t kMaxCsvFileBytes = 64u << 20;    // 64 MiB
constexpr std::size_t kMaxCsvLineBytes = 64u << 10;       // 64 KiB
// Columns of a CSV header: each price column holds 8760 values, so their number bounds memory.
constexpr std::size_t kMaxCsvColumns = 256;
// The deepest field of the formats (profile.temperature.capacity_factor[0].temp_c) is 5 levels.
constexpr int kMaxYamlNestingDepth = 20;
// Rows of a logged SOC series: four years at one row a minute.
constexpr std::size_t kMaxSocRows = 2'000'000;

constexpr long kMaxStringsParallel = 1000;    // designs[].strings_parallel, max_strings_parallel
constexpr std::size_t kMaxProfiles = 100;     // entries of study.profiles
constexpr std::size_t kMaxDesigns = 1000;     // entries of study.designs, each simulated
constexpr long kMaxDodLadderSetpoints = 101;  // a step of 0.01 over the whole (0, 1] range
constexpr double kMaxBusVoltageV = 1500;      // low voltage ends at 1500 V DC (from memory)
constexpr long kMaxCellsInSeries = 2000;      // site.bus_voltage_v / profile.cell.nominal_v
constexpr double kMaxCellCapacityAh = 100000;
constexpr double kMaxAutonomyDays = 365;
constexpr double kMaxDesignMargin = 10;
constexpr double kMaxPowerKw = 100000;  // load_kw and source_kw of the hourly CSV: 100 MW
// Any number in a YAML input: beyond this no quantity of the formats is meaningful, and sums
// over 8760 hours and 100 years of such values stay far from overflow.
constexpr double kMaxInputMagnitude = 1e12;

// "must be at most LIMIT (a plausibility limit, see docs/input-format.md), found VALUE".
std::string limit_message(double limit, const std::string& found_text, const std::string& hint);

// A whole-number field already checked by the schema (an integer >= 1), as an int: throws
// InputError at `node` when it exceeds `max_value`, before any conversion that could wrap.
int plausible_count(const YamlDocument& doc, const YAML::Node& node, const std::string& field,
                    long max_value, const std::string& hint = "");

// A number field already checked by the schema: throws InputError at `node` when it exceeds
// `max_value`; returns the value.
double plausible_number(const YamlDocument& doc, const YAML::Node& node, const std::string& field,
                        double max_value, const std::string& hint = "");

}  // namespace stowage
