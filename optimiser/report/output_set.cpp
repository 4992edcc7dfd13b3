// SPDX-License-Identifier: MIT
#include "optimiser/report/output_set.h"

#include <fcntl.h>
#include <signal.h>
#include <stdio.h>
#include <sys/stat.h>
#include <unistd.h>

#include <cerrno>
#include <cstring>
#include <filesystem>
#include <fstream>
#include <set>
#include <system_error>

namespace stowage::report {

namespace fs = std::filesystem;

namespace {

std::string reason(int err) { return std::strerror(err); }

[[noreturn]] void fail(const std::string& what, const std::string& why) {
  throw OutputFileError(what + ": " + why);
}

// The staging folders of a target directory: ".<name>.staging-<pid>" beside it.
std::string staging_prefix(const fs::path& dir) {
  return "." + dir.filename().string() + ".staging-";
}

std::set<std::string> read_manifest(const fs::path& dir) {
  std::set<std::string> names;
  std::ifstream in(dir / OutputSet::kManifest);
  for (std::string line; std::getline(in, line);) {
    if (!line.empty()) names.insert(line);
  }
  return names;
}

void remove_stale_staging(const fs::path& dir) {
  const fs::path parent = dir.parent_path().empty() ? fs::path(".") : dir.parent_path();
  const std::string prefix = staging_prefix(dir);
  std::error_code ec;
  for (fs::directory_iterator it(parent, ec), end; !ec && it != end; it.increment(ec)) {
    const std::string name = it->path().filename().string();
    if (name.rfind(prefix, 0) != 0) continue;
    const long pid = std::strtol(name.c_str() + prefix.size(), nullptr, 10);
    if (pid > 0 && pid != ::getpid() && ::kill(static_cast<pid_t>(pid), 0) == 0) continue;
    std::error_code ignore;
    fs::remove_all(it->path(), ignore);  // a killed run's leftovers
  }
}

bool exchange(const fs::path& a, const fs::path& b) {
#ifdef RENAME_EXCHANGE
  if (::renameat2(AT_FDCWD, a.c_str(), AT_FDCWD, b.c_str(), RENAME_EXCHANGE) == 0) return true;
  if (errno != EINVAL && errno != ENOSYS && errno != ENOTSUP) {
    fail("cannot move the new output set into '" + b.string() + "'", reason(errno));
  }
#else
  (void)a;
  (void)b;
#endif
  return false;
}

}  // namespace

OutputSet::OutputSet(std::string directory, const std::string& option)
    : directory_(std::move(directory)) {
  if (directory_.empty()) fail(option, "needs a directory name, not an empty string");
  while (directory_.size() > 1 && directory_.back() == '/') directory_.pop_back();
  const fs::path dir(directory_);
  std::error_code ec;
  const fs::file_status status = fs::symlink_status(dir, ec);
  if (fs::exists(status)) {
    if (!fs::is_directory(status))
      fail("cannot write into '" + directory_ + "'", "not a directory");
    const std::set<std::string> ours = read_manifest(dir);
    for (fs::directory_iterator it(dir, ec), end; !ec && it != end; it.increment(ec)) {
      const std::string name = it->path().filename().string();
      if (name == kManifest || ours.count(name)) continue;
      fail("refusing to replace '" + directory_ + "'",
           "it holds '" + name +
               "', which no earlier stowage run wrote there; choose an empty or new directory");
    }
    if (ec) fail("cannot read '" + directory_ + "'", ec.message());
  }
  const fs::path parent = dir.parent_path().empty() ? fs::path(".") : dir.parent_path();
  if (::access(parent.c_str(), W_OK | X_OK) != 0) {
    fail("cannot write into '" + parent.string() + "'", reason(errno));
  }
  remove_stale_staging(dir);
}

void OutputSet::add(std::string name, std::function<void(std::ostream&)> write) {
  files_.emplace_back(std::move(name), std::move(write));
}

void OutputSet::commit() {
  const fs::path dir(directory_);
  const fs::path parent = dir.parent_path().empty() ? fs::path(".") : dir.parent_path();
  const fs::path staging = parent / (staging_prefix(dir) + std::to_string(::getpid()));
  std::error_code ec;
  fs::remove_all(staging, ec);
  if (::mkdir(staging.c_str(), 0777) != 0) {
    fail("cannot create '" + staging.string() + "'", reason(errno));
  }
  auto discard = [&]() {
    std::error_code ignore;
    fs::remove_all(staging, ignore);
  };
  auto write_file = [&](const std::string& name, const std::function<void(std::ostream&)>& fill) {
    std::ofstream out(staging / name, std::ios::binary | std::ios::trunc);
    if (!out) {
      const int err = errno;
      discard();
      fail("cannot write '" + (dir / name).string() + "'", reason(err));
    }
    fill(out);
    out.flush();
    if (!out) {
      const int err = errno;
      discard();
      fail("cannot write '" + (dir / name).string() + "'", err ? reason(err) : "write failed");
    }
  };
  for (const auto& [name, fill] : files_) write_file(name, fill);
  write_file(kManifest, [&](std::ostream& out) {
    for (const auto& file : files_) out << file.first << "\n";
  });
  if (!fs::exists(fs::symlink_status(dir, ec))) {
    if (::rename(staging.c_str(), dir.c_str()) != 0) {
      const int err = errno;
      discard();
      fail("cannot move the output set into '" + directory_ + "'", reason(err));
    }
    return;
  }
  if (!exchange(staging, dir)) {
    // No atomic exchange here: keep the old set whole beside DIR until the new one is in.
    const fs::path old = parent / (staging_prefix(dir) + std::to_string(::getpid()) + "-old");
    if (::rename(dir.c_str(), old.c_str()) != 0) {
      const int err = errno;
      discard();
      fail("cannot move the old output set aside from '" + directory_ + "'", reason(err));
    }
    if (::rename(staging.c_str(), dir.c_str()) != 0) {
      const int err = errno;
      ::rename(old.c_str(), dir.c_str());
      discard();
      fail("cannot move the output set into '" + directory_ + "'", reason(err));
    }
    fs::remove_all(old, ec);
    return;
  }
  fs::remove_all(staging, ec);  // now holds the previous set
}

OutputFile::OutputFile(std::string option, std::string path) : path_(std::move(path)) {
  if (path_.empty()) fail(option, "needs a file name, not an empty string");
  const fs::path file(path_);
  std::error_code ec;
  if (fs::is_directory(fs::status(file, ec)) || path_.back() == '/') {
    fail("cannot write '" + path_ + "'", "it is a directory; " + option + " needs a file name");
  }
  const fs::path parent = file.parent_path().empty() ? fs::path(".") : file.parent_path();
  if (::access(parent.c_str(), W_OK | X_OK) != 0) {
    fail("cannot write into '" + parent.string() + "'", reason(errno));
  }
  staging_ = (parent / (".staging-" + std::to_string(::getpid()) + "-" + file.filename().string()))
                 .string();
}

OutputFile::~OutputFile() {
  if (!committed_) ::unlink(staging_.c_str());
}

void OutputFile::commit() {
  if (::rename(staging_.c_str(), path_.c_str()) != 0) {
    const int err = errno;
    ::unlink(staging_.c_str());
    fail("cannot write '" + path_ + "'", reason(err));
  }
  committed_ = true;
}

}  // namespace stowage::report
