// SPDX-License-Identifier: MIT
#include "optimiser/report/robustness_charts.h"

#include <algorithm>
#include <cmath>
#include <limits>
#include <utility>

#include "model/contract.h"
#include "optimiser/report/number_format.h"
#include "optimiser/report/svg_chart.h"
#include "optimiser/report/sweep_report.h"

namespace stowage::report {

namespace {

using svg::Axis;
using svg::Canvas;
using svg::LegendEntry;
using svg::Plot;

// A solid black stroke between two data points (medians, whiskers): black and solid so that
// it reads the same in colour, in greyscale and for every colour vision.
void black_segment(Canvas& canvas, const Plot& plot, double x0, double y0, double x1, double y1,
                   double width) {
  canvas.raw("<line x1=\"" + svg::num(plot.px(x0)) + "\" y1=\"" + svg::num(plot.py(y0)) +
             "\" x2=\"" + svg::num(plot.px(x1)) + "\" y2=\"" + svg::num(plot.py(y1)) +
             "\" stroke=\"#000000\" stroke-width=\"" + svg::num(width) + "\"/>\n");
}

// A legend row for a black_segment: the stroke at (x, y) and its text.
void black_legend_row(Canvas& canvas, double x, double y, const std::string& text, double width) {
  canvas.raw("<g class=\"legend\">\n<line x1=\"" + svg::num(x) + "\" y1=\"" + svg::num(y - 4) +
             "\" x2=\"" + svg::num(x + 22) + "\" y2=\"" + svg::num(y - 4) +
             "\" stroke=\"#000000\" stroke-width=\"" + svg::num(width) + "\"/>\n");
  canvas.text(x + 28, y, text, "legend-text");
  canvas.raw("</g>\n");
}

// Axis limits padded to round ticks around [lo, hi].
Axis padded_axis(std::string label, double lo, double hi) {
  return svg::padded_axis(std::move(label), lo, hi, 1e-3);
}

// Category axis: one tick per name at i + 0.5, names turned when long.
Axis category_axis(std::string label, const std::vector<std::string>& names) {
  Axis x;
  x.label = std::move(label);
  x.lo = 0;
  x.hi = static_cast<double>(std::max<std::size_t>(1, names.size()));
  std::size_t longest = 0;
  for (const std::string& n : names) longest = std::max(longest, n.size());
  if (longest > 10) {
    x.tick_rotate = -30;
    x.label_offset = 24 + 0.55 * 7.0 * static_cast<double>(longest);
  }
  for (std::size_t i = 0; i < names.size(); ++i) x.ticks.push_back(static_cast<double>(i) + 0.5);
  x.tick_text = [names](double v) {
    const auto i = static_cast<std::size_t>(std::floor(v));
    return i < names.size() ? names[i] : std::string();
  };
  return x;
}

double category_drop(const Axis& x) { return x.label_offset + 16; }

std::string amount_or_thousands(double v, bool thousands) {
  return thousands ? format_amount(v / 1000) : format_amount(v);
}

}  // namespace

std::string profile_letter(std::size_t index) {
  std::string out;
  std::size_t n = index + 1;
  while (n > 0) {
    out.insert(out.begin(), static_cast<char>('A' + (n - 1) % 26));
    n = (n - 1) / 26;
  }
  return out;
}

ReportFigure uncertainty_spread_chart(const UncertaintyResult& r, SpreadQuantity quantity,
                                      const std::string& currency) {
  const bool npc = quantity == SpreadQuantity::Npc;
  const auto stats = [npc](const ProfileUncertainty& p) -> const SampleStatistics& {
    return npc ? p.npc : p.lcos;
  };
  std::vector<std::string> names;
  double lo = std::numeric_limits<double>::infinity(), hi = -lo;
  for (const ProfileUncertainty& p : r.profiles) {
    names.push_back(p.profile_id);
    for (double v : {stats(p).p10, stats(p).p90, stats(p).mean}) {
      if (std::isfinite(v)) {
        lo = std::min(lo, v);
        hi = std::max(hi, v);
      }
    }
  }
  if (!std::isfinite(lo))
    throw ContractViolation("uncertainty_spread_chart", "needs a profile with samples");
  const bool thousands = npc && std::max(std::fabs(lo), std::fabs(hi)) >= 1e6;
  const std::string unit =
      npc ? (thousands ? "thousand " : "") + currency : currency + " per kWh delivered";
  Axis y = padded_axis((npc ? "net present cost (" : "LCOS (") + unit + ")", lo, hi);
  if (npc) {
    y.tick_text = [thousands](double v) { return amount_or_thousands(v, thousands); };
  } else {
    y.tick_text = [](double v) { return format_general(v, 4); };
  }
  Axis x = category_axis("profile", names);
  const double n = static_cast<double>(std::max<std::size_t>(1, names.size()));
  const double plot_w = std::max(240.0, std::min(520.0, 110.0 * n));
  const double plot_h = 280;
  const std::string id = npc ? "fig-npc-spread" : "fig-lcos-spread";
  const std::string what = npc ? "net present cost" : "LCOS";
  Canvas canvas(id, 110 + plot_w + 250, 30 + plot_h + category_drop(x) + 10,
                "Spread of each profile's " + what + " over the samples",
                "For each profile, a box from the 10th to the 90th percentile of its " + what +
                    " over " + std::to_string(r.samples) +
                    " samples, a black bar at the median and a diamond at the mean.");
  Plot plot(canvas, 100, 30, plot_w, plot_h, x, y);
  plot.draw_axes();
  std::vector<double> mean_x, mean_y;
  for (std::size_t i = 0; i < r.profiles.size(); ++i) {
    const SampleStatistics& s = stats(r.profiles[i]);
    if (!std::isfinite(s.p10) || !std::isfinite(s.p90)) continue;
    const double c = static_cast<double>(i) + 0.5;
    const auto text = [&](double v) {
      return npc ? format_amount(v) + " " + currency : format_fixed(v, 4) + " " + currency + "/kWh";
    };
    plot.begin_data("p10-p90 " + r.profiles[i].profile_id);
    plot.bar(c - 0.28, c + 0.28, s.p10, s.p90, 4,
             r.profiles[i].profile_id + ": P10 " + text(s.p10) + ", P90 " + text(s.p90));
    plot.end_data();
    plot.begin_data("p50 " + r.profiles[i].profile_id);
    black_segment(canvas, plot, c - 0.28, s.p50, c + 0.28, s.p50, 3.5);
    plot.end_data();
    mean_x.push_back(c);
    mean_y.push_back(s.mean);
  }
  plot.points(mean_x, mean_y, 3, "mean");
  canvas.legend(110 + plot_w + 20, 60,
                {{4, "10th to 90th percentile", true, false}, {3, "mean", false, true}});
  black_legend_row(canvas, 110 + plot_w + 20, 96, "median (P50)", 3.5);
  ReportFigure f;
  f.id = id;
  f.caption = "Spread of each profile's " + what + " over the " + std::to_string(r.samples) +
              " samples: the box runs from P10 to P90, the black bar is the median (P50) and the "
              "diamond the mean (the numbers of the table above).";
  f.svg = canvas.str();
  return f;
}

ReportFigure npc_ecdf_chart(const UncertaintyResult& r, const std::string& currency) {
  std::vector<std::vector<double>> sorted(r.profiles.size());
  double lo = std::numeric_limits<double>::infinity(), hi = -lo;
  for (const std::vector<double>& sample : r.npc) {
    for (std::size_t i = 0; i < sample.size() && i < sorted.size(); ++i) {
      if (!std::isfinite(sample[i])) continue;
      sorted[i].push_back(sample[i]);
      lo = std::min(lo, sample[i]);
      hi = std::max(hi, sample[i]);
    }
  }
  if (!std::isfinite(lo)) throw ContractViolation("npc_ecdf_chart", "needs a finite NPC");
  const bool thousands = std::max(std::fabs(lo), std::fabs(hi)) >= 1e6;
  Axis x = padded_axis(
      "net present cost (" + std::string(thousands ? "thousand " : "") + currency + ")", lo, hi);
  x.tick_text = [thousands](double v) { return amount_or_thousands(v, thousands); };
  Axis y;
  y.label = "samples at or below (%)";
  y.lo = 0;
  y.hi = 100;
  y.ticks = {0, 20, 40, 60, 80, 100};
  const double plot_w = 520, plot_h = 260;
  const double legend_h = 20.0 * static_cast<double>(r.profiles.size());
  Canvas canvas("fig-npc-ecdf", 110 + plot_w + 40, 30 + plot_h + 70 + legend_h,
                "Distribution of each profile's net present cost over the samples",
                "For each profile, the share of samples whose net present cost is at or below "
                "each value: a step line rising at each sampled value.");
  Plot plot(canvas, 100, 30, plot_w, plot_h, x, y);
  plot.draw_axes();
  std::vector<LegendEntry> legend;
  for (std::size_t i = 0; i < sorted.size(); ++i) {
    std::vector<double>& v = sorted[i];
    if (v.empty()) continue;
    std::sort(v.begin(), v.end());
    const double n = static_cast<double>(v.size());
    std::vector<double> xs, ys;
    for (std::size_t j = 0; j < v.size(); ++j) {
      xs.push_back(v[j]);
      ys.push_back(100 * static_cast<double>(j) / n);
      xs.push_back(v[j]);
      ys.push_back(100 * static_cast<double>(j + 1) / n);
    }
    // About six markers per line, so the lines stay apart without their colour.
    const int every = std::max(1, static_cast<int>(xs.size() / 6));
    plot.line(xs, ys, static_cast<int>(i), r.profiles[i].profile_id, every);
    legend.push_back({static_cast<int>(i), r.profiles[i].profile_id, false, false});
  }
  canvas.legend(110, 30 + plot_h + 70, legend);
  ReportFigure f;
  f.id = "fig-npc-ecdf";
  f.caption =
      "Empirical distribution of each profile's net present cost over the samples "
      "(samples.csv): the height of a line at a cost is the share of samples at or below it; "
      "a line further left is cheaper more often.";
  f.svg = canvas.str();
  return f;
}

ReportFigure win_probability_chart(const UncertaintyResult& r) {
  std::vector<std::string> names;
  for (const ProfileUncertainty& p : r.profiles) names.push_back(p.profile_id);
  Axis x = category_axis("profile", names);
  Axis y;
  y.label = "probability of being cheapest (% of samples)";
  y.lo = 0;
  y.hi = 100;
  y.ticks = {0, 20, 40, 60, 80, 100};
  const double n = static_cast<double>(std::max<std::size_t>(1, names.size()));
  const double plot_w = std::max(240.0, std::min(520.0, 110.0 * n));
  const double plot_h = 260;
  Canvas canvas("fig-win-probability", 110 + plot_w + 250, 40 + plot_h + category_drop(x) + 10,
                "Probability of each profile being cheapest",
                "For each profile, the share of " + std::to_string(r.samples) +
                    " samples in which its design has the lowest net present cost of those "
                    "meeting the unserved-energy limit, with a whisker of one standard error "
                    "either side.");
  Plot plot(canvas, 100, 40, plot_w, plot_h, x, y);
  plot.draw_axes();
  plot.begin_data("win probability");
  for (std::size_t i = 0; i < r.profiles.size(); ++i) {
    const ProfileUncertainty& p = r.profiles[i];
    const double c = static_cast<double>(i) + 0.5;
    plot.bar(c - 0.3, c + 0.3, 0, 100 * p.win_probability, 2,
             p.profile_id + ": " + format_fixed(100 * p.win_probability, 1) + " % +- " +
                 format_fixed(100 * p.win_probability_se, 1) + " %");
  }
  plot.end_data();
  for (std::size_t i = 0; i < r.profiles.size(); ++i) {
    const ProfileUncertainty& p = r.profiles[i];
    const double c = static_cast<double>(i) + 0.5;
    const double top = std::min(100.0, 100 * (p.win_probability + p.win_probability_se));
    const double bottom = std::max(0.0, 100 * (p.win_probability - p.win_probability_se));
    // The whisker: a vertical stroke with a cap at each end.
    plot.begin_data("standard error " + p.profile_id);
    black_segment(canvas, plot, c, bottom, c, top, 1.5);
    black_segment(canvas, plot, c - 0.08, top, c + 0.08, top, 1.5);
    black_segment(canvas, plot, c - 0.08, bottom, c + 0.08, bottom, 1.5);
    plot.end_data();
    plot.begin_data("value " + p.profile_id);
    plot.label(c, top + 2, format_fixed(100 * p.win_probability, 1) + " %");
    plot.end_data();
  }
  canvas.legend(110 + plot_w + 20, 70, {{2, "share of samples cheapest", true, false}});
  black_legend_row(canvas, 110 + plot_w + 20, 88, "plus or minus one standard error", 1.5);
  ReportFigure f;
  f.id = "fig-win-probability";
  f.caption = "Share of the " + std::to_string(r.samples) +
              " samples in which each profile's design is the cheapest meeting the "
              "unserved-energy limit; the whiskers are one standard error, sqrt(p(1-p)/N).";
  f.svg = canvas.str();
  return f;
}

ReportFigure breakeven_chart(const BreakevenResult& r, const std::string& currency) {
  std::vector<BreakevenProbe> probes = r.scan;
  probes.insert(probes.end(), r.bisection.begin(), r.bisection.end());
  std::stable_sort(
      probes.begin(), probes.end(),
      [](const BreakevenProbe& a, const BreakevenProbe& b) { return a.value < b.value; });
  std::vector<double> xs, own, rival;
  double lo = std::numeric_limits<double>::infinity(), hi = -lo;
  for (const BreakevenProbe& p : probes) {
    xs.push_back(p.value);
    own.push_back(p.profile_npc);
    rival.push_back(p.rival_npc);
    for (double v : {p.profile_npc, p.rival_npc}) {
      if (std::isfinite(v)) {
        lo = std::min(lo, v);
        hi = std::max(hi, v);
      }
    }
  }
  if (!std::isfinite(lo)) throw ContractViolation("breakeven_chart", "needs a finite NPC");
  const bool thousands = std::max(std::fabs(lo), std::fabs(hi)) >= 1e6;
  Axis y = padded_axis(
      "net present cost (" + std::string(thousands ? "thousand " : "") + currency + ")", lo, hi);
  y.tick_text = [thousands](double v) { return amount_or_thousands(v, thousands); };
  Axis x = padded_axis(r.path + (r.unit.empty() ? "" : " (" + r.unit + ")"), r.from, r.to);
  x.lo = r.from;
  x.hi = r.to;
  x.ticks = svg::nice_ticks(r.from, r.to);
  x.ticks.erase(std::remove_if(x.ticks.begin(), x.ticks.end(),
                               [&](double t) { return t < r.from - 1e-12 || t > r.to + 1e-12; }),
                x.ticks.end());
  if (x.ticks.size() < 2) x.ticks = {r.from, r.to};
  const double plot_w = 520, plot_h = 280;
  Canvas canvas("fig-breakeven", 110 + plot_w + 40, 30 + plot_h + 60 + 50,
                "Net present cost of " + r.profile_id + " and of the cheapest other profile",
                "Net present cost of " + r.profile_id +
                    "'s best design and of the cheapest other profile's at every value of " +
                    r.path + " evaluated by the break-even search" +
                    (r.crossing ? ", with the break-even value marked." : "; no crossing."));
  Plot plot(canvas, 100, 30, plot_w, plot_h, x, y);
  plot.draw_axes();
  plot.line(xs, own, 0, r.profile_id, 1);
  plot.line(xs, rival, 1, "cheapest other profile", 1);
  if (r.crossing) {
    plot.vline(r.value,
               "break-even " + format_general(r.value, 7) + (r.unit.empty() ? "" : " " + r.unit));
  }
  canvas.legend(110, 30 + plot_h + 70,
                {{0, r.profile_id + " (the profile whose tie is sought)", false, false},
                 {1, "cheapest other profile at that value", false, false}});
  ReportFigure f;
  f.id = "fig-breakeven";
  f.caption = "Net present cost of " + r.profile_id +
              " and of the cheapest other profile at every value the search evaluated (the "
              "probes table); " +
              (r.crossing ? "the dashed line marks the break-even value."
                          : "the lines do not cross "
                            "in the range searched.");
  f.svg = canvas.str();
  return f;
}

ReportFigure sweep_line_chart(const StudyCase& study, const GridResult& g) {
  if (g.axes.size() != 1) throw ContractViolation("sweep_line_chart", "needs a 1-D grid");
  const Variation& v = g.axes[0];
  const std::vector<double>& xs = g.values[0];
  const std::string& cur = study.economics.currency;
  std::vector<std::vector<double>> npc(study.profiles.size());
  std::vector<double> win_x, win_y;
  double lo = std::numeric_limits<double>::infinity(), hi = -lo;
  for (std::size_t i = 0; i < xs.size(); ++i) {
    const PointOutcome& p = g.at(i);
    for (std::size_t k = 0; k < study.profiles.size(); ++k) {
      const bool has = k < p.by_profile.size() && p.by_profile[k];
      const double value = has ? p.by_profile[k]->npc : std::numeric_limits<double>::quiet_NaN();
      npc[k].push_back(value);
      if (std::isfinite(value)) {
        lo = std::min(lo, value);
        hi = std::max(hi, value);
      }
    }
    if (p.feasible()) {
      win_x.push_back(xs[i]);
      win_y.push_back(p.winner().npc);
    }
  }
  if (!std::isfinite(lo)) throw ContractViolation("sweep_line_chart", "needs a design");
  const bool thousands = std::max(std::fabs(lo), std::fabs(hi)) >= 1e6;
  Axis y = padded_axis("net present cost (" + std::string(thousands ? "thousand " : "") + cur + ")",
                       lo, hi);
  y.tick_text = [thousands](double t) { return amount_or_thousands(t, thousands); };
  Axis x;
  x.label = v.label + (v.unit.empty() ? "" : " (" + v.unit + ")");
  x.lo = xs.front();
  x.hi = xs.back() > xs.front() ? xs.back() : xs.front() + 1;
  x.ticks = xs.size() <= 8 ? xs : svg::nice_ticks(x.lo, x.hi);
  x.tick_text = [](double t) { return format_general(t, 4); };
  const double plot_w = 520, plot_h = 280;
  const double legend_h = 20.0 * static_cast<double>(study.profiles.size() + 1);
  Canvas canvas("fig-sweep", 110 + plot_w + 40, 30 + plot_h + 70 + legend_h,
                "Net present cost of each profile against " + v.label,
                "Net present cost of each profile's design at every value of " + v.label +
                    " in the grid, the winner at each value ringed.");
  Plot plot(canvas, 100, 30, plot_w, plot_h, x, y);
  plot.draw_axes();
  std::vector<LegendEntry> legend;
  for (std::size_t k = 0; k < study.profiles.size(); ++k) {
    plot.line(xs, npc[k], static_cast<int>(k), study.profiles[k].id, 1);
    legend.push_back({static_cast<int>(k), study.profiles[k].id, false, false});
  }
  // The winner: an open ring around its marker.
  plot.begin_data("winner");
  for (std::size_t i = 0; i < win_x.size(); ++i) {
    canvas.raw("<circle cx=\"" + svg::num(plot.px(win_x[i])) + "\" cy=\"" +
               svg::num(plot.py(win_y[i])) +
               "\" r=\"8\" fill=\"none\" stroke=\"#000000\" stroke-width=\"1.5\"/>\n");
  }
  plot.end_data();
  const double ly = 30 + plot_h + 70;
  canvas.legend(110, ly, legend);
  canvas.raw("<circle cx=\"121\" cy=\"" + svg::num(ly + legend_h - 24) +
             "\" r=\"7\" fill=\"none\" stroke=\"#000000\" stroke-width=\"1.5\"/>\n");
  canvas.text(138, ly + legend_h - 20, "the winner at that value", "legend-text");
  ReportFigure f;
  f.id = "fig-sweep";
  f.caption = "Net present cost of each profile's design against " + v.label +
              " (each line its own dash and marker); the ring marks the winner at each value.";
  f.svg = canvas.str();
  return f;
}

ReportFigure winner_map_chart(const StudyCase& study, const GridResult& g) {
  if (g.axes.size() != 2) throw ContractViolation("winner_map_chart", "needs a 2-D grid");
  const std::vector<double>& rows = g.values[0];
  const std::vector<double>& cols = g.values[1];
  const double nr = static_cast<double>(rows.size()), nc = static_cast<double>(cols.size());
  // Cells big enough for the axis labels to fit beside the map (about 6.6 px a character),
  // small enough for the page.
  const auto label_px = [](const Variation& v) {
    return 6.6 * static_cast<double>(v.label.size() + v.unit.size() + 3);
  };
  const double most = std::max(16.0, std::min(110.0, 560.0 / std::max(nr, nc)));
  const double cell =
      std::min(most, std::max({40.0, label_px(g.axes[0]) / nr, label_px(g.axes[1]) / nc}));
  const double plot_w = cell * nc, plot_h = cell * nr;
  const auto value_axis = [](const Variation& v, const std::vector<double>& values, bool reverse) {
    Axis a;
    a.label = v.label + (v.unit.empty() ? "" : " (" + v.unit + ")");
    a.lo = 0;
    a.hi = static_cast<double>(values.size());
    for (std::size_t i = 0; i < values.size(); ++i) a.ticks.push_back(static_cast<double>(i) + 0.5);
    a.tick_text = [values, reverse](double t) {
      auto i = static_cast<std::size_t>(std::floor(t));
      if (reverse) i = values.size() - 1 - i;
      return i < values.size() ? format_general(values[i], 4) : std::string();
    };
    return a;
  };
  // Rows from the top in the order of the first input's values.
  Axis y = value_axis(g.axes[0], rows, true);
  y.label_offset = 40;
  Axis x = value_axis(g.axes[1], cols, false);
  if (cols.size() > 6) x.tick_rotate = -30;
  const double key_h = 20.0 * static_cast<double>(study.profiles.size() + 1);
  Canvas canvas("fig-winner-map", 130 + std::max(plot_w, 380.0) + 40, 30 + plot_h + 70 + key_h,
                "Winning profile at every point of the grid",
                "A map of the winner at every combination of " + g.axes[0].label + " (rows) and " +
                    g.axes[1].label + " (columns), each cell labelled with its winner's letter.");
  Plot plot(canvas, 120, 30, plot_w, plot_h, x, y);
  plot.draw_axes();
  plot.begin_data("winners");
  for (std::size_t i = 0; i < rows.size(); ++i) {
    for (std::size_t j = 0; j < cols.size(); ++j) {
      const PointOutcome& p = g.at(i, j);
      const double y1 = nr - static_cast<double>(i), y0 = y1 - 1;
      const double x0 = static_cast<double>(j), x1 = x0 + 1;
      std::string letter = "-";
      std::string fill = "#FFFFFF";
      if (p.feasible()) {
        const std::size_t k = *study.find_profile(p.winner().profile_id);
        letter = profile_letter(k);
        // Steps of the sequential scheme far apart in lightness, one per profile, so the
        // map also reads in greyscale; the letter is the cue that never depends on it.
        static const int kSteps[] = {9, 6, 4, 8, 5, 7};
        fill = svg::sequential_colour(kSteps[k % 6], 10);
      }
      plot.cell(x0, x1, y0, y1, fill);
      canvas.text(plot.px(x0 + 0.5), plot.py(y0 + 0.5) + 5, letter, "value-label", "middle");
    }
  }
  plot.end_data();
  std::vector<std::string> key_lines;
  const double ky = 30 + plot_h + 70;
  for (std::size_t k = 0; k < study.profiles.size(); ++k) {
    canvas.text(120, ky + 20.0 * static_cast<double>(k),
                profile_letter(k) + " = " + study.profiles[k].id, "legend-text");
  }
  canvas.text(120, ky + 20.0 * static_cast<double>(study.profiles.size()),
              "- = no design meets the limits", "legend-text");
  ReportFigure f;
  f.id = "fig-winner-map";
  f.caption = "The winning profile at every point of the grid, rows " + g.axes[0].label +
              " and columns " + g.axes[1].label +
              "; each cell carries its winner's letter (key below the map).";
  f.svg = canvas.str();
  return f;
}

}  // namespace stowage::report
