// The contact side around the checks (src/method.md "Contact side", "Safety"): relay records
// in specs and in the table, bad fields, the ELV-keyed cautions, the JSON contract of both
// examples, and pick over relays.
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
        CHECK_THROWS_WITH_AS(read(doc), "spec.json: coil.preset: given with relay; the relay's record fills the coil",
                             InputError);
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
        CHECK_THROWS_WITH_AS(
            read(doc), "spec.json: load.power_factor: given for a DC load; give load.time_constant (its L/R) instead",
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
            {"irrigation-pump.json",
             {"load_inrush_a", "breaking_current_limit_a"},
             {"contact.voltage", "contact.current", "contact.inrush", "contact.breaking", "contact.min_load"}},
            {"greenhouse-heater.json",
             {"load_inrush_a"},
             {"contact.voltage", "contact.current", "contact.inrush", "contact.min_load"}},
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
            if (const auto* a = s.array())
                s.clamp.diode = a->diode;
            else
                s.clamp.diode = *table().catalogue.find_diode(c.driver.diode);
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
