// SPDX-License-Identifier: MIT
#include "optimiser/cli/cli_support.h"

#include <filesystem>
#include <iostream>
#include <sstream>
#include <utility>

#include "catalog-schema/input_error.h"
#include "catalog-schema/study_loader.h"
#include "model/invalid_value.h"
#include "optimiser/cli/command.h"
#include "optimiser/report/check_report.h"
#include "optimiser/report/messages.h"
#include "optimiser/report/output_set.h"

namespace stowage::cli {

int run_guarded(const std::function<int()>& body) {
  using report::Failure;
  try {
    return body();
  } catch (const InputError& e) {
    report::write_failure(std::cerr, Failure::BadInput, e.what());
    return kExitBadInput;
  } catch (const InvalidValue& e) {
    report::write_failure(std::cerr, Failure::InvalidValue, e.what());
    return kExitBadInput;
  } catch (const report::OutputFileError& e) {
    report::write_failure(std::cerr, Failure::Output, e.what());
    return kExitBadInput;
  } catch (const std::exception& e) {
    // ContractViolation and everything unexpected: a bug, not the user's input.
    report::write_failure(std::cerr, Failure::Internal, e.what());
    return kExitInternalError;
  }
}

void refuse_same_directory(const std::optional<std::string>& out_dir,
                           const std::optional<std::string>& report_dir) {
  if (!out_dir || !report_dir) return;
  namespace fs = std::filesystem;
  const auto canonical = [](const std::string& path) {
    std::error_code ec;
    fs::path p = fs::weakly_canonical(fs::absolute(path, ec), ec).lexically_normal();
    return p.has_filename() ? p : p.parent_path();  // "dir/" names dir
  };
  if (canonical(*out_dir) == canonical(*report_dir)) {
    throw report::OutputFileError("--out and --report name the same directory '" + *report_dir +
                                  "'; each needs its own, or use --report alone (the report "
                                  "holds the CSV files too)");
  }
}

void add_format_option(CLI::App& command, OutputFormat& format) {
  command
      .add_option_function<std::string>(
          "--format",
          [&format](const std::string& name) {
            format = name == "json" ? OutputFormat::Json : OutputFormat::Text;
          },
          "Output format: text (default) or json")
      ->check(CLI::IsMember({"text", "json"}))
      ->type_name("FORMAT");
}

std::string exit_code_help() {
  constexpr std::size_t kWidth = 78;
  const std::string indent = "     ";
  std::string text = "Exit codes:\n";
  for (const ExitCodeMeaning& row : kExitCodeTable) {
    std::string line = "  " + std::to_string(static_cast<int>(row.code)) + "  ";
    std::istringstream words(row.meaning);
    bool first = true;
    for (std::string word; words >> word; first = false) {
      if (!first && line.size() + 1 + word.size() > kWidth) {
        text += line + "\n";
        line = indent + word;
      } else {
        line += (first ? "" : " ") + word;
      }
    }
    text += line + "\n";
  }
  return text;
}

int optimise_exit_code(const OptimiseResult& result) {
  if (result.feasible()) return kExitOk;
  return result.time_limit_reached ? kExitTimeLimitNoDesign : kExitInfeasible;
}

StudyCase load_study_for_cli(const std::string& path) {
  LoadedStudy loaded = load_study_details_file(path);
  report::write_check_notes_text(std::cerr, loaded.notes);  // the notes check shows, on stderr
  return std::move(loaded.study);
}

}  // namespace stowage::cli
