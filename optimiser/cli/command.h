// SPDX-License-Identifier: MIT
// The subcommands of `stowage`. Each registers a CLI11 subcommand on the app; its callback runs
// the command and stores the process exit code in `exit_code`. Exit codes are defined here once
// and copied into docs/usage.md.
#pragma once

#include <CLI/CLI.hpp>

#include "catalog-schema/study_loader.h"
#include "optimiser/optimise.h"
#include "optimiser/report/output_set.h"

namespace stowage::cli {

enum ExitCode : int {
  kExitOk = 0,
  kExitInternalError = 1,
  kExitBadInput = 2,
  kExitInfeasible = 3,  // optimise: no design meets the requirements; tender: no bid does
};

void register_check(CLI::App& app, int& exit_code);
void register_evaluate(CLI::App& app, int& exit_code);
void register_cycles(CLI::App& app, int& exit_code);
void register_optimise(CLI::App& app, int& exit_code);
void register_tender(CLI::App& app, int& exit_code);
void register_report(CLI::App& app, int& exit_code);
void register_sweep(CLI::App& app, int& exit_code);
void register_breakeven(CLI::App& app, int& exit_code);
void register_uncertainty(CLI::App& app, int& exit_code);
void register_merge(CLI::App& app, int& exit_code);

// Adds the study report of `result` to `files` and commits them (cmd_report.cpp); returns
// kExitOk, or kExitInfeasible when no design is feasible (the report then says why).
int write_study_report(report::OutputSet& files, const LoadedStudy& loaded,
                       const OptimiseResult& result);

}  // namespace stowage::cli
