// SPDX-License-Identifier: MIT
// stowage: lifecycle cost of battery storage at a site. See README.md and docs/usage.md.
#include <CLI/CLI.hpp>
#include <exception>
#include <iostream>

#include "optimiser/cli/command.h"
#include "optimiser/report/messages.h"
#include "stowage_version.h"

int main(int argc, char** argv) {
  CLI::App app{
      "stowage " STOWAGE_VERSION_STRING
      ": simulate, age and price battery banks at a site over the project life,\n"
      "and find the chemistry, DoD setpoint and bank size with the lowest lifecycle cost."};
  app.set_version_flag("-V,--version", "stowage " STOWAGE_VERSION_STRING);
  app.footer(stowage::cli::exit_code_help());
  app.require_subcommand(1);
  int exit_code = stowage::cli::kExitOk;
  stowage::cli::register_check(app, exit_code);
  stowage::cli::register_evaluate(app, exit_code);
  stowage::cli::register_cycles(app, exit_code);
  stowage::cli::register_optimise(app, exit_code);
  stowage::cli::register_tender(app, exit_code);
  stowage::cli::register_report(app, exit_code);
  stowage::cli::register_sweep(app, exit_code);
  stowage::cli::register_breakeven(app, exit_code);
  stowage::cli::register_uncertainty(app, exit_code);
  stowage::cli::register_merge(app, exit_code);
  try {
    app.parse(argc, argv);
  } catch (const CLI::ParseError& e) {
    // --help and --version are success; usage mistakes are bad input (exit 2), worded as
    // every other failure is.
    if (e.get_exit_code() == static_cast<int>(CLI::ExitCodes::Success)) {
      app.exit(e);
      return stowage::cli::kExitOk;
    }
    stowage::report::write_failure(std::cerr, stowage::report::Failure::Usage, e.what());
    return stowage::cli::kExitBadInput;
  } catch (const std::exception& e) {
    stowage::report::write_failure(std::cerr, stowage::report::Failure::Internal, e.what());
    return stowage::cli::kExitInternalError;
  }
  return exit_code;
}
