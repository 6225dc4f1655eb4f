// Statistical yield: confidence interval, random numbers, determinism, the worst-case invariant.
#include <doctest/doctest.h>

#include <cmath>
#include <string>

#include "coilfit/yield.hpp"
#include "flat_figures.hpp"
#include "io/parts_io.hpp"
#include "io/spec_io.hpp"
#include "support.hpp"

using namespace coilfit;

namespace {

const io::PartsTable& table() { return test::shipped_table(); }

Spec load(const std::string& path) { return io::read_spec(io::load_spec_document(path), table()); }
Spec example(const char* name) { return load(std::string(COILFIT_TEST_EXAMPLES_DIR) + "/" + name); }
Spec data(const char* name) { return load(std::string(COILFIT_TEST_DATA_DIR) + "/" + name); }

// Standard normal distribution function in closed form: Phi(z) = erfc(-z / sqrt 2) / 2.
double phi(double z) { return 0.5 * std::erfc(-z / std::sqrt(2.0)); }

// Every corner of the worst-case box (each input at 0 or 1 of its band): 2^7 points.
template <typename F>
void for_each_vertex(F f) {
    for (unsigned mask = 0; mask < (1U << yield_input_count); ++mask) {
        BandPositions t{};
        for (std::size_t s = 0; s < yield_input_count; ++s) t[s] = (mask >> s) & 1U ? 1.0 : 0.0;
        f(t);
    }
}

bool same_counts(const YieldResult& a, const YieldResult& b) {
    if (a.passed != b.passed || a.checks.size() != b.checks.size()) return false;
    for (std::size_t i = 0; i < a.checks.size(); ++i) {
        if (a.checks[i].id != b.checks[i].id || a.checks[i].failed != b.checks[i].failed ||
            a.checks[i].evaluated != b.checks[i].evaluated) {
            return false;
        }
    }
    return true;
}

}  // namespace

TEST_SUITE("yield") {
    TEST_CASE("the Wilson score interval matches hand-computed values") {
        // Source: Wilson, E. B. (1927), "Probable inference, the law of succession, and
        // statistical inference", J. Am. Stat. Assoc. 22, 209-212. With p = x/n and z = 1.959964
        // (z^2 = 3.841459):  centre = (p + z^2/2n) / (1 + z^2/n),
        //                    half   = z / (1 + z^2/n) * sqrt(p(1-p)/n + z^2/4n^2).
        SUBCASE("8 of 10") {
            // z^2/n = 0.3841459, 1 + z^2/n = 1.3841459; centre = (0.8 + 0.1920729) / 1.3841459
            // = 0.716740; p(1-p)/n = 0.016, z^2/4n^2 = 0.0096036, sqrt(0.0256036) = 0.1600113,
            // half = 1.959964 * 0.1600113 / 1.3841459 = 0.226578; [0.490162, 0.943318].
            const Interval i = wilson_interval(8, 10);
            CHECK(i.lo == doctest::Approx(0.490162).epsilon(1e-5));
            CHECK(i.hi == doctest::Approx(0.943318).epsilon(1e-5));
        }
        SUBCASE("all of 10: the lower bound is n / (n + z^2)") {
            // p = 1: centre + half = 1 exactly; lower = n/(n + z^2) = 10 / 13.841459 = 0.722467.
            const Interval i = wilson_interval(10, 10);
            CHECK(i.lo == doctest::Approx(0.722467).epsilon(1e-5));
            CHECK(i.hi == 1.0);
        }
        SUBCASE("none of 10: the upper bound is z^2 / (n + z^2)") {
            // p = 0: upper = z^2 / (n + z^2) = 3.841459 / 13.841459 = 0.277533.
            const Interval i = wilson_interval(0, 10);
            CHECK(i.lo == 0.0);
            CHECK(i.hi == doctest::Approx(0.277533).epsilon(1e-5));
        }
        SUBCASE("100 000 of 100 000, a yield run where every sample passed") {
            // lower = 100000 / 100003.841459 = 0.9999616.
            const Interval i = wilson_interval(100000, 100000);
            CHECK(i.lo == doctest::Approx(0.99996159).epsilon(1e-8));
            CHECK(i.hi == 1.0);
        }
        SUBCASE("the worked examples of a comparison of intervals") {
            // Newcombe, R. G. (1998), "Two-sided confidence intervals for the single proportion:
            // comparison of seven methods", Stat. Med. 17, 857-872, Table I, Wilson score
            // column (values from memory; they agree with the hand computation by the formula
            // above to the 4 decimals printed there).
            const Interval a = wilson_interval(81, 263);
            CHECK(a.lo == doctest::Approx(0.2553).epsilon(2e-4));
            CHECK(a.hi == doctest::Approx(0.3662).epsilon(2e-4));
            const Interval b = wilson_interval(15, 148);
            CHECK(b.lo == doctest::Approx(0.0624).epsilon(1e-3));
            CHECK(b.hi == doctest::Approx(0.1605).epsilon(1e-3));
            const Interval c = wilson_interval(0, 20);
            CHECK(c.lo == 0.0);
            CHECK(c.hi == doctest::Approx(0.1611).epsilon(1e-3));
            const Interval d = wilson_interval(1, 29);
            CHECK(d.lo == doctest::Approx(0.0061).epsilon(1e-2));
            CHECK(d.hi == doctest::Approx(0.1718).epsilon(1e-3));
        }
    }

    TEST_CASE("the generator is SplitMix64") {
        // The first output of SplitMix64 seeded with 0 is mix(0 + 0x9e3779b97f4a7c15)
        // = 0xe220a8397b1dcdaf (Steele, Lea, Flood 2014; reference value from memory).
        CHECK(splitmix64_mix(0x9e3779b97f4a7c15ULL) == 0xe220a8397b1dcdafULL);
        CHECK(unit_uniform(0) == 0.0);
        CHECK(unit_uniform(~std::uint64_t{0}) == 1.0 - 0x1.0p-53);
        // Counter-based: a draw depends only on (seed, sample, stream).
        CHECK(random_bits(7, 123456, 3) == random_bits(7, 123456, 3));
        CHECK(random_bits(7, 123456, 3) != random_bits(7, 123457, 3));
        CHECK(random_bits(7, 123456, 3) != random_bits(7, 123456, 4));
        CHECK(random_bits(7, 123456, 3) != random_bits(8, 123456, 3));
    }

    TEST_CASE("uniform draws have the mean and variance of a uniform distribution") {
        // Closed form: mean 1/2, variance 1/12; the mean of n draws has sigma sqrt(1/12n).
        constexpr std::uint64_t n = 200000;
        for (std::uint64_t stream = 0; stream < yield_input_count; ++stream) {
            double sum = 0, sum2 = 0;
            for (std::uint64_t i = 0; i < n; ++i) {
                const double u = unit_uniform(random_bits(1, i, stream));
                sum += u;
                sum2 += u * u;
            }
            const double mean = sum / n;
            const double var = sum2 / n - mean * mean;
            CHECK(std::abs(mean - 0.5) < 5.0 * std::sqrt(1.0 / 12.0 / n));
            CHECK(var == doctest::Approx(1.0 / 12.0).epsilon(0.01));
        }
    }

    TEST_CASE("the normal quantile inverts the normal distribution function") {
        // Phi in closed form through erfc; Acklam's approximation is good to about 1.2e-9.
        for (double p = 1e-6; p < 1.0; p = p < 0.01 || p > 0.98 ? p * 1.7 : p + 0.01) {
            if (p >= 1.0) break;
            const double z = normal_quantile(p);
            CHECK(phi(z) == doctest::Approx(p).epsilon(1e-8));
        }
        CHECK(normal_quantile(0.5) == doctest::Approx(0.0).epsilon(1e-12));
        // 97.5 % point of the standard normal, 1.959964 (statistical tables).
        CHECK(normal_quantile(0.975) == doctest::Approx(1.959964).epsilon(1e-6));
    }

    TEST_CASE("the truncated normal stays within 3 sigma and has the truncated distribution's spread") {
        CHECK(truncated_normal_3sigma(0.0) == doctest::Approx(-3.0).epsilon(1e-9));
        CHECK(truncated_normal_3sigma(0.5) == doctest::Approx(0.0).epsilon(1e-9));
        CHECK(truncated_normal_3sigma(1.0 - 0x1.0p-53) == doctest::Approx(3.0).epsilon(1e-9));
        // P(|Z| < 1 | |Z| < 3) = (Phi(1) - Phi(-1)) / (Phi(3) - Phi(-3)) = 0.682689 / 0.997300
        // = 0.684538 (closed form through erfc, computed here).
        const double expected = (phi(1) - phi(-1)) / (phi(3) - phi(-3));
        constexpr std::uint64_t n = 200000;
        std::uint64_t inside = 0;
        for (std::uint64_t i = 0; i < n; ++i) {
            const double z = truncated_normal_3sigma(unit_uniform(random_bits(5, i, 0)));
            REQUIRE(std::abs(z) <= 3.0);
            if (std::abs(z) < 1.0) ++inside;
        }
        const double rate = static_cast<double>(inside) / n;
        CHECK(std::abs(rate - expected) < 5.0 * std::sqrt(expected * (1 - expected) / n));
    }

    TEST_CASE("a sample collapses every range to one point inside the worst-case box") {
        const Spec spec = data("yield_zener_gain.json");
        const Conditions box = worst_case_conditions(spec);
        for (Distribution d : {Distribution::uniform, Distribution::normal}) {
            for (std::uint64_t i = 0; i < 20000; ++i) {
                const Conditions c = conditions_at(box, sample_positions(3, i, d));
                REQUIRE(c.vs_lo_v == c.vs_hi_v);
                REQUIRE(c.ta_lo_c == c.ta_hi_c);
                REQUIRE(c.vdd_lo_v == c.vdd_hi_v);
                REQUIRE(c.r_coil_lo_ohm == c.r_coil_hi_ohm);
                REQUIRE(c.rb_lo_factor == c.rb_hi_factor);
                REQUIRE(c.vz_lo_v == c.vz_hi_v);
                REQUIRE((c.vs_lo_v >= box.vs_lo_v && c.vs_lo_v <= box.vs_hi_v));
                REQUIRE((c.ta_lo_c >= box.ta_lo_c && c.ta_lo_c <= box.ta_hi_c));
                REQUIRE((c.vdd_lo_v >= box.vdd_lo_v && c.vdd_lo_v <= box.vdd_hi_v));
                REQUIRE((c.r_coil_lo_ohm >= box.r_coil_lo_ohm && c.r_coil_lo_ohm <= box.r_coil_hi_ohm));
                REQUIRE((c.rb_lo_factor >= box.rb_lo_factor && c.rb_lo_factor <= box.rb_hi_factor));
                REQUIRE((c.vz_lo_v >= box.vz_lo_v && c.vz_lo_v <= box.vz_hi_v));
                REQUIRE((c.hfe_position >= 0.0 && c.hfe_position <= 1.0));
            }
        }
        // The centre of the box is the nominal point: 12 V, 20 C, 5 V, 400 ohm, factor 1, 12 V.
        BandPositions mid{};
        mid.fill(0.5);
        const Conditions c = conditions_at(box, mid);
        CHECK(c.vs_lo_v == doctest::Approx(12.0));
        CHECK(c.ta_lo_c == doctest::Approx(20.0));
        CHECK(c.vdd_lo_v == doctest::Approx(5.0));
        CHECK(c.r_coil_lo_ohm == doctest::Approx(400.0));
        CHECK(c.rb_lo_factor == doctest::Approx(1.0));
        CHECK(c.vz_lo_v == doctest::Approx(spec.clamp.zener->vz_v));
    }

    TEST_CASE("the same seed and count give the same result, for any number of jobs") {
        const Spec spec = data("yield_marginal_operate.json");
        YieldSettings s;
        s.samples = 150001;  // more than two chunks, not a multiple of one
        s.seed = 42;
        s.conditions = ConditionsMode::sampled;  // conditions drawn too: failures depend on the seed
        s.jobs = 1;
        const YieldResult one = run_yield(spec, s);
        const YieldResult again = run_yield(spec, s);
        s.jobs = 2;
        const YieldResult two = run_yield(spec, s);
        s.jobs = 3;
        const YieldResult three = run_yield(spec, s);
        CHECK(one.settings.samples == 150001);
        CHECK(same_counts(one, again));
        CHECK(same_counts(one, two));
        CHECK(same_counts(one, three));
        CHECK(one.pass_rate == two.pass_rate);
        // Another seed draws other samples (and, here, another count of failures).
        s.seed = 43;
        const YieldResult other = run_yield(spec, s);
        CHECK(other.passed != one.passed);
        // The first samples do not depend on how many follow.
        s.seed = 42;
        s.samples = 1000;
        s.jobs = 1;
        const YieldCounts head =
            count_samples(prepare(spec), one.design.conditions, one.design.r_drive_ohm.value_or(0), s, 0, 1000);
        const YieldResult short_run = run_yield(spec, s);
        CHECK(short_run.passed == head.passed);
    }

    TEST_CASE("when the worst case passes, every sample passes") {
        // The invariant of extreme-value analysis: the worst case bounds every point of the box.
        // Checked on every corner of the box (the most extreme samples there are) and on
        // random samples of both distributions, for the examples and the yield test specs, and
        // for the greenhouse spec with every transistor of the table that passes there.
        std::vector<Spec> specs{example("greenhouse-valve.json"), example("dust-extractor.json"),
                                example("lab-valve-manifold.json"), data("yield_zener_gain.json")};
        const Spec base = example("greenhouse-valve.json");
        for (const Bipolar& b : table().catalogue.bipolars) {
            Spec s = base;
            s.transistor = b;
            specs.push_back(s);
        }
        int passing_specs = 0;
        for (const Spec& spec : specs) {
            const Sized design = size_numbers(spec);
            if (!design.worst.passes()) continue;
            ++passing_specs;
            CAPTURE(spec.name);
            CAPTURE(origin(spec.transistor).id);
            const double rb = design.r_drive_ohm.value_or(0.0);
            for_each_vertex([&](const BandPositions& t) {
                REQUIRE(evaluate(spec, conditions_at(design.conditions, t), rb).passes());
            });
            for (Distribution d : {Distribution::uniform, Distribution::normal}) {
                YieldSettings st;
                st.samples = 5000;
                st.distribution = d;
                const YieldResult r = run_yield(spec, st);
                CHECK(r.passed == st.samples);
                CHECK(r.pass_rate == 1.0);
                CHECK(!r.most_frequent_failure);
                for (const CheckYield& c : r.checks) CHECK(c.pass_rate == 1.0);
            }
        }
        CHECK(passing_specs >= 6);
    }

    TEST_CASE("a check that fails at worst case fails in samples near its corner") {
        // Must-operate 85 % with a hot coil: coil.operate fails at worst case by about 15 %.
        const Spec spec = data("yield_marginal_operate.json");
        const Sized design = size_numbers(spec);
        REQUIRE(design.worst.check(CheckId::coil_operate).verdict == Verdict::fail);
        const double rb = design.r_drive_ohm.value_or(0.0);
        // Its corner: lowest supply, highest ambient, highest coil resistance.
        BandPositions corner{};
        corner.fill(0.5);
        corner[static_cast<std::size_t>(YieldInput::supply)] = 0.0;
        corner[static_cast<std::size_t>(YieldInput::ambient)] = 1.0;
        corner[static_cast<std::size_t>(YieldInput::coil_resistance)] = 1.0;
        const Evaluation at_corner = evaluate(spec, conditions_at(design.conditions, corner), rb);
        CHECK(at_corner.check(CheckId::coil_operate).verdict == Verdict::fail);
        // Samples within a tenth of each band from that corner all fail it.
        for (std::uint64_t i = 0; i < 2000; ++i) {
            BandPositions t = sample_positions(9, i, Distribution::uniform);
            t[0] = 0.1 * t[0];
            t[1] = 1.0 - 0.1 * t[1];
            t[3] = 1.0 - 0.1 * t[3];
            REQUIRE(evaluate(spec, conditions_at(design.conditions, t), rb).check(CheckId::coil_operate).verdict ==
                    Verdict::fail);
        }
        // The worst corner over all corners of the box is no better than the worst case and
        // fails too (the worst case may be a little worse: it takes Vce(sat) at the highest
        // current, which a single point of the box does not reach together with the lowest supply).
        double worst_margin = 1e9;
        for_each_vertex([&](const BandPositions& t) {
            const Evaluation e = evaluate(spec, conditions_at(design.conditions, t), rb);
            worst_margin = std::min(worst_margin, e.check(CheckId::coil_operate).margin());
        });
        CHECK(worst_margin < 0.0);
        CHECK(worst_margin >= design.worst.check(CheckId::coil_operate).margin());
        CHECK(worst_margin == doctest::Approx(design.worst.check(CheckId::coil_operate).margin()).epsilon(0.02));
        // And the yield run names it (conditions drawn, as the corner test above draws them).
        YieldSettings st;
        st.samples = 20000;
        st.conditions = ConditionsMode::sampled;
        const YieldResult r = run_yield(spec, st);
        CHECK(r.passed < st.samples);
        CHECK(r.passed > 0);
        REQUIRE(r.most_frequent_failure);
        CHECK(*r.most_frequent_failure == CheckId::coil_operate);
        CHECK(r.interval.lo <= r.pass_rate);
        CHECK(r.interval.hi >= r.pass_rate);
    }

    TEST_CASE(
        "by default the conditions stay at each check's worst corner: a design failing only at the lowest supply "
        "yields 0 %") {
        // src/method.md "Statistical yield": yield is about part-to-part spread. The marginal
        // design fails coil.operate at the lowest supply with a hot coil; every unit meets that
        // supply, so none is guaranteed: 0 % held at the corner, clearly more with the
        // conditions drawn (edition 1's --conditions sampled).
        const Spec spec = data("yield_marginal_operate.json");
        YieldSettings st;
        st.samples = 20000;
        const YieldResult held = run_yield(spec, st);
        CHECK(held.settings.conditions == ConditionsMode::worst);
        CHECK(held.pass_rate < 0.01);
        st.conditions = ConditionsMode::sampled;
        const YieldResult drawn = run_yield(spec, st);
        CHECK(drawn.pass_rate > 0.3);
        CHECK(drawn.pass_rate > held.pass_rate + 0.3);
    }

    TEST_CASE("checks skipped by the spec are left out of the per-check rates") {
        // yield_marginal_operate.json gives no inductance, switching frequency, coil maximum
        // voltage or release time: those checks are skipped and not listed.
        const Spec spec = data("yield_marginal_operate.json");
        YieldSettings st;
        st.samples = 100;
        const YieldResult r = run_yield(spec, st);
        for (const CheckYield& c : r.checks) {
            CHECK(c.id != CheckId::release_time);
            CHECK(c.id != CheckId::coil_overvoltage);
            CHECK(c.id != CheckId::clamp_power);
            CHECK(c.evaluated == 100);
        }
        // The nine edition-1 checks that apply: the twelve less the three skipped above.
        CHECK(r.checks.size() == 9);
    }

    TEST_CASE("a design with no base resistor fails every sample") {
        // The garage-door example: no E24 value serves both the gain and the pin's current.
        const Spec spec = example("garage-door.json");
        YieldSettings st;
        st.samples = 1000;
        const YieldResult r = run_yield(spec, st);
        CHECK(!r.design.worst.passes());
        CHECK(r.passed == 0);
        CHECK(r.pass_rate == 0.0);
        CHECK(r.interval.lo == 0.0);
        REQUIRE(r.most_frequent_failure);
    }
}
