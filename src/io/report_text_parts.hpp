// The sections of the text report (report_text*.cpp); render_text puts them in order:
// verdict, design, checks, [contacts], inputs, figures, clamp options, notes, cautions.
#pragma once

#include <string>
#include <string_view>

#include "coilfit/report.hpp"
#include "io/report_io.hpp"

namespace coilfit::io::text {

[[nodiscard]] std::string qf(double v, Unit u);
[[nodiscard]] std::string heading(std::string_view title);
// "label  text" with the text wrapped under itself; the label column is `label_w` wide.
[[nodiscard]] std::string labelled(std::string_view label, const std::string& text, const TextStyle& style,
                                   std::size_t label_w = 15);

// "coilfit 0.1.0 - channel name", wrapped.
[[nodiscard]] std::string title_line(const SizingReport& report, const TextStyle& style);
// "PASS: every check holds at worst case." / "FAIL: 3 of 13 checks fail; worst: pin.current".
[[nodiscard]] std::string verdict_line(const SizingReport& report, const TextStyle& style);
// The parts and values of the design; the resistor window in words when no resistor fits.
[[nodiscard]] std::string design_section(const SizingReport& report, const TextStyle& style);
[[nodiscard]] std::string design_brief(const SizingReport& report, const TextStyle& style);
[[nodiscard]] std::string inputs_section(const SizingReport& report, const TextStyle& style);

// One table of checks: each row says what it compared; skipped rows say why; failing and
// warning rows say what would fix them. Stacks each check on its own lines when narrow.
[[nodiscard]] std::string checks_section(const SizingReport& report, const TextStyle& style);
// The failing and warning checks only, one line each (for --brief); at most `max_rows` rows.
[[nodiscard]] std::string checks_brief(const SizingReport& report, const TextStyle& style, std::size_t max_rows);
// "+12 %", "-277 % (3.8x the limit)".
// "pass", "WARN", "FAIL", "skip": the verdict column of every text table.
[[nodiscard]] std::string verdict_word(Verdict v);
[[nodiscard]] std::string margin_text(const Check& c);
// Whether a check is shown in the checks table (contact checks have their own section).
[[nodiscard]] bool in_checks_table(const Check& c);

[[nodiscard]] std::string figures_section(const SizingReport& report, const TextStyle& style);
[[nodiscard]] std::string clamp_options_section(const SizingReport& report, const TextStyle& style);
[[nodiscard]] std::string notes_section(const SizingReport& report, const TextStyle& style);
[[nodiscard]] std::string cautions_section(const SizingReport& report, const TextStyle& style);

}  // namespace coilfit::io::text
