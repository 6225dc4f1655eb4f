#include "coilfit/parts.hpp"

#include <algorithm>
#include <cmath>

namespace coilfit {
namespace {

// Linear interpolation of y on log(x) over points sorted by x; nearest point outside.
// ln_x is ln(x) or NaN (then computed only when needed); ln_p gives a point's ln(x) or NaN.
template <typename Points, typename X, typename LnX, typename Y>
Lookup interpolate_log(const Points& points, double x, double ln_x, X get_x, LnX get_ln, Y get_y) {
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
            return {y0 + t * (y1 - y0), false};
        }
    }
    return {get_y(points.back()), true};
}

constexpr auto gain_x = [](const GainPoint& p) { return p.ic_a; };
constexpr auto gain_ln = [](const GainPoint& p) { return p.ln_ic; };
constexpr auto sat_x = [](const SaturationPoint& p) { return p.ic_a; };
constexpr auto sat_ln = [](const SaturationPoint& p) { return p.ln_ic; };
constexpr auto sat_y = [](const SaturationPoint& p) { return p.v_max; };
constexpr auto fwd_x = [](const ForwardPoint& p) { return p.if_a; };
constexpr auto fwd_ln = [](const ForwardPoint& p) { return p.ln_if; };
constexpr auto fwd_y = [](const ForwardPoint& p) { return p.vf_max_v; };

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

Lookup hfe_min_at(const Bipolar& part, double ic_a, double ln_ic) {
    return interpolate_log(part.hfe_min, ic_a, ln_ic, gain_x, gain_ln, [](const GainPoint& p) { return p.hfe_min; });
}

Lookup hfe_typ_at(const Bipolar& part, double ic_a, double ln_ic) {
    return interpolate_log(part.hfe_min, ic_a, ln_ic, gain_x, gain_ln,
                           [](const GainPoint& p) { return p.hfe_typ.value_or(p.hfe_min); });
}

Lookup vce_sat_at(const Bipolar& part, double ic_a, double ln_ic) {
    return interpolate_log(part.vce_sat, ic_a, ln_ic, sat_x, sat_ln, sat_y);
}

Lookup vbe_sat_at(const Bipolar& part, double ic_a, double ln_ic) {
    return interpolate_log(part.vbe_sat, ic_a, ln_ic, sat_x, sat_ln, sat_y);
}

Lookup vf_max_at(const Diode& part, double if_a, double ln_if) {
    return interpolate_log(part.vf, if_a, ln_if, fwd_x, fwd_ln, fwd_y);
}

Lookup hfe_min_at(const Bipolar& part, double ic_a) { return hfe_min_at(part, ic_a, ln_not_set); }
Lookup hfe_typ_at(const Bipolar& part, double ic_a) { return hfe_typ_at(part, ic_a, ln_not_set); }
Lookup vce_sat_at(const Bipolar& part, double ic_a) { return vce_sat_at(part, ic_a, ln_not_set); }
Lookup vbe_sat_at(const Bipolar& part, double ic_a) { return vbe_sat_at(part, ic_a, ln_not_set); }
Lookup vf_max_at(const Diode& part, double if_a) { return vf_max_at(part, if_a, ln_not_set); }

void precompute_logs(Bipolar& part) {
    for (auto& p : part.hfe_min) p.ln_ic = std::log(p.ic_a);
    for (auto& p : part.vce_sat) p.ln_ic = std::log(p.ic_a);
    for (auto& p : part.vbe_sat) p.ln_ic = std::log(p.ic_a);
}

void precompute_logs(Diode& part) {
    for (auto& p : part.vf) p.ln_if = std::log(p.if_a);
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
