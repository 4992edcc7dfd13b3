// SPDX-License-Identifier: MIT
// One error channel each: a user's mistake is exit 2, a broken internal contract is exit 1.
#include <catch2/catch.hpp>
#include <sstream>
#include <string>

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

TEST_CASE("a time limit before any feasible design is exit 4, not the infeasible exit 3",
          "[cli][errors]") {
  OptimiseResult result;  // no ranking: no feasible design
  result.time_limit_reached = false;
  CHECK(optimise_exit_code(result) == kExitInfeasible);
  result.time_limit_reached = true;
  CHECK(optimise_exit_code(result) == kExitTimeLimitNoDesign);
  result.ranking.emplace_back();  // a feasible design found before the limit
  CHECK(optimise_exit_code(result) == kExitOk);
}

TEST_CASE("the help's exit-code table lists every code once, in order", "[cli][errors]") {
  const std::string help = exit_code_help();
  std::size_t at = 0;
  for (const ExitCodeMeaning& row : kExitCodeTable) {
    const std::size_t found =
        help.find("\n  " + std::to_string(static_cast<int>(row.code)) + "  ", at);
    CHECK(found != std::string::npos);
    at = found == std::string::npos ? at : found + 1;
  }
  CHECK(help.rfind("Exit codes:", 0) == 0);
  // Wrapped to a terminal's width.
  std::istringstream lines(help);
  for (std::string line; std::getline(lines, line);) CHECK(line.size() <= 78);
}
