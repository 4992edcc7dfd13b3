// SPDX-License-Identifier: MIT
#include "optimiser/report/number_format.h"

#include <fmt/format.h>

#include <cmath>

namespace stowage::report {

std::string format_amount(double value, int decimals) {
  if (!std::isfinite(value)) return "n/a";
  std::string digits = fmt::format("{:.{}f}", std::fabs(value), decimals);
  const std::size_t dot = digits.find('.');
  std::size_t int_end = dot == std::string::npos ? digits.size() : dot;
  std::string out;
  for (std::size_t i = 0; i < int_end; ++i) {
    if (i > 0 && (int_end - i) % 3 == 0) out += ',';
    out += digits[i];
  }
  out += digits.substr(int_end);
  const bool negative = value < 0 && std::stod(digits) != 0.0;
  return negative ? "-" + out : out;
}

std::string format_fixed(double value, int decimals) {
  if (!std::isfinite(value)) return "n/a";
  return fmt::format("{:.{}f}", value, decimals);
}

std::string format_general(double value, int significant) {
  return fmt::format("{:.{}g}", value, significant);
}

std::string format_machine(double value, int significant) {
  if (!std::isfinite(value)) return "";
  return fmt::format("{:.{}g}", value, significant);
}

std::string format_signed_amount(double value) {
  return (value >= 0 ? "+" : "-") + format_amount(std::fabs(value));
}

}  // namespace stowage::report
