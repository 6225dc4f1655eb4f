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

namespace coilfit::io {
namespace {

// The simulation runs at 27 °C, the SPICE default for TEMP and TNOM; the thermal voltage kT/q
// there places the diode models (k/q = 8.617333262e-5 V/K, CODATA 2018).
constexpr double sim_temp_c = 27.0;
constexpr double vt_v = 8.617333262e-5 * (sim_temp_c + 273.15);

// Emission coefficient N when the part's table gives no slope at the operating point: about 2
// for a silicon pn diode at forward currents of milliamperes to amperes, about 1.1 for a
// Schottky barrier (common practice, from memory).
double default_emission(DiodeKind kind) { return kind == DiodeKind::schottky ? 1.1 : 2.0; }

// Generic NPN: saturation current and reverse gain (see the header comment of the netlist).
constexpr double npn_is_a = 1e-14;
constexpr double npn_br = 10.0;
// The collector resistance gives an ohmic drop of this fraction of the data's Vce(sat) maximum.
constexpr double npn_rc_fraction = 0.05;

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

std::string num(double v) { return fmt::format("{:.6g}", v); }
std::string secs(double v) { return fmt::format("{:.9g}", v); }

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
    case ClampType::diode_zener:
        return fmt::format("diode {} + zener {} ({} V +/- {} %)", c.diode->id, c.zener->id, num(c.zener->vz_v),
                           num(100.0 * c.zener->tolerance));
    case ClampType::diode_resistor:
        return fmt::format("diode {} + resistor {} ohm", c.diode->id, num(c.resistor_ohm.value_or(0)));
    case ClampType::none: return "none";
    }
    return "none";
}

}  // namespace

std::string spice_netlist(const Spec& spec, const Sized& sized) {
    if (!spec.coil.inductance_h || !(*spec.coil.inductance_h > 0)) {
        throw InputError("--netlist: the simulation needs the coil inductance; give coil.inductance (measure the coil "
                         "with an LCR meter with the armature held in its energised position, or ask the maker)");
    }
    if (spec.clamp.type == ClampType::none || !spec.clamp.diode) {
        throw InputError("--netlist: the design has no clamp, so the collector voltage is limited only by breakdown and "
                         "there is no release to simulate; choose clamp.type diode, diode_zener or diode_resistor");
    }
    if (!sized.rb_ohm) {
        throw InputError("--netlist: no base resistor could be chosen, so there is no circuit to simulate; "
                         "give base_resistor.value to simulate a resistor of your choice");
    }
    const Conditions& c = sized.conditions;
    const Evaluation& e = sized.worst;
    const Diode& diode = *spec.clamp.diode;
    const Bipolar& tr = spec.transistor;
    const double l_h = *spec.coil.inductance_h;
    const double r_cold = e.r_coil_cold_ohm;
    const double i0 = e.coil_current_max_a;
    const double i_rel = e.release_current_a;
    const double rs = e.clamp.series_ohm;

    // Drive at its weakest: pin at its low VDD behind its output resistance, Rb at +tolerance.
    const double vdd = c.vdd_lo_v;
    const double r_out = std::max(e.pin_r_out_ohm, 1e-3);  // SPICE resistors must not be zero
    const double rb = *sized.rb_ohm * c.rb_hi_factor;

    // Diode models. Peak corner: through the report's maximum drop at I0. Timing corner: through
    // the low drop vf_low at the release current, no series resistance, so the drop is at least
    // vf_low while the current is above the release current, and as close to it as the junction allows.
    const double vf_peak = vf_max_at(diode, i0).value;
    const DiodeModel d_peak = diode_through(i0, vf_peak, table_emission(diode, i0));
    const double vf_lo = vf_low(diode);
    const DiodeModel d_low = diode_through(i_rel, vf_lo, default_emission(diode.kind));

    // Generic NPN: forward gain the part's minimum at I0; the saturation voltage kept low.
    const double bf = e.hfe_min;
    const double rc = npn_rc_fraction * e.vce_sat_v / i0;
    // Intrinsic Gummel-Poon saturation voltage at forced gain bf_f:
    // Vce(sat) = Vt ln[(1/alpha_R + bf_f/BR) / (1 - bf_f/BF)], alpha_R = BR/(1+BR) (Ebers-Moll).
    const double forced = e.saturates ? std::min(e.forced_gain_worst, 0.99 * bf) : 0.5 * bf;
    const double vce_model =
        vt_v * std::log(((1.0 + npn_br) / npn_br + forced / npn_br) / (1.0 - forced / bf)) + rc * i0;

    // Timing: the coil settles for ten on-state time constants, then the pin falls.
    const double tau_on = l_h / r_cold;
    const double t_on = settle_time_constants * tau_on;
    const double t_off = pin_delay_s + pin_edge_s + t_on;
    const double tau_off = l_h / (r_cold + rs);
    const double t_end = e.current_zero_time_s > 0 ? e.current_zero_time_s : 5.0 * tau_off;
    const double t_stop = t_off + 1.25 * t_end;
    const double t_res = e.release_time_s > 0 ? std::min(e.release_time_s, tau_off) : tau_off;
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
    comment(fmt::format("  base drive at its weakest: pin {} V (low VDD) behind {} ohm, base resistor {} ohm at +{} % = {} ohm{}",
                        num(vdd), num(e.pin_r_out_ohm), num(*sized.rb_ohm), num(100.0 * (c.rb_hi_factor - 1.0)), num(rb),
                        spec.pulldown_ohm ? fmt::format(", pull-down {} ohm", num(*spec.pulldown_ohm)) : std::string()));
    comment(fmt::format("  transistor {}; clamp {}", tr.id, clamp_words(spec)));
    comment("Two copies of the driver share the supply and the pin and differ only in the clamp models:");
    comment("  copy r (nodes *_r) has the clamp at its lowest voltage (timing corner): it gives release_time;");
    comment("  copy p (nodes *_p) has the clamp at its highest voltage (peak corner): it gives peak_collector.");
    comment("");
    comment("Models are generic, written by coilfit from the parts table data; they are NOT vendor models.");
    comment(fmt::format("  NPN: Gummel-Poon, BF = {} (the part's minimum hFE at {} A), IS = {} A, BR = {}, RC = {} ohm.", num(bf),
                        num(i0), num(npn_is_a), num(npn_br), num(rc)));
    comment(fmt::format("    Vce(sat) of the model at this drive is about {:.3g} V ({:.2g} % of the supply); the data's maximum is {} V.",
                        vce_model, 100.0 * vce_model / c.vs_hi_v, num(e.vce_sat_v)));
    comment("    The report's highest coil current neglects Vce(sat) (it only lowers the current), so the model keeps");
    comment("    it low on purpose (a generous BR, and RC giving 5 % of the data's maximum) and the simulated current");
    comment(fmt::format("    checks that figure. For the current at the data's maximum Vce(sat) set RC to about {:.3g} ohm.",
                        e.vce_sat_v / i0));
    if (tr.kind == BipolarKind::darlington) {
        comment("    The Darlington is modelled as one NPN with the pair's gain; its higher Vce(sat) and Vbe are not.");
    }
    comment(fmt::format("  diode {}, peak corner DPEAK: passes through the data's maximum drop {} V at {} A, N = {}", diode.id,
                        num(vf_peak), num(i0), num(d_peak.n)));
    comment("    (N from the slope of the part's forward-voltage points around that current, else the default for its kind).");
    comment(fmt::format("  diode {}, timing corner DLOW: passes through the low drop {} V at the release current {} A,", diode.id,
                        num(vf_lo), num(i_rel)));
    comment(fmt::format("    N = {}, no series resistance: its drop stays at or above {} V while the current is above release.",
                        num(d_low.n), num(vf_lo)));
    if (spec.clamp.type == ClampType::diode_zener) {
        comment(fmt::format("  zener {}: a diode with breakdown BV = {} V (top tolerance) at {} A for the peak copy (ZPEAK),",
                            spec.clamp.zener->id, num(c.vz_hi_v), num(i0)));
        comment(fmt::format("    BV = {} V (bottom tolerance) at the release current {} A for the timing copy (ZLOW).", num(c.vz_lo_v),
                            num(i_rel)));
    }
    comment("");
    comment("The report predicts (ngspice prints the same names; the report should not be below the simulation");
    comment("by more than 1 %, and is expected a little above it: it takes constant clamp voltages at their corners):");
    comment(fmt::format("  coil_current_on = {} A   (supply / cold coil resistance)", num(i0)));
    comment(fmt::format("  peak_collector  = {} V", num(e.peak_collector_voltage_v)));
    if (e.release_time_s > 0) comment(fmt::format("  release_time    = {} s   (until the coil current falls to {} A)", secs(e.release_time_s), num(i_rel)));
    comment(fmt::format("Pin: high at {} s, low at {} s (the turn-off instant); edges {} s.", secs(pin_delay_s), secs(t_off), num(pin_edge_s)));
    line("");

    line(fmt::format("vsupply vs 0 dc {}", num(c.vs_hi_v)));
    line(fmt::format("vpin pin 0 pulse(0 {} {} {} {} {} {})", num(vdd), secs(pin_delay_s), secs(pin_edge_s), secs(pin_edge_s),
                     secs(t_on), secs(10.0 * t_stop)));
    for (const char* copy : {"r", "p"}) {
        const bool peak = copy[0] == 'p';
        line("");
        comment(peak ? "copy p: clamp at its highest voltage" : "copy r: clamp at its lowest voltage");
        line(fmt::format("rout_{0} pin pin_{0} {1}", copy, num(r_out)));
        line(fmt::format("rb_{0} pin_{0} b_{0} {1}", copy, num(rb)));
        if (spec.pulldown_ohm) line(fmt::format("rbe_{0} b_{0} 0 {1}", copy, num(*spec.pulldown_ohm)));
        line(fmt::format("q_{0} c_{0} b_{0} 0 qdrv", copy));
        line(fmt::format("vsense_{0} vs top_{0} dc 0", copy));
        line(fmt::format("rcoil_{0} top_{0} mid_{0} {1}", copy, num(r_cold)));
        line(fmt::format("lcoil_{0} mid_{0} c_{0} {1}", copy, num(l_h)));
        const char* dmodel = peak ? "dpeak" : "dlow";
        switch (spec.clamp.type) {
        case ClampType::diode: line(fmt::format("d_{0} c_{0} vs {1}", copy, dmodel)); break;
        case ClampType::diode_zener:
            line(fmt::format("d_{0} c_{0} k_{0} {1}", copy, dmodel));
            line(fmt::format("dz_{0} vs k_{0} {1}", copy, peak ? "zpeak" : "zlow"));
            break;
        case ClampType::diode_resistor:
            line(fmt::format("d_{0} c_{0} k_{0} {1}", copy, dmodel));
            line(fmt::format("rs_{0} k_{0} vs {1}", copy, num(rs)));
            break;
        case ClampType::none: break;
        }
    }
    line("");
    line(fmt::format(".model qdrv npn(is={} bf={} br={} rc={})", num(npn_is_a), num(bf), num(npn_br), num(rc)));
    line(fmt::format(".model dpeak d(is={} n={})", num(d_peak.is_a), num(d_peak.n)));
    line(fmt::format(".model dlow d(is={} n={})", num(d_low.is_a), num(d_low.n)));
    if (spec.clamp.type == ClampType::diode_zener) {
        line(fmt::format(".model zpeak d(is=1e-14 n=1 bv={} ibv={})", num(c.vz_hi_v), num(i0)));
        line(fmt::format(".model zlow d(is=1e-14 n=1 bv={} ibv={})", num(c.vz_lo_v), num(i_rel)));
    }
    line("");
    comment("Gear integration and a tight relative tolerance for the stiff turn-off.");
    line(fmt::format(".options method=gear reltol=1e-4 temp={} tnom={}", num(sim_temp_c), num(sim_temp_c)));
    line(fmt::format(".tran {} {} 0 {}", secs(t_max), secs(t_stop), secs(t_max)));
    line(fmt::format(".meas tran {} find i(vsense_r) at={}", meas_coil_current, secs(t_off)));
    line(fmt::format(".meas tran {} max v(c_p) from={} to={}", meas_peak_collector, secs(t_off), secs(t_stop)));
    line(fmt::format(".meas tran {} trig at={} targ i(vsense_r) val={} fall=1", meas_release_time, secs(t_off), num(i_rel)));
    line(".end");
    return o;
}

}  // namespace coilfit::io
