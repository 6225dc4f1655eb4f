// Plausible ranges (src/io/plausible.cpp, common practice): a plain number keeps its SI meaning,
// and a value outside its field's range names what was probably meant.
#include <doctest/doctest.h>

#include "io/plausible.hpp"
#include "io/spec_io.hpp"
#include "support.hpp"

using namespace coilfit;
namespace io = coilfit::io;

namespace {

// The greenhouse valve with one field set as a flag would set it; the message read back.
std::string message_for(const std::string& path, const io::Json& value, const std::string& flag,
                        const std::string& rated = "12V") {
    io::SpecDocument d = io::load_spec_document(std::string(COILFIT_TEST_EXAMPLES_DIR) + "/greenhouse-valve.json");
    io::set_field(d, "coil.rated_voltage", rated, "--coil-voltage");
    io::set_field(d, path, value, flag);
    try {
        (void)io::read_spec(d, test::shipped_table());
    } catch (const InputError& e) {
        return e.what();
    }
    return "accepted";
}

}  // namespace

TEST_SUITE("plausible") {
    TEST_CASE("the suggestion is the same digits with the prefix that brings the value into range") {
        const auto& pin = io::plausible_range(io::Plausible::pin_current);
        CHECK(io::plausible_suggestion(8.0, pin) == "8mA");
        CHECK(io::plausible_suggestion(500.0, pin) == "500µA");
        CHECK(io::plausible_suggestion(1e6, pin).empty());   // no prefix brings 1 MA to a pin
        CHECK(io::plausible_suggestion(1e-9, pin).empty());  // too small is not a prefix slip for a current
        const auto& coil = io::plausible_range(io::Plausible::coil_resistance);
        CHECK(io::plausible_suggestion(0.4, coil) == "0.4k");
        CHECK(io::plausible_suggestion(1e-4, coil) == "0.0001M");
    }

    TEST_CASE("a value outside its plausible range is bad input naming the field and the likely meaning") {
        CHECK(message_for("pin.max_current", 8, "--pin-max-current") ==
              "--pin-max-current: 8 A is not a plausible pin current (1 µA to 200 mA); did you mean 8mA?");
        CHECK(message_for("pin.max_current", 0.008, "--pin-max-current") == "accepted");
        // 12 A from 12 V across 1 Ω is a plausible solenoid; 48 V across 1 Ω is not a coil.
        CHECK(message_for("coil.resistance", 1, "--coil-resistance") == "accepted");
        CHECK(message_for("coil.resistance", 1, "--coil-resistance", "48V") ==
              "--coil-resistance: 48 V across 1 Ω is 48 A, not a plausible coil current (100 µA to 20 A); did you mean "
              "1k?");
        CHECK(message_for("coil.resistance", 0.5, "--coil-resistance") ==
              "--coil-resistance: 500 mΩ is not a plausible coil resistance (1 Ω to 200 kΩ); did you mean 0.5k?");
        CHECK(message_for("pulldown", 47, "--pulldown") ==
              "--pulldown: 47 Ω is not a plausible pull-down (100 Ω to 100 MΩ); did you mean 47k?");
        // A flag changing the clamp's type asks for the new type's own field.
        const std::string m = message_for("clamp.type", "diode_resistor", "--clamp");
        CHECK(m.find("greenhouse-valve.json: clamp.resistor: missing; a diode_resistor clamp needs a resistance such "
                     "as \"470R\"") != std::string::npos);
    }
}
