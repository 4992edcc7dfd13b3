// SPDX-License-Identifier: MIT
// A logged state-of-charge series (CSV), as operators export it, for counting the cycles a bank
// has really done (rainflow) and the damage they did.
//
// Columns by name, any order: exactly one of
//   soc       state of charge as a fraction, [0, 1]
//   soc_pct   state of charge in percent, [0, 100]; converted to a fraction
// and optionally
//   temp_c    battery temperature, degrees Celsius (for the temperature acceleration of damage)
//   time      any text (a timestamp); ignored
// At least 2 data rows; every value finite and in range. Any other column is an error (with
// the expected unit for soc_percent, temp_f, ...). CSV dialect: csv_table.h. Errors name the
// file, the physical line, the character column and the CSV column name.
#pragma once

#include <istream>
#include <string>
#include <vector>

#include "catalog-schema/input_error.h"  // what the readers throw

namespace stowage {

struct SocSeries {
  std::vector<double> soc_fraction;  // one value per row, [0, 1]
  std::vector<double> temp_c;        // one value per row, or empty when the file has no temp_c
};

SocSeries read_soc_series(std::istream& in, const std::string& source_name);
SocSeries read_soc_series_file(const std::string& path);

}  // namespace stowage
