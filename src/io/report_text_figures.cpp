// The figures (grouped by what they describe), clamp options, notes and cautions of the text report.
#include <array>
#include <vector>

#include <fmt/format.h>

#include "io/format.hpp"
#include "io/report_text_parts.hpp"

namespace coilfit::io::text {
namespace {

// The group of a figure, from its key (the JSON report's flat keys).
std::size_t group_of(std::string_view key) {
    const auto starts = [&](std::string_view p) { return key.rfind(p, 0) == 0; };
    if (starts("coil_") || starts("operate_voltage") || starts("release_current")) return 0;
    if (starts("transistor_power") || starts("junction_")) return 2;
    if (starts("peak_") || starts("clamp_") || starts("stored_") || starts("diode_") || starts("zener_") ||
        starts("avalanche_"))
        return 3;
    if (starts("release_time") || starts("current_zero") || starts("operate_time")) return 4;
    return 1;  // the drive: gain, base or gate, pin
}

constexpr std::array<std::string_view, 5> group_names{"coil", "drive", "transistor", "clamp", "timing"};

}  // namespace

std::string figures_section(const SizingReport& report, const TextStyle& style) {
    // Labels longer than the room left for them take a line of their own, the value under it.
    // (at most 56 columns, so that one long label does not push every value far right).
    const std::size_t room = std::min<std::size_t>(56, style.width > 4 + 2 + 12 ? style.width - 4 - 2 - 12 : 0);
    std::size_t label_w = 0;
    for (const auto& e : report.quantities) {
        if (display_width(e.label) <= room) label_w = std::max(label_w, display_width(e.label));
    }
    std::string out = heading("Figures");
    for (std::size_t g = 0; g < group_names.size(); ++g) {
        bool first = true;
        for (const auto& e : report.quantities) {
            if (group_of(e.key) != g) continue;
            if (first) out += "  " + std::string(group_names[g]) + "\n";
            first = false;
            if (display_width(e.label) > label_w) {
                out += "    " + wrap(e.label, style.width, 4) + "\n    " + pad_right("", label_w) + "  " +
                       qf(e.value, e.unit) + "\n";
            } else {
                out += "    " + pad_right(e.label, label_w) + "  " + qf(e.value, e.unit) + "\n";
            }
        }
    }
    return out + "\n";
}

std::string clamp_options_section(const SizingReport& report, const TextStyle& style) {
    if (report.clamp_options.empty()) return {};
    std::string out = wrap("Clamp options (faster release costs collector voltage)", style.width, 2) + "\n";
    std::size_t ow = 6;
    for (const auto& o : report.clamp_options) ow = std::max(ow, display_width(o.label));
    const bool narrow = 4 + ow + std::size_t{33} + 11 > style.width;  // three 11-column cells and the last
    if (!narrow) {
        out += "    " + pad_right("clamp", ow) + "  " + pad_left("peak Vce", 9) + "  " + pad_left("release", 9) + "  " +
               pad_left("energy", 9) + "  in rating\n";
    }
    for (const auto& o : report.clamp_options) {
        const std::string mark = o.chosen ? "  > " : "    ";
        const std::string peak = qf(o.peak_collector_v, Unit::volt);
        const std::string release =
            o.release_time_s ? qf(*o.release_time_s, Unit::second) : std::string("not estimated");
        const std::string energy = qf(o.clamp_energy_j, Unit::joule);
        if (narrow) {
            out += mark + o.label + "\n      " +
                   wrap(fmt::format("peak {}, release {}, energy {}, {}", peak, release, energy,
                                    o.within_rating ? "within rating" : "beyond rating"),
                        style.width, 6) +
                   "\n";
        } else {
            out += mark + pad_right(o.label, ow) + "  " + pad_left(peak, 9) + "  " + pad_left(release, 9) + "  " +
                   pad_left(energy, 9) + "  " + (o.within_rating ? "yes" : "no") + "\n";
        }
    }
    return out + "  (> marks the clamp of this spec)\n\n";
}

std::string notes_section(const SizingReport& report, const TextStyle& style) {
    // The defaults the method filled in read as one note; the rest one each.
    constexpr std::string_view default_prefix = "default used: ";
    std::string defaults;
    std::vector<std::string> others;
    for (const auto& n : report.notes) {
        if (n.rfind(default_prefix, 0) == 0)
            defaults += (defaults.empty() ? "" : "; ") + n.substr(default_prefix.size());
        else
            others.push_back(n);
    }
    if (defaults.empty() && others.empty()) return {};
    std::string out = heading("Notes");
    if (!defaults.empty()) out += "  - " + wrap("defaults used: " + defaults, style.width, 4) + "\n";
    for (const auto& n : others) out += "  - " + wrap(n, style.width, 4) + "\n";
    return out + "\n";
}

std::string cautions_section(const SizingReport& report, const TextStyle& style) {
    std::string out = heading("Cautions");
    std::vector<std::string> seen;
    for (const auto& c : report.cautions) {
        if (std::find(seen.begin(), seen.end(), c) != seen.end()) continue;  // each caution once
        seen.push_back(c);
        out += "  ! " + wrap(c, style.width, 4) + "\n";
    }
    return out;
}

}  // namespace coilfit::io::text
