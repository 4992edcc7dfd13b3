// SPDX-License-Identifier: MIT
#include "optimiser/cli/cli_support.h"

#include <fmt/format.h>

#include <cmath>
#include <iostream>

#include "catalog-schema/input_error.h"
#include "catalog-schema/study_loader.h"
#include "model/invalid_value.h"
#include "optimiser/cli/command.h"
#include "optimiser/cli/output_files.h"

namespace stowage::cli {

int run_guarded(const std::function<int()>& body) {
  try {
    return body();
  } catch (const InputError& e) {
    std::cerr << "stowage: " << e.what() << "\n";
    return kExitBadInput;
  } catch (const InvalidValue& e) {
    std::cerr << "stowage: invalid value: " << e.what() << "\n";
    return kExitBadInput;
  } catch (const OutputFileError& e) {
    std::cerr << "stowage: " << e.what() << "\n";
    return kExitBadInput;
  } catch (const std::exception& e) {
    std::cerr << "stowage: internal error: " << e.what() << "\n";
    return kExitInternalError;
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

Study load_study_for_cli(const std::string& path) { return load_study_file(path); }

std::string format_amount(double value, int decimals) {
  if (!std::isfinite(value)) return "n/a";
  std::string digits = fmt::format("{:.{}f}", std::fabs(value), decimals);
  const std::size_t dot = digits.find('.');
  std::size_t int_end = dot == std::string::npos ? digits.size() : dot;
  std::string out;
  for (std::size_t i = 0; i < int_end; ++i) {
    if (i > 0 && (int_end - i) % 3 == 0) out += ',';
    out += digits[i];
  }
  out += digits.substr(int_end);
  const bool negative = value < 0 && std::stod(digits) != 0.0;
  return negative ? "-" + out : out;
}

}  // namespace stowage::cli
