// SPDX-License-Identifier: MIT
// The JSON Schemas of the input files (catalog-schema/schemas/*.schema.json), compiled into the
// program by embed_schemas.cmake so the loader enforces exactly the rules that editors show.
//
// Names are the file names without ".schema.json": "profile", "site", "study".
// embedded_schema() returns the schema text, or an empty view for an unknown name.
#pragma once

#include <string_view>
#include <vector>

namespace stowage {

std::string_view embedded_schema(std::string_view name);
std::vector<std::string_view> embedded_schema_names();

}  // namespace stowage
