// Method edition 2, drive side (src/method.md "Corners", "Coil", "Data limits"): asymmetric
// supplies and transients, the must-operate temperature, the coil's self-heating fixed point, and
// part values beyond the part's data.
#include <doctest/doctest.h>

#include <cmath>

#include "coilfit/report.hpp"
#include "coilfit/sizing.hpp"
#include "flat_figures.hpp"

using namespace coilfit;
using doctest::Approx;

namespace {

constexpr double alpha = 0.00393;  // IEC 60028, annealed copper at 20 °C

Bipolar test_npn() {
    Bipolar b;
    b.id = "TEST-NPN";
    b.kind = BipolarKind::npn;
    b.ic_max_a = 0.6;
    b.vceo_v = 40;
    b.hfe_min = {{0.001, 100, std::nullopt}, {1.0, 100, std::nullopt}};
    b.vce_sat = {{0.001, 0.0001, 0.2}, {1.0, 0.1, 0.2}};
    b.vbe_sat = {{0.001, 0.0001, 0.9}, {1.0, 0.1, 0.9}};
    b.pd_w = 0.625;
    b.rth_ja_k_per_w = 200;
    b.source = "test data";
    return b;
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

// A 12 V vehicle relay of our own, 160 ohm, on a 5 V pin.
Spec vehicle_spec() {
    Spec s;
    s.name = "vehicle accessory relay";
    s.supply.min_v = 9.0;
    s.supply.max_v = 16.0;
    s.supply.transient_max_v = 40.0;
    s.ambient = {25.0, 25.0};
    s.coil.rated_voltage_v = 12.0;
    s.coil.resistance_ohm = 160.0;
    s.coil.tolerance = 0.10;
    s.coil.reference_temp_c = 25.0;
    s.coil.must_operate = 0.6;
    s.pin.vdd_v = 5.0;
    s.pin.vdd_tolerance = 0.05;
    s.pin.max_current_a = 0.02;
    s.base_resistor.power_rating_w = 0.25;
    s.transistor = test_npn();
    s.clamp.type = ClampType::diode;
    s.clamp.diode = test_diode();
    return s;
}

}  // namespace

TEST_SUITE("corners") {
    TEST_CASE("an asymmetric 9-16 V supply sizes at 16 V and operates at 9 V; the transient sets the peak") {
        const Spec s = vehicle_spec();
        const Sized z = size_numbers(s);
        CHECK(z.conditions.vs_lo_v == Approx(9.0));
        CHECK(z.conditions.vs_hi_v == Approx(16.0));
        // Ohm's law at the highest supply into the coil at its low tolerance (25 °C reference).
        CHECK(z.worst.coil_current_max_a() == Approx(16.0 / 144.0));
        CHECK(z.worst.check(CheckId::coil_operate).value == Approx(9.0 - 0.2));
        // The collector must withstand max(transient_max, Vs_hi + Vc) = max(40 V, 17 V).
        CHECK(z.worst.check(CheckId::transistor_voltage).value == Approx(40.0));
        CHECK(z.worst.check(CheckId::transistor_voltage).verdict == Verdict::fail);  // 40 V > 0.75 x 40 V
        Spec lower = s;
        lower.supply.transient_max_v.reset();
        CHECK(size_numbers(lower).worst.check(CheckId::transistor_voltage).value == Approx(16.0 + 1.0));
    }

    TEST_CASE("the must-operate voltage scales from the temperature the data state it at") {
        // V_op(T) = k V_rated (1 + alpha (T - T_ref)) / (1 + alpha (T_mo - T_ref)) (src/method.md "Coil").
        CoilSpec coil;
        coil.rated_voltage_v = 12.0;
        coil.reference_temp_c = 20.0;
        coil.must_operate = 0.75;
        CHECK(operate_voltage_v(coil, 20.0) == Approx(9.0));
        CHECK(operate_voltage_v(coil, 70.0) == Approx(9.0 * (1 + alpha * 50.0)));
        coil.must_operate_temp_c = 85.0;  // a vehicle relay stating must-operate hot
        CHECK(operate_voltage_v(coil, 85.0) == Approx(9.0));
        CHECK(operate_voltage_v(coil, 20.0) == Approx(9.0 / (1 + alpha * 65.0)));
    }

    TEST_CASE("the coil's self-heating is the fixed point of its own power and the copper law") {
        // T = Ta + Rth V^2 / R(T), solved in closed form; against an iteration done here.
        const double v = 13.2, r_lo = 360.0, t_ref = 20.0, ta = 50.0, rth = 60.0;
        double t = ta;
        for (int n = 0; n < 500; ++n) t = ta + rth * v * v / (r_lo * (1 + alpha * (t - t_ref)));
        CHECK(ta + coil_rise_k(v, r_lo, t_ref, ta, rth) == Approx(t).epsilon(1e-10));
        // In a spec: the hot coil for the operate check is the one that has been running.
        Spec s = vehicle_spec();
        s.supply = SupplySpec{};
        s.supply.voltage_v = 12.0;
        s.supply.tolerance = 0.10;
        s.coil.resistance_ohm = 400.0;
        s.coil.reference_temp_c = t_ref;
        s.coil.thermal_resistance_k_per_w = rth;
        s.coil.max_temperature_c = 130.0;  // insulation class B
        s.ambient = {ta, ta};
        const Sized z = size_numbers(s);
        CHECK(z.worst.coil.at[1].temp_hot_c == Approx(t).epsilon(1e-10));
        CHECK(z.worst.check(CheckId::coil_operate).limit == Approx(0.6 * 12.0 * (1 + alpha * (t - t_ref))));
        CHECK(z.worst.check(CheckId::coil_thermal).value == Approx(t).epsilon(1e-10));
        CHECK(z.worst.check(CheckId::coil_thermal).verdict == Verdict::pass);
        s.coil.max_temperature_c = 60.0;
        CHECK(size_numbers(s).worst.check(CheckId::coil_thermal).verdict == Verdict::fail);
    }

    TEST_CASE("a part run beyond its highest Vce(sat) and hFE points warns, and strict would fail it") {
        Spec s = vehicle_spec();
        s.supply.transient_max_v.reset();
        Bipolar b = test_npn();
        b.hfe_min = {{0.001, 100, std::nullopt}, {0.05, 100, std::nullopt}};  // data stop at 50 mA
        b.vce_sat = {{0.001, 0.0001, 0.2}, {0.05, 0.005, 0.2}};
        s.transistor = b;
        const SizingReport r = size(s, Catalogue{});
        const Check* sat = r.find_check("transistor.saturation");
        const Check* op = r.find_check("coil.operate");
        const Check* th = r.find_check("transistor.thermal");
        REQUIRE(sat != nullptr);
        CHECK(sat->verdict == Verdict::warn);
        CHECK(sat->beyond_data);
        CHECK(sat->message.find("beyond the part's data") != std::string::npos);
        CHECK(op->verdict == Verdict::warn);
        CHECK(th->verdict == Verdict::warn);
        CHECK(r.verdict == Verdict::pass);
        CHECK(r.has_warnings);  // --strict turns these into exit 1
        // Below the lowest point Vce(sat) is on its safe side: a note, no warning.
        Bipolar low = test_npn();
        low.vce_sat = {{0.5, 0.05, 0.2}, {1.0, 0.1, 0.2}};
        s.transistor = low;
        const SizingReport safe = size(s, Catalogue{});
        CHECK(safe.find_check("coil.operate")->verdict == Verdict::pass);
        bool noted = false;
        for (const auto& n : safe.notes) noted = noted || n.find("(the safe side)") != std::string::npos;
        CHECK(noted);
    }

    TEST_CASE("a diode's Vf above its highest point is extrapolated on log(current)") {
        Diode d = test_diode();
        d.vf = {{0.01, 0.8}, {0.1, 0.9}};
        // Linear in ln(I) from the last two points: +0.1 V per decade.
        CHECK(vf_max_at(d, 1.0).value == Approx(1.0));
        CHECK(vf_max_at(d, 1.0).outside);
        // One point: + 2 x 26 mV x ln(I / I_pt), the diode law with emission coefficient 2.
        d.vf = {{0.1, 0.9}};
        CHECK(vf_max_at(d, 1.0).value == Approx(0.9 + 0.052 * std::log(10.0)));
        // Below the lowest point the nearest is kept (safe for the peak).
        CHECK(vf_max_at(d, 0.01).value == Approx(0.9));
    }

    TEST_CASE("a pin without VOH is taken as ideal, and the report says so") {
        const SizingReport r = size(vehicle_spec(), Catalogue{});
        bool noted = false;
        for (const auto& n : r.notes) noted = noted || n.find("the pin was taken as ideal") != std::string::npos;
        CHECK(noted);
    }
}
