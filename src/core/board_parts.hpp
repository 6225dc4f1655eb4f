// Internal to the core: what board.cpp works out per channel and per array package, and the
// words of the board's checks (board_words.cpp).
#pragma once

#include <array>
#include <string>
#include <vector>

#include "coilfit/board.hpp"

namespace coilfit::board {

// What one channel adds to the board's sums while it is on.
struct Load {
    double pin_a = 0;                               // its highest pin current
    double coil_a = 0;                              // its highest coil current
    std::array<double, corner_count> power_w{};     // the switch's dissipation at each ambient corner
    std::array<bool, corner_count> power_beyond{};  // Vce(sat) there came from beyond the part's data
};

// One array package and the channels on it.
struct Package {
    std::string name;
    const ArrayPart* part = nullptr;
    std::vector<std::size_t> channels;
    double rth_k_per_w = 0;
    double tj_limit_c = 0;  // Tj max less the junction margin
    double current_derating = 0;
    double ambient_lo_c = 0, ambient_hi_c = 0;
};

struct Context {
    const Board& board;
    std::vector<Load> loads;
    std::vector<Package> packages;
};

[[nodiscard]] std::string message(const Context& ctx, CheckId id, const std::string& subject, const CheckValue& c,
                                  const WorstSet& set, const std::vector<double>& weights);
[[nodiscard]] std::string skip_reason(const Context& ctx, CheckId id, const std::string& subject, const WorstSet& set);
[[nodiscard]] std::string array_power_message(const Context& ctx, const Package& pkg, const CheckValue& c,
                                              const WorstSet& set, double ambient_c);
[[nodiscard]] std::vector<QuantityEntry> quantities(const Context& ctx);
[[nodiscard]] std::vector<std::string> notes(const Context& ctx);

}  // namespace coilfit::board
