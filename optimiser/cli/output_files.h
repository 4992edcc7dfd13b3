// SPDX-License-Identifier: MIT
// Writing result files without ever leaving a half-written one: each file is written to a
// temporary name in the target directory and renamed into place only when complete; on any
// failure the temporaries are removed and the error names the path.
#pragma once

#include <stdexcept>
#include <string>
#include <utility>
#include <vector>

namespace stowage::cli {

struct OutputFileError : std::runtime_error {
  using std::runtime_error::runtime_error;
};

// Writes every (file name, content) pair into `directory` (created if missing). All files are
// first written to temporaries; only when all succeeded are they renamed into place.
void write_output_files(const std::string& directory,
                        const std::vector<std::pair<std::string, std::string>>& files);

}  // namespace stowage::cli
