// The nmos driver's numbers (src/method.md "N-MOSFET driver (nmos)"); words in mosfet_words.cpp.
#include "coilfit/drivers/mosfet.hpp"

#include <algorithm>
#include <cmath>

#include "coilfit/eseries.hpp"

namespace coilfit {
namespace {

constexpr double data_temp_c = 25.0;  // Rds(on) and Vgs(th) are 25 °C data

// The Rds(on) guaranteed at a gate voltage: the point with the highest vgs at or below it.
int rds_point_at(const Mosfet& part, double vgs_v) {
    int best = -1;
    for (std::size_t i = 0; i < part.rds_on.size(); ++i) {
        if (part.rds_on[i].vgs_v <= vgs_v * (1.0 + 1e-12)) best = static_cast<int>(i);
    }
    return best;
}

double lowest_rated_vgs(const Mosfet& part) {
    double lo = INFINITY;
    for (const RdsOnPoint& p : part.rds_on) lo = std::min(lo, p.vgs_v);
    return lo;
}

}  // namespace

double avalanche_energy_j(double l_h, double i0_a, double v_br_v, double vs_hi_v) {
    // E = 1/2 L I0^2 V_BR / (V_BR - Vs_hi) (the common unclamped-inductive-switching formula).
    if (!(v_br_v > vs_hi_v)) return INFINITY;
    return 0.5 * l_h * i0_a * i0_a * v_br_v / (v_br_v - vs_hi_v);
}

HotRds hot_rds(double i_a, double rds25_ohm, double tempco_per_k, double ambient_c, double rth_k_per_w) {
    HotRds h;
    const double i2r = i_a * i_a * rds25_ohm;
    const double denom = 1.0 - i2r * tempco_per_k * rth_k_per_w;
    if (!(denom > 0)) {
        h.runaway = true;
        return h;
    }
    h.power_w = i2r * (1.0 + tempco_per_k * (ambient_c - data_temp_c)) / denom;
    h.junction_c = ambient_c + h.power_w * rth_k_per_w;
    h.rds_ohm = rds25_ohm * (1.0 + tempco_per_k * (h.junction_c - data_temp_c));
    return h;
}

MosfetDriver prepare_mosfet(const Spec& spec, const Mosfet& part, double pin_r_out_ohm) {
    MosfetDriver d;
    d.part = &part;
    d.derated_id_a = spec.policy.current_derating * part.id_max_a;
    d.derated_vds_v = spec.policy.voltage_derating * part.vds_max_v;
    d.tj_limit_c = part.tj_max_c - spec.policy.junction_margin_k;
    d.rth_k_per_w = rth_ja(part);
    d.tempco_per_k = part.rds_on_tempco_per_k.value_or(defaults::rds_on_tempco_per_k);
    d.vth_tempco_v_per_k = std::abs(part.vgs_th_tempco_v_per_k.value_or(defaults::vgs_th_tempco_v_per_k));
    d.pulldown_ohm = spec.pulldown_ohm.value_or(defaults::nmos_pulldown_ohm);
    d.pin_r_out_ohm = pin_r_out_ohm;
    return d;
}

void mosfet_corner(const MosfetDriver& d, const Spec& spec, const Conditions& c, const DriveInput& in, double rg_ohm,
                   bool all, MosfetCorner& f, DriverCorner& common, CheckSet& checks) {
    (void)all;
    const Mosfet& m = *d.part;
    const double rgs_lo = d.pulldown_ohm * c.rb_lo_factor;
    const double rg_hi = rg_ohm * c.rb_hi_factor;
    // Vgs_lo = VDD_lo Rgs_lo / (Rgs_lo + Rg_hi + R_out); the threshold rises k_th per kelvin below 25 °C.
    f.vgs_lo_v = c.vdd_lo_v * rgs_lo / (rgs_lo + rg_hi + d.pin_r_out_ohm);
    f.vgs_eff_v = f.vgs_lo_v - d.vth_tempco_v_per_k * std::max(0.0, data_temp_c - in.ambient_c);
    f.rds_point = rds_point_at(m, f.vgs_eff_v);
    const double vgs_floor = lowest_rated_vgs(m);
    CheckValue drive = at_least(f.vgs_eff_v, vgs_floor);
    if (f.rds_point < 0) drive.detail = static_cast<std::uint8_t>(GateCase::no_rds_point);
    checks.set(CheckId::gate_drive, drive);
    // The figures go on with the lowest stated point when none is met (gate.drive fails then).
    const RdsOnPoint& pt = m.rds_on[static_cast<std::size_t>(std::max(f.rds_point, 0))];
    const double typ = pt.typ_ohm.value_or(pt.max_ohm);
    f.rds25_ohm = pt.max_ohm - c.rds_position * (pt.max_ohm - std::min(typ, pt.max_ohm));
    f.rds_beyond = in.current_a > pt.id_a * (1.0 + 1e-9);
    checks.set(CheckId::gate_voltage, at_most(c.vdd_hi_v, m.vgs_max_v));

    // Pin: the gate-charge peak VDD_hi / (Rg (1 - tb)) (R_out = 0), or the pull-down's DC
    // current VDD_hi / (Rg_lo + Rgs_lo), whichever is larger.
    if (rg_ohm > 0) {
        f.pin_peak_a = c.vdd_hi_v / (rg_ohm * c.rb_lo_factor);
        f.pin_dc_a = c.vdd_hi_v / (rg_ohm * c.rb_lo_factor + rgs_lo);
        CheckValue pin = at_most(std::max(f.pin_peak_a, f.pin_dc_a), spec.pin.max_current_a);
        pin.detail =
            static_cast<std::uint8_t>(f.pin_peak_a >= f.pin_dc_a ? GateCase::charge_peak : GateCase::pulldown_dc);
        checks.set(CheckId::pin_current, pin);
    } else {
        CheckValue pin = failed_without_value(spec.pin.max_current_a);
        pin.detail = static_cast<std::uint8_t>(GateCase::no_resistor);
        checks.set(CheckId::pin_current, pin);
    }
    checks.set(CheckId::transistor_current, at_most(in.current_a, d.derated_id_a));

    // Thermal: Rds(on) at the junction its own dissipation gives, in closed form. Without a
    // clamp and with an avalanche rating, each turn-off's avalanche energy adds f E on average.
    double p_avalanche_w = 0;
    if (spec.clamp.type == ClampType::none && m.ear_j && spec.coil.inductance_h && spec.switching.frequency_hz) {
        const double e_j = avalanche_energy_j(*spec.coil.inductance_h, in.thermal_current_a, m.vds_max_v, c.vs_hi_v);
        p_avalanche_w = std::isfinite(e_j) ? *spec.switching.frequency_hz * e_j : 0.0;
    }
    f.thermal = hot_rds(in.thermal_current_a, f.rds25_ohm, d.tempco_per_k,
                        in.thermal_ambient_c + p_avalanche_w * d.rth_k_per_w, d.rth_k_per_w);
    if (f.thermal.runaway) {
        checks.set(CheckId::transistor_thermal, failed_without_value(d.tj_limit_c));
    } else {
        f.thermal.power_w += p_avalanche_w;
        CheckValue thermal = at_most(f.thermal.junction_c, d.tj_limit_c);
        // Data limits: a current above the Rds(on) point's test current is its unsafe side.
        if (f.rds_point >= 0 &&
            in.thermal_current_a > m.rds_on[static_cast<std::size_t>(f.rds_point)].id_a * (1.0 + 1e-9)) {
            mark_beyond_data(thermal);
        }
        checks.set(CheckId::transistor_thermal, thermal);
    }

    // Operate: the hot coil at the lowest supply, Rds(on) at the junction that current gives.
    const double r_coil = in.r_coil_hot_ohm;
    const double i_op = c.vs_lo_v / r_coil;
    const HotRds op = hot_rds(i_op, f.rds25_ohm, d.tempco_per_k, in.ambient_c, d.rth_k_per_w);
    f.rds_operate_ohm = op.runaway ? f.rds25_ohm * (1.0 + d.tempco_per_k * (m.tj_max_c - data_temp_c)) : op.rds_ohm;
    f.junction_operate_c = op.runaway ? m.tj_max_c : op.junction_c;
    // V_coil = Vs_lo R_hot / (R_hot + R_ds,hot)
    common.coil_voltage_min_v = c.vs_lo_v * r_coil / (r_coil + f.rds_operate_ohm);
    common.on_drop_v = c.vs_lo_v - common.coil_voltage_min_v;
    common.drop_beyond_data = f.rds_point >= 0 && i_op > pt.id_a * (1.0 + 1e-9);
    common.pin_current_max_a = std::max(f.pin_peak_a, f.pin_dc_a);
    common.power_w = f.thermal.power_w;
    common.junction_c = f.thermal.junction_c;
}

void mosfet_design(const MosfetDriver& d, const Spec& spec, const Conditions& c, double rg_ohm, MosfetFigures& f) {
    const Mosfet& m = *d.part;
    f.pin_r_out_ohm = d.pin_r_out_ohm;
    f.pulldown_ohm = d.pulldown_ohm;
    f.gate_resistor_min_ohm = c.vdd_hi_v / (spec.pin.max_current_a * c.rb_lo_factor);
    f.vplateau_v = m.vplateau_v.value_or(m.vgs_th_max_v + defaults::vplateau_above_threshold_v);
    // Gate switching time, a figure: t_g = Qg (Rg + R_out) / (VDD_lo - Vplateau).
    if (c.vdd_lo_v > f.vplateau_v && rg_ohm > 0) {
        f.gate_time_s = m.qg_c * (rg_ohm + d.pin_r_out_ohm) / (c.vdd_lo_v - f.vplateau_v);
    }
}

std::optional<double> choose_gate_resistor(const Spec& spec, const Conditions& c) {
    if (spec.gate_resistor.value_ohm) return spec.gate_resistor.value_ohm;
    // The smallest series value with VDD_hi / (Rg (1 - tb)) <= the pin's limit.
    return eseries_ceil(c.vdd_hi_v / (spec.pin.max_current_a * c.rb_lo_factor), spec.gate_resistor.series);
}

}  // namespace coilfit
