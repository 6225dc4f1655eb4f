// The timing stage (docs/method.md "Clamp (flyback) and timing", "Switching timing").
#include "coilfit/timing.hpp"

#include <cmath>

#include "coilfit/sizing.hpp"
#include "stages.hpp"

namespace coilfit {
namespace {

std::string q(double value, Unit unit) { return format_quantity(value, unit); }

}  // namespace

double operate_time_s(double l_h, double r_hot_ohm, double coil_voltage_min_v, double operate_voltage_v) {
    // i(t) = I_final (1 - e^(-t/tau_on)) reaches I_op at t_op = tau_on ln(I_final / (I_final - I_op));
    // with I = V / R_hot the ratio is V_min / (V_min - V_op) (closed form, first-order RL).
    if (!(coil_voltage_min_v > operate_voltage_v) || !(r_hot_ohm > 0)) return INFINITY;
    return l_h / r_hot_ohm * std::log(coil_voltage_min_v / (coil_voltage_min_v - operate_voltage_v));
}

namespace stages {

void timing_corner(const Spec& spec, const CoilCorner& coil, const DriverCorner& driver, const ClampCorner& clamp,
                   bool all, TimingCorner& out, CheckSet& checks) {
    out = TimingCorner{};
    if (clamp.has_timing && spec.coil.max_release_time_s) {
        checks.set(CheckId::release_time, at_most(clamp.release_time_s, *spec.coil.max_release_time_s));
    }
    if (all && spec.coil.inductance_h) {
        // The hot coil at the lowest supply: the slowest rise to the operate current.
        out.has_operate = true;
        out.operate_time_s =
            operate_time_s(*spec.coil.inductance_h, coil.r_hot_ohm, driver.coil_voltage_min_v, coil.operate_voltage_v);
        out.operates = std::isfinite(out.operate_time_s);
    }
}

}  // namespace stages

std::string timing_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e) {
    const bool ok = c.verdict == Verdict::pass || c.verdict == Verdict::warn;
    (void)spec;
    (void)e;
    switch (id) {
    case CheckId::release_time:
        return "the coil current falls to the release current within " + q(c.value, Unit::second) +
               " (cold coil, lowest clamp voltage) against " + q(c.limit, Unit::second) +
               (ok ? std::string() : ": a diode + zener clamp releases faster; see the clamp options");
    default: return {};
    }
}

std::string timing_skip_reason(CheckId id, const Spec& spec) {
    switch (id) {
    case CheckId::release_time:
        if (!spec.coil.max_release_time_s) return "not checked: give coil.max_release_time to check it";
        if (spec.clamp.type == ClampType::none) {
            return "not checked: without a clamp the turn-off is set by the transistor's breakdown; fit a clamp";
        }
        return "not checked: give coil.inductance to estimate the release time";
    case CheckId::switching_timing:
        if (!spec.switching.frequency_hz) return "not checked: give switching.frequency to check the on and off times";
        return "not checked: give coil.inductance to estimate the coil current's rise and fall";
    default: return "not checked";
    }
}

}  // namespace coilfit
