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
#pragma once

#include <cstddef>
#include <istream>
#include <string>
#include <vector>

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

}  // namespace stowage
