// The coil stage: the winding's resistance, current, temperature and must-operate voltage at
// one ambient corner, and the coil's checks (coil.operate, coil.overvoltage, coil.thermal)
// (src/method.md "Coil").
#pragma once

#include <array>
#include <string>

#include "coilfit/check.hpp"
#include "coilfit/corners.hpp"
#include "coilfit/driver.hpp"
#include "coilfit/spec.hpp"

namespace coilfit {

// A winding above this temperature has left every insulation class (IEC 60085 tops out at
// 250 °C): the self-heating fixed point is then taken as a runaway (coil.thermal fails).
inline constexpr double coil_runaway_c = 250.0;

// The coil at one ambient corner.
struct CoilCorner {
    double ambient_c = 0;
    double r_cold_ohm = 0;         // at the ambient, low tolerance: the switch-on resistance
    double current_max_a = 0;      // highest supply into it: sizes driver, drive and clamp
    double rise_k = 0;             // winding rise above ambient (given, or from its own power)
    double temp_hot_c = 0;         // ambient + rise: the coil that has been running
    double r_hot_ohm = 0;          // at temp_hot, high tolerance
    double r_hot_low_ohm = 0;      // at temp_hot, low tolerance
    double operate_voltage_v = 0;  // must-operate voltage of the hot coil
    bool runaway = false;          // the self-heating fixed point lies beyond coil_runaway_c
};

struct CoilFigures {
    std::array<CoilCorner, corner_count> at{};
    double current_nominal_a = 0;  // nominal supply / reference resistance (0: no nominal)
    double release_current_a = 0;  // must-release voltage / reference resistance
};

// Winding rise above ambient with the coil's own power P = V^2 / R(T) (resistance at its low
// tolerance r_ref_lo_ohm at t_ref_c, the most power) and thermal resistance rth: the fixed point
// of T = Ta + rth V^2 / R(T) with the copper law, in closed form (a quadratic in the rise).
[[nodiscard]] double coil_rise_k(double v_coil_v, double r_ref_lo_ohm, double t_ref_c, double ambient_c,
                                 double rth_k_per_w);

// The must-operate voltage of a coil at t_coil_c: k_op V_rated scaled by the copper factor from
// the temperature the data state it at (must_operate_temp, default the reference temperature).
[[nodiscard]] double operate_voltage_v(const CoilSpec& coil, double t_coil_c);

// The coil at one ambient, written field by field into k (the Monte Carlo path reuses it).
void coil_corner(const CoilSpec& coil, const Conditions& c, double ambient_c, CoilCorner& k);
[[nodiscard]] CoilCorner coil_corner(const CoilSpec& coil, const Conditions& c, double ambient_c);
// Both corners (the second only when the ambients differ or `both`) and the nominal figures.
void coil_figures(const Spec& spec, const Conditions& c, bool both, CoilFigures& f);

// coil.operate (the lowest coil voltage the driver leaves, against the hot must-operate voltage),
// coil.overvoltage and coil.thermal at one corner.
void coil_checks(const CoilSpec& coil, const CoilCorner& corner, const DriverCorner& driver, double coil_voltage_max_v,
                 CheckSet& out);

struct Evaluation;
// The words of the coil's checks.
[[nodiscard]] std::string coil_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e);
[[nodiscard]] std::string coil_skip_reason(CheckId id, const Spec& spec);

}  // namespace coilfit
