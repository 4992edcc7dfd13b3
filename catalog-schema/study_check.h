// SPDX-License-Identifier: MIT
// check_study_file: every problem of a study that one run can find, for `stowage check`.
//
// The loaders stop at the first error (a later rule may need the values an earlier one
// refused). This collects more in three passes, each over files whose structure is known:
//   1. the study file: its YAML syntax (one error stops the file), then every schema violation
//      (unknown keys with the nearest allowed key, wrong types, ranges, missing keys);
//   2. every file the study names, each on its own, whether or not pass 1 found problems:
//      study.site (and that site's site.hourly CSV), each study.profiles[i] and study.soc_log.
//      A file that cannot be opened is reported at the study key naming it. A YAML file gives
//      its syntax error or all its schema violations, and when it has none the first error of
//      its own value rules (a profile's dod.min <= dod.default, a CSV's row, ...);
//   3. when passes 1 and 2 found nothing: the full load (load_study_details), whose rules
//      across files (unique profile ids, one currency, cells that make the bus, sizing for
//      autonomy, each design, the design space's limits, each variation) are all checked and
//      all their errors reported (the loader throws InputErrors when there are several).
// Passes 1 and 2 are the same checks as the loaders', in the same words: a study that check
// passes is one evaluate and optimise load, and a study they refuse gives check that error
// among its problems. Profile warnings are emitted once, by pass 3.
// Problems come in the order found: the study's in document order, then the referenced files
// in the order the study names them.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "catalog-schema/input_error.h"
#include "catalog-schema/study_loader.h"

namespace stowage {

struct StudyCheck {
  std::vector<InputError> problems;  // empty when the study is valid
  std::optional<LoadedStudy> study;  // the loaded study, exactly when problems is empty
};

StudyCheck check_study_file(const std::string& path);

}  // namespace stowage
