// The result of sizing one channel: the resolved inputs, the sized design, quantities, checks
// with their words, notes and cautions. Renderers in src/io turn it into text, JSON, a netlist or
// a plot without sizing again; the core never prints.
#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "coilfit/check.hpp"
#include "coilfit/eseries.hpp"
#include "coilfit/quantity.hpp"
#include "coilfit/sizing.hpp"
#include "coilfit/spec.hpp"
#include "coilfit/transient.hpp"

namespace coilfit {

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
    std::string reason;            // why a check was skipped (empty otherwise)
    Corner corner = Corner::cold;  // the ambient corner of the value
    bool beyond_data = false;      // it used a part value beyond the part's data
};

// One entry of the flat "quantities" object: key with unit suffix ("coil_current_max_a").
struct QuantityEntry {
    std::string key;
    double value = 0;
    Unit unit = Unit::number;
    std::string label;  // words for the text report: "coil current, highest"
};

// The drive resistor of the design (base or gate resistor; none for an array channel).
struct ResistorReport {
    std::string_view kind = "base resistor";  // "base resistor", "gate resistor", "" (built in)
    std::optional<double> value_ohm;          // absent when no value of the series can work
    ESeries series = ESeries::e24;
    double tolerance = 0.05;
    std::optional<double> power_rating_w;
    bool fixed = false;  // given by the spec rather than chosen
    std::optional<double> window_min_ohm, window_max_ohm;
};

// One row of the clamp trade-off table (diode alone, diode + zener, ...).
struct ClampOption {
    std::string label;            // "diode 1N4148", "diode + zener 1N4742A (12 V)"
    ClampSpec clamp;              // the clamp it stands for (the plot draws each option)
    double peak_collector_v = 0;  // at the corner that is worst for it
    std::optional<double> release_time_s;
    double clamp_energy_j = 0;
    bool within_rating = true;              // collector within the transistor's derated rating (and pulse)
    std::string failed_check;               // the first check this option fails, if any
    Verdict pulse_verdict = Verdict::skip;  // clamp.pulse of a zener or TVS option
    bool chosen = false;                    // the clamp the spec uses
    std::optional<TurnOff> turn_off;        // its decay for the plot (with an inductance and a clamp)
};

// The contact side of the report (src/method.md "Contact side"): what the contacts switch, the
// inrush taken, and the suppression advice with its values.
struct ContactReport {
    std::string relay;  // "pcb-power-relay-12v-16a (relay, 1 form A)", or "none given"
    std::string load;   // "24 V DC motor, 8 A steady"
    std::optional<double> inrush_a;
    std::string inrush_words;              // how the inrush was found ("6 x steady, the default for a motor ...")
    std::vector<std::string> suppression;  // advice, one line each
    std::optional<double> snubber_capacitance_f, snubber_resistance_ohm;  // AC inductive load
    std::optional<double> varistor_voltage_v;                             // AC inductive load
    // A DC load of several amperes with a plain-diode coil clamp: the release times side by side.
    std::optional<double> release_plain_s, release_zener_s;
    std::string zener_option;  // the clamp option the zener time is for
};

struct SizingReport {
    Spec spec;                        // the inputs as understood
    Sized sized;                      // the design and its worst-case evaluation
    Verdict verdict = Verdict::fail;  // pass | fail (warnings do not fail)
    bool has_warnings = false;
    ResistorReport resistor;
    std::vector<QuantityEntry> quantities;
    std::vector<Check> checks;
    std::vector<ClampOption> clamp_options;
    std::optional<ContactReport> contact;  // when the spec names a relay or a kind of load
    std::vector<std::string> notes;
    std::vector<std::string> cautions;

    [[nodiscard]] const Check* find_check(std::string_view id) const;
    [[nodiscard]] std::optional<double> quantity(std::string_view key) const;
    // The check with the smallest margin (the binding one); nullptr when none has a margin.
    [[nodiscard]] const Check* worst_check() const;
};

// Sizes and checks one channel at worst case. Pure. The catalogue supplies the zeners (and TVS)
// for the clamp trade-off table (it may be empty).
[[nodiscard]] SizingReport size(const Spec& spec, const Catalogue& catalogue);

// The words of one evaluated check, from the stage that owns it.
[[nodiscard]] std::string check_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e);
[[nodiscard]] std::string check_skip_reason(CheckId id, const Spec& spec);
// The unit a check's value is in (clamp.pulse is an energy for an avalanche rating).
[[nodiscard]] Unit check_unit(CheckId id, const CheckValue& c);

}  // namespace coilfit
