#include "coilfit/pick.hpp"

#include <algorithm>
#include <cmath>
#include <map>

#include "coilfit/sizing.hpp"

namespace coilfit {
namespace {

std::string reason_for(std::string_view check, const Evaluation& e, const Spec& spec, std::string_view family) {
    const std::string at = " at " + format_quantity(e.coil_current_max_a, Unit::ampere);
    if (check == "pin.current" || check == "transistor.saturation") {
        // A pin whose lowest VDD does not reach Vbe(sat) drives no base current through any
        // resistor; a Darlington, whose Vbe(sat) is higher still, would not help.
        const double vdd_lo = spec.pin.vdd_v * (1.0 - spec.pin.vdd_tolerance);
        if (vdd_lo <= e.vbe_sat_v) {
            return "the pin's lowest VDD of " + format_quantity(vdd_lo, Unit::volt) + " does not reach their Vbe(sat) of " +
                   format_quantity(e.vbe_sat_v, Unit::volt) +
                   ", so no base resistor can drive them; a higher pin voltage or a level-shifting stage would";
        }
        if (e.forced_gain_policy * spec.policy.overdrive <= e.hfe) {
            return "the pin can't supply the base current that forced gain " +
                   format_quantity(e.forced_gain_policy, Unit::number) + " asks for (" +
                   format_quantity(e.base_current_required_a, Unit::ampere) + "); " +
                   (family == "darlington" ? "a pin or buffer that can source it would"
                                           : "a Darlington would, or a pin or buffer that can source it");
        }
        return "the pin can't supply the base current; " + (family == "darlington" ? std::string() : "a Darlington or ") +
               "a part with hFE min of at least " + format_quantity(e.hfe_needed, Unit::number) + at + " would";
    }
    if (check == "transistor.current") {
        return "the coil current" + at + " is above " + format_quantity(spec.policy.current_derating, Unit::ratio) +
               " of their Ic max";
    }
    if (check == "transistor.voltage") {
        return e.clamp.limited ? "the collector peak of " + format_quantity(e.peak_collector_voltage_v, Unit::volt) +
                                     " is above " + format_quantity(spec.policy.voltage_derating, Unit::ratio) + " of their Vceo"
                               : "without a clamp no transistor survives turn-off";
    }
    if (check == "transistor.thermal") return "the junction runs too hot at the highest ambient";
    if (check == "coil.operate") {
        return "the coil gets only " + format_quantity(e.coil_voltage_min_v, Unit::volt) +
               " (lowest supply less their Vce(sat) of " + format_quantity(e.vce_sat_v, Unit::volt) + ") but needs " +
               format_quantity(e.operate_voltage_hot_v, Unit::volt) + " to operate when hot";
    }
    if (check == "coil.overvoltage") return "the coil's maximum voltage is exceeded whatever the transistor";
    if (check == "resistor.power") return "the base resistor's power rating is too low for the base current they need";
    if (check.rfind("diode.", 0) == 0 || check == "clamp.power") return "no diode of the table passes " + std::string(check);
    if (check == "release.time") return "the release is too slow with this clamp type; try diode_zener";
    return "fails " + std::string(check);
}

}  // namespace

std::string transistor_family(const Bipolar& part) {
    if (part.kind == BipolarKind::darlington) return "darlington";
    // Common practice: small-signal parts are rated below 1 A and 1 W in free air.
    return (part.ic_max_a >= 1.0 || part.pd_w >= 1.0) ? "medium-power" : "small-signal";
}

PickResult pick(const Spec& spec, const Catalogue& catalogue) {
    PickResult result;
    std::vector<std::optional<Diode>> diodes;
    if (spec.clamp.type == ClampType::none) {
        diodes.emplace_back(std::nullopt);
    } else {
        for (const Diode& d : catalogue.diodes) diodes.emplace_back(d);
        if (diodes.empty() && spec.clamp.diode) diodes.emplace_back(spec.clamp.diode);
    }
    // Per family, how often each check was the first to fail, and one evaluation to word it.
    std::map<std::string, std::map<std::string, int>> family_fails;
    std::map<std::string, Evaluation> family_eval;

    // Each part is evaluated with many partners: its ln(current) points once.
    for (auto& d : diodes) {
        if (d) precompute_logs(*d);
    }
    Spec trial = spec;
    for (const Bipolar& t : catalogue.bipolars) {
        trial.transistor = t;
        precompute_logs(trial.transistor);
        for (const auto& d : diodes) {
            trial.clamp.diode = d;
            const Sized sized = size_numbers(trial);
            const Evaluation& e = sized.worst;
            Candidate c;
            c.transistor = t.id;
            c.diode = d ? d->id : std::string();
            c.family = transistor_family(t);
            c.base_resistor_ohm = sized.rb_ohm;
            c.pin_current_max_a = e.pin_current_max_a;
            bool first = true;
            double worst = 0;
            for (std::size_t i = 0; i < check_count; ++i) {
                const CheckValue& v = e.checks[i];
                if (v.verdict == Verdict::skip) continue;
                if (v.verdict == Verdict::fail) c.failed.emplace_back(check_id_name(static_cast<CheckId>(i)));
                if (first || v.margin() < worst) {
                    worst = v.margin();
                    c.worst_check = std::string(check_id_name(static_cast<CheckId>(i)));
                    first = false;
                }
            }
            c.worst_margin = std::isfinite(worst) ? worst : -1.0;
            c.verdict = c.failed.empty() ? Verdict::pass : Verdict::fail;
            if (!c.failed.empty()) {
                // Word the family's reason by its transistor-side failure when there is one.
                std::string key = c.failed.front();
                for (const auto& f : c.failed) {
                    if (f.rfind("transistor.", 0) == 0 || f == "pin.current") {
                        key = f;
                        break;
                    }
                }
                ++family_fails[c.family][key];
                family_eval.emplace(c.family + "|" + key, e);
            }
            result.candidates.push_back(std::move(c));
        }
    }

    std::stable_sort(result.candidates.begin(), result.candidates.end(), [](const Candidate& a, const Candidate& b) {
        if (a.verdict != b.verdict) return a.verdict == Verdict::pass;
        if (a.worst_margin != b.worst_margin) return a.worst_margin > b.worst_margin;
        if (a.pin_current_max_a != b.pin_current_max_a) return a.pin_current_max_a < b.pin_current_max_a;
        if (a.transistor != b.transistor) return a.transistor < b.transistor;
        return a.diode < b.diode;
    });

    const bool any_pass = !result.candidates.empty() && result.candidates.front().verdict == Verdict::pass;
    if (!any_pass) {
        for (const auto& [family, counts] : family_fails) {
            const auto most = std::max_element(counts.begin(), counts.end(),
                                               [](const auto& a, const auto& b) { return a.second < b.second; });
            const Evaluation& e = family_eval.at(family + "|" + most->first);
            result.reasons.push_back("every " + family + " part: " + reason_for(most->first, e, spec, family));
        }
    }
    return result;
}

}  // namespace coilfit
