// SPDX-License-Identifier: MIT
// The messages a failed run prints on stderr, one wording per kind of failure. The command
// line maps the kinds to exit codes (optimiser/cli/command.h); this file words them.
#pragma once

#include <ostream>
#include <string_view>

namespace stowage::report {

enum class Failure {
  BadInput,      // an input file or option is wrong: the message names file, line and field
  InvalidValue,  // a validated value is out of its range: the message names its path
  Output,        // an output file or directory cannot be written: the message says why
  Internal,      // a broken internal contract or an unexpected failure: a bug to report
  Usage,         // the command line itself is wrong (unknown option, missing argument)
};

// "stowage: <what>", with "invalid value: " or "internal error: " for those kinds; a Usage
// failure adds a line pointing at --help. Every line written starts "stowage: ", and control
// characters in `what` (it may quote a command-line argument) are escaped, never echoed raw.
void write_failure(std::ostream& err, Failure kind, std::string_view what);

}  // namespace stowage::report
