// SPDX-License-Identifier: MIT
// The one number formatter of every report. Text for people: amounts with thousands
// separators and fixed decimals, "n/a" for a non-finite value. Text for machines (CSV, JSON):
// shortest round-trip-safe form up to a number of significant digits, empty (CSV) or null
// (JSON, handled by JsonWriter) for a non-finite value.
#pragma once

#include <string>

namespace stowage::report {

// 1234567.8 -> "1,234,568" (decimals 0); -0.4 -> "0", never "-0".
std::string format_amount(double value, int decimals = 0);
// Fixed decimals without separators: format_fixed(0.954, 2) -> "0.95".
std::string format_fixed(double value, int decimals);
// printf's %g with `significant` digits: format_general(0.05) -> "0.05".
std::string format_general(double value, int significant = 6);
// Machine form with up to `significant` digits (%.{significant}g); "" when not finite.
std::string format_machine(double value, int significant = 10);
// "+1,234" or "-1,234".
std::string format_signed_amount(double value);

}  // namespace stowage::report
