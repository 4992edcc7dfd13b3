// SPDX-License-Identifier: MIT
// The fingerprint of a study's inputs, so a reader can check that a report was made from the
// files they hold: the SHA-256 (sha256.h, FIPS 180-4) of the bytes of every file the study
// read (the study file, the site file, its hourly CSV, each profile in study order, and the
// logged SOC series when given), and one study digest: the SHA-256 of the text
//   "<hex digest>  <role>\n" for each file in that order
// (the line format of `sha256sum`, with the file's role in place of its path, so that moving
// the study folder does not change the digest but changing any byte of any input does).
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "catalog-schema/study_loader.h"
#include "catalog-schema/tender_loader.h"

namespace stowage::report {

struct InputFileHash {
  std::string role;  // "study", "site", "hourly series", "profile <id>", "SOC log", ...
  std::string path;  // as the loader opened it, lexically normalised
  std::uintmax_t bytes = 0;
  std::string sha256;  // 64 lower-case hex digits
};

struct StudyHash {
  std::vector<InputFileHash> files;
  std::string digest;  // over the per-file digests, as above
};

// Reads the files again; a file that can no longer be read is an InputError naming it.
StudyHash hash_study_inputs(const LoadedStudy& loaded);

// The same for a tender (the tender report): the tender file, the site file, its hourly CSV,
// then for each bid in tender order its bid file ("bid file <label>") and the chemistry profile it
// names ("profile of <label>").
StudyHash hash_tender_inputs(const TenderCase& tender);

}  // namespace stowage::report
