// SPDX-License-Identifier: MIT
// The figures of the robustness reports (robustness_document.h), drawn with svg_chart.h from
// the result objects as they are: the P10 / P50 / P90, mean and per-sample NPCs of
// UncertaintyResult, its win probabilities and their standard errors, the probes of a
// BreakevenResult, the points of a GridResult. Nothing is re-derived. Each returns a
// ReportFigure whose id is also the name of its .svg file.
// Readability (docs/report.md): profiles are told apart by their name on an axis or by letter
// and legend, never by colour alone; lines differ in dash and marker as well as colour.
#pragma once

#include <string>

#include "catalog-schema/study_case.h"
#include "optimiser/analysis/breakeven.h"
#include "optimiser/analysis/sweep.h"
#include "optimiser/analysis/uncertainty.h"
#include "optimiser/report/report_document.h"

namespace stowage::report {

// Which sampled quantity a spread chart draws.
enum class SpreadQuantity { Npc, Lcos };

// Per profile (x axis, by name): a hatched box from P10 to P90 of the samples, a black bar at
// the P50 and a diamond at the mean. Id "fig-npc-spread" or "fig-lcos-spread".
ReportFigure uncertainty_spread_chart(const UncertaintyResult& r, SpreadQuantity quantity,
                                      const std::string& currency);
// Per profile, the empirical distribution function of its NPC over the samples (the per-sample
// NPCs of UncertaintyResult::npc): a step line rising by 1/n at each of its n sampled values,
// own dash and marker per profile, legend below. Id "fig-npc-ecdf". Requires a finite NPC.
ReportFigure npc_ecdf_chart(const UncertaintyResult& r, const std::string& currency);
// Per profile (x axis, by name): the share of samples in which it is cheapest, in %, as a bar
// with its value printed above and a whisker of one standard error either side.
// Id "fig-win-probability".
ReportFigure win_probability_chart(const UncertaintyResult& r);
// NPC of the profile and of the cheapest other profile at every evaluated value (scan and
// bisection, in ascending value), with the break-even value marked by a labelled line when
// there is a crossing. Requires at least one probe with a finite NPC. Id "fig-breakeven".
ReportFigure breakeven_chart(const BreakevenResult& r, const std::string& currency);
// A 1-D grid: each profile's NPC against the varied input (a line each, own dash and marker),
// and a ring around the winner's NPC at every value. Requires one axis and a feasible point.
// Id "fig-sweep".
ReportFigure sweep_line_chart(const StudyCase& study, const GridResult& g);
// A 2-D grid: a map of the winner at every point (rows: the first input, columns: the
// second), each cell carrying its winner's letter (A, B, ... in study profile order, key
// below the map; "-" where no design meets the limits). Id "fig-winner-map".
ReportFigure winner_map_chart(const StudyCase& study, const GridResult& g);
// "A", "B", ... "Z", "AA", ...: the letter of profile `index` in the winner map and tables.
std::string profile_letter(std::size_t index);

}  // namespace stowage::report
