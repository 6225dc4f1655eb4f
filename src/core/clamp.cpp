// The clamp stage's numbers (src/method.md "Clamp (flyback) and timing"); words in
// clamp_words.cpp.
#include "coilfit/clamp.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <span>

#include "clamp_math.hpp"
#include "coilfit/drivers/mosfet.hpp"
#include "stages.hpp"

namespace coilfit {

ClampVoltages clamp_voltages(const ClampSpec& clamp, double i0_a, const Conditions& c, double ln_i0, double ambient_c) {
    (void)ambient_c;
    return clamp_math::voltages(clamp, i0_a, c, ln_i0);
}

double pulse_rating_w(std::span<const PulsePoint> points, double width_s) {
    if (points.empty() || !(width_s > 0)) return 0.0;
    const auto scaled = [width_s](const PulsePoint& p) { return p.power_w * std::sqrt(p.width_s / width_s); };
    if (width_s <= points.front().width_s) return scaled(points.front());
    if (width_s >= points.back().width_s) return scaled(points.back());
    for (std::size_t i = 1; i < points.size(); ++i) {
        if (width_s <= points[i].width_s) {
            const PulsePoint& a = points[i - 1];
            const PulsePoint& b = points[i];
            const double t = std::log(width_s / a.width_s) / std::log(b.width_s / a.width_s);
            return a.power_w * std::pow(b.power_w / a.power_w, t);
        }
    }
    return scaled(points.back());
}

Decay rl_decay(double l_h, double r_ohm, double vc_v, double i0_a, double i_release_a) {
    return clamp_math::decay(l_h, r_ohm, vc_v, i0_a, i_release_a);
}

double clamp_energy(const Decay& decay, double vc_v, double series_ohm) {
    return clamp_math::energy(decay, vc_v, series_ohm);
}

namespace stages {
namespace {

// The checks that grow with the switching rate: the diode's average current (from the charge at
// the timing corner, `slow`) and the clamp's power (from the charge and heat at the energy
// corner, `hot`, and the clamp energy per turn-off worked out from it). diode_peak is the diode's
// peak-current check, kept when it is the tighter of the two. True when both rate checks pass.
bool set_rate_checks(ClampCorner& k, const Prepared& p, const Conditions& c, const CheckValue& diode_peak,
                     const Decay& slow, const Decay& hot, double clamp_energy_j, bool all, CheckSet& checks) {
    (void)c;
    const Spec& spec = *p.spec;
    const Policy& policy = spec.policy;
    const double f = *spec.switching.frequency_hz;
    k.has_rate = true;
    k.clamp_power_w = f * clamp_energy_j;
    k.diode_average_current_a = f * slow.charge_c;  // most charge at the lowest clamp voltage
    const Diode& d = *spec.clamp.diode;
    // The diode's average-current rating also bounds the repetitive clamp current.
    CheckValue avg = at_most(k.diode_average_current_a, d.if_avg_a);
    avg.detail = static_cast<std::uint8_t>(DiodeCurrentCase::average);
    // The tighter of the two stands; for verdicts alone, the failing one (no margins needed).
    const bool avg_stands = all ? avg.margin() < diode_peak.margin() : avg.verdict == Verdict::fail;
    checks.set(CheckId::diode_current, avg_stands ? avg : diode_peak);
    CheckValue power;
    switch (spec.clamp.type) {
        case ClampType::diode_zener:
            k.zener_power_w = f * k.v.part_peak_v * hot.charge_c;
            power = at_most(k.zener_power_w, policy.power_derating * spec.clamp.zener->pd_w);
            break;
        case ClampType::diode_resistor:
            k.resistor_power_w = f * k.v.series_ohm * hot.i2_integral;
            power = at_most(k.resistor_power_w, policy.power_derating * spec.clamp.resistor_power_w);
            break;
        case ClampType::diode:
            // A diode has no power rating of its own here: its dissipation at the rated average
            // current, if_avg * Vf(if_avg), stands for it.
            power = at_most(k.clamp_power_w, p.diode_rated_power_w);
            break;
        case ClampType::diode_tvs:
            // The diode's share, f Vf Q, against its rated dissipation; the TVS's pulses are
            // clamp.pulse's (a TVS record gives no average rating).
            power = at_most(f * (k.v.peak_v - k.v.part_peak_v) * hot.charge_c, p.diode_rated_power_w);
            break;
        case ClampType::none:
            return true;
    }
    checks.set(CheckId::clamp_power, power);
    return avg.verdict == Verdict::pass && power.verdict == Verdict::pass;
}

// clamp.pulse: the zener's (or TVS's) peak power P_pk = V I0 against d_pulse P_rated(t_p), with
// the pulse's equivalent rectangular width t_p = E/P_pk = Q/I0 (src/method.md, pulse rating).
// True unless it fails.
bool set_pulse_check(ClampCorner& k, const Spec& spec, double charge_c, CheckSet& checks) {
    const bool tvs = spec.clamp.type == ClampType::diode_tvs;
    k.has_pulse = true;
    k.pulse_peak_w = k.v.part_peak_v * k.i0_a;
    k.pulse_energy_j = k.v.part_peak_v * charge_c;
    k.pulse_width_s = charge_c / k.i0_a;
    const PulsePoint tvs_point{tvs ? spec.clamp.tvs->ppk_width_s : 0.0, tvs ? spec.clamp.tvs->ppk_w : 0.0};
    const std::span<const PulsePoint> points =
        tvs ? std::span<const PulsePoint>(&tvs_point, 1) : std::span<const PulsePoint>(spec.clamp.zener->pulse);
    CheckValue pulse;
    if (points.empty()) {
        // No pulse data: the check warns and names the peak power and width the part must stand.
        // (No limit to compare: the report leaves the limit and the margin out.)
        pulse = at_most(k.pulse_peak_w, 0.0);
        pulse.verdict = Verdict::warn;
    } else {
        k.pulse_rating_w = pulse_rating_w(points, k.pulse_width_s);
        pulse = at_most(k.pulse_peak_w, spec.policy.pulse_derating * k.pulse_rating_w);
    }
    pulse.detail = static_cast<std::uint8_t>(points.empty() ? PulseCase::unrated
                                             : tvs          ? PulseCase::tvs
                                                            : PulseCase::zener);
    checks.set(CheckId::clamp_pulse, pulse);
    return pulse.verdict != Verdict::fail;
}

// Release time, charge and energy of the decay, the rate checks (see set_rate_checks) and the
// pulse check.
void decay_figures(const Prepared& p, const Conditions& c, double r_coil_cold_ohm, double release_current_a, bool all,
                   ClampCorner& k, CheckSet& checks) {
    const Spec& spec = *p.spec;
    const double l = *spec.coil.inductance_h;
    const double i0 = k.i0_a;
    const bool release_checked = spec.coil.max_release_time_s.has_value();
    const bool rate_checked = spec.switching.frequency_hz.has_value();
    const bool pulse_checked = spec.clamp.type == ClampType::diode_zener || spec.clamp.type == ClampType::diode_tvs;
    k.has_timing = true;
    // Timing corner: cold coil (longest tau, highest I0) and the lowest clamp voltage.
    // Energy corner: the highest clamp voltage takes the largest share of the stored energy.
    const double r_loop_slow = r_coil_cold_ohm + k.v.series_timing_ohm;
    const double r_loop_hot = r_coil_cold_ohm + k.v.series_ohm;
    const double vc_energy =
        spec.clamp.type == ClampType::diode_resistor ? k.v.peak_v - i0 * k.v.series_ohm : k.v.peak_v;
    const CheckValue diode_peak = checks[CheckId::diode_current];
    k.slow_tau_s = l / r_loop_slow;
    k.slow_vc_over_r_a = k.v.timing_v > 0 ? k.v.timing_v / r_loop_slow : 0.0;
    k.end_time_is_bound = false;
    bool exact = all;
    if (!all) {
        // Verdicts only: bounds first, no logarithms. The charge Q = tau I0 - (Vc/R) t_end is at
        // most tau I0, the resistor's integral of i^2 at most I0^2 tau / 2, the time to zero
        // current t_end = tau ln(1 + I0 R/Vc) at most L I0 / Vc (ln(1 + x) <= x). The rate, pulse
        // and switching checks all grow with these, so where one passes at its bound it passes;
        // only a failing one needs the exact decay.
        Decay slow_bound;
        slow_bound.tau_s = k.slow_tau_s;
        slow_bound.charge_c = slow_bound.tau_s * i0;
        slow_bound.end_time_s = k.v.timing_v > 0 ? l * i0 / k.v.timing_v : INFINITY;
        Decay hot_bound;
        hot_bound.tau_s = l / r_loop_hot;
        hot_bound.charge_c = hot_bound.tau_s * i0;
        hot_bound.i2_integral = 0.5 * i0 * i0 * hot_bound.tau_s;
        if (rate_checked) {
            const double bound_energy = clamp_math::energy(hot_bound, vc_energy, k.v.series_ohm);
            exact = !set_rate_checks(k, p, c, diode_peak, slow_bound, hot_bound, bound_energy, all, checks) || exact;
        }
        if (pulse_checked) exact = !set_pulse_check(k, spec, hot_bound.charge_c, checks) || exact;
        k.current_zero_time_s = slow_bound.end_time_s;
        k.end_time_is_bound = true;
    }
    if (!exact && !release_checked) return;
    // A release current of I0 spares the release log where no one reads the release time;
    // without the exact rate or pulse checks the charge (and its log) is not needed either.
    const double i_release = all || release_checked ? release_current_a : i0;
    const Decay slow = clamp_math::decay(l, r_loop_slow, k.v.timing_v, i0, i_release, exact);
    k.release_time_s = slow.release_time_s;
    if (!exact) return;
    k.current_zero_time_s = slow.end_time_s;
    k.end_time_is_bound = false;
    k.charge_c = slow.charge_c;
    // Only the energy corner's charge and heat are used, never its release time.
    const Decay hot = clamp_math::decay(l, r_loop_hot, vc_energy, i0, i0);
    k.charge_peak_c = hot.charge_c;
    k.energy_j = clamp_math::energy(hot, vc_energy, k.v.series_ohm);
    if (rate_checked) set_rate_checks(k, p, c, diode_peak, slow, hot, k.energy_j, all, checks);
    if (pulse_checked) set_pulse_check(k, spec, hot.charge_c, checks);
}

}  // namespace

void prepare_clamp(const Spec& spec, Prepared& p) {
    if (!spec.clamp.diode) return;
    const Diode& d = *spec.clamp.diode;
    p.clamp_diode = &d;
    p.derated_vrrm_v = spec.policy.voltage_derating * d.vrrm_v;
    // Repetitive switching: the repetitive peak rating IFRM when given, else IF(AV); the 8.3 ms
    // non-repetitive surge rating IFSM is never a limit here (src/method.md, diode checks).
    p.diode_peak_limit_a = d.ifrm_a ? *d.ifrm_a : d.if_avg_a;
    p.diode_rated_power_w = d.if_avg_a * vf_max_at(d, d.if_avg_a).value;
}

void clamp_corner(const Prepared& p, const Conditions& c, double i0_a, double ln_i0, double ambient_c,
                  double r_coil_cold_ohm, double release_current_a, const DriverCommon& driver, bool all,
                  ClampCorner& k, CheckSet& checks) {
    const Spec& spec = *p.spec;
    k.i0_a = i0_a;
    k.has_timing = false;
    k.has_rate = false;
    k.release_time_s = 0;
    (void)ambient_c;
    k.v = clamp_math::voltages(spec.clamp, i0_a, c, ln_i0);
    k.has_pulse = false;
    if (!k.v.limited) {
        // No clamp: only breakdown limits the voltage. A MOSFET rated for repetitive avalanche
        // takes E = 1/2 L I0^2 V_BR / (V_BR - Vs_hi) per turn-off against d_P EAR (src/method.md
        // "N-MOSFET driver", no clamp); any other switch fails.
        k.avalanche_j = 0;
        if (driver.avalanche_j > 0 && spec.coil.inductance_h) {
            k.avalanche_j = avalanche_energy_j(*spec.coil.inductance_h, i0_a, driver.rated_voltage_v, c.vs_hi_v);
            CheckValue pulse = std::isfinite(k.avalanche_j)
                                   ? at_most(k.avalanche_j, spec.policy.power_derating * driver.avalanche_j)
                                   : failed_without_value(spec.policy.power_derating * driver.avalanche_j);
            pulse.detail = static_cast<std::uint8_t>(PulseCase::avalanche);
            checks.set(CheckId::clamp_pulse, pulse);
            k.peak_collector_v = driver.rated_voltage_v;
            return;  // transistor.voltage: the drain avalanches by design (skipped, with its reason)
        }
        checks.set(CheckId::transistor_voltage, failed_without_value(driver.peak_limit_v));
        return;
    }
    // Peak collector voltage: the highest supply plus the highest clamp voltage, or the rail's
    // highest transient when that is higher.
    k.peak_collector_v = std::max(c.vs_transient_v, c.vs_hi_v + k.v.peak_v);
    checks.set(CheckId::transistor_voltage, at_most(k.peak_collector_v, driver.peak_limit_v));
    // The diode blocks the supply while the transistor conducts: VRRM >= Vs_hi / d_V.
    checks.set(CheckId::diode_voltage, at_most(c.vs_hi_v, p.derated_vrrm_v));
    // Peak forward current: the whole coil current at turn-off, against the repetitive peak
    // rating (or the surge rating, or the average rating when neither is given).
    CheckValue peak = at_most(i0_a, p.diode_peak_limit_a);
    peak.detail = static_cast<std::uint8_t>(DiodeCurrentCase::peak);
    checks.set(CheckId::diode_current, peak);
    const bool release_checked = spec.coil.max_release_time_s.has_value();
    const bool rate_checked = spec.switching.frequency_hz.has_value();
    if (spec.coil.inductance_h && (all || release_checked || rate_checked)) {
        decay_figures(p, c, r_coil_cold_ohm, release_current_a, all, k, checks);
    }
}

}  // namespace stages
}  // namespace coilfit
