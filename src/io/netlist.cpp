// The SPICE netlist of a sized driver (see netlist.hpp). Every model parameter is written here
// from the parts table data; the formulas that place them are beside each one.
#include "io/netlist.hpp"

#include <algorithm>
#include <cmath>
#include <string>
#include <vector>

#include <fmt/format.h>

#include "coilfit/clamp.hpp"
#include "coilfit/parts.hpp"
#include "coilfit/quantity.hpp"
#include "io/netlist_devices.hpp"

namespace coilfit::io {
namespace {

using netlist::num;
using netlist::secs;
using netlist::vt_v;

// Emission coefficient N when the part's table gives no slope at the operating point: about 2
// for a silicon pn diode at forward currents of milliamperes to amperes, about 1.1 for a
// Schottky barrier (common practice, from memory).
double default_emission(DiodeKind kind) { return kind == DiodeKind::schottky ? 1.1 : 2.0; }

// Pin edges and the settling of the coil current before turn-off.
constexpr double pin_delay_s = 10e-6;
constexpr double pin_edge_s = 100e-9;
constexpr double settle_time_constants = 10.0;  // e^-10: the current is within 5e-5 of final
constexpr double steps_per_release = 500.0;     // time step: 1/500 of the release time or tau

struct DiodeModel {
    double is_a = 0;
    double n = 1;
};

// Shockley diode I = IS * (exp(V / (N Vt)) - 1) through the point (i, v).
DiodeModel diode_through(double i_a, double v_v, double n) { return {i_a / std::expm1(v_v / (n * vt_v)), n}; }

// The emission coefficient that gives the part's table slope around i_a: the report
// interpolates Vf linearly on log(I) between two points, which is a Shockley diode with
// N = dVf/dln(I) / Vt. Outside the points (where the report holds the nearest value) or with
// one point, the default for the kind.
double table_emission(const Diode& d, double i_a) {
    std::vector<ForwardPoint> pts = d.vf;
    std::sort(pts.begin(), pts.end(), [](const ForwardPoint& a, const ForwardPoint& b) { return a.if_a < b.if_a; });
    for (std::size_t k = 1; k < pts.size(); ++k) {
        const ForwardPoint& lo = pts[k - 1];
        const ForwardPoint& hi = pts[k];
        if (lo.if_a <= i_a && i_a <= hi.if_a && hi.if_a > lo.if_a && hi.vf_max_v > lo.vf_max_v) {
            const double n = (hi.vf_max_v - lo.vf_max_v) / std::log(hi.if_a / lo.if_a) / vt_v;
            return std::clamp(n, 1.0, 20.0);
        }
    }
    return default_emission(d.kind);
}

// Comments stay printable ASCII: a spec name may hold anything.
std::string ascii(std::string_view s) {
    std::string out;
    for (const char ch : s) {
        const auto u = static_cast<unsigned char>(ch);
        out += (u >= 0x20 && u < 0x7f) ? ch : '?';
    }
    return out;
}

std::string clamp_words(const Spec& spec) {
    const ClampSpec& c = spec.clamp;
    switch (c.type) {
        case ClampType::diode:
            return "diode " + display_id(*c.diode);
        case ClampType::diode_tvs:
            return fmt::format("diode {} + TVS {} (breakdown {} V to {} V)", display_id(*c.diode), display_id(*c.tvs),
                               num(c.tvs->vbr_min_v), num(c.tvs->vbr_max_v));
        case ClampType::diode_zener:
            return fmt::format("diode {} + zener {} ({} V +/- {} %)", display_id(*c.diode), display_id(*c.zener),
                               num(c.zener->vz_v), num(100.0 * c.zener->tolerance));
        case ClampType::diode_resistor:
            return fmt::format("diode {} + resistor {} ohm", display_id(*c.diode), num(c.resistor_ohm.value_or(0)));
        case ClampType::none:
            return "none";
    }
    return "none";
}

// The clamp's own part (zener or TVS) as a diode in breakdown for each copy: BV and a series
// resistance that give its voltage at the coil current.
struct BreakdownModel {
    double bv_v = 0, ibv_a = 0, rs_ohm = 0;
};

std::string breakdown_model(const std::string& name, const BreakdownModel& m) {
    return fmt::format(".model {} d(is=1e-14 n=1 bv={} ibv={}{})", name, num(m.bv_v), num(m.ibv_a),
                       m.rs_ohm > 0 ? " rs=" + num(m.rs_ohm) : std::string());
}

void check_simulable(const SizingReport& report) {
    const Spec& spec = report.spec;
    if (!spec.coil.inductance_h || !(*spec.coil.inductance_h > 0)) {
        throw InputError(
            "--netlist: the simulation needs the coil inductance; give coil.inductance (measure the coil "
            "with an LCR meter with the armature held in its energised position, or ask the maker)");
    }
    if (spec.clamp.type == ClampType::none || !spec.clamp.diode) {
        throw InputError(
            "--netlist: the design has no clamp, so the collector voltage is limited only by breakdown and "
            "there is no release to simulate; choose clamp.type diode, diode_zener, diode_tvs or diode_resistor");
    }
    if (!spec.array() && !report.sized.r_drive_ohm) {
        throw InputError("--netlist: no " + std::string(report.resistor.kind) +
                         " could be chosen, so there is no circuit to "
                         "simulate; give " +
                         (spec.mosfet() ? "gate_resistor.value" : "base_resistor.value") +
                         " to simulate a resistor of your choice");
    }
}

// Everything the netlist's text needs, worked out from the report.
struct Plan {
    const Spec* spec = nullptr;
    const Conditions* c = nullptr;
    const ClampCorner* k = nullptr;  // the cold corner: the longest release, the highest peak
    netlist::DriverNetlist drv;
    bool cold_devices = false;
    double l_h = 0, r_cold = 0, i0 = 0, i_rel = 0;
    double vf_peak = 0, vf_lo = 0;
    DiodeModel d_peak, d_low;
    BreakdownModel z_peak, z_low;
    double rs_peak = 0, rs_low = 0;
    double t_on = 0, t_off = 0, t_stop = 0, t_max = 0;
};

// The clamp's breakdown part: the zener at the top (peak copy) and bottom (timing copy) of its
// band; a TVS from Vbr max to Vc at Ipp (peak) and at Vbr min.
void place_breakdown(const Spec& spec, const Conditions& c, Plan& p) {
    if (spec.clamp.type == ClampType::diode_zener) {
        const Zener& z = *spec.clamp.zener;
        if (z.zzt_ohm && z.izt_a && *z.zzt_ohm > 0) {
            // A zener with its dynamic impedance as series resistance: V(Izt) is the band's top
            // (peak copy) or bottom (timing copy), V(I) = that + Zzt (I - Izt) either side.
            p.z_peak = {c.vz_hi_v - *z.zzt_ohm * *z.izt_a, *z.izt_a, *z.zzt_ohm};
            p.z_low = {c.vz_lo_v - *z.zzt_ohm * *z.izt_a, *z.izt_a, *z.zzt_ohm};
        } else {
            p.z_peak = {p.k->v.part_peak_v, p.i0, 0};
            p.z_low = {p.k->v.timing_v - p.vf_lo, p.i_rel, 0};
        }
    } else if (spec.clamp.type == ClampType::diode_tvs) {
        const Tvs& t = *spec.clamp.tvs;
        p.z_peak = {t.vbr_max_v, 1e-3, t.ipp_a > 1e-3 ? (t.vc_v - t.vbr_max_v) / (t.ipp_a - 1e-3) : 0.0};
        p.z_low = {t.vbr_min_v, std::min(1e-3, p.i_rel), 0};
    }
}

Plan make_plan(const SizingReport& report, const NetlistOptions& options) {
    Plan p;
    const Spec& spec = report.spec;
    const Evaluation& e = report.sized.worst;
    p.spec = &spec;
    p.c = &report.sized.conditions;
    p.k = &e.clamp.at[0];
    p.cold_devices = options.device_temperature && spec.bipolar();
    p.drv = spec.mosfet()  ? netlist::mosfet_netlist(report)
            : spec.array() ? netlist::array_netlist(report)
                           : netlist::bipolar_netlist(report, p.cold_devices);
    const Diode& diode = *spec.clamp.diode;
    p.l_h = *spec.coil.inductance_h;
    p.r_cold = e.coil.at[0].r_cold_ohm;
    p.i0 = e.coil.at[0].current_max_a;
    p.i_rel = e.coil.release_current_a;
    // Diode models. Peak corner: through the report's maximum drop at I0. Timing corner: through
    // the low drop vf_low at the release current, no series resistance, so the drop is at least
    // vf_low while the current is above the release current, and as close to it as the junction allows.
    p.vf_peak = vf_max_at(diode, p.i0).value;
    p.d_peak = diode_through(p.i0, p.vf_peak, table_emission(diode, p.i0));
    p.vf_lo = vf_low(diode);
    p.d_low = diode_through(p.i_rel, p.vf_lo, default_emission(diode.kind));
    place_breakdown(spec, *p.c, p);
    p.rs_peak = p.k->v.series_ohm;
    p.rs_low = p.k->v.series_timing_ohm;
    // Timing: the coil settles for ten on-state time constants, then the pin falls.
    p.t_on = settle_time_constants * p.l_h / p.r_cold;
    p.t_off = pin_delay_s + pin_edge_s + p.t_on;
    const double tau_off = p.l_h / (p.r_cold + p.rs_low);
    const double t_end = p.k->current_zero_time_s > 0 ? p.k->current_zero_time_s : 5.0 * tau_off;
    p.t_stop = p.t_off + 1.25 * t_end;
    const double t_res = p.k->release_time_s > 0 ? std::min(p.k->release_time_s, tau_off) : tau_off;
    p.t_max = t_res / steps_per_release;
    return p;
}

struct Writer {
    std::string o;
    void line(const std::string& s) {
        o += s;
        o += '\n';
    }
    void comment(const std::string& s) {
        o += "* " + ascii(s);
        o += '\n';
    }
};

void write_header(Writer& w, const Plan& p) {
    const Spec& spec = *p.spec;
    const Conditions& c = *p.c;
    const Diode& diode = *spec.clamp.diode;
    w.comment(fmt::format("coilfit {} SPICE netlist: {}", COILFIT_VERSION, spec.name.empty() ? "driver" : spec.name));
    w.comment("generated by coilfit size --netlist; run it with: ngspice -b THIS_FILE");
    w.comment("");
    w.comment("Corner: the one that gives the longest release.");
    w.comment(fmt::format("  supply at its highest, {} V", num(c.vs_hi_v)));
    w.comment(fmt::format("  coil cold and low: R = {} ohm x (1 - {}) x (1 + 0.00393/K x ({} - {}) C) = {} ohm,",
                          num(spec.coil.resistance_ohm), num(spec.coil.tolerance), num(c.ta_lo_c),
                          num(spec.coil.reference_temp_c), num(p.r_cold)));
    w.comment(fmt::format("    L = {} H (energised armature)", num(p.l_h)));
    w.comment(p.drv.comments.front());
    w.comment(fmt::format("  transistor {}; clamp {}", display_id(origin(spec.transistor)), clamp_words(spec)));
    w.comment("Two copies of the driver share the supply and the pin and differ only in the clamp models:");
    w.comment("  copy r (nodes *_r) has the clamp at its lowest voltage (timing corner): it gives release_time;");
    w.comment("  copy p (nodes *_p) has the clamp at its highest voltage (peak corner): it gives peak_collector.");
    w.comment("");
    w.comment("Models are generic, written by coilfit from the parts table data; they are NOT vendor models.");
    for (std::size_t i = 1; i < p.drv.comments.size(); ++i) w.comment(p.drv.comments[i]);
    w.comment(fmt::format("  diode {}, peak corner DPEAK: passes through the data's maximum drop {} V at {} A, N = {}",
                          display_id(diode), num(p.vf_peak), num(p.i0), num(p.d_peak.n)));
    w.comment(
        "    (N from the slope of the part's forward-voltage points around that current, else the default for its "
        "kind).");
    w.comment(
        fmt::format("  diode {}, timing corner DLOW: passes through the low drop {} V at the release current {} A,",
                    display_id(diode), num(p.vf_lo), num(p.i_rel)));
    w.comment(fmt::format(
        "    N = {}, no series resistance: its drop stays at or above {} V while the current is above release.",
        num(p.d_low.n), num(p.vf_lo)));
    if (p.z_peak.bv_v > 0) {
        w.comment(fmt::format(
            "  clamp part: a diode in breakdown, BV = {} V at {} A (series {} ohm) for the peak copy (ZPEAK),",
            num(p.z_peak.bv_v), num(p.z_peak.ibv_a), num(p.z_peak.rs_ohm)));
        w.comment(
            fmt::format("    BV = {} V at {} A for the timing copy (ZLOW).", num(p.z_low.bv_v), num(p.z_low.ibv_a)));
    }
    if (spec.clamp.type == ClampType::diode_resistor) {
        w.comment(fmt::format("  clamp resistor {} ohm in the peak copy, {} ohm in the timing copy (its tolerance).",
                              num(p.rs_peak), num(p.rs_low)));
    }
    w.comment("");
    w.comment("The report predicts (ngspice prints the same names; the report should not be below the simulation");
    w.comment(
        "by more than 1 %, and is expected a little above it: it takes constant clamp voltages at their corners):");
    w.comment(fmt::format("  coil_current_on = {} A   (supply / cold coil resistance)", num(p.i0)));
    w.comment(fmt::format("  peak_collector  = {} V", num(p.k->peak_collector_v)));
    if (p.k->release_time_s > 0) {
        w.comment(fmt::format("  release_time    = {} s   (until the coil current falls to {} A)",
                              secs(p.k->release_time_s), num(p.i_rel)));
    }
    w.comment(fmt::format("Pin: high at {} s, low at {} s (the turn-off instant); edges {} s.", secs(pin_delay_s),
                          secs(p.t_off), num(pin_edge_s)));
    w.line("");
}

void write_circuit(Writer& w, const Plan& p) {
    const Spec& spec = *p.spec;
    w.line(fmt::format("vsupply vs 0 dc {}", num(p.c->vs_hi_v)));
    w.line(fmt::format("vpin pin 0 pulse(0 {} {} {} {} {} {})", num(p.drv.drive_v), secs(pin_delay_s), secs(pin_edge_s),
                       secs(pin_edge_s), secs(p.t_on), secs(10.0 * p.t_stop)));
    const std::string held = p.cold_devices ? " temp=27" : "";
    for (const char* copy : {"r", "p"}) {
        const bool peak = copy[0] == 'p';
        w.line("");
        w.comment(peak ? "copy p: clamp at its highest voltage" : "copy r: clamp at its lowest voltage");
        for (const std::string& el : p.drv.elements(copy)) w.line(el);
        w.line(fmt::format("vsense_{0} vs top_{0} dc 0", copy));
        w.line(fmt::format("rcoil_{0} top_{0} mid_{0} {1}", copy, num(p.r_cold)));
        w.line(fmt::format("lcoil_{0} mid_{0} c_{0} {1}", copy, num(p.l_h)));
        const std::string dmodel = std::string(peak ? "dpeak" : "dlow") + held;
        switch (spec.clamp.type) {
            case ClampType::diode:
                w.line(fmt::format("d_{0} c_{0} vs {1}", copy, dmodel));
                break;
            case ClampType::diode_zener:
            case ClampType::diode_tvs:
                w.line(fmt::format("d_{0} c_{0} k_{0} {1}", copy, dmodel));
                w.line(fmt::format("dz_{0} vs k_{0} {1}{2}", copy, peak ? "zpeak" : "zlow", held));
                break;
            case ClampType::diode_resistor:
                w.line(fmt::format("d_{0} c_{0} k_{0} {1}", copy, dmodel));
                w.line(fmt::format("rs_{0} k_{0} vs {1}", copy, num(peak ? p.rs_peak : p.rs_low)));
                break;
            case ClampType::none:
                break;
        }
    }
    w.line("");
}

void write_models_and_analysis(Writer& w, const Plan& p) {
    for (const std::string& m : p.drv.models) w.line(m);
    w.line(fmt::format(".model dpeak d(is={} n={})", num(p.d_peak.is_a), num(p.d_peak.n)));
    w.line(fmt::format(".model dlow d(is={} n={})", num(p.d_low.is_a), num(p.d_low.n)));
    if (p.z_peak.bv_v > 0) {
        w.line(breakdown_model("zpeak", p.z_peak));
        w.line(breakdown_model("zlow", p.z_low));
    }
    w.line("");
    w.comment("Gear integration and a tight relative tolerance for the stiff turn-off.");
    const double temp = p.cold_devices ? p.c->ta_lo_c : netlist::sim_temp_c;
    w.line(fmt::format(".options method=gear reltol=1e-4 temp={} tnom={}", num(temp), num(netlist::sim_temp_c)));
    w.line(fmt::format(".tran {} {} 0 {}", secs(p.t_max), secs(p.t_stop), secs(p.t_max)));
    w.line(fmt::format(".meas tran {} find i(vsense_r) at={}", meas_coil_current, secs(p.t_off)));
    w.line(fmt::format(".meas tran {} max v(c_p) from={} to={}", meas_peak_collector, secs(p.t_off), secs(p.t_stop)));
    w.line(fmt::format(".meas tran {} trig at={} targ i(vsense_r) val={} fall=1", meas_release_time, secs(p.t_off),
                       num(p.i_rel)));
    // An array channel's on-voltage is not negligible (a Vbe and more): measured for the report's Vce(sat).
    if (p.spec->array()) w.line(fmt::format(".meas tran {} find v(c_r) at={}", meas_output_on, secs(p.t_off)));
    w.line(".end");
}

}  // namespace

std::string spice_netlist(const SizingReport& report) { return spice_netlist(report, NetlistOptions{}); }

std::string spice_netlist(const SizingReport& report, const NetlistOptions& options) {
    check_simulable(report);
    const Plan plan = make_plan(report, options);
    Writer w;
    write_header(w, plan);
    write_circuit(w, plan);
    write_models_and_analysis(w, plan);
    return w.o;
}

}  // namespace coilfit::io
