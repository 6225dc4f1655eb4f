#include "coilfit/pick.hpp"

#include <algorithm>
#include <cmath>
#include <functional>
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

bool ranks_before(const Candidate& a, const Candidate& b) {
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
}

namespace {

// The diodes tried behind each transistor: the table's (or the spec's own when the table has
// none); none for clamp "none".
std::vector<std::optional<Diode>> diodes_to_try(const Spec& spec, const Catalogue& catalogue) {
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
    return diodes;
}

// Tries one transistor with every diode; hands over its best row, or each pair's row (ranked
// among themselves when rank_pairs: a heap that ranks them anyway does not need it).
void try_transistor(Spec& trial, const Spec& spec, const std::vector<std::optional<Diode>>& diodes, bool all_clamps,
                    bool rank_pairs, pick_detail::FamilyFailures& failures, PickResult& counts,
                    const std::function<void(const Candidate&)>& row) {
    // A forced gain written for the spec's own kind of transistor does not carry over: a
    // Darlington tried for an npn spec (or the other way round) takes its kind's default.
    trial.policy.forced_gain = transistor_kind_name(trial.transistor) == transistor_kind_name(spec.transistor)
                                   ? spec.policy.forced_gain
                                   : std::nullopt;
    precompute_logs(trial);
    // An array channel clamps through its own built-in diode.
    const ArrayPart* array = trial.array();
    const std::size_t n = array ? 1 : diodes.size();
    std::optional<Candidate> best;
    std::vector<Candidate> pairs;
    std::size_t passing = 0;
    for (std::size_t k = 0; k < n; ++k) {
        if (array) {
            trial.clamp = ClampSpec{};
            trial.clamp.diode = array->diode;
        } else {
            trial.clamp.diode = diodes[k];
        }
        const Sized sized = size_numbers(trial);
        Candidate c = candidate_of(trial, sized);
        ++counts.evaluations;
        if (!c.failed.empty()) failures.add(c, sized.worst);
        passing += c.verdict == Verdict::pass ? 1U : 0U;
        if (all_clamps)
            pairs.push_back(std::move(c));
        else if (!best || ranks_before(c, *best))
            best = std::move(c);
    }
    trial.clamp = spec.clamp;
    if (best) {
        best->clamps_tried = n;
        best->clamps_passing = passing;
        pairs.push_back(std::move(*best));
    }
    if (rank_pairs) std::sort(pairs.begin(), pairs.end(), ranks_before);
    for (const Candidate& c : pairs) {
        ++counts.rows;
        counts.passing += c.verdict == Verdict::pass ? 1U : 0U;
        row(c);
    }
}

PickResult pick_rows(const Spec& spec, const Catalogue& catalogue, const PickSettings& settings, bool rank_pairs,
                     const std::function<void(const Candidate&)>& row) {
    PickResult result;
    const std::vector<std::optional<Diode>> diodes = diodes_to_try(spec, catalogue);
    pick_detail::FamilyFailures failures;
    Spec trial = spec;
    // The table's transistors one at a time, copied into the trial spec (never all at once).
    const auto each = [&](const auto& parts) {
        for (const auto& part : parts) {
            trial.transistor = part;
            try_transistor(trial, spec, diodes, settings.all_clamps, rank_pairs, failures, result, row);
        }
    };
    each(catalogue.bipolars);
    each(catalogue.mosfets);
    each(catalogue.arrays);
    if (result.passing == 0) result.reasons = failures.reasons(spec);
    return result;
}

}  // namespace

PickResult pick_each(const Spec& spec, const Catalogue& catalogue, const PickSettings& settings,
                     const std::function<void(const Candidate&)>& row) {
    return pick_rows(spec, catalogue, settings, true, row);
}

PickResult pick(const Spec& spec, const Catalogue& catalogue, const PickSettings& settings) {
    // A bounded heap of the best `top` rows, the worst kept on top so it leaves first.
    std::vector<Candidate> kept;
    const std::size_t top = settings.top;
    PickResult result = pick_rows(spec, catalogue, settings, false, [&](const Candidate& c) {
        if (top != 0 && kept.size() == top) {
            if (!ranks_before(c, kept.front())) return;
            std::pop_heap(kept.begin(), kept.end(), ranks_before);
            kept.back() = c;
        } else {
            kept.push_back(c);
        }
        if (top != 0) std::push_heap(kept.begin(), kept.end(), ranks_before);
    });
    std::sort(kept.begin(), kept.end(), ranks_before);
    result.candidates = std::move(kept);
    return result;
}

PickResult pick(const Spec& spec, const Catalogue& catalogue) { return pick(spec, catalogue, PickSettings{}); }

}  // namespace coilfit
