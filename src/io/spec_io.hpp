// Spec files (schema "coilfit.spec/1") and command-line overrides into a validated Spec.
#pragma once

#include <string>

#include "coilfit/spec.hpp"
#include "io/json_read.hpp"
#include "io/parts_io.hpp"
#include "io/sections_read.hpp"

namespace coilfit::io {

inline constexpr std::string_view spec_schema = "coilfit.spec/1";
inline constexpr std::size_t max_spec_bytes = 1U << 20U;

// A spec document before validation, with where each part of it came from.
struct SpecDocument {
    Json doc = Json::object();
    Origin origin;
};

// Parses spec text (file label for messages). The text must hold a JSON object.
[[nodiscard]] SpecDocument parse_spec_text(std::string_view text, const std::string& file);
// Reads a spec file, or standard input for "-".
[[nodiscard]] SpecDocument load_spec_document(const std::string& path);
// An empty document for a spec given wholly as flags.
[[nodiscard]] SpecDocument flags_only_document();

// Sets a field ("coil.resistance") from a command-line flag; messages about it name the flag.
void set_field(SpecDocument& d, const std::string& dotted_path, Json value, const std::string& flag);

// Validates the document against the schema and resolves parts and presets from the table.
[[nodiscard]] Spec read_spec(const SpecDocument& d, const PartsTable& table);

// The resolved spec, all values in SI numbers (the report's "input").
[[nodiscard]] Json spec_to_json(const Spec& spec);

}  // namespace coilfit::io
