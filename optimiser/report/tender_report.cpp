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
#include "stowage_version.h"

namespace stowage::report {

namespace {

std::string life_text(double years) {
  return std::isfinite(years) ? format_fixed(years, 1) + " y" : std::string("beyond any horizon");
}

std::string shortfall_text(const Shortfall& s) {
  if (s.kind == Shortfall::Kind::UsableEnergy) {
    return "usable energy " + format_amount(s.offered) + " kWh at the end of year " +
           std::to_string(s.year) + ", " + format_amount(s.required - s.offered) +
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
    fmt::print(out, "  {}: {} year-ends, worst year {} ({} kWh warranted, {} kWh modelled); ",
               b.label, b.capacity_claims.size(), worst.year, format_amount(worst.warranted_kwh),
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

}  // namespace

void write_tender_text(std::ostream& out, const TenderCase& tender, const TenderResult& result) {
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
    if (result.near_tie) {
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

void write_tender_json(std::ostream& out, const TenderCase& tender, const TenderResult& result) {
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
  json.field("near_tie", result.near_tie);
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
