// SPDX-License-Identifier: MIT
#include "catalog-schema/input_file.h"

#include <cerrno>
#include <cstring>
#include <filesystem>
#include <system_error>

#include "catalog-schema/input_error.h"

namespace stowage {

std::string size_text(std::uintmax_t bytes) {
  if (bytes >= (1u << 20) && bytes % (1u << 20) == 0) return std::to_string(bytes >> 20) + " MiB";
  if (bytes >= (1u << 10) && bytes % (1u << 10) == 0) return std::to_string(bytes >> 10) + " KiB";
  return std::to_string(bytes) + " bytes";
}

bool open_input(const std::string& path, std::ifstream& in, std::string& reason,
                std::uintmax_t max_bytes) {
  namespace fs = std::filesystem;
  const std::string shown = "'" + printable_input(path, 200) + "'";
  std::error_code ec;
  // status() follows symbolic links and never opens the file, so a FIFO is refused here
  // instead of blocking in open() until a writer appears.
  const fs::file_status status = fs::status(path, ec);
  // A missing or inaccessible path is left to open(), whose errno says why.
  if (fs::exists(status)) {
    if (fs::is_directory(status)) {
      reason = shown + " is a directory, not a file";
      return false;
    }
    if (!fs::is_regular_file(status)) {
      const char* kind = fs::is_fifo(status)             ? "a FIFO (named pipe)"
                         : fs::is_character_file(status) ? "a character device"
                         : fs::is_block_file(status)     ? "a block device"
                         : fs::is_socket(status)         ? "a socket"
                                                         : "not a regular file";
      reason = shown + " is " + std::string(kind) + "; stowage reads only regular files";
      return false;
    }
    const std::uintmax_t size = fs::file_size(path, ec);
    if (!ec && size > max_bytes) {
      reason = shown + " has " + std::to_string(size) + " bytes, more than the " +
               size_text(max_bytes) + " an input file of this kind may have";
      return false;
    }
  }
  errno = 0;
  in.open(path, std::ios::in | std::ios::binary);
  if (!in.is_open()) {
    reason = "cannot open " + shown + ": " +
             (errno != 0 ? std::string(std::strerror(errno)) : std::string("unknown reason"));
    return false;
  }
  return true;
}

std::ifstream open_input_or_throw(const std::string& path, const std::string& field,
                                  std::uintmax_t max_bytes) {
  std::ifstream in;
  std::string reason;
  if (!open_input(path, in, reason, max_bytes)) throw InputError::unreadable(path, field, reason);
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
