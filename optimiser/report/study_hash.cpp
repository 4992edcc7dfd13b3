// SPDX-License-Identifier: MIT
#include "optimiser/report/study_hash.h"

#include <cerrno>
#include <cstring>
#include <filesystem>
#include <fstream>

#include "optimiser/report/sha256.h"

namespace stowage::report {

namespace {

InputFileHash hash_file(const std::string& role, const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  if (!in) throw InputError::unreadable(path, role, std::strerror(errno));
  Sha256 hash;
  InputFileHash out;
  out.role = role;
  out.path = std::filesystem::path(path).lexically_normal().generic_string();
  char buffer[65536];
  while (in) {
    in.read(buffer, sizeof buffer);
    const std::streamsize got = in.gcount();
    if (got > 0) {
      hash.update(buffer, static_cast<std::size_t>(got));
      out.bytes += static_cast<std::uintmax_t>(got);
    }
  }
  if (in.bad()) throw InputError::unreadable(path, role, "read error");
  out.sha256 = hash.finish_hex();
  return out;
}

// Digest over the per-file lines, in their order.
StudyHash with_digest(std::vector<InputFileHash> files) {
  StudyHash out;
  out.files = std::move(files);
  Sha256 digest;
  for (const InputFileHash& f : out.files) digest.update(f.sha256 + "  " + f.role + "\n");
  out.digest = digest.finish_hex();
  return out;
}

}  // namespace

StudyHash hash_study_inputs(const LoadedStudy& loaded) {
  std::vector<InputFileHash> files;
  files.push_back(hash_file("study", loaded.path));
  files.push_back(hash_file("site", loaded.site_path));
  files.push_back(hash_file("hourly series", loaded.hourly_path));
  for (std::size_t i = 0; i < loaded.profile_paths.size(); ++i) {
    const std::string id =
        i < loaded.profiles.size() ? loaded.profiles[i].profile.id : std::to_string(i + 1);
    files.push_back(hash_file("profile " + id, loaded.profile_paths[i]));
  }
  if (!loaded.soc_log_path.empty()) files.push_back(hash_file("SOC log", loaded.soc_log_path));
  return with_digest(std::move(files));
}

StudyHash hash_tender_inputs(const TenderCase& tender) {
  std::vector<InputFileHash> files;
  files.push_back(hash_file("tender", tender.path));
  files.push_back(hash_file("site", tender.site_path));
  files.push_back(hash_file("hourly series", tender.hourly_path));
  for (const Bid& bid : tender.bids) {
    files.push_back(hash_file("bid file " + bid.label, bid.path));
    files.push_back(hash_file("profile of " + bid.label, bid.profile_path));
  }
  return with_digest(std::move(files));
}

}  // namespace stowage::report
