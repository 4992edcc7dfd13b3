// SPDX-License-Identifier: MIT
// Loading a site file (format: docs/input-format.md, schema: schemas/site.schema.json) and its
// hourly CSV (hourly_csv.h) into validated SiteConditions.
//
// site.hourly is read relative to `base_dir` (the directory of the site file). A CSV that
// cannot be opened is reported at the site file's `site.hourly` key; errors inside the CSV name
// the CSV. charging_price gives either a constant per_kwh, copied to all 8760 hours, or the
// name of a price column, which the CSV must have (else the error is at
// `site.charging_price.column`). Optional blocks left out: no back-up (backup_price_per_kwh
// unset), no unserved limit, penalty 0, design_margin 1. bus_voltage_v, autonomy_days and
// design_margin are held to the plausibility limits of input_limits.h at their keys.
#pragma once

#include <istream>
#include <optional>
#include <string>
#include <vector>

#include "catalog-schema/input_error.h"  // what the readers throw
#include "model/site.h"

namespace stowage {

struct LoadedSite {
  SiteConditions site;
  std::string path;                         // source name of the site file
  std::string hourly_path;                  // the CSV as opened (base_dir joined)
  std::optional<std::string> price_column;  // set when the charging price comes from the CSV
  std::vector<InputNote> notes;             // what the hourly CSV reader ignored
};

LoadedSite load_site_details(std::istream& in, const std::string& source_name,
                             const std::string& base_dir);
LoadedSite load_site_details_file(const std::string& path);

SiteConditions load_site(std::istream& in, const std::string& source_name,
                         const std::string& base_dir);
SiteConditions load_site_file(const std::string& path);

}  // namespace stowage
