// SPDX-License-Identifier: MIT
#include "optimiser/report/report_document.h"

#include <string>
#include <utility>
#include <vector>

#include "optimiser/report/number_format.h"

namespace stowage::report {

ReportCell plain(std::string text) { return {std::move(text), "", ""}; }
ReportCell tagged(std::string text, std::string key, double value) {
  return {std::move(text), std::move(key), format_machine(value, 12)};
}
ReportCell tagged_text(std::string text, std::string key) {
  std::string machine = text;
  return {std::move(text), std::move(key), std::move(machine)};
}

std::string years_list(const std::vector<int>& years) {
  if (years.empty()) return "none";
  std::string out;
  for (int y : years) out += (out.empty() ? "" : ", ") + std::to_string(y);
  return out;
}

std::string replacement_times(const std::vector<int>& years, const std::vector<int>& months) {
  if (years.empty()) return "none";
  std::string out;
  for (std::size_t i = 0; i < years.size(); ++i) {
    if (!out.empty()) out += ", ";
    if (i < months.size()) out += "month " + std::to_string(months[i]) + " of ";
    out += "year " + std::to_string(years[i]);
  }
  return out;
}

ReportSection& ReportSection::paragraph(std::string text) {
  ReportBlock b;
  b.kind = ReportBlock::Kind::Paragraph;
  b.text = std::move(text);
  blocks.push_back(std::move(b));
  return *this;
}

ReportSection& ReportSection::bullets(std::vector<std::string> items) {
  ReportBlock b;
  b.kind = ReportBlock::Kind::Bullets;
  b.items = std::move(items);
  blocks.push_back(std::move(b));
  return *this;
}

ReportSection& ReportSection::table(ReportTable t) {
  ReportBlock b;
  b.kind = ReportBlock::Kind::Table;
  b.table = std::move(t);
  blocks.push_back(std::move(b));
  return *this;
}

ReportSection& ReportSection::figure(ReportFigure f) {
  ReportBlock b;
  b.kind = ReportBlock::Kind::Figure;
  b.figure = std::move(f);
  blocks.push_back(std::move(b));
  return *this;
}

ReportSection& ReportSection::notice(std::string text) {
  ReportBlock b;
  b.kind = ReportBlock::Kind::Notice;
  b.text = std::move(text);
  blocks.push_back(std::move(b));
  return *this;
}

std::vector<const ReportFigure*> ReportDocument::figures() const {
  std::vector<const ReportFigure*> out;
  for (const ReportSection& s : sections) {
    for (const ReportBlock& b : s.blocks) {
      if (b.kind == ReportBlock::Kind::Figure) out.push_back(&b.figure);
    }
  }
  return out;
}

}  // namespace stowage::report
