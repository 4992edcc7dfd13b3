// SPDX-License-Identifier: MIT
// The hourly CSV of a site: columns by name with the unit in the name, 8760 rows, finite
// values; errors point at the physical line and name the column.
#include "catalog-schema/hourly_csv.h"

#include <catch2/catch.hpp>
#include <cstdio>
#include <sstream>

#include "catalog-schema/input_limits.h"
#include "catalog_test_support.h"

namespace stowage {
namespace {

using testing::expect_input_error;
using testing::fixture_path;
using testing::replace_once;

const char* const kName = "hourly.csv";

// A CSV with `header`, then `rows` copies of `row`; `first_rows` replace the first rows.
std::string make_csv(const std::string& header, int rows, const std::string& row,
                     const std::vector<std::string>& first_rows = {}) {
  std::string text = "# test data\n" + header + "\n";
  for (int i = 0; i < rows; ++i) {
    text +=
        (static_cast<std::size_t>(i) < first_rows.size() ? first_rows[static_cast<std::size_t>(i)]
                                                         : row) +
        "\n";
  }
  return text;
}

HourlySeries read_text(const std::string& text) {
  std::istringstream in(text);
  return read_hourly_csv(in, kName);
}

std::string csv_error(const std::string& text, int line, const std::string& field) {
  return expect_input_error([&] { read_text(text); }, kName, line, field).message();
}

TEST_CASE("the fixture year reads into 8760 hourly values", "[catalog][csv]") {
  const HourlySeries s = read_hourly_csv_file(fixture_path("hourly.csv"));
  REQUIRE(s.load_kw.size() == 8760);
  REQUIRE(s.source_kw.size() == 8760);
  REQUIRE(s.temp_c.size() == 8760);
  CHECK(s.prices.empty());
  // Values from the formulas in the fixture's header comment.
  CHECK(s.load_kw[0] == 0.6);
  CHECK(s.load_kw[18] == 1.5);
  CHECK(s.source_kw[12] == 3);
  CHECK(s.source_kw[9] == 2.12);  // 3 sin(pi/4) = 2.1213, rounded to 2 decimals
  CHECK(s.temp_c[0] == -2);
}

TEST_CASE("columns may come in any order, with hour, comments, CRLF and a price column",
          "[catalog][csv]") {
  std::string text = "# comment\r\nhour,temp_c,price_per_kwh,source_kw,load_kw\r\n";
  for (int h = 0; h < 8760; ++h) {
    if (h == 5) text += "  # a comment between rows\r\n\r\n";
    text += std::to_string(h) + ",-3.5,0.25," + (h == 1 ? "1e-1" : "0") + ", 2 \r\n";
  }
  const HourlySeries s = read_text(text);
  REQUIRE(s.load_kw.size() == 8760);
  CHECK(s.load_kw[7] == 2);
  CHECK(s.source_kw[1] == 0.1);
  CHECK(s.temp_c[8759] == -3.5);
  REQUIRE(s.prices.count("price_per_kwh"));
  CHECK(s.prices.at("price_per_kwh")[100] == 0.25);
}

TEST_CASE("a leap year is refused with the leap-day hint", "[catalog][csv][bad]") {
  const std::string text = make_csv("load_kw,source_kw,temp_c", 8784, "1,0,20");
  // Comment on line 1, header on line 2, rows from line 3: row 8761 is on line 8763.
  const std::string message = csv_error(text, 8763, "(rows)");
  CHECK_THAT(message, Catch::Contains("8784 data rows"));
  CHECK_THAT(message, Catch::Contains("leap day"));
}

TEST_CASE("too few rows are refused at the last line", "[catalog][csv][bad]") {
  const std::string text = make_csv("load_kw,source_kw,temp_c", 8759, "1,0,20");
  CHECK_THAT(csv_error(text, 8761, "(rows)"), Catch::Contains("ends after 8759 data rows"));
  CHECK_THAT(csv_error(make_csv("load_kw,source_kw,temp_c", 0, ""), 2, "(rows)"),
             Catch::Contains("ends after 0 data rows"));
}

TEST_CASE("non-finite and non-numeric values are refused", "[catalog][csv][bad]") {
  const std::string nan =
      make_csv("load_kw,source_kw,temp_c", 8760, "1,0,20", {"1,0,20", "NaN,0,20"});
  CHECK_THAT(csv_error(nan, 4, "load_kw"), Catch::Contains("finite number, found 'NaN'"));
  const std::string inf = make_csv("load_kw,source_kw,temp_c", 8760, "1,0,20", {"1,0,-inf"});
  CHECK_THAT(csv_error(inf, 3, "temp_c"), Catch::Contains("finite"));
  const std::string word = make_csv("load_kw,source_kw,temp_c", 8760, "1,0,20", {"1,none,20"});
  CHECK_THAT(csv_error(word, 3, "source_kw"), Catch::Contains("not a number: 'none'"));
  const std::string comma = make_csv("load_kw,source_kw,temp_c", 8760, "1,0,20", {"1,0,\"20,5\""});
  CHECK_THAT(csv_error(comma, 3, "temp_c"), Catch::Contains("decimal point"));
  const std::string empty = make_csv("load_kw,source_kw,temp_c", 8760, "1,0,20", {"1,,20"});
  CHECK_THAT(csv_error(empty, 3, "source_kw"), Catch::Contains("missing value"));
}

TEST_CASE("negative power and rows of the wrong width are refused", "[catalog][csv][bad]") {
  const std::string negative = make_csv("load_kw,source_kw,temp_c", 8760, "1,0,20", {"1,-0.5,20"});
  CHECK_THAT(csv_error(negative, 3, "source_kw"), Catch::Contains("must be >= 0, found -0.5"));
  const std::string shorter = make_csv("load_kw,source_kw,temp_c", 8760, "1,0,20", {"1,0"});
  CHECK_THAT(csv_error(shorter, 3, "temp_c"), Catch::Contains("the row has 2 fields"));
  const std::string longer = make_csv("load_kw,source_kw,temp_c", 8760, "1,0,20", {"1,0,20,4"});
  CHECK_THAT(csv_error(longer, 3, "(extra field 4)"), Catch::Contains("only 3 columns"));
}

TEST_CASE("a column in the wrong unit names the expected unit and name", "[catalog][csv][bad]") {
  const auto header_error = [](const std::string& header, const std::string& field) {
    return csv_error(make_csv(header, 8760, "1,0,20"), 2, field);
  };
  CHECK(header_error("load_w,source_kw,temp_c", "load_w") ==
        "expected kW: name it load_kw and give the values in kilowatts");
  CHECK_THAT(header_error("load_kw,source_mw,temp_c", "source_mw"),
             Catch::Contains("expected kW: name it source_kw"));
  CHECK_THAT(header_error("load_kw,source_kw,temp_f", "temp_f"),
             Catch::Contains("expected degrees Celsius: name it temp_c"));
  CHECK_THAT(header_error("load_kw,source_kw,temp_k", "temp_k"), Catch::Contains("name it temp_c"));
  CHECK_THAT(csv_error(make_csv("load_kw,source_kw,temp_c,price_per_mwh", 8760, "1,0,20,5"), 2,
                       "price_per_mwh"),
             Catch::Contains("name it price_per_kwh"));
  CHECK_THAT(header_error("load_kW,source_kw,temp_c", "load_kW"),
             Catch::Contains("lower case: name it load_kw"));
}

TEST_CASE("unknown, duplicate and missing columns are refused", "[catalog][csv][bad]") {
  CHECK_THAT(csv_error(make_csv("laod_kw,source_kw,temp_c", 8760, "1,0,20"), 2, "laod_kw"),
             Catch::Contains("did you mean 'load_kw'?"));
  CHECK_THAT(csv_error(make_csv("load_kw,source_kw,temp_c,tmep_c", 8760, "1,0,20,3"), 2, "tmep_c"),
             Catch::Contains("did you mean 'temp_c'?"));
  CHECK_THAT(csv_error(make_csv("load_kw,source_kw,load_kw", 8760, "1,0,20"), 2, "load_kw"),
             Catch::Contains("appears twice"));
  CHECK_THAT(csv_error(make_csv("load_kw,source_kw", 8760, "1,0"), 2, "temp_c"),
             Catch::Contains("no column temp_c"));
  CHECK_THAT(csv_error("# only a comment\n\n", 2, "(header)"), Catch::Contains("no header"));
}

TEST_CASE("an unreadable hourly CSV is an InputError", "[catalog][csv][bad]") {
  const std::string missing = fixture_path("no-such.csv");
  expect_input_error([&] { read_hourly_csv_file(missing); }, missing, 1, "(file)");
}

}  // namespace
}  // namespace stowage

namespace stowage {
namespace {

// An hourly CSV of one year with a time column of ISO 8601 date-times starting at `year`-01-01;
// the 29 February of a leap year is left out, as the format asks.
std::string dated_csv(int year, const std::string& extra_header = "",
                      const std::string& extra_value = "") {
  static const int days[] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
  std::string text = "time,load_kw,source_kw,temp_c" + extra_header + "\n";
  char stamp[32];
  for (int m = 1; m <= 12; ++m) {
    for (int d = 1; d <= days[m - 1]; ++d) {
      for (int h = 0; h < 24; ++h) {
        std::snprintf(stamp, sizeof stamp, "%04d-%02d-%02dT%02d:00", year, m, d, h);
        text += std::string(stamp) + ",1,0,20" + extra_value + "\n";
      }
    }
  }
  return text;
}

TEST_CASE("a file saved by a spreadsheet reads: byte-order mark, CRLF, time, extra columns",
          "[catalog][csv][spreadsheet]") {
  std::string text = "\xef\xbb\xbf" + dated_csv(2026, ",logger_status", ",0");
  std::string crlf;
  for (const char c : text) crlf += c == '\n' ? std::string("\r\n") : std::string(1, c);
  const HourlySeries s = read_text(crlf);
  CHECK(s.load_kw.size() == 8760);
  REQUIRE(s.notes.size() == 1);
  CHECK(s.notes[0].field == "logger_status");
  CHECK(s.notes[0].line == 1);
  CHECK(s.notes[0].message.find("ignored") != std::string::npos);
  // A leap year with its 29 February dropped: the 25 h step over it is accepted.
  CHECK(read_text(dated_csv(2028)).load_kw.size() == 8760);
  // Hours as numbers from 0.
  std::string hours = "time,load_kw,source_kw,temp_c\n";
  for (int h = 0; h < 8760; ++h) hours += std::to_string(h) + ",1,0,20\n";
  CHECK(read_text(hours).load_kw.size() == 8760);
  // Another year, every time with an offset: the clock reads 1 January 00:00.
  std::string offset = dated_csv(2031);
  for (std::size_t at = offset.find(",1,0,20"); at != std::string::npos;
       at = offset.find(",1,0,20", at + 13)) {
    offset.insert(at, "+02:00");
  }
  REQUIRE(offset.find("2031-12-31T23:00+02:00,1,0,20") != std::string::npos);
  CHECK(read_text(offset).load_kw.size() == 8760);
}

TEST_CASE("a time column that is not hourly and increasing is refused at its row",
          "[catalog][csv][spreadsheet][bad]") {
  std::string quarter = "time,load_kw,source_kw,temp_c\n";
  for (int i = 0; i < 8760; ++i) quarter += std::to_string(i * 0.25) + ",1,0,20\n";
  CHECK_THAT(csv_error(quarter, 3, "time"), Catch::Contains("one hour apart, this one is 15 min"));
  const std::string back = replace_once(dated_csv(2026), "2026-01-01T02:00", "2026-01-01T00:30");
  CHECK_THAT(csv_error(back, 4, "time"), Catch::Contains("before the previous row"));
  const std::string gap = replace_once(dated_csv(2026), "2026-01-01T05:00", "2026-01-01T04:59");
  CHECK_THAT(csv_error(gap, 7, "time"), Catch::Contains("59 min"));
  // A year that starts on 1 June would be read a season out of place.
  std::string june = "time,load_kw,source_kw,temp_c\n";
  for (int h = 0; h < 8760; ++h) june += std::to_string(h + 3624) + ",1,0,20\n";
  CHECK_THAT(csv_error(june, 2, "time"), Catch::Contains("from 1 January 00:00"));
  CHECK_THAT(
      csv_error(replace_once(dated_csv(2026), "2026-01-01T00:00", "2026-01-01T01:00"), 2, "time"),
      Catch::Contains("start the file there"));
  CHECK_THAT(csv_error(replace_once(dated_csv(2026), "2026-01-01T05:00", "5 o'clock"), 7, "time"),
             Catch::Contains("not a time"));
}

TEST_CASE("semicolons and decimal commas are named as such", "[catalog][csv][spreadsheet][bad]") {
  const std::string semicolon = make_csv("load_kw;source_kw;temp_c", 8760, "1;0;20");
  CHECK_THAT(csv_error(semicolon, 2, "(header)"),
             Catch::Contains("separated by ';'") && Catch::Contains("decimal comma"));
  const std::string split = make_csv("load_kw,source_kw,temp_c", 8760, "1,0,20", {"0,62,0,20"});
  CHECK_THAT(csv_error(split, 3, "(extra field 4)"), Catch::Contains("decimal comma (0,62"));
  const std::string quoted =
      make_csv("load_kw,source_kw,temp_c", 8760, "1,0,20", {"\"0,62\",0,20"});
  CHECK_THAT(csv_error(quoted, 3, "load_kw"), Catch::Contains("a decimal comma: write 0.62"));
}

TEST_CASE("bytes that are not UTF-8 and overlong lines are refused at their line",
          "[catalog][csv][bad]") {
  const std::string latin1 = make_csv("load_kw,source_kw,temp_c", 8760, "1,0,20", {"1,0,2\xb0"});
  const InputError e = expect_input_error([&] { read_text(latin1); }, kName, 3, "temp_c");
  CHECK(e.column() == 6);
  CHECK_THAT(e.message(), Catch::Contains("not valid UTF-8"));
  CHECK_THAT(csv_error("# caf\xe9\nload_kw,source_kw,temp_c\n", 1, "(comment)"),
             Catch::Contains("UTF-8"));
  CHECK_THAT(csv_error(std::string("\xff\xfel\0o\0", 6), 1, "(file)"), Catch::Contains("UTF-16"));
  const std::string wide = "load_kw,source_kw,temp_c\n" + std::string(kMaxCsvLineBytes + 1, '1');
  CHECK_THAT(csv_error(wide, 2, "(line)"), Catch::Contains("longer than 64 KiB"));
}

TEST_CASE("load and source power beyond the plausibility limit are refused",
          "[catalog][csv][bad]") {
  const std::string huge = make_csv("load_kw,source_kw,temp_c", 8760, "1,0,20", {"1e300,0,20"});
  CHECK_THAT(csv_error(huge, 3, "load_kw"), Catch::Contains("at most 100000"));
  const std::string watts = make_csv("load_kw,source_kw,temp_c", 8760, "1,0,20", {"1,250000,20"});
  CHECK_THAT(csv_error(watts, 3, "source_kw"), Catch::Contains("W instead of kW"));
}

TEST_CASE("control characters in a CSV field are escaped in the message", "[catalog][csv][bad]") {
  const std::string bell = make_csv("load_kw,source_kw,temp_c", 8760, "1,0,20", {"1\x1b[2J,0,20"});
  const InputError e = expect_input_error([&] { read_text(bell); }, kName, 3, "load_kw");
  CHECK(std::string(e.what()).find('\x1b') == std::string::npos);
  CHECK_THAT(e.what(), Catch::Contains("1\\x1b[2J"));
}

}  // namespace
}  // namespace stowage
