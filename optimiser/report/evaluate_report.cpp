// SPDX-License-Identifier: MIT
#include "optimiser/report/evaluate_report.h"

#include <fmt/format.h>
#include <fmt/ostream.h>

#include <algorithm>

#include "optimiser/report/design_report.h"
#include "optimiser/report/json_writer.h"
#include "optimiser/report/number_format.h"

namespace stowage::report {

namespace {

std::string ranking_remark(const DesignResult& d, const RequirementCheck& c) {
  std::string why;
  if (!c.meets_autonomy) why += "autonomy";
  if (!c.meets_peak) why += std::string(why.empty() ? "" : ", ") + "peak discharge";
  if (!d.meets_unserved_limit)
    why += std::string(why.empty() ? "" : ", ") + "unserved-energy limit";
  return why.empty() ? "" : "  (FAILS " + why + ")";
}

}  // namespace

void write_evaluate_text(std::ostream& out, const StudyCase& study,
                         const std::vector<DesignResult>& results,
                         const std::vector<RequirementCheck>& checks) {
  print_study_header(out, study, "lifecycle evaluation");
  out << "\n";
  for (std::size_t i = 0; i < results.size(); ++i) {
    fmt::print(out, "Design {}: ", i + 1);
    print_design_table(out, results[i], &checks[i]);
    out << "\n";
  }
  std::vector<std::size_t> order(results.size());
  for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
  std::stable_sort(order.begin(), order.end(),
                   [&](std::size_t a, std::size_t b) { return results[a].npc < results[b].npc; });
  const std::string& cur = study.economics.currency;
  fmt::print(out, "Designs by net present cost of serving the site\n");
  fmt::print(out, "{:>4}  {:<28}{:>5}{:>9}{:>11}{:>14}{:>13}{:>13}{:>14}\n", "rank", "profile",
             "DoD", "strings", "kWh", "replacements", "LCOS " + cur, "Schmidt " + cur,
             "NPC " + cur);
  int rank = 1;
  for (std::size_t i : order) {
    const auto& d = results[i];
    fmt::print(out, "{:>4}  {:<28}{:>5.2f}{:>9}{:>11}{:>14}{:>13}{:>13}{:>14}{}\n", rank++,
               d.profile_id, d.dod_setpoint, d.bank.strings_parallel,
               format_amount(d.bank.nameplate_kwh, 1), d.replacement_years.size(),
               lcos_cell(d, d.lcos_per_kwh), lcos_cell(d, d.lcos_schmidt_per_kwh),
               format_amount(d.npc), ranking_remark(d, checks[i]));
  }
  const auto failing = std::count_if(checks.begin(), checks.end(),
                                     [](const RequirementCheck& c) { return !c.meets_all(); });
  if (failing > 0)
    fmt::print(out,
               "{} of {} designs fail the autonomy or peak-discharge requirement: they cannot do "
               "the site's job, and optimise would not offer them, whatever their cost.\n",
               failing, results.size());
  if (std::any_of(results.begin(), results.end(),
                  [](const DesignResult& d) { return !d.delivers_energy(); }))
    out << "LCOS \"none\": " << no_lcos_statement() << ".\n";
  out << "\n";
  print_safety_notice(out);
}

void write_evaluate_json(std::ostream& out, const StudyCase& study,
                         const std::vector<DesignResult>& results,
                         const std::vector<RequirementCheck>& checks) {
  JsonWriter json;
  json.begin_object();
  write_study_json(json, study);
  json.key("designs").begin_array();
  for (std::size_t i = 0; i < results.size(); ++i) write_design_json(json, results[i], &checks[i]);
  json.end_array();
  json.field("notice",
             "Planning estimate only; follow local codes, the manufacturer's instructions and "
             "licensed practice.");
  json.end_object();
  out << json.str() << "\n";
}

}  // namespace stowage::report
