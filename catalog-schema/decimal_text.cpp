// SPDX-License-Identifier: MIT
#include "catalog-schema/decimal_text.h"

#include <cctype>
#include <limits>
#include <locale>
#include <sstream>

namespace stowage {
namespace {

bool digit(char c) { return c >= '0' && c <= '9'; }

// Advances `i` over digits; returns how many there were.
std::size_t skip_digits(std::string_view text, std::size_t& i) {
  const std::size_t start = i;
  while (i < text.size() && digit(text[i])) ++i;
  return i - start;
}

}  // namespace

bool is_integer_text(std::string_view text) {
  std::size_t i = 0;
  if (i < text.size() && (text[i] == '+' || text[i] == '-')) ++i;
  return skip_digits(text, i) > 0 && i == text.size();
}

bool is_decimal_text(std::string_view text) {
  std::size_t i = 0;
  if (i < text.size() && (text[i] == '+' || text[i] == '-')) ++i;
  std::size_t mantissa = skip_digits(text, i);
  if (i < text.size() && text[i] == '.') {
    ++i;
    mantissa += skip_digits(text, i);
  }
  if (mantissa == 0) return false;
  if (i < text.size() && (text[i] == 'e' || text[i] == 'E')) {
    ++i;
    if (i < text.size() && (text[i] == '+' || text[i] == '-')) ++i;
    if (skip_digits(text, i) == 0) return false;
  }
  return i == text.size();
}

double decimal_value(const std::string& text) {
  std::istringstream in(text);
  in.imbue(std::locale::classic());
  double value = 0;
  in >> value;
  if (in.fail()) {
    // The only decimal text that fails to convert is one beyond the range of double.
    return !text.empty() && text[0] == '-' ? -std::numeric_limits<double>::infinity()
                                           : std::numeric_limits<double>::infinity();
  }
  return value;
}

std::string number_text(double value) {
  std::ostringstream out;
  out.imbue(std::locale::classic());
  out.precision(10);
  out << value;
  return out.str();
}

}  // namespace stowage
