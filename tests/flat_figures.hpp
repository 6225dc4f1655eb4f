// Test helper: the figures of an evaluation as one flat struct (the extremes over both ambient
// corners, as the report quotes them), so that hand-worked checks read like the method.
#pragma once

#include <algorithm>
#include <variant>

#include "coilfit/sizing.hpp"

namespace coilfit::test {

struct Flat {
    double r_coil_cold_ohm = 0, r_coil_hot_ohm = 0, coil_temp_hot_c = 0;
    double coil_current_nominal_a = 0, coil_current_max_a = 0, coil_current_min_a = 0;
    double coil_voltage_min_v = 0, operate_voltage_hot_v = 0, release_current_a = 0;
    double hfe_min = 0, hfe_needed = 0, beta_target = 0, forced_gain_policy = 0, base_current_required_a = 0;
    double vce_sat_v = 0, vbe_sat_v = 0, pin_r_out_ohm = 0;
    double base_resistor_max_ohm = 0, base_resistor_min_ohm = 0;
    double base_current_min_a = 0, pin_current_max_a = 0, forced_gain_worst = 0, resistor_power_w = 0;
    double transistor_power_w = 0, junction_temp_max_c = 0;
    double peak_collector_voltage_v = 0, release_time_s = 0, current_zero_time_s = 0;
    double clamp_energy_j = 0, clamp_charge_c = 0, clamp_power_w = 0, diode_average_current_a = 0, zener_power_w = 0;
    double stored_energy_j = 0;
    bool has_timing = false, has_rate = false;
};

inline Flat flat(const Evaluation& e) {
    Flat f;
    const auto& c0 = e.coil.at[0];
    const auto& c1 = e.coil.at[1];
    f.r_coil_cold_ohm = std::min(c0.r_cold_ohm, c1.r_cold_ohm);
    f.r_coil_hot_ohm = std::max(c0.r_hot_ohm, c1.r_hot_ohm);
    f.coil_temp_hot_c = std::max(c0.temp_hot_c, c1.temp_hot_c);
    f.coil_current_nominal_a = e.coil.current_nominal_a;
    f.coil_current_max_a = e.coil_current_max_a();
    f.coil_voltage_min_v = std::min(e.driver.at[0].coil_voltage_min_v, e.driver.at[1].coil_voltage_min_v);
    f.coil_current_min_a = std::min(std::max(0.0, e.driver.at[0].coil_voltage_min_v) / c0.r_hot_ohm,
                                    std::max(0.0, e.driver.at[1].coil_voltage_min_v) / c1.r_hot_ohm);
    f.operate_voltage_hot_v = std::max(c0.operate_voltage_v, c1.operate_voltage_v);
    f.release_current_a = e.coil.release_current_a;
    if (const auto* b = std::get_if<BipolarFigures>(&e.drive)) {
        const auto& a = b->at[0];
        const auto& h = b->at[1];
        f.hfe_min = std::min(a.hfe_min, h.hfe_min);
        f.hfe_needed = std::max(a.hfe_needed, h.hfe_needed);
        f.beta_target = std::min(a.beta_target, h.beta_target);
        f.forced_gain_policy = a.forced_gain_policy;
        f.base_current_required_a = std::max(a.base_current_required_a, h.base_current_required_a);
        f.vce_sat_v = std::max(a.vce_sat_v, h.vce_sat_v);
        f.vbe_sat_v = std::max(a.vbe_sat_v, h.vbe_sat_v);
        f.pin_r_out_ohm = b->pin_r_out_ohm;
        f.base_resistor_max_ohm = b->window_max_ohm;
        f.base_resistor_min_ohm = b->window_min_ohm;
        f.base_current_min_a = std::min(a.base_current_min_a, h.base_current_min_a);
        f.pin_current_max_a = std::max(a.pin_current_max_a, h.pin_current_max_a);
        f.forced_gain_worst = std::max(a.forced_gain_worst, h.forced_gain_worst);
        f.resistor_power_w = std::max(a.resistor_power_w, h.resistor_power_w);
    }
    f.transistor_power_w = std::max(e.driver.at[0].power_w, e.driver.at[1].power_w);
    f.junction_temp_max_c = std::max(e.driver.at[0].junction_c, e.driver.at[1].junction_c);
    const auto& k0 = e.clamp.at[0];
    const auto& k1 = e.clamp.at[1];
    f.peak_collector_voltage_v = e.peak_collector_voltage_v();
    f.release_time_s = e.release_time_s();
    f.current_zero_time_s = std::max(k0.current_zero_time_s, k1.current_zero_time_s);
    f.clamp_energy_j = std::max(k0.energy_j, k1.energy_j);
    f.clamp_charge_c = std::max(k0.charge_c, k1.charge_c);
    f.clamp_power_w = std::max(k0.clamp_power_w, k1.clamp_power_w);
    f.diode_average_current_a = std::max(k0.diode_average_current_a, k1.diode_average_current_a);
    f.zener_power_w = std::max(k0.zener_power_w, k1.zener_power_w);
    f.stored_energy_j = e.clamp.stored_energy_j;
    f.has_timing = k0.has_timing;
    f.has_rate = k0.has_rate;
    return f;
}

// The clamp voltages at I0 with the zener's band lo..hi (resistor tolerances at 1).
inline ClampVoltages clamp_voltages_at(const ClampSpec& clamp, double i0_a, double vz_lo_v, double vz_hi_v) {
    Conditions c;
    c.ta_lo_c = c.ta_hi_c = 25.0;  // the zener at its 25 °C data (no drift)
    c.vz_lo_v = vz_lo_v;
    c.vz_hi_v = vz_hi_v;
    return clamp_voltages(clamp, i0_a, c);
}

}  // namespace coilfit::test
