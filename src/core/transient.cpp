// The turn-off transient as sampled points (coilfit/transient.hpp): the closed-form decay of a
// constant-voltage clamp, the same one the clamp stage works out its release time and charge
// from (src/core/clamp_math.hpp, src/method.md "Clamp (flyback) and timing").
#include "coilfit/transient.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

namespace coilfit {
namespace {

double loop_timing_ohm(const TurnOff& t) { return t.r_coil_ohm + t.r_series_timing_ohm; }
double loop_peak_ohm(const TurnOff& t) { return t.r_coil_peak_ohm + t.r_series_peak_ohm; }

// Collector voltage at the peak corner while the clamp conducts: Vs_hi + Vc + Rs i(t).
double collector_v(const TurnOff& t, double time_s) {
    const double i = decay_current_a(t.l_h, loop_peak_ohm(t), t.vc_peak_v, t.i0_peak_a, time_s);
    return t.vs_hi_v + t.vc_peak_v + t.r_series_peak_ohm * i;
}

// The evenly spaced times plus the given instants inside the window, sorted, without repeats.
std::vector<double> sample_times(double from_s, double to_s, std::size_t samples, std::initializer_list<double> extra) {
    std::vector<double> ts;
    const std::size_t n = std::max<std::size_t>(samples, 2);
    ts.reserve(n + extra.size());
    for (std::size_t k = 0; k < n; ++k) {
        ts.push_back(from_s + (to_s - from_s) * static_cast<double>(k) / static_cast<double>(n - 1));
    }
    for (const double e : extra) {
        if (std::isfinite(e) && e > from_s && e < to_s) ts.push_back(e);
    }
    std::sort(ts.begin(), ts.end());
    ts.erase(std::unique(ts.begin(), ts.end()), ts.end());
    return ts;
}

}  // namespace

double decay_current_a(double l_h, double r_ohm, double vc_v, double i0_a, double t_s) {
    if (t_s <= 0) return i0_a;
    if (!(l_h > 0) || !(r_ohm > 0)) return 0.0;
    const double tau = l_h / r_ohm;
    const double a = vc_v / r_ohm;  // Vc/R
    // i(t) = (I0 + Vc/R) exp(-t/tau) - Vc/R, first-order RL with a constant clamp voltage.
    return std::max(0.0, (i0_a + a) * std::exp(-t_s / tau) - a);
}

double decay_end_s(double l_h, double r_ohm, double vc_v, double i0_a) {
    if (!(l_h > 0) || !(r_ohm > 0) || !(i0_a > 0)) return 0.0;
    if (!(vc_v > 0)) return std::numeric_limits<double>::infinity();
    // i(t0) = 0: t0 = tau ln(1 + I0 R / Vc).
    return l_h / r_ohm * std::log1p(i0_a * r_ohm / vc_v);
}

double turn_off_duration_s(const TurnOff& t) {
    const double slow = decay_end_s(t.l_h, loop_timing_ohm(t), t.vc_timing_v, t.i0_a);
    const double fast = decay_end_s(t.l_h, loop_peak_ohm(t), t.vc_peak_v, t.i0_peak_a);
    // Without a clamp voltage the current never ends: five time constants leave under 1 %.
    const auto finite = [&t](double end, double r) { return std::isfinite(end) ? end : 5.0 * t.l_h / r; };
    return std::max(finite(slow, loop_timing_ohm(t)), finite(fast, loop_peak_ohm(t)));
}

TurnOffSeries sample_turn_off(const TurnOff& t, double t_from_s, double t_to_s, std::size_t samples) {
    TurnOffSeries s;
    const double r_slow = loop_timing_ohm(t);
    s.current_end_s = decay_end_s(t.l_h, r_slow, t.vc_timing_v, t.i0_a);
    s.voltage_end_s = decay_end_s(t.l_h, loop_peak_ohm(t), t.vc_peak_v, t.i0_peak_a);
    // Release time, the same expression as the clamp stage: tau ln((I0 + Vc/R) / (Ir + Vc/R)).
    const double a = r_slow > 0 ? t.vc_timing_v / r_slow : 0.0;
    if (t.i0_a > t.release_current_a && t.release_current_a + a > 0 && r_slow > 0) {
        s.release_time_s = t.l_h / r_slow * std::log((t.i0_a + a) / (t.release_current_a + a));
    }
    for (const double ts : sample_times(t_from_s, t_to_s, samples, {0.0, s.release_time_s, s.current_end_s})) {
        s.current.push_back({ts, decay_current_a(t.l_h, r_slow, t.vc_timing_v, t.i0_a, ts)});
    }
    for (const double ts : sample_times(t_from_s, t_to_s, samples, {0.0, s.voltage_end_s})) {
        if (ts < 0) {
            s.voltage.push_back({ts, t.v_on_v});
        } else if (ts == 0.0) {
            // The step at turn-off: from the on-state drop straight up to the clamp's voltage.
            s.voltage.push_back({0.0, t.v_on_v});
            s.voltage.push_back({0.0, collector_v(t, 0.0)});
        } else if (ts < s.voltage_end_s) {
            s.voltage.push_back({ts, collector_v(t, ts)});
        } else if (ts == s.voltage_end_s) {
            // The clamp stops conducting: the collector falls back to the supply (ringing aside).
            s.voltage.push_back({ts, t.vs_hi_v + t.vc_peak_v});
            s.voltage.push_back({ts, t.vs_hi_v});
        } else {
            s.voltage.push_back({ts, t.vs_hi_v});
        }
    }
    for (const SamplePoint& p : s.voltage) s.peak_v = std::max(s.peak_v, p.value);
    return s;
}

}  // namespace coilfit
