// SPDX-License-Identifier: MIT
// What `check` says about a valid study: the site, the economics, each profile with the
// strings its autonomy needs at its default setpoint, and the designs listed.
#pragma once

#include <ostream>
#include <string>

#include "model/study.h"

namespace stowage::report {

void write_check_text(std::ostream& out, const std::string& study_path, const Study& study);

}  // namespace stowage::report
