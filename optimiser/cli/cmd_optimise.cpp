// SPDX-License-Identifier: MIT
// `stowage optimise STUDY`: the profile, DoD setpoint and strings in parallel with the lowest
// lifecycle cost of serving the site (optimiser/optimise.h), the best design of each profile
// ranked with what makes it lose, and the model's estimate against the exact value.
#include <fmt/format.h>
#include <fmt/ostream.h>
#include <unistd.h>

#include <algorithm>
#include <cmath>
#include <iostream>
#include <memory>
#include <optional>
#include <stdexcept>
#include <utility>

#include "optimiser/cli/cli_support.h"
#include "optimiser/cli/command.h"
#include "optimiser/cli/design_report.h"
#include "optimiser/cli/output_files.h"
#include "optimiser/optimise.h"
#include "stowage_version.h"

namespace stowage::cli {

namespace {

struct OptimiseArgs {
  std::string study_path;
  OutputFormat format = OutputFormat::Text;
  std::string out_dir;
  std::string method = "milp";
  std::optional<double> time_limit_s;
  std::string export_model;
  int days_per_month = 1;
};

// One item of the cost breakdown (present values).
struct CostItem {
  const char* name;
  double value;
};

std::vector<CostItem> items(const CostBreakdown& b) {
  return {{"investment", b.investment},
          {"replacements", b.replacements},
          {"fixed O&M", b.fixed_om},
          {"variable O&M", b.variable_om},
          {"charging energy", b.charging},
          {"back-up energy", b.backup},
          {"unserved penalty", b.unserved_penalty},
          {"end of life", b.end_of_life},
          {"residual value", b.residual_value}};
}

// The items where `design` costs more (positive) or less than `winner`, biggest first.
std::vector<CostItem> differences(const DesignResult& design, const DesignResult& winner) {
  const auto a = items(design.present_value), b = items(winner.present_value);
  std::vector<CostItem> d;
  for (std::size_t i = 0; i < a.size(); ++i) {
    const double delta = a[i].value - b[i].value;
    if (std::fabs(delta) >= 0.5) d.push_back({a[i].name, delta});
  }
  std::stable_sort(d.begin(), d.end(),
                   [](const CostItem& x, const CostItem& y) { return x.value > y.value; });
  return d;
}

std::string signed_amount(double v) { return (v >= 0 ? "+" : "-") + format_amount(std::fabs(v)); }

void print_header(std::ostream& out, const Study& study, const OptimiseResult& r) {
  print_study_header(out, study,
                     std::string("design optimisation (method ") + to_string(r.method) + ")");
  fmt::print(out,
             "Search space: {} profiles, DoD ladder {:g} to {:g} step {:g}, 1 to {} strings; "
             "{} admissible designs\n",
             study.profiles.size(), study.search.dod_from, study.search.dod_to,
             study.search.dod_step, study.search.max_strings_parallel, r.admissible_designs);
  for (const std::string& note : r.notes) fmt::print(out, "Note: {}\n", note);
  out << "\n";
}

void print_text(const Study& study, const OptimiseResult& r) {
  auto& out = std::cout;
  print_header(out, study, r);
  if (!r.feasible()) {
    if (r.time_limit_reached) {
      fmt::print(out, "No feasible design found before the time limit ({:.1f} s).\n",
                 r.solve_seconds);
    } else {
      out << "No feasible design: no design meets every requirement.\n";
    }
    for (const UnmetRequirement& u : r.unmet)
      fmt::print(out, "  {}: {}\n", u.requirement, u.detail);
    out << "\n";
    print_safety_notice(out);
    return;
  }
  const DesignResult& best = r.best();
  const std::string& cur = study.economics.currency;
  switch (r.status) {
    case Optimality::Proven:
      out << "Best design (proven optimal: every other design was evaluated exactly or is ruled "
             "out by the cost bound):\n";
      break;
    case Optimality::VerifiedByEstimate:
      fmt::print(out,
                 "Best design (verified by estimate, not proven: {} designs were passed over on "
                 "the model's estimate rather than ruled out by the cost bound; "
                 "--method exhaustive proves it):\n",
                 r.designs_unsettled);
      break;
    case Optimality::TimeLimited:
      out << "Best design found so far -- NOT PROVEN OPTIMAL (time limit reached):\n";
      break;
  }
  print_design_table(out, best);
  out << "\n";
  if (std::isfinite(r.model_estimate_npc)) {
    const std::string lcos = std::isfinite(r.model_estimate_per_kwh)
                                 ? fmt::format("{:.4f} {}/kWh", r.model_estimate_per_kwh, cur)
                                 : std::string("n/a (no discharge planned)");
    fmt::print(out,
               "Model estimate of this design: NPC {} {}, LCOS {}; exact NPC {} {}, LCOS "
               "{:.4f} {}/kWh (gap {:+.2f} % of the exact NPC)\n",
               format_amount(r.model_estimate_npc), cur, lcos, format_amount(best.npc), cur,
               best.lcos_per_kwh, cur, 100 * r.gap);
  }
  if (r.method == SearchMethod::Milp) {
    fmt::print(out,
               "Search: {} sub-models solved, {} (profile, DoD) pairs pruned by the cost bound "
               "and {} by the calibrated model estimate; {} of {} designs evaluated exactly in "
               "{:.2f} s\n\n",
               r.submodels_solved, r.pairs_pruned_by_bound, r.pairs_pruned_by_estimate,
               r.designs_evaluated_exactly, r.admissible_designs, r.solve_seconds);
  } else {
    fmt::print(out, "Search: {} of {} designs evaluated exactly in {:.2f} s\n\n",
               r.designs_evaluated_exactly, r.admissible_designs, r.solve_seconds);
  }

  out << "Best design of each profile, by net present cost of serving the site\n";
  fmt::print(out, "{:>4}  {:<28}{:>5}{:>9}{:>11}{:>13}{:>14}{:>14}\n", "rank", "profile", "DoD",
             "strings", "kWh", "LCOS " + cur, "NPC " + cur, "vs best");
  for (std::size_t i = 0; i < r.ranking.size(); ++i) {
    const DesignResult& d = r.ranking[i];
    fmt::print(out, "{:>4}  {:<28}{:>5.2f}{:>9}{:>11}{:>13.4f}{:>14}{:>14}\n", i + 1, d.profile_id,
               d.dod_setpoint, d.bank.strings_parallel, format_amount(d.bank.nameplate_kwh, 1),
               d.lcos_per_kwh, format_amount(d.npc),
               i == 0 ? std::string("-") : signed_amount(d.npc - best.npc));
  }
  if (r.ranking.size() > 1) {
    out << "\nWhy each loses against " << best.profile_id << " (present-value difference, " << cur
        << ", biggest first):\n";
    for (std::size_t i = 1; i < r.ranking.size(); ++i) {
      const DesignResult& d = r.ranking[i];
      fmt::print(out, "  {:<28}", d.profile_id);
      bool first = true;
      for (const CostItem& item : differences(d, best)) {
        fmt::print(out, "{}{} {}", first ? "" : ", ", item.name, signed_amount(item.value));
        first = false;
      }
      out << "\n";
    }
  }
  if (r.method == SearchMethod::Milp && r.ranking.size() > 1) {
    out << "(Other profiles show the best design found where the model pointed; only the "
           "winner is searched to the end.)\n";
  }
  out << "\n";
  print_safety_notice(out);
}

void write_number_or_null(JsonWriter& json, const char* key, double v) {
  json.key(key);
  if (std::isfinite(v)) {
    json.value(v);
  } else {
    json.null();
  }
}

void print_json(const Study& study, const OptimiseResult& r) {
  JsonWriter json;
  json.begin_object();
  write_study_json(json, study);
  json.field("method", to_string(r.method));
  json.field("feasible", r.feasible());
  json.key("designs").begin_array();
  for (const DesignResult& d : r.ranking) write_design_json(json, d);
  json.end_array();
  json.key("best");
  if (r.feasible()) {
    write_design_json(json, r.best());
  } else {
    json.null();
  }
  json.key("ranking").begin_array();
  for (std::size_t i = 0; i < r.ranking.size(); ++i) {
    const DesignResult& d = r.ranking[i];
    json.begin_object();
    json.field("rank", static_cast<int>(i + 1));
    json.field("npc_difference_to_best", d.npc - r.best().npc);
    json.key("loses_on").begin_array();
    if (i > 0) {
      for (const CostItem& item : differences(d, r.best())) {
        json.begin_object().field("item", item.name).field("difference", item.value).end_object();
      }
    }
    json.end_array();
    json.key("design");
    write_design_json(json, d);
    json.end_object();
  }
  json.end_array();
  write_number_or_null(json, "model_estimate_npc", r.model_estimate_npc);
  write_number_or_null(json, "model_estimate_per_kwh", r.model_estimate_per_kwh);
  write_number_or_null(json, "gap", r.gap);
  json.field("solve_seconds", r.solve_seconds);
  json.field("designs_evaluated_exactly", static_cast<long>(r.designs_evaluated_exactly));
  json.field("admissible_designs", static_cast<long>(r.admissible_designs));
  json.field("submodels_solved", static_cast<long>(r.submodels_solved));
  json.field("pairs_pruned_by_bound", static_cast<long>(r.pairs_pruned_by_bound));
  json.field("pairs_pruned_by_estimate", static_cast<long>(r.pairs_pruned_by_estimate));
  json.field("optimality", to_string(r.status));
  json.field("proven_optimal", r.proven_optimal());
  json.field("designs_unsettled", static_cast<long>(r.designs_unsettled));
  json.field("time_limit_reached", r.time_limit_reached);
  json.key("unmet").begin_array();
  for (const UnmetRequirement& u : r.unmet) {
    json.begin_object()
        .field("requirement", u.requirement)
        .field("detail", u.detail)
        .field("needed", u.needed)
        .field("best_available", u.best_available)
        .end_object();
  }
  json.end_array();
  json.key("notes").begin_array();
  for (const std::string& n : r.notes) json.value(n);
  json.end_array();
  json.field("notice",
             "Planning estimate only; follow local codes, the manufacturer's instructions and "
             "licensed practice.");
  json.end_object();
  std::cout << json.str() << "\n";
}

// Progress on stderr, only for a terminal and only once a run has lasted a second.
class ProgressLine {
 public:
  ProgressLine() : enabled_(isatty(STDERR_FILENO) == 1) {}
  ~ProgressLine() { finish(); }
  void update(const OptimiseProgress& p) {
    if (!enabled_ || p.seconds < 1.0) return;
    std::string best = std::isfinite(p.best_npc) ? format_amount(p.best_npc) : "none yet";
    fmt::print(std::cerr, "\r  {} {}/{}, best NPC {}, {:.1f} s   ", p.phase, p.done, p.total, best,
               p.seconds);
    std::cerr.flush();
    shown_ = true;
  }
  void finish() {
    if (shown_) std::cerr << "\r" << std::string(72, ' ') << "\r";
    shown_ = false;
  }

 private:
  bool enabled_;
  bool shown_ = false;
};

}  // namespace

void register_optimise(CLI::App& app, int& exit_code) {
  auto args = std::make_shared<OptimiseArgs>();
  auto* cmd = app.add_subcommand(
      "optimise",
      "Choose the profile, DoD setpoint and strings in parallel with the lowest lifecycle cost");
  cmd->add_option("study", args->study_path, "Study file (YAML)")->required();
  cmd->add_option("--method", args->method,
                  "milp (default: model-guided search with exact verification) or exhaustive "
                  "(every design through the exact simulator)")
      ->check(CLI::IsMember({"milp", "exhaustive"}));
  cmd->add_option("--time-limit", args->time_limit_s,
                  "Stop after this many seconds and report the best design found so far "
                  "(marked not proven optimal)")
      ->check(CLI::PositiveNumber);
  cmd->add_option("--export-model", args->export_model,
                  "Write the mixed-integer model of the whole design space (free MPS, or CPLEX "
                  "LP when FILE ends in .lp)")
      ->type_name("FILE");
  cmd->add_option("--days-per-month", args->days_per_month,
                  "Representative consecutive days per month in the model (default 1)")
      ->check(CLI::Range(1, 28));
  add_format_option(*cmd, args->format);
  cmd->add_option("--out", args->out_dir,
                  "Also write designs.csv and cash-flows.csv of the ranking into this directory")
      ->type_name("DIR");
  cmd->callback([args, &exit_code]() {
    exit_code = run_guarded([&]() {
      const Study study = load_study_for_cli(args->study_path);
      if (!args->export_model.empty()) {
        if (build_design_space(study).admissible_choices() == 0) {
          std::cerr << "stowage: no admissible design, so no model was written to "
                    << args->export_model << "\n";
        } else {
          try {
            export_design_space_model(study, args->export_model, args->days_per_month);
          } catch (const std::runtime_error& e) {
            throw OutputFileError(e.what());
          }
        }
      }
      OptimiseOptions options;
      options.method = *search_method_from_string(args->method);
      options.time_limit_s = args->time_limit_s;
      options.days_per_block = args->days_per_month;
      ProgressLine progress;
      options.progress = [&progress](const OptimiseProgress& p) { progress.update(p); };
      const OptimiseResult result = optimise(study, options);
      progress.finish();
      if (!args->out_dir.empty() && result.feasible()) {
        write_output_files(args->out_dir, {{"designs.csv", designs_summary_csv(result.ranking)},
                                           {"cash-flows.csv", cash_flows_csv(result.ranking)}});
      }
      if (args->format == OutputFormat::Json) {
        print_json(study, result);
      } else {
        print_text(study, result);
      }
      return static_cast<int>(result.feasible() ? kExitOk : kExitInfeasible);
    });
  });
}

}  // namespace stowage::cli
