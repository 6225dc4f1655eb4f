// The logic-level N-MOSFET driver (nmos): gate resistor from the pin, a pull-down from gate to
// source, Rds(on) at the gate voltage the pin guarantees and at the junction temperature its own
// dissipation gives (src/method.md "N-MOSFET driver (nmos)").
#pragma once

#include <array>
#include <optional>
#include <string>

#include "coilfit/check.hpp"
#include "coilfit/corners.hpp"
#include "coilfit/driver.hpp"
#include "coilfit/spec.hpp"

namespace coilfit {

// Which bound set pin.current, or why gate.drive failed (CheckValue::detail).
enum class GateCase : std::uint8_t { charge_peak, pulldown_dc, no_resistor, no_rds_point };

// The hot on-resistance in closed form: with R(Tj) = R25 (1 + tc (Tj - 25 °C)), P = I^2 R(Tj) and
// Tj = Ta + P RthJA, P = I^2 R25 (1 + tc (Ta - 25)) / (1 - I^2 R25 tc RthJA). A denominator at or
// below zero is thermal runaway (no steady state).
struct HotRds {
    double power_w = 0;
    double junction_c = 0;
    double rds_ohm = 0;  // at the junction
    bool runaway = false;
};
[[nodiscard]] HotRds hot_rds(double i_a, double rds25_ohm, double tempco_per_k, double ambient_c, double rth_k_per_w);

// Unclamped turn-off: the drain avalanches at V_BR and each turn-off leaves
// E = 1/2 L I0^2 V_BR / (V_BR - Vs_hi) in it; V_BR is taken at Vds max, the lowest breakdown the
// rating allows (the largest energy). Infinite when V_BR is not above the supply.
[[nodiscard]] double avalanche_energy_j(double l_h, double i0_a, double v_br_v, double vs_hi_v);

struct MosfetCorner {
    double vgs_lo_v = 0;   // the lowest gate voltage: pin at VDD_lo through Rg (+tb) and R_out, pull-down at -tb
    double vgs_eff_v = 0;  // less the threshold's rise when cold
    int rds_point = -1;    // the rds_on point used: the highest vgs at or below vgs_eff (-1: none)
    double rds25_ohm = 0;  // its 25 °C value (maximum, or towards typical in a sample)
    double rds_operate_ohm = 0, junction_operate_c = 0;  // at the lowest-supply operate point
    HotRds thermal{};                                    // at the thermal check's corner
    double pin_peak_a = 0, pin_dc_a = 0;
    bool rds_beyond = false;  // the current lies above the rds_on point's test current
};

struct MosfetFigures {
    std::array<MosfetCorner, corner_count> at{};
    double pin_r_out_ohm = 0;
    double pulldown_ohm = 0;
    double gate_resistor_min_ohm = 0;  // the smallest the pin's current limit allows
    double vplateau_v = 0;
    std::optional<double>
        gate_time_s;  // Qg (Rg + R_out) / (VDD_lo - Vplateau); none if the pin never passes the plateau
};

struct MosfetDriver {
    using Figures = MosfetFigures;
    const Mosfet* part = nullptr;
    double derated_id_a = 0, derated_vds_v = 0, tj_limit_c = 0, rth_k_per_w = 0;
    double tempco_per_k = 0, vth_tempco_v_per_k = 0;
    double pulldown_ohm = 0;
    double pin_r_out_ohm = 0;
};

[[nodiscard]] MosfetDriver prepare_mosfet(const Spec& spec, const Mosfet& part, double pin_r_out_ohm);

// One corner of the nmos driver with gate resistor rg_ohm (0: none): gate.drive, gate.voltage,
// pin.current, transistor.current, transistor.thermal.
void mosfet_corner(const MosfetDriver& d, const Spec& spec, const Conditions& c, const DriveInput& in, double rg_ohm,
                   bool all, MosfetCorner& out, DriverCorner& common, CheckSet& checks);
// The design-level figures (gate resistor window, gate switching time).
void mosfet_design(const MosfetDriver& d, const Spec& spec, const Conditions& c, double rg_ohm, MosfetFigures& f);

// The smallest series value that keeps the gate-charge peak VDD_hi / (Rg (1 - tb)) within the
// pin's limit, or the fixed one.
[[nodiscard]] std::optional<double> choose_gate_resistor(const Spec& spec, const Conditions& c);

struct Evaluation;
[[nodiscard]] std::string mosfet_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e);

}  // namespace coilfit
