// The report's quantities, stage by stage: each key carries its unit in its suffix.
#include <algorithm>
#include <cmath>

#include "report_parts.hpp"

namespace coilfit::report {
namespace {

using Q = std::vector<QuantityEntry>;

double max2(double a, double b) { return std::max(a, b); }
double min2(double a, double b) { return std::min(a, b); }

void coil_quantities(Q& qs, const Spec& spec, const Evaluation& e) {
    const CoilCorner& cold = e.coil.at[0];
    const CoilCorner& hot = e.coil.at[1];
    if (spec.supply.voltage_v > 0)
        add(qs, "coil_current_nominal_a", e.coil.current_nominal_a, Unit::ampere, "coil current, nominal");
    add(qs, "coil_current_max_a", e.coil_current_max_a(), Unit::ampere,
        "coil current, highest (cold coil, high supply)");
    const double i_min = min2(std::max(0.0, e.driver.at[0].coil_voltage_min_v) / cold.r_hot_ohm,
                              std::max(0.0, e.driver.at[1].coil_voltage_min_v) / hot.r_hot_ohm);
    add(qs, "coil_current_min_a", i_min, Unit::ampere, "coil current, lowest (hot coil, low supply)");
    add(qs, "coil_resistance_cold_ohm", min2(cold.r_cold_ohm, hot.r_cold_ohm), Unit::ohm,
        "coil resistance, cold and low");
    add(qs, "coil_resistance_hot_ohm", max2(cold.r_hot_ohm, hot.r_hot_ohm), Unit::ohm, "coil resistance, hot and high");
    add(qs, "coil_temperature_hot_c", max2(cold.temp_hot_c, hot.temp_hot_c), Unit::celsius, "coil temperature, hot");
    add(qs, "coil_voltage_min_v", min2(e.driver.at[0].coil_voltage_min_v, e.driver.at[1].coil_voltage_min_v),
        Unit::volt, "coil voltage, lowest");
    add(qs, "operate_voltage_hot_v", max2(cold.operate_voltage_v, hot.operate_voltage_v), Unit::volt,
        "must-operate voltage, hot coil");
    add(qs, "release_current_a", e.coil.release_current_a, Unit::ampere, "release current (must-release)");
}

void bipolar_quantities(Q& qs, const Spec& spec, const Sized& sized, const BipolarFigures& f) {
    const BipolarCorner& a = f.at[0];
    const BipolarCorner& b = f.at[1];
    // The saturation check's corner gives the drive figures that go with it.
    const BipolarCorner& s = f.at[static_cast<std::size_t>(sized.worst.check(CheckId::transistor_saturation).corner)];
    add(qs, "hfe_min", min2(a.hfe_min, b.hfe_min), Unit::number, "hFE min at the highest coil current");
    add(qs, "hfe_needed", max2(a.hfe_needed, b.hfe_needed), Unit::number,
        "hFE min needed on this pin (overdrive x I / I pin)");
    add(qs, "forced_gain_target", s.beta_target, Unit::number, "forced gain target");
    add(qs, "base_current_required_a", max2(a.base_current_required_a, b.base_current_required_a), Unit::ampere,
        "base current required");
    add(qs, "vce_sat_v", max2(a.vce_sat_v, b.vce_sat_v), Unit::volt, "Vce(sat) max at the highest coil current");
    add(qs, "vbe_sat_v", max2(a.vbe_sat_v, b.vbe_sat_v), Unit::volt, "Vbe(sat) max at the highest coil current");
    add(qs, "pin_output_resistance_ohm", f.pin_r_out_ohm, Unit::ohm, "pin output resistance");
    add(qs, "base_resistor_max_ohm", f.window_max_ohm, Unit::ohm, "base resistor, largest that saturates");
    add(qs, "base_resistor_min_ohm", f.window_min_ohm, Unit::ohm, "base resistor, smallest the pin can carry");
    // The window's robustness (src/method.md "Bipolar drivers"): Rb_max / Rb_min.
    if (f.window_min_ohm > 0 && f.window_max_ohm > 0) {
        add(qs, "base_resistor_window_ratio", f.window_max_ohm / f.window_min_ohm, Unit::number,
            "base resistor window, largest over smallest");
    }
    if (sized.r_drive_ohm) {
        add(qs, "base_resistor_ohm", *sized.r_drive_ohm, Unit::ohm, "base resistor");
        add(qs, "base_current_min_a", min2(a.base_current_min_a, b.base_current_min_a), Unit::ampere,
            "base current, lowest");
        add(qs, "pin_current_max_a", max2(a.pin_current_max_a, b.pin_current_max_a), Unit::ampere,
            "pin current, highest");
        if (a.saturates && b.saturates) {
            add(qs, "forced_gain_worst", max2(a.forced_gain_worst, b.forced_gain_worst), Unit::number,
                "forced gain, worst case");
        }
        add(qs, "resistor_power_w", max2(a.resistor_power_w, b.resistor_power_w), Unit::watt,
            "base resistor power, highest");
    }
    (void)spec;
}

void mosfet_quantities(Q& qs, const Sized& sized, const MosfetFigures& f) {
    const MosfetCorner& a = f.at[0];
    const MosfetCorner& b = f.at[1];
    const MosfetCorner& hot = f.at[static_cast<std::size_t>(sized.worst.check(CheckId::transistor_thermal).corner)];
    add(qs, "gate_voltage_min_v", min2(a.vgs_eff_v, b.vgs_eff_v), Unit::volt,
        "gate voltage, lowest (threshold shift included)");
    add(qs, "rds_on_ohm", max2(a.rds25_ohm, b.rds25_ohm), Unit::ohm, "Rds(on) max at 25 °C, at the gate voltage used");
    if (!hot.thermal.runaway) add(qs, "rds_on_hot_ohm", hot.thermal.rds_ohm, Unit::ohm, "Rds(on) at the hot junction");
    add(qs, "pin_output_resistance_ohm", f.pin_r_out_ohm, Unit::ohm, "pin output resistance");
    add(qs, "gate_resistor_min_ohm", f.gate_resistor_min_ohm, Unit::ohm, "gate resistor, smallest the pin can carry");
    if (sized.r_drive_ohm) add(qs, "gate_resistor_ohm", *sized.r_drive_ohm, Unit::ohm, "gate resistor");
    add(qs, "pulldown_ohm", f.pulldown_ohm, Unit::ohm, "gate pull-down");
    add(qs, "pin_current_max_a", max2(max2(a.pin_peak_a, a.pin_dc_a), max2(b.pin_peak_a, b.pin_dc_a)), Unit::ampere,
        "pin current, highest (gate charging)");
    add(qs, "pin_current_dc_a", max2(a.pin_dc_a, b.pin_dc_a), Unit::ampere, "pin current, steady (pull-down)");
    if (f.gate_time_s)
        add(qs, "gate_time_s", *f.gate_time_s, Unit::second, "gate switching time (Qg through the gate resistor)");
}

void array_quantities(Q& qs, const ArrayFigures& f) {
    add(qs, "pin_current_max_a", max2(f.at[0].pin_current_max_a, f.at[1].pin_current_max_a), Unit::ampere,
        "pin current, highest");
    add(qs, "input_voltage_on_v", max2(f.at[0].vin_on.value, f.at[1].vin_on.value), Unit::volt,
        "input voltage that guarantees the output on");
    add(qs, "vce_sat_v", max2(f.at[0].vce_sat.value, f.at[1].vce_sat.value), Unit::volt,
        "Vce(sat) max at the highest coil current");
}

void clamp_quantities(Q& qs, const Spec& spec, const Evaluation& e) {
    const ClampCorner& a = e.clamp.at[0];
    const ClampCorner& b = e.clamp.at[1];
    if (a.v.limited) {
        add(qs, "peak_collector_voltage_v", e.peak_collector_voltage_v(), Unit::volt,
            "peak " + std::string(e.driver.terminal) + " voltage at turn-off");
        add(qs, "clamp_voltage_peak_v", max2(a.v.peak_v, b.v.peak_v), Unit::volt, "clamp voltage, highest");
        add(qs, "clamp_voltage_timing_v", min2(a.v.timing_v, b.v.timing_v), Unit::volt,
            "clamp voltage, lowest (for timing)");
    }
    if (a.has_timing) {
        add(qs, "release_time_s", e.release_time_s(), Unit::second,
            "coil current falls to the release current in (longest)");
        add(qs, "current_zero_time_s", max2(a.current_zero_time_s, b.current_zero_time_s), Unit::second,
            "time until the coil current is zero");
    }
    if (spec.coil.inductance_h)
        add(qs, "stored_energy_j", e.clamp.stored_energy_j, Unit::joule, "stored energy 1/2 L I^2");
    if (a.has_timing) {
        add(qs, "clamp_energy_j", max2(a.energy_j, b.energy_j), Unit::joule, "clamp energy per turn-off");
        add(qs, "clamp_charge_coulomb", max2(a.charge_c, b.charge_c), Unit::coulomb, "charge through the clamp");
    }
    for (const ClampCorner* k : {&a, &b}) {
        if (!k->has_pulse || (k == &b && a.has_pulse && a.pulse_peak_w >= b.pulse_peak_w)) continue;
        add(qs, "clamp_pulse_peak_w", k->pulse_peak_w, Unit::watt, "clamp part's peak power per turn-off");
        add(qs, "clamp_pulse_width_s", k->pulse_width_s, Unit::second, "its equivalent pulse width");
        if (k->pulse_rating_w > 0)
            add(qs, "clamp_pulse_rating_w", k->pulse_rating_w, Unit::watt, "its surge rating at that width");
        break;
    }
    if (a.avalanche_j > 0)
        add(qs, "avalanche_energy_j", std::max(a.avalanche_j, b.avalanche_j), Unit::joule,
            "avalanche energy per turn-off");
    if (a.has_rate) {
        add(qs, "clamp_power_w", max2(a.clamp_power_w, b.clamp_power_w), Unit::watt, "clamp average power");
        add(qs, "diode_average_current_a", max2(a.diode_average_current_a, b.diode_average_current_a), Unit::ampere,
            "diode average current");
        if (spec.clamp.type == ClampType::diode_zener) {
            add(qs, "zener_power_w", max2(a.zener_power_w, b.zener_power_w), Unit::watt, "zener average power");
        }
        if (spec.clamp.type == ClampType::diode_resistor) {
            add(qs, "clamp_resistor_power_w", max2(a.resistor_power_w, b.resistor_power_w), Unit::watt,
                "clamp resistor average power");
        }
    }
}

void timing_quantities(Q& qs, const Evaluation& e) {
    const TimingCorner& a = e.timing.at[0];
    const TimingCorner& b = e.timing.at[1];
    if (a.has_operate && a.operates && b.operates) {
        add(qs, "operate_time_s", max2(a.operate_time_s, b.operate_time_s), Unit::second,
            "operate time of the coil current, longest (armature travel not included)");
    }
}

}  // namespace

void add(std::vector<QuantityEntry>& out, std::string key, double value, Unit unit, std::string label) {
    if (!std::isfinite(value)) return;  // never NaN or infinity in a report
    out.push_back({std::move(key), value, unit, std::move(label)});
}

std::vector<QuantityEntry> quantities(const Spec& spec, const Sized& sized) {
    const Evaluation& e = sized.worst;
    Q qs;
    coil_quantities(qs, spec, e);
    if (const auto* b = std::get_if<BipolarFigures>(&e.drive)) bipolar_quantities(qs, spec, sized, *b);
    if (const auto* m = std::get_if<MosfetFigures>(&e.drive)) mosfet_quantities(qs, sized, *m);
    if (const auto* a = std::get_if<ArrayFigures>(&e.drive)) array_quantities(qs, *a);
    const std::size_t th = static_cast<std::size_t>(e.check(CheckId::transistor_thermal).corner);
    add(qs, "transistor_power_w", e.driver.at[th].power_w, Unit::watt, "transistor power, highest");
    add(qs, "junction_temp_max_c", e.driver.at[th].junction_c, Unit::celsius, "junction temperature, highest");
    clamp_quantities(qs, spec, e);
    timing_quantities(qs, e);
    contact_quantities(qs, spec);
    return qs;
}

}  // namespace coilfit::report
