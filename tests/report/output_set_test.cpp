// SPDX-License-Identifier: MIT
// Output sets: all files of a run replace the previous set together, and nothing of the
// user's is ever overwritten or removed.
#include "optimiser/report/output_set.h"

#include <unistd.h>

#include <catch2/catch.hpp>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>

using stowage::report::OutputFileError;
using stowage::report::OutputSet;
namespace fs = std::filesystem;

namespace {

fs::path fresh_dir(const std::string& name) {
  const fs::path root =
      fs::temp_directory_path() / ("stowage-output-set-" + std::to_string(::getpid()) + "-" + name);
  fs::remove_all(root);
  fs::create_directories(root);
  return root;
}

std::string slurp(const fs::path& p) {
  std::ifstream in(p);
  std::stringstream s;
  s << in.rdbuf();
  return s.str();
}

void write_set(const fs::path& dir, const std::string& tag) {
  OutputSet set(dir.string());
  set.add("a.csv", [&](std::ostream& out) { out << "a " << tag << "\n"; });
  set.add("b.csv", [&](std::ostream& out) { out << "b " << tag << "\n"; });
  set.commit();
}

}  // namespace

TEST_CASE("an output set replaces the previous set as a whole", "[report][output]") {
  const fs::path root = fresh_dir("replace");
  const fs::path dir = root / "out";
  write_set(dir, "one");
  CHECK(slurp(dir / "a.csv") == "a one\n");
  write_set(dir, "two");
  CHECK(slurp(dir / "a.csv") == "a two\n");
  CHECK(slurp(dir / "b.csv") == "b two\n");
  // Nothing is left beside the set: no staging folder, no old set.
  int entries = 0;
  for (const auto& e : fs::directory_iterator(root)) {
    (void)e;
    ++entries;
  }
  CHECK(entries == 1);
  fs::remove_all(root);
}

TEST_CASE("a run that fails while writing leaves the previous set whole", "[report][output]") {
  const fs::path root = fresh_dir("fail");
  const fs::path dir = root / "out";
  write_set(dir, "one");
  OutputSet set(dir.string());
  set.add("a.csv", [](std::ostream& out) { out << "a two\n"; });
  set.add("b.csv", [](std::ostream&) { throw std::runtime_error("killed half way"); });
  CHECK_THROWS(set.commit());
  CHECK(slurp(dir / "a.csv") == "a one\n");
  CHECK(slurp(dir / "b.csv") == "b one\n");
  fs::remove_all(root);
}

TEST_CASE("stale staging folders of a killed run are removed by the next run", "[report][output]") {
  const fs::path root = fresh_dir("stale");
  const fs::path dir = root / "out";
  write_set(dir, "one");
  // What a run killed before its swap leaves: a staging folder named after a dead process.
  const fs::path stale = root / ".out.staging-999999999";
  fs::create_directories(stale);
  std::ofstream(stale / "a.csv") << "half";
  write_set(dir, "two");
  CHECK_FALSE(fs::exists(stale));
  CHECK(slurp(dir / "a.csv") == "a two\n");
  fs::remove_all(root);
}

TEST_CASE("a directory holding files of the user's is refused before any work",
          "[report][output]") {
  const fs::path root = fresh_dir("foreign");
  std::ofstream(root / "thesis.docx") << "precious";
  try {
    OutputSet set(root.string());
    FAIL("expected OutputFileError");
  } catch (const OutputFileError& e) {
    CHECK_THAT(e.what(), Catch::Contains("thesis.docx"));
  }
  CHECK(slurp(root / "thesis.docx") == "precious");
  CHECK_THROWS_AS(OutputSet(""), OutputFileError);
  // A file where the directory should be; the reason is named, never "Success".
  std::ofstream(root / "plain") << "x";
  try {
    OutputSet set((root / "plain").string());
    FAIL("expected OutputFileError");
  } catch (const OutputFileError& e) {
    CHECK_THAT(e.what(), Catch::Contains("not a directory"));
    CHECK_THAT(e.what(), !Catch::Contains("Success"));
  }
  fs::remove_all(root);
}

TEST_CASE("an unwritable parent is reported with the system's reason", "[report][output]") {
  if (::geteuid() == 0) return;  // root may write anywhere; the rule cannot be shown
  try {
    OutputSet set("/proc/stowage-no-such/out");
    FAIL("expected OutputFileError");
  } catch (const OutputFileError& e) {
    CHECK_THAT(e.what(), !Catch::Contains("Success"));
  }
}

TEST_CASE("an output file appears whole at commit and not at all without it", "[report][output]") {
  using stowage::report::OutputFile;
  const fs::path root = fresh_dir("file");
  const fs::path target = root / "model.mps";
  {
    OutputFile file("--export-model", target.string());
    std::ofstream(file.staging_path()) << "half a model";
    // A failure on the way: the staging file goes, nothing appears at the path.
  }
  CHECK_FALSE(fs::exists(target));
  CHECK(fs::is_empty(root));
  {
    OutputFile file("--export-model", target.string());
    // The staging file keeps the extension, which says the format (.mps or .lp).
    CHECK(fs::path(file.staging_path()).extension() == ".mps");
    CHECK(fs::path(file.staging_path()).parent_path() == root);
    std::ofstream(file.staging_path()) << "NAME x\nENDATA\n";
    file.commit();
  }
  CHECK(slurp(target) == "NAME x\nENDATA\n");
  int entries = 0;
  for (const auto& e : fs::directory_iterator(root)) {
    (void)e;
    ++entries;
  }
  CHECK(entries == 1);
  fs::remove_all(root);
}

TEST_CASE("an output file refuses an empty name, a directory and a missing parent at once",
          "[report][output]") {
  using stowage::report::OutputFile;
  const fs::path root = fresh_dir("file-bad");
  auto message = [](const std::string& path) -> std::string {
    try {
      OutputFile file("--export-model", path);
    } catch (const OutputFileError& e) {
      return e.what();
    }
    return "";
  };
  CHECK_THAT(message(""), Catch::Contains("--export-model") && Catch::Contains("empty"));
  CHECK_THAT(message(root.string()), Catch::Contains("directory"));
  CHECK_THAT(message((root / "sub").string() + "/"), Catch::Contains("directory"));
  CHECK_THAT(message((root / "no-such" / "m.mps").string()),
             Catch::Contains("no-such") && !Catch::Contains("Success"));
  fs::remove_all(root);
}
