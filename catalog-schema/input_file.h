// SPDX-License-Identifier: MIT
// Opening input files and resolving the paths that input files write relative to themselves.
//
// open_input() never throws: it reports why a file cannot be read ("No such file or
// directory", "is a directory", ...), so each caller can raise the InputError at the right
// place: at line 1 of the file itself when the user named it on the command line, or at the
// key of the file that refers to it (study.site, study.profiles[1], site.hourly).
// Only a regular file of at most `max_bytes` is opened: the type and size are looked up (stat)
// before open(), so a FIFO cannot block the program in open() and a device such as /dev/zero
// cannot be read without end (input_limits.h has the sizes).
#pragma once

#include <cstdint>
#include <fstream>
#include <string>

namespace stowage {

// Opens `path` for reading into `in`; on failure returns false and sets `reason`.
bool open_input(const std::string& path, std::ifstream& in, std::string& reason,
                std::uintmax_t max_bytes);

// Opens `path` or throws InputError::unreadable(path, field, reason).
std::ifstream open_input_or_throw(const std::string& path, const std::string& field,
                                  std::uintmax_t max_bytes);

// "1 MiB", "64 MiB", "512 bytes": a size limit as messages show it.
std::string size_text(std::uintmax_t bytes);

// The directory part of `path` ("" when it has none, meaning the working directory).
std::string parent_directory(const std::string& path);
// `path` as written inside a file located in `base_dir`: absolute paths stay as they are,
// relative ones are joined to base_dir; the result is lexically normalised.
std::string resolve_relative(const std::string& base_dir, const std::string& path);

}  // namespace stowage
