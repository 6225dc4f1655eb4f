// Method edition 2, clamp and timing (src/method.md "Clamp (flyback) and timing", "Switching
// timing"): zener and TVS pulse ratings, the diode's repetitive current rating, the clamp
// resistor's tolerance and the switching timing.
#include <doctest/doctest.h>

#include <cmath>
#include <string>

#include "coilfit/report.hpp"
#include "coilfit/sizing.hpp"
#include "io/spec_io.hpp"
#include "support.hpp"

using namespace coilfit;
using doctest::Approx;

namespace {

const io::PartsTable& table() { return test::shipped_table(); }

Spec data(const std::string& name) { return test::load_spec_file(std::string(COILFIT_TEST_DATA_DIR) + "/" + name); }

bool any_note(const SizingReport& r, const std::string& words) {
    for (const auto& n : r.notes) {
        if (n.find(words) != std::string::npos) return true;
    }
    return false;
}

}  // namespace

TEST_SUITE("pulse") {
    TEST_CASE("surge ratings scale as t^-1/2 beyond their points and log-log between them") {
        // Common practice: the thermal impedance of a small junction grows as the square root
        // of the pulse width, so the power it stands falls as t^(-1/2).
        const std::vector<PulsePoint> one{{1e-3, 100.0}};
        CHECK(pulse_rating_w(one, 4e-3) == Approx(50.0));
        CHECK(pulse_rating_w(one, 0.25e-3) == Approx(200.0));
        const std::vector<PulsePoint> two{{1e-4, 40.0}, {8.3e-3, 5.0}};
        CHECK(pulse_rating_w(two, 1e-4) == Approx(40.0));
        CHECK(pulse_rating_w(two, 8.3e-3) == Approx(5.0));
        // Log-log between the points: P = 40 (5/40)^t, t = ln(w/1e-4)/ln(83).
        const double w = 1e-3;
        CHECK(pulse_rating_w(two, w) == Approx(40.0 * std::pow(5.0 / 40.0, std::log(w / 1e-4) / std::log(83.0))));
        CHECK(pulse_rating_w(two, 0.0332) == Approx(2.5));  // beyond: 5 W x sqrt(8.3/33.2)
        CHECK(pulse_rating_w({}, 1e-3) == 0.0);
    }

    TEST_CASE("a 1.28 A solenoid with a 1 W zener fails clamp.pulse; a 400 W TVS passes") {
        const SizingReport zener = size(data("solenoid_zener_1w.json"), table().catalogue);
        const Check* p = zener.find_check("clamp.pulse");
        REQUIRE(p != nullptr);
        CHECK(p->verdict == Verdict::fail);
        // P_pk = Vz_hi I0 against d_pulse P_rated(t_p), t_p = Q / I0 (src/method.md).
        const Evaluation& e = zener.sized.worst;
        const ClampCorner& k = e.clamp_at(e.check(CheckId::clamp_pulse).corner);
        CHECK(k.pulse_peak_w == Approx(k.v.part_peak_v * k.i0_a));
        CHECK(k.pulse_width_s == Approx(k.pulse_energy_j / k.pulse_peak_w));
        CHECK(p->limit.value() == Approx(0.5 * pulse_rating_w(zener.spec.clamp.zener->pulse, k.pulse_width_s)));
        CHECK(zener.verdict == Verdict::fail);
        const SizingReport tvs = size(data("solenoid_tvs.json"), table().catalogue);
        CHECK(tvs.find_check("clamp.pulse")->verdict == Verdict::pass);
        CHECK(tvs.verdict == Verdict::pass);
        // The TVS's clamping line: Vbr max at 1 mA to Vc at Ipp.
        const Tvs& t = *tvs.spec.clamp.tvs;
        const ClampCorner& kt = tvs.sized.worst.clamp_at(Corner::cold);
        const double slope = (t.vc_v - t.vbr_max_v) / (t.ipp_a - 1e-3);
        CHECK(kt.v.part_peak_v == Approx(t.vbr_max_v + slope * (kt.i0_a - 1e-3)));
        CHECK(kt.v.timing_v == Approx(t.vbr_min_v + 0.6));
    }

    TEST_CASE("the clamp options never offer a zener that fails its pulse rating") {
        const SizingReport r = size(data("solenoid_zener_1w.json"), table().catalogue);
        for (const auto& o : r.clamp_options) {
            CAPTURE(o.label);
            if (!o.chosen && o.clamp.type == ClampType::diode_zener) CHECK(o.within_rating);
            if (!o.within_rating) CHECK_FALSE(o.failed_check.empty());
        }
    }

    TEST_CASE("a zener without pulse data warns and names the peak power and the width") {
        Spec s = data("solenoid_zener_1w.json");
        s.clamp.zener->pulse.clear();
        const SizingReport r = size(s, table().catalogue);
        const Check* p = r.find_check("clamp.pulse");
        CHECK(p->verdict == Verdict::warn);
        CHECK_FALSE(p->limit.has_value());
        CHECK(p->message.find("peak into the zener for an equivalent") != std::string::npos);
        CHECK(p->message.find("no pulse rating") != std::string::npos);
    }

    TEST_CASE("the diode's peak current is held to IFRM, else IF(AV); IFSM is only quoted") {
        Spec s = test::load_example("greenhouse-valve.json");
        Diode d = *s.clamp.diode;  // 1N4148: IFRM 450 mA
        s.clamp.diode = d;
        CHECK(size_numbers(s).worst.check(CheckId::diode_current).limit == Approx(0.45));
        d.ifrm_a.reset();
        d.ifsm_a = 1.0;
        s.clamp.diode = d;
        const SizingReport r = size(s, table().catalogue);
        CHECK(r.sized.worst.check(CheckId::diode_current).limit == Approx(d.if_avg_a));
        CHECK(any_note(r, "is a non-repetitive 8.3 ms rating, quoted only"));
    }

    TEST_CASE("the clamp resistor takes its high tolerance for the peak and its low one for timing") {
        Spec s = test::load_example("dust-extractor.json");
        s.clamp.type = ClampType::diode_resistor;
        s.clamp.zener.reset();
        s.clamp.resistor_ohm = 680.0;
        s.clamp.resistor_tolerance = 0.05;
        const Sized z = size_numbers(s);
        const ClampCorner& k = z.worst.clamp.at[0];
        CHECK(k.v.series_ohm == Approx(680.0 * 1.05));
        CHECK(k.v.series_timing_ohm == Approx(680.0 * 0.95));
        CHECK(k.v.peak_v == Approx(k.i0_a * 714.0 + vf_max_at(*s.clamp.diode, k.i0_a).value));
        // The release with the loop at R_coil + Rs (1 - t) (closed form).
        const double r_loop = z.worst.coil.at[0].r_cold_ohm + 646.0;
        const double tau = *s.coil.inductance_h / r_loop;
        const double a = 0.6 / r_loop;
        CHECK(k.release_time_s == Approx(tau * std::log((k.i0_a + a) / (z.worst.coil.release_current_a + a))));
    }

    TEST_CASE("a 100 Hz greenhouse valve fails switching.timing; at 1 Hz it passes") {
        // t_end = tau ln(1 + I0 R / Vc) must fit in the off-time (1 - D)/f (src/method.md).
        Spec s = test::load_example("greenhouse-valve.json");
        s.switching.frequency_hz = 100.0;
        const SizingReport fast = size(s, table().catalogue);
        const Check* t = fast.find_check("switching.timing");
        REQUIRE(t != nullptr);
        CHECK(t->verdict == Verdict::fail);
        CHECK(t->limit.value() == Approx(0.005));  // 50 % of 10 ms
        const ClampCorner& k = fast.sized.worst.clamp.at[0];
        const double r = fast.sized.worst.coil.at[0].r_cold_ohm;
        const double tau = 0.9 / r;
        CHECK(k.current_zero_time_s == Approx(tau * std::log1p(k.i0_a * r / k.v.timing_v)));
        CHECK(t->message.find("to reach zero after turn-off") != std::string::npos);
        s.switching.frequency_hz = 1.0;
        CHECK(size(s, table().catalogue).find_check("switching.timing")->verdict == Verdict::pass);
    }

    TEST_CASE("the operate time is the RL rise to the operate current, checked against the on-time") {
        Spec s = test::load_example("greenhouse-valve.json");
        s.switching.frequency_hz = 10.0;
        s.switching.duty = 0.05;  // 5 ms on
        const Sized z = size_numbers(s);
        const TimingCorner& hot = z.worst.timing.at[1];
        const CoilCorner& coil = z.worst.coil.at[1];
        // t_op = (L / R_hot) ln(V_min / (V_min - V_op)) (closed form, first-order RL).
        const double v_min = z.worst.driver.at[1].coil_voltage_min_v;
        CHECK(hot.operate_time_s == Approx(0.9 / coil.r_hot_ohm * std::log(v_min / (v_min - coil.operate_voltage_v))));
        CHECK(z.worst.check(CheckId::switching_timing).verdict == Verdict::fail);
        CHECK(z.worst.check(CheckId::switching_timing).detail == static_cast<std::uint8_t>(SwitchingCase::on_time));
    }
}
