#include "cli/spec_flags.hpp"

#include <iterator>

namespace coilfit::cli {
namespace {

// Our own flag names; each sets one field of the spec (coilfit.spec/1). The defaults are those
// of include/coilfit/defaults.hpp, written as a flag would take them.
constexpr SpecFlag table[] = {
    {"--name", "name", "NAME", "channel name for the report", ""},
    {"--supply", "supply.voltage", "VOLTAGE", "coil supply voltage, e.g. 12V", ""},
    {"--supply-tolerance", "supply.tolerance", "PERCENT", "supply tolerance, e.g. 10%", "10%"},
    {"--supply-min", "supply.min", "VOLTAGE", "lowest supply of an asymmetric band, e.g. 9V (with --supply-max)", ""},
    {"--supply-max", "supply.max", "VOLTAGE", "highest supply of an asymmetric band, e.g. 16V (with --supply-min)", ""},
    {"--transient-max", "supply.transient_max", "VOLTAGE", "highest transient on the rail, e.g. 40V", ""},
    {"--ambient-min", "ambient.min", "TEMP", "lowest ambient, e.g. -20C", "0C"},
    {"--ambient-max", "ambient.max", "TEMP", "highest ambient, e.g. 50C", "70C"},
    {"--coil-preset", "coil.preset", "ID", "start the coil from a preset of the parts table", ""},
    {"--coil-voltage", "coil.rated_voltage", "VOLTAGE", "coil rated voltage, e.g. 12V", ""},
    {"--coil-resistance", "coil.resistance", "OHMS", "coil resistance at its reference temperature, e.g. 400R", ""},
    {"--coil-tolerance", "coil.tolerance", "PERCENT", "coil resistance tolerance, e.g. 10%", "10%"},
    {"--coil-reference-temp", "coil.reference_temp", "TEMP", "temperature of the coil resistance figure, e.g. 20C",
     "20C"},
    {"--must-operate", "coil.must_operate", "PERCENT", "must-operate voltage in % of rated, e.g. 75%", "75%"},
    {"--must-release", "coil.must_release", "PERCENT", "must-release voltage in % of rated, e.g. 10%", "10%"},
    {"--coil-inductance", "coil.inductance", "INDUCTANCE", "coil inductance, armature energised, e.g. 0.9H", ""},
    {"--self-heating", "coil.self_heating", "KELVIN", "coil winding rise above ambient, e.g. 15K", "0K"},
    {"--coil-thermal-resistance", "coil.thermal_resistance", "K/W",
     "winding to ambient, e.g. 60K/W: the rise from its own power", ""},
    {"--coil-max-temperature", "coil.max_temperature", "TEMP", "insulation class limit, e.g. 130C: checks coil.thermal",
     ""},
    {"--must-operate-temp", "coil.must_operate_temp", "TEMP", "coil temperature the must-operate is stated at",
     "the reference"},
    {"--coil-max-voltage", "coil.max_voltage", "VOLTAGE", "highest continuous coil voltage, e.g. 15.6V", ""},
    {"--max-release-time", "coil.max_release_time", "TIME", "longest acceptable release time, e.g. 10ms", ""},
    {"--pin-preset", "pin.preset", "ID", "start the pin from a preset of the parts table", ""},
    {"--pin-vdd", "pin.vdd", "VOLTAGE", "pin supply (VDD), e.g. 3.3V", ""},
    {"--pin-vdd-tolerance", "pin.vdd_tolerance", "PERCENT", "pin supply tolerance, e.g. 5%", "5%"},
    {"--pin-voh", "pin.voh", "VOLTAGE", "guaranteed output high voltage at --pin-voh-current, e.g. 2.9V", ""},
    {"--pin-voh-current", "pin.voh_current", "CURRENT", "current of the VOH rating, e.g. 8mA", ""},
    {"--pin-voh-vdd", "pin.voh_vdd", "VOLTAGE", "the pin supply VOH is stated at", "the lowest VDD"},
    {"--pin-max-current", "pin.max_current", "CURRENT", "the pin's rated output current, e.g. 8mA", ""},
    {"--transistor", "transistor", "ID",
     "transistor id from the parts table (npn, darlington, nmos or array), e.g. 2N4401", ""},
    {"--clamp", "clamp.type", "TYPE", "clamp: diode, diode_zener, diode_resistor, diode_tvs or none", "diode"},
    {"--diode", "clamp.diode", "ID", "clamp diode id, e.g. 1N4148", ""},
    {"--zener", "clamp.zener", "ID", "zener id for a diode_zener clamp", ""},
    {"--tvs", "clamp.tvs", "ID", "TVS id for a diode_tvs clamp", ""},
    {"--clamp-resistor", "clamp.resistor", "OHMS", "resistor of a diode_resistor clamp, e.g. 470R", ""},
    {"--clamp-resistor-tolerance", "clamp.resistor_tolerance", "PERCENT", "its tolerance", "5%"},
    {"--clamp-resistor-power", "clamp.resistor_power", "POWER", "its power rating", "0.25W"},
    {"--series", "base_resistor.series", "SERIES", "E-series of the base resistor: E3 .. E192", "E24"},
    {"--resistor-tolerance", "base_resistor.tolerance", "PERCENT", "base resistor tolerance, e.g. 1%", "5%"},
    {"--resistor-power", "base_resistor.power_rating", "POWER", "base resistor power rating, e.g. 0.25W", "0.125W"},
    {"--base-resistor", "base_resistor.value", "OHMS", "fix the base resistor and check it, e.g. 1k2", ""},
    {"--choose", "base_resistor.choose", "largest|centred",
     "where the base resistor sits in its window: largest or centred", "largest"},
    {"--gate-resistor", "gate_resistor.value", "OHMS",
     "fix the gate resistor of an nmos driver and check it, e.g. 470R", ""},
    {"--gate-series", "gate_resistor.series", "SERIES", "E-series of the gate resistor", "E24"},
    {"--gate-tolerance", "gate_resistor.tolerance", "PERCENT", "gate resistor (and pull-down) tolerance", "5%"},
    {"--pulldown", "pulldown", "OHMS", "base-emitter or gate-source pull-down, e.g. 47k", "none (nmos: 100k)"},
    {"--forced-gain", "policy.forced_gain", "RATIO", "forced gain Ic/Ib for saturation", "10 (npn)"},
    {"--overdrive", "policy.overdrive", "RATIO", "base drive over minimum gain", "2"},
    {"--current-derating", "policy.current_derating", "PERCENT", "transistor current derating", "75%"},
    {"--voltage-derating", "policy.voltage_derating", "PERCENT", "transistor and diode voltage derating", "75%"},
    {"--junction-margin", "policy.junction_margin", "KELVIN", "margin below Tj max", "25K"},
    {"--power-derating", "policy.power_derating", "PERCENT", "resistor and zener power derating", "50%"},
    {"--vbe-low", "policy.vbe_low", "VOLTAGE", "lowest Vbe, for the highest pin current", "0.6V"},
    {"--frequency", "switching.frequency", "FREQUENCY", "switching frequency, e.g. 1Hz", ""},
    {"--duty", "switching.duty", "PERCENT", "on-time share of the switching period", "50%"},
    {"--load-voltage", "load.voltage", "VOLTAGE", "voltage the contacts switch, e.g. 230V", ""},
    {"--load-kind", "load.kind", "KIND",
     "kind of load: resistive, inductive, motor, lamp, capacitive, solenoid, transformer (or ac, dc)", ""},
    {"--load-current", "load.current", "CURRENT", "current the contacts switch, e.g. 2A", ""},
    {"--relay", "relay", "ID", "relay or contactor id from the parts table: fills the coil and the contacts", ""},
    {"--load-type", "load.type", "ac|dc", "ac or dc: what the contacts switch", ""},
    {"--load-inrush", "load.inrush", "CURRENT|Nx",
     "the load's inrush, in amperes (48A) or times the steady current (6x)", "by kind"},
    {"--load-power-factor", "load.power_factor", "RATIO", "power factor of an AC load, e.g. 0.8", ""},
    {"--load-time-constant", "load.time_constant", "TIME", "L/R of a DC load, e.g. 20ms", ""},
};

}  // namespace

std::span<const SpecFlag> spec_flags() { return {std::begin(table), std::end(table)}; }

std::string_view spec_flag_group(std::string_view path) {
    const std::string_view section = path.substr(0, path.find('.'));
    if (section == "name" || section == "supply" || section == "ambient") return "Spec: supply and ambient";
    if (section == "coil") return "Spec: coil";
    if (section == "pin") return "Spec: microcontroller pin";
    if (section == "clamp") return "Spec: clamp";
    if (section == "policy") return "Spec: method policy";
    if (section == "switching" || section == "load" || section == "relay") return "Spec: switching, relay and load";
    return "Spec: driver";  // transistor, base_resistor, gate_resistor, pulldown
}

}  // namespace coilfit::cli
