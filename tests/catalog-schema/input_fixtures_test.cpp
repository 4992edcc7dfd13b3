// SPDX-License-Identifier: MIT
// The file fixtures: every bad-inputs/NN-name/study.yaml (or tender.yaml, loaded as a tender)
// fails with an InputError whose text (or, for several problems, one of its InputErrors) holds
// each line of its expect.txt (the same check the end-to-end run of `stowage check` makes on
// stderr), and the shipped profiles and demo studies load.
#include <algorithm>
#include <catch2/catch.hpp>
#include <filesystem>
#include <functional>
#include <vector>

#include "catalog-schema/profile_loader.h"
#include "catalog-schema/study_loader.h"
#include "catalog-schema/tender_loader.h"
#include "catalog-schema/yaml_document.h"
#include "catalog_test_support.h"

namespace stowage {
namespace {

namespace fs = std::filesystem;
using testing::read_text;
using testing::source_path;

std::vector<fs::path> sorted_entries(const fs::path& dir) {
  std::vector<fs::path> entries;
  for (const fs::directory_entry& e : fs::directory_iterator(dir)) entries.push_back(e.path());
  std::sort(entries.begin(), entries.end());
  return entries;
}

std::vector<std::string> lines_of(const std::string& text) {
  std::vector<std::string> lines;
  std::istringstream in(text);
  std::string line;
  while (std::getline(in, line)) {
    if (!line.empty() && line.back() == '\r') line.pop_back();
    if (!line.empty()) lines.push_back(line);
  }
  return lines;
}

TEST_CASE("every bad-input fixture fails with the expected file, line and field",
          "[catalog][fixtures][bad]") {
  const fs::path root = source_path("tests/catalog-schema/bad-inputs");
  std::size_t count = 0;
  for (const fs::path& dir : sorted_entries(root)) {
    if (!fs::is_directory(dir)) continue;
    ++count;
    INFO("fixture " << dir.filename().string());
    const std::vector<std::string> expected = lines_of(read_text((dir / "expect.txt").string()));
    // At least a "FILE:LINE:" line and a field line; the first names the file and line.
    REQUIRE(expected.size() >= 2);
    CHECK(expected.front().find(':') != std::string::npos);
    bool threw = false;
    try {
      if (fs::exists(dir / "tender.yaml")) {
        load_tender_file((dir / "tender.yaml").string());
      } else {
        load_study_details_file((dir / "study.yaml").string());
      }
    } catch (const InputError& e) {
      threw = true;
      // Several independent problems come as InputErrors: each expected line is in one of them.
      std::string what = e.what();
      if (const auto* all = dynamic_cast<const InputErrors*>(&e)) {
        what.clear();
        for (const InputError& one : all->all()) what += std::string(one.what()) + "\n";
      }
      INFO(what);
      CHECK(e.line() >= 1);
      for (const std::string& line : expected) CHECK_THAT(what, Catch::Contains(line));
    }
    CHECK(threw);
  }
  // The input issue asks for at least 60 distinct bad cases.
  CHECK(count >= 60);
}

// Numeric leaves of a profile below `node`, as field paths relative to "profile".
void numeric_fields(const YAML::Node& node, const std::string& path,
                    std::vector<std::string>& out) {
  if (node.IsMap()) {
    for (auto it = node.begin(); it != node.end(); ++it) {
      const std::string key = it->first.Scalar();
      if (path.empty() && key == "sources") continue;
      numeric_fields(it->second, join_key(path, key), out);
    }
  } else if (node.IsSequence()) {
    for (std::size_t i = 0; i < node.size(); ++i) numeric_fields(node[i], join_index(path, i), out);
  } else if (node.IsScalar()) {
    const ScalarKind kind = scalar_kind(node);
    if (kind == ScalarKind::Integer || kind == ScalarKind::Number) out.push_back(path);
  }
}

TEST_CASE("the shipped profiles load and give a source and a confidence for every number",
          "[catalog][profiles]") {
  const fs::path dir = source_path("catalog-schema/profiles");
  std::size_t count = 0;
  if (fs::is_directory(dir)) {
    for (const fs::path& file : sorted_entries(dir)) {
      if (file.extension() != ".yaml") continue;
      ++count;
      INFO("profile " << file.string());
      LoadedProfile loaded;
      REQUIRE_NOTHROW(loaded = load_profile_details_file(file.string()));
      const std::string text = read_text(file.string());
      std::istringstream in(text);
      const YamlDocument doc = parse_yaml(in, file.string());
      std::vector<std::string> fields;
      numeric_fields(doc.root()["profile"], "", fields);
      CHECK(fields.size() >= 20);  // a complete profile has at least the required numbers
      for (const std::string& field : fields) {
        INFO("field " << field);
        CHECK(source_covers(loaded.sources, field));
        // Every number carries a confidence label, and the label claims no more than the
        // source text admits (the project's sourcing rule): "sourced" only for text that is
        // neither recalled nor chosen, "from-memory" and "illustrative" only where the text
        // says so.
        const std::optional<ValueConfidence> label = confidence_of(loaded, field);
        REQUIRE(label);
        std::string source;
        for (std::size_t i = field.size() + 1; i-- > 0;) {
          if (i < field.size() && field[i] != '.' && field[i] != '[') continue;
          const auto it = loaded.sources.find(field.substr(0, i));
          if (it != loaded.sources.end()) {
            source = it->second;
            break;
          }
        }
        INFO("label " << confidence_name(*label) << ", source: " << source);
        const bool recalled = source.find("from memory") != std::string::npos;
        const bool chosen = source.find("illustrative") != std::string::npos;
        if (*label == ValueConfidence::Sourced) CHECK_FALSE((recalled || chosen));
        if (*label == ValueConfidence::FromMemory) CHECK(recalled);
        if (*label == ValueConfidence::Illustrative) CHECK(chosen);
      }
      // The shipped curves keep lifetime throughput from falling toward shallow DoD.
      CHECK(loaded.warnings.empty());
    }
  }
  // The catalogue promises at least six chemistries.
  CHECK(count >= 6);
}

TEST_CASE("the demo studies load", "[catalog][studies]") {
  const fs::path dir = source_path("studies");
  std::size_t count = 0;
  if (fs::is_directory(dir)) {
    for (const fs::path& study : sorted_entries(dir)) {
      const fs::path file = study / "study.yaml";
      if (!fs::exists(file)) continue;
      ++count;
      INFO("study " << file.string());
      try {
        const LoadedStudy loaded = load_study_details_file(file.string());
        CHECK_FALSE(loaded.study.profiles.empty());
        CHECK(loaded.study.site.load_kw.size() == 8760);
      } catch (const InputError& e) {
        FAIL(e.what());
      }
    }
  }
  CHECK(count >= 1);
}

}  // namespace
}  // namespace stowage
