#include "coilfit/sizing.hpp"

#include <algorithm>
#include <cmath>
#include <string>

#include "clamp_math.hpp"
#include "coilfit/clamp.hpp"
#include "coilfit/copper.hpp"
#include "curves.hpp"

namespace coilfit {
namespace {

constexpr std::array<std::string_view, check_count> check_names{
    "coil.operate",          "coil.overvoltage",   "transistor.current", "transistor.voltage",
    "transistor.saturation", "transistor.thermal", "pin.current",        "resistor.power",
    "diode.voltage",         "diode.current",      "clamp.power",        "release.time"};

constexpr std::array<Unit, check_count> check_units{
    Unit::volt,   Unit::volt,    Unit::ampere, Unit::volt, Unit::number, Unit::celsius,
    Unit::ampere, Unit::watt,    Unit::volt,   Unit::ampere, Unit::watt, Unit::second};

// value must stay at or below limit
CheckValue at_most(double value, double limit) {
    CheckValue c;
    c.has_value = true;
    c.value = value;
    c.limit = limit;
    c.bound = CheckValue::Bound::at_most;
    c.verdict = value <= limit ? Verdict::pass : Verdict::fail;
    return c;
}

// value must stay at or above limit
CheckValue at_least(double value, double limit) {
    CheckValue c;
    c.has_value = true;
    c.value = value;
    c.limit = limit;
    c.bound = CheckValue::Bound::at_least;
    c.verdict = value >= limit ? Verdict::pass : Verdict::fail;
    return c;
}

CheckValue failed_without_value(double limit) {
    CheckValue c;
    c.verdict = Verdict::fail;
    c.limit = limit;
    return c;
}

double forced_gain_policy(const Spec& spec, double test_ratio) {
    if (spec.policy.forced_gain) return *spec.policy.forced_gain;
    // Common practice: datasheets specify Vce(sat) at Ic/Ib = 10, the textbook ratio for hard
    // saturation. Darlingtons are specified at their own, much higher ratio (e.g. 250 or 1000).
    if (spec.transistor.kind == BipolarKind::darlington) return test_ratio;
    return 10.0;
}

}  // namespace

std::string_view check_id_name(CheckId id) { return check_names.at(static_cast<std::size_t>(id)); }
Unit check_unit(CheckId id) { return check_units.at(static_cast<std::size_t>(id)); }

std::string_view verdict_name(Verdict verdict) {
    switch (verdict) {
    case Verdict::pass: return "pass";
    case Verdict::warn: return "warn";
    case Verdict::fail: return "fail";
    case Verdict::skip: return "skip";
    }
    return "skip";
}

std::string_view clamp_type_name(ClampType type) {
    switch (type) {
    case ClampType::diode: return "diode";
    case ClampType::diode_zener: return "diode_zener";
    case ClampType::diode_resistor: return "diode_resistor";
    case ClampType::none: return "none";
    }
    return "none";
}

Conditions worst_case_conditions(const Spec& spec) {
    Conditions c;
    c.vs_lo_v = spec.supply.voltage_v * (1.0 - spec.supply.tolerance);
    c.vs_hi_v = spec.supply.voltage_v * (1.0 + spec.supply.tolerance);
    c.ta_lo_c = spec.ambient.min_c;
    c.ta_hi_c = spec.ambient.max_c;
    c.vdd_lo_v = spec.pin.vdd_v * (1.0 - spec.pin.vdd_tolerance);
    c.vdd_hi_v = spec.pin.vdd_v * (1.0 + spec.pin.vdd_tolerance);
    c.r_coil_lo_ohm = spec.coil.resistance_ohm * (1.0 - spec.coil.tolerance);
    c.r_coil_hi_ohm = spec.coil.resistance_ohm * (1.0 + spec.coil.tolerance);
    c.rb_lo_factor = 1.0 - spec.base_resistor.tolerance;
    c.rb_hi_factor = 1.0 + spec.base_resistor.tolerance;
    if (spec.clamp.zener) {
        c.vz_lo_v = spec.clamp.zener->vz_v * (1.0 - spec.clamp.zener->tolerance);
        c.vz_hi_v = spec.clamp.zener->vz_v * (1.0 + spec.clamp.zener->tolerance);
    }
    c.hfe_position = 0.0;
    return c;
}

double CheckValue::margin() const {
    if (!has_value) return verdict == Verdict::fail ? -1.0 : 0.0;
    const double headroom = bound == Bound::at_most ? limit - value : value - limit;
    if (limit == 0) return headroom >= 0 ? 0.0 : -1.0;
    return headroom / std::abs(limit);
}

bool Evaluation::passes() const {
    return std::none_of(checks.begin(), checks.end(),
                        [](const CheckValue& c) { return c.verdict == Verdict::fail; });
}

namespace {

// The checks that grow with the switching rate: the diode's average current (from the charge at
// the timing corner, `slow`) and the clamp's power (from the charge and heat at the energy
// corner, `hot`, and the clamp energy per turn-off worked out from it). diode_peak is the diode's
// peak-current check, kept when it is the tighter of the two. True when both rate checks pass.
bool set_rate_checks(Evaluation& e, const Prepared& p, const Conditions& c, const CheckValue& diode_peak,
                     const Decay& slow, const Decay& hot, double clamp_energy_j, Figures figures) {
    const Spec& spec = *p.spec;
    const Policy& policy = spec.policy;
    auto set = [&e](CheckId id, CheckValue v) { e.checks[static_cast<std::size_t>(id)] = v; };
    const double f = *spec.switching_frequency_hz;
    e.has_rate = true;
    e.clamp_power_w = f * clamp_energy_j;
    e.diode_average_current_a = f * slow.charge_c;  // most charge at the lowest clamp voltage
    const Diode& d = *spec.clamp.diode;
    // The diode's average-current rating also bounds the repetitive clamp current.
    const CheckValue avg = at_most(e.diode_average_current_a, d.if_avg_a);
    // The tighter of the two stands; for verdicts alone, the failing one (no margins needed).
    const bool avg_stands = figures == Figures::all ? avg.margin() < diode_peak.margin()
                                                    : avg.verdict == Verdict::fail;
    set(CheckId::diode_current, avg_stands ? avg : diode_peak);
    CheckValue power;
    switch (spec.clamp.type) {
    case ClampType::diode_zener:
        e.zener_power_w = f * c.vz_hi_v * hot.charge_c;
        power = at_most(e.zener_power_w, policy.power_derating * spec.clamp.zener->pd_w);
        break;
    case ClampType::diode_resistor:
        e.clamp_resistor_power_w = f * e.clamp.series_ohm * hot.i2_integral;
        // The clamp resistor's rating is not in the spec; hold it to the base resistor's
        // policy against a 0.25 W part (common practice for a through-hole resistor).
        power = at_most(e.clamp_resistor_power_w, policy.power_derating * 0.25);
        break;
    case ClampType::diode:
        // A diode has no power rating of its own here: its dissipation at the rated average
        // current, if_avg * Vf(if_avg), stands for it.
        power = at_most(e.clamp_power_w, p.diode_rated_power_w);
        break;
    case ClampType::none: return true;
    }
    set(CheckId::clamp_power, power);
    return avg.verdict == Verdict::pass && power.verdict == Verdict::pass;
}

}  // namespace

Prepared prepare(const Spec& spec) {
    Prepared p;
    p.spec = &spec;
    const Policy& policy = spec.policy;
    // Ohm's law at nominal supply and reference resistance, for orientation.
    p.coil_current_nominal_a = spec.supply.voltage_v / spec.coil.resistance_ohm;
    p.release_current_a = spec.coil.must_release * spec.coil.rated_voltage_v / spec.coil.resistance_ohm;
    // Pin as a Thevenin source: R_out = (VDD - VOH) / IOH.
    if (spec.pin.voh_v && spec.pin.voh_current_a && *spec.pin.voh_current_a > 0) {
        p.pin_r_out_ohm = std::max(0.0, (spec.pin.vdd_v - *spec.pin.voh_v) / *spec.pin.voh_current_a);
    }
    p.rth_ja_k_per_w = rth_ja(spec.transistor);
    p.derated_vceo_v = policy.voltage_derating * spec.transistor.vceo_v;
    p.derated_ic_a = policy.current_derating * spec.transistor.ic_max_a;
    p.tj_limit_c = spec.transistor.tj_max_c - policy.junction_margin_k;
    p.resistor_power_limit_w = policy.power_derating * spec.base_resistor.power_rating_w;
    if (spec.clamp.diode) {
        const Diode& d = *spec.clamp.diode;
        p.diode_peak_limit_a = d.ifrm_a ? *d.ifrm_a : d.ifsm_a ? *d.ifsm_a : d.if_avg_a;
        p.diode_rated_power_w = d.if_avg_a * vf_max_at(d, d.if_avg_a).value;
    }
    return p;
}

Evaluation evaluate(const Spec& spec, const Conditions& c, double rb_ohm) { return evaluate(prepare(spec), c, rb_ohm); }

Evaluation evaluate(const Prepared& p, const Conditions& c, double rb_ohm, Figures figures) {
    Evaluation e;
    const bool all = figures == Figures::all;
    const Spec& spec = *p.spec;
    const CoilSpec& coil = spec.coil;
    const Bipolar& tr = spec.transistor;
    const Policy& policy = spec.policy;
    auto set = [&e](CheckId id, CheckValue v) { e.checks[static_cast<std::size_t>(id)] = v; };

    // --- Coil (method.md "Corners"; copper law IEC 60028) ---
    e.coil_temp_hot_c = c.ta_hi_c + coil.self_heating_k;
    e.r_coil_cold_ohm = c.r_coil_lo_ohm * copper_factor(coil.reference_temp_c, c.ta_lo_c);
    e.r_coil_hot_ohm = c.r_coil_hi_ohm * copper_factor(coil.reference_temp_c, e.coil_temp_hot_c);
    e.coil_current_nominal_a = p.coil_current_nominal_a;
    // Highest current: highest supply into the coldest, lowest coil (Vce(sat) neglected).
    e.coil_current_max_a = c.vs_hi_v / e.r_coil_cold_ohm;
    // One log of the operating current serves every table lookup below.
    const double ln_i0 = std::log(e.coil_current_max_a);
    const Lookup vce = curves::vce_sat_at(tr, e.coil_current_max_a, ln_i0);
    e.vce_sat_v = vce.value;
    e.vce_outside = vce.outside;
    // Lowest coil voltage: lowest supply less the saturation voltage.
    e.coil_voltage_min_v = c.vs_lo_v - e.vce_sat_v;
    e.coil_voltage_max_v = c.vs_hi_v;
    if (all) e.coil_current_min_a = std::max(0.0, e.coil_voltage_min_v) / e.r_coil_hot_ohm;
    // Must-operate is an ampere-turn threshold: it rises with the hot coil's copper factor.
    e.operate_voltage_hot_v =
        coil.must_operate * coil.rated_voltage_v * copper_factor(coil.reference_temp_c, e.coil_temp_hot_c);
    e.release_current_a = p.release_current_a;

    set(CheckId::coil_operate, at_least(e.coil_voltage_min_v, e.operate_voltage_hot_v));
    if (coil.max_voltage_v) set(CheckId::coil_overvoltage, at_most(e.coil_voltage_max_v, *coil.max_voltage_v));

    // --- Base drive (method.md "Base drive") ---
    const Lookup hfe_min = curves::hfe_min_at(tr, e.coil_current_max_a, ln_i0);
    e.hfe_min = hfe_min.value;
    e.hfe_outside = hfe_min.outside;
    e.hfe = e.hfe_min;
    if (c.hfe_position > 0) {
        const double typ = curves::hfe_typ_at(tr, e.coil_current_max_a, ln_i0).value;
        e.hfe = e.hfe_min + c.hfe_position * (std::max(typ, e.hfe_min) - e.hfe_min);
    }
    e.vce_sat_test_ratio = curves::vce_sat_test_ratio(tr, e.coil_current_max_a, ln_i0);
    e.forced_gain_policy = forced_gain_policy(spec, e.vce_sat_test_ratio);
    e.beta_target = std::min(e.forced_gain_policy, e.hfe / policy.overdrive);
    e.base_current_required_a = e.coil_current_max_a / e.beta_target;
    // The minimum gain this pin can serve: k * I_max / I_pin (common practice).
    if (all) e.hfe_needed = policy.overdrive * e.coil_current_max_a / spec.pin.max_current_a;
    const Lookup vbe = curves::vbe_sat_at(tr, e.coil_current_max_a, ln_i0);
    e.vbe_sat_v = vbe.value;
    e.vbe_outside = vbe.outside;
    e.vce_sat_not_guaranteed = e.beta_target > e.vce_sat_test_ratio * (1.0 + 1e-9);
    e.pin_r_out_ohm = p.pin_r_out_ohm;
    e.pulldown_current_a = spec.pulldown_ohm ? e.vbe_sat_v / *spec.pulldown_ohm : 0.0;
    if (all) {
        // Rb_max = [(VDD_lo - Vbe_sat) / (Ib_req + Vbe_sat/Rbe) - R_out] / (1 + tb)
        e.base_resistor_max_ohm =
            ((c.vdd_lo_v - e.vbe_sat_v) / (e.base_current_required_a + e.pulldown_current_a) - e.pin_r_out_ohm) /
            c.rb_hi_factor;
        // Rb_min = (VDD_hi - Vbe_low) / (I_pin_limit (1 - tb))
        e.base_resistor_min_ohm = (c.vdd_hi_v - policy.vbe_low_v) / (spec.pin.max_current_a * c.rb_lo_factor);
    }

    set(CheckId::transistor_current, at_most(e.coil_current_max_a, p.derated_ic_a));

    // --- With the resistor ---
    e.base_resistor_ohm = rb_ohm;
    if (rb_ohm > 0) {
        // Lowest base current: VDD_lo, Vbe(sat) max, Rb at +tb, behind R_out, less the pull-down.
        e.base_current_min_a =
            (c.vdd_lo_v - e.vbe_sat_v) / (rb_ohm * c.rb_hi_factor + e.pin_r_out_ohm) - e.pulldown_current_a;
        e.saturates = e.base_current_min_a > 0;
        // Highest pin current: VDD_hi, Vbe low, Rb at -tb, R_out = 0.
        e.pin_current_max_a = std::max(0.0, c.vdd_hi_v - policy.vbe_low_v) / (rb_ohm * c.rb_lo_factor);
        e.resistor_power_w = e.pin_current_max_a * e.pin_current_max_a * rb_ohm * c.rb_lo_factor;
        if (e.saturates) {
            e.forced_gain_worst = e.coil_current_max_a / e.base_current_min_a;
            CheckValue sat = at_most(e.forced_gain_worst, e.beta_target);
            if (sat.verdict == Verdict::pass && e.vce_sat_not_guaranteed) sat.verdict = Verdict::warn;
            set(CheckId::transistor_saturation, sat);
        } else {
            set(CheckId::transistor_saturation, failed_without_value(e.beta_target));
        }
        set(CheckId::pin_current, at_most(e.pin_current_max_a, spec.pin.max_current_a));
        set(CheckId::resistor_power, at_most(e.resistor_power_w, p.resistor_power_limit_w));
        // Steady-state dissipation P = Vce(sat) Ic + Vbe(sat) Ib; Tj = Ta_hi + P RthJA.
        const double ib_max = e.pin_current_max_a;
        e.transistor_power_w = e.vce_sat_v * e.coil_current_max_a + e.vbe_sat_v * ib_max;
    } else {
        set(CheckId::transistor_saturation, failed_without_value(e.beta_target));
        set(CheckId::pin_current, failed_without_value(spec.pin.max_current_a));
        // Without base drive nothing flows; the thermal figure is taken at full coil current.
        e.transistor_power_w = e.vce_sat_v * e.coil_current_max_a;
    }
    e.junction_temp_max_c = c.ta_hi_c + e.transistor_power_w * p.rth_ja_k_per_w;
    set(CheckId::transistor_thermal, at_most(e.junction_temp_max_c, p.tj_limit_c));

    // --- Clamp (method.md "Clamp (flyback) and timing") ---
    const double i0 = e.coil_current_max_a;
    e.clamp = clamp_math::voltages(spec.clamp, i0, c.vz_lo_v, c.vz_hi_v, ln_i0);
    if (e.clamp.limited) {
        // Peak collector voltage: highest supply plus the highest clamp voltage.
        e.peak_collector_voltage_v = c.vs_hi_v + e.clamp.peak_v;
        set(CheckId::transistor_voltage, at_most(e.peak_collector_voltage_v, p.derated_vceo_v));
        const Diode& d = *spec.clamp.diode;
        // The diode blocks the supply while the transistor conducts: VRRM >= Vs_hi / d_V.
        set(CheckId::diode_voltage, at_most(c.vs_hi_v, policy.voltage_derating * d.vrrm_v));
        // Peak forward current: the whole coil current at turn-off, against the repetitive
        // peak rating (or the surge rating, or the average rating when neither is given).
        set(CheckId::diode_current, at_most(i0, p.diode_peak_limit_a));
    } else {
        set(CheckId::transistor_voltage, failed_without_value(p.derated_vceo_v));
    }

    // Stored energy 1/2 L I0^2; without a clamp all of it goes into the transistor at turn-off.
    if (coil.inductance_h && all) e.stored_energy_j = stored_energy(*coil.inductance_h, i0);
    const bool release_checked = coil.max_release_time_s.has_value();
    const bool rate_checked = spec.switching_frequency_hz.has_value();
    if (coil.inductance_h && e.clamp.limited && (all || release_checked || rate_checked)) {
        const double l = *coil.inductance_h;
        e.has_timing = true;
        // Timing corner: cold coil (longest tau, highest I0) and the lowest clamp voltage.
        // Energy corner: the highest clamp voltage takes the largest share of the stored energy.
        const double r_loop = e.r_coil_cold_ohm + e.clamp.series_ohm;
        const double vc_energy = spec.clamp.type == ClampType::diode_resistor
                                     ? e.clamp.peak_v - i0 * e.clamp.series_ohm
                                     : e.clamp.peak_v;
        const CheckValue diode_peak = e.check(CheckId::diode_current);
        // Verdicts only, no series resistor: the charge through the clamp is at most tau*I0
        // (Q = tau*I0 - (Vc/R)*t_end, the second term is not negative) and the rate checks grow
        // with it, so where they pass at that bound they pass, and the charge logarithms are
        // spared. Otherwise (and always for every figure) the decays are worked out.
        bool exact_rate = all || rate_checked;
        if (!all && rate_checked && e.clamp.series_ohm == 0) {
            Decay bound;
            bound.tau_s = l / r_loop;
            bound.charge_c = bound.tau_s * i0;
            const double bound_energy = clamp_math::energy(bound, vc_energy, e.clamp.series_ohm);
            exact_rate = !set_rate_checks(e, p, c, diode_peak, bound, bound, bound_energy, figures);
        }
        if (exact_rate || release_checked) {
            // A release current of I0 spares the release log where no one reads the release
            // time; without exact rate checks the charge (and its log) is not needed either.
            const double i_release = all || release_checked ? e.release_current_a : i0;
            const Decay slow = clamp_math::decay(l, r_loop, e.clamp.timing_v, i0, i_release, exact_rate);
            e.release_time_s = slow.release_time_s;
            e.current_zero_time_s = slow.end_time_s;
            e.clamp_charge_c = slow.charge_c;
            if (exact_rate) {
                // Only the energy corner's charge and heat are used, never its release time.
                const Decay hot = clamp_math::decay(l, r_loop, vc_energy, i0, i0);
                e.clamp_energy_j = clamp_math::energy(hot, vc_energy, e.clamp.series_ohm);
                if (rate_checked) set_rate_checks(e, p, c, diode_peak, slow, hot, e.clamp_energy_j, figures);
            }
        }
        if (coil.max_release_time_s) set(CheckId::release_time, at_most(e.release_time_s, *coil.max_release_time_s));
    }
    return e;
}

void precompute_logs(Spec& spec) {
    precompute_logs(spec.transistor);
    if (spec.clamp.diode) precompute_logs(*spec.clamp.diode);
}

std::optional<double> choose_base_resistor(const Spec& spec, const Evaluation& worst) {
    if (spec.base_resistor.value_ohm) return spec.base_resistor.value_ohm;
    if (!(worst.base_resistor_max_ohm > 0)) return std::nullopt;
    return eseries_floor(worst.base_resistor_max_ohm, spec.base_resistor.series);
}

Sized size_numbers(const Spec& spec) {
    Sized s;
    s.conditions = worst_case_conditions(spec);
    const Evaluation bare = evaluate(spec, s.conditions, 0.0);
    s.rb_ohm = choose_base_resistor(spec, bare);
    s.worst = s.rb_ohm ? evaluate(spec, s.conditions, *s.rb_ohm) : bare;
    return s;
}

}  // namespace coilfit
