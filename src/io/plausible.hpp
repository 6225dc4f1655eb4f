// Plausible ranges of the fields people most often type without a unit prefix. A plain number
// keeps meaning SI units ("8" is 8 A); a value outside its field's plausible range is an error
// that says what was probably meant ("8 A is not a plausible pin current (1 µA to 200 mA);
// did you mean 8mA?"). The ranges are common practice for a coil driver on a logic pin, wide
// enough for every part a designer meets there; the README lists the same table.
#pragma once

#include <string>
#include <string_view>

#include "coilfit/quantity.hpp"
#include "io/json_read.hpp"

namespace coilfit::io {

enum class Plausible {
    pin_current,      // pin.max_current, pin.voh_current
    coil_current,     // coil.rated_voltage / coil.resistance
    coil_resistance,  // coil.resistance
    base_resistor,    // base_resistor.value
    gate_resistor,    // gate_resistor.value
    pulldown,         // pulldown
    clamp_resistor,   // clamp.resistor
    supply_voltage,   // supply.voltage, supply.min, supply.max, coil.rated_voltage, coil.max_voltage
    pin_voltage,      // pin.vdd, pin.voh_vdd
};

struct PlausibleRange {
    Plausible field;
    std::string_view noun;  // "pin current"
    Unit unit;
    double lo;
    double hi;
};

// The table (common practice; README "Plausible ranges").
[[nodiscard]] const PlausibleRange& plausible_range(Plausible field);

// "8mA" for 8 A outside a pin current's range: the same digits with the SI prefix that brings
// the value into range (m, µ for a value too large; k, M for one too small); empty when none does.
[[nodiscard]] std::string plausible_suggestion(double value, const PlausibleRange& range);

// Returns value when it lies in the field's plausible range; else fails at key with
// "<value> is not a plausible <noun> (<lo> to <hi>); did you mean <suggestion>?".
double plausible(const ObjectReader& r, const std::string& key, double value, Plausible field);

}  // namespace coilfit::io
