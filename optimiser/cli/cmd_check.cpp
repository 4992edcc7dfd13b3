// SPDX-License-Identifier: MIT
// `stowage check STUDY [--format text|json]`: load and validate every file of a study and say
// everything that is wrong in one run (catalog-schema/study_check.h says how far that goes).
#include <iostream>
#include <memory>

#include "catalog-schema/study_check.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/report/check_report.h"

namespace stowage::cli {

namespace {

struct CheckArgs {
  std::string study_path;
  OutputFormat format = OutputFormat::Text;
};

}  // namespace

void register_check(CLI::App& app, int& exit_code) {
  auto* cmd = app.add_subcommand(
      "check",
      "Validate a study, its site, hourly series and profiles; report every problem's "
      "file, line and field");
  auto args = std::make_shared<CheckArgs>();
  cmd->add_option("study", args->study_path, "Study file (YAML)")->required();
  add_format_option(*cmd, args->format);
  cmd->callback([args, &exit_code]() {
    exit_code = run_guarded([&]() {
      const StudyCheck result = check_study_file(args->study_path);
      static const std::vector<InputNote> kNone;
      const std::vector<InputNote>& notes = result.study ? result.study->notes : kNone;
      if (args->format == OutputFormat::Json) {
        report::write_check_json(std::cout, args->study_path,
                                 result.study ? &result.study->study : nullptr, result.problems,
                                 notes);
      } else if (result.study) {
        report::write_check_notes_text(std::cerr, notes);
        report::write_check_text(std::cout, args->study_path, result.study->study);
      } else {
        report::write_check_problems_text(std::cerr, args->study_path, result.problems);
      }
      return static_cast<int>(result.study ? kExitOk : kExitBadInput);
    });
  });
}

}  // namespace stowage::cli
