// The checks table of the text report: one row per check saying what it compared.
#include <array>
#include <cmath>
#include <vector>

#include <fmt/format.h>

#include "io/format.hpp"
#include "io/report_text_parts.hpp"

namespace coilfit::io::text {
namespace {

// What each check compares, in a few words (the message has the whole story).
std::string compared(const Check& c, const Spec& spec) {
    const bool mos = spec.mosfet() != nullptr;
    static const std::array<std::pair<std::string_view, std::string_view>, 21> words{{
        {"coil.operate", "coil voltage vs must-operate"},
        {"coil.overvoltage", "coil voltage vs coil max"},
        {"coil.thermal", "winding vs insulation limit"},
        {"transistor.saturation", "forced gain Ic/Ib vs target"},
        {"transistor.thermal", "junction vs Tj max less margin"},
        {"pin.current", "pin current vs rated output"},
        {"resistor.power", "base resistor power vs rating"},
        {"diode.voltage", "diode reverse voltage vs VRRM"},
        {"diode.current", "diode current vs rating"},
        {"clamp.power", "clamp average power vs rating"},
        {"clamp.pulse", "clamp pulse vs surge rating"},
        {"release.time", "release time vs longest allowed"},
        {"switching.timing", "coil settling vs on/off-time"},
        {"gate.drive", "gate voltage vs Rds(on) test Vgs"},
        {"gate.voltage", "gate voltage vs Vgs max"},
        {"input.drive", "input voltage vs input-on level"},
        {"contact.voltage", "load voltage vs contact rating"},
        {"contact.current", "load current vs contact rating"},
        {"contact.inrush", "inrush vs contact making rating"},
        {"contact.breaking", "DC current vs breaking curve"},
        {"contact.min_load", "load vs contacts' minimum load"},
    }};
    if (c.id == "transistor.current") return mos ? "coil current vs derated Id max" : "coil current vs derated Ic max";
    if (c.id == "transistor.voltage") return mos ? "peak drain voltage vs Vds max" : "peak collector voltage vs Vceo";
    for (const auto& [id, w] : words) {
        if (c.id == id) return std::string(w);
    }
    return c.id;
}

// The reason a check was skipped, without the "not checked: " the JSON message starts with.
std::string skip_words(const Check& c) {
    std::string r = c.reason.empty() ? c.message : c.reason;
    constexpr std::string_view prefix = "not checked: ";
    if (r.rfind(prefix, 0) == 0) r = r.substr(prefix.size());
    return "skipped: " + r;
}

// What a failing or warning check says to change: its message after the comparison ("...
// against 8 mA: use a smaller base resistor" gives "use a smaller base resistor").
// Only a colon outside parentheses counts: "(beyond the part's data: ...)" is a remark, not the fix.
std::string fix_words(const Check& c) {
    int depth = 0;
    for (std::size_t i = 0; i + 1 < c.message.size(); ++i) {
        const char ch = c.message[i];
        if (ch == '(')
            ++depth;
        else if (ch == ')' && depth > 0)
            --depth;
        else if (ch == ':' && c.message[i + 1] == ' ' && depth == 0)
            return c.message.substr(i + 2);
    }
    return {};
}

// The line under a failing or warning row: what to change, else (a warning with nothing to
// change, e.g. data beyond the part's range) what was found.
std::string fix_line(const Check& c, std::size_t width, std::size_t indent) {
    const std::string fix = fix_words(c);
    if (!fix.empty()) return "fix: " + wrap(fix, width, indent + 5);
    return "found: " + wrap(c.message, width, indent + 7);
}

struct Row {
    const Check* check;
    std::string value, limit, margin, what;
};

std::string value_cell(const std::optional<double>& v, Unit u) { return v ? qf(*v, u) : std::string(); }

std::vector<Row> rows_of(const SizingReport& report) {
    std::vector<Row> rows;
    for (const Check& c : report.checks) {
        if (!in_checks_table(c)) continue;
        const bool skipped = c.verdict == Verdict::skip;
        rows.push_back({&c, value_cell(c.value, c.unit), value_cell(c.limit, c.unit), margin_text(c),
                        skipped ? skip_words(c) : compared(c, report.spec)});
    }
    return rows;
}

// Each check on its own lines, for screens too narrow for the table.
std::string stacked(const std::vector<Row>& rows, const TextStyle& style) {
    std::string out;
    for (const Row& r : rows) {
        const Check& c = *r.check;
        out += "  " + c.id + "  " + paint(verdict_word(c.verdict), c.verdict, style) + "\n";
        out += "    " + wrap(r.what, style.width, 4) + "\n";
        if (!r.value.empty() || !r.limit.empty()) {
            out += "    " +
                   wrap(fmt::format("{}{}{}", r.value, r.limit.empty() ? "" : " against " + r.limit,
                                    r.margin.empty() ? "" : ", margin " + r.margin),
                        style.width, 4) +
                   "\n";
        }
        if (c.verdict == Verdict::fail || c.verdict == Verdict::warn)
            out += "    " + fix_line(c, style.width, 4) + "\n";
    }
    return out;
}

}  // namespace

std::string verdict_word(Verdict v) {
    switch (v) {
        case Verdict::pass:
            return "pass";
        case Verdict::warn:
            return "WARN";
        case Verdict::fail:
            return "FAIL";
        case Verdict::skip:
            return "skip";
    }
    return "";
}

bool in_checks_table(const Check&) { return true; }

std::string margin_text(const Check& c) {
    if (!c.margin) return "";
    const double m = *c.margin;
    std::string out = m < -9.99 ? std::string("<-999 %") : fmt::format("{:+.0f} %", m * 100.0);
    // Far beyond its limit the ratio says more than the percentage: "-277 % (3.8x)".
    if (m < -1.0 && c.value && c.limit && *c.limit > 0 && *c.value > 0) {
        out += " (" + format_quantity(*c.value / *c.limit, Unit::number, 2) + "x)";
    }
    return out;
}

std::string checks_section(const SizingReport& report, const TextStyle& style) {
    const std::vector<Row> rows = rows_of(report);
    std::string out = heading("Checks (each at its own worst case)");
    std::size_t iw = 5, vw = 5, lw = 5, mw = 6;
    for (const Row& r : rows) {
        iw = std::max(iw, display_width(r.check->id));
        vw = std::max(vw, display_width(r.value));
        lw = std::max(lw, display_width(r.limit));
        mw = std::max(mw, display_width(r.margin));
    }
    // verdict, check, value, limit, margin, then what it compared in the rest of the line.
    const std::size_t fixed = 2 + 4 + 2 + iw + 2 + vw + 2 + lw + 2 + mw + 2;
    if (fixed > style.width) return out + stacked(rows, style) + "\n";
    // Room for what it compared beside the numbers, else on a line of its own under them.
    const bool beside = fixed + 28 <= style.width;
    constexpr std::size_t indent = 8;
    out += "  " + pad_right("", 4) + "  " + pad_right("check", iw) + "  " + pad_left("value", vw) + "  " +
           pad_left("limit", lw) + "  " + pad_left("margin", mw) + (beside ? "  compared" : "") + "\n";
    for (const Row& r : rows) {
        const Check& c = *r.check;
        std::string line = "  " + paint(pad_right(verdict_word(c.verdict), 4), c.verdict, style) + "  " +
                           pad_right(c.id, iw) + "  " + pad_left(r.value, vw) + "  " + pad_left(r.limit, lw) + "  " +
                           pad_left(r.margin, mw);
        if (c.verdict == Verdict::skip) line = "  " + paint("skip", c.verdict, style) + "  " + c.id;
        if (beside)
            line = pad_right(line, fixed) + wrap(r.what, style.width, fixed);
        else
            line += "\n" + std::string(indent, ' ') + wrap(r.what, style.width, indent);
        out += line + "\n";
        if (c.verdict == Verdict::fail || c.verdict == Verdict::warn) {
            out += std::string(indent, ' ') + fix_line(c, style.width, indent) + "\n";
        }
    }
    return out + "\n";
}

std::string checks_brief(const SizingReport& report, const TextStyle& style, std::size_t max_rows) {
    std::string out;
    std::size_t shown = 0;
    std::size_t more = 0;
    for (const Check& c : report.checks) {
        if (c.verdict != Verdict::fail && c.verdict != Verdict::warn) continue;
        if (shown == max_rows) {
            ++more;
            continue;
        }
        ++shown;
        std::string line = paint(verdict_word(c.verdict), c.verdict, style) + " " + c.id;
        if (c.value && c.limit)
            line += fmt::format(": {} against {} ({})", qf(*c.value, c.unit), qf(*c.limit, c.unit), margin_text(c));
        else
            line += ": " + compared(c, report.spec);
        out += "  " + wrap(line, style.width, 4) + "\n";
    }
    if (more) out += fmt::format("  ... and {} more (the full report: coilfit size without --brief)\n", more);
    return out;
}

}  // namespace coilfit::io::text
