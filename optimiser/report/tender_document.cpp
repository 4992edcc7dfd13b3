// SPDX-License-Identifier: MIT
#include "optimiser/report/tender_document.h"

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <functional>
#include <memory>

#include "model/contract.h"
#include "optimiser/report/cost_lines.h"
#include "optimiser/report/design_report.h"
#include "optimiser/report/number_format.h"
#include "optimiser/report/report_charts.h"
#include "optimiser/report/study_hash.h"
#include "optimiser/report/study_report.h"
#include "optimiser/report/tender_report.h"
#include "stowage_version.h"

namespace stowage::report {

namespace {

// ---- cells ----------------------------------------------------------------------------------

std::string bid_key(std::size_t i) { return "bids[" + std::to_string(i) + "]"; }

std::string path_text(const std::string& path) {
  return std::filesystem::path(path).lexically_normal().generic_string();
}

// Years to one decimal, tagged, or the words for a bank that outlives any horizon.
ReportCell years_cell(double years, const std::string& key) {
  return std::isfinite(years) ? tagged(format_fixed(years, 1), key, years)
                              : plain("beyond any horizon");
}

// What every section reads.
struct Ctx {
  const TenderCase& tender;
  const TenderResult& result;
  const TenderUncertainty* uncertainty;  // may be null
  const std::string& cur() const { return tender.economics.currency; }
};

// ---- decision -------------------------------------------------------------------------------

void add_runner_up(ReportSection& s, const Ctx& c, const BidResult& best, const BidResult& second) {
  const std::string& cur = c.cur();
  const double npc_margin = second.npc - best.npc;
  s.paragraph("Runner-up: " + second.label + ", " +
              format_fixed(best.total_score - second.total_score, 1) +
              " points behind in total score, " + format_signed_amount(npc_margin) + " " + cur +
              " in net present cost (" + format_fixed(100 * npc_margin / std::fabs(best.npc), 1) +
              " % of the recommended bid's). Where the difference in net present cost comes "
              "from (runner-up minus recommended, present values, biggest first):");
  std::vector<std::string> items;
  for (const CostDifference& d :
       cost_differences(second.design.present_value, best.design.present_value))
    items.push_back(std::string(d.line->label) + ": " + format_signed_amount(d.amount) + " " + cur);
  const double ld = second.liquidated_damages_pv - best.liquidated_damages_pv;
  if (std::fabs(ld) >= 0.5)
    items.push_back("liquidated damages (credit): " + format_signed_amount(ld) + " " + cur);
  if (items.empty()) items.push_back("no cost line differs by a currency unit or more");
  s.bullets(items);
}

ReportSection decision_section(const Ctx& c) {
  ReportSection s;
  s.id = "decision";
  s.title = "Decision";
  const TenderResult& r = c.result;
  const std::string& cur = c.cur();
  if (r.order.empty()) {
    s.paragraph(
        "No bid meets the tender's requirements: none is recommended. Each bid's shortfall is "
        "listed under Non-compliant bids; the bids were evaluated as offered, not resized.");
    return s;
  }
  const std::size_t bi = r.order.front();
  const BidResult& best = r.bids[bi];
  s.paragraph("Recommended: " + best.label + " (" + best.family + "), the best total score of " +
              "the compliant bids, " + format_fixed(best.total_score, 1) +
              " of 100, with a net present cost of " + format_amount(best.npc) + " " + cur +
              " over " + std::to_string(c.tender.economics.project_years) +
              " years and an LCOS of " + format_fixed(best.lcos_per_kwh, 4) + " " + cur +
              " per kWh delivered (" + format_fixed(best.lcos_schmidt_per_kwh, 4) +
              " under Schmidt et al. 2019 conventions), the buyer's costs with the warranty "
              "applied.");
  if (c.uncertainty && c.uncertainty->tie.called) {
    s.notice(sampled_tie_sentence(c.tender, *c.uncertainty) +
             (c.uncertainty->tie.near_tie
                  ? " Treat the two as equal on this evidence and decide on clarification or the "
                    "criteria the scoring does not hold."
                  : ""));
  } else if (r.near_tie) {
    s.notice("Near tie: the two best bids lie within " +
             format_general(c.tender.scoring.near_tie_points) + " points of total score or " +
             format_general(100 * c.tender.scoring.near_tie_npc_share) +
             " % of net present cost (the tender's margins). The ranking may turn on inputs "
             "this evaluation cannot settle: treat the two as equal on this evidence and decide "
             "on clarification or the criteria the scoring does not hold.");
  }
  const bool has_runner = r.order.size() > 1;
  ReportTable t;
  t.caption = has_runner ? "Recommended bid and runner-up" : "Recommended bid";
  t.header = {"quantity", "recommended"};
  t.numeric = {false, true, true};
  if (has_runner) t.header.push_back("runner-up");
  const auto add = [&](const std::string& what,
                       const std::function<ReportCell(std::size_t, const BidResult&)>& cell) {
    std::vector<ReportCell> row{plain(what), cell(bi, best)};
    if (has_runner) row.push_back(cell(r.order[1], r.bids[r.order[1]]));
    t.rows.push_back(row);
  };
  add("bid", [](std::size_t i, const BidResult& b) {
    return tagged_text(b.label, bid_key(i) + ".label");
  });
  add("chemistry", [](std::size_t i, const BidResult& b) {
    return tagged_text(b.family, bid_key(i) + ".family");
  });
  add("total score (of 100)", [](std::size_t i, const BidResult& b) {
    return tagged(format_fixed(b.total_score, 1), bid_key(i) + ".total_score", b.total_score);
  });
  add("net present cost (" + cur + ")", [](std::size_t i, const BidResult& b) {
    return tagged(format_amount(b.npc), bid_key(i) + ".npc", b.npc);
  });
  add("LCOS (" + cur + " per kWh delivered)", [](std::size_t i, const BidResult& b) {
    return tagged(format_fixed(b.lcos_per_kwh, 4), bid_key(i) + ".lcos_per_kwh", b.lcos_per_kwh);
  });
  add("LCOS, Schmidt et al. 2019 conventions (" + cur + " per kWh delivered)",
      [](std::size_t i, const BidResult& b) {
        return tagged(format_fixed(b.lcos_schmidt_per_kwh, 4), bid_key(i) + ".lcos_schmidt_per_kwh",
                      b.lcos_schmidt_per_kwh);
      });
  add("warranty ends (years)", [](std::size_t i, const BidResult& b) {
    return years_cell(b.warranty.years, bid_key(i) + ".warranty_end_years");
  });
  add("modelled life (years)", [](std::size_t i, const BidResult& b) {
    return years_cell(b.modelled_life_years, bid_key(i) + ".modelled_life_years");
  });
  add("replacements the buyer pays (end of year)",
      [](std::size_t, const BidResult& b) { return plain(years_list(b.buyer_paid_years)); });
  s.table(t);
  if (has_runner) {
    add_runner_up(s, c, best, r.bids[r.order[1]]);
  } else {
    s.paragraph("There is no runner-up: only one bid meets the tender's requirements.");
  }
  s.paragraph(
      "This is a planning estimate for a tender decision. Read the claims to question and the "
      "safety cautions in this report before acting on it.");
  return s;
}

// ---- scoring --------------------------------------------------------------------------------

ReportSection scoring_section(const Ctx& c) {
  ReportSection s;
  s.id = "scoring";
  s.title = "Scoring";
  const TenderScoring& sc = c.tender.scoring;
  const std::string& cur = c.cur();
  s.paragraph(
      "Price score = 100 x (least net present cost of the compliant bids) / (the bid's "
      "net present cost); total = " +
      format_general(sc.price_weight) +
      " x price score + the weighted technical scores (docs/tender.md, rule 8). The "
      "criteria, the technical scores and the weights are the evaluator's. Only "
      "compliant bids are scored.");
  ReportTable t;
  t.caption = "Compliant bids by total score";
  t.header = {"rank",
              "bid",
              "NPC (" + cur + ")",
              "LCOS (" + cur + "/kWh)",
              "LCOS Schmidt (" + cur + "/kWh)",
              "price score (weight " + format_general(sc.price_weight) + ")"};
  t.numeric = {true, false, true, true, true, true};
  for (const auto& [name, weight] : sc.criteria) {
    t.header.push_back(name + " (weight " + format_general(weight) + ")");
    t.numeric.push_back(true);
  }
  t.header.push_back("technical (weighted points)");
  t.header.push_back("total");
  t.numeric.push_back(true);
  t.numeric.push_back(true);
  for (std::size_t i : c.result.order) {
    const BidResult& b = c.result.bids[i];
    const std::string k = bid_key(i);
    std::vector<ReportCell> row{
        tagged(std::to_string(b.rank), k + ".rank", b.rank),
        tagged_text(b.label, k + ".label"),
        tagged(format_amount(b.npc), k + ".npc", b.npc),
        tagged(format_fixed(b.lcos_per_kwh, 4), k + ".lcos_per_kwh", b.lcos_per_kwh),
        tagged(format_fixed(b.lcos_schmidt_per_kwh, 4), k + ".lcos_schmidt_per_kwh",
               b.lcos_schmidt_per_kwh),
        tagged(format_fixed(b.price_score, 1), k + ".price_score", b.price_score)};
    const Bid& bid = c.tender.bids[i];
    for (const auto& [name, weight] : sc.criteria) {
      (void)weight;
      const auto it = bid.technical_scores.find(name);
      row.push_back(plain(it == bid.technical_scores.end() ? "-" : format_general(it->second)));
    }
    row.push_back(
        tagged(format_fixed(b.technical_score, 1), k + ".technical_score", b.technical_score));
    row.push_back(tagged(format_fixed(b.total_score, 1), k + ".total_score", b.total_score));
    t.rows.push_back(row);
  }
  if (t.rows.empty()) {
    s.paragraph("No bid is scored: none meets the tender's requirements.");
  } else {
    s.table(t);
  }
  return s;
}

// ---- cost breakdown -------------------------------------------------------------------------

ReportFigure bids_chart(const Ctx& c) {
  StackedBars in;
  const std::string& cur = c.cur();
  in.id = "fig-bids";
  in.title = "Present-value cost breakdown of each bid, the buyer's cash flows";
  in.description =
      "Stacked bars: one per bid in the tender's order, each cost line a hatched segment, "
      "credits below zero; the buyer's net present cost is printed above each bar.";
  in.x_label = "bid, in the tender's order";
  in.currency = cur;
  in.caption = "Present value of each cost line of each bid on the tender's duty (" + cur +
               "), the supplier's warranty payments removed; the number above each bar is the "
               "buyer's net present cost, the sum of all segments with credits counted "
               "negative. Bids marked not compliant are not scored.";
  for (const CostLine& line : cost_lines())
    in.series.push_back({line.key, line.label, static_cast<int>(in.series.size())});
  in.series.push_back(
      {"liquidated_damages", "liquidated damages (credit)", static_cast<int>(in.series.size())});
  for (const BidResult& b : c.result.bids) {
    in.bars.push_back({b.label + (b.compliant() ? "" : " (not compliant)"), b.label, b.npc});
    std::vector<double> values;
    for (const CostLine& line : cost_lines()) values.push_back(b.design.present_value.*line.member);
    values.push_back(b.liquidated_damages_pv);
    in.values.push_back(values);
  }
  return stacked_bars_chart(in);
}

ReportSection uncertainty_section(const Ctx& c) {
  const TenderUncertainty& u = *c.uncertainty;
  ReportSection s;
  s.id = "uncertainty";
  s.title = "Uncertainty of the ranking";
  std::string drawn;
  for (const Variation& v : u.drawn) {
    drawn += (drawn.empty() ? "" : ", ") + v.label + " (" + to_string(v.distribution->kind) +
             (v.source.empty() ? std::string() : "; " + v.source) + ")";
  }
  s.paragraph("The tender's variations were drawn " + std::to_string(u.samples) + " times (seed " +
              std::to_string(u.seed) + "): " + drawn +
              ". Every bid went through the same evaluation on each sample: simulated, its "
              "warranty applied, checked against the requirements and scored.");
  ReportTable t;
  t.caption = "Sampled net present cost and LCOS by bid, and how often each ranks first";
  t.header = {"bid",        "NPC P10 (" + c.cur() + ")",
              "NPC P50",    "NPC P90",
              "LCOS P10",   "LCOS P50",
              "LCOS P90",   "compliant",
              "ranks first"};
  t.numeric = {false, true, true, true, true, true, true, true, true};
  for (std::size_t i = 0; i < u.bids.size(); ++i) {
    const BidUncertainty& b = u.bids[i];
    const std::string key = "uncertainty.bids[" + std::to_string(i) + "]";
    t.rows.push_back({tagged_text(b.label, key + ".label"),
                      tagged(format_amount(b.npc.p10), key + ".npc.p10", b.npc.p10),
                      tagged(format_amount(b.npc.p50), key + ".npc.p50", b.npc.p50),
                      tagged(format_amount(b.npc.p90), key + ".npc.p90", b.npc.p90),
                      tagged(format_fixed(b.lcos.p10, 4), key + ".lcos_per_kwh.p10", b.lcos.p10),
                      tagged(format_fixed(b.lcos.p50, 4), key + ".lcos_per_kwh.p50", b.lcos.p50),
                      tagged(format_fixed(b.lcos.p90, 4), key + ".lcos_per_kwh.p90", b.lcos.p90),
                      plain(format_fixed(100 * b.compliant_share, 1) + " %"),
                      plain(share_text(b.win_probability, b.win_probability_se))});
  }
  s.table(t);
  if (u.tie.called) s.paragraph(sampled_tie_sentence(c.tender, u));
  return s;
}

ReportSection breakdown_section(const Ctx& c) {
  ReportSection s;
  s.id = "costs";
  s.title = "Cost breakdown per bid";
  const std::string& cur = c.cur();
  s.paragraph("Every bid on the same duty, period and discount rate, as present values in " + cur +
              ": the buyer's cash flows, with the replacements and end-of-life flows the "
              "supplier pays within the warranty removed and the liquidated damages it pays "
              "credited (docs/tender.md, rules 3 to 5).");
  ReportTable t;
  t.caption = "Present values by bid (" + cur + ")";
  t.header = {"cost line"};
  t.numeric = {false};
  for (const BidResult& b : c.result.bids) {
    t.header.push_back(b.label);
    t.numeric.push_back(true);
  }
  const auto row = [&](const std::string& label,
                       const std::function<ReportCell(std::size_t, const BidResult&)>& cell) {
    std::vector<ReportCell> r{plain(label)};
    for (std::size_t i = 0; i < c.result.bids.size(); ++i) r.push_back(cell(i, c.result.bids[i]));
    t.rows.push_back(r);
  };
  for (const CostLine& line : cost_lines()) {
    row(line.label, [&line](std::size_t i, const BidResult& b) {
      const double v = b.design.present_value.*line.member;
      return tagged(format_amount(v), bid_key(i) + ".design.breakdown." + line.key, v);
    });
  }
  row("liquidated damages (credit)", [](std::size_t i, const BidResult& b) {
    return tagged(format_amount(b.liquidated_damages_pv), bid_key(i) + ".liquidated_damages",
                  b.liquidated_damages_pv);
  });
  row("net present cost, the buyer's", [](std::size_t i, const BidResult& b) {
    return tagged(format_amount(b.npc), bid_key(i) + ".npc", b.npc);
  });
  row("of which hours out of service", [](std::size_t i, const BidResult& b) {
    return tagged(format_amount(b.availability_pv), bid_key(i) + ".availability_cost",
                  b.availability_pv);
  });
  row("net present cost without the warranty", [](std::size_t i, const BidResult& b) {
    return tagged(format_amount(b.npc_without_warranty), bid_key(i) + ".npc_without_warranty",
                  b.npc_without_warranty);
  });
  row("LCOS (" + cur + " per kWh delivered)", [](std::size_t i, const BidResult& b) {
    return tagged(format_fixed(b.lcos_per_kwh, 4), bid_key(i) + ".lcos_per_kwh", b.lcos_per_kwh);
  });
  row("LCOS, Schmidt et al. 2019 conventions (" + cur + " per kWh delivered)",
      [](std::size_t i, const BidResult& b) {
        return tagged(format_fixed(b.lcos_schmidt_per_kwh, 4), bid_key(i) + ".lcos_schmidt_per_kwh",
                      b.lcos_schmidt_per_kwh);
      });
  s.table(t);
  s.figure(bids_chart(c));
  return s;
}

// ---- warranty -------------------------------------------------------------------------------

std::vector<std::string> claims_to_question(const Ctx& c) {
  std::vector<std::string> items;
  const std::string& cur = c.cur();
  for (std::size_t i = 0; i < c.result.bids.size(); ++i) {
    const BidResult& b = c.result.bids[i];
    if (b.warranty_exceeds_model) {
      items.push_back(b.label + ": the warranty runs " + format_fixed(b.warranty.years, 1) +
                      " years, longer than the " + format_fixed(b.modelled_life_years, 1) +
                      " years its chemistry profile gives the bank on this duty; the evaluation "
                      "counts the supplier paying the replacement the chemistry cannot avoid. "
                      "Ask how the supplier expects the bank to last.");
    }
    if (b.capacity_claims.empty()) continue;
    const CapacityClaim& worst =
        *std::max_element(b.capacity_claims.begin(), b.capacity_claims.end(),
                          [](const CapacityClaim& x, const CapacityClaim& y) {
                            return x.shortfall_kwh < y.shortfall_kwh;
                          });
    std::string remedy;
    switch (c.tender.bids[i].warranty.capacity_remedy) {
      case CapacityRemedy::TopUp:
        remedy = "the supplier tops up " + format_amount(b.top_up_kwh) + " kWh in all";
        break;
      case CapacityRemedy::LiquidatedDamages:
        remedy = "the supplier pays liquidated damages worth " +
                 format_amount(-b.liquidated_damages_pv) + " " + cur + " today";
        break;
      case CapacityRemedy::None:
        remedy = "the warranty names no remedy above its floor";
        break;
    }
    items.push_back(b.label +
                    ": the retention curve promises more capacity than the chemistry "
                    "profile gives at " +
                    std::to_string(b.capacity_claims.size()) +
                    " years within the warranty (its lowest health in each), most in year " +
                    std::to_string(worst.year) + " (" + format_amount(worst.warranted_kwh) +
                    " kWh warranted, " + format_amount(worst.modelled_kwh) + " kWh modelled); " +
                    remedy + ".");
  }
  return items;
}

ReportSection warranty_section(const Ctx& c) {
  ReportSection s;
  s.id = "warranty";
  s.title = "Warranty against modelled life";
  s.paragraph(
      "Each bank ages as its chemistry profile says on the tender's duty; the warranty ends at "
      "its years or its throughput or cycles, whichever comes first, and decides who pays a "
      "replacement, not how fast the bank ages (docs/tender.md, rules 1 to 6). Replacements "
      "fall at the end of the years shown.");
  ReportTable t;
  t.caption = "Warranted and modelled life of each bid";
  t.header = {"bid",
              "warranty ends (years)",
              "ended by",
              "modelled life (years)",
              "supplier pays",
              "buyer pays",
              "capacity remedy",
              "top-up (kWh)"};
  t.numeric = {false, true, false, true, false, false, false, true};
  for (std::size_t i = 0; i < c.result.bids.size(); ++i) {
    const BidResult& b = c.result.bids[i];
    const std::string k = bid_key(i);
    t.rows.push_back(
        {tagged_text(b.label, k + ".label"),
         years_cell(b.warranty.years, k + ".warranty_end_years"),
         tagged_text(warranty_end_cause_name(b.warranty.cause), k + ".warranty_end_by"),
         years_cell(b.modelled_life_years, k + ".modelled_life_years"),
         plain(years_list(b.supplier_paid_years)), plain(years_list(b.buyer_paid_years)),
         tagged_text(capacity_remedy_name(c.tender.bids[i].warranty.capacity_remedy),
                     k + ".capacity_remedy"),
         tagged(format_amount(b.top_up_kwh), k + ".top_up_kwh", b.top_up_kwh)});
  }
  s.table(t);
  const std::vector<std::string> claims = claims_to_question(c);
  if (claims.empty()) {
    s.paragraph(
        "Claims to question: none. No warranty promises more life or capacity than the "
        "chemistry profile of its bid gives on this duty.");
  } else {
    s.paragraph(
        "Claims to question in clarification, where a bid promises more than its "
        "chemistry profile gives on this duty:");
    s.bullets(claims);
  }
  return s;
}

// ---- compliance -----------------------------------------------------------------------------

ReportSection compliance_section(const Ctx& c) {
  ReportSection s;
  s.id = "compliance";
  s.title = "Non-compliant bids";
  ReportTable t;
  t.caption = "Requirements a bid misses, evaluated as offered (not resized)";
  t.header = {"bid", "requirement", "required", "offered", "short by", "year-end"};
  t.numeric = {false, false, true, true, true, true};
  for (std::size_t i = 0; i < c.result.bids.size(); ++i) {
    const BidResult& b = c.result.bids[i];
    for (std::size_t j = 0; j < b.shortfalls.size(); ++j) {
      const Shortfall& f = b.shortfalls[j];
      const std::string k = bid_key(i) + ".shortfalls[" + std::to_string(j) + "]";
      const bool energy = f.kind == Shortfall::Kind::UsableEnergy;
      const std::string unit = energy ? " kWh" : " kW";
      t.rows.push_back({tagged_text(b.label, bid_key(i) + ".label"),
                        tagged_text(energy ? "min_usable_kwh" : "min_power_kw", k + ".requirement"),
                        tagged(format_amount(f.required), k + ".required", f.required),
                        tagged(format_amount(f.offered), k + ".offered", f.offered),
                        plain(format_amount(f.required - f.offered) + unit),
                        energy ? tagged(std::to_string(f.year), k + ".year", f.year) : plain("-")});
    }
  }
  if (t.rows.empty()) {
    s.paragraph("None: every bid meets the tender's requirements.");
  } else {
    s.paragraph(
        "These bids miss a requirement of the tender (docs/tender.md, rule 7: usable energy "
        "at every year-end, discharge power within the C-rate). They are listed as offered "
        "and not scored; their costs are shown above for reference.");
    s.table(t);
  }
  return s;
}

// ---- inputs ---------------------------------------------------------------------------------

double max_of(const std::vector<double>& v) { return *std::max_element(v.begin(), v.end()); }
double min_of(const std::vector<double>& v) { return *std::min_element(v.begin(), v.end()); }

ReportTable basis_table(const Ctx& c) {
  const TenderCase& tender = c.tender;
  const std::string src = "tender file " + path_text(tender.path);
  ReportTable t;
  t.caption = "Tender basis, requirements and weights";
  t.header = {"quantity", "value", "unit", "source"};
  t.numeric = {false, true, false, false};
  t.rows.push_back({plain("evaluation period"),
                    tagged(std::to_string(tender.economics.project_years), "project_years",
                           tender.economics.project_years),
                    plain("years"), plain(src)});
  t.rows.push_back({plain("real discount rate"),
                    tagged(format_general(tender.economics.real_discount_rate, 4),
                           "real_discount_rate", tender.economics.real_discount_rate),
                    plain("fraction per year"), plain(src)});
  t.rows.push_back({plain("currency (real, constant prices)"),
                    tagged_text(tender.economics.currency, "currency"), plain(""), plain(src)});
  const TenderRequirements& req = tender.requirements;
  t.rows.push_back({plain("usable energy at every year-end, at least"),
                    plain(req.min_usable_kwh ? format_amount(*req.min_usable_kwh) : "none"),
                    plain("kWh"), plain(src)});
  t.rows.push_back({plain("discharge power, at least"),
                    plain(req.min_power_kw ? format_amount(*req.min_power_kw) : "none"),
                    plain("kW"), plain(src)});
  t.rows.push_back({plain("weight of the price score"),
                    plain(format_general(tender.scoring.price_weight)), plain("fraction"),
                    plain(src)});
  for (const auto& [name, weight] : tender.scoring.criteria)
    t.rows.push_back(
        {plain("weight of " + name), plain(format_general(weight)), plain("fraction"), plain(src)});
  t.rows.push_back({plain("near tie within"),
                    tagged(format_general(tender.scoring.near_tie_points), "near_tie_points",
                           tender.scoring.near_tie_points),
                    plain("points of total score"), plain(src)});
  t.rows.push_back({plain("or within"),
                    tagged(format_general(tender.scoring.near_tie_npc_share), "near_tie_npc_share",
                           tender.scoring.near_tie_npc_share),
                    plain("fraction of the best NPC"), plain(src)});
  return t;
}

ReportTable site_table(const Ctx& c) {
  const SiteConditions& site = c.tender.site;
  const std::string site_src = "site file " + path_text(c.tender.site_path);
  const std::string hourly_src = "hourly series " + path_text(c.tender.hourly_path);
  ReportTable t;
  t.caption = "Duty: " + site.name;
  t.header = {"quantity", "value", "unit", "source"};
  t.numeric = {false, true, false, false};
  const auto row = [&](const std::string& q, const std::string& v, const std::string& u,
                       const std::string& src) {
    t.rows.push_back({plain(q), plain(v), plain(u), plain(src)});
  };
  row("DC bus voltage", format_general(site.bus_voltage_v, 6), "V", site_src);
  row("annual demand", format_amount(site.annual_demand_kwh()), "kWh", hourly_src);
  row("peak load", format_general(max_of(site.load_kw), 4), "kW", hourly_src);
  row("battery temperature, lowest hour", format_fixed(min_of(site.temp_c), 1), "\u00B0C",
      hourly_src);
  row("battery temperature, highest hour", format_fixed(max_of(site.temp_c), 1), "\u00B0C",
      hourly_src);
  if (site.backup_price_per_kwh)
    row("back-up energy price", format_general(*site.backup_price_per_kwh, 4), c.cur() + "/kWh",
        site_src);
  return t;
}

ReportTable bid_table(const Ctx& c, std::size_t i) {
  const Bid& bid = c.tender.bids[i];
  const BidResult& b = c.result.bids[i];
  const WarrantyTerms& w = bid.warranty;
  const std::string& cur = c.cur();
  const std::string src = "bid file " + path_text(bid.path);
  ReportTable t;
  t.caption = "Offer of " + bid.label;
  t.header = {"field", "value", "unit", "source"};
  t.numeric = {false, true, false, false};
  const auto row = [&](const std::string& f, ReportCell v, const std::string& u,
                       const std::string& s) {
    t.rows.push_back({plain(f), std::move(v), plain(u), plain(s)});
  };
  const auto g = [](double v) { return plain(format_general(v, 6)); };
  row("chemistry profile", plain(bid.profile.id + " (" + bid.profile.family + ")"), "",
      "profile file " + path_text(bid.profile_path));
  row("offer.strings_parallel", plain(std::to_string(bid.strings_parallel)), "strings", src);
  row("offer.dod_setpoint", g(bid.dod_setpoint), "fraction", src);
  row("nameplate energy of the offered bank",
      tagged(format_amount(b.design.bank.nameplate_kwh, 1), bid_key(i) + ".design.nameplate_kwh",
             b.design.bank.nameplate_kwh),
      "kWh", "profile cell data x offered strings");
  row("prices.capex", plain(format_amount(bid.capex)), cur, src);
  row("prices.installation", plain(format_amount(bid.installation)), cur, src);
  row("prices.annual_service", plain(format_amount(bid.annual_service)), cur + "/year", src);
  row("prices.replacement_share", g(bid.profile.costs.replacement_share), "fraction", src);
  row("warranty.years", g(w.years), "years", src);
  row("warranty.throughput_mwh", w.throughput_mwh ? g(*w.throughput_mwh) : plain("none"), "MWh",
      src);
  row("warranty.equivalent_full_cycles",
      w.equivalent_full_cycles ? g(*w.equivalent_full_cycles) : plain("none"), "cycles", src);
  row("warranty.capacity_floor", g(w.capacity_floor), "fraction of nameplate", src);
  std::string curve;
  for (const RetentionPoint& p : w.retention)
    curve += (curve.empty() ? "" : "; ") + format_general(p.year, 4) +
             " y: " + format_general(p.capacity, 4);
  row("warranty.retention", plain(curve.empty() ? "the floor throughout" : curve), "year: fraction",
      src);
  row("warranty.capacity_remedy", plain(capacity_remedy_name(w.capacity_remedy)), "", src);
  if (w.capacity_remedy == CapacityRemedy::LiquidatedDamages)
    row("warranty.liquidated_damages_per_kwh", g(w.liquidated_damages_per_kwh), cur + "/kWh", src);
  row("warranty.availability", w.availability ? g(*w.availability) : plain("none"),
      "fraction of the time", src);
  std::string scores;
  for (const auto& [name, score] : bid.technical_scores)
    scores += (scores.empty() ? "" : "; ") + name + ": " + format_general(score);
  row("technical_scores", plain(scores.empty() ? "none" : scores), "0..100", src);
  return t;
}

ReportSection inputs_section(const Ctx& c) {
  ReportSection s;
  s.id = "inputs";
  s.title = "Inputs";
  s.paragraph(
      "The values the evaluation used, with their units and the file they come from. Each "
      "bid's ageing comes from the chemistry profile its file names; its prices replace the "
      "profile's (docs/tender.md, Files).");
  s.table(basis_table(c));
  s.table(site_table(c));
  for (std::size_t i = 0; i < c.tender.bids.size(); ++i) s.table(bid_table(c, i));
  return s;
}

// ---- method, limits -------------------------------------------------------------------------

ReportSection method_section() {
  ReportSection s;
  s.id = "method";
  s.title = "Method and validation";
  s.paragraph(
      "docs/tender.md gives every rule of the evaluation and its source or says it is our "
      "convention; docs/method.md gives the simulation and cost equations, docs/validation.md "
      "the checks against outside values.");
  s.bullets({
      "Duty: every bid is simulated hour by hour on the tender's site over the evaluation "
      "period, through the same simulator as a study (dispatch, rainflow ageing with "
      "Palmgren-Miner damage, calendar ageing, temperature acceleration).",
      "Ageing: from the bid's chemistry profile, re-expressed to retire the bank at the "
      "warranted capacity floor; the warranty adds no ageing.",
      "Warranty: ends at its years, throughput or equivalent full cycles, whichever comes "
      "first; replacements within it are the supplier's, after it the buyer's; a retention "
      "curve is met by a top-up or paid as liquidated damages; an availability guarantee buys "
      "the duty of the hours out of service as back-up energy.",
      "Costs: net present cost and LCOS per kWh delivered after the inverter, ours with the "
      "residual value and under Schmidt et al. (2019), Joule 3:81-100, without it "
      "(docs/method.md 7), both with the liquidated-damages credit.",
      "Compliance and score: usable energy at every year-end and discharge power against the "
      "requirements; price score 100 x least NPC / bid NPC, weighted with the evaluator's "
      "technical scores.",
      "Validation: warranty arithmetic against hand-derived cases, a bid's cost lines against "
      "a hand calculation, the simulator as in docs/validation.md.",
  });
  return s;
}

ReportSection limits_section() {
  ReportSection s;
  s.id = "limits";
  s.title = "Assumptions and limits";
  s.bullets({
      "One typical year of hourly data is repeated for every year of the evaluation: no load "
      "growth and no weather variation between years.",
      "Chemistry profiles are generic descriptions of a chemistry, not the offered product's "
      "data; a claim to question is a difference between the bid and its profile, which "
      "clarification settles, not proof that the bid is wrong.",
      "A top-up does not feed back into the dispatch: the buyer's energy costs are not lowered "
      "by it (conservative).",
      "Availability damages, price escalation clauses and a bid-specific end-of-life policy "
      "other than the floor are not modelled.",
      "The near-tie margins are the evaluator's, not computed from an uncertainty run.",
      "Prices and the discount rate are real (constant currency).",
  });
  return s;
}

}  // namespace

ReportDocument build_tender_report(const TenderReportInputs& in) {
  if (!in.tender) throw ContractViolation("TenderReportInputs::tender", "must be set");
  if (!in.result) throw ContractViolation("TenderReportInputs::result", "must be set");
  if (in.result->bids.size() != in.tender->bids.size())
    throw ContractViolation("TenderReportInputs::result", "must hold one result per bid");
  const Ctx c{*in.tender, *in.result, in.uncertainty};
  const TenderCase& tender = *in.tender;
  ReportDocument doc;
  doc.title = tender.title.empty() ? "Tender evaluation" : tender.title;
  doc.subtitle = "Tender evaluation of " + std::to_string(tender.bids.size()) +
                 " bids on the same duty at " + tender.site.name + " over " +
                 std::to_string(tender.economics.project_years) + " years at a " +
                 format_general(100 * tender.economics.real_discount_rate, 4) +
                 " % real discount rate, in " + tender.economics.currency + ".";
  doc.generated_line = "Generated " + in.generated_at + " by stowage " + STOWAGE_VERSION_STRING;
  doc.sections.push_back(decision_section(c));
  doc.sections.push_back(scoring_section(c));
  if (in.uncertainty) doc.sections.push_back(uncertainty_section(c));
  doc.sections.push_back(breakdown_section(c));
  doc.sections.push_back(warranty_section(c));
  doc.sections.push_back(compliance_section(c));
  doc.sections.push_back(inputs_section(c));
  doc.sections.push_back(reproduce_section(hash_tender_inputs(tender), "Tender"));
  doc.sections.push_back(method_section());
  doc.sections.push_back(limits_section());
  doc.sections.push_back(safety_section());
  return doc;
}

void add_tender_report_files(OutputSet& set, const TenderReportInputs& in) {
  add_document_files(set, std::make_shared<const ReportDocument>(build_tender_report(in)));
  const TenderCase* tender = in.tender;
  const TenderResult* result = in.result;
  const TenderUncertainty* uncertainty = in.uncertainty;
  auto designs = std::make_shared<std::vector<DesignResult>>();
  for (const BidResult& b : result->bids) designs->push_back(b.design);
  set.add("tender.json", [tender, result, uncertainty](std::ostream& out) {
    write_tender_json(out, *tender, *result, uncertainty);
  });
  if (uncertainty) {
    set.add("bid-uncertainty.csv",
            [uncertainty](std::ostream& out) { write_tender_uncertainty_csv(out, *uncertainty); });
  }
  set.add("bids.csv",
          [tender, result](std::ostream& out) { write_tender_csv(out, *tender, *result); });
  set.add("designs.csv", [designs](std::ostream& out) { write_designs_csv(out, *designs); });
  set.add("cash-flows.csv", [designs](std::ostream& out) { write_cash_flows_csv(out, *designs); });
}

}  // namespace stowage::report
