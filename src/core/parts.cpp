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

// Thermal resistance from the power rating at 25 °C when the record gives none.
double derived_rth(const std::optional<double>& given, double pd_w, double tj_max_c) {
    if (given) return *given;
    return pd_w > 0 ? (tj_max_c - 25.0) / pd_w : 0.0;
}

}  // namespace

std::string display_id(const PartOrigin& part) { return part.inline_record ? "inline " + part.id : part.id; }

std::string_view bipolar_kind_name(BipolarKind kind) { return kind == BipolarKind::darlington ? "darlington" : "npn"; }

std::string_view diode_kind_name(DiodeKind kind) {
    switch (kind) {
        case DiodeKind::rectifier:
            return "rectifier";
        case DiodeKind::fast:
            return "fast";
        case DiodeKind::signal:
            return "signal";
        case DiodeKind::schottky:
            return "schottky";
    }
    return "rectifier";
}

std::string_view transistor_kind_name(const Transistor& t) {
    if (const auto* b = std::get_if<Bipolar>(&t)) return bipolar_kind_name(b->kind);
    if (std::holds_alternative<Mosfet>(t)) return "nmos";
    return "array";
}

const PartOrigin& origin(const Transistor& t) {
    return std::visit([](const auto& p) -> const PartOrigin& { return p; }, t);
}

Lookup hfe_min_at(const Bipolar& part, double ic_a, double ln_ic) { return curves::hfe_min_at(part, ic_a, ln_ic); }
Lookup hfe_typ_at(const Bipolar& part, double ic_a, double ln_ic) { return curves::hfe_typ_at(part, ic_a, ln_ic); }
Lookup vce_sat_at(const Bipolar& part, double ic_a, double ln_ic) { return curves::vce_sat_at(part, ic_a, ln_ic); }
Lookup vbe_sat_at(const Bipolar& part, double ic_a, double ln_ic) { return curves::vbe_sat_at(part, ic_a, ln_ic); }
Lookup vf_max_at(const Diode& part, double if_a, double ln_if) { return curves::vf_max_at(part, if_a, ln_if); }
Lookup curve_at(const std::vector<CurrentPoint>& points, double ic_a, double ln_ic) {
    return curves::curve_at(points, ic_a, ln_ic);
}

void precompute_logs(Bipolar& part) {
    for (auto& p : part.hfe_min) p.ln_ic = std::log(p.ic_a);
    for (auto& p : part.vce_sat) p.ln_ic = std::log(p.ic_a);
    for (auto& p : part.vbe_sat) p.ln_ic = std::log(p.ic_a);
}

void precompute_logs(Diode& part) {
    for (auto& p : part.vf) p.ln_if = std::log(p.if_a);
}

void precompute_logs(ArrayPart& part) {
    for (auto& p : part.vin_on) p.ln_ic = std::log(p.ic_a);
    for (auto& p : part.vce_sat) p.ln_ic = std::log(p.ic_a);
    precompute_logs(part.diode);
}

double vce_sat_test_ratio(const Bipolar& part, double ic_a, double ln_ic) {
    return curves::vce_sat_test_ratio(part, ic_a, ln_ic);
}

double vf_low(const Diode& part) {
    if (part.vf_low_v) return *part.vf_low_v;
    // Common practice: about 0.6 V for silicon, 0.3 V for Schottky at small current.
    return part.kind == DiodeKind::schottky ? 0.3 : 0.6;
}

double rth_ja(const Bipolar& part) { return derived_rth(part.rth_ja_k_per_w, part.pd_w, part.tj_max_c); }
double rth_ja(const Mosfet& part) { return derived_rth(part.rth_ja_k_per_w, part.pd_w, part.tj_max_c); }
double rth_ja(const ArrayPart& part) { return derived_rth(part.rth_ja_k_per_w, part.pd_w, part.tj_max_c); }

const Bipolar* Catalogue::find_bipolar(std::string_view id) const { return find_by_id(bipolars, id); }
const Mosfet* Catalogue::find_mosfet(std::string_view id) const { return find_by_id(mosfets, id); }
const ArrayPart* Catalogue::find_array(std::string_view id) const { return find_by_id(arrays, id); }
const Diode* Catalogue::find_diode(std::string_view id) const { return find_by_id(diodes, id); }
const Zener* Catalogue::find_zener(std::string_view id) const { return find_by_id(zeners, id); }
const Tvs* Catalogue::find_tvs(std::string_view id) const { return find_by_id(tvs, id); }

std::optional<Transistor> Catalogue::find_transistor(std::string_view id) const {
    if (const Bipolar* b = find_bipolar(id)) return Transistor{*b};
    if (const Mosfet* m = find_mosfet(id)) return Transistor{*m};
    if (const ArrayPart* a = find_array(id)) return Transistor{*a};
    return std::nullopt;
}

}  // namespace coilfit
