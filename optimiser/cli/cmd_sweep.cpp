// SPDX-License-Identifier: MIT
// `stowage sweep STUDY`: one-at-a-time sensitivity (tornado) over the study's variations, or a
// 1-D / 2-D grid of named ones (--grid), each point re-optimised or with the base case's
// designs held (--hold-designs); optimiser/analysis/sweep.h.
#include <iostream>
#include <memory>
#include <optional>

#include "model/invalid_value.h"
#include "optimiser/analysis/sweep.h"
#include "optimiser/cli/analysis_support.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/report/output_set.h"
#include "optimiser/report/robustness_document.h"
#include "optimiser/report/study_report.h"
#include "optimiser/report/sweep_report.h"

namespace stowage::cli {

namespace {

struct SweepArgs {
  std::string study_path;
  std::vector<std::string> grid;
  std::vector<std::string> vary;
  int steps = 5;
  bool hold_designs = false;
  RunArgs run;
};

// The variations named by --grid, in the order given.
std::vector<Variation> grid_axes(const std::vector<Variation>& all,
                                 const std::vector<std::string>& paths) {
  if (paths.size() > 2) throw InvalidValue("--grid", "names one or two paths, not more");
  if (paths.size() == 2 && paths[0] == paths[1]) {
    throw InvalidValue("--grid", "names " + paths[0] + " twice; give two different paths");
  }
  std::vector<Variation> axes;
  for (const std::string& path : paths) {
    const Variation* found = nullptr;
    for (const Variation& v : all) {
      if (v.path == path) found = &v;
    }
    if (!found) {
      throw InvalidValue("--grid", "no variation for " + path +
                                       "; add it to study.variations or give --vary " + path +
                                       "=LOW:HIGH");
    }
    axes.push_back(*found);
  }
  return axes;
}

int run_sweep(const SweepArgs& args) {
  std::optional<report::OutputSet> files;
  refuse_same_directory(args.run.out_dir, args.run.report_dir);
  if (args.run.out_dir) files.emplace(*args.run.out_dir);  // refuses a bad DIR now
  std::optional<report::OutputSet> report_files;
  if (args.run.report_dir) report_files.emplace(*args.run.report_dir, "--report");
  const LoadedStudy loaded = load_study_details_file(args.study_path);
  const StudyCase& study = loaded.study;
  const std::vector<Variation> variations = variations_with(loaded, args.vary);
  SweepOptions options;
  options.hold_designs = args.hold_designs;
  options.threads = args.run.threads;
  options.steps = args.steps;
  RunProgress progress(args.run.quiet, "points");
  if (!args.grid.empty()) {
    const std::vector<Variation> axes = grid_axes(variations, args.grid);
    std::size_t total = 1;
    for (const Variation& v : axes) total *= axis_values(v, args.steps).size();
    options.progress = progress.callback(total);
    const GridResult result = run_grid(study, axes, options);
    progress.finish();
    if (files) {
      files->add("sweep.json",
                 [&](std::ostream& out) { report::write_grid_json(out, study, result); });
      files->add("grid.csv",
                 [&](std::ostream& out) { report::write_grid_csv(out, study, result); });
      files->commit();
    }
    if (report_files) {
      report::add_grid_report_files(*report_files, loaded, result, report::report_timestamp());
      report_files->commit();
    }
    if (args.run.format == OutputFormat::Json) {
      report::write_grid_json(std::cout, study, result);
    } else {
      report::write_grid_text(std::cout, study, result);
    }
    return static_cast<int>(result.base.feasible() ? kExitOk : kExitInfeasible);
  }
  if (variations.empty()) {
    throw InvalidValue("variations",
                       "the study has no variations to sweep; add a study.variations block or "
                       "give --vary PATH=LOW:HIGH");
  }
  options.progress = progress.callback(2 * variations.size());
  const TornadoResult result = run_tornado(study, variations, options);
  progress.finish();
  if (files) {
    files->add("sweep.json",
               [&](std::ostream& out) { report::write_tornado_json(out, study, result); });
    files->add("tornado.csv",
               [&](std::ostream& out) { report::write_tornado_csv(out, study, result); });
    files->commit();
  }
  if (report_files) {
    report::add_tornado_report_files(*report_files, loaded, result, report::report_timestamp());
    report_files->commit();
  }
  if (args.run.format == OutputFormat::Json) {
    report::write_tornado_json(std::cout, study, result);
  } else {
    report::write_tornado_text(std::cout, study, result);
  }
  return static_cast<int>(result.base.feasible() ? kExitOk : kExitInfeasible);
}

}  // namespace

void register_sweep(CLI::App& app, int& exit_code) {
  auto args = std::make_shared<SweepArgs>();
  auto* cmd = app.add_subcommand(
      "sweep",
      "How the answer moves with its inputs: a tornado over the study's variations (default) "
      "or a 1-D / 2-D grid of named ones");
  cmd->add_option("study", args->study_path, "Study file (YAML)")->required();
  cmd->add_option("--grid", args->grid,
                  "A grid instead of the tornado: one or two parameter paths, comma-separated, "
                  "each with a variation in the study or a --vary option")
      ->delimiter(',')
      ->type_name("PATH[,PATH]");
  cmd->add_option("--steps", args->steps,
                  "Grid values of a low/high variation, from low to high (default 5)")
      ->check(CLI::Range(2, 1000));
  cmd->add_option("--vary", args->vary,
                  "Also vary PATH from LOW to HIGH (repeatable; replaces the study's entry for "
                  "that path)")
      ->type_name("PATH=LOW:HIGH");
  cmd->add_flag("--hold-designs", args->hold_designs,
                "Evaluate the base case's best design of each profile at every point instead "
                "of re-optimising");
  add_run_options(*cmd, args->run, "sweep.json and tornado.csv (or grid.csv)");
  cmd->callback(
      [args, &exit_code]() { exit_code = run_guarded([&]() { return run_sweep(*args); }); });
}

}  // namespace stowage::cli
