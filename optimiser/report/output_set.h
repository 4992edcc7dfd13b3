// SPDX-License-Identifier: MIT
// OutputSet: the files of one run (--out DIR), replaced together or not at all.
//
// Contract
//   - The constructor checks DIR at once, before any work: "" is refused; a DIR that exists
//     must be a directory that is empty or holds an earlier set of ours (its manifest
//     `.stowage-output-set` lists exactly the files in it), so no file of the user's is ever
//     replaced or removed. Stale staging folders of killed runs beside DIR are removed.
//   - commit() writes every file into a staging folder beside DIR (same parent, so the same
//     file system), then swaps it with DIR in one atomic step (Linux renameat2 with
//     RENAME_EXCHANGE; where the file system lacks it, two renames with the old set kept
//     whole until the new one is in place) and removes the old set. A run killed at any point
//     leaves DIR holding the previous set or the new one, whole, never a mixture.
//   - Failures throw OutputFileError naming the path and the reason (strerror), and leave DIR
//     as it was.
#pragma once

#include <functional>
#include <ostream>
#include <stdexcept>
#include <string>
#include <utility>
#include <vector>

namespace stowage::report {

struct OutputFileError : std::runtime_error {
  using std::runtime_error::runtime_error;
};

class OutputSet {
 public:
  explicit OutputSet(std::string directory,
                     const std::string& option = "--out");  // option: for messages
  // Adds a file by name (no path separators); `write` fills it.
  void add(std::string name, std::function<void(std::ostream&)> write);
  void commit();

  static constexpr const char* kManifest = ".stowage-output-set";

 private:
  std::string directory_;
  std::vector<std::pair<std::string, std::function<void(std::ostream&)>>> files_;
};

// OutputFile: one file at a path the user named (optimise --export-model FILE), whole or absent.
//
// Contract
//   - The constructor checks the path at once, before any work: "" is refused, and so are a
//     path that is a directory and a parent directory that is missing or not writable.
//   - The writer fills staging_path() (beside the file, ending in the same name so its
//     extension still says the format); commit() renames it over the path in one atomic step.
//     Without commit() (a failure or an exception on the way) the staging file is removed.
//   - Failures throw OutputFileError naming the path and the reason.
class OutputFile {
 public:
  OutputFile(std::string option, std::string path);
  ~OutputFile();
  OutputFile(const OutputFile&) = delete;
  OutputFile& operator=(const OutputFile&) = delete;

  const std::string& staging_path() const { return staging_; }
  void commit();

 private:
  std::string path_;
  std::string staging_;
  bool committed_ = false;
};

}  // namespace stowage::report
