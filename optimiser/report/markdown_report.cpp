// SPDX-License-Identifier: MIT
#include "optimiser/report/markdown_report.h"

namespace stowage::report {

namespace {

// Backslash escapes for the characters that would start emphasis, code, links or table
// cells; entities for markup characters.
std::string md(const std::string& text) {
  std::string out;
  for (char c : text) {
    switch (c) {
      case '\\':
      case '`':
      case '*':
      case '_':
      case '[':
      case ']':
      case '|':
        out += '\\';
        out += c;
        break;
      case '<':
        out += "&lt;";
        break;
      case '>':
        out += "&gt;";
        break;
      case '&':
        out += "&amp;";
        break;
      case '\n':
        out += ' ';
        break;
      default:
        out += c;
    }
  }
  return out;
}

void write_table(std::ostream& out, const ReportTable& t) {
  if (!t.caption.empty()) out << "**" << md(t.caption) << "**\n\n";
  const auto is_numeric = [&](std::size_t c) { return c < t.numeric.size() && t.numeric[c]; };
  out << "|";
  for (const std::string& h : t.header) out << " " << md(h) << " |";
  out << "\n|";
  for (std::size_t c = 0; c < t.header.size(); ++c) out << (is_numeric(c) ? " ---: |" : " --- |");
  out << "\n";
  for (const auto& row : t.rows) {
    out << "|";
    for (const ReportCell& cell : row) out << " " << md(cell.text) << " |";
    out << "\n";
  }
  out << "\n";
}

}  // namespace

void write_report_markdown(std::ostream& out, const ReportDocument& doc) {
  out << "# " << md(doc.title) << "\n\n"
      << md(doc.subtitle) << "\n\n"
      << md(doc.generated_line) << "\n\n";
  int figure_number = 0;
  for (const ReportSection& s : doc.sections) {
    out << "## " << md(s.title) << "\n\n";
    for (const ReportBlock& b : s.blocks) {
      switch (b.kind) {
        case ReportBlock::Kind::Paragraph:
          out << md(b.text) << "\n\n";
          break;
        case ReportBlock::Kind::Bullets:
          for (const std::string& item : b.items) out << "- " << md(item) << "\n";
          out << "\n";
          break;
        case ReportBlock::Kind::Table:
          write_table(out, b.table);
          break;
        case ReportBlock::Kind::Figure:
          ++figure_number;
          out << "![" << md(b.figure.caption) << "](" << b.figure.id << ".svg)\n\n"
              << "*Figure " << figure_number << ". " << md(b.figure.caption) << "*\n\n";
          break;
        case ReportBlock::Kind::Notice:
          out << "> " << md(b.text) << "\n\n";
          break;
      }
    }
  }
}

}  // namespace stowage::report
