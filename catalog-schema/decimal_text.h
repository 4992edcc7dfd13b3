// SPDX-License-Identifier: MIT
// Recognising and reading decimal numbers in input text, shared by the YAML and CSV readers.
//
// Accepted form: optional sign, digits with an optional '.' and fraction (or a fraction alone,
// ".5"), optional exponent (e, E, optional sign, digits). No hexadecimal, no thousands
// separators, no locale: the decimal point is always '.'. Recognition is a hand-written scan,
// not a regular expression, so text of any length is handled in constant stack space.
#pragma once

#include <string>
#include <string_view>

namespace stowage {

bool is_integer_text(std::string_view text);  // optional sign and digits only
bool is_decimal_text(std::string_view text);  // the accepted form above

// The value of a text for which is_decimal_text() holds; +-infinity when it is out of the range
// of double (e.g. "1e999").
double decimal_value(const std::string& text);

// A number as messages show it: up to 10 significant digits, '.' as the decimal point.
std::string number_text(double value);

// std::regex_search / regex_match recurse once per character in common implementations; text
// longer than this is refused before any pattern is applied to it.
constexpr std::size_t kMaxPatternText = 256;

}  // namespace stowage
