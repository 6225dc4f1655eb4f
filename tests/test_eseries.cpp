// IEC 60063 E-series (include/coilfit/eseries.hpp).
#include <doctest/doctest.h>

#include <cmath>
#include <vector>

#include "coilfit/eseries.hpp"

using coilfit::ESeries;
using doctest::Approx;

namespace {

// IEC 60063:2015, table of the E12 series (two significant figures).
const std::vector<int> iec_e12{10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82};

// IEC 60063:2015, table of the E24 series (two significant figures). Note the values that
// differ from round(10^(i/24)): 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7 and 8.2.
const std::vector<int> iec_e24{10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30,
                               33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91};

// IEC 60063:2015, table of the E96 series (three significant figures).
const std::vector<int> iec_e96{100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130, 133, 137, 140, 143,
                               147, 150, 154, 158, 162, 165, 169, 174, 178, 182, 187, 191, 196, 200, 205, 210,
                               215, 221, 226, 232, 237, 243, 249, 255, 261, 267, 274, 280, 287, 294, 301, 309,
                               316, 324, 332, 340, 348, 357, 365, 374, 383, 392, 402, 412, 422, 432, 442, 453,
                               464, 475, 487, 499, 511, 523, 536, 549, 562, 576, 590, 604, 619, 634, 649, 665,
                               681, 698, 715, 732, 750, 768, 787, 806, 825, 845, 866, 887, 909, 931, 953, 976};

std::vector<int> mantissas(ESeries s) {
    const auto m = coilfit::eseries_mantissas(s);
    return {m.begin(), m.end()};
}

}  // namespace

TEST_SUITE("eseries") {
    TEST_CASE("E12 matches the IEC 60063 table") {
        std::vector<int> expected;
        for (int v : iec_e12) expected.push_back(v * 10);
        CHECK(mantissas(ESeries::e12) == expected);
    }

    TEST_CASE("E24 matches the IEC 60063 table, irregular values included") {
        std::vector<int> expected;
        for (int v : iec_e24) expected.push_back(v * 10);
        CHECK(mantissas(ESeries::e24) == expected);
        // The rounded formula would give 2.6, 2.9, 3.2, 3.5, 3.8, 4.2, 4.6 and 8.3 here.
        for (const double v : {2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2})
            CHECK(coilfit::eseries_contains(v, ESeries::e24));
        for (const double v : {2.6, 2.9, 3.2, 3.5, 3.8, 4.2, 4.6, 8.3})
            CHECK_FALSE(coilfit::eseries_contains(v, ESeries::e24));
    }

    TEST_CASE("E96 matches the IEC 60063 table") { CHECK(mantissas(ESeries::e96) == iec_e96); }

    TEST_CASE("E48 is every second E96 value and E192 has 9.20, not the formula's 9.19") {
        // IEC 60063: E48 values are the odd-numbered E96 values.
        const auto e48 = mantissas(ESeries::e48);
        REQUIRE(e48.size() == 48);
        for (std::size_t i = 0; i < e48.size(); ++i) CHECK(e48[i] == iec_e96[2 * i]);
        const auto e192 = mantissas(ESeries::e192);
        REQUIRE(e192.size() == 192);
        CHECK(coilfit::eseries_contains(9.20, ESeries::e192));
        CHECK_FALSE(coilfit::eseries_contains(9.19, ESeries::e192));
        // E96 is every second E192 value (IEC 60063).
        for (std::size_t i = 0; i < iec_e96.size(); ++i) CHECK(e192[2 * i] == iec_e96[i]);
    }

    TEST_CASE("E3 and E6 are the standard's coarse series") {
        CHECK(mantissas(ESeries::e3) == std::vector<int>{100, 220, 470});
        CHECK(mantissas(ESeries::e6) == std::vector<int>{100, 150, 220, 330, 470, 680});
    }

    TEST_CASE("floor, ceil and nearest snap across decades") {
        CHECK(*coilfit::eseries_floor(4700.0, ESeries::e24) == Approx(4700.0));
        CHECK(*coilfit::eseries_floor(4699.0, ESeries::e24) == Approx(4300.0));
        CHECK(*coilfit::eseries_ceil(4701.0, ESeries::e24) == Approx(5100.0));
        CHECK(*coilfit::eseries_floor(9.99e3, ESeries::e24) == Approx(9.1e3));
        CHECK(*coilfit::eseries_ceil(9.2e3, ESeries::e24) == Approx(10e3));
        CHECK(*coilfit::eseries_ceil(95.0, ESeries::e12) == Approx(100.0));
        CHECK(*coilfit::eseries_floor(1.05e5, ESeries::e12) == Approx(1.0e5));
        CHECK(*coilfit::eseries_nearest(4.5e3, ESeries::e12) == Approx(4.7e3));
        CHECK(*coilfit::eseries_nearest(1.1e3, ESeries::e6) == Approx(1.0e3));
        CHECK(*coilfit::eseries_nearest(1.3e3, ESeries::e6) == Approx(1.5e3));
        CHECK(*coilfit::eseries_floor(473.0, ESeries::e96) == Approx(464.0));
        CHECK(*coilfit::eseries_floor(1234.0, ESeries::e192) == Approx(1230.0));
        // A value that is itself standard but computed with rounding error stays itself.
        CHECK(*coilfit::eseries_floor(0.1 * 47000.0 * 3.0 / 3.0, ESeries::e24) == Approx(4700.0));
        CHECK(*coilfit::eseries_next_up(4700.0, ESeries::e24) == Approx(5100.0));
        CHECK(*coilfit::eseries_next_up(9100.0, ESeries::e24) == Approx(10000.0));
    }

    TEST_CASE("the edges of the 1 ohm to 100 Mohm range") {
        CHECK_FALSE(coilfit::eseries_floor(0.99, ESeries::e24).has_value());
        CHECK(*coilfit::eseries_floor(1.0, ESeries::e24) == Approx(1.0));
        CHECK(*coilfit::eseries_ceil(0.5, ESeries::e24) == Approx(1.0));
        CHECK(*coilfit::eseries_floor(1e9, ESeries::e24) == Approx(100e6));
        CHECK(*coilfit::eseries_ceil(100e6, ESeries::e24) == Approx(100e6));
        CHECK_FALSE(coilfit::eseries_ceil(101e6, ESeries::e24).has_value());
        CHECK(*coilfit::eseries_nearest(0.2, ESeries::e24) == Approx(1.0));
        CHECK(*coilfit::eseries_nearest(5e8, ESeries::e24) == Approx(100e6));
        CHECK_FALSE(coilfit::eseries_next_up(100e6, ESeries::e24).has_value());
        CHECK_FALSE(coilfit::eseries_floor(std::nan(""), ESeries::e24).has_value());
    }

    TEST_CASE("every series lists its values in every decade") {
        for (const ESeries s :
             {ESeries::e3, ESeries::e6, ESeries::e12, ESeries::e24, ESeries::e48, ESeries::e96, ESeries::e192}) {
            const auto m = coilfit::eseries_mantissas(s);
            for (int decade = 0; decade <= 7; ++decade) {
                for (const int v : m) {
                    const double value = v * std::pow(10.0, decade) / 100.0;
                    CAPTURE(value);
                    CHECK(coilfit::eseries_contains(value, s));
                }
            }
        }
    }

    TEST_CASE("names and usual tolerances") {
        CHECK(coilfit::eseries_from_name("E24") == ESeries::e24);
        CHECK(coilfit::eseries_from_name("e96") == ESeries::e96);
        CHECK_FALSE(coilfit::eseries_from_name("E25").has_value());
        CHECK(coilfit::eseries_name(ESeries::e192) == "E192");
        // Usual tolerance classes of the series (IEC 60063 foreword; common practice).
        CHECK(coilfit::eseries_tolerance(ESeries::e12) == Approx(0.10));
        CHECK(coilfit::eseries_tolerance(ESeries::e24) == Approx(0.05));
        CHECK(coilfit::eseries_tolerance(ESeries::e96) == Approx(0.01));
    }
}
