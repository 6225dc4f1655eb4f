// IEC 60063 preferred-number series (E-series) of resistor values.
//
// The series are tables, as the standard prints them, not the rounded formula 10^(i/n): E24 has
// irregular values (2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2) and E192 has 9.20. Values span
// 1 Ω to 100 MΩ (decades 10^0 .. 10^7 plus the single value 100 MΩ).
#pragma once

#include <optional>
#include <span>
#include <string_view>

namespace coilfit {

enum class ESeries { e3, e6, e12, e24, e48, e96, e192 };

inline constexpr double eseries_lowest_ohm = 1.0;
inline constexpr double eseries_highest_ohm = 100e6;

[[nodiscard]] std::optional<ESeries> eseries_from_name(std::string_view name);  // "E24", "e24"
[[nodiscard]] std::string_view eseries_name(ESeries series);                    // "E24"
// The usual tolerance of a series (E6 20 %, E12 10 %, E24 5 %, E48 2 %, E96 1 %, E192 0.5 %;
// E3 is listed with 20 % as its nearest marked class, from memory).
[[nodiscard]] double eseries_tolerance(ESeries series);
// The significant figures of one decade, as the standard lists them, in hundredths
// (E24: 100, 110, 120, ...; E96: 100, 102, 105, ...), ascending.
[[nodiscard]] std::span<const int> eseries_mantissas(ESeries series);

// Largest standard value <= value (nullopt below 1 Ω), smallest >= value (nullopt above
// 100 MΩ), and the nearest on a logarithmic scale (ties go to the lower value); all clamp to
// the 1 Ω .. 100 MΩ range. A value that is itself standard (within 1e-9 relative) is returned.
[[nodiscard]] std::optional<double> eseries_floor(double value, ESeries series);
[[nodiscard]] std::optional<double> eseries_ceil(double value, ESeries series);
[[nodiscard]] std::optional<double> eseries_nearest(double value, ESeries series);
// The next value up or down from a standard value (nullopt past the range).
[[nodiscard]] std::optional<double> eseries_next_up(double value, ESeries series);

// True when value is a member of the series (within 1e-9 relative).
[[nodiscard]] bool eseries_contains(double value, ESeries series);

}  // namespace coilfit
