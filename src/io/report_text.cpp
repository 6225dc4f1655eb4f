#include <fmt/format.h>

#include "io/format.hpp"
#include "io/report_contact_io.hpp"
#include "io/report_io.hpp"

namespace coilfit::io {
namespace {

std::string qf(double v, Unit u) { return format_quantity(v, u); }

std::string margin_text(const std::optional<double>& m) {
    if (!m) return "";
    if (*m < -9.99) return "<-999 %";
    return fmt::format("{:+.0f} %", *m * 100.0);
}

std::string verdict_word(Verdict v) {
    switch (v) {
    case Verdict::pass: return "pass";
    case Verdict::warn: return "WARN";
    case Verdict::fail: return "FAIL";
    case Verdict::skip: return "-";
    }
    return "";
}

std::string heading(std::string_view title) { return std::string(title) + "\n"; }

}  // namespace

std::string paint(std::string_view text, Verdict verdict, const TextStyle& style) {
    if (!style.color) return std::string(text);
    std::string_view code;
    switch (verdict) {
    case Verdict::pass: code = "\x1b[32m"; break;
    case Verdict::warn: code = "\x1b[33m"; break;
    case Verdict::fail: code = "\x1b[1;31m"; break;
    case Verdict::skip: code = "\x1b[2m"; break;
    }
    return std::string(code) + std::string(text) + "\x1b[0m";
}

namespace {

std::string supply_words(const SupplySpec& s) {
    if (s.min_v || s.max_v) {
        return fmt::format("{} to {}{}", qf(s.lo_v(), Unit::volt), qf(s.hi_v(), Unit::volt),
                           s.voltage_v > 0 ? " (nominal " + qf(s.voltage_v, Unit::volt) + ")" : std::string());
    }
    return fmt::format("{} ± {} ({} to {})", qf(s.voltage_v, Unit::volt), qf(s.tolerance, Unit::ratio), qf(s.lo_v(), Unit::volt),
                       qf(s.hi_v(), Unit::volt));
}

std::string transistor_words(const Transistor& tr) {
    if (const auto* t = std::get_if<Bipolar>(&tr)) {
        return fmt::format("{} ({}, Ic max {}, Vceo {}, {})", display_id(*t), bipolar_kind_name(t->kind), qf(t->ic_max_a, Unit::ampere),
                           qf(t->vceo_v, Unit::volt), t->package.empty() ? std::string("package not given") : t->package);
    }
    if (const auto* m = std::get_if<Mosfet>(&tr)) {
        return fmt::format("{} (nmos, Id max {}, Vds max {}, Vgs(th) {} to {}, {})", display_id(*m), qf(m->id_max_a, Unit::ampere),
                           qf(m->vds_max_v, Unit::volt), qf(m->vgs_th_min_v, Unit::volt), qf(m->vgs_th_max_v, Unit::volt),
                           m->package.empty() ? std::string("package not given") : m->package);
    }
    const auto& a = std::get<ArrayPart>(tr);
    return fmt::format("{} (array channel, {} channels, Ic max {} each, Vceo {}, input {})", display_id(a), a.channels,
                       qf(a.ic_max_a, Unit::ampere), qf(a.vceo_v, Unit::volt), qf(a.input_resistor_ohm, Unit::ohm));
}

std::string clamp_words(const ClampSpec& c) {
    const std::string diode = c.diode ? display_id(*c.diode) : std::string();
    switch (c.type) {
    case ClampType::diode: return "diode " + diode;
    case ClampType::diode_zener:
        return fmt::format("diode {} + zener {} ({} ± {})", diode, display_id(*c.zener), qf(c.zener->vz_v, Unit::volt),
                           qf(c.zener->tolerance, Unit::ratio));
    case ClampType::diode_resistor: return fmt::format("diode {} + {} resistor", diode, qf(c.resistor_ohm.value_or(0), Unit::ohm));
    case ClampType::diode_tvs:
        return fmt::format("diode {} + TVS {} (breakdown {} to {})", diode, display_id(*c.tvs), qf(c.tvs->vbr_min_v, Unit::volt),
                           qf(c.tvs->vbr_max_v, Unit::volt));
    case ClampType::none: return "none";
    }
    return "none";
}

}  // namespace

std::string render_text(const SizingReport& report, const TextStyle& style) {
    const Spec& spec = report.spec;
    std::string out;
    const auto line = [&](std::string_view label, const std::string& text) {
        out += "  " + pad_right(label, 15) + wrap(text, style.width, 17) + "\n";
    };

    out += fmt::format("coilfit {} - {}\n\n", COILFIT_VERSION, spec.name.empty() ? std::string("unnamed channel") : spec.name);

    // --- inputs as understood ---
    out += heading("Inputs as understood");
    line("supply", supply_words(spec.supply));
    line("ambient", fmt::format("{} to {}", qf(spec.ambient.min_c, Unit::celsius), qf(spec.ambient.max_c, Unit::celsius)));
    std::string coil = fmt::format("{} rated, {} ± {} at {}; operate {}, release {} of rated",
                                   qf(spec.coil.rated_voltage_v, Unit::volt), qf(spec.coil.resistance_ohm, Unit::ohm),
                                   qf(spec.coil.tolerance, Unit::ratio), qf(spec.coil.reference_temp_c, Unit::celsius),
                                   qf(spec.coil.must_operate, Unit::ratio), qf(spec.coil.must_release, Unit::ratio));
    if (spec.coil.inductance_h) coil += ", L " + qf(*spec.coil.inductance_h, Unit::henry);
    if (spec.coil.self_heating_k.value_or(0) > 0) coil += ", self-heating " + qf(*spec.coil.self_heating_k, Unit::kelvin);
    if (spec.coil.thermal_resistance_k_per_w) coil += ", winding " + qf(*spec.coil.thermal_resistance_k_per_w, Unit::kelvin_per_watt);
    if (spec.coil.max_voltage_v) coil += ", max " + qf(*spec.coil.max_voltage_v, Unit::volt);
    if (!spec.coil.preset.empty()) coil += " (preset " + spec.coil.preset + ")";
    line("coil", coil);
    std::string pin = fmt::format("{} ± {}, may source {}", qf(spec.pin.vdd_v, Unit::volt), qf(spec.pin.vdd_tolerance, Unit::ratio),
                                  qf(spec.pin.max_current_a, Unit::ampere));
    if (spec.pin.voh_v) pin += fmt::format(", VOH {} at {}", qf(*spec.pin.voh_v, Unit::volt), qf(spec.pin.voh_current_a.value_or(0), Unit::ampere));
    if (!spec.pin.preset.empty()) pin += " (preset " + spec.pin.preset + ")";
    line("pin", pin);
    line("transistor", transistor_words(spec.transistor));
    line("clamp", clamp_words(spec.clamp));
    if (spec.switching.frequency_hz) line("switching", qf(*spec.switching.frequency_hz, Unit::hertz));
    if (spec.load) {
        line("load", fmt::format("{} {}{}", qf(spec.load->voltage_v, Unit::volt), spec.load->kind == LoadKind::ac ? "AC" : "DC",
                                 spec.load->current_a ? ", " + qf(*spec.load->current_a, Unit::ampere) : std::string()));
    }
    out += "\n";

    // --- design ---
    out += heading("Design");
    const ResistorReport& rc = report.resistor;
    if (rc.kind.empty()) {
        line("input", "built into the array (no resistor to choose)");
    } else if (rc.value_ohm) {
        line(std::string(rc.kind), fmt::format("{}  ({} series, ± {}{}){}", qf(*rc.value_ohm, Unit::ohm), eseries_name(rc.series),
                                         qf(rc.tolerance, Unit::ratio), rc.power_rating_w ? ", " + qf(*rc.power_rating_w, Unit::watt) : std::string(),
                                         rc.fixed ? ", fixed by the spec"
                                         : rc.kind == "base resistor" ? ", largest that saturates"
                                                                      : ", smallest the pin can carry"));
    } else {
        line(std::string(rc.kind), fmt::format("none of the {} series works (see checks)", eseries_name(rc.series)));
    }
    if (auto lo = report.quantity("base_resistor_min_ohm"), hi = report.quantity("base_resistor_max_ohm"); lo && hi) {
        line("window", fmt::format("{} (pin limit) to {} (saturation)", qf(*lo, Unit::ohm), qf(*hi, Unit::ohm)));
    }
    if (spec.mosfet()) {
        line("pull-down", qf(spec.pulldown_ohm.value_or(defaults::nmos_pulldown_ohm), Unit::ohm) +
                              (spec.pulldown_ohm ? std::string() : std::string(" (default)")));
    } else if (spec.bipolar()) {
        line("pull-down", spec.pulldown_ohm ? qf(*spec.pulldown_ohm, Unit::ohm) : std::string("none (see notes)"));
    }
    out += "\n";

    // --- checks ---
    out += heading("Checks (each at its own worst case)");
    std::size_t id_w = 5;
    std::vector<std::array<std::string, 5>> rows;
    for (const auto& c : report.checks) {
        rows.push_back({c.id, c.value ? qf(*c.value, c.unit) : std::string(), c.limit ? qf(*c.limit, c.unit) : std::string(),
                        margin_text(c.margin), verdict_word(c.verdict)});
        id_w = std::max(id_w, c.id.size());
    }
    std::size_t vw = 5;
    std::size_t lw = 5;
    for (const auto& r : rows) {
        vw = std::max(vw, display_width(r[1]));
        lw = std::max(lw, display_width(r[2]));
    }
    out += "  " + pad_right("check", id_w) + "  " + pad_left("value", vw) + "  " + pad_left("limit", lw) + "  " +
           pad_left("margin", 7) + "  verdict\n";
    for (std::size_t i = 0; i < rows.size(); ++i) {
        const auto& r = rows[i];
        out += "  " + pad_right(r[0], id_w) + "  " + pad_left(r[1], vw) + "  " + pad_left(r[2], lw) + "  " + pad_left(r[3], 7) +
               "  " + paint(r[4], report.checks[i].verdict, style) + "\n";
    }
    out += "\n";
    bool any_detail = false;
    for (const auto& c : report.checks) {
        if (c.verdict == Verdict::skip) continue;
        if (!any_detail) out += heading("What the checks found");
        any_detail = true;
        out += "  " + paint(pad_right(c.id, id_w), c.verdict, style) + "  " + wrap(c.message, style.width, id_w + 4) + "\n";
    }
    if (any_detail) out += "\n";

    // --- figures ---
    out += heading("Figures");
    std::size_t label_w = 0;
    for (const auto& e : report.quantities) label_w = std::max(label_w, display_width(e.label));
    for (const auto& e : report.quantities) {
        out += "  " + pad_right(e.label, label_w) + "  " + qf(e.value, e.unit) + "\n";
    }
    out += "\n";

    if (!report.clamp_options.empty()) {
        out += heading("Clamp options (faster release costs collector voltage)");
        std::size_t ow = 6;
        for (const auto& o : report.clamp_options) ow = std::max(ow, display_width(o.label));
        out += "    " + pad_right("clamp", ow) + "  " + pad_left("peak Vce", 9) + "  " + pad_left("release", 9) + "  " +
               pad_left("energy", 9) + "  within rating\n";
        for (const auto& o : report.clamp_options) {
            out += std::string(o.chosen ? "  > " : "    ") + pad_right(o.label, ow) + "  " + pad_left(qf(o.peak_collector_v, Unit::volt), 9) +
                   "  " + pad_left(o.release_time_s ? qf(*o.release_time_s, Unit::second) : std::string("-"), 9) + "  " +
                   pad_left(qf(o.clamp_energy_j, Unit::joule), 9) + "  " + (o.within_rating ? "yes" : "no") + "\n";
        }
        out += "  (> marks the clamp of this spec)\n\n";
    }
    out += render_contact_text(report, style);

    if (!report.notes.empty()) {
        out += heading("Notes");
        for (const auto& n : report.notes) out += "  - " + wrap(n, style.width, 4) + "\n";
        out += "\n";
    }
    out += heading("Cautions");
    for (const auto& c : report.cautions) out += "  ! " + wrap(c, style.width, 4) + "\n";
    out += "\n";

    std::size_t fails = 0;
    std::size_t warns = 0;
    for (const auto& c : report.checks) {
        fails += c.verdict == Verdict::fail ? 1U : 0U;
        warns += c.verdict == Verdict::warn ? 1U : 0U;
    }
    if (report.verdict == Verdict::pass) {
        out += paint("Result: PASS", warns ? Verdict::warn : Verdict::pass, style) +
               (warns ? fmt::format(" with {} warning{}: every check holds at worst case; read the warnings.\n", warns, warns == 1 ? "" : "s")
                      : std::string(": every check holds at worst case.\n"));
    } else {
        const Check* w = report.worst_check();
        out += paint("Result: FAIL", Verdict::fail, style) +
               fmt::format(": {} check{} failed{}.\n", fails, fails == 1 ? "" : "s", w ? " (worst: " + w->id + ")" : std::string());
    }
    return out;
}

}  // namespace coilfit::io
