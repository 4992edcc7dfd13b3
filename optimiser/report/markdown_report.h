// SPDX-License-Identifier: MIT
// The report as Markdown (tables in the pipe syntax that common renderers read, such as
// python3-markdown's `tables` extension), with each figure as an image link to its .svg file
// in the same folder: `![caption](fig-id.svg)`. Same sections, text and table cells as the
// HTML (html_report.h).
#pragma once

#include <ostream>

#include "optimiser/report/report_document.h"

namespace stowage::report {

void write_report_markdown(std::ostream& out, const ReportDocument& document);

}  // namespace stowage::report
