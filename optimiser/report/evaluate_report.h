// SPDX-License-Identifier: MIT
// How `evaluate` shows the exact lifecycle of each design: a table per design and a ranking by
// net present cost (text), or one JSON document (field names in docs/usage.md).
#pragma once

#include <ostream>
#include <vector>

#include "model/lifecycle.h"
#include "model/study.h"

namespace stowage::report {

void write_evaluate_text(std::ostream& out, const Study& study,
                         const std::vector<DesignResult>& results);
void write_evaluate_json(std::ostream& out, const Study& study,
                         const std::vector<DesignResult>& results);

}  // namespace stowage::report
