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
    c.transistor = display_id(origin(trial.transistor));  // "inline ID" for a record of the spec
    c.driver = std::string(transistor_kind_name(trial.transistor));
    c.diode = trial.clamp.diode ? display_id(*trial.clamp.diode) : std::string();
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
    double other = INFINITY;
    for (std::size_t i = 0; i < check_count; ++i) {
        const CheckValue& v = e.checks.values[i];
        if (v.verdict == Verdict::skip) continue;
        c.beyond_data = c.beyond_data || v.beyond_data;
        if (static_cast<CheckId>(i) != CheckId::transistor_saturation) other = std::min(other, v.margin());
    }
    c.margin_other = std::isfinite(other) ? other : 0.0;
    if (const auto* b = std::get_if<BipolarFigures>(&e.drive); b && b->window_min_ohm > 0 && b->window_max_ohm > 0) {
        c.window_ratio = b->window_max_ohm / b->window_min_ohm;
    }
    return c;
}

// The ranking's robustness figure: a bipolar design's window ratio, or the ratio a centred
// resistor would give the others' smallest margin m, (1 + m)^2 (sqrt of the ratio is the
// headroom on each side of the geometric middle).
double robustness(const Candidate& c) {
    if (c.window_ratio) return *c.window_ratio;
    const double m = std::max(c.worst_margin, -1.0);
    return (1.0 + m) * (1.0 + m);
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
        // A forced gain written for the spec's own kind of transistor does not carry over: a
        // Darlington tried for an npn spec (or the other way round) takes its kind's default.
        trial.policy.forced_gain = transistor_kind_name(trial.transistor) == transistor_kind_name(spec.transistor)
                                       ? spec.policy.forced_gain
                                       : std::nullopt;
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
        if (a.beyond_data != b.beyond_data) return !a.beyond_data;
        if (a.verdict == Verdict::pass) {
            const double ra = robustness(a);
            const double rb = robustness(b);
            if (ra != rb) return ra > rb;
            if (a.margin_other != b.margin_other) return a.margin_other > b.margin_other;
        }
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
