#include "coilfit/yield.hpp"

#include <algorithm>
#include <atomic>
#include <cmath>
#include <limits>
#include <thread>

namespace coilfit {
namespace {

// 2^64 / golden ratio, odd: the SplitMix64 increment (Steele, Lea, Flood 2014).
constexpr std::uint64_t golden_gamma = 0x9e3779b97f4a7c15ULL;

// Phi(-3) = erfc(3 / sqrt 2) / 2, the lower tail cut of a normal truncated at 3 sigma
// (closed form; the value is checked against std::erfc in the tests).
constexpr double phi_minus_3 = 0.0013498980316300946;

// Samples per unit of work handed to a thread; also the progress granularity.
constexpr std::uint64_t chunk_samples = 1U << 16;

// Samples drawn together before they are evaluated (see count_samples).
constexpr std::size_t draw_block = 64;

// Each stream (one per input) is a SplitMix64 sequence of its own, seeded by hashing the user's
// seed with the stream number; sample i takes the (i+1)-th output of its stream.
std::uint64_t stream_key(std::uint64_t seed, std::uint64_t stream) {
    return splitmix64_mix(splitmix64_mix(seed) + golden_gamma * (stream + 1));
}

std::uint64_t stream_bits(std::uint64_t key, std::uint64_t sample) {
    return splitmix64_mix(key + golden_gamma * (sample + 1));
}

inline double acklam_quantile(double p) {
    // Acklam, P. J. (2003), "An algorithm for computing the inverse normal cumulative
    // distribution function": rational approximations in a central region and two tails.
    // Coefficients from memory; the tests check the round trip against std::erfc.
    constexpr double a[] = {-3.969683028665376e+01, 2.209460984245205e+02,  -2.759285104469687e+02,
                            1.383577518672690e+02,  -3.066479806614716e+01, 2.506628277459239e+00};
    constexpr double b[] = {-5.447609879822406e+01, 1.615858368580409e+02, -1.556989798598866e+02,
                            6.680131188771972e+01, -1.328068155288572e+01};
    constexpr double c[] = {-7.784894002430293e-03, -3.223964580411365e-01, -2.400758277161838e+00,
                            -2.549732539343734e+00, 4.374664141464968e+00,  2.938163982698783e+00};
    constexpr double d[] = {7.784695709041462e-03, 3.224671290700398e-01, 2.445134137142996e+00, 3.754408661907416e+00};
    constexpr double p_low = 0.02425;
    if (!(p > 0)) return -std::numeric_limits<double>::infinity();
    if (!(p < 1)) return std::numeric_limits<double>::infinity();
    auto tail = [&](double q) {
        return (((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) /
               ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1.0);
    };
    if (p < p_low) return tail(std::sqrt(-2.0 * std::log(p)));
    if (p > 1.0 - p_low) return -tail(std::sqrt(-2.0 * std::log1p(-p)));
    const double q = p - 0.5;
    const double r = q * q;
    return (((((a[0] * r + a[1]) * r + a[2]) * r + a[3]) * r + a[4]) * r + a[5]) * q /
           (((((b[0] * r + b[1]) * r + b[2]) * r + b[3]) * r + b[4]) * r + 1.0);
}

inline double truncated_z(double u) {
    // Inversion restricted to [Phi(-3), Phi(3)]; the clamp keeps the approximation's last bits
    // from stepping outside the band.
    const double p = phi_minus_3 + u * (1.0 - 2.0 * phi_minus_3);
    return std::clamp(acklam_quantile(p), -3.0, 3.0);
}

inline double position_of(YieldInput input, double u, Distribution distribution) {
    if (distribution == Distribution::uniform) return u;
    const double z = truncated_z(u);
    if (input == YieldInput::gain || input == YieldInput::rds_on) {
        // Normal about the typical value (position 1) with the limit at -3 sigma; beyond typical
        // the value is taken at typical.
        return z >= 0 ? 1.0 : 1.0 + z * (1.0 / 3.0);
    }
    // Centred on the band, half-width at 3 sigma: -3 -> 0, +3 -> 1.
    return std::clamp(0.5 + z * (1.0 / 6.0), 0.0, 1.0);
}

double at(double lo, double hi, double position) { return lo + (hi - lo) * position; }

}  // namespace

std::string_view distribution_name(Distribution d) { return d == Distribution::normal ? "normal" : "uniform"; }

std::string_view yield_input_name(YieldInput input) {
    switch (input) {
        case YieldInput::supply:
            return "supply.voltage";
        case YieldInput::ambient:
            return "ambient";
        case YieldInput::pin_vdd:
            return "pin.vdd";
        case YieldInput::coil_resistance:
            return "coil.resistance";
        case YieldInput::base_resistor:
            return "base_resistor.tolerance";
        case YieldInput::zener:
            return "clamp.zener";
        case YieldInput::gain:
            return "transistor.hfe";
        case YieldInput::clamp_resistor:
            return "clamp.resistor";
        case YieldInput::rds_on:
            return "transistor.rds_on";
    }
    return "supply.voltage";
}

std::uint64_t random_bits(std::uint64_t seed, std::uint64_t sample, std::uint64_t stream) {
    return stream_bits(stream_key(seed, stream), sample);
}

double normal_quantile(double p) { return acklam_quantile(p); }

double truncated_normal_3sigma(double u) { return truncated_z(u); }

std::string_view conditions_mode_name(ConditionsMode m) { return m == ConditionsMode::worst ? "worst" : "sampled"; }

Conditions conditions_at(const Conditions& box, const BandPositions& t, ConditionsMode mode) {
    auto pos = [&t](YieldInput input) { return t[static_cast<std::size_t>(input)]; };
    Conditions c = box;
    if (mode == ConditionsMode::sampled) {
        c.vs_lo_v = c.vs_hi_v = at(box.vs_lo_v, box.vs_hi_v, pos(YieldInput::supply));
        c.ta_lo_c = c.ta_hi_c = at(box.ta_lo_c, box.ta_hi_c, pos(YieldInput::ambient));
        c.vdd_lo_v = c.vdd_hi_v = at(box.vdd_lo_v, box.vdd_hi_v, pos(YieldInput::pin_vdd));
    }
    c.r_coil_lo_ohm = c.r_coil_hi_ohm = at(box.r_coil_lo_ohm, box.r_coil_hi_ohm, pos(YieldInput::coil_resistance));
    c.rb_lo_factor = c.rb_hi_factor = at(box.rb_lo_factor, box.rb_hi_factor, pos(YieldInput::base_resistor));
    c.vz_lo_v = c.vz_hi_v = at(box.vz_lo_v, box.vz_hi_v, pos(YieldInput::zener));
    c.rs_lo_factor = c.rs_hi_factor = at(box.rs_lo_factor, box.rs_hi_factor, pos(YieldInput::clamp_resistor));
    c.rds_position = pos(YieldInput::rds_on);
    // The box's own gain position is its worst (0, minimum); a sample may lie up to typical.
    c.hfe_position = pos(YieldInput::gain);
    return c;
}

BandPositions sample_positions(std::uint64_t seed, std::uint64_t index, Distribution distribution) {
    BandPositions t{};
    for (std::size_t s = 0; s < yield_input_count; ++s) {
        const double u = unit_uniform(random_bits(seed, index, s));
        t[s] = position_of(static_cast<YieldInput>(s), u, distribution);
    }
    return t;
}

YieldCounts& YieldCounts::operator+=(const YieldCounts& other) {
    samples += other.samples;
    passed += other.passed;
    for (std::size_t i = 0; i < check_count; ++i) {
        evaluated[i] += other.evaluated[i];
        failed[i] += other.failed[i];
    }
    return *this;
}

YieldCounts count_samples(const Prepared& prepared, const Conditions& box, double rb_ohm, const YieldSettings& settings,
                          std::uint64_t first, std::uint64_t last) {
    std::array<std::uint64_t, yield_input_count> keys{};
    for (std::size_t s = 0; s < yield_input_count; ++s) keys[s] = stream_key(settings.seed, s);
    // An input whose band is a single point needs no draw: its position has no effect. The gain
    // has none without a typical value (typical falls back to the minimum); holding it at 0 also
    // spares evaluate() a lookup. Streams are independent, so skipping one changes no other.
    std::array<bool, yield_input_count> varies{};
    // Conditions held at their worst corners are not drawn.
    const bool sampled = settings.conditions == ConditionsMode::sampled;
    varies[static_cast<std::size_t>(YieldInput::supply)] = sampled && box.vs_lo_v != box.vs_hi_v;
    varies[static_cast<std::size_t>(YieldInput::ambient)] = sampled && box.ta_lo_c != box.ta_hi_c;
    varies[static_cast<std::size_t>(YieldInput::pin_vdd)] = sampled && box.vdd_lo_v != box.vdd_hi_v;
    varies[static_cast<std::size_t>(YieldInput::coil_resistance)] = box.r_coil_lo_ohm != box.r_coil_hi_ohm;
    varies[static_cast<std::size_t>(YieldInput::base_resistor)] = box.rb_lo_factor != box.rb_hi_factor;
    varies[static_cast<std::size_t>(YieldInput::zener)] = box.vz_lo_v != box.vz_hi_v;
    varies[static_cast<std::size_t>(YieldInput::clamp_resistor)] = box.rs_lo_factor != box.rs_hi_factor;
    if (const Bipolar* b = prepared.spec->bipolar()) {
        varies[static_cast<std::size_t>(YieldInput::gain)] =
            std::any_of(b->hfe_min.begin(), b->hfe_min.end(), [](const GainPoint& p) { return p.hfe_typ.has_value(); });
    }
    if (const Mosfet* m = prepared.spec->mosfet()) {
        varies[static_cast<std::size_t>(YieldInput::rds_on)] =
            std::any_of(m->rds_on.begin(), m->rds_on.end(), [](const RdsOnPoint& p) { return p.typ_ohm.has_value(); });
    }
    YieldCounts counts;
    // The checks that apply to this design: those evaluated at its worst case (whether a check
    // applies follows from the spec, not from a sample's values) and coil.thermal where the
    // coil's self-heating can run away in some sample. Only these are tallied.
    std::array<std::uint8_t, check_count> in_use{};
    std::size_t n_in_use = 0;
    {
        const Evaluation worst = evaluate(prepared, box, rb_ohm, Figures::verdicts);
        for (std::size_t k = 0; k < check_count; ++k) {
            const bool thermal = static_cast<CheckId>(k) == CheckId::coil_thermal &&
                                 prepared.spec->coil.thermal_resistance_k_per_w.has_value();
            if (worst.checks.values[k].verdict != Verdict::skip || thermal)
                in_use[n_in_use++] = static_cast<std::uint8_t>(k);
        }
    }
    // Samples go a block at a time, input by input: the draws of a block are independent
    // chains the processor overlaps. The positions are those of sample_positions().
    std::array<BandPositions, draw_block> block{};  // inputs that do not vary stay at 0
    Evaluation e;                                   // reused: every verdict is written anew by each evaluation
    for (std::uint64_t start = first; start < last; start += draw_block) {
        const auto n = static_cast<std::size_t>(std::min<std::uint64_t>(draw_block, last - start));
        for (std::size_t s = 0; s < yield_input_count; ++s) {
            if (!varies[s]) continue;
            const auto input = static_cast<YieldInput>(s);
            for (std::size_t j = 0; j < n; ++j) {
                block[j][s] = position_of(input, unit_uniform(stream_bits(keys[s], start + j)), settings.distribution);
            }
        }
        for (std::size_t j = 0; j < n; ++j) {
            evaluate_into(prepared, conditions_at(box, block[j], settings.conditions), rb_ohm, Figures::verdicts, e);
            bool pass = true;
            for (std::size_t m = 0; m < n_in_use; ++m) {
                const std::size_t k = in_use[m];
                const Verdict v = e.checks.values[k].verdict;
                if (v == Verdict::skip) continue;
                ++counts.evaluated[k];
                if (v == Verdict::fail) {
                    ++counts.failed[k];
                    pass = false;
                }
            }
            ++counts.samples;
            if (pass) ++counts.passed;
        }
    }
    return counts;
}

Interval wilson_interval(std::uint64_t successes, std::uint64_t trials, double z) {
    if (trials == 0) return {0.0, 1.0};
    const double n = static_cast<double>(trials);
    const double p = static_cast<double>(std::min(successes, trials)) / n;
    const double z2n = z * z / n;
    const double denom = 1.0 + z2n;
    const double centre = (p + z2n / 2.0) / denom;
    const double half = z / denom * std::sqrt(p * (1.0 - p) / n + z2n / (4.0 * n));
    Interval out{std::clamp(centre - half, 0.0, 1.0), std::clamp(centre + half, 0.0, 1.0)};
    // At the ends the interval touches 0 or 1 exactly (the formula gives it up to rounding).
    if (successes == 0) out.lo = 0.0;
    if (successes >= trials) out.hi = 1.0;
    return out;
}

YieldResult summarise_yield(const Sized& design, const YieldSettings& settings, const YieldCounts& counts) {
    YieldResult r;
    r.settings = settings;
    r.settings.samples = counts.samples;
    r.design = design;
    r.passed = counts.passed;
    r.pass_rate = counts.samples > 0 ? static_cast<double>(counts.passed) / static_cast<double>(counts.samples) : 0.0;
    r.interval = wilson_interval(counts.passed, counts.samples);
    std::uint64_t most = 0;
    for (std::size_t k = 0; k < check_count; ++k) {
        if (counts.evaluated[k] == 0) continue;
        CheckYield c;
        c.id = static_cast<CheckId>(k);
        c.evaluated = counts.evaluated[k];
        c.failed = counts.failed[k];
        c.pass_rate = static_cast<double>(c.evaluated - c.failed) / static_cast<double>(c.evaluated);
        r.checks.push_back(c);
        if (c.failed > most) {  // ties keep the first in report order
            most = c.failed;
            r.most_frequent_failure = c.id;
        }
    }
    return r;
}

YieldResult run_yield(const Spec& given, const YieldSettings& settings, const YieldProgress& progress) {
    // The parts' ln(current) points once, so each sample's table lookups share one log.
    Spec spec = given;
    precompute_logs(spec);
    const Sized design = size_numbers(spec);
    const Prepared prepared = prepare(spec);
    const double rb_ohm = design.r_drive_ohm.value_or(0.0);
    const std::uint64_t total = settings.samples;
    const std::uint64_t chunks = (total + chunk_samples - 1) / chunk_samples;
    const std::uint64_t threads = std::clamp<std::uint64_t>(settings.jobs, 1, std::max<std::uint64_t>(chunks, 1));

    std::atomic<std::uint64_t> next_chunk{0};
    std::atomic<std::uint64_t> done{0};
    // Threads take chunks in any order; the integer tallies add up the same whatever the order.
    auto work = [&](YieldCounts& counts, bool report) {
        for (;;) {
            const std::uint64_t k = next_chunk.fetch_add(1);
            if (k >= chunks) break;
            const std::uint64_t first = k * chunk_samples;
            const std::uint64_t last = std::min(total, first + chunk_samples);
            counts += count_samples(prepared, design.conditions, rb_ohm, settings, first, last);
            const std::uint64_t now = done.fetch_add(last - first) + (last - first);
            if (report && progress) progress(now, total);
        }
    };

    std::vector<YieldCounts> per_thread(threads);
    {
        std::vector<std::jthread> pool;
        pool.reserve(threads - 1);
        for (std::uint64_t t = 1; t < threads; ++t)
            pool.emplace_back([&work, &per_thread, t] { work(per_thread[t], false); });
        work(per_thread[0], true);
    }  // joins
    YieldCounts all;
    for (const YieldCounts& c : per_thread) all += c;
    if (progress) progress(total, total);
    return summarise_yield(design, settings, all);
}

}  // namespace coilfit
