// Statistical yield: the share of built units that pass every check (Monte Carlo).
//
// Worst case says whether every unit is guaranteed to work; yield estimates how many do when the
// tolerances fall where they will. Assumptions:
//  1. The design under test is the sized one (size_numbers: the chosen or fixed base resistor
//     and the spec's parts). Samples vary parts and conditions, never these choices.
//  2. A sample is one point of the worst-case box (Conditions with every range collapsed to a
//     point, lo == hi): supply, ambient, pin VDD, coil resistance at its reference temperature,
//     base (or gate) resistor, zener voltage, clamp resistor, the gain between the part's minimum
//     (position 0) and typical (position 1), and a MOSFET's Rds(on) between its maximum (0) and
//     typical (1). Each input is drawn on its own (independent).
//  3. uniform: every input uniform over its band. normal: centred on the band with the band's
//     half-width at 3 sigma, truncated at the band, so no sample lies outside the worst case.
//     The gain is the one one-sided input: normal about the typical gain with the minimum at
//     3 sigma below it; gains above typical are taken at typical (not credited).
//  4. Vce(sat), Vbe(sat), diode forward drops and the policy limits stay at their datasheet or
//     policy values in every sample: only the inputs above vary.
//  5. Random numbers come from a counter-based generator (SplitMix64 finaliser keyed by seed,
//     sample index and input index), so a sample depends on nothing but (seed, index): the same
//     seed and count give the same result on any run, machine and number of threads.
// The pass rate carries a 95 % Wilson score interval (Wilson 1927).
#pragma once

#include <array>
#include <cstdint>
#include <functional>
#include <optional>
#include <string_view>
#include <vector>

#include "coilfit/corners.hpp"
#include "coilfit/sizing.hpp"
#include "coilfit/spec.hpp"

namespace coilfit {

enum class Distribution : std::uint8_t { uniform, normal };
[[nodiscard]] std::string_view distribution_name(Distribution d);  // "uniform", "normal"

// The inputs a sample varies, in the order of their generator streams.
enum class YieldInput : std::uint8_t {
    supply,
    ambient,
    pin_vdd,
    coil_resistance,
    base_resistor,
    zener,
    gain,
    clamp_resistor,
    rds_on
};
inline constexpr std::size_t yield_input_count = 9;
[[nodiscard]] std::string_view yield_input_name(YieldInput input);  // "supply.voltage", ...

// --- Counter-based random numbers -------------------------------------------------------------

// SplitMix64 output function (Steele, Lea, Flood 2014, "Fast splittable pseudorandom number
// generators", OOPSLA; the finaliser constants of Stafford's "Mix13"): a bijection of 64 bits.
[[nodiscard]] constexpr std::uint64_t splitmix64_mix(std::uint64_t z) {
    z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9ULL;
    z = (z ^ (z >> 27)) * 0x94d049bb133111ebULL;
    return z ^ (z >> 31);
}

// 64 random bits for (seed, sample index, stream), independent of any other call.
[[nodiscard]] std::uint64_t random_bits(std::uint64_t seed, std::uint64_t sample, std::uint64_t stream);
// Uniform in [0, 1) with 53 random bits: exact, no rounding (k * 2^-53).
[[nodiscard]] constexpr double unit_uniform(std::uint64_t bits) { return static_cast<double>(bits >> 11) * 0x1.0p-53; }
// Inverse of the standard normal distribution function, p in (0, 1) (Acklam's rational
// approximation, relative error below 1.2e-9).
[[nodiscard]] double normal_quantile(double p);
// A standard normal deviate truncated to [-3, 3], from u in [0, 1) by inversion: monotone in u.
[[nodiscard]] double truncated_normal_3sigma(double u);

// --- Samples ----------------------------------------------------------------------------------

// Where each input lies in its band, 0 (lo) .. 1 (hi); for the gain 0 = minimum, 1 = typical;
// for Rds(on) 0 = maximum, 1 = typical.
using BandPositions = std::array<double, yield_input_count>;

// The point of the worst-case box at the given positions: every range collapsed (lo == hi).
// How a sample treats the operating conditions (supply, ambient, pin VDD): held at each check's
// worst corner (the default: yield asks about part-to-part spread, src/method.md "Statistical
// yield"), or drawn like the part spreads (edition 1's behaviour).
enum class ConditionsMode : std::uint8_t { worst, sampled };
[[nodiscard]] std::string_view conditions_mode_name(ConditionsMode m);  // "worst", "sampled"

// With ConditionsMode::worst the supply, ambient and pin VDD keep the box's bands.
[[nodiscard]] Conditions conditions_at(const Conditions& box, const BandPositions& positions,
                                       ConditionsMode mode = ConditionsMode::sampled);
// The positions of sample `index` under a seed and distribution.
[[nodiscard]] BandPositions sample_positions(std::uint64_t seed, std::uint64_t index, Distribution distribution);

// --- Running --------------------------------------------------------------------------------

struct YieldSettings {
    std::uint64_t samples = 100000;
    std::uint64_t seed = 1;
    Distribution distribution = Distribution::uniform;
    ConditionsMode conditions = ConditionsMode::worst;
    unsigned jobs = 1;  // threads; the result does not depend on it
};

// Integer tallies: summed over threads in any order, they give the same result.
struct YieldCounts {
    std::uint64_t samples = 0;
    std::uint64_t passed = 0;                            // no check failed (warnings pass)
    std::array<std::uint64_t, check_count> evaluated{};  // the check was not skipped
    std::array<std::uint64_t, check_count> failed{};
    YieldCounts& operator+=(const YieldCounts& other);
};

// Evaluates samples [first, last) of the design (box, rb_ohm) and tallies them. Inputs whose
// band is one point (and the gain of a part without typical values) are not drawn: their
// position has no effect, and each input has a stream of its own.
// The prepared spec is evaluated as given (run_yield prepares one with precompute_logs()).
[[nodiscard]] YieldCounts count_samples(const Prepared& prepared, const Conditions& box, double rb_ohm,
                                        const YieldSettings& settings, std::uint64_t first, std::uint64_t last);

// A 95 % (or other) two-sided confidence interval for a proportion.
struct Interval {
    double lo = 0;
    double hi = 1;
};
// Wilson score interval for x successes in n trials (Wilson, E. B. (1927), "Probable inference,
// the law of succession, and statistical inference", J. Am. Stat. Assoc. 22, 209-212):
//   centre = (p + z^2/2n) / (1 + z^2/n),  half = z / (1 + z^2/n) * sqrt(p(1-p)/n + z^2/4n^2).
// z is the two-sided normal quantile (1.959964 for 95 %). n must be > 0.
[[nodiscard]] Interval wilson_interval(std::uint64_t successes, std::uint64_t trials, double z = 1.959963984540054);

struct CheckYield {
    CheckId id{};
    std::uint64_t evaluated = 0;  // samples in which the check applied
    std::uint64_t failed = 0;
    double pass_rate = 1;
};

struct YieldResult {
    YieldSettings settings;
    Sized design;  // the design under test and its worst-case evaluation
    std::uint64_t passed = 0;
    double pass_rate = 0;
    Interval interval;                             // 95 % Wilson score interval of pass_rate
    std::vector<CheckYield> checks;                // checks that applied in at least one sample, report order
    std::optional<CheckId> most_frequent_failure;  // none when every sample passed
};

// Called on the calling thread with (samples done, samples in all) now and then; may be empty.
using YieldProgress = std::function<void(std::uint64_t, std::uint64_t)>;

// Sizes the spec (size_numbers), then runs settings.samples samples on settings.jobs threads.
// The result is the same for any number of jobs. Pure apart from the threads it starts.
[[nodiscard]] YieldResult run_yield(const Spec& spec, const YieldSettings& settings,
                                    const YieldProgress& progress = {});

// Summarises tallies (split out so tests can build results from counts).
[[nodiscard]] YieldResult summarise_yield(const Sized& design, const YieldSettings& settings,
                                          const YieldCounts& counts);

}  // namespace coilfit
