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

// The one precondition on a DoD setpoint handed to the simulator, the sizing rule or the
// model: a fraction in (0, 1]. (Which setpoints a profile allows is the profile's own rule,
// DodRange, checked where the profile is validated.)
inline void require_dod_setpoint(double dod_setpoint) {
  if (!(dod_setpoint > 0 && dod_setpoint <= 1)) {
    throw ContractViolation("dod_setpoint", "must be in (0, 1]");
  }
}

}  // namespace stowage
