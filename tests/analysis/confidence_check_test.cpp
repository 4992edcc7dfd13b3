// SPDX-License-Identifier: MIT
#include "optimiser/analysis/confidence_check.h"

#include <catch2/catch.hpp>

#include "catalog-schema/parameter_paths.h"
#include "model/lifecycle.h"
#include "support/synthetic_study.h"

using namespace stowage;

namespace {

// A generated study, optimised exhaustively, with the winner's profile labelled by hand.
struct Labelled {
  StudyCase study;
  OptimiseResult result;
  std::vector<LoadedProfile> profiles;
};

Labelled labelled(const std::map<std::string, ValueConfidence>& labels) {
  SyntheticStudySpec spec;
  spec.seed = 5;
  spec.project_years = 10;
  Labelled l;
  l.study = make_synthetic_study(spec);
  OptimiseOptions options;
  options.method = SearchMethod::Exhaustive;
  l.result = optimise(l.study, options);
  for (const ChemistryProfile& p : l.study.profiles) {
    LoadedProfile lp;
    lp.profile = p;
    if (p.id == l.result.best().profile_id) lp.confidence = labels;
    l.profiles.push_back(lp);
  }
  return l;
}

double npc_with(const Labelled& l, const std::string& path, double value) {
  StudyCase changed = l.study;
  apply_parameter(changed, path, value);
  const DesignResult& best = l.result.best();
  const std::size_t i = *changed.find_profile(best.profile_id);
  LifecycleEvaluator ev(changed.profiles[i], changed.site, changed.economics);
  return ev.evaluate(best.dod_setpoint, best.bank.strings_parallel).npc;
}

}  // namespace

TEST_CASE("the winner's low-confidence inputs are moved by their label's spread, design held",
          "[analysis][confidence]") {
  Labelled l = labelled({{"costs.capital_per_kwh", ValueConfidence::Illustrative},
                         {"ageing.cycle_life", ValueConfidence::FromMemory},
                         {"cell.coulombic_efficiency", ValueConfidence::Sourced}});
  REQUIRE(l.result.feasible());
  const ConfidenceCheck check = check_low_confidence(l.study, l.profiles, l.result);
  const DesignResult& best = l.result.best();
  CHECK(check.profile_id == best.profile_id);
  REQUIRE(l.result.ranking.size() > 1);
  CHECK(check.margin == Approx(l.result.ranking[1].npc - best.npc));
  // Sourced and unlabelled inputs stay out; the two labelled ones are in, largest rise first.
  REQUIRE(check.inputs.size() == 2);
  CHECK(check.inputs[0].npc_rise >= check.inputs[1].npc_rise);
  const std::string prefix = "profiles." + best.profile_id + ".";
  for (const LowConfidenceInput& in : check.inputs) {
    INFO(in.path);
    if (in.path == prefix + "costs.capital_per_kwh") {
      // Illustrative: +-25 % of the price; a dearer bank only costs more.
      CHECK(in.spread == 0.25);
      const double base = find_parameter(l.study, in.path).base;
      CHECK(in.npc_rise == Approx(npc_with(l, in.path, base * 1.25) - best.npc).epsilon(1e-12));
      CHECK(in.npc_rise > 0);
    } else {
      // From memory: the cycle-life table scaled by 0.9 or 1.1; fewer cycles cost more.
      CHECK(in.path == prefix + "ageing.cycle_life_scale");
      CHECK(in.spread == 0.10);
      const double worse = std::max(npc_with(l, in.path, 0.9), npc_with(l, in.path, 1.1));
      CHECK(in.npc_rise == Approx(std::max(0.0, worse - best.npc)).epsilon(1e-12));
    }
  }
  CHECK(check.exceeds_margin() == (check.inputs[0].npc_rise > check.margin));
}

TEST_CASE("a winner whose inputs are all sourced has nothing to flag", "[analysis][confidence]") {
  Labelled l = labelled({{"costs", ValueConfidence::Sourced},
                         {"cell", ValueConfidence::Sourced},
                         {"ageing", ValueConfidence::Sourced}});
  const ConfidenceCheck check = check_low_confidence(l.study, l.profiles, l.result);
  CHECK(check.inputs.empty());
  CHECK_FALSE(check.exceeds_margin());
}
