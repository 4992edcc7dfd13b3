// SPDX-License-Identifier: MIT
// A logged state-of-charge series (CSV), as operators export it, for counting the cycles a bank
// has really done (rainflow) and the damage they did.
//
// Columns by name, any order: exactly one of
//   soc       state of charge as a fraction, [0, 1]
//   soc_pct   state of charge in percent, [0, 100]; converted to a fraction
// and optionally
//   temp_c    battery temperature, degrees Celsius (for the temperature acceleration of damage)
//   time      hours or ISO 8601 date-times (time_column.h), strictly increasing and evenly
//             spaced; the spacing is returned, so the caller need not be told it
// At least 2 data rows, at most kMaxSocRows; every value finite and in range. A column with a
// known quantity in another unit or a near miss of a name is an error (soc_percent, temp_f,
// tmep_c); any other column (a logger's voltage or status) is ignored with a note. CSV
// dialect: csv_table.h. Errors name the file, the physical line, the character column and the
// CSV column name.
#pragma once

#include <istream>
#include <optional>
#include <string>
#include <vector>

#include "catalog-schema/input_error.h"  // what the readers throw

namespace stowage {

struct SocSeries {
  std::vector<double> soc_fraction;  // one value per row, [0, 1]
  std::vector<double> temp_c;        // one value per row, or empty when the file has no temp_c
  std::vector<double> time_hours;    // hours since the first row, or empty without a time column
  // The logging interval read from the time column, hours; unset without one (the caller then
  // has to be told the interval).
  std::optional<double> hours_per_sample;
  std::vector<InputNote> notes;  // columns ignored
};

SocSeries read_soc_series(std::istream& in, const std::string& source_name);
SocSeries read_soc_series_file(const std::string& path);

}  // namespace stowage
