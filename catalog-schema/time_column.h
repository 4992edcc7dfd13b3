// SPDX-License-Identifier: MIT
// The `time` column of the CSV inputs (SOC log, hourly CSV): each value is either a number of
// hours (0, 0.25, 8759) or an ISO 8601 date-time, "2026-03-01T00:15", "2026-03-01 00:15:30",
// "2026-03-01T00:15:30.5Z", "2026-03-01T00:15+01:00" (a space may stand for the 'T'; seconds,
// fraction and offset are optional; a date alone means 00:00). All values of one column take
// the same form. Dates are proleptic Gregorian and checked (no 30 February, no hour 24);
// without an offset the times are taken as one local time scale (no daylight-saving jumps).
#pragma once

#include <optional>
#include <string>

#include "catalog-schema/csv_table.h"

namespace stowage {

struct TimeValue {
  double hours = 0;        // hours (a number as given; a date-time from 1970-01-01T00:00 UTC)
  bool is_date = false;    // written as an ISO 8601 date-time
  int month = 0;           // 1..12 for a date-time, for the leap-day rule of the hourly CSV
  int day = 0;             // 1..31 for a date-time
  double clock_hours = 0;  // time of day as written (before any offset), hours, for a date-time
};

// The value of one field; nullopt when it is neither a finite number nor a valid ISO 8601
// date-time; `problem` then says what is wrong ("no 30 February", "not a time").
std::optional<TimeValue> parse_time(const std::string& text, std::string& problem);

// The time in column `column` of `row`; throws InputError at its line and column (field "time")
// naming the problem when the cell holds no valid time.
TimeValue time_cell(const CsvTable& table, const CsvRow& row, std::size_t column);

// A step between two samples as messages show it: "1 h", "15 min", "2.5 s".
std::string duration_text(double hours);

}  // namespace stowage
