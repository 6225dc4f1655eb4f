#include "coilfit/corners.hpp"

namespace coilfit {

Conditions worst_case_conditions(const Spec& spec) {
    Conditions c;
    c.vs_lo_v = spec.supply.lo_v();
    c.vs_hi_v = spec.supply.hi_v();
    c.vs_transient_v = spec.supply.transient_max_v.value_or(0.0);
    c.ta_lo_c = spec.ambient.min_c;
    c.ta_hi_c = spec.ambient.max_c;
    c.vdd_lo_v = spec.pin.vdd_v * (1.0 - spec.pin.vdd_tolerance);
    c.vdd_hi_v = spec.pin.vdd_v * (1.0 + spec.pin.vdd_tolerance);
    c.r_coil_lo_ohm = spec.coil.resistance_ohm * (1.0 - spec.coil.tolerance);
    c.r_coil_hi_ohm = spec.coil.resistance_ohm * (1.0 + spec.coil.tolerance);
    // The drive resistor's tolerance: the base resistor's, or the gate resistor's (which the
    // gate pull-down shares).
    const double tb = spec.mosfet() ? spec.gate_resistor.tolerance : spec.base_resistor.tolerance;
    c.rb_lo_factor = 1.0 - tb;
    c.rb_hi_factor = 1.0 + tb;
    // The clamp resistor: its high tolerance for the peak, its low one for timing.
    c.rs_lo_factor = 1.0 - spec.clamp.resistor_tolerance;
    c.rs_hi_factor = 1.0 + spec.clamp.resistor_tolerance;
    if (spec.clamp.zener) {
        c.vz_lo_v = spec.clamp.zener->vz_v * (1.0 - spec.clamp.zener->tolerance);
        c.vz_hi_v = spec.clamp.zener->vz_v * (1.0 + spec.clamp.zener->tolerance);
    }
    c.hfe_position = 0.0;
    c.rds_position = 0.0;
    return c;
}

}  // namespace coilfit

namespace coilfit {

std::string_view clamp_type_name(ClampType type) {
    switch (type) {
        case ClampType::diode:
            return "diode";
        case ClampType::diode_zener:
            return "diode_zener";
        case ClampType::diode_resistor:
            return "diode_resistor";
        case ClampType::diode_tvs:
            return "diode_tvs";
        case ClampType::none:
            return "none";
    }
    return "none";
}

}  // namespace coilfit
