// Internal to the core: the pieces of a SizingReport, each in its own file.
#pragma once

#include <string>
#include <vector>

#include "coilfit/report.hpp"

namespace coilfit::report {

[[nodiscard]] ResistorReport resistor_report(const Spec& spec, const Sized& sized);
// Contract keys first (docs/architecture: unit in the key's suffix), then supporting figures.
[[nodiscard]] std::vector<QuantityEntry> quantities(const Spec& spec, const Sized& sized);
[[nodiscard]] std::vector<std::string> notes(const Spec& spec, const Sized& sized);
[[nodiscard]] std::vector<std::string> cautions(const Spec& spec);
[[nodiscard]] std::vector<ClampOption> clamp_options(const Spec& spec, const Catalogue& catalogue, const Sized& sized);
// The contact side (report_contact.cpp): its section, its quantities and notes; the section is
// present when the spec names a relay or the kind of its load.
[[nodiscard]] std::optional<ContactReport> contact_report(const Spec& spec,
                                                          const std::vector<ClampOption>& clamp_options);
void contact_quantities(std::vector<QuantityEntry>& out, const Spec& spec);
void contact_notes(std::vector<std::string>& out, const Spec& spec);
[[nodiscard]] bool contact_side_shown(const Spec& spec);

// Whether an edition-2 check the spec leaves unchecked is still listed (with its reason).
[[nodiscard]] bool shows_skipped(CheckId id, const Spec& spec);

// Adds a quantity unless it is not finite (never NaN or infinity in a report).
void add(std::vector<QuantityEntry>& out, std::string key, double value, Unit unit, std::string label);

}  // namespace coilfit::report
