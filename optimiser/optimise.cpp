// SPDX-License-Identifier: MIT
#include "optimiser/optimise.h"

#include <algorithm>
#include <atomic>
#include <chrono>
#include <cmath>
#include <exception>
#include <limits>
#include <map>
#include <memory>
#include <stdexcept>
#include <thread>

#include "model/contract.h"
#include "optimiser/representative_days.h"
#include "optimiser/storage_milp.h"

namespace stowage {

const char* to_string(SearchMethod method) {
  switch (method) {
    case SearchMethod::Milp:
      return "milp";
    case SearchMethod::Exhaustive:
      return "exhaustive";
    case SearchMethod::Bounded:
      return "bounded";
  }
  return "?";
}

const char* to_string(Optimality status) {
  switch (status) {
    case Optimality::Proven:
      return "proven_optimal";
    case Optimality::VerifiedByEstimate:
      return "verified_by_estimate";
    case Optimality::TimeLimited:
      return "time_limited";
  }
  return "?";
}

std::optional<SearchMethod> search_method_from_string(std::string_view text) {
  if (text == "milp") return SearchMethod::Milp;
  if (text == "exhaustive") return SearchMethod::Exhaustive;
  if (text == "bounded") return SearchMethod::Bounded;
  return std::nullopt;
}

void OptimiseOptions::validate() const {
  if (time_limit_s && !(*time_limit_s > 0)) throw ContractViolation("time_limit_s", "must be > 0");
  if (days_per_block < 1 || days_per_block > 28) {
    throw ContractViolation("days_per_block", "must be between 1 and 28");
  }
  if (!(base_margin >= 0 && base_margin < 1))
    throw ContractViolation("base_margin", "must be in [0, 1)");
  if (!(lone_margin >= 0 && lone_margin < 1))
    throw ContractViolation("lone_margin", "must be in [0, 1)");
  if (patience < 1) throw ContractViolation("patience", "must be >= 1");
  if (threads < 0) throw ContractViolation("threads", "must be >= 0 (0: every core)");
}

namespace {

constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();
constexpr double kInf = std::numeric_limits<double>::infinity();
// Designs evaluated together by the exhaustive, bounded and proof searches (a fixed size, so
// which designs get evaluated never depends on the thread count).
constexpr std::size_t kBatch = 32;

using Clock = std::chrono::steady_clock;

double median(std::vector<double> v) {
  std::sort(v.begin(), v.end());
  const std::size_t k = v.size();
  return k % 2 ? v[k / 2] : 0.5 * (v[k / 2 - 1] + v[k / 2]);
}

// The state of one search: evaluators, cache of exact results, the incumbents.
class Search {
 public:
  Search(const StudyCase& study, const OptimiseOptions& options)
      : study_(study), options_(options), start_(Clock::now()) {
    space_ = build_design_space(study);
    const unsigned cores = std::max(1u, std::thread::hardware_concurrency());
    threads_ = options.threads > 0 ? static_cast<std::size_t>(options.threads) : cores;
    evaluators_.resize(threads_);
    for (auto& row : evaluators_) row.resize(study.profiles.size());
    for (std::size_t p = 0; p < study.profiles.size(); ++p) evaluator(0, p);
    profile_best_.resize(study.profiles.size());
    ratios_.resize(study.profiles.size());
    lower_bound_.resize(space_.choices.size(), kInf);
    for (std::size_t c = 0; c < space_.choices.size(); ++c) {
      const DesignChoice& ch = space_.choices[c];
      if (ch.admissible()) {
        lower_bound_[c] = npc_lower_bound(study.profiles[ch.profile_index], study, ch.min_strings,
                                          calendar_damage(ch.profile_index));
      }
    }
  }

  OptimiseResult run() {
    OptimiseResult result;
    result.method = options_.method;
    result.admissible_designs = space_.admissible_designs();
    result.notes = space_.notes;
    result.unmet = space_.diagnose(study_);
    if (!result.unmet.empty()) {
      result.status = Optimality::Proven;  // infeasibility of the caps is exact
      result.solve_seconds = elapsed();
      return result;
    }
    days_ = select_representative_days(study_.site, options_.days_per_block);
    bool complete = false;
    switch (options_.method) {
      case SearchMethod::Exhaustive:
        complete = run_exhaustive();
        break;
      case SearchMethod::Bounded:
        complete = prove_by_bound();  // from an empty cache: bound-ordered exact search
        break;
      case SearchMethod::Milp:
        complete = run_milp();
        break;
    }
    if (options_.method == SearchMethod::Milp && !any_feasible() && !time_up()) {
      complete = settle_unserved_limit() && complete;
    }
    if (options_.method == SearchMethod::Milp && complete && options_.prove && any_feasible() &&
        !time_up()) {
      complete = prove_by_bound();
    }

    for (std::size_t p = 0; p < profile_best_.size(); ++p) {
      if (profile_best_[p]) {
        result.ranking.push_back(*profile_best_[p]);
      } else if (!hit_limit_) {
        result.notes.push_back(why_absent(p));
      }
    }
    std::stable_sort(result.ranking.begin(), result.ranking.end(),
                     [](const DesignResult& a, const DesignResult& b) { return a.npc < b.npc; });
    result.designs_evaluated_exactly = evaluated_;
    result.designs_evaluated_for_proof = proved_;
    result.designs_stopped_early = stopped_early_;
    result.years_simulated = years_simulated_;
    result.submodels_solved = submodels_solved_;
    result.pairs_pruned_by_bound = pruned_bound_;
    result.pairs_pruned_by_estimate = pruned_estimate_;
    result.time_limit_reached = hit_limit_;
    result.model_seconds = model_seconds_;
    result.designs_unsettled = unsettled_designs();
    result.status = !complete || hit_limit_         ? Optimality::TimeLimited
                    : result.designs_unsettled == 0 ? Optimality::Proven
                                                    : Optimality::VerifiedByEstimate;
    result.model_estimate_npc = result.model_estimate_per_kwh = result.gap = kNaN;
    if (result.feasible()) {
      estimate_answer(result);
    } else if (!hit_limit_) {
      result.unmet.push_back(unserved_diagnosis());
    }
    result.solve_seconds = elapsed();
    return result;
  }

 private:
  struct Exact {
    double npc = kInf;  // a lower bound when stopped_early
    bool feasible = false;
    double unserved_fraction = kInf;
    bool stopped_early = false;  // NPC above its profile's best: settled, never an incumbent
  };

  // Admissible designs that are neither evaluated exactly nor excluded by the rigorous bound
  // against the best exact NPC: what the answer's optimality does not cover.
  std::size_t unsettled_designs() const {
    std::size_t open = 0;
    for (std::size_t c = 0; c < space_.choices.size(); ++c) {
      const DesignChoice& ch = space_.choices[c];
      if (!ch.admissible()) continue;
      const ChemistryProfile& profile = study_.profiles[ch.profile_index];
      for (int n = ch.min_strings; n <= ch.max_strings; ++n) {
        if (cache_.count({c, n})) continue;
        if (best_ &&
            npc_lower_bound(profile, study_, n, calendar_damage(ch.profile_index)) >= best_->npc) {
          continue;
        }
        ++open;
      }
    }
    return open;
  }

  // Settles every design the guided search passed over: in order of the rigorous bound,
  // each design whose bound is below the best exact NPC so far is evaluated exactly; the
  // first bound at or above it ends the proof (all later bounds are higher).
  bool prove_by_bound() {
    struct Open {
      double bound;
      std::size_t choice;
      int strings;
    };
    std::vector<Open> open;
    for (std::size_t c = 0; c < space_.choices.size(); ++c) {
      const DesignChoice& ch = space_.choices[c];
      if (!ch.admissible()) continue;
      const ChemistryProfile& profile = study_.profiles[ch.profile_index];
      for (int n = ch.min_strings; n <= ch.max_strings; ++n) {
        if (cache_.count({c, n})) continue;
        const double bound = npc_lower_bound(profile, study_, n, calendar_damage(ch.profile_index));
        if (bound < best_npc()) open.push_back({bound, c, n});
      }
    }
    std::stable_sort(open.begin(), open.end(),
                     [](const Open& a, const Open& b) { return a.bound < b.bound; });
    // Batches of a fixed size, each taken while its bounds lie below the best exact NPC at
    // the batch's start: the same designs are evaluated for any thread count.
    std::size_t done = 0;
    for (std::size_t first = 0; first < open.size();) {
      if (open[first].bound >= best_npc()) break;
      if (time_up()) return false;
      std::vector<std::pair<std::size_t, int>> batch;
      std::size_t k = first;
      for (; k < open.size() && batch.size() < kBatch && open[k].bound < best_npc(); ++k) {
        batch.emplace_back(open[k].choice, open[k].strings);
      }
      const std::size_t before = evaluated_;
      evaluate_batch(batch);
      proved_ += evaluated_ - before;
      done += batch.size();
      first = k;
      report("prove", done, open.size());
    }
    return true;
  }

  double calendar_damage(std::size_t p) const {
    // The bound needs a floor on a year's calendar damage: with an SOC stress the yearly
    // damage is the SOC-free figure times multipliers no lower than the least over [0, 1].
    // With an enclosure the battery temperature comes from the dispatch, so the reference
    // series gives no floor: the bound takes no calendar damage (still a lower bound).
    if (study_.site.enclosure) return 0.0;
    const double per_year = evaluators_[0][p]->acceleration().calendar_damage_per_year;
    const ChemistryProfile& profile = study_.profiles[p];
    if (!profile.calendar_soc_stress) return per_year;
    const double least = std::min(profile.calendar_soc_stress->multiplier(0.0),
                                  profile.calendar_soc_stress->multiplier(1.0));
    return per_year * least;
  }

  double elapsed() const { return std::chrono::duration<double>(Clock::now() - start_).count(); }
  bool time_up() {
    if (options_.time_limit_s && elapsed() >= *options_.time_limit_s) hit_limit_ = true;
    return hit_limit_;
  }
  double remaining() const {
    return options_.time_limit_s ? std::max(1e-3, *options_.time_limit_s - elapsed()) : 1e7;
  }
  double best_npc() const { return best_ ? best_->npc : kInf; }
  bool any_feasible() const { return best_.has_value(); }

  void report(const char* phase, std::size_t done, std::size_t total) {
    if (!options_.progress) return;
    OptimiseProgress p;
    p.phase = phase;
    p.done = done;
    p.total = total;
    p.seconds = elapsed();
    p.best_npc = best_ ? best_->npc : kNaN;
    options_.progress(p);
  }

  // Exact evaluation with a cache; keeps the incumbents up to date.
  const Exact& evaluate(std::size_t c, int n) {
    const auto key = std::make_pair(c, n);
    auto it = cache_.find(key);
    if (it != cache_.end()) return it->second;
    const DesignChoice& ch = space_.choices[c];
    return record(key,
                  evaluator(0, ch.profile_index).evaluate_unless_above(ch.dod_setpoint, n, kInf));
  }

  // The NPC above which a design of `profile` cannot change the ranking: its best so far.
  double stop_above(std::size_t profile) const {
    return profile_best_[profile] ? profile_best_[profile]->npc : kInf;
  }

  // The evaluator of `profile` for worker `thread` (0: the calling thread). Each worker only
  // touches its own row, so rows can be filled from their threads.
  LifecycleEvaluator& evaluator(std::size_t thread, std::size_t profile) {
    auto& slot = evaluators_[thread][profile];
    if (!slot) {
      slot = std::make_unique<LifecycleEvaluator>(study_.profiles[profile], study_.site,
                                                  study_.economics);
    }
    return *slot;
  }

  const Exact& record(const std::pair<std::size_t, int>& key,
                      const LifecycleEvaluator::Bounded& b) {
    ++evaluated_;
    years_simulated_ += static_cast<std::size_t>(b.years_simulated);
    if (!b.result) {
      ++stopped_early_;
      Exact e;
      e.npc = b.npc_lower_bound;
      e.stopped_early = true;
      return cache_.emplace(key, e).first->second;
    }
    const DesignResult& r = *b.result;
    const DesignChoice& ch = space_.choices[key.first];
    Exact e;
    e.npc = r.npc;
    e.feasible = r.meets_unserved_limit;
    e.unserved_fraction = r.unserved_fraction_max;
    if (e.unserved_fraction < least_unserved_) {
      least_unserved_ = e.unserved_fraction;
      least_unserved_at_ = DesignRef{ch.profile_index, ch.dod_setpoint, key.second, ch.cap};
    }
    if (e.feasible) {
      auto& pb = profile_best_[ch.profile_index];
      if (!pb || r.npc < pb->npc) pb = r;
      if (!best_ || r.npc < best_->npc) best_ = r;
    }
    return cache_.emplace(key, e).first->second;
  }

  // Evaluates the designs not yet in the cache on up to `threads_` threads; the results enter
  // the cache and the incumbents in the order given, so the outcome does not depend on the
  // thread count (each evaluation is a pure function of its design).
  void evaluate_batch(const std::vector<std::pair<std::size_t, int>>& designs) {
    std::vector<std::pair<std::size_t, int>> todo;
    for (const auto& d : designs) {
      if (!cache_.count(d) && std::find(todo.begin(), todo.end(), d) == todo.end()) {
        todo.push_back(d);
      }
    }
    // Each design may stop early above its profile's best at the batch's start (a value fixed
    // before the threads run, so the outcome still does not depend on the thread count).
    std::vector<double> limits(todo.size());
    for (std::size_t i = 0; i < todo.size(); ++i) {
      limits[i] = stop_above(space_.choices[todo[i].first].profile_index);
    }
    std::vector<LifecycleEvaluator::Bounded> results(todo.size());
    std::atomic<std::size_t> next{0};
    auto work = [&](std::size_t thread) {
      for (std::size_t i; (i = next.fetch_add(1)) < todo.size();) {
        const DesignChoice& ch = space_.choices[todo[i].first];
        results[i] = evaluator(thread, ch.profile_index)
                         .evaluate_unless_above(ch.dod_setpoint, todo[i].second, limits[i]);
      }
    };
    const std::size_t workers = std::min(threads_, todo.size());
    if (workers <= 1) {
      work(0);
    } else {
      std::vector<std::exception_ptr> errors(workers);
      std::vector<std::thread> pool;
      for (std::size_t t = 1; t < workers; ++t) {
        pool.emplace_back([&, t]() {
          try {
            work(t);
          } catch (...) {
            errors[t] = std::current_exception();
          }
        });
      }
      try {
        work(0);
      } catch (...) {
        errors[0] = std::current_exception();
      }
      for (std::thread& t : pool) t.join();
      for (const std::exception_ptr& e : errors) {
        if (e) std::rethrow_exception(e);
      }
    }
    for (std::size_t i = 0; i < todo.size(); ++i) record(todo[i], results[i]);
  }

  MilpChoice milp_choice(std::size_t c, int lo, int hi) const {
    const DesignChoice& ch = space_.choices[c];
    MilpChoice m;
    m.profile = &study_.profiles[ch.profile_index];
    m.acceleration = &evaluators_[0][ch.profile_index]->acceleration();
    m.dod_setpoint = ch.dod_setpoint;
    m.min_strings = lo;
    m.max_strings = hi;
    return m;
  }

  // One sub-model per profile, moved from setpoint to setpoint so GLPK starts warm.
  SolveReport solve_submodel(std::size_t c, int lo, int hi) {
    const auto start = Clock::now();
    struct AddTime {
      double& total;
      Clock::time_point start;
      ~AddTime() { total += std::chrono::duration<double>(Clock::now() - start).count(); }
    } add_time{model_seconds_, start};
    const std::size_t p = space_.choices[c].profile_index;
    if (submodels_.size() != study_.profiles.size()) submodels_.resize(study_.profiles.size());
    if (!submodels_[p]) {
      submodels_[p] = std::make_unique<StorageMilp>(
          study_, std::vector<MilpChoice>{milp_choice(c, lo, hi)}, days_);
    } else {
      submodels_[p]->set_setpoint(0, space_.choices[c].dod_setpoint, lo, hi);
    }
    MilpOptions mo;
    mo.time_limit_s = remaining();
    return submodels_[p]->solve(mo);
  }

  // ---- exhaustive -------------------------------------------------------------------------
  bool run_exhaustive() {
    const std::size_t total = space_.admissible_designs();
    std::vector<std::pair<std::size_t, int>> batch;
    std::size_t done = 0;
    for (std::size_t c = 0; c < space_.choices.size(); ++c) {
      const DesignChoice& ch = space_.choices[c];
      for (int n = ch.min_strings; n <= ch.max_strings && ch.admissible(); ++n) {
        batch.emplace_back(c, n);
        if (batch.size() < kBatch) continue;
        if (time_up()) return false;
        evaluate_batch(batch);
        done += batch.size();
        batch.clear();
        report("exhaustive", done, total);
      }
    }
    if (time_up()) return false;
    evaluate_batch(batch);
    report("exhaustive", done + batch.size(), total);
    return true;
  }

  // ---- model-guided search ----------------------------------------------------------------
  struct PairState {
    bool solved = false;
    bool model_feasible = false;
    double estimate = kInf;
    int model_strings = 0;
    bool searched = false;
  };

  void solve_pair(std::size_t c) {
    PairState& s = pairs_[c];
    if (s.solved) return;
    const DesignChoice& ch = space_.choices[c];
    SolveReport r = solve_submodel(c, ch.min_strings, ch.max_strings);
    ++submodels_solved_;
    s.solved = true;
    if (r.solution_usable()) {
      s.model_feasible = true;
      s.estimate = r.estimate_npc;
      s.model_strings = r.strings;
    } else {
      // The model finds the pair infeasible (its representative days miss the unserved limit)
      // or failed: search from the largest bank, where unserved energy is least.
      s.model_feasible = false;
      s.model_strings = ch.max_strings;
    }
  }

  // Local search in strings for pair c from the model's choice; returns the best exact npc of
  // the pair found (inf when none meets the unserved limit).
  double local_search(std::size_t c) {
    PairState& s = pairs_[c];
    s.searched = true;
    const DesignChoice& ch = space_.choices[c];
    const ChemistryProfile& profile = study_.profiles[ch.profile_index];
    const int n0 = std::clamp(s.model_strings, ch.min_strings, ch.max_strings);
    double pair_best = kInf;
    if (time_up()) return pair_best;
    const Exact& e0 = evaluate(c, n0);
    if (e0.feasible) pair_best = e0.npc;
    for (int dir : {+1, -1}) {
      int misses = 0;
      for (int n = n0 + dir; n >= ch.min_strings && n <= ch.max_strings; n += dir) {
        if (time_up()) return pair_best;
        if (dir > 0 && npc_lower_bound(profile, study_, n, calendar_damage(ch.profile_index)) >=
                           std::min(best_npc(), pair_best)) {
          break;
        }
        const Exact& e = evaluate(c, n);
        if (e.feasible && e.npc < pair_best) {
          pair_best = e.npc;
          misses = 0;
        } else if (pair_best < kInf || dir < 0) {
          // Without any feasible bank yet, larger banks are the way to meet the limit.
          if (++misses >= options_.patience) break;
        }
      }
      report("verify", evaluated_, space_.admissible_designs());
    }
    if (s.model_feasible && pair_best < kInf && s.estimate > 0) {
      ratios_[ch.profile_index].push_back(pair_best / s.estimate);
    }
    return pair_best;
  }

  // The calibrated prediction of the best exact npc of pair c, less the safety margin.
  double calibrated_floor(std::size_t c) const {
    const PairState& s = pairs_[c];
    const std::vector<double>& obs = ratios_[space_.choices[c].profile_index];
    std::vector<double> pool = obs;
    if (pool.empty()) {
      for (const auto& v : ratios_) pool.insert(pool.end(), v.begin(), v.end());
    }
    if (pool.empty()) return -kInf;
    const double ratio = median(pool);
    double spread = 0;
    for (double r : pool) spread = std::max(spread, std::fabs(r - ratio) / ratio);
    double margin = std::max(options_.base_margin, 2 * spread);
    if (obs.size() < 3) margin = std::max(margin, options_.lone_margin);
    margin = std::min(margin, 0.95);
    const double predicted = s.estimate * ratio;
    // A negative estimate scales the other way; the margin always widens toward lower cost.
    return predicted >= 0 ? predicted * (1 - margin) : predicted * (1 + margin);
  }

  bool run_milp() {
    pairs_.assign(space_.choices.size(), PairState{});
    std::vector<std::size_t> order;
    for (std::size_t c = 0; c < space_.choices.size(); ++c) {
      if (space_.choices[c].admissible()) order.push_back(c);
    }
    std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) {
      return lower_bound_[a] < lower_bound_[b];
    });
    const std::size_t pairs_total = order.size();

    // 1-2. Per profile: solve its pairs in bound order, deferring those whose bound exceeds
    // the profile's best estimate by far; search the best-estimate pair exactly.
    std::size_t solved_count = 0;
    for (std::size_t p = 0; p < study_.profiles.size(); ++p) {
      double profile_estimate = kInf;
      constexpr std::size_t kNone = std::numeric_limits<std::size_t>::max();
      std::size_t profile_pick = kNone;
      for (std::size_t c : order) {
        if (space_.choices[c].profile_index != p) continue;
        if (time_up()) return false;
        if (profile_estimate < kInf &&
            lower_bound_[c] > profile_estimate + 0.25 * std::fabs(profile_estimate)) {
          continue;  // deferred to step 3, where the exact incumbent decides
        }
        solve_pair(c);
        report("model", ++solved_count, pairs_total);
        if (pairs_[c].model_feasible && pairs_[c].estimate < profile_estimate) {
          profile_estimate = pairs_[c].estimate;
          profile_pick = c;
        }
      }
      if (profile_pick == kNone) {
        // No pair of this profile is feasible in the model: try its cheapest pair by bound.
        for (std::size_t c : order) {
          if (space_.choices[c].profile_index == p) {
            profile_pick = c;
            break;
          }
        }
      }
      if (profile_pick != kNone && pairs_[profile_pick].solved) local_search(profile_pick);
    }

    // 3. Every other pair, cheapest estimate (or bound, when unsolved) first.
    std::vector<std::size_t> rest;
    for (std::size_t c : order) {
      if (!pairs_[c].searched) rest.push_back(c);
    }
    auto key = [&](std::size_t c) {
      return pairs_[c].solved && pairs_[c].model_feasible ? pairs_[c].estimate : lower_bound_[c];
    };
    std::stable_sort(rest.begin(), rest.end(),
                     [&](std::size_t a, std::size_t b) { return key(a) < key(b); });
    for (std::size_t c : rest) {
      if (time_up()) return false;
      if (lower_bound_[c] >= best_npc()) {
        ++pruned_bound_;
        continue;
      }
      solve_pair(c);
      if (any_feasible() && pairs_[c].model_feasible && calibrated_floor(c) >= best_npc()) {
        ++pruned_estimate_;
        continue;
      }
      local_search(c);
    }
    return !time_up();
  }

  // Nothing met the unserved limit: try the largest allowed bank of every pair (least unserved
  // energy); if one meets it, search down from there.
  bool settle_unserved_limit() {
    std::vector<std::size_t> found;
    for (std::size_t c = 0; c < space_.choices.size(); ++c) {
      const DesignChoice& ch = space_.choices[c];
      if (!ch.admissible()) continue;
      if (time_up()) return false;
      if (evaluate(c, ch.max_strings).feasible) found.push_back(c);
    }
    if (pairs_.size() != space_.choices.size()) pairs_.assign(space_.choices.size(), PairState{});
    for (std::size_t c : found) {
      pairs_[c].model_strings = space_.choices[c].max_strings;
      pairs_[c].model_feasible = false;
      local_search(c);
    }
    return !time_up();
  }

  // Why a profile has no design in the ranking.
  ProfileNote why_absent(std::size_t p) const {
    ProfileNote note;
    note.profile_index = p;
    bool admissible = false;
    for (const DesignChoice& c : space_.choices) {
      if (c.profile_index != p) continue;
      admissible |= c.admissible();
      note.autonomy_needs_more |= c.autonomy_strings > c.max_strings;
      note.peak_needs_more |= c.c_rate_strings > c.max_strings;
      note.cap_strings = std::max(c.max_strings, 0);
      note.cap = c.cap;
    }
    if (admissible) {
      note.kind = ProfileNote::Kind::NoDesignMeetsUnservedLimit;
    } else if (dod_ladder(study_.search, study_.profiles[p]).empty()) {
      note.kind = ProfileNote::Kind::LadderOutsideDodRange;
    } else {
      note.kind = ProfileNote::Kind::CapsBelowNeed;
    }
    return note;
  }

  UnmetRequirement unserved_diagnosis() const {
    UnmetRequirement u;
    u.requirement = Requirement::UnservedLimit;
    u.needed = study_.site.unserved_limit_fraction.value_or(0);
    u.best_available = least_unserved_;
    u.best_at = least_unserved_at_;
    return u;
  }

  // The model's estimate of the answer's own design: the sub-model with the strings fixed.
  void estimate_answer(OptimiseResult& result) {
    const DesignResult& best = result.best();
    std::size_t c = space_.choices.size();
    for (std::size_t k = 0; k < space_.choices.size(); ++k) {
      const DesignChoice& ch = space_.choices[k];
      if (study_.profiles[ch.profile_index].id == best.profile_id &&
          std::fabs(ch.dod_setpoint - best.dod_setpoint) < 1e-9) {
        c = k;
        break;
      }
    }
    if (c == space_.choices.size()) return;
    const int n = best.bank.strings_parallel;
    MilpOptions mo;
    mo.time_limit_s = 60;
    // With the unserved limit first (the dispatch the model would plan for this bank); if the
    // representative days cannot meet it with this bank, without it.
    SolveReport r;
    for (bool limit : {true, false}) {
      StorageMilp model(study_, {milp_choice(c, n, n)}, days_, limit);
      r = model.solve(mo);
      if (r.solution_usable()) break;
    }
    if (!r.solution_usable()) return;
    result.model_estimate_npc = r.estimate_npc;
    result.model_estimate_per_kwh =
        r.estimate_discharged_kwh_per_year > 0 ? r.estimate_lcos_per_kwh : kNaN;
    result.gap = (best.npc - r.estimate_npc) / std::max(std::fabs(best.npc), 1e-9);
  }

  const StudyCase& study_;
  const OptimiseOptions& options_;
  Clock::time_point start_;
  DesignSpace space_;
  RepresentativeDays days_;
  std::size_t threads_ = 1;
  // [thread][profile]; row 0 serves the calling thread, the guided search and the model.
  std::vector<std::vector<std::unique_ptr<LifecycleEvaluator>>> evaluators_;
  std::vector<double> lower_bound_;
  std::vector<PairState> pairs_;
  std::vector<std::unique_ptr<StorageMilp>> submodels_;
  std::map<std::pair<std::size_t, int>, Exact> cache_;
  std::vector<std::optional<DesignResult>> profile_best_;
  std::vector<std::vector<double>> ratios_;
  std::optional<DesignResult> best_;
  std::size_t stopped_early_ = 0, years_simulated_ = 0;
  std::size_t evaluated_ = 0, submodels_solved_ = 0, pruned_bound_ = 0, pruned_estimate_ = 0;
  std::size_t proved_ = 0;
  double model_seconds_ = 0;
  bool hit_limit_ = false;
  double least_unserved_ = kInf;
  std::optional<DesignRef> least_unserved_at_;
};

}  // namespace

OptimiseResult optimise(const StudyCase& study, const OptimiseOptions& options) {
  options.validate();
  Search search(study, options);
  return search.run();
}

double export_design_space_model(const StudyCase& study, const std::string& path,
                                 int days_per_block, bool solve) {
  const DesignSpace space = build_design_space(study);
  std::vector<std::unique_ptr<LifecycleEvaluator>> evaluators;
  for (const ChemistryProfile& p : study.profiles) {
    evaluators.push_back(std::make_unique<LifecycleEvaluator>(p, study.site, study.economics));
  }
  std::vector<MilpChoice> choices;
  for (const DesignChoice& ch : space.choices) {
    if (!ch.admissible()) continue;
    MilpChoice m;
    m.profile = &study.profiles[ch.profile_index];
    m.acceleration = &evaluators[ch.profile_index]->acceleration();
    m.dod_setpoint = ch.dod_setpoint;
    m.min_strings = ch.min_strings;
    m.max_strings = ch.max_strings;
    choices.push_back(m);
  }
  if (choices.empty()) {
    throw std::runtime_error("no admissible design: there is no model to export");
  }
  StorageMilp model(study, std::move(choices),
                    select_representative_days(study.site, days_per_block));
  const bool lp = path.size() >= 3 && path.compare(path.size() - 3, 3, ".lp") == 0;
  if (lp) {
    model.write_lp(path);
  } else {
    model.write_mps(path);
  }
  if (!solve) return kNaN;
  const SolveReport r = model.solve(MilpOptions{});
  return r.solution_usable() ? r.glpk_objective : kNaN;
}

}  // namespace stowage
