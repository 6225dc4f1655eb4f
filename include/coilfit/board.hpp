// A board: many driver channels on one coil supply and one microcontroller (src/method.md
// "Boards: many channels, one supply, one MCU"). Every channel is sized and checked on its own
// as `size` would; the board then checks the limits the channels share (port.current,
// package.current, supply.current, array.power, array.current), each at the worst set of
// channels the board allows on at once, and says which set that was.
//
// Modelling assumptions (beside those of sizing.hpp, which hold for every channel):
//  1. A channel on draws its highest pin current and its highest coil current (each at its
//     own worst corner, as its report gives them); the board's sums add those highest values,
//     which is the extreme-value analysis of the method applied to a sum.
//  2. The drive currents are counted as drawn from the coil supply too (as through a linear
//     regulator feeding the MCU): supply.current = sum of coil currents + pin currents.
//  3. Channels of one array package share its ground pin and its common clamp pin: the package
//     carries the sum of their coil currents while on, and the common pin the same sum when they
//     turn off together; the package dissipates the sum of Vce(sat) I, all at one junction.
//  4. Contributions are never negative, so the worst allowed set for a sum is found exactly:
//     all channels; or the largest max_on contributions; or, with groups that exclude each
//     other, the best of (channels in no group + one group), each under max_on when both apply.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "coilfit/check.hpp"
#include "coilfit/report.hpp"
#include "coilfit/spec.hpp"

namespace coilfit {

// A group of MCU pins sharing one supply pin: their source currents together have a limit.
struct PortSpec {
    std::string name;                     // "PA"
    std::optional<double> current_max_a;  // the port's total source limit
};

struct McuSpec {
    std::vector<PortSpec> ports;
    std::optional<double> package_current_max_a;  // the whole package's total source limit
};

struct BoardChannel {
    Spec spec;                        // the channel's whole spec (board sections and defaults filled in)
    std::string pin;                  // "PA0"
    std::optional<std::size_t> port;  // index into mcu.ports
    std::string package;              // the array package it is a channel of ("U3"); empty: discrete
    std::size_t entry = 0;            // the entry of the board file's channel list it came from
    std::string entry_name;           // that entry's name ("K2-K8 valves"); spec.name adds " #3" to repeats
    std::size_t repeat = 0;           // which of the entry's `count` copies (0-based)
    std::size_t repeats = 1;          // the entry's count
    bool board_supply = true;         // false when the channel gives a supply of its own
};

// Which channels may be on at once: all (the default), at most max_on, and/or groups that
// exclude each other (channels of two different groups are never on together; channels in no
// group may be on with any).
struct Simultaneity {
    std::optional<std::size_t> max_on;
    std::vector<std::vector<std::size_t>> groups;  // channel indices

    [[nodiscard]] bool all() const { return !max_on && groups.empty(); }
};

struct Board {
    std::string name;
    SupplySpec supply;
    std::optional<double> supply_current_max_a;
    AmbientSpec ambient;
    McuSpec mcu;
    std::vector<BoardChannel> channels;
    Simultaneity simultaneous;
};

// Whether a set of channels (on[i] for channel i) may be on at once.
[[nodiscard]] bool allowed(const Simultaneity& s, const std::vector<bool>& on);

// The allowed set with the largest sum of the channels' contributions (weights >= 0), and the
// channels in it that contribute (weight > 0), in channel order.
struct WorstSet {
    double sum = 0;
    std::vector<std::size_t> on;
};
[[nodiscard]] WorstSet worst_allowed_set(const Simultaneity& s, const std::vector<double>& weights);

// One check of the board's shared limits: a check of the usual shape, what it is about and the
// set of channels it was taken at.
struct BoardCheck {
    std::string subject;  // "port PA", "MCU package", "supply", "array U3"
    Check check;
    std::vector<std::size_t> set;  // the channels on in the worst allowed set (those that count)
};

struct BoardReport {
    Board board;
    std::vector<SizingReport> channels;  // one full report per channel, in board order
    std::vector<BoardCheck> checks;
    std::vector<QuantityEntry> quantities;  // the board's sums
    Verdict verdict = Verdict::fail;        // fail when any channel or any board check fails
    bool has_warnings = false;
    std::vector<std::string> notes;
    std::vector<std::string> cautions;  // every channel's cautions, each once

    [[nodiscard]] std::size_t failed_channels() const;
    [[nodiscard]] std::size_t failed_board_checks() const;
};

// Sizes every channel and checks the board. Pure. Channels repeated from one entry of the file
// (same spec but the name) are sized once.
[[nodiscard]] BoardReport size_board(const Board& board, const Catalogue& catalogue);

// The words of a set of channels: "all 8 channels", "K1 pump, K2 zone 1", ... (names of
// repeated channels kept whole).
[[nodiscard]] std::string set_words(const Board& board, const std::vector<std::size_t>& set);
// The words of the board's simultaneity rule: "all channels may be on at once", ...
[[nodiscard]] std::string simultaneity_words(const Board& board);

}  // namespace coilfit
