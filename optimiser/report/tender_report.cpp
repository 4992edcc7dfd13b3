// SPDX-License-Identifier: MIT
#include "optimiser/report/tender_report.h"

#include <fmt/format.h>
#include <fmt/ostream.h>

#include <algorithm>
#include <cmath>
#include <string>

#include "optimiser/report/cost_lines.h"
#include "optimiser/report/design_report.h"
#include "optimiser/report/json_writer.h"
#include "optimiser/report/number_format.h"
#include "optimiser/report/report_document.h"
#include "optimiser/report/uncertainty_report.h"
#include "stowage_version.h"

namespace stowage::report {

namespace {

std::string life_text(double years) {
  return std::isfinite(years) ? format_fixed(years, 1) + " y" : std::string("beyond any horizon");
}

std::string shortfall_text(const Shortfall& s) {
  if (s.kind == Shortfall::Kind::UsableEnergy) {
    return "usable energy " + format_amount(s.offered) + " kWh in year " + std::to_string(s.year) +
           " (its lowest health, at a month's end), " + format_amount(s.required - s.offered) +
           " kWh short of the required " + format_amount(s.required) + " kWh";
  }
  return "discharge power " + format_amount(s.offered) + " kW within its C-rate, " +
         format_amount(s.required - s.offered) + " kW short of the required " +
         format_amount(s.required) + " kW";
}

// The year-ends within the warranty at which the retention curve promises more than the
// chemistry model gives, and what the supplier owes for them.
void write_capacity_claims_text(std::ostream& out, const TenderCase& tender,
                                const TenderResult& result) {
  bool any = false;
  for (std::size_t i = 0; i < result.bids.size(); ++i) {
    const BidResult& b = result.bids[i];
    if (b.capacity_claims.empty()) continue;
    if (!any) out << "\nRetention curve above the modelled capacity within the warranty\n";
    any = true;
    const CapacityClaim& worst =
        *std::max_element(b.capacity_claims.begin(), b.capacity_claims.end(),
                          [](const CapacityClaim& x, const CapacityClaim& y) {
                            return x.shortfall_kwh < y.shortfall_kwh;
                          });
    fmt::print(out, "  {}: {} years, worst year {} ({} kWh warranted, {} kWh modelled); ", b.label,
               b.capacity_claims.size(), worst.year, format_amount(worst.warranted_kwh),
               format_amount(worst.modelled_kwh));
    switch (tender.bids[i].warranty.capacity_remedy) {
      case CapacityRemedy::TopUp:
        fmt::print(out, "the supplier tops up {} kWh in all\n", format_amount(b.top_up_kwh));
        break;
      case CapacityRemedy::LiquidatedDamages:
        fmt::print(out, "the supplier pays liquidated damages worth {} {} today\n",
                   format_amount(-b.liquidated_damages_pv), tender.economics.currency);
        break;
      case CapacityRemedy::None:
        out << "the warranty names no remedy above its floor\n";
        break;
    }
  }
}

std::string percent(double share) { return format_fixed(100 * share, 1) + " %"; }

std::string drawn_list(const TenderUncertainty& u) {
  std::string text;
  for (const Variation& v : u.drawn) {
    if (!text.empty()) text += ", ";
    text += v.label + " (" + to_string(v.distribution->kind) + ")";
  }
  return text;
}

void write_uncertainty_text(std::ostream& out, const TenderCase& tender,
                            const TenderUncertainty& u) {
  const std::string& cur = tender.economics.currency;
  fmt::print(out,
             "\nUncertainty over {} samples of the tender's variations (seed {}; every bid "
             "through the same evaluation)\n  drawn: {}\n",
             u.samples, u.seed, drawn_list(u));
  fmt::print(out, "  {:<10}{:>13}{:>13}{:>13}{:>9}{:>9}{:>9}{:>11}{:>20}\n", "bid", "NPC P10",
             "NPC P50", "NPC P90", "LCOS P10", "P50", "P90", "compliant", "ranks first");
  for (const BidUncertainty& b : u.bids) {
    fmt::print(out, "  {:<10}{:>13}{:>13}{:>13}{:>9}{:>9}{:>9}{:>11}{:>20}\n", b.label,
               format_amount(b.npc.p10), format_amount(b.npc.p50), format_amount(b.npc.p90),
               format_fixed(b.lcos.p10, 4), format_fixed(b.lcos.p50, 4),
               format_fixed(b.lcos.p90, 4), percent(b.compliant_share),
               percent(b.win_probability) + " +- " + percent(b.win_probability_se));
  }
  fmt::print(out, "  (NPC in {}, LCOS ours in {}/kWh; +- one standard error)\n", cur, cur);
  if (u.no_winner_probability > 0) {
    fmt::print(out, "  No bid compliant in {} of the samples.\n", percent(u.no_winner_probability));
  }
  if (u.tie.called && u.tie.margin_samples > 0) {
    fmt::print(out,
               "  Score margin of {} over {}: P10 {}, P50 {}, P90 {} points ({} samples with "
               "both compliant)\n",
               tender.bids[u.tie.leader].label, tender.bids[u.tie.runner_up].label,
               format_fixed(u.tie.margin_p10, 1), format_fixed(u.tie.margin_p50, 1),
               format_fixed(u.tie.margin_p90, 1), u.tie.margin_samples);
  }
}

void write_stats_json(JsonWriter& json, const char* key, const SampleStatistics& s) {
  json.key(key).begin_object();
  json.field("mean", s.mean);
  json.field("standard_error", s.standard_error);
  json.field("p10", s.p10);
  json.field("p50", s.p50);
  json.field("p90", s.p90);
  json.end_object();
}

void write_uncertainty_json(JsonWriter& json, const TenderCase& tender, const TenderResult& result,
                            const TenderUncertainty& u) {
  json.key("uncertainty").begin_object();
  json.field("samples", static_cast<long>(u.samples));
  json.field("seed", std::to_string(u.seed));
  write_drawn_json(json, u.drawn);
  json.field("near_tie_by_margins", result.near_tie);
  json.key("leader");
  if (u.tie.called) {
    json.value(tender.bids[u.tie.leader].label);
  } else {
    json.null();
  }
  json.key("runner_up");
  if (u.tie.called) {
    json.value(tender.bids[u.tie.runner_up].label);
  } else {
    json.null();
  }
  const double nan = std::nan("");
  json.field("runner_up_at_least_as_good_share", u.tie.called ? u.tie.runner_up_share : nan);
  json.field("runner_up_at_least_as_good_share_se", u.tie.called ? u.tie.runner_up_share_se : nan);
  json.field("near_tie_share", kNearTieShare);
  json.field("near_tie_standard_errors", kNearTieStandardErrors);
  const bool margin = u.tie.called && u.tie.margin_samples > 0;
  json.field("margin_samples", static_cast<long>(u.tie.margin_samples));
  json.field("margin_p10", margin ? u.tie.margin_p10 : nan);
  json.field("margin_p50", margin ? u.tie.margin_p50 : nan);
  json.field("margin_p90", margin ? u.tie.margin_p90 : nan);
  json.field("no_winner_probability", u.no_winner_probability);
  json.key("bids").begin_array();
  for (const BidUncertainty& b : u.bids) {
    json.begin_object();
    json.field("label", b.label);
    write_stats_json(json, "npc", b.npc);
    write_stats_json(json, "lcos_per_kwh", b.lcos);
    json.field("compliant_share", b.compliant_share);
    json.field("win_probability", b.win_probability);
    json.field("win_probability_se", b.win_probability_se);
    json.end_object();
  }
  json.end_array();
  json.end_object();
}

}  // namespace

std::string share_text(double share, double standard_error) {
  return percent(share) + " (standard error " + percent(standard_error) + ")";
}

std::string sampled_tie_sentence(const TenderCase& tender, const TenderUncertainty& u) {
  const std::string& leader = tender.bids[u.tie.leader].label;
  const std::string& runner = tender.bids[u.tie.runner_up].label;
  const std::string finding =
      " from " + std::to_string(u.samples) + " samples of the tender's variations: " + runner +
      " does at least as well as " + leader + " in " + percent(u.tie.runner_up_share) +
      " of them (standard error " + percent(u.tie.runner_up_share_se) +
      "); the rule from the samples calls a near tie when this share plus " +
      format_general(kNearTieStandardErrors) + " standard errors reaches " +
      percent(kNearTieShare) + " (docs/tender.md)";
  return u.tie.near_tie ? "NEAR TIE" + finding + "; the ranking may turn on the inputs varied."
                        : "No near tie" + finding + ".";
}

void write_tender_text(std::ostream& out, const TenderCase& tender, const TenderResult& result,
                       const TenderUncertainty* uncertainty) {
  const std::string& cur = tender.economics.currency;
  fmt::print(out, "stowage {}: tender evaluation\n", STOWAGE_VERSION_STRING);
  fmt::print(out, "Tender: {}\nDuty:   {} ({} kWh demand a year)\n", tender.title, tender.site.name,
             format_amount(tender.site.annual_demand_kwh()));
  fmt::print(out,
             "Basis:  {} years, {:.1f} % real discount rate, {}; every bid on the same duty\n\n",
             tender.economics.project_years, 100 * tender.economics.real_discount_rate, cur);

  if (result.order.empty()) {
    out << "No bid meets the tender's requirements.\n\n";
  } else {
    const BidResult& best = result.bids[result.order.front()];
    fmt::print(out,
               "Recommended: {} ({}), total score {:.1f}, NPC {} {}, LCOS {} {}/kWh "
               "({} under Schmidt et al. 2019 conventions)\n",
               best.label, best.family, best.total_score, format_amount(best.npc), cur,
               format_fixed(best.lcos_per_kwh, 4), cur, format_fixed(best.lcos_schmidt_per_kwh, 4));
    if (result.order.size() > 1) {
      const BidResult& second = result.bids[result.order[1]];
      fmt::print(out, "Runner-up:   {}, {:.1f} points behind, NPC {} {}\n", second.label,
                 best.total_score - second.total_score, format_signed_amount(second.npc - best.npc),
                 cur);
    }
    if (uncertainty && uncertainty->tie.called) {
      out << sampled_tie_sentence(tender, *uncertainty) << "\n";
    } else if (result.near_tie) {
      fmt::print(out,
                 "NEAR TIE: the two best bids are within {} points of total score or {} % of "
                 "NPC (the tender's margins); the ranking may turn on inputs the evaluation "
                 "cannot settle.\n",
                 format_general(tender.scoring.near_tie_points),
                 format_general(100 * tender.scoring.near_tie_npc_share));
    }
    out << "\n";
  }

  out << "Scoring (price score = 100 x lowest NPC / bid NPC; LCOS per kWh delivered, ours with\n"
         "the residual value and Schmidt et al. 2019 conventions without it)\n";
  fmt::print(out, "{:>4}  {:<10}{:>14}{:>12}{:>12}{:>8}{:>11}{:>8}\n", "rank", "bid", "NPC " + cur,
             "LCOS", "LCOS Schm.", "price", "technical", "total");
  for (std::size_t i : result.order) {
    const BidResult& b = result.bids[i];
    fmt::print(out, "{:>4}  {:<10}{:>14}{:>12}{:>12}{:>8.1f}{:>11.1f}{:>8.1f}\n", b.rank, b.label,
               format_amount(b.npc), format_fixed(b.lcos_per_kwh, 4),
               format_fixed(b.lcos_schmidt_per_kwh, 4), b.price_score, b.technical_score,
               b.total_score);
  }
  if (uncertainty) write_uncertainty_text(out, tender, *uncertainty);
  out << "\nWarranty against the chemistry's own ageing model\n";
  out << "  (replacements at the end of the years shown)\n";
  fmt::print(out, "  {:<10}{:>15}{:>12}{:>16}{:>20}{:>18}\n", "bid", "warranty ends", "by",
             "modelled life", "supplier replaces", "buyer replaces");
  for (const BidResult& b : result.bids) {
    fmt::print(out, "  {:<10}{:>15}{:>12}{:>16}{:>20}{:>18}\n", b.label,
               life_text(b.warranty.years), warranty_end_cause_name(b.warranty.cause),
               life_text(b.modelled_life_years), years_list(b.supplier_paid_years),
               years_list(b.buyer_paid_years));
  }
  for (const BidResult& b : result.bids) {
    if (b.warranty_exceeds_model) {
      fmt::print(out,
                 "  Clarify {}: its warranty runs {}, longer than the {} its chemistry model "
                 "gives the bank; the evaluation counts the supplier paying the difference.\n",
                 b.label, life_text(b.warranty.years), life_text(b.modelled_life_years));
    }
  }
  write_capacity_claims_text(out, tender, result);
  bool any_failed = false;
  for (const BidResult& b : result.bids) any_failed |= !b.compliant();
  if (any_failed) {
    out << "\nNon-compliant bids (evaluated as offered, not resized, not scored)\n";
    for (const BidResult& b : result.bids) {
      for (const Shortfall& s : b.shortfalls)
        fmt::print(out, "  {}: {}\n", b.label, shortfall_text(s));
    }
  }
  fmt::print(out, "\nPresent values by bid ({}; buyer's cash flows)\n", cur);
  fmt::print(out, "  {:<34}", "");
  for (const BidResult& b : result.bids) fmt::print(out, "{:>14}", b.label);
  out << "\n";
  for (const CostLine& line : cost_lines()) {
    fmt::print(out, "  {:<34}", line.label);
    for (const BidResult& b : result.bids) {
      fmt::print(out, "{:>14}", format_amount(b.design.present_value.*line.member));
    }
    out << "\n";
  }
  fmt::print(out, "  {:<34}", "liquidated damages (credit)");
  for (const BidResult& b : result.bids) {
    fmt::print(out, "{:>14}", format_amount(b.liquidated_damages_pv));
  }
  out << "\n";
  fmt::print(out, "  {:<34}", "net present cost");
  for (const BidResult& b : result.bids) fmt::print(out, "{:>14}", format_amount(b.npc));
  out << "\n";
  fmt::print(out, "  {:<34}", "  of which hours out of service");
  for (const BidResult& b : result.bids)
    fmt::print(out, "{:>14}", format_amount(b.availability_pv));
  out << "\n\n";
  print_safety_notice(out);
}

void write_tender_json(std::ostream& out, const TenderCase& tender, const TenderResult& result,
                       const TenderUncertainty* uncertainty) {
  JsonWriter json;
  json.begin_object();
  json.field("stowage_version", STOWAGE_VERSION_STRING);
  json.field("tender", tender.title);
  json.field("site", tender.site.name);
  json.field("project_years", tender.economics.project_years);
  json.field("real_discount_rate", tender.economics.real_discount_rate);
  json.field("currency", tender.economics.currency);
  json.key("recommended");
  if (result.order.empty()) {
    json.null();
  } else {
    json.value(result.bids[result.order.front()].label);
  }
  if (uncertainty) {
    // The call is the samples' (near_tie_by_margins in "uncertainty" keeps the margins' call).
    json.field("near_tie", uncertainty->tie.near_tie);
    json.field("near_tie_rule", "samples");
  } else {
    json.field("near_tie", result.near_tie);
  }
  json.field("near_tie_points", tender.scoring.near_tie_points);
  json.field("near_tie_npc_share", tender.scoring.near_tie_npc_share);
  json.key("bids").begin_array();
  for (std::size_t i = 0; i < result.bids.size(); ++i) {
    const BidResult& b = result.bids[i];
    json.begin_object();
    json.field("label", b.label);
    json.field("family", b.family);
    json.field("compliant", b.compliant());
    json.key("rank");
    if (b.rank > 0) {
      json.value(b.rank);
    } else {
      json.null();
    }
    json.field("price_score", b.compliant() ? b.price_score : std::nan(""));
    json.field("technical_score", b.compliant() ? b.technical_score : std::nan(""));
    json.field("total_score", b.compliant() ? b.total_score : std::nan(""));
    json.field("npc", b.npc);
    json.field("lcos_per_kwh", b.lcos_per_kwh);
    json.field("lcos_schmidt_per_kwh", b.lcos_schmidt_per_kwh);
    json.field("npc_without_warranty", b.npc_without_warranty);
    json.field("liquidated_damages", b.liquidated_damages_pv);
    json.field("availability_cost", b.availability_pv);
    json.field("top_up_kwh", b.top_up_kwh);
    json.field("warranty_end_years", b.warranty.years);
    json.field("warranty_end_by", warranty_end_cause_name(b.warranty.cause));
    json.field("modelled_life_years", b.modelled_life_years);
    json.field("warranty_exceeds_model", b.warranty_exceeds_model);
    json.key("supplier_paid_replacement_years").begin_array();
    for (int y : b.supplier_paid_years) json.value(y);
    json.end_array();
    json.key("buyer_paid_replacement_years").begin_array();
    for (int y : b.buyer_paid_years) json.value(y);
    json.end_array();
    json.field("capacity_remedy", capacity_remedy_name(tender.bids[i].warranty.capacity_remedy));
    json.key("capacity_claims").begin_array();
    for (const CapacityClaim& c : b.capacity_claims) {
      json.begin_object();
      json.field("year", c.year);
      json.field("warranted_kwh", c.warranted_kwh);
      json.field("modelled_kwh", c.modelled_kwh);
      json.field("shortfall_kwh", c.shortfall_kwh);
      json.field("top_up_kwh", c.top_up_kwh);
      json.field("liquidated_damages", c.liquidated_damages);
      json.end_object();
    }
    json.end_array();
    json.field("least_usable_kwh", b.least_usable_kwh);
    json.field("power_kw", b.power_kw);
    json.key("shortfalls").begin_array();
    for (const Shortfall& s : b.shortfalls) {
      json.begin_object();
      json.field("requirement",
                 s.kind == Shortfall::Kind::UsableEnergy ? "min_usable_kwh" : "min_power_kw");
      json.field("required", s.required);
      json.field("offered", s.offered);
      if (s.kind == Shortfall::Kind::UsableEnergy) json.field("year", s.year);
      json.end_object();
    }
    json.end_array();
    json.key("design");
    write_design_json(json, b.design);
    json.end_object();
  }
  json.end_array();
  if (uncertainty) write_uncertainty_json(json, tender, result, *uncertainty);
  json.field("notice",
             "Planning estimate only; follow local codes, the manufacturer's instructions and "
             "licensed practice.");
  json.end_object();
  out << json.str() << "\n";
}

void write_tender_csv(std::ostream& out, const TenderCase&, const TenderResult& result) {
  out << "bid,family,compliant,rank,npc,lcos_per_kwh,lcos_schmidt_per_kwh,price_score,technical_"
         "score,total_score,"
         "warranty_end_years,warranty_end_by,modelled_life_years,supplier_paid_replacements,"
         "buyer_paid_replacements,least_usable_kwh,power_kw,top_up_kwh,liquidated_damages,"
         "availability_cost\n";
  for (const BidResult& b : result.bids) {
    out << b.label << ',' << b.family << ',' << (b.compliant() ? "true" : "false") << ','
        << (b.rank > 0 ? std::to_string(b.rank) : std::string()) << ',' << format_machine(b.npc)
        << ',' << format_machine(b.lcos_per_kwh) << ',' << format_machine(b.lcos_schmidt_per_kwh)
        << ',' << (b.compliant() ? format_machine(b.price_score) : "") << ','
        << (b.compliant() ? format_machine(b.technical_score) : "") << ','
        << (b.compliant() ? format_machine(b.total_score) : "") << ','
        << format_machine(b.warranty.years) << ',' << warranty_end_cause_name(b.warranty.cause)
        << ',' << format_machine(b.modelled_life_years) << ',' << b.supplier_paid_years.size()
        << ',' << b.buyer_paid_years.size() << ',' << format_machine(b.least_usable_kwh) << ','
        << format_machine(b.power_kw) << ',' << format_machine(b.top_up_kwh) << ','
        << format_machine(b.liquidated_damages_pv) << ',' << format_machine(b.availability_pv)
        << "\n";
  }
}

void write_tender_uncertainty_csv(std::ostream& out, const TenderUncertainty& u) {
  out << "bid,samples,npc_mean,npc_se,npc_p10,npc_p50,npc_p90,lcos_p10,lcos_p50,lcos_p90,"
         "compliant_share,win_probability,win_probability_se\n";
  for (const BidUncertainty& b : u.bids) {
    out << b.label << ',' << u.samples << ',' << format_machine(b.npc.mean) << ','
        << format_machine(b.npc.standard_error) << ',' << format_machine(b.npc.p10) << ','
        << format_machine(b.npc.p50) << ',' << format_machine(b.npc.p90) << ','
        << format_machine(b.lcos.p10) << ',' << format_machine(b.lcos.p50) << ','
        << format_machine(b.lcos.p90) << ',' << format_machine(b.compliant_share) << ','
        << format_machine(b.win_probability) << ',' << format_machine(b.win_probability_se) << "\n";
  }
}

const char* warranty_end_cause_name(WarrantyEnd::Cause cause) {
  switch (cause) {
    case WarrantyEnd::Cause::Years:
      return "years";
    case WarrantyEnd::Cause::Throughput:
      return "throughput";
    case WarrantyEnd::Cause::Cycles:
      return "cycles";
  }
  return "?";
}

const char* capacity_remedy_name(CapacityRemedy remedy) {
  switch (remedy) {
    case CapacityRemedy::None:
      return "none";
    case CapacityRemedy::TopUp:
      return "top_up";
    case CapacityRemedy::LiquidatedDamages:
      return "liquidated_damages";
  }
  return "?";
}

}  // namespace stowage::report
