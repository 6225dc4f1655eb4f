#include "coilfit/eseries.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <string>
#include <vector>

namespace coilfit {
namespace {

// IEC 60063 tables, significant figures x100 (E3..E24 have two figures, E48..E192 three).
constexpr std::array<int, 3> e3{100, 220, 470};
constexpr std::array<int, 6> e6{100, 150, 220, 330, 470, 680};
constexpr std::array<int, 12> e12{100, 120, 150, 180, 220, 270, 330, 390, 470, 560, 680, 820};
constexpr std::array<int, 24> e24{100, 110, 120, 130, 150, 160, 180, 200, 220, 240, 270, 300,
                                  330, 360, 390, 430, 470, 510, 560, 620, 680, 750, 820, 910};
constexpr std::array<int, 192> e192{
    100, 101, 102, 104, 105, 106, 107, 109, 110, 111, 113, 114, 115, 117, 118, 120, 121, 123, 124, 126, 127, 129,
    130, 132, 133, 135, 137, 138, 140, 142, 143, 145, 147, 149, 150, 152, 154, 156, 158, 160, 162, 164, 165, 167,
    169, 172, 174, 176, 178, 180, 182, 184, 187, 189, 191, 193, 196, 198, 200, 203, 205, 208, 210, 213, 215, 218,
    221, 223, 226, 229, 232, 234, 237, 240, 243, 246, 249, 252, 255, 258, 261, 264, 267, 271, 274, 277, 280, 284,
    287, 291, 294, 298, 301, 305, 309, 312, 316, 320, 324, 328, 332, 336, 340, 344, 348, 352, 357, 361, 365, 370,
    374, 379, 383, 388, 392, 397, 402, 407, 412, 417, 422, 427, 432, 437, 442, 448, 453, 459, 464, 470, 475, 481,
    487, 493, 499, 505, 511, 517, 523, 530, 536, 542, 549, 556, 562, 569, 576, 583, 590, 597, 604, 612, 619, 626,
    634, 642, 649, 657, 665, 673, 681, 690, 698, 706, 715, 723, 732, 741, 750, 759, 768, 777, 787, 796, 806, 816,
    825, 835, 845, 856, 866, 876, 887, 898, 909, 920, 931, 942, 953, 965, 976, 988};

// E96 is every second value of E192 and E48 every fourth (IEC 60063).
template <std::size_t N, std::size_t Step>
constexpr std::array<int, N> every() {
    std::array<int, N> out{};
    for (std::size_t i = 0; i < N; ++i) out[i] = e192[i * Step];
    return out;
}
constexpr auto e96 = every<96, 2>();
constexpr auto e48 = every<48, 4>();

constexpr double rel_eps = 1e-9;

// Every standard value of a series, 1 Ω .. 100 MΩ, ascending.
std::span<const double> all_values(ESeries series) {
    static const auto build = [](std::span<const int> m) {
        std::vector<double> v;
        for (int decade = 0; decade <= 7; ++decade) {
            const double scale = std::pow(10.0, decade) / 100.0;
            for (const int x : m) v.push_back(std::round(static_cast<double>(x) * scale * 100.0) / 100.0);
        }
        v.push_back(eseries_highest_ohm);
        return v;
    };
    static const std::array<std::vector<double>, 7> tables{build(e3),  build(e6),  build(e12), build(e24),
                                                           build(e48), build(e96), build(e192)};
    return tables.at(static_cast<std::size_t>(series));
}

}  // namespace

std::optional<ESeries> eseries_from_name(std::string_view name) {
    std::string n(name);
    for (auto& c : n) c = static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
    constexpr std::array names{"E3", "E6", "E12", "E24", "E48", "E96", "E192"};
    for (std::size_t i = 0; i < names.size(); ++i) {
        if (n == names[i]) return static_cast<ESeries>(i);
    }
    return std::nullopt;
}

std::string_view eseries_name(ESeries series) {
    constexpr std::array<std::string_view, 7> names{"E3", "E6", "E12", "E24", "E48", "E96", "E192"};
    return names.at(static_cast<std::size_t>(series));
}

double eseries_tolerance(ESeries series) {
    constexpr std::array tol{0.20, 0.20, 0.10, 0.05, 0.02, 0.01, 0.005};
    return tol.at(static_cast<std::size_t>(series));
}

std::span<const int> eseries_mantissas(ESeries series) {
    switch (series) {
        case ESeries::e3:
            return e3;
        case ESeries::e6:
            return e6;
        case ESeries::e12:
            return e12;
        case ESeries::e24:
            return e24;
        case ESeries::e48:
            return e48;
        case ESeries::e96:
            return e96;
        case ESeries::e192:
            return e192;
    }
    return e24;
}

std::optional<double> eseries_floor(double value, ESeries series) {
    if (std::isnan(value)) return std::nullopt;
    const auto v = all_values(series);
    // First element strictly greater than value*(1+eps); the one before it is the floor.
    const auto it = std::upper_bound(v.begin(), v.end(), value * (1.0 + rel_eps));
    if (it == v.begin()) return std::nullopt;
    return *(it - 1);
}

std::optional<double> eseries_ceil(double value, ESeries series) {
    if (std::isnan(value)) return std::nullopt;
    const auto v = all_values(series);
    const auto it = std::lower_bound(v.begin(), v.end(), value * (1.0 - rel_eps));
    if (it == v.end()) return std::nullopt;
    return *it;
}

std::optional<double> eseries_nearest(double value, ESeries series) {
    if (std::isnan(value)) return std::nullopt;
    const auto lo = eseries_floor(value, series);
    const auto hi = eseries_ceil(value, series);
    if (!lo) return hi;
    if (!hi) return lo;
    return std::log(value / *lo) <= std::log(*hi / value) ? lo : hi;
}

std::optional<double> eseries_next_up(double value, ESeries series) {
    const auto v = all_values(series);
    const auto it = std::upper_bound(v.begin(), v.end(), value * (1.0 + rel_eps));
    if (it == v.end()) return std::nullopt;
    return *it;
}

bool eseries_contains(double value, ESeries series) {
    const auto f = eseries_floor(value, series);
    return f && std::abs(*f - value) <= rel_eps * value;
}

}  // namespace coilfit
