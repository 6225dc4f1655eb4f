// The clamp trade-off table: the spec's diode alone, with its resistor, and with the highest
// zeners of the table that keep the collector within its rating, side by side
// (src/method.md "Clamp (flyback) and timing": faster release costs collector voltage).
#include <algorithm>
#include <cmath>

#include "report_parts.hpp"

namespace coilfit::report {
namespace {

std::string q(double value, Unit unit) { return format_quantity(value, unit); }

// The option's turn-off for the plot (coilfit/transient.hpp): the current at the corner of the
// longer release (the one the report quotes), the voltage at the corner of the higher peak.
std::optional<TurnOff> turn_off(const Spec& s, const Evaluation& e) {
    if (!s.coil.inductance_h || !e.clamp.at[0].has_timing) return std::nullopt;
    const std::size_t slow =
        e.clamp.at[1].has_timing && e.clamp.at[1].release_time_s > e.clamp.at[0].release_time_s ? 1 : 0;
    const std::size_t peak = e.clamp.at[1].peak_collector_v > e.clamp.at[0].peak_collector_v ? 1 : 0;
    const ClampCorner& ks = e.clamp.at[slow];
    const ClampCorner& kp = e.clamp.at[peak];
    TurnOff t;
    t.i0_a = ks.i0_a;
    t.l_h = *s.coil.inductance_h;
    t.r_coil_ohm = e.coil.at[slow].r_cold_ohm;
    t.release_current_a = e.coil.release_current_a;
    t.v_on_v = e.driver.at[slow].on_drop_v;
    t.vc_timing_v = ks.v.timing_v;
    t.r_series_timing_ohm = ks.v.series_timing_ohm;
    t.vs_hi_v = e.conditions.vs_hi_v;
    t.i0_peak_a = kp.i0_a;
    t.r_coil_peak_ohm = e.coil.at[peak].r_cold_ohm;
    // The series resistor's drop follows the current; the rest of the clamp voltage is constant.
    t.vc_peak_v = kp.v.peak_v - kp.i0_a * kp.v.series_ohm;
    t.r_series_peak_ohm = kp.v.series_ohm;
    return t;
}

ClampOption option_for(const Spec& spec, const Sized& sized, ClampSpec clamp, std::string label, bool chosen) {
    Spec s = spec;
    s.clamp = clamp;
    const Evaluation e = evaluate(s, worst_case_conditions(s), sized.r_drive_ohm.value_or(0.0));
    ClampOption o;
    o.label = std::move(label);
    o.clamp = std::move(clamp);
    o.peak_collector_v = e.peak_collector_voltage_v();
    if (e.clamp.at[0].has_timing) o.release_time_s = e.release_time_s();
    o.clamp_energy_j = std::max(e.clamp.at[0].energy_j, e.clamp.at[1].energy_j);
    // Within rating: the collector within its derated rating and the clamp part's pulse (and
    // every other clamp check) passing; a failing option names its check.
    o.within_rating = true;
    for (const CheckId id :
         {CheckId::transistor_voltage, CheckId::clamp_pulse, CheckId::diode_current, CheckId::clamp_power}) {
        if (e.check(id).verdict == Verdict::fail) {
            o.within_rating = false;
            o.failed_check = std::string(check_id_name(id));
            break;
        }
    }
    o.pulse_verdict = e.check(CheckId::clamp_pulse).verdict;
    o.chosen = chosen;
    o.turn_off = turn_off(s, e);
    return o;
}

}  // namespace

std::vector<ClampOption> clamp_options(const Spec& spec, const Catalogue& catalogue, const Sized& sized) {
    std::vector<ClampOption> out;
    if (!spec.coil.inductance_h || !spec.clamp.diode) return out;
    const double derated = sized.worst.driver.peak_limit_v;
    ClampSpec plain;
    plain.type = ClampType::diode;
    plain.diode = spec.clamp.diode;
    out.push_back(
        option_for(spec, sized, plain, "diode " + display_id(*spec.clamp.diode), spec.clamp.type == ClampType::diode));
    if (spec.clamp.type == ClampType::diode_resistor) {
        out.push_back(option_for(spec, sized, spec.clamp,
                                 "diode + " + q(spec.clamp.resistor_ohm.value_or(0), Unit::ohm) + " resistor", true));
    }
    // The highest zeners of the table that keep the collector within the derated rating.
    const double i0 = sized.worst.coil_current_max_a();
    std::vector<const Zener*> fitting;
    for (const Zener& z : catalogue.zeners) {
        ClampSpec zc;
        zc.type = ClampType::diode_zener;
        zc.diode = spec.clamp.diode;
        zc.zener = z;
        Conditions c = sized.conditions;
        c.vz_lo_v = z.vz_v * (1 - z.tolerance);
        c.vz_hi_v = z.vz_v * (1 + z.tolerance);
        const ClampVoltages v = clamp_voltages(zc, i0, c);
        if (sized.conditions.vs_hi_v + v.peak_v > derated) continue;
        // Never offer a zener that fails its pulse rating (or any clamp check).
        if (!option_for(spec, sized, zc, "", false).within_rating) continue;
        fitting.push_back(&z);
    }
    std::stable_sort(fitting.begin(), fitting.end(), [](const Zener* a, const Zener* b) { return a->vz_v > b->vz_v; });
    // One per voltage, three at most, listed from low to high.
    std::vector<const Zener*> shown;
    for (const Zener* z : fitting) {
        if (shown.size() >= 3) break;
        if (std::none_of(shown.begin(), shown.end(),
                         [&](const Zener* s) { return std::abs(s->vz_v - z->vz_v) < 1e-9; })) {
            shown.push_back(z);
        }
    }
    std::reverse(shown.begin(), shown.end());
    const bool spec_zener = spec.clamp.type == ClampType::diode_zener && spec.clamp.zener;
    bool spec_zener_shown = false;
    for (const Zener* z : shown) {
        ClampSpec zc;
        zc.type = ClampType::diode_zener;
        zc.diode = spec.clamp.diode;
        zc.zener = *z;
        const bool chosen = spec_zener && spec.clamp.zener->id == z->id && !spec.clamp.zener->inline_record;
        spec_zener_shown = spec_zener_shown || chosen;
        out.push_back(
            option_for(spec, sized, zc, "diode + zener " + z->id + " (" + q(z->vz_v, Unit::volt) + ")", chosen));
    }
    if (spec_zener && !spec_zener_shown) {
        out.push_back(option_for(
            spec, sized, spec.clamp,
            "diode + zener " + display_id(*spec.clamp.zener) + " (" + q(spec.clamp.zener->vz_v, Unit::volt) + ")",
            true));
    }
    return out;
}

}  // namespace coilfit::report
