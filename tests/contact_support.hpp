// Shared fixtures of the contact-side tests (test_contact.cpp, test_contact_side.cpp): a 24 V
// channel on an inline relay record with every contact rating, read against the shipped table.
#pragma once

#include <cmath>

#include <doctest/doctest.h>

#include "coilfit/report.hpp"
#include "io/spec_io.hpp"
#include "support.hpp"

namespace coilfit::test::contact {

inline const coilfit::io::PartsTable& table() { return test::shipped_table(); }

// A 24 V channel on an inline relay: DC rating 30 V 10 A, a two-point breaking curve, make
// current 40 A, minimum load 100 mA at 5 V (numbers of our own for the hand-worked checks).
inline coilfit::io::Json base_spec() {
    return coilfit::io::Json::parse(R"({ "schema": "coilfit.spec/1",
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

inline Spec read(const coilfit::io::Json& doc) {
    coilfit::io::SpecDocument d;
    d.origin.file = "spec.json";
    d.doc = doc;
    return coilfit::io::read_spec(d, table());
}

inline SizingReport sized(const coilfit::io::Json& doc) { return size(read(doc), table().catalogue); }

inline const Check& check(const SizingReport& r, const char* id) {
    const Check* c = r.find_check(id);
    REQUIRE_MESSAGE(c != nullptr, id);
    return *c;
}

inline void check_numbers_finite(const coilfit::io::Json& j) {
    if (j.is_number()) {
        CHECK(std::isfinite(j.get<double>()));
    } else if (j.is_structured()) {
        for (const auto& v : j) check_numbers_finite(v);
    }
}

}  // namespace coilfit::test::contact
