// SPDX-License-Identifier: MIT
#include "catalog-schema/input_error.h"

#include <cstdio>
#include <utility>

namespace stowage {
namespace {

constexpr std::size_t kMaxEchoedFieldChars = 120;

// Length of the valid UTF-8 sequence starting at text[i], or 0 when it is not one.
std::size_t utf8_length(std::string_view text, std::size_t i) {
  const auto byte = [&](std::size_t k) { return static_cast<unsigned char>(text[k]); };
  const unsigned char b = byte(i);
  if (b < 0x80) return 1;
  std::size_t n = 0;
  unsigned long code = 0;
  if (b >= 0xC2 && b <= 0xDF) {
    n = 2;
    code = b & 0x1F;
  } else if (b >= 0xE0 && b <= 0xEF) {
    n = 3;
    code = b & 0x0F;
  } else if (b >= 0xF0 && b <= 0xF4) {
    n = 4;
    code = b & 0x07;
  } else {
    return 0;
  }
  if (i + n > text.size()) return 0;
  for (std::size_t k = 1; k < n; ++k) {
    if ((byte(i + k) & 0xC0) != 0x80) return 0;
    code = (code << 6) | (byte(i + k) & 0x3F);
  }
  if (n == 3 && (code < 0x800 || (code >= 0xD800 && code <= 0xDFFF))) return 0;
  if (n == 4 && (code < 0x10000 || code > 0x10FFFF)) return 0;
  return n;
}

std::string hex_escape(const char* form, unsigned value) {
  char buffer[16];
  std::snprintf(buffer, sizeof buffer, form, value);
  return buffer;
}

// Appends the code point at text[i] (length n, 0 for an invalid byte) in printable form.
void append_printable(std::string& out, std::string_view text, std::size_t i, std::size_t n) {
  const unsigned char b = static_cast<unsigned char>(text[i]);
  if (n == 0) {
    out += hex_escape("\\x%02x", b);
  } else if (n == 1 && (b < 0x20 || b == 0x7F)) {
    out += hex_escape("\\x%02x", b);
  } else if (n == 2 && b == 0xC2 && static_cast<unsigned char>(text[i + 1]) < 0xA0) {
    out += hex_escape("\\u%04x", static_cast<unsigned char>(text[i + 1]));  // C1 control
  } else {
    out.append(text.substr(i, n));
  }
}

std::string format_error(const std::string& file, int line, int column, const std::string& field,
                         const std::string& message) {
  return escape_controls(file) + ":" + std::to_string(line) + ":" + std::to_string(column) + ": " +
         printable_input(field, kMaxEchoedFieldChars) + ": " + escape_controls(message);
}

}  // namespace

std::size_t invalid_utf8_at(std::string_view text) {
  for (std::size_t i = 0; i < text.size();) {
    const std::size_t n = utf8_length(text, i);
    if (n == 0) return i;
    i += n;
  }
  return std::string_view::npos;
}

std::string printable_input(std::string_view text, std::size_t max_chars) {
  std::string out;
  std::size_t chars = 0, total = 0;
  for (std::size_t i = 0; i < text.size(); ++total) {
    const std::size_t n = utf8_length(text, i);
    if (chars < max_chars) {
      append_printable(out, text, i, n);
      ++chars;
    }
    i += n == 0 ? 1 : n;
  }
  if (total > max_chars) out += "... (" + std::to_string(total) + " characters)";
  return out;
}

std::string escape_controls(std::string_view text) {
  std::string out;
  for (std::size_t i = 0; i < text.size();) {
    const std::size_t n = utf8_length(text, i);
    append_printable(out, text, i, n);
    i += n == 0 ? 1 : n;
  }
  return out;
}

InputError::InputError(std::string file, int line, int column, std::string field,
                       std::string message)
    : std::runtime_error(format_error(file, line, column, field, message)),
      file_(std::move(file)),
      line_(line),
      column_(column),
      field_(std::move(field)),
      message_(std::move(message)) {}

InputErrors::InputErrors(std::vector<InputError> all)
    : InputError(all.at(0)), all_(std::move(all)) {}

std::string InputNote::text() const {
  return format_error(file, line, column, field, "note: " + message);
}

InputError InputError::unreadable(const std::string& file, const std::string& field,
                                  const std::string& reason) {
  return InputError(file, 1, 1, field, reason);
}

}  // namespace stowage
