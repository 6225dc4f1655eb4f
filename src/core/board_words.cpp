// The words of a board's checks, its sums and its notes (numbers in board.cpp).
#include <algorithm>

#include "board_parts.hpp"
#include "report_parts.hpp"

namespace coilfit {
namespace {

std::string q(double value, Unit unit) { return format_quantity(value, unit); }
std::string amps(double value) { return q(value, Unit::ampere); }

// Consecutive channels of the set that come from one entry of the board file.
struct Run {
    std::size_t first = 0;  // a channel index
    std::size_t count = 0;
};

std::vector<Run> runs_of(const Board& board, const std::vector<std::size_t>& set) {
    std::vector<Run> runs;
    for (const std::size_t i : set) {
        if (!runs.empty() && board.channels[runs.back().first].entry == board.channels[i].entry)
            ++runs.back().count;
        else
            runs.push_back({i, 1});
    }
    return runs;
}

std::string run_words(const Board& board, const Run& run) {
    const BoardChannel& ch = board.channels[run.first];
    if (run.count == 1) return ch.spec.name;
    if (run.count == ch.repeats) return ch.entry_name + " (all " + std::to_string(run.count) + ")";
    return std::to_string(run.count) + " of " + ch.entry_name;
}

std::string join(const std::vector<std::string>& parts) {
    std::string out;
    for (std::size_t k = 0; k < parts.size(); ++k) {
        if (k > 0) out += k + 1 == parts.size() ? " and " : ", ";
        out += parts[k];
    }
    return out;
}

// "K1 pump 4.12 mA, 7 x K2-K8 valves 1.05 mA each"
std::string contributions(const Board& board, const std::vector<std::size_t>& set, const std::vector<double>& w,
                          Unit unit) {
    std::vector<std::string> parts;
    for (const Run& run : runs_of(board, set)) {
        if (run.count == 1) {
            parts.push_back(board.channels[run.first].spec.name + " " + q(w[run.first], unit));
        } else {
            parts.push_back(std::to_string(run.count) + " x " + board.channels[run.first].entry_name + " " +
                            q(w[run.first], unit) + " each");
        }
    }
    return join(parts);
}

bool whole_board(const Board& board, const std::vector<std::size_t>& set) {
    return set.size() == board.channels.size();
}

std::string on_words(const Board& board, const WorstSet& set) {
    if (set.on.empty()) return "with no channel on";
    return "with " + set_words(board, set.on) + " on";
}

}  // namespace

std::string set_words(const Board& board, const std::vector<std::size_t>& set) {
    if (set.empty()) return "no channel";
    if (whole_board(board, set))
        return set.size() == 1 ? "the only channel" : "all " + std::to_string(set.size()) + " channels";
    std::vector<std::string> parts;
    for (const Run& run : runs_of(board, set)) parts.push_back(run_words(board, run));
    return join(parts);
}

std::string simultaneity_words(const Board& board) {
    const Simultaneity& s = board.simultaneous;
    if (s.all()) return "every channel may be on at once (simultaneous: all)";
    std::string out;
    if (s.max_on)
        out = "at most " + std::to_string(*s.max_on) + " channel" + (*s.max_on == 1 ? "" : "s") + " on at once";
    if (!s.groups.empty()) {
        std::vector<std::string> groups;
        for (const auto& g : s.groups) groups.push_back("[" + set_words(board, g) + "]");
        std::string text = "channels of different groups never on together: ";
        for (std::size_t k = 0; k < groups.size(); ++k) text += (k ? " | " : "") + groups[k];
        out += (out.empty() ? "" : "; ") + text;
    }
    return out;
}

namespace board {

std::string message(const Context& ctx, CheckId id, const std::string& subject, const CheckValue& c,
                    const WorstSet& set, const std::vector<double>& weights) {
    const Board& b = ctx.board;
    const bool ok = c.verdict != Verdict::fail;
    const std::string who = contributions(b, set.on, weights, Unit::ampere);
    switch (id) {
        case CheckId::port_current:
            return "the pins on " + subject + " source up to " + amps(c.value) + " together (" + who + ") " +
                   on_words(b, set) + ", against the port's limit " + amps(c.limit) +
                   (ok ? std::string()
                       : ": allow fewer channels on at once (simultaneous), move channels to another port, or draw "
                         "less "
                         "per pin (a larger base resistor where saturation allows it, an array with a larger input "
                         "resistor)");
        case CheckId::package_current:
            return "the MCU's pins source up to " + amps(c.value) + " together " + on_words(b, set) +
                   ", against the package's limit " + amps(c.limit) +
                   (ok ? std::string()
                       : ": allow fewer channels on at once, or buffer the drive (a driver that draws less from the "
                         "pin)");
        case CheckId::supply_current:
            return "the channels on the board's supply draw up to " + amps(c.value) +
                   " (coil and drive currents: " + who + ") " + on_words(b, set) + ", " +
                   q(c.value * b.supply.hi_v(), Unit::watt) + " at the highest supply " +
                   q(b.supply.hi_v(), Unit::volt) + ", against the supply's rating " + amps(c.limit) +
                   (ok ? std::string() : ": use a supply rated for it, or allow fewer channels on at once");
        case CheckId::array_current: {
            const ArrayPart& part = *b.channels[set.on.empty() ? 0 : set.on.front()].spec.array();
            return "the channels of " + subject + " carry up to " + amps(c.value) + " through its ground pin " +
                   on_words(b, set) +
                   ", and the same through its common clamp pin when they turn off together, against " + amps(c.limit) +
                   " (" + q(b.channels[set.on.empty() ? 0 : set.on.front()].spec.policy.current_derating, Unit::ratio) +
                   " of the package's total rating " + amps(part.ic_total_max_a.value_or(0)) + ")" +
                   (ok ? std::string() : ": spread the channels over two packages, or allow fewer on at once");
        }
        default:
            return {};
    }
}

std::string skip_reason(const Context& ctx, CheckId id, const std::string& subject, const WorstSet& set) {
    const Board& b = ctx.board;
    const std::string sum = amps(set.sum) + " " + on_words(b, set);
    switch (id) {
        case CheckId::port_current:
            return "not checked: " + subject + " gives no current_max (its pins source up to " + sum + ")";
        case CheckId::package_current:
            return "not checked: the mcu gives no package_current_max (its pins source up to " + sum + ")";
        case CheckId::supply_current:
            return "not checked: the supply gives no current_max (the channels draw up to " + sum + ", " +
                   q(set.sum * b.supply.hi_v(), Unit::watt) + " at the highest supply)";
        case CheckId::array_current:
            return "not checked: the array's record gives no total current rating (ic_total_max); the channels of " +
                   subject + " carry up to " + sum;
        default:
            return "not checked";
    }
}

std::string array_power_message(const Context& ctx, const Package& pkg, const CheckValue& c, const WorstSet& set,
                                double ambient_c) {
    const Board& b = ctx.board;
    std::vector<double> w(b.channels.size(), 0.0);
    for (const std::size_t i : set.on) w[i] = ctx.loads[i].power_w[static_cast<std::size_t>(c.corner)];
    const double tj = ambient_c + c.value * pkg.rth_k_per_w;
    const bool ok = c.verdict != Verdict::fail;
    return "array " + pkg.name + " (" + display_id(*pkg.part) + ") dissipates up to " + q(c.value, Unit::watt) +
           " (Vce(sat) I: " + contributions(b, set.on, w, Unit::watt) + ") " + on_words(b, set) + ": junction " +
           q(tj, Unit::celsius) + " at " + q(ambient_c, Unit::celsius) + " ambient against " +
           q(pkg.tj_limit_c, Unit::celsius) + "; the package may dissipate " + q(c.limit, Unit::watt) + " there (Pd " +
           q(pkg.part->pd_w, Unit::watt) + ", RthJA " + q(pkg.rth_k_per_w, Unit::kelvin_per_watt) + ")" +
           (ok ? std::string()
               : ": spread the channels over two packages, allow fewer on at once, or use an array with a lower "
                 "on-voltage");
}

std::vector<QuantityEntry> quantities(const Context& ctx) {
    const Board& b = ctx.board;
    const std::size_t n = b.channels.size();
    std::vector<double> supply(n, 0.0), pins(n, 0.0);
    for (std::size_t i = 0; i < n; ++i) {
        if (b.channels[i].board_supply) supply[i] = ctx.loads[i].coil_a + ctx.loads[i].pin_a;
        pins[i] = ctx.loads[i].pin_a;
    }
    const double supply_a = worst_allowed_set(b.simultaneous, supply).sum;
    std::vector<QuantityEntry> out;
    report::add(out, "supply_current_max_a", supply_a, Unit::ampere, "supply current, worst allowed set");
    report::add(out, "supply_power_max_w", supply_a * b.supply.hi_v(), Unit::watt,
                "supply power at the highest supply");
    report::add(out, "mcu_current_max_a", worst_allowed_set(b.simultaneous, pins).sum, Unit::ampere,
                "MCU source current, worst allowed set");
    report::add(out, "channel_count", static_cast<double>(n), Unit::number, "channels");
    return out;
}

std::vector<std::string> notes(const Context& ctx) {
    const Board& b = ctx.board;
    std::vector<std::string> out;
    out.push_back(simultaneity_words(b) + "; each board check is taken at the allowed set of channels worst for it");
    out.emplace_back(
        "a channel on counts with its highest pin and coil currents (each at its own worst corner); the port, "
        "package and supply limits are used as given, not derated");
    out.emplace_back(
        "drive currents are counted against the coil supply too, as if the MCU were fed from it through a "
        "linear regulator");
    for (const BoardChannel& ch : b.channels) {
        if (!ch.board_supply && ch.repeat == 0) {
            out.push_back(ch.entry_name + " gives a supply of its own: it is not counted in supply.current");
        }
    }
    if (!ctx.packages.empty()) {
        out.emplace_back(
            "channels of one array package share its ground pin and its common clamp pin: tie the common pin to "
            "the coil supply of those channels");
    }
    return out;
}

}  // namespace board
}  // namespace coilfit
