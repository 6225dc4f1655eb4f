// The flyback clamp across the coil: clamp voltage, peak collector voltage and the RL decay.
//
// At turn-off the coil keeps its current I0 and drives the collector up until the clamp
// conducts; with a clamp voltage Vc held constant the coil current decays as
//   i(t) = (I0 + Vc/R) * exp(-t/tau) - Vc/R,  tau = L/R          (closed form, first-order RL)
// (method.md, "Clamp (flyback) and timing").
#pragma once

#include <optional>

#include "coilfit/spec.hpp"

namespace coilfit {

// Clamp voltages for the two corners of the method.
struct ClampVoltages {
    // Highest clamp voltage while current flows (peak collector voltage = Vs_hi + this):
    // diode Vf_max(I0); diode + zener Vz_hi + Vf_max; diode + resistor I0*Rs + Vf_max.
    double peak_v = 0;
    // Lowest clamp voltage for timing: the diode's low drop, zener at its bottom tolerance.
    // For diode + resistor it is the diode drop alone, the resistor adds to the coil's R.
    double timing_v = 0;
    // Resistance in series with the coil during the decay (diode + resistor), else 0.
    double series_ohm = 0;
    bool vf_outside = false;  // I0 outside the diode's forward-voltage points
    bool limited = true;      // false for "none": only breakdown limits the voltage
};

// ln_i0 is ln(i0_a) when the caller has it (one log serves every lookup), else NaN.
[[nodiscard]] ClampVoltages clamp_voltages(const ClampSpec& clamp, double i0_a, double vz_lo_v,
                                           double vz_hi_v, double ln_i0 = ln_not_set);

// The decay of the coil current through the clamp, closed form with Vc constant.
struct Decay {
    double tau_s = 0;
    double release_time_s = 0;  // until i falls to the release current
    double end_time_s = 0;      // until i reaches zero: tau * ln(1 + I0*R/Vc)
    double charge_c = 0;        // Q = tau*I0 - (Vc/R)*t_end, charge through the clamp
    double i2_integral = 0;     // integral of i^2 dt over the decay (A^2 s), for resistor heat
};

// l_h, r_ohm: the loop's inductance and total resistance; vc_v > 0 the clamp voltage.
[[nodiscard]] Decay rl_decay(double l_h, double r_ohm, double vc_v, double i0_a, double i_release_a);

// Energy a single turn-off leaves in the clamp (diode, zener and series resistor together):
// Vc*Q for a voltage clamp; Vf*Q + Rs * integral(i^2) for diode + resistor.
[[nodiscard]] double clamp_energy(const Decay& decay, double vc_v, double series_ohm);

// Stored magnetic energy 1/2 L I^2.
[[nodiscard]] constexpr double stored_energy(double l_h, double i_a) { return 0.5 * l_h * i_a * i_a; }

}  // namespace coilfit
