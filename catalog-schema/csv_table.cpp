// SPDX-License-Identifier: MIT
#include "catalog-schema/csv_table.h"

#include <cctype>
#include <cmath>
#include <limits>
#include <locale>
#include <sstream>
#include <utility>

#include "catalog-schema/decimal_text.h"

namespace stowage {
namespace {

bool blank(const std::string& s) {
  for (const char c : s) {
    if (!std::isspace(static_cast<unsigned char>(c))) return false;
  }
  return true;
}

std::string lower(std::string s) {
  for (char& c : s) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return s;
}

// Splits one line; columns are 1-based character positions of the first character of a field.
std::vector<CsvField> split(const std::string& line) {
  std::vector<CsvField> fields;
  std::size_t i = 0;
  while (true) {
    while (i < line.size() && (line[i] == ' ' || line[i] == '\t')) ++i;
    CsvField field;
    field.column = static_cast<int>(i) + 1;
    if (i < line.size() && line[i] == '"') {
      ++i;
      while (i < line.size()) {
        if (line[i] == '"') {
          if (i + 1 < line.size() && line[i + 1] == '"') {
            field.text += '"';
            i += 2;
            continue;
          }
          ++i;
          break;
        }
        field.text += line[i++];
      }
      while (i < line.size() && line[i] != ',') ++i;  // ignore anything after the closing quote
    } else {
      const std::size_t start = i;
      while (i < line.size() && line[i] != ',') ++i;
      std::size_t end = i;
      while (end > start && (line[end - 1] == ' ' || line[end - 1] == '\t')) --end;
      field.text = line.substr(start, end - start);
    }
    fields.push_back(std::move(field));
    if (i >= line.size()) break;
    ++i;  // the comma
  }
  return fields;
}

}  // namespace

CsvTable::CsvTable(std::istream& in, std::string source_name)
    : in_(in), source_(std::move(source_name)) {
  if (!read_line(header_)) {
    throw InputError(source_, line_ > 0 ? line_ : 1, 1, "(header)",
                     "the file has no header line naming the columns");
  }
}

bool CsvTable::read_line(CsvRow& row) {
  std::string text;
  while (std::getline(in_, text)) {
    ++line_;
    if (!text.empty() && text.back() == '\r') text.pop_back();
    if (blank(text)) continue;
    const std::size_t first = text.find_first_not_of(" \t");
    if (text[first] == '#') continue;
    row.line = line_;
    row.fields = split(text);
    return true;
  }
  if (in_.bad()) throw InputError(source_, line_ + 1, 1, "(file)", "read error");
  return false;
}

bool CsvTable::next(CsvRow& row) {
  if (!read_line(row)) return false;
  const std::size_t want = header_.fields.size();
  if (row.fields.size() < want) {
    const std::string& missing = header_.fields[row.fields.size()].text;
    throw error(row.line, row.fields.back().column, missing,
                "missing value: the row has " + std::to_string(row.fields.size()) +
                    " fields, the header names " + std::to_string(want) + " columns");
  }
  if (row.fields.size() > want) {
    throw error(row.line, row.fields[want].column, "(extra field " + std::to_string(want + 1) + ")",
                "the row has " + std::to_string(row.fields.size()) +
                    " fields, the header names only " + std::to_string(want) + " columns");
  }
  return true;
}

InputError CsvTable::error(int line, int column, const std::string& field,
                           const std::string& message) const {
  return InputError(source_, line, column, field, message);
}

CsvNumberStatus parse_csv_number(const std::string& text, double& value) {
  if (text.empty()) return CsvNumberStatus::Empty;
  if (is_decimal_text(text)) {
    value = decimal_value(text);
    return std::isfinite(value) ? CsvNumberStatus::Ok : CsvNumberStatus::NotFinite;
  }
  std::string word = lower(text);
  if (!word.empty() && (word[0] == '+' || word[0] == '-')) word.erase(0, 1);
  if (word == "nan" || word == "inf" || word == "infinity" || word == ".nan" || word == ".inf") {
    value = std::numeric_limits<double>::quiet_NaN();
    return CsvNumberStatus::NotFinite;
  }
  return CsvNumberStatus::NotANumber;
}

double csv_number(const CsvTable& table, const CsvRow& row, std::size_t index,
                  const std::string& field, double min_value, double max_value,
                  const std::string& range_hint) {
  const CsvField& cell = row.fields[index];
  double value = 0;
  switch (parse_csv_number(cell.text, value)) {
    case CsvNumberStatus::Ok:
      break;
    case CsvNumberStatus::Empty:
      throw table.error(row.line, cell.column, field, "missing value");
    case CsvNumberStatus::NotANumber:
      throw table.error(row.line, cell.column, field,
                        "not a number: '" + cell.text + "' (use '.' as the decimal point)");
    case CsvNumberStatus::NotFinite:
      throw table.error(row.line, cell.column, field,
                        "must be a finite number, found '" + cell.text + "'");
  }
  if (value < min_value || value > max_value) {
    std::string range;
    if (max_value == std::numeric_limits<double>::infinity()) {
      range = "must be >= " + number_text(min_value);
    } else {
      range = "must be within [" + number_text(min_value) + ", " + number_text(max_value) + "]";
    }
    throw table.error(row.line, cell.column, field,
                      range + ", found " + cell.text + (range_hint.empty() ? "" : range_hint));
  }
  return value;
}

}  // namespace stowage
