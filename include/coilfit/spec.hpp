// The validated inputs of one driver channel, in SI units (temperatures in °C, ratios as
// fractions). The I/O layer builds a Spec from JSON or flags, fills every default of the method
// (coilfit/defaults.hpp) and lists the defaults it used; the core only reads it. The driver kind
// follows the transistor's record: npn or darlington (base resistor), nmos (gate resistor),
// array (a built-in input resistor).
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "coilfit/contact.hpp"
#include "coilfit/defaults.hpp"
#include "coilfit/eseries.hpp"
#include "coilfit/parts.hpp"

namespace coilfit {

enum class ClampType { diode, diode_zener, diode_resistor, diode_tvs, none };
enum class LoadKind { ac, dc };

[[nodiscard]] std::string_view clamp_type_name(ClampType type);  // "diode", "diode_zener", ...

struct SupplySpec {
    double voltage_v = 0;  // nominal; 0 when only min and max are given
    double tolerance = defaults::supply_tolerance;
    std::optional<double> min_v, max_v;     // an asymmetric band (e.g. 9 V to 16 V), instead of the tolerance
    std::optional<double> transient_max_v;  // the highest the rail reaches in a transient

    [[nodiscard]] double lo_v() const { return min_v ? *min_v : voltage_v * (1.0 - tolerance); }
    [[nodiscard]] double hi_v() const { return max_v ? *max_v : voltage_v * (1.0 + tolerance); }
};

struct AmbientSpec {
    double min_c = defaults::ambient_min_c;
    double max_c = defaults::ambient_max_c;
};

struct CoilSpec {
    std::string preset;  // the preset the fields started from, if any
    double rated_voltage_v = 0;
    double resistance_ohm = 0;                    // at reference_temp_c
    double tolerance = defaults::coil_tolerance;  // of the resistance
    double reference_temp_c = defaults::coil_reference_temp_c;
    double must_operate = defaults::must_operate;      // fraction of rated voltage
    double must_release = defaults::must_release;      // fraction of rated voltage
    std::optional<double> must_operate_temp_c;         // coil temperature the must-operate is stated at
    std::optional<double> self_heating_k;              // winding rise above ambient when energised
    std::optional<double> thermal_resistance_k_per_w;  // winding to ambient: the rise from its power
    std::optional<double> max_temperature_c;           // insulation class limit
    std::optional<double> inductance_h;                // energised (armature closed) inductance
    std::optional<double> max_voltage_v;
    std::optional<double> max_release_time_s;
};

// A relay or contactor of the parts table: its coil and its contacts (pick tries them).
struct RelayRecord : RelayPart {
    CoilSpec coil;
};

struct PinSpec {
    std::string preset;
    double vdd_v = 0;
    double vdd_tolerance = defaults::pin_vdd_tolerance;
    std::optional<double> voh_v;  // guaranteed output high at voh_current_a
    std::optional<double> voh_current_a;
    std::optional<double> voh_vdd_v;  // the supply VOH is stated at (default: the lowest VDD)
    double max_current_a = 0;         // the most the pin may source
};

struct ClampSpec {
    ClampType type = ClampType::diode;
    std::optional<Diode> diode;
    std::optional<Zener> zener;
    std::optional<Tvs> tvs;
    std::optional<double> resistor_ohm;  // diode_resistor only
    double resistor_tolerance = defaults::clamp_resistor_tolerance;
    double resistor_power_w = defaults::clamp_resistor_power_w;
};

enum class ResistorChoice : unsigned char { largest, centred };

struct BaseResistorSpec {
    ESeries series = ESeries::e24;
    double tolerance = 0.05;
    double power_rating_w = defaults::base_resistor_power_w;
    std::optional<double> value_ohm;  // fixed: check it instead of choosing
    ResistorChoice choose = ResistorChoice::largest;
};

struct GateResistorSpec {
    ESeries series = ESeries::e24;
    double tolerance = 0.05;
    std::optional<double> value_ohm;  // fixed: check it instead of choosing
};

struct Policy {
    std::optional<double> forced_gain;       // default 10 (npn) or the Vce(sat) test ratio (darlington)
    double overdrive = defaults::overdrive;  // k: drive over minimum gain
    double current_derating = defaults::current_derating;
    double voltage_derating = defaults::voltage_derating;
    double junction_margin_k = defaults::junction_margin_k;
    double power_derating = defaults::power_derating;  // of resistor and zener power ratings
    double pulse_derating = defaults::pulse_derating;  // of a zener's or TVS's surge rating
    double vbe_low_v = defaults::vbe_low_v;            // the lowest Vbe, for the highest pin current
};

struct SwitchingSpec {
    std::optional<double> frequency_hz;
    double duty = defaults::switching_duty;
};

// What the contacts switch (src/method.md "Contact side"). `kind` is AC or DC (the spec's
// `type`, or an edition-1 `kind` of "ac"/"dc"); `load_class` the spec's `kind` of load.
struct LoadSpec {
    double voltage_v = 0;  // RMS for AC
    LoadKind kind = LoadKind::ac;
    std::optional<double> current_a;  // steady
    LoadClass load_class = LoadClass::resistive;
    bool class_given = false;               // the spec named the kind of load (edition 2)
    std::optional<double> inrush_a;         // given in amperes
    std::optional<double> inrush_multiple;  // given as a multiple of the steady current ("6x")
    std::optional<double> power_factor;     // AC
    std::optional<double> time_constant_s;  // DC: the load's L/R
};

struct Spec {
    std::string name;
    SupplySpec supply;
    AmbientSpec ambient;
    CoilSpec coil;
    PinSpec pin;
    Transistor transistor;  // its kind selects the driver
    ClampSpec clamp;
    BaseResistorSpec base_resistor;      // bipolar drivers
    GateResistorSpec gate_resistor;      // nmos drivers
    std::optional<double> pulldown_ohm;  // base-emitter or gate-source pull-down
    Policy policy;
    SwitchingSpec switching;
    std::optional<LoadSpec> load;
    std::optional<RelayPart> relay;  // the relay or contactor record the coil came from, with its contacts
    // Defaults the loader filled in, one phrase each ("supply.tolerance 10 %"), for the notes.
    // Words for people only: the core never reads them (it sees the optional fields).
    std::vector<std::string> defaults_used;

    [[nodiscard]] const Bipolar* bipolar() const { return std::get_if<Bipolar>(&transistor); }
    [[nodiscard]] const Mosfet* mosfet() const { return std::get_if<Mosfet>(&transistor); }
    [[nodiscard]] const ArrayPart* array() const { return std::get_if<ArrayPart>(&transistor); }
};

}  // namespace coilfit
