// SPDX-License-Identifier: MIT
#include "optimiser/report/messages.h"

namespace stowage::report {

void write_failure(std::ostream& err, Failure kind, std::string_view what) {
  err << "stowage: ";
  switch (kind) {
    case Failure::BadInput:
    case Failure::Output:
      break;
    case Failure::InvalidValue:
      err << "invalid value: ";
      break;
    case Failure::Internal:
      err << "internal error: ";
      break;
  }
  err << what << "\n";
}

}  // namespace stowage::report
