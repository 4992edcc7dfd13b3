// SPDX-License-Identifier: MIT
// Opening input files and resolving the paths that input files write relative to themselves.
//
// open_input() never throws: it reports why a file cannot be read ("No such file or
// directory", "is a directory", ...), so each caller can raise the InputError at the right
// place: at line 1 of the file itself when the user named it on the command line, or at the
// key of the file that refers to it (study.site, study.profiles[1], site.hourly).
#pragma once

#include <fstream>
#include <string>

namespace stowage {

// Opens `path` for reading into `in`; on failure returns false and sets `reason`.
bool open_input(const std::string& path, std::ifstream& in, std::string& reason);

// Opens `path` or throws InputError::unreadable(path, field, reason).
std::ifstream open_input_or_throw(const std::string& path, const std::string& field);

// The directory part of `path` ("" when it has none, meaning the working directory).
std::string parent_directory(const std::string& path);
// `path` as written inside a file located in `base_dir`: absolute paths stay as they are,
// relative ones are joined to base_dir; the result is lexically normalised.
std::string resolve_relative(const std::string& base_dir, const std::string& path);

}  // namespace stowage
