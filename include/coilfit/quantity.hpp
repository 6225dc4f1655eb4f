// Physical quantities as engineers type them: "12V", "25mA", "4k7", "10%", "50C".
//
// Parsing is a pure function on strings (no files), so tests need no fixtures. The caller knows
// which kind of quantity a field holds and passes it in; a value in another unit is an error
// that says what was expected. All results are SI base units (temperatures in degrees Celsius,
// ratios as fractions: "10%" is 0.1).
#pragma once

#include <stdexcept>
#include <string>
#include <string_view>

namespace coilfit {

// The one exception type for bad input. The message names the field path when the caller knows it.
class InputError : public std::runtime_error {
public:
    using std::runtime_error::runtime_error;
};

enum class Unit {
    ratio,   // dimensionless: 0.1 or "10%" (gains are plain numbers)
    number,  // dimensionless count or gain; "%" not accepted
    volt,
    ampere,
    ohm,
    watt,
    henry,
    second,
    hertz,
    joule,
    coulomb,          // charge (printing only; not parsed, "C" reads as °C)
    celsius,          // a temperature, degrees Celsius ("50C", "-20°C", 50)
    kelvin,           // a temperature difference ("25K")
    kelvin_per_watt,  // thermal resistance ("200K/W", "200°C/W")
    per_kelvin,       // a relative temperature coefficient ("0.6%/K", 0.006)
    volt_per_kelvin,  // a voltage temperature coefficient ("-4mV/K", "2mV/°C")
    farad,            // a capacitance (printing only; not parsed)
};

// "a voltage", "a current", ... for messages.
[[nodiscard]] std::string_view unit_noun(Unit unit);
// The SI symbol used when printing: "V", "A", "Ω", "W", "H", "s", "Hz", "J", "°C", "K", "K/W", "".
[[nodiscard]] std::string_view unit_symbol(Unit unit);
// The suffix used in report keys: "_v", "_a", "_ohm", ... ("" for ratios).
[[nodiscard]] std::string_view unit_key_suffix(Unit unit);
// An example value for messages: "12V", "25mA", "400R", ...
[[nodiscard]] std::string_view unit_example(Unit unit);

// Parses a value typed by a person. Accepted forms:
//   plain numbers in SI:                       "12", "0.025", "1e-3"
//   SI prefixes p n u µ m k M G, unit optional: "25mA", "2.2k", "0.9H", "360mW", "12 V"
//   the IEC 60062 resistance (RKM) code:        "4k7", "4K7", "2R2", "R47", "1M0" (resistances only)
//   ohm spelled Ω, R or ohm:                    "400R", "400Ω", "2.2kohm"
//   percentages for ratios:                     "10%"
//   temperatures in °C, differences in K:       "50C", "-20°C", "25K"
//   thermal resistance:                         "200K/W", "200°C/W"
//   temperature coefficients:                   "0.6%/K", "0.006/K", "-4mV/K", "2mV/°C"
//   charge (where a charge is expected):        "1.5nC" (C is coulomb there, not °C)
// Throws InputError with a message without field path, for example:
//   expected a voltage such as "12V", got "12A" (a current)
[[nodiscard]] double parse_quantity(std::string_view text, Unit expected);

// Formats a value with an engineering prefix and the unit symbol, `significant` digits with
// trailing zeros dropped: 1300 Ω -> "1.3 kΩ", 0.0231 A -> "23.1 mA", 0.1 (ratio) -> "10 %",
// 50 °C -> "50 °C". Non-finite values print as "n/a" (callers omit them before that).
[[nodiscard]] std::string format_quantity(double value, Unit unit, int significant = 3);

// A value with its unit, for fmt (see src/io/format.hpp) and for messages.
struct Quantity {
    double value = 0;
    Unit unit = Unit::number;
};

}  // namespace coilfit
