// The policy defaults of the method (src/method.md), written once: the spec's struct
// initialisers, the report's "default used" notes and the command line's help all read them here.
#pragma once

namespace coilfit::defaults {

// Corners
inline constexpr double supply_tolerance = 0.10;
inline constexpr double ambient_min_c = 0.0;  // commercial grade (src/method.md "Corners")
inline constexpr double ambient_max_c = 70.0;
inline constexpr double pin_vdd_tolerance = 0.05;

// Coil (common practice: relay data)
inline constexpr double coil_tolerance = 0.10;
inline constexpr double coil_reference_temp_c = 20.0;  // IEC 60028's copper reference
inline constexpr double must_operate = 0.75;
inline constexpr double must_release = 0.10;
inline constexpr double self_heating_k = 0.0;

// Bipolar drive (common practice)
inline constexpr double forced_gain_npn = 10.0;
inline constexpr double overdrive = 2.0;
inline constexpr double vbe_low_v = 0.6;
inline constexpr double base_resistor_power_w = 0.125;

// Ratings
inline constexpr double current_derating = 0.75;
inline constexpr double voltage_derating = 0.75;
inline constexpr double junction_margin_k = 25.0;
inline constexpr double power_derating = 0.50;

// Clamp
inline constexpr double clamp_resistor_power_w = 0.25;  // a through-hole resistor (common practice)
inline constexpr double clamp_resistor_tolerance = 0.05;
inline constexpr double vf_low_silicon_v = 0.6;
inline constexpr double vf_low_schottky_v = 0.3;
// Repetitive pulses against a non-repetitive surge rating: 50 % (from memory: repetitive-pulse
// derating of surge ratings is commonly 30-50 %).
inline constexpr double pulse_derating = 0.50;
// Below a zener's test current without Zzt: 10 % off its bottom tolerance (common practice).
inline constexpr double zener_knee_factor = 0.90;

// N-MOSFET drive (src/method.md "N-MOSFET driver")
inline constexpr double nmos_pulldown_ohm = 100e3;
inline constexpr double rds_on_tempco_per_k = 0.006;    // from memory: Rds(on) x1.5-1.7 at 125 °C
inline constexpr double vgs_th_tempco_v_per_k = 0.004;  // from memory: Vgs(th) falls about 4 mV/K
inline constexpr double vplateau_above_threshold_v = 1.0;
inline constexpr double slow_gate_s = 10e-6;

// Transistor-array channel (src/method.md "Transistor-array channel")
inline constexpr double array_vin_low_v = 1.2;  // two Vbe at their low (common practice)
inline constexpr double array_input_tolerance = 0.20;

// Switching
inline constexpr double switching_duty = 0.5;

}  // namespace coilfit::defaults
