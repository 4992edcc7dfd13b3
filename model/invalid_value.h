// SPDX-License-Identifier: MIT
// InvalidValue: the one error the model raises for a value that breaks a documented rule.
//
// `field` is the path of the offending value relative to the object being built, in the
// same spelling as the input files (for example "cycle_life[2].cycles" or "temperature.
// halving_interval_k"), so the loader can map it back to a file, line and column.
#pragma once

#include <stdexcept>
#include <string>

namespace stowage {

class InvalidValue : public std::invalid_argument {
 public:
  InvalidValue(std::string field, const std::string& rule)
      : std::invalid_argument(field + ": " + rule), field_(std::move(field)), rule_(rule) {}

  const std::string& field() const { return field_; }
  const std::string& rule() const { return rule_; }

  // The same error with `prefix` put in front of the field path ("profile" + "cells" ->
  // "profile.cells"), for objects that validate their parts.
  InvalidValue nested_in(const std::string& prefix) const {
    if (field_.empty()) return InvalidValue(prefix, rule_);
    const bool index = !field_.empty() && field_[0] == '[';
    return InvalidValue(prefix + (index ? "" : ".") + field_, rule_);
  }

 private:
  std::string field_;
  std::string rule_;
};

}  // namespace stowage
