// SPDX-License-Identifier: MIT
// The report's figures, drawn with svg_chart.h from the result objects as they are (nothing
// is re-derived: the bars are CostBreakdown's present values, the capacity and damage lines
// are YearRecord's, the SOC, cycles and temperature effects are the first-year DesignTrace of
// optimiser/analysis/design_trace.h). Each returns a ReportFigure whose id is also the name
// of its .svg file.
#pragma once

#include <string>
#include <vector>

#include "model/chemistry_profile.h"
#include "model/lifecycle.h"
#include "optimiser/analysis/design_trace.h"
#include "optimiser/analysis/sweep.h"
#include "optimiser/report/report_document.h"

namespace stowage::report {

// Stacked present-value bars, one per bar entry, each series a hatched segment in series
// order, positive values up from zero, credits down; series zero in every bar are left out;
// each bar's `total` is printed above it. Values of a million and more are shown on the axis in
// thousands.
struct StackedBars {
  struct Series {
    std::string key;    // names the <g class="data"> group
    std::string label;  // legend
    int style = 0;      // svg::series_style: colour, hatch; distinct among the series drawn
  };
  struct Bar {
    std::string tick;  // x-axis text
    std::string name;  // in each segment's tooltip
    double total = 0;
  };
  std::string id, title, description, x_label, caption, currency;
  std::vector<Series> series;
  std::vector<Bar> bars;
  std::vector<std::vector<double>> values;  // [bar][series]
};
ReportFigure stacked_bars_chart(const StackedBars& bars);

// The study's ranking: one bar per design, its CostBreakdown lines (cost_lines.h).
ReportFigure breakdown_chart(const std::vector<DesignResult>& designs, const std::string& currency);
// SOC at the end of each hour of year 1, by hour of day (rows) and day of year (columns).
ReportFigure soc_heat_map(const DesignResult& design, const DesignTrace& trace);
// Rainflow cycles of year 1 by depth, 5 % bins.
ReportFigure rainflow_histogram(const DesignResult& design, const DesignTrace& trace);
// Capacity at the start of each year and damage at its end, replacements marked.
ReportFigure life_chart(const DesignResult& design, const ChemistryProfile& profile);
// The profile's cycle-life curve (log-log) with its table points and the setpoint marked.
ReportFigure cycle_life_chart(const DesignResult& design, const ChemistryProfile& profile);
// Daily site temperature, available capacity factor and ageing acceleration over year 1.
ReportFigure temperature_chart(const DesignResult& design, const DesignTrace& trace,
                               const ChemistryProfile& profile);

// Tornado of a sensitivity sweep: one row per variation (largest swing at the top), a bar from
// the base winner's NPC to the winner's NPC at the low end and one to the high end (two
// hatches), the base NPC as a reference line, and an asterisk where the winner changes.
// Variations with an end without a winner are left out. Requires tornado.base.feasible().
ReportFigure tornado_chart(const TornadoResult& tornado, const std::string& currency);

}  // namespace stowage::report
