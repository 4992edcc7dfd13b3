// SPDX-License-Identifier: MIT
// A small SVG chart module of our own: a canvas with titled plot panels, linear or log10
// axes with ticks, grid and axis labels, lines, markers, bars, shaded cells, reference lines
// and legends. Output is plain SVG 1.1 text, the same bytes for the same input (coordinates
// with two decimals through number_format.h), valid as XML so that it can sit inline in the
// HTML report and stand alone as a .svg file.
//
// Readability: series take their colour from the Okabe-Ito palette (Okabe & Ito 2008, "Color
// Universal Design", distinguishable with the common colour-vision deficiencies) and, so that
// colour is never the only cue, a dash pattern and a marker shape for lines and a hatch
// pattern for areas; every series is named in a legend or a direct label. Sequential values
// (the SOC heat map) use ten steps of Paul Tol's YlOrBr scheme (SRON technical note
// SRON/EPS/TN/09-002, from memory), whose lightness falls monotonically, so they read in
// greyscale too, with a labelled key.
// Structure the tests rely on (tests/e2e/report.sh): every plotted mark sits in a
// <g class="data">, every axis has a <text class="axis-label"> with its quantity and unit,
// and the <svg> carries <title> and <desc>.
#pragma once

#include <functional>
#include <string>
#include <vector>

namespace stowage::report::svg {

struct SeriesStyle {
  const char* colour;  // Okabe-Ito hex colour
  const char* dash;    // stroke-dasharray, "" for solid
  const char* marker;  // "circle", "square", "triangle", "diamond", "cross", "none"
  int hatch;           // index of the hatch pattern for areas, 0..7
};
// Style i (taken modulo series_style_count(), 10): the eight Okabe-Ito colours, then two of
// them again with a hatch and dash of their own, so every style differs in its colour and
// hatch pair and in its dash.
const SeriesStyle& series_style(int i);
int series_style_count();
// Sequential colour of step `step` of `steps` (0 = darkest) of the YlOrBr scheme.
std::string sequential_colour(int step, int steps);

struct Axis {
  std::string label;  // quantity and unit, e.g. "depth of discharge (%)"
  double lo = 0, hi = 1;
  bool log10 = false;
  // Tick positions; empty: chosen by nice_ticks() (linear) or at 1-2-5 decades (log).
  std::vector<double> ticks;
  // Tick text; empty: format_general(value, 4).
  std::function<std::string(double)> tick_text;
  // x axis only: tick text turned by this many degrees (negative: counter-clockwise) for long
  // category names.
  double tick_rotate = 0;
  // Distance of the axis label from the plot area in pixels: below it (x axis), or
  // label_offset + 24 to its left (y axis, leaving room for the tick text).
  double label_offset = 34;
};

// About `target` round-numbered ticks (steps of 1, 2 or 5 x 10^k) covering [lo, hi].
std::vector<double> nice_ticks(double lo, double hi, int target = 5);

// A linear axis from [lo, hi] widened to whole steps of its nice_ticks(); an empty range
// (hi <= lo) is first padded by max(min_pad, 10 % of |hi|) on each side.
Axis padded_axis(std::string label, double lo, double hi, double min_pad);

class Canvas;

class Plot {
 public:
  // The plot area (inside the axes) in canvas pixels.
  Plot(Canvas& canvas, double left, double top, double width, double height, Axis x, Axis y);
  double px(double x) const;
  double py(double y) const;
  // Frame, grid, ticks, tick text and the two axis labels.
  void draw_axes(const std::string& panel_title = "");
  // A polyline through the points (non-finite points break the line), with markers every
  // `marker_every` points (0: none).
  void line(const std::vector<double>& xs, const std::vector<double>& ys, int style,
            const std::string& name, int marker_every = 0, double width = 2.0);
  // Markers only.
  void points(const std::vector<double>& xs, const std::vector<double>& ys, int style,
              const std::string& name);
  // A filled rectangle in data coordinates with the style's colour and hatch.
  void bar(double x0, double x1, double y0, double y1, int style, const std::string& tip);
  // A rectangle in data coordinates with a plain fill (heat-map cells).
  void cell(double x0, double x1, double y0, double y1, const std::string& fill);
  // A labelled vertical or horizontal reference line.
  void vline(double x, const std::string& label, bool label_at_top = true);
  void hline(double y, const std::string& label);
  // Text at a data position.
  void label(double x, double y, const std::string& text, const char* anchor = "middle");
  void begin_data(const std::string& name);
  void end_data();

 private:
  Canvas& canvas_;
  double left_, top_, width_, height_;
  Axis x_, y_;
  std::vector<double> x_ticks_, y_ticks_;
  double tx(double v, const Axis& a) const;
};

struct LegendEntry {
  int style = 0;
  std::string text;
  bool area = false;    // a hatched swatch (areas, bars) rather than a line sample
  bool marker = false;  // the style's marker alone (points) rather than a line sample
};

class Canvas {
 public:
  // `id` prefixes the ids of the canvas's patterns (unique when several sit in one page).
  Canvas(std::string id, double width, double height, std::string title, std::string description);
  // A legend block of rows starting at (x, y); returns its height.
  double legend(double x, double y, const std::vector<LegendEntry>& entries, double row = 18);
  // A key of filled swatches with text, one row.
  void colour_key(double x, double y, const std::vector<std::pair<std::string, std::string>>& keys,
                  const std::string& caption);
  void text(double x, double y, const std::string& text, const char* css_class,
            const char* anchor = "start", double rotate = 0);
  void raw(const std::string& element) { body_ += element; }
  const std::string& id() const { return id_; }
  std::string hatch_url(int hatch) const;
  // The whole <svg> element (no XML declaration, so it can be inlined).
  std::string str() const;

 private:
  std::string id_, title_, description_;
  double width_, height_;
  std::string body_;
};

// Coordinates and lengths as text: two decimals, no "-0.00".
std::string num(double v);
// XML escaping of text and attribute values.
std::string escape(const std::string& text);

}  // namespace stowage::report::svg
