// The calculation record: every check of a design as a derivation a
// checking engineer can follow, drawn from the DesignRecord (never computed
// again). HTML (self-contained: inline CSS and SVG) or Markdown.
#pragma once

#include <filesystem>
#include <string>

#include <nlohmann/json_fwd.hpp>

#include "armature/design.hpp"

namespace armature {

enum class RecordFormat { html, markdown };

// .html / .htm → HTML, .md → Markdown; anything else is an InputError on
// the field `report`.
RecordFormat record_format_for(const std::filesystem::path& path);

// The record of one design; `request` is the request as given (its inputs
// and fingerprint appear in the record); `date` is printed in the title block.
std::string calculation_record(const DesignRecord& record, const nlohmann::json& request,
                               RecordFormat format, const std::string& date);

// FNV-1a 64-bit hash of the request's canonical JSON text, in hex.
std::string request_fingerprint(const nlohmann::json& request);

// Today's date (UTC), ISO 8601.
std::string today_iso();

// Writes through a temporary file in the same directory, then renames it
// over `path`. Throws std::runtime_error on failure; `path` is untouched then.
void write_file_atomically(const std::filesystem::path& path, const std::string& content);

}  // namespace armature
