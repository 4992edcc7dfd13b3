// SPDX-License-Identifier: MIT
// The hourly CSV of a site: columns by name with the unit in the name, 8760 rows, finite
// values; errors point at the physical line and name the column.
#include "catalog-schema/hourly_csv.h"

#include <catch2/catch.hpp>
#include <sstream>

#include "catalog_test_support.h"

namespace stowage {
namespace {

using testing::expect_input_error;
using testing::fixture_path;

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
  CHECK_THAT(csv_error(make_csv("load_kw,source_kw,temp_c,wind", 8760, "1,0,20,3"), 2, "wind"),
             Catch::Contains("unknown column"));
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
