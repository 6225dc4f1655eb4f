// The contact side (src/method.md "Contact side", "Safety"): relay records, load kinds and
// inrush, the five contact checks, the breaking curve's log-log interpolation, the RC snubber
// rule, the ELV-keyed cautions, pick over relays, and the JSON contract of both examples.
#include <doctest/doctest.h>

#include <cmath>

#include "coilfit/contact.hpp"
#include "coilfit/pick_relays.hpp"
#include "coilfit/report.hpp"
#include "io/report_io.hpp"
#include "io/spec_io.hpp"
#include "support.hpp"

using namespace coilfit;
namespace io = coilfit::io;
using doctest::Approx;

namespace {

const io::PartsTable& table() { return test::shipped_table(); }

// A 24 V channel on an inline relay: DC rating 30 V 10 A, a two-point breaking curve, make
// current 40 A, minimum load 100 mA at 5 V (numbers of our own for the hand-worked checks).
io::Json base_spec() {
    return io::Json::parse(R"({ "schema": "coilfit.spec/1",
      "supply": { "voltage": "24V", "tolerance": "10%" },
      "ambient": { "min": "0C", "max": "40C" },
      "relay": { "id": "TEST-RELAY", "kind": "relay",
                 "rated_voltage": "24V", "resistance": "1.6k", "inductance": "3H",
                 "contacts": { "form": "1 form A",
                               "ac": { "voltage": "250V", "current": "10A" },
                               "dc": { "voltage": "30V", "current": "10A" },
                               "dc_breaking": [ { "voltage": "30V", "current": "10A" }, { "voltage": "60V", "current": "1A" } ],
                               "make_current": "40A",
                               "min_load": { "voltage": "5V", "current": "100mA" } } },
      "pin": { "preset": "cmos-3v3-8ma" },
      "transistor": "array-7ch-mosfet-50v",
      "load": { "type": "dc", "voltage": "24V", "kind": "motor", "current": "5A" } })");
}

Spec read(const io::Json& doc) {
    io::SpecDocument d;
    d.origin.file = "spec.json";
    d.doc = doc;
    return io::read_spec(d, table());
}

SizingReport sized(const io::Json& doc) { return size(read(doc), table().catalogue); }

const Check& check(const SizingReport& r, const char* id) {
    const Check* c = r.find_check(id);
    REQUIRE_MESSAGE(c != nullptr, id);
    return *c;
}

void check_numbers_finite(const io::Json& j) {
    if (j.is_number()) {
        CHECK(std::isfinite(j.get<double>()));
    } else if (j.is_structured()) {
        for (const auto& v : j) check_numbers_finite(v);
    }
}

}  // namespace

TEST_SUITE("contact") {
    TEST_CASE("the DC breaking curve is interpolated on log-log axes between its points") {
        // Hand-worked: between (30 V, 10 A) and (60 V, 1 A) at 30 sqrt(2) V, t = ln(sqrt 2)/ln 2 = 1/2,
        // so I = 10 A x (1/10)^(1/2) = 3.1623 A; at 45 V, t = ln 1.5 / ln 2 = 0.58496, I = 10 x 0.1^t = 10^(1 - 0.58496) = 2.6004 A.
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
        for (double v : {25.0, 50.0, 80.0}) CHECK(breaking_current_at(power, v).current_a == Approx(10.0 / v).epsilon(1e-12));
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
        doc["load"] = io::Json::parse(R"({ "type": "ac", "voltage": "230V", "kind": "inductive", "current": "2A", "power_factor": 0.6 })");
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
        for (const auto& d : r.spec.defaults_used) noted = noted || (d.find("load.inrush 6 x") != std::string::npos &&
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
        const char* ids[] = {"contact.voltage", "contact.current", "contact.inrush", "contact.breaking", "contact.min_load"};
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

    TEST_CASE("an edition-1 load (kind ac or dc, no relay) keeps its report: no contact rows") {
        const Spec s = test::load_example("greenhouse-valve.json");
        const SizingReport r = size(s, table().catalogue);
        CHECK(r.find_check("contact.voltage") == nullptr);
        CHECK(!r.contact.has_value());
        CHECK(s.load->kind == LoadKind::ac);
        CHECK(!s.load->class_given);
    }

    TEST_CASE("a relay record fills the coil and the contacts; coil fields beside it win") {
        io::Json doc = base_spec();
        doc["relay"] = "pcb-power-relay-24v-16a";
        Spec s = read(doc);
        REQUIRE(s.relay.has_value());
        CHECK(s.relay->id == "pcb-power-relay-24v-16a");
        REQUIRE(s.relay->contacts.has_value());
        CHECK(s.relay->contacts->ac->current_a == Approx(16.0));
        CHECK(s.coil.rated_voltage_v == Approx(24.0));
        CHECK(s.coil.resistance_ohm == Approx(1080.0));
        doc["coil"] = io::Json::parse(R"({ "resistance": "1.2k", "self_heating": "15K" })");
        s = read(doc);
        CHECK(s.coil.resistance_ohm == Approx(1200.0));
        CHECK(s.coil.self_heating_k.value_or(0) == Approx(15.0));
        // A coil preset beside a relay is refused; an unknown relay names the command that lists them.
        doc["coil"] = io::Json::parse(R"({ "preset": "pcb-relay-24v-360mw" })");
        CHECK_THROWS_WITH_AS(read(doc), "spec.json: coil.preset: given with relay; the relay's record fills the coil", InputError);
        doc.erase("coil");
        doc["relay"] = "no-such-relay";
        CHECK_THROWS_WITH_AS(read(doc), doctest::Contains("no relay or contactor \"no-such-relay\""), InputError);
    }

    TEST_CASE("the shipped relay records are a dozen classes, each marked as values from memory") {
        const auto& relays = table().relays;
        CHECK(relays.size() >= 12);
        int contactors = 0;
        for (const auto& e : relays) {
            CAPTURE(e.record.id);
            CHECK(e.record.source.find("from memory") != std::string::npos);
            REQUIRE(e.record.contacts.has_value());
            CHECK((e.record.contacts->ac || e.record.contacts->dc));
            CHECK(e.record.coil.resistance_ohm > 0);
            contactors += e.record.kind == RelayKind::contactor ? 1 : 0;
        }
        CHECK(contactors >= 1);
    }

    TEST_CASE("bad load and relay fields exit with the field named") {
        io::Json doc = base_spec();
        doc["load"]["power_factor"] = 0.8;
        CHECK_THROWS_WITH_AS(read(doc), "spec.json: load.power_factor: given for a DC load; give load.time_constant (its L/R) instead",
                             InputError);
        doc = base_spec();
        doc["load"]["inrush"] = "six times";
        CHECK_THROWS_AS(read(doc), InputError);
        doc = base_spec();
        doc["relay"]["contacts"]["dc_breaking"][1]["current"] = "20A";
        CHECK_THROWS_WITH_AS(read(doc), doctest::Contains("relay.contacts.dc_breaking[1]"), InputError);
    }

    TEST_CASE("the safety caution follows the load voltage's IEC 61140 band, once") {
        auto cautions_for = [](const char* load) {
            io::Json doc = base_spec();
            doc["load"] = io::Json::parse(load);
            return sized(doc).cautions;
        };
        auto count = [](const std::vector<std::string>& cs, const char* what) {
            int n = 0;
            for (const auto& c : cs) n += c.find(what) != std::string::npos ? 1 : 0;
            return n;
        };
        // 24 V DC: extra-low voltage (at most 120 V ripple-free DC).
        auto cs = cautions_for(R"({ "type": "dc", "voltage": "24V", "kind": "motor", "current": "5A" })");
        CHECK(count(cs, "within extra-low voltage") == 1);
        CHECK(count(cs, "licensed practice") == 1);
        // 60 V AC is above the 50 V AC band; 60 V DC is not above the 120 V DC band.
        cs = cautions_for(R"({ "type": "ac", "voltage": "60V", "kind": "resistive", "current": "1A" })");
        CHECK(count(cs, "above extra-low voltage") == 1);
        CHECK(count(cs, "IEC 60664-1") == 1);
        CHECK(count(cs, "creepage and clearance") == 1);
        CHECK(count(cs, "licensed practice") == 1);
        cs = cautions_for(R"({ "type": "dc", "voltage": "60V", "kind": "resistive", "current": "1A" })");
        CHECK(count(cs, "within extra-low voltage") == 1);
        // 230 V AC: hazardous, with fusing, enclosure and local codes.
        cs = cautions_for(R"({ "type": "ac", "voltage": "230V", "kind": "resistive", "current": "1A" })");
        CHECK(count(cs, "230 V AC, above extra-low voltage") == 1);
        CHECK(count(cs, "fuse the load") == 1);
        CHECK(count(cs, "enclose live parts") == 1);
        CHECK(count(cs, "local electrical codes") == 1);
        CHECK(cs.size() == 2);
    }

    TEST_CASE("both contact examples hold the JSON contract: contact quantities and checks, no NaN") {
        struct Case {
            const char* file;
            std::vector<const char*> quantities;
            std::vector<const char*> evaluated;
        };
        const Case cases[] = {
            {"irrigation-pump.json", {"load_inrush_a", "breaking_current_limit_a"},
             {"contact.voltage", "contact.current", "contact.inrush", "contact.breaking", "contact.min_load"}},
            {"greenhouse-heater.json", {"load_inrush_a"}, {"contact.voltage", "contact.current", "contact.inrush", "contact.min_load"}},
        };
        for (const Case& c : cases) {
            CAPTURE(c.file);
            const SizingReport r = size(test::load_example(c.file), table().catalogue);
            CHECK(r.verdict == Verdict::pass);
            const io::Json j = io::report_to_json(r);
            for (const char* q : c.quantities) {
                CAPTURE(q);
                CHECK(j["quantities"].contains(q));
            }
            for (const char* id : c.evaluated) {
                CAPTURE(id);
                bool found = false;
                for (const auto& cj : j["checks"]) {
                    if (cj["id"] != id) continue;
                    found = true;
                    CHECK(cj["verdict"] != "skip");
                    CHECK(cj["value"].is_number());
                    CHECK(cj["margin"].is_number());
                }
                CHECK(found);
            }
            CHECK(j["input"]["relay"]["contacts"].is_object());
            CHECK(j["contact"].is_object());
            check_numbers_finite(j);
            CHECK(io::Json::parse(j.dump()) == j);
            const std::string text = io::render_text(r, io::TextStyle{});
            CHECK(text.find("Contact side") != std::string::npos);
            CHECK(text.find("nan") == std::string::npos);
        }
    }

    TEST_CASE("pick tries the table's relays for a load and lists combinations that pass both sides") {
        io::Json doc = base_spec();
        doc.erase("relay");
        doc["coil"] = io::Json::parse(R"({ "preset": "pcb-relay-24v-360mw" })");
        doc["load"] = io::Json::parse(R"({ "type": "dc", "voltage": "24V", "kind": "motor", "current": "8A" })");
        const Spec spec = read(doc);
        REQUIRE(picks_relays(spec));
        const auto records = table().relay_records();
        const RelayPickResult r = pick_relays(spec, table().catalogue, records);
        CHECK(r.relays_tried == records.size());
        REQUIRE(!r.passing.empty());
        for (const RelayCandidate& c : r.passing) {
            CAPTURE(c.relay);
            CAPTURE(c.driver.transistor);
            // Sized on its own, the combination passes both the coil side and the contacts.
            const RelayRecord* rec = nullptr;
            for (const auto& x : records) rec = x.id == c.relay ? &x : rec;
            REQUIRE(rec != nullptr);
            Spec s = with_relay(spec, *rec);
            s.transistor = *table().catalogue.find_transistor(c.driver.transistor);
            if (const auto* a = s.array()) s.clamp.diode = a->diode;
            else s.clamp.diode = *table().catalogue.find_diode(c.driver.diode);
            const SizingReport sr = size(s, Catalogue{});
            CHECK(sr.verdict == Verdict::pass);
            CHECK(sr.find_check("contact.inrush")->verdict != Verdict::skip);
        }
        // A relay whose contacts cannot carry 8 A never passes (the reed relays, 0.5 A).
        for (const RelayCandidate& c : r.passing) CHECK(c.relay.find("reed") == std::string::npos);
        // With a relay named, pick does not try the others.
        doc["relay"] = "auto-relay-24v-20a";
        doc.erase("coil");
        CHECK(!picks_relays(read(doc)));
    }
}
