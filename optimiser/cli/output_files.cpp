// SPDX-License-Identifier: MIT
#include "optimiser/cli/output_files.h"

#include <unistd.h>

#include <filesystem>
#include <fstream>
#include <system_error>

namespace stowage::cli {

namespace fs = std::filesystem;

void write_output_files(const std::string& directory,
                        const std::vector<std::pair<std::string, std::string>>& files) {
  std::error_code ec;
  fs::create_directories(directory, ec);
  if (ec || !fs::is_directory(directory))
    throw OutputFileError("cannot create output directory '" + directory +
                          "': " + (ec ? ec.message() : "a file of that name exists"));

  std::vector<fs::path> temporaries;
  auto discard = [&]() {
    for (const auto& t : temporaries) fs::remove(t, ec);
  };
  const std::string suffix = ".partial-" + std::to_string(static_cast<long>(::getpid()));
  for (const auto& [name, content] : files) {
    const fs::path tmp = fs::path(directory) / (name + suffix);
    temporaries.push_back(tmp);
    std::ofstream out(tmp, std::ios::binary | std::ios::trunc);
    out << content;
    out.flush();
    if (!out) {
      discard();
      throw OutputFileError("cannot write '" + (fs::path(directory) / name).string() + "'");
    }
  }
  for (std::size_t i = 0; i < files.size(); ++i) {
    fs::rename(temporaries[i], fs::path(directory) / files[i].first, ec);
    if (ec) {
      discard();
      throw OutputFileError("cannot move '" + temporaries[i].string() +
                            "' into place: " + ec.message());
    }
  }
}

}  // namespace stowage::cli
