// SPDX-License-Identifier: MIT
// `stowage sweep STUDY`: one-at-a-time sensitivity (tornado) over the study's variations, or a
// 1-D / 2-D grid of named ones (--grid), each point re-optimised or with the base case's
// designs held (--hold-designs); optimiser/analysis/sweep.h. --shard i/N evaluates one slice
// of the points for `stowage merge` (optimiser/analysis/shards.h).
#include <filesystem>
#include <iostream>
#include <memory>
#include <optional>

#include "model/invalid_value.h"
#include "optimiser/analysis/shards.h"
#include "optimiser/analysis/sweep.h"
#include "optimiser/cli/analysis_support.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/report/output_set.h"
#include "optimiser/report/shard_report.h"
#include "optimiser/report/study_hash.h"

namespace stowage::cli {

namespace {

struct SweepArgs {
  std::string study_path;
  std::vector<std::string> grid;
  std::vector<std::string> vary;
  int steps = 5;
  bool hold_designs = false;
  std::string shard;
  RunArgs run;
};

// One slice of the sweep's points, written as a partial result for `stowage merge`
// (optimiser/analysis/shards.h): the points are listed as the unsharded run lists them.
int run_sweep_shard(const SweepArgs& args, const LoadedStudy& loaded, const PointList& points,
                    std::optional<report::OutputSet>& files, RunProgress& progress) {
  SweepPart part;
  part.shard = parse_shard(args.shard);
  part.slice = shard_slice(points.size(), part.shard);
  part.grid = !args.grid.empty();
  part.hold_designs = args.hold_designs;
  part.steps = args.steps;
  part.points = points.size();
  part.vary = args.vary;
  part.axes = args.grid;
  for (const ChemistryProfile& p : loaded.study.profiles) part.profile_ids.push_back(p.id);
  const PreparedRun run = prepare_run(loaded.study, args.hold_designs, OptimiseOptions{});
  part.base = run.base;
  part.outcomes =
      evaluate_points(loaded.study, run.point, points, part.slice.first, part.slice.last,
                      args.run.threads, progress.callback(part.slice.last - part.slice.first));
  progress.finish();
  part.study_path = std::filesystem::absolute(args.study_path).lexically_normal().string();
  part.study_digest = report::hash_study_inputs(loaded).digest;
  if (files) {
    const std::string name = "part-" + std::to_string(part.shard.index) + "-of-" +
                             std::to_string(part.shard.count) + ".txt";
    files->add(name, [&](std::ostream& out) { report::write_sweep_part(out, part); });
    files->commit();
  } else {
    report::write_sweep_part(std::cout, part);
  }
  return kExitOk;
}

int run_sweep(const SweepArgs& args) {
  std::optional<report::OutputSet> files;
  refuse_same_directory(args.run.out_dir, args.run.report_dir);
  if (args.run.report_dir && !args.shard.empty()) {
    throw InvalidValue("--report",
                       "needs every point of the sweep; it cannot be given with --shard (give "
                       "--report to stowage merge, which joins the shards)");
  }
  if (!args.shard.empty()) parse_shard(args.shard);        // refuses a bad slice before the work
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
    const std::vector<Variation> axes = sweep_grid_axes(variations, args.grid);
    std::vector<std::vector<double>> values;
    for (const Variation& v : axes) values.push_back(axis_values(v, args.steps));
    if (!args.shard.empty()) {
      return run_sweep_shard(args, loaded, grid_points(axes, values), files, progress);
    }
    std::size_t total = 1;
    for (const std::vector<double>& v : values) total *= v.size();
    options.progress = progress.callback(total);
    const GridResult result = run_grid(study, axes, options);
    progress.finish();
    return emit_grid(files, report_files, args.run.format, loaded, result);
  }
  if (variations.empty()) {
    throw InvalidValue("variations",
                       "the study has no variations to sweep; add a study.variations block or "
                       "give --vary PATH=LOW:HIGH");
  }
  if (!args.shard.empty()) {
    return run_sweep_shard(args, loaded, tornado_points(variations), files, progress);
  }
  options.progress = progress.callback(2 * variations.size());
  const TornadoResult result = run_tornado(study, variations, options);
  progress.finish();
  return emit_tornado(files, report_files, args.run.format, loaded, result);
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
  cmd->add_option("--shard", args->shard,
                  "Evaluate only slice i of N of the points and write a partial result (stdout, "
                  "or part-i-of-N.txt in --out DIR) for `stowage merge`")
      ->type_name("i/N");
  add_run_options(*cmd, args->run, "sweep.json and tornado.csv (or grid.csv)");
  cmd->callback(
      [args, &exit_code]() { exit_code = run_guarded([&]() { return run_sweep(*args); }); });
}

}  // namespace stowage::cli
