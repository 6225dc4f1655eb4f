// The contact side of a report as text and as JSON.
#include <cmath>

#include <fmt/format.h>

#include "io/format.hpp"
#include "io/report_contact_io.hpp"

namespace coilfit::io {
namespace {

std::string qf(double v, Unit u) { return format_quantity(v, u); }

Json number_or_null(const std::optional<double>& v) { return v && std::isfinite(*v) ? Json(*v) : Json(nullptr); }

}  // namespace

std::string render_contact_text(const SizingReport& report, const TextStyle& style) {
    if (!report.contact) return {};
    const ContactReport& c = *report.contact;
    std::string out = "Contact side\n";
    const auto line = [&](std::string_view label, const std::string& text) {
        out += "  " + pad_right(label, 15) + wrap(text, style.width, 17) + "\n";
    };
    line("relay", c.relay);
    line("load", c.load);
    if (c.inrush_a) line("inrush", qf(*c.inrush_a, Unit::ampere) + " (" + c.inrush_words + ")");
    if (c.snubber_capacitance_f && c.snubber_resistance_ohm) {
        line("RC snubber", qf(*c.snubber_capacitance_f, Unit::farad) + " in series with " +
                               qf(*c.snubber_resistance_ohm, Unit::ohm) + " (empirical rule; confirm on the bench)");
    }
    if (c.varistor_voltage_v) line("or varistor", "rated at least " + qf(*c.varistor_voltage_v, Unit::volt));
    if (c.release_plain_s) {
        std::string times = qf(*c.release_plain_s, Unit::second) + " with the plain diode";
        if (c.release_zener_s) times += ", " + qf(*c.release_zener_s, Unit::second) + " with " + c.zener_option;
        line("coil release", times);
    }
    bool first = true;
    for (const auto& s : c.suppression) {
        out += "  " + pad_right(first ? "suppression" : "", 15) + "- " + wrap(s, style.width, 19) + "\n";
        first = false;
    }
    if (c.suppression.empty() && c.inrush_a) line("suppression", "none needed for this kind of load");
    return out + "\n";
}

Json contact_to_json(const ContactReport& c) {
    Json j;
    j["relay"] = c.relay;
    j["load"] = c.load;
    j["inrush_a"] = number_or_null(c.inrush_a);
    j["inrush"] = c.inrush_words;
    j["suppression"] = c.suppression;
    j["snubber_capacitance_f"] = number_or_null(c.snubber_capacitance_f);
    j["snubber_resistance_ohm"] = number_or_null(c.snubber_resistance_ohm);
    j["varistor_voltage_v"] = number_or_null(c.varistor_voltage_v);
    j["release_time_plain_diode_s"] = number_or_null(c.release_plain_s);
    j["release_time_diode_zener_s"] = number_or_null(c.release_zener_s);
    j["diode_zener_option"] = c.zener_option.empty() ? Json(nullptr) : Json(c.zener_option);
    return j;
}

}  // namespace coilfit::io
