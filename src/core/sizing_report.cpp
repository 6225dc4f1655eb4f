// Words for the numbers: builds the SizingReport (checks with messages, quantities, notes,
// cautions, the clamp trade-off table) from the worst-case evaluation in sizing.cpp.
#include <algorithm>
#include <cmath>
#include <string>

#include "coilfit/clamp.hpp"
#include "coilfit/sizing.hpp"

namespace coilfit {
namespace {

std::string q(double value, Unit unit) { return format_quantity(value, unit); }

// Extra-low voltage limits: 50 V AC, 120 V ripple-free DC (IEC 61140 / IEC 60364 ELV bands).
constexpr double elv_ac_v = 50.0;
constexpr double elv_dc_v = 120.0;

std::string check_message(CheckId id, const Spec& spec, const Evaluation& e, const CheckValue& c) {
    const Policy& p = spec.policy;
    const Bipolar& tr = spec.transistor;
    const bool ok = c.verdict == Verdict::pass || c.verdict == Verdict::warn;
    switch (id) {
    case CheckId::coil_operate:
        if (ok) {
            return "the coil gets at least " + q(e.coil_voltage_min_v, Unit::volt) +
                   " at the lowest supply; hot (" + q(e.coil_temp_hot_c, Unit::celsius) + ") it needs " +
                   q(e.operate_voltage_hot_v, Unit::volt) + " to operate";
        }
        if (e.coil_voltage_min_v <= 0) {
            // The transistor's saturation voltage alone takes the whole lowest supply.
            return "Vce(sat) " + q(e.vce_sat_v, Unit::volt) + " takes the whole lowest supply " +
                   q(e.coil_voltage_min_v + e.vce_sat_v, Unit::volt) + ", so the coil gets no voltage but needs " +
                   q(e.operate_voltage_hot_v, Unit::volt) + " to operate when hot: the supply is far too low for this "
                   "coil and transistor";
        }
        return "the coil gets only " + q(e.coil_voltage_min_v, Unit::volt) +
               " at the lowest supply but needs " + q(e.operate_voltage_hot_v, Unit::volt) +
               " to operate when hot (" + q(e.coil_temp_hot_c, Unit::celsius) +
               "): it may not pull in; raise or tighten the supply, lower the ambient, or use a coil "
               "rated for a lower voltage";
    case CheckId::coil_overvoltage:
        return "the coil sees up to " + q(e.coil_voltage_max_v, Unit::volt) + " against its maximum " +
               q(c.limit, Unit::volt) +
               (ok ? std::string() : std::string(": tighten the supply or use a coil rated for it"));
    case CheckId::transistor_current:
        return "coil current up to " + q(e.coil_current_max_a, Unit::ampere) + " against " +
               q(c.limit, Unit::ampere) + " (" + q(p.current_derating, Unit::ratio) + " of Ic max " +
               q(tr.ic_max_a, Unit::ampere) + ")" +
               (ok ? std::string()
                   : ": choose a transistor rated for at least " +
                         q(e.coil_current_max_a / p.current_derating, Unit::ampere));
    case CheckId::transistor_voltage:
        if (!e.clamp.limited) {
            return "no clamp: at turn-off the collector voltage is limited only by breakdown, and the "
                   "stored energy 1/2 L I^2" +
                   (spec.coil.inductance_h ? " (" + q(e.stored_energy_j, Unit::joule) + ")" : std::string()) +
                   " goes into the transistor; fit a diode across the coil";
        }
        return "the collector flies to " + q(e.peak_collector_voltage_v, Unit::volt) +
               " at turn-off against " + q(c.limit, Unit::volt) + " (" + q(p.voltage_derating, Unit::ratio) +
               " of Vceo " + q(tr.vceo_v, Unit::volt) + ")" +
               (ok ? std::string()
                   : ": use a lower clamp voltage or a transistor with Vceo of at least " +
                         q(e.peak_collector_voltage_v / p.voltage_derating, Unit::volt));
    case CheckId::transistor_saturation: {
        const std::string target = "the target " + format_quantity(e.beta_target, Unit::number) +
                                   " = min(forced gain " + format_quantity(e.forced_gain_policy, Unit::number) +
                                   ", hFE min " + format_quantity(e.hfe_min, Unit::number) + " / overdrive " +
                                   format_quantity(p.overdrive, Unit::number) + ")";
        if (e.base_resistor_ohm <= 0) {
            return "no resistor of the " + std::string(eseries_name(spec.base_resistor.series)) +
                   " series drives the base hard enough: the pin at " + q(spec.pin.vdd_v * (1 - spec.pin.vdd_tolerance), Unit::volt) +
                   " less Vbe(sat) " + q(e.vbe_sat_v, Unit::volt) + " cannot deliver " +
                   q(e.base_current_required_a, Unit::ampere) + "; use a higher-gain transistor or a buffer";
        }
        if (!e.saturates) {
            return "the base gets no current at the low corner (the pull-down takes it all): the "
                   "transistor does not switch on; use a smaller base resistor or a larger pull-down";
        }
        std::string m = "worst-case forced gain Ic/Ib " + format_quantity(e.forced_gain_worst, Unit::number) +
                        " against " + target;
        if (c.verdict == Verdict::fail) m += ": the transistor may not saturate; use a smaller base resistor";
        if (c.verdict == Verdict::warn) {
            m += "; Vce(sat) is specified at Ic/Ib = " + format_quantity(e.vce_sat_test_ratio, Unit::number) +
                 " and is not guaranteed at this looser drive";
        }
        return m;
    }
    case CheckId::transistor_thermal:
        return "junction up to " + q(e.junction_temp_max_c, Unit::celsius) + " at " +
               q(spec.ambient.max_c, Unit::celsius) + " ambient (" + q(e.transistor_power_w, Unit::watt) +
               " at " + q(rth_ja(tr), Unit::kelvin_per_watt) + ") against " + q(c.limit, Unit::celsius) +
               " (Tj max less " + q(p.junction_margin_k, Unit::kelvin) + ")" +
               (ok ? std::string() : ": use a transistor in a larger package or with a lower Vce(sat)");
    case CheckId::pin_current: {
        if (e.base_resistor_ohm <= 0 && e.vbe_sat_v >= spec.pin.vdd_v * (1 - spec.pin.vdd_tolerance)) {
            // No gain helps when the pin's own voltage does not reach Vbe(sat).
            return "the pin's lowest VDD " + q(spec.pin.vdd_v * (1 - spec.pin.vdd_tolerance), Unit::volt) +
                   " does not reach Vbe(sat) " + q(e.vbe_sat_v, Unit::volt) +
                   ": no base resistor and no gain can switch this transistor on; use a pin with a higher supply or a "
                   "buffer";
        }
        if (e.base_resistor_ohm <= 0) {
            return "no base resistor can be chosen, so the pin cannot drive this transistor; a part with "
                   "hFE of at least " + format_quantity(e.hfe_needed, Unit::number) + " at " +
                   q(e.coil_current_max_a, Unit::ampere) + " would";
        }
        std::string m = "the pin sources up to " + q(e.pin_current_max_a, Unit::ampere) + " at " +
                        q(spec.pin.vdd_v * (1 + spec.pin.vdd_tolerance), Unit::volt) + " against its limit " +
                        q(c.limit, Unit::ampere);
        if (!ok) {
            m += ": the base resistor must be at least " + q(e.base_resistor_min_ohm, Unit::ohm) +
                 " for the pin but at most " + q(e.base_resistor_max_ohm, Unit::ohm) + " to saturate the transistor";
            if (e.forced_gain_policy * p.overdrive <= e.hfe) {
                // The forced-gain policy, not the part's gain, sets the base current.
                m += "; the forced gain " + format_quantity(e.forced_gain_policy, Unit::number) +
                     " sets the base current, so more hFE does not help: use a Darlington, a pin or buffer that can source " +
                     q(e.pin_current_max_a, Unit::ampere) + ", or a looser policy.forced_gain (Vce(sat) is then not guaranteed)";
            } else {
                m += "; use a transistor with hFE min of at least " + format_quantity(e.hfe_needed, Unit::number) +
                     " at " + q(e.coil_current_max_a, Unit::ampere) + " (a Darlington, say), or a pin or buffer that can source " +
                     q(e.pin_current_max_a, Unit::ampere);
            }
        }
        return m;
    }
    case CheckId::resistor_power:
        return "the base resistor dissipates up to " + q(e.resistor_power_w, Unit::watt) + " against " +
               q(c.limit, Unit::watt) + " (" + q(p.power_derating, Unit::ratio) + " of " +
               q(spec.base_resistor.power_rating_w, Unit::watt) + ")" +
               (ok ? std::string() : ": use a resistor with a higher power rating");
    case CheckId::diode_voltage:
        return "the diode blocks up to " + q(c.value, Unit::volt) + " against " + q(c.limit, Unit::volt) +
               " (" + q(p.voltage_derating, Unit::ratio) + " of VRRM " +
               q(spec.clamp.diode ? spec.clamp.diode->vrrm_v : 0.0, Unit::volt) + ")" +
               (ok ? std::string() : ": use a diode with a higher reverse voltage rating");
    case CheckId::diode_current:
        if (e.has_rate && std::abs(c.value - e.diode_average_current_a) < 1e-15) {
            return "the clamp carries " + q(c.value, Unit::ampere) + " on average at " +
                   q(*spec.switching_frequency_hz, Unit::hertz) + " against the diode's average rating " +
                   q(c.limit, Unit::ampere) + (ok ? std::string() : ": use a larger diode or switch less often");
        }
        return "the diode takes the whole coil current " + q(c.value, Unit::ampere) +
               " at turn-off against its peak rating " + q(c.limit, Unit::ampere) +
               (ok ? std::string() : ": use a diode with a higher peak current rating");
    case CheckId::clamp_power:
        return "the clamp dissipates " + q(c.value, Unit::watt) + " on average at " +
               q(spec.switching_frequency_hz.value_or(0), Unit::hertz) + " against " + q(c.limit, Unit::watt) +
               (ok ? std::string() : ": use a larger clamp part or switch less often");
    case CheckId::release_time:
        return "the relay lets go within " + q(e.release_time_s, Unit::second) + " (cold coil, lowest clamp voltage) against " +
               q(c.limit, Unit::second) +
               (ok ? std::string() : ": a diode + zener clamp releases faster; see the clamp options");
    }
    return {};
}

std::string skip_message(CheckId id, const Spec& spec) {
    switch (id) {
    case CheckId::coil_overvoltage: return "not checked: give coil.max_voltage to check it";
    case CheckId::diode_voltage:
    case CheckId::diode_current: return "not checked: there is no clamp diode";
    case CheckId::clamp_power:
        if (spec.clamp.type == ClampType::none) return "not checked: there is no clamp";
        if (!spec.coil.inductance_h) return "not checked: give coil.inductance to estimate the clamp energy";
        return "not checked: give switching.frequency to estimate the clamp's average power";
    case CheckId::release_time:
        if (!spec.coil.max_release_time_s) return "not checked: give coil.max_release_time to check it";
        if (spec.clamp.type == ClampType::none) {
            return "not checked: without a clamp the turn-off is set by the transistor's breakdown; fit a clamp";
        }
        return "not checked: give coil.inductance to estimate the release time";
    default: return "not checked";
    }
}

void add(std::vector<QuantityEntry>& out, std::string key, double value, Unit unit, std::string label) {
    if (!std::isfinite(value)) return;  // never NaN or infinity in a report
    out.push_back({std::move(key), value, unit, std::move(label)});
}

bool used_default(const Spec& spec, std::string_view field) {
    return std::any_of(spec.defaults_used.begin(), spec.defaults_used.end(),
                       [&](const std::string& d) { return d.rfind(field, 0) == 0; });
}

std::vector<ClampOption> clamp_options(const Spec& spec, const Catalogue& catalogue, const Sized& sized) {
    std::vector<ClampOption> out;
    if (!spec.coil.inductance_h || !spec.clamp.diode) return out;
    const double derated = spec.policy.voltage_derating * spec.transistor.vceo_v;
    const double rb = sized.rb_ohm.value_or(0.0);
    auto option_for = [&](ClampSpec clamp, std::string label, bool chosen) {
        Spec s = spec;
        s.clamp = std::move(clamp);
        const Evaluation e = evaluate(s, worst_case_conditions(s), rb);
        ClampOption o;
        o.label = std::move(label);
        o.peak_collector_v = e.peak_collector_voltage_v;
        if (e.has_timing) o.release_time_s = e.release_time_s;
        o.clamp_energy_j = e.clamp_energy_j;
        o.within_rating = e.peak_collector_voltage_v <= derated;
        o.chosen = chosen;
        return o;
    };
    ClampSpec plain;
    plain.type = ClampType::diode;
    plain.diode = spec.clamp.diode;
    out.push_back(option_for(plain, "diode " + spec.clamp.diode->id, spec.clamp.type == ClampType::diode));
    if (spec.clamp.type == ClampType::diode_resistor) {
        out.push_back(option_for(spec.clamp,
                                 "diode + " + q(spec.clamp.resistor_ohm.value_or(0), Unit::ohm) + " resistor", true));
    }
    // The highest zeners of the table that keep the collector within the derated Vceo.
    std::vector<const Zener*> fitting;
    for (const Zener& z : catalogue.zeners) {
        ClampSpec zc;
        zc.type = ClampType::diode_zener;
        zc.diode = spec.clamp.diode;
        zc.zener = z;
        Spec s = spec;
        s.clamp = zc;
        const ClampVoltages v = clamp_voltages(zc, sized.worst.coil_current_max_a, 0, z.vz_v * (1 + z.tolerance));
        if (sized.conditions.vs_hi_v + v.peak_v <= derated) fitting.push_back(&z);
    }
    std::stable_sort(fitting.begin(), fitting.end(), [](const Zener* a, const Zener* b) { return a->vz_v > b->vz_v; });
    // One per voltage, three at most, listed from low to high.
    std::vector<const Zener*> shown;
    for (const Zener* z : fitting) {
        if (shown.size() >= 3) break;
        if (std::none_of(shown.begin(), shown.end(), [&](const Zener* s) { return std::abs(s->vz_v - z->vz_v) < 1e-9; })) {
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
        const bool chosen = spec_zener && spec.clamp.zener->id == z->id;
        spec_zener_shown = spec_zener_shown || chosen;
        out.push_back(option_for(zc, "diode + zener " + z->id + " (" + q(z->vz_v, Unit::volt) + ")", chosen));
    }
    if (spec_zener && !spec_zener_shown) {
        out.push_back(option_for(spec.clamp,
                                 "diode + zener " + spec.clamp.zener->id + " (" + q(spec.clamp.zener->vz_v, Unit::volt) + ")",
                                 true));
    }
    return out;
}

}  // namespace

const Check* SizingReport::find_check(std::string_view id) const {
    const auto it = std::find_if(checks.begin(), checks.end(), [&](const Check& c) { return c.id == id; });
    return it == checks.end() ? nullptr : &*it;
}

std::optional<double> SizingReport::quantity(std::string_view key) const {
    const auto it = std::find_if(quantities.begin(), quantities.end(), [&](const QuantityEntry& e) { return e.key == key; });
    if (it == quantities.end()) return std::nullopt;
    return it->value;
}

const Check* SizingReport::worst_check() const {
    const Check* worst = nullptr;
    for (const Check& c : checks) {
        if (!c.margin) continue;
        if (!worst || *c.margin < *worst->margin) worst = &c;
    }
    return worst;
}

SizingReport size(const Spec& spec, const Catalogue& catalogue) {
    const Sized sized = size_numbers(spec);
    const Evaluation& e = sized.worst;
    SizingReport r;

    r.resistor.value_ohm = sized.rb_ohm;
    r.resistor.series = spec.base_resistor.series;
    r.resistor.tolerance = spec.base_resistor.tolerance;
    r.resistor.power_rating_w = spec.base_resistor.power_rating_w;
    r.resistor.fixed = spec.base_resistor.value_ohm.has_value();

    // --- checks ---
    bool failed = false;
    for (std::size_t i = 0; i < check_count; ++i) {
        const auto id = static_cast<CheckId>(i);
        const CheckValue& c = e.checks[i];
        Check out;
        out.id = std::string(check_id_name(id));
        out.verdict = c.verdict;
        out.unit = check_unit(id);
        if (c.verdict == Verdict::skip) {
            out.message = skip_message(id, spec);
        } else {
            if (c.has_value && std::isfinite(c.value)) out.value = c.value;
            if (std::isfinite(c.limit)) out.limit = c.limit;
            if (const double m = c.margin(); std::isfinite(m)) out.margin = m;
            out.message = check_message(id, spec, e, c);
        }
        failed = failed || c.verdict == Verdict::fail;
        r.has_warnings = r.has_warnings || c.verdict == Verdict::warn;
        r.checks.push_back(std::move(out));
    }
    r.verdict = failed ? Verdict::fail : Verdict::pass;

    // --- quantities (contract keys first, then the supporting figures) ---
    auto& qs = r.quantities;
    add(qs, "coil_current_nominal_a", e.coil_current_nominal_a, Unit::ampere, "coil current, nominal");
    add(qs, "coil_current_max_a", e.coil_current_max_a, Unit::ampere, "coil current, highest (cold coil, high supply)");
    add(qs, "coil_current_min_a", e.coil_current_min_a, Unit::ampere, "coil current, lowest (hot coil, low supply)");
    add(qs, "coil_resistance_cold_ohm", e.r_coil_cold_ohm, Unit::ohm, "coil resistance, cold and low");
    add(qs, "coil_resistance_hot_ohm", e.r_coil_hot_ohm, Unit::ohm, "coil resistance, hot and high");
    add(qs, "coil_temperature_hot_c", e.coil_temp_hot_c, Unit::celsius, "coil temperature, hot");
    add(qs, "coil_voltage_min_v", e.coil_voltage_min_v, Unit::volt, "coil voltage, lowest");
    add(qs, "operate_voltage_hot_v", e.operate_voltage_hot_v, Unit::volt, "must-operate voltage, hot coil");
    add(qs, "release_current_a", e.release_current_a, Unit::ampere, "release current (must-release)");
    add(qs, "hfe_min", e.hfe_min, Unit::number, "hFE min at the highest coil current");
    add(qs, "hfe_needed", e.hfe_needed, Unit::number, "hFE min needed on this pin (overdrive x I / I pin)");
    add(qs, "forced_gain_target", e.beta_target, Unit::number, "forced gain target");
    add(qs, "base_current_required_a", e.base_current_required_a, Unit::ampere, "base current required");
    add(qs, "vce_sat_v", e.vce_sat_v, Unit::volt, "Vce(sat) max at the highest coil current");
    add(qs, "vbe_sat_v", e.vbe_sat_v, Unit::volt, "Vbe(sat) max at the highest coil current");
    add(qs, "pin_output_resistance_ohm", e.pin_r_out_ohm, Unit::ohm, "pin output resistance");
    add(qs, "base_resistor_max_ohm", e.base_resistor_max_ohm, Unit::ohm, "base resistor, largest that saturates");
    add(qs, "base_resistor_min_ohm", e.base_resistor_min_ohm, Unit::ohm, "base resistor, smallest the pin can carry");
    if (sized.rb_ohm) {
        add(qs, "base_resistor_ohm", *sized.rb_ohm, Unit::ohm, "base resistor");
        add(qs, "base_current_min_a", e.base_current_min_a, Unit::ampere, "base current, lowest");
        add(qs, "pin_current_max_a", e.pin_current_max_a, Unit::ampere, "pin current, highest");
        if (e.saturates) add(qs, "forced_gain_worst", e.forced_gain_worst, Unit::number, "forced gain, worst case");
        add(qs, "resistor_power_w", e.resistor_power_w, Unit::watt, "base resistor power, highest");
    }
    add(qs, "transistor_power_w", e.transistor_power_w, Unit::watt, "transistor power, highest");
    add(qs, "junction_temp_max_c", e.junction_temp_max_c, Unit::celsius, "junction temperature, highest");
    if (e.clamp.limited) {
        add(qs, "peak_collector_voltage_v", e.peak_collector_voltage_v, Unit::volt, "collector voltage at turn-off, peak");
        add(qs, "clamp_voltage_peak_v", e.clamp.peak_v, Unit::volt, "clamp voltage, highest");
        add(qs, "clamp_voltage_timing_v", e.clamp.timing_v, Unit::volt, "clamp voltage, lowest (for timing)");
    }
    if (e.has_timing) {
        add(qs, "release_time_s", e.release_time_s, Unit::second, "release time, longest");
        add(qs, "current_zero_time_s", e.current_zero_time_s, Unit::second, "time until the coil current is zero");
    }
    if (spec.coil.inductance_h) add(qs, "stored_energy_j", e.stored_energy_j, Unit::joule, "stored energy 1/2 L I^2");
    if (e.has_timing) {
        add(qs, "clamp_energy_j", e.clamp_energy_j, Unit::joule, "clamp energy per turn-off");
        add(qs, "clamp_charge_coulomb", e.clamp_charge_c, Unit::coulomb, "charge through the clamp");
    }
    if (e.has_rate) {
        add(qs, "clamp_power_w", e.clamp_power_w, Unit::watt, "clamp average power");
        add(qs, "diode_average_current_a", e.diode_average_current_a, Unit::ampere, "diode average current");
        if (spec.clamp.type == ClampType::diode_zener) add(qs, "zener_power_w", e.zener_power_w, Unit::watt, "zener average power");
        if (spec.clamp.type == ClampType::diode_resistor) {
            add(qs, "clamp_resistor_power_w", e.clamp_resistor_power_w, Unit::watt, "clamp resistor average power");
        }
    }

    // --- notes ---
    auto& notes = r.notes;
    for (const std::string& d : spec.defaults_used) notes.push_back("default used: " + d);
    if (used_default(spec, "coil.self_heating")) {
        notes.push_back("coil self-heating taken as 0 K: the hot coil needs more voltage to operate; ask the maker "
                        "for the winding temperature rise, or measure it, and give coil.self_heating");
    }
    notes.push_back("a transistor on this pin needs hFE min of at least " + format_quantity(e.hfe_needed, Unit::number) +
                    " at " + q(e.coil_current_max_a, Unit::ampere) + " (overdrive " +
                    format_quantity(spec.policy.overdrive, Unit::number) + " x coil current / pin limit " +
                    q(spec.pin.max_current_a, Unit::ampere) + ")");
    if (!spec.policy.forced_gain && spec.transistor.kind == BipolarKind::darlington) {
        notes.push_back("forced gain taken from the Darlington's Vce(sat) test ratio, " +
                        format_quantity(e.forced_gain_policy, Unit::number) + ", instead of 10");
    }
    const std::string at = " at " + q(e.coil_current_max_a, Unit::ampere);
    if (e.hfe_outside) notes.push_back("the operating point" + at + " lies outside " + spec.transistor.id + "'s hFE points; the nearest point was used");
    if (e.vce_outside) notes.push_back("the operating point" + at + " lies outside " + spec.transistor.id + "'s Vce(sat) points; the nearest point was used");
    if (e.vbe_outside) notes.push_back("the operating point" + at + " lies outside " + spec.transistor.id + "'s Vbe(sat) points; the nearest point was used");
    if (e.clamp.vf_outside && spec.clamp.diode) {
        notes.push_back("the coil current" + at + " lies outside " + spec.clamp.diode->id + "'s forward-voltage points; the nearest point was used");
    }
    if (e.vce_sat_not_guaranteed) {
        notes.push_back("Vce(sat) is specified at Ic/Ib = " + format_quantity(e.vce_sat_test_ratio, Unit::number) +
                        "; the drive target " + format_quantity(e.beta_target, Unit::number) +
                        " is looser, so the coil voltage figure is not guaranteed; set policy.forced_gain to " +
                        format_quantity(e.vce_sat_test_ratio, Unit::number) + " for a guaranteed Vce(sat)");
    }
    if (!spec.pulldown_ohm) {
        const double rb = sized.rb_ohm.value_or(10e3);
        const double suggested = eseries_nearest(std::clamp(10.0 * rb, 10e3, 100e3), ESeries::e12).value_or(47e3);
        notes.push_back("no base-emitter pull-down: while the pin floats during reset the transistor may conduct; fit about " +
                        q(suggested, Unit::ohm) + " from base to emitter and give it as pulldown (it takes Vbe/Rbe from the base drive)");
    }
    if (!spec.coil.inductance_h) {
        notes.push_back("no coil inductance: release time and clamp energy are not estimated; measure the coil with an LCR "
                        "meter with the armature held in its energised position, or ask the maker, and give coil.inductance");
    }
    if (!sized.rb_ohm) {
        notes.push_back("no value of the " + std::string(eseries_name(spec.base_resistor.series)) +
                        " series is at most the largest base resistor that saturates (" + q(e.base_resistor_max_ohm, Unit::ohm) + ")");
    } else if (!r.resistor.fixed && *sized.rb_ohm < e.base_resistor_min_ohm) {
        notes.push_back("no base resistor works: the transistor needs at most " + q(e.base_resistor_max_ohm, Unit::ohm) +
                        " but the pin needs at least " + q(e.base_resistor_min_ohm, Unit::ohm));
    }
    if (spec.clamp.type == ClampType::diode_resistor) {
        notes.push_back("the clamp resistor's power is checked against a 0.25 W part derated by policy.power_derating");
    }

    // --- cautions ---
    r.cautions.push_back("figures are worst-case estimates from datasheet limits; the shipped parts table holds values "
                         "from memory: confirm every part against the datasheet in use and the design on the bench; "
                         "wiring to mains follows local electrical codes and licensed practice");
    const std::string contact_rules =
        "keep creepage and clearance between the coil circuit and the contacts, fuse the load, enclose live parts, "
        "and follow local electrical codes and licensed practice";
    if (spec.load) {
        const bool hazardous = spec.load->kind == LoadKind::ac ? spec.load->voltage_v > elv_ac_v : spec.load->voltage_v > elv_dc_v;
        if (hazardous) {
            r.cautions.push_back("the contacts switch " + q(spec.load->voltage_v, Unit::volt) +
                                 (spec.load->kind == LoadKind::ac ? " AC" : " DC") +
                                 ", above extra-low voltage: hazardous; " + contact_rules);
        }
    } else {
        r.cautions.push_back("if the contacts switch mains or any voltage above extra-low voltage (50 V AC, 120 V DC): " + contact_rules);
    }

    r.clamp_options = clamp_options(spec, catalogue, sized);
    return r;
}

}  // namespace coilfit
