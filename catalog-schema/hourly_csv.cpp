// SPDX-License-Identifier: MIT
#include "catalog-schema/hourly_csv.h"

#include <cctype>
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
#include "model/site.h"

namespace stowage {
namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();

const std::regex& price_column() {
  static const std::regex re("price(_[a-z0-9]+)*_per_kwh");
  return re;
}

std::string lower(std::string s) {
  for (char& c : s) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return s;
}

bool is_price_column(const std::string& name) {
  return name.size() <= kMaxPatternText && std::regex_match(name, price_column());
}

bool allowed_name(const std::string& name) {
  return name == "load_kw" || name == "source_kw" || name == "temp_c" || name == "ambient_c" ||
         name == "irradiance_w_m2" || name == "hour" || name == "time" || is_price_column(name);
}

// The step between two rows of the time column: an hour, or 25 hours from 28 February to
// 1 March where a leap year's 29 February was dropped as the format asks.
bool hourly_step(const TimeValue& previous, const TimeValue& next) {
  const double step = next.hours - previous.hours;
  constexpr double kSecond = 1.0 / 3600.0;
  if (std::fabs(step - 1.0) <= kSecond) return true;
  return previous.is_date && previous.month == 2 && previous.day == 28 && next.month == 3 &&
         next.day == 1 && std::fabs(step - 25.0) <= kSecond;
}

}  // namespace

std::string hourly_column_problem(const std::string& name) {
  if (allowed_name(name)) return "";
  if (allowed_name(lower(name))) {
    return "column names are lower case: name it " + lower(name);
  }
  static const std::regex power("(load|source)_([A-Za-z0-9]+)");
  static const std::regex temperature("(temp|temperature|ambient)_([A-Za-z0-9]+)");
  static const std::regex price("(price(_[a-z0-9]+)*)_per_([A-Za-z0-9]+)");
  if (name.size() > kMaxPatternText) return "";
  std::smatch m;
  if (std::regex_match(name, m, power)) {
    return "expected kW: name it " + m[1].str() + "_kw and give the values in kilowatts";
  }
  if (std::regex_match(name, m, temperature)) {
    return std::string("expected degrees Celsius: name it ") +
           (m[1].str() == "ambient" ? "ambient_c" : "temp_c") +
           " and give the values in degrees Celsius";
  }
  if (std::regex_match(name, m, price)) {
    return "expected a price per kWh: name it " + m[1].str() +
           "_per_kwh and give the values in currency per kWh";
  }
  // A near miss of a name is refused: ignoring it would hide the column the user meant.
  const std::string hint =
      closest_match(name, {"load_kw", "source_kw", "temp_c", "ambient_c", "irradiance_w_m2",
                           "price_per_kwh", "hour", "time"});
  if (hint.empty()) return "";
  return "unknown column (did you mean '" + hint +
         "'?); the columns are load_kw, source_kw, temp_c (or ambient_c with an enclosure), and "
         "optionally irradiance_w_m2, price_per_kwh (or price_<tag>_per_kwh), hour and time";
}

HourlySeries read_hourly_csv(std::istream& in, const std::string& source_name) {
  CsvTable table(in, source_name);
  const CsvRow& header = table.header();

  std::optional<std::size_t> load, source, temp, ambient, irradiance, time;
  std::vector<std::size_t> ignored;
  std::map<std::string, std::size_t> price_index;
  for (std::size_t i = 0; i < header.fields.size(); ++i) {
    const CsvField& field = header.fields[i];
    const std::string& name = field.text;
    if (name.empty()) {
      throw table.error(header.line, field.column, "(column " + std::to_string(i + 1) + ")",
                        "empty column name");
    }
    const std::string problem = hourly_column_problem(name);
    if (!problem.empty()) throw table.error(header.line, field.column, name, problem);
    if (!allowed_name(name)) ignored.push_back(i);
    for (std::size_t j = 0; j < i; ++j) {
      if (header.fields[j].text == name) {
        throw table.error(header.line, field.column, name,
                          "the column appears twice (also column " + std::to_string(j + 1) + ")");
      }
    }
    if (name == "load_kw") load = i;
    if (name == "source_kw") source = i;
    if (name == "temp_c") temp = i;
    if (name == "ambient_c") ambient = i;
    if (name == "irradiance_w_m2") irradiance = i;
    if (name == "time") time = i;
    if (is_price_column(name)) price_index[name] = i;
  }
  for (const char* required : {"load_kw", "source_kw", "temp_c"}) {
    bool present = false;
    for (const CsvField& field : header.fields) present = present || field.text == required;
    // Outdoor air instead of the battery temperature: the site's enclosure computes the latter.
    if (std::string(required) == "temp_c" && ambient) present = true;
    if (!present) {
      throw table.error(header.line, 1, required,
                        std::string("the header has no column ") + required +
                            " (the columns needed are load_kw, source_kw and temp_c, or "
                            "ambient_c instead of temp_c for a site with an enclosure)");
    }
  }

  HourlySeries series;
  for (const std::size_t i : ignored) {
    series.notes.push_back({table.source(), header.line, header.fields[i].column,
                            header.fields[i].text,
                            "column ignored: the hourly CSV uses load_kw, source_kw, temp_c, "
                            "ambient_c, irradiance_w_m2, price columns, hour and time"});
  }
  std::optional<TimeValue> previous_time;
  for (const auto& entry : price_index) series.prices[entry.first];
  const std::size_t hours = static_cast<std::size_t>(kHoursPerYear);
  series.load_kw.reserve(hours);
  series.source_kw.reserve(hours);
  series.temp_c.reserve(hours);

  const auto power = [&](const CsvRow& row, std::size_t index, const char* name) {
    const double kw = csv_number(table, row, index, name, 0, kInf);
    if (kw > kMaxPowerKw) {
      throw table.error(row.line, row.fields[index].column, name,
                        limit_message(kMaxPowerKw, printable_input(row.fields[index].text),
                                      " kW (values in W instead of kW?)"));
    }
    return kw;
  };
  std::size_t rows = 0;
  int first_extra_line = 0;
  CsvRow row;
  while (table.next(row)) {
    ++rows;
    if (rows == hours + 1) first_extra_line = row.line;
    series.load_kw.push_back(power(row, *load, "load_kw"));
    series.source_kw.push_back(power(row, *source, "source_kw"));
    if (temp)
      series.temp_c.push_back(csv_number(table, row, *temp, "temp_c", kMinPlausibleTempC,
                                         kMaxPlausibleTempC, kTempRangeHint));
    if (ambient)
      series.ambient_c.push_back(csv_number(table, row, *ambient, "ambient_c", kMinPlausibleTempC,
                                            kMaxPlausibleTempC, kTempRangeHint));
    if (irradiance)
      series.irradiance_w_m2.push_back(csv_number(table, row, *irradiance, "irradiance_w_m2", 0,
                                                  kMaxIrradianceWm2, kIrradianceRangeHint));
    if (time) {
      const CsvField& cell = row.fields[*time];
      const TimeValue t = time_cell(table, row, *time);
      if (!previous_time) {
        // Hour 0 of the format is 1 January 00:00; a series that starts elsewhere would be
        // read a season out of place.
        const bool starts_the_year =
            t.is_date ? t.month == 1 && t.day == 1 && t.clock_hours == 0 : t.hours == 0;
        if (!starts_the_year) {
          throw table.error(row.line, cell.column, "time",
                            "the first row is '" + printable_input(cell.text) +
                                "', but the hourly CSV is one year from 1 January 00:00 (hour "
                                "0): start the file there");
        }
      } else {
        if (t.is_date != previous_time->is_date) {
          throw table.error(row.line, cell.column, "time",
                            "'" + printable_input(cell.text) +
                                "' is not in the form of the previous row's time; give every "
                                "time as hours or every time as a date-time");
        }
        if (!(t.hours > previous_time->hours)) {
          throw table.error(row.line, cell.column, "time",
                            "times must increase from row to row: '" + printable_input(cell.text) +
                                "' is " +
                                (t.hours == previous_time->hours ? "the same as" : "before") +
                                " the previous row's");
        }
        if (!hourly_step(*previous_time, t)) {
          throw table.error(row.line, cell.column, "time",
                            "the rows must be one hour apart, this one is " +
                                duration_text(t.hours - previous_time->hours) +
                                " after the previous row (the hourly CSV holds hourly means)");
        }
      }
      previous_time = t;
    }
    for (const auto& entry : price_index) {
      series.prices[entry.first].push_back(
          csv_number(table, row, entry.second, entry.first, 0, kInf));
    }
  }
  if (rows == hours) return series;

  const std::string expected = "expected exactly " + std::to_string(hours) +
                               " hourly rows, one non-leap year starting 1 January 00:00";
  if (rows > hours) {
    std::string message = "the file has " + std::to_string(rows) + " data rows; " + expected;
    if (rows == hours + 24) {
      message += ": this looks like a leap year, drop the leap day (the 24 rows of 29 February)";
    } else {
      message += "; the rows from here on are too many";
    }
    throw table.error(first_extra_line, 1, "(rows)", message);
  }
  throw table.error(table.last_line(), 1, "(rows)",
                    "the file ends after " + std::to_string(rows) + " data rows; " + expected);
}

HourlySeries read_hourly_csv_file(const std::string& path) {
  std::ifstream in = open_input_or_throw(path, "(file)", kMaxCsvFileBytes);
  return read_hourly_csv(in, path);
}

}  // namespace stowage
