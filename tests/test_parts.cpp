// Parts records, interpolation and the table loader (include/coilfit/parts.hpp, src/io/parts_io).
#include <doctest/doctest.h>

#include <cmath>
#include <set>

#include "coilfit/parts.hpp"
#include "io/parts_io.hpp"

using coilfit::InputError;
using doctest::Approx;
namespace io = coilfit::io;

namespace {

io::PartsTable parse(const std::string& text, const std::string& file = "parts/test.json") {
    io::PartsTable t;
    io::parse_parts_text(text, file, t);
    return t;
}

const char* good_npn = R"([{ "id": "Q1", "kind": "npn", "ic_max": "600mA", "vceo": "40V",
  "hfe_min": [ { "ic": "10mA", "min": 80 }, { "ic": "150mA", "min": 100, "typ": 200 }, { "ic": "500mA", "min": 40 } ],
  "vce_sat": [ { "ic": "150mA", "ib": "15mA", "max": "0.4V" }, { "ic": "500mA", "ib": "50mA", "max": "0.75V" } ],
  "vbe_sat": [ { "ic": "150mA", "ib": "15mA", "max": "0.95V" } ],
  "pd": "625mW", "rth_ja": "200K/W", "tj_max": "150C", "package": "TO-92", "source": "test data" }])";

}  // namespace

TEST_SUITE("parts") {
    TEST_CASE("the shipped table loads whole and has every kind") {
        const io::PartsTable t = io::load_parts(COILFIT_TEST_PARTS_DIR);
        CHECK(t.catalogue.bipolars.size() >= 15);
        CHECK(t.catalogue.diodes.size() >= 8);
        CHECK(t.catalogue.zeners.size() >= 10);
        CHECK(t.catalogue.bipolars.size() + t.catalogue.diodes.size() + t.catalogue.zeners.size() >= 40);
        CHECK(t.catalogue.find_bipolar("2N4401") != nullptr);
        CHECK(t.catalogue.find_diode("1N4148") != nullptr);
        CHECK(t.find_preset("coil", "pcb-relay-12v-360mw") != nullptr);
        CHECK(t.find_preset("pin", "cmos-3v3-8ma") != nullptr);
    }

    TEST_CASE("schema check of the whole shipped table") {
        const io::PartsTable t = io::load_parts(COILFIT_TEST_PARTS_DIR);
        std::set<std::string> ids;
        int darlingtons = 0;
        for (const auto& b : t.catalogue.bipolars) {
            CAPTURE(b.id);
            CHECK(ids.insert(b.id).second);
            CHECK(b.ic_max_a > 0);
            CHECK(b.vceo_v > 0);
            CHECK(b.pd_w > 0);
            CHECK(b.tj_max_c >= 100);  // plausible silicon junction limits: 100..200 °C
            CHECK(b.tj_max_c <= 200);
            CHECK(b.hfe_min.size() >= 2);
            CHECK_FALSE(b.vce_sat.empty());
            CHECK_FALSE(b.vbe_sat.empty());
            for (const auto& g : b.hfe_min) CHECK(g.hfe_min > 0);
            for (const auto& s : b.vce_sat) CHECK(s.v_max > 0);
            for (const auto& s : b.vbe_sat) CHECK(s.v_max > 0.4);
            CHECK(b.source.find("from memory") != std::string::npos);
            darlingtons += b.kind == coilfit::BipolarKind::darlington ? 1 : 0;
        }
        CHECK(darlingtons >= 2);
        std::set<coilfit::DiodeKind> kinds;
        for (const auto& d : t.catalogue.diodes) {
            CAPTURE(d.id);
            CHECK(ids.insert(d.id).second);
            CHECK(d.vrrm_v > 0);
            CHECK(d.if_avg_a > 0);
            CHECK_FALSE(d.vf.empty());
            CHECK(coilfit::vf_low(d) > 0);
            CHECK(d.source.find("from memory") != std::string::npos);
            kinds.insert(d.kind);
        }
        CHECK(kinds.size() == 4);  // rectifier, fast, signal, Schottky
        double vz_lo = 1e9;
        double vz_hi = 0;
        for (const auto& z : t.catalogue.zeners) {
            CAPTURE(z.id);
            CHECK(ids.insert(z.id).second);
            CHECK(z.vz_v > 0);
            CHECK(z.tolerance > 0);
            CHECK(z.tolerance < 0.25);
            CHECK(z.pd_w > 0);
            CHECK(z.source.find("from memory") != std::string::npos);
            vz_lo = std::min(vz_lo, z.vz_v);
            vz_hi = std::max(vz_hi, z.vz_v);
        }
        CHECK(vz_lo <= 5.1);
        CHECK(vz_hi >= 47.0);
        for (const auto& p : t.presets) {
            CAPTURE(p.id);
            CHECK(ids.insert(p.id).second);
            CHECK_FALSE(p.source.empty());
        }
    }

    TEST_CASE("a good record is read in SI units") {
        const auto t = parse(good_npn);
        REQUIRE(t.catalogue.bipolars.size() == 1);
        const auto& b = t.catalogue.bipolars[0];
        CHECK(b.ic_max_a == Approx(0.6));
        CHECK(b.vceo_v == Approx(40.0));
        CHECK(b.hfe_min[1].hfe_typ.value() == Approx(200.0));
        CHECK(b.vce_sat[1].ib_a == Approx(0.05));
        CHECK(coilfit::rth_ja(b) == Approx(200.0));
    }

    TEST_CASE("gain and saturation interpolate on log(current) and flag points outside") {
        const auto t = parse(good_npn);
        const auto& b = t.catalogue.bipolars[0];
        // Halfway between 10 mA and 150 mA on a log scale is sqrt(10*150) mA.
        const auto mid = coilfit::hfe_min_at(b, std::sqrt(0.010 * 0.150));
        CHECK(mid.value == Approx(90.0));
        CHECK_FALSE(mid.outside);
        CHECK(coilfit::hfe_min_at(b, 0.150).value == Approx(100.0));
        const auto beyond = coilfit::hfe_min_at(b, 0.8);
        CHECK(beyond.value == Approx(40.0));
        CHECK(beyond.outside);
        CHECK(coilfit::vce_sat_at(b, std::sqrt(0.15 * 0.5)).value == Approx(0.575));
        CHECK(coilfit::vce_sat_test_ratio(b, 0.2) == Approx(10.0));
        // One point is used everywhere, flagged when more than a factor of two away.
        CHECK(coilfit::vbe_sat_at(b, 0.1).value == Approx(0.95));
        CHECK_FALSE(coilfit::vbe_sat_at(b, 0.1).outside);
        CHECK(coilfit::vbe_sat_at(b, 0.02).outside);
        CHECK(coilfit::hfe_typ_at(b, 0.150).value == Approx(200.0));
    }

    TEST_CASE("the Vce(sat) test ratio is the one of the point nearest on a log scale") {
        coilfit::Bipolar b;
        b.vce_sat = {{0.010, 0.0005, 0.3}, {0.100, 0.010, 0.5}};  // Ic/Ib 20 and 10
        // The geometric mean sqrt(10 mA * 100 mA) = 31.6 mA divides the two (a linear rule would
        // keep the 10 mA point up to 55 mA).
        CHECK(coilfit::vce_sat_test_ratio(b, 0.030) == Approx(20.0));
        CHECK(coilfit::vce_sat_test_ratio(b, 0.033) == Approx(10.0));
        CHECK(coilfit::vce_sat_test_ratio(b, 0.001) == Approx(20.0));
        CHECK(coilfit::vce_sat_test_ratio(b, 2.0) == Approx(10.0));
        coilfit::Bipolar prepared = b;
        coilfit::precompute_logs(prepared);
        for (double ic = 1e-3; ic < 2.0; ic *= 1.07) {
            CAPTURE(ic);
            CHECK(coilfit::vce_sat_test_ratio(prepared, ic, std::log(ic)) == coilfit::vce_sat_test_ratio(b, ic));
        }
        b.vce_sat.clear();
        CHECK(coilfit::vce_sat_test_ratio(b, 0.1) == Approx(10.0));  // common practice when not given
    }

    TEST_CASE("precomputed logs change no looked-up value") {
        const auto t = parse(good_npn);
        coilfit::Bipolar prepared = t.catalogue.bipolars[0];
        coilfit::precompute_logs(prepared);
        for (double ic = 1e-3; ic < 2.0; ic *= 1.37) {
            CAPTURE(ic);
            const auto& plain = t.catalogue.bipolars[0];
            CHECK(coilfit::hfe_min_at(prepared, ic, std::log(ic)).value ==
                  Approx(coilfit::hfe_min_at(plain, ic).value).epsilon(1e-12));
            CHECK(coilfit::vce_sat_at(prepared, ic, std::log(ic)).value ==
                  Approx(coilfit::vce_sat_at(plain, ic).value).epsilon(1e-12));
            CHECK(coilfit::hfe_typ_at(prepared, ic).value ==
                  Approx(coilfit::hfe_typ_at(plain, ic).value).epsilon(1e-12));
        }
    }

    TEST_CASE("broken tables are rejected naming the file and the field") {
        CHECK_THROWS_WITH_AS(parse("[{ \"id\": \"Q1\", "),
                             "parts/test.json:1:16: not valid JSON: unexpected end of input; expected string literal",
                             InputError);
        CHECK_THROWS_WITH_AS(
            parse("{}"), "parts/test.json: expected a JSON list [ ... ] of part records, got an object", InputError);
        std::string missing = good_npn;
        missing.replace(missing.find("\"vceo\": \"40V\","), 14, "");
        CHECK_THROWS_WITH_AS(parse(missing), "parts/test.json: [0].vceo: missing; expected a voltage such as \"12V\"",
                             InputError);
        std::string wrong_unit = good_npn;
        wrong_unit.replace(wrong_unit.find("\"40V\""), 5, "\"fourty\"");
        CHECK_THROWS_WITH_AS(parse(wrong_unit),
                             "parts/test.json: [0].vceo: expected a voltage such as \"12V\", got \"fourty\"",
                             InputError);
        std::string amps = good_npn;
        amps.replace(amps.find("\"40V\""), 5, "\"40A\"");
        CHECK_THROWS_WITH_AS(parse(amps),
                             "parts/test.json: [0].vceo: expected a voltage such as \"12V\", got \"40A\" (a current)",
                             InputError);
        std::string dup = std::string(good_npn);
        dup = dup.substr(0, dup.size() - 1) + "," + std::string(good_npn).substr(1);
        CHECK_THROWS_WITH_AS(parse(dup), "parts/test.json: [1].id: duplicate id \"Q1\" (also at [0])", InputError);
        std::string unsorted = good_npn;
        unsorted.replace(unsorted.find("\"10mA\""), 6, "\"900mA\"");
        CHECK_THROWS_WITH_AS(parse(unsorted),
                             "parts/test.json: [0].hfe_min[1]: points must be in order of increasing current",
                             InputError);
        std::string nosource = good_npn;
        nosource.replace(nosource.find(", \"source\": \"test data\""), 23, "");
        CHECK_THROWS_WITH_AS(parse(nosource),
                             "parts/test.json: [0].source: missing; every record says where its values come from",
                             InputError);
        std::string typo = good_npn;
        typo.replace(typo.find("\"pd\""), 4, "\"pdd\"");
        CHECK_THROWS_AS(parse(typo), InputError);
        CHECK_THROWS_WITH_AS(parse("[{ \"id\": \"X\", \"kind\": \"triode\" }]"),
                             "parts/test.json: [0].kind: unknown kind \"triode\"; expected npn, darlington, nmos, "
                             "array, rectifier, fast, signal, schottky, zener, tvs, coil, pin, relay or contactor",
                             InputError);
    }

    TEST_CASE("an id repeated across files is an error naming the later file") {
        io::PartsTable t;
        io::parse_parts_text(good_npn, "parts/a.json", t);
        CHECK_THROWS_WITH_AS(io::parse_parts_text(good_npn, "parts/b.json", t),
                             "parts/b.json: [0].id: duplicate id \"Q1\" (also at an earlier file)", InputError);
    }

    TEST_CASE("a missing path says so") {
        CHECK_THROWS_WITH_AS(io::load_parts("/nonexistent/parts"), "/nonexistent/parts: no such parts file or folder",
                             InputError);
    }
}
