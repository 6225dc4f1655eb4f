// What each driver kind tells the stages after it, and the design's drive resistor.
#include <algorithm>
#include <cmath>

#include "stages.hpp"

namespace coilfit::stages {

double pin_output_resistance(const Spec& spec) {
    // The pin as a Thevenin source: R_out = (VDD_voh - VOH) / IOH, VDD_voh the supply VOH is
    // guaranteed at (pin.voh_vdd, by default the lowest VDD, as pin data state it)
    // (src/method.md "Bipolar drivers").
    if (spec.pin.voh_v && spec.pin.voh_current_a && *spec.pin.voh_current_a > 0) {
        const double vdd_voh = spec.pin.voh_vdd_v.value_or(spec.pin.vdd_v * (1.0 - spec.pin.vdd_tolerance));
        return std::max(0.0, (vdd_voh - *spec.pin.voh_v) / *spec.pin.voh_current_a);
    }
    return 0.0;
}

void describe_driver(const BipolarDriver& d, const Spec&, double r_drive_ohm, DriverCommon& out) {
    out.drop_name = "Vce(sat)";
    out.terminal = "collector";
    out.rating_name = "Vceo";
    out.resistor_name = "base resistor";
    out.resistor_ohm = r_drive_ohm;
    out.rated_voltage_v = d.part->vceo_v;
    out.peak_limit_v = d.derated_vceo_v;
}

void describe_driver(const MosfetDriver& d, const Spec&, double r_drive_ohm, DriverCommon& out) {
    out.drop_name = "the Rds(on) drop";
    out.terminal = "drain";
    out.rating_name = "Vds max";
    out.resistor_name = "gate resistor";
    out.resistor_ohm = r_drive_ohm;
    out.rated_voltage_v = d.part->vds_max_v;
    out.peak_limit_v = d.derated_vds_v;
    out.avalanche_j = d.part->ear_j.value_or(0.0);
}

void describe_driver(const ArrayDriver& d, const Spec&, double, DriverCommon& out) {
    out.drop_name = "Vce(sat)";
    out.terminal = "output";
    out.rating_name = "Vceo";
    out.resistor_name = "";
    out.resistor_ohm = 0;
    out.rated_voltage_v = d.part->vceo_v;
    out.peak_limit_v = d.derated_vceo_v;
}

void design_figures(const BipolarDriver& d, const Spec&, const Conditions&, double, BipolarFigures& f) {
    f.pin_r_out_ohm = d.pin_r_out_ohm;
    // The window is the intersection of both corners' windows.
    f.window_max_ohm = std::min(f.at[0].base_resistor_max_ohm, f.at[1].base_resistor_max_ohm);
    f.window_min_ohm = std::max(f.at[0].base_resistor_min_ohm, f.at[1].base_resistor_min_ohm);
}

void design_figures(const MosfetDriver& d, const Spec& spec, const Conditions& c, double r, MosfetFigures& f) {
    mosfet_design(d, spec, c, r, f);
}

void design_figures(const ArrayDriver&, const Spec&, const Conditions&, double, ArrayFigures&) {}

std::optional<double> choose_drive_resistor(const Prepared& p, const Conditions& c) {
    const Spec& spec = *p.spec;
    if (std::holds_alternative<BipolarDriver>(p.driver)) {
        if (spec.base_resistor.value_ohm) return spec.base_resistor.value_ohm;
        const Evaluation bare = evaluate(p, c, 0.0);
        return choose_base_resistor(spec, std::get<BipolarFigures>(bare.drive));
    }
    if (std::holds_alternative<MosfetDriver>(p.driver)) return choose_gate_resistor(spec, c);
    return std::nullopt;
}

bool drive_resistor_fixed(const Spec& spec) {
    if (spec.bipolar()) return spec.base_resistor.value_ohm.has_value();
    if (spec.mosfet()) return spec.gate_resistor.value_ohm.has_value();
    return false;
}

}  // namespace coilfit::stages
