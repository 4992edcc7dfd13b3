// SPDX-License-Identifier: MIT
// The words of the robustness reports that are fixed by arithmetic: the progress line's rate
// and time left (done / seconds, remaining / rate; worked by hand below) and a partial result
// that keeps every double exactly (%.17g reads back to the same double, IEEE 754-2008 5.12.2).
#include <catch2/catch.hpp>
#include <sstream>

#include "optimiser/analysis/shards.h"
#include "optimiser/report/shard_report.h"
#include "optimiser/report/sweep_report.h"

using namespace stowage;

TEST_CASE("progress states done/total, the rate and the time left", "[report][robustness]") {
  // 30 of 120 samples in 12 s: 2.5 per s, 90 left / 2.5 per s = 36 s.
  CHECK(report::format_run_progress(30, 120, 12.0, "samples") ==
        "30 / 120 samples, 2.5 per s, about 36 s left");
  CHECK(report::format_run_progress(0, 10, 0.0, "points") ==
        "0 / 10 points, 0 per s, about ? left");
}

TEST_CASE("a written partial result reads back to the same doubles", "[report][robustness]") {
  UncertaintyPart part;
  part.study_path = "/tmp/some study/study.yaml";
  part.study_digest = "d1";
  part.run.samples = 3;
  part.run.seed = 18446744073709551615ull;  // 2^64 - 1: the largest seed
  part.run.profile_ids = {"lfp"};
  Variation v;
  v.path = "economics.real_discount_rate";
  part.run.drawn = {v};
  part.shard = {2, 3};
  part.slice = {1, 2};
  SampleRecord r;
  r.values = {0.1 + 0.2};  // 0.30000000000000004: needs 17 digits
  r.profiles = {{true, 1.0 / 3.0, 2.0 / 3.0, false}};
  part.records = {r};
  std::stringstream text;
  report::write_uncertainty_part(text, part);
  const UncertaintyPart back = read_uncertainty_part(text, "part.txt");
  CHECK(back.study_path == part.study_path);
  CHECK(back.run.seed == part.run.seed);
  CHECK(back.run.base_winner.empty());
  REQUIRE(back.records.size() == 1);
  CHECK(back.records[0].values[0] == 0.1 + 0.2);
  CHECK(back.records[0].profiles[0].npc == 1.0 / 3.0);
  CHECK(back.records[0].profiles[0].lcos_per_kwh == 2.0 / 3.0);
  CHECK_FALSE(back.records[0].profiles[0].meets_unserved_limit);
}
