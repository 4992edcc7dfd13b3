// SPDX-License-Identifier: MIT
// `stowage evaluate STUDY`: the exact lifecycle of each design of a study.
#include <fmt/format.h>
#include <fmt/ostream.h>

#include <algorithm>
#include <iostream>
#include <map>
#include <memory>

#include "model/lifecycle.h"
#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/cli/design_report.h"
#include "optimiser/cli/output_files.h"
#include "stowage_version.h"

namespace stowage::cli {

namespace {

struct EvaluateArgs {
  std::string study_path;
  OutputFormat format = OutputFormat::Text;
  std::string out_dir;
};

std::vector<DesignResult> evaluate_all(const Study& study) {
  std::vector<DesignResult> results;
  std::map<const ChemistryProfile*, std::unique_ptr<LifecycleEvaluator>> evaluators;
  for (const ResolvedDesign& d : resolve_designs(study)) {
    auto& ev = evaluators[d.profile];
    if (!ev) ev = std::make_unique<LifecycleEvaluator>(*d.profile, study.site, study.economics);
    results.push_back(ev->evaluate(d.dod_setpoint, d.strings_parallel));
  }
  return results;
}

void print_text(const Study& study, const std::vector<DesignResult>& results) {
  auto& out = std::cout;
  print_study_header(out, study, "lifecycle evaluation");
  out << "\n";
  for (std::size_t i = 0; i < results.size(); ++i) {
    fmt::print(out, "Design {}: ", i + 1);
    print_design_table(out, results[i]);
    out << "\n";
  }
  std::vector<std::size_t> order(results.size());
  for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
  std::stable_sort(order.begin(), order.end(),
                   [&](std::size_t a, std::size_t b) { return results[a].npc < results[b].npc; });
  const std::string& cur = study.economics.currency;
  fmt::print(out, "Designs by net present cost of serving the site\n");
  fmt::print(out, "{:>4}  {:<28}{:>5}{:>9}{:>11}{:>14}{:>13}{:>14}\n", "rank", "profile", "DoD",
             "strings", "kWh", "replacements", "LCOS " + cur, "NPC " + cur);
  int rank = 1;
  for (std::size_t i : order) {
    const auto& d = results[i];
    fmt::print(out, "{:>4}  {:<28}{:>5.2f}{:>9}{:>11}{:>14}{:>13.4f}{:>14}{}\n", rank++,
               d.profile_id, d.dod_setpoint, d.bank.strings_parallel,
               format_amount(d.bank.nameplate_kwh, 1), d.replacement_years.size(), d.lcos_per_kwh,
               format_amount(d.npc),
               d.meets_unserved_limit ? "" : "  (misses the unserved-energy limit)");
  }
  out << "\n";
  print_safety_notice(out);
}

void print_json(const Study& study, const std::vector<DesignResult>& results) {
  JsonWriter json;
  json.begin_object();
  write_study_json(json, study);
  json.key("designs").begin_array();
  for (const auto& d : results) write_design_json(json, d);
  json.end_array();
  json.field("notice",
             "Planning estimate only; follow local codes, the manufacturer's instructions and "
             "licensed practice.");
  json.end_object();
  std::cout << json.str() << "\n";
}

}  // namespace

void register_evaluate(CLI::App& app, int& exit_code) {
  auto args = std::make_shared<EvaluateArgs>();
  auto* cmd = app.add_subcommand(
      "evaluate", "Simulate, age and price each design of a study over the project life");
  cmd->add_option("study", args->study_path, "Study file (YAML)")->required();
  add_format_option(*cmd, args->format);
  cmd->add_option("--out", args->out_dir,
                  "Also write designs.csv and cash-flows.csv into this directory")
      ->type_name("DIR");
  cmd->callback([args, &exit_code]() {
    exit_code = run_guarded([&]() {
      const Study study = load_study_for_cli(args->study_path);
      const std::vector<DesignResult> results = evaluate_all(study);
      // Files first: a failure to write them must not follow a printed success.
      if (!args->out_dir.empty())
        write_output_files(args->out_dir, {{"designs.csv", designs_summary_csv(results)},
                                           {"cash-flows.csv", cash_flows_csv(results)}});
      if (args->format == OutputFormat::Json)
        print_json(study, results);
      else
        print_text(study, results);
      return static_cast<int>(kExitOk);
    });
  });
}

}  // namespace stowage::cli
