// The report's notes (defaults used, points outside a part's data, advice) and cautions.
#include <algorithm>
#include <cmath>

#include "report_parts.hpp"

namespace coilfit::report {
namespace {

std::string q(double value, Unit unit) { return format_quantity(value, unit); }
std::string n(double value) { return format_quantity(value, Unit::number); }

// Extra-low voltage limits: 50 V AC, 120 V ripple-free DC (IEC 61140 / IEC 60364 ELV bands).
constexpr double elv_ac_v = 50.0;
constexpr double elv_dc_v = 120.0;
// The top of low voltage: 1000 V AC, 1500 V DC (IEC 61140 bands).
constexpr double lv_ac_v = 1000.0;
constexpr double lv_dc_v = 1500.0;

void bipolar_notes(std::vector<std::string>& notes, const Spec& spec, const Sized& sized, const BipolarFigures& f) {
    const Bipolar& tr = *spec.bipolar();
    const BipolarCorner& k = f.at[static_cast<std::size_t>(sized.worst.check(CheckId::transistor_saturation).corner)];
    const std::string at = " at " + q(k.current_a, Unit::ampere);
    // When the forced-gain policy sets the base current, more gain does not help: no hFE advice.
    if (!k.policy_binds) {
        notes.push_back("a transistor on this pin needs hFE min of at least " + n(k.hfe_needed) + at + " (overdrive " +
                        n(spec.policy.overdrive) + " x coil current / pin limit " +
                        q(spec.pin.max_current_a, Unit::ampere) + ")");
    }
    if (!spec.policy.forced_gain && tr.kind == BipolarKind::darlington) {
        notes.push_back("forced gain taken from the Darlington's Vce(sat) test ratio, " + n(k.forced_gain_policy) +
                        ", instead of 10");
    }
    const std::string id = display_id(tr);
    // The direction rule (src/method.md "Data limits"): below its points Vce(sat) and Vbe(sat)
    // are on their safe side; beyond them, and hFE on either side, the checks using them warn.
    if (k.hfe_lookup.side != Side::within) {
        notes.push_back("the operating point" + at + " lies beyond " + id +
                        "'s hFE points; the nearest point was used, "
                        "but gain falls off beyond the data: transistor.saturation warns (beyond the part's data)");
    }
    if (k.vce_lookup.side == Side::below && k.vce_lookup.outside) {
        notes.push_back("the operating point" + at + " lies below " + id +
                        "'s Vce(sat) points; the nearest point was used (the safe side)");
    } else if (k.vce_lookup.side == Side::above) {
        notes.push_back("the operating point" + at + " lies above " + id +
                        "'s Vce(sat) points; the nearest point was used: "
                        "coil.operate and transistor.thermal warn (beyond the part's data)");
    }
    if (k.vbe_lookup.side == Side::below && k.vbe_lookup.outside) {
        notes.push_back("the operating point" + at + " lies below " + id +
                        "'s Vbe(sat) points; the nearest point was used (the safe side)");
    } else if (k.vbe_lookup.side == Side::above) {
        notes.push_back("the operating point" + at + " lies above " + id +
                        "'s Vbe(sat) points; the nearest point was used: "
                        "transistor.saturation warns (beyond the part's data)");
    }
    if (k.vce_sat_not_guaranteed) {
        notes.push_back("Vce(sat) is specified at Ic/Ib = " + n(k.vce_sat_test_ratio) + "; the drive target " +
                        n(k.beta_target) +
                        " is looser, so the coil voltage figure is not guaranteed; set policy.forced_gain to " +
                        n(k.vce_sat_test_ratio) + " for a guaranteed Vce(sat)");
    }
    // The 25 °C data corrected at the corners (src/method.md "Bipolar drivers", Temperature).
    const BipolarCorner& cold = f.at[0];
    if (cold.hfe_min < cold.hfe_lookup.value * (1.0 - 1e-12)) {
        notes.push_back("at the cold corner (" + q(sized.conditions.ta_lo_c, Unit::celsius) +
                        ") the 25 °C data are corrected: hFE min x " + n(cold.hfe_min / cold.hfe_lookup.value) +
                        " (exponent " + n(tr.hfe_temp_exponent.value_or(1.5)) +
                        (tr.hfe_temp_exponent ? ", the part's" : ", the default; the part may give hfe_temp_exponent") +
                        "), Vbe(sat) + " + q(cold.vbe_sat_v - cold.vbe_lookup.value, Unit::volt) + " (2 mV/K)");
    }
    const BipolarCorner& hot = f.at[1];
    if (hot.vbe_low_v < spec.policy.vbe_low_v * (1.0 - 1e-12)) {
        notes.push_back("at the hot corner (" + q(sized.conditions.ta_hi_c, Unit::celsius) + ") Vbe low falls to " +
                        q(hot.vbe_low_v, Unit::volt) + " (2 mV/K above 25 °C), which raises the pin current");
    }
    if (!spec.pulldown_ohm) {
        const double rb = sized.r_drive_ohm.value_or(10e3);
        const double suggested = eseries_nearest(std::clamp(10.0 * rb, 10e3, 100e3), ESeries::e12).value_or(47e3);
        notes.push_back(
            "no base-emitter pull-down: while the pin floats during reset the transistor may conduct; fit about " +
            q(suggested, Unit::ohm) +
            " from base to emitter and give it as pulldown (it takes Vbe/Rbe from the base drive)");
    }
    if (!sized.r_drive_ohm) {
        notes.push_back("no value of the " + std::string(eseries_name(spec.base_resistor.series)) +
                        " series is at most the largest base resistor that saturates (" +
                        q(f.window_max_ohm, Unit::ohm) + ")");
    } else if (!sized.resistor_fixed && *sized.r_drive_ohm < f.window_min_ohm) {
        notes.push_back("no base resistor works: the transistor needs at most " + q(f.window_max_ohm, Unit::ohm) +
                        " but the pin needs at least " + q(f.window_min_ohm, Unit::ohm));
    }
}

void mosfet_notes(std::vector<std::string>& notes, const Spec& spec, const MosfetFigures& f) {
    const Mosfet& m = *spec.mosfet();
    notes.push_back("the 25 °C data are corrected at the corners: the gate threshold rises " +
                    q(m.vgs_th_tempco_v_per_k.value_or(defaults::vgs_th_tempco_v_per_k), Unit::volt) +
                    "/K below 25 °C" + (m.vgs_th_tempco_v_per_k ? "" : " (default, from memory)") + ", Rds(on) rises " +
                    q(m.rds_on_tempco_per_k.value_or(defaults::rds_on_tempco_per_k), Unit::ratio) +
                    "/K with the junction" + (m.rds_on_tempco_per_k ? "" : " (default, from memory)"));
    if (!spec.pulldown_ohm) {
        notes.push_back(
            "gate pull-down taken as " + q(f.pulldown_ohm, Unit::ohm) +
            " (default): it holds the gate low while the pin floats during reset; give pulldown to change it");
    }
    if (f.gate_time_s && *f.gate_time_s > defaults::slow_gate_s) {
        notes.push_back(
            "the gate takes about " + q(*f.gate_time_s, Unit::second) +
            " to pass its plateau: slow edges heat the part at high switching rates; a smaller gate resistor "
            "or a pin with more current shortens them");
    } else if (!f.gate_time_s) {
        notes.push_back("the pin's lowest VDD does not pass the gate's plateau (about " + q(f.vplateau_v, Unit::volt) +
                        "): the gate switching time is not estimated");
    }
    const auto& a = f.at;
    if (a[0].rds_beyond || a[1].rds_beyond) {
        notes.push_back("the coil current is above the test current of " + display_id(m) +
                        "'s Rds(on) point; Rds(on) rises with current beyond it");
    }
}

}  // namespace

std::vector<std::string> notes(const Spec& spec, const Sized& sized) {
    const Evaluation& e = sized.worst;
    std::vector<std::string> out;
    for (const std::string& d : spec.defaults_used) out.push_back("default used: " + d);
    if (!spec.coil.self_heating_k && !spec.coil.thermal_resistance_k_per_w) {
        out.emplace_back(
            "coil self-heating taken as 0 K: the hot coil needs more voltage to operate; ask the maker "
            "for the winding temperature rise, or measure it, and give coil.self_heating");
    }
    if (const auto* b = std::get_if<BipolarFigures>(&e.drive)) bipolar_notes(out, spec, sized, *b);
    if (const auto* m = std::get_if<MosfetFigures>(&e.drive)) mosfet_notes(out, spec, *m);
    if (e.clamp.at[0].v.vf_outside && spec.clamp.diode) {
        const Diode& d = *spec.clamp.diode;
        const bool above = e.clamp.at[0].i0_a > d.vf.back().if_a;
        out.push_back("the coil current at " + q(e.clamp.at[0].i0_a, Unit::ampere) +
                      (above ? " lies above " : " lies below ") + display_id(d) + "'s forward-voltage points; " +
                      (above ? "Vf was extrapolated on log(current) from its last points"
                             : "the nearest point was used (the safe side for the peak)"));
    }
    if (spec.clamp.diode && spec.clamp.diode->ifsm_a) {
        out.push_back("the diode's surge rating IFSM " + q(*spec.clamp.diode->ifsm_a, Unit::ampere) +
                      " is a non-repetitive 8.3 ms rating, quoted only: repetitive turn-offs are held to " +
                      (spec.clamp.diode->ifrm_a ? std::string("IFRM") : std::string("IF(AV)")));
    }
    if (spec.clamp.type == ClampType::diode_zener && spec.clamp.zener) {
        const Zener& z = *spec.clamp.zener;
        if (!z.zzt_ohm) {
            out.push_back(display_id(z) +
                          " gives no dynamic impedance zzt: its rise above the test current, and so part of the "
                          "peak, is unknown; give zzt at izt");
        }
        if (!z.izt_a) {
            out.push_back(display_id(z) + " gives no test current izt: the timing takes no knee below it; give izt");
        }
    }
    if (!spec.pin.voh_v && !spec.array()) {
        out.emplace_back(
            "the pin was taken as ideal (no output resistance): give pin.voh at pin.voh_current from the "
            "microcontroller's data (VOH at IOH) for its real output voltage under load");
    }
    if (!spec.coil.inductance_h) {
        out.emplace_back(
            "no coil inductance: release time and clamp energy are not estimated; measure the coil with an LCR "
            "meter with the armature held in its energised position, or ask the maker, and give coil.inductance");
    }
    if (spec.clamp.type == ClampType::diode_resistor) {
        out.push_back("the clamp resistor's power is checked against its rating " +
                      q(spec.clamp.resistor_power_w, Unit::watt) + " derated by policy.power_derating");
    }
    contact_notes(out, spec);
    return out;
}

std::vector<std::string> cautions(const Spec& spec) {
    std::vector<std::string> out;
    out.emplace_back(
        "figures are worst-case estimates from datasheet limits; the shipped parts table holds values "
        "from memory: confirm every part against the datasheet in use and the design on the bench");
    // One caution keyed to the load voltage (src/method.md "Safety"; IEC 61140 voltage bands).
    const std::string rules =
        "keep creepage and clearance between the coil circuit and the contacts (insulation coordination per IEC "
        "60664-1 "
        "and the product standard of the equipment), fuse the load, enclose live parts, and follow local electrical "
        "codes "
        "and licensed practice";
    if (!spec.load) {
        out.push_back(
            "if the contacts switch mains or any voltage above extra-low voltage (50 V AC, 120 V ripple-free DC, "
            "IEC 61140): " +
            rules);
        return out;
    }
    const LoadSpec& load = *spec.load;
    const bool ac = load.kind == LoadKind::ac;
    const std::string what = "the contacts switch " + q(load.voltage_v, Unit::volt) + (ac ? " AC" : " DC");
    const double elv = ac ? elv_ac_v : elv_dc_v;
    const double lv = ac ? lv_ac_v : lv_dc_v;
    if (load.voltage_v > lv) {
        out.push_back(what + ", above extra-low voltage and above the low-voltage band (" + q(lv, Unit::volt) +
                      (ac ? " AC" : " DC") +
                      ", IEC 61140): hazardous, and beyond what a relay board is for; use switchgear "
                      "rated for it, " +
                      rules);
    } else if (load.voltage_v > elv) {
        out.push_back(what + ", above extra-low voltage (" + q(elv, Unit::volt) + (ac ? " AC" : " ripple-free DC") +
                      ", IEC 61140): hazardous; " + rules);
    } else {
        out.push_back(what + ", within extra-low voltage (at most " + q(elv, Unit::volt) +
                      (ac ? " AC" : " ripple-free DC") +
                      ", IEC 61140) as long as its source is a safety extra-low voltage supply; fuse the load for its "
                      "wiring, keep the contact wiring apart from any mains wiring, and follow local electrical codes "
                      "and licensed practice");
    }
    return out;
}

ResistorReport resistor_report(const Spec& spec, const Sized& sized) {
    ResistorReport r;
    r.value_ohm = sized.r_drive_ohm;
    r.fixed = sized.resistor_fixed;
    if (spec.bipolar()) {
        r.kind = "base resistor";
        r.series = spec.base_resistor.series;
        r.tolerance = spec.base_resistor.tolerance;
        r.power_rating_w = spec.base_resistor.power_rating_w;
        const auto& f = std::get<BipolarFigures>(sized.worst.drive);
        r.window_min_ohm = f.window_min_ohm;
        r.window_max_ohm = f.window_max_ohm;
    } else if (spec.mosfet()) {
        r.kind = "gate resistor";
        r.series = spec.gate_resistor.series;
        r.tolerance = spec.gate_resistor.tolerance;
        r.window_min_ohm = std::get<MosfetFigures>(sized.worst.drive).gate_resistor_min_ohm;
    } else {
        r.kind = "";
    }
    return r;
}

bool shows_skipped(CheckId id, const Spec& spec) {
    switch (id) {
        case CheckId::switching_timing:
            return spec.switching.frequency_hz.has_value();
        case CheckId::clamp_pulse:
            return spec.clamp.type == ClampType::diode_zener || spec.clamp.type == ClampType::diode_tvs ||
                   (spec.clamp.type == ClampType::none && spec.mosfet() && spec.mosfet()->ear_j.has_value());
        case CheckId::coil_thermal:
            return spec.coil.thermal_resistance_k_per_w.has_value();
        case CheckId::contact_voltage:
        case CheckId::contact_current:
        case CheckId::contact_inrush:
        case CheckId::contact_breaking:
        case CheckId::contact_min_load:
            return contact_side_shown(spec);
        default:
            return false;
    }
}

}  // namespace coilfit::report
