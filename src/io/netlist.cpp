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
    case ClampType::diode: return "diode " + c.diode->id;
    case ClampType::diode_tvs:
        return fmt::format("diode {} + TVS {} (breakdown {} V to {} V)", c.diode->id, c.tvs->id, num(c.tvs->vbr_min_v),
                           num(c.tvs->vbr_max_v));
    case ClampType::diode_zener:
        return fmt::format("diode {} + zener {} ({} V +/- {} %)", c.diode->id, c.zener->id, num(c.zener->vz_v),
                           num(100.0 * c.zener->tolerance));
    case ClampType::diode_resistor:
        return fmt::format("diode {} + resistor {} ohm", c.diode->id, num(c.resistor_ohm.value_or(0)));
    case ClampType::none: return "none";
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
        throw InputError("--netlist: the simulation needs the coil inductance; give coil.inductance (measure the coil "
                         "with an LCR meter with the armature held in its energised position, or ask the maker)");
    }
    if (spec.clamp.type == ClampType::none || !spec.clamp.diode) {
        throw InputError("--netlist: the design has no clamp, so the collector voltage is limited only by breakdown and "
                         "there is no release to simulate; choose clamp.type diode, diode_zener, diode_tvs or diode_resistor");
    }
    if (spec.array()) {
        throw InputError("--netlist: an array channel is not simulated yet; size the same coil with a discrete transistor "
                         "to check the clamp and the release in a simulator");
    }
    if (!report.sized.r_drive_ohm) {
        throw InputError("--netlist: no " + std::string(report.resistor.kind) + " could be chosen, so there is no circuit to "
                         "simulate; give " + (spec.mosfet() ? "gate_resistor.value" : "base_resistor.value") +
                         " to simulate a resistor of your choice");
    }
}

}  // namespace

std::string spice_netlist(const SizingReport& report) { return spice_netlist(report, NetlistOptions{}); }

std::string spice_netlist(const SizingReport& report, const NetlistOptions& options) {
    check_simulable(report);
    const bool cold_devices = options.device_temperature && report.spec.bipolar();
    const Spec& spec = report.spec;
    const Sized& sized = report.sized;
    const Conditions& c = sized.conditions;
    const Evaluation& e = sized.worst;
    const ClampCorner& k = e.clamp.at[0];  // the cold corner: the longest release, the highest peak
    const Diode& diode = *spec.clamp.diode;
    const double l_h = *spec.coil.inductance_h;
    const double r_cold = e.coil.at[0].r_cold_ohm;
    const double i0 = e.coil.at[0].current_max_a;
    const double i_rel = e.coil.release_current_a;
    const netlist::DriverNetlist drv = spec.mosfet() ? netlist::mosfet_netlist(report) : netlist::bipolar_netlist(report, cold_devices);

    // Diode models. Peak corner: through the report's maximum drop at I0. Timing corner: through
    // the low drop vf_low at the release current, no series resistance, so the drop is at least
    // vf_low while the current is above the release current, and as close to it as the junction allows.
    const double vf_peak = vf_max_at(diode, i0).value;
    const DiodeModel d_peak = diode_through(i0, vf_peak, table_emission(diode, i0));
    const double vf_lo = vf_low(diode);
    const DiodeModel d_low = diode_through(i_rel, vf_lo, default_emission(diode.kind));
    // The clamp's breakdown part: the zener at the top (peak copy) and bottom (timing copy) of its
    // band at I0 and at the release current; a TVS from Vbr max to Vc at Ipp (peak) and at Vbr min.
    BreakdownModel z_peak, z_low;
    if (spec.clamp.type == ClampType::diode_zener) {
        const Zener& z = *spec.clamp.zener;
        if (z.zzt_ohm && z.izt_a && *z.zzt_ohm > 0) {
            // A zener with its dynamic impedance as series resistance: V(Izt) is the band's top
            // (peak copy) or bottom (timing copy), V(I) = that + Zzt (I - Izt) either side.
            z_peak = {c.vz_hi_v - *z.zzt_ohm * *z.izt_a, *z.izt_a, *z.zzt_ohm};
            z_low = {c.vz_lo_v - *z.zzt_ohm * *z.izt_a, *z.izt_a, *z.zzt_ohm};
        } else {
            z_peak = {k.v.part_peak_v, i0, 0};
            z_low = {k.v.timing_v - vf_lo, i_rel, 0};
        }
    } else if (spec.clamp.type == ClampType::diode_tvs) {
        const Tvs& t = *spec.clamp.tvs;
        z_peak = {t.vbr_max_v, 1e-3, t.ipp_a > 1e-3 ? (t.vc_v - t.vbr_max_v) / (t.ipp_a - 1e-3) : 0.0};
        z_low = {t.vbr_min_v, std::min(1e-3, i_rel), 0};
    }
    const double rs_peak = k.v.series_ohm;
    const double rs_low = k.v.series_timing_ohm;

    // Timing: the coil settles for ten on-state time constants, then the pin falls.
    const double tau_on = l_h / r_cold;
    const double t_on = settle_time_constants * tau_on;
    const double t_off = pin_delay_s + pin_edge_s + t_on;
    const double tau_off = l_h / (r_cold + rs_low);
    const double t_end = k.current_zero_time_s > 0 ? k.current_zero_time_s : 5.0 * tau_off;
    const double t_stop = t_off + 1.25 * t_end;
    const double t_res = k.release_time_s > 0 ? std::min(k.release_time_s, tau_off) : tau_off;
    const double t_max = t_res / steps_per_release;

    std::string o;
    auto line = [&o](const std::string& s) {
        o += s;
        o += '\n';
    };
    auto comment = [&o](const std::string& s) {
        o += "* " + ascii(s);
        o += '\n';
    };

    comment(fmt::format("coilfit {} SPICE netlist: {}", COILFIT_VERSION, spec.name.empty() ? "driver" : spec.name));
    comment("generated by coilfit size --netlist; run it with: ngspice -b THIS_FILE");
    comment("");
    comment("Corner: the one that gives the longest release.");
    comment(fmt::format("  supply at its highest, {} V", num(c.vs_hi_v)));
    comment(fmt::format("  coil cold and low: R = {} ohm x (1 - {}) x (1 + 0.00393/K x ({} - {}) C) = {} ohm,", num(spec.coil.resistance_ohm),
                        num(spec.coil.tolerance), num(c.ta_lo_c), num(spec.coil.reference_temp_c), num(r_cold)));
    comment(fmt::format("    L = {} H (energised armature)", num(l_h)));
    comment(drv.comments.front());
    comment(fmt::format("  transistor {}; clamp {}", origin(spec.transistor).id, clamp_words(spec)));
    comment("Two copies of the driver share the supply and the pin and differ only in the clamp models:");
    comment("  copy r (nodes *_r) has the clamp at its lowest voltage (timing corner): it gives release_time;");
    comment("  copy p (nodes *_p) has the clamp at its highest voltage (peak corner): it gives peak_collector.");
    comment("");
    comment("Models are generic, written by coilfit from the parts table data; they are NOT vendor models.");
    for (std::size_t i = 1; i < drv.comments.size(); ++i) comment(drv.comments[i]);
    comment(fmt::format("  diode {}, peak corner DPEAK: passes through the data's maximum drop {} V at {} A, N = {}", diode.id,
                        num(vf_peak), num(i0), num(d_peak.n)));
    comment("    (N from the slope of the part's forward-voltage points around that current, else the default for its kind).");
    comment(fmt::format("  diode {}, timing corner DLOW: passes through the low drop {} V at the release current {} A,", diode.id,
                        num(vf_lo), num(i_rel)));
    comment(fmt::format("    N = {}, no series resistance: its drop stays at or above {} V while the current is above release.",
                        num(d_low.n), num(vf_lo)));
    if (z_peak.bv_v > 0) {
        comment(fmt::format("  clamp part: a diode in breakdown, BV = {} V at {} A (series {} ohm) for the peak copy (ZPEAK),",
                            num(z_peak.bv_v), num(z_peak.ibv_a), num(z_peak.rs_ohm)));
        comment(fmt::format("    BV = {} V at {} A for the timing copy (ZLOW).", num(z_low.bv_v), num(z_low.ibv_a)));
    }
    if (spec.clamp.type == ClampType::diode_resistor) {
        comment(fmt::format("  clamp resistor {} ohm in the peak copy, {} ohm in the timing copy (its tolerance).", num(rs_peak), num(rs_low)));
    }
    comment("");
    comment("The report predicts (ngspice prints the same names; the report should not be below the simulation");
    comment("by more than 1 %, and is expected a little above it: it takes constant clamp voltages at their corners):");
    comment(fmt::format("  coil_current_on = {} A   (supply / cold coil resistance)", num(i0)));
    comment(fmt::format("  peak_collector  = {} V", num(k.peak_collector_v)));
    if (k.release_time_s > 0) comment(fmt::format("  release_time    = {} s   (until the coil current falls to {} A)", secs(k.release_time_s), num(i_rel)));
    comment(fmt::format("Pin: high at {} s, low at {} s (the turn-off instant); edges {} s.", secs(pin_delay_s), secs(t_off), num(pin_edge_s)));
    line("");

    line(fmt::format("vsupply vs 0 dc {}", num(c.vs_hi_v)));
    line(fmt::format("vpin pin 0 pulse(0 {} {} {} {} {} {})", num(drv.drive_v), secs(pin_delay_s), secs(pin_edge_s), secs(pin_edge_s),
                     secs(t_on), secs(10.0 * t_stop)));
    for (const char* copy : {"r", "p"}) {
        const bool peak = copy[0] == 'p';
        line("");
        comment(peak ? "copy p: clamp at its highest voltage" : "copy r: clamp at its lowest voltage");
        for (const std::string& el : drv.elements(copy)) line(el);
        line(fmt::format("vsense_{0} vs top_{0} dc 0", copy));
        line(fmt::format("rcoil_{0} top_{0} mid_{0} {1}", copy, num(r_cold)));
        line(fmt::format("lcoil_{0} mid_{0} c_{0} {1}", copy, num(l_h)));
        const std::string dmodel = std::string(peak ? "dpeak" : "dlow") + (cold_devices ? " temp=27" : "");
        switch (spec.clamp.type) {
        case ClampType::diode: line(fmt::format("d_{0} c_{0} vs {1}", copy, dmodel)); break;
        case ClampType::diode_zener:
        case ClampType::diode_tvs:
            line(fmt::format("d_{0} c_{0} k_{0} {1}", copy, dmodel));
            line(fmt::format("dz_{0} vs k_{0} {1}{2}", copy, peak ? "zpeak" : "zlow", cold_devices ? " temp=27" : ""));
            break;
        case ClampType::diode_resistor:
            line(fmt::format("d_{0} c_{0} k_{0} {1}", copy, dmodel));
            line(fmt::format("rs_{0} k_{0} vs {1}", copy, num(peak ? rs_peak : rs_low)));
            break;
        case ClampType::none: break;
        }
    }
    line("");
    for (const std::string& m : drv.models) line(m);
    line(fmt::format(".model dpeak d(is={} n={})", num(d_peak.is_a), num(d_peak.n)));
    line(fmt::format(".model dlow d(is={} n={})", num(d_low.is_a), num(d_low.n)));
    if (z_peak.bv_v > 0) {
        line(breakdown_model("zpeak", z_peak));
        line(breakdown_model("zlow", z_low));
    }
    line("");
    comment("Gear integration and a tight relative tolerance for the stiff turn-off.");
    const double temp = cold_devices ? c.ta_lo_c : netlist::sim_temp_c;
    line(fmt::format(".options method=gear reltol=1e-4 temp={} tnom={}", num(temp), num(netlist::sim_temp_c)));
    line(fmt::format(".tran {} {} 0 {}", secs(t_max), secs(t_stop), secs(t_max)));
    line(fmt::format(".meas tran {} find i(vsense_r) at={}", meas_coil_current, secs(t_off)));
    line(fmt::format(".meas tran {} max v(c_p) from={} to={}", meas_peak_collector, secs(t_off), secs(t_stop)));
    line(fmt::format(".meas tran {} trig at={} targ i(vsense_r) val={} fall=1", meas_release_time, secs(t_off), num(i_rel)));
    line(".end");
    return o;
}

}  // namespace coilfit::io
