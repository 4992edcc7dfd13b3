// SPDX-License-Identifier: MIT
// YamlDocument: one parsed YAML input file together with the name it is reported under, and the
// helpers every loader uses to read values and to raise InputError at a node.
//
// parse_yaml() never lets a yaml-cpp exception escape: a syntax error becomes an InputError at
// the error's line and column, with the field path guessed from the keys above that line (the
// file cannot be parsed, so the path is read from the indentation of the text).
// Scalars are classified as YAML 1.2 core-schema values: a plain (unquoted) scalar is null
// (~, null, empty), a boolean (true/false), an integer, a number (decimal or exponent form,
// .inf/.nan counting as non-finite numbers) or else text; a quoted scalar is always text.
#pragma once

#include <yaml-cpp/yaml.h>

#include <istream>
#include <optional>
#include <string>

#include "catalog-schema/input_error.h"

namespace stowage {

enum class ScalarKind { Null, Boolean, Integer, Number, NonFiniteNumber, Text };

// Kind of a scalar or null node; must not be called on a mapping or a sequence.
ScalarKind scalar_kind(const YAML::Node& node);
// The value of an Integer, Number or NonFiniteNumber node; nullopt for any other node.
std::optional<double> scalar_number(const YAML::Node& node);
// How a node is described in messages: "a list", "text 'abc'", "the number 2.5", ...
std::string describe_node(const YAML::Node& node);

// Path joining in input spelling: join_key("profile", "cell") == "profile.cell",
// join_index("profile.ageing.cycle_life", 2) == "profile.ageing.cycle_life[2]".
std::string join_key(const std::string& parent, const std::string& key);
std::string join_index(const std::string& parent, std::size_t index);
// How an empty path (the document itself) is named in messages.
std::string display_path(const std::string& path);

class YamlDocument {
 public:
  YamlDocument(std::string source_name, YAML::Node root);

  const std::string& source() const { return source_; }
  const YAML::Node& root() const { return root_; }

  // An error located at `node` (its 1-based line and column); a node without a position (an
  // empty document) is reported at 1:1.
  InputError error_at(const YAML::Node& node, const std::string& field,
                      const std::string& message) const;

  // The node at `path` ("profile.ageing.cycle_life[2].cycles"), or the deepest existing node on
  // the way to it when the path does not exist; `exact` (if given) says whether it was found.
  // A mapping value that is null is located at its key, which is where a reader looks for it.
  YAML::Node locate(const std::string& path, bool* exact = nullptr) const;
  // error_at(locate(field), field, message): for rules checked after the structure is known.
  InputError error_at_path(const std::string& field, const std::string& message) const;

 private:
  std::string source_;
  YAML::Node root_;
};

// Parses the whole stream. Throws InputError on a syntax error or a read failure, and before
// yaml-cpp sees the text, for more than kMaxYamlFileBytes, a byte that is not UTF-8 (at its
// line and column) or collections nested deeper than kMaxYamlNestingDepth (input_limits.h).
YamlDocument parse_yaml(std::istream& in, const std::string& source_name);

}  // namespace stowage
