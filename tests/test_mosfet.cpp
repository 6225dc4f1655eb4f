// The logic-level N-MOSFET driver (include/coilfit/drivers/mosfet.hpp, src/method.md
// "N-MOSFET driver (nmos)"): hand-worked cases against closed forms and an iteration done here.
#include <doctest/doctest.h>

#include <cmath>

#include "coilfit/report.hpp"
#include "coilfit/sizing.hpp"
#include "flat_figures.hpp"

using namespace coilfit;
using doctest::Approx;

namespace {

constexpr double alpha = 0.00393;  // IEC 60028, annealed copper at 20 °C

// A logic-level part with three stated gate voltages, worked by hand below.
Mosfet test_nmos() {
    Mosfet m;
    m.id = "TEST-NMOS";
    m.vds_max_v = 30;
    m.id_max_a = 4;
    m.vgs_max_v = 12;
    m.vgs_th_min_v = 0.7;
    m.vgs_th_max_v = 1.5;
    m.rds_on = {{2.5, 1.0, 0.080, 0.050}, {4.5, 2.0, 0.050, 0.035}, {10.0, 3.0, 0.040, 0.030}};
    m.rds_on_tempco_per_k = 0.006;
    m.qg_c = 5e-9;
    m.pd_w = 1.0;
    m.rth_ja_k_per_w = 125;
    m.tj_max_c = 150;
    m.source = "test data";
    return m;
}

Diode test_diode() {
    Diode d;
    d.id = "TEST-D";
    d.kind = DiodeKind::rectifier;
    d.vrrm_v = 100;
    d.if_avg_a = 1;
    d.vf = {{0.001, 1.0}, {1.0, 1.0}};
    d.source = "test data";
    return d;
}

// A greenhouse vent relay of our own on a 3.3 V pin: 12 V, 270 ohm, 0.54 H.
Spec vent_spec() {
    Spec s;
    s.name = "vent relay, hand-worked";
    s.supply.voltage_v = 12.0;
    s.supply.tolerance = 0.10;
    s.ambient = {-10.0, 55.0};
    s.coil.rated_voltage_v = 12.0;
    s.coil.resistance_ohm = 270.0;
    s.coil.tolerance = 0.10;
    s.coil.reference_temp_c = 20.0;
    s.coil.inductance_h = 0.54;
    s.pin.vdd_v = 3.3;
    s.pin.vdd_tolerance = 0.10;
    s.pin.max_current_a = 0.008;
    s.transistor = test_nmos();
    s.gate_resistor.series = ESeries::e24;
    s.gate_resistor.tolerance = 0.05;
    s.pulldown_ohm = 100e3;
    s.clamp.type = ClampType::diode;
    s.clamp.diode = test_diode();
    return s;
}

const MosfetFigures& figures(const Sized& z) { return std::get<MosfetFigures>(z.worst.drive); }

}  // namespace

TEST_SUITE("mosfet") {
    TEST_CASE("the gate resistor is the smallest E24 value that keeps the charging peak within the pin's limit") {
        const Sized z = size_numbers(vent_spec());
        // VDD_hi / (Rg (1 - tb)) <= 8 mA: Rg >= 3.63 V / (8 mA * 0.95) = 477.6 ohm -> E24 510 ohm (IEC 60063).
        REQUIRE(z.r_drive_ohm.has_value());
        CHECK(*z.r_drive_ohm == Approx(510.0));
        CHECK(figures(z).gate_resistor_min_ohm == Approx(3.63 / (0.008 * 0.95)));
        // The pin's check takes the larger of the charging peak and the pull-down's DC current.
        const double peak = 3.63 / (510.0 * 0.95);
        const double dc = 3.63 / (510.0 * 0.95 + 100e3 * 0.95);
        CHECK(z.worst.check(CheckId::pin_current).value == Approx(std::max(peak, dc)));
        CHECK(z.worst.check(CheckId::pin_current).verdict == Verdict::pass);
        CHECK(z.worst.check(CheckId::gate_voltage).value == Approx(3.63));
    }

    TEST_CASE("the gate voltage divides down the pin and loses the threshold's rise when cold") {
        Spec s = vent_spec();
        const Sized z = size_numbers(s);
        // Vgs_lo = VDD_lo Rgs_lo / (Rgs_lo + Rg_hi + R_out), no VOH given: R_out = 0 (Ohm's law).
        const double rgs = 100e3 * 0.95;
        const double vgs_lo = 2.97 * rgs / (rgs + 510.0 * 1.05);
        CHECK(figures(z).at[0].vgs_lo_v == Approx(vgs_lo));
        // At -10 °C the threshold rises 4 mV/K x 35 K = 140 mV (from memory, the default).
        CHECK(figures(z).at[0].vgs_eff_v == Approx(vgs_lo - 0.004 * 35.0));
        CHECK(figures(z).at[1].vgs_eff_v == Approx(vgs_lo));  // 55 °C: no rise above 25 °C
        // The Rds(on) point: the highest stated gate voltage at or below Vgs_eff (2.81 V -> the 2.5 V point).
        CHECK(figures(z).at[0].rds_point == 0);
        CHECK(figures(z).at[0].rds25_ohm == Approx(0.080));
        CHECK(z.worst.check(CheckId::gate_drive).verdict == Verdict::pass);
        CHECK(z.worst.check(CheckId::gate_drive).limit == Approx(2.5));
    }

    TEST_CASE("a gate voltage below every stated point fails gate.drive and says Vgs(th) is not an on-state") {
        Spec s = vent_spec();
        s.pin.vdd_v = 2.5;  // 2.25 V low, less the cold rise: below the 2.5 V point
        const SizingReport r = size(s, Catalogue{});
        const Check* g = r.find_check("gate.drive");
        REQUIRE(g != nullptr);
        CHECK(g->verdict == Verdict::fail);
        CHECK(g->message.find("not an on-state") != std::string::npos);
        CHECK(r.verdict == Verdict::fail);
    }

    TEST_CASE("the hot on-resistance in closed form equals the fixed point of Rds(Tj) and Tj = Ta + I^2 Rds RthJA") {
        // Closed form (src/method.md) against an iteration done here.
        for (const double i : {0.5, 2.0, 4.0}) {
            for (const double ta : {-20.0, 25.0, 70.0}) {
                const double r25 = 0.08, tc = 0.006, rth = 62.5;
                const HotRds h = hot_rds(i, r25, tc, ta, rth);
                REQUIRE_FALSE(h.runaway);
                double tj = ta;
                for (int n = 0; n < 200; ++n) tj = ta + i * i * r25 * (1 + tc * (tj - 25)) * rth;
                CAPTURE(i);
                CAPTURE(ta);
                CHECK(h.junction_c == Approx(tj).epsilon(1e-9));
                CHECK(h.rds_ohm == Approx(r25 * (1 + tc * (tj - 25))).epsilon(1e-9));
                CHECK(h.power_w == Approx(i * i * h.rds_ohm).epsilon(1e-9));
            }
        }
    }

    TEST_CASE("a denominator at or below zero is thermal runaway and fails transistor.thermal") {
        // 1 - I^2 R25 tc RthJA <= 0: with 10 A, 80 mOhm, 0.6 %/K, 125 K/W the product is 6.
        CHECK(hot_rds(10.0, 0.08, 0.006, 25.0, 125.0).runaway);
        Spec s = vent_spec();
        s.coil.resistance_ohm = 1.2;  // a 10 A solenoid
        s.coil.rated_voltage_v = 12.0;
        const SizingReport r = size(s, Catalogue{});
        const Check* t = r.find_check("transistor.thermal");
        REQUIRE(t != nullptr);
        CHECK(t->verdict == Verdict::fail);
        CHECK_FALSE(t->value.has_value());
        CHECK(t->message.find("thermal runaway") != std::string::npos);
    }

    TEST_CASE("the thermal check takes the coil at the hot ambient, low tolerance, highest supply") {
        const Sized z = size_numbers(vent_spec());
        const double r_hot_ambient = 270.0 * 0.9 * (1 + alpha * (55.0 - 20.0));
        const double i = 13.2 / r_hot_ambient;
        const HotRds h = hot_rds(i, 0.080, 0.006, 55.0, 125.0);
        CHECK(z.worst.check(CheckId::transistor_thermal).value == Approx(h.junction_c));
        CHECK(z.worst.check(CheckId::transistor_thermal).corner == Corner::hot);
    }

    TEST_CASE("coil.operate divides the lowest supply between the hot coil and the hot Rds(on)") {
        Spec s = vent_spec();
        s.transistor = [] {
            Mosfet m = test_nmos();
            for (auto& p : m.rds_on) p.max_ohm *= 100;  // 8 ohm: a drop that shows
            return m;
        }();
        const Sized z = size_numbers(s);
        // Hot corner: coil at 55 °C, low tolerance; I = Vs_lo / R; Rds at the junction that gives.
        const double r_coil = 270.0 * 0.9 * (1 + alpha * 35.0);
        const HotRds h = hot_rds(10.8 / r_coil, 8.0, 0.006, 55.0, 125.0);
        CHECK(z.worst.driver.at[1].coil_voltage_min_v == Approx(10.8 * r_coil / (r_coil + h.rds_ohm)));
    }

    TEST_CASE("no clamp is allowed only with an avalanche rating, and the energy per turn-off is checked") {
        Spec s = vent_spec();
        s.clamp.type = ClampType::none;
        s.clamp.diode.reset();
        CHECK(size(s, Catalogue{}).find_check("transistor.voltage")->verdict == Verdict::fail);
        s.transistor = [] {
            Mosfet m = test_nmos();
            m.ear_j = 0.004;
            return m;
        }();
        const Sized z = size_numbers(s);
        // E = 1/2 L I0^2 V_BR / (V_BR - Vs_hi), V_BR = Vds max (unclamped inductive switching).
        const double i0 = 13.2 / (270.0 * 0.9 * (1 + alpha * (-30.0)));
        const double e = 0.5 * 0.54 * i0 * i0 * 30.0 / (30.0 - 13.2);
        CHECK(z.worst.check(CheckId::clamp_pulse).value == Approx(e));
        CHECK(z.worst.check(CheckId::clamp_pulse).limit == Approx(0.5 * 0.004));
        CHECK(z.worst.check(CheckId::transistor_voltage).verdict == Verdict::skip);
        const SizingReport r = size(s, Catalogue{});
        CHECK(r.find_check("clamp.pulse")->unit == Unit::joule);
    }

    TEST_CASE("the gate switching time is Qg through the gate resistor over the headroom above the plateau") {
        const Sized z = size_numbers(vent_spec());
        // t_g = Qg (Rg + R_out) / (VDD_lo - Vplateau), Vplateau = Vgs(th) max + 1 V.
        REQUIRE(figures(z).gate_time_s.has_value());
        CHECK(*figures(z).gate_time_s == Approx(5e-9 * 510.0 / (2.97 - 2.5)));
    }

    TEST_CASE("Monte Carlo draws Rds(on) between typical and maximum") {
        Spec s = vent_spec();
        Conditions c = worst_case_conditions(s);
        c.rds_position = 1.0;
        const Prepared p = prepare(s);
        const Evaluation typ = evaluate(p, c, 510.0);
        CHECK(std::get<MosfetFigures>(typ.drive).at[0].rds25_ohm == Approx(0.050));
        c.rds_position = 0.5;
        CHECK(std::get<MosfetFigures>(evaluate(p, c, 510.0).drive).at[0].rds25_ohm == Approx(0.065));
    }
}
