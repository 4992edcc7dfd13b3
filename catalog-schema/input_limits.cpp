// SPDX-License-Identifier: MIT
#include "catalog-schema/input_limits.h"

#include <cmath>

#include "catalog-schema/decimal_text.h"

namespace stowage {

std::string limit_message(double limit, const std::string& found_text, const std::string& hint) {
  return "must be at most " + number_text(limit) +
         " (a plausibility limit, see docs/input-format.md), found " + found_text + hint;
}

int plausible_count(const YamlDocument& doc, const YAML::Node& node, const std::string& field,
                    long max_value, const std::string& hint) {
  const std::optional<double> value = scalar_number(node);
  // The comparison is made on the double, so a value beyond the range of int (4294967298)
  // is refused instead of being wrapped by the conversion below.
  if (!value || !std::isfinite(*value) || *value != std::floor(*value) || *value < 0) {
    throw doc.error_at(node, field, "expected a whole number, found " + describe_node(node));
  }
  if (*value > static_cast<double>(max_value)) {
    throw doc.error_at(
        node, field,
        limit_message(static_cast<double>(max_value), printable_input(node.Scalar()), hint));
  }
  return static_cast<int>(*value);
}

double plausible_number(const YamlDocument& doc, const YAML::Node& node, const std::string& field,
                        double max_value, const std::string& hint) {
  const std::optional<double> value = scalar_number(node);
  if (!value || !std::isfinite(*value)) {
    throw doc.error_at(node, field, "expected a finite number, found " + describe_node(node));
  }
  if (*value > max_value) {
    throw doc.error_at(node, field, limit_message(max_value, printable_input(node.Scalar()), hint));
  }
  return *value;
}

}  // namespace stowage
