// SPDX-License-Identifier: MIT
// InputError: the one error the loaders raise for a bad input file (profile, site, study, CSV).
//
// It says where and what: the file (as the caller named it), the 1-based line and column, the
// field path in the spelling of the input file ("profile.ageing.cycle_life[2].cycles" for YAML,
// the column name such as "load_kw" for CSV) and a message that states the rule and, where it
// helps, how to fix the input. what() is "FILE:LINE:COL: FIELD: message", the form editors and
// terminals turn into a link.
// A file that cannot be opened is reported at line 1, column 1 of that file. Line and column
// are never 0 once built through the factories below (yaml-cpp marks are 0-based: add 1).
// what() never carries a control character or a byte that is not UTF-8: they are written as
// escapes (\x1b, \u0085), so a hostile file cannot drive the terminal that shows the message;
// a field path longer than kMaxEchoedChars is cut.
#pragma once

#include <cstddef>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

namespace stowage {

// Input text as messages show it: control characters and bytes that are not UTF-8 escaped, and
// cut after `max_chars` code points ("...", then the full length in characters).
constexpr std::size_t kMaxEchoedChars = 60;
std::string printable_input(std::string_view text, std::size_t max_chars = kMaxEchoedChars);
// Only the escaping of printable_input(), no cut.
std::string escape_controls(std::string_view text);

// Position of the first byte of `text` that does not start a valid UTF-8 sequence (overlong
// forms, surrogates and code points above U+10FFFF count as invalid); npos when all is valid.
std::size_t invalid_utf8_at(std::string_view text);

class InputError : public std::runtime_error {
 public:
  InputError(std::string file, int line, int column, std::string field, std::string message);

  const std::string& file() const { return file_; }
  int line() const { return line_; }
  int column() const { return column_; }
  const std::string& field() const { return field_; }
  const std::string& message() const { return message_; }

  // The file could not be opened or read; `reason` says why (see input_file.h).
  static InputError unreadable(const std::string& file, const std::string& field,
                               const std::string& reason);

 private:
  std::string file_;
  int line_;
  int column_;
  std::string field_;
  std::string message_;
};

// Several independent errors of one pass (each design of study.designs, say), for a caller
// that reports them all (check_study_file); a caller that catches InputError sees the first.
class InputErrors : public InputError {
 public:
  explicit InputErrors(std::vector<InputError> all);  // requires !all.empty()
  const std::vector<InputError>& all() const { return all_; }

 private:
  std::vector<InputError> all_;
};

// Something a loader noticed and accepted, for the caller to show (an ignored CSV column): same
// location as an error, but the input is used. text() is "FILE:LINE:COL: FIELD: note: message",
// escaped like an error's what().
struct InputNote {
  std::string file;
  int line = 1;
  int column = 1;
  std::string field;
  std::string message;

  std::string text() const;
};

}  // namespace stowage
