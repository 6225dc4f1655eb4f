// Sequences the stages (coil -> driver -> clamp -> timing) at both ambient corners and keeps,
// for every check, the worse of the two (src/method.md "Two ambient corners"). The formulas
// live in the stages' files.
#include "coilfit/sizing.hpp"

#include <algorithm>
#include <bit>
#include <cmath>

#include "stages.hpp"

namespace coilfit {
namespace {

// What the driver is told at corner k: the devices at that ambient, the coil there switched on
// cold (its highest current) and hot (the operate point).
DriveInput drive_input(const CoilFigures& coil, const Conditions& c, std::size_t k) {
    const CoilCorner& at = coil.at[k];
    DriveInput in;
    in.corner = static_cast<Corner>(k);
    in.ambient_c = at.ambient_c;
    in.current_a = at.current_max_a;
    in.r_coil_hot_ohm = at.r_hot_low_ohm;
    in.thermal_ambient_c = at.ambient_c;
    in.thermal_current_a = at.current_max_a;
    (void)c;
    return in;
}

// One corner of every stage: the driver, then the coil's checks with the driver's on-state
// voltage, the clamp at the coil's highest current there, the timing.
template <typename D>
void corner(const Prepared& p, const D& d, const Conditions& c, double r_drive_ohm, bool all, std::size_t k,
            typename D::Figures& fig, Evaluation& e, CheckSet& checks) {
    const Spec& spec = *p.spec;
    DriveInput in = stages::drive_input(d, e.coil, c, k, drive_input(e.coil, c, k));
    // One log of the operating current serves every table lookup at it.
    in.ln_current = std::log(in.current_a);
    const CoilCorner& coil = e.coil.at[k];
    stages::drive_corner(d, spec, c, in, r_drive_ohm, all, fig.at[k], e.driver.at[k], checks);
    coil_checks(spec.coil, coil, e.driver.at[k], c.vs_hi_v, checks);
    const double ln_i0 = coil.current_max_a == in.current_a ? in.ln_current : std::log(coil.current_max_a);
    stages::clamp_corner(p, c, coil.current_max_a, ln_i0, coil.ambient_c, coil.r_cold_ohm, e.coil.release_current_a,
                         e.driver, all, e.clamp.at[k], checks);
    stages::timing_corner(spec, coil, e.driver.at[k], e.clamp.at[k], all, e.timing.at[k], checks);
    contact_checks(spec, checks);
}

// Writes every check anew (a reused Evaluation starts with each verdict skipped).
template <typename D>
void evaluate_with(const Prepared& p, const D& d, const Conditions& c, double r_drive_ohm, Figures figures,
                   Evaluation& e) {
    const bool all = figures == Figures::all;
    const Spec& spec = *p.spec;
    e.checks.clear_verdicts();
    if (c.ta_lo_c != c.ta_hi_c) e.hot_checks.clear_verdicts();
    if (all) e.conditions = c;  // for the words; no check reads it
    coil_figures(spec, c, all, e.coil);
    stages::describe_driver(d, spec, r_drive_ohm, e.driver);
    using F = typename D::Figures;
    if (!std::holds_alternative<F>(e.drive)) e.drive.template emplace<F>();
    auto& fig = std::get<F>(e.drive);
    corner(p, d, c, r_drive_ohm, all, 0, fig, e, e.checks);
    if (c.ta_lo_c == c.ta_hi_c) {
        // One ambient (a Monte Carlo sample of the conditions): both corners are the same; the
        // figures are copied only where someone reads them.
        if (!all) return;
        fig.at[1] = fig.at[0];
        e.driver.at[1] = e.driver.at[0];
        e.clamp.at[1] = e.clamp.at[0];
        e.timing.at[1] = e.timing.at[0];
    } else {
        CheckSet& hot = e.hot_checks;
        corner(p, d, c, r_drive_ohm, all, 1, fig, e, hot);
        for (std::size_t i = 0; i < check_count; ++i) {
            CheckValue& cold = e.checks.values[i];
            CheckValue& h = hot.values[i];
            cold.corner = Corner::cold;
            h.corner = Corner::hot;
            if (h.verdict == Verdict::skip) continue;
            if (&worse(cold, h, !all) != &cold) CheckSet::assign(cold, h);
        }
    }
    if (all) {
        stages::design_figures(d, spec, c, r_drive_ohm, fig);
        if (spec.coil.inductance_h)
            e.clamp.stored_energy_j = stored_energy(*spec.coil.inductance_h, e.coil_current_max_a());
    }
}

}  // namespace

double Evaluation::coil_current_max_a() const { return std::max(coil.at[0].current_max_a, coil.at[1].current_max_a); }

double Evaluation::peak_collector_voltage_v() const {
    return std::max(clamp.at[0].peak_collector_v, clamp.at[1].peak_collector_v);
}

double Evaluation::release_time_s() const { return std::max(clamp.at[0].release_time_s, clamp.at[1].release_time_s); }

Prepared prepare(const Spec& spec) {
    Prepared p;
    p.spec = &spec;
    p.pin_r_out_ohm = stages::pin_output_resistance(spec);
    std::visit(
        [&](const auto& part) {
            using P = std::decay_t<decltype(part)>;
            if constexpr (std::is_same_v<P, Bipolar>)
                p.driver = prepare_bipolar(spec, part, p.pin_r_out_ohm);
            else if constexpr (std::is_same_v<P, Mosfet>)
                p.driver = prepare_mosfet(spec, part, p.pin_r_out_ohm);
            else
                p.driver = prepare_array(spec, part);
        },
        spec.transistor);
    stages::prepare_clamp(spec, p);
    return p;
}

Evaluation evaluate(const Spec& spec, const Conditions& c, double r_drive_ohm) {
    return evaluate(prepare(spec), c, r_drive_ohm);
}

Evaluation evaluate(const Prepared& p, const Conditions& c, double r_drive_ohm, Figures figures) {
    Evaluation e;
    evaluate_into(p, c, r_drive_ohm, figures, e);
    return e;
}

void evaluate_into(const Prepared& p, const Conditions& c, double r_drive_ohm, Figures figures, Evaluation& out) {
    std::visit([&](const auto& d) { evaluate_with(p, d, c, r_drive_ohm, figures, out); }, p.driver);
}

void precompute_logs(Spec& spec) {
    std::visit(
        [](auto& part) {
            using P = std::decay_t<decltype(part)>;
            if constexpr (!std::is_same_v<P, Mosfet>) precompute_logs(part);
        },
        spec.transistor);
    if (spec.clamp.diode) precompute_logs(*spec.clamp.diode);
}

Sized size_numbers(const Spec& spec) {
    Sized s;
    s.conditions = worst_case_conditions(spec);
    const Prepared p = prepare(spec);
    s.r_drive_ohm = stages::choose_drive_resistor(p, s.conditions);
    s.resistor_fixed = stages::drive_resistor_fixed(spec);
    s.worst = evaluate(p, s.conditions, s.r_drive_ohm.value_or(0.0));
    return s;
}

}  // namespace coilfit
