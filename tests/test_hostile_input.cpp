// Hostile input, table-driven like tests/test_bad_input.cpp: texts that would mislead a reader
// if echoed raw (terminal escapes, C1 controls, no-break and zero-width spaces, byte-order marks,
// bidi overrides) and lengths that count characters. Every row gives the exact first line of
// the message after "coilfit: error: ". The code points are the Unicode Character Database's
// (U+00A0 NO-BREAK SPACE, U+200B ZERO WIDTH SPACE, U+202E RIGHT-TO-LEFT OVERRIDE, U+2066
// LEFT-TO-RIGHT ISOLATE, U+FEFF ZERO WIDTH NO-BREAK SPACE, U+0085 NEXT LINE); the expected
// messages are this project's own contract (architecture doc, "Errors"; issue 17).
#include <doctest/doctest.h>

#include <string>
#include <vector>

#include "coilfit/pick.hpp"
#include "coilfit/sizing.hpp"
#include "coilfit/text.hpp"
#include "io/netlist.hpp"
#include "io/parts_io.hpp"
#include "io/report_io.hpp"
#include "io/spec_io.hpp"
#include "support.hpp"

using namespace coilfit;
namespace io = coilfit::io;

namespace {

const std::string nbsp = "\xc2\xa0";
const std::string zwsp = "\xe2\x80\x8b";
const std::string rlo = "\xe2\x80\xae";
const std::string lri = "\xe2\x81\xa6";
const std::string bom = "\xef\xbb\xbf";
const std::string nel = "\xc2\x85";

// Demo data: the greenhouse irrigation valve relay K2 (examples/greenhouse-valve.json).
std::string spec_text(const std::string& name) {
    return R"({ "schema": "coilfit.spec/1", "name": ")" + name + R"(",
  "supply": { "voltage": "12V" }, "coil": { "rated_voltage": "12V", "resistance": "400R" },
  "pin": { "vdd": "3.3V", "max_current": "8mA" }, "transistor": "2N4401",
  "clamp": { "type": "diode", "diode": "1N4148" } })";
}

std::string npn_with_id(const std::string& id) {
    return R"([{ "id": ")" + id + R"(", "kind": "npn", "ic_max": "600mA", "vceo": "40V",
  "hfe_min": [{ "ic": "150mA", "min": 100 }], "vce_sat": [{ "ic": "150mA", "ib": "15mA", "max": "0.4V" }],
  "vbe_sat": [{ "ic": "150mA", "ib": "15mA", "max": "0.95V" }], "pd": "625mW", "source": "test data" }])";
}

enum class Source { spec, parts, flag };

struct Row {
    Source source;
    std::string text;     // spec text, table text, or a flag's value
    std::string message;  // exact message; empty: accepted
    std::string field{};
    std::string flag{};
};

std::string run(const Row& row) {
    const io::PartsTable& table = test::shipped_table();
    try {
        switch (row.source) {
            case Source::spec:
                (void)io::read_spec(io::parse_spec_text(row.text, "spec.json"), table);
                break;
            case Source::parts: {
                io::PartsTable t;
                io::parse_parts_text(row.text, "parts/test.json", t);
                break;
            }
            case Source::flag: {
                io::SpecDocument d = io::parse_spec_text(spec_text("K2"), "spec.json");
                io::set_field(d, row.field, row.text, row.flag);
                (void)io::read_spec(d, table);
                break;
            }
        }
    } catch (const InputError& e) {
        return e.what();
    }
    return {};
}

std::vector<Row> rows() {
    const Source S = Source::spec;
    const Source P = Source::parts;
    const Source F = Source::flag;
    const std::string files = std::to_string(test::shipped_table().files.size()) + " files";
    std::string e200;
    for (int i = 0; i < 200; ++i) e200 += "\xc3\xa9";  // 200 characters, 400 bytes
    return {
        // Names: bidi controls rejected, shown escaped; invisible characters allowed but escaped
        // wherever they are echoed; lengths in characters.
        {S, spec_text("valve " + rlo + "2K"),
         R"(spec.json: name: expected a text without bidirectional controls, got "valve \u202e2K")"},
        {S, spec_text("valve " + lri + "K2"),
         R"(spec.json: name: expected a text without bidirectional controls, got "valve \u2066K2")"},
        {S, spec_text("valve" + nbsp + "K2"), ""},
        {S, spec_text(e200), ""},
        {S, spec_text(e200 + "x"), "spec.json: name: expected a text of at most 200 characters, got 201"},
        {S, spec_text("K2 " + nel), R"(spec.json: name: expected a text without control characters, got "K2 \u0085")"},
        {F, "K2" + rlo, R"(--name: expected a text without bidirectional controls, got "K2\u202e")", "name", "--name"},
        // Values: a no-break or zero-width space, or a byte-order mark, is shown, not hidden.
        {F, "12" + nbsp + "V", R"(--supply: expected a voltage such as "12V", got "12\u00a0V")", "supply.voltage",
         "--supply"},
        {F, "12" + zwsp + "V", R"(--supply: expected a voltage such as "12V", got "12\u200bV")", "supply.voltage",
         "--supply"},
        {F, bom + "12V", R"(--supply: expected a voltage such as "12V", got "\ufeff12V")", "supply.voltage",
         "--supply"},
        {F, "2N4401" + zwsp,
         R"(--transistor: no transistor "2N4401\u200b" in the parts table ()" + files +
             "); nearest: 2N4401; `coilfit parts transistors` lists them",
         "transistor", "--transistor"},
        {F, "1N4148" + nbsp,
         R"(--diode: no diode "1N4148\u00a0" in the parts table ()" + files +
             "); nearest: 1N4148, 1N4448; `coilfit parts diodes` lists them",
         "clamp.diode", "--diode"},
        {S, "{ \"na" + zwsp + "me\": \"K2\"," + spec_text("K2").substr(1),
         "spec.json: na\\u200bme: unknown key (expected one of: ambient, base_resistor, clamp, coil, gate_resistor, "
         "load, name, pin, "
         "policy, pulldown, relay, schema, supply, switching, transistor)"},
        // Ids in the table: no bidi controls, no invisible characters.
        {P, npn_with_id("QT" + rlo + "1"),
         R"(parts/test.json: [0].id: expected a text without bidirectional controls, got "QT\u202e1")"},
        {P, npn_with_id("2N4401" + zwsp),
         R"(parts/test.json: [0].id: expected an id without invisible characters, got "2N4401\u200b")"},
        {P, npn_with_id(nbsp + "QT1"),
         R"(parts/test.json: [0].id: expected an id without invisible characters, got "\u00a0QT1")"},
    };
}

}  // namespace

TEST_SUITE("hostile input") {
    TEST_CASE("hostile texts are refused or shown escaped, with exact messages") {
        const auto all = rows();
        for (std::size_t i = 0; i < all.size(); ++i) {
            CAPTURE(i);
            CHECK(run(all[i]) == all[i].message);
        }
    }

    TEST_CASE("the escaping function: controls as \\xNN, C1, invisible and bidi characters as \\uNNNN") {
        // Code points from the Unicode Character Database; the escapes are this project's format.
        CHECK(escape_text("a\x1b[2Jb") == "a\\x1b[2Jb");
        CHECK(escape_text("a\nb\x7f") == "a\\x0ab\\x7f");
        CHECK(escape_text("x" + nel) == "x\\u0085");
        CHECK(escape_text(nbsp + zwsp + rlo + bom) == "\\u00a0\\u200b\\u202e\\ufeff");
        CHECK(escape_text("\xf3\xa0\x80\x81") == "\\U000e0001");  // U+E0001 LANGUAGE TAG
        CHECK(escape_text("\xff\xfe") == "\\xff\\xfe");
        CHECK(escape_text("12 V, 4k7, 470 \xce\xa9, 25 \xc2\xb0"
                          "C") ==
              "12 V, 4k7, 470 \xce\xa9, 25 \xc2\xb0"
              "C");  // Ω and ° stay
        CHECK(escape_text("abcdef", 3) == "abc...");
        CHECK(escape_text("\xc3\xa9\xc3\xa9\xc3\xa9", 2) == "\xc3\xa9\xc3\xa9...");
        CHECK(count_characters("\xc3\xa9t\xc3\xa9") == 3);
    }

    TEST_CASE("an inline record that reuses a table id is labelled inline in every output") {
        const Spec spec = test::load_spec_file(std::string(COILFIT_TEST_DATA_DIR) + "/inline_2n4401.json");
        const SizingReport r = size(spec, test::shipped_table().catalogue);
        const std::string text = io::render_text(r, io::TextStyle{});
        CHECK(text.find("inline 2N4401 (npn") != std::string::npos);
        CHECK(text.find("diode inline 1N4148") != std::string::npos);
        const io::Json j = io::report_to_json(r);
        CHECK(j["input"]["transistor"]["label"] == "inline 2N4401");
        CHECK(j["input"]["clamp"]["diode"]["label"] == "inline 1N4148");
        const std::string net = io::spice_netlist(r);
        CHECK(net.find("transistor inline 2N4401; clamp diode inline 1N4148") != std::string::npos);
        // pick: with a table of no diodes the spec's own diode is tried, and named as inline.
        Catalogue no_diodes = test::shipped_table().catalogue;
        no_diodes.diodes.clear();
        const PickResult p = pick(spec, no_diodes);
        REQUIRE_FALSE(p.candidates.empty());
        for (const Candidate& c : p.candidates) {
            if (c.driver != "array") CHECK(c.diode == "inline 1N4148");
        }
    }
}
