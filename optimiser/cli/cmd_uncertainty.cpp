// SPDX-License-Identifier: MIT
// `stowage uncertainty STUDY --samples N --seed S`: Monte Carlo or Latin hypercube over the
// distributions of the study's variations (optimiser/analysis/uncertainty.h).
#include <filesystem>
#include <iostream>
#include <memory>
#include <optional>

#include "model/invalid_value.h"
#include "optimiser/analysis/shards.h"
#include "optimiser/analysis/uncertainty.h"
#include "optimiser/cli/analysis_support.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/report/output_set.h"
#include "optimiser/report/robustness_document.h"
#include "optimiser/report/shard_report.h"
#include "optimiser/report/study_hash.h"
#include "optimiser/report/study_report.h"
#include "optimiser/report/uncertainty_report.h"

namespace stowage::cli {

namespace {

struct UncertaintyArgs {
  std::string study_path;
  std::size_t samples = 1000;
  std::uint64_t seed = 1;
  bool lhs = false;
  bool reoptimise = false;
  std::string shard;
  RunArgs run;
};

int run_uncertainty_command(const UncertaintyArgs& args) {
  std::optional<report::OutputSet> files;
  refuse_same_directory(args.run.out_dir, args.run.report_dir);
  if (args.run.out_dir) files.emplace(*args.run.out_dir);
  if (args.run.report_dir && !args.shard.empty()) {
    throw InvalidValue("--report",
                       "needs every sample of the run; it cannot be given with --shard (give "
                       "--report to stowage merge, which joins the shards)");
  }
  std::optional<report::OutputSet> report_files;
  if (args.run.report_dir) report_files.emplace(*args.run.report_dir, "--report");
  const LoadedStudy loaded = load_study_details_file(args.study_path);
  const StudyCase& study = loaded.study;
  UncertaintyOptions options;
  options.samples = args.samples;
  options.seed = args.seed;
  options.latin_hypercube = args.lhs;
  options.reoptimise = args.reoptimise;
  options.threads = args.run.threads;
  RunProgress progress(args.run.quiet, "samples");
  const std::optional<ShardSpec> shard =
      args.shard.empty() ? std::nullopt : std::optional<ShardSpec>(parse_shard(args.shard));
  UncertaintyPart part;
  if (shard) {
    part.shard = *shard;
    part.slice = shard_slice(args.samples, *shard);
  } else {
    part.slice = {0, args.samples};
  }
  options.progress = progress.callback(part.slice.last - part.slice.first);
  const UncertaintySampler sampler(study, loaded.variations, options);
  part.run = sampler.run();
  part.records = sampler.samples(part.slice.first, part.slice.last);
  progress.finish();
  if (!shard) {
    const UncertaintyResult result = summarise_uncertainty(part.run, part.records);
    if (report_files) {
      report::add_uncertainty_report_files(*report_files, loaded, result,
                                           report::report_timestamp());
      report_files->commit();
    }
    emit_uncertainty(files, args.run.format, study, result);
    return kExitOk;
  }
  part.study_path = std::filesystem::absolute(args.study_path).lexically_normal().string();
  part.study_digest = report::hash_study_inputs(loaded).digest;
  if (files) {
    const std::string name =
        "part-" + std::to_string(shard->index) + "-of-" + std::to_string(shard->count) + ".txt";
    files->add(name, [&](std::ostream& out) { report::write_uncertainty_part(out, part); });
    files->commit();
  } else {
    report::write_uncertainty_part(std::cout, part);
  }
  return kExitOk;
}

}  // namespace

void register_uncertainty(CLI::App& app, int& exit_code) {
  auto args = std::make_shared<UncertaintyArgs>();
  auto* cmd = app.add_subcommand(
      "uncertainty",
      "How likely each profile is to be cheapest when the study's inputs are drawn from their "
      "distributions (Monte Carlo or Latin hypercube)");
  cmd->add_option("study", args->study_path, "Study file (YAML)")->required();
  cmd->add_option("--samples", args->samples, "Number of samples (default 1000, at least 2)")
      ->check(CLI::Range(static_cast<std::size_t>(2), static_cast<std::size_t>(100000000)));
  cmd->add_option("--seed", args->seed,
                  "Seed of the draws (default 1); the same seed gives the same samples")
      ->type_name("S");
  cmd->add_flag("--lhs", args->lhs, "Latin hypercube sampling instead of plain Monte Carlo");
  cmd->add_flag("--reoptimise", args->reoptimise,
                "Re-optimise every sample instead of evaluating the base case's designs");
  cmd->add_option("--shard", args->shard,
                  "Evaluate only slice i of N of the samples and write a partial result "
                  "(stdout, or part-i-of-N.txt in --out DIR) for `stowage merge`")
      ->type_name("i/N");
  add_run_options(*cmd, args->run, "uncertainty.json, summary.csv and samples.csv");
  cmd->callback([args, &exit_code]() {
    exit_code = run_guarded([&]() { return run_uncertainty_command(*args); });
  });
}

}  // namespace stowage::cli
