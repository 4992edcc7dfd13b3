// SPDX-License-Identifier: MIT
#include "catalog-schema/referenced_input.h"

#include "catalog-schema/input_file.h"
#include "catalog-schema/input_limits.h"
#include "model/invalid_value.h"

namespace stowage {

std::ifstream open_referenced(const YamlDocument& doc, const YAML::Node& node,
                              const std::string& field, const std::string& path,
                              const std::string& what, std::uintmax_t max_bytes) {
  std::ifstream in;
  std::string reason;
  if (!open_input(path, in, reason, max_bytes))
    throw doc.error_at(node, field, what + ": " + reason);
  return in;
}

Economics read_economics(const YamlDocument& doc, const YAML::Node& e, const std::string& field) {
  Economics economics;
  economics.project_years =
      plausible_count(doc, e["project_years"], field + ".project_years", 100, " years");
  economics.real_discount_rate = *scalar_number(e["real_discount_rate"]);
  economics.currency = e["currency"].Scalar();
  try {
    economics.validate();
  } catch (const InvalidValue& error) {
    throw doc.error_at_path(field + "." + error.field(), error.rule());
  }
  return economics;
}

}  // namespace stowage
