// SPDX-License-Identifier: MIT
// Re-pricing held designs (model/repricing.h, scenario.h): when only prices change, the
// re-priced result must equal the full simulation it replaces, and the shortcut must not be
// taken when an input that changes the dispatch or the wear varies. The check value is the
// project's own exact simulation: the shortcut is only valid if it reproduces it (common
// practice for a fast path), so the tolerance is rounding, 1e-9 relative.
#include "model/repricing.h"

#include <catch2/catch.hpp>
#include <cmath>
#include <string>
#include <vector>

#include "catalog-schema/parameter_paths.h"
#include "model/contract.h"
#include "optimiser/analysis/scenario.h"
#include "optimiser/analysis/uncertainty.h"
#include "support/synthetic_study.h"

namespace stowage {
namespace {

void check_equal(const DesignResult& repriced, const DesignResult& simulated) {
  const auto same = [](double a, double b) {
    return std::fabs(a - b) <= 1e-9 * std::max(1.0, std::fabs(b));
  };
  CHECK(same(repriced.npc, simulated.npc));
  CHECK(same(repriced.lcos_per_kwh, simulated.lcos_per_kwh));
  CHECK(same(repriced.lcos_schmidt_per_kwh, simulated.lcos_schmidt_per_kwh));
  CHECK(same(repriced.investment, simulated.investment));
  const CostBreakdown& a = repriced.present_value;
  const CostBreakdown& b = simulated.present_value;
  CHECK(same(a.replacements, b.replacements));
  CHECK(same(a.fixed_om, b.fixed_om));
  CHECK(same(a.variable_om, b.variable_om));
  CHECK(same(a.charging, b.charging));
  CHECK(same(a.backup, b.backup));
  CHECK(same(a.unserved_penalty, b.unserved_penalty));
  CHECK(same(a.end_of_life, b.end_of_life));
  CHECK(same(a.residual_value, b.residual_value));
  CHECK(same(repriced.discounted_delivered_kwh, simulated.discounted_delivered_kwh));
  CHECK(repriced.replacement_years == simulated.replacement_years);
  CHECK(repriced.meets_unserved_limit == simulated.meets_unserved_limit);
}

// Every price the study lets a user vary, changed at once.
StudyCase repriced_case(StudyCase s) {
  apply_parameter(s, "economics.real_discount_rate", 0.095);
  apply_parameter(s, "site.charging_price.per_kwh", 0.21);
  if (s.site.backup_price_per_kwh) apply_parameter(s, "site.backup.price_per_kwh", 1.4);
  apply_parameter(s, "site.unserved_penalty_per_kwh", 3.5);
  for (const ChemistryProfile& p : std::vector<ChemistryProfile>(s.profiles)) {
    const std::string c = "profiles." + p.id + ".costs.";
    apply_parameter(s, c + "capital_per_kwh", p.costs.capital_per_kwh * 1.37);
    apply_parameter(s, c + "capital_per_string", 55);
    apply_parameter(s, c + "installation_fixed", 900);
    apply_parameter(s, c + "fixed_om_per_kwh_year", 4.5);
    apply_parameter(s, c + "variable_om_per_mwh", 7);
    apply_parameter(s, c + "replacement_share", 0.8);
    apply_parameter(s, c + "price_decline_per_year", 0.035);
    apply_parameter(s, c + "end_of_life_per_kwh", -12);
    apply_parameter(s, c + "replacement_end_of_life_per_kwh", 9);
  }
  return s;
}

}  // namespace

TEST_CASE("re-priced designs equal their simulation when only prices change",
          "[analysis][repricing]") {
  int replaced = 0, residual = 0;
  for (std::uint64_t seed : {3, 8, 21}) {
    for (bool backup : {true, false}) {
      SyntheticStudySpec spec;
      spec.seed = seed;
      spec.project_years = 20;
      spec.full_dod_range = true;
      spec.backup = backup;
      const StudyCase base = make_synthetic_study(spec);
      const StudyCase changed = repriced_case(base);
      for (std::size_t p = 0; p < base.profiles.size(); ++p) {
        for (double dod : {0.4, 0.9}) {
          INFO("seed " << seed << " backup " << backup << " profile " << p << " dod " << dod);
          LifecycleEvaluator on_base(base.profiles[p], base.site, base.economics);
          const DesignResult simulated_base = on_base.evaluate(dod, 3);
          LifecycleEvaluator on_changed(changed.profiles[p], changed.site, changed.economics);
          const DesignResult simulated = on_changed.evaluate(dod, 3);
          const DesignResult repriced =
              reprice(simulated_base, changed.profiles[p], changed.site, changed.economics);
          check_equal(repriced, simulated);
          // And re-pricing with the base prices gives the base result back.
          check_equal(reprice(simulated_base, base.profiles[p], base.site, base.economics),
                      simulated_base);
          replaced += simulated.replacement_years.empty() ? 0 : 1;
          residual += simulated.present_value.residual_value < 0 ? 1 : 0;
        }
      }
    }
  }
  // The cases exercise replacements and a residual value, not only the simple lines.
  CHECK(replaced > 0);
  CHECK(residual > 0);
}

TEST_CASE("re-pricing refuses a design of another project length", "[analysis][repricing]") {
  SyntheticStudySpec spec;
  spec.project_years = 10;
  StudyCase s = make_synthetic_study(spec);
  LifecycleEvaluator e(s.profiles[0], s.site, s.economics);
  const DesignResult r = e.evaluate(0.5, 2);
  apply_parameter(s, "economics.project_years", 12);
  CHECK_THROWS_AS(reprice(r, s.profiles[0], s.site, s.economics), ContractViolation);
}

TEST_CASE("only price paths are marked as leaving the dispatch unchanged",
          "[analysis][repricing]") {
  const StudyCase s = make_synthetic_study(SyntheticStudySpec{});
  const std::string id = s.profiles[0].id;
  CHECK(prices_only(s,
                    {"economics.real_discount_rate", "profiles." + id + ".costs.capital_per_kwh"}));
  CHECK(prices_only(s, {"site.backup.price_per_kwh", "site.unserved_penalty_per_kwh",
                        "site.charging_price.per_kwh"}));
  CHECK_FALSE(prices_only(s, {"economics.project_years"}));
  CHECK_FALSE(prices_only(s, {"economics.real_discount_rate", "site.hourly.temp_c_offset"}));
  CHECK_FALSE(prices_only(s, {"site.charger_efficiency"}));
  CHECK_FALSE(prices_only(s, {"site.hourly.load_kw_scale"}));
}

TEST_CASE("an uncertainty run over prices re-prices and matches the simulated run",
          "[analysis][repricing][uncertainty]") {
  SyntheticStudySpec spec;
  spec.seed = 5;
  spec.project_years = 15;
  spec.full_dod_range = true;
  const StudyCase study = make_synthetic_study(spec);
  const auto drawn = [&](const std::string& path, double low, double high) {
    Variation v;
    v.path = v.label = path;
    v.low = low;
    v.high = high;
    v.base = find_parameter(study, path).base;
    Distribution d;
    d.kind = DistributionKind::Uniform;
    d.lower = low;
    d.upper = high;
    v.distribution = d;
    return v;
  };
  const std::string price = "profiles." + study.profiles[1].id + ".costs.capital_per_kwh";
  const double p0 = study.profiles[1].costs.capital_per_kwh;
  std::vector<Variation> vars{drawn("economics.real_discount_rate", 0.02, 0.10),
                              drawn(price, 0.6 * p0, 1.4 * p0),
                              drawn("site.backup.price_per_kwh", 0.2, 1.5)};
  UncertaintyOptions options;
  options.samples = 12;
  options.seed = 4;
  options.threads = 2;
  const UncertaintySampler fast(study, vars, options);
  CHECK(fast.run().repriced);
  options.reprice_when_prices_only = false;
  const UncertaintySampler slow(study, vars, options);
  CHECK_FALSE(slow.run().repriced);
  const UncertaintyResult a = summarise_uncertainty(fast.run(), fast.samples(0, 12));
  const UncertaintyResult b = summarise_uncertainty(slow.run(), slow.samples(0, 12));
  CHECK(a.values == b.values);
  REQUIRE(a.npc.size() == b.npc.size());
  for (std::size_t k = 0; k < a.npc.size(); ++k) {
    for (std::size_t p = 0; p < a.npc[k].size(); ++p) {
      CHECK(a.npc[k][p] == Approx(b.npc[k][p]).epsilon(1e-9));
    }
  }
  CHECK(a.winners == b.winners);

  // A physical input among the drawn ones: every sample is simulated.
  options.reprice_when_prices_only = true;
  vars.push_back(drawn("site.hourly.temp_c_offset", -3, 3));
  CHECK_FALSE(UncertaintySampler(study, vars, options).run().repriced);
  options.reoptimise = true;
  vars.pop_back();
  CHECK_FALSE(UncertaintySampler(study, vars, options).run().repriced);
}

}  // namespace stowage
