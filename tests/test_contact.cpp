// The contact checks (src/method.md "Contact side"): the breaking curve's log-log
// interpolation, the RC snubber rule, inrush, breaking, ratings and minimum load worked by hand,
// and every check skipped with its reason when its data are missing.
#include <doctest/doctest.h>

#include <cmath>

#include "coilfit/contact.hpp"
#include "coilfit/pick_relays.hpp"
#include "coilfit/report.hpp"
#include "contact_support.hpp"
#include "io/report_io.hpp"
#include "io/spec_io.hpp"
#include "support.hpp"

using namespace coilfit;
namespace io = coilfit::io;
using doctest::Approx;

using namespace coilfit::test::contact;

TEST_SUITE("contact") {
    TEST_CASE("the DC breaking curve is interpolated on log-log axes between its points") {
        // Hand-worked: between (30 V, 10 A) and (60 V, 1 A) at 30 sqrt(2) V, t = ln(sqrt 2)/ln 2 = 1/2,
        // so I = 10 A x (1/10)^(1/2) = 3.1623 A; at 45 V, t = ln 1.5 / ln 2 = 0.58496, I = 10 x 0.1^t = 10^(1 -
        // 0.58496) = 2.6004 A.
        const std::vector<BreakingPoint> curve{{30.0, 10.0}, {60.0, 1.0}};
        CHECK(breaking_current_at(curve, 30.0 * std::sqrt(2.0)).current_a == Approx(3.16228).epsilon(1e-5));
        CHECK(breaking_current_at(curve, 45.0).current_a == Approx(2.60038).epsilon(1e-5));
        // At the points themselves, the points.
        CHECK(breaking_current_at(curve, 30.0).current_a == Approx(10.0));
        CHECK(breaking_current_at(curve, 60.0).current_a == Approx(1.0));
        // Below the lowest voltage its first current; above the highest none.
        const BreakingLimit low = breaking_current_at(curve, 12.0);
        CHECK(low.current_a == Approx(10.0));
        CHECK(low.below);
        const BreakingLimit high = breaking_current_at(curve, 61.0);
        CHECK(high.above);
        // Closed form: a constant-power limit (10 W) is a straight line on log-log axes, so the
        // interpolation between (20 V, 0.5 A) and (100 V, 0.1 A) gives 10 W / V exactly.
        const std::vector<BreakingPoint> power{{20.0, 0.5}, {100.0, 0.1}};
        for (double v : {25.0, 50.0, 80.0})
            CHECK(breaking_current_at(power, v).current_a == Approx(10.0 / v).epsilon(1e-12));
    }

    TEST_CASE("the RC snubber follows the empirical rule, worked by hand") {
        // C = I^2/10 uF, R = V/(10 I (1 + 50/V)) (src/method.md; common practice, from memory).
        // 2 A at 230 V: C = 4/10 uF = 0.4 uF; R = 230 / (20 x 1.217391) = 9.4464 ohm.
        CHECK(snubber_capacitance_f(2.0) == Approx(0.4e-6));
        CHECK(snubber_resistance_ohm(230.0, 2.0) == Approx(9.44643).epsilon(1e-5));
        // 10 A at 120 V: C = 10 uF; R = 120 / (100 x 1.416667) = 0.84706 ohm.
        CHECK(snubber_capacitance_f(10.0) == Approx(10e-6));
        CHECK(snubber_resistance_ohm(120.0, 10.0) == Approx(0.847059).epsilon(1e-5));
        // Varistor: 1.2 x the peak of 230 V RMS = 1.2 x 325.27 V = 390.32 V.
        CHECK(varistor_voltage_min_v(230.0) == Approx(390.323).epsilon(1e-5));
    }

    TEST_CASE("an AC inductive load gets the RC snubber values in the report and its JSON") {
        io::Json doc = base_spec();
        doc["load"] = io::Json::parse(
            R"({ "type": "ac", "voltage": "230V", "kind": "inductive", "current": "2A", "power_factor": 0.6 })");
        const SizingReport r = sized(doc);
        REQUIRE(r.contact.has_value());
        REQUIRE(r.contact->snubber_capacitance_f.has_value());
        CHECK(*r.contact->snubber_capacitance_f == Approx(0.4e-6));
        CHECK(*r.contact->snubber_resistance_ohm == Approx(9.44643).epsilon(1e-5));
        CHECK(r.quantity("snubber_capacitance_f").value_or(0) == Approx(0.4e-6));
        CHECK(r.quantity("snubber_resistance_ohm").value_or(0) == Approx(9.44643).epsilon(1e-5));
        CHECK(r.quantity("varistor_voltage_min_v").value_or(0) == Approx(390.323).epsilon(1e-5));
        const io::Json j = io::report_to_json(r);
        CHECK(j["quantities"]["snubber_capacitance_f"].get<double>() == Approx(0.4e-6));
        CHECK(j["contact"]["snubber_resistance_ohm"].get<double>() == Approx(9.44643).epsilon(1e-5));
        CHECK(io::render_text(r, io::TextStyle{}).find("RC snubber") != std::string::npos);
        // The power factor below 1 is noted against the resistive AC rating.
        bool pf = false;
        for (const auto& n : r.notes) pf = pf || n.find("power factor 0.6") != std::string::npos;
        CHECK(pf);
    }

    TEST_CASE("contact.inrush against the make current, and against twice the steady rating without one") {
        // Motor default 6 x: 5 A -> 30 A against make 40 A: margin (40 - 30)/40 = 25 %.
        SizingReport r = sized(base_spec());
        CHECK(check(r, "contact.inrush").verdict == Verdict::pass);
        CHECK(*check(r, "contact.inrush").value == Approx(30.0));
        CHECK(*check(r, "contact.inrush").limit == Approx(40.0));
        CHECK(*check(r, "contact.inrush").margin == Approx(0.25));
        CHECK(r.quantity("load_inrush_a").value_or(0) == Approx(30.0));
        // The default is noted as a default to confirm.
        bool noted = false;
        for (const auto& d : r.spec.defaults_used)
            noted = noted || (d.find("load.inrush 6 x") != std::string::npos &&
                              d.find("confirm for the real load") != std::string::npos);
        CHECK(noted);
        // No make current: 30 A against 2 x 10 A = 20 A fails.
        io::Json doc = base_spec();
        doc["relay"]["contacts"].erase("make_current");
        r = sized(doc);
        CHECK(check(r, "contact.inrush").verdict == Verdict::fail);
        CHECK(*check(r, "contact.inrush").limit == Approx(20.0));
        // A given inrush in amperes: 15 A (3 x) within 20 A, but above 2 x: a warning.
        doc["load"]["inrush"] = "15A";
        r = sized(doc);
        CHECK(check(r, "contact.inrush").verdict == Verdict::warn);
        CHECK(*check(r, "contact.inrush").value == Approx(15.0));
        // A given multiple of 2 x: 10 A within 20 A, no warning.
        doc["load"]["inrush"] = "2x";
        r = sized(doc);
        CHECK(check(r, "contact.inrush").verdict == Verdict::pass);
        CHECK(*check(r, "contact.inrush").value == Approx(10.0));
        // A lamp on the AC rating: 10 x 0.5 A = 5 A within 20 A, a warning (above 2 x).
        doc["load"] = io::Json::parse(R"({ "type": "ac", "voltage": "230V", "kind": "lamp", "current": "0.5A" })");
        r = sized(doc);
        CHECK(check(r, "contact.inrush").verdict == Verdict::warn);
        CHECK(*check(r, "contact.inrush").value == Approx(5.0));
    }

    TEST_CASE("contact.breaking against the curve, above it, and with a slow plain-diode release") {
        io::Json doc = base_spec();
        // 45 V DC at 2 A against 2.6004 A (log-log, worked above): passes, margin 1 - 2/2.6004.
        doc["relay"]["contacts"]["dc"]["voltage"] = "60V";
        doc["load"] = io::Json::parse(R"({ "type": "dc", "voltage": "45V", "kind": "resistive", "current": "2A" })");
        SizingReport r = sized(doc);
        CHECK(check(r, "contact.breaking").verdict == Verdict::pass);
        CHECK(*check(r, "contact.breaking").limit == Approx(2.60038).epsilon(1e-5));
        CHECK(*check(r, "contact.breaking").margin == Approx(1.0 - 2.0 / 2.60038).epsilon(1e-4));
        CHECK(r.quantity("breaking_current_limit_a").value_or(0) == Approx(2.60038).epsilon(1e-5));
        // 3 A there is above the curve: fails.
        doc["load"]["current"] = "3A";
        CHECK(check(sized(doc), "contact.breaking").verdict == Verdict::fail);
        // Above the curve's highest voltage (60 V): fails whatever the current.
        doc["load"]["voltage"] = "61V";
        doc["load"]["current"] = "0.1A";
        r = sized(doc);
        CHECK(check(r, "contact.breaking").verdict == Verdict::fail);
        CHECK(check(r, "contact.breaking").message.find("above the highest voltage") != std::string::npos);
        // 8 A at 24 V: below the curve, its first current 10 A; a plain diode clamp at more than
        // 3 A warns and the contact side lists both release times.
        doc = base_spec();
        doc["load"]["current"] = "8A";
        doc["load"]["inrush"] = "3x";
        doc["transistor"] = "TIP120";
        doc["pin"] = io::Json::parse(R"({ "preset": "cmos-5v-20ma" })");
        doc["clamp"] = io::Json::parse(R"({ "type": "diode", "diode": "1N4148" })");
        r = sized(doc);
        CHECK(check(r, "contact.breaking").verdict == Verdict::warn);
        CHECK(*check(r, "contact.breaking").limit == Approx(10.0));
        REQUIRE(r.contact.has_value());
        REQUIRE(r.contact->release_plain_s.has_value());
        REQUIRE(r.contact->release_zener_s.has_value());
        CHECK(*r.contact->release_zener_s < *r.contact->release_plain_s);
        // The same release times as the clamp options table.
        CHECK(*r.contact->release_plain_s == Approx(*r.quantity("release_time_s")));
        // With diode + zener the warning goes.
        doc["clamp"] = io::Json::parse(R"({ "type": "diode_zener", "diode": "1N4148", "zener": "1N4742A" })");
        CHECK(check(sized(doc), "contact.breaking").verdict == Verdict::pass);
    }

    TEST_CASE("contact.voltage, contact.current and contact.min_load against the ratings") {
        io::Json doc = base_spec();
        SizingReport r = sized(doc);
        // 24 V against 30 V: margin 0.2; 5 A against 10 A: margin 0.5; 5 A at least 100 mA.
        CHECK(*check(r, "contact.voltage").margin == Approx(0.2));
        CHECK(*check(r, "contact.current").margin == Approx(0.5));
        CHECK(check(r, "contact.min_load").verdict == Verdict::pass);
        // 20 mA below the 100 mA minimum: a warning, not a failure.
        doc["load"] = io::Json::parse(R"({ "type": "dc", "voltage": "24V", "kind": "resistive", "current": "20mA" })");
        r = sized(doc);
        CHECK(check(r, "contact.min_load").verdict == Verdict::warn);
        CHECK(*check(r, "contact.min_load").margin == Approx(-0.8));
        // 3 V below the 5 V minimum, the current above it: a warning in volts.
        doc["load"] = io::Json::parse(R"({ "type": "dc", "voltage": "3V", "kind": "resistive", "current": "0.5A" })");
        r = sized(doc);
        CHECK(check(r, "contact.min_load").verdict == Verdict::warn);
        CHECK(check(r, "contact.min_load").unit == Unit::volt);
        // 12 A and 36 V over the DC rating: both fail.
        doc["load"] = io::Json::parse(R"({ "type": "dc", "voltage": "36V", "kind": "resistive", "current": "12A" })");
        r = sized(doc);
        CHECK(check(r, "contact.voltage").verdict == Verdict::fail);
        CHECK(check(r, "contact.current").verdict == Verdict::fail);
        CHECK(r.verdict == Verdict::fail);
    }

    TEST_CASE("every contact check is skipped with a reason when its data are missing") {
        const char* ids[] = {"contact.voltage", "contact.current", "contact.inrush", "contact.breaking",
                             "contact.min_load"};
        // No load.
        io::Json doc = base_spec();
        doc.erase("load");
        SizingReport r = sized(doc);
        for (const char* id : ids) {
            CAPTURE(id);
            CHECK(check(r, id).verdict == Verdict::skip);
            CHECK(check(r, id).reason.find("give the load") != std::string::npos);
        }
        // A relay without contact ratings.
        doc = base_spec();
        doc["relay"].erase("contacts");
        r = sized(doc);
        for (const char* id : ids) {
            CAPTURE(id);
            CHECK(check(r, id).verdict == Verdict::skip);
            CHECK(check(r, id).reason.find("gives no contact ratings") != std::string::npos);
        }
        // A load kind without a relay.
        doc = base_spec();
        doc.erase("relay");
        doc["coil"] = io::Json::parse(R"({ "preset": "pcb-relay-24v-360mw" })");
        r = sized(doc);
        for (const char* id : ids) CHECK(check(r, id).reason.find("give relay") != std::string::npos);
        // No steady current: the current, inrush, breaking and minimum-load checks need it.
        doc = base_spec();
        doc["load"].erase("current");
        r = sized(doc);
        CHECK(check(r, "contact.voltage").verdict == Verdict::pass);
        for (const char* id : {"contact.current", "contact.inrush", "contact.breaking", "contact.min_load"}) {
            CAPTURE(id);
            CHECK(check(r, id).verdict == Verdict::skip);
            CHECK(check(r, id).reason.find("load.current") != std::string::npos);
        }
        // Ratings the record lacks: no DC rating, no curve, no minimum load, no make current.
        doc = base_spec();
        auto& k = doc["relay"]["contacts"];
        k.erase("dc");
        k.erase("dc_breaking");
        k.erase("min_load");
        k.erase("make_current");
        r = sized(doc);
        CHECK(check(r, "contact.voltage").reason.find("gives no DC rating") != std::string::npos);
        CHECK(check(r, "contact.current").reason.find("gives no DC rating") != std::string::npos);
        CHECK(check(r, "contact.inrush").reason.find("neither a make current") != std::string::npos);
        CHECK(check(r, "contact.breaking").reason.find("no DC breaking curve") != std::string::npos);
        CHECK(check(r, "contact.min_load").reason.find("no minimum load") != std::string::npos);
        // An AC load is not held to the DC curve.
        doc = base_spec();
        doc["load"] = io::Json::parse(R"({ "type": "ac", "voltage": "230V", "kind": "resistive", "current": "2A" })");
        CHECK(check(sized(doc), "contact.breaking").reason.find("an AC load") != std::string::npos);
    }
}
