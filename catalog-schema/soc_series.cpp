// SPDX-License-Identifier: MIT
#include "catalog-schema/soc_series.h"

#include <algorithm>
#include <cmath>
#include <limits>
#include <optional>
#include <regex>

#include "catalog-schema/csv_table.h"
#include "catalog-schema/decimal_text.h"
#include "catalog-schema/input_error.h"
#include "catalog-schema/input_file.h"
#include "catalog-schema/input_limits.h"
#include "catalog-schema/schema_validator.h"
#include "catalog-schema/time_column.h"

namespace stowage {
namespace {

// The message for a column the reader refuses, or "" for a column it ignores: a known quantity
// in another unit or spelling, or a near miss of a known name, is refused (the user meant it);
// anything else (a logger's voltage, current, status) is ignored with a note.
std::string column_problem(const std::string& name) {
  static const std::regex soc_like("(soc|state_of_charge|charge)_?([A-Za-z%]*)");
  static const std::regex temperature("(temp|temperature)_([A-Za-z0-9]+)");
  if (name.size() > kMaxPatternText) return "";
  std::smatch m;
  if (std::regex_match(name, m, temperature)) {
    return "expected degrees Celsius: name it temp_c and give the values in degrees Celsius";
  }
  if (std::regex_match(name, m, soc_like)) {
    return "expected a fraction or percent: name it soc (values 0 to 1) or soc_pct (values 0 to "
           "100)";
  }
  const std::string hint = closest_match(name, {"soc", "soc_pct", "temp_c", "time"});
  if (hint.empty()) return "";
  return "unknown column (did you mean '" + hint +
         "'?); the columns are soc or soc_pct, and optionally temp_c and time";
}

// Two samples count as evenly spaced when their steps differ by at most this share of the
// first step, or by a second (loggers round their timestamps to whole seconds).
constexpr double kSpacingTolerance = 1e-3;
constexpr double kOneSecondHours = 1.0 / 3600.0;

}  // namespace

SocSeries read_soc_series(std::istream& in, const std::string& source_name) {
  CsvTable table(in, source_name);
  const CsvRow& header = table.header();
  std::optional<std::size_t> soc, pct, temp, time;
  SocSeries series;
  for (std::size_t i = 0; i < header.fields.size(); ++i) {
    const CsvField& field = header.fields[i];
    const std::string& name = field.text;
    std::optional<std::size_t>* slot = nullptr;
    if (name == "soc") slot = &soc;
    if (name == "soc_pct") slot = &pct;
    if (name == "temp_c") slot = &temp;
    if (name == "time") slot = &time;
    if (slot == nullptr) {
      if (name.empty()) {
        throw table.error(header.line, field.column, "(column " + std::to_string(i + 1) + ")",
                          "empty column name");
      }
      const std::string problem = column_problem(name);
      if (!problem.empty()) throw table.error(header.line, field.column, name, problem);
      series.notes.push_back({table.source(), header.line, field.column, name,
                              "column ignored: a SOC series uses soc or soc_pct, temp_c and "
                              "time"});
      continue;
    }
    if (*slot) {
      throw table.error(
          header.line, field.column, name,
          "the column appears twice (also column " + std::to_string(**slot + 1) + ")");
    }
    *slot = i;
  }
  if (soc && pct) {
    throw table.error(header.line, header.fields[std::max(*soc, *pct)].column,
                      header.fields[std::max(*soc, *pct)].text,
                      "give the state of charge once: either soc (fraction) or soc_pct "
                      "(percent), not both");
  }
  if (!soc && !pct) {
    throw table.error(header.line, 1, "soc",
                      "the header has no state-of-charge column: name it soc (values 0 to 1) or "
                      "soc_pct (values 0 to 100)");
  }

  CsvRow row;
  std::optional<bool> dates;  // whether the time column holds date-times (fixed by row 1)
  double first_time = 0, first_step = 0;
  while (table.next(row)) {
    if (series.soc_fraction.size() == kMaxSocRows) {
      throw table.error(row.line, 1, "(rows)",
                        "a SOC series may have at most " + std::to_string(kMaxSocRows) +
                            " rows (a plausibility limit, see docs/input-format.md); split the "
                            "log or take every n-th sample");
    }
    if (soc) {
      series.soc_fraction.push_back(
          csv_number(table, row, *soc, "soc", 0, 1,
                     " (soc is a fraction; for percent values name the column soc_pct)"));
    } else {
      series.soc_fraction.push_back(csv_number(table, row, *pct, "soc_pct", 0, 100) / 100.0);
    }
    if (temp)
      series.temp_c.push_back(csv_number(table, row, *temp, "temp_c", kMinPlausibleTempC,
                                         kMaxPlausibleTempC, kTempRangeHint));
    if (time) {
      const CsvField& cell = row.fields[*time];
      const TimeValue t = time_cell(table, row, *time);
      if (!dates) dates = t.is_date;
      if (*dates != t.is_date) {
        throw table.error(row.line, cell.column, "time",
                          "'" + printable_input(cell.text) + "' is " +
                              (t.is_date ? "a date-time" : "a number of hours") +
                              " but the first row's time is " +
                              (*dates ? "a date-time" : "a number of hours") +
                              "; give every time in one form");
      }
      const double hours = t.hours;
      if (series.time_hours.empty()) {
        first_time = hours;
      } else {
        const double previous = first_time + series.time_hours.back();
        const double step = hours - previous;
        if (!(step > 0)) {
          throw table.error(row.line, cell.column, "time",
                            "times must increase from row to row: '" + printable_input(cell.text) +
                                "' is " + (step == 0 ? "the same as" : "before") +
                                " the previous row's");
        }
        if (series.time_hours.size() == 1) {
          first_step = step;
        } else if (std::fabs(step - first_step) >
                   std::max(kSpacingTolerance * first_step, kOneSecondHours)) {
          throw table.error(row.line, cell.column, "time",
                            "the samples must be evenly spaced: this step is " +
                                duration_text(step) + ", the log's first step is " +
                                duration_text(first_step) +
                                "; split the log at the gap or fill it");
        }
      }
      series.time_hours.push_back(hours - first_time);
    }
  }
  if (series.soc_fraction.size() < 2) {
    throw table.error(table.last_line(), 1, soc ? "soc" : "soc_pct",
                      "needs at least 2 rows to show any cycling, found " +
                          std::to_string(series.soc_fraction.size()));
  }
  if (time) {
    series.hours_per_sample =
        series.time_hours.back() / static_cast<double>(series.time_hours.size() - 1);
  }
  return series;
}

SocSeries read_soc_series_file(const std::string& path) {
  std::ifstream in = open_input_or_throw(path, "(file)", kMaxCsvFileBytes);
  return read_soc_series(in, path);
}

}  // namespace stowage
