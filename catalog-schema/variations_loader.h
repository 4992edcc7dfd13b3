// SPDX-License-Identifier: MIT
// Variations: the inputs a study lets sweeps, break-even searches and uncertainty runs vary,
// from the study file's `study.variations` block (or a tender file's `tender.variations`) (schema:
// schemas/study.schema.json, format: docs/input-format.md) or from a `--vary PATH=LOW:HIGH` option.
//
// Each variation names one parameter path (parameter_paths.h) and gives exactly one of
//   low/high (with an optional base)     the tornado's ends; grids use `steps` points between
//   values: [v1, v2, ...]                the points of a grid (sorted), low/high their extremes
//   range: {from, to, steps}             evenly spaced points, from..to
// base defaults to the study's value (0 for an Offset path, 1 for a Scale path) and must lie
// in [low, high]. Every low, base, high, listed value and range end is applied to a copy of the
// study with apply_parameter, so a value the study would refuse is refused here, at its line.
// A whole-number path (project_years, max_strings_parallel) takes whole values only and, in
// uncertainty runs, only a discrete distribution.
//
// Distributions (what an uncertainty run draws; optional):
//   uniform     on [low, high]
//   triangular  on [low, high] with mode (default base)
//   normal      mean (default base), sd; truncated to the path's valid range
//   lognormal   median (default base) and log_sd (sd of ln x); truncated to the valid range
//   discrete    one of `values` with `weights` (default equal), normalised to sum 1
// The truncation interval is stored in Distribution::lower/upper with whether each end is open.
//
// Rank correlations (optional, uncertainty runs only): an entry with a distribution may list
//   rank_correlations: [{with: NAME, rho: R}, ...]
// NAME is the path or the label of another entry of the same block that has a distribution;
// R in [-1, 1] is the target Spearman rank correlation between the two inputs. A pair may be
// given on either entry or on both; given on both, the two values must be equal (the matrix
// is symmetric). Pairs not given are 0. The matrix of all drawn entries must be positive
// definite (Cholesky succeeds), so the targets can hold at once. They are met by the
// Iman-Conover reordering (optimiser/analysis/sampling.h). Refused: an unknown or ambiguous
// NAME, an entry naming itself, a pair named twice on one entry, an entry without a
// distribution (on either side), disagreeing sides, |R| > 1 (schema), a matrix that is not
// positive definite (reported at the block).
// Stored symmetrically: each side's Variation::rank_correlations holds the other's path.
//
// Errors: InputError at the offending node (file, line, column, field path such as
// study.variations[2].high); for --vary, InvalidValue with field "--vary".
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "catalog-schema/profile_loader.h"  // SourcePosition
#include "catalog-schema/study_case.h"
#include "catalog-schema/yaml_document.h"

namespace stowage {

enum class DistributionKind { Uniform, Triangular, Normal, Lognormal, Discrete };
// "uniform", "triangular", "normal", "lognormal", "discrete".
const char* to_string(DistributionKind kind);

struct Distribution {
  DistributionKind kind = DistributionKind::Uniform;
  double lower = 0, upper = 0;  // support: [low, high], or the path's valid range (truncation)
  bool lower_open = false, upper_open = false;
  double mode = 0;                    // triangular
  double mean = 0, sd = 0;            // normal, before truncation
  double median = 0, log_sd = 0;      // lognormal, before truncation
  std::vector<double> values;         // discrete, ascending
  std::vector<double> probabilities;  // discrete, same order, sum 1
};

struct RankCorrelation {
  std::string with;  // the path of the other variation
  double rho = 0;    // target Spearman rank correlation, in [-1, 1]
};

struct Variation {
  std::string path;
  std::string label;   // the path when not given
  std::string unit;    // the path's unit
  std::string source;  // may be empty
  double low = 0, base = 0, high = 0;
  std::vector<double> points;  // grid points, ascending; empty for the low/high form
  bool whole_number = false;
  std::optional<Distribution> distribution;
  std::vector<RankCorrelation> rank_correlations;  // non-zero pairs, both sides; by path
  SourcePosition at;  // where it is defined; file "--vary" for the option
};

struct TenderCase;  // tender_loader.h

// Reads study.variations (empty when absent). `study` is the validated case the block belongs
// to. A path given twice is refused at the second entry. Each entry is checked on its own: more
// than one bad entry throws InputErrors holding each one's error.
std::vector<Variation> read_variations(const YamlDocument& doc, const StudyCase& study);
// Reads tender.variations the same way, against the tender's paths (parameter_paths.h);
// `tender` is the loaded tender with its bids. Errors name tender.variations[i]....
std::vector<Variation> read_tender_variations(const YamlDocument& doc, const TenderCase& tender);

// Parses "PATH=LOW:HIGH" (base: the study's value, no distribution); throws InvalidValue with
// field "--vary" naming the text and the rule broken.
Variation parse_vary_option(const std::string& text, const StudyCase& study);

// The variations with `extra` added; an extra one for a path already in `variations` replaces
// it (the command line wins over the file), and the rank correlations other entries had with
// the replaced one are dropped with it (a --vary entry has no distribution, so is not drawn).
std::vector<Variation> merge_variations(std::vector<Variation> variations,
                                        const std::vector<Variation>& extra);

}  // namespace stowage
