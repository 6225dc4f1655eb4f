// The timing stage (src/method.md "Clamp (flyback) and timing", "Switching timing").
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
    const bool switching = spec.switching.frequency_hz.has_value();
    if (!spec.coil.inductance_h || !(all || switching)) return;
    const double l = *spec.coil.inductance_h;
    const double period_s = switching ? 1.0 / *spec.switching.frequency_hz : 0.0;
    const double on_s = spec.switching.duty * period_s;
    const double off_s = period_s - on_s;
    // The hot coil at the lowest supply: the slowest rise to the operate current. For verdicts
    // alone its bound tau V_op/(V - V_op) (ln(1/(1 - x)) <= x/(1 - x)) spares the log where it fits.
    out.has_operate = true;
    const double v = driver.coil_voltage_min_v;
    const double v_op = coil.operate_voltage_v;
    const double op_bound = v > v_op ? l / coil.r_hot_ohm * v_op / (v - v_op) : INFINITY;
    out.operate_time_s = !all && op_bound <= on_s ? op_bound : operate_time_s(l, coil.r_hot_ohm, v, v_op);
    out.operates = std::isfinite(out.operate_time_s);
    if (!switching) return;
    // switching.timing (src/method.md "Switching timing"): the coil current reaches zero before
    // the next turn-on, t_end <= (1 - D)/f, and the on-time exceeds the operate time, t_op <= D/f.
    CheckValue on = out.operates ? at_most(out.operate_time_s, on_s) : failed_without_value(on_s);
    on.detail = static_cast<std::uint8_t>(out.operates ? SwitchingCase::on_time : SwitchingCase::never_operates);
    if (!clamp.has_timing) {
        checks.set(CheckId::switching_timing, on);
        return;
    }
    double t_end = clamp.current_zero_time_s;
    if (clamp.end_time_is_bound && t_end > off_s) {
        // The bound does not fit: the exact time to zero, tau ln(1 + I0 R / Vc).
        t_end =
            clamp.slow_vc_over_r_a > 0 ? clamp.slow_tau_s * std::log1p(clamp.i0_a / clamp.slow_vc_over_r_a) : INFINITY;
    }
    CheckValue off = at_most(t_end, off_s);
    off.detail = static_cast<std::uint8_t>(SwitchingCase::off_time);
    // The worse of the two stands (for verdicts alone, the failing one).
    const bool off_stands = all ? off.margin() < on.margin() : off.verdict == Verdict::fail;
    checks.set(CheckId::switching_timing, off_stands ? off : on);
}

}  // namespace stages

std::string timing_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e) {
    const bool ok = c.verdict == Verdict::pass || c.verdict == Verdict::warn;
    (void)e;
    switch (id) {
        case CheckId::release_time:
            return "the coil current falls to the release current in " + q(c.value, Unit::second) +
                   " (cold coil, lowest clamp voltage) against " + q(c.limit, Unit::second) +
                   "; the contacts open after the armature moves as well" +
                   (ok ? std::string() : ": a diode + zener clamp releases faster; see the clamp options");
        case CheckId::switching_timing: {
            const auto how = static_cast<SwitchingCase>(c.detail);
            const std::string at = " at " + q(spec.switching.frequency_hz.value_or(0), Unit::hertz) + ", " +
                                   q(spec.switching.duty, Unit::ratio) + " on";
            if (how == SwitchingCase::never_operates) {
                return "the coil current never reaches the operate current at the lowest supply, so no on-time is long "
                       "enough";
            }
            if (how == SwitchingCase::off_time) {
                return "the coil current takes " + q(c.value, Unit::second) +
                       " to reach zero after turn-off against the off-time " + q(c.limit, Unit::second) + at +
                       (ok ? std::string()
                           : ": switch less often, lower the duty, or use a faster clamp (diode + zener)");
            }
            return "the coil current takes " + q(c.value, Unit::second) +
                   " to reach the operate current against the on-time " + q(c.limit, Unit::second) + at +
                   " (the armature's travel comes on top)" +
                   (ok ? std::string() : ": switch less often or raise the duty");
        }
        default:
            return {};
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
            if (!spec.switching.frequency_hz)
                return "not checked: give switching.frequency to check the on and off times";
            return "not checked: give coil.inductance to estimate the coil current's rise and fall";
        default:
            return "not checked";
    }
}

}  // namespace coilfit
