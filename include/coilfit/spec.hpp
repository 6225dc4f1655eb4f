// The validated inputs of one driver channel, in SI units (temperatures in °C, ratios as
// fractions). The I/O layer builds a Spec from JSON or flags, fills every default of the method
// and lists the defaults it used; the core only reads it.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "coilfit/eseries.hpp"
#include "coilfit/parts.hpp"

namespace coilfit {

enum class ClampType { diode, diode_zener, diode_resistor, none };
enum class LoadKind { ac, dc };

[[nodiscard]] std::string_view clamp_type_name(ClampType type);  // "diode", "diode_zener", ...

struct SupplySpec {
    double voltage_v = 0;
    double tolerance = 0.10;
};

struct AmbientSpec {
    double min_c = 0;
    double max_c = 50;
};

struct CoilSpec {
    std::string preset;  // the preset the fields started from, if any
    double rated_voltage_v = 0;
    double resistance_ohm = 0;           // at reference_temp_c
    double tolerance = 0.10;             // of the resistance
    double reference_temp_c = 20;
    double must_operate = 0.75;          // fraction of rated voltage, at reference temperature
    double must_release = 0.10;          // fraction of rated voltage
    double self_heating_k = 0;           // winding rise above ambient when energised
    std::optional<double> inductance_h;  // energised (armature closed) inductance
    std::optional<double> max_voltage_v;
    std::optional<double> max_release_time_s;
};

struct PinSpec {
    std::string preset;
    double vdd_v = 0;
    double vdd_tolerance = 0.05;
    std::optional<double> voh_v;          // guaranteed output high at voh_current_a
    std::optional<double> voh_current_a;
    double max_current_a = 0;             // the most the pin may source
};

struct ClampSpec {
    ClampType type = ClampType::diode;
    std::optional<Diode> diode;
    std::optional<Zener> zener;
    std::optional<double> resistor_ohm;   // diode_resistor only
};

struct BaseResistorSpec {
    ESeries series = ESeries::e24;
    double tolerance = 0.05;
    double power_rating_w = 0.125;
    std::optional<double> value_ohm;  // fixed: check it instead of choosing
};

struct Policy {
    std::optional<double> forced_gain;  // default 10 (npn) or the Vce(sat) test ratio (darlington)
    double overdrive = 2;               // k: drive over minimum gain
    double current_derating = 0.75;
    double voltage_derating = 0.75;
    double junction_margin_k = 25;
    double power_derating = 0.50;       // of resistor and zener power ratings
    double vbe_low_v = 0.6;             // the lowest Vbe, for the highest pin current
};

struct LoadSpec {
    double voltage_v = 0;
    LoadKind kind = LoadKind::ac;
    std::optional<double> current_a;
};

struct Spec {
    std::string name;
    SupplySpec supply;
    AmbientSpec ambient;
    CoilSpec coil;
    PinSpec pin;
    Bipolar transistor;
    ClampSpec clamp;
    BaseResistorSpec base_resistor;
    std::optional<double> pulldown_ohm;
    Policy policy;
    std::optional<double> switching_frequency_hz;
    std::optional<LoadSpec> load;
    // Defaults the loader filled in, one phrase each ("supply.tolerance 10 %"), for the notes.
    std::vector<std::string> defaults_used;
};

}  // namespace coilfit
