// The turn-off plot (plot_svg.hpp): two panels over one time axis, the coil current above and the
// collector voltage below, one colour per clamp option, the release current and the derated
// voltage limit as dashed lines, a legend on the right. A white page of its own, so it reads the
// same in light and dark viewers.
#include "io/plot_svg.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

namespace coilfit::io {
namespace {

constexpr double page_w = 960, page_h = 640;
constexpr double plot_x = 84, plot_w = 600;
constexpr double current_y = 92, voltage_y = 352, panel_h = 214;
constexpr double legend_x = 712;
constexpr std::size_t samples_per_curve = 320;
// Our own palette: saturated enough to tell apart on white, none of them grey or red (the two
// marker lines use those).
constexpr const char* palette[] = {"#1d5f9f", "#d9661f", "#2b8a57", "#8a3fb0", "#b08a00", "#13878f"};
constexpr const char* ink = "#1f2a36";
constexpr const char* soft_ink = "#5b6672";
constexpr const char* grid = "#e3e7ec";
constexpr const char* release_colour = "#4a525c";
constexpr const char* limit_colour = "#c4202f";

std::string esc(std::string_view s) {
    std::string out;
    for (const char ch : s) {
        switch (ch) {
            case '&':
                out += "&amp;";
                break;
            case '<':
                out += "&lt;";
                break;
            case '>':
                out += "&gt;";
                break;
            case '"':
                out += "&quot;";
                break;
            default:
                out += ch;
        }
    }
    return out;
}

// A linear axis: its range, a tick step of 1, 2 or 5 times a power of ten, and the SI prefix
// (power of 1000) its labels are written in.
struct Axis {
    double lo = 0, hi = 1, step = 0.2;
    int exp3 = 0;

    [[nodiscard]] double frac(double v) const { return (v - lo) / (hi - lo); }
};

Axis make_axis(double lo, double hi, bool round_hi) {
    if (!(hi > lo)) hi = lo + 1.0;
    Axis a;
    const double raw = (hi - lo) / 6.0;
    const double mag = std::pow(10.0, std::floor(std::log10(raw)));
    const double norm = raw / mag;
    a.step = (norm < 1.5 ? 1.0 : norm < 3.5 ? 2.0 : norm < 7.5 ? 5.0 : 10.0) * mag;
    a.lo = lo;
    a.hi = round_hi ? std::ceil(hi / a.step - 1e-9) * a.step : hi;
    const double top = std::max(std::abs(a.lo), std::abs(a.hi));
    a.exp3 = std::clamp(static_cast<int>(std::floor(std::log10(top) / 3.0)) * 3, -12, 6);
    return a;
}

std::string_view prefix(int exp3) {
    switch (exp3) {
        case -12:
            return "p";
        case -9:
            return "n";
        case -6:
            return "µ";
        case -3:
            return "m";
        case 3:
            return "k";
        case 6:
            return "M";
        default:
            return "";
    }
}

std::string tick_label(const Axis& a, double v) {
    const double scale = std::pow(10.0, a.exp3);
    const double scaled_step = a.step / scale;
    const int decimals = scaled_step >= 1.0 ? 0 : static_cast<int>(std::ceil(-std::log10(scaled_step) - 1e-9));
    const double x = v / scale;
    if (std::abs(x) < scaled_step * 1e-6) return "0";
    const std::string s = fmt::format("{:.{}f}", std::abs(x), decimals);
    return x < 0 ? "\u2212" + s : s;  // a true minus sign
}

std::vector<double> ticks(const Axis& a) {
    std::vector<double> t;
    for (double k = std::ceil(a.lo / a.step - 1e-9); k * a.step <= a.hi + a.step * 1e-9; k += 1.0)
        t.push_back(k * a.step);
    return t;
}

struct Panel {
    double y = 0;
    Axis x, v;
    std::string id;

    [[nodiscard]] double px(double t) const { return plot_x + x.frac(t) * plot_w; }
    [[nodiscard]] double py(double value) const { return y + panel_h - v.frac(value) * panel_h; }
};

// Grid, frame, tick labels and the axis title of one panel; time labels only under the lower one.
void draw_panel(std::string& o, const Panel& p, const std::string& title, bool time_labels) {
    // The axes' ranges ride along as data attributes, so that a test can read values back off the drawing.
    o += fmt::format(R"(<rect class="panel" id="{}" x="{}" y="{}" width="{}" height="{}" fill="#fbfcfd" stroke="none" )"
                     R"(data-t-from="{:.9g}" data-t-to="{:.9g}" data-lo="{:.9g}" data-hi="{:.9g}"/>)"
                     "\n",
                     p.id, plot_x, p.y, plot_w, panel_h, p.x.lo, p.x.hi, p.v.lo, p.v.hi);
    for (const double t : ticks(p.x)) {
        const double x = p.px(t);
        o += fmt::format(R"(<line x1="{:.2f}" y1="{}" x2="{:.2f}" y2="{}" stroke="{}" stroke-width="1"/>)"
                         "\n",
                         x, p.y, x, p.y + panel_h, t == 0.0 ? "#c9d0d8" : grid);
        if (time_labels) {
            o += fmt::format(R"(<text x="{:.2f}" y="{}" text-anchor="middle" fill="{}">{}</text>)"
                             "\n",
                             x, p.y + panel_h + 18, soft_ink, tick_label(p.x, t));
        }
    }
    for (const double v : ticks(p.v)) {
        const double y = p.py(v);
        o += fmt::format(R"(<line x1="{}" y1="{:.2f}" x2="{}" y2="{:.2f}" stroke="{}" stroke-width="1"/>)"
                         "\n",
                         plot_x, y, plot_x + plot_w, y, grid);
        o += fmt::format(R"(<text x="{}" y="{:.2f}" text-anchor="end" fill="{}">{}</text>)"
                         "\n",
                         plot_x - 8, y + 4, soft_ink, tick_label(p.v, v));
    }
    // The value axis as one firm line on the left; no box around the panel.
    o += fmt::format(R"(<line x1="{}" y1="{}" x2="{}" y2="{}" stroke="{}" stroke-width="1.5"/>)"
                     "\n",
                     plot_x, p.y, plot_x, p.y + panel_h, soft_ink);
    o += fmt::format(R"(<text x="{}" y="{}" fill="{}" font-weight="600">{}</text>)"
                     "\n",
                     plot_x, p.y - 10, ink, esc(title));
}

void draw_curve(std::string& o, const Panel& p, const std::vector<SamplePoint>& pts, const char* colour, bool chosen,
                const std::string& label) {
    std::string points;
    for (const SamplePoint& s : pts) points += fmt::format("{:.2f},{:.2f} ", p.px(s.t_s), p.py(s.value));
    if (!points.empty()) points.pop_back();
    o += fmt::format(R"(<polyline class="curve" data-option="{}" fill="none" stroke="{}" stroke-width="{}" )"
                     R"~(stroke-linejoin="round" stroke-linecap="round" clip-path="url(#clip-{})" points="{}"/>)~"
                     "\n",
                     esc(label), colour, chosen ? 3.4 : 2.4, p.id, points);
}

// A dashed horizontal marker across a panel, its words above it at the right end.
void draw_marker(std::string& o, const Panel& p, double value, const char* colour, const std::string& words) {
    const double y = p.py(value);
    o += fmt::format(R"(<line class="marker" x1="{}" y1="{:.2f}" x2="{}" y2="{:.2f}" stroke="{}" stroke-width="1.6" )"
                     R"(stroke-dasharray="7 4"/>)"
                     "\n",
                     plot_x, y, plot_x + plot_w, y, colour);
    o += fmt::format(R"(<text x="{}" y="{:.2f}" text-anchor="end" fill="{}">{}</text>)"
                     "\n",
                     plot_x + plot_w - 4, y - 5, colour, esc(words));
}

struct Drawn {
    const ClampOption* option;
    TurnOffSeries series;
    const char* colour;
};

void draw_legend(std::string& o, const std::vector<Drawn>& drawn, const SizingReport& r) {
    double y = current_y;
    o += fmt::format(R"(<text x="{}" y="{}" fill="{}" font-weight="600">clamp options</text>)"
                     "\n",
                     legend_x, y - 10, ink);
    for (const Drawn& d : drawn) {
        y += 12;
        o += fmt::format(
            R"(<line class="swatch" x1="{}" y1="{}" x2="{}" y2="{}" stroke="{}" stroke-width="{}" stroke-linecap="round"/>)"
            "\n",
            legend_x, y - 4, legend_x + 26, y - 4, d.colour, d.option->chosen ? 3.4 : 2.4);
        o += fmt::format(R"(<text x="{}" y="{}" fill="{}">{}</text>)"
                         "\n",
                         legend_x + 34, y, ink, esc(d.option->label + (d.option->chosen ? " *" : "")));
        y += 16;
        std::string facts = "release " + format_quantity(d.series.release_time_s, Unit::second) + ", peak " +
                            format_quantity(d.series.peak_v, Unit::volt);
        if (!d.option->within_rating) facts += ", fails " + d.option->failed_check;
        o += fmt::format(R"(<text x="{}" y="{}" fill="{}" font-size="11">{}</text>)"
                         "\n",
                         legend_x + 34, y, d.option->within_rating ? soft_ink : limit_colour, esc(facts));
        y += 8;
    }
    y += 18;
    o += fmt::format(R"(<text x="{}" y="{}" fill="{}" font-size="11">* the spec's clamp (drawn thicker)</text>)"
                     "\n",
                     legend_x, y, soft_ink);
    y += 26;
    const auto key = [&](const char* colour, const std::string& words) {
        o += fmt::format(
            R"(<line x1="{}" y1="{}" x2="{}" y2="{}" stroke="{}" stroke-width="1.6" stroke-dasharray="7 4"/>)"
            "\n",
            legend_x, y - 4, legend_x + 26, y - 4, colour);
        o += fmt::format(R"(<text x="{}" y="{}" fill="{}" font-size="11">{}</text>)"
                         "\n",
                         legend_x + 34, y, ink, esc(words));
        y += 18;
    };
    key(release_colour, "release current (must-release)");
    key(limit_colour, "derated " + std::string(r.sized.worst.driver.rating_name) + " limit");
}

}  // namespace

std::string turn_off_svg(const SizingReport& r) {
    std::vector<Drawn> drawn;
    double duration = 0, i_max = 0;
    for (const ClampOption& o : r.clamp_options) {
        if (!o.turn_off) continue;
        duration = std::max(duration, turn_off_duration_s(*o.turn_off));
        i_max = std::max({i_max, o.turn_off->i0_a, o.turn_off->i0_peak_a});
        drawn.push_back({&o, {}, palette[drawn.size() % std::size(palette)]});
    }
    if (!r.spec.coil.inductance_h)
        throw InputError("--plot: the turn-off transient needs the coil inductance; give coil.inductance");
    if (drawn.empty() || !(duration > 0)) {
        throw InputError(
            "--plot: nothing to draw; the turn-off transient needs a clamp with a diode (clamp.type is \"none\")");
    }
    const double t_to = duration * 1.08, t_from = -duration * 0.08;
    const double limit_v = r.sized.worst.driver.peak_limit_v;
    double v_max = limit_v;
    for (Drawn& d : drawn) {
        d.series = sample_turn_off(*d.option->turn_off, t_from, t_to, samples_per_curve);
        v_max = std::max(v_max, d.series.peak_v);
    }
    const Axis time = make_axis(t_from, t_to, false);
    const Panel current{current_y, time, make_axis(0.0, i_max * 1.08, true), "panel-current"};
    const Panel voltage{voltage_y, time, make_axis(0.0, v_max * 1.08, true), "panel-voltage"};
    const std::string terminal(r.sized.worst.driver.terminal);

    std::string o;
    o += fmt::format(R"(<svg xmlns="http://www.w3.org/2000/svg" width="{0}" height="{1}" viewBox="0 0 {0} {1}" )"
                     R"(font-family="'DejaVu Sans', 'Liberation Sans', Arial, sans-serif" font-size="12">)"
                     "\n",
                     page_w, page_h);
    o += "<title>coilfit turn-off transient</title>\n";
    for (const Panel* p : {&current, &voltage}) {
        o +=
            fmt::format(R"(<defs><clipPath id="clip-{}"><rect x="{}" y="{}" width="{}" height="{}"/></clipPath></defs>)"
                        "\n",
                        p->id, plot_x - 2, p->y - 2, plot_w + 4, panel_h + 4);
    }
    o += fmt::format(R"(<rect id="page" x="0" y="0" width="{}" height="{}" fill="#ffffff"/>)"
                     "\n",
                     page_w, page_h);
    o += fmt::format(R"(<rect x="0" y="0" width="{}" height="6" fill="{}"/>)"
                     "\n",
                     page_w, ink);
    const std::string name = r.spec.name.empty() ? std::string("unnamed channel") : r.spec.name.substr(0, 80);
    o += fmt::format(R"(<text x="{}" y="36" fill="{}" font-size="17" font-weight="700">Turn-off: {}</text>)"
                     "\n",
                     plot_x, ink, esc(name));
    o += fmt::format(
        R"(<text x="{}" y="56" fill="{}" font-size="11.5">current at the slow corner (cold coil, lowest clamp )"
        R"(voltage); {} voltage at the highest supply and clamp voltage</text>)"
        "\n",
        plot_x, soft_ink, esc(terminal));
    draw_panel(o, current, fmt::format("coil current ({}A)", prefix(current.v.exp3)), false);
    draw_panel(o, voltage, fmt::format("{} voltage ({}V)", terminal, prefix(voltage.v.exp3)), true);
    o += fmt::format(R"(<text x="{}" y="{}" text-anchor="middle" fill="{}">time after turn-off ({}s)</text>)"
                     "\n",
                     plot_x + plot_w / 2, voltage_y + panel_h + 40, ink, prefix(time.exp3));
    const double i_rel = drawn.front().option->turn_off->release_current_a;
    draw_marker(o, current, i_rel, release_colour, "release current " + format_quantity(i_rel, Unit::ampere));
    draw_marker(o, voltage, limit_v, limit_colour, "derated limit " + format_quantity(limit_v, Unit::volt));
    draw_legend(o, drawn, r);
    // The spec's own clamp last, so that it lies on top.
    std::stable_partition(drawn.begin(), drawn.end(), [](const Drawn& d) { return !d.option->chosen; });
    for (const Drawn& d : drawn) {
        draw_curve(o, current, d.series.current, d.colour, d.option->chosen, d.option->label);
        draw_curve(o, voltage, d.series.voltage, d.colour, d.option->chosen, d.option->label);
        if (d.series.release_time_s > 0 && d.series.release_time_s < t_to) {
            o +=
                fmt::format(R"(<circle cx="{:.2f}" cy="{:.2f}" r="3.6" fill="{}" stroke="#ffffff" stroke-width="1.2"/>)"
                            "\n",
                            current.px(d.series.release_time_s), current.py(i_rel), d.colour);
        }
    }
    o += fmt::format(
        R"(<text x="{}" y="{}" fill="{}" font-size="10.5">Closed-form RL decay with the clamp voltage held )"
        R"(constant; ringing and the switch's own turn-off neglected. Values from the datasheet limits in use.</text>)"
        "\n",
        plot_x, page_h - 14, soft_ink);
    o += "</svg>\n";
    return o;
}

}  // namespace coilfit::io
