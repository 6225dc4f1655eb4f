// Worst-case sizing of a low-side coil driver on a microcontroller pin: the stages in sequence
// (coil -> driver -> clamp -> timing) at the ambient corners, and the design's choice of drive
// resistor.
//
// Modelling assumptions (src/method.md is the contract; the source of each formula is beside it
// in the stage that owns it, src/core/<stage>.cpp):
//  1. Every check is made at the corner worst for it (extreme-value analysis), from the
//     tolerance bands of supply, pin VDD, coil resistance, drive resistor and zener, and the
//     ambient range. Nominal values are reported for orientation only.
//  2. The coil is a resistance R and an inductance L. R follows annealed copper,
//     R(T) = R_ref (1 + 0.00393/K (T - T_ref)) (IEC 60028); L does not change with temperature
//     and is the energised (armature closed) value.
//  3. The hot coil is at the ambient plus the self-heating rise given (default 0 K), or the rise
//     its own power gives through its thermal resistance.
//  4. The highest coil current flows with the highest supply into the cold coil at its low
//     resistance tolerance; the switch's on-state drop is neglected there (it only lowers it).
//  5. Must-operate is an ampere-turn threshold: the guaranteed must-operate voltage rises with
//     the copper factor of the hot coil; it already covers the resistance spread.
//  6. Part data come from the part's points, interpolated on log(current), nearest point outside
//     them (with a note, and a warning where that is on the unsafe side).
//  7. The pin is a Thevenin source: VDD behind R_out = (VDD - VOH)/IOH (0 when VOH is not
//     given). For the highest pin current R_out is taken as 0.
//  8. A pull-down from base (gate) to emitter (source) draws its current away from the drive.
//  9. The switch's dissipation is its steady on-state loss; switching losses are neglected
//     (a relay switches a few times a second at most).
// 10. The clamp voltage is held constant during the decay (closed-form RL decay); the clamp's
//     highest voltage sets the peak collector voltage, its lowest the release time, which
//     therefore errs long.
#pragma once

#include <optional>
#include <variant>

#include "coilfit/check.hpp"
#include "coilfit/clamp.hpp"
#include "coilfit/coil.hpp"
#include "coilfit/corners.hpp"
#include "coilfit/driver.hpp"
#include "coilfit/drivers/array.hpp"
#include "coilfit/drivers/bipolar.hpp"
#include "coilfit/drivers/mosfet.hpp"
#include "coilfit/parts.hpp"
#include "coilfit/spec.hpp"
#include "coilfit/timing.hpp"

namespace coilfit {

// The driver of a spec, prepared: one alternative per kind, chosen by the transistor's record.
using Driver = std::variant<BipolarDriver, MosfetDriver, ArrayDriver>;
// monostate first: an Evaluation is built with nothing in it, then evaluate() emplaces its kind.
using DriverFigures = std::variant<std::monostate, BipolarFigures, MosfetFigures, ArrayFigures>;

// The pieces of an evaluation that depend on the spec alone, worked out once: Monte Carlo
// evaluates one spec millions of times. It points at the spec, which must outlive it.
struct Prepared {
    const Spec* spec = nullptr;
    Driver driver;
    double pin_r_out_ohm = 0;  // (VDD_voh - VOH) / IOH, 0 when VOH is not given
    const Diode* clamp_diode = nullptr;
    double derated_vrrm_v = 0;
    double diode_peak_limit_a = 0;   // repetitive peak rating, else the average rating
    double diode_rated_power_w = 0;  // if_avg * Vf(if_avg): a diode clamp's power limit
};
[[nodiscard]] Prepared prepare(const Spec& spec);

// What evaluate() works out: every figure, or only what the checks' verdicts need (Monte Carlo
// reads verdicts alone). With `verdicts` every verdict is the same as with `all`; figures no
// check uses (the drive resistor window, the gain needed, stored energy, release time, charge
// and clamp energy where no check reads them) are left at zero, and the rate checks may be
// decided on an upper bound of the clamp charge, their values then that bound.
enum class Figures : std::uint8_t { all, verdicts };

// Every figure of one evaluation, SI units. Cheap enough for Monte Carlo: no allocation.
struct Evaluation {
    Conditions conditions;
    CoilFigures coil;
    DriverCommon driver;
    DriverFigures drive;
    ClampFigures clamp;
    TimingFigures timing;
    CheckSet checks;      // every check at its worse corner
    CheckSet hot_checks;  // the hot corner's own checks, before the merge into `checks`

    [[nodiscard]] const CheckValue& check(CheckId id) const { return checks[id]; }
    [[nodiscard]] bool passes() const { return checks.passes(); }
    // The corner figures of a check's own corner.
    [[nodiscard]] const CoilCorner& coil_at(Corner k) const { return coil.at[static_cast<std::size_t>(k)]; }
    [[nodiscard]] const DriverCorner& driver_at(Corner k) const { return driver.at[static_cast<std::size_t>(k)]; }
    [[nodiscard]] const ClampCorner& clamp_at(Corner k) const { return clamp.at[static_cast<std::size_t>(k)]; }
    // The figures a report quotes: the extreme over both corners.
    [[nodiscard]] double coil_current_max_a() const;
    [[nodiscard]] double peak_collector_voltage_v() const;
    [[nodiscard]] double release_time_s() const;
};

// Evaluates the design with drive resistor r_drive_ohm (base or gate resistor; 0: none could
// be chosen; ignored for an array channel) over the given conditions. Pure, allocation-free,
// fast (Monte Carlo calls it millions of times). The first form prepares the spec on each call;
// both give the same figures.
[[nodiscard]] Evaluation evaluate(const Spec& spec, const Conditions& conditions, double r_drive_ohm);
[[nodiscard]] Evaluation evaluate(const Prepared& prepared, const Conditions& conditions, double r_drive_ohm,
                                  Figures figures = Figures::all);

// The same evaluation into `out`, reusing its storage (Monte Carlo): every check and every figure
// a check reads is written anew; with Figures::verdicts other figures may keep an earlier
// evaluation's values. Verdicts are the same as evaluate()'s.
void evaluate_into(const Prepared& prepared, const Conditions& conditions, double r_drive_ohm, Figures figures,
                   Evaluation& out);

// Fills the ln(current) points of the spec's transistor and clamp diode (see parts.hpp): a
// speed-up for callers that evaluate one spec many times; results are unchanged.
void precompute_logs(Spec& spec);

// The chosen design only: the worst-case evaluation with the chosen (or fixed) drive resistor.
struct Sized {
    Conditions conditions;
    std::optional<double> r_drive_ohm;  // base or gate resistor; none for an array channel
    bool resistor_fixed = false;
    Evaluation worst;
};
[[nodiscard]] Sized size_numbers(const Spec& spec);

}  // namespace coilfit
