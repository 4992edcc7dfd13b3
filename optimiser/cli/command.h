// SPDX-License-Identifier: MIT
// The subcommands of `stowage`. Each registers a CLI11 subcommand on the app; its callback runs
// the command and stores the process exit code in `exit_code`. Exit codes are defined here once
// (the enum and its table kExitCodeTable); `stowage --help` prints the table and docs/usage.md
// copies it (tests/e2e/exit_codes.sh checks that the two agree).
#pragma once

#include <CLI/CLI.hpp>
#include <array>
#include <string>

#include "catalog-schema/study_loader.h"
#include "optimiser/analysis/confidence_check.h"
#include "optimiser/optimise.h"
#include "optimiser/report/output_set.h"

namespace stowage::cli {

enum ExitCode : int {
  kExitOk = 0,
  kExitInternalError = 1,
  kExitBadInput = 2,
  kExitInfeasible = 3,         // optimise: no design meets the requirements; tender: no bid does
  kExitTimeLimitNoDesign = 4,  // optimise: the time limit passed before any feasible design
};

struct ExitCodeMeaning {
  ExitCode code;
  const char* meaning;
};
inline constexpr std::array<ExitCodeMeaning, 5> kExitCodeTable{{
    {kExitOk, "success"},
    {kExitInternalError,
     "internal error: a broken internal contract or an unexpected failure; a bug, please "
     "report it with the input"},
    {kExitBadInput,
     "bad input: a file, a field, an option or an output path; the message says where"},
    {kExitInfeasible,
     "optimise and report: no design meets the study's requirements (the message says which "
     "and by how much); tender: no bid meets the tender's requirements; sweep: the base case has "
     "no design meeting them"},
    {kExitTimeLimitNoDesign,
     "optimise --time-limit: the time limit passed before any feasible design was found; "
     "nothing is known about feasibility, so run again with a longer limit"},
}};

// The "Exit codes:" section that `stowage --help` ends with, from kExitCodeTable.
std::string exit_code_help();

// The exit code of an optimisation: kExitOk with a feasible design, kExitTimeLimitNoDesign when
// the time limit passed before one was found, kExitInfeasible when none meets the requirements.
int optimise_exit_code(const OptimiseResult& result);

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
// optimise_exit_code(result) (with no feasible design the report says why).
int write_study_report(report::OutputSet& files, const LoadedStudy& loaded,
                       const OptimiseResult& result, const ConfidenceCheck* confidence);

}  // namespace stowage::cli
