// The text report, laid out for scanning: the verdict and the design first, then one table of
// checks, then the inputs as understood, the figures by group, notes and cautions.
#include <fmt/format.h>

#include "io/format.hpp"
#include "io/report_contact_io.hpp"
#include "io/report_io.hpp"
#include "io/report_text_parts.hpp"

namespace coilfit::io {

std::string paint(std::string_view text, Verdict verdict, const TextStyle& style) {
    if (!style.color) return std::string(text);
    std::string_view code;
    switch (verdict) {
        case Verdict::pass:
            code = "\x1b[32m";
            break;
        case Verdict::warn:
            code = "\x1b[33m";
            break;
        case Verdict::fail:
            code = "\x1b[1;31m";
            break;
        case Verdict::skip:
            code = "\x1b[2m";
            break;
    }
    return std::string(code) + std::string(text) + "\x1b[0m";
}

namespace text {

std::string qf(double v, Unit u) { return format_quantity(v, u); }

std::string heading(std::string_view title) { return std::string(title) + "\n"; }

std::string labelled(std::string_view label, const std::string& text, const TextStyle& style, std::size_t label_w) {
    // Narrow screens: the label on its own line, the text under it.
    if (style.width < label_w + 30) return "  " + std::string(label) + "\n    " + wrap(text, style.width, 4) + "\n";
    return "  " + pad_right(label, label_w) + "  " + wrap(text, style.width, label_w + 4) + "\n";
}

std::string verdict_line(const SizingReport& report, const TextStyle& style) {
    std::size_t fails = 0;
    std::size_t warns = 0;
    std::size_t checked = 0;
    for (const auto& c : report.checks) {
        fails += c.verdict == Verdict::fail ? 1U : 0U;
        warns += c.verdict == Verdict::warn ? 1U : 0U;
        checked += c.verdict != Verdict::skip ? 1U : 0U;
    }
    // Wrapped plain, then the verdict word painted (escape codes take no columns).
    const auto line = [&](std::string_view word, Verdict colour, const std::string& rest) {
        const std::string plain = wrap(std::string(word) + rest, style.width, 2);
        return paint(word, colour, style) + plain.substr(word.size()) + "\n";
    };
    if (report.verdict == Verdict::pass) {
        const std::string rest =
            warns ? fmt::format(" with {} warning{}: every check holds at worst case; read the warnings.", warns,
                                warns == 1 ? "" : "s")
                  : std::string(": every check holds at worst case.");
        return line("Result: PASS", warns ? Verdict::warn : Verdict::pass, rest);
    }
    const Check* w = report.worst_check();
    return line("Result: FAIL", Verdict::fail,
                fmt::format(": {} of {} checks fail{}.", fails, checked, w ? "; worst: " + w->id : std::string()));
}

std::string title_line(const SizingReport& report, const TextStyle& style) {
    return wrap(fmt::format("coilfit {} - {}", COILFIT_VERSION,
                            report.spec.name.empty() ? std::string("unnamed channel") : report.spec.name),
                style.width, 2) +
           "\n";
}

}  // namespace text

namespace {

using text::qf;

std::string package_words(const std::string& package) {
    return package.empty() ? std::string("package not given") : package;
}

std::string transistor_words(const Transistor& tr) {
    if (const auto* t = std::get_if<Bipolar>(&tr)) {
        return fmt::format("{} ({}, Ic max {}, Vceo {}, {})", display_id(*t), bipolar_kind_name(t->kind),
                           qf(t->ic_max_a, Unit::ampere), qf(t->vceo_v, Unit::volt), package_words(t->package));
    }
    if (const auto* m = std::get_if<Mosfet>(&tr)) {
        return fmt::format("{} (nmos, Id max {}, Vds max {}, Vgs(th) {} to {}, {})", display_id(*m),
                           qf(m->id_max_a, Unit::ampere), qf(m->vds_max_v, Unit::volt), qf(m->vgs_th_min_v, Unit::volt),
                           qf(m->vgs_th_max_v, Unit::volt), package_words(m->package));
    }
    const auto& a = std::get<ArrayPart>(tr);
    return fmt::format("{} (array channel, {} channels, Ic max {} each, Vceo {}, input {})", display_id(a), a.channels,
                       qf(a.ic_max_a, Unit::ampere), qf(a.vceo_v, Unit::volt), qf(a.input_resistor_ohm, Unit::ohm));
}

std::string clamp_words(const ClampSpec& c) {
    const std::string diode = c.diode ? display_id(*c.diode) : std::string();
    switch (c.type) {
        case ClampType::diode:
            return "diode " + diode;
        case ClampType::diode_zener:
            return fmt::format("diode {} + zener {} ({} ± {})", diode, display_id(*c.zener),
                               qf(c.zener->vz_v, Unit::volt), qf(c.zener->tolerance, Unit::ratio));
        case ClampType::diode_resistor:
            return fmt::format("diode {} + {} resistor", diode, qf(c.resistor_ohm.value_or(0), Unit::ohm));
        case ClampType::diode_tvs:
            return fmt::format("diode {} + TVS {} (breakdown {} to {})", diode, display_id(*c.tvs),
                               qf(c.tvs->vbr_min_v, Unit::volt), qf(c.tvs->vbr_max_v, Unit::volt));
        case ClampType::none:
            return "none";
    }
    return "none";
}

// The base resistor window, in words when it is empty (src/method.md "Bipolar drivers": the
// pin limit sets the smallest resistor, saturation the largest).
std::string window_words(double lo, double hi) {
    if (hi <= 0) {
        return fmt::format(
            "no resistor fits: the pin limit needs at least {}, and saturation needs more base current than "
            "the pin's voltage can drive through any resistor",
            qf(lo, Unit::ohm));
    }
    if (lo > hi) {
        return fmt::format("no resistor fits: the pin limit needs at least {}, saturation needs at most {}",
                           qf(lo, Unit::ohm), qf(hi, Unit::ohm));
    }
    return fmt::format("{} (pin limit) to {} (saturation), ratio {}", qf(lo, Unit::ohm), qf(hi, Unit::ohm),
                       qf(hi / lo, Unit::number));
}

std::string resistor_words(const ResistorReport& rc) {
    if (!rc.value_ohm) return fmt::format("none of the {} series fits", eseries_name(rc.series));
    return fmt::format("{} ({} ± {}{}), {}", qf(*rc.value_ohm, Unit::ohm), eseries_name(rc.series),
                       qf(rc.tolerance, Unit::ratio),
                       rc.power_rating_w ? ", " + qf(*rc.power_rating_w, Unit::watt) : std::string(),
                       rc.fixed                     ? "fixed by the spec"
                       : rc.kind == "base resistor" ? "largest that saturates"
                                                    : "smallest the pin can carry");
}

std::string pulldown_words(const Spec& spec) {
    if (spec.mosfet()) {
        return qf(spec.pulldown_ohm.value_or(defaults::nmos_pulldown_ohm), Unit::ohm) +
               (spec.pulldown_ohm ? "" : " (default)");
    }
    return spec.pulldown_ohm ? qf(*spec.pulldown_ohm, Unit::ohm) : std::string("none (see notes)");
}

}  // namespace

namespace text {

std::string design_section(const SizingReport& report, const TextStyle& style) {
    const Spec& spec = report.spec;
    const ResistorReport& rc = report.resistor;
    std::string out = heading("Design");
    out += labelled("transistor", transistor_words(spec.transistor), style);
    if (rc.kind.empty())
        out += labelled("input", "built into the array (no resistor to choose)", style);
    else
        out += labelled(rc.kind, resistor_words(rc), style);
    if (auto lo = report.quantity("base_resistor_min_ohm"), hi = report.quantity("base_resistor_max_ohm"); lo && hi) {
        out += labelled("window", window_words(*lo, *hi), style);
    }
    if (spec.mosfet() || spec.bipolar()) out += labelled("pull-down", pulldown_words(spec), style);
    out += labelled("clamp", clamp_words(spec.clamp), style);
    return out + "\n";
}

std::string design_brief(const SizingReport& report, const TextStyle& style) {
    const Spec& spec = report.spec;
    const ResistorReport& rc = report.resistor;
    std::string d = "Design: " + std::string(display_id(origin(spec.transistor)));
    if (!rc.kind.empty()) {
        d += ", " + std::string(rc.kind) + " " +
             (rc.value_ohm ? qf(*rc.value_ohm, Unit::ohm) + " " + std::string(eseries_name(rc.series))
                           : std::string("(none fits)"));
    }
    if (spec.bipolar() || spec.mosfet()) d += ", pull-down " + pulldown_words(spec);
    d += ", clamp " + clamp_words(spec.clamp);
    return wrap(d, style.width, 2) + "\n";
}

std::string inputs_section(const SizingReport& report, const TextStyle& style) {
    const Spec& spec = report.spec;
    const SupplySpec& s = spec.supply;
    std::string out = heading("Inputs as understood");
    out +=
        labelled("supply",
                 (s.min_v || s.max_v)
                     ? fmt::format("{} to {}{}", qf(s.lo_v(), Unit::volt), qf(s.hi_v(), Unit::volt),
                                   s.voltage_v > 0 ? " (nominal " + qf(s.voltage_v, Unit::volt) + ")" : std::string())
                     : fmt::format("{} ± {} ({} to {})", qf(s.voltage_v, Unit::volt), qf(s.tolerance, Unit::ratio),
                                   qf(s.lo_v(), Unit::volt), qf(s.hi_v(), Unit::volt)),
                 style);
    out += labelled(
        "ambient",
        fmt::format("{} to {}", qf(spec.ambient.min_c, Unit::celsius), qf(spec.ambient.max_c, Unit::celsius)), style);
    const CoilSpec& c = spec.coil;
    std::string coil = fmt::format("{} rated, {} ± {} at {}; must-operate {}, must-release {} of rated",
                                   qf(c.rated_voltage_v, Unit::volt), qf(c.resistance_ohm, Unit::ohm),
                                   qf(c.tolerance, Unit::ratio), qf(c.reference_temp_c, Unit::celsius),
                                   qf(c.must_operate, Unit::ratio), qf(c.must_release, Unit::ratio));
    if (c.inductance_h) coil += ", L " + qf(*c.inductance_h, Unit::henry);
    if (c.self_heating_k.value_or(0) > 0) coil += ", self-heating " + qf(*c.self_heating_k, Unit::kelvin);
    if (c.thermal_resistance_k_per_w) coil += ", winding " + qf(*c.thermal_resistance_k_per_w, Unit::kelvin_per_watt);
    if (c.max_voltage_v) coil += ", max " + qf(*c.max_voltage_v, Unit::volt);
    if (!c.preset.empty()) coil += " (preset " + c.preset + ")";
    out += labelled("coil", coil, style);
    const PinSpec& p = spec.pin;
    std::string pin = fmt::format("{} ± {}, rated output current {}", qf(p.vdd_v, Unit::volt),
                                  qf(p.vdd_tolerance, Unit::ratio), qf(p.max_current_a, Unit::ampere));
    if (p.voh_v)
        pin += fmt::format(", VOH {} at {}", qf(*p.voh_v, Unit::volt), qf(p.voh_current_a.value_or(0), Unit::ampere));
    if (!p.preset.empty()) pin += " (preset " + p.preset + ")";
    out += labelled("pin", pin, style);
    if (spec.switching.frequency_hz) {
        out += labelled("switching",
                        fmt::format("{}, {} on", qf(*spec.switching.frequency_hz, Unit::hertz),
                                    qf(spec.switching.duty, Unit::ratio)),
                        style);
    }
    if (spec.load) {
        out += labelled(
            "load",
            fmt::format("{} {}{}", qf(spec.load->voltage_v, Unit::volt), spec.load->kind == LoadKind::ac ? "AC" : "DC",
                        spec.load->current_a ? ", " + qf(*spec.load->current_a, Unit::ampere) : std::string()),
            style);
    }
    return out + "\n";
}

}  // namespace text

namespace {

// --brief: the verdict, the design and the failing or warning checks, about 12 lines at most.
std::string render_brief(const SizingReport& report, const TextStyle& style) {
    std::string out = text::title_line(report, style);
    out += text::verdict_line(report, style);
    out += text::design_brief(report, style);
    out += text::checks_brief(report, style, 8);
    return out;
}

}  // namespace

std::string render_text(const SizingReport& report, const TextStyle& style) {
    if (style.brief) return render_brief(report, style);
    std::string out = text::title_line(report, style);
    out += text::verdict_line(report, style) + "\n";
    out += text::design_section(report, style);
    out += text::checks_section(report, style);
    out += render_contact_text(report, style);  // the contact ratings against the load
    out += text::inputs_section(report, style);
    out += text::figures_section(report, style);
    out += text::clamp_options_section(report, style);
    out += text::notes_section(report, style);
    out += text::cautions_section(report, style);
    return out;
}

}  // namespace coilfit::io
