// Worst-case sizing (include/coilfit/sizing.hpp): hand-worked examples computed independently
// here, the common-practice rules, and properties.
#include <doctest/doctest.h>

#include <cmath>
#include <variant>
#include <vector>

#include "coilfit/report.hpp"
#include "coilfit/sizing.hpp"
#include "flat_figures.hpp"

using namespace coilfit;
using doctest::Approx;

namespace {

constexpr double alpha = 0.00393;  // IEC 60028, annealed copper at 20 °C

// A plain NPN with flat data, so the expected numbers are easy to work by hand.
Bipolar flat_npn(double hfe = 100, double vce_sat = 0.2, double vbe_sat = 0.9) {
    Bipolar b;
    b.id = "TEST-NPN";
    b.kind = BipolarKind::npn;
    b.ic_max_a = 0.6;
    b.vceo_v = 40;
    b.hfe_min = {{0.001, hfe, std::nullopt}, {1.0, hfe, std::nullopt}};
    b.vce_sat = {{0.001, 0.0001, vce_sat}, {1.0, 0.1, vce_sat}};
    b.vbe_sat = {{0.001, 0.0001, vbe_sat}, {1.0, 0.1, vbe_sat}};
    b.pd_w = 0.625;
    b.rth_ja_k_per_w = 200;
    b.tj_max_c = 150;
    b.source = "test data";
    return b;
}

Diode flat_diode() {
    Diode d;
    d.id = "TEST-D";
    d.kind = DiodeKind::rectifier;
    d.vrrm_v = 100;
    d.if_avg_a = 1;
    d.ifsm_a = 30;
    d.vf = {{0.001, 1.0}, {1.0, 1.0}};
    d.source = "test data";
    return d;
}

// The irrigation-valve example worked by hand below.
Spec hand_spec() {
    Spec s;
    s.name = "hand-worked";
    s.supply.voltage_v = 12.0;
    s.supply.tolerance = 0.10;
    s.ambient = {-20.0, 60.0};
    s.coil.rated_voltage_v = 12.0;
    s.coil.resistance_ohm = 400.0;
    s.coil.tolerance = 0.10;
    s.coil.reference_temp_c = 20.0;
    s.coil.must_operate = 0.75;
    s.coil.must_release = 0.10;
    s.pin.vdd_v = 3.3;
    s.pin.vdd_tolerance = 0.05;
    s.pin.max_current_a = 0.008;
    s.transistor = flat_npn();
    s.clamp.type = ClampType::diode;
    s.clamp.diode = flat_diode();
    s.base_resistor.series = ESeries::e24;
    s.base_resistor.tolerance = 0.05;
    return s;
}

}  // namespace

TEST_SUITE("sizing") {
    TEST_CASE("coil current follows Ohm's law with the copper temperature at each corner") {
        const Spec s = hand_spec();
        const Sized z = size_numbers(s);
        // Ohm's law; cold coil: 400 Ω -10 % at -20 °C (IEC 60028 copper, 40 K below 20 °C).
        const double r_cold = 400.0 * 0.9 * (1.0 + alpha * (-20.0 - 20.0));
        CHECK(test::flat(z.worst).r_coil_cold_ohm == Approx(r_cold));
        CHECK(test::flat(z.worst).coil_current_max_a == Approx(13.2 / r_cold));  // highest supply 12 V +10 %
        // Hot coil: 400 Ω +10 % at 60 °C.
        const double r_hot = 400.0 * 1.1 * (1.0 + alpha * 40.0);
        CHECK(test::flat(z.worst).r_coil_hot_ohm == Approx(r_hot));
        CHECK(test::flat(z.worst).coil_current_nominal_a == Approx(12.0 / 400.0));
        // Lowest coil voltage: 10.8 V less Vce(sat) 0.2 V; must-operate 75 % of 12 V, hot.
        CHECK(test::flat(z.worst).coil_voltage_min_v == Approx(10.6));
        CHECK(test::flat(z.worst).operate_voltage_hot_v == Approx(9.0 * (1.0 + alpha * 40.0)));
        CHECK(test::flat(z.worst).release_current_a == Approx(1.2 / 400.0));
    }

    TEST_CASE("the base resistor is the largest E24 value that saturates at both ambient corners") {
        // Hand-worked at -20 °C and 60 °C (src/method.md "Bipolar drivers", edition 2): at the
        // cold corner hFE_min falls as (T/298.15 K)^1.5 (from memory: the gain exponent of common
        // small-signal models) and Vbe(sat) rises 2 mV/K below 25 °C; at the hot corner Vbe low
        // falls 2 mV/K above 25 °C (common practice, the -2 mV/K junction coefficient).
        const Spec s = hand_spec();
        const Sized z = size_numbers(s);
        const double r_cold = 400.0 * 0.9 * (1.0 + alpha * (-40.0));
        const double i_max = 13.2 / r_cold;  // 0.04344 A
        const double hfe_cold = 100.0 * std::pow(253.15 / 298.15, 1.5);
        CHECK(hfe_cold == Approx(78.23).epsilon(1e-3));
        const double vbe_cold = 0.9 + 0.002 * 45.0;                     // 0.99 V
        const double ib_req = i_max / 10.0;                             // forced gain 10 (hFE 78.2 / 2 = 39 is looser)
        const double rb_max = (3.3 * 0.95 - vbe_cold) / ib_req / 1.05;  // VDD low, Vbe(sat) cold, Rb +5 %
        CHECK(test::flat(z.worst).base_resistor_max_ohm == Approx(rb_max));
        // By hand: rb_max = 2.145 / 0.004344 / 1.05 = 469.6 Ω, just under 470 Ω: the E24 value below is 430 Ω.
        CHECK(rb_max == Approx(469.56).epsilon(0.002));
        REQUIRE(z.r_drive_ohm.has_value());
        CHECK(*z.r_drive_ohm == Approx(430.0));
        // Pin current at the opposite corner: VDD high, Vbe low 0.6 V - 2 mV/K x 35 K at 60 °C, Rb -5 %.
        const double vbe_low_hot = 0.6 - 0.002 * 35.0;
        const double i_pin = (3.3 * 1.05 - vbe_low_hot) / (430.0 * 0.95);
        CHECK(test::flat(z.worst).pin_current_max_a == Approx(i_pin));
        CHECK(z.worst.check(CheckId::pin_current).verdict == Verdict::pass);
        CHECK(z.worst.check(CheckId::pin_current).corner == Corner::hot);
        // Lowest base current and the worst forced gain with 430 Ω, both at the cold corner.
        const double ib_min = (3.3 * 0.95 - vbe_cold) / (430.0 * 1.05);
        CHECK(test::flat(z.worst).base_current_min_a == Approx(ib_min));
        CHECK(test::flat(z.worst).forced_gain_worst == Approx(i_max / ib_min));
        CHECK(z.worst.check(CheckId::transistor_saturation).verdict == Verdict::pass);
        CHECK(z.worst.check(CheckId::transistor_saturation).corner == Corner::cold);
        // Smallest resistor the pin can carry: (3.465 - 0.53) / (8 mA * 0.95), the hot corner's.
        CHECK(test::flat(z.worst).base_resistor_min_ohm == Approx((3.465 - vbe_low_hot) / (0.008 * 0.95)));
    }

    TEST_CASE("hand-worked corners at -40 °C and 85 °C: gain, Vbe(sat), window, pin current and operate") {
        // src/method.md edition 2: hFE x (233.15/298.15)^1.5 = 0.69 at -40 °C (from memory, the
        // exponent 1.5), Vbe(sat) + 2 mV/K x 65 K = +130 mV; at 85 °C Vbe low 0.6 V - 120 mV.
        Spec s = hand_spec();
        s.ambient = {-40.0, 85.0};
        const Sized z = size_numbers(s);
        const auto& f = std::get<BipolarFigures>(z.worst.drive);
        CHECK(f.at[0].hfe_min == Approx(100.0 * std::pow(233.15 / 298.15, 1.5)));
        CHECK(f.at[0].hfe_min == Approx(69.15).epsilon(1e-3));  // "about two thirds"
        CHECK(f.at[1].hfe_min == Approx(100.0));                // above 25 °C the 25 °C value is kept
        CHECK(f.at[0].vbe_sat_v == Approx(0.9 + 0.130));
        CHECK(f.at[1].vbe_low_v == Approx(0.6 - 0.120));
        const double i_cold = 13.2 / (360.0 * (1.0 + alpha * (-60.0)));
        const double i_hot = 13.2 / (360.0 * (1.0 + alpha * 65.0));
        // The window is the intersection: Rb_max of the cold corner, Rb_min of the hot one.
        const double rb_max_cold = (3.135 - 1.03) / (i_cold / 10.0) / 1.05;
        const double rb_max_hot = (3.135 - 0.9) / (i_hot / 10.0) / 1.05;
        CHECK(f.window_max_ohm == Approx(std::min(rb_max_cold, rb_max_hot)));
        CHECK(f.window_min_ohm == Approx((3.465 - 0.48) / (0.008 * 0.95)));
        // Operate: the hot coil at 85 °C needs 9 V x (1 + alpha 65 K); it gets 10.8 V - 0.2 V.
        CHECK(z.worst.check(CheckId::coil_operate).limit == Approx(9.0 * (1.0 + alpha * 65.0)));
        CHECK(z.worst.check(CheckId::coil_operate).corner == Corner::hot);
        // Thermal at the hot corner's current (coil at 85 °C, low tolerance), not the cold coil's.
        const double ib = (3.465 - 0.48) / (*z.r_drive_ohm * 0.95);
        const double tj = 85.0 + (0.2 * i_hot + 0.9 * ib) * 200.0;
        CHECK(z.worst.check(CheckId::transistor_thermal).value == Approx(tj));
    }

    TEST_CASE("the pin's output resistance and the pull-down enter the largest resistor") {
        Spec s = hand_spec();
        s.ambient = {25.0, 25.0};  // device data at their 25 °C values
        s.pin.voh_v = 2.9;
        s.pin.voh_current_a = 0.008;
        s.pulldown_ohm = 47e3;
        const Sized z = size_numbers(s);
        const double i_max = 13.2 / (360.0 * (1.0 + alpha * 5.0));
        // Thevenin from the supply VOH is stated at, by default the lowest VDD (src/method.md
        // edition 2): (3.135 - 2.9) / 8 mA = 29.4 Ω.
        const double r_out = (3.135 - 2.9) / 0.008;
        const double rb_max = ((3.135 - 0.9) / (i_max / 10.0 + 0.9 / 47e3) - r_out) / 1.05;
        CHECK(test::flat(z.worst).pin_r_out_ohm == Approx(29.375));
        CHECK(test::flat(z.worst).base_resistor_max_ohm == Approx(rb_max));
        CHECK(test::flat(z.worst).base_current_min_a ==
              Approx((3.135 - 0.9) / (*z.r_drive_ohm * 1.05 + r_out) - 0.9 / 47e3));
        // With pin.voh_vdd the resistance is taken from that supply instead.
        s.pin.voh_vdd_v = 3.3;
        CHECK(test::flat(size_numbers(s).worst).pin_r_out_ohm == Approx(50.0));
    }

    TEST_CASE("with overdrive 5 the minimum gain a pin can serve is 5 I_coil / I_pin") {
        // Common practice, no single source: drive the base with five times the current the
        // minimum gain needs.
        Spec s = hand_spec();
        s.policy.overdrive = 5;
        const Sized z = size_numbers(s);
        CHECK(test::flat(z.worst).hfe_needed == Approx(5.0 * test::flat(z.worst).coil_current_max_a / 0.008));
    }

    TEST_CASE("with the pin at the supply and Vbe neglected the base resistor is hFE R_coil / 5") {
        // Common practice, no single source: Rb = hFE * R_coil / 5 when the drive voltage equals
        // the coil supply, Vbe is neglected and the base gets five times the minimum current.
        Spec s = hand_spec();
        s.supply.voltage_v = 5.0;
        s.supply.tolerance = 0.0;
        s.ambient = {25.0, 25.0};  // device data at their 25 °C values, coil at its reference
        s.coil.reference_temp_c = 25.0;
        s.coil.tolerance = 0.0;
        s.coil.rated_voltage_v = 5.0;
        s.coil.resistance_ohm = 70.0;
        s.pin.vdd_v = 5.0;
        s.pin.vdd_tolerance = 0.0;
        s.pin.max_current_a = 0.025;
        s.base_resistor.tolerance = 0.0;
        s.policy.overdrive = 5;
        s.policy.forced_gain = 1e4;  // let the overdrive rule bind
        s.transistor = flat_npn(100, 1e-9, 1e-9);
        const Sized z = size_numbers(s);
        CHECK(test::flat(z.worst).base_resistor_max_ohm == Approx(100.0 * 70.0 / 5.0).epsilon(1e-6));
        CHECK(*z.r_drive_ohm == Approx(1300.0));  // E24 value below 1400 Ω
    }

    TEST_CASE("a fixed base resistor is checked, not chosen") {
        Spec s = hand_spec();
        s.base_resistor.value_ohm = 1000.0;
        const Sized z = size_numbers(s);
        CHECK(*z.r_drive_ohm == Approx(1000.0));
        CHECK(z.worst.check(CheckId::transistor_saturation).verdict == Verdict::fail);
        const SizingReport r = size(s, Catalogue{});
        CHECK(r.resistor.fixed);
        CHECK(r.verdict == Verdict::fail);
    }

    TEST_CASE("a pin that cannot drive the transistor fails and says what gain would do") {
        Spec s = hand_spec();
        s.pin.max_current_a = 0.002;
        s.transistor = flat_npn(15);  // hFE 15 / overdrive 2 binds below the forced gain 10
        const SizingReport r = size(s, Catalogue{});
        CHECK(r.verdict == Verdict::fail);
        const Check* pin = r.find_check("pin.current");
        REQUIRE(pin != nullptr);
        CHECK(pin->verdict == Verdict::fail);
        CHECK(pin->message.find("hFE min of at least") != std::string::npos);
        const double hfe_needed = 2.0 * r.quantity("coil_current_max_a").value() / 0.002;
        CHECK(r.quantity("hfe_needed").value() == Approx(hfe_needed));
    }

    TEST_CASE("a coil that cannot operate at the lowest supply is a failed check, not an error") {
        Spec s = hand_spec();
        s.supply.voltage_v = 9.0;
        s.supply.tolerance = 0.10;  // 8.1 V low against 9 V * 1.157 hot must-operate
        const SizingReport r = size(s, Catalogue{});
        const Check* op = r.find_check("coil.operate");
        REQUIRE(op != nullptr);
        CHECK(op->verdict == Verdict::fail);
        CHECK(op->margin.value() < 0);
        CHECK(op->message.find("may not pull in") != std::string::npos);
    }

    TEST_CASE("no clamp always fails the transistor's voltage check") {
        Spec s = hand_spec();
        s.clamp.type = ClampType::none;
        s.clamp.diode.reset();
        const SizingReport r = size(s, Catalogue{});
        const Check* v = r.find_check("transistor.voltage");
        REQUIRE(v != nullptr);
        CHECK(v->verdict == Verdict::fail);
        CHECK_FALSE(v->value.has_value());
        CHECK(v->message.find("limited only by breakdown") != std::string::npos);
        CHECK(r.verdict == Verdict::fail);
    }

    TEST_CASE("a pin below Vbe gives no resistor and failed checks, no NaN") {
        Spec s = hand_spec();
        s.pin.vdd_v = 0.8;
        const SizingReport r = size(s, Catalogue{});
        CHECK_FALSE(r.resistor.value_ohm.has_value());
        CHECK(r.find_check("transistor.saturation")->verdict == Verdict::fail);
        CHECK(r.find_check("pin.current")->verdict == Verdict::fail);
        for (const auto& q : r.quantities) CHECK(std::isfinite(q.value));
    }

    TEST_CASE("the diode clamp peak is the supply plus one diode drop") {
        // Common practice: a plain diode holds the collector about one drop above the supply.
        const Sized z = size_numbers(hand_spec());
        CHECK(test::flat(z.worst).peak_collector_voltage_v == Approx(13.2 + 1.0));
        CHECK(z.worst.check(CheckId::transistor_voltage).limit == Approx(0.75 * 40.0));
    }

    TEST_CASE("properties: more supply never means less coil current; the resistor is the series' best") {
        for (double vs = 3.0; vs <= 48.0; vs *= 1.21) {
            for (const ESeries series : {ESeries::e6, ESeries::e12, ESeries::e24, ESeries::e96}) {
                Spec s = hand_spec();
                s.base_resistor.series = series;
                s.base_resistor.tolerance = eseries_tolerance(series);
                s.supply.voltage_v = vs;
                Spec higher = s;
                higher.supply.voltage_v = vs * 1.01;
                const Sized a = size_numbers(s);
                const Sized b = size_numbers(higher);
                CAPTURE(vs);
                CHECK(test::flat(b.worst).coil_current_max_a >= test::flat(a.worst).coil_current_max_a);
                CHECK(test::flat(b.worst).coil_current_min_a >= test::flat(a.worst).coil_current_min_a);
                if (a.r_drive_ohm) {
                    CHECK(eseries_contains(*a.r_drive_ohm, series));
                    CHECK(*a.r_drive_ohm <= test::flat(a.worst).base_resistor_max_ohm);
                    const auto up = eseries_next_up(*a.r_drive_ohm, series);
                    if (up) CHECK(*up > test::flat(a.worst).base_resistor_max_ohm);
                    // The chosen value saturates the transistor at worst case.
                    CHECK(test::flat(a.worst).forced_gain_worst <= test::flat(a.worst).beta_target * (1 + 1e-12));
                }
            }
        }
    }

    TEST_CASE("the report lists the defaults-independent notes and the cautions") {
        Spec s = hand_spec();
        s.load = LoadSpec{};
        s.load->voltage_v = 230.0;
        s.load->kind = LoadKind::ac;
        s.load->current_a = 2.0;
        const SizingReport r = size(s, Catalogue{});
        bool mains = false;
        for (const auto& c : r.cautions)
            mains = mains || c.find("local electrical codes and licensed practice") != std::string::npos;
        CHECK(mains);
        CHECK(r.cautions.front().find("worst-case estimates") != std::string::npos);
        bool pulldown = false;
        for (const auto& n : r.notes) pulldown = pulldown || n.find("pull-down") != std::string::npos;
        CHECK(pulldown);
    }

    TEST_CASE("a check's margin is its headroom as a fraction of the limit") {
        // Definition (src/method.md, "Report"): (limit - value)/|limit| for an upper bound,
        // (value - limit)/|limit| for a lower one.
        using Bound = CheckValue::Bound;
        CHECK(CheckValue{9.0, 10.0, Verdict::pass, Bound::at_most, true}.margin() == Approx(0.1));
        CHECK(CheckValue{12.0, 10.0, Verdict::fail, Bound::at_most, true}.margin() == Approx(-0.2));
        CHECK(CheckValue{8.0, 10.0, Verdict::fail, Bound::at_least, true}.margin() == Approx(-0.2));
        CHECK(CheckValue{-3.0, -2.0, Verdict::pass, Bound::at_most, true}.margin() == Approx(0.5));
        CHECK(CheckValue{0.0, 0.0, Verdict::pass, Bound::at_most, true}.margin() == 0.0);
        CHECK(CheckValue{1.0, 0.0, Verdict::fail, Bound::at_most, true}.margin() == -1.0);
        CHECK(CheckValue{0.0, 5.0, Verdict::fail, Bound::at_most, false}.margin() == -1.0);
        CHECK(CheckValue{}.margin() == 0.0);  // skipped
    }

    TEST_CASE("a prepared spec gives the same figures, and verdicts-only evaluation the same verdicts") {
        // Yield evaluates a prepared spec with Figures::verdicts; size() the plain form. The
        // worst-case invariant needs the same numbers bit for bit, and the same verdicts.
        std::vector<Spec> specs;
        Spec base = hand_spec();
        base.coil.inductance_h = 0.9;
        specs.push_back(base);
        // Around 7.7 to 9 kHz the rate checks fail on the charge bound tau*I0 yet pass on the
        // exact charge (worked by hand: I0 = 43.5 mA, tau = 2.97 ms, Q = 0.11 mC): the sweep
        // covers a pass on the bound, a pass on the exact charge only, and a failure.
        for (double f : {1.0, 1000.0, 7000.0, 8000.0, 8500.0, 9000.0, 9500.0, 20000.0}) {
            Spec rated = base;
            rated.switching.frequency_hz = f;
            rated.pulldown_ohm = 47e3;
            specs.push_back(rated);
            Spec zener = rated;
            zener.clamp.type = ClampType::diode_zener;
            Zener tz;
            tz.id = "TEST-Z";
            tz.vz_v = 12.0;
            tz.tolerance = 0.05;
            tz.pd_w = 0.5;
            tz.izt_a = 0.02;
            tz.source = "test data";
            zener.clamp.zener = tz;
            specs.push_back(zener);
            Spec resistor = rated;
            resistor.clamp.type = ClampType::diode_resistor;
            resistor.clamp.resistor_ohm = 470.0;
            specs.push_back(resistor);
            Spec released = rated;
            released.coil.max_release_time_s = 0.004;
            released.coil.max_voltage_v = 13.0;
            specs.push_back(released);
        }
        Spec release_only = base;
        release_only.coil.max_release_time_s = 0.01;
        specs.push_back(release_only);
        Spec darlington = base;
        darlington.switching.frequency_hz = 10.0;
        std::get<Bipolar>(darlington.transistor).kind = BipolarKind::darlington;
        std::get<Bipolar>(darlington.transistor).vce_sat = {{0.01, 0.00001, 0.9}, {0.5, 0.0005, 1.1}};
        specs.push_back(darlington);
        Spec no_clamp = base;
        no_clamp.clamp.type = ClampType::none;
        no_clamp.clamp.diode.reset();
        specs.push_back(no_clamp);
        // The contact stage (src/method.md "Contact side"): the same verdicts in every mode, a
        // passing, a warning (slow release, minimum load) and a failing set.
        Spec contacts = base;
        contacts.load = LoadSpec{};
        contacts.load->kind = LoadKind::dc;
        contacts.load->voltage_v = 24.0;
        contacts.load->current_a = 8.0;
        contacts.load->load_class = LoadClass::motor;
        contacts.load->class_given = true;
        RelayPart relay;
        relay.id = "TEST-RELAY";
        relay.contacts = Contacts{};
        relay.contacts->dc = ContactRating{30.0, 10.0};
        relay.contacts->dc_breaking = {{30.0, 10.0}, {60.0, 1.0}};
        relay.contacts->make_current_a = 60.0;
        relay.contacts->min_load = ContactRating{5.0, 0.1};
        contacts.relay = relay;
        specs.push_back(contacts);
        Spec contacts_low = contacts;
        contacts_low.load->current_a = 0.05;
        specs.push_back(contacts_low);
        Spec contacts_high = contacts;
        contacts_high.load->voltage_v = 61.0;
        specs.push_back(contacts_high);
        int rate_verdicts[2] = {0, 0};  // rate checks seen passing, failing in verdicts mode
        Evaluation reused;
        for (Spec& spec : specs) {
            precompute_logs(spec);
            const Prepared prepared = prepare(spec);
            const Sized sized = size_numbers(spec);
            std::vector<Conditions> points{sized.conditions};
            for (double t : {0.0, 0.3, 0.71, 1.0}) {
                Conditions c = sized.conditions;
                const double u = 1.0 - t;
                c.vs_lo_v = c.vs_hi_v = c.vs_lo_v + t * (c.vs_hi_v - c.vs_lo_v);
                c.ta_lo_c = c.ta_hi_c = c.ta_lo_c + u * (c.ta_hi_c - c.ta_lo_c);
                c.r_coil_lo_ohm = c.r_coil_hi_ohm = c.r_coil_lo_ohm + u * (c.r_coil_hi_ohm - c.r_coil_lo_ohm);
                c.vz_lo_v = c.vz_hi_v = c.vz_lo_v + t * (c.vz_hi_v - c.vz_lo_v);
                c.hfe_position = t;
                points.push_back(c);
            }
            for (const Conditions& c : points) {
                for (double rb : {0.0, sized.r_drive_ohm.value_or(1000.0), 270.0}) {
                    CAPTURE(clamp_type_name(spec.clamp.type));
                    CAPTURE(spec.switching.frequency_hz.value_or(0.0));
                    CAPTURE(rb);
                    const Evaluation plain = evaluate(spec, c, rb);
                    const Evaluation all = evaluate(prepared, c, rb);
                    const Evaluation verdicts = evaluate(prepared, c, rb, Figures::verdicts);
                    // Monte Carlo reuses one Evaluation: an earlier evaluation's leftovers must not
                    // change a verdict.
                    evaluate_into(prepared, c, rb, Figures::verdicts, reused);
                    CHECK(test::flat(all).release_time_s == test::flat(plain).release_time_s);
                    CHECK(test::flat(all).clamp_energy_j == test::flat(plain).clamp_energy_j);
                    CHECK(test::flat(all).clamp_power_w == test::flat(plain).clamp_power_w);
                    CHECK(test::flat(all).base_resistor_max_ohm == test::flat(plain).base_resistor_max_ohm);
                    CHECK(test::flat(all).junction_temp_max_c == test::flat(plain).junction_temp_max_c);
                    for (std::size_t k = 0; k < check_count; ++k) {
                        CAPTURE(check_id_name(static_cast<CheckId>(k)));
                        const CheckValue& want = plain.checks.values[k];
                        CHECK(all.checks.values[k].verdict == want.verdict);
                        CHECK(all.checks.values[k].has_value == want.has_value);
                        CHECK(all.checks.values[k].bound == want.bound);
                        CHECK(all.checks.values[k].value == want.value);
                        CHECK(all.checks.values[k].limit == want.limit);
                        CHECK(verdicts.checks.values[k].verdict == want.verdict);
                        CHECK(reused.checks.values[k].verdict == want.verdict);
                    }
                    if (plain.check(CheckId::clamp_power).verdict != Verdict::skip) {
                        ++rate_verdicts[plain.check(CheckId::clamp_power).verdict == Verdict::fail ? 1 : 0];
                    }
                }
            }
        }
        CHECK(rate_verdicts[0] > 0);
        CHECK(rate_verdicts[1] > 0);
    }
}
