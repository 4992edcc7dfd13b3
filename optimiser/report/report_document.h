// SPDX-License-Identifier: MIT
// The content of a study report as a plain value, built once (study_report.h) and written
// by two renderers, html_report.h and markdown_report.h, so that both files say the same:
// the same sections, paragraphs, tables (cell for cell) and figures (the same SVG bytes).
// A table cell may carry `key`, the path of the same number in the report's result.json
// (for example "best.npc" or "ranking[1].design.lcos_per_kwh"), and `machine`, that number
// in machine form; the HTML writes them as data-key / data-value attributes so a test can
// check every quoted number against the JSON.
#pragma once

#include <string>
#include <vector>

namespace stowage::report {

struct ReportCell {
  std::string text;     // as a person reads it
  std::string key;      // JSON path in result.json, "" for none
  std::string machine;  // the value in machine form when `key` is set
};

// Cell factories shared by the report builders: text only; a number also in the report's JSON
// at `key` (its machine form with 12 significant digits); a text also in the JSON at `key`.
ReportCell plain(std::string text);
ReportCell tagged(std::string text, std::string key, double value);
ReportCell tagged_text(std::string text, std::string key);
// "4, 8, 12", or "none" for an empty list: project years as a report sentence gives them.
std::string years_list(const std::vector<int>& years);
// "month 4 of year 6, month 12 of year 12", or "none": when each replacement happened, from
// the parallel lists of project years and months (1-12) of a lifecycle result.
std::string replacement_times(const std::vector<int>& years, const std::vector<int>& months);

struct ReportTable {
  std::string caption;
  std::vector<std::string> header;
  std::vector<bool> numeric;  // per column: right-aligned
  std::vector<std::vector<ReportCell>> rows;
  bool wrap_anywhere = false;  // long tokens (hashes, paths) may break anywhere
};

struct ReportFigure {
  std::string id;       // also the file name stem of its .svg
  std::string caption;  // one sentence saying what is drawn and how to read it
  std::string svg;      // the whole <svg> element
};

struct ReportBlock {
  enum class Kind { Paragraph, Bullets, Table, Figure, Notice };
  Kind kind = Kind::Paragraph;
  std::string text;                // Paragraph, Notice
  std::vector<std::string> items;  // Bullets
  ReportTable table;               // Table
  ReportFigure figure;             // Figure
};

struct ReportSection {
  std::string id;  // HTML anchor
  std::string title;
  std::vector<ReportBlock> blocks;

  ReportSection& paragraph(std::string text);
  ReportSection& bullets(std::vector<std::string> items);
  ReportSection& table(ReportTable table);
  ReportSection& figure(ReportFigure figure);
  ReportSection& notice(std::string text);
};

struct ReportDocument {
  std::string title;
  std::string subtitle;
  // The one line that differs between reruns: when the report was made. Written alone on
  // its line, starting "Generated ", in both renderings.
  std::string generated_line;
  std::vector<ReportSection> sections;

  std::vector<const ReportFigure*> figures() const;
};

}  // namespace stowage::report
