// SPDX-License-Identifier: MIT
// `stowage optimise STUDY`: the profile, DoD setpoint and strings in parallel with the lowest
// lifecycle cost of serving the site (optimiser/optimise.h), the best design of each profile
// ranked with what makes it lose, and the model's estimate against the exact value.
#include <unistd.h>

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <iostream>
#include <memory>
#include <optional>
#include <stdexcept>
#include <utility>

#include "catalog-schema/study_loader.h"
#include "optimiser/analysis/confidence_check.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/optimise.h"
#include "optimiser/report/check_report.h"
#include "optimiser/report/design_report.h"
#include "optimiser/report/optimise_report.h"
#include "optimiser/report/output_set.h"

namespace stowage::cli {

namespace {

struct OptimiseArgs {
  std::string study_path;
  OutputFormat format = OutputFormat::Text;
  std::optional<std::string> out_dir;
  std::optional<std::string> report_dir;
  std::string method = "milp";
  std::optional<double> time_limit_s;
  std::string export_model;
  bool export_model_given = false;
  int days_per_month = 1;
  bool skip_proof = false;
  int threads = 0;
};

// Progress on stderr, only for a terminal and only once a run has lasted a second.
class ProgressLine {
 public:
  ProgressLine() : enabled_(isatty(STDERR_FILENO) == 1) {}
  ~ProgressLine() { finish(); }
  void update(const OptimiseProgress& p) {
    if (!enabled_ || p.seconds < 1.0) return;
    std::cerr << "\r" << report::format_progress(p) << "   ";
    std::cerr.flush();
    shown_ = true;
  }
  void finish() {
    if (shown_) std::cerr << "\r" << std::string(72, ' ') << "\r";
    shown_ = false;
  }

 private:
  bool enabled_;
  bool shown_ = false;
};

}  // namespace

void register_optimise(CLI::App& app, int& exit_code) {
  auto args = std::make_shared<OptimiseArgs>();
  auto* cmd = app.add_subcommand(
      "optimise",
      "Choose the profile, DoD setpoint and strings in parallel with the lowest lifecycle cost");
  cmd->alias("optimize");
  cmd->add_option("study", args->study_path, "Study file (YAML)")->required();
  cmd->add_option("--method", args->method,
                  "milp (default: model-guided search, then a proof by the cost bound), "
                  "bounded (exact search in order of the cost bound, no model) or exhaustive "
                  "(every design through the exact simulator)")
      ->check(CLI::IsMember({"milp", "bounded", "exhaustive"}));
  cmd->add_option("--time-limit", args->time_limit_s,
                  "Stop after this many seconds and report the best design found so far "
                  "(marked not proven optimal)")
      ->check(CLI::PositiveNumber);
  cmd->add_option_function<std::string>(
         "--export-model",
         [args](const std::string& path) {
           args->export_model = path;
           args->export_model_given = true;
         },
         "Write the mixed-integer model of the whole design space (free MPS, or CPLEX "
         "LP when FILE ends in .lp)")
      ->type_name("FILE");
  cmd->add_option("--days-per-month", args->days_per_month,
                  "Representative consecutive days per month in the model (default 1)")
      ->check(CLI::Range(1, 28));
  cmd->add_flag("--skip-proof", args->skip_proof,
                "Stop after the model-guided search: faster, but the answer is only verified by "
                "the model's estimate, not proven optimal");
  cmd->add_option("--threads", args->threads,
                  "Threads for exact evaluations (default 0: every core); the answer does not "
                  "depend on it")
      ->check(CLI::Range(0, 1024));
  add_format_option(*cmd, args->format);
  cmd->add_option("--out", args->out_dir,
                  "Also write designs.csv and cash-flows.csv of the ranking into this directory")
      ->type_name("DIR");
  cmd->add_option("--report", args->report_dir,
                  "Also write the study report (HTML, Markdown, SVG figures, JSON, CSV) into "
                  "this directory")
      ->type_name("DIR");
  cmd->callback([args, &exit_code]() {
    exit_code = run_guarded([&]() {
      // Every output path is refused now, before any work, if it cannot be written.
      std::optional<report::OutputSet> files;
      if (args->out_dir) files.emplace(*args->out_dir);
      std::optional<report::OutputSet> report_files;
      if (args->report_dir) {
        refuse_same_directory(args->out_dir, args->report_dir);
        report_files.emplace(*args->report_dir, "--report");
      }
      std::optional<report::OutputFile> model_file;
      if (args->export_model_given) model_file.emplace("--export-model", args->export_model);
      const LoadedStudy loaded = load_study_details_file(args->study_path);
      report::write_check_notes_text(std::cerr, loaded.notes);  // as check shows them
      const StudyCase& study = loaded.study;
      if (model_file) {
        if (build_design_space(study).admissible_choices() == 0) {
          report::write_no_model_exported(std::cerr, args->export_model);
        } else {
          try {
            export_design_space_model(study, model_file->staging_path(), args->days_per_month);
          } catch (const std::runtime_error& e) {
            throw report::OutputFileError(e.what());
          }
          model_file->commit();
        }
      }
      OptimiseOptions options;
      options.method = *search_method_from_string(args->method);
      options.time_limit_s = args->time_limit_s;
      options.days_per_block = args->days_per_month;
      options.prove = !args->skip_proof;
      options.threads = args->threads;
      ProgressLine progress;
      options.progress = [&progress](const OptimiseProgress& p) { progress.update(p); };
      const OptimiseResult result = optimise(study, options);
      progress.finish();
      if (files && result.feasible()) {
        const report::CsvRunColumns run{study.title, to_string(result.method)};
        files->add("designs.csv", [&](std::ostream& out) {
          report::write_designs_csv(out, result.ranking, nullptr, run);
        });
        files->add("cash-flows.csv", [&](std::ostream& out) {
          report::write_cash_flows_csv(out, result.ranking, run);
        });
        files->commit();
      }
      std::optional<ConfidenceCheck> confidence;
      if (result.feasible()) confidence = check_low_confidence(study, loaded.profiles, result);
      const ConfidenceCheck* check = confidence ? &*confidence : nullptr;
      if (report_files) write_study_report(*report_files, loaded, result, check);
      if (args->format == OutputFormat::Json) {
        report::write_optimise_json(std::cout, study, result, check);
      } else {
        report::write_optimise_text(std::cout, study, result, check);
      }
      return optimise_exit_code(result);
    });
  });
}

}  // namespace stowage::cli
