// SPDX-License-Identifier: MIT
// CsvTable: a line-by-line reader for the small CSV dialect of stowage's data files, shared by
// the hourly site data and the logged SOC series.
//
// Dialect: comma-separated; a line whose first non-blank character is '#' is a comment; blank
// lines are skipped; the first other line is the header of column names; a field may be quoted
// with double quotes (a doubled quote inside stands for one); spaces around a field are
// dropped; CRLF line ends and a UTF-8 byte-order mark (as spreadsheets save CSV) are
// accepted. Lines are counted physically (1-based, comments included) so every error points at
// the line an editor shows. A row must have as many fields as the header. Every line must be
// UTF-8 (a UTF-16 file is named as such); a header separated by ';' is refused with the hint
// that the file was saved in a decimal-comma locale, and so is a row split by decimal commas.
// Lines are at most kMaxCsvLineBytes and the file kMaxCsvFileBytes (input_limits.h).
// Numbers are decimal with '.' as the point (1, -2.5, 3e-2); nan/inf in any spelling are
// recognised so that the message can say "not finite" rather than "not a number".
#pragma once

#include <cstdint>
#include <istream>
#include <optional>
#include <string>
#include <vector>

#include "catalog-schema/input_error.h"

namespace stowage {

struct CsvField {
  std::string text;
  int column = 1;  // 1-based character column where the field starts
};

struct CsvRow {
  int line = 0;  // 1-based physical line
  std::vector<CsvField> fields;
};

class CsvTable {
 public:
  // Reads up to and including the header line. Throws InputError when the stream has no header.
  CsvTable(std::istream& in, std::string source_name);

  const std::string& source() const { return source_; }
  const CsvRow& header() const { return header_; }
  // The next data row, or false at the end. Throws InputError for a row whose field count
  // differs from the header's, naming the first missing or the extra field.
  bool next(CsvRow& row);
  // The line of the last line read (the header's before any row); for "too few rows" errors.
  int last_line() const { return line_; }

  InputError error(int line, int column, const std::string& field,
                   const std::string& message) const;

 private:
  bool read_line(CsvRow& row);       // next non-comment, non-blank line split into fields
  bool get_line(std::string& text);  // std::getline bounded by the line and file limits
  std::string utf8_field(const std::string& text, std::size_t offset) const;
  std::istream& in_;
  std::string source_;
  CsvRow header_;
  int line_ = 0;
  std::uintmax_t bytes_ = 0;
};

enum class CsvNumberStatus { Ok, Empty, NotANumber, NotFinite };

// Parses a field as a decimal number; the status says what is wrong otherwise.
CsvNumberStatus parse_csv_number(const std::string& text, double& value);

// Reads a numeric field and throws InputError (naming `field`, the column name) unless it is a
// finite number within [min_value, max_value]; `range_hint` is added to a range failure.
// Battery-space temperatures outside this range are taken for a unit or data mistake (a
// kelvin or Fahrenheit column, a logger's error code): no battery operates there.
constexpr double kMinPlausibleTempC = -60.0;
constexpr double kMaxPlausibleTempC = 90.0;
constexpr const char* kTempRangeHint =
    " (a battery-space temperature in degrees Celsius; kelvin or Fahrenheit values?)";

// Irradiance above this is taken for a unit mistake (the solar constant is 1361 W/m2).
constexpr double kMaxIrradianceWm2 = 1500.0;
constexpr const char* kIrradianceRangeHint = " W/m2 (values in kW/m2 or Wh per day instead?)";

double csv_number(const CsvTable& table, const CsvRow& row, std::size_t index,
                  const std::string& field, double min_value, double max_value,
                  const std::string& range_hint = "");

}  // namespace stowage
