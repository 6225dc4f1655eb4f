// Internal to the netlist writer: the driver's device models, one per driver kind, written from
// the parts data (never vendor models), and the shared SPICE number formatting.
#pragma once

#include <string>
#include <vector>

#include "coilfit/report.hpp"

namespace coilfit::io::netlist {

// The simulation runs at 27 °C, the SPICE default for TEMP and TNOM; the thermal voltage kT/q
// there places the diode models (k/q = 8.617333262e-5 V/K, CODATA 2018).
inline constexpr double sim_temp_c = 27.0;
inline constexpr double vt_v = 8.617333262e-5 * (sim_temp_c + 273.15);

std::string num(double v);
std::string secs(double v);

// The driver of one copy of the circuit: its element lines (drive from node pin_<copy> to the
// switch at c_<copy>), its .model lines and the header comments that explain them.
struct DriverNetlist {
    std::vector<std::string> comments;  // explained in the header
    std::vector<std::string> models;    // .model lines, written once
    double drive_v = 0;                 // the pin's voltage step (the weakest drive)
    // Element lines of copy `copy` ("r" or "p"): pin_<copy> -> switch -> c_<copy>.
    std::vector<std::string> elements(const std::string& copy) const;
    std::vector<std::string> element_templates;  // with {0} for the copy's suffix
};

// device_temperature: the model's 25 °C gain with XTB (see NetlistOptions).
[[nodiscard]] DriverNetlist bipolar_netlist(const SizingReport& report, bool device_temperature = false);
[[nodiscard]] DriverNetlist mosfet_netlist(const SizingReport& report);
// One channel of a transistor array: its input resistor, then a Darlington pair (or, for the
// MOSFET class, a level-1 NMOS) to the output.
[[nodiscard]] DriverNetlist array_netlist(const SizingReport& report);

}  // namespace coilfit::io::netlist
