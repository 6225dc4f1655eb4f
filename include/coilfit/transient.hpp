// The turn-off transient of a clamp option as a time series: the coil current and the collector
// (drain) voltage against time, from the same closed-form RL decay the clamp stage uses
// (coilfit/clamp.hpp, src/method.md "Clamp (flyback) and timing"). The plot draws these points.
//
// With the clamp voltage Vc held constant and R the loop's resistance (coil plus any series
// resistor), L di/dt = -(R i + Vc) gives, for 0 <= t <= t0,
//   i(t) = (I0 + Vc/R) exp(-t/tau) - Vc/R,  tau = L/R,  t0 = tau ln(1 + I0 R / Vc)
// (closed form of the first-order linear ODE); after t0 the clamp blocks and i = 0.
#pragma once

#include <cstddef>
#include <vector>

namespace coilfit {

// What one clamp option's turn-off needs, taken from its worst-case evaluation. Two corners, as
// the report quotes them: the current at the timing corner (lowest clamp voltage: the release
// time the report gives), the collector voltage at the peak corner (highest supply and clamp
// voltage: the peak the report checks against the derated rating).
struct TurnOff {
    double i0_a = 0;               // coil current at turn-off (the highest: cold coil, highest supply)
    double l_h = 0;                // coil inductance
    double r_coil_ohm = 0;         // the cold coil's resistance at that corner
    double release_current_a = 0;  // the coil lets go below this current (must-release)
    double v_on_v = 0;             // collector voltage before turn-off: the switch's on-state drop
    // Timing corner: the clamp's lowest voltage and the series resistor at its low tolerance.
    double vc_timing_v = 0;
    double r_series_timing_ohm = 0;
    // Peak corner: highest supply, the clamp's constant part at its highest (diode drop, plus the
    // zener or TVS), the series resistor at its high tolerance (its drop follows the current).
    double vs_hi_v = 0;
    double i0_peak_a = 0;  // the coil current and cold resistance at that corner
    double r_coil_peak_ohm = 0;
    double vc_peak_v = 0;
    double r_series_peak_ohm = 0;
};

struct SamplePoint {
    double t_s = 0;
    double value = 0;  // A for the current, V for the voltage
};

struct TurnOffSeries {
    std::vector<SamplePoint> current;  // timing corner
    std::vector<SamplePoint> voltage;  // peak corner; vertical steps at t = 0 and where i ends
    double release_time_s = 0;         // i falls to the release current (0 if it starts below)
    double current_end_s = 0;          // timing corner: i reaches zero
    double voltage_end_s = 0;          // peak corner: i reaches zero, the collector falls to Vs
    double peak_v = 0;                 // highest collector voltage of the series
};

// i(t) of a constant-voltage clamp, closed form above; 0 beyond the end of the decay, I0 before
// turn-off (t < 0). vc_v >= 0, r_ohm > 0, l_h > 0.
[[nodiscard]] double decay_current_a(double l_h, double r_ohm, double vc_v, double i0_a, double t_s);
// t0 = tau ln(1 + I0 R / Vc); with Vc = 0 the current never reaches zero: +infinity.
[[nodiscard]] double decay_end_s(double l_h, double r_ohm, double vc_v, double i0_a);

// The later of the two corners' ends of conduction: how long the plot's window must be.
[[nodiscard]] double turn_off_duration_s(const TurnOff& t);

// Samples over [t_from_s, t_to_s] (t_from_s may be negative: before turn-off) at `samples`
// evenly spaced times, plus the exact instants where a curve has a corner or a step (turn-off,
// the ends of conduction), so that no edge is cut. samples >= 2.
[[nodiscard]] TurnOffSeries sample_turn_off(const TurnOff& t, double t_from_s, double t_to_s, std::size_t samples);

}  // namespace coilfit
