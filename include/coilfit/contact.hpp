// The contact side (src/method.md "Contact side (ed. 2)"): a relay's or contactor's contact
// ratings, the load's kind and inrush, the five contact checks and the suppression rules.
//
// The contact checks depend on the spec alone (the load and the record's ratings), not on the
// ambient corner: the contact stage writes the same values at both corners.
#pragma once

#include <cstdint>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "coilfit/check.hpp"
#include "coilfit/parts.hpp"

namespace coilfit {

struct Spec;
struct LoadSpec;

enum class RelayKind : std::uint8_t { relay, contactor };
[[nodiscard]] std::string_view relay_kind_name(RelayKind kind);  // "relay", "contactor"

struct ContactRating {  // the most the contacts switch: a voltage and a current
    double voltage_v = 0;
    double current_a = 0;
};

struct BreakingPoint {  // one point of the maximum DC breaking curve
    double voltage_v = 0;
    double current_a = 0;
};

struct Contacts {
    std::string form;                        // "1 form A", "2 form C", ...
    std::optional<ContactRating> ac, dc;     // resistive ratings
    std::vector<BreakingPoint> dc_breaking;  // sorted by voltage, current falling
    std::optional<double> make_current_a;    // the inrush the contacts may make
    std::optional<ContactRating> min_load;   // below it the contacts may not wet
};

// The relay or contactor a spec names: where it came from and its contacts (its coil data fill
// the spec's coil).
struct RelayPart : PartOrigin {
    RelayKind kind = RelayKind::relay;
    std::optional<Contacts> contacts;
};

// What the contacts switch. `transformer` is the method's inrush row of that name.
enum class LoadClass : std::uint8_t { resistive, inductive, motor, lamp, capacitive, solenoid, transformer };
[[nodiscard]] std::string_view load_class_name(LoadClass c);  // "resistive", ...
[[nodiscard]] std::optional<LoadClass> load_class_from_name(std::string_view name);
// Loads that store magnetic energy and arc at the contacts on opening.
[[nodiscard]] bool is_inductive(LoadClass c);

// The inrush a kind of load draws when the spec gives none (src/method.md "Contact side":
// common practice, from memory, to be confirmed for the real load).
struct InrushDefault {
    double multiple = 1;    // x the steady current
    double duration_s = 0;  // about how long it lasts (0: no inrush to speak of)
    std::string_view what;  // "locked rotor", ...
};
[[nodiscard]] InrushDefault default_inrush(LoadClass c, bool ac);

// The load's inrush in amperes (given, or a multiple of the steady current, given or by kind);
// none without a steady current or amperes.
[[nodiscard]] std::optional<double> load_inrush_a(const LoadSpec& load);
[[nodiscard]] double load_inrush_multiple(const LoadSpec& load);

// The maximum DC breaking curve at a voltage: log-log interpolation between its points (a
// straight line on log I against log V); below its lowest voltage the first current applies;
// above its highest voltage there is no current it breaks (above = true, current 0).
struct BreakingLimit {
    double current_a = 0;
    bool above = false;
    bool below = false;
};
[[nodiscard]] BreakingLimit breaking_current_at(const std::vector<BreakingPoint>& curve, double voltage_v);

// An RC snubber by the long-standing empirical rule (src/method.md "Contact side"; from memory,
// common practice): C = I^2 / 10 uF with I in amperes, R = V / (10 I (1 + 50 / V)) ohms.
[[nodiscard]] double snubber_capacitance_f(double current_a);
[[nodiscard]] double snubber_resistance_ohm(double voltage_v, double current_a);
// A varistor across an AC line: rated at least 1.2 x the peak line voltage, 1.2 sqrt(2) V_rms.
[[nodiscard]] double varistor_voltage_min_v(double line_rms_v);

// A DC load current above which a plain-diode coil clamp's slow release draws a long arc
// (src/method.md "more than a few amperes"; 3 A here, common practice, from memory).
inline constexpr double slow_release_current_a = 3.0;

// How a contact check came out (CheckValue::detail), for its words.
enum class ContactCase : std::uint8_t {
    rated,           // against the record's rating
    no_make_rating,  // contact.inrush: no make_current; the steady rating with the 2x rule
    above_curve,     // contact.breaking: the load voltage is above the curve's last point
    below_curve,     // contact.breaking: below the curve's first point (its first current)
    slow_release,    // contact.breaking passes, but a plain diode clamp releases slowly
    min_voltage,     // contact.min_load: the voltage (not the current) is below the minimum
};

// The contact checks of a spec into `checks`; each is left skipped when its data are missing.
void contact_checks(const Spec& spec, CheckSet& checks);

// How the inrush was found, for the words: "given", "6 x steady, the default for a motor ...".
[[nodiscard]] std::string inrush_words(const LoadSpec& load);
[[nodiscard]] std::string contact_message(CheckId id, const CheckValue& c, const Spec& spec);
[[nodiscard]] std::string contact_skip_reason(CheckId id, const Spec& spec);

}  // namespace coilfit
