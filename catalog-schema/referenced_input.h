// SPDX-License-Identifier: MIT
// What the study and tender loaders share: opening a file that another file names (an error
// is reported at the naming key), and reading an `economics` block.
#pragma once

#include <cstdint>
#include <fstream>
#include <string>

#include "catalog-schema/yaml_document.h"
#include "model/economics.h"

namespace stowage {

// Opens `path`, named at `node` (field `field`) of `doc`, within `max_bytes`; on failure throws
// InputError at that key: "<what>: <reason>".
std::ifstream open_referenced(const YamlDocument& doc, const YAML::Node& node,
                              const std::string& field, const std::string& path,
                              const std::string& what, std::uintmax_t max_bytes);

// The economics block at `node`, whose field path is `field` ("study.economics"), validated;
// errors name `field` + "." + the offending key.
Economics read_economics(const YamlDocument& doc, const YAML::Node& node, const std::string& field);

}  // namespace stowage
