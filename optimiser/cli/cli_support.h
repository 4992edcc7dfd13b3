// SPDX-License-Identifier: MIT
// What every subcommand shares: running a command body with the error-to-exit-code mapping,
// the output format option, and loading a study for the command line.
#pragma once

#include <CLI/CLI.hpp>
#include <functional>
#include <optional>
#include <string>

#include "catalog-schema/study_case.h"

namespace stowage::cli {

// Runs `body` and returns its exit code; bad input (InputError, InvalidValue, an output path
// that cannot be written) prints "stowage: <where>: <what>" on stderr and gives kExitBadInput;
// anything else, ContractViolation included, is an internal error (kExitInternalError).
int run_guarded(const std::function<int()>& body);

enum class OutputFormat { Text, Json };
// Adds --format text|json bound to `format`.
void add_format_option(CLI::App& command, OutputFormat& format);

// Throws OutputFileError (bad input) when --out and --report are both given and name one
// directory (as written, or once both exist): each output set needs its own.
void refuse_same_directory(const std::optional<std::string>& out_dir,
                           const std::optional<std::string>& report_dir);

// Loads and validates a study file; throws InputError naming file, line and field.
StudyCase load_study_for_cli(const std::string& path);

}  // namespace stowage::cli
