// SPDX-License-Identifier: MIT
#include "optimiser/cli/analysis_support.h"

#include <unistd.h>

#include <iostream>

#include "model/invalid_value.h"
#include "optimiser/cli/command.h"
#include "optimiser/report/robustness_document.h"
#include "optimiser/report/study_report.h"
#include "optimiser/report/sweep_report.h"
#include "optimiser/report/uncertainty_report.h"

namespace stowage::cli {

void add_run_options(CLI::App& command, RunArgs& args, const std::string& out_files) {
  add_format_option(command, args.format);
  command.add_option("--out", args.out_dir, "Also write " + out_files + " into this directory")
      ->type_name("DIR");
  command
      .add_option("--report", args.report_dir,
                  "Also write the report (HTML, Markdown, SVG figures and the JSON and CSV it "
                  "was made from) into this directory")
      ->type_name("DIR");
  command
      .add_option("--threads", args.threads,
                  "Threads for the points or samples (default 0: every core); the results do "
                  "not depend on it")
      ->check(CLI::Range(0, 1024));
  command.add_flag("--quiet", args.quiet, "No progress line on stderr");
}

std::vector<Variation> variations_with(const LoadedStudy& loaded,
                                       const std::vector<std::string>& vary_options) {
  std::vector<Variation> extra;
  for (const std::string& text : vary_options) {
    extra.push_back(parse_vary_option(text, loaded.study));
  }
  return merge_variations(loaded.variations, extra);
}

void emit_uncertainty(std::optional<report::OutputSet>& files, OutputFormat format,
                      const StudyCase& study, const UncertaintyResult& result) {
  if (files) {
    files->add("uncertainty.json",
               [&](std::ostream& out) { report::write_uncertainty_json(out, study, result); });
    files->add("summary.csv",
               [&](std::ostream& out) { report::write_uncertainty_summary_csv(out, result); });
    files->add("samples.csv",
               [&](std::ostream& out) { report::write_uncertainty_samples_csv(out, result); });
    files->commit();
  }
  if (format == OutputFormat::Json) {
    report::write_uncertainty_json(std::cout, study, result);
  } else {
    report::write_uncertainty_text(std::cout, study, result);
  }
}

std::vector<Variation> sweep_grid_axes(const std::vector<Variation>& all,
                                       const std::vector<std::string>& paths) {
  if (paths.size() > 2) throw InvalidValue("--grid", "names one or two paths, not more");
  if (paths.size() == 2 && paths[0] == paths[1]) {
    throw InvalidValue("--grid", "names " + paths[0] + " twice; give two different paths");
  }
  std::vector<Variation> axes;
  for (const std::string& path : paths) {
    const Variation* found = nullptr;
    for (const Variation& v : all) {
      if (v.path == path) found = &v;
    }
    if (!found) {
      throw InvalidValue("--grid", "no variation for " + path +
                                       "; add it to study.variations or give --vary " + path +
                                       "=LOW:HIGH");
    }
    axes.push_back(*found);
  }
  return axes;
}

int emit_tornado(std::optional<report::OutputSet>& files,
                 std::optional<report::OutputSet>& report_files, OutputFormat format,
                 const LoadedStudy& loaded, const TornadoResult& result) {
  const StudyCase& study = loaded.study;
  if (files) {
    files->add("sweep.json",
               [&](std::ostream& out) { report::write_tornado_json(out, study, result); });
    files->add("tornado.csv",
               [&](std::ostream& out) { report::write_tornado_csv(out, study, result); });
    files->commit();
  }
  if (report_files) {
    report::add_tornado_report_files(*report_files, loaded, result, report::report_timestamp());
    report_files->commit();
  }
  if (format == OutputFormat::Json) {
    report::write_tornado_json(std::cout, study, result);
  } else {
    report::write_tornado_text(std::cout, study, result);
  }
  return static_cast<int>(result.base.feasible() ? kExitOk : kExitInfeasible);
}

int emit_grid(std::optional<report::OutputSet>& files,
              std::optional<report::OutputSet>& report_files, OutputFormat format,
              const LoadedStudy& loaded, const GridResult& result) {
  const StudyCase& study = loaded.study;
  if (files) {
    files->add("sweep.json",
               [&](std::ostream& out) { report::write_grid_json(out, study, result); });
    files->add("grid.csv", [&](std::ostream& out) { report::write_grid_csv(out, study, result); });
    files->commit();
  }
  if (report_files) {
    report::add_grid_report_files(*report_files, loaded, result, report::report_timestamp());
    report_files->commit();
  }
  if (format == OutputFormat::Json) {
    report::write_grid_json(std::cout, study, result);
  } else {
    report::write_grid_text(std::cout, study, result);
  }
  return static_cast<int>(result.base.feasible() ? kExitOk : kExitInfeasible);
}

RunProgress::RunProgress(bool quiet, std::string unit)
    : enabled_(!quiet && isatty(STDERR_FILENO) == 1),
      unit_(std::move(unit)),
      start_(std::chrono::steady_clock::now()),
      last_(start_) {}

RunProgress::~RunProgress() { finish(); }

DoneCallback RunProgress::callback(std::size_t total) {
  if (!enabled_) return {};
  start_ = last_ = std::chrono::steady_clock::now();
  return [this, total](std::size_t done) { show(done, total); };
}

std::function<void(std::size_t, std::size_t)> RunProgress::callback() {
  if (!enabled_) return {};
  start_ = last_ = std::chrono::steady_clock::now();
  return [this](std::size_t done, std::size_t total) { show(done, total); };
}

void RunProgress::show(std::size_t done, std::size_t total) {
  const auto now = std::chrono::steady_clock::now();
  if (done < total && now - last_ < std::chrono::milliseconds(250)) return;
  last_ = now;
  const double seconds = std::chrono::duration<double>(now - start_).count();
  std::cerr << '\r' << report::format_run_progress(done, total, seconds, unit_) << "   ";
  std::cerr.flush();
  shown_ = true;
}

void RunProgress::finish() {
  if (shown_) std::cerr << '\r' << std::string(72, ' ') << '\r';
  shown_ = false;
}

}  // namespace stowage::cli
