// Fuzzes parse_quantity with every unit: it returns a finite number or throws InputError with
// a one-line message; a parsed value printed by format_quantity reads back as the same value.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <string>
#include <string_view>

#include "fuzz_common.hpp"

namespace {

using coilfit::Unit;

constexpr Unit all_units[] = {Unit::ratio,   Unit::number,  Unit::volt,   Unit::ampere,         Unit::ohm,
                              Unit::watt,    Unit::henry,   Unit::second, Unit::hertz,          Unit::joule,
                              Unit::coulomb, Unit::celsius, Unit::kelvin, Unit::kelvin_per_watt};

void round_trip(double value, Unit unit) {
    // "C" reads as °C, so a charge does not read back; that is by design (printing only).
    if (unit == Unit::coulomb) return;
    const std::string printed = coilfit::format_quantity(value, unit, 12);
    double again = 0;
    try {
        again = coilfit::parse_quantity(printed, unit);
    } catch (const coilfit::InputError& e) {
        coilfit::fuzz::finding("a printed quantity does not read back", printed + " -> " + e.what());
    }
    // Twelve significant digits (°C: one decimal place below 1e15 °C).
    const double tolerance = std::abs(value) * 1e-10 + (unit == Unit::celsius ? 0.051 : 1e-300);
    if (!(std::abs(again - value) <= tolerance)) {
        coilfit::fuzz::finding("a printed quantity reads back as another value", printed);
    }
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::string_view text(reinterpret_cast<const char*>(data), size);
    for (const Unit unit : all_units) {
        double value = 0;
        try {
            value = coilfit::parse_quantity(text, unit);
        } catch (const coilfit::InputError& e) {
            coilfit::fuzz::check_message(e.what(), "expected ");
            continue;
        }
        if (!std::isfinite(value)) coilfit::fuzz::finding("parse_quantity returned a non-finite value", text);
        round_trip(value, unit);
        // Every format of the value is printable text, never "nan" or "inf".
        for (int digits = 1; digits <= 12; digits += 11) {
            coilfit::fuzz::check_text(coilfit::format_quantity(value, unit, digits),
                                      "format_quantity printed nan or inf");
        }
    }
    return 0;
}
