// Readers of the clamp records: diode, zener, TVS.
#include "io/parts_read_common.hpp"

namespace coilfit::io {
namespace {

using namespace records;

std::vector<PulsePoint> read_pulse(ObjectReader& r) {
    auto pts = read_points<PulsePoint>(
        r, "pulse",
        [](ObjectReader& pr) {
            PulsePoint p;
            p.width_s = pr.within("width", pr.positive("width", pr.required("width", Unit::second)), 1e-7, 10.0);
            p.power_w = pr.within("power", pr.positive("power", pr.required("power", Unit::watt)), 1e-3, 1e6);
            return p;
        },
        false);
    check_sorted(
        r, "pulse", pts, [](const PulsePoint& p) { return p.width_s; }, "width");
    return pts;
}

}  // namespace

Diode read_diode(ObjectReader& r, RecordPlace place) {
    Diode d;
    d.id = read_id(r);
    const std::string kind = r.required_text("kind", 32);
    if (kind == "rectifier")
        d.kind = DiodeKind::rectifier;
    else if (kind == "fast")
        d.kind = DiodeKind::fast;
    else if (kind == "signal")
        d.kind = DiodeKind::signal;
    else if (kind == "schottky")
        d.kind = DiodeKind::schottky;
    else
        r.fail_at("kind",
                  "expected \"rectifier\", \"fast\", \"signal\" or \"schottky\", got \"" + printable(kind) + "\"");
    d.vrrm_v = voltage(r, "vrrm", 1.0, 1e4);
    d.if_avg_a = r.within("if_avg", r.positive("if_avg", r.required("if_avg", Unit::ampere)), 1e-6, 1e3);
    if (auto v = r.quantity("ifrm", Unit::ampere)) d.ifrm_a = current(r, "ifrm", *v);
    if (auto v = r.quantity("ifsm", Unit::ampere)) d.ifsm_a = current(r, "ifsm", *v);
    d.vf = read_forward_points(r, "vf");
    if (auto v = r.quantity("vf_low", Unit::volt)) d.vf_low_v = r.within("vf_low", *v, 0.05, 5.0);
    read_origin(r, d, place);
    return d;
}

Zener read_zener(ObjectReader& r, RecordPlace place) {
    Zener z;
    z.id = read_id(r);
    const std::string kind = r.required_text("kind", 32);
    if (kind != "zener") r.fail_at("kind", "expected \"zener\", got \"" + printable(kind) + "\"");
    z.vz_v = voltage(r, "vz", 1.0, 1000.0);
    z.tolerance = r.fraction("tolerance", r.quantity("tolerance", Unit::ratio).value_or(0.05), 0.0, 0.5, true);
    z.pd_w = r.within("pd", r.positive("pd", r.required("pd", Unit::watt)), 1e-3, 1e3);
    if (auto v = r.quantity("izt", Unit::ampere)) z.izt_a = current(r, "izt", *v);
    if (auto v = r.quantity("zzt", Unit::ohm)) z.zzt_ohm = r.within("zzt", r.non_negative("zzt", *v), 0.0, 1e4);
    // The drift as datasheets give it: relative ("0.08%/K") or absolute ("8mV/K"; a plain
    // number is absolute, in V/K).
    if (const Json* tc = r.get("vz_tempco")) {
        const bool relative = tc->is_string() && tc->get<std::string>().find("V/") == std::string::npos;
        if (!relative) {
            z.vz_tempco_v_per_k = r.within("vz_tempco", *r.quantity("vz_tempco", Unit::volt_per_kelvin), -1.0, 1.0);
        } else {
            z.vz_tempco_v_per_k =
                r.within("vz_tempco", *r.quantity("vz_tempco", Unit::per_kelvin), -0.01, 0.01) * z.vz_v;
        }
    }
    z.pulse = read_pulse(r);
    read_origin(r, z, place);
    return z;
}

Tvs read_tvs(ObjectReader& r, RecordPlace place) {
    Tvs t;
    t.id = read_id(r);
    const std::string kind = r.required_text("kind", 32);
    if (kind != "tvs") r.fail_at("kind", "expected \"tvs\", got \"" + printable(kind) + "\"");
    t.vrwm_v = voltage(r, "vrwm", 1.0, 1000.0);
    {
        const Json* bj = r.get("vbr");
        if (!bj) r.fail_at("vbr", "missing; expected { \"min\": \"16.7V\", \"max\": \"18.5V\" } (breakdown at 1 mA)");
        ObjectReader br(*bj, r.origin(), r.path_of("vbr"));
        t.vbr_min_v = voltage(br, "min", 1.0, 1000.0);
        t.vbr_max_v = voltage(br, "max", 1.0, 1000.0);
        if (t.vbr_max_v < t.vbr_min_v) {
            br.fail_at("max",
                       fmt::format("expected at least vbr.min {}, got {}", format_quantity(t.vbr_min_v, Unit::volt, 6),
                                   format_quantity(t.vbr_max_v, Unit::volt, 6)));
        }
        br.finish();
    }
    t.vc_v = voltage(r, "vc", 1.0, 2000.0);
    if (t.vc_v < t.vbr_max_v) {
        r.fail_at("vc",
                  fmt::format("expected at least vbr.max {} (the clamping voltage at Ipp), got {}",
                              format_quantity(t.vbr_max_v, Unit::volt, 6), format_quantity(t.vc_v, Unit::volt, 6)));
    }
    t.ipp_a = current(r, "ipp", r.required("ipp", Unit::ampere));
    t.ppk_w = r.within("ppk", r.positive("ppk", r.required("ppk", Unit::watt)), 1.0, 1e6);
    if (auto v = r.quantity("ppk_width", Unit::second))
        t.ppk_width_s = r.within("ppk_width", r.positive("ppk_width", *v), 1e-7, 1.0);
    read_origin(r, t, place);
    return t;
}

}  // namespace coilfit::io
