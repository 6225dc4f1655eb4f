// The JSON report against the contract (architecture doc, "JSON report") and the text report.
#include <doctest/doctest.h>

#include "coilfit/report.hpp"

#include <cmath>
#include <set>

#include "coilfit/sizing.hpp"
#include "flat_figures.hpp"
#include "io/report_io.hpp"
#include "io/spec_io.hpp"
#include "support.hpp"

using namespace coilfit;
namespace io = coilfit::io;

namespace {

struct Loaded {
    const io::PartsTable& table = test::shipped_table();
    Spec spec;
};

Loaded load_example(const std::string& name) {
    Loaded l;
    l.spec = test::load_example(name);
    return l;
}

void check_numbers_finite(const io::Json& j) {
    if (j.is_number()) {
        CHECK(std::isfinite(j.get<double>()));
    } else if (j.is_structured()) {
        for (const auto& v : j) check_numbers_finite(v);
    }
}

}  // namespace

TEST_SUITE("report") {
    TEST_CASE("the JSON report has the contract's keys in a stable order") {
        const Loaded l = load_example("greenhouse-valve.json");
        const SizingReport r = size(l.spec, l.table.catalogue);
        const io::Json j = io::report_to_json(r);
        std::vector<std::string> keys;
        for (const auto& [k, v] : j.items()) keys.push_back(k);
        const std::vector<std::string> contract{"schema",     "tool",   "verdict", "input",
                                                "quantities", "checks", "notes",   "cautions"};
        REQUIRE(keys.size() >= contract.size());
        CHECK(std::vector<std::string>(keys.begin(), keys.begin() + 8) == contract);
        CHECK(j["schema"] == "coilfit.report/1");
        CHECK(j["tool"]["name"] == "coilfit");
        CHECK(j["verdict"] == "pass");
        for (const char* q :
             {"coil_current_nominal_a", "coil_current_max_a", "coil_voltage_min_v", "operate_voltage_hot_v",
              "base_resistor_max_ohm", "base_resistor_min_ohm", "base_resistor_ohm", "base_current_min_a",
              "pin_current_max_a", "forced_gain_worst", "hfe_needed", "transistor_power_w", "junction_temp_max_c",
              "peak_collector_voltage_v", "release_time_s", "clamp_energy_j", "stored_energy_j"}) {
            CAPTURE(q);
            CHECK(j["quantities"].contains(q));
            CHECK(j["quantities"][q].is_number());
        }
        const std::set<std::string> ids{"coil.operate", "coil.overvoltage", "transistor.current", "transistor.voltage",
                                        "transistor.saturation", "transistor.thermal", "pin.current", "resistor.power",
                                        "diode.voltage", "diode.current", "clamp.power", "release.time",
                                        // edition 2: the greenhouse valve switches at 1 Hz
                                        "switching.timing"};
        std::set<std::string> seen;
        for (const auto& c : j["checks"]) {
            std::vector<std::string> ck;
            for (const auto& [k, v] : c.items()) ck.push_back(k);
            // Edition 2 adds the corner of the value (or, for a skipped check, the reason).
            const std::string last = c["verdict"] == "skip" ? "reason" : "corner";
            CHECK(ck == std::vector<std::string>{"id", "verdict", "value", "limit", "unit", "margin", "message", last});
            seen.insert(c["id"].get<std::string>());
            const std::string v = c["verdict"];
            CHECK((v == "pass" || v == "warn" || v == "fail" || v == "skip"));
            if (v != "skip") {
                CHECK(c["margin"].is_number());
                CHECK((c["margin"].get<double>() >= 0) == (v != "fail"));
            }
        }
        CHECK(seen == ids);
        CHECK(j["input"]["supply"]["voltage"] == 12.0);  // SI numbers
        CHECK(j["input"]["transistor"]["id"] == "2N4401");
        check_numbers_finite(j);
        // Parsing the dump gives the same document (no NaN written as null, no loss).
        CHECK(io::Json::parse(j.dump()) == j);
    }

    TEST_CASE("every example renders as text with the cautions and a result line") {
        for (const char* name :
             {"greenhouse-valve.json", "dust-extractor.json", "garage-door.json", "lab-valve-manifold.json"}) {
            CAPTURE(name);
            const Loaded l = load_example(name);
            const SizingReport r = size(l.spec, l.table.catalogue);
            const std::string text = io::render_text(r, io::TextStyle{});
            CHECK(text.find("Checks") != std::string::npos);
            CHECK(text.find("Cautions") != std::string::npos);
            CHECK(text.find("licensed practice") != std::string::npos);
            CHECK(text.find("Result: ") != std::string::npos);
            CHECK(text.find("nan") == std::string::npos);
            CHECK(text.find("inf") == std::string::npos);
            CHECK(text.find("\x1b[") == std::string::npos);  // no colour unless asked
            check_numbers_finite(io::report_to_json(r));
            if (l.spec.coil.inductance_h) {
                // Timing and the clamp trade-off table for every example with an inductance.
                CHECK(r.quantity("release_time_s").has_value());
                CHECK(r.clamp_options.size() >= 2);
                CHECK(text.find("Clamp options") != std::string::npos);
            }
        }
    }

    TEST_CASE("the dust-extractor example carries the mains caution") {
        const Loaded l = load_example("dust-extractor.json");
        const SizingReport r = size(l.spec, l.table.catalogue);
        bool found = false;
        for (const auto& c : r.cautions)
            found = found || c.find("400 V AC, above extra-low voltage") != std::string::npos;
        CHECK(found);
    }
}
