// Checks: the ids, the table that defines them (name, unit, the stage that owns them), one
// check's numbers (CheckValue) and a fixed-capacity set of them (no allocation).
//
// A check is one row of the table in src/core/check.cpp plus one function in the stage that
// owns it; the words it prints live with that stage (src/method.md names the formulas).
#pragma once

#include <array>
#include <cstddef>
#include <cstdint>
#include <string_view>

#include "coilfit/quantity.hpp"

namespace coilfit {

// skip first: a default CheckValue is all zero bits (cheap to clear on the Monte Carlo path).
enum class Verdict : std::uint8_t { skip, pass, warn, fail };
[[nodiscard]] std::string_view verdict_name(Verdict verdict);  // "pass", "warn", "fail", "skip"

enum class CheckId : std::uint8_t {
    // edition 1 (ids and order kept)
    coil_operate,
    coil_overvoltage,
    transistor_current,
    transistor_voltage,
    transistor_saturation,
    transistor_thermal,
    pin_current,
    resistor_power,
    diode_voltage,
    diode_current,
    clamp_power,
    release_time,
    // edition 2
    coil_thermal,
    gate_drive,
    gate_voltage,
    input_drive,
    clamp_pulse,
    switching_timing,
    contact_voltage,
    contact_current,
    contact_inrush,
    contact_breaking,
    contact_min_load,
    // edition 2, a board's shared limits (src/method.md "Boards"): worked out over the channels
    // of a board, never by one channel's evaluation (which leaves them skipped)
    port_current,
    package_current,
    supply_current,
    array_power,
    array_current,
};
inline constexpr std::size_t check_count = 28;

// The stage whose file computes and words a check (board: src/core/board*.cpp).
enum class Stage : std::uint8_t { coil, driver, clamp, timing, contact, board };

struct CheckInfo {
    CheckId id;
    std::string_view name;  // "coil.operate"
    Unit unit;
    Stage stage;
};

[[nodiscard]] const CheckInfo& check_info(CheckId id);
[[nodiscard]] std::string_view check_id_name(CheckId id);  // "coil.operate", ...
[[nodiscard]] Unit check_unit(CheckId id);
[[nodiscard]] constexpr std::size_t index_of(CheckId id) { return static_cast<std::size_t>(id); }

// The ambient corner a figure or check was taken at (src/method.md "Two ambient corners").
enum class Corner : std::uint8_t { cold = 0, hot = 1 };
inline constexpr std::size_t corner_count = 2;

// One check evaluated numerically (no words).
struct CheckValue {
    enum class Bound : std::uint8_t { at_most, at_least };
    double value = 0;
    double limit = 0;
    Verdict verdict = Verdict::skip;
    Bound bound = Bound::at_most;  // the value must stay at most / at least the limit
    bool has_value = false;        // false when the value cannot be computed (e.g. no clamp)
    Corner corner = Corner::cold;  // the ambient corner the value was taken at
    bool beyond_data = false;      // a value it uses lies beyond the part's data, unsafe side
    std::uint8_t detail = 0;       // which bound or case the stage found (the stage's own enum)

    // Headroom as a fraction of the limit, negative when the check fails: (limit - value)/|limit|
    // for an upper bound, (value - limit)/|limit| for a lower one. Against a zero limit it is 0
    // or -1; without a value it is -1 for a failed check, 0 for a skipped one. Worked out on
    // demand: Monte Carlo needs only the verdicts.
    [[nodiscard]] double margin() const {
        if (!has_value) return verdict == Verdict::fail ? -1.0 : 0.0;
        const double headroom = bound == Bound::at_most ? limit - value : value - limit;
        if (limit == 0) return headroom >= 0 ? 0.0 : -1.0;
        return headroom / (limit < 0 ? -limit : limit);
    }
};

// value must stay at or below / at or above the limit (inline: the Monte Carlo hot path).
[[nodiscard]] inline CheckValue at_most(double value, double limit) {
    CheckValue c;
    c.has_value = true;
    c.value = value;
    c.limit = limit;
    c.bound = CheckValue::Bound::at_most;
    c.verdict = value <= limit ? Verdict::pass : Verdict::fail;
    return c;
}
[[nodiscard]] inline CheckValue at_least(double value, double limit) {
    CheckValue c;
    c.has_value = true;
    c.value = value;
    c.limit = limit;
    c.bound = CheckValue::Bound::at_least;
    c.verdict = value >= limit ? Verdict::pass : Verdict::fail;
    return c;
}
// A failed check without a value (nothing to compare): e.g. no resistor could be chosen.
[[nodiscard]] inline CheckValue failed_without_value(double limit) {
    CheckValue c;
    c.verdict = Verdict::fail;
    c.limit = limit;
    return c;
}
// The direction rule (src/method.md "Data limits"): a check that uses a value beyond the part's
// data on its unsafe side passes only as a warning ("beyond the part's data").
void mark_beyond_data(CheckValue& c);

// Every check of one evaluation, indexed by CheckId.
struct CheckSet {
    std::array<CheckValue, check_count> values{};

    [[nodiscard]] const CheckValue& operator[](CheckId id) const { return values[index_of(id)]; }
    void set(CheckId id, const CheckValue& v) { assign(values[index_of(id)], v); }
    // Field by field: a whole-struct copy of narrow fields just written would stall the
    // processor's store forwarding on the Monte Carlo path.
    static void assign(CheckValue& to, const CheckValue& from) {
        to.value = from.value;
        to.limit = from.limit;
        to.verdict = from.verdict;
        to.bound = from.bound;
        to.has_value = from.has_value;
        to.corner = from.corner;
        to.beyond_data = from.beyond_data;
        to.detail = from.detail;
    }
    [[nodiscard]] bool passes() const;  // no check failed (warnings pass)
    // One bit per check (bit i for CheckId i): those evaluated (not skipped), those failed.
    [[nodiscard]] std::uint32_t evaluated_bits() const {
        std::uint32_t bits = 0;
        for (std::size_t i = 0; i < check_count; ++i) bits |= std::uint32_t{values[i].verdict != Verdict::skip} << i;
        return bits;
    }
    [[nodiscard]] std::uint32_t failed_bits() const {
        std::uint32_t bits = 0;
        for (std::size_t i = 0; i < check_count; ++i) bits |= std::uint32_t{values[i].verdict == Verdict::fail} << i;
        return bits;
    }
    // Every verdict back to skip (a reused set before an evaluation).
    void clear_verdicts() {
#if defined(__GNUC__)
#pragma GCC unroll 32
#endif
        for (std::size_t i = 0; i < check_count; ++i) values[i].verdict = Verdict::skip;
    }
};
static_assert(check_count <= 32, "one bit per check");

// The worse of two evaluations of one check (fail before warn before pass; then the smaller
// margin, or with verdicts_only the first). Skipped counts as not evaluated. The verdicts are
// declared in order of severity (skip, pass, warn, fail).
[[nodiscard]] inline const CheckValue& worse(const CheckValue& a, const CheckValue& b, bool verdicts_only) {
    if (a.verdict != b.verdict) return a.verdict > b.verdict ? a : b;
    if (verdicts_only || a.verdict == Verdict::skip) return a;
    return b.margin() < a.margin() ? b : a;
}

}  // namespace coilfit
