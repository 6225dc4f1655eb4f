// Builds the SizingReport: sizes the spec, words each check through the stage that owns it, and
// gathers the quantities, notes, cautions and clamp options (report_*.cpp).
#include "coilfit/report.hpp"

#include <algorithm>
#include <cmath>

#include "report_parts.hpp"

namespace coilfit {

std::string check_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e) {
    switch (check_info(id).stage) {
        case Stage::coil:
            return coil_message(id, c, spec, e);
        case Stage::clamp:
            return clamp_message(id, c, spec, e);
        case Stage::timing:
            return timing_message(id, c, spec, e);
        case Stage::contact:
            return contact_message(id, c, spec);
        case Stage::board:
            return {};  // a board's checks are worded in src/core/board_words.cpp
        case Stage::driver:
            break;
    }
    if (spec.bipolar()) return bipolar_message(id, c, spec, e);
    if (spec.mosfet()) return mosfet_message(id, c, spec, e);
    return array_message(id, c, spec, e);
}

std::string check_skip_reason(CheckId id, const Spec& spec) {
    switch (check_info(id).stage) {
        case Stage::coil:
            return coil_skip_reason(id, spec);
        case Stage::clamp:
            return clamp_skip_reason(id, spec);
        case Stage::timing:
            return timing_skip_reason(id, spec);
        case Stage::contact:
            return contact_skip_reason(id, spec);
        case Stage::board:
            return "not checked: a board's check (coilfit board)";
        case Stage::driver:
            break;
    }
    switch (id) {
        case CheckId::gate_drive:
        case CheckId::gate_voltage:
            return "not checked: a MOSFET driver's check";
        case CheckId::input_drive:
            return "not checked: a transistor-array channel's check";
        case CheckId::transistor_saturation:
            return "not checked: a bipolar driver's check";
        case CheckId::resistor_power:
            return spec.bipolar() ? "not checked: no base resistor"
                                  : "not checked: a bipolar driver's base resistor check";
        default:
            return "not checked";
    }
}

Unit check_unit(CheckId id, const CheckValue& c) {
    if (id == CheckId::clamp_pulse && c.detail == static_cast<std::uint8_t>(PulseCase::avalanche)) return Unit::joule;
    if (id == CheckId::contact_min_load && c.detail == static_cast<std::uint8_t>(ContactCase::min_voltage))
        return Unit::volt;
    return check_info(id).unit;
}

const Check* SizingReport::find_check(std::string_view id) const {
    const auto it = std::find_if(checks.begin(), checks.end(), [&](const Check& c) { return c.id == id; });
    return it == checks.end() ? nullptr : &*it;
}

std::optional<double> SizingReport::quantity(std::string_view key) const {
    const auto it =
        std::find_if(quantities.begin(), quantities.end(), [&](const QuantityEntry& e) { return e.key == key; });
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

namespace {

// Skipped checks that belong to another driver kind are left out of the report altogether.
bool belongs_to_kind(CheckId id, const Spec& spec) {
    switch (id) {
        case CheckId::transistor_saturation:
        case CheckId::resistor_power:
            return spec.bipolar() != nullptr;
        case CheckId::gate_drive:
        case CheckId::gate_voltage:
            return spec.mosfet() != nullptr;
        case CheckId::input_drive:
            return spec.array() != nullptr;
        default:
            return true;
    }
}

// Checks of edition 2 appear once they are evaluated (edition-1 reports keep their rows).
bool shown(CheckId id, const CheckValue& c, const Spec& spec) {
    if (!belongs_to_kind(id, spec)) return false;
    if (index_of(id) < index_of(CheckId::coil_thermal)) return true;
    return c.verdict != Verdict::skip || report::shows_skipped(id, spec);
}

}  // namespace

SizingReport size(const Spec& spec, const Catalogue& catalogue) {
    SizingReport r;
    r.spec = spec;
    r.sized = size_numbers(r.spec);
    const Evaluation& e = r.sized.worst;
    r.resistor = report::resistor_report(r.spec, r.sized);
    bool failed = false;
    for (std::size_t i = 0; i < check_count; ++i) {
        const auto id = static_cast<CheckId>(i);
        const CheckValue& c = e.checks.values[i];
        if (!shown(id, c, r.spec)) continue;
        Check out;
        out.id = std::string(check_id_name(id));
        out.verdict = c.verdict;
        out.unit = check_unit(id, c);
        out.corner = c.corner;
        out.beyond_data = c.beyond_data;
        if (c.verdict == Verdict::skip) {
            out.reason = check_skip_reason(id, r.spec);
            out.message = out.reason;
        } else {
            if (c.has_value && std::isfinite(c.value)) out.value = c.value;
            // A zener without pulse data has nothing to compare against: no limit, no margin.
            const bool unrated =
                id == CheckId::clamp_pulse && c.detail == static_cast<std::uint8_t>(PulseCase::unrated);
            if (std::isfinite(c.limit) && !unrated) out.limit = c.limit;
            if (const double m = c.margin(); std::isfinite(m) && !unrated) out.margin = m;
            out.message = check_message(id, c, r.spec, e);
            if (c.beyond_data)
                out.message += " (beyond the part's data: the nearest point was used on its unsafe side)";
        }
        failed = failed || c.verdict == Verdict::fail;
        r.has_warnings = r.has_warnings || c.verdict == Verdict::warn;
        r.checks.push_back(std::move(out));
    }
    r.verdict = failed ? Verdict::fail : Verdict::pass;
    r.quantities = report::quantities(r.spec, r.sized);
    r.notes = report::notes(r.spec, r.sized);
    r.cautions = report::cautions(r.spec);
    r.clamp_options = report::clamp_options(r.spec, catalogue, r.sized);
    r.contact = report::contact_report(r.spec, r.clamp_options);
    return r;
}

}  // namespace coilfit
