// SPDX-License-Identifier: MIT
// `stowage check STUDY`: load and validate every file of a study and say what is wrong.
#include <iostream>
#include <memory>

#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/report/check_report.h"

namespace stowage::cli {

void register_check(CLI::App& app, int& exit_code) {
  auto* cmd = app.add_subcommand(
      "check",
      "Validate a study, its site, hourly series and profiles; report every problem's "
      "file, line and field");
  auto path = std::make_shared<std::string>();
  cmd->add_option("study", *path, "Study file (YAML)")->required();
  cmd->callback([path, &exit_code]() {
    exit_code = run_guarded([&]() {
      const Study study = load_study_for_cli(*path);
      report::write_check_text(std::cout, *path, study);
      return static_cast<int>(kExitOk);
    });
  });
}

}  // namespace stowage::cli
