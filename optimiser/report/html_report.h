// SPDX-License-Identifier: MIT
// The report as one self-contained HTML5 file: inline CSS and inline SVG, no script, no
// font, image or style sheet from anywhere else. Written as well-formed XML (every element
// closed, attributes quoted, text escaped) so that an XML parser reads it too. Print CSS
// lets a browser print it to PDF on A4 or Letter: @page with margins and no fixed size, so
// the printer's paper is used; the content fits the narrower A4 text width; figures, table
// rows and the safety notice are not split across pages.
#pragma once

#include <ostream>

#include "optimiser/report/report_document.h"

namespace stowage::report {

void write_report_html(std::ostream& out, const ReportDocument& document);

}  // namespace stowage::report
