// SPDX-License-Identifier: MIT
// What `sweep`, `breakeven` and `uncertainty` share: the run options (--format, --out,
// --threads, --quiet), the variations of a study with any --vary options added, and the
// progress line on stderr (only when stderr is a terminal and --quiet is not given).
#pragma once

#include <CLI/CLI.hpp>
#include <chrono>
#include <cstddef>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "catalog-schema/study_loader.h"
#include "optimiser/analysis/parallel.h"
#include "optimiser/analysis/sweep.h"
#include "optimiser/analysis/uncertainty.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/report/output_set.h"

namespace stowage::cli {

struct RunArgs {
  OutputFormat format = OutputFormat::Text;
  std::optional<std::string> out_dir;
  std::optional<std::string> report_dir;  // --report DIR (robustness_document.h)
  int threads = 0;                        // 0: every core
  bool quiet = false;
};
void add_run_options(CLI::App& command, RunArgs& args, const std::string& out_files);

// study.variations with each --vary PATH=LOW:HIGH added (the command line wins for a path
// given in both). Throws InvalidValue naming "--vary" for a bad option.
std::vector<Variation> variations_with(const LoadedStudy& loaded,
                                       const std::vector<std::string>& vary_options);

// Writes an uncertainty result: uncertainty.json, summary.csv and samples.csv into `files`
// (committed) when given, and the text or JSON report on stdout. Shared by `uncertainty` and
// `merge`, so a merged run prints exactly what the unsharded one does.
void emit_uncertainty(std::optional<report::OutputSet>& files, OutputFormat format,
                      const StudyCase& study, const UncertaintyResult& result);

// Done/total, rate and time left on stderr, redrawn at most four times a second; silent when
// stderr is not a terminal or `quiet` (then the callbacks are empty). The callbacks are called
// one at a time (parallel.h). callback(total) is for a run of known size; the two-argument
// callback for one whose total is learnt on the way (break-even's bisection), each call
// giving the current total.
// The variations named by --grid, in the order given; InvalidValue("--grid") for more than
// two, a path twice, or a path with no variation.
std::vector<Variation> sweep_grid_axes(const std::vector<Variation>& all,
                                       const std::vector<std::string>& paths);

// Writes a sweep result: sweep.json and tornado.csv (grid.csv) into `files` and the report
// into `report_files` (each committed when given), and the text or JSON on stdout; returns the
// exit code (kExitInfeasible when the base case has no design meeting the requirements).
// Shared by `sweep` and `merge`, so a merged sweep prints exactly what the unsharded one does.
int emit_tornado(std::optional<report::OutputSet>& files,
                 std::optional<report::OutputSet>& report_files, OutputFormat format,
                 const LoadedStudy& loaded, const TornadoResult& result);
int emit_grid(std::optional<report::OutputSet>& files,
              std::optional<report::OutputSet>& report_files, OutputFormat format,
              const LoadedStudy& loaded, const GridResult& result);

class RunProgress {
 public:
  RunProgress(bool quiet, std::string unit);
  ~RunProgress();
  RunProgress(const RunProgress&) = delete;
  RunProgress& operator=(const RunProgress&) = delete;
  DoneCallback callback(std::size_t total);
  std::function<void(std::size_t done, std::size_t total)> callback();
  void finish();

 private:
  void show(std::size_t done, std::size_t total);
  bool enabled_;
  std::string unit_;
  bool shown_ = false;
  std::chrono::steady_clock::time_point start_, last_;
};

}  // namespace stowage::cli
