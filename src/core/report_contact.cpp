// The contact side of the report (src/method.md "Contact side"): what the contacts switch, the
// inrush taken, the suppression advice and its values, and the quantities that go with them.
#include <algorithm>
#include <cmath>

#include "report_parts.hpp"

namespace coilfit::report {
namespace {

std::string q(double value, Unit unit) { return format_quantity(value, unit); }

std::string load_words(const LoadSpec& load) {
    std::string out = q(load.voltage_v, Unit::volt) + (load.kind == LoadKind::ac ? " AC " : " DC ") +
                      std::string(load_class_name(load.load_class)) + (load.class_given ? "" : " (kind not given)");
    if (load.current_a) out += ", " + q(*load.current_a, Unit::ampere) + " steady";
    if (load.power_factor) out += ", power factor " + format_quantity(*load.power_factor, Unit::number);
    if (load.time_constant_s) out += ", L/R " + q(*load.time_constant_s, Unit::second);
    return out;
}

std::string relay_words(const Spec& spec) {
    if (!spec.relay) return "none given (give relay for the contact checks)";
    const RelayPart& r = *spec.relay;
    std::string out = display_id(r) + " (" + std::string(relay_kind_name(r.kind));
    if (r.contacts && !r.contacts->form.empty()) out += ", " + r.contacts->form;
    if (!r.contacts) out += ", no contact ratings";
    return out + ")";
}

// The plain diode option and the fastest zener option within rating, for the slow-release advice.
void release_side_by_side(ContactReport& c, const std::vector<ClampOption>& options) {
    for (const ClampOption& o : options) {
        if (o.clamp.type == ClampType::diode && o.release_time_s) c.release_plain_s = o.release_time_s;
        if (o.clamp.type != ClampType::diode_zener || !o.within_rating || !o.release_time_s) continue;
        if (!c.release_zener_s || *o.release_time_s < *c.release_zener_s) {
            c.release_zener_s = o.release_time_s;
            c.zener_option = o.label;
        }
    }
}

void ac_inductive_advice(ContactReport& c, const LoadSpec& load) {
    c.varistor_voltage_v = varistor_voltage_min_v(load.voltage_v);
    std::string rc;
    if (load.current_a && *load.current_a > 0 && load.voltage_v > 0) {
        c.snubber_capacitance_f = snubber_capacitance_f(*load.current_a);
        c.snubber_resistance_ohm = snubber_resistance_ohm(load.voltage_v, *load.current_a);
        rc = " of about " + q(*c.snubber_capacitance_f, Unit::farad) + " in series with " +
             q(*c.snubber_resistance_ohm, Unit::ohm) +
             " (the empirical rule C = I^2/10 uF, R = V/(10 I (1 + 50/V)), common practice, from memory)";
    } else {
        rc = " (give load.current for its values)";
    }
    c.suppression.push_back(
        "an AC inductive load: fit an RC snubber across the contacts or across the load" + rc +
        ", rated for the line voltage (a safety-rated capacitor across mains); or a varistor rated at least " +
        q(*c.varistor_voltage_v, Unit::volt) +
        " (1.2 x the peak line voltage); across the contacts the "
        "snubber passes a small current while they are open; confirm on the bench");
}

}  // namespace

bool contact_side_shown(const Spec& spec) { return spec.relay.has_value() || (spec.load && spec.load->class_given); }

std::optional<ContactReport> contact_report(const Spec& spec, const std::vector<ClampOption>& clamp_options) {
    if (!contact_side_shown(spec)) return std::nullopt;
    ContactReport c;
    c.relay = relay_words(spec);
    if (!spec.load) {
        c.load = "not given (give load for the contact checks)";
        return c;
    }
    const LoadSpec& load = *spec.load;
    c.load = load_words(load);
    c.inrush_a = load_inrush_a(load);
    c.inrush_words = inrush_words(load);
    const bool ac = load.kind == LoadKind::ac;
    if (is_inductive(load.load_class) && !ac) {
        c.suppression.emplace_back(
            "a DC inductive load: fit a suppression device across the load, a diode rated for the load current with a "
            "reverse "
            "voltage above the load supply, or diode + zener where the load must release fast; it keeps the arc off "
            "the contacts");
    }
    if (is_inductive(load.load_class) && ac) ac_inductive_advice(c, load);
    if (load.load_class == LoadClass::capacitive) {
        c.suppression.emplace_back(
            "a capacitive load: its inrush, not the opening, wears the contacts; an inrush limiter "
            "(an NTC thermistor or a series resistor) spares them");
    }
    const double i = load.current_a.value_or(0.0);
    if (!ac && i > slow_release_current_a && spec.clamp.type == ClampType::diode) {
        release_side_by_side(c, clamp_options);
        std::string times;
        if (c.release_plain_s && c.release_zener_s) {
            times = ": release " + q(*c.release_plain_s, Unit::second) + " with the plain diode against " +
                    q(*c.release_zener_s, Unit::second) + " with " + c.zener_option;
        } else if (c.release_plain_s) {
            times = ": release " + q(*c.release_plain_s, Unit::second) +
                    " with the plain diode (no zener of the table fits)";
        }
        c.suppression.push_back(
            "a DC load of " + q(i, Unit::ampere) +
            ": the plain diode across the coil lets the contacts open slowly and draw a longer arc; a diode + "
            "zener clamp opens them faster" +
            times);
    }
    return c;
}

void contact_quantities(std::vector<QuantityEntry>& out, const Spec& spec) {
    if (!contact_side_shown(spec) || !spec.load) return;
    const LoadSpec& load = *spec.load;
    if (const auto i = load_inrush_a(load)) add(out, "load_inrush_a", *i, Unit::ampere, "load inrush current");
    const Contacts* k = spec.relay && spec.relay->contacts ? &*spec.relay->contacts : nullptr;
    if (k && load.kind == LoadKind::dc && !k->dc_breaking.empty()) {
        const BreakingLimit b = breaking_current_at(k->dc_breaking, load.voltage_v);
        if (!b.above)
            add(out, "breaking_current_limit_a", b.current_a, Unit::ampere, "DC breaking current at the load voltage");
    }
    if (load.kind == LoadKind::ac && is_inductive(load.load_class)) {
        if (load.current_a && *load.current_a > 0 && load.voltage_v > 0) {
            add(out, "snubber_capacitance_f", snubber_capacitance_f(*load.current_a), Unit::farad,
                "RC snubber capacitance (rule)");
            add(out, "snubber_resistance_ohm", snubber_resistance_ohm(load.voltage_v, *load.current_a), Unit::ohm,
                "RC snubber resistance (rule)");
        }
        add(out, "varistor_voltage_min_v", varistor_voltage_min_v(load.voltage_v), Unit::volt,
            "varistor voltage, lowest");
    }
}

void contact_notes(std::vector<std::string>& out, const Spec& spec) {
    if (!spec.load || !spec.relay || !spec.relay->contacts) return;
    const LoadSpec& load = *spec.load;
    if (load.kind == LoadKind::ac && load.power_factor && *load.power_factor < 1.0) {
        out.push_back("the contacts' AC rating is for a resistive load; at power factor " +
                      format_quantity(*load.power_factor, Unit::number) +
                      " they wear faster: ask the maker for the rating at this power factor (for a contactor, its "
                      "utilisation category for the load)");
    }
    if (load.kind == LoadKind::dc && is_inductive(load.load_class) && !load.time_constant_s) {
        out.emplace_back(
            "the DC breaking curve is for a resistive load: an inductive load breaks less; give load.time_constant "
            "(its L/R) and ask the maker for the inductive breaking rating");
    }
}

}  // namespace coilfit::report
