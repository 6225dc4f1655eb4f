// Inputs the fuzz targets (tests/fuzz) found, kept as regular tests so that they stay fixed.
// Each case names the target that found it and what went wrong before the fix.
#include <doctest/doctest.h>

#include <cmath>
#include <limits>
#include <string>

#include "coilfit/quantity.hpp"

using coilfit::format_quantity;
using coilfit::parse_quantity;
using coilfit::Unit;

TEST_SUITE("fuzz findings") {
    TEST_CASE("a huge temperature prints in exponent form and reads back") {
        // fuzz_quantity, input "55e058": °C printed with "%.1f" gave a 60-digit number cut at
        // 63 characters (wrong digits, and too long to read back).
        const double t = parse_quantity("55e058", Unit::celsius);
        CHECK(t == doctest::Approx(5.5e59));
        const std::string printed = format_quantity(t, Unit::celsius, 12);
        CHECK(printed == "5.5e+59 °C");
        CHECK(parse_quantity(printed, Unit::celsius) == doctest::Approx(t));
        // Ordinary temperatures keep their one decimal place.
        CHECK(format_quantity(-20.0, Unit::celsius) == "-20.0 °C");
    }

    TEST_CASE("values far outside the SI prefixes keep their exponent instead of a prefix") {
        // Found in review while fixing the above (not by the fuzzer): 1e300 V printed as
        // "1e+291 GV", and error messages about out-of-range values showed it so.
        CHECK(format_quantity(1e300, Unit::volt) == "1e+300 V");
        CHECK(format_quantity(1e-20, Unit::ampere) == "1e-20 A");
        CHECK(format_quantity(2e6, Unit::ohm) == "2 MΩ");
    }

    TEST_CASE("a ratio near the largest double does not print as infinity") {
        // Found in review (not by the fuzzer): 100 x 9e307 overflows, so the percentage
        // printed as "inf %".
        const double big = std::numeric_limits<double>::max() / 2;
        const std::string printed = format_quantity(big, Unit::ratio, 12);
        CHECK(printed.find("inf") == std::string::npos);
        CHECK(parse_quantity(printed, Unit::ratio) == doctest::Approx(big));
    }
}
