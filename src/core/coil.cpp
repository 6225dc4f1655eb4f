// The coil stage (src/method.md "Coil"): copper law IEC 60028, the must-operate voltage as an
// ampere-turn threshold, the winding's self-heating as a fixed point.
#include "coilfit/coil.hpp"

#include <cmath>

#include "coilfit/copper.hpp"
#include "coilfit/sizing.hpp"

namespace coilfit {
namespace {

std::string q(double value, Unit unit) { return format_quantity(value, unit); }

}  // namespace

double coil_rise_k(double v_coil_v, double r_ref_lo_ohm, double t_ref_c, double ambient_c, double rth_k_per_w) {
    // T = Ta + u with u (1 + alpha (Ta - T_ref) + alpha u) = rth V^2 / R_ref: the fixed point of
    // the rise with the copper law. alpha u^2 + b u - K = 0, the positive root, written
    // u = 2K / (b + sqrt(b^2 + 4 alpha K)) so that it stays exact for small alpha K.
    const double k = rth_k_per_w * v_coil_v * v_coil_v / r_ref_lo_ohm;
    const double b = copper_factor(t_ref_c, ambient_c);
    if (!(k > 0)) return 0.0;
    const double disc = b * b + 4.0 * copper_alpha_per_k * k;
    const double denom = b + std::sqrt(disc);
    return denom > 0 ? 2.0 * k / denom : INFINITY;
}

double operate_voltage_v(const CoilSpec& coil, double t_coil_c) {
    // V_op(T) = k_op V_rated (1 + alpha (T - T_ref)) / (1 + alpha (T_mo - T_ref)): the ampere-turn
    // threshold of the winding, stated at T_mo (src/method.md "Coil"); tR is not applied again.
    const double t_mo = coil.must_operate_temp_c.value_or(coil.reference_temp_c);
    return coil.must_operate * coil.rated_voltage_v * copper_factor(coil.reference_temp_c, t_coil_c) /
           copper_factor(coil.reference_temp_c, t_mo);
}

CoilCorner coil_corner(const CoilSpec& coil, const Conditions& c, double ambient_c) {
    CoilCorner k;
    coil_corner(coil, c, ambient_c, k);
    return k;
}

void coil_corner(const CoilSpec& coil, const Conditions& c, double ambient_c, CoilCorner& k) {
    k.ambient_c = ambient_c;
    // The coil just switched on is at the ambient; at its low tolerance it draws the most current.
    k.r_cold_ohm = c.r_coil_lo_ohm * copper_factor(coil.reference_temp_c, ambient_c);
    k.current_max_a = c.vs_hi_v / k.r_cold_ohm;
    if (coil.thermal_resistance_k_per_w) {
        // A hot restart: the coil has been running at the highest supply, low tolerance.
        k.rise_k =
            coil_rise_k(c.vs_hi_v, c.r_coil_lo_ohm, coil.reference_temp_c, ambient_c, *coil.thermal_resistance_k_per_w);
    } else {
        k.rise_k = coil.self_heating_k.value_or(defaults::self_heating_k);
    }
    k.temp_hot_c = ambient_c + k.rise_k;
    k.runaway = !(k.temp_hot_c <= coil_runaway_c);
    k.r_hot_ohm = c.r_coil_hi_ohm * copper_factor(coil.reference_temp_c, k.temp_hot_c);
    k.r_hot_low_ohm = c.r_coil_lo_ohm * copper_factor(coil.reference_temp_c, k.temp_hot_c);
    k.operate_voltage_v = operate_voltage_v(coil, k.temp_hot_c);
}

void coil_figures(const Spec& spec, const Conditions& c, bool both, CoilFigures& f) {
    coil_corner(spec.coil, c, c.ta_lo_c, f.at[0]);
    if (both || c.ta_hi_c != c.ta_lo_c) coil_corner(spec.coil, c, c.ta_hi_c, f.at[1]);
    // Ohm's law at nominal supply and reference resistance, for orientation.
    f.current_nominal_a = spec.supply.voltage_v / spec.coil.resistance_ohm;
    f.release_current_a = spec.coil.must_release * spec.coil.rated_voltage_v / spec.coil.resistance_ohm;
}

void coil_checks(const CoilSpec& coil, const CoilCorner& k, const DriverCorner& driver, double coil_voltage_max_v,
                 CheckSet& out) {
    CheckValue op = at_least(driver.coil_voltage_min_v, k.operate_voltage_v);
    // The direction rule (src/method.md "Data limits"): a drop taken beyond the part's data.
    if (driver.drop_beyond_data) mark_beyond_data(op);
    out.set(CheckId::coil_operate, op);
    if (coil.max_voltage_v) out.set(CheckId::coil_overvoltage, at_most(coil_voltage_max_v, *coil.max_voltage_v));
    if (coil.max_temperature_c) {
        CheckValue t = at_most(k.temp_hot_c, *coil.max_temperature_c);
        if (k.runaway) t = failed_without_value(*coil.max_temperature_c);
        out.set(CheckId::coil_thermal, t);
    } else if (k.runaway) {
        out.set(CheckId::coil_thermal, failed_without_value(coil_runaway_c));
    }
}

std::string coil_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e) {
    const bool ok = c.verdict == Verdict::pass || c.verdict == Verdict::warn;
    const CoilCorner& k = e.coil.at[static_cast<std::size_t>(c.corner)];
    const DriverCorner& d = e.driver.at[static_cast<std::size_t>(c.corner)];
    switch (id) {
        case CheckId::coil_operate:
            if (ok) {
                return "the coil gets at least " + q(c.value, Unit::volt) + " at the lowest supply; hot (" +
                       q(k.temp_hot_c, Unit::celsius) + ") it needs " + q(c.limit, Unit::volt) + " to operate";
            }
            if (c.value <= 0) {
                return std::string(e.driver.drop_name) + " " + q(d.on_drop_v, Unit::volt) +
                       " takes the whole lowest supply " + q(e.conditions.vs_lo_v, Unit::volt) +
                       ", so the coil gets no voltage but needs " + q(c.limit, Unit::volt) +
                       " to operate when hot: the supply is far too low for this coil and transistor";
            }
            return "the coil gets only " + q(c.value, Unit::volt) + " at the lowest supply but needs " +
                   q(c.limit, Unit::volt) + " to operate when hot (" + q(k.temp_hot_c, Unit::celsius) +
                   "): it may not pull in; raise or tighten the supply, lower the ambient, or use a coil rated for a "
                   "lower voltage";
        case CheckId::coil_overvoltage:
            return "the coil sees up to " + q(c.value, Unit::volt) + " against its maximum " + q(c.limit, Unit::volt) +
                   (ok ? std::string() : std::string(": tighten the supply or use a coil rated for it"));
        case CheckId::coil_thermal:
            if (!c.has_value) {
                return "the winding's own heat has no stable temperature below " + q(coil_runaway_c, Unit::celsius) +
                       " at the highest supply (thermal resistance " +
                       q(spec.coil.thermal_resistance_k_per_w.value_or(0), Unit::kelvin_per_watt) +
                       "): the coil is overdriven; lower the supply or use a coil rated for it";
            }
            return "the winding reaches " + q(c.value, Unit::celsius) + " (" + q(k.ambient_c, Unit::celsius) +
                   " ambient + " + q(k.rise_k, Unit::kelvin) + " rise) against its insulation limit " +
                   q(c.limit, Unit::celsius) +
                   (ok ? std::string()
                       : std::string(": lower the supply, improve cooling, or use a coil with a higher class"));
        default:
            return {};
    }
}

std::string coil_skip_reason(CheckId id, const Spec& spec) {
    switch (id) {
        case CheckId::coil_overvoltage:
            return "not checked: give coil.max_voltage to check it";
        case CheckId::coil_thermal:
            if (!spec.coil.thermal_resistance_k_per_w) {
                return "not checked: give coil.thermal_resistance and coil.max_temperature to check the winding's "
                       "temperature";
            }
            return "not checked: give coil.max_temperature (the insulation class limit) to check it";
        default:
            return "not checked";
    }
}

}  // namespace coilfit
