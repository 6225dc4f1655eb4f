// The contact stage (src/method.md "Contact side (ed. 2)"): the load against the contacts'
// ratings, its inrush, the DC breaking curve and the minimum load.
#include "coilfit/contact.hpp"

#include <array>
#include <cmath>

#include "coilfit/spec.hpp"

namespace coilfit {
namespace {

struct ClassName {
    LoadClass c;
    std::string_view name;
};
constexpr std::array<ClassName, 7> class_names{{
    {LoadClass::resistive, "resistive"},
    {LoadClass::inductive, "inductive"},
    {LoadClass::motor, "motor"},
    {LoadClass::lamp, "lamp"},
    {LoadClass::capacitive, "capacitive"},
    {LoadClass::solenoid, "solenoid"},
    {LoadClass::transformer, "transformer"},
}};

CheckValue with_detail(CheckValue v, ContactCase how) {
    v.detail = static_cast<std::uint8_t>(how);
    return v;
}

}  // namespace

std::string_view relay_kind_name(RelayKind kind) { return kind == RelayKind::contactor ? "contactor" : "relay"; }

std::string_view load_class_name(LoadClass c) {
    for (const auto& n : class_names) {
        if (n.c == c) return n.name;
    }
    return "resistive";
}

std::optional<LoadClass> load_class_from_name(std::string_view name) {
    for (const auto& n : class_names) {
        if (n.name == name) return n.c;
    }
    return std::nullopt;
}

bool is_inductive(LoadClass c) {
    return c == LoadClass::inductive || c == LoadClass::motor || c == LoadClass::solenoid ||
           c == LoadClass::transformer;
}

InrushDefault default_inrush(LoadClass c, bool ac) {
    // src/method.md "Contact side": common practice, from memory, to be confirmed for the real load.
    switch (c) {
        case LoadClass::lamp:
            return {10.0, 10e-3, "incandescent filament, cold"};
        case LoadClass::motor:
            return {6.0, 0.5, "locked rotor"};
        case LoadClass::capacitive:
            return {30.0, 1e-3, "capacitive input of a switch-mode supply or LED driver"};
        case LoadClass::transformer:
            return {10.0, 10e-3, "core magnetising"};
        case LoadClass::solenoid:
            if (ac) return {5.0, 20e-3, "armature open until it seals"};
            return {1.0, 0.0, "the current rises with L/R"};
        case LoadClass::inductive:
            // Not a row of the method: taken as the solenoid's (an iron-cored AC load draws more
            // until its core closes; a DC one rises with L/R), src/method.md "Refinements".
            if (ac) return {5.0, 20e-3, "iron-cored, as an AC solenoid until it seals"};
            return {1.0, 0.0, "the current rises with L/R"};
        case LoadClass::resistive:
            break;
    }
    return {1.0, 0.0, "no inrush"};
}

double load_inrush_multiple(const LoadSpec& load) {
    if (load.inrush_a && load.current_a && *load.current_a > 0) return *load.inrush_a / *load.current_a;
    if (load.inrush_multiple) return *load.inrush_multiple;
    return default_inrush(load.load_class, load.kind == LoadKind::ac).multiple;
}

std::optional<double> load_inrush_a(const LoadSpec& load) {
    if (load.inrush_a) return load.inrush_a;
    if (!load.current_a) return std::nullopt;
    return load_inrush_multiple(load) * *load.current_a;
}

BreakingLimit breaking_current_at(const std::vector<BreakingPoint>& curve, double voltage_v) {
    BreakingLimit out;
    if (curve.empty()) return out;
    if (voltage_v <= curve.front().voltage_v) {
        out.current_a = curve.front().current_a;
        out.below = voltage_v < curve.front().voltage_v;
        return out;
    }
    if (voltage_v > curve.back().voltage_v) {
        out.above = true;
        return out;
    }
    for (std::size_t i = 1; i < curve.size(); ++i) {
        const BreakingPoint& a = curve[i - 1];
        const BreakingPoint& b = curve[i];
        if (voltage_v > b.voltage_v) continue;
        // A straight line on log-log axes: ln I = ln I_a + t (ln I_b - ln I_a),
        // t = (ln V - ln V_a) / (ln V_b - ln V_a).
        const double t = std::log(voltage_v / a.voltage_v) / std::log(b.voltage_v / a.voltage_v);
        out.current_a = a.current_a * std::pow(b.current_a / a.current_a, t);
        return out;
    }
    out.current_a = curve.back().current_a;
    return out;
}

double snubber_capacitance_f(double current_a) {
    // C = I^2 / 10 uF, I in amperes (empirical rule, from memory, common practice).
    return current_a * current_a / 10.0 * 1e-6;
}

double snubber_resistance_ohm(double voltage_v, double current_a) {
    // R = V / (10 I (1 + 50 / V)) ohms (empirical rule, from memory, common practice).
    if (!(voltage_v > 0) || !(current_a > 0)) return INFINITY;
    return voltage_v / (10.0 * current_a * (1.0 + 50.0 / voltage_v));
}

double varistor_voltage_min_v(double line_rms_v) {
    // At least 1.2 x the peak line voltage (src/method.md "Contact side").
    return 1.2 * std::sqrt(2.0) * line_rms_v;
}

void contact_checks(const Spec& spec, CheckSet& checks) {
    if (!spec.load || !spec.relay || !spec.relay->contacts) return;
    const LoadSpec& load = *spec.load;
    const Contacts& k = *spec.relay->contacts;
    const bool ac = load.kind == LoadKind::ac;
    const std::optional<ContactRating>& rating = ac ? k.ac : k.dc;
    // contact.voltage and contact.current: the load within the AC or DC rating.
    if (rating) {
        checks.set(CheckId::contact_voltage,
                   with_detail(at_most(load.voltage_v, rating->voltage_v), ContactCase::rated));
        if (load.current_a) {
            checks.set(CheckId::contact_current,
                       with_detail(at_most(*load.current_a, rating->current_a), ContactCase::rated));
        }
    }
    // contact.inrush: at most make_current when given; otherwise at most twice the steady rating
    // (src/method.md "Refinements"), a warning for a load whose inrush is above 2x.
    if (const auto inrush = load_inrush_a(load)) {
        if (k.make_current_a) {
            checks.set(CheckId::contact_inrush, with_detail(at_most(*inrush, *k.make_current_a), ContactCase::rated));
        } else if (rating) {
            CheckValue v = with_detail(at_most(*inrush, 2.0 * rating->current_a), ContactCase::no_make_rating);
            if (v.verdict == Verdict::pass && load_inrush_multiple(load) > 2.0) v.verdict = Verdict::warn;
            checks.set(CheckId::contact_inrush, v);
        }
    }
    // contact.breaking (DC): the steady current at most the breaking curve at the load voltage.
    if (!ac && load.current_a && !k.dc_breaking.empty()) {
        const double i = *load.current_a;
        const BreakingLimit b = breaking_current_at(k.dc_breaking, load.voltage_v);
        CheckValue v = at_most(i, b.current_a);
        v.detail = static_cast<std::uint8_t>(b.above   ? ContactCase::above_curve
                                             : b.below ? ContactCase::below_curve
                                                       : ContactCase::rated);
        if (b.above) v.verdict = Verdict::fail;
        // A plain diode across the coil releases slowly: a long arc at several amperes DC.
        if (v.verdict == Verdict::pass && i > slow_release_current_a && spec.clamp.type == ClampType::diode) {
            v.verdict = Verdict::warn;
            v.detail = static_cast<std::uint8_t>(ContactCase::slow_release);
        }
        checks.set(CheckId::contact_breaking, v);
    }
    // contact.min_load: the load at or above the contacts' minimum (a warning).
    if (k.min_load && load.current_a) {
        CheckValue v = with_detail(at_least(*load.current_a, k.min_load->current_a), ContactCase::rated);
        if (v.verdict == Verdict::pass && load.voltage_v < k.min_load->voltage_v) {
            v = with_detail(at_least(load.voltage_v, k.min_load->voltage_v), ContactCase::min_voltage);
        }
        if (v.verdict == Verdict::fail) v.verdict = Verdict::warn;
        checks.set(CheckId::contact_min_load, v);
    }
}

}  // namespace coilfit
