// SPDX-License-Identifier: MIT
// `stowage optimise` through its CLI11 registration: exit codes, the JSON fields other tools
// read, the text report's ranking and safety notice, and the files it writes.
#include <CLI/CLI.hpp>
#include <catch2/catch.hpp>
#include <filesystem>
#include <fstream>
#include <iostream>
#include <sstream>
#include <string>
#include <vector>

#include "optimiser/cli/command.h"
#include "test_paths.h"

namespace fs = std::filesystem;

namespace {

struct RunOutput {
  int exit_code = -1;
  std::string out;
};

RunOutput run_optimise(std::vector<std::string> args) {
  CLI::App app("stowage");
  app.require_subcommand(1);
  RunOutput result;
  stowage::cli::register_optimise(app, result.exit_code);
  std::vector<std::string> argv_text{"stowage", "optimise"};
  argv_text.insert(argv_text.end(), args.begin(), args.end());
  std::vector<char*> argv;
  for (std::string& a : argv_text) argv.push_back(a.data());
  std::ostringstream captured;
  std::streambuf* old = std::cout.rdbuf(captured.rdbuf());
  try {
    app.parse(static_cast<int>(argv.size()), argv.data());
  } catch (...) {
    std::cout.rdbuf(old);
    throw;
  }
  std::cout.rdbuf(old);
  result.out = captured.str();
  return result;
}

std::string demo(const char* name) {
  return std::string(STOWAGE_SOURCE_DIR) + "/studies/" + name + "/study.yaml";
}

// A study that asks for 3 days of autonomy at the Tarnbeck site but allows 2 strings.
std::string write_too_small_study(const fs::path& dir) {
  fs::create_directories(dir);
  const fs::path path = dir / "study.yaml";
  std::ofstream f(path);
  f << "study:\n"
       "  title: too few strings for the autonomy\n"
       "  site: "
    << STOWAGE_SOURCE_DIR << "/studies/tarnbeck-saddle/site.yaml\n"
    << "  profiles:\n    - " << STOWAGE_SOURCE_DIR << "/catalog-schema/profiles/lfp.yaml\n"
    << "  economics: {project_years: 20, real_discount_rate: 0.06, currency: EUR}\n"
       "  design_space:\n"
       "    dod_ladder: {from: 0.20, to: 1.00, step: 0.05}\n"
       "    max_strings_parallel: 2\n";
  return path.string();
}

}  // namespace

TEST_CASE("optimise --format json gives the documented fields", "[optimiser][cli]") {
  const RunOutput r = run_optimise({demo("sandglass-mast"), "--format", "json"});
  REQUIRE(r.exit_code == stowage::cli::kExitOk);
  for (const char* key : {"\"designs\"", "\"best\"", "\"ranking\"", "\"model_estimate_per_kwh\"",
                          "\"gap\"", "\"solve_seconds\"", "\"designs_evaluated_exactly\"",
                          "\"proven_optimal\"", "\"method\"", "\"loses_on\""}) {
    CHECK_THAT(r.out, Catch::Contains(key));
  }
  CHECK_THAT(r.out, Catch::Contains("\"milp\""));
}

TEST_CASE("optimise ranks profiles, explains the losses and ends with the safety notice",
          "[optimiser][cli]") {
  const RunOutput r = run_optimise({demo("sandglass-mast")});
  REQUIRE(r.exit_code == stowage::cli::kExitOk);
  // The screen leads with the decision, its margin and its confidence, before any table.
  const std::size_t decision = r.out.find("DECISION  ");
  REQUIRE(decision != std::string::npos);
  CHECK(decision < r.out.find("  margin        "));
  CHECK(r.out.find("  margin        ") < r.out.find("  confidence    proven optimal"));
  CHECK(r.out.find("  confidence    ") < r.out.find("Every profile's cheapest design found"));
  CHECK_THAT(r.out, Catch::Contains("Where each alternative's money goes otherwise"));
  CHECK_THAT(r.out, !Catch::Contains("Why each loses"));
  CHECK_THAT(r.out, !Catch::Contains("earch space"));
  // Cost lines are grouped under the LCOS terms, in the published order.
  const std::size_t investment = r.out.find("    investment          investment (year 0)");
  REQUIRE(investment != std::string::npos);
  CHECK(investment < r.out.find("    O&M                 fixed O&M"));
  CHECK(r.out.find("    O&M ") < r.out.find("    charging  "));
  CHECK_THAT(r.out, Catch::Contains("Model estimate of this design"));
  CHECK_THAT(r.out, Catch::Contains("planning estimate"));
}

TEST_CASE("optimise exits 3 and names the autonomy shortfall when no bank is big enough",
          "[optimiser][cli]") {
  const fs::path dir = fs::temp_directory_path() / "stowage_optimise_cli_infeasible";
  const std::string study = write_too_small_study(dir);
  const RunOutput r = run_optimise({study});
  CHECK(r.exit_code == stowage::cli::kExitInfeasible);
  CHECK_THAT(r.out, Catch::Contains("autonomy"));
  CHECK_THAT(r.out, Catch::Contains("short by"));
  CHECK_THAT(r.out, Catch::Contains("planning estimate"));
  const RunOutput j = run_optimise({study, "--format", "json"});
  CHECK(j.exit_code == stowage::cli::kExitInfeasible);
  CHECK_THAT(j.out,
             Catch::Contains("\"feasible\":false") || Catch::Contains("\"feasible\": false"));
  fs::remove_all(dir);
}

TEST_CASE("optimise writes the CSVs and the exported model", "[optimiser][cli]") {
  const fs::path dir = fs::temp_directory_path() / "stowage_optimise_cli_out";
  fs::remove_all(dir);
  const std::string model = (fs::temp_directory_path() / "stowage_cli_model.mps").string();
  const RunOutput r =
      run_optimise({demo("sandglass-mast"), "--out", dir.string(), "--export-model", model});
  REQUIRE(r.exit_code == stowage::cli::kExitOk);
  CHECK(fs::exists(dir / "designs.csv"));
  CHECK(fs::exists(dir / "cash-flows.csv"));
  std::ifstream mps(model);
  std::string first;
  std::getline(mps, first);
  CHECK_THAT(first, Catch::Contains("Problem"));
  fs::remove_all(dir);
  fs::remove(model);
}

TEST_CASE("optimise --time-limit marks the answer as not proven", "[optimiser][cli]") {
  const RunOutput r = run_optimise({demo("tarnbeck-saddle"), "--method", "exhaustive",
                                    "--time-limit", "0.2", "--format", "json"});
  CHECK(r.exit_code == stowage::cli::kExitOk);
  CHECK_THAT(r.out, Catch::Contains("\"proven_optimal\":false") ||
                        Catch::Contains("\"proven_optimal\": false"));
}
