// One channel of a transistor-array sink (array): a built-in input resistor, an output that
// saturates to Vce(sat), a built-in clamp diode to a common pin (src/method.md
// "Transistor-array channel (array)"). The package's shared limits belong to the board.
#pragma once

#include <array>
#include <string>

#include "coilfit/check.hpp"
#include "coilfit/corners.hpp"
#include "coilfit/driver.hpp"
#include "coilfit/spec.hpp"

namespace coilfit {

struct ArrayCorner {
    Lookup vin_on{};  // input voltage that guarantees the output on at the corner's current
    Lookup vce_sat{};
    double pin_current_max_a = 0;        // (VDD_hi - vin_low) / (R_in (1 - t_in))
    double power_w = 0, junction_c = 0;  // one channel alone
};

struct ArrayFigures {
    std::array<ArrayCorner, corner_count> at{};
};

struct ArrayDriver {
    using Figures = ArrayFigures;
    const ArrayPart* part = nullptr;
    double derated_ic_a = 0, derated_vceo_v = 0, tj_limit_c = 0, rth_k_per_w = 0;
    double input_lo_ohm = 0;  // R_in (1 - t_in)
};

[[nodiscard]] ArrayDriver prepare_array(const Spec& spec, const ArrayPart& part);

// One corner of an array channel: pin.current, input.drive, transistor.current, transistor.thermal.
void array_corner(const ArrayDriver& d, const Spec& spec, const Conditions& c, const DriveInput& in, ArrayCorner& out,
                  DriverCorner& common, CheckSet& checks);

struct Evaluation;
[[nodiscard]] std::string array_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e);

}  // namespace coilfit
