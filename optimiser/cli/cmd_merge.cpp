// SPDX-License-Identifier: MIT
// `stowage merge PARTS...`: joins the partial results of `stowage uncertainty --shard i/N` or
// `stowage sweep --shard i/N` into exactly the result of the unsharded run
// (optimiser/analysis/shards.h); with --report DIR also the report of the whole run
// (optimiser/report/robustness_document.h).
#include <iostream>
#include <memory>
#include <optional>

#include "catalog-schema/input_error.h"
#include "optimiser/analysis/shards.h"
#include "optimiser/cli/analysis_support.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/report/output_set.h"
#include "optimiser/report/robustness_document.h"
#include "optimiser/report/study_hash.h"
#include "optimiser/report/study_report.h"

namespace stowage::cli {

namespace {

struct MergeArgs {
  std::vector<std::string> parts;
  RunArgs run;
};

// The study a part names, refused when its inputs changed since the shards ran.
LoadedStudy load_unchanged_study(const std::string& study_path, const std::string& digest,
                                 const std::string& part_name) {
  LoadedStudy loaded = load_study_details_file(study_path);
  if (report::hash_study_inputs(loaded).digest != digest) {
    throw InputError(part_name, 0, 0, "study_digest",
                     "the study's input files have changed since the shards ran (" + study_path +
                         "); run the shards again");
  }
  return loaded;
}

// Sweep parts: the points are listed again from the study and the parts' options, exactly as
// `stowage sweep` lists them, and the joined outcomes are assembled into the whole result.
int merge_sweep(const MergeArgs& args, std::optional<report::OutputSet>& files,
                std::optional<report::OutputSet>& report_files) {
  std::vector<SweepPart> parts;
  for (const std::string& path : args.parts) parts.push_back(read_sweep_part_file(path));
  std::vector<PointOutcome> outcomes = join_sweep_parts(parts, args.parts);
  const SweepPart& first = parts.front();
  const LoadedStudy loaded =
      load_unchanged_study(first.study_path, first.study_digest, args.parts.front());
  const std::vector<Variation> variations = variations_with(loaded, first.vary);
  const auto check_count = [&](std::size_t points) {
    if (points != first.points) {
      throw InputError(args.parts.front(), 0, 0, "sweep",
                       "the study now lists " + std::to_string(points) +
                           " sweep points, the shards " + std::to_string(first.points));
    }
  };
  if (first.grid) {
    const std::vector<Variation> axes = sweep_grid_axes(variations, first.axes);
    std::vector<std::vector<double>> values;
    for (const Variation& v : axes) values.push_back(axis_values(v, first.steps));
    check_count(grid_points(axes, values).size());
    const GridResult result =
        assemble_grid(first.hold_designs, first.base, axes, values, std::move(outcomes));
    return emit_grid(files, report_files, args.run.format, loaded, result);
  }
  check_count(tornado_points(variations).size());
  const TornadoResult result =
      assemble_tornado(first.hold_designs, first.base, variations, std::move(outcomes));
  return emit_tornado(files, report_files, args.run.format, loaded, result);
}

int run_merge(const MergeArgs& args) {
  std::optional<report::OutputSet> files;
  refuse_same_directory(args.run.out_dir, args.run.report_dir);
  if (args.run.out_dir) files.emplace(*args.run.out_dir);
  std::optional<report::OutputSet> report_files;
  if (args.run.report_dir) report_files.emplace(*args.run.report_dir, "--report");
  const std::string kind = partial_result_kind(args.parts.front());
  for (const std::string& path : args.parts) {
    if (partial_result_kind(path) != kind) {
      throw InputError(path, 1, 1, "stowage-partial",
                       "a partial " + partial_result_kind(path) + " result; " + args.parts.front() +
                           " is a partial " + kind + " result");
    }
  }
  if (kind == "sweep") return merge_sweep(args, files, report_files);
  std::vector<UncertaintyPart> parts;
  for (const std::string& path : args.parts) parts.push_back(read_uncertainty_part_file(path));
  const std::vector<SampleRecord> records = join_parts(parts, args.parts);
  // The study as it is now must be the one the shards ran on.
  const UncertaintyPart& first = parts.front();
  const LoadedStudy loaded =
      load_unchanged_study(first.study_path, first.study_digest, args.parts.front());
  UncertaintyRun run = first.run;
  run.drawn.clear();
  for (const Variation& v : loaded.variations) {
    if (v.distribution) run.drawn.push_back(v);
  }
  bool same = run.drawn.size() == first.run.drawn.size();
  for (std::size_t j = 0; same && j < run.drawn.size(); ++j) {
    same = run.drawn[j].path == first.run.drawn[j].path;
  }
  if (!same) {
    throw InputError(args.parts.front(), 0, 0, "drawn",
                     "the study's drawn inputs differ from the shards'");
  }
  const UncertaintyResult result = summarise_uncertainty(run, records);
  if (report_files) {
    report::add_uncertainty_report_files(*report_files, loaded, result, report::report_timestamp());
    report_files->commit();
  }
  emit_uncertainty(files, args.run.format, loaded.study, result);
  return kExitOk;
}

}  // namespace

void register_merge(CLI::App& app, int& exit_code) {
  auto args = std::make_shared<MergeArgs>();
  auto* cmd = app.add_subcommand(
      "merge",
      "Join the partial results of `stowage uncertainty --shard i/N` or `stowage sweep --shard "
      "i/N` runs into the result of the whole run");
  cmd->add_option("parts", args->parts, "Partial result files, in any order")->required();
  add_format_option(*cmd, args->run.format);
  cmd->add_option("--out", args->run.out_dir,
                  "Also write the whole run's files into this directory (uncertainty.json, "
                  "summary.csv and samples.csv; or sweep.json and tornado.csv or grid.csv)")
      ->type_name("DIR");
  cmd->add_option("--report", args->run.report_dir,
                  "Also write the report of the whole run (HTML, Markdown, SVG "
                  "figures and the JSON and CSV it was made from) into this directory")
      ->type_name("DIR");
  cmd->callback(
      [args, &exit_code]() { exit_code = run_guarded([&]() { return run_merge(*args); }); });
}

}  // namespace stowage::cli
