// SPDX-License-Identifier: MIT
#include "catalog-schema/time_column.h"

#include <cmath>

#include "catalog-schema/decimal_text.h"
#include "catalog-schema/input_error.h"

namespace stowage {
namespace {

bool digits(const std::string& s, std::size_t at, std::size_t n, int& value) {
  if (at + n > s.size()) return false;
  value = 0;
  for (std::size_t i = at; i < at + n; ++i) {
    if (s[i] < '0' || s[i] > '9') return false;
    value = value * 10 + (s[i] - '0');
  }
  return true;
}

bool leap(int y) { return (y % 4 == 0 && y % 100 != 0) || y % 400 == 0; }

int days_in_month(int y, int m) {
  static const int days[] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
  return m == 2 && leap(y) ? 29 : days[m - 1];
}

// Days from 1970-01-01 to y-m-d in the proleptic Gregorian calendar (the era-based algorithm
// of H. Hinnant, "chrono-Compatible Low-Level Date Algorithms", days_from_civil).
long days_from_civil(int y, int m, int d) {
  y -= m <= 2;
  const long era = (y >= 0 ? y : y - 399) / 400;
  const long yoe = y - era * 400;
  const long doy = (153 * (m + (m > 2 ? -3 : 9)) + 2) / 5 + d - 1;
  const long doe = yoe * 365 + yoe / 4 - yoe / 100 + doy;
  return era * 146097 + doe - 719468;
}

const char* const kMonths[] = {"January",   "February", "March",    "April",
                               "May",       "June",     "July",     "August",
                               "September", "October",  "November", "December"};

std::optional<TimeValue> parse_date_time(const std::string& s, std::string& problem) {
  int y = 0, mo = 0, d = 0;
  if (!(digits(s, 0, 4, y) && s.size() >= 10 && s[4] == '-' && digits(s, 5, 2, mo) && s[7] == '-' &&
        digits(s, 8, 2, d))) {
    return std::nullopt;
  }
  if (mo < 1 || mo > 12) {
    problem = "month " + std::to_string(mo) + " does not exist";
    return std::nullopt;
  }
  if (d < 1 || d > days_in_month(y, mo)) {
    problem =
        std::string(kMonths[mo - 1]) + " " + std::to_string(y) + " has no day " + std::to_string(d);
    return std::nullopt;
  }
  int h = 0, mi = 0;
  double sec = 0;
  double offset_hours = 0;
  std::size_t i = 10;
  if (i < s.size()) {
    if (s[i] != 'T' && s[i] != ' ') return std::nullopt;
    if (!(digits(s, i + 1, 2, h) && i + 3 < s.size() && s[i + 3] == ':' &&
          digits(s, i + 4, 2, mi))) {
      return std::nullopt;
    }
    i += 6;
    if (i < s.size() && s[i] == ':') {
      int whole = 0;
      if (!digits(s, i + 1, 2, whole)) return std::nullopt;
      sec = whole;
      i += 3;
      if (i < s.size() && (s[i] == '.' || s[i] == ',')) {
        std::size_t j = i + 1;
        double scale = 0.1;
        while (j < s.size() && s[j] >= '0' && s[j] <= '9') {
          sec += (s[j] - '0') * scale;
          scale /= 10;
          ++j;
        }
        if (j == i + 1) return std::nullopt;
        i = j;
      }
    }
    if (h > 23 || mi > 59 || sec >= 60) {
      problem = "the time of day " + s.substr(11, i - 11) + " does not exist";
      return std::nullopt;
    }
    if (i < s.size() && s[i] == 'Z') {
      ++i;
    } else if (i < s.size() && (s[i] == '+' || s[i] == '-')) {
      int oh = 0, om = 0;
      const int sign = s[i] == '-' ? -1 : 1;
      if (!digits(s, i + 1, 2, oh)) return std::nullopt;
      std::size_t j = i + 3;
      if (j < s.size() && s[j] == ':') ++j;
      if (j < s.size() && !digits(s, j, 2, om)) return std::nullopt;
      if (j < s.size()) j += 2;
      if (oh > 14 || om > 59) return std::nullopt;
      offset_hours = sign * (oh + om / 60.0);
      i = j;
    }
    if (i != s.size()) return std::nullopt;
  }
  TimeValue t;
  t.is_date = true;
  t.month = mo;
  t.day = d;
  t.clock_hours = h + mi / 60.0 + sec / 3600.0;
  t.hours = static_cast<double>(days_from_civil(y, mo, d)) * 24.0 + h + mi / 60.0 + sec / 3600.0 -
            offset_hours;
  return t;
}

}  // namespace

std::optional<TimeValue> parse_time(const std::string& text, std::string& problem) {
  problem.clear();
  if (is_decimal_text(text)) {
    const double hours = decimal_value(text);
    if (!std::isfinite(hours)) {
      problem = "hours out of range";
      return std::nullopt;
    }
    TimeValue t;
    t.hours = hours;
    return t;
  }
  std::optional<TimeValue> t = parse_date_time(text, problem);
  if (!t && problem.empty()) {
    problem =
        "not a time: give hours (0, 0.25, ...) or an ISO 8601 date-time such as "
        "2026-03-01T00:15 or 2026-03-01 00:15:00";
  }
  return t;
}

std::string duration_text(double hours) {
  const double seconds = hours * 3600.0;
  if (std::fabs(seconds) < 60) return number_text(seconds) + " s";
  if (std::fabs(seconds) < 3600) return number_text(seconds / 60.0) + " min";
  return number_text(hours) + " h";
}

TimeValue time_cell(const CsvTable& table, const CsvRow& row, std::size_t column) {
  const CsvField& cell = row.fields[column];
  std::string problem;
  const std::optional<TimeValue> t = parse_time(cell.text, problem);
  if (!t) {
    throw table.error(row.line, cell.column, "time",
                      "'" + printable_input(cell.text) + "': " + problem);
  }
  return *t;
}

}  // namespace stowage
