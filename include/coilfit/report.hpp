// The result of sizing one channel: quantities, checks, notes and cautions. Renderers in
// src/io turn it into text or JSON (schema "coilfit.report/1"); the core never prints.
#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "coilfit/eseries.hpp"
#include "coilfit/quantity.hpp"

namespace coilfit {

enum class Verdict { pass, warn, fail, skip };
[[nodiscard]] std::string_view verdict_name(Verdict verdict);  // "pass", "warn", "fail", "skip"

struct Check {
    std::string id;  // "coil.operate", "pin.current", ...
    Verdict verdict = Verdict::skip;
    std::optional<double> value;
    std::optional<double> limit;
    Unit unit = Unit::number;
    // Fraction of headroom: (limit - value) / limit for upper limits, (value - limit) / limit
    // for lower limits. Positive passes, negative fails; absent when not computable.
    std::optional<double> margin;
    std::string message;
};

// One entry of the flat "quantities" object: key with unit suffix ("coil_current_max_a").
struct QuantityEntry {
    std::string key;
    double value = 0;
    Unit unit = Unit::number;
    std::string label;  // words for the text report: "coil current, highest"
};

struct ResistorChoice {
    std::optional<double> value_ohm;  // absent when no value of the series can work
    ESeries series = ESeries::e24;
    double tolerance = 0.05;
    double power_rating_w = 0.125;
    bool fixed = false;  // given by the spec rather than chosen
};

// One row of the clamp trade-off table (diode alone, diode + zener, ...).
struct ClampOption {
    std::string label;                // "diode 1N4148", "diode + zener 1N4742A (12 V)"
    double peak_collector_v = 0;      // at the corner that is worst for it
    std::optional<double> release_time_s;
    double clamp_energy_j = 0;
    bool within_rating = true;        // collector within the transistor's derated Vceo
    bool chosen = false;              // the clamp the spec uses
};

struct SizingReport {
    Verdict verdict = Verdict::fail;  // pass | fail (warnings do not fail)
    bool has_warnings = false;
    ResistorChoice resistor;
    std::vector<QuantityEntry> quantities;
    std::vector<Check> checks;
    std::vector<ClampOption> clamp_options;
    std::vector<std::string> notes;
    std::vector<std::string> cautions;

    [[nodiscard]] const Check* find_check(std::string_view id) const;
    [[nodiscard]] std::optional<double> quantity(std::string_view key) const;
    // The check with the smallest margin (the binding one); nullptr when none has a margin.
    [[nodiscard]] const Check* worst_check() const;
};

}  // namespace coilfit
