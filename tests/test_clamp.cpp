// The flyback clamp and release timing (include/coilfit/clamp.hpp, src/method.md "Clamp (flyback)
// and timing"): the closed forms against a numerical integration of the RL decay, the clamp
// voltages of each option, "none", the missing-inductance note and the trade-off table.
#include <doctest/doctest.h>

#include "coilfit/report.hpp"

#include <cmath>
#include <filesystem>
#include <string>
#include <vector>

#include "coilfit/clamp.hpp"
#include "coilfit/sizing.hpp"
#include "flat_figures.hpp"
#include "io/parts_io.hpp"
#include "io/spec_io.hpp"
#include "support.hpp"

using namespace coilfit;
using doctest::Approx;

namespace {

const io::PartsTable& table() { return test::shipped_table(); }

Spec spec_from(const std::string& json) { return io::read_spec(io::parse_spec_text(json, "clamp-test.json"), table()); }

// An irrigation-valve relay of our own: 12 V, 400 ohm, 0.9 H, 1N4148 across it.
std::string valve(const std::string& clamp, const std::string& coil_extra = R"(, "inductance": "0.9H")") {
    return R"({ "schema": "coilfit.spec/1", "name": "greenhouse valve relay, clamp test",
      "supply": { "voltage": "12V", "tolerance": "10%" }, "ambient": { "min": "0C", "max": "50C" },
      "coil": { "rated_voltage": "12V", "resistance": "400R", "tolerance": "10%")" +
           coil_extra + R"( },
      "pin": { "vdd": "3.3V", "vdd_tolerance": "5%", "voh": "2.9V", "voh_current": "8mA", "max_current": "8mA" },
      "transistor": "2N4401", "clamp": )" +
           clamp + R"(, "pulldown": "47k", "switching": { "frequency": "1Hz" } })";
}

// The RL decay through a constant clamp voltage, integrated numerically: L di/dt = -(R i + Vc),
// with the charge q' = i and the coil's heat w' = R i^2 carried along. Classical fourth-order
// Runge-Kutta with a fixed step; crossings are interpolated linearly inside the step.
struct Integrated {
    double release_time_s = 0;
    double end_time_s = 0;
    double charge_c = 0;
    double coil_heat_j = 0;
};

Integrated integrate_decay(double l_h, double r_ohm, double vc_v, double i0_a, double i_rel_a, int steps_per_tau) {
    const double tau = l_h / r_ohm;
    const double h = tau / steps_per_tau;
    struct State {
        double i, q, w;
    };
    auto deriv = [&](const State& s) { return State{-(r_ohm * s.i + vc_v) / l_h, s.i, r_ohm * s.i * s.i}; };
    auto axpy = [](const State& s, double a, const State& d) {
        return State{s.i + a * d.i, s.q + a * d.q, s.w + a * d.w};
    };
    Integrated out;
    State s{i0_a, 0.0, 0.0};
    double t = 0;
    bool released = false;
    for (long n = 0; n < 100L * steps_per_tau; ++n) {
        const State k1 = deriv(s);
        const State k2 = deriv(axpy(s, h / 2, k1));
        const State k3 = deriv(axpy(s, h / 2, k2));
        const State k4 = deriv(axpy(s, h, k3));
        const State next{s.i + h / 6 * (k1.i + 2 * k2.i + 2 * k3.i + k4.i),
                         s.q + h / 6 * (k1.q + 2 * k2.q + 2 * k3.q + k4.q),
                         s.w + h / 6 * (k1.w + 2 * k2.w + 2 * k3.w + k4.w)};
        if (!released && next.i <= i_rel_a) {
            out.release_time_s = t + h * (s.i - i_rel_a) / (s.i - next.i);
            released = true;
        }
        if (next.i <= 0) {
            // The clamp stops conducting at zero current: interpolate the end inside the step.
            const double f = s.i / (s.i - next.i);
            out.end_time_s = t + h * f;
            out.charge_c = s.q + f * (next.q - s.q);
            out.coil_heat_j = s.w + f * (next.w - s.w);
            return out;
        }
        s = next;
        t += h;
    }
    return out;
}

struct DecayCase {
    const char* what;
    double l_h, r_ohm, vc_v, i0_a, i_rel_a;
};

// Our own coils: a 12 V relay with a diode, the same with a 12 V zener, a 24 V relay with a
// diode and 680 ohm, a 24 V contactor with a 15 V zener, a 5 V relay with a Schottky.
const DecayCase decay_cases[] = {
    {"12 V relay, diode", 0.9, 331.7, 0.6, 0.0398, 0.003},
    {"12 V relay, diode + 12 V zener", 0.9, 331.7, 12.0, 0.0398, 0.003},
    {"24 V relay, diode + 680 ohm", 3.3, 873.3 + 680.0, 0.6, 0.0302, 0.00218},
    {"24 V contactor, diode + 15 V zener", 5.0, 113.8, 14.85, 0.232, 0.016},
    {"5 V relay, Schottky", 0.2, 58.05, 0.3, 0.0947, 0.00714},
};

}  // namespace

TEST_SUITE("clamp") {
    TEST_CASE("the closed-form release time, end time and clamp charge agree with an RK4 integration to 0.1 %") {
        // Closed form (src/method.md): t_rel = tau ln((I0 + Vc/R)/(I_rel + Vc/R)), t_end = tau ln(1 + I0 R/Vc),
        // Q = tau I0 - (Vc/R) t_end; reference: RK4 of L di/dt = -(R i + Vc) written in this test.
        for (const DecayCase& c : decay_cases) {
            INFO(c.what);
            const Decay d = rl_decay(c.l_h, c.r_ohm, c.vc_v, c.i0_a, c.i_rel_a);
            const Integrated n = integrate_decay(c.l_h, c.r_ohm, c.vc_v, c.i0_a, c.i_rel_a, 20000);
            REQUIRE(n.end_time_s > 0);
            CHECK(d.tau_s == Approx(c.l_h / c.r_ohm));
            CHECK(d.release_time_s == Approx(n.release_time_s).epsilon(0.001));
            CHECK(d.end_time_s == Approx(n.end_time_s).epsilon(0.001));
            CHECK(d.charge_c == Approx(n.charge_c).epsilon(0.001));
            CHECK(d.release_time_s < d.end_time_s);
        }
    }

    TEST_CASE("the stored energy splits into the clamp energy and the coil's heat") {
        // Energy balance (closed-form physics): 1/2 L I0^2 = Vc Q + R * integral(i^2), with the
        // coil's heat from the RK4 integration above; the resistor clamp's own heat is Rs * integral(i^2).
        for (const DecayCase& c : decay_cases) {
            INFO(c.what);
            const Decay d = rl_decay(c.l_h, c.r_ohm, c.vc_v, c.i0_a, c.i_rel_a);
            const Integrated n = integrate_decay(c.l_h, c.r_ohm, c.vc_v, c.i0_a, c.i_rel_a, 20000);
            CHECK(c.r_ohm * d.i2_integral == Approx(n.coil_heat_j).epsilon(0.001));
            CHECK(clamp_energy(d, c.vc_v, 0.0) + c.r_ohm * d.i2_integral ==
                  Approx(stored_energy(c.l_h, c.i0_a)).epsilon(1e-9));
        }
        // diode + resistor: the loop resistance holds coil and clamp resistor; the clamp takes Vf Q + Rs integral(i^2).
        const double r_coil = 873.3, rs = 680.0, vf = 0.6, i0 = 0.0302;
        const Decay d = rl_decay(3.3, r_coil + rs, vf, i0, 0.00218);
        CHECK(clamp_energy(d, vf, rs) + r_coil * d.i2_integral == Approx(stored_energy(3.3, i0)).epsilon(1e-9));
    }

    TEST_CASE("a coil already below its release current releases at once") {
        const Decay d = rl_decay(0.9, 330.0, 0.6, 0.002, 0.003);
        CHECK(d.release_time_s == 0.0);
        CHECK(d.end_time_s > 0.0);
    }

    TEST_CASE("each clamp option takes the method's clamp voltages at its two corners") {
        const Diode d = *table().catalogue.find_diode("1N4148");
        const Zener z = *table().catalogue.find_zener("1N4742A");
        const double i0 = 0.04;
        const double vf_max = vf_max_at(d, i0).value;
        ClampSpec c;
        c.diode = d;
        c.type = ClampType::diode;  // Vc = Vf(I0) for the peak, the low drop for timing
        ClampVoltages v = test::clamp_voltages_at(c, i0, 11.4, 12.6);
        CHECK(v.limited);
        CHECK(v.peak_v == Approx(vf_max));
        CHECK(v.timing_v == Approx(0.6));
        CHECK(v.series_ohm == 0.0);
        c.type = ClampType::diode_zener;  // Vz_hi + Vf for the peak, Vz_lo + the low drop for timing
        c.zener = z;
        v = test::clamp_voltages_at(c, i0, 11.4, 12.6);
        // Edition 2: above its test current the zener rises Zzt (I0 - Izt) for the peak; the
        // timing takes the bottom of the band (no knee above Izt).
        REQUIRE(z.zzt_ohm.has_value());
        REQUIRE(z.izt_a.has_value());
        REQUIRE(i0 > *z.izt_a);
        CHECK(v.peak_v == Approx(12.6 + *z.zzt_ohm * (i0 - *z.izt_a) + vf_max));
        CHECK(v.timing_v == Approx(11.4 + 0.6));
        // Below its test current the timing voltage takes the knee: Vz_lo - Zzt (Izt - I),
        // or 90 % of Vz_lo without Zzt (common practice).
        const double small = 0.5 * *z.izt_a;
        v = test::clamp_voltages_at(c, small, 11.4, 12.6);
        CHECK(v.timing_v == Approx(11.4 - *z.zzt_ohm * (*z.izt_a - small) + 0.6));
        CHECK(v.peak_v == Approx(12.6 + vf_max_at(d, small).value));
        Zener no_zzt = z;
        no_zzt.zzt_ohm.reset();
        c.zener = no_zzt;
        CHECK(test::clamp_voltages_at(c, small, 11.4, 12.6).timing_v == Approx(0.9 * 11.4 + 0.6));
        c.zener = z;
        c.type = ClampType::diode_resistor;  // I0 Rs + Vf for the peak; Rs joins the loop for timing
        c.zener.reset();
        c.resistor_ohm = 470.0;
        v = test::clamp_voltages_at(c, i0, 0, 0);
        CHECK(v.peak_v == Approx(i0 * 470.0 + vf_max));
        CHECK(v.timing_v == Approx(0.6));
        CHECK(v.series_ohm == 470.0);
        c.type = ClampType::none;
        c.diode.reset();
        c.resistor_ohm.reset();
        CHECK_FALSE(test::clamp_voltages_at(c, i0, 0, 0).limited);
    }

    TEST_CASE("the report's timing uses the cold coil and the zener at its bottom tolerance, the peak its top") {
        const Spec s = spec_from(valve(R"({ "type": "diode_zener", "diode": "1N4148", "zener": "1N4742A" })"));
        const Sized z = size_numbers(s);
        const double alpha = 0.00393;  // IEC 60028
        const double r_cold = 400.0 * 0.9 * (1.0 + alpha * (0.0 - 20.0));
        const double i0 = 13.2 / r_cold;
        const double i_rel = 0.1 * 12.0 / 400.0;
        const double vf_max = vf_max_at(*s.clamp.diode, i0).value;
        // Edition 2: the zener's top tolerance, its rise Zzt (I0 - Izt), and its drift at 50 °C;
        // for timing its bottom tolerance less the drift at 0 °C (where it is lowest).
        const Zener& zr = *s.clamp.zener;
        const double drift_hot = zr.vz_tempco_v_per_k.value_or(0) * (50.0 - 25.0);
        const double drift_cold = zr.vz_tempco_v_per_k.value_or(0) * (0.0 - 25.0);
        const double vz_peak =
            12.0 * 1.05 + zr.zzt_ohm.value_or(0) * (i0 - zr.izt_a.value_or(i0)) + std::max(drift_hot, 0.0);
        CHECK(test::flat(z.worst).peak_collector_voltage_v == Approx(13.2 + vz_peak + vf_max));
        // Closed form (src/method.md) with Vc = Vz_lo + vf_low, worked here independently.
        const double vc = 12.0 * 0.95 + std::min(drift_cold, 0.0) + 0.6;
        const double tau = 0.9 / r_cold;
        CHECK(test::flat(z.worst).release_time_s == Approx(tau * std::log((i0 + vc / r_cold) / (i_rel + vc / r_cold))));
        // Zener power: f Vz_hi Q at the highest clamp voltage, where the zener takes the most energy.
        const double vc_hi = vz_peak + vf_max;
        const double q_hi = tau * i0 - vc_hi / r_cold * tau * std::log1p(i0 * r_cold / vc_hi);
        CHECK(test::flat(z.worst).zener_power_w == Approx(1.0 * vz_peak * q_hi));
        CHECK(test::flat(z.worst).clamp_energy_j == Approx(vc_hi * q_hi));
    }

    TEST_CASE("the release time check compares the longest release with coil.max_release_time") {
        const std::string clamp = R"({ "type": "diode", "diode": "1N4148" })";
        const SizingReport slow =
            size(spec_from(valve(clamp, R"(, "inductance": "0.9H", "max_release_time": "4ms")")), table().catalogue);
        const Check* c = slow.find_check("release.time");
        REQUIRE(c != nullptr);
        CHECK(c->verdict == Verdict::fail);
        CHECK(c->message.find("diode + zener clamp releases faster") != std::string::npos);
        const SizingReport fast =
            size(spec_from(valve(R"({ "type": "diode_zener", "diode": "1N4148", "zener": "1N4742A" })",
                                 R"(, "inductance": "0.9H", "max_release_time": "4ms")")),
                 table().catalogue);
        CHECK(fast.find_check("release.time")->verdict == Verdict::pass);
    }

    TEST_CASE("no clamp always fails: breakdown limits the voltage and the stored energy goes into the transistor") {
        const Spec s =
            spec_from(valve(R"({ "type": "none" })", R"(, "inductance": "0.9H", "max_release_time": "10ms")"));
        const SizingReport r = size(s, table().catalogue);
        CHECK(r.verdict == Verdict::fail);
        const Check* v = r.find_check("transistor.voltage");
        REQUIRE(v != nullptr);
        CHECK(v->verdict == Verdict::fail);
        CHECK(
            v->message ==
            "no clamp: at turn-off the collector voltage is limited only by breakdown, and the stored energy 1/2 L I^2 "
            "(713 µJ) goes into the transistor; fit a diode across the coil");
        // 1/2 L I0^2 with I0 = 13.2 V / 331.704 ohm.
        REQUIRE(r.quantity("stored_energy_j"));
        CHECK(*r.quantity("stored_energy_j") == Approx(0.5 * 0.9 * std::pow(13.2 / 331.704, 2)));
        CHECK_FALSE(r.quantity("release_time_s"));
        CHECK_FALSE(r.quantity("peak_collector_voltage_v"));
        CHECK(r.find_check("release.time")->verdict == Verdict::skip);
        CHECK(r.find_check("release.time")->message.find("without a clamp") != std::string::npos);
        CHECK(r.find_check("clamp.power")->message == "not checked: there is no clamp");
        CHECK(r.clamp_options.empty());
    }

    TEST_CASE("without the inductance timing is omitted and a note says how to get it") {
        const SizingReport r =
            size(spec_from(valve(R"({ "type": "diode", "diode": "1N4148" })", "")), table().catalogue);
        for (const char* key :
             {"release_time_s", "current_zero_time_s", "stored_energy_j", "clamp_energy_j", "clamp_power_w"}) {
            INFO(key);
            CHECK_FALSE(r.quantity(key));
        }
        CHECK(r.quantity("peak_collector_voltage_v"));
        CHECK(r.clamp_options.empty());
        bool note = false;
        for (const std::string& n : r.notes) {
            note = note ||
                   (n.find("no coil inductance") != std::string::npos && n.find("LCR meter") != std::string::npos &&
                    n.find("energised position") != std::string::npos && n.find("ask the maker") != std::string::npos);
        }
        CHECK(note);
        CHECK(r.find_check("release.time")->verdict == Verdict::skip);
    }

    TEST_CASE("with the inductance the report sets the diode beside the zeners that fit the transistor") {
        const Spec s = spec_from(valve(R"({ "type": "diode", "diode": "1N4148" })"));
        const SizingReport r = size(s, table().catalogue);
        REQUIRE(r.clamp_options.size() >= 2);
        const ClampOption& diode = r.clamp_options.front();
        CHECK(diode.label == "diode 1N4148");
        CHECK(diode.chosen);
        REQUIRE(diode.release_time_s);
        CHECK(*diode.release_time_s == Approx(*r.quantity("release_time_s")));
        const double derated = 0.75 * 40.0;  // policy voltage derating of the 2N4401's Vceo
        std::size_t zeners = 0;
        double last_peak = diode.peak_collector_v;
        for (std::size_t k = 1; k < r.clamp_options.size(); ++k) {
            const ClampOption& o = r.clamp_options[k];
            INFO(o.label);
            ++zeners;
            CHECK(o.label.find("zener") != std::string::npos);
            CHECK(o.within_rating);
            CHECK(o.peak_collector_v <= derated);
            CHECK(o.peak_collector_v > last_peak);  // listed from low to high
            last_peak = o.peak_collector_v;
            REQUIRE(o.release_time_s);
            CHECK(*o.release_time_s < *diode.release_time_s);  // the trade: faster release, higher peak
        }
        CHECK(zeners <= 3);
        // The highest zener of the table that fits is shown: 12 V fits (13.2 + 12.6 + Vf < 30 V),
        // 15 V does not (13.2 + 15.75 + Vf > 30 V).
        CHECK(r.clamp_options.back().label.find("(12 V)") != std::string::npos);
    }

    TEST_CASE("every example with a coil inductance gives the release time and the clamp options") {
        namespace fs = std::filesystem;
        std::size_t with_inductance = 0;
        for (const auto& entry : fs::directory_iterator(COILFIT_TEST_EXAMPLES_DIR)) {
            if (entry.path().extension() != ".json") continue;
            if (entry.path().stem().string().find("-board") != std::string::npos) continue;  // coilfit board files
            INFO(entry.path().string());
            const Spec s = io::read_spec(io::load_spec_document(entry.path().string()), table());
            if (!s.coil.inductance_h || s.clamp.type == ClampType::none) continue;
            ++with_inductance;
            const SizingReport r = size(s, table().catalogue);
            CHECK(r.quantity("release_time_s"));
            CHECK(r.quantity("clamp_energy_j"));
            CHECK(r.quantity("stored_energy_j"));
            CHECK(r.clamp_options.size() >= 2);
        }
        CHECK(with_inductance >= 1);
    }
}
