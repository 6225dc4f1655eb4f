// Copper winding resistance against temperature (include/coilfit/copper.hpp).
#include <doctest/doctest.h>

#include "coilfit/copper.hpp"

using doctest::Approx;

TEST_SUITE("copper") {
    TEST_CASE("a 400 ohm coil at 20 C has 400*(1+0.00393*65) ohm at 85 C") {
        // IEC 60028: annealed copper, temperature coefficient 0.00393 /K at 20 °C.
        CHECK(coilfit::copper_resistance(400.0, 20.0, 85.0) == Approx(400.0 * (1.0 + 0.00393 * 65.0)));
        CHECK(coilfit::copper_resistance(400.0, 20.0, 85.0) == Approx(502.18));
    }

    TEST_CASE("the coefficient is the IEC 60028 value") {
        CHECK(coilfit::copper_alpha_per_k == 0.00393);  // IEC 60028
    }

    TEST_CASE("a cold coil has less resistance and the reference temperature is a fixed point") {
        CHECK(coilfit::copper_resistance(400.0, 20.0, 20.0) == Approx(400.0));
        // IEC 60028 linear law below the reference: -20 °C is 40 K colder.
        CHECK(coilfit::copper_resistance(400.0, 20.0, -20.0) == Approx(400.0 * (1.0 - 0.00393 * 40.0)));
        CHECK(coilfit::copper_factor(23.0, 73.0) == Approx(1.0 + 0.00393 * 50.0));
    }
}
