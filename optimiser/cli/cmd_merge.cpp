// SPDX-License-Identifier: MIT
// `stowage merge PARTS...`: joins the partial results of `stowage uncertainty --shard i/N`
// into exactly the result of the unsharded run (optimiser/analysis/shards.h); with --report DIR
// also the uncertainty report of the whole run (optimiser/report/robustness_document.h).
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

int run_merge(const MergeArgs& args) {
  std::optional<report::OutputSet> files;
  refuse_same_directory(args.run.out_dir, args.run.report_dir);
  if (args.run.out_dir) files.emplace(*args.run.out_dir);
  std::optional<report::OutputSet> report_files;
  if (args.run.report_dir) report_files.emplace(*args.run.report_dir, "--report");
  std::vector<UncertaintyPart> parts;
  for (const std::string& path : args.parts) parts.push_back(read_uncertainty_part_file(path));
  const std::vector<SampleRecord> records = join_parts(parts, args.parts);
  // The study as it is now must be the one the shards ran on.
  const UncertaintyPart& first = parts.front();
  const LoadedStudy loaded = load_study_details_file(first.study_path);
  if (report::hash_study_inputs(loaded).digest != first.study_digest) {
    throw InputError(args.parts.front(), 0, 0, "study_digest",
                     "the study's input files have changed since the shards ran (" +
                         first.study_path + "); run the shards again");
  }
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
      "Join the partial results of `stowage uncertainty --shard i/N` runs into the result of "
      "the whole run");
  cmd->add_option("parts", args->parts, "Partial result files, in any order")->required();
  add_format_option(*cmd, args->run.format);
  cmd->add_option("--out", args->run.out_dir,
                  "Also write uncertainty.json, summary.csv and samples.csv into this directory")
      ->type_name("DIR");
  cmd->add_option("--report", args->run.report_dir,
                  "Also write the uncertainty report of the whole run (HTML, Markdown, SVG "
                  "figures and the JSON and CSV it was made from) into this directory")
      ->type_name("DIR");
  cmd->callback(
      [args, &exit_code]() { exit_code = run_guarded([&]() { return run_merge(*args); }); });
}

}  // namespace stowage::cli
