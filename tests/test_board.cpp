// Boards (include/coilfit/board.hpp, src/io/board_read*.cpp): the shared sums worked by hand,
// the worst allowed set against a brute force over every subset, and the array channel's
// figures (input current, Vce(sat) on the coil, package dissipation, common-pin current) each
// worked by hand from the parts table's points.
#include <doctest/doctest.h>

#include <cmath>
#include <random>
#include <string>
#include <vector>

#include "coilfit/board.hpp"
#include "io/board_io.hpp"
#include "support.hpp"

using namespace coilfit;
using doctest::Approx;

namespace {

constexpr double alpha = 0.00393;  // IEC 60028, annealed copper at 20 °C

// A lab valve manifold of our own: a pilot relay on a 2N4401 with a fixed 1 kOhm base resistor
// on port PA, three 60 ohm valve coils on array U2 (PA1-PA3) and two on array U3 (PB0, PB1).
const char* manifold = R"json({ "schema": "coilfit.board/1", "name": "lab valve manifold (test)",
  "supply": { "voltage": "12V", "tolerance": "5%", "current_max": "2A" },
  "ambient": { "min": "0C", "max": "50C" },
  "mcu": { "vdd": "3.3V", "vdd_tolerance": "5%", "pin": { "max_current": "8mA" },
           "ports": [ { "name": "PA", "current_max": "20mA" }, { "name": "PB", "current_max": "20mA" } ],
           "package_current_max": "50mA" },
  "defaults": { "coil": { "rated_voltage": "12V", "resistance": "60R" } },
  "channels": [
    { "name": "K1 pilot", "pin": "PA0", "port": "PA", "transistor": "2N4401", "base_resistor": { "value": "1k" },
      "clamp": { "type": "diode", "diode": "1N4148" }, "coil": { "resistance": "400R" } },
    { "name": "V1-V3", "pin": "PA1", "port": "PA", "count": 3, "transistor": "array-7ch-darlington-50v", "package": "U2" },
    { "name": "V4-V5", "pin": "PB0", "port": "PB", "count": 2, "transistor": "array-7ch-darlington-50v", "package": "U3" }
  ] SIMULTANEOUS })json";

Board board_from(const std::string& simultaneous = "") {
    std::string text = manifold;
    text.replace(text.find(" SIMULTANEOUS"), 13, simultaneous.empty() ? "" : ", \"simultaneous\": " + simultaneous);
    return io::read_board(io::parse_board_text(text, "manifold.json"), test::shipped_table());
}

const BoardCheck& find(const BoardReport& r, std::string_view id, std::string_view subject) {
    for (const BoardCheck& c : r.checks) {
        if (c.check.id == id && c.subject == subject) return c;
    }
    FAIL("no board check " << id << " for " << subject);
    return r.checks.front();
}

// Hand-worked pin currents (src/method.md "Transistor-array channel", "Bipolar drivers"):
// VDD_hi = 3.3 V x 1.05 = 3.465 V.
// Array input: (VDD_hi - 1.2 V) / (2.7 kOhm x (1 - 20 %)) = 2.265 V / 2160 ohm.
const double pin_array_a = (3.465 - 1.2) / (2700.0 * 0.8);
// Pilot: (VDD_hi - Vbe_low) / (1 kOhm x (1 - 5 %)), Vbe_low 0.6 V less 2 mV/K above 25 °C at
// the hot corner (50 °C): 0.55 V (common practice), the higher of the two corners.
const double pin_pilot_a = (3.465 - (0.6 - 0.002 * 25.0)) / 950.0;

// Hand-worked 60 ohm valve coil: cold corner 0 °C, resistance at -10 % (the default tolerance),
// highest supply 12.6 V; hot corner 50 °C.
const double r_cold_ohm = 60.0 * 0.9 * (1 + alpha * (0.0 - 20.0));
const double r_hot_low_ohm = 60.0 * 0.9 * (1 + alpha * (50.0 - 20.0));
const double i_cold_a = 12.6 / r_cold_ohm;    // 253 mA
const double i_hot_a = 12.6 / r_hot_low_ohm;  // 209 mA
// Vce(sat) of the array between its points 200 mA 1.3 V and 350 mA 1.6 V, linear on ln(I).
double vce_sat(double i) { return 1.3 + 0.3 * std::log(i / 0.2) / std::log(0.35 / 0.2); }

// The brute force: every subset of n channels, its own reading of the rule (at most max_on on;
// channels of two different groups never together), the largest sum.
double brute_force(const std::vector<double>& w, std::optional<std::size_t> max_on, const std::vector<int>& group) {
    const std::size_t n = w.size();
    double best = 0;
    for (std::uint32_t mask = 0; mask < (1U << n); ++mask) {
        std::size_t count = 0;
        int seen = -1;
        bool ok = true;
        double sum = 0;
        for (std::size_t i = 0; i < n; ++i) {
            if ((mask & (1U << i)) == 0) continue;
            ++count;
            sum += w[i];
            if (group[i] >= 0) {
                if (seen >= 0 && seen != group[i]) ok = false;
                seen = group[i];
            }
        }
        if (max_on && count > *max_on) ok = false;
        if (ok) best = std::max(best, sum);
    }
    return best;
}

}  // namespace

TEST_SUITE("board") {
    TEST_CASE("an array channel's pin current is the input resistor's at its low tolerance, worked by hand") {
        const Board b = board_from();
        REQUIRE(b.channels.size() == 6);
        const SizingReport r = size(b.channels[1].spec, test::shipped_table().catalogue);
        REQUIRE(r.find_check("pin.current"));
        CHECK(*r.find_check("pin.current")->value == Approx(pin_array_a).epsilon(1e-9));  // 1.049 mA
        // input.drive: the lowest VDD 3.135 V against vin_on at the coil current (253 mA, between
        // the points 250 mA 2.7 V and 300 mA 3 V, linear on ln(I)).
        const double vin_on = 2.7 + 0.3 * std::log(i_cold_a / 0.25) / std::log(0.3 / 0.25);
        REQUIRE(r.find_check("input.drive"));
        CHECK(*r.find_check("input.drive")->value == Approx(3.135).epsilon(1e-9));
        CHECK(*r.find_check("input.drive")->limit == Approx(vin_on).epsilon(1e-9));
    }

    TEST_CASE("Vce(sat) of the array channel comes off the coil's voltage at each corner, worked by hand") {
        const Board b = board_from();
        const Sized s = size_numbers(b.channels[1].spec);
        // Coil current: Ohm's law with the IEC 60028 copper factor (12.6 V into the cold coil).
        CHECK(s.worst.coil_at(Corner::cold).current_max_a == Approx(i_cold_a).epsilon(1e-9));
        CHECK(s.worst.coil_at(Corner::hot).current_max_a == Approx(i_hot_a).epsilon(1e-9));
        // The coil's lowest voltage when on: Vs_lo 11.4 V less Vce(sat) at that corner's current.
        CHECK(s.worst.driver_at(Corner::cold).coil_voltage_min_v == Approx(11.4 - vce_sat(i_cold_a)).epsilon(1e-9));
        CHECK(s.worst.driver_at(Corner::hot).coil_voltage_min_v == Approx(11.4 - vce_sat(i_hot_a)).epsilon(1e-9));
        // One channel alone: P = Vce(sat) I.
        CHECK(s.worst.driver_at(Corner::hot).power_w == Approx(vce_sat(i_hot_a) * i_hot_a).epsilon(1e-9));
    }

    TEST_CASE("port and package sums with every channel on, worked by hand") {
        const BoardReport r = size_board(board_from(), test::shipped_table().catalogue);
        const BoardCheck& pa = find(r, "port.current", "port PA");
        CHECK(*pa.check.value == Approx(pin_pilot_a + 3 * pin_array_a).epsilon(1e-9));  // 6.22 mA
        CHECK(*pa.check.limit == Approx(0.020));
        CHECK(pa.check.verdict == Verdict::pass);
        CHECK(pa.set == std::vector<std::size_t>{0, 1, 2, 3});
        const BoardCheck& pb = find(r, "port.current", "port PB");
        CHECK(*pb.check.value == Approx(2 * pin_array_a).epsilon(1e-9));
        CHECK(pb.set == std::vector<std::size_t>{4, 5});
        const BoardCheck& pkg = find(r, "package.current", "MCU package");
        CHECK(*pkg.check.value == Approx(pin_pilot_a + 5 * pin_array_a).epsilon(1e-9));
        CHECK(*pkg.check.limit == Approx(0.050));
        CHECK(*pkg.check.margin == Approx((0.050 - (pin_pilot_a + 5 * pin_array_a)) / 0.050).epsilon(1e-9));
        // The supply: coil currents and drive currents (board.hpp assumption 2).
        const double pilot_coil_a = 12.6 / (400.0 * 0.9 * (1 + alpha * (0.0 - 20.0)));
        const BoardCheck& sup = find(r, "supply.current", "supply");
        CHECK(*sup.check.value == Approx(pilot_coil_a + pin_pilot_a + 5 * (i_cold_a + pin_array_a)).epsilon(1e-9));
    }

    TEST_CASE("array package dissipation and common-pin current, worked by hand") {
        const BoardReport r = size_board(board_from(), test::shipped_table().catalogue);
        // U2, three channels: cold corner 3 x Vce(sat)(253 mA) x 253 mA = 1.08 W against
        // min(Pd 1.7 W, (150 - 25 - 0) / 73 K/W = 1.71 W); hot corner 3 x Vce(sat)(209 mA) x 209 mA
        // = 0.83 W against (150 - 25 - 50) / 73 = 1.03 W: the hot corner has the smaller margin.
        const double p_hot = 3 * vce_sat(i_hot_a) * i_hot_a;
        const double limit_hot = (150.0 - 25.0 - 50.0) / 73.0;
        const BoardCheck& power = find(r, "array.power", "array U2");
        CHECK(power.check.corner == Corner::hot);
        CHECK(*power.check.value == Approx(p_hot).epsilon(1e-9));
        CHECK(*power.check.limit == Approx(limit_hot).epsilon(1e-9));
        CHECK(power.set == std::vector<std::size_t>{1, 2, 3});
        CHECK((3 * vce_sat(i_cold_a) * i_cold_a - 1.7) / 1.7 <
              (p_hot - limit_hot) / limit_hot);  // cold has more headroom
        // The ground pin carries the sum of the coil currents; the common clamp pin the same sum
        // when they turn off together: 3 x 253 mA against 75 % of 2.5 A.
        const BoardCheck& current = find(r, "array.current", "array U2");
        CHECK(*current.check.value == Approx(3 * i_cold_a).epsilon(1e-9));
        CHECK(*current.check.limit == Approx(0.75 * 2.5));
        CHECK(current.check.message.find("common clamp pin") != std::string::npos);
        CHECK(*find(r, "array.current", "array U3").check.value == Approx(2 * i_cold_a).epsilon(1e-9));
    }

    TEST_CASE("max_on: the worst set for each sum is its largest contributions, worked by hand") {
        const BoardReport r = size_board(board_from(R"({ "max_on": 2 })"), test::shipped_table().catalogue);
        // Port PA: the pilot (3.07 mA) and one array input (1.05 mA).
        const BoardCheck& pa = find(r, "port.current", "port PA");
        CHECK(*pa.check.value == Approx(pin_pilot_a + pin_array_a).epsilon(1e-9));
        CHECK(pa.set == std::vector<std::size_t>{0, 1});
        CHECK(*find(r, "array.current", "array U2").check.value == Approx(2 * i_cold_a).epsilon(1e-9));
        // The supply's worst pair: two valve coils (253 mA each) beat the 31 mA pilot.
        CHECK(*find(r, "supply.current", "supply").check.value == Approx(2 * (i_cold_a + pin_array_a)).epsilon(1e-9));
    }

    TEST_CASE("groups that exclude each other: channels in no group, plus the worst one group") {
        const BoardReport r =
            size_board(board_from(R"({ "groups": [ [ "K1 pilot" ], [ "V1-V3" ] ] })"), test::shipped_table().catalogue);
        // Port PA: the pilot alone (3.07 mA) or the three valves (3 x 1.05 mA = 3.15 mA).
        const BoardCheck& pa = find(r, "port.current", "port PA");
        CHECK(*pa.check.value == Approx(3 * pin_array_a).epsilon(1e-9));
        CHECK(pa.set == std::vector<std::size_t>{1, 2, 3});
        // The package: V4, V5 (in no group) plus the worse group.
        CHECK(*find(r, "package.current", "MCU package").check.value == Approx(5 * pin_array_a).epsilon(1e-9));
    }

    TEST_CASE("the board's checks agree with a brute force over every allowed set of a small board") {
        for (const char* rule : {"\"all\"", R"({ "max_on": 1 })", R"({ "max_on": 3 })",
                                 R"({ "groups": [ [ "PA0", "PB1" ], [ "V1-V3" ] ] })",
                                 R"({ "max_on": 2, "groups": [ [ "PA0" ], [ "PA1", "PB0" ] ] })"}) {
            INFO(rule);
            const BoardReport r = size_board(board_from(rule), test::shipped_table().catalogue);
            const Simultaneity& s = r.board.simultaneous;
            std::vector<int> group(r.board.channels.size(), -1);
            for (std::size_t g = 0; g < s.groups.size(); ++g) {
                for (const std::size_t i : s.groups[g]) group[i] = static_cast<int>(g);
            }
            std::vector<double> pins;
            for (const SizingReport& c : r.channels) pins.push_back(*c.find_check("pin.current")->value);
            CHECK(*find(r, "package.current", "MCU package").check.value ==
                  Approx(brute_force(pins, s.max_on, group)).epsilon(1e-12));
            std::vector<double> pa = pins;
            for (std::size_t i = 4; i < pa.size(); ++i) pa[i] = 0;
            CHECK(*find(r, "port.current", "port PA").check.value ==
                  Approx(brute_force(pa, s.max_on, group)).epsilon(1e-12));
        }
    }

    TEST_CASE("worst_allowed_set equals a brute force over every subset, for random small boards") {
        std::mt19937 rng(14);
        std::uniform_real_distribution<double> weight(0.0, 10.0);
        for (int trial = 0; trial < 400; ++trial) {
            const std::size_t n = 1 + rng() % 9;
            std::vector<double> w(n);
            for (double& x : w) x = rng() % 5 == 0 ? 0.0 : weight(rng);
            Simultaneity s;
            if (rng() % 2) s.max_on = 1 + rng() % n;
            std::vector<int> group(n, -1);
            const std::size_t groups = rng() % 4;
            s.groups.resize(groups);
            for (std::size_t i = 0; i < n && groups > 0; ++i) {
                const std::size_t g = rng() % (groups + 1);
                if (g == groups) continue;
                s.groups[g].push_back(i);
                group[i] = static_cast<int>(g);
            }
            const WorstSet found = worst_allowed_set(s, w);
            INFO("trial " << trial);
            CHECK(found.sum == Approx(brute_force(w, s.max_on, group)).epsilon(1e-12));
            // The set it names is allowed and adds up to the sum.
            std::vector<bool> on(n, false);
            double sum = 0;
            for (const std::size_t i : found.on) {
                on[i] = true;
                sum += w[i];
            }
            CHECK(allowed(s, on));
            CHECK(sum == Approx(found.sum).epsilon(1e-12));
        }
    }

    TEST_CASE("defaults fill every channel, a channel's own fields win, and count repeats pins and names") {
        const Board b = board_from();
        CHECK(b.channels[0].spec.coil.resistance_ohm == Approx(400));  // its own coil field
        CHECK(b.channels[1].spec.coil.resistance_ohm == Approx(60));   // the defaults'
        CHECK(b.channels[1].spec.coil.rated_voltage_v == Approx(12));
        CHECK(b.channels[0].spec.pin.vdd_v == Approx(3.3));  // the mcu's
        CHECK(b.channels[3].pin == "PA3");
        CHECK(b.channels[3].spec.name == "V1-V3 #3");
        CHECK(b.channels[5].pin == "PB1");
        CHECK(b.channels[5].package == "U3");
        // The array channels clamp through their built-in diode.
        CHECK(b.channels[1].spec.clamp.diode->source == "the array's record");
        CHECK(b.channels[0].spec.clamp.diode->id == "1N4148");
    }

    TEST_CASE("a bad field is named where the board file wrote it") {
        std::string text = manifold;
        text.replace(text.find(" SIMULTANEOUS"), 13, "");
        const auto read = [](const std::string& t) {
            (void)io::read_board(io::parse_board_text(t, "b.json"), test::shipped_table());
        };
        std::string bad = text;
        bad.replace(bad.find(R"("resistance": "60R")"), 19, R"("resistance": "-6R")");
        CHECK_THROWS_WITH_AS(read(bad),
                             "b.json: defaults.coil.resistance: expected a resistance greater than zero, got -6 Ω",
                             InputError);
        bad = text;
        bad.replace(bad.find(R"("vdd": "3.3V")"), 13, R"("vdd": "-3V")");
        CHECK_THROWS_WITH_AS(read(bad), "b.json: mcu.vdd: expected a voltage greater than zero, got -3 V", InputError);
        bad = text;
        bad.replace(bad.find(R"("count": 3)"), 10, R"("count": 3, "pulldwn": "10k")");
        CHECK_THROWS_WITH_AS(read(bad), doctest::Contains("b.json: channels[1].pulldwn: unknown key"), InputError);
    }
}

TEST_SUITE("board") {
    TEST_CASE("a channel may override the mcu's pin ratings and give a supply of its own") {
        std::string text = manifold;
        text.replace(text.find(" SIMULTANEOUS"), 13, "");
        text.replace(text.find(R"("pin": "PA0")"), 12,
                     R"("pin": { "name": "PA0", "max_current": "4mA" }, "supply": { "voltage": "24V" })");
        const Board b = io::read_board(io::parse_board_text(text, "b.json"), test::shipped_table());
        CHECK(b.channels[0].pin == "PA0");
        CHECK(b.channels[0].spec.pin.max_current_a == Approx(0.004));
        CHECK(b.channels[0].spec.pin.vdd_v == Approx(3.3));
        CHECK(b.channels[1].spec.pin.max_current_a == Approx(0.008));
        CHECK(b.channels[0].spec.supply.voltage_v == Approx(24));
        CHECK_FALSE(b.channels[0].board_supply);
        // The pilot on its own supply is left out of supply.current: five valves, coil and drive.
        const BoardReport r = size_board(b, test::shipped_table().catalogue);
        CHECK(*find(r, "supply.current", "supply").check.value == Approx(5 * (i_cold_a + pin_array_a)).epsilon(1e-9));
    }

    TEST_CASE("two channels of one name are rejected, naming the second") {
        std::string text = manifold;
        text.replace(text.find(" SIMULTANEOUS"), 13, "");
        text.replace(text.find(R"("name": "V4-V5")"), 15, R"("name": "V1-V3 #2")");
        CHECK_THROWS_WITH_AS(
            (void)io::read_board(io::parse_board_text(text, "b.json"), test::shipped_table()),
            "b.json: channels[2].name: \"V1-V3 #2\" is already the name of a channel of channels[1]; give every "
            "channel a name of its own",
            InputError);
    }
}
