// The clamp stage: the flyback clamp across the coil, the peak collector (drain) voltage, the RL
// decay, the clamp's ratings (src/method.md "Clamp (flyback) and timing").
//
// At turn-off the coil keeps its current I0 and drives the collector up until the clamp
// conducts; with a clamp voltage Vc held constant the coil current decays as
//   i(t) = (I0 + Vc/R) * exp(-t/tau) - Vc/R,  tau = L/R          (closed form, first-order RL)
#pragma once

#include <array>
#include <optional>
#include <span>
#include <string>

#include "coilfit/check.hpp"
#include "coilfit/corners.hpp"
#include "coilfit/spec.hpp"

namespace coilfit {

// Clamp voltages for the two corners of the method.
struct ClampVoltages {
    // Highest clamp voltage while current flows (peak collector voltage = Vs_hi + this):
    // diode Vf_max(I0); diode + zener Vz_hi + Vf_max; diode + resistor I0*Rs_hi + Vf_max.
    double peak_v = 0;
    // Lowest clamp voltage for timing: the diode's low drop, zener at its bottom tolerance.
    // For diode + resistor it is the diode drop alone, the resistor adds to the coil's R.
    double timing_v = 0;
    // Resistance in series with the coil during the decay (diode + resistor), else 0: at its
    // high tolerance for the peak and energy, at its low one for timing.
    double series_ohm = 0;
    double series_timing_ohm = 0;
    // The clamp part's own voltage at the peak (zener or TVS, without the diode), for its pulse.
    double part_peak_v = 0;
    bool vf_outside = false;  // I0 outside the diode's forward-voltage points
    bool limited = true;      // false for "none": only breakdown limits the voltage
};

// ln_i0 is ln(i0_a) when the caller has it (one log serves every lookup), else NaN; ambient_c the
// corner's ambient, for a zener's temperature drift from its 25 °C data.
[[nodiscard]] ClampVoltages clamp_voltages(const ClampSpec& clamp, double i0_a, const Conditions& c,
                                           double ln_i0 = ln_not_set, double ambient_c = 25.0);

// A zener's or TVS's non-repetitive surge rating at an equivalent rectangular pulse width:
// log-log between its points, beyond them the nearest point scaled as P ~ t^(-1/2) (the usual
// thermal-impedance rule, common practice). 0 without points.
[[nodiscard]] double pulse_rating_w(std::span<const PulsePoint> points, double width_s);

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

// The clamp at one ambient corner.
struct ClampCorner {
    double i0_a = 0;
    ClampVoltages v{};
    double peak_collector_v = 0;  // Vs_hi + the highest clamp voltage (or the transient, if higher)
    bool has_timing = false;      // inductance given and the clamp limits the voltage
    double release_time_s = 0, current_zero_time_s = 0, charge_c = 0;  // timing corner
    double slow_tau_s = 0, slow_vc_over_r_a = 0;                       // the timing corner's decay: tau and Vc/R
    bool end_time_is_bound = false;          // verdicts only: current_zero_time_s is the bound L I0 / Vc
    double energy_j = 0, charge_peak_c = 0;  // energy corner
    double avalanche_j = 0;                  // no clamp, a MOSFET rated for it: the energy per turn-off
    // The pulse each turn-off drives into a zener or TVS (src/method.md, pulse rating).
    bool has_pulse = false;
    double pulse_peak_w = 0, pulse_energy_j = 0, pulse_width_s = 0, pulse_rating_w = 0;
    bool has_rate = false;  // and a switching frequency
    double clamp_power_w = 0, diode_average_current_a = 0, zener_power_w = 0, resistor_power_w = 0;
};

struct ClampFigures {
    std::array<ClampCorner, corner_count> at{};
    double stored_energy_j = 0;  // at the highest coil current
};

// How the diode.current check came out (CheckValue::detail).
enum class DiodeCurrentCase : std::uint8_t { peak, average };
// What clamp.pulse compared (CheckValue::detail): a zener's or TVS's peak power against its
// pulse rating, or, without a clamp, a MOSFET's avalanche energy per turn-off against EAR.
enum class PulseCase : std::uint8_t { zener, tvs, avalanche, unrated };

struct Evaluation;
[[nodiscard]] std::string clamp_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e);
[[nodiscard]] std::string clamp_skip_reason(CheckId id, const Spec& spec);

}  // namespace coilfit
