// SPDX-License-Identifier: MIT
// Hostile or broken input never crashes the loaders: every case ends in an InputError.
#include <catch2/catch.hpp>
#include <sstream>

#include "catalog-schema/hourly_csv.h"
#include "catalog-schema/profile_loader.h"
#include "catalog-schema/soc_series.h"
#include "catalog-schema/study_loader.h"
#include "catalog_test_support.h"

namespace stowage {
namespace {

void require_input_error(const std::function<void()>& call) {
  try {
    call();
    FAIL("no error for bad input");
  } catch (const InputError& e) {
    INFO(e.what());
    CHECK(e.line() >= 1);
    CHECK(e.column() >= 1);
    CHECK_FALSE(e.field().empty());
  }
}

void profile_text(const std::string& text) {
  std::istringstream in(text);
  load_profile(in, "p.yaml");
}

TEST_CASE("broken YAML of many kinds is an InputError", "[catalog][robustness]") {
  const std::string deep = std::string(5000, '[') + std::string(5000, ']');
  const std::vector<std::string> inputs = {
      "profile:\n\tid: x\n",                                 // tab indentation
      "profile: *nowhere\n",                                 // alias of an undefined anchor
      "profile: {id: x\n",                                   // unclosed flow mapping at the end
      "? {a: 1}\n: 2\n",                                     // a mapping as a key
      std::string("\x00\x01\xff\xfe", 4),                    // binary bytes
      "profile:\n  id: " + std::string(100000, 'a') + "\n",  // a huge scalar
      "profile:\n  cell:\n    nominal_v: " + std::string(100000, '9') + "\n",
      "profile: " + deep + "\n",             // nesting deeper than the parser allows
      "---\nprofile: 1\n---\nprofile: 2\n",  // two documents
      "profile: !!binary AAAA\n",
  };
  for (const std::string& text : inputs) {
    INFO(text.substr(0, 60));
    require_input_error([&] { profile_text(text); });
  }
}

TEST_CASE("broken CSV of many kinds is an InputError", "[catalog][robustness]") {
  const std::vector<std::string> inputs = {
      std::string(200000, ',') + "\n",
      "load_kw,source_kw,temp_c\n" + std::string(100000, '7') + "e99999,0,0\n",
      "\"load_kw,source_kw,temp_c\n1,2,3\n",  // an unclosed quote swallows the header
      std::string("load_kw,source_kw,temp_c\n\x00,1,2\n", 30),
      "load_" + std::string(100000, 'x') + ",source_kw,temp_c\n",
  };
  for (const std::string& text : inputs) {
    INFO(text.substr(0, 60));
    require_input_error([&] {
      std::istringstream in(text);
      read_hourly_csv(in, "h.csv");
    });
    require_input_error([&] {
      std::istringstream in(text);
      read_soc_series(in, "s.csv");
    });
  }
}

TEST_CASE("a study whose paths point at odd places is an InputError", "[catalog][robustness]") {
  const std::string base = testing::source_path("tests/catalog-schema/fixtures");
  for (const char* site : {"site: .", "site: /", "site: hourly.csv", "site: study.yaml"}) {
    INFO(site);
    std::string text = testing::read_text(testing::fixture_path("study.yaml"));
    text = testing::replace_once(text, "site: site.yaml", site);
    require_input_error([&] {
      std::istringstream in(text);
      load_study(in, "s.yaml", base);
    });
  }
}

}  // namespace
}  // namespace stowage
