// SPDX-License-Identifier: MIT
// SchemaValidator: checks a parsed YAML document against a JSON Schema (draft 2020-12), so the
// embedded schemas/*.schema.json are the one source of the structural rules of the input files.
//
// Supported keywords (others make the constructor throw, so a schema cannot silently demand
// more than is enforced):
//   type (object, array, string, number, integer, boolean, null; one name or a list),
//   properties, required, additionalProperties (false or a schema), enum, minimum, maximum,
//   exclusiveMinimum, exclusiveMaximum, minLength, minItems, maxItems, items, pattern
//   (ECMAScript, unanchored as in JSON Schema), oneOf, $ref to "#/$defs/NAME", and the
//   annotations $schema, $id, $comment, title, description, default, examples. The editor
//   extensions errorMessage (message for a failed oneOf) and patternErrorMessage (hint for a
//   failed pattern) are used for the wording. The extension renamedKeys (an object mapping an
//   old key name to its new one) refuses a retired key with a message naming the new key.
// Beyond JSON Schema, a mapping with the same key twice is an error (YAML forbids it, yaml-cpp
// keeps both), and an unknown key is reported with the nearest allowed key as a suggestion.
// Numbers follow the YAML core schema (see yaml_document.h): a quoted "3" is text, not a number;
// .nan and .inf fail every numeric type.
#pragma once

#include <yaml-cpp/yaml.h>

#include <string>
#include <string_view>
#include <vector>

#include "catalog-schema/input_error.h"
#include "catalog-schema/yaml_document.h"

namespace stowage {

class SchemaValidator {
 public:
  // Throws std::invalid_argument when the text is not JSON/YAML or uses an unsupported keyword
  // or an unresolvable $ref: a defect of the program, not of the user's input.
  explicit SchemaValidator(std::string_view schema_text);

  // The validator of an embedded schema ("profile", "site", "study"), built once.
  // Throws std::out_of_range for an unknown name.
  static const SchemaValidator& embedded(std::string_view name);

  // Every violation, in document order (line, then column).
  std::vector<InputError> check(const YamlDocument& document) const;
  // Throws the first violation, if any.
  void enforce(const YamlDocument& document) const;

  const YAML::Node& schema() const { return schema_; }
  // The schema a $ref-bearing schema points to (itself when it has no $ref).
  YAML::Node resolve(const YAML::Node& schema) const;

 private:
  void check_node(const YAML::Node& schema, const YAML::Node& value, const YAML::Node& anchor,
                  const std::string& path, const YamlDocument& document,
                  std::vector<InputError>& out) const;
  void check_object(const YAML::Node& schema, const YAML::Node& value, const std::string& path,
                    const YamlDocument& document, std::vector<InputError>& out) const;
  void check_one_of(const YAML::Node& schema, const YAML::Node& value, const YAML::Node& anchor,
                    const std::string& path, const YamlDocument& document,
                    std::vector<InputError>& out) const;
  void verify_schema(const YAML::Node& schema, const std::string& where) const;

  YAML::Node schema_;
};

// The allowed word closest to `word` by edit distance, or "" when none is close enough to be a
// plausible typo (distance at most 1 + length / 4, case ignored). The distance counts an
// insertion, a deletion, a substitution or a swap of two adjacent characters as one edit
// (optimal string alignment, Damerau 1964), so "lpf" suggests "lfp".
std::string closest_match(const std::string& word, const std::vector<std::string>& allowed);

}  // namespace stowage
