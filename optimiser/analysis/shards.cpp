// SPDX-License-Identifier: MIT
#include "optimiser/analysis/shards.h"

#include <cmath>
#include <cstdlib>
#include <fstream>
#include <limits>
#include <sstream>

#include "catalog-schema/input_error.h"
#include "model/invalid_value.h"

namespace stowage {

namespace {

std::size_t parse_count(const std::string& text, bool& ok) {
  char* end = nullptr;
  const unsigned long long v = std::strtoull(text.c_str(), &end, 10);
  ok = !text.empty() && text[0] != '-' && end && *end == '\0';
  return static_cast<std::size_t>(v);
}

class LineReader {
 public:
  LineReader(std::istream& in, std::string name) : in_(in), name_(std::move(name)) {}
  // The next line's words; `want` must be its first word.
  std::vector<std::string> next(const std::string& want) {
    std::string line;
    if (!std::getline(in_, line)) fail(want, "the file ends early (a part cut short?)");
    ++line_;
    last_ = line;
    std::istringstream words(line);
    std::vector<std::string> out;
    for (std::string w; words >> w;) out.push_back(w);
    if (out.empty() || out[0] != want) fail(want, "expected a line starting with '" + want + "'");
    return out;
  }
  const std::string& last_line() const { return last_; }
  [[noreturn]] void fail(const std::string& field, const std::string& message) const {
    throw InputError(name_, line_ + 1, 1, field, message);
  }
  std::size_t count(const std::string& text, const std::string& field) const {
    bool ok = false;
    const std::size_t v = parse_count(text, ok);
    if (!ok) fail(field, "not a whole number: " + text);
    return v;
  }
  double number(const std::string& text, const std::string& field) const {
    if (text == "nan") return std::numeric_limits<double>::quiet_NaN();
    char* end = nullptr;
    const double v = std::strtod(text.c_str(), &end);
    if (text.empty() || !end || *end != '\0') fail(field, "not a number: " + text);
    return v;
  }
  bool flag(const std::string& text, const std::string& field) const {
    if (text != "0" && text != "1") fail(field, "must be 0 or 1, not " + text);
    return text == "1";
  }
  int line() const { return line_; }

 private:
  std::istream& in_;
  std::string name_;
  int line_ = 0;
  std::string last_;
};

std::string text_of(const std::string& word) { return word == "-" ? std::string() : word; }

constexpr std::size_t kOutcomeFields = 9;  // per profile

// Reads an outcome from w[at..]: the status, then kOutcomeFields per profile.
PointOutcome read_outcome(const LineReader& r, const std::vector<std::string>& w, std::size_t at,
                          const std::vector<std::string>& profile_ids, const std::string& field) {
  if (w.size() != at + 1 + kOutcomeFields * profile_ids.size()) {
    r.fail(field, "wrong number of fields");
  }
  PointOutcome o;
  if (w[at] != "-") {
    for (Optimality s :
         {Optimality::Proven, Optimality::VerifiedByEstimate, Optimality::TimeLimited}) {
      if (w[at] == to_string(s)) o.status = s;
    }
    if (!o.status) r.fail(field, "unknown optimality status " + w[at]);
  }
  for (std::size_t p = 0; p < profile_ids.size(); ++p) {
    const std::size_t f = at + 1 + kOutcomeFields * p;
    if (!r.flag(w[f], field)) {
      o.by_profile.emplace_back();
      continue;
    }
    DesignSummary d;
    d.profile_id = profile_ids[p];
    d.dod_setpoint = r.number(w[f + 1], field);
    d.cells_series = static_cast<int>(r.count(w[f + 2], field));
    d.strings_parallel = static_cast<int>(r.count(w[f + 3], field));
    d.nameplate_kwh = r.number(w[f + 4], field);
    d.npc = r.number(w[f + 5], field);
    d.lcos_per_kwh = r.number(w[f + 6], field);
    d.investment = r.number(w[f + 7], field);
    d.meets_unserved_limit = r.flag(w[f + 8], field);
    o.by_profile.push_back(d);
  }
  rank_point(o);
  return o;
}

bool same_summary(const std::optional<DesignSummary>& a, const std::optional<DesignSummary>& b) {
  if (a.has_value() != b.has_value()) return false;
  if (!a) return true;
  const auto same = [](double x, double y) { return x == y || (std::isnan(x) && std::isnan(y)); };
  return a->profile_id == b->profile_id && same(a->dod_setpoint, b->dod_setpoint) &&
         a->cells_series == b->cells_series && a->strings_parallel == b->strings_parallel &&
         same(a->nameplate_kwh, b->nameplate_kwh) && same(a->npc, b->npc) &&
         same(a->lcos_per_kwh, b->lcos_per_kwh) && same(a->investment, b->investment) &&
         a->meets_unserved_limit == b->meets_unserved_limit;
}

bool same_outcome(const PointOutcome& a, const PointOutcome& b) {
  if (a.status != b.status || a.by_profile.size() != b.by_profile.size()) return false;
  for (std::size_t p = 0; p < a.by_profile.size(); ++p) {
    if (!same_summary(a.by_profile[p], b.by_profile[p])) return false;
  }
  return true;
}

}  // namespace

ShardSpec parse_shard(const std::string& text) {
  const std::size_t slash = text.find('/');
  bool ok_i = false, ok_n = false;
  ShardSpec s;
  if (slash != std::string::npos) {
    s.index = parse_count(text.substr(0, slash), ok_i);
    s.count = parse_count(text.substr(slash + 1), ok_n);
  }
  if (!ok_i || !ok_n || s.count < 1 || s.index < 1 || s.index > s.count) {
    throw InvalidValue("--shard", "'" + text + "' is not i/N with 1 <= i <= N, e.g. 2/4");
  }
  return s;
}

SampleSlice shard_slice(std::size_t samples, const ShardSpec& shard) {
  return {(shard.index - 1) * samples / shard.count, shard.index * samples / shard.count};
}

namespace {

// The first three lines of every part file: its kind and version, the study's path and digest.
void read_part_header(LineReader& r, const std::string& kind, std::string& study_path,
                      std::string& study_digest) {
  std::vector<std::string> w = r.next("stowage-partial");
  if (w.size() != 3 || w[1] != "1" || w[2] != kind) {
    r.fail("stowage-partial", "not a partial " + kind + " result of this version");
  }
  w = r.next("study");
  if (w.size() < 2) r.fail("study", "expected the study's path");
  study_path = r.last_line().substr(std::string("study ").size());
  w = r.next("study_digest");
  if (w.size() != 2) r.fail("study_digest", "expected one digest");
  study_digest = w[1];
}

// Opens a partial result file and reads it with `read`.
template <typename Read>
auto read_part_file(const std::string& path, Read read) {
  std::ifstream in(path);
  if (!in) throw InputError(path, 0, 0, "", "cannot open the partial result");
  return read(in, path);
}

// The parts' items in order over [0, total): each part holds the items of its slice, and every
// index must lie in exactly one part. `unit` names the items in the messages ("samples").
template <typename Part, typename Item>
std::vector<Item> stitch_slices(const std::vector<Part>& parts,
                                const std::vector<std::string>& names, std::size_t total,
                                const std::string& unit, std::vector<Item> Part::*items) {
  std::vector<const Part*> by_start(total, nullptr);
  for (std::size_t i = 0; i < parts.size(); ++i) {
    const Part& p = parts[i];
    if (p.slice.first == p.slice.last) continue;
    if (by_start[p.slice.first]) {
      throw InputError(names[i], 0, 0, "", "its " + unit + " overlap another part's");
    }
    by_start[p.slice.first] = &p;
  }
  std::vector<Item> out;
  std::size_t k = 0;
  while (k < total) {
    const Part* p = by_start[k];
    if (!p) {
      throw InvalidValue("PARTS", unit + " from " + std::to_string(k) +
                                      " on are in no part: a shard is missing or parts overlap");
    }
    out.insert(out.end(), (p->*items).begin(), (p->*items).end());
    k = p->slice.last;
  }
  return out;
}

}  // namespace

UncertaintyPart read_uncertainty_part(std::istream& in, const std::string& source_name) {
  LineReader r(in, source_name);
  UncertaintyPart part;
  read_part_header(r, "uncertainty", part.study_path, part.study_digest);
  std::vector<std::string> w;
  w = r.next("run");
  if (w.size() != 6) r.fail("run", "expected samples, seed, latin_hypercube, reoptimise, winner");
  part.run.samples = r.count(w[1], "run");
  part.run.seed = r.count(w[2], "run");
  part.run.latin_hypercube = r.flag(w[3], "run");
  part.run.reoptimise = r.flag(w[4], "run");
  part.run.base_winner = text_of(w[5]);
  w = r.next("profiles");
  part.run.profile_ids.assign(w.begin() + 1, w.end());
  w = r.next("drawn");
  for (std::size_t j = 1; j < w.size(); ++j) {
    Variation v;
    v.path = w[j];
    part.run.drawn.push_back(v);
  }
  w = r.next("shard");
  if (w.size() != 5) r.fail("shard", "expected i, N, first, last");
  part.shard = {r.count(w[1], "shard"), r.count(w[2], "shard")};
  part.slice = {r.count(w[3], "shard"), r.count(w[4], "shard")};
  if (part.slice.first > part.slice.last || part.slice.last > part.run.samples) {
    r.fail("shard", "the slice lies outside the run's samples");
  }
  const std::size_t nd = part.run.drawn.size(), np = part.run.profile_ids.size();
  for (std::size_t k = part.slice.first; k < part.slice.last; ++k) {
    w = r.next("sample");
    if (w.size() != 2 + nd + 4 * np) r.fail("sample", "wrong number of fields");
    if (r.count(w[1], "sample") != k) r.fail("sample", "samples out of order");
    SampleRecord rec;
    for (std::size_t j = 0; j < nd; ++j) rec.values.push_back(r.number(w[2 + j], "sample"));
    for (std::size_t p = 0; p < np; ++p) {
      const std::size_t at = 2 + nd + 4 * p;
      ProfileDraw d;
      d.present = r.flag(w[at], "sample");
      d.npc = r.number(w[at + 1], "sample");
      d.lcos_per_kwh = r.number(w[at + 2], "sample");
      d.meets_unserved_limit = r.flag(w[at + 3], "sample");
      rec.profiles.push_back(d);
    }
    part.records.push_back(std::move(rec));
  }
  w = r.next("end");
  return part;
}

UncertaintyPart read_uncertainty_part_file(const std::string& path) {
  return read_part_file(path, read_uncertainty_part);
}

std::vector<SampleRecord> join_parts(const std::vector<UncertaintyPart>& parts,
                                     const std::vector<std::string>& names) {
  if (parts.empty()) throw InvalidValue("PARTS", "no partial results to merge");
  const UncertaintyPart& a = parts.front();
  for (std::size_t i = 0; i < parts.size(); ++i) {
    const UncertaintyPart& p = parts[i];
    const auto refuse = [&](const std::string& what) {
      throw InputError(names[i], 0, 0, "", what + " differs from " + names[0]);
    };
    if (p.study_digest != a.study_digest) refuse("the study (its input files)");
    if (p.run.samples != a.run.samples || p.run.seed != a.run.seed ||
        p.run.latin_hypercube != a.run.latin_hypercube || p.run.reoptimise != a.run.reoptimise ||
        p.run.base_winner != a.run.base_winner) {
      refuse("the run (samples, seed, sampling or base winner)");
    }
    if (p.run.profile_ids != a.run.profile_ids) refuse("the profiles");
    if (p.run.drawn.size() != a.run.drawn.size()) refuse("the drawn inputs");
    for (std::size_t j = 0; j < p.run.drawn.size(); ++j) {
      if (p.run.drawn[j].path != a.run.drawn[j].path) refuse("the drawn inputs");
    }
  }
  return stitch_slices(parts, names, a.run.samples, "samples", &UncertaintyPart::records);
}

std::string partial_result_kind(const std::string& path) {
  std::ifstream in(path);
  if (!in) throw InputError(path, 0, 0, "", "cannot open the partial result");
  std::string line;
  std::getline(in, line);
  if (line == "stowage-partial 1 uncertainty") return "uncertainty";
  if (line == "stowage-partial 1 sweep") return "sweep";
  throw InputError(path, 1, 1, "stowage-partial",
                   "not a partial result of this version (from `stowage uncertainty --shard` or "
                   "`stowage sweep --shard`)");
}

SweepPart read_sweep_part(std::istream& in, const std::string& source_name) {
  LineReader r(in, source_name);
  SweepPart part;
  read_part_header(r, "sweep", part.study_path, part.study_digest);
  std::vector<std::string> w;
  w = r.next("sweep");
  if (w.size() != 6 || (w[1] != "tornado" && w[1] != "grid")) {
    r.fail("sweep", "expected tornado or grid, hold_designs, steps, points, vary options");
  }
  part.grid = w[1] == "grid";
  part.hold_designs = r.flag(w[2], "sweep");
  part.steps = static_cast<int>(r.count(w[3], "sweep"));
  part.points = r.count(w[4], "sweep");
  const std::size_t vary = r.count(w[5], "sweep");
  for (std::size_t j = 0; j < vary; ++j) {
    w = r.next("vary");
    if (w.size() < 2) r.fail("vary", "expected a --vary option");
    part.vary.push_back(r.last_line().substr(std::string("vary ").size()));
  }
  w = r.next("axes");
  part.axes.assign(w.begin() + 1, w.end());
  if (part.grid != !part.axes.empty()) r.fail("axes", "a grid has axes, a tornado none");
  w = r.next("profiles");
  part.profile_ids.assign(w.begin() + 1, w.end());
  w = r.next("shard");
  if (w.size() != 5) r.fail("shard", "expected i, N, first, last");
  part.shard = {r.count(w[1], "shard"), r.count(w[2], "shard")};
  part.slice = {r.count(w[3], "shard"), r.count(w[4], "shard")};
  if (part.slice.first > part.slice.last || part.slice.last > part.points) {
    r.fail("shard", "the slice lies outside the sweep's points");
  }
  w = r.next("base");
  part.base = read_outcome(r, w, 1, part.profile_ids, "base");
  for (std::size_t k = part.slice.first; k < part.slice.last; ++k) {
    w = r.next("point");
    if (w.size() < 2 || r.count(w[1], "point") != k) r.fail("point", "points out of order");
    part.outcomes.push_back(read_outcome(r, w, 2, part.profile_ids, "point"));
  }
  w = r.next("end");
  return part;
}

SweepPart read_sweep_part_file(const std::string& path) {
  return read_part_file(path, read_sweep_part);
}

std::vector<PointOutcome> join_sweep_parts(const std::vector<SweepPart>& parts,
                                           const std::vector<std::string>& names) {
  if (parts.empty()) throw InvalidValue("PARTS", "no partial results to merge");
  const SweepPart& a = parts.front();
  for (std::size_t i = 0; i < parts.size(); ++i) {
    const SweepPart& p = parts[i];
    const auto refuse = [&](const std::string& what) {
      throw InputError(names[i], 0, 0, "", what + " differs from " + names[0]);
    };
    if (p.study_digest != a.study_digest) refuse("the study (its input files)");
    if (p.grid != a.grid || p.hold_designs != a.hold_designs || p.steps != a.steps ||
        p.points != a.points || p.vary != a.vary || p.axes != a.axes) {
      refuse("the sweep (kind, --hold-designs, --steps, --vary or --grid)");
    }
    if (p.profile_ids != a.profile_ids) refuse("the profiles");
    if (!same_outcome(p.base, a.base)) refuse("the base point");
  }
  return stitch_slices(parts, names, a.points, "points", &SweepPart::outcomes);
}

}  // namespace stowage
