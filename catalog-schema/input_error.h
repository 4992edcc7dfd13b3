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
#pragma once

#include <stdexcept>
#include <string>

namespace stowage {

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

}  // namespace stowage
