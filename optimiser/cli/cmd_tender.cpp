// SPDX-License-Identifier: MIT
// `stowage tender TENDER`: every bid of a tender on the same duty, warranties applied as cash
// flows, checked against the requirements and scored (optimiser/analysis/tender.h); with
// --report DIR also the tender report (optimiser/report/tender_document.h).
#include <iostream>
#include <memory>
#include <optional>

#include "catalog-schema/tender_loader.h"
#include "optimiser/analysis/tender.h"
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
                  "Also write bids.csv, designs.csv and cash-flows.csv into this directory")
      ->type_name("DIR");
  cmd->add_option("--report", args->report_dir,
                  "Also write the tender report (HTML, Markdown, SVG figure, JSON, CSV) into "
                  "this directory")
      ->type_name("DIR");
  cmd->callback([args, &exit_code]() {
    exit_code = run_guarded([&]() {
      std::optional<report::OutputSet> files;
      if (args->out_dir) files.emplace(*args->out_dir);  // refuses a bad DIR now
      std::optional<report::OutputSet> report_files;
      if (args->report_dir) report_files.emplace(*args->report_dir);
      const TenderCase tender = load_tender_file(args->tender_path);
      const TenderResult result = evaluate_tender(tender);
      if (files) {
        std::vector<DesignResult> designs;
        for (const BidResult& b : result.bids) designs.push_back(b.design);
        files->add("bids.csv",
                   [&](std::ostream& out) { report::write_tender_csv(out, tender, result); });
        files->add("designs.csv",
                   [&](std::ostream& out) { report::write_designs_csv(out, designs); });
        files->add("cash-flows.csv",
                   [&](std::ostream& out) { report::write_cash_flows_csv(out, designs); });
        files->commit();
      }
      if (report_files) {
        report::TenderReportInputs inputs;
        inputs.tender = &tender;
        inputs.result = &result;
        inputs.generated_at = report::report_timestamp();
        report::add_tender_report_files(*report_files, inputs);
        report_files->commit();
      }
      if (args->format == OutputFormat::Json) {
        report::write_tender_json(std::cout, tender, result);
      } else {
        report::write_tender_text(std::cout, tender, result);
      }
      return static_cast<int>(result.order.empty() ? kExitInfeasible : kExitOk);
    });
  });
}

}  // namespace stowage::cli
