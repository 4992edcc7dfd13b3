// SPDX-License-Identifier: MIT
// `stowage tender TENDER`: every bid of a tender on the same duty, warranties applied as cash
// flows, checked against the requirements and scored (optimiser/analysis/tender.h); with
// --report DIR also the tender report (optimiser/report/tender_document.h). When the tender
// file has variations with distributions, the tender is also sampled over them
// (optimiser/analysis/tender_uncertainty.h) and the near tie is called from the samples.
#include <iostream>
#include <memory>
#include <optional>

#include "catalog-schema/tender_loader.h"
#include "optimiser/analysis/tender.h"
#include "optimiser/analysis/tender_uncertainty.h"
#include "optimiser/cli/analysis_support.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/report/design_report.h"
#include "optimiser/report/output_set.h"
#include "optimiser/report/study_report.h"
#include "optimiser/report/tender_document.h"
#include "optimiser/report/tender_report.h"

namespace stowage::cli {

namespace {

struct TenderArgs {
  std::string tender_path;
  OutputFormat format = OutputFormat::Text;
  std::optional<std::string> out_dir;
  std::optional<std::string> report_dir;
  std::size_t samples = TenderUncertaintyOptions{}.samples;
  std::uint64_t seed = TenderUncertaintyOptions{}.seed;
  int threads = 0;
  bool quiet = false;
};

}  // namespace

void register_tender(CLI::App& app, int& exit_code) {
  auto args = std::make_shared<TenderArgs>();
  auto* cmd = app.add_subcommand(
      "tender",
      "Put every bid of a tender on one lifecycle-cost basis for the same duty, with its "
      "warranty, check it against the requirements and score it");
  cmd->add_option("tender", args->tender_path, "Tender file (YAML)")->required();
  add_format_option(*cmd, args->format);
  cmd->add_option("--out", args->out_dir,
                  "Also write bids.csv, designs.csv and cash-flows.csv (and bid-uncertainty.csv "
                  "when the tender has variations) into this directory")
      ->type_name("DIR");
  cmd->add_option("--report", args->report_dir,
                  "Also write the tender report (HTML, Markdown, SVG figure, JSON, CSV) into "
                  "this directory")
      ->type_name("DIR");
  cmd->add_option("--samples", args->samples,
                  "Draws of the tender's variations, when it has any with a distribution "
                  "(default 1000, at least 2)")
      ->check(CLI::Range(static_cast<std::size_t>(2), static_cast<std::size_t>(1000000)));
  cmd->add_option("--seed", args->seed,
                  "Seed of the draws (default 1); the same seed gives the same samples")
      ->type_name("S");
  cmd->add_option("--threads", args->threads,
                  "Threads for the samples (default 0: every core); the results do not depend "
                  "on it")
      ->check(CLI::Range(0, 1024));
  cmd->add_flag("--quiet", args->quiet, "No progress line on stderr");
  cmd->callback([args, &exit_code]() {
    exit_code = run_guarded([&]() {
      std::optional<report::OutputSet> files;
      refuse_same_directory(args->out_dir, args->report_dir);
      if (args->out_dir) files.emplace(*args->out_dir);  // refuses a bad DIR now
      std::optional<report::OutputSet> report_files;
      if (args->report_dir) report_files.emplace(*args->report_dir, "--report");
      const TenderCase tender = load_tender_file(args->tender_path);
      const TenderResult result = evaluate_tender(tender);
      std::optional<TenderUncertainty> sampled;
      if (!tender.variations.empty()) {
        RunProgress progress(args->quiet, "samples");
        TenderUncertaintyOptions options;
        options.samples = args->samples;
        options.seed = args->seed;
        options.threads = args->threads;
        options.progress = progress.callback(args->samples);
        sampled = run_tender_uncertainty(tender, result, options);
        progress.finish();
      }
      const TenderUncertainty* uncertainty = sampled ? &*sampled : nullptr;
      if (files) {
        std::vector<DesignResult> designs;
        for (const BidResult& b : result.bids) designs.push_back(b.design);
        files->add("bids.csv",
                   [&](std::ostream& out) { report::write_tender_csv(out, tender, result); });
        // Each bid is evaluated as offered: no search ran, so `method` stays empty.
        const report::CsvRunColumns run{tender.title, ""};
        files->add("designs.csv", [&](std::ostream& out) {
          report::write_designs_csv(out, designs, nullptr, run);
        });
        files->add("cash-flows.csv",
                   [&](std::ostream& out) { report::write_cash_flows_csv(out, designs, run); });
        if (uncertainty) {
          files->add("bid-uncertainty.csv", [&](std::ostream& out) {
            report::write_tender_uncertainty_csv(out, *uncertainty);
          });
        }
        files->commit();
      }
      if (report_files) {
        report::TenderReportInputs inputs;
        inputs.tender = &tender;
        inputs.result = &result;
        inputs.generated_at = report::report_timestamp();
        inputs.uncertainty = uncertainty;
        report::add_tender_report_files(*report_files, inputs);
        report_files->commit();
      }
      if (args->format == OutputFormat::Json) {
        report::write_tender_json(std::cout, tender, result, uncertainty);
      } else {
        report::write_tender_text(std::cout, tender, result, uncertainty);
      }
      return static_cast<int>(result.order.empty() ? kExitInfeasible : kExitOk);
    });
  });
}

}  // namespace stowage::cli
