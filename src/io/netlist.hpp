// A SPICE netlist of the sized circuit, for checking the report in a simulator:
// `coilfit size SPEC --netlist FILE`, then `ngspice -b FILE`.
//
// The netlist holds the driver at the corner that gives the longest release (highest supply,
// cold coil at its low resistance tolerance, the chosen base resistor at its weakest drive),
// with generic device models written here from the parts table data (never vendor models), a
// transient run (pin high, coil current settles, pin low) and three `.meas` statements named as
// the report's figures: coil_current_on, peak_collector and release_time.
#pragma once

#include <string>

#include "coilfit/report.hpp"

namespace coilfit::io {

// Names of the measurements, as ngspice prints them.
inline constexpr std::string_view meas_coil_current = "coil_current_on";
inline constexpr std::string_view meas_peak_collector = "peak_collector";
inline constexpr std::string_view meas_release_time = "release_time";
// An array channel's netlist also measures its on-voltage just before turn-off.
inline constexpr std::string_view meas_output_on = "output_on";

// The netlist text for the sized design in the report (it sizes nothing again). Throws InputError
// when the design cannot be simulated meaningfully: no coil inductance, no clamp, or no drive
// resistor (an array channel's is built in).
[[nodiscard]] std::string spice_netlist(const SizingReport& report);

// With device_temperature the simulation runs at the cold corner's ambient (.options temp) and
// the NPN model carries the part's 25 °C gain with SPICE's own temperature law (XTB equal to the
// method's gain exponent, TNOM 25 °C), instead of the gain the report corrected for the corner;
// the clamp diodes stay at the simulator's 27 °C (instance temp), so only the drive is affected.
struct NetlistOptions {
    bool device_temperature = false;
};
[[nodiscard]] std::string spice_netlist(const SizingReport& report, const NetlistOptions& options);

}  // namespace coilfit::io
