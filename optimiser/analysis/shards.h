// SPDX-License-Identifier: MIT
// Shards of an uncertainty run: `--shard i/N` evaluates one slice of the samples and writes a
// partial result; `stowage merge` joins the parts into exactly the unsharded result (every
// sample depends only on (seed, k), uncertainty.h, and summarise_uncertainty() sees the samples
// in sample order whatever the split). With rank correlations the Iman-Conover reordering
// needs all samples: every shard draws the whole N-sample matrix from (seed, N) and evaluates
// only its slice, so its samples are the unsharded run's (sampling.h, draw_inputs).
//
// Slice i of N (1 <= i <= N) of S samples: [floor((i - 1) S / N), floor(i S / N)), so the
// slices tile [0, S) exactly and differ in size by at most one.
//
// Partial file (text, one record a line, fields separated by single spaces; numbers as %.17g,
// which reads back to the same double; "-" for an empty text):
//   stowage-partial 1 uncertainty
//   study <absolute path of the study file>
//   study_digest <hex digest of the study's inputs (report/study_hash.h)>
//   run <samples> <seed> <latin_hypercube 0|1> <reoptimise 0|1> <base winner>
//   profiles <id> ...                   the study's profile ids, in study order
//   drawn <path> ...                    the drawn paths, in draw order
//   shard <i> <N> <first> <last>
//   sample <k> <value> ... then per profile: <present 0|1> <npc> <lcos> <meets 0|1>
//   end
// Written by report/shard_report.h; read here. Reading fails with InputError naming the file
// and line for anything else, a truncated file (no `end`) included.
// Merging checks that the parts share the study digest and the run line, profiles and drawn
// paths, and that their slices tile [0, samples) with no gap or overlap; otherwise it throws
// InputError naming the part.
//
// Shards of a sweep (sweep.h): `stowage sweep ... --shard i/N` lists all the points of the
// tornado or grid, evaluates slice i of N of them (the rule above, over the points) and writes
// a partial result; every point depends only on its settings and the base case, so joining the
// parts in point order gives the outcomes the unsharded run evaluates. Partial file, same line
// rules:
//   stowage-partial 1 sweep
//   study <absolute path of the study file>
//   study_digest <hex digest of the study's inputs>
//   sweep <tornado|grid> <hold_designs 0|1> <steps> <points> <vary options>
//   vary <one --vary option as given, the rest of the line>     (that many lines)
//   axes <path> ...                     the --grid paths (none for a tornado)
//   profiles <id> ...                   the study's profile ids, in study order
//   shard <i> <N> <first> <last>
//   base <outcome>                      the base point
//   point <k> <outcome>                 for k = first .. last - 1
//   end
// where <outcome> is <status: - | proven_optimal | verified_by_estimate | time_limited> then,
// per profile in study order: <present 0|1> <dod_setpoint> <cells_series> <strings_parallel>
// <nameplate_kwh> <npc> <lcos_per_kwh> <investment> <meets_unserved_limit 0|1> (zeros when
// absent); the ranking is rebuilt by rank_point() (scenario.h). Merging checks that the parts
// share the study digest, the sweep, vary, axes and profiles lines and the base point, and that
// their slices tile [0, points); otherwise InputError naming the part.
#pragma once

#include <cstddef>
#include <istream>
#include <string>
#include <vector>

#include "optimiser/analysis/scenario.h"
#include "optimiser/analysis/uncertainty.h"

namespace stowage {

struct ShardSpec {
  std::size_t index = 1, count = 1;  // 1 <= index <= count
};
// "i/N"; throws InvalidValue("--shard", ...) otherwise.
ShardSpec parse_shard(const std::string& text);

struct SampleSlice {
  std::size_t first = 0, last = 0;
};
SampleSlice shard_slice(std::size_t samples, const ShardSpec& shard);

struct UncertaintyPart {
  std::string study_path, study_digest;
  UncertaintyRun run;  // drawn holds only the paths
  ShardSpec shard;
  SampleSlice slice;
  std::vector<SampleRecord> records;  // samples slice.first .. slice.last - 1
};

UncertaintyPart read_uncertainty_part(std::istream& in, const std::string& source_name);
UncertaintyPart read_uncertainty_part_file(const std::string& path);

// The records of all parts in sample order, after the checks above. `names` are the parts'
// file names, for the messages.
std::vector<SampleRecord> join_parts(const std::vector<UncertaintyPart>& parts,
                                     const std::vector<std::string>& names);

// "uncertainty" or "sweep": what the partial result file at `path` holds, from its first
// line; InputError when it is not a partial result.
std::string partial_result_kind(const std::string& path);

struct SweepPart {
  std::string study_path, study_digest;
  bool grid = false;  // a tornado otherwise
  bool hold_designs = false;
  int steps = 5;
  std::size_t points = 0;         // of the whole sweep
  std::vector<std::string> vary;  // the --vary options, as given
  std::vector<std::string> axes;  // the --grid paths
  std::vector<std::string> profile_ids;
  ShardSpec shard;
  SampleSlice slice;
  PointOutcome base;
  std::vector<PointOutcome> outcomes;  // points slice.first .. slice.last - 1
};

SweepPart read_sweep_part(std::istream& in, const std::string& source_name);
SweepPart read_sweep_part_file(const std::string& path);

// The outcomes of all parts in point order, after the checks above.
std::vector<PointOutcome> join_sweep_parts(const std::vector<SweepPart>& parts,
                                           const std::vector<std::string>& names);

}  // namespace stowage
