// One channel of a transistor array (src/method.md "Transistor-array channel (array)").
#include "coilfit/drivers/array.hpp"

#include <algorithm>
#include <cmath>

#include "../curves.hpp"

namespace coilfit {

ArrayDriver prepare_array(const Spec& spec, const ArrayPart& part) {
    ArrayDriver d;
    d.part = &part;
    d.derated_ic_a = spec.policy.current_derating * part.ic_max_a;
    d.derated_vceo_v = spec.policy.voltage_derating * part.vceo_v;
    d.tj_limit_c = part.tj_max_c - spec.policy.junction_margin_k;
    d.rth_k_per_w = rth_ja(part);
    d.input_lo_ohm =
        part.input_resistor_ohm * (1.0 - part.input_resistor_tolerance.value_or(defaults::array_input_tolerance));
    return d;
}

void array_corner(const ArrayDriver& d, const Spec& spec, const Conditions& c, const DriveInput& in, ArrayCorner& f,
                  DriverCorner& common, CheckSet& checks) {
    const ArrayPart& a = *d.part;
    const double i = in.current_a;
    const double ln_i = in.ln_current;
    f.vin_on = curves::curve_at(a.vin_on, i, ln_i);
    f.vce_sat = curves::curve_at(a.vce_sat, i, ln_i);
    // The pin drives the built-in input resistor: (VDD_hi - vin_low) / (R_in (1 - t_in)), vin_low
    // two base-emitter drops at their low (common practice).
    f.pin_current_max_a = std::max(0.0, c.vdd_hi_v - defaults::array_vin_low_v) / d.input_lo_ohm;
    checks.set(CheckId::pin_current, at_most(f.pin_current_max_a, spec.pin.max_current_a));
    // The lowest pin voltage must reach the input voltage that guarantees the output on.
    CheckValue drive = at_least(c.vdd_lo_v, f.vin_on.value);
    if (f.vin_on.side == Side::above) mark_beyond_data(drive);  // src/method.md "Data limits"
    checks.set(CheckId::input_drive, drive);
    checks.set(CheckId::transistor_current, at_most(i, d.derated_ic_a));
    // One channel alone: P = Vce(sat) I, Tj = Ta + P RthJA (the board adds the package's sum).
    const double i_th = in.thermal_current_a;
    const Lookup vce_th = i_th == i ? f.vce_sat : curves::curve_at(a.vce_sat, i_th, ln_not_set);
    f.power_w = vce_th.value * i_th;
    f.junction_c = in.thermal_ambient_c + f.power_w * d.rth_k_per_w;
    CheckValue thermal = at_most(f.junction_c, d.tj_limit_c);
    if (vce_th.side == Side::above) mark_beyond_data(thermal);
    checks.set(CheckId::transistor_thermal, thermal);
    common.on_drop_v = f.vce_sat.value;
    common.drop_beyond_data = f.vce_sat.side == Side::above;
    common.coil_voltage_min_v = c.vs_lo_v - f.vce_sat.value;
    common.pin_current_max_a = f.pin_current_max_a;
    common.power_w = f.power_w;
    common.junction_c = f.junction_c;
}

}  // namespace coilfit
