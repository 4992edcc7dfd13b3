// SPDX-License-Identifier: MIT
#include "catalog-schema/soc_series.h"

#include <limits>
#include <optional>
#include <regex>

#include "catalog-schema/csv_table.h"
#include "catalog-schema/decimal_text.h"
#include "catalog-schema/input_error.h"
#include "catalog-schema/input_file.h"
#include "catalog-schema/input_limits.h"
#include "catalog-schema/schema_validator.h"

namespace stowage {
namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();

std::string column_problem(const std::string& name) {
  static const std::regex soc_like("(soc|state_of_charge|charge)_?([A-Za-z%]*)");
  static const std::regex temperature("(temp|temperature)_([A-Za-z0-9]+)");
  if (name.size() > kMaxPatternText) {
    return "unknown column (a name of " + std::to_string(name.size()) + " characters)";
  }
  std::smatch m;
  if (std::regex_match(name, m, temperature)) {
    return "expected degrees Celsius: name it temp_c and give the values in degrees Celsius";
  }
  if (std::regex_match(name, m, soc_like)) {
    return "expected a fraction or percent: name it soc (values 0 to 1) or soc_pct (values 0 to "
           "100)";
  }
  std::string message =
      "unknown column; the columns are soc or soc_pct, and optionally temp_c "
      "and time";
  const std::string hint = closest_match(name, {"soc", "soc_pct", "temp_c", "time"});
  if (!hint.empty()) message += " (did you mean '" + hint + "'?)";
  return message;
}

}  // namespace

SocSeries read_soc_series(std::istream& in, const std::string& source_name) {
  CsvTable table(in, source_name);
  const CsvRow& header = table.header();
  std::optional<std::size_t> soc, pct, temp;
  for (std::size_t i = 0; i < header.fields.size(); ++i) {
    const CsvField& field = header.fields[i];
    const std::string& name = field.text;
    std::optional<std::size_t>* slot = nullptr;
    if (name == "soc") slot = &soc;
    if (name == "soc_pct") slot = &pct;
    if (name == "temp_c") slot = &temp;
    if (name == "time") continue;
    if (slot == nullptr) {
      throw table.error(header.line, field.column,
                        name.empty() ? "(column " + std::to_string(i + 1) + ")" : name,
                        name.empty() ? "empty column name" : column_problem(name));
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

  SocSeries series;
  CsvRow row;
  while (table.next(row)) {
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
  }
  if (series.soc_fraction.size() < 2) {
    throw table.error(table.last_line(), 1, soc ? "soc" : "soc_pct",
                      "needs at least 2 rows to show any cycling, found " +
                          std::to_string(series.soc_fraction.size()));
  }
  return series;
}

SocSeries read_soc_series_file(const std::string& path) {
  std::ifstream in = open_input_or_throw(path, "(file)", kMaxCsvFileBytes);
  return read_soc_series(in, path);
}

}  // namespace stowage
