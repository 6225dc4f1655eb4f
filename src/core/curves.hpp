// The characteristic-curve lookups of parts.hpp, defined inline so that the sizing core's hot
// path (evaluate(), millions of times in yield) compiles them in place. Internal to the core:
// parts.cpp's public functions are these same functions, so every caller gets the same numbers.
#pragma once

#include <algorithm>
#include <cmath>
#include <cstddef>

#include "coilfit/parts.hpp"

namespace coilfit::curves {

// Linear interpolation of y on log(x) over points sorted by x; nearest point outside.
// ln_x is ln(x) or NaN (then computed only when needed); ln_p gives a point's ln(x) or NaN.
template <typename Points, typename X, typename LnX, typename Y>
inline Lookup interpolate_log(const Points& points, double x, double ln_x, X get_x, LnX get_ln, Y get_y) {
    if (points.empty() || !(x > 0)) return {points.empty() ? 0.0 : get_y(points.front()), true, Side::below};
    const double x_first = get_x(points.front());
    const double x_last = get_x(points.back());
    if (points.size() == 1) {
        // One point is used everywhere; it is flagged (outside) when the operating point is
        // more than a factor of two away, and its side is told exactly for the direction rule.
        const double ratio = x / x_first;
        const Side side = x > x_first * (1.0 + 1e-9)   ? Side::above
                          : x < x_first * (1.0 - 1e-9) ? Side::below
                                                       : Side::within;
        return {get_y(points.front()), ratio > 2.0 || ratio < 0.5, side};
    }
    if (x <= x_first) {
        const bool out = x < x_first * (1.0 - 1e-9);
        return {get_y(points.front()), out, out ? Side::below : Side::within};
    }
    if (x >= x_last) {
        const bool out = x > x_last * (1.0 + 1e-9);
        return {get_y(points.back()), out, out ? Side::above : Side::within};
    }
    const auto ln_of = [&](const auto& p) {
        const double l = get_ln(p);
        return std::isnan(l) ? std::log(get_x(p)) : l;
    };
    for (std::size_t i = 1; i < points.size(); ++i) {
        const double x1 = get_x(points[i]);
        if (x <= x1) {
            const double l0 = ln_of(points[i - 1]);
            const double l1 = ln_of(points[i]);
            const double lx = std::isnan(ln_x) ? std::log(x) : ln_x;
            const double y0 = get_y(points[i - 1]);
            const double y1 = get_y(points[i]);
            const double t = (lx - l0) / (l1 - l0);
            return {y0 + t * (y1 - y0), false, Side::within};
        }
    }
    return {get_y(points.back()), true, Side::above};
}

inline constexpr auto gain_x = [](const GainPoint& p) { return p.ic_a; };
inline constexpr auto gain_ln = [](const GainPoint& p) { return p.ln_ic; };
inline constexpr auto sat_x = [](const SaturationPoint& p) { return p.ic_a; };
inline constexpr auto sat_ln = [](const SaturationPoint& p) { return p.ln_ic; };
inline constexpr auto sat_y = [](const SaturationPoint& p) { return p.v_max; };
inline constexpr auto fwd_x = [](const ForwardPoint& p) { return p.if_a; };
inline constexpr auto fwd_ln = [](const ForwardPoint& p) { return p.ln_if; };
inline constexpr auto fwd_y = [](const ForwardPoint& p) { return p.vf_max_v; };

inline Lookup hfe_min_at(const Bipolar& part, double ic_a, double ln_ic) {
    return interpolate_log(part.hfe_min, ic_a, ln_ic, gain_x, gain_ln, [](const GainPoint& p) { return p.hfe_min; });
}

inline Lookup hfe_typ_at(const Bipolar& part, double ic_a, double ln_ic) {
    return interpolate_log(part.hfe_min, ic_a, ln_ic, gain_x, gain_ln,
                           [](const GainPoint& p) { return p.hfe_typ.value_or(p.hfe_min); });
}

inline Lookup vce_sat_at(const Bipolar& part, double ic_a, double ln_ic) {
    return interpolate_log(part.vce_sat, ic_a, ln_ic, sat_x, sat_ln, sat_y);
}

inline Lookup vbe_sat_at(const Bipolar& part, double ic_a, double ln_ic) {
    return interpolate_log(part.vbe_sat, ic_a, ln_ic, sat_x, sat_ln, sat_y);
}

// Above its highest point Vf is extrapolated on log(current) from the last two points, or from
// one point by the diode law with emission coefficient 2, + 2 * 26 mV * ln(I / I_pt) (common
// practice; src/method.md "Data limits"); below its lowest point the nearest is used (safe: Vf
// falls with current).
inline constexpr double vf_one_point_slope_v = 2.0 * 0.026;

inline Lookup vf_max_at(const Diode& part, double if_a, double ln_if) {
    Lookup l = interpolate_log(part.vf, if_a, ln_if, fwd_x, fwd_ln, fwd_y);
    if (l.side != Side::above || part.vf.empty()) return l;
    const double lx = std::isnan(ln_if) ? std::log(if_a) : ln_if;
    const ForwardPoint& last = part.vf.back();
    const double l_last = std::isnan(last.ln_if) ? std::log(last.if_a) : last.ln_if;
    double slope = vf_one_point_slope_v;
    if (part.vf.size() >= 2) {
        const ForwardPoint& prev = part.vf[part.vf.size() - 2];
        const double l_prev = std::isnan(prev.ln_if) ? std::log(prev.if_a) : prev.ln_if;
        slope = (last.vf_max_v - prev.vf_max_v) / (l_last - l_prev);
    }
    l.value = last.vf_max_v + std::max(0.0, slope) * (lx - l_last);
    l.outside = true;
    return l;
}

inline constexpr auto cur_x = [](const CurrentPoint& p) { return p.ic_a; };
inline constexpr auto cur_ln = [](const CurrentPoint& p) { return p.ln_ic; };
inline constexpr auto cur_y = [](const CurrentPoint& p) { return p.v_max; };

inline Lookup curve_at(const std::vector<CurrentPoint>& points, double ic_a, double ln_ic) {
    return interpolate_log(points, ic_a, ln_ic, cur_x, cur_ln, cur_y);
}

inline double vce_sat_test_ratio(const Bipolar& part, double ic_a, double ln_ic) {
    if (part.vce_sat.empty()) return 10.0;
    if (part.vce_sat.size() == 1 || !(ic_a > 0)) {
        const SaturationPoint& p = part.vce_sat.front();
        return p.ic_a / p.ib_a;
    }
    // Nearest on a log scale: the point with the least |ln(Ic_point) - ln(Ic)|; the first wins a tie.
    const double lx = std::isnan(ln_ic) ? std::log(ic_a) : ln_ic;
    const SaturationPoint* nearest = nullptr;
    double best = 0;
    for (const SaturationPoint& p : part.vce_sat) {
        const double d = std::abs((std::isnan(p.ln_ic) ? std::log(p.ic_a) : p.ln_ic) - lx);
        if (nearest == nullptr || d < best) {
            nearest = &p;
            best = d;
        }
    }
    return nearest->ic_a / nearest->ib_a;
}

}  // namespace coilfit::curves
