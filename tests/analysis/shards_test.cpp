// SPDX-License-Identifier: MIT
// Shards of an uncertainty run (optimiser/analysis/shards.h): the slices tile the samples, a
// partial file reads back exactly, and joining refuses gaps and overlaps. The slice bounds are
// worked by hand from floor((i - 1) S / N) .. floor(i S / N).
#include "optimiser/analysis/shards.h"

#include <catch2/catch.hpp>
#include <sstream>

#include "catalog-schema/input_error.h"
#include "model/invalid_value.h"

using namespace stowage;

TEST_CASE("shard slices tile the samples by floor((i - 1) S / N)", "[analysis][shards]") {
  // 10 samples in 4 shards: floor(0), floor(2.5), floor(5), floor(7.5), floor(10).
  const std::size_t want[4][2] = {{0, 2}, {2, 5}, {5, 7}, {7, 10}};
  for (std::size_t i = 1; i <= 4; ++i) {
    const SampleSlice s = shard_slice(10, {i, 4});
    CHECK(s.first == want[i - 1][0]);
    CHECK(s.last == want[i - 1][1]);
  }
  CHECK(parse_shard("3/8").index == 3);
  CHECK(parse_shard("3/8").count == 8);
  CHECK_THROWS_AS(parse_shard("0/4"), InvalidValue);
  CHECK_THROWS_AS(parse_shard("5/4"), InvalidValue);
  CHECK_THROWS_AS(parse_shard("2-4"), InvalidValue);
  CHECK_THROWS_AS(parse_shard("-1/4"), InvalidValue);
}

namespace {

std::string part_text(std::size_t first, std::size_t last) {
  std::ostringstream s;
  s << "stowage-partial 1 uncertainty\nstudy /studies/a b/study.yaml\nstudy_digest abc\n"
       "run 4 9 1 0 lfp\nprofiles lfp nmc\ndrawn economics.real_discount_rate\n"
    << "shard 1 2 " << first << ' ' << last << '\n';
  for (std::size_t k = first; k < last; ++k) {
    s << "sample " << k << " 0.1000000000000000055511151231257827 1 1234.5 0.25 1 0 nan nan 1\n";
  }
  s << "end\n";
  return s.str();
}

}  // namespace

TEST_CASE("a partial result reads back exactly and joins in sample order", "[analysis][shards]") {
  std::istringstream a(part_text(2, 4)), b(part_text(0, 2));
  const UncertaintyPart pa = read_uncertainty_part(a, "a.txt");
  const UncertaintyPart pb = read_uncertainty_part(b, "b.txt");
  CHECK(pa.study_path == "/studies/a b/study.yaml");
  CHECK(pa.run.seed == 9);
  CHECK(pa.run.latin_hypercube);
  CHECK(pa.run.base_winner == "lfp");
  REQUIRE(pa.records.size() == 2);
  CHECK(pa.records[0].values[0] == 0.1);  // the decimal above is 0.1's double to 34 digits
  CHECK(pa.records[0].profiles[0].npc == 1234.5);
  CHECK_FALSE(pa.records[0].profiles[1].present);
  const std::vector<SampleRecord> joined = join_parts({pa, pb}, {"a.txt", "b.txt"});
  CHECK(joined.size() == 4);
  CHECK_THROWS_AS(join_parts({pa}, {"a.txt"}), InvalidValue);              // samples 0, 1 missing
  CHECK_THROWS_AS(join_parts({pa, pa, pb}, {"a", "a", "b"}), InputError);  // overlap
  std::istringstream cut(part_text(0, 2).substr(0, 120));
  CHECK_THROWS_AS(read_uncertainty_part(cut, "cut.txt"), InputError);
}

namespace {

// A sweep part of two profiles; point k has lfp at NPC 2000 - k and nmc at 1500 (nmc breaks
// the unserved-energy limit at point 2), so the ranking rebuilt on reading is known by hand.
std::string sweep_part_text(std::size_t first, std::size_t last, const std::string& base_npc) {
  std::ostringstream s;
  s << "stowage-partial 1 sweep\nstudy /studies/a b/study.yaml\nstudy_digest abc\n"
       "sweep grid 0 5 4 1\nvary economics.real_discount_rate=0.03:0.09\n"
       "axes economics.real_discount_rate\nprofiles lfp nmc\n"
    << "shard 1 2 " << first << ' ' << last << '\n'
    << "base proven_optimal 1 0.8 15 2 28.8 " << base_npc << " 0.5 900 1 0 0 0 0 0 0 0 0 0\n";
  for (std::size_t k = first; k < last; ++k) {
    s << "point " << k << " time_limited 1 0.8 15 2 28.8 " << 2000 - k << " 0.5 900 1 1 0.7 16 3 "
      << "43.2 1500 0.4 1100 " << (k == 2 ? 0 : 1) << '\n';
  }
  s << "end\n";
  return s.str();
}

}  // namespace

TEST_CASE("a sweep part reads back and its ranking is rebuilt", "[analysis][shards]") {
  std::istringstream in(sweep_part_text(1, 3, "1000"));
  const SweepPart part = read_sweep_part(in, "p.txt");
  CHECK(part.study_path == "/studies/a b/study.yaml");
  CHECK(part.grid);
  CHECK(part.points == 4);
  REQUIRE(part.vary.size() == 1);
  CHECK(part.vary[0] == "economics.real_discount_rate=0.03:0.09");
  CHECK(part.axes == std::vector<std::string>{"economics.real_discount_rate"});
  CHECK(part.base.status == Optimality::Proven);
  REQUIRE(part.base.ranking.size() == 1);  // nmc absent at the base point
  CHECK_FALSE(part.base.by_profile[1].has_value());
  REQUIRE(part.outcomes.size() == 2);
  CHECK(part.outcomes[0].status == Optimality::TimeLimited);
  REQUIRE(part.outcomes[0].ranking.size() == 2);
  CHECK(part.outcomes[0].winner().profile_id == "nmc");  // 1500 < 1999
  CHECK(part.outcomes[0].winner().strings_parallel == 3);
  REQUIRE(part.outcomes[1].ranking.size() == 1);  // nmc breaks the limit at point 2
  CHECK(part.outcomes[1].winner().profile_id == "lfp");
  CHECK(part.outcomes[1].winner().npc == 1998);

  // A part cut short names its file and the line where it ends.
  const std::string text = sweep_part_text(1, 3, "1000");
  std::istringstream cut(text.substr(0, text.find("point 2")));
  try {
    read_sweep_part(cut, "cut.txt");
    FAIL("a truncated part was read");
  } catch (const InputError& e) {
    CHECK(std::string(e.what()).find("cut.txt:11") != std::string::npos);
  }
}

TEST_CASE("joining sweep parts refuses gaps and parts of another base", "[analysis][shards]") {
  const auto read = [](std::size_t first, std::size_t last, const std::string& base) {
    std::istringstream in(sweep_part_text(first, last, base));
    return read_sweep_part(in, "p");
  };
  const std::vector<PointOutcome> joined =
      join_sweep_parts({read(2, 4, "1000"), read(0, 2, "1000")}, {"b", "a"});
  REQUIRE(joined.size() == 4);
  CHECK(joined[3].by_profile[0]->npc == 1997);
  CHECK_THROWS_AS(join_sweep_parts({read(0, 2, "1000")}, {"a"}), InvalidValue);
  CHECK_THROWS_AS(join_sweep_parts({read(0, 2, "1000"), read(2, 4, "1001")}, {"a", "b"}),
                  InputError);
  CHECK_THROWS_AS(join_sweep_parts({read(0, 2, "1000"), read(0, 2, "1000")}, {"a", "b"}),
                  InputError);
}
