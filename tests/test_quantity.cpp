// Quantity parsing and formatting (include/coilfit/quantity.hpp).
#include <doctest/doctest.h>

#include <fmt/format.h>
#include <cmath>

#include "coilfit/quantity.hpp"
#include "io/format.hpp"

using coilfit::InputError;
using coilfit::parse_quantity;
using coilfit::Unit;
using doctest::Approx;

TEST_SUITE("quantity") {
    TEST_CASE("plain numbers are SI values") {
        CHECK(parse_quantity("12", Unit::volt) == Approx(12.0));
        CHECK(parse_quantity("0.025", Unit::ampere) == Approx(0.025));
        CHECK(parse_quantity("1e-3", Unit::ampere) == Approx(1e-3));
        CHECK(parse_quantity("  12.5 ", Unit::volt) == Approx(12.5));
        CHECK(parse_quantity("-20", Unit::celsius) == Approx(-20.0));
        CHECK(parse_quantity("+5", Unit::volt) == Approx(5.0));
        CHECK(parse_quantity(".5", Unit::volt) == Approx(0.5));
    }

    TEST_CASE("SI prefixes work with and without a unit") {
        CHECK(parse_quantity("25mA", Unit::ampere) == Approx(0.025));
        CHECK(parse_quantity("25 mA", Unit::ampere) == Approx(0.025));
        CHECK(parse_quantity("2.2k", Unit::ohm) == Approx(2200.0));
        CHECK(parse_quantity("0.9H", Unit::henry) == Approx(0.9));
        CHECK(parse_quantity("360mW", Unit::watt) == Approx(0.36));
        CHECK(parse_quantity("12V", Unit::volt) == Approx(12.0));
        CHECK(parse_quantity("100uA", Unit::ampere) == Approx(100e-6));
        CHECK(parse_quantity("100µA", Unit::ampere) == Approx(100e-6));
        CHECK(parse_quantity("47nH", Unit::henry) == Approx(47e-9));
        CHECK(parse_quantity("10pJ", Unit::joule) == Approx(10e-12));
        CHECK(parse_quantity("1M", Unit::ohm) == Approx(1e6));
        CHECK(parse_quantity("1GΩ", Unit::ohm) == Approx(1e9));
        CHECK(parse_quantity("10ms", Unit::second) == Approx(0.010));
        CHECK(parse_quantity("1kHz", Unit::hertz) == Approx(1000.0));
        CHECK(parse_quantity("5m", Unit::volt) == Approx(0.005));
    }

    TEST_CASE("the IEC 60062 resistance code reads as the standard writes it") {
        // IEC 60062:2016, clause 4 (RKM code): the letter stands for the decimal point and the
        // multiplier: R = 1, K = 10^3, M = 10^6, G = 10^9.
        CHECK(parse_quantity("4k7", Unit::ohm) == Approx(4700.0));
        CHECK(parse_quantity("4K7", Unit::ohm) == Approx(4700.0));
        CHECK(parse_quantity("2R2", Unit::ohm) == Approx(2.2));
        CHECK(parse_quantity("R47", Unit::ohm) == Approx(0.47));
        CHECK(parse_quantity("1M0", Unit::ohm) == Approx(1.0e6));
        CHECK(parse_quantity("100R", Unit::ohm) == Approx(100.0));
        CHECK(parse_quantity("6M8", Unit::ohm) == Approx(6.8e6));
        CHECK(parse_quantity("1G5", Unit::ohm) == Approx(1.5e9));
        CHECK(parse_quantity("33K", Unit::ohm) == Approx(33e3));
    }

    TEST_CASE("ohm can be written as Ω, R or ohm") {
        CHECK(parse_quantity("400R", Unit::ohm) == Approx(400.0));
        CHECK(parse_quantity("400Ω", Unit::ohm) == Approx(400.0));
        CHECK(parse_quantity("400 ohm", Unit::ohm) == Approx(400.0));
        CHECK(parse_quantity("2.2kohm", Unit::ohm) == Approx(2200.0));
        CHECK(parse_quantity("2.2kΩ", Unit::ohm) == Approx(2200.0));
        CHECK(parse_quantity("1.5ohms", Unit::ohm) == Approx(1.5));
    }

    TEST_CASE("percentages, temperatures and thermal resistance") {
        CHECK(parse_quantity("10%", Unit::ratio) == Approx(0.10));
        CHECK(parse_quantity("0.1", Unit::ratio) == Approx(0.10));
        CHECK(parse_quantity("75 %", Unit::ratio) == Approx(0.75));
        CHECK(parse_quantity("50C", Unit::celsius) == Approx(50.0));
        CHECK(parse_quantity("-20°C", Unit::celsius) == Approx(-20.0));
        CHECK(parse_quantity("25K", Unit::kelvin) == Approx(25.0));
        CHECK(parse_quantity("200K/W", Unit::kelvin_per_watt) == Approx(200.0));
        CHECK(parse_quantity("62.5°C/W", Unit::kelvin_per_watt) == Approx(62.5));
        CHECK(parse_quantity("10", Unit::number) == Approx(10.0));
    }

    TEST_CASE("malformed inputs are rejected with exact messages") {
        struct Bad {
            const char* text;
            Unit unit;
            const char* message;
        };
        const Bad cases[] = {
            {"", Unit::volt, "expected a voltage such as \"12V\", got an empty string"},
            {"   ", Unit::volt, "expected a voltage such as \"12V\", got \"   \""},
            {"12A", Unit::volt, "expected a voltage such as \"12V\", got \"12A\" (a current)"},
            {"12V", Unit::ampere, "expected a current such as \"25mA\", got \"12V\" (a voltage)"},
            {"400R", Unit::volt, "expected a voltage such as \"12V\", got \"400R\" (a resistance)"},
            {"fourty", Unit::volt, "expected a voltage such as \"12V\", got \"fourty\""},
            {"nan", Unit::volt, "expected a voltage such as \"12V\", got \"nan\""},
            {"NaN", Unit::ampere, "expected a current such as \"25mA\", got \"NaN\""},
            {"inf", Unit::volt, "expected a voltage such as \"12V\", got \"inf\""},
            {"-inf", Unit::volt, "expected a voltage such as \"12V\", got \"-inf\""},
            {"1e999", Unit::volt, "expected a voltage such as \"12V\", got \"1e999\" (out of range)"},
            {"12Vx", Unit::volt, "expected a voltage such as \"12V\", got \"12Vx\""},
            {"12 V V", Unit::volt, "expected a voltage such as \"12V\", got \"12 V V\""},
            {"1.2.3", Unit::volt, "expected a voltage such as \"12V\", got \"1.2.3\""},
            {"4k7k", Unit::ohm, "expected a resistance such as \"400R\", got \"4k7k\""},
            {"4k7", Unit::volt, "expected a voltage such as \"12V\", got \"4k7\""},
            {"10%", Unit::volt, "expected a voltage such as \"12V\", got \"10%\" (a percentage)"},
            {"50K", Unit::celsius, "expected a temperature such as \"50C\", got \"50K\" (a temperature difference)"},
            {"5mC", Unit::celsius, "expected a temperature such as \"50C\", got \"5mC\" (no prefix here)"},
            {"10k", Unit::number, "expected a number such as \"10\", got \"10k\" (no prefix here)"},
            {"V12", Unit::volt, "expected a voltage such as \"12V\", got \"V12\""},
            {"-", Unit::volt, "expected a voltage such as \"12V\", got \"-\""},
            {"0x10", Unit::volt, "expected a voltage such as \"12V\", got \"0x10\""},
            {"12\x01V", Unit::volt, "expected a voltage such as \"12V\", got \"12\\x01V\""},
            {"200W/K", Unit::kelvin_per_watt, "expected a thermal resistance such as \"200K/W\", got \"200W/K\""},
        };
        for (const auto& c : cases) {
            CAPTURE(c.text);
            CHECK_THROWS_WITH_AS((void)parse_quantity(c.text, c.unit), c.message, InputError);
        }
    }

    TEST_CASE("very long texts are refused without echoing them") {
        const std::string long_text(100, '9');
        CHECK_THROWS_WITH_AS((void)parse_quantity(long_text, Unit::volt),
                             "expected a voltage such as \"12V\", got a text of 100 characters", InputError);
    }

    TEST_CASE("quantities format with engineering prefixes through fmt") {
        using coilfit::Quantity;
        CHECK(fmt::format("{}", Quantity{1300.0, Unit::ohm}) == "1.3 kΩ");
        CHECK(fmt::format("{}", Quantity{0.0231, Unit::ampere}) == "23.1 mA");
        CHECK(fmt::format("{}", Quantity{12.0, Unit::volt}) == "12 V");
        CHECK(fmt::format("{}", Quantity{0.36, Unit::watt}) == "360 mW");
        CHECK(fmt::format("{}", Quantity{4.7e-6, Unit::second}) == "4.7 µs");
        CHECK(fmt::format("{}", Quantity{0.1, Unit::ratio}) == "10 %");
        CHECK(fmt::format("{}", Quantity{50.0, Unit::celsius}) == "50.0 °C");
        CHECK(fmt::format("{}", Quantity{999.96, Unit::ohm}) == "1 kΩ");
        CHECK(fmt::format("{}", Quantity{0.0, Unit::volt}) == "0 V");
        CHECK(fmt::format("{}", Quantity{-0.6, Unit::volt}) == "-600 mV");
        CHECK(fmt::format("{:4}", Quantity{4712.0, Unit::ohm}) == "4.712 kΩ");
        CHECK(fmt::format("{}", Quantity{100e6, Unit::ohm}) == "100 MΩ");
        CHECK(coilfit::format_quantity(std::nan(""), Unit::volt) == "n/a");
    }

    TEST_CASE("formatting and parsing round-trip within the printed precision") {
        for (const double v : {1.0, 4.7e3, 0.0251, 330e-6, 12.6, 1.5e6}) {
            const std::string s = coilfit::format_quantity(v, Unit::ampere, 6);
            CHECK(parse_quantity(s, Unit::ampere) == Approx(v).epsilon(1e-5));
        }
    }
}
