// The turn-off transient the plot draws (include/coilfit/transient.hpp): the sampled coil current
// against hand-worked values of the closed-form RL decay and against the loop equation itself,
// the collector voltage's steps, the figures of a sized report, and the SVG's refusal without an
// inductance.
#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>
#include <string>

#include "coilfit/report.hpp"
#include "coilfit/transient.hpp"
#include "io/plot_svg.hpp"
#include "support.hpp"

using namespace coilfit;
using doctest::Approx;

namespace {

// A hand-worked loop: L = 1 H, R = 100 ohm (tau = 10 ms), I0 = 100 mA, a 10 V clamp (Vc/R = 100 mA).
TurnOff hand_worked() {
    TurnOff t;
    t.i0_a = 0.1;
    t.l_h = 1.0;
    t.r_coil_ohm = 100.0;
    t.release_current_a = 0.05;
    t.v_on_v = 0.2;
    t.vc_timing_v = 10.0;
    t.vs_hi_v = 12.0;
    t.i0_peak_a = 0.1;
    t.r_coil_peak_ohm = 100.0;
    t.vc_peak_v = 10.0;
    return t;
}

double value_at(const std::vector<SamplePoint>& pts, double t_s) {
    const auto it =
        std::find_if(pts.begin(), pts.end(), [t_s](const SamplePoint& p) { return std::abs(p.t_s - t_s) < 1e-12; });
    REQUIRE(it != pts.end());
    return it->value;
}

}  // namespace

TEST_SUITE("transient") {
    TEST_CASE("the sampled coil current follows the closed-form RL decay at hand-worked points") {
        // Closed form of L di/dt = -(R i + Vc): i(t) = (I0 + Vc/R) e^(-t/tau) - Vc/R; here
        // i(t) = 0.2 e^(-t/10ms) - 0.1 A. Worked by hand: i(10 ms ln(4/3)) = 0.2 * 3/4 - 0.1 = 50 mA;
        // i(10 ms ln 2) = 0 (t0 = tau ln(1 + I0 R/Vc) = 10 ms ln 2 = 6.931 ms); i(10 ms ln(8/7)) = 75 mA.
        const TurnOff t = hand_worked();
        CHECK(decay_current_a(1.0, 100.0, 10.0, 0.1, 0.010 * std::log(4.0 / 3.0)) == Approx(0.050).epsilon(1e-12));
        CHECK(decay_current_a(1.0, 100.0, 10.0, 0.1, 0.010 * std::log(8.0 / 7.0)) == Approx(0.075).epsilon(1e-12));
        CHECK(decay_end_s(1.0, 100.0, 10.0, 0.1) == Approx(0.010 * std::log(2.0)).epsilon(1e-12));
        CHECK(decay_current_a(1.0, 100.0, 10.0, 0.1, -0.001) == 0.1);  // before turn-off
        CHECK(decay_current_a(1.0, 100.0, 10.0, 0.1, 0.008) == 0.0);   // the clamp has stopped conducting

        const TurnOffSeries s = sample_turn_off(t, -0.001, 0.008, 91);
        // The release time is where i = 50 mA: 10 ms ln(4/3) = 2.877 ms, and it is one of the samples.
        CHECK(s.release_time_s == Approx(0.010 * std::log(4.0 / 3.0)).epsilon(1e-12));
        CHECK(value_at(s.current, s.release_time_s) == Approx(0.050).epsilon(1e-12));
        CHECK(s.current_end_s == Approx(0.010 * std::log(2.0)).epsilon(1e-12));
        CHECK(value_at(s.current, s.current_end_s) == Approx(0.0).epsilon(1e-12));
        CHECK(value_at(s.current, 0.0) == 0.1);
        // Evenly spaced samples every 0.1 ms: at 1 ms, i = 0.2 e^-0.1 - 0.1 = 80.97 mA (by hand).
        CHECK(value_at(s.current, 0.001) == Approx(0.2 * std::exp(-0.1) - 0.1).epsilon(1e-9));
        CHECK(value_at(s.current, 0.001) == Approx(0.08097).epsilon(1e-4));
    }

    TEST_CASE("the sampled current satisfies the loop equation L di/dt + R i + Vc = 0 while the clamp conducts") {
        // Kirchhoff's voltage law around coil and clamp, checked by central differences on a
        // fine sampling (not the closed form): the residual stays below 0.1 % of Vc.
        const TurnOff t = hand_worked();
        const TurnOffSeries s = sample_turn_off(t, 0.0, turn_off_duration_s(t), 4001);
        for (std::size_t k = 1; k + 1 < s.current.size(); ++k) {
            const SamplePoint& a = s.current[k - 1];
            const SamplePoint& b = s.current[k];
            const SamplePoint& c = s.current[k + 1];
            if (c.t_s >= s.current_end_s || a.t_s <= 0.0) continue;
            const double didt = (c.value - a.value) / (c.t_s - a.t_s);
            CHECK(std::abs(t.l_h * didt + t.r_coil_ohm * b.value + t.vc_timing_v) < 1e-3 * t.vc_timing_v);
        }
    }

    TEST_CASE("the collector steps up to supply plus clamp at turn-off and back to the supply when the current ends") {
        TurnOff t = hand_worked();
        const TurnOffSeries s = sample_turn_off(t, -0.001, 0.008, 50);
        // At t = 0 two points: the on-state drop, then Vs_hi + Vc = 22 V.
        const auto at0 =
            std::find_if(s.voltage.begin(), s.voltage.end(), [](const SamplePoint& p) { return p.t_s == 0.0; });
        REQUIRE(at0 + 1 != s.voltage.end());
        CHECK(at0->value == 0.2);
        CHECK((at0 + 1)->value == Approx(22.0));
        CHECK(s.peak_v == Approx(22.0));
        CHECK(s.voltage.back().value == 12.0);
        // With a series resistor (diode + resistor clamp) the peak is Vs_hi + Vf + I0 Rs and
        // falls with the current: 12 + 0.7 + 0.1 * 200 = 32.7 V.
        t.vc_peak_v = 0.7;
        t.r_series_peak_ohm = 200.0;
        const TurnOffSeries r = sample_turn_off(t, 0.0, 0.008, 50);
        CHECK(r.peak_v == Approx(32.7));
        CHECK(r.voltage_end_s == Approx(1.0 / 300.0 * std::log1p(0.1 * 300.0 / 0.7)));
    }

    TEST_CASE("each clamp option's turn-off gives the release time and peak the report quotes") {
        // The report's figures come from the clamp stage (clamp.cpp, rl_decay); the series from
        // transient.cpp: two paths to the same closed form must agree.
        const Spec spec = test::load_example("dust-extractor.json");
        const SizingReport r = size(spec, test::shipped_table().catalogue);
        REQUIRE(r.clamp_options.size() >= 2);
        for (const ClampOption& o : r.clamp_options) {
            INFO(o.label);
            REQUIRE(o.turn_off.has_value());
            REQUIRE(o.release_time_s.has_value());
            const TurnOffSeries s = sample_turn_off(*o.turn_off, 0.0, turn_off_duration_s(*o.turn_off), 64);
            CHECK(s.release_time_s == Approx(*o.release_time_s).epsilon(1e-9));
            CHECK(s.peak_v == Approx(o.peak_collector_v).epsilon(1e-9));
            CHECK(o.turn_off->i0_a == Approx(r.sized.worst.coil_current_max_a()));
        }
    }

    TEST_CASE("the plot needs the coil inductance") {
        Spec spec = test::load_example("greenhouse-valve.json");
        spec.coil.inductance_h.reset();
        const SizingReport r = size(spec, test::shipped_table().catalogue);
        CHECK_THROWS_WITH_AS((void)io::turn_off_svg(r),
                             "--plot: the turn-off transient needs the coil inductance; give coil.inductance",
                             InputError);
    }

    TEST_CASE("the plot escapes the channel's name and draws both panels") {
        Spec spec = test::load_example("greenhouse-valve.json");
        spec.name = "valve <K2> & pump";
        const std::string svg = io::turn_off_svg(size(spec, test::shipped_table().catalogue));
        CHECK(svg.find("valve &lt;K2&gt; &amp; pump") != std::string::npos);
        CHECK(svg.find("<K2>") == std::string::npos);
        CHECK(svg.find("id=\"panel-current\"") != std::string::npos);
        CHECK(svg.find("id=\"panel-voltage\"") != std::string::npos);
    }
}
