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
// Whether an edition-2 check the spec leaves unchecked is still listed (with its reason).
[[nodiscard]] bool shows_skipped(CheckId id, const Spec& spec);

// Adds a quantity unless it is not finite (never NaN or infinity in a report).
void add(std::vector<QuantityEntry>& out, std::string key, double value, Unit unit, std::string label);

}  // namespace coilfit::report
