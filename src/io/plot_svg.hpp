// `coilfit size --plot FILE.svg`: the turn-off transient of every clamp option of a report as an
// SVG drawing (our own drawing code, no plotting library). The points come from the core
// (coilfit/transient.hpp); this file only lays them out.
#pragma once

#include <string>

#include "coilfit/report.hpp"

namespace coilfit::io {

// Raises InputError when no clamp option has a decay to draw (no coil inductance, or no clamp).
[[nodiscard]] std::string turn_off_svg(const SizingReport& report);

}  // namespace coilfit::io
