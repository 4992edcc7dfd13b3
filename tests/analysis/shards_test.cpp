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
