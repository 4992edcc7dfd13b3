// SPDX-License-Identifier: MIT
#include "optimiser/report/html_report.h"

#include "optimiser/report/svg_chart.h"

namespace stowage::report {

namespace {

using svg::escape;

// Black on white with grey rules: reads the same on screen, in greyscale print and to
// colour-blind readers; the charts carry their own palette and patterns.
constexpr const char* kStyle = R"css(
:root { color: #000; background: #fff; }
body { font-family: "DejaVu Sans", Arial, sans-serif; font-size: 15px; line-height: 1.45;
       margin: 0 auto; padding: 16px 24px; max-width: 980px; }
h1 { font-size: 1.6em; margin: 0.2em 0; }
h2 { font-size: 1.25em; border-bottom: 2px solid #000; padding-bottom: 2px; margin-top: 1.6em; }
p.subtitle { font-size: 1.05em; margin: 0.2em 0; }
p.generated { font-size: 0.85em; color: #333; }
nav ol { columns: 2; font-size: 0.9em; }
table { border-collapse: collapse; margin: 0.6em 0 1em; font-size: 0.88em; max-width: 100%; }
caption { text-align: left; font-weight: bold; padding: 0.2em 0; }
th, td { border: 1px solid #777; padding: 3px 6px; vertical-align: top; text-align: left;
         overflow-wrap: break-word; }
th { background: #e8e8e8; }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; }
table.wrap td { word-break: break-all; font-family: "DejaVu Sans Mono", monospace; font-size: 0.9em; }
figure { margin: 1em 0; }
figure svg { max-width: 100%; height: auto; display: block; }
figcaption { font-size: 0.88em; margin-top: 0.3em; }
div.notice { border: 3px solid #000; padding: 6px 12px; margin: 1em 0; }
div.notice p { margin: 0.4em 0; }
@page { margin: 15mm 14mm; }
@media print {
  body { font-size: 10pt; max-width: none; padding: 0; }
  nav { display: none; }
  h2 { break-after: avoid; page-break-after: avoid; }
  figure, tr, div.notice, caption { break-inside: avoid; page-break-inside: avoid; }
  thead { display: table-header-group; }
  table { font-size: 8.5pt; }
}
)css";

void write_table(std::ostream& out, const ReportTable& t) {
  out << "<table" << (t.wrap_anywhere ? " class=\"wrap\"" : "") << ">\n";
  if (!t.caption.empty()) out << "<caption>" << escape(t.caption) << "</caption>\n";
  const auto is_numeric = [&](std::size_t c) { return c < t.numeric.size() && t.numeric[c]; };
  out << "<thead><tr>";
  for (std::size_t c = 0; c < t.header.size(); ++c)
    out << "<th" << (is_numeric(c) ? " class=\"num\"" : "") << " scope=\"col\">"
        << escape(t.header[c]) << "</th>";
  out << "</tr></thead>\n<tbody>\n";
  for (const auto& row : t.rows) {
    out << "<tr>";
    for (std::size_t c = 0; c < row.size(); ++c) {
      const ReportCell& cell = row[c];
      out << "<td" << (is_numeric(c) ? " class=\"num\"" : "");
      if (!cell.key.empty())
        out << " data-key=\"" << escape(cell.key) << "\" data-value=\"" << escape(cell.machine)
            << "\"";
      out << ">" << escape(cell.text) << "</td>";
    }
    out << "</tr>\n";
  }
  out << "</tbody>\n</table>\n";
}

}  // namespace

void write_report_html(std::ostream& out, const ReportDocument& doc) {
  out << "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n"
         "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n"
         "<title>"
      << escape(doc.title) << "</title>\n<style>" << kStyle << "</style>\n</head>\n<body>\n";
  out << "<header>\n<h1>" << escape(doc.title) << "</h1>\n<p class=\"subtitle\">"
      << escape(doc.subtitle) << "</p>\n<p class=\"generated\">\n"
      << escape(doc.generated_line) << "\n</p>\n</header>\n";
  out << "<nav>\n<ol>\n";
  for (const ReportSection& s : doc.sections)
    out << "<li><a href=\"#" << escape(s.id) << "\">" << escape(s.title) << "</a></li>\n";
  out << "</ol>\n</nav>\n<main>\n";
  int figure_number = 0;
  for (const ReportSection& s : doc.sections) {
    out << "<section id=\"" << escape(s.id) << "\">\n<h2>" << escape(s.title) << "</h2>\n";
    for (const ReportBlock& b : s.blocks) {
      switch (b.kind) {
        case ReportBlock::Kind::Paragraph:
          out << "<p>" << escape(b.text) << "</p>\n";
          break;
        case ReportBlock::Kind::Bullets:
          out << "<ul>\n";
          for (const std::string& item : b.items) out << "<li>" << escape(item) << "</li>\n";
          out << "</ul>\n";
          break;
        case ReportBlock::Kind::Table:
          write_table(out, b.table);
          break;
        case ReportBlock::Kind::Figure:
          ++figure_number;
          out << "<figure id=\"" << escape(b.figure.id) << "\">\n"
              << b.figure.svg << "<figcaption>Figure " << figure_number << ". "
              << escape(b.figure.caption) << "</figcaption>\n</figure>\n";
          break;
        case ReportBlock::Kind::Notice:
          out << "<div class=\"notice\" role=\"note\">\n<p>" << escape(b.text) << "</p>\n</div>\n";
          break;
      }
    }
    out << "</section>\n";
  }
  out << "</main>\n</body>\n</html>\n";
}

}  // namespace stowage::report
