// Copper winding resistance against temperature.
#pragma once

namespace coilfit {

// Temperature coefficient of resistance of annealed copper at 20 °C, per kelvin (IEC 60028).
inline constexpr double copper_alpha_per_k = 0.00393;

// R(T) = R_ref * (1 + alpha * (T - T_ref)), alpha referred to 20 °C (IEC 60028). The linear law
// is used as the method states; for T_ref other than 20 °C the small change of alpha with the
// reference temperature is neglected (under 1 % of the correction for 20..25 °C).
[[nodiscard]] constexpr double copper_resistance(double r_ref_ohm, double t_ref_c, double t_c) {
    return r_ref_ohm * (1.0 + copper_alpha_per_k * (t_c - t_ref_c));
}

// The factor by which a copper quantity (resistance, or an ampere-turn threshold voltage)
// scales from t_ref_c to t_c.
[[nodiscard]] constexpr double copper_factor(double t_ref_c, double t_c) {
    return 1.0 + copper_alpha_per_k * (t_c - t_ref_c);
}

}  // namespace coilfit
