// SPDX-License-Identifier: MIT
// Input files that are not what they seem: FIFOs, devices, files too large, YAML nested without
// end, bytes that are not UTF-8. Each is refused with an InputError naming the file, line and
// field before it can block, read without end or reach a report.
#include <sys/stat.h>

#include <catch2/catch.hpp>
#include <sstream>

#include "catalog-schema/input_error.h"
#include "catalog-schema/input_limits.h"
#include "catalog-schema/profile_loader.h"
#include "catalog-schema/site_loader.h"
#include "catalog-schema/study_loader.h"
#include "catalog-schema/yaml_document.h"
#include "catalog_test_support.h"

namespace stowage {
namespace {

using testing::expect_input_error;
using testing::TempDir;

TEST_CASE("a FIFO named as an input is refused without opening it", "[catalog][files]") {
  TempDir dir;
  const std::string fifo = dir.path() + "/study.yaml";
  REQUIRE(::mkfifo(fifo.c_str(), 0600) == 0);
  // Opening a FIFO for reading blocks until a writer appears: reaching the check at all
  // shows that the loader did not open it.
  const InputError e = expect_input_error([&] { load_study_file(fifo); }, fifo, 1, "study");
  CHECK(e.message().find("FIFO") != std::string::npos);
}

TEST_CASE("a device named as the hourly CSV is refused at site.hourly", "[catalog][files]") {
  TempDir dir;
  std::string site = testing::read_text(testing::fixture_path("site.yaml"));
  site = testing::replace_once(site, "hourly: hourly.csv", "hourly: /dev/zero");
  const std::string path = dir.write("site.yaml", site);
  const InputError e = expect_input_error([&] { load_site_file(path); }, path,
                                          testing::line_of(site, "hourly:"), "site.hourly");
  CHECK(e.message().find("character device") != std::string::npos);
}

TEST_CASE("a YAML file over the size limit is refused before it is parsed", "[catalog][files]") {
  TempDir dir;
  const std::string path = dir.write(
      "big.yaml", "profile:\n  description: " +
                      std::string(static_cast<std::size_t>(kMaxYamlFileBytes), 'a') + "\n");
  const InputError e = expect_input_error([&] { load_profile_file(path); }, path, 1, "profile");
  CHECK(e.message().find("256 KiB") != std::string::npos);
  // The same through a stream, which has no size to look up.
  std::istringstream in(testing::read_text(path));
  expect_input_error([&] { parse_yaml(in, "s.yaml"); }, "s.yaml", 1, "(top level)");
}

TEST_CASE("YAML nested deeper than the limit is refused at the line that passes it",
          "[catalog][files]") {
  const int depth = kMaxYamlNestingDepth + 5;
  std::istringstream flow("study:\n  title: x\n  profiles: " + std::string(depth, '[') +
                          std::string(depth, ']') + "\n");
  expect_input_error([&] { parse_yaml(flow, "f.yaml"); }, "f.yaml", 3, "study.profiles");
  std::string dashes = "study:\n  designs:\n    ";
  for (int i = 0; i < depth; ++i) dashes += "- ";
  dashes += "x\n";
  std::istringstream block(dashes);
  expect_input_error([&] { parse_yaml(block, "b.yaml"); }, "b.yaml", 3, "study.designs");
  // Brackets inside quotes and comments do not count.
  std::istringstream quoted("study:\n  title: \"" + std::string(depth, '[') + "\" # " +
                            std::string(depth, '{') + "\n");
  CHECK_NOTHROW(parse_yaml(quoted, "q.yaml"));
}

TEST_CASE("bytes that are not UTF-8 are refused at their line and column", "[catalog][files]") {
  std::istringstream in("study:\n  title: caf\xe9 hut\n");
  const InputError e =
      expect_input_error([&] { parse_yaml(in, "u.yaml"); }, "u.yaml", 2, "study.title");
  CHECK(e.column() == 13);
  CHECK(e.message().find("UTF-8") != std::string::npos);
  CHECK(std::string(e.what()).find('\xe9') == std::string::npos);
  std::istringstream utf16(std::string("\xff\xfes\x00t\x00", 6));
  const InputError e16 =
      expect_input_error([&] { parse_yaml(utf16, "w.yaml"); }, "w.yaml", 1, "(top level)");
  CHECK(e16.message().find("UTF-16") != std::string::npos);
}

TEST_CASE("messages escape control characters and cut long input text", "[catalog][files]") {
  CHECK(printable_input("a\x1b[31mb") == "a\\x1b[31mb");
  CHECK(printable_input("tab\there") == "tab\\x09here");
  CHECK(printable_input("\xc2\x85") == "\\u0085");         // NEL, a C1 control
  CHECK(printable_input("caf\xc3\xa9") == "caf\xc3\xa9");  // valid UTF-8 stays
  CHECK(printable_input("\xff") == "\\xff");
  CHECK(printable_input(std::string(100, 'x'), 10) == "xxxxxxxxxx... (100 characters)");
  const InputError e("f\x07.yaml", 3, 4, "study.\x1b", "found '\x1b]0;title\x07'");
  const std::string what = e.what();
  CHECK(what == "f\\x07.yaml:3:4: study.\\x1b: found '\\x1b]0;title\\x07'");
}

TEST_CASE("invalid_utf8_at finds overlong forms, surrogates and cut sequences",
          "[catalog][files]") {
  // Unicode 15.0, table 3-7 (well-formed UTF-8 byte sequences).
  CHECK(invalid_utf8_at("plain") == std::string::npos);
  CHECK(invalid_utf8_at("\xe2\x82\xac") == std::string::npos);      // U+20AC
  CHECK(invalid_utf8_at("\xf0\x9f\x94\x8b") == std::string::npos);  // U+1F50B
  CHECK(invalid_utf8_at("ab\xc0\xaf") == 2);                        // overlong '/'
  CHECK(invalid_utf8_at("\xed\xa0\x80") == 0);                      // surrogate U+D800
  CHECK(invalid_utf8_at("x\xe2\x82") == 1);                         // cut short
  CHECK(invalid_utf8_at("\xf4\x90\x80\x80") == 0);                  // above U+10FFFF
}

}  // namespace
}  // namespace stowage
