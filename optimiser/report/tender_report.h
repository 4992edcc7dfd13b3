// SPDX-License-Identifier: MIT
// How a tender evaluation is shown: the recommendation first (the best-scored compliant bid,
// its margin and any near tie), the scoring table, each bid's warranty against its modelled
// life, the non-compliant bids with their shortfalls, and each bid's cost breakdown; or one
// JSON document; or bids.csv (one row per bid).
#pragma once

#include <ostream>

#include "catalog-schema/tender_loader.h"
#include "optimiser/analysis/tender.h"

namespace stowage::report {

// "years", "throughput" or "cycles": what ended the warranty, in text, JSON and CSV alike.
const char* warranty_end_cause_name(WarrantyEnd::Cause cause);
// "none", "top_up" or "liquidated_damages": the warranty's capacity remedy, likewise.
const char* capacity_remedy_name(CapacityRemedy remedy);

void write_tender_text(std::ostream& out, const TenderCase& tender, const TenderResult& result);
void write_tender_json(std::ostream& out, const TenderCase& tender, const TenderResult& result);
void write_tender_csv(std::ostream& out, const TenderCase& tender, const TenderResult& result);

}  // namespace stowage::report
