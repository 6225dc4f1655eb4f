// The driver's device models for the netlist (see netlist_devices.hpp): every model parameter is
// written here from the parts table data; the formulas that place them are beside each one.
#include "io/netlist_devices.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

namespace coilfit::io::netlist {
namespace {

// Generic NPN: saturation current and reverse gain.
constexpr double npn_is_a = 1e-14;
constexpr double npn_br = 10.0;
// The collector resistance gives an ohmic drop of this fraction of the data's Vce(sat) maximum.
constexpr double npn_rc_fraction = 0.05;

// A Darlington array channel of the 7- and 8-channel class (from memory, typical of the class;
// the parts record does not give them): 7.2 kOhm from the first base to its emitter, 3 kOhm
// across the output transistor's base-emitter junction, each transistor a gain of about 30 (the
// pair about 900, near the class's guaranteed minimum of about 1000).
constexpr double array_r_be1_ohm = 7.2e3;
constexpr double array_r_be2_ohm = 3.0e3;
constexpr double array_bf = 30.0;
constexpr double array_br = 1.0;

}  // namespace

std::string num(double v) { return fmt::format("{:.6g}", v); }
std::string secs(double v) { return fmt::format("{:.9g}", v); }

std::vector<std::string> DriverNetlist::elements(const std::string& copy) const {
    std::vector<std::string> out;
    for (const auto& t : element_templates) out.push_back(fmt::format(fmt::runtime(t), copy));
    return out;
}

DriverNetlist bipolar_netlist(const SizingReport& report, bool device_temperature) {
    const Spec& spec = report.spec;
    const Sized& sized = report.sized;
    const Conditions& c = sized.conditions;
    const Evaluation& e = sized.worst;
    const BipolarCorner& f = std::get<BipolarFigures>(e.drive).at[0];
    const Bipolar& tr = *spec.bipolar();
    const double i0 = e.coil.at[0].current_max_a;
    DriverNetlist d;
    // Drive at its weakest: pin at its low VDD behind its output resistance, Rb at +tolerance.
    d.drive_v = c.vdd_lo_v;
    const double r_out =
        std::max(std::get<BipolarFigures>(e.drive).pin_r_out_ohm, 1e-3);  // SPICE resistors must not be zero
    const double rb = *sized.r_drive_ohm * c.rb_hi_factor;
    // Generic NPN: forward gain the part's minimum at I0; the saturation voltage kept low.
    // With device_temperature, the 25 °C gain and SPICE's own law BF(T) = BF (T/TNOM)^XTB.
    const double bf = device_temperature ? f.hfe_lookup.value : f.hfe_min;
    const double xtb = tr.hfe_temp_exponent.value_or(1.5);
    const double rc = npn_rc_fraction * f.vce_sat_v / i0;
    // Intrinsic Gummel-Poon saturation voltage at forced gain bf_f:
    // Vce(sat) = Vt ln[(1/alpha_R + bf_f/BR) / (1 - bf_f/BF)], alpha_R = BR/(1+BR) (Ebers-Moll).
    const double forced = f.saturates ? std::min(f.forced_gain_worst, 0.99 * bf) : 0.5 * bf;
    const double vce_model =
        vt_v * std::log(((1.0 + npn_br) / npn_br + forced / npn_br) / (1.0 - forced / bf)) + rc * i0;
    d.comments.push_back(fmt::format(
        "  base drive at its weakest: pin {} V (low VDD) behind {} ohm, base resistor {} ohm at +{} % = {} ohm{}",
        num(c.vdd_lo_v), num(r_out), num(*sized.r_drive_ohm), num(100.0 * (c.rb_hi_factor - 1.0)), num(rb),
        spec.pulldown_ohm ? fmt::format(", pull-down {} ohm", num(*spec.pulldown_ohm)) : std::string()));
    d.comments.push_back(
        fmt::format("  NPN: Gummel-Poon, BF = {} (the part's minimum hFE at {} A), IS = {} A, BR = {}, RC = {} ohm.",
                    num(bf), num(i0), num(npn_is_a), num(npn_br), num(rc)));
    d.comments.push_back(
        fmt::format("    Vce(sat) of the model at this drive is about {:.3g} V ({:.2g} % of the supply); the data's "
                    "maximum is {} V.",
                    vce_model, 100.0 * vce_model / c.vs_hi_v, num(f.vce_sat_v)));
    d.comments.emplace_back(
        "    The report's highest coil current neglects Vce(sat) (it only lowers the current), so the model keeps");
    d.comments.emplace_back(
        "    it low on purpose (a generous BR, and RC giving 5 % of the data's maximum) and the simulated current");
    d.comments.push_back(fmt::format(
        "    checks that figure. For the current at the data's maximum Vce(sat) set RC to about {:.3g} ohm.",
        f.vce_sat_v / i0));
    if (tr.kind == BipolarKind::darlington) {
        d.comments.emplace_back(
            "    The Darlington is modelled as one NPN with the pair's gain; its higher Vce(sat) and Vbe are not.");
    }
    d.element_templates.push_back("rout_{0} pin pin_{0} " + num(r_out));
    d.element_templates.push_back("rb_{0} pin_{0} b_{0} " + num(rb));
    if (spec.pulldown_ohm) d.element_templates.push_back("rbe_{0} b_{0} 0 " + num(*spec.pulldown_ohm));
    d.element_templates.emplace_back("q_{0} c_{0} b_{0} 0 qdrv");
    if (device_temperature) {
        d.comments.push_back(fmt::format(
            "    At the cold corner's {} C: BF is the 25 C gain with XTB = {} and TNOM = 25 C (SPICE's gain law",
            num(sized.conditions.ta_lo_c), num(xtb)));
        d.comments.emplace_back(
            "    BF (T/TNOM)^XTB, the method's exponent); the clamp diodes keep 27 C (instance temp).");
        d.models.push_back(fmt::format(".model qdrv npn(is={} bf={} br={} rc={} xtb={} tnom=25)", num(npn_is_a),
                                       num(bf), num(npn_br), num(rc), num(xtb)));
    } else {
        d.models.push_back(
            fmt::format(".model qdrv npn(is={} bf={} br={} rc={})", num(npn_is_a), num(bf), num(npn_br), num(rc)));
    }
    return d;
}

DriverNetlist mosfet_netlist(const SizingReport& report) {
    const Spec& spec = report.spec;
    const Sized& sized = report.sized;
    const Conditions& c = sized.conditions;
    const Evaluation& e = sized.worst;
    const auto& fig = std::get<MosfetFigures>(e.drive);
    const MosfetCorner& f = fig.at[0];
    const Mosfet& m = *spec.mosfet();
    const double i0 = e.coil.at[0].current_max_a;
    DriverNetlist d;
    d.drive_v = c.vdd_lo_v;
    const double r_out = std::max(fig.pin_r_out_ohm, 1e-3);
    const double rg = *sized.r_drive_ohm * c.rb_hi_factor;
    const double rgs = fig.pulldown_ohm * c.rb_lo_factor;
    // The gate settles at the divider's voltage, the lowest the report allows (Vgs_lo).
    const double vgs = f.vgs_lo_v;
    const double rds = f.rds25_ohm;
    // Level-1 NMOS (Shichman-Hodges): in the linear region Id = KP (W/L) [(Vgs - VTO) Vds - Vds^2/2].
    // VTO at Vgs(th) max, lowered where needed so the overdrive is at least 4 I0 Rds (the switch
    // stays linear); KP so that Vds = I0 Rds at Id = I0: KP = 1 / (Rds (Vov - I0 Rds / 2)), W = L.
    const double vto = std::max(0.1, std::min(m.vgs_th_max_v, vgs - 4.0 * i0 * rds));
    const double vov = std::max(vgs - vto, 1e-3);
    const double kp = 1.0 / (rds * std::max(vov - 0.5 * i0 * rds, 0.25 * vov));
    d.comments.push_back(fmt::format(
        "  gate drive at its weakest: pin {} V (low VDD) behind {} ohm, gate resistor {} ohm at +{} % = {} ohm,",
        num(c.vdd_lo_v), num(r_out), num(*sized.r_drive_ohm), num(100.0 * (c.rb_hi_factor - 1.0)), num(rg)));
    d.comments.push_back(fmt::format("    pull-down {} ohm at -{} % = {} ohm: the gate settles at {} V",
                                     num(fig.pulldown_ohm), num(100.0 * (1.0 - c.rb_lo_factor)), num(rgs), num(vgs)));
    d.comments.push_back(
        fmt::format("  NMOS: level 1, VTO = {} V, KP = {} A/V^2 (W = L): its on-resistance at {} V and {} A is {} ohm,",
                    num(vto), num(kp), num(vgs), num(i0), num(rds)));
    d.comments.push_back(fmt::format(
        "    the Rds(on) maximum the report uses ({} V point of {}); no capacitances, no body diode in the way.",
        num(m.rds_on[static_cast<std::size_t>(std::max(f.rds_point, 0))].vgs_v), display_id(m)));
    d.element_templates.push_back("rout_{0} pin pin_{0} " + num(r_out));
    d.element_templates.push_back("rg_{0} pin_{0} g_{0} " + num(rg));
    d.element_templates.push_back("rgs_{0} g_{0} 0 " + num(rgs));
    d.element_templates.emplace_back("m_{0} c_{0} g_{0} 0 0 nsw l=1u w=1u");
    d.models.push_back(fmt::format(".model nsw nmos(level=1 vto={} kp={} lambda=0)", num(vto), num(kp)));
    return d;
}

namespace {

// The pin's Thevenin resistance, as the core takes it: (VDD_voh - VOH) / IOH, VDD_voh pin.voh_vdd
// or the lowest VDD (src/method.md "Bipolar drivers"); SPICE resistors must not be zero.
double pin_r_out(const Spec& spec) {
    if (spec.pin.voh_v && spec.pin.voh_current_a && *spec.pin.voh_current_a > 0) {
        const double vdd_voh = spec.pin.voh_vdd_v.value_or(spec.pin.vdd_v * (1.0 - spec.pin.vdd_tolerance));
        return std::max(1e-3, (vdd_voh - *spec.pin.voh_v) / *spec.pin.voh_current_a);
    }
    return 1e-3;
}

}  // namespace

DriverNetlist array_netlist(const SizingReport& report) {
    const Spec& spec = report.spec;
    const Conditions& c = report.sized.conditions;
    const Evaluation& e = report.sized.worst;
    const ArrayPart& a = *spec.array();
    const ArrayCorner& f = std::get<ArrayFigures>(e.drive).at[0];
    const double i0 = e.coil.at[0].current_max_a;
    DriverNetlist d;
    // Drive at its weakest: the pin at its low VDD behind its output resistance, the built-in
    // input resistor at its high tolerance (default 20 %, src/method.md "Transistor-array channel").
    d.drive_v = c.vdd_lo_v;
    const double r_out = pin_r_out(spec);
    const double t_in = a.input_resistor_tolerance.value_or(defaults::array_input_tolerance);
    const double r_in = a.input_resistor_ohm * (1.0 + t_in);
    d.comments.push_back(
        fmt::format("  input drive at its weakest: pin {} V (low VDD) behind {} ohm, the array's input resistor {} ohm "
                    "at +{} % = {} ohm",
                    num(c.vdd_lo_v), num(r_out), num(a.input_resistor_ohm), num(100.0 * t_in), num(r_in)));
    d.element_templates.push_back("rout_{0} pin pin_{0} " + num(r_out));
    d.element_templates.push_back("rin_{0} pin_{0} b_{0} " + num(r_in));
    if (a.structure == ArrayStructure::darlington) {
        d.comments.push_back(fmt::format(
            "  array channel {}: a Darlington pair, each NPN Gummel-Poon IS = {} A, BF = {}, BR = {}; {} ohm from the",
            display_id(a), num(npn_is_a), num(array_bf), num(array_br), num(array_r_be1_ohm)));
        d.comments.push_back(fmt::format(
            "    first base to its emitter and {} ohm across the output transistor's base-emitter (typical of the",
            num(array_r_be2_ohm)));
        d.comments.emplace_back(
            "    class, from memory). Its on-voltage is a Vbe plus the first transistor's Vce(sat): it must stay at "
            "or");
        d.comments.push_back(fmt::format(
            "    below the data's maximum Vce(sat) {} V at {} A, which the report takes off the coil's voltage.",
            num(f.vce_sat.value), num(i0)));
        d.element_templates.push_back("rbe1_{0} b_{0} e1_{0} " + num(array_r_be1_ohm));
        d.element_templates.emplace_back("q1_{0} c_{0} b_{0} e1_{0} qarr");
        d.element_templates.push_back("rbe2_{0} e1_{0} 0 " + num(array_r_be2_ohm));
        d.element_templates.emplace_back("q2_{0} c_{0} e1_{0} 0 qarr");
        d.models.push_back(
            fmt::format(".model qarr npn(is={} bf={} br={})", num(npn_is_a), num(array_bf), num(array_br)));
        return d;
    }
    // The MOSFET class: the gate behind the input resistor (no gate current in a DC model), a
    // level-1 NMOS whose on-resistance at the pin's low VDD is the data's Vce(sat) max / I0, placed
    // as in mosfet_netlist(): VTO at most 1 V below the gate and low enough that the switch stays
    // linear (overdrive at least 4 I0 Rds), KP = 1 / (Rds (Vov - I0 Rds / 2)), W = L.
    const double rds = f.vce_sat.value / i0;
    const double vgs = c.vdd_lo_v;
    const double vto = std::max(0.1, std::min(vgs - 1.0, vgs - 4.0 * i0 * rds));
    const double vov = std::max(vgs - vto, 1e-3);
    const double kp = 1.0 / (rds * std::max(vov - 0.5 * i0 * rds, 0.25 * vov));
    d.comments.push_back(fmt::format(
        "  array channel {}: a level-1 NMOS, VTO = {} V, KP = {} A/V^2 (W = L): {} ohm on at {} V and {} A,",
        display_id(a), num(vto), num(kp), num(rds), num(vgs), num(i0)));
    d.comments.push_back(
        fmt::format("    the data's maximum on-voltage {} V at that current; no capacitances.", num(f.vce_sat.value)));
    d.element_templates.emplace_back("m_{0} c_{0} b_{0} 0 0 narr l=1u w=1u");
    d.models.push_back(fmt::format(".model narr nmos(level=1 vto={} kp={} lambda=0)", num(vto), num(kp)));
    return d;
}

}  // namespace coilfit::io::netlist
