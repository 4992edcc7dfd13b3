// SPDX-License-Identifier: MIT
// The chart module: round ticks, escaping, deterministic bytes, the structure the report tests
// look for, and refusing axes it cannot draw.
#include "optimiser/report/svg_chart.h"

#include <catch2/catch.hpp>
#include <set>
#include <string>
#include <utility>

#include "model/contract.h"

using namespace stowage::report::svg;

namespace {

Axis axis(const char* label, double lo, double hi) {
  Axis a;
  a.label = label;
  a.lo = lo;
  a.hi = hi;
  return a;
}

std::string sample_chart() {
  Canvas canvas("t", 400, 300, "A <title> & more", "desc");
  Axis x = axis("hour of day (h)", 0, 24);
  Axis y = axis("cycles (-)", 1, 1000);
  y.log10 = true;
  Plot plot(canvas, 60, 20, 300, 200, x, y);
  plot.draw_axes("panel");
  plot.line({0, 12, 24}, {1, 10, 1000}, 0, "series", 1);
  plot.bar(1, 2, 1, 10, 1, "bar");
  return canvas.str();
}

std::size_t count(const std::string& text, const std::string& what) {
  std::size_t n = 0;
  for (std::size_t at = text.find(what); at != std::string::npos; at = text.find(what, at + 1)) ++n;
  return n;
}

}  // namespace

TEST_CASE("ticks are round numbers covering the range", "[svg]") {
  CHECK(nice_ticks(0, 97) == std::vector<double>{0, 20, 40, 60, 80});
  CHECK(nice_ticks(-10, 10, 4) == std::vector<double>{-10, -5, 0, 5, 10});
  const std::vector<double> fifths = nice_ticks(0.2, 1.0, 4);
  REQUIRE(fifths.size() == 5);
  for (std::size_t i = 0; i < 5; ++i) CHECK(fifths[i] == Approx(0.2 * (i + 1)).margin(1e-12));
}

TEST_CASE("coordinates print with two decimals and never as -0", "[svg]") {
  CHECK(num(1.005) == "1");  // binary 1.00499..., rounds down
  CHECK(num(2.5) == "2.5");
  CHECK(num(-0.001) == "0");
  CHECK(num(120) == "120");
}

TEST_CASE("text is escaped for XML", "[svg]") {
  CHECK(escape("a<b & \"c\">") == "a&lt;b &amp; &quot;c&quot;&gt;");
}

TEST_CASE("a chart has its title, labelled axes, data groups and the same bytes every time",
          "[svg]") {
  const std::string svg = sample_chart();
  CHECK(svg == sample_chart());
  CHECK(svg.find("<title id=\"t-title\">A &lt;title&gt; &amp; more</title>") != std::string::npos);
  CHECK(count(svg, "class=\"axis-label\"") == 2);
  CHECK(svg.find(">hour of day (h)</text>") != std::string::npos);
  CHECK(count(svg, "<g class=\"data\"") == 1);  // the bar is drawn outside a data group here
  // Log axis ticks at 1-2-5 per decade from 1 to 1000.
  for (const char* tick : {">1<", ">2<", ">5<", ">10<", ">20<", ">50<", ">100<", ">1,000<"})
    CHECK(svg.find(tick) != std::string::npos);
  // Hatch pattern ids are prefixed by the canvas id, so charts can share one page.
  CHECK(svg.find("id=\"t-hatch-1\"") != std::string::npos);
}

TEST_CASE("the eight series styles differ in colour, dash and hatch", "[svg]") {
  std::set<std::string> colours, dashes;
  std::set<int> hatches;
  for (int i = 0; i < 8; ++i) {
    colours.insert(series_style(i).colour);
    dashes.insert(series_style(i).dash);
    hatches.insert(series_style(i).hatch);
  }
  CHECK(colours.size() == 8);
  CHECK(dashes.size() == 8);
  CHECK(hatches.size() == 8);
  // The eight Okabe-Ito colours (Okabe & Ito 2008, Color Universal Design).
  CHECK(colours == std::set<std::string>{"#000000", "#E69F00", "#56B4E9", "#009E73", "#F0E442",
                                         "#0072B2", "#D55E00", "#CC79A7"});
}

TEST_CASE("every series style differs from the others in colour and hatch together and in dash",
          "[svg]") {
  // Nine cost lines (cost_lines.h) and a tender's damages credit must not share a look.
  REQUIRE(series_style_count() >= 10);
  std::set<std::pair<std::string, int>> looks;
  std::set<std::string> dashes;
  for (int i = 0; i < series_style_count(); ++i) {
    looks.insert({series_style(i).colour, series_style(i).hatch});
    dashes.insert(series_style(i).dash);
  }
  CHECK(looks.size() == static_cast<std::size_t>(series_style_count()));
  CHECK(dashes.size() == static_cast<std::size_t>(series_style_count()));
  CHECK(series_style(series_style_count()).colour == series_style(0).colour);
}

TEST_CASE("sequential colours darken step by step", "[svg]") {
  // YlOrBr end points (Paul Tol's sequential scheme, from memory): darkest and lightest.
  CHECK(sequential_colour(0, 10) == "#662506");
  CHECK(sequential_colour(9, 10) == "#FFFFE5");
  CHECK_THROWS_AS(sequential_colour(10, 10), stowage::ContractViolation);
}

TEST_CASE("an axis that cannot be drawn is a broken contract", "[svg]") {
  Canvas canvas("t", 100, 100, "t", "d");
  Axis flat = axis("x", 1, 1);
  Axis fine = axis("y", 0, 1);
  CHECK_THROWS_AS(Plot(canvas, 0, 0, 10, 10, flat, fine), stowage::ContractViolation);
  Axis log_at_zero = axis("y", 0, 10);
  log_at_zero.log10 = true;
  CHECK_THROWS_AS(Plot(canvas, 0, 0, 10, 10, fine, log_at_zero), stowage::ContractViolation);
}
