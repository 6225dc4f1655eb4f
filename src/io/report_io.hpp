// Rendering a SizingReport: JSON (schema "coilfit.report/1") for scripts, text for people.
#pragma once

#include <string>

#include "coilfit/report.hpp"
#include "io/json_read.hpp"

namespace coilfit::io {

inline constexpr std::string_view report_schema = "coilfit.report/1";

[[nodiscard]] Json report_to_json(const SizingReport& report);
// One check in the report's shape: id, verdict, value, limit, unit, margin, message, and the
// reason of a skipped check or the corner of an evaluated one.
[[nodiscard]] Json check_to_json(const Check& check);

struct TextStyle {
    bool color = false;       // ANSI colours: only on a terminal, never with NO_COLOR
    std::size_t width = 100;  // fit the report to this many columns (40 at least)
    bool brief = false;       // verdict, design and the failing or warning checks only
};

// Colours a verdict word (pass green, warn yellow, fail red, skip dim) when style.color.
[[nodiscard]] std::string paint(std::string_view text, Verdict verdict, const TextStyle& style);

[[nodiscard]] std::string render_text(const SizingReport& report, const TextStyle& style);

}  // namespace coilfit::io
