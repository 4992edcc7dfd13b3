// SPDX-License-Identifier: MIT
// The robustness reports' figures draw the result's numbers where they belong: bar heights in
// proportion to the win probabilities, whiskers one standard error long, the spread boxes from
// P10 to P90, the break-even line only with a crossing; and the winner map's letters.
#include "optimiser/report/robustness_charts.h"

#include <algorithm>
#include <catch2/catch.hpp>
#include <cmath>
#include <limits>
#include <regex>
#include <string>
#include <vector>

#include "model/contract.h"

using namespace stowage;
using namespace stowage::report;

namespace {

UncertaintyResult two_profiles() {
  UncertaintyResult r;
  r.samples = 100;
  r.base_winner = "first";
  ProfileUncertainty a;
  a.profile_id = "first";
  a.samples = 100;
  a.win_probability = 0.75;
  a.win_probability_se = std::sqrt(0.75 * 0.25 / 100);
  a.npc = {1000, 10, 900, 1000, 1100};
  a.lcos = {0.5, 0.01, 0.4, 0.5, 0.6};
  ProfileUncertainty b = a;
  b.profile_id = "second";
  b.win_probability = 0.25;
  b.npc = {1200, 12, 1050, 1180, 1400};
  b.lcos = {0.6, 0.01, 0.5, 0.58, 0.7};
  r.profiles = {a, b};
  return r;
}

// Heights of the <rect>s with a <title> (the bars) in document order.
std::vector<double> bar_heights(const std::string& svg) {
  std::vector<double> out;
  const std::regex bar(
      R"re(<rect x="[^"]+" y="[^"]+" width="[^"]+" height="([^"]+)" fill="#[^"]+" stroke="#000000" stroke-width="0.6"><title>)re");
  for (auto it = std::sregex_iterator(svg.begin(), svg.end(), bar); it != std::sregex_iterator();
       ++it)
    out.push_back(std::stod((*it)[1]));
  return out;
}

}  // namespace

TEST_CASE("profile letters follow the spreadsheet column convention", "[robustness-charts]") {
  // Spreadsheet column names, bijective base 26 (common practice).
  CHECK(profile_letter(0) == "A");
  CHECK(profile_letter(25) == "Z");
  CHECK(profile_letter(26) == "AA");
  CHECK(profile_letter(51) == "AZ");
  CHECK(profile_letter(52) == "BA");
  CHECK(profile_letter(701) == "ZZ");
  CHECK(profile_letter(702) == "AAA");
}

TEST_CASE("win-probability bars are in proportion to the probabilities, labelled in per cent",
          "[robustness-charts]") {
  const ReportFigure f = win_probability_chart(two_profiles());
  CHECK(f.id == "fig-win-probability");
  const std::vector<double> h = bar_heights(f.svg);
  REQUIRE(h.size() == 2);
  // The axis runs 0..100 %: the bars stand in the ratio of the probabilities, 0.75 : 0.25.
  CHECK(h[0] / h[1] == Approx(3.0).epsilon(0.01));
  CHECK(f.svg.find(">75.0 %</text>") != std::string::npos);
  CHECK(f.svg.find(">25.0 %</text>") != std::string::npos);
  CHECK(f.svg.find("probability of being cheapest (% of samples)") != std::string::npos);
  // One whisker (three black strokes) per profile.
  std::size_t strokes = 0;
  for (std::size_t at = f.svg.find("stroke=\"#000000\" stroke-width=\"1.5\"/>");
       at != std::string::npos;
       at = f.svg.find("stroke=\"#000000\" stroke-width=\"1.5\"/>", at + 1))
    ++strokes;
  CHECK(strokes == 2 * 3 + 1);  // and the legend's sample stroke
}

TEST_CASE("spread boxes run from P10 to P90 of each profile", "[robustness-charts]") {
  const UncertaintyResult r = two_profiles();
  const ReportFigure npc = uncertainty_spread_chart(r, SpreadQuantity::Npc, "EUR");
  CHECK(npc.id == "fig-npc-spread");
  const std::vector<double> h = bar_heights(npc.svg);
  REQUIRE(h.size() == 2);
  // The same value axis for both boxes: heights in the ratio of the P10-P90 widths, 200 : 350.
  CHECK(h[1] / h[0] == Approx(350.0 / 200.0).epsilon(0.01));
  CHECK(npc.svg.find("first: P10 900 EUR, P90 1,100 EUR") != std::string::npos);
  const ReportFigure lcos = uncertainty_spread_chart(r, SpreadQuantity::Lcos, "EUR");
  CHECK(lcos.id == "fig-lcos-spread");
  CHECK(lcos.svg.find("LCOS (EUR per kWh delivered)") != std::string::npos);
  UncertaintyResult empty = r;
  const double nan = std::numeric_limits<double>::quiet_NaN();
  for (ProfileUncertainty& p : empty.profiles) p.npc = {nan, nan, nan, nan, nan};
  CHECK_THROWS_AS(uncertainty_spread_chart(empty, SpreadQuantity::Npc, "EUR"), ContractViolation);
}

TEST_CASE("the break-even chart marks the value only when there is a crossing",
          "[robustness-charts]") {
  BreakevenResult r;
  r.path = "profiles.b.costs.capital_per_kwh";
  r.unit = "EUR/kWh";
  r.profile_id = "a";
  r.from = 200;
  r.to = 400;
  // Two straight lines, a flat 1500 and b = 5 x, given as probes; they cross at x = 300.
  for (double x : {200.0, 300.0, 400.0}) {
    BreakevenProbe p;
    p.value = x;
    p.profile_npc = 1500;
    p.rival_npc = 5 * x;
    p.rival_id = "b";
    p.gap = p.profile_npc - p.rival_npc;
    r.scan.push_back(p);
  }
  const ReportFigure none = breakeven_chart(r, "EUR");
  CHECK(none.id == "fig-breakeven");
  CHECK(none.svg.find("class=\"reference\"") == std::string::npos);
  r.crossing = true;
  r.value = 300;
  const ReportFigure crossing = breakeven_chart(r, "EUR");
  CHECK(crossing.svg.find(">break-even 300 EUR/kWh</text>") != std::string::npos);
  for (BreakevenProbe& p : r.scan) p.profile_npc = p.rival_npc = std::nan("");
  CHECK_THROWS_AS(breakeven_chart(r, "EUR"), ContractViolation);
}

TEST_CASE("the NPC distribution rises by one sample's share at each sampled value",
          "[robustness-charts]") {
  UncertaintyResult r = two_profiles();
  const double nan = std::numeric_limits<double>::quiet_NaN();
  // Four samples; the second profile has no design in one of them.
  r.npc = {{1000, 1300}, {900, nan}, {1100, 1200}, {950, 1250}};
  const ReportFigure f = npc_ecdf_chart(r, "EUR");
  CHECK(f.id == "fig-npc-ecdf");
  // One step line per profile: two vertices per sampled value (empirical distribution
  // function, common practice), 4 for the first profile and 3 for the second.
  const std::regex path(R"re(<path d="([^"]+)" fill="none")re");
  std::vector<std::size_t> vertices;
  for (auto it = std::sregex_iterator(f.svg.begin(), f.svg.end(), path);
       it != std::sregex_iterator(); ++it) {
    const std::string d = (*it)[1];
    vertices.push_back(static_cast<std::size_t>(std::count(d.begin(), d.end(), 'L')) + 1);
  }
  const std::vector<std::size_t> want{8, 6};
  CHECK(std::vector<std::size_t>(vertices.end() - 2, vertices.end()) == want);
  r.npc = {{nan, nan}};
  CHECK_THROWS_AS(npc_ecdf_chart(r, "EUR"), ContractViolation);
}
