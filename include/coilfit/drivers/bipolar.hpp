// The bipolar driver (npn, darlington): base resistor from the pin, saturation at the weakest
// corner, the pin current at the strongest (src/method.md "Bipolar drivers").
#pragma once

#include <array>
#include <optional>
#include <string>

#include "coilfit/check.hpp"
#include "coilfit/corners.hpp"
#include "coilfit/driver.hpp"
#include "coilfit/spec.hpp"

namespace coilfit {

// How a pin-side check came out, recorded by the stage for the words (CheckValue::detail).
enum class BipolarCase : std::uint8_t { normal, no_resistor, pin_below_vbe, no_base_current };

struct BipolarCorner {
    double current_a = 0;  // the coil current that sizes the drive at this corner
    double thermal_ambient_c = 0;
    double hfe_min = 0;  // at the corner's current and temperature
    double hfe = 0;      // the sample's gain (minimum, or towards typical in a sample)
    double forced_gain_policy = 0, vce_sat_test_ratio = 0, beta_target = 0;
    bool policy_binds = false;  // the forced-gain policy, not the part's gain, sets the base current
    double base_current_required_a = 0, hfe_needed = 0;
    double vce_sat_v = 0, vbe_sat_v = 0, vbe_low_v = 0;
    double pulldown_current_a = 0;  // Vbe(sat) through the pull-down and any internal resistor
    double base_resistor_max_ohm = 0, base_resistor_min_ohm = 0;
    // with the resistor
    double base_current_min_a = 0, pin_current_max_a = 0, forced_gain_worst = 0, resistor_power_w = 0;
    bool saturates = false;
    double transistor_power_w = 0, junction_temp_c = 0;
    // the data limits
    Lookup hfe_lookup, vce_lookup, vbe_lookup;
    bool vce_sat_not_guaranteed = false;
};

struct BipolarFigures {
    std::array<BipolarCorner, corner_count> at{};
    double pin_r_out_ohm = 0;
    double window_min_ohm = 0, window_max_ohm = 0;  // the base resistor window of both corners
};

// The spec-only part of the bipolar driver, worked out once (Monte Carlo evaluates it often).
struct BipolarDriver {
    using Figures = BipolarFigures;
    const Bipolar* part = nullptr;
    double derated_ic_a = 0, derated_vceo_v = 0, tj_limit_c = 0, rth_k_per_w = 0;
    double resistor_power_limit_w = 0;
    double pin_r_out_ohm = 0;
    double internal_rbe_ohm = 0;  // 0: none
    // The gain's temperature factor at the spec's two ambients, worked out once (a pow each).
    double gain_ta_c[2] = {25.0, 25.0};
    double gain_factor[2] = {1.0, 1.0};
};

[[nodiscard]] BipolarDriver prepare_bipolar(const Spec& spec, const Bipolar& part, double pin_r_out_ohm);

// One corner of the bipolar driver with base resistor rb_ohm (0: none): its figures, what every
// driver gives, and its checks (transistor.current, .saturation, .thermal, pin.current,
// resistor.power). `all` false leaves the window and other figures no check reads.
void bipolar_corner(const BipolarDriver& d, const Spec& spec, const Conditions& c, const DriveInput& in, double rb_ohm,
                    bool all, BipolarCorner& out, DriverCorner& common, CheckSet& checks);

// The design's base resistor: the largest series value <= the window's top (or the one nearest
// its geometric middle with choose "centred"), or the fixed one; nullopt when none fits.
[[nodiscard]] std::optional<double> choose_base_resistor(const Spec& spec, const BipolarFigures& f);

struct Evaluation;
[[nodiscard]] std::string bipolar_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e);

}  // namespace coilfit
