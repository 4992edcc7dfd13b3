// SPDX-License-Identifier: MIT
// Helpers shared by the catalog-schema tests: fixture paths and the check that a call fails
// with an InputError naming the file, the line and the field.
#pragma once

#include <catch2/catch.hpp>
#include <filesystem>
#include <fstream>
#include <functional>
#include <random>
#include <sstream>
#include <string>

#include "catalog-schema/input_error.h"
#include "test_paths.h"

namespace stowage::testing {

inline std::string source_path(const std::string& relative) {
  return std::string(STOWAGE_SOURCE_DIR) + "/" + relative;
}

inline std::string fixture_path(const std::string& name) {
  return source_path("tests/catalog-schema/fixtures/" + name);
}

inline std::string read_text(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  std::ostringstream out;
  out << in.rdbuf();
  return out.str();
}

// 1-based line of the first occurrence of `needle` in `text`.
inline int line_of(const std::string& text, const std::string& needle) {
  const std::size_t at = text.find(needle);
  REQUIRE(at != std::string::npos);
  int line = 1;
  for (std::size_t i = 0; i < at; ++i) line += text[i] == '\n';
  return line;
}

// Replaces the first occurrence of `from` in `text` by `to`; fails the test if absent, so an
// edit that silently does nothing cannot make a bad-input test pass for the wrong reason.
inline std::string replace_once(std::string text, const std::string& from, const std::string& to) {
  const std::size_t at = text.find(from);
  REQUIRE(at != std::string::npos);
  return text.replace(at, from.size(), to);
}

// Runs `call`, requires an InputError, checks file, line, field and that what() carries the
// "FILE:LINE:COL: FIELD: " prefix; returns the error for further checks on the message.
inline InputError expect_input_error(const std::function<void()>& call, const std::string& file,
                                     int line, const std::string& field) {
  try {
    call();
  } catch (const InputError& e) {
    INFO(e.what());
    CHECK(e.file() == file);
    CHECK(e.line() == line);
    CHECK(e.column() >= 1);
    CHECK(e.field() == field);
    const std::string prefix =
        file + ":" + std::to_string(line) + ":" + std::to_string(e.column()) + ": " + field + ": ";
    CHECK(std::string(e.what()).rfind(prefix, 0) == 0);
    return e;
  } catch (const std::exception& e) {
    FAIL("expected stowage::InputError, got another exception: " << e.what());
  }
  FAIL("expected stowage::InputError, nothing was thrown");
  throw std::logic_error("unreachable");
}

// A fresh directory under the system's temporary directory, removed with its contents when
// the object goes out of scope; tests write generated files there, never into the source tree.
class TempDir {
 public:
  TempDir() {
    std::random_device seed;
    path_ = std::filesystem::temp_directory_path() /
            ("stowage-catalog-test-" + std::to_string(seed()) + std::to_string(seed()));
    std::filesystem::create_directories(path_);
  }
  ~TempDir() {
    std::error_code ignored;
    std::filesystem::remove_all(path_, ignored);
  }
  TempDir(const TempDir&) = delete;
  TempDir& operator=(const TempDir&) = delete;

  std::string path() const { return path_.string(); }
  std::string write(const std::string& name, const std::string& text) const {
    const std::filesystem::path file = path_ / name;
    std::filesystem::create_directories(file.parent_path());
    std::ofstream out(file, std::ios::binary);
    out << text;
    return file.string();
  }

 private:
  std::filesystem::path path_;
};

}  // namespace stowage::testing
