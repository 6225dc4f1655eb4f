// Part records back to JSON, values in SI numbers (`coilfit parts ID --format json`, the
// report's "input").
#include "coilfit/defaults.hpp"
#include "io/parts_read_common.hpp"

namespace coilfit::io {
namespace {

Json sat_json(const std::vector<SaturationPoint>& pts) {
    Json a = Json::array();
    for (const auto& p : pts) a.push_back(Json{{"ic", p.ic_a}, {"ib", p.ib_a}, {"max", p.v_max}});
    return a;
}

Json forward_json(const std::vector<ForwardPoint>& pts) {
    Json v = Json::array();
    for (const auto& f : pts) v.push_back(Json{{"if", f.if_a}, {"max", f.vf_max_v}});
    return v;
}

}  // namespace

Json to_json(const Bipolar& p) {
    Json j;
    j["id"] = p.id;
    j["kind"] = bipolar_kind_name(p.kind);
    j["ic_max"] = p.ic_max_a;
    j["vceo"] = p.vceo_v;
    Json h = Json::array();
    for (const auto& g : p.hfe_min) {
        Json e{{"ic", g.ic_a}, {"min", g.hfe_min}};
        if (g.hfe_typ) e["typ"] = *g.hfe_typ;
        h.push_back(e);
    }
    j["hfe_min"] = h;
    j["vce_sat"] = sat_json(p.vce_sat);
    j["vbe_sat"] = sat_json(p.vbe_sat);
    j["pd"] = p.pd_w;
    j["rth_ja"] = rth_ja(p);
    j["tj_max"] = p.tj_max_c;
    if (p.hfe_temp_exponent) j["hfe_temp_exponent"] = *p.hfe_temp_exponent;
    if (p.r_be_internal_ohm) j["r_be_internal"] = *p.r_be_internal_ohm;
    records::origin_json(p, j);
    return j;
}

Json to_json(const Mosfet& m) {
    Json j;
    j["id"] = m.id;
    j["kind"] = "nmos";
    j["vds_max"] = m.vds_max_v;
    j["id_max"] = m.id_max_a;
    j["vgs_max"] = m.vgs_max_v;
    j["vgs_th"] = {{"min", m.vgs_th_min_v}, {"max", m.vgs_th_max_v}};
    Json r = Json::array();
    for (const auto& p : m.rds_on) {
        Json e{{"vgs", p.vgs_v}, {"id", p.id_a}, {"max", p.max_ohm}};
        if (p.typ_ohm) e["typ"] = *p.typ_ohm;
        r.push_back(e);
    }
    j["rds_on"] = r;
    j["rds_on_tempco"] = m.rds_on_tempco_per_k.value_or(defaults::rds_on_tempco_per_k);
    j["vgs_th_tempco"] = -m.vgs_th_tempco_v_per_k.value_or(defaults::vgs_th_tempco_v_per_k);
    j["qg"] = m.qg_c;
    if (m.vplateau_v) j["vplateau"] = *m.vplateau_v;
    j["pd"] = m.pd_w;
    j["rth_ja"] = rth_ja(m);
    j["tj_max"] = m.tj_max_c;
    if (m.ear_j) j["ear"] = *m.ear_j;
    records::origin_json(m, j);
    return j;
}

Json to_json(const ArrayPart& a) {
    Json j;
    j["id"] = a.id;
    j["kind"] = "array";
    j["structure"] = a.structure == ArrayStructure::mosfet ? "mosfet" : "darlington";
    j["channels"] = a.channels;
    j["input_resistor"] = a.input_resistor_ohm;
    j["input_resistor_tolerance"] = a.input_resistor_tolerance.value_or(defaults::array_input_tolerance);
    j["vin_on"] = records::current_points_json(a.vin_on);
    j["vce_sat"] = records::current_points_json(a.vce_sat);
    j["ic_max"] = a.ic_max_a;
    j["vceo"] = a.vceo_v;
    j["diode"] = {{"vf", forward_json(a.diode.vf)}, {"if_max", a.diode.if_avg_a}, {"vrrm", a.diode.vrrm_v}};
    j["pd"] = a.pd_w;
    j["rth_ja"] = rth_ja(a);
    j["tj_max"] = a.tj_max_c;
    if (a.ic_total_max_a) j["ic_total_max"] = *a.ic_total_max_a;
    records::origin_json(a, j);
    return j;
}

Json to_json(const Diode& p) {
    Json j;
    j["id"] = p.id;
    j["kind"] = diode_kind_name(p.kind);
    j["vrrm"] = p.vrrm_v;
    j["if_avg"] = p.if_avg_a;
    if (p.ifrm_a) j["ifrm"] = *p.ifrm_a;
    if (p.ifsm_a) j["ifsm"] = *p.ifsm_a;
    j["vf"] = forward_json(p.vf);
    j["vf_low"] = vf_low(p);
    records::origin_json(p, j);
    return j;
}

Json to_json(const Zener& p) {
    Json j;
    j["id"] = p.id;
    j["kind"] = "zener";
    j["vz"] = p.vz_v;
    j["tolerance"] = p.tolerance;
    j["pd"] = p.pd_w;
    if (p.izt_a) j["izt"] = *p.izt_a;
    if (p.zzt_ohm) j["zzt"] = *p.zzt_ohm;
    if (p.vz_tempco_v_per_k) j["vz_tempco"] = *p.vz_tempco_v_per_k;
    if (!p.pulse.empty()) {
        Json a = Json::array();
        for (const auto& q : p.pulse) a.push_back(Json{{"width", q.width_s}, {"power", q.power_w}});
        j["pulse"] = a;
    }
    records::origin_json(p, j);
    return j;
}

Json to_json(const Tvs& t) {
    Json j;
    j["id"] = t.id;
    j["kind"] = "tvs";
    j["vrwm"] = t.vrwm_v;
    j["vbr"] = {{"min", t.vbr_min_v}, {"max", t.vbr_max_v}};
    j["vc"] = t.vc_v;
    j["ipp"] = t.ipp_a;
    j["ppk"] = t.ppk_w;
    j["ppk_width"] = t.ppk_width_s;
    records::origin_json(t, j);
    return j;
}

Json to_json(const Transistor& p) {
    return std::visit([](const auto& part) { return to_json(part); }, p);
}

}  // namespace coilfit::io
