// SPDX-License-Identifier: MIT
#include "optimiser/report/shard_report.h"

#include <cmath>

#include "optimiser/report/number_format.h"

namespace stowage::report {

namespace {

std::string exact(double x) {
  if (std::isnan(x)) return "nan";
  if (std::isinf(x)) return x > 0 ? "inf" : "-inf";
  return format_machine(x, 17);
}

void write_outcome(std::ostream& out, const PointOutcome& o) {
  out << ' ' << (o.status ? to_string(*o.status) : "-");
  for (const std::optional<DesignSummary>& d : o.by_profile) {
    if (!d) {
      out << " 0 0 0 0 0 0 0 0 0";
      continue;
    }
    out << " 1 " << exact(d->dod_setpoint) << ' ' << d->cells_series << ' ' << d->strings_parallel
        << ' ' << exact(d->nameplate_kwh) << ' ' << exact(d->npc) << ' ' << exact(d->lcos_per_kwh)
        << ' ' << exact(d->investment) << ' ' << (d->meets_unserved_limit ? 1 : 0);
  }
}

}  // namespace

void write_uncertainty_part(std::ostream& out, const UncertaintyPart& part) {
  const UncertaintyRun& run = part.run;
  out << "stowage-partial 1 uncertainty\n";
  out << "study " << part.study_path << '\n';
  out << "study_digest " << part.study_digest << '\n';
  out << "run " << run.samples << ' ' << run.seed << ' ' << (run.latin_hypercube ? 1 : 0) << ' '
      << (run.reoptimise ? 1 : 0) << ' ' << (run.base_winner.empty() ? "-" : run.base_winner)
      << '\n';
  out << "profiles";
  for (const std::string& id : run.profile_ids) out << ' ' << id;
  out << "\ndrawn";
  for (const Variation& v : run.drawn) out << ' ' << v.path;
  out << "\nshard " << part.shard.index << ' ' << part.shard.count << ' ' << part.slice.first << ' '
      << part.slice.last << '\n';
  for (std::size_t i = 0; i < part.records.size(); ++i) {
    const SampleRecord& r = part.records[i];
    out << "sample " << part.slice.first + i;
    for (double x : r.values) out << ' ' << exact(x);
    for (const ProfileDraw& d : r.profiles) {
      out << ' ' << (d.present ? 1 : 0) << ' ' << exact(d.npc) << ' ' << exact(d.lcos_per_kwh)
          << ' ' << (d.meets_unserved_limit ? 1 : 0);
    }
    out << '\n';
  }
  out << "end\n";
}

void write_sweep_part(std::ostream& out, const SweepPart& part) {
  out << "stowage-partial 1 sweep\n";
  out << "study " << part.study_path << '\n';
  out << "study_digest " << part.study_digest << '\n';
  out << "sweep " << (part.grid ? "grid" : "tornado") << ' ' << (part.hold_designs ? 1 : 0) << ' '
      << part.steps << ' ' << part.points << ' ' << part.vary.size() << '\n';
  for (const std::string& v : part.vary) out << "vary " << v << '\n';
  out << "axes";
  for (const std::string& a : part.axes) out << ' ' << a;
  out << "\nprofiles";
  for (const std::string& id : part.profile_ids) out << ' ' << id;
  out << "\nshard " << part.shard.index << ' ' << part.shard.count << ' ' << part.slice.first << ' '
      << part.slice.last << '\n';
  out << "base";
  write_outcome(out, part.base);
  out << '\n';
  for (std::size_t i = 0; i < part.outcomes.size(); ++i) {
    out << "point " << part.slice.first + i;
    write_outcome(out, part.outcomes[i]);
    out << '\n';
  }
  out << "end\n";
}

}  // namespace stowage::report
