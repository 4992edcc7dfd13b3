// SPDX-License-Identifier: MIT
// One error channel each: a user's mistake is exit 2, a broken internal contract is exit 1.
#include <catch2/catch.hpp>

#include "catalog-schema/input_error.h"
#include "model/contract.h"
#include "model/invalid_value.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/report/output_set.h"

using namespace stowage;
using namespace stowage::cli;

TEST_CASE("bad input maps to exit 2 and a broken contract to exit 1", "[cli][errors]") {
  CHECK(run_guarded([]() -> int { throw InvalidValue("site.autonomy_days", "must be >= 0"); }) ==
        kExitBadInput);
  CHECK(run_guarded([]() -> int { throw report::OutputFileError("out: not a directory"); }) ==
        kExitBadInput);
  CHECK(run_guarded([]() -> int {
          throw ContractViolation("dod_setpoint", "must be in (0, 1]");
        }) == kExitInternalError);
  CHECK(run_guarded([]() -> int {
          require_dod_setpoint(1.5);
          return kExitOk;
        }) == kExitInternalError);
  CHECK(run_guarded([]() -> int {
          throw InputError("study.yaml", 3, 5, "study.site", "missing");
        }) == kExitBadInput);
  CHECK(run_guarded([]() -> int { return kExitOk; }) == kExitOk);
}
