// The clamp arithmetic of clamp.hpp, defined inline so that the sizing core's hot path
// (evaluate(), millions of times in yield) compiles it in place. Internal to the core:
// clamp.cpp's public functions are these same functions, so every caller gets the same numbers.
#pragma once

#include <cmath>

#include <algorithm>

#include "coilfit/clamp.hpp"
#include "coilfit/corners.hpp"
#include "curves.hpp"

namespace coilfit::clamp_math {

// A zener's voltage at the coil current (src/method.md "Clamp (flyback) and timing"): for the
// peak its top tolerance plus Zzt (I0 - Izt) above its test current; for timing its bottom
// tolerance, below its test current lowered for the knee by Zzt (Izt - I0), or to 90 % without
// Zzt. With vz_tempco the drift from its 25 °C data is taken where it is worst over the
// ambient range: at Ta_hi for the peak (the method's rule; at Ta_lo for a negative
// coefficient), and, a refinement on the safe side, where it lowers the voltage for timing.
inline double zener_drift_v(const Zener& z, const Conditions& c, bool highest) {
    if (!z.vz_tempco_v_per_k) return 0.0;
    const double a = *z.vz_tempco_v_per_k * (c.ta_lo_c - 25.0);
    const double b = *z.vz_tempco_v_per_k * (c.ta_hi_c - 25.0);
    return highest ? std::max({a, b, 0.0}) : std::min({a, b, 0.0});
}

inline double zener_peak_v(const Zener& z, const Conditions& c, double i0_a) {
    double v = c.vz_hi_v;
    if (z.zzt_ohm && z.izt_a && i0_a > *z.izt_a) v += *z.zzt_ohm * (i0_a - *z.izt_a);
    return v + zener_drift_v(z, c, true);
}

inline double zener_timing_v(const Zener& z, const Conditions& c, double i0_a) {
    double v = c.vz_lo_v;
    if (z.izt_a && i0_a < *z.izt_a) {
        v = z.zzt_ohm ? c.vz_lo_v - *z.zzt_ohm * (*z.izt_a - i0_a) : defaults::zener_knee_factor * c.vz_lo_v;
    }
    return std::max(v + zener_drift_v(z, c, false), 0.0);
}

inline ClampVoltages voltages(const ClampSpec& clamp, double i0_a, const Conditions& c, double ln_i0) {
    ClampVoltages out;
    if (clamp.type == ClampType::none || !clamp.diode) {
        out.limited = false;
        return out;
    }
    const Lookup vf = curves::vf_max_at(*clamp.diode, i0_a, ln_i0);
    out.vf_outside = vf.outside;
    const double vf_lo = vf_low(*clamp.diode);
    switch (clamp.type) {
        case ClampType::diode:
            out.peak_v = vf.value;
            out.timing_v = vf_lo;
            break;
        case ClampType::diode_zener:
            out.part_peak_v = zener_peak_v(*clamp.zener, c, i0_a);
            out.peak_v = out.part_peak_v + vf.value;
            out.timing_v = zener_timing_v(*clamp.zener, c, i0_a) + vf_lo;
            break;
        case ClampType::diode_resistor: {
            const double rs = clamp.resistor_ohm.value_or(0.0);
            out.series_ohm = rs * c.rs_hi_factor;
            out.series_timing_ohm = rs * c.rs_lo_factor;
            out.peak_v = i0_a * out.series_ohm + vf.value;
            out.timing_v = vf_lo;
            break;
        }
        case ClampType::diode_tvs: {
            const Tvs& t = *clamp.tvs;
            // Vc(I0) linear in current from Vbr max at 1 mA to the clamping voltage at Ipp, the same
            // line beyond Ipp (src/method.md "TVS clamp"); timing with the lowest breakdown.
            constexpr double i_br_a = 1e-3;
            const double slope = t.ipp_a > i_br_a ? (t.vc_v - t.vbr_max_v) / (t.ipp_a - i_br_a) : 0.0;
            out.part_peak_v = t.vbr_max_v + slope * std::max(0.0, i0_a - i_br_a);
            out.peak_v = out.part_peak_v + vf.value;
            out.timing_v = t.vbr_min_v + vf_lo;
            break;
        }
        case ClampType::none:
            break;
    }
    return out;
}

// With charge false only tau and the release time are worked out (one logarithm fewer).
inline Decay decay(double l_h, double r_ohm, double vc_v, double i0_a, double i_release_a, bool charge = true) {
    Decay d;
    if (!(l_h > 0) || !(r_ohm > 0) || !(i0_a > 0)) return d;
    d.tau_s = l_h / r_ohm;
    const double a = vc_v > 0 ? vc_v / r_ohm : 0.0;  // Vc/R
    const double big_a = i0_a + a;                   // I0 + Vc/R
    if (i0_a > i_release_a && i_release_a + a > 0) {
        d.release_time_s = d.tau_s * std::log(big_a / (i_release_a + a));
    }
    if (!charge) return d;
    if (a > 0) {
        d.end_time_s = d.tau_s * std::log1p(i0_a / a);
        d.charge_c = d.tau_s * i0_a - a * d.end_time_s;
    } else {
        // No clamp voltage: the current only decays exponentially; integrate to infinity.
        d.end_time_s = 0;
        d.charge_c = d.tau_s * i0_a;
    }
    // integral of (A e^{-t/tau} - a)^2 over [0, T]
    const double t = d.end_time_s;
    if (a > 0) {
        // exp(-t/tau) at t = tau ln(1 + I0/a) is exactly a / (I0 + a): no exp needed.
        const double e1 = a / big_a;
        d.i2_integral =
            big_a * big_a * d.tau_s / 2.0 * (1.0 - e1 * e1) - 2.0 * big_a * a * d.tau_s * (1.0 - e1) + a * a * t;
    } else {
        d.i2_integral = i0_a * i0_a * d.tau_s / 2.0;
    }
    return d;
}

inline double energy(const Decay& decay, double vc_v, double series_ohm) {
    return vc_v * decay.charge_c + series_ohm * decay.i2_integral;
}

}  // namespace coilfit::clamp_math
