// SPDX-License-Identifier: MIT
// Bound-ordered exact search and threads. References: exhaustive enumeration with the exact
// simulator (optimal by definition), and the single-threaded run of the same search.
#include <catch2/catch.hpp>
#include <map>

#include "model/lifecycle.h"
#include "optimiser/design_space.h"
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

TEST_CASE("designs stopped early above their profile's best leave every profile's best exact",
          "[optimiser][early-stop]") {
  // Reference: every admissible design evaluated in full (LifecycleEvaluator::evaluate, no
  // stop), the best feasible NPC of each profile taken by hand.
  std::size_t stopped = 0;
  for (std::uint64_t seed = 61; seed <= 64; ++seed) {
    SyntheticStudySpec spec;
    spec.seed = seed;
    spec.backup = seed % 2 == 1;
    const StudyCase study = make_synthetic_study(spec);
    const DesignSpace space = build_design_space(study);
    std::map<std::string, double> best_of_profile;
    for (const DesignChoice& ch : space.choices) {
      LifecycleEvaluator evaluator(study.profiles[ch.profile_index], study.site, study.economics);
      for (int n = ch.min_strings; n <= ch.max_strings && ch.admissible(); ++n) {
        const DesignResult r = evaluator.evaluate(ch.dod_setpoint, n);
        if (!r.meets_unserved_limit) continue;
        auto it = best_of_profile.find(r.profile_id);
        if (it == best_of_profile.end() || r.npc < it->second)
          best_of_profile[r.profile_id] = r.npc;
      }
    }
    const OptimiseResult all = run(study, SearchMethod::Exhaustive, 2);
    INFO("seed " << seed);
    REQUIRE(all.ranking.size() == best_of_profile.size());
    for (const DesignResult& r : all.ranking) CHECK(r.npc == best_of_profile.at(r.profile_id));
    CHECK(all.designs_evaluated_exactly == space.admissible_designs());
    CHECK(all.years_simulated <=
          all.designs_evaluated_exactly * static_cast<std::size_t>(study.economics.project_years));
    stopped += all.designs_stopped_early;
    if (all.designs_stopped_early > 0) {
      CHECK(all.years_simulated < all.designs_evaluated_exactly *
                                      static_cast<std::size_t>(study.economics.project_years));
    }
  }
  CHECK(stopped > 0);  // the rule was exercised
}
