// Worst-case sizing of a low-side NPN coil driver on a microcontroller pin.
//
// Modelling assumptions (method.md is the contract; the source of each formula is beside it
// in src/core/sizing.cpp):
//  1. Every check is made at the corner worst for it (extreme-value analysis), from the
//     tolerance bands of supply, pin VDD, coil resistance, base resistor and zener, and the
//     ambient range. Nominal values are reported for orientation only.
//  2. The coil is a resistance R and an inductance L. R follows annealed copper,
//     R(T) = R_ref (1 + 0.00393/K (T - T_ref)) (IEC 60028); L does not change with temperature
//     and is the energised (armature closed) value.
//  3. The hot coil is at the highest ambient plus the self-heating rise given (default 0 K).
//  4. The highest coil current flows with the highest supply into the cold coil at its low
//     resistance tolerance; Vce(sat) is neglected there (it only lowers the current).
//  5. Must-operate is an ampere-turn threshold: the guaranteed must-operate voltage rises with
//     the copper factor of the hot coil; it already covers the resistance spread.
//  6. The transistor's minimum gain, Vce(sat) and Vbe(sat) come from the part's points,
//     interpolated on log(Ic), nearest point outside them (with a note). Vbe is taken at its
//     Vbe(sat) maximum for the base drive and at policy.vbe_low (0.6 V) for the pin current.
//  7. The pin is a Thevenin source: VDD behind R_out = (VDD - VOH)/IOH (0 when VOH is not
//     given). For the highest pin current R_out is taken as 0.
//  8. The base-emitter pull-down draws Vbe/Rbe away from the base.
//  9. Transistor power is Vce(sat)*Ic + Vbe(sat)*Ib in steady state; switching losses are
//     neglected (a relay switches a few times a second at most).
// 10. The clamp voltage is held constant during the decay (closed-form RL decay); the diode's
//     maximum drop sets the peak collector voltage, its low drop (and the zener's bottom
//     tolerance) the release time, which therefore errs long.
#pragma once

#include <array>
#include <cstdint>
#include <optional>
#include <string_view>

#include "coilfit/clamp.hpp"
#include "coilfit/parts.hpp"
#include "coilfit/report.hpp"
#include "coilfit/spec.hpp"

namespace coilfit {

enum class CheckId : std::uint8_t {
    coil_operate,
    coil_overvoltage,
    transistor_current,
    transistor_voltage,
    transistor_saturation,
    transistor_thermal,
    pin_current,
    resistor_power,
    diode_voltage,
    diode_current,
    clamp_power,
    release_time,
};
inline constexpr std::size_t check_count = 12;
[[nodiscard]] std::string_view check_id_name(CheckId id);  // "coil.operate", ...
[[nodiscard]] Unit check_unit(CheckId id);

// The ranges a design must work over. The worst case takes every tolerance band; a Monte Carlo
// sample sets each range to one point (lo == hi). Samples vary parts and conditions, never the
// design's choices (the resistor's nominal value, the parts).
struct Conditions {
    double vs_lo_v = 0, vs_hi_v = 0;                  // supply
    double ta_lo_c = 0, ta_hi_c = 0;                  // ambient
    double vdd_lo_v = 0, vdd_hi_v = 0;                // pin supply
    double r_coil_lo_ohm = 0, r_coil_hi_ohm = 0;      // coil resistance at its reference temperature
    double rb_lo_factor = 1, rb_hi_factor = 1;        // base resistor: 1 - tb, 1 + tb
    double vz_lo_v = 0, vz_hi_v = 0;                  // zener voltage
    double hfe_position = 0;                          // 0: minimum gain; 1: typical gain
};

[[nodiscard]] Conditions worst_case_conditions(const Spec& spec);

// One check evaluated numerically (no words).
struct CheckValue {
    enum class Bound : std::uint8_t { at_most, at_least };
    double value = 0;
    double limit = 0;
    Verdict verdict = Verdict::skip;
    Bound bound = Bound::at_most;  // the value must stay at most / at least the limit
    bool has_value = false;        // false when the value cannot be computed (e.g. no clamp)

    // Headroom as a fraction of the limit, negative when the check fails: (limit - value)/|limit|
    // for an upper bound, (value - limit)/|limit| for a lower one. Against a zero limit it is 0
    // or -1; without a value it is -1 for a failed check, 0 for a skipped one. Worked out on
    // demand: Monte Carlo needs only the verdicts.
    [[nodiscard]] double margin() const;
};

// Every figure of one evaluation, SI units. Cheap enough for Monte Carlo: no allocation.
struct Evaluation {
    // coil
    double r_coil_cold_ohm = 0, r_coil_hot_ohm = 0, coil_temp_hot_c = 0;
    double coil_current_nominal_a = 0, coil_current_max_a = 0, coil_current_min_a = 0;
    double coil_voltage_min_v = 0, coil_voltage_max_v = 0, operate_voltage_hot_v = 0;
    double release_current_a = 0;
    // transistor and base drive
    double hfe_min = 0, hfe = 0, forced_gain_policy = 0, beta_target = 0;
    double base_current_required_a = 0, hfe_needed = 0;
    double vce_sat_v = 0, vbe_sat_v = 0, vce_sat_test_ratio = 0;
    double pin_r_out_ohm = 0, pulldown_current_a = 0;
    double base_resistor_max_ohm = 0, base_resistor_min_ohm = 0;
    // with a resistor
    double base_resistor_ohm = 0;  // 0: none
    double base_current_min_a = 0, pin_current_max_a = 0, forced_gain_worst = 0;
    bool saturates = false;  // base_current_min_a > 0
    double transistor_power_w = 0, junction_temp_max_c = 0, resistor_power_w = 0;
    // clamp and timing
    ClampVoltages clamp{};
    double peak_collector_voltage_v = 0;
    bool has_timing = false;  // inductance given
    double release_time_s = 0, current_zero_time_s = 0, stored_energy_j = 0;
    double clamp_energy_j = 0, clamp_charge_c = 0;
    bool has_rate = false;    // inductance and switching frequency given
    double clamp_power_w = 0, diode_average_current_a = 0, zener_power_w = 0, clamp_resistor_power_w = 0;
    // flags for notes
    bool hfe_outside = false, vce_outside = false, vbe_outside = false;
    bool vce_sat_not_guaranteed = false;
    std::array<CheckValue, check_count> checks{};

    [[nodiscard]] const CheckValue& check(CheckId id) const {
        return checks[static_cast<std::size_t>(id)];
    }
    [[nodiscard]] bool passes() const;  // no check failed (warnings pass)
};

// The pieces of evaluate() that depend on the spec alone, worked out once: Monte Carlo
// evaluates one spec millions of times. It points at the spec, which must outlive it.
struct Prepared {
    const Spec* spec = nullptr;
    double coil_current_nominal_a = 0;  // nominal supply / reference resistance
    double release_current_a = 0;       // must-release voltage / reference resistance
    double pin_r_out_ohm = 0;           // (VDD - VOH) / IOH, 0 when VOH is not given
    double rth_ja_k_per_w = 0;
    double derated_vceo_v = 0, derated_ic_a = 0, tj_limit_c = 0;
    double resistor_power_limit_w = 0;
    double diode_peak_limit_a = 0;      // repetitive peak, else surge, else average rating
    double diode_rated_power_w = 0;     // if_avg * Vf(if_avg): a diode clamp's power limit
};
[[nodiscard]] Prepared prepare(const Spec& spec);

// What evaluate() works out: every figure, or only what the checks' verdicts need (Monte Carlo
// reads verdicts alone). With `verdicts` every verdict is the same as with `all`; figures no
// check uses (the base resistor window, the gain needed, the lowest coil current, stored energy,
// release time, charge and clamp energy where no check reads them) are left at zero, and the
// rate checks may be decided on an upper bound of the clamp charge, their values then that bound.
enum class Figures : std::uint8_t { all, verdicts };

// Evaluates the design with base resistor rb_ohm (0: no resistor could be chosen) over the
// given conditions. Pure, allocation-free, fast (Monte Carlo calls it millions of times).
// The first form prepares the spec on each call; both give the same figures.
[[nodiscard]] Evaluation evaluate(const Spec& spec, const Conditions& conditions, double rb_ohm);
[[nodiscard]] Evaluation evaluate(const Prepared& prepared, const Conditions& conditions, double rb_ohm,
                                  Figures figures = Figures::all);

// Fills the ln(current) points of the spec's transistor and clamp diode (see parts.hpp): a
// speed-up for callers that evaluate one spec many times; results are unchanged.
void precompute_logs(Spec& spec);

// The largest value of the spec's series <= Rb_max, or the fixed value; nullopt when no value
// of the series is small enough.
[[nodiscard]] std::optional<double> choose_base_resistor(const Spec& spec, const Evaluation& worst);

// Sizes and checks one channel at worst case. Pure. The catalogue supplies the zeners for the
// clamp trade-off table (it may be empty).
[[nodiscard]] SizingReport size(const Spec& spec, const Catalogue& catalogue);

// The chosen design only: the worst-case evaluation with the chosen (or fixed) resistor.
struct Sized {
    Conditions conditions;
    std::optional<double> rb_ohm;
    Evaluation worst;
};
[[nodiscard]] Sized size_numbers(const Spec& spec);

}  // namespace coilfit
