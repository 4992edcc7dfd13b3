// SPDX-License-Identifier: MIT
// ContractViolation: a caller broke a function's documented precondition (a DoD setpoint
// outside (0, 1] handed to the simulator, zero strings, an empty model). Inputs from files
// and options are validated before they reach such a function, so this is a bug, never a
// user's mistake: the command line reports it as an internal error (exit 1), while bad input
// is InvalidValue or InputError (exit 2). `what()` names the argument and the rule.
#pragma once

#include <stdexcept>
#include <string>

namespace stowage {

struct ContractViolation : std::logic_error {
  ContractViolation(const std::string& argument, const std::string& rule)
      : std::logic_error(argument + ": " + rule) {}
};

}  // namespace stowage
