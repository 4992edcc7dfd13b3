// SPDX-License-Identifier: MIT
// `stowage breakeven STUDY --vary PATH --between A B`: the value of one input at which a
// profile's best design ties the cheapest other profile's (optimiser/analysis/breakeven.h).
#include <iostream>
#include <memory>
#include <optional>

#include "model/invalid_value.h"
#include "optimiser/analysis/breakeven.h"
#include "optimiser/cli/analysis_support.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/report/breakeven_report.h"
#include "optimiser/report/output_set.h"
#include "optimiser/report/robustness_document.h"
#include "optimiser/report/study_report.h"

namespace stowage::cli {

namespace {

struct BreakevenArgs {
  std::string study_path;
  std::string path;
  std::vector<double> between;
  std::string profile;
  double tolerance = 0;
  int scan_points = 8;
  bool hold_designs = false;
  RunArgs run;
};

int run_breakeven(const BreakevenArgs& args) {
  std::optional<report::OutputSet> files;
  refuse_same_directory(args.run.out_dir, args.run.report_dir);
  if (args.run.out_dir) files.emplace(*args.run.out_dir);
  std::optional<report::OutputSet> report_files;
  if (args.run.report_dir) report_files.emplace(*args.run.report_dir, "--report");
  const LoadedStudy loaded = load_study_details_file(args.study_path);
  const StudyCase& study = loaded.study;
  BreakevenOptions options;
  options.path = args.path;
  if (args.between.size() == 2) {
    options.from = args.between[0];
    options.to = args.between[1];
  } else {
    const Variation* found = nullptr;
    for (const Variation& v : loaded.variations) {
      if (v.path == args.path) found = &v;
    }
    if (!found) {
      throw InvalidValue("--between", "give the range A B: the study has no variation for " +
                                          args.path + " to take it from");
    }
    options.from = found->low;
    options.to = found->high;
  }
  if (!(options.from < options.to)) {
    throw InvalidValue("--between", "A must be below B");
  }
  options.profile_id = args.profile;
  options.tolerance = args.tolerance;
  options.scan_points = args.scan_points;
  options.hold_designs = args.hold_designs;
  options.threads = args.run.threads;
  RunProgress progress(args.run.quiet, "evaluations");
  options.progress = progress.callback();
  const BreakevenResult result = find_breakeven(study, options);
  progress.finish();
  if (files) {
    files->add("breakeven.json",
               [&](std::ostream& out) { report::write_breakeven_json(out, study, result); });
    files->add("probes.csv", [&](std::ostream& out) { report::write_breakeven_csv(out, result); });
    files->commit();
  }
  if (report_files) {
    report::add_breakeven_report_files(*report_files, loaded, result, report::report_timestamp());
    report_files->commit();
  }
  if (args.run.format == OutputFormat::Json) {
    report::write_breakeven_json(std::cout, study, result);
  } else {
    report::write_breakeven_text(std::cout, study, result);
  }
  return kExitOk;
}

}  // namespace

void register_breakeven(CLI::App& app, int& exit_code) {
  auto args = std::make_shared<BreakevenArgs>();
  auto* cmd = app.add_subcommand(
      "breakeven",
      "The value of one input at which a profile's best design costs as much as the cheapest "
      "other profile's");
  cmd->add_option("study", args->study_path, "Study file (YAML)")->required();
  cmd->add_option("--vary", args->path, "Parameter path of the input to move")
      ->required()
      ->type_name("PATH");
  cmd->add_option("--between", args->between,
                  "The range to search, A below B (default: the study's variation of PATH, "
                  "low to high)")
      ->expected(2)
      ->type_name("A B");
  cmd->add_option("--profile", args->profile,
                  "Profile id whose tie is sought (default: the base case's runner-up)")
      ->type_name("ID");
  cmd->add_option("--tolerance", args->tolerance,
                  "Bracket width to stop at, in the input's unit (default: range x 1e-4)")
      ->check(CLI::NonNegativeNumber);
  cmd->add_option("--scan-points", args->scan_points,
                  "Values scanned between A and B before bisection (default 8)")
      ->check(CLI::Range(0, 1000));
  cmd->add_flag("--hold-designs", args->hold_designs,
                "Evaluate the base case's designs instead of re-optimising at each value");
  add_run_options(*cmd, args->run, "breakeven.json and probes.csv");
  cmd->callback(
      [args, &exit_code]() { exit_code = run_guarded([&]() { return run_breakeven(*args); }); });
}

}  // namespace stowage::cli
