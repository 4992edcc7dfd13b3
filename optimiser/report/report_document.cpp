// SPDX-License-Identifier: MIT
#include "optimiser/report/report_document.h"

#include <utility>

namespace stowage::report {

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
