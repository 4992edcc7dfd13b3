// SPDX-License-Identifier: MIT
// How a tender evaluation is shown: the recommendation first (the best-scored compliant bid,
// its margin and any near tie), the scoring table, each bid's warranty against its modelled
// life, the non-compliant bids with their shortfalls, and each bid's cost breakdown; or one
// JSON document; or bids.csv (one row per bid).
#pragma once

#include <ostream>

#include "catalog-schema/tender_loader.h"
#include "optimiser/analysis/tender.h"
#include "optimiser/analysis/tender_uncertainty.h"

namespace stowage::report {

// "years", "throughput" or "cycles": what ended the warranty, in text, JSON and CSV alike.
const char* warranty_end_cause_name(WarrantyEnd::Cause cause);
// "none", "top_up" or "liquidated_damages": the warranty's capacity remedy, likewise.
const char* capacity_remedy_name(CapacityRemedy remedy);

// `uncertainty`, when given (the tender has variations; tender_uncertainty.h), adds the
// sampled figures and makes the near-tie call from the samples; without it the output is that
// of the deterministic evaluation alone, the call made by the tender's margins.
void write_tender_text(std::ostream& out, const TenderCase& tender, const TenderResult& result,
                       const TenderUncertainty* uncertainty = nullptr);
void write_tender_json(std::ostream& out, const TenderCase& tender, const TenderResult& result,
                       const TenderUncertainty* uncertainty = nullptr);
void write_tender_csv(std::ostream& out, const TenderCase& tender, const TenderResult& result);
// bid-uncertainty.csv: one row per bid with the sampled NPC and LCOS percentiles, the
// compliant share and the win probability with its standard error.
void write_tender_uncertainty_csv(std::ostream& out, const TenderUncertainty& uncertainty);

// The near-tie call from the samples in words (the rule of tender_uncertainty.h), the same
// sentence on screen and in the tender report; requires uncertainty.tie.called.
std::string sampled_tie_sentence(const TenderCase& tender, const TenderUncertainty& uncertainty);
// The same call as a share with its standard error, e.g. "23.5 % (standard error 3.0 %)".
std::string share_text(double share, double standard_error);

}  // namespace stowage::report
