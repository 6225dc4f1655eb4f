// Bad input, table-driven: every row is a spec text, a parts-table text or a flag override,
// the exit code the program gives for it (2: bad input) and the exact first line of the
// message (what `coilfit: error:` is followed by). The program maps InputError to exit 2 and
// a failed check to exit 1 (src/cli/main.cpp, architecture doc "Exit codes"); exit_code_of
// below does the same in-process. The expected messages are this project's own contract
// (architecture doc, "Errors": file, field path, what was expected, what came).
//
// Physical impossibilities are results, not errors: the last test cases check that they come
// out as failed checks with an explanation (exit 1), never as an exception.
#include <doctest/doctest.h>

#include "coilfit/report.hpp"

#include <cmath>
#include <string>
#include <vector>

#include "coilfit/sizing.hpp"
#include "flat_figures.hpp"
#include "io/parts_io.hpp"
#include "io/report_io.hpp"
#include "io/spec_io.hpp"
#include "support.hpp"

using namespace coilfit;
namespace io = coilfit::io;

namespace {

const io::PartsTable& table() { return test::shipped_table(); }

// Demo data: the lab valve manifold's 24 V valve coil on a 3.3 V pin.
const char* base_spec = R"({
  "schema": "coilfit.spec/1",
  "name": "lab valve manifold V3",
  "supply": { "voltage": "24V", "tolerance": "10%" },
  "ambient": { "min": "5C", "max": "40C" },
  "coil": { "rated_voltage": "24V", "resistance": "1k2", "tolerance": "10%", "must_operate": "75%",
            "must_release": "10%", "inductance": "1.5H" },
  "pin": { "vdd": "3.3V", "vdd_tolerance": "5%", "max_current": "8mA" },
  "transistor": "2N4401",
  "clamp": { "type": "diode", "diode": "1N4148" },
  "base_resistor": { "series": "E24" },
  "pulldown": "47k",
  "policy": { "overdrive": 2 },
  "switching": { "frequency": "1Hz" },
  "load": { "voltage": "24V", "kind": "dc" }
})";

// A record of each kind that the table accepts; rows below break one field of them.
const char* good_npn = R"({ "id": "QT1", "kind": "npn", "ic_max": "600mA", "vceo": "40V",
  "hfe_min": [{ "ic": "10mA", "min": 100 }, { "ic": "150mA", "min": 100, "typ": 200 }],
  "vce_sat": [{ "ic": "150mA", "ib": "15mA", "max": "0.4V" }],
  "vbe_sat": [{ "ic": "150mA", "ib": "15mA", "max": "0.95V" }],
  "pd": "625mW", "rth_ja": "200K/W", "tj_max": "150C", "source": "test data" })";
const char* good_diode = R"({ "id": "DT1", "kind": "signal", "vrrm": "100V", "if_avg": "200mA",
  "vf": [{ "if": "10mA", "max": "1V" }], "source": "test data" })";
const char* good_zener = R"({ "id": "ZT1", "kind": "zener", "vz": "12V", "tolerance": "5%", "pd": "1W",
  "source": "test data" })";
const char* good_coil = R"({ "id": "coil-t", "kind": "coil", "rated_voltage": "12V", "resistance": "400R",
  "source": "test data" })";
const char* good_pin = R"({ "id": "pin-t", "kind": "pin", "vdd": "3.3V", "voh": "2.9V", "voh_current": "8mA",
  "max_current": "8mA", "source": "test data" })";

// Sets a field by dotted path ("coil.resistance") in a JSON text; a null value removes it.
std::string with(const std::string& text, const std::string& path, const io::Json& value) {
    io::Json j = io::Json::parse(text);
    io::Json* node = &j;
    std::size_t start = 0;
    while (true) {
        const auto dot = path.find('.', start);
        const std::string key = path.substr(start, dot == std::string::npos ? std::string::npos : dot - start);
        if (dot == std::string::npos) {
            if (value.is_null())
                node->erase(key);
            else
                (*node)[key] = value;
            break;
        }
        node = &(*node)[key];
        start = dot + 1;
    }
    return j.dump();
}
std::string spec_with(const std::string& path, const io::Json& value) { return with(base_spec, path, value); }
io::Json with_json(const std::string& text, const std::string& path, const io::Json& value) {
    return io::Json::parse(with(text, path, value));
}
std::string spec_without(const std::string& path) { return with(base_spec, path, nullptr); }
std::string table_of(const std::string& record) { return "[" + record + "]"; }
std::string npn_with(const std::string& path, const io::Json& value) { return table_of(with(good_npn, path, value)); }

enum class Source { spec, parts, flag };

struct BadInput {
    Source source;
    std::string text;     // spec text, parts-table text, or the flag's value
    int exit_code;        // what the program exits with
    std::string message;  // exact first line after "coilfit: error: "
    std::string field{};  // for flags: the spec field the flag sets
    std::string flag{};   // for flags: the flag's name
};

// Runs one row as the program would: reads the spec (or table), sizes it, and returns the exit
// code with the message of the input error, if any.
struct Outcome {
    int exit_code = 0;
    std::string message;
};

Outcome run(const BadInput& row) {
    Outcome out;
    try {
        Spec spec;
        switch (row.source) {
            case Source::spec:
                spec = io::read_spec(io::parse_spec_text(row.text, "spec.json"), table());
                break;
            case Source::parts: {
                io::PartsTable t;
                io::parse_parts_text(row.text, "parts/test.json", t);
                spec = io::read_spec(io::parse_spec_text(base_spec, "spec.json"),
                                     t);  // ids of the shipped table are absent
                break;
            }
            case Source::flag: {
                io::SpecDocument d = io::parse_spec_text(base_spec, "spec.json");
                io::set_field(d, row.field, row.text, row.flag);
                spec = io::read_spec(d, table());
                break;
            }
        }
        out.exit_code = size(spec, table().catalogue).verdict == Verdict::fail ? 1 : 0;
    } catch (const InputError& e) {
        out.exit_code = 2;
        const std::string what = e.what();
        out.message = what.substr(0, what.find('\n'));
    }
    return out;
}

// "5 files": the messages count the files of the shipped table.
std::string table_files() { return std::to_string(table().files.size()) + " files"; }

std::vector<BadInput> spec_rows() {
    const Source S = Source::spec;
    const std::string files = table_files();
    const std::string long_name(201, 'x');
    return {
        // The document itself.
        {S, "", 2, R"(spec.json: the file is empty; expected a JSON object { "schema": "coilfit.spec/1", ... })"},
        {S, " \n\t ", 2, R"(spec.json: the file is empty; expected a JSON object { "schema": "coilfit.spec/1", ... })"},
        {S, "[]", 2, R"(spec.json: expected a JSON object { "schema": "coilfit.spec/1", ... }, got a list)"},
        {S, "42", 2, R"(spec.json: expected a JSON object { "schema": "coilfit.spec/1", ... }, got 42)"},
        {S, "\"12V\"", 2, R"(spec.json: expected a JSON object { "schema": "coilfit.spec/1", ... }, got "12V")"},
        {S, "null", 2, R"(spec.json: expected a JSON object { "schema": "coilfit.spec/1", ... }, got null)"},
        {S,
         std::string("\x7f"
                     "ELF\x02\x01\x01\0\0\0",
                     10),
         2, "spec.json:1:1: not valid JSON: invalid literal"},
        {S, std::string("{\"name\": \"caf\xe9\"}"), 2,
         "spec.json:1:15: not valid JSON: invalid string: ill-formed UTF-8 byte"},
        {S, R"({ "schema": "coilfit.spec/1", )", 2,
         "spec.json:1:31: not valid JSON: unexpected end of input; expected string literal"},
        {S, std::string(base_spec) + " }", 2, "spec.json:16:3: not valid JSON: unexpected '}'; expected end of input"},
        {S, std::string(100, '[') + std::string(100, ']'), 2, "spec.json: nested deeper than 64 levels"},
        {S, "{\"name\": \"" + std::string(1U << 20U, 'x') + "\"}", 2,
         "spec.json: larger than 1048576 bytes; this is not a coilfit file"},
        {S, R"({ "schema": "coilfit.spec/1", "supply": { "voltage": 1e400 } })", 2,
         "spec.json:1:54: not valid JSON: the number 1e400 is out of range"},
        {S, R"({ "schema": "coilfit.spec/1", "supply": { "voltage": "12V", "voltage": "24V" } })", 2,
         "spec.json: supply.voltage: the key appears twice in one object"},
        // Schema, sections and keys.
        {S, spec_without("schema"), 2, R"(spec.json: schema: missing; expected "coilfit.spec/1")"},
        {S, spec_with("schema", "coilfit.spec/2"), 2,
         R"(spec.json: schema: expected "coilfit.spec/1" (the schema this coilfit reads), got "coilfit.spec/2")"},
        {S, spec_with("schema", 1), 2,
         R"(spec.json: schema: expected "coilfit.spec/1" (the schema this coilfit reads), got 1)"},
        {S, spec_with("suply", io::Json::object()), 2,
         "spec.json: suply: unknown key (expected one of: ambient, base_resistor, clamp, coil, gate_resistor, load, "
         "name, pin, policy, "
         "pulldown, relay, schema, supply, switching, transistor)"},
        {S, spec_with("coil.resistence", "400R"), 2,
         "spec.json: coil.resistence: unknown key (expected one of: inductance, max_release_time, max_temperature, "
         "max_voltage, must_operate, "
         "must_operate_temp, must_release, preset, rated_voltage, reference_temp, resistance, self_heating, "
         "thermal_resistance, tolerance)"},
        {S, spec_without("supply"), 2,
         R"(spec.json: supply: missing; expected an object such as { "voltage": "12V", "tolerance": "10%" })"},
        {S, spec_without("coil"), 2,
         R"(spec.json: coil: missing; expected an object such as { "rated_voltage": "12V", "resistance": "400R", ... } or { "preset": ID })"},
        {S, spec_without("pin"), 2,
         R"(spec.json: pin: missing; expected an object such as { "vdd": "3.3V", "max_current": "8mA", ... } or { "preset": ID })"},
        {S, spec_without("clamp"), 2,
         R"(spec.json: clamp: missing; expected an object such as { "type": "diode", "diode": ID })"},
        {S, spec_without("transistor"), 2,
         "spec.json: transistor: missing; expected transistor id from the parts table or an inline record"},
        {S, spec_with("supply", "12V"), 2, R"(spec.json: supply: expected a JSON object { ... }, got "12V")"},
        {S, spec_with("supply", io::Json::object()), 2,
         R"(spec.json: supply.voltage: missing; expected a voltage such as "12V")"},
        // Supply and ambient.
        {S, spec_with("supply.voltage", "24A"), 2,
         R"(spec.json: supply.voltage: expected a voltage such as "12V", got "24A" (a current))"},
        {S, spec_with("supply.voltage", -24), 2,
         "spec.json: supply.voltage: expected a voltage greater than zero, got -24 V"},
        {S, spec_with("supply.voltage", "0V"), 2,
         "spec.json: supply.voltage: expected a voltage greater than zero, got 0 V"},
        {S, spec_with("supply.voltage", "2kV"), 2,
         "spec.json: supply.voltage: 2 kV is not a plausible coil supply voltage (100 mV to 1 kV); did you mean "
         "2000mV?"},
        {S, spec_with("supply.tolerance", "100%"), 2,
         "spec.json: supply.tolerance: expected a ratio from 0 % to 50 %, got 100 %"},
        {S, spec_with("supply.tolerance", 10), 2,
         R"(spec.json: supply.tolerance: expected a ratio from 0 % to 50 %, got 1000 % (a plain number is a fraction: write "10%" or 0.1))"},
        {S, spec_with("ambient.min", "60C"), 2,
         "spec.json: ambient.min: expected at most ambient.max 40.0 °C, got 60.0 °C"},
        {S, spec_with("ambient.min", "-300C"), 2,
         "spec.json: ambient.min: expected a temperature above absolute zero (-273.15 °C), got -300.0 °C"},
        {S, spec_with("ambient.max", "300C"), 2,
         "spec.json: ambient.max: expected a temperature from -100.0 °C to 250.0 °C, got 300.0 °C"},
        {S, spec_with("ambient.min", "20K"), 2,
         R"(spec.json: ambient.min: expected a temperature such as "50C", got "20K" (a temperature difference))"},
        // Coil.
        {S, spec_with("coil.resistance", "-3R"), 2,
         "spec.json: coil.resistance: expected a resistance greater than zero, got -3 Ω"},
        {S, spec_with("coil.resistance", 0), 2,
         "spec.json: coil.resistance: expected a resistance greater than zero, got 0 Ω"},
        {S, spec_with("coil.resistance", "fourty"), 2,
         R"(spec.json: coil.resistance: expected a resistance such as "400R", got "fourty")"},
        {S, spec_with("coil.resistance", true), 2,
         R"(spec.json: coil.resistance: expected a resistance such as "400R", got true)"},
        {S, spec_with("coil.resistance", "4" + std::string(99, '0')), 2,
         R"(spec.json: coil.resistance: expected a resistance such as "400R", got a text of 100 characters)"},
        {S, spec_with("coil.tolerance", "120%"), 2,
         "spec.json: coil.tolerance: expected a ratio from 0 % to 50 %, got 120 %"},
        {S, spec_with("coil.reference_temp", "200C"), 2,
         "spec.json: coil.reference_temp: expected a temperature from -55.0 °C to 125.0 °C, got 200.0 °C"},
        {S, spec_with("coil.must_operate", "120%"), 2,
         "spec.json: coil.must_operate: expected a ratio from 0 % to 100 %, got 120 %"},
        {S, spec_with("coil.must_operate", "0%"), 2,
         "spec.json: coil.must_operate: expected a ratio greater than zero, got 0 %"},
        {S, spec_with("coil.must_release", "80%"), 2,
         "spec.json: coil.must_release: expected below coil.must_operate 75 %, got 80 %"},
        {S, spec_with("coil.must_release", "-5%"), 2,
         "spec.json: coil.must_release: expected a ratio from 0 % to below 100 %, got -5 %"},
        {S, with(spec_without("coil.must_release"), "coil.must_operate", "5%"), 2,
         "spec.json: coil.must_operate: expected above coil.must_release 10 % (the default; give coil.must_release), "
         "got 5 %"},
        {S, spec_with("coil.inductance", "-1H"), 2,
         "spec.json: coil.inductance: expected an inductance greater than zero, got -1 H"},
        {S, spec_with("coil.max_voltage", "20V"), 2,
         "spec.json: coil.max_voltage: expected at least coil.rated_voltage 24 V, got 20 V"},
        {S, spec_with("coil.max_release_time", "0s"), 2,
         "spec.json: coil.max_release_time: expected a time greater than zero, got 0 s"},
        {S, spec_with("coil.self_heating", "-5K"), 2,
         "spec.json: coil.self_heating: expected a temperature difference from 0 K to 200 K, got -5 K"},
        {S, spec_with("coil", io::Json{{"preset", "no-such-coil"}}), 2,
         R"(spec.json: coil.preset: no coil preset "no-such-coil" in the parts table; `coilfit parts coil` lists them)"},
        {S, spec_with("coil", io::Json{{"preset", 5}}), 2,
         "spec.json: coil.preset: expected a preset id in quotes, got 5"},
        // Pin.
        {S, spec_with("pin.vdd", "0V"), 2, "spec.json: pin.vdd: expected a voltage greater than zero, got 0 V"},
        {S, spec_with("pin.vdd", "100V"), 2,
         "spec.json: pin.vdd: 100 V is not a plausible logic pin voltage (500 mV to 60 V)"},
        {S, spec_with("pin.max_current", "0A"), 2,
         "spec.json: pin.max_current: expected a current greater than zero, got 0 A"},
        {S, spec_with("pin.vdd_tolerance", "60%"), 2,
         "spec.json: pin.vdd_tolerance: expected a ratio from 0 % to 50 %, got 60 %"},
        {S, with(spec_with("pin.voh", "5V"), "pin.voh_current", "8mA"), 2,
         "spec.json: pin.voh: expected at most pin.vdd 3.3 V, got 5 V"},
        {S, spec_with("pin.voh", "2.9V"), 2,
         R"(spec.json: pin.voh_current: missing; pin.voh needs the current it is rated at, such as "8mA")"},
        // Parts named by the spec.
        {S, spec_with("transistor", "2N9999"), 2,
         "spec.json: transistor: no transistor \"2N9999\" in the parts table (" + files +
             "); nearest: 2N3904; `coilfit parts transistors` lists them"},
        {S, spec_with("transistor", 42), 2,
         "spec.json: transistor: expected transistor id such as a text in quotes, or an inline record, got 42"},
        {S, spec_with("transistor", with_json(good_npn, "vceo", nullptr)), 2,
         R"(spec.json: transistor.vceo: missing; expected a voltage such as "12V")"},
        {S,
         spec_with("transistor", with_json(good_npn, "hfe_min", io::Json::parse(R"([{ "ic": "10mA", "min": 0.5 }])"))),
         2, "spec.json: transistor.hfe_min[0].min: expected a number from 1 to 1000000, got 0.5"},
        // Clamp.
        {S, spec_with("clamp.type", "zener"), 2,
         R"(spec.json: clamp.type: expected "diode", "diode_zener", "diode_resistor", "diode_tvs" or "none", got "zener")"},
        {S, spec_with("clamp.type", "diode_zener"), 2,
         "spec.json: clamp.zener: missing; a diode_zener clamp needs a zener id or an inline zener record"},
        {S, spec_with("clamp.zener", "1N4742A"), 2,
         R"(spec.json: clamp.zener: given, but clamp.type is "diode"; use "diode_zener")"},
        {S, spec_with("clamp.type", "none"), 2, R"(spec.json: clamp.diode: given, but clamp.type is "none")"},
        {S, spec_with("clamp.type", "diode_resistor"), 2,
         R"(spec.json: clamp.resistor: missing; a diode_resistor clamp needs a resistance such as "470R")"},
        {S, with(spec_with("clamp.type", "diode_resistor"), "clamp.resistor", "0R"), 2,
         "spec.json: clamp.resistor: expected a resistance greater than zero, got 0 Ω"},
        {S, spec_with("clamp.diode", "1N9999"), 2,
         "spec.json: clamp.diode: no diode \"1N9999\" in the parts table (" + files +
             "); nearest: 1N4937, 1N5819; `coilfit parts diodes` lists them"},
        // Base resistor, pull-down, policy.
        {S, spec_with("base_resistor.series", "E7"), 2,
         R"(spec.json: base_resistor.series: expected one of E3, E6, E12, E24, E48, E96, E192, got "E7")"},
        {S, spec_with("base_resistor.tolerance", "100%"), 2,
         "spec.json: base_resistor.tolerance: expected a ratio from 0 % to 50 %, got 100 %"},
        {S, spec_with("base_resistor.value", "-1k"), 2,
         "spec.json: base_resistor.value: expected a resistance greater than zero, got -1 kΩ"},
        {S, spec_with("base_resistor.power_rating", "0W"), 2,
         "spec.json: base_resistor.power_rating: expected a power greater than zero, got 0 W"},
        {S, spec_with("pulldown", "0R"), 2, "spec.json: pulldown: expected a resistance greater than zero, got 0 Ω"},
        {S, spec_with("policy.forced_gain", 0), 2,
         "spec.json: policy.forced_gain: expected a number greater than zero, got 0"},
        {S, spec_with("policy.forced_gain", -5), 2,
         "spec.json: policy.forced_gain: expected a number greater than zero, got -5"},
        {S, spec_with("policy.overdrive", 0), 2,
         "spec.json: policy.overdrive: expected a number greater than zero, got 0"},
        {S, spec_with("policy.overdrive", 0.5), 2,
         "spec.json: policy.overdrive: expected a number from 1 to 100, got 0.5"},
        {S, spec_with("policy.forced_gain", "10%"), 2,
         R"(spec.json: policy.forced_gain: expected a number such as "10", got "10%" (a percentage))"},
        {S, spec_with("policy.current_derating", "0%"), 2,
         "spec.json: policy.current_derating: expected a ratio greater than zero, got 0 %"},
        {S, spec_with("policy.voltage_derating", "150%"), 2,
         "spec.json: policy.voltage_derating: expected a ratio from 0 % to 100 %, got 150 %"},
        {S, spec_with("policy.vbe_low", "3V"), 2,
         "spec.json: policy.vbe_low: expected a voltage from 0 V to 2 V, got 3 V"},
        {S, spec_with("switching.frequency", "-1Hz"), 2,
         "spec.json: switching.frequency: expected a frequency greater than zero, got -1 Hz"},
        {S, spec_with("load.kind", "mains"), 2,
         R"(spec.json: load.kind: expected resistive, inductive, motor, lamp, capacitive, solenoid or transformer (or "ac" or "dc"), got "mains")"},
        {S, spec_with("load.voltage", "-5V"), 2,
         "spec.json: load.voltage: expected a voltage of zero or more, got -5 V"},
        // Texts.
        {S, spec_with("name", "valve \x1b[31mK2"), 2,
         R"(spec.json: name: expected a text without control characters, got "valve \x1b[31mK2")"},
        {S, spec_with("name", long_name), 2, "spec.json: name: expected a text of at most 200 characters, got 201"},
    };
}

std::vector<BadInput> parts_rows() {
    const Source P = Source::parts;
    std::string many_points = "[";
    for (int i = 1; i <= 65; ++i)
        many_points += (i > 1 ? "," : "") + std::string(R"({ "ic": ")") + std::to_string(i) + R"(mA", "min": 100 })";
    many_points += "]";
    return {
        {P, "", 2, "parts/test.json: the file is empty; expected a JSON list [ ... ] of part records"},
        {P, "{}", 2, "parts/test.json: expected a JSON list [ ... ] of part records, got an object"},
        {P, "[1]", 2, "parts/test.json: [0]: expected a JSON object { ... }, got 1"},
        {P, table_of(with(good_npn, "kind", nullptr)), 2,
         "parts/test.json: [0].kind: missing; expected npn, darlington, nmos, array, rectifier, fast, signal, "
         "schottky, zener, tvs, coil, pin, relay or contactor"},
        {P, table_of(with(good_npn, "kind", "triode")), 2,
         "parts/test.json: [0].kind: unknown kind \"triode\"; expected npn, darlington, nmos, array, rectifier, fast, "
         "signal, schottky, zener, tvs, coil, pin, relay or contactor"},
        {P, table_of(with(good_npn, "kind", 3)), 2,
         "parts/test.json: [0].kind: expected npn, darlington, nmos, array, rectifier, fast, signal, schottky, zener, "
         "tvs, coil, pin, relay or contactor, got 3"},
        {P, table_of(with(good_npn, "id", "")), 2,
         R"(parts/test.json: [0].id: expected an id such as "2N4401", got an empty text)"},
        {P, table_of(with(good_npn, "id", " QT1")), 2,
         R"(parts/test.json: [0].id: expected an id without spaces at either end, got " QT1")"},
        {P, table_of(with(good_npn, "id", "Q\x07")), 2,
         R"(parts/test.json: [0].id: expected a text without control characters, got "Q\x07")"},
        {P, "[" + std::string(good_npn) + "," + good_npn + "]", 2,
         R"(parts/test.json: [1].id: duplicate id "QT1" (also at [0]))"},
        {P, npn_with("ic_max", "-1A"), 2,
         "parts/test.json: [0].ic_max: expected a current greater than zero, got -1 A"},
        {P, npn_with("ic_max", "2kA"), 2,
         "parts/test.json: [0].ic_max: expected a current from 1 µA to 1 kA, got 2 kA"},
        {P, npn_with("vceo", "0V"), 2, "parts/test.json: [0].vceo: expected a voltage greater than zero, got 0 V"},
        {P, npn_with("hfe_min", io::Json::array()), 2,
         "parts/test.json: [0].hfe_min: expected a list of one or more points, got a list"},
        {P, npn_with("hfe_min", io::Json::parse(many_points)), 2, "parts/test.json: [0].hfe_min: more than 64 points"},
        {P, npn_with("hfe_min", io::Json::parse(R"([{ "ic": "150mA", "min": 100 }, { "ic": "10mA", "min": 100 }])")), 2,
         "parts/test.json: [0].hfe_min[1]: points must be in order of increasing current"},
        {P, npn_with("hfe_min", io::Json::parse(R"([{ "ic": "150mA", "min": 100, "typ": 50 }])")), 2,
         "parts/test.json: [0].hfe_min[0].typ: expected a typical gain of at least the minimum 100, got 50"},
        {P, npn_with("vce_sat", io::Json::parse(R"([{ "ic": "10mA", "ib": "15mA", "max": "0.4V" }])")), 2,
         "parts/test.json: [0].vce_sat[0].ib: expected a base current at most the test's ic 10 mA (a saturation test "
         "condition), got 15 mA"},
        {P, npn_with("pd", nullptr), 2, R"(parts/test.json: [0].pd: missing; expected a power such as "360mW")"},
        {P, npn_with("rth_ja", "0K/W"), 2,
         "parts/test.json: [0].rth_ja: expected a thermal resistance greater than zero, got 0 K/W"},
        {P, npn_with("tj_max", "400C"), 2,
         "parts/test.json: [0].tj_max: expected a temperature from 50.0 °C to 250.0 °C, got 400.0 °C"},
        {P, npn_with("source", nullptr), 2,
         "parts/test.json: [0].source: missing; every record says where its values come from"},
        {P, npn_with("pdd", "1W"), 2,
         "parts/test.json: [0].pdd: unknown key (expected one of: description, hfe_min, hfe_temp_exponent, ic_max, id, "
         "kind, "
         "package, pd, r_be_internal, rth_ja, source, tj_max, vbe_sat, vce_sat, vceo)"},
        {P, table_of(with(good_diode, "vrrm", "-100V")), 2,
         "parts/test.json: [0].vrrm: expected a voltage greater than zero, got -100 V"},
        {P, table_of(with(good_diode, "vf", io::Json::parse(R"([{ "if": "10mA", "max": "20V" }])"))), 2,
         "parts/test.json: [0].vf[0].max: expected a voltage from 50 mV to 10 V, got 20 V"},
        {P, table_of(with(good_zener, "tolerance", "60%")), 2,
         "parts/test.json: [0].tolerance: expected a ratio from 0 % to 50 %, got 60 %"},
        {P, table_of(with(good_zener, "vz", "0.5V")), 2,
         "parts/test.json: [0].vz: expected a voltage from 1 V to 1 kV, got 500 mV"},
        {P, table_of(with(good_coil, "resistance", "-5R")), 2,
         "parts/test.json: [0].resistance: expected a resistance greater than zero, got -5 Ω"},
        {P, table_of(with(good_coil, "resistence", "400R")), 2,
         "parts/test.json: [0].resistence: unknown key (expected one of: inductance, max_release_time, "
         "max_temperature, max_voltage, must_operate, "
         "must_operate_temp, must_release, preset, rated_voltage, reference_temp, resistance, self_heating, "
         "thermal_resistance, tolerance)"},
        {P, table_of(with(good_coil, "preset", "coil-t")), 2,
         "parts/test.json: [0].preset: expected no preset inside a preset"},
        {P, table_of(with(good_pin, "voh", "5V")), 2,
         "parts/test.json: [0].voh: expected at most pin.vdd 3.3 V, got 5 V"},
    };
}

std::vector<BadInput> flag_rows() {
    const Source F = Source::flag;
    const std::string files = table_files();
    return {
        {F, "abc", 2, R"(--supply: expected a voltage such as "12V", got "abc")", "supply.voltage", "--supply"},
        {F, "-3", 2, "--coil-resistance: expected a resistance greater than zero, got -3 Ω", "coil.resistance",
         "--coil-resistance"},
        {F, "60C", 2, "--ambient-min: expected at most ambient.max 40.0 °C, got 60.0 °C", "ambient.min",
         "--ambient-min"},
        {F, "E7", 2, R"(--series: expected one of E3, E6, E12, E24, E48, E96, E192, got "E7")", "base_resistor.series",
         "--series"},
        {F, "zener", 2,
         R"(--clamp: expected "diode", "diode_zener", "diode_resistor", "diode_tvs" or "none", got "zener")",
         "clamp.type", "--clamp"},
        {F, "K2 \x1b[2J", 2, R"(--name: expected a text without control characters, got "K2 \x1b[2J")", "name",
         "--name"},
        {F, "K2 \xff\xfe", 2, R"(--name: expected UTF-8 text, got "K2 \xff\xfe")", "name", "--name"},
        {F, "NOPE", 2,
         R"(--transistor: no transistor "NOPE" in the parts table ()" + files +
             "); `coilfit parts transistors` lists them",
         "transistor", "--transistor"},
        {F, "120%", 2, "--must-operate: expected a ratio from 0 % to 100 %, got 120 %", "coil.must_operate",
         "--must-operate"},
        {F, "0", 2, "--overdrive: expected a number greater than zero, got 0", "policy.overdrive", "--overdrive"},
        {F, "10", 2,
         R"(--supply-tolerance: expected a ratio from 0 % to 50 %, got 1000 % (a plain number is a fraction: write "10%" or 0.1))",
         "supply.tolerance", "--supply-tolerance"},
        {F, "1e999", 2, R"(--pin-vdd: expected a voltage such as "12V", got "1e999" (out of range))", "pin.vdd",
         "--pin-vdd"},
        {F, "12V\x01", 2, R"(--supply: expected a voltage such as "12V", got "12V\x01")", "supply.voltage", "--supply"},
    };
}

void check_rows(const std::vector<BadInput>& rows) {
    for (std::size_t i = 0; i < rows.size(); ++i) {
        const BadInput& row = rows[i];
        CAPTURE(i);
        CAPTURE(row.message);
        const Outcome got = run(row);
        CHECK(got.exit_code == row.exit_code);
        CHECK(got.message == row.message);
    }
}

}  // namespace

TEST_SUITE("bad input") {
    TEST_CASE("the table holds at least sixty bad inputs") {
        CHECK(spec_rows().size() + parts_rows().size() + flag_rows().size() >= 60);
    }

    TEST_CASE("bad spec files exit 2 with one line naming the file, the field and what was expected") {
        check_rows(spec_rows());
    }

    TEST_CASE("bad parts tables exit 2 naming the table file and the record") { check_rows(parts_rows()); }

    TEST_CASE("bad flag values exit 2 naming the flag instead of the file") { check_rows(flag_rows()); }

    TEST_CASE("a spec of flags alone names the flag that gives a missing field") {
        io::SpecDocument d = io::flags_only_document();
        d.origin.flag_names = {{"supply.voltage", "--supply"}, {"coil.rated_voltage", "--coil-voltage"}};
        io::set_field(d, "coil.resistance", "400R", "--coil-resistance");
        CHECK_THROWS_WITH_AS(
            (void)io::read_spec(d, table()),
            "command line: supply.voltage: missing; expected a voltage such as \"12V\" (give --supply)", InputError);
        io::set_field(d, "supply.voltage", "12V", "--supply");
        CHECK_THROWS_WITH_AS(
            (void)io::read_spec(d, table()),
            "command line: coil.rated_voltage: missing; expected a voltage such as \"12V\" (give --coil-voltage)",
            InputError);
    }

    TEST_CASE("a table file with an error adds nothing to the table") {
        io::PartsTable t;
        io::parse_parts_text(table_of(good_zener), "parts/a.json", t);
        // The first record is good, the second is broken: neither may be kept.
        const std::string broken = "[" + std::string(good_npn) + "," + with(good_diode, "vrrm", "0V") + "]";
        CHECK_THROWS_WITH_AS(io::parse_parts_text(broken, "parts/b.json", t),
                             "parts/b.json: [1].vrrm: expected a voltage greater than zero, got 0 V", InputError);
        CHECK(t.catalogue.bipolars.empty());
        CHECK(t.catalogue.diodes.empty());
        CHECK(t.catalogue.zeners.size() == 1);
        CHECK(t.files == std::vector<std::string>{"parts/a.json"});
    }

    TEST_CASE("a bad preset rejects the table when it loads, not when a spec uses it") {
        io::PartsTable t;
        CHECK_THROWS_WITH_AS(
            io::parse_parts_text(table_of(with(good_coil, "must_operate", "120%")), "parts/coils.json", t),
            "parts/coils.json: [0].must_operate: expected a ratio from 0 % to 100 %, got 120 %", InputError);
        CHECK(t.presets.empty());
        // A preset may leave the fields a spec must give to the spec.
        CHECK_NOTHROW(io::parse_parts_text(table_of(with(good_coil, "resistance", nullptr)), "parts/coils.json", t));
        CHECK(t.presets.size() == 1);
    }

    TEST_CASE("the shipped parts table loads whole") {
        const io::PartsTable& t = table();
        CHECK(t.files.size() >= 5);
        CHECK(t.catalogue.bipolars.size() >= 10);
        CHECK(t.presets.size() >= 10);
    }
}

TEST_SUITE("bad input") {
    // Physical impossibilities that are not typos: the spec is valid, the design cannot work.
    // Each comes out as a failed check with words (exit 1), never as an exception.
    TEST_CASE("a coil that can never operate at the lowest supply is a failed check, not an error") {
        // 24 V coil on a 12 V supply: 10.8 V at the low corner against 18 V (75 % of 24 V) to operate, hot.
        const Spec s = io::read_spec(io::parse_spec_text(spec_with("supply.voltage", "12V"), "spec.json"), table());
        const SizingReport r = size(s, table().catalogue);
        CHECK(r.verdict == Verdict::fail);
        const Check* c = r.find_check("coil.operate");
        REQUIRE(c != nullptr);
        CHECK(c->verdict == Verdict::fail);
        CHECK(c->message.rfind("the coil gets only ", 0) == 0);
        CHECK(c->message.find("it may not pull in") != std::string::npos);
    }

    TEST_CASE("a pin supply below Vbe leaves no base resistor: failed checks with reasons, finite figures") {
        io::SpecDocument d = io::parse_spec_text(base_spec, "spec.json");
        io::set_field(d, "pin.vdd", "0.5V", "--pin-vdd");
        const Spec s = io::read_spec(d, table());
        const SizingReport r = size(s, table().catalogue);
        CHECK(r.verdict == Verdict::fail);
        CHECK_FALSE(r.resistor.value_ohm.has_value());
        for (const char* id : {"transistor.saturation", "pin.current"}) {
            const Check* c = r.find_check(id);
            REQUIRE(c != nullptr);
            CHECK(c->verdict == Verdict::fail);
            CHECK_FALSE(c->message.empty());
        }
        // No transistor would do: the advice is about the pin, not about more gain.
        CHECK(
            r.find_check("pin.current")->message ==
            "the pin's lowest VDD 475 mV does not reach Vbe(sat) 990 mV: no base resistor and no gain can switch this "
            "transistor on; use a pin with a higher supply or a buffer");
        for (const auto& q : r.quantities) CHECK(std::isfinite(q.value));
        const std::string text = io::render_text(r, io::TextStyle{});
        CHECK(text.find("nan") == std::string::npos);
        CHECK(text.find("inf") == std::string::npos);
        CHECK(text.find("n/a") == std::string::npos);
    }

    TEST_CASE("a supply below Vce(sat) gives the coil nothing: a failed check that says so") {
        // 0.2 V supply and 1 Ω coil: about 260 mA flows at the high corner, where the 2N4401's
        // Vce(sat) alone is more than the 0.18 V lowest supply.
        io::SpecDocument d = io::parse_spec_text(base_spec, "spec.json");
        io::set_field(d, "supply.voltage", "0.2V", "--supply");
        io::set_field(d, "coil.rated_voltage", "0.2V", "--coil-voltage");
        io::set_field(d, "coil.resistance", "1R", "--coil-resistance");
        const Spec s = io::read_spec(d, table());
        const SizingReport r = size(s, table().catalogue);
        const Check* c = r.find_check("coil.operate");
        REQUIRE(c != nullptr);
        CHECK(c->verdict == Verdict::fail);
        CHECK(c->message.find("takes the whole lowest supply 180 mV, so the coil gets no voltage") !=
              std::string::npos);
    }

    TEST_CASE("no clamp is a failed transistor.voltage check with advice") {
        std::string spec = spec_with("clamp", io::Json{{"type", "none"}});
        const Spec s = io::read_spec(io::parse_spec_text(spec, "spec.json"), table());
        const SizingReport r = size(s, table().catalogue);
        const Check* c = r.find_check("transistor.voltage");
        REQUIRE(c != nullptr);
        CHECK(c->verdict == Verdict::fail);
        CHECK(c->message.find("fit a diode across the coil") != std::string::npos);
    }
}
