// SPDX-License-Identifier: MIT
// Bound-ordered exact search and threads. References: exhaustive enumeration with the exact
// simulator (optimal by definition), and the single-threaded run of the same search.
#include <catch2/catch.hpp>

#include "optimiser/optimise.h"
#include "support/synthetic_study.h"

using namespace stowage;

namespace {

OptimiseResult run(const StudyCase& study, SearchMethod method, int threads) {
  OptimiseOptions o;
  o.method = method;
  o.threads = threads;
  return optimise(study, o);
}

void require_identical(const OptimiseResult& a, const OptimiseResult& b) {
  REQUIRE(a.ranking.size() == b.ranking.size());
  for (std::size_t i = 0; i < a.ranking.size(); ++i) {
    CHECK(a.ranking[i].profile_id == b.ranking[i].profile_id);
    CHECK(a.ranking[i].bank.strings_parallel == b.ranking[i].bank.strings_parallel);
    CHECK(a.ranking[i].npc == b.ranking[i].npc);  // bit for bit
  }
  CHECK(a.designs_evaluated_exactly == b.designs_evaluated_exactly);
  CHECK(a.status == b.status);
}

}  // namespace

TEST_CASE("bound-ordered search finds the exhaustive optimum and proves it",
          "[optimiser][bounded]") {
  for (std::uint64_t seed = 41; seed <= 46; ++seed) {
    SyntheticStudySpec spec;
    spec.seed = seed;
    spec.backup = seed % 2 == 0;
    const StudyCase study = make_synthetic_study(spec);
    const OptimiseResult all = run(study, SearchMethod::Exhaustive, 1);
    const OptimiseResult bounded = run(study, SearchMethod::Bounded, 1);
    INFO("seed " << seed);
    REQUIRE(all.feasible() == bounded.feasible());
    CHECK(bounded.status == Optimality::Proven);
    if (!all.feasible()) continue;
    CHECK(bounded.best().npc == all.best().npc);
    CHECK(bounded.designs_evaluated_exactly <= all.designs_evaluated_exactly);
  }
}

TEST_CASE("the answer and the work done do not depend on the thread count",
          "[optimiser][threads]") {
  SyntheticStudySpec spec;
  spec.seed = 52;
  const StudyCase study = make_synthetic_study(spec);
  for (SearchMethod method :
       {SearchMethod::Exhaustive, SearchMethod::Bounded, SearchMethod::Milp}) {
    INFO(to_string(method));
    const OptimiseResult one = run(study, method, 1);
    const OptimiseResult two = run(study, method, 2);
    const OptimiseResult five = run(study, method, 5);
    require_identical(one, two);
    require_identical(one, five);
  }
}
