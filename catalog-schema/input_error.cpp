// SPDX-License-Identifier: MIT
#include "catalog-schema/input_error.h"

#include <utility>

namespace stowage {
namespace {

std::string format_error(const std::string& file, int line, int column, const std::string& field,
                         const std::string& message) {
  return file + ":" + std::to_string(line) + ":" + std::to_string(column) + ": " + field + ": " +
         message;
}

}  // namespace

InputError::InputError(std::string file, int line, int column, std::string field,
                       std::string message)
    : std::runtime_error(format_error(file, line, column, field, message)),
      file_(std::move(file)),
      line_(line),
      column_(column),
      field_(std::move(field)),
      message_(std::move(message)) {}

InputError InputError::unreadable(const std::string& file, const std::string& field,
                                  const std::string& reason) {
  return InputError(file, 1, 1, field, reason);
}

}  // namespace stowage
