// Readers of the transistor records: npn/darlington, nmos, array.
#include <cmath>

#include "io/parts_read_common.hpp"

namespace coilfit::io {
namespace {

using namespace records;

SaturationPoint read_saturation(ObjectReader& p) {
    SaturationPoint s;
    s.ic_a = current(p, "ic", p.required("ic", Unit::ampere));
    s.ib_a = current(p, "ib", p.required("ib", Unit::ampere));
    s.v_max = p.within("max", p.positive("max", p.required("max", Unit::volt)), 0.001, 10.0);
    if (s.ib_a > s.ic_a) {
        p.fail_at("ib",
                  fmt::format("expected a base current at most the test's ic {} (a saturation test condition), got {}",
                              format_quantity(s.ic_a, Unit::ampere, 6), format_quantity(s.ib_a, Unit::ampere, 6)));
    }
    return s;
}

GainPoint read_gain(ObjectReader& pr) {
    GainPoint g;
    g.ic_a = current(pr, "ic", pr.required("ic", Unit::ampere));
    // A bipolar transistor's current gain is above 1 (a Darlington's up to about 10^5).
    g.hfe_min = pr.within("min", pr.positive("min", pr.required("min", Unit::number)), 1.0, 1e6);
    if (auto typ = pr.quantity("typ", Unit::number)) {
        g.hfe_typ = pr.within("typ", *typ, 1.0, 1e6);
        if (*typ < g.hfe_min) {
            pr.fail_at("typ", fmt::format("expected a typical gain of at least the minimum {}, got {}",
                                          format_quantity(g.hfe_min, Unit::number, 6),
                                          format_quantity(*typ, Unit::number, 6)));
        }
    }
    return g;
}

RdsOnPoint read_rds_point(ObjectReader& pr) {
    RdsOnPoint p;
    p.vgs_v = pr.within("vgs", pr.positive("vgs", pr.required("vgs", Unit::volt)), 0.5, 30.0);
    p.id_a = current(pr, "id", pr.required("id", Unit::ampere));
    p.max_ohm = pr.within("max", pr.positive("max", pr.required("max", Unit::ohm)), 1e-4, 1e4);
    if (auto typ = pr.quantity("typ", Unit::ohm)) {
        p.typ_ohm = pr.within("typ", pr.positive("typ", *typ), 1e-4, 1e4);
        if (*typ > p.max_ohm) {
            pr.fail_at("typ",
                       fmt::format("expected a typical Rds(on) of at most the maximum {}, got {}",
                                   format_quantity(p.max_ohm, Unit::ohm, 6), format_quantity(*typ, Unit::ohm, 6)));
        }
    }
    return p;
}

}  // namespace

Bipolar read_bipolar(ObjectReader& r, RecordPlace place) {
    Bipolar p;
    p.id = read_id(r);
    const std::string kind = r.required_text("kind", 32);
    if (kind == "npn")
        p.kind = BipolarKind::npn;
    else if (kind == "darlington")
        p.kind = BipolarKind::darlington;
    else
        r.fail_at("kind", "expected \"npn\" or \"darlington\", got \"" + printable(kind) + "\"");
    p.ic_max_a = r.within("ic_max", r.positive("ic_max", r.required("ic_max", Unit::ampere)), 1e-6, 1e3);
    p.vceo_v = voltage(r, "vceo", 1.0, 1e4);
    p.hfe_min = read_points<GainPoint>(r, "hfe_min", read_gain, true);
    check_sorted(r, "hfe_min", p.hfe_min, [](const GainPoint& g) { return g.ic_a; });
    p.vce_sat = read_points<SaturationPoint>(r, "vce_sat", read_saturation, true);
    check_sorted(r, "vce_sat", p.vce_sat, [](const SaturationPoint& g) { return g.ic_a; });
    p.vbe_sat = read_points<SaturationPoint>(r, "vbe_sat", read_saturation, true);
    check_sorted(r, "vbe_sat", p.vbe_sat, [](const SaturationPoint& g) { return g.ic_a; });
    read_thermal(r, p.pd_w, p.rth_ja_k_per_w, p.tj_max_c);
    if (auto v = r.quantity("hfe_temp_exponent", Unit::number))
        p.hfe_temp_exponent = r.within("hfe_temp_exponent", *v, 0.0, 5.0);
    if (auto v = r.quantity("r_be_internal", Unit::ohm)) {
        p.r_be_internal_ohm = r.within("r_be_internal", r.positive("r_be_internal", *v), 10.0, 1e6);
    }
    read_origin(r, p, place);
    return p;
}

Mosfet read_mosfet(ObjectReader& r, RecordPlace place) {
    Mosfet m;
    m.id = read_id(r);
    const std::string kind = r.required_text("kind", 32);
    if (kind != "nmos") r.fail_at("kind", "expected \"nmos\", got \"" + printable(kind) + "\"");
    m.vds_max_v = voltage(r, "vds_max", 1.0, 1e4);
    m.id_max_a = r.within("id_max", r.positive("id_max", r.required("id_max", Unit::ampere)), 1e-6, 1e3);
    m.vgs_max_v = voltage(r, "vgs_max", 1.0, 100.0);
    {
        const Json* th = r.get("vgs_th");
        if (!th) r.fail_at("vgs_th", "missing; expected { \"min\": \"1V\", \"max\": \"2.5V\" }");
        ObjectReader tr(*th, r.origin(), r.path_of("vgs_th"));
        m.vgs_th_min_v = voltage(tr, "min", 0.05, 20.0);
        m.vgs_th_max_v = voltage(tr, "max", 0.05, 20.0);
        if (m.vgs_th_max_v < m.vgs_th_min_v) {
            tr.fail_at("max", fmt::format("expected at least vgs_th.min {}, got {}",
                                          format_quantity(m.vgs_th_min_v, Unit::volt, 6),
                                          format_quantity(m.vgs_th_max_v, Unit::volt, 6)));
        }
        tr.finish();
    }
    m.rds_on = read_points<RdsOnPoint>(r, "rds_on", read_rds_point, true);
    check_sorted(
        r, "rds_on", m.rds_on, [](const RdsOnPoint& p) { return p.vgs_v; }, "gate voltage");
    if (auto v = r.quantity("rds_on_tempco", Unit::per_kelvin))
        m.rds_on_tempco_per_k = r.within("rds_on_tempco", *v, 0.0, 0.05);
    if (auto v = r.quantity("vgs_th_tempco", Unit::volt_per_kelvin)) {
        m.vgs_th_tempco_v_per_k = r.within("vgs_th_tempco", std::abs(*v), 0.0, 0.05);
    }
    m.qg_c = r.within("qg", r.positive("qg", r.required("qg", Unit::coulomb)), 1e-12, 1e-5);
    if (auto v = r.quantity("vplateau", Unit::volt))
        m.vplateau_v = r.within("vplateau", r.positive("vplateau", *v), 0.1, 20.0);
    read_thermal(r, m.pd_w, m.rth_ja_k_per_w, m.tj_max_c);
    if (auto v = r.quantity("ear", Unit::joule)) m.ear_j = r.within("ear", r.positive("ear", *v), 1e-9, 100.0);
    read_origin(r, m, place);
    return m;
}

ArrayPart read_array(ObjectReader& r, RecordPlace place) {
    ArrayPart a;
    a.id = read_id(r);
    const std::string kind = r.required_text("kind", 32);
    if (kind != "array") r.fail_at("kind", "expected \"array\", got \"" + printable(kind) + "\"");
    const std::string structure = r.text("structure", 32).value_or("darlington");
    if (structure == "darlington")
        a.structure = ArrayStructure::darlington;
    else if (structure == "mosfet")
        a.structure = ArrayStructure::mosfet;
    else
        r.fail_at("structure", "expected \"darlington\" or \"mosfet\", got \"" + printable(structure) + "\"");
    const double channels = r.within("channels", r.required("channels", Unit::number), 1.0, 64.0);
    if (channels != std::floor(channels)) r.fail_at("channels", "expected a whole number of channels");
    a.channels = static_cast<int>(channels);
    a.input_resistor_ohm =
        r.within("input_resistor", r.positive("input_resistor", r.required("input_resistor", Unit::ohm)), 1.0, 1e6);
    if (auto v = r.quantity("input_resistor_tolerance", Unit::ratio)) {
        a.input_resistor_tolerance = r.fraction("input_resistor_tolerance", *v, 0.0, 0.5, true);
    }
    a.vin_on = read_current_points(r, "vin_on");
    a.vce_sat = read_current_points(r, "vce_sat");
    a.ic_max_a = r.within("ic_max", r.positive("ic_max", r.required("ic_max", Unit::ampere)), 1e-6, 1e3);
    a.vceo_v = voltage(r, "vceo", 1.0, 1e4);
    {
        const Json* dj = r.get("diode");
        if (!dj)
            r.fail_at("diode", "missing; expected the built-in clamp diode { \"vf\": [...], \"if_max\": \"500mA\" }");
        ObjectReader dr(*dj, r.origin(), r.path_of("diode"));
        a.diode.id = a.id + " (built-in diode)";
        a.diode.kind = DiodeKind::rectifier;
        a.diode.vf = read_forward_points(dr, "vf");
        a.diode.if_avg_a = dr.within("if_max", dr.positive("if_max", dr.required("if_max", Unit::ampere)), 1e-6, 1e3);
        a.diode.ifrm_a = a.diode.if_avg_a;
        a.diode.vrrm_v = dr.quantity("vrrm", Unit::volt).value_or(a.vceo_v);
        a.diode.vrrm_v = dr.within("vrrm", a.diode.vrrm_v, 1.0, 1e4);
        a.diode.description = "built-in clamp diode of " + a.id + " to its common pin";
        a.diode.source = "the array's record";
        dr.finish();
    }
    read_thermal(r, a.pd_w, a.rth_ja_k_per_w, a.tj_max_c);
    if (auto v = r.quantity("ic_total_max", Unit::ampere)) a.ic_total_max_a = current(r, "ic_total_max", *v);
    read_origin(r, a, place);
    a.diode.inline_record = a.inline_record;
    return a;
}

Transistor read_transistor(ObjectReader& r, RecordPlace place) {
    const Json* kind = r.get("kind");
    const std::string k = kind && kind->is_string() ? kind->get<std::string>() : std::string();
    if (k == "nmos") return read_mosfet(r, place);
    if (k == "array") return read_array(r, place);
    if (k == "npn" || k == "darlington" || !kind) return read_bipolar(r, place);
    r.fail_at("kind", "expected \"npn\", \"darlington\", \"nmos\" or \"array\", got " + describe(*kind));
}

}  // namespace coilfit::io
