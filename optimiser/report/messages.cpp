// SPDX-License-Identifier: MIT
#include "optimiser/report/messages.h"

#include <algorithm>
#include <string>

#include "catalog-schema/input_error.h"

namespace stowage::report {

namespace {

// Writes each line of `text` as "stowage: <prefix><line>".
void write_prefixed_lines(std::ostream& err, std::string_view prefix, std::string_view text) {
  std::size_t start = 0;
  do {
    const std::size_t end = std::min(text.find('\n', start), text.size());
    err << "stowage: " << prefix << escape_controls(text.substr(start, end - start)) << "\n";
    start = end + 1;
  } while (start < text.size());
}

}  // namespace

void write_failure(std::ostream& err, Failure kind, std::string_view what) {
  std::string_view prefix;
  switch (kind) {
    case Failure::BadInput:
    case Failure::Output:
    case Failure::Usage:
      break;
    case Failure::InvalidValue:
      prefix = "invalid value: ";
      break;
    case Failure::Internal:
      prefix = "internal error: ";
      break;
  }
  while (!what.empty() && what.back() == '\n') what.remove_suffix(1);
  write_prefixed_lines(err, prefix, what);
  if (kind == Failure::Usage) {
    err << "stowage: run 'stowage --help' or 'stowage COMMAND --help' for the options\n";
  }
}

}  // namespace stowage::report
