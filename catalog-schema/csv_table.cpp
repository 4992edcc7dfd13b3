// SPDX-License-Identifier: MIT
#include "catalog-schema/csv_table.h"

#include <cctype>
#include <cmath>
#include <limits>
#include <locale>
#include <sstream>
#include <utility>

#include "catalog-schema/decimal_text.h"
#include "catalog-schema/input_file.h"
#include "catalog-schema/input_limits.h"

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

// A spreadsheet saved with a decimal comma gives "0,5": say so rather than "not a number".
std::string decimal_comma_hint(const std::string& text) {
  std::string dotted = text;
  for (char& c : dotted) c = c == ',' ? '.' : c;
  if (dotted != text && is_decimal_text(dotted)) {
    return " (a decimal comma: write " + dotted +
           "; stowage reads '.' as the decimal point, as spreadsheets save CSV in an English "
           "locale)";
  }
  return " (use '.' as the decimal point)";
}

// Two neighbouring fields that are both plain digits, as "0,62" splits into "0" and "62".
bool looks_like_decimal_comma(const std::vector<CsvField>& fields) {
  const auto digits = [](const std::string& s) {
    if (s.empty()) return false;
    std::size_t i = s[0] == '-' || s[0] == '+' ? 1 : 0;
    if (i == s.size()) return false;
    for (; i < s.size(); ++i) {
      if (s[i] < '0' || s[i] > '9') return false;
    }
    return true;
  };
  for (std::size_t i = 1; i < fields.size(); ++i) {
    if (digits(fields[i - 1].text) && digits(fields[i].text)) return true;
  }
  return false;
}

}  // namespace

CsvTable::CsvTable(std::istream& in, std::string source_name)
    : in_(in), source_(std::move(source_name)) {
  if (!read_line(header_)) {
    throw InputError(source_, line_ > 0 ? line_ : 1, 1, "(header)",
                     "the file has no header line naming the columns");
  }
  if (header_.fields.size() > kMaxCsvColumns) {
    throw error(header_.line, header_.fields[kMaxCsvColumns].column, "(header)",
                "the header names " + std::to_string(header_.fields.size()) +
                    " columns, more than the plausibility limit of " +
                    std::to_string(kMaxCsvColumns) + " (see docs/input-format.md)");
  }
  if (header_.fields.size() == 1 && header_.fields[0].text.find(';') != std::string::npos) {
    throw error(header_.line, 1, "(header)",
                "the columns are separated by ';', as a spreadsheet saves CSV in a locale with "
                "a decimal comma; stowage reads ',' between fields and '.' as the decimal "
                "point: save the file as CSV with those, or replace ';' by ',' and decimal "
                "commas by points");
  }
}

bool CsvTable::get_line(std::string& text) {
  text.clear();
  std::streambuf* buffer = in_.rdbuf();
  if (buffer == nullptr || !in_.good()) return false;
  bool any = false;
  while (true) {
    const int c = buffer->sbumpc();
    if (c == std::char_traits<char>::eof()) {
      in_.setstate(std::ios::eofbit);
      break;
    }
    any = true;
    if (++bytes_ > kMaxCsvFileBytes) {
      throw error(
          line_ + 1, 1, "(file)",
          "the file is larger than the " + size_text(kMaxCsvFileBytes) + " a CSV input may have");
    }
    if (c == '\n') break;
    if (text.size() >= kMaxCsvLineBytes) {
      throw error(line_ + 1, 1, "(line)",
                  "the line is longer than " + size_text(kMaxCsvLineBytes) +
                      " (a plausibility limit, see docs/input-format.md); is this a CSV file?");
    }
    text += static_cast<char>(c);
  }
  return any;
}

bool CsvTable::read_line(CsvRow& row) {
  std::string text;
  while (get_line(text)) {
    ++line_;
    if (line_ == 1) {
      if (text.compare(0, 2, "\xff\xfe") == 0 || text.compare(0, 2, "\xfe\xff") == 0) {
        throw error(1, 1, "(file)",
                    "the file is UTF-16 (it starts with a UTF-16 byte-order mark); save it as "
                    "UTF-8 CSV");
      }
      // The UTF-8 byte-order mark some spreadsheets write first.
      if (text.compare(0, 3, "\xef\xbb\xbf") == 0) text.erase(0, 3);
    }
    if (!text.empty() && text.back() == '\r') text.pop_back();
    if (const std::size_t bad = invalid_utf8_at(text); bad != std::string::npos) {
      int column = 1;
      for (std::size_t i = 0; i < bad; ++i) column += (text[i] & 0xC0) != 0x80;
      throw error(line_, column, utf8_field(text, bad),
                  "the line is not valid UTF-8 here (byte " + escape_controls(text.substr(bad, 1)) +
                      "); save the file as UTF-8");
    }
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

// The column a byte offset of a line falls into, named by the header once it has been read.
std::string CsvTable::utf8_field(const std::string& text, std::size_t offset) const {
  const std::size_t first = text.find_first_not_of(" \t");
  if (first != std::string::npos && text[first] == '#') return "(comment)";
  if (header_.fields.empty()) return "(header)";
  std::size_t index = 0;
  bool quoted = false;
  for (std::size_t i = 0; i < offset; ++i) {
    if (text[i] == '"') quoted = !quoted;
    if (text[i] == ',' && !quoted) ++index;
  }
  if (index < header_.fields.size()) return printable_input(header_.fields[index].text);
  return "(extra field " + std::to_string(index + 1) + ")";
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
                    " fields, the header names only " + std::to_string(want) + " columns" +
                    (looks_like_decimal_comma(row.fields)
                         ? "; the values look written with a decimal comma (0,62 for 0.62), "
                           "which splits each of them in two: write the decimal point '.'"
                         : ""));
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
      throw table.error(
          row.line, cell.column, field,
          "not a number: '" + printable_input(cell.text) + "'" + decimal_comma_hint(cell.text));
    case CsvNumberStatus::NotFinite:
      throw table.error(row.line, cell.column, field,
                        "must be a finite number, found '" + printable_input(cell.text) + "'");
  }
  if (value < min_value || value > max_value) {
    std::string range;
    if (max_value == std::numeric_limits<double>::infinity()) {
      range = "must be >= " + number_text(min_value);
    } else {
      range = "must be within [" + number_text(min_value) + ", " + number_text(max_value) + "]";
    }
    throw table.error(row.line, cell.column, field,
                      range + ", found " + printable_input(cell.text) + range_hint);
  }
  return value;
}

}  // namespace stowage
