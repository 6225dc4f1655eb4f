#include "io/plausible.hpp"

#include <array>
#include <cmath>

#include <fmt/format.h>

namespace coilfit::io {
namespace {

// Common practice: logic outputs and their buffers source microamperes to a few hundred
// milliamperes; relay, contactor and valve coils draw from about 100 µA (reed relays) to tens of
// amperes (large solenoids) and measure 1 Ω to a few hundred kΩ; base resistors lie between
// tens of ohms and megaohms, gate resistors from an ohm, pull-downs from a few hundred ohms to
// about 100 MΩ; coil supplies from 100 mV (a test of
// the physics) to mains-derived 1 kV; logic supplies 0.5 V to 60 V.
constexpr std::array<PlausibleRange, 9> ranges{{
    {Plausible::pin_current, "pin current", Unit::ampere, 1e-6, 0.2},
    {Plausible::coil_current, "coil current", Unit::ampere, 1e-4, 20.0},
    {Plausible::coil_resistance, "coil resistance", Unit::ohm, 1.0, 200e3},
    {Plausible::base_resistor, "base resistor", Unit::ohm, 10.0, 10e6},
    {Plausible::gate_resistor, "gate resistor", Unit::ohm, 1.0, 10e6},
    {Plausible::pulldown, "pull-down", Unit::ohm, 100.0, 100e6},
    {Plausible::clamp_resistor, "clamp resistor", Unit::ohm, 1.0, 1e6},
    {Plausible::supply_voltage, "coil supply voltage", Unit::volt, 0.1, 1000.0},
    {Plausible::pin_voltage, "logic pin voltage", Unit::volt, 0.5, 60.0},
}};

std::string plain(double v) { return fmt::format("{:g}", v); }

}  // namespace

const PlausibleRange& plausible_range(Plausible field) {
    for (const auto& r : ranges) {
        if (r.field == field) return r;
    }
    return ranges.front();
}

std::string plausible_suggestion(double value, const PlausibleRange& range) {
    struct Prefix {
        double factor;
        const char* text;
    };
    static constexpr std::array<Prefix, 2> smaller{{{1e-3, "m"}, {1e-6, "µ"}}};
    static constexpr std::array<Prefix, 2> larger{{{1e3, "k"}, {1e6, "M"}}};
    // A value too small is a missing k or M only for a resistance ("4.7" for 4.7 kΩ); a voltage
    // or current too small is not a prefix slip.
    if (value < range.lo && range.unit != Unit::ohm) return {};
    const auto& tries = value > range.hi ? smaller : larger;
    // The resistance's symbol is left out: "4.7k" reads as 4.7 kΩ.
    const std::string symbol = range.unit == Unit::ohm ? std::string() : std::string(unit_symbol(range.unit));
    for (const Prefix& p : tries) {
        const double v = value * p.factor;
        if (v >= range.lo && v <= range.hi) return plain(value) + p.text + symbol;
    }
    return {};
}

double plausible(const ObjectReader& r, const std::string& key, double value, Plausible field) {
    const PlausibleRange& range = plausible_range(field);
    if (value >= range.lo && value <= range.hi) return value;
    const std::string hint = std::isfinite(value) ? plausible_suggestion(value, range) : std::string();
    r.fail_at(key, fmt::format("{} is not a plausible {} ({} to {}){}", format_quantity(value, range.unit, 6),
                               range.noun, format_quantity(range.lo, range.unit), format_quantity(range.hi, range.unit),
                               hint.empty() ? std::string() : "; did you mean " + hint + "?"));
}

}  // namespace coilfit::io
