// Property test: random valid specs never produce NaN or infinity in any output.
//
// A fixed-seed generator of our own (SplitMix64, not the std distributions, whose output may
// differ between standard libraries) draws specs across the whole valid range of every field:
// supplies from 100 mV to 1 kV, coils from 10 mΩ to 10 MΩ, ambient from -100 °C to 250 °C,
// every clamp type, every transistor and diode of the shipped table, numbers with and without
// units. Each spec must read without an error, and then every number of the JSON report is
// finite, the JSON dumps and parses back, and the text report never shows "nan", "inf" or
// "n/a" (the architecture doc: "No number in the output is ever NaN or infinite").
#include <doctest/doctest.h>

#include "coilfit/report.hpp"

#include <cmath>
#include <cstdint>
#include <string>
#include <vector>

#include "coilfit/pick.hpp"
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

// SplitMix64 (Steele, Lea, Flood 2014): small, fast, the same numbers on every platform.
class Random {
public:
    explicit Random(std::uint64_t seed) : state_(seed) {}
    std::uint64_t next() {
        std::uint64_t z = (state_ += 0x9E3779B97F4A7C15ULL);
        z = (z ^ (z >> 30U)) * 0xBF58476D1CE4E5B9ULL;
        z = (z ^ (z >> 27U)) * 0x94D049BB133111EBULL;
        return z ^ (z >> 31U);
    }
    // Uniform in [0, 1): the top 53 bits as a fraction.
    double unit() { return static_cast<double>(next() >> 11U) * 0x1.0p-53; }
    double uniform(double lo, double hi) { return lo + (hi - lo) * unit(); }
    // Uniform on a log scale: as many small coils as large ones.
    double log_uniform(double lo, double hi) { return std::exp(uniform(std::log(lo), std::log(hi))); }
    bool chance(double p) { return unit() < p; }
    std::size_t below(std::size_t n) { return static_cast<std::size_t>(next() % n); }

private:
    std::uint64_t state_;
};

// A value as JSON: sometimes a plain SI number, sometimes a string with its unit.
io::Json value(Random& rng, double v, const char* unit) {
    if (rng.chance(0.5)) return v;
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.9g%s", v, unit);
    return std::string(buf);
}
io::Json percent(Random& rng, double fraction) {
    if (rng.chance(0.5)) return fraction;
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.9g%%", fraction * 100.0);
    return std::string(buf);
}

// One random spec that the reader must accept.
io::Json random_spec(Random& rng) {
    const Catalogue& cat = table().catalogue;
    io::Json j;
    j["schema"] = "coilfit.spec/1";
    j["name"] = "random channel";
    j["supply"] = {{"voltage", value(rng, rng.log_uniform(0.1, 1000.0), "V")}};
    if (rng.chance(0.8)) j["supply"]["tolerance"] = percent(rng, rng.uniform(0.0, 0.5));
    if (rng.chance(0.8)) {
        const double a = rng.uniform(-100.0, 250.0);
        const double b = rng.uniform(-100.0, 250.0);
        j["ambient"] = {{"min", value(rng, std::min(a, b), "C")}, {"max", value(rng, std::max(a, b), "C")}};
    }
    io::Json coil;
    const double rated = rng.log_uniform(0.1, 1000.0);
    coil["rated_voltage"] = value(rng, rated, "V");
    // Within the plausible ranges (src/io/plausible.cpp): 1 Ω to 200 kΩ, and a rated current of
    // 100 µA to 20 A.
    coil["resistance"] = value(rng, rng.log_uniform(std::max(1.0, rated / 20.0), std::min(200e3, rated / 1e-4)), "R");
    if (rng.chance(0.7)) coil["tolerance"] = percent(rng, rng.uniform(0.0, 0.5));
    if (rng.chance(0.5)) coil["reference_temp"] = value(rng, rng.uniform(-55.0, 125.0), "C");
    const double operate = rng.uniform(0.11, 1.0);  // above the default must_release 10 %
    if (rng.chance(0.7)) coil["must_operate"] = percent(rng, operate);
    // must_release below must_operate (default 75 %)
    if (rng.chance(0.7))
        coil["must_release"] = percent(rng, rng.uniform(0.0, 0.999) * (coil.contains("must_operate") ? operate : 0.75));
    if (rng.chance(0.5)) coil["self_heating"] = value(rng, rng.uniform(0.0, 200.0), "K");
    if (rng.chance(0.7)) coil["inductance"] = value(rng, rng.log_uniform(1e-6, 1e4), "H");
    if (rng.chance(0.3)) coil["max_voltage"] = value(rng, std::min(1000.0, rated * rng.uniform(1.0, 3.0)), "V");
    if (rng.chance(0.3)) coil["max_release_time"] = value(rng, rng.log_uniform(1e-6, 100.0), "s");
    j["coil"] = coil;
    io::Json pin;
    const double vdd = rng.uniform(0.5, 60.0);
    pin["vdd"] = value(rng, vdd, "V");
    if (rng.chance(0.7)) pin["vdd_tolerance"] = percent(rng, rng.uniform(0.0, 0.5));
    pin["max_current"] = value(rng, rng.log_uniform(1e-6, 0.2), "A");  // a plausible pin current
    if (rng.chance(0.5)) {
        pin["voh"] = value(rng, vdd * rng.uniform(0.01, 1.0), "V");
        pin["voh_current"] = value(rng, rng.log_uniform(1e-6, 0.2), "A");
    }
    j["pin"] = pin;
    j["transistor"] = cat.bipolars[rng.below(cat.bipolars.size())].id;
    io::Json clamp;
    const std::string diode = cat.diodes[rng.below(cat.diodes.size())].id;
    switch (rng.below(4)) {
        case 0:
            clamp = {{"type", "diode"}, {"diode", diode}};
            break;
        case 1:
            clamp = {{"type", "diode_zener"}, {"diode", diode}, {"zener", cat.zeners[rng.below(cat.zeners.size())].id}};
            break;
        case 2:
            clamp = {
                {"type", "diode_resistor"}, {"diode", diode}, {"resistor", value(rng, rng.log_uniform(1.0, 1e6), "R")}};
            break;
        default:
            clamp = {{"type", "none"}};
            break;
    }
    j["clamp"] = clamp;
    if (rng.chance(0.7)) {
        constexpr const char* series[] = {"E3", "E6", "E12", "E24", "E48", "E96", "E192"};
        io::Json rb = {{"series", series[rng.below(7)]}};
        if (rng.chance(0.5)) rb["tolerance"] = percent(rng, rng.uniform(0.0, 0.5));
        if (rng.chance(0.5)) rb["power_rating"] = value(rng, rng.log_uniform(1e-3, 100.0), "W");
        if (rng.chance(0.2)) rb["value"] = value(rng, rng.log_uniform(10.0, 1e7), "R");
        j["base_resistor"] = rb;
    }
    if (rng.chance(0.5)) j["pulldown"] = value(rng, rng.log_uniform(100.0, 1e8), "R");
    if (rng.chance(0.7)) {
        io::Json p;
        if (rng.chance(0.5)) p["forced_gain"] = rng.log_uniform(0.1, 1e5);
        if (rng.chance(0.5)) p["overdrive"] = rng.uniform(1.0, 100.0);
        if (rng.chance(0.5)) p["current_derating"] = percent(rng, rng.uniform(0.01, 1.0));
        if (rng.chance(0.5)) p["voltage_derating"] = percent(rng, rng.uniform(0.01, 1.0));
        if (rng.chance(0.5)) p["junction_margin"] = value(rng, rng.uniform(0.0, 200.0), "K");
        if (rng.chance(0.5)) p["power_derating"] = percent(rng, rng.uniform(0.01, 1.0));
        if (rng.chance(0.5)) p["vbe_low"] = value(rng, rng.uniform(0.0, 2.0), "V");
        j["policy"] = p;
    }
    if (rng.chance(0.5)) {
        // Half the specs are everyday relays on everyday pins (a 0.2 W to 1 W coil on its own
        // supply, L/R of 2 ms to 20 ms, a 3.3 V or 5 V pin), so that passing designs are
        // common enough to test that path as well as the failing ones.
        constexpr double supplies[] = {5.0, 12.0, 24.0, 48.0};
        const double vs = supplies[rng.below(4)];
        const double r_coil = vs * vs / rng.uniform(0.2, 1.0);
        j["supply"] = {{"voltage", value(rng, vs, "V")}, {"tolerance", percent(rng, rng.uniform(0.0, 0.1))}};
        j["ambient"] = {{"min", value(rng, rng.uniform(-40.0, 0.0), "C")},
                        {"max", value(rng, rng.uniform(25.0, 70.0), "C")}};
        j["coil"] = {{"rated_voltage", value(rng, vs, "V")},
                     {"resistance", value(rng, r_coil, "R")},
                     {"inductance", value(rng, r_coil * rng.uniform(0.002, 0.02), "H")}};
        const double pin_vdd = rng.chance(0.5) ? 3.3 : 5.0;
        j["pin"] = {{"vdd", value(rng, pin_vdd, "V")}, {"max_current", value(rng, rng.uniform(0.004, 0.025), "A")}};
        j.erase("policy");
    }
    if (rng.chance(0.6)) j["switching"] = {{"frequency", value(rng, rng.log_uniform(1e-9, 1e4), "Hz")}};
    if (rng.chance(0.5)) {
        j["load"] = {{"voltage", value(rng, rng.uniform(0.0, 1e5), "V")}, {"kind", rng.chance(0.5) ? "ac" : "dc"}};
        if (rng.chance(0.5)) j["load"]["current"] = value(rng, rng.uniform(0.0, 1e4), "A");
        if (rng.chance(0.5)) {
            // Edition 2: the kind of load, its inrush, power factor or L/R, and a relay record.
            constexpr const char* kinds[] = {"resistive",  "inductive", "motor",      "lamp",
                                             "capacitive", "solenoid",  "transformer"};
            const bool ac = j["load"]["kind"] == "ac";
            j["load"]["type"] = ac ? "ac" : "dc";
            j["load"]["kind"] = kinds[rng.below(7)];
            if (rng.chance(0.3)) j["load"]["inrush"] = std::to_string(rng.uniform(1.0, 100.0)) + "x";
            if (ac && rng.chance(0.3)) j["load"]["power_factor"] = rng.uniform(0.05, 1.0);
            if (!ac && rng.chance(0.3)) j["load"]["time_constant"] = value(rng, rng.log_uniform(1e-6, 100.0), "s");
            const auto& relays = table().relays;
            if (rng.chance(0.6)) {
                j["relay"] = relays[rng.below(relays.size())].record.id;
                j.erase("coil");  // the record's coil (coil fields beside it would override it)
            }
        }
    }
    return j;
}

bool is_word_char(char c) { return std::isalnum(static_cast<unsigned char>(c)) != 0 || c == '_'; }

// "nan" or "inf" (any case) as a whole word, or format_quantity's "n/a".
bool shows_non_finite(const std::string& text) {
    if (text.find("n/a") != std::string::npos) return true;
    std::string lower = text;
    for (char& c : lower) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    for (const std::string word : {"nan", "inf", "infinity"}) {
        for (auto at = lower.find(word); at != std::string::npos; at = lower.find(word, at + 1)) {
            const auto end = at + word.size();
            if ((at == 0 || !is_word_char(lower[at - 1])) && (end >= lower.size() || !is_word_char(lower[end])))
                return true;
        }
    }
    return false;
}

// The first non-finite number in a JSON document, by path; empty when all are finite.
std::string non_finite_path(const io::Json& j, const std::string& path) {
    if (j.is_number_float() && !std::isfinite(j.get<double>())) return path;
    if (j.is_object()) {
        for (const auto& [k, v] : j.items()) {
            if (auto p = non_finite_path(v, path + "." + k); !p.empty()) return p;
        }
    } else if (j.is_array()) {
        for (std::size_t i = 0; i < j.size(); ++i) {
            if (auto p = non_finite_path(j[i], path + "[" + std::to_string(i) + "]"); !p.empty()) return p;
        }
    }
    return {};
}

}  // namespace

TEST_SUITE("properties") {
    TEST_CASE("random valid specs never produce NaN or infinity, and the JSON report always parses") {
        Random rng(20261202);
        constexpr int count = 3000;
        int failing = 0;
        int passing = 0;
        for (int i = 0; i < count; ++i) {
            const io::Json doc = random_spec(rng);
            const std::string text = doc.dump();
            CAPTURE(text);
            Spec spec;
            REQUIRE_NOTHROW(spec = io::read_spec(io::parse_spec_text(text, "random.json"), table()));
            const SizingReport report = size(spec, table().catalogue);
            (report.verdict == Verdict::fail ? failing : passing) += 1;

            const io::Json j = io::report_to_json(report);
            CHECK(non_finite_path(j, "report") == "");
            std::string dumped;
            REQUIRE_NOTHROW(dumped = j.dump(2));
            io::Json back;
            REQUIRE_NOTHROW(back = io::Json::parse(dumped));
            CHECK(back["schema"] == "coilfit.report/1");
            CHECK(back["checks"].size() == report.checks.size());
            CHECK(report.checks.size() >= 12);  // every edition-1 check of a bipolar driver is listed
            for (const auto& c : report.checks) {
                CHECK_FALSE(shows_non_finite(c.message));
                for (const auto& v : {c.value, c.limit, c.margin}) CHECK((!v || std::isfinite(*v)));
            }
            CHECK_FALSE(shows_non_finite(io::render_text(report, io::TextStyle{})));
            if (i % 100 == 0) {
                // pick sizes the spec with every part of the table: its figures stay finite too.
                const PickResult picked = pick(spec, table().catalogue, PickSettings{0, true});
                for (const Candidate& c : picked.candidates) {
                    CHECK(std::isfinite(c.worst_margin));
                    CHECK((!c.resistor_ohm || std::isfinite(*c.resistor_ohm)));
                }
                for (const auto& r : picked.reasons) CHECK_FALSE(shows_non_finite(r));
            }
        }
        // The generator reaches both verdicts, so the property is tested on both paths.
        CHECK(failing > 300);
        CHECK(passing > 100);
        MESSAGE("random specs: " << passing << " pass, " << failing << " fail");
    }
}
