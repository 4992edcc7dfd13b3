// SPDX-License-Identifier: MIT
// The hourly CSV of a site: one typical non-leap year, 8760 rows, hour 0 = 1 January 00:00.
//
// Columns, by name in any order (the unit is part of the name):
//   load_kw     mean load in the hour, kW, >= 0 (required)
//   source_kw   power available for charging/serving the load, kW, >= 0 (required)
//   temp_c      battery-space temperature, degrees Celsius (required)
//   price_per_kwh, price_<tag>_per_kwh   price of charging energy, currency/kWh, >= 0 (optional;
//               a site's charging_price.column picks one)
//   hour        ignored (optional, for the reader's orientation)
//   time        optional: hours or ISO 8601 date-times (time_column.h), from hour 0 or
//               1 January 00:00, one hour apart (25 h over a dropped 29 February)
// A column with a known quantity but another unit (load_w, source_mw, temp_f, temp_k,
// price_per_mwh) or a near miss of a name (laod_kw) is an error naming the expected name; any
// other column (irradiance, wind speed) is ignored with a note. Exactly 8760 data rows; 8784 rows
// means a leap year, whose 29 February must be dropped. Every value must be finite. Errors name the
// file, the physical line (1-based, comments counted), the character column and the CSV column
// name. CSV dialect: csv_table.h.
#pragma once

#include <istream>
#include <map>
#include <string>
#include <vector>

#include "catalog-schema/input_error.h"  // what the readers throw

namespace stowage {

struct HourlySeries {
  std::vector<double> load_kw;
  std::vector<double> source_kw;
  std::vector<double> temp_c;           // empty when the CSV gives ambient_c instead
  std::vector<double> ambient_c;        // outdoor air, degC; empty when not given
  std::vector<double> irradiance_w_m2;  // for an enclosure's solar gain; empty when not given
  std::map<std::string, std::vector<double>> prices;  // price column name -> 8760 values
  std::vector<InputNote> notes;                       // columns ignored
};

HourlySeries read_hourly_csv(std::istream& in, const std::string& source_name);
HourlySeries read_hourly_csv_file(const std::string& path);

// The message for a column name that is refused in an hourly CSV ("" when it is used or
// ignored): the wrong-unit hint ("expected kW: name it load_kw") or the nearest allowed name.
std::string hourly_column_problem(const std::string& name);

}  // namespace stowage
