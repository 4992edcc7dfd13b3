// SPDX-License-Identifier: MIT
#include "optimiser/report/report_charts.h"

#include <algorithm>
#include <cmath>
#include <limits>

#include "optimiser/report/cost_lines.h"
#include "optimiser/report/number_format.h"
#include "optimiser/report/svg_chart.h"
#include "optimiser/report/sweep_report.h"

namespace stowage::report {

namespace {

using svg::Axis;
using svg::Canvas;
using svg::LegendEntry;
using svg::Plot;

constexpr int kDays = 365;

std::string amount_tick(double v) { return format_amount(v); }
std::string percent_tick(double v) { return format_general(v, 3); }

std::string design_name(const DesignResult& d) {
  return d.profile_id + " at DoD " + format_fixed(d.dod_setpoint, 2) + " with " +
         std::to_string(d.bank.strings_parallel) + " strings";
}

// Day-of-year axis for the hourly series, ticks at round days.
Axis day_axis() {
  Axis a;
  a.label = "day of the first project year";
  a.lo = 0;
  a.hi = kDays;
  a.ticks = {0, 50, 100, 150, 200, 250, 300, 350};
  return a;
}

struct Daily {
  std::vector<double> day, min, mean, max;
};
Daily daily(const std::vector<double>& hourly) {
  Daily out;
  for (int d = 0; d < kDays; ++d) {
    double lo = std::numeric_limits<double>::infinity(), hi = -lo, sum = 0;
    for (int h = 0; h < 24; ++h) {
      const double v = hourly[static_cast<std::size_t>(d * 24 + h)];
      lo = std::min(lo, v);
      hi = std::max(hi, v);
      sum += v;
    }
    out.day.push_back(d + 0.5);
    out.min.push_back(lo);
    out.mean.push_back(sum / 24);
    out.max.push_back(hi);
  }
  return out;
}

// Axis limits padded to round ticks around [lo, hi].
Axis value_axis(std::string label, double lo, double hi) {
  return svg::padded_axis(std::move(label), lo, hi, 1.0);
}

}  // namespace

ReportFigure stacked_bars_chart(const StackedBars& in) {
  const std::size_t series = in.series.size();
  const auto value = [&in](std::size_t bar, std::size_t k) { return in.values[bar][k]; };
  // Series that are zero for every bar stay out of the chart and its legend.
  std::vector<std::size_t> used;
  for (std::size_t k = 0; k < series; ++k) {
    for (std::size_t i = 0; i < in.bars.size(); ++i) {
      if (value(i, k) != 0) {
        used.push_back(k);
        break;
      }
    }
  }
  double top = 0, bottom = 0;
  for (std::size_t i = 0; i < in.bars.size(); ++i) {
    double up = 0, down = 0;
    for (std::size_t k : used) (value(i, k) > 0 ? up : down) += value(i, k);
    top = std::max(top, up);
    bottom = std::min(bottom, down);
  }
  const double n = static_cast<double>(std::max<std::size_t>(1, in.bars.size()));
  const double plot_w = std::max(260.0, std::min(480.0, 80.0 * n));
  std::size_t longest = 0;
  for (const StackedBars::Bar& b : in.bars) longest = std::max(longest, b.tick.size());
  // Category names are turned by 35 degrees; room below for the longest.
  const double name_drop = 20 + 0.6 * 7.0 * static_cast<double>(longest);
  const double plot_h = 300;
  const double legend_h = 60 + 20.0 * static_cast<double>(used.size());
  const double height = std::max(30 + plot_h + name_drop + 30, legend_h);
  Canvas canvas(in.id, 100 + plot_w + 250, height, in.title, in.description);
  // Tick text of seven digits and more would run into the axis label: thousands then.
  const bool thousands = std::max(top, -bottom) >= 1e6;
  Axis y =
      value_axis("present value (" + std::string(thousands ? "thousand " : "") + in.currency + ")",
                 bottom, top * 1.1);
  y.tick_text = thousands ? [](double v) { return format_amount(v / 1000); } : amount_tick;
  Axis x;
  x.label = in.x_label;
  x.lo = 0;
  x.hi = n;
  x.tick_rotate = -35;
  x.label_offset = name_drop + 12;
  for (std::size_t i = 0; i < in.bars.size(); ++i) x.ticks.push_back(static_cast<double>(i) + 0.5);
  x.tick_text = [&in](double v) {
    const auto i = static_cast<std::size_t>(std::floor(v));
    return i < in.bars.size() ? in.bars[i].tick : std::string();
  };
  Plot plot(canvas, 90, 30, plot_w, plot_h, x, y);
  plot.draw_axes();
  for (std::size_t k = 0; k < used.size(); ++k) {
    const StackedBars::Series& line = in.series[used[k]];
    plot.begin_data(line.key);
    for (std::size_t i = 0; i < in.bars.size(); ++i) {
      // Stack in series order: positives from zero up, credits from zero down.
      double up = 0, down = 0;
      for (std::size_t m = 0; m < k; ++m) (value(i, used[m]) > 0 ? up : down) += value(i, used[m]);
      const double v = value(i, used[k]);
      if (v == 0) continue;
      const double base = v > 0 ? up : down;
      const double x0 = static_cast<double>(i) + 0.18, x1 = static_cast<double>(i) + 0.82;
      plot.bar(x0, x1, base, base + v, line.style,
               in.bars[i].name + ": " + line.label + " " + format_amount(v) + " " + in.currency);
    }
    plot.end_data();
  }
  for (std::size_t i = 0; i < in.bars.size(); ++i) {
    double up = 0;
    for (std::size_t k : used) up += std::max(0.0, value(i, k));
    plot.label(static_cast<double>(i) + 0.5, up, format_amount(in.bars[i].total));
  }
  std::vector<LegendEntry> legend;
  for (std::size_t k : used) legend.push_back({in.series[k].style, in.series[k].label, true});
  canvas.text(100 + plot_w + 20, 34, "cost line (present value)", "legend-title");
  canvas.legend(100 + plot_w + 20, 56, legend, 20);
  ReportFigure f;
  f.id = in.id;
  f.caption = in.caption;
  f.svg = canvas.str();
  return f;
}

ReportFigure breakdown_chart(const std::vector<DesignResult>& designs,
                             const std::string& currency) {
  StackedBars in;
  in.id = "fig-breakdown";
  in.title = "Present-value cost breakdown of the best design of each profile";
  in.description =
      "Stacked bars: one per profile, each cost line a hatched segment, credits below "
      "zero; the net present cost is printed above each bar.";
  in.x_label = "best design of each profile, ranked by net present cost";
  in.currency = currency;
  in.caption = "Present value of each cost line of the best design of each profile (" + currency +
               "); the number above each bar is its net present cost, the sum of all segments "
               "with credits counted negative.";
  for (const CostLine& line : cost_lines())
    in.series.push_back({line.key, line.label, static_cast<int>(in.series.size())});
  for (std::size_t i = 0; i < designs.size(); ++i) {
    const DesignResult& d = designs[i];
    in.bars.push_back({std::to_string(i + 1) + ". " + d.profile_id, d.profile_id, d.npc});
    std::vector<double> values;
    for (const CostLine& line : cost_lines()) values.push_back(d.present_value.*line.member);
    in.values.push_back(values);
  }
  return stacked_bars_chart(in);
}

ReportFigure soc_heat_map(const DesignResult& design, const DesignTrace& trace) {
  // Equal steps of 10 % (5 % for a bank that stays above half full) from the lowest SOC of
  // the year, rounded down, to full, so that a shallow cycle still shows its pattern.
  double lowest = 1;
  for (std::size_t i = 1; i < trace.soc.size(); ++i) lowest = std::min(lowest, trace.soc[i]);
  double soc_step = 0.05;
  double soc_lo = std::min(0.95, std::floor(lowest * 20 + 1e-9) / 20);
  if (1 - soc_lo > 0.5 + 1e-9) {
    soc_step = 0.10;
    soc_lo = std::floor(lowest * 10 + 1e-9) / 10;
  }
  const int kSteps = std::max(1, static_cast<int>(std::lround((1 - soc_lo) / soc_step)));
  Canvas canvas("fig-soc", 760, 400, "State of charge by hour of day and day of year",
                "Heat map of the SOC at the end of each hour of the first project year of " +
                    design_name(design) + "; darker is emptier.");
  Axis x = day_axis();
  Axis y;
  y.label = "hour of day";
  y.lo = 0;
  y.hi = 24;
  y.ticks = {0, 6, 12, 18, 24};
  Plot plot(canvas, 80, 30, 640, 260, x, y);
  plot.begin_data("soc");
  // One cell per hour, merged along the days while the step is unchanged, so the file stays
  // small without losing a cell.
  for (int h = 0; h < 24; ++h) {
    int start = 0, run_step = -1;
    for (int d = 0; d <= kDays; ++d) {
      int step = -1;
      if (d < kDays) {
        const double soc = trace.soc[static_cast<std::size_t>(d * 24 + h + 1)];
        step = std::clamp(static_cast<int>(std::floor((soc - soc_lo) / soc_step)), 0, kSteps - 1);
      }
      if (step != run_step) {
        if (run_step >= 0) plot.cell(start, d, h, h + 1, svg::sequential_colour(run_step, kSteps));
        start = d;
        run_step = step;
      }
    }
  }
  plot.end_data();
  plot.draw_axes();
  std::vector<std::pair<std::string, std::string>> keys;
  for (int s = 0; s < kSteps; ++s)
    keys.push_back({format_general(100 * (soc_lo + s * soc_step), 3) + "-" +
                        format_general(100 * (soc_lo + (s + 1) * soc_step), 3),
                    svg::sequential_colour(s, kSteps)});
  canvas.colour_key(80, 350, keys, "SOC at the end of the hour (% of the charge held when full)");
  ReportFigure f;
  f.id = "fig-soc";
  f.caption = "State of charge of " + design_name(design) +
              " at the end of each hour of the first project year, as the lifecycle simulated "
              "it; each column is a day, each row an hour of the day, darker cells are emptier "
              "(steps of " +
              format_general(100 * soc_step, 2) + " % from " + format_general(100 * soc_lo, 3) +
              " % to 100 %, the lowest SOC of the year being " + format_fixed(100 * lowest, 1) +
              " %).";
  f.svg = canvas.str();
  return f;
}

ReportFigure rainflow_histogram(const DesignResult& design, const DesignTrace& trace) {
  double highest = 0;
  for (const DepthBin& b : trace.cycles.histogram) highest = std::max(highest, b.count);
  Canvas canvas("fig-rainflow", 760, 360, "Rainflow cycle count by depth, first year",
                "Histogram of the rainflow cycles (ASTM E1049-85) of the first-year SOC trace of " +
                    design_name(design) + ", by depth in 5 % bins.");
  Axis x;
  x.label = "cycle depth (% of the charge held when full)";
  x.lo = 0;
  x.hi = 100;
  x.ticks = {0, 10, 20, 30, 40, 50, 60, 70, 80, 90, 100};
  Axis y = value_axis("cycles in the first year", 0, highest > 0 ? highest * 1.12 : 1);
  Plot plot(canvas, 80, 30, 640, 260, x, y);
  plot.draw_axes();
  plot.begin_data("cycles");
  for (const DepthBin& b : trace.cycles.histogram) {
    if (b.count <= 0) continue;
    plot.bar(100 * b.depth_from, 100 * b.depth_to, 0, b.count, 0,
             format_fixed(100 * b.depth_from, 0) + "-" + format_fixed(100 * b.depth_to, 0) +
                 " %: " + format_general(b.count, 6) + " cycles");
    plot.label(100 * (b.depth_from + b.depth_to) / 2, b.count, format_general(b.count, 4));
  }
  plot.end_data();
  ReportFigure f;
  f.id = "fig-rainflow";
  f.caption = "Rainflow cycles (ASTM E1049-85) of the first-year SOC trace of " +
              design_name(design) +
              " by depth in 5 % bins; the number on each bar is its count (half cycles count 0.5).";
  f.svg = canvas.str();
  return f;
}

ReportFigure life_chart(const DesignResult& design, const ChemistryProfile& profile) {
  Canvas canvas("fig-life", 760, 520, "Capacity and damage over the project",
                "Two panels over the project years of " + design_name(design) +
                    ": capacity at the start of each year, and the most accumulated damage a bank "
                    "reached in it, "
                    "with the replacements marked.");
  const int n = static_cast<int>(design.years.size());
  std::vector<double> years, health, damage;
  double lowest = 100, most = 1;
  for (const YearRecord& y : design.years) {
    years.push_back(y.year);
    health.push_back(100 * y.health_start);
    damage.push_back(y.damage_peak);
    lowest = std::min(lowest, 100 * y.health_start);
    most = std::max(most, y.damage_peak);
  }
  const double eol = 100 * profile.eol_capacity_fraction;
  Axis x;
  x.label = "project year";
  x.lo = 0;
  x.hi = n + 1;
  x.ticks = svg::nice_ticks(0, n + 1, 10);
  Axis top = value_axis("capacity (% of rated)", std::min(lowest, eol) - 5, 100);
  top.hi = std::min(top.hi, 100.0);
  if (!(top.hi > top.lo)) top.lo = top.hi - 10;
  top.tick_text = percent_tick;
  Axis bottom = value_axis("damage (1 = end of life)", 0, most * 1.1);
  Plot upper(canvas, 90, 36, 560, 170, x, top);
  upper.draw_axes("capacity at the start of each year");
  upper.hline(eol, "end of life " + format_general(eol, 3) + " %");
  upper.line(years, health, 0, "capacity", 1);
  Plot lower(canvas, 90, 286, 560, 170, x, bottom);
  lower.draw_axes("most accumulated damage in each year");
  lower.hline(1, "end of life (damage 1)");
  lower.line(years, damage, 3, "damage", 1);
  for (std::size_t i = 0; i < design.replacement_years.size(); ++i) {
    const int yr = design.replacement_years[i];
    const int month = design.replacement_months[i];
    if (i > 0 && design.replacement_years[i - 1] == yr && design.replacement_months[i - 1] == month)
      continue;  // several in one month
    // Project time at the end of that month: year yr ends at yr.
    const double at = yr - 1 + month / 12.0;
    upper.vline(at, "replaced year " + std::to_string(yr) + " month " + std::to_string(month),
                false);
    lower.vline(at, "replaced", true);
  }
  canvas.legend(665, 60, {{0, "capacity", false}}, 18);
  canvas.legend(665, 310, {{3, "damage", false}}, 18);
  ReportFigure f;
  f.id = "fig-life";
  f.caption =
      "Capacity of the bank in service at the start of each project year and the most "
      "accumulated damage a bank reached in the year, " +
      design_name(design) + "; dashed vertical lines mark the replacements " +
      (design.replacement_years.empty() ? std::string("(none within the project)")
                                        : std::string("at the end of the month named")) +
      ".";
  f.svg = canvas.str();
  return f;
}

ReportFigure cycle_life_chart(const DesignResult& design, const ChemistryProfile& profile) {
  const CycleLifeCurve& curve = profile.cycle_life;
  double dod_lo = design.dod_setpoint;
  for (const CycleLifePoint& p : curve.points()) dod_lo = std::min(dod_lo, p.dod);
  dod_lo = std::max(0.01, std::pow(10.0, std::floor(std::log10(dod_lo) * 2) / 2));
  std::vector<double> xs, ys;
  for (int i = 0; i <= 80; ++i) {
    const double dod = dod_lo * std::pow(1.0 / dod_lo, i / 80.0);
    xs.push_back(100 * dod);
    ys.push_back(curve.cycles_to_end_of_life(dod));
  }
  const double y_lo =
      std::pow(10.0, std::floor(std::log10(*std::min_element(ys.begin(), ys.end()))));
  const double y_hi =
      std::pow(10.0, std::ceil(std::log10(*std::max_element(ys.begin(), ys.end()) * 1.01)));
  Canvas canvas("fig-cycle-life", 760, 400, "Cycle-life curve with the DoD setpoint",
                "Cycles to end of life against depth of discharge for profile " + profile.id +
                    " on log-log axes, with its table points and the design's setpoint.");
  Axis x;
  x.label = "depth of discharge (% of capacity)";
  x.lo = 100 * dod_lo;
  x.hi = 100;
  x.log10 = true;
  x.tick_text = percent_tick;
  Axis y;
  y.label = "cycles to end of life at " +
            format_general(profile.temperature.spec().reference_temp_c, 3) + " \u00B0C";
  y.lo = y_lo;
  y.hi = y_hi;
  y.log10 = true;
  y.tick_text = amount_tick;
  Plot plot(canvas, 90, 30, 560, 290, x, y);
  plot.draw_axes();
  plot.line(xs, ys, 0, "interpolated curve");
  std::vector<double> px, py;
  for (const CycleLifePoint& p : curve.points()) {
    px.push_back(100 * p.dod);
    py.push_back(p.cycles);
  }
  plot.points(px, py, 1, "profile table");
  const double at = curve.cycles_to_end_of_life(design.dod_setpoint);
  plot.vline(
      100 * design.dod_setpoint,
      "setpoint DoD " + format_fixed(design.dod_setpoint, 2) + ": " + format_amount(at) + " cycles",
      false);
  canvas.legend(104, 260,
                {{0, "interpolated (log-log)", false, false}, {1, "profile table", false, true}},
                18);
  ReportFigure f;
  f.id = "fig-cycle-life";
  f.caption = "Cycle-life curve of profile " + profile.id +
              " (full cycles to end of life at the reference temperature, interpolated in "
              "log-log space between the profile's table points, squares) with the design's DoD "
              "setpoint marked.";
  f.svg = canvas.str();
  return f;
}

ReportFigure temperature_chart(const DesignResult& design, const DesignTrace& trace,
                               const ChemistryProfile& profile) {
  const Daily temp = daily(trace.temp_c);
  const Daily cap = daily(trace.capacity_factor);
  const Daily acc = daily(trace.ageing_acceleration);
  auto scaled = [](std::vector<double> v) {
    for (double& x : v) x *= 100;
    return v;
  };
  Canvas canvas("fig-temperature", 790, 640,
                "Site temperature, available capacity and ageing acceleration over the year",
                "Three panels by day of the first project year: daily minimum, mean and maximum "
                "battery temperature; the available capacity and the ageing acceleration of " +
                    design_name(design) + ".");
  const Axis x = day_axis();
  const double t_lo = *std::min_element(temp.min.begin(), temp.min.end());
  const double t_hi = *std::max_element(temp.max.begin(), temp.max.end());
  Plot p1(canvas, 90, 36, 540, 130, x, value_axis("temperature (\u00B0C)", t_lo, t_hi));
  p1.draw_axes("site temperature");
  p1.line(temp.day, temp.max, 3, "daily maximum", 0, 1.5);
  p1.line(temp.day, temp.mean, 0, "daily mean", 0, 1.5);
  p1.line(temp.day, temp.min, 4, "daily minimum", 0, 1.5);
  const double c_lo = 100 * *std::min_element(cap.min.begin(), cap.min.end());
  const double c_hi = 100 * *std::max_element(cap.max.begin(), cap.max.end());
  Axis cap_axis = value_axis("capacity (% of rated)", c_lo, c_hi);
  cap_axis.tick_text = percent_tick;
  Plot p2(canvas, 90, 246, 540, 130, x, cap_axis);
  p2.draw_axes("available capacity at that temperature");
  p2.line(cap.day, scaled(cap.mean), 0, "daily mean", 0, 1.5);
  p2.line(cap.day, scaled(cap.min), 4, "daily minimum", 0, 1.5);
  const double a_hi = *std::max_element(acc.max.begin(), acc.max.end());
  Plot p3(canvas, 90, 456, 540, 130, x, value_axis("acceleration (x reference)", 1, a_hi));
  p3.draw_axes("ageing acceleration at that temperature");
  p3.line(acc.day, acc.max, 3, "daily maximum", 0, 1.5);
  p3.line(acc.day, acc.mean, 0, "daily mean", 0, 1.5);
  canvas.legend(640, 60, {{3, "daily maximum"}, {0, "daily mean"}, {4, "daily minimum"}}, 18);
  canvas.legend(640, 270, {{0, "daily mean"}, {4, "daily minimum"}}, 18);
  canvas.legend(640, 480, {{3, "daily maximum"}, {0, "daily mean"}}, 18);
  ReportFigure f;
  f.id = "fig-temperature";
  f.caption =
      "Battery-space temperature of the site by day of the first project year, and what "
      "it does to profile " +
      profile.id +
      ": the available capacity (the profile's table, linear between rows) and the "
      "ageing acceleration relative to the reference temperature (floored at 1, "
      "docs/method.md section 3), as daily means with the daily extremes.";
  f.svg = canvas.str();
  return f;
}

ReportFigure tornado_chart(const TornadoResult& tornado, const std::string& currency) {
  std::vector<const TornadoBar*> bars;
  for (const TornadoBar& b : tornado.bars) {
    if (b.low.feasible() && b.high.feasible()) bars.push_back(&b);
  }
  const double base = tornado.base.winner().npc;
  double lo = base, hi = base;
  for (const TornadoBar* b : bars) {
    for (const PointOutcome* end : {&b->low, &b->high}) {
      lo = std::min(lo, end->winner().npc);
      hi = std::max(hi, end->winner().npc);
    }
  }
  const double row_px = 34;
  const double rows = std::max(1.0, static_cast<double>(bars.size()));
  const double plot_h = rows * row_px;
  Canvas canvas("fig-tornado", 900, plot_h + 120, "Sensitivity of the winner's net present cost",
                "Tornado chart: for each varied input, the net present cost of the winning design "
                "at the input's low and high end, against the base case.");
  Axis x = value_axis("net present cost of the winner (" + currency + ")", lo, hi);
  x.tick_text = [](double v) { return format_amount(v); };
  // Rows from the top, largest swing first; each row's tick is its input (an asterisk where
  // the winner changes at one of its ends).
  Axis y;
  y.label = "varied input";
  y.label_offset = 306;
  y.lo = 0;
  y.hi = rows;
  std::vector<std::string> names;
  for (std::size_t i = 0; i < bars.size(); ++i) {
    y.ticks.push_back(rows - static_cast<double>(i) - 0.5);
    names.push_back((bars[i]->winner_changes ? "* " : "") + bars[i]->variation.label);
  }
  y.tick_text = [names, rows](double v) {
    const auto i = static_cast<std::size_t>(std::lround(rows - 0.5 - v));
    return i < names.size() ? names[i] : std::string();
  };
  Plot plot(canvas, 340, 30, 520, plot_h, x, y);
  plot.draw_axes();
  plot.vline(base, "base " + format_amount(base));
  plot.begin_data("tornado");
  for (std::size_t i = 0; i < bars.size(); ++i) {
    const TornadoBar& b = *bars[i];
    const double top = rows - static_cast<double>(i) - 0.15, bottom = top - 0.7;
    const double at_low = b.low.winner().npc, at_high = b.high.winner().npc;
    plot.bar(std::min(base, at_low), std::max(base, at_low), bottom, top, 0,
             b.variation.label + " at " + variation_value_text(b.variation, b.variation.low) +
                 ": " + format_amount(at_low) + " " + currency);
    plot.bar(std::min(base, at_high), std::max(base, at_high), bottom, top, 1,
             b.variation.label + " at " + variation_value_text(b.variation, b.variation.high) +
                 ": " + format_amount(at_high) + " " + currency);
  }
  plot.end_data();
  canvas.legend(340, plot_h + 80,
                {{0, "winner at the input's low end", true, false},
                 {1, "winner at the input's high end", true, false}});
  ReportFigure f;
  f.id = "fig-tornado";
  f.caption =
      "Net present cost of the winning design at the low and high end of each varied "
      "input, every other input at its base value; the line is the base case. An "
      "asterisk marks an input at one of whose ends another profile wins.";
  f.svg = canvas.str();
  return f;
}

}  // namespace stowage::report
