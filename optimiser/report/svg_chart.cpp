// SPDX-License-Identifier: MIT
#include "optimiser/report/svg_chart.h"

#include <algorithm>
#include <cmath>
#include <utility>

#include "model/contract.h"
#include "optimiser/report/number_format.h"

namespace stowage::report::svg {

namespace {

// Okabe & Ito (2008), "Color Universal Design (CUD): how to make figures and presentations
// that are friendly to colorblind people": black, orange, sky blue, bluish green, yellow,
// blue, vermillion, reddish purple. Black is used last for areas (it hides hatching), so the
// order starts with the strong colours; yellow is paired with a solid dark outline.
constexpr SeriesStyle kStyles[] = {
    {"#0072B2", "", "circle", 0},          // blue
    {"#E69F00", "6 3", "square", 1},       // orange
    {"#009E73", "2 2", "triangle", 2},     // bluish green
    {"#D55E00", "8 3 2 3", "diamond", 3},  // vermillion
    {"#56B4E9", "4 4", "cross", 4},        // sky blue
    {"#CC79A7", "1 3", "circle", 5},       // reddish purple
    {"#F0E442", "10 2", "square", 6},      // yellow
    {"#000000", "3 6", "triangle", 7},     // black
    // Beyond the eight colours: a colour again with a hatch and dash it has nowhere else, so
    // that the nine cost lines of a breakdown and a tender's damages credit stay apart.
    {"#0072B2", "2 4", "diamond", 5},    // blue, cross-hatched
    {"#D55E00", "5 2 1 2", "cross", 6},  // vermillion, dotted
};
constexpr int kStyleCount = static_cast<int>(sizeof(kStyles) / sizeof(kStyles[0]));

// Paul Tol's YlOrBr sequential scheme (9 anchors, light to dark).
constexpr int kYlOrBr[9][3] = {{0xFF, 0xFF, 0xE5}, {0xFF, 0xF7, 0xBC}, {0xFE, 0xE3, 0x91},
                               {0xFE, 0xC4, 0x4F}, {0xFB, 0x9A, 0x29}, {0xEC, 0x70, 0x14},
                               {0xCC, 0x4C, 0x02}, {0x99, 0x34, 0x04}, {0x66, 0x25, 0x06}};

std::string hex_colour(int r, int g, int b) {
  static const char* digits = "0123456789ABCDEF";
  std::string out = "#";
  for (int c : {r, g, b}) {
    c = std::clamp(c, 0, 255);
    out += digits[c >> 4];
    out += digits[c & 15];
  }
  return out;
}

std::string default_tick_text(double v) {
  if (std::fabs(v) >= 1000 && std::fabs(v - std::round(v)) < 1e-9) return format_amount(v);
  if (std::fabs(v) < 1e-12) return "0";
  return format_general(v, 4);
}

std::vector<double> log_ticks(double lo, double hi) {
  std::vector<double> out;
  const int k0 = static_cast<int>(std::floor(std::log10(lo)));
  const int k1 = static_cast<int>(std::ceil(std::log10(hi)));
  for (int k = k0; k <= k1; ++k) {
    for (double d : {1.0, 2.0, 5.0}) {
      const double v = d * std::pow(10.0, k);
      if (v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9)) out.push_back(v);
    }
  }
  return out;
}

std::string marker_shape(const char* kind, double x, double y, const char* colour) {
  const std::string fill =
      std::string(" fill=\"") + colour + "\" stroke=\"#000000\" stroke-width=\"0.6\"";
  const std::string k = kind;
  if (k == "circle")
    return "<circle cx=\"" + num(x) + "\" cy=\"" + num(y) + "\" r=\"3.5\"" + fill + "/>";
  if (k == "square")
    return "<rect x=\"" + num(x - 3.2) + "\" y=\"" + num(y - 3.2) +
           "\" width=\"6.4\" height=\"6.4\"" + fill + "/>";
  if (k == "triangle")
    return "<path d=\"M" + num(x) + " " + num(y - 4.2) + " L" + num(x + 4) + " " + num(y + 3) +
           " L" + num(x - 4) + " " + num(y + 3) + " Z\"" + fill + "/>";
  if (k == "diamond")
    return "<path d=\"M" + num(x) + " " + num(y - 4.5) + " L" + num(x + 4) + " " + num(y) + " L" +
           num(x) + " " + num(y + 4.5) + " L" + num(x - 4) + " " + num(y) + " Z\"" + fill + "/>";
  if (k == "cross")
    return "<path d=\"M" + num(x - 4) + " " + num(y - 4) + " L" + num(x + 4) + " " + num(y + 4) +
           " M" + num(x - 4) + " " + num(y + 4) + " L" + num(x + 4) + " " + num(y - 4) +
           "\" stroke=\"" + colour + "\" stroke-width=\"2\"/>";
  return "";
}

}  // namespace

int series_style_count() { return kStyleCount; }

const SeriesStyle& series_style(int i) {
  return kStyles[((i % kStyleCount) + kStyleCount) % kStyleCount];
}

std::string sequential_colour(int step, int steps) {
  if (steps < 1 || step < 0 || step >= steps)
    throw ContractViolation("sequential_colour", "step must lie in [0, steps)");
  // 0 = darkest: position along the anchors from dark (8) to light (0).
  const double t = steps == 1 ? 0.0 : 8.0 * (1.0 - static_cast<double>(step) / (steps - 1));
  const int i = std::min(7, static_cast<int>(std::floor(t)));
  const double f = t - i;
  int rgb[3];
  for (int c = 0; c < 3; ++c) {
    rgb[c] = static_cast<int>(std::lround(kYlOrBr[i][c] + f * (kYlOrBr[i + 1][c] - kYlOrBr[i][c])));
  }
  return hex_colour(rgb[0], rgb[1], rgb[2]);
}

std::string num(double v) {
  std::string s = format_fixed(v, 2);
  if (s == "-0.00") s = "0.00";
  // Trim trailing zeros: fewer bytes, same value.
  if (s.find('.') != std::string::npos) {
    while (s.back() == '0') s.pop_back();
    if (s.back() == '.') s.pop_back();
  }
  return s;
}

std::string escape(const std::string& text) {
  std::string out;
  out.reserve(text.size());
  for (char c : text) {
    switch (c) {
      case '&':
        out += "&amp;";
        break;
      case '<':
        out += "&lt;";
        break;
      case '>':
        out += "&gt;";
        break;
      case '"':
        out += "&quot;";
        break;
      default:
        out += c;
    }
  }
  return out;
}

Axis padded_axis(std::string label, double lo, double hi, double min_pad) {
  if (!(hi > lo)) {
    const double pad = std::max(min_pad, std::fabs(hi) * 0.1);
    lo -= pad;
    hi += pad;
  }
  const std::vector<double> ticks = nice_ticks(lo, hi);
  const double step = ticks.size() > 1 ? ticks[1] - ticks[0] : (hi - lo);
  Axis a;
  a.label = std::move(label);
  a.lo = std::floor(lo / step + 1e-9) * step;
  a.hi = std::ceil(hi / step - 1e-9) * step;
  if (!(a.hi > a.lo)) a.hi = a.lo + step;
  return a;
}

std::vector<double> nice_ticks(double lo, double hi, int target) {
  if (!(hi > lo) || target < 1) throw ContractViolation("nice_ticks", "needs hi > lo");
  const double raw = (hi - lo) / target;
  const double magnitude = std::pow(10.0, std::floor(std::log10(raw)));
  double step = magnitude;
  for (double m : {1.0, 2.0, 5.0, 10.0}) {
    step = m * magnitude;
    if (step >= raw) break;
  }
  std::vector<double> out;
  const double first = std::ceil(lo / step - 1e-9) * step;
  for (int i = 0;; ++i) {
    const double v = first + i * step;
    if (v > hi + step * 1e-9) break;
    out.push_back(std::fabs(v) < step * 1e-9 ? 0.0 : v);
  }
  return out;
}

// ---- Canvas -------------------------------------------------------------------------------

Canvas::Canvas(std::string id, double width, double height, std::string title,
               std::string description)
    : id_(std::move(id)),
      title_(std::move(title)),
      description_(std::move(description)),
      width_(width),
      height_(height) {}

std::string Canvas::hatch_url(int hatch) const {
  return "url(#" + id_ + "-hatch-" + std::to_string(hatch) + ")";
}

void Canvas::text(double x, double y, const std::string& content, const char* css_class,
                  const char* anchor, double rotate) {
  body_ += "<text x=\"" + num(x) + "\" y=\"" + num(y) + "\" class=\"" + css_class +
           "\" text-anchor=\"" + anchor + "\"";
  if (std::string(css_class) == "panel-title" || std::string(css_class) == "axis-label")
    body_ += " font-weight=\"bold\"";
  if (rotate != 0)
    body_ += " transform=\"rotate(" + num(rotate) + " " + num(x) + " " + num(y) + ")\"";
  body_ += ">" + escape(content) + "</text>\n";
}

double Canvas::legend(double x, double y, const std::vector<LegendEntry>& entries, double row) {
  body_ += "<g class=\"legend\">\n";
  for (std::size_t i = 0; i < entries.size(); ++i) {
    const LegendEntry& e = entries[i];
    const SeriesStyle& s = series_style(e.style);
    const double cy = y + row * static_cast<double>(i);
    if (e.area) {
      body_ += "<rect x=\"" + num(x) + "\" y=\"" + num(cy - 10) +
               "\" width=\"22\" height=\"13\" fill=\"" + s.colour + "\" stroke=\"#000\"/>";
      body_ += "<rect x=\"" + num(x) + "\" y=\"" + num(cy - 10) +
               "\" width=\"22\" height=\"13\" fill=\"" + hatch_url(s.hatch) + "\"/>\n";
    } else if (e.marker) {
      body_ += marker_shape(s.marker, x + 11, cy - 4, s.colour) + "\n";
    } else {
      body_ += "<line x1=\"" + num(x) + "\" y1=\"" + num(cy - 4) + "\" x2=\"" + num(x + 22) +
               "\" y2=\"" + num(cy - 4) + "\" stroke=\"" + s.colour + "\" stroke-width=\"2.5\"" +
               (*s.dash ? std::string(" stroke-dasharray=\"") + s.dash + "\"" : std::string()) +
               "/>\n";
    }
    text(x + 28, cy, e.text, "legend-text");
  }
  body_ += "</g>\n";
  return row * static_cast<double>(entries.size());
}

void Canvas::colour_key(double x, double y,
                        const std::vector<std::pair<std::string, std::string>>& keys,
                        const std::string& caption) {
  body_ += "<g class=\"legend\">\n";
  text(x, y - 6, caption, "legend-text");
  const double w = 44;
  for (std::size_t i = 0; i < keys.size(); ++i) {
    const double cx = x + w * static_cast<double>(i);
    body_ += "<rect x=\"" + num(cx) + "\" y=\"" + num(y) + "\" width=\"" + num(w) +
             "\" height=\"12\" fill=\"" + keys[i].second +
             "\" stroke=\"#000\" stroke-width=\"0.5\"/>\n";
    text(cx + w / 2, y + 25, keys[i].first, "legend-text", "middle");
  }
  body_ += "</g>\n";
}

std::string Canvas::str() const {
  std::string out = "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" + num(width_) +
                    "\" height=\"" + num(height_) + "\" viewBox=\"0 0 " + num(width_) + " " +
                    num(height_) + "\" role=\"img\" aria-labelledby=\"" + id_ + "-title " + id_ +
                    "-desc\" class=\"chart\" font-family=\"DejaVu Sans, Arial, sans-serif\" "
                    "font-size=\"12\">\n";
  out += "<title id=\"" + id_ + "-title\">" + escape(title_) + "</title>\n";
  out += "<desc id=\"" + id_ + "-desc\">" + escape(description_) + "</desc>\n";
  // Hatches drawn in black at partial opacity over the series colour; 0 is plain.
  static const char* hatch_paths[8] = {
      "",
      "M0 8 L8 0",
      "M0 0 L8 8",
      "M0 4 L8 4",
      "M4 0 L4 8",
      "M0 8 L8 0 M0 0 L8 8",
      "M2 2 h1 v1 h-1 z M6 6 h1 v1 h-1 z",
      "M0 4 L8 4 M4 0 L4 8",
  };
  out += "<defs>\n";
  for (int h = 0; h < 8; ++h) {
    out += "<pattern id=\"" + id_ + "-hatch-" + std::to_string(h) +
           "\" patternUnits=\"userSpaceOnUse\" width=\"8\" height=\"8\">";
    if (*hatch_paths[h])
      out += std::string("<path d=\"") + hatch_paths[h] +
             "\" stroke=\"#000\" stroke-opacity=\"0.55\" stroke-width=\"1.2\" fill=\"none\"/>";
    out += "</pattern>\n";
  }
  out += "</defs>\n";
  out += "<rect width=\"" + num(width_) + "\" height=\"" + num(height_) + "\" fill=\"#FFFFFF\"/>\n";
  out += body_;
  out += "</svg>\n";
  return out;
}

// ---- Plot ---------------------------------------------------------------------------------

Plot::Plot(Canvas& canvas, double left, double top, double width, double height, Axis x, Axis y)
    : canvas_(canvas),
      left_(left),
      top_(top),
      width_(width),
      height_(height),
      x_(std::move(x)),
      y_(std::move(y)) {
  for (const Axis* a : {&x_, &y_}) {
    if (!(a->hi > a->lo) || (a->log10 && a->lo <= 0))
      throw ContractViolation("svg::Axis " + a->label, "needs lo < hi (and lo > 0 on a log axis)");
  }
  x_ticks_ = !x_.ticks.empty() ? x_.ticks
             : x_.log10        ? log_ticks(x_.lo, x_.hi)
                               : nice_ticks(x_.lo, x_.hi);
  y_ticks_ = !y_.ticks.empty() ? y_.ticks
             : y_.log10        ? log_ticks(y_.lo, y_.hi)
                               : nice_ticks(y_.lo, y_.hi);
}

double Plot::tx(double v, const Axis& a) const {
  if (a.log10) return (std::log10(v) - std::log10(a.lo)) / (std::log10(a.hi) - std::log10(a.lo));
  return (v - a.lo) / (a.hi - a.lo);
}
double Plot::px(double x) const { return left_ + width_ * tx(x, x_); }
double Plot::py(double y) const { return top_ + height_ * (1 - tx(y, y_)); }

void Plot::draw_axes(const std::string& panel_title) {
  const auto tick_text = [](const Axis& a, double v) {
    return a.tick_text ? a.tick_text(v) : default_tick_text(v);
  };
  canvas_.raw("<g class=\"axis x\">\n");
  for (double t : x_ticks_) {
    const double x = px(t);
    canvas_.raw("<line x1=\"" + num(x) + "\" y1=\"" + num(top_) + "\" x2=\"" + num(x) + "\" y2=\"" +
                num(top_ + height_ + 4) + "\" stroke=\"#CCCCCC\" stroke-width=\"0.6\"/>\n");
    if (x_.tick_rotate != 0)
      canvas_.text(x + 4, top_ + height_ + 14, tick_text(x_, t), "tick", "end", x_.tick_rotate);
    else
      canvas_.text(x, top_ + height_ + 16, tick_text(x_, t), "tick", "middle");
  }
  canvas_.text(left_ + width_ / 2, top_ + height_ + x_.label_offset, x_.label, "axis-label",
               "middle");
  canvas_.raw("</g>\n<g class=\"axis y\">\n");
  for (double t : y_ticks_) {
    const double y = py(t);
    canvas_.raw("<line x1=\"" + num(left_ - 4) + "\" y1=\"" + num(y) + "\" x2=\"" +
                num(left_ + width_) + "\" y2=\"" + num(y) +
                "\" stroke=\"#CCCCCC\" stroke-width=\"0.6\"/>\n");
    canvas_.text(left_ - 7, y + 4, tick_text(y_, t), "tick", "end");
  }
  canvas_.text(left_ - (y_.label_offset + 24), top_ + height_ / 2, y_.label, "axis-label", "middle",
               -90);
  canvas_.raw("</g>\n");
  canvas_.raw("<rect x=\"" + num(left_) + "\" y=\"" + num(top_) + "\" width=\"" + num(width_) +
              "\" height=\"" + num(height_) + "\" fill=\"none\" stroke=\"#000000\"/>\n");
  if (!panel_title.empty()) canvas_.text(left_, top_ - 8, panel_title, "panel-title");
}

void Plot::begin_data(const std::string& name) {
  canvas_.raw("<g class=\"data\" data-series=\"" + escape(name) + "\">\n");
}
void Plot::end_data() { canvas_.raw("</g>\n"); }

void Plot::line(const std::vector<double>& xs, const std::vector<double>& ys, int style,
                const std::string& name, int marker_every, double width) {
  if (xs.size() != ys.size())
    throw ContractViolation("svg::Plot::line", "xs and ys differ in size");
  const SeriesStyle& s = series_style(style);
  begin_data(name);
  std::string d;
  bool pen_down = false;
  for (std::size_t i = 0; i < xs.size(); ++i) {
    if (!std::isfinite(xs[i]) || !std::isfinite(ys[i])) {
      pen_down = false;
      continue;
    }
    d += (pen_down ? " L" : (d.empty() ? "M" : " M")) + num(px(xs[i])) + " " + num(py(ys[i]));
    pen_down = true;
  }
  canvas_.raw("<path d=\"" + d + "\" fill=\"none\" stroke=\"" + s.colour + "\" stroke-width=\"" +
              num(width) + "\"" +
              (*s.dash ? std::string(" stroke-dasharray=\"") + s.dash + "\"" : std::string()) +
              "/>\n");
  if (marker_every > 0) {
    for (std::size_t i = 0; i < xs.size(); i += static_cast<std::size_t>(marker_every)) {
      if (std::isfinite(xs[i]) && std::isfinite(ys[i]))
        canvas_.raw(marker_shape(s.marker, px(xs[i]), py(ys[i]), s.colour) + "\n");
    }
  }
  end_data();
}

void Plot::points(const std::vector<double>& xs, const std::vector<double>& ys, int style,
                  const std::string& name) {
  if (xs.size() != ys.size())
    throw ContractViolation("svg::Plot::points", "xs and ys differ in size");
  const SeriesStyle& s = series_style(style);
  begin_data(name);
  for (std::size_t i = 0; i < xs.size(); ++i)
    canvas_.raw(marker_shape(s.marker, px(xs[i]), py(ys[i]), s.colour) + "\n");
  end_data();
}

void Plot::bar(double x0, double x1, double y0, double y1, int style, const std::string& tip) {
  const SeriesStyle& s = series_style(style);
  const double ax = std::min(px(x0), px(x1)), bx = std::max(px(x0), px(x1));
  const double ay = std::min(py(y0), py(y1)), by = std::max(py(y0), py(y1));
  const std::string geometry = "x=\"" + num(ax) + "\" y=\"" + num(ay) + "\" width=\"" +
                               num(bx - ax) + "\" height=\"" + num(by - ay) + "\"";
  canvas_.raw("<rect " + geometry + " fill=\"" + s.colour +
              "\" stroke=\"#000000\" stroke-width=\"0.6\"><title>" + escape(tip) +
              "</title></rect>\n");
  if (s.hatch != 0)
    canvas_.raw("<rect " + geometry + " fill=\"" + canvas_.hatch_url(s.hatch) + "\"/>\n");
}

void Plot::cell(double x0, double x1, double y0, double y1, const std::string& fill) {
  const double ax = std::min(px(x0), px(x1)), bx = std::max(px(x0), px(x1));
  const double ay = std::min(py(y0), py(y1)), by = std::max(py(y0), py(y1));
  canvas_.raw("<rect x=\"" + num(ax) + "\" y=\"" + num(ay) + "\" width=\"" + num(bx - ax) +
              "\" height=\"" + num(by - ay) + "\" fill=\"" + fill + "\"/>\n");
}

void Plot::vline(double x, const std::string& text, bool label_at_top) {
  const double X = px(x);
  canvas_.raw("<line x1=\"" + num(X) + "\" y1=\"" + num(top_) + "\" x2=\"" + num(X) + "\" y2=\"" +
              num(top_ + height_) +
              "\" stroke=\"#000000\" stroke-width=\"1.4\" stroke-dasharray=\"5 3\"/>\n");
  // Near the right edge the label goes to the left of the line.
  const bool left_side = X > left_ + 0.6 * width_;
  canvas_.text(left_side ? X - 4 : X + 4, label_at_top ? top_ + 14 : top_ + height_ - 6, text,
               "reference", left_side ? "end" : "start");
}

void Plot::hline(double y, const std::string& text) {
  const double Y = py(y);
  canvas_.raw("<line x1=\"" + num(left_) + "\" y1=\"" + num(Y) + "\" x2=\"" + num(left_ + width_) +
              "\" y2=\"" + num(Y) +
              "\" stroke=\"#000000\" stroke-width=\"1.4\" stroke-dasharray=\"5 3\"/>\n");
  canvas_.text(left_ + width_ - 4, Y - 5, text, "reference", "end");
}

void Plot::label(double x, double y, const std::string& text, const char* anchor) {
  canvas_.text(px(x), py(y) - 4, text, "value-label", anchor);
}

}  // namespace stowage::report::svg
