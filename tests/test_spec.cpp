// Spec files and overrides (src/io/spec_io): presets, table ids, inline parts, defaults, errors.
#include <doctest/doctest.h>

#include "io/spec_io.hpp"
#include "support.hpp"

using namespace coilfit;
namespace io = coilfit::io;
using doctest::Approx;

namespace {

const io::PartsTable& table() { return test::shipped_table(); }

const char* minimal = R"({ "schema": "coilfit.spec/1",
  "supply": { "voltage": "12V" },
  "coil": { "rated_voltage": "12V", "resistance": "400R" },
  "pin": { "vdd": "3.3V", "max_current": "8mA" },
  "transistor": "2N4401",
  "clamp": { "diode": "1N4148" } })";

Spec read(const std::string& text) { return io::read_spec(io::parse_spec_text(text, "spec.json"), table()); }

}  // namespace

TEST_SUITE("spec") {
    TEST_CASE("a minimal spec gets the method's defaults and lists them") {
        const Spec s = read(minimal);
        CHECK(s.supply.tolerance == Approx(0.10));
        CHECK(s.coil.tolerance == Approx(0.10));
        CHECK(s.coil.must_operate == Approx(0.75));
        CHECK(s.coil.must_release == Approx(0.10));
        CHECK(s.coil.reference_temp_c == Approx(20.0));
        CHECK(s.base_resistor.series == ESeries::e24);
        CHECK(s.base_resistor.tolerance == Approx(0.05));
        CHECK(s.policy.overdrive == Approx(2.0));
        CHECK(s.policy.current_derating == Approx(0.75));
        CHECK(s.clamp.type == ClampType::diode);
        CHECK(origin(s.transistor).id == "2N4401");
        CHECK(s.defaults_used.size() >= 8);
    }

    TEST_CASE("presets start a coil or pin and the spec's own fields win") {
        std::string text = minimal;
        const std::string old_coil = R"("coil": { "rated_voltage": "12V", "resistance": "400R" })";
        text.replace(text.find(old_coil), old_coil.size(),
                     R"("coil": { "preset": "pcb-relay-12v-360mw", "tolerance": "5%" })");
        const Spec s = read(text);
        CHECK(s.coil.rated_voltage_v == Approx(12.0));
        CHECK(s.coil.tolerance == Approx(0.05));
        CHECK(s.coil.preset == "pcb-relay-12v-360mw");
    }

    TEST_CASE("inline part records are read like table records") {
        std::string text = minimal;
        text.replace(text.find(R"("transistor": "2N4401")"), 22,
                     R"("transistor": { "id": "MY-NPN", "kind": "npn", "ic_max": "1A", "vceo": "60V",
            "hfe_min": [ { "ic": "100mA", "min": 120 }, { "ic": "500mA", "min": 60 } ],
            "vce_sat": [ { "ic": "500mA", "ib": "50mA", "max": "0.5V" } ],
            "vbe_sat": [ { "ic": "500mA", "ib": "50mA", "max": "1.1V" } ],
            "pd": "1W", "source": "our own bench measurement" })");
        const Spec s = read(text);
        CHECK(origin(s.transistor).id == "MY-NPN");
        CHECK(std::get<Bipolar>(s.transistor).vceo_v == Approx(60.0));
    }

    TEST_CASE("flags override fields and are named in their errors") {
        io::SpecDocument d = io::parse_spec_text(minimal, "spec.json");
        io::set_field(d, "supply.voltage", "24V", "--supply");
        io::set_field(d, "clamp.type", "diode_zener", "--clamp");
        io::set_field(d, "clamp.zener", "1N4749A", "--zener");
        const Spec s = io::read_spec(d, table());
        CHECK(s.supply.voltage_v == Approx(24.0));
        CHECK(s.clamp.zener->id == "1N4749A");
        io::SpecDocument bad = io::parse_spec_text(minimal, "spec.json");
        io::set_field(bad, "coil.resistance", "12V", "--coil-resistance");
        CHECK_THROWS_WITH_AS((void)io::read_spec(bad, table()),
                             "--coil-resistance: expected a resistance such as \"400R\", got \"12V\" (a voltage)",
                             InputError);
    }

    TEST_CASE("a whole spec can come from flags") {
        io::SpecDocument d = io::flags_only_document();
        io::set_field(d, "supply.voltage", "12V", "--supply");
        io::set_field(d, "coil.rated_voltage", "12V", "--coil-voltage");
        io::set_field(d, "coil.resistance", "400R", "--coil-resistance");
        io::set_field(d, "pin.vdd", "3.3V", "--pin-vdd");
        io::set_field(d, "pin.max_current", "8mA", "--pin-max-current");
        io::set_field(d, "transistor", "2N4401", "--transistor");
        io::set_field(d, "clamp.diode", "1N4148", "--diode");
        const Spec s = io::read_spec(d, table());
        CHECK(s.pin.max_current_a == Approx(0.008));
    }

    TEST_CASE("typos and unknown parts are errors naming the field") {
        std::string typo = minimal;
        typo.replace(typo.find("\"resistance\""), 12, "\"resistence\"");
        CHECK_THROWS_WITH_AS(read(typo), "spec.json: coil.resistance: missing; expected a resistance such as \"400R\"",
                             InputError);
        std::string extra = minimal;
        extra.replace(extra.find("\"max_current\""), 13, "\"max_curent\": 1, \"max_current\"");
        CHECK_THROWS_WITH_AS(read(extra),
                             "spec.json: pin.max_curent: unknown key (expected one of: max_current, preset, vdd, "
                             "vdd_tolerance, voh, voh_current, voh_vdd)",
                             InputError);
        std::string unknown = minimal;
        unknown.replace(unknown.find("\"2N4401\""), 8, "\"2N9999\"");
        CHECK_THROWS_AS(read(unknown), InputError);
        std::string schema = minimal;
        schema.replace(schema.find("coilfit.spec/1"), 14, "coilfit.spec/9");
        CHECK_THROWS_WITH_AS(
            read(schema),
            "spec.json: schema: expected \"coilfit.spec/1\" (the schema this coilfit reads), got \"coilfit.spec/9\"",
            InputError);
    }
}
