// SPDX-License-Identifier: MIT
#include "catalog-schema/decimal_text.h"

#include <cctype>
#include <charconv>
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
  // std::from_chars reads the shortest text that rounds correctly, as strtod does under the
  // classic locale, without building a stream per number (the hourly CSV holds ~35,000 of
  // them). It takes no leading '+'; what it does not read whole (out of range) goes through the
  // stream, which turns an overflow into a failure and an underflow into strtod's value.
  const char* first = text.data();
  const char* last = first + text.size();
  if (first != last && *first == '+') ++first;
  double fast = 0;
  const std::from_chars_result r = std::from_chars(first, last, fast);
  if (r.ec == std::errc() && r.ptr == last) return fast;
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
