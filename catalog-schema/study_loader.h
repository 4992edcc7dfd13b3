// SPDX-License-Identifier: MIT
// Loading a study file (format: docs/input-format.md, schema: schemas/study.schema.json) with
// the site and profile files it names, into a validated Study.
//
// Paths in the study are relative to `base_dir` (the study file's directory). Errors inside a
// referenced file name that file; a referenced file that cannot be opened is reported at the
// study key naming it (study.site, study.profiles[i]). Rules across files, checked here; each
// rule runs on what has loaded (a rule needing a value another rule refused is skipped), and
// when more than one fails they come together as one InputErrors (what() is the first's):
//   - profile ids are unique (error at the later study.profiles[i], naming the earlier file);
//   - every profile's costs.currency equals study.economics.currency (error at the profile's
//     costs.currency, naming the study's value and position);
//   - a design names a loaded profile id (with a suggestion for a near miss) and its
//     dod_setpoint lies within that profile's [dod.min, dod.max]; every design is checked;
//   - search.dod_ladder has from <= to; search.max_mass_kg / max_volume_l need cell.mass_kg /
//     cell.volume_l in every profile.
//   - at most kMaxProfiles profiles and kMaxDesigns designs; strings_parallel and
//     max_strings_parallel at most kMaxStringsParallel, compared before the conversion to int;
//     the DoD ladder at most kMaxDodLadderSetpoints; at most kMaxCellsInSeries cells make the
//     bus (input_limits.h);
//   - sizing for autonomy succeeds for each profile at its default DoD and at the shallowest
//     ladder setpoint, and for each design without strings_parallel; where the sized bank is
//     used (no designs listed, or a design without strings_parallel) it has at most
//     kMaxStringsParallel strings. So `check` refuses what evaluate and optimise would.
// The optional study.soc_log (a logged SOC series of an existing bank, soc_series.h) is read
// and checked too; a file that cannot be opened is reported at study.soc_log. `stowage cycles
// --study` counts its cycles (against a profile of the study picked by id). What the CSV
// readers ignored (extra columns) is collected in LoadedStudy::notes.
// Designs and search keep the model defaults when left out (no designs: each profile at its
// default DoD, sized for autonomy).
#pragma once

#include <istream>
#include <optional>
#include <string>
#include <vector>

#include "catalog-schema/input_error.h"  // what the readers throw
#include "catalog-schema/profile_loader.h"
#include "catalog-schema/site_loader.h"
#include "catalog-schema/soc_series.h"
#include "catalog-schema/study_case.h"
#include "catalog-schema/variations_loader.h"

namespace stowage {

struct LoadedStudy {
  StudyCase study;
  std::string path;                        // source name of the study file
  std::string site_path;                   // the site file as opened
  std::string hourly_path;                 // the site's hourly CSV as opened
  std::vector<std::string> profile_paths;  // as opened, in the order of study.profiles
  std::vector<LoadedProfile> profiles;     // same order; currency and sources of each
  std::string soc_log_path;                // study.soc_log as opened; empty when not given
  std::optional<SocSeries> soc_log;        // the logged SOC series, when study.soc_log is given
  SourcePosition study_at;                 // the `study` key, for errors about the whole study
  std::vector<InputNote> notes;            // what the readers accepted but ignored, for display
  std::vector<Variation> variations;       // study.variations (variations_loader.h), in order
};

// For `cycles --study`: the study's SOC log; throws InputError at the study's `study` key
// (field study.soc_log) when the study names none.
const SocSeries& study_soc_log(const LoadedStudy& loaded);
// The loaded profile with id `id`; throws InvalidValue with field `field` (the option that
// named it) listing the ids, with a suggestion for a near miss.
const ChemistryProfile& study_profile(const LoadedStudy& loaded, const std::string& id,
                                      const std::string& field);

LoadedStudy load_study_details(std::istream& in, const std::string& source_name,
                               const std::string& base_dir);
LoadedStudy load_study_details_file(const std::string& path);

StudyCase load_study(std::istream& in, const std::string& source_name, const std::string& base_dir);
StudyCase load_study_file(const std::string& path);

}  // namespace stowage
