// The words of the contact checks: what was found and, on failure, what would fix it.
#include <cmath>

#include "coilfit/contact.hpp"
#include "coilfit/spec.hpp"

namespace coilfit {
namespace {

std::string q(double value, Unit unit) { return format_quantity(value, unit); }
std::string n(double value) { return format_quantity(value, Unit::number); }

std::string current_type(const LoadSpec& load) { return load.kind == LoadKind::ac ? " AC" : " DC"; }

std::string relay_id(const Spec& spec) { return spec.relay ? display_id(*spec.relay) : std::string("the relay"); }

}  // namespace

std::string inrush_words(const LoadSpec& load) {
    if (load.inrush_a) return "given";
    const double m = load_inrush_multiple(load);
    if (load.inrush_multiple) return n(m) + " x steady, given";
    const InrushDefault d = default_inrush(load.load_class, load.kind == LoadKind::ac);
    std::string out = n(m) + " x steady: the default for a " + std::string(load_class_name(load.load_class)) +
                      " load, " + std::string(d.what);
    if (d.duration_s > 0) out += ", about " + q(d.duration_s, Unit::second);
    return out + "; confirm for the real load";
}

std::string contact_message(CheckId id, const CheckValue& c, const Spec& spec) {
    if (!spec.load || !spec.relay) return {};
    const LoadSpec& load = *spec.load;
    const bool ok = c.verdict == Verdict::pass || c.verdict == Verdict::warn;
    const auto how = static_cast<ContactCase>(c.detail);
    const std::string rating = load.kind == LoadKind::ac ? "AC rating" : "DC rating";
    switch (id) {
        case CheckId::contact_voltage:
            return "the load's " + q(c.value, Unit::volt) + current_type(load) + " against the contacts' " + rating +
                   " " + q(c.limit, Unit::volt) +
                   (ok ? "" : ": choose contacts rated for the load voltage (a power relay or a contactor)");
        case CheckId::contact_current: {
            std::string out = "the load's steady " + q(c.value, Unit::ampere) + " against the contacts' " + rating +
                              " " + q(c.limit, Unit::ampere) + " (a resistive rating)";
            if (is_inductive(load.load_class))
                out += "; an inductive load wears contacts faster: ask the maker for the inductive rating";
            return out + (ok ? "" : ": choose contacts rated for the current, or a contactor");
        }
        case CheckId::contact_inrush: {
            std::string out = "the load's inrush " + q(c.value, Unit::ampere) + " (" + inrush_words(load) + ")";
            if (how == ContactCase::rated) {
                return out + " against the make current " + q(c.limit, Unit::ampere) +
                       (ok ? ""
                           : ": the contacts may weld; choose contacts with a higher make rating, or limit the inrush");
            }
            out += " against twice the steady " + rating + ", " + q(c.limit, Unit::ampere) + ": " + relay_id(spec) +
                   " gives no make current";
            if (!ok) return out + "; the contacts may weld: choose contacts rated for the inrush, or limit it";
            if (c.verdict == Verdict::warn) {
                return out +
                       "; an inrush above twice the steady current can weld contacts rated for resistive loads: ask "
                       "the "
                       "maker for the make (inrush) rating, or choose contacts rated for this kind of load";
            }
            return out;
        }
        case CheckId::contact_breaking: {
            const std::string at = q(load.voltage_v, Unit::volt) + " DC";
            if (how == ContactCase::above_curve) {
                const double top = spec.relay->contacts ? spec.relay->contacts->dc_breaking.back().voltage_v : 0.0;
                return "the load's " + at + " is above the highest voltage of the DC breaking curve, " +
                       q(top, Unit::volt) + ": the contacts may not break " + q(c.value, Unit::ampere) +
                       " there; choose contacts rated to break DC at "
                       "this voltage (a DC contactor, or contacts in series where the maker allows it)";
            }
            std::string out = "the load's " + q(c.value, Unit::ampere) + " at " + at +
                              " against the DC breaking curve's " + q(c.limit, Unit::ampere) + " there";
            out += how == ContactCase::below_curve ? " (below the curve's lowest voltage: its first current)"
                                                   : " (log-log between the curve's points)";
            if (load.time_constant_s)
                out += "; the curve is for a resistive load, and an L/R of " + q(*load.time_constant_s, Unit::second) +
                       " breaks less";
            if (!ok) return out + ": the arc may not go out; choose contacts that break more DC, or lower the current";
            if (how == ContactCase::slow_release) {
                out += "; with a plain diode across the coil the contacts open slowly and draw a longer arc at " +
                       q(c.value, Unit::ampere) +
                       ": a diode + zener clamp opens them faster (the contact side lists both release times)";
            }
            return out;
        }
        case CheckId::contact_min_load: {
            const Contacts* k = spec.relay->contacts ? &*spec.relay->contacts : nullptr;
            const std::string min = k && k->min_load ? q(k->min_load->current_a, Unit::ampere) + " at " +
                                                           q(k->min_load->voltage_v, Unit::volt)
                                                     : std::string();
            std::string out =
                how == ContactCase::min_voltage
                    ? "the load's " + q(c.value, Unit::volt) + " against the contacts' minimum load " + min
                    : "the load's " + q(c.value, Unit::ampere) + " against the contacts' minimum load " + min;
            if (c.verdict == Verdict::warn) {
                out +=
                    ": below it the contact film may not break down and the contacts may not conduct reliably; choose "
                    "signal contacts (gold-clad) or a reed relay for a dry circuit";
            }
            return out;
        }
        default:
            return {};
    }
}

std::string contact_skip_reason(CheckId id, const Spec& spec) {
    if (!spec.load) return "not checked: give the load the contacts switch (load.voltage, load.current, load.kind)";
    if (!spec.relay)
        return "not checked: give relay (a relay or contactor id of the parts table, or an inline record) for the "
               "contact ratings";
    if (!spec.relay->contacts) return "not checked: " + relay_id(spec) + " gives no contact ratings (contacts)";
    const LoadSpec& load = *spec.load;
    const Contacts& k = *spec.relay->contacts;
    const bool ac = load.kind == LoadKind::ac;
    const bool rated = ac ? k.ac.has_value() : k.dc.has_value();
    std::string no_rating = "not checked: " + relay_id(spec) + " gives no " + (ac ? "AC" : "DC") +
                            " rating (contacts." + (ac ? "ac" : "dc") + ")";
    std::string no_current = "not checked: give load.current (the steady current the contacts carry)";
    switch (id) {
        case CheckId::contact_voltage:
            return no_rating;
        case CheckId::contact_current:
            return rated ? no_current : no_rating;
        case CheckId::contact_inrush:
            if (!load.current_a && !load.inrush_a) return "not checked: give load.current (or load.inrush in amperes)";
            return "not checked: " + relay_id(spec) + " gives neither a make current (contacts.make_current) nor an " +
                   (ac ? "AC" : "DC") + " rating";
        case CheckId::contact_breaking:
            if (ac)
                return "not checked: an AC load (its current's zero crossings put the arc out; the AC rating covers "
                       "breaking)";
            if (k.dc_breaking.empty())
                return "not checked: " + relay_id(spec) + " gives no DC breaking curve (contacts.dc_breaking)";
            return no_current;
        case CheckId::contact_min_load:
            if (!k.min_load) return "not checked: " + relay_id(spec) + " gives no minimum load (contacts.min_load)";
            return no_current;
        default:
            return "not checked";
    }
}

}  // namespace coilfit
