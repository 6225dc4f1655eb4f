// The driver: the switch between the coil and ground, and its drive from the pin. One variant per
// kind (src/method.md "The circuit"): bipolar (npn, darlington; base resistor), nmos (gate
// resistor), array (one channel of a sink array). Everything after the driver stage (clamp,
// timing, yield, pick, the renderers) sees only DriverCommon; a driver's own figures are in its
// header under coilfit/drivers/.
#pragma once

#include <array>
#include <string_view>

#include "coilfit/check.hpp"

namespace coilfit {

// What the driver stage is told about one ambient corner.
struct DriveInput {
    Corner corner = Corner::cold;
    double ambient_c = 25;          // the devices' temperature (gain, Vbe, threshold, Rds(on))
    double current_a = 0;           // the highest coil current there: sizes the drive
    double ln_current = 0;          // ln(current_a): one log serves every table lookup at it
    double r_coil_hot_ohm = 0;      // the hot coil, for the on-state coil voltage
    double thermal_ambient_c = 25;  // the ambient of the thermal check
    double thermal_current_a = 0;   // the coil current of the thermal check
};

// What every driver gives the stages after it, at one ambient corner.
struct DriverCorner {
    double on_drop_v = 0;           // the switch's on-state drop at the lowest supply
    double coil_voltage_min_v = 0;  // the lowest coil voltage when on (lowest supply less the drop)
    double pin_current_max_a = 0;   // the most the pin sources
    double power_w = 0;             // the switch's dissipation (thermal check's corner)
    double junction_c = 0;          // its junction temperature there
    bool drop_beyond_data = false;  // the on-state drop came from beyond the part's data (unsafe side)
};

struct DriverCommon {
    std::array<DriverCorner, corner_count> at{};
    std::string_view drop_name = "Vce(sat)";           // words for the on-state drop
    std::string_view terminal = "collector";           // collector, drain, output
    std::string_view rating_name = "Vceo";             // the voltage rating
    std::string_view resistor_name = "base resistor";  // "" when the drive resistor is built in
    double resistor_ohm = 0;                           // the design's base or gate resistor (0: none could be chosen)
    double rated_voltage_v = 0;                        // Vceo, Vds max
    double peak_limit_v = 0;                           // the derated rating: the peak the clamp must keep below
    double avalanche_j = 0;                            // repetitive avalanche rating (nmos with ear), else 0
};

}  // namespace coilfit
