// SPDX-License-Identifier: MIT
// `stowage evaluate STUDY`: the exact lifecycle of each design of a study.
#include <iostream>
#include <memory>
#include <optional>

#include "optimiser/analysis/evaluate_all.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/report/design_report.h"
#include "optimiser/report/evaluate_report.h"
#include "optimiser/report/output_set.h"

namespace stowage::cli {

namespace {

struct EvaluateArgs {
  std::string study_path;
  OutputFormat format = OutputFormat::Text;
  std::optional<std::string> out_dir;
};

}  // namespace

void register_evaluate(CLI::App& app, int& exit_code) {
  auto args = std::make_shared<EvaluateArgs>();
  auto* cmd = app.add_subcommand(
      "evaluate", "Simulate, age and price each design of a study over the project life");
  cmd->add_option("study", args->study_path, "Study file (YAML)")->required();
  add_format_option(*cmd, args->format);
  cmd->add_option("--out", args->out_dir,
                  "Also write designs.csv and cash-flows.csv into this directory")
      ->type_name("DIR");
  cmd->callback([args, &exit_code]() {
    exit_code = run_guarded([&]() {
      std::optional<report::OutputSet> files;
      if (args->out_dir) files.emplace(*args->out_dir);  // refuses a bad DIR now
      const StudyCase study = load_study_for_cli(args->study_path);
      const std::vector<DesignResult> results = evaluate_all(study);
      const std::vector<RequirementCheck> checks = requirement_checks(study, results);
      // Files first: a failure to write them must not follow a printed success.
      if (files) {
        const report::CsvRunColumns run{study.title, ""};  // no search ran
        files->add("designs.csv", [&](std::ostream& out) {
          report::write_designs_csv(out, results, &checks, run);
        });
        files->add("cash-flows.csv",
                   [&](std::ostream& out) { report::write_cash_flows_csv(out, results, run); });
        files->commit();
      }
      if (args->format == OutputFormat::Json)
        report::write_evaluate_json(std::cout, study, results, checks);
      else
        report::write_evaluate_text(std::cout, study, results, checks);
      return static_cast<int>(kExitOk);
    });
  });
}

}  // namespace stowage::cli
