#include "coilfit/parts.hpp"

#include <algorithm>
#include <cmath>

namespace coilfit {
namespace {

// Linear interpolation of y on log(x) over points sorted by x; nearest point outside.
template <typename Points, typename X, typename Y>
Lookup interpolate_log(const Points& points, double x, X get_x, Y get_y) {
    if (points.empty() || !(x > 0)) return {points.empty() ? 0.0 : get_y(points.front()), true};
    if (points.size() == 1) {
        // One point is used everywhere; flag it when the operating point is more than a
        // factor of two away from it.
        const double ratio = x / get_x(points.front());
        return {get_y(points.front()), ratio > 2.0 || ratio < 0.5};
    }
    if (x <= get_x(points.front())) {
        return {get_y(points.front()), x < get_x(points.front()) * (1.0 - 1e-9)};
    }
    if (x >= get_x(points.back())) {
        return {get_y(points.back()), x > get_x(points.back()) * (1.0 + 1e-9)};
    }
    for (std::size_t i = 1; i < points.size(); ++i) {
        const double x1 = get_x(points[i]);
        if (x <= x1) {
            const double x0 = get_x(points[i - 1]);
            const double y0 = get_y(points[i - 1]);
            const double y1 = get_y(points[i]);
            const double t = std::log(x / x0) / std::log(x1 / x0);
            return {y0 + t * (y1 - y0), false};
        }
    }
    return {get_y(points.back()), true};
}

template <typename T>
const T* find_by_id(const std::vector<T>& v, std::string_view id) {
    const auto it = std::find_if(v.begin(), v.end(), [&](const T& p) { return p.id == id; });
    return it == v.end() ? nullptr : &*it;
}

}  // namespace

std::string_view bipolar_kind_name(BipolarKind kind) {
    return kind == BipolarKind::darlington ? "darlington" : "npn";
}

std::string_view diode_kind_name(DiodeKind kind) {
    switch (kind) {
    case DiodeKind::rectifier: return "rectifier";
    case DiodeKind::fast: return "fast";
    case DiodeKind::signal: return "signal";
    case DiodeKind::schottky: return "schottky";
    }
    return "rectifier";
}

Lookup hfe_min_at(const Bipolar& part, double ic_a) {
    return interpolate_log(
        part.hfe_min, ic_a, [](const GainPoint& p) { return p.ic_a; },
        [](const GainPoint& p) { return p.hfe_min; });
}

Lookup hfe_typ_at(const Bipolar& part, double ic_a) {
    return interpolate_log(
        part.hfe_min, ic_a, [](const GainPoint& p) { return p.ic_a; },
        [](const GainPoint& p) { return p.hfe_typ.value_or(p.hfe_min); });
}

Lookup vce_sat_at(const Bipolar& part, double ic_a) {
    return interpolate_log(
        part.vce_sat, ic_a, [](const SaturationPoint& p) { return p.ic_a; },
        [](const SaturationPoint& p) { return p.v_max; });
}

Lookup vbe_sat_at(const Bipolar& part, double ic_a) {
    return interpolate_log(
        part.vbe_sat, ic_a, [](const SaturationPoint& p) { return p.ic_a; },
        [](const SaturationPoint& p) { return p.v_max; });
}

double vce_sat_test_ratio(const Bipolar& part, double ic_a) {
    if (part.vce_sat.empty()) return 10.0;
    const auto nearest = std::min_element(
        part.vce_sat.begin(), part.vce_sat.end(), [&](const SaturationPoint& a, const SaturationPoint& b) {
            // nearest on a log scale: |ln r| grows with max(r, 1/r), so compare those (no log)
            return std::max(a.ic_a / ic_a, ic_a / a.ic_a) < std::max(b.ic_a / ic_a, ic_a / b.ic_a);
        });
    return nearest->ic_a / nearest->ib_a;
}

Lookup vf_max_at(const Diode& part, double if_a) {
    return interpolate_log(
        part.vf, if_a, [](const ForwardPoint& p) { return p.if_a; },
        [](const ForwardPoint& p) { return p.vf_max_v; });
}

double vf_low(const Diode& part) {
    if (part.vf_low_v) return *part.vf_low_v;
    // Common practice: about 0.6 V for silicon, 0.3 V for Schottky at small current.
    return part.kind == DiodeKind::schottky ? 0.3 : 0.6;
}

double rth_ja(const Bipolar& part) {
    if (part.rth_ja_k_per_w) return *part.rth_ja_k_per_w;
    return part.pd_w > 0 ? (part.tj_max_c - 25.0) / part.pd_w : 0.0;
}

const Bipolar* Catalogue::find_bipolar(std::string_view id) const { return find_by_id(bipolars, id); }
const Diode* Catalogue::find_diode(std::string_view id) const { return find_by_id(diodes, id); }
const Zener* Catalogue::find_zener(std::string_view id) const { return find_by_id(zeners, id); }

}  // namespace coilfit
