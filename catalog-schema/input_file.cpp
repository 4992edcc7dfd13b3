// SPDX-License-Identifier: MIT
#include "catalog-schema/input_file.h"

#include <cerrno>
#include <cstring>
#include <filesystem>
#include <system_error>

#include "catalog-schema/input_error.h"

namespace stowage {

bool open_input(const std::string& path, std::ifstream& in, std::string& reason) {
  std::error_code ec;
  if (std::filesystem::is_directory(path, ec)) {
    reason = "'" + path + "' is a directory, not a file";
    return false;
  }
  errno = 0;
  in.open(path, std::ios::in | std::ios::binary);
  if (!in.is_open()) {
    reason = "cannot open '" + path + "': " +
             (errno != 0 ? std::string(std::strerror(errno)) : std::string("unknown reason"));
    return false;
  }
  return true;
}

std::ifstream open_input_or_throw(const std::string& path, const std::string& field) {
  std::ifstream in;
  std::string reason;
  if (!open_input(path, in, reason)) throw InputError::unreadable(path, field, reason);
  return in;
}

std::string parent_directory(const std::string& path) {
  return std::filesystem::path(path).parent_path().string();
}

std::string resolve_relative(const std::string& base_dir, const std::string& path) {
  const std::filesystem::path written(path);
  if (written.is_absolute() || base_dir.empty()) return written.lexically_normal().string();
  return (std::filesystem::path(base_dir) / written).lexically_normal().string();
}

}  // namespace stowage
