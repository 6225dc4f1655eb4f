#include "coilfit/parts.hpp"

#include <algorithm>
#include <cmath>

#include "curves.hpp"

namespace coilfit {
namespace {

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

Lookup hfe_min_at(const Bipolar& part, double ic_a, double ln_ic) { return curves::hfe_min_at(part, ic_a, ln_ic); }
Lookup hfe_typ_at(const Bipolar& part, double ic_a, double ln_ic) { return curves::hfe_typ_at(part, ic_a, ln_ic); }
Lookup vce_sat_at(const Bipolar& part, double ic_a, double ln_ic) { return curves::vce_sat_at(part, ic_a, ln_ic); }
Lookup vbe_sat_at(const Bipolar& part, double ic_a, double ln_ic) { return curves::vbe_sat_at(part, ic_a, ln_ic); }
Lookup vf_max_at(const Diode& part, double if_a, double ln_if) { return curves::vf_max_at(part, if_a, ln_if); }

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

double vce_sat_test_ratio(const Bipolar& part, double ic_a, double ln_ic) {
    return curves::vce_sat_test_ratio(part, ic_a, ln_ic);
}

double vce_sat_test_ratio(const Bipolar& part, double ic_a) { return vce_sat_test_ratio(part, ic_a, ln_not_set); }

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
