#include "coilfit/pick.hpp"

#include <algorithm>
#include <cmath>
#include <map>

#include "coilfit/sizing.hpp"
#include "pick_reasons.hpp"

namespace coilfit {

std::string transistor_family(const Transistor& part) {
    if (const auto* b = std::get_if<Bipolar>(&part)) {
        if (b->kind == BipolarKind::darlington) return "darlington";
        // Common practice: small-signal parts are rated below 1 A and 1 W in free air.
        return (b->ic_max_a >= 1.0 || b->pd_w >= 1.0) ? "medium-power" : "small-signal";
    }
    if (const auto* m = std::get_if<Mosfet>(&part)) return m->id_max_a >= 1.0 ? "power MOSFET" : "small-signal MOSFET";
    return "transistor array";
}

namespace {

Candidate candidate_of(const Spec& trial, const Sized& sized) {
    const Evaluation& e = sized.worst;
    Candidate c;
    c.transistor = origin(trial.transistor).id;
    c.driver = std::string(transistor_kind_name(trial.transistor));
    c.diode = trial.clamp.diode ? trial.clamp.diode->id : std::string();
    c.family = transistor_family(trial.transistor);
    c.resistor_ohm = sized.r_drive_ohm;
    c.pin_current_max_a = std::max(e.driver.at[0].pin_current_max_a, e.driver.at[1].pin_current_max_a);
    bool first = true;
    double worst = 0;
    for (std::size_t i = 0; i < check_count; ++i) {
        const CheckValue& v = e.checks.values[i];
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
    return c;
}

}  // namespace

PickResult pick(const Spec& spec, const Catalogue& catalogue) {
    PickResult result;
    std::vector<std::optional<Diode>> diodes;
    if (spec.clamp.type == ClampType::none) {
        diodes.emplace_back(std::nullopt);
    } else {
        for (const Diode& d : catalogue.diodes) diodes.emplace_back(d);
        if (diodes.empty() && spec.clamp.diode) diodes.emplace_back(spec.clamp.diode);
    }
    // Each part is evaluated with many partners: its ln(current) points once.
    for (auto& d : diodes) {
        if (d) precompute_logs(*d);
    }
    std::vector<Transistor> transistors;
    for (const Bipolar& b : catalogue.bipolars) transistors.emplace_back(b);
    for (const Mosfet& m : catalogue.mosfets) transistors.emplace_back(m);
    for (const ArrayPart& a : catalogue.arrays) transistors.emplace_back(a);

    pick_detail::FamilyFailures failures;
    Spec trial = spec;
    for (Transistor& t : transistors) {
        trial.transistor = std::move(t);
        precompute_logs(trial);
        // An array channel clamps through its own built-in diode.
        const ArrayPart* array = trial.array();
        const std::size_t n = array ? 1 : diodes.size();
        for (std::size_t k = 0; k < n; ++k) {
            if (array) {
                trial.clamp = ClampSpec{};
                trial.clamp.diode = array->diode;
            } else {
                trial.clamp.diode = diodes[k];
            }
            const Sized sized = size_numbers(trial);
            Candidate c = candidate_of(trial, sized);
            if (!c.failed.empty()) failures.add(c, sized.worst);
            result.candidates.push_back(std::move(c));
        }
        trial.clamp = spec.clamp;
    }

    std::stable_sort(result.candidates.begin(), result.candidates.end(), [](const Candidate& a, const Candidate& b) {
        if (a.verdict != b.verdict) return a.verdict == Verdict::pass;
        if (a.worst_margin != b.worst_margin) return a.worst_margin > b.worst_margin;
        if (a.pin_current_max_a != b.pin_current_max_a) return a.pin_current_max_a < b.pin_current_max_a;
        if (a.transistor != b.transistor) return a.transistor < b.transistor;
        return a.diode < b.diode;
    });
    const bool any_pass = !result.candidates.empty() && result.candidates.front().verdict == Verdict::pass;
    if (!any_pass) result.reasons = failures.reasons(spec);
    return result;
}

}  // namespace coilfit
