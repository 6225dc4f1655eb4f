#include "coilfit/check.hpp"

#include <algorithm>
#include <cmath>

namespace coilfit {
namespace {

// The check table: id, name, unit of value and limit, owning stage (one row per check).
constexpr std::array<CheckInfo, check_count> table{{
    {CheckId::coil_operate, "coil.operate", Unit::volt, Stage::coil},
    {CheckId::coil_overvoltage, "coil.overvoltage", Unit::volt, Stage::coil},
    {CheckId::transistor_current, "transistor.current", Unit::ampere, Stage::driver},
    {CheckId::transistor_voltage, "transistor.voltage", Unit::volt, Stage::clamp},
    {CheckId::transistor_saturation, "transistor.saturation", Unit::number, Stage::driver},
    {CheckId::transistor_thermal, "transistor.thermal", Unit::celsius, Stage::driver},
    {CheckId::pin_current, "pin.current", Unit::ampere, Stage::driver},
    {CheckId::resistor_power, "resistor.power", Unit::watt, Stage::driver},
    {CheckId::diode_voltage, "diode.voltage", Unit::volt, Stage::clamp},
    {CheckId::diode_current, "diode.current", Unit::ampere, Stage::clamp},
    {CheckId::clamp_power, "clamp.power", Unit::watt, Stage::clamp},
    {CheckId::release_time, "release.time", Unit::second, Stage::timing},
    {CheckId::coil_thermal, "coil.thermal", Unit::celsius, Stage::coil},
    {CheckId::gate_drive, "gate.drive", Unit::volt, Stage::driver},
    {CheckId::gate_voltage, "gate.voltage", Unit::volt, Stage::driver},
    {CheckId::input_drive, "input.drive", Unit::volt, Stage::driver},
    {CheckId::clamp_pulse, "clamp.pulse", Unit::watt, Stage::clamp},
    {CheckId::switching_timing, "switching.timing", Unit::second, Stage::timing},
    {CheckId::contact_voltage, "contact.voltage", Unit::volt, Stage::contact},
    {CheckId::contact_current, "contact.current", Unit::ampere, Stage::contact},
    {CheckId::contact_inrush, "contact.inrush", Unit::ampere, Stage::contact},
    {CheckId::contact_breaking, "contact.breaking", Unit::ampere, Stage::contact},
    {CheckId::contact_min_load, "contact.min_load", Unit::ampere, Stage::contact},
    {CheckId::port_current, "port.current", Unit::ampere, Stage::board},
    {CheckId::package_current, "package.current", Unit::ampere, Stage::board},
    {CheckId::supply_current, "supply.current", Unit::ampere, Stage::board},
    {CheckId::array_power, "array.power", Unit::watt, Stage::board},
    {CheckId::array_current, "array.current", Unit::ampere, Stage::board},
}};

constexpr bool table_in_order() {
    for (std::size_t i = 0; i < table.size(); ++i) {
        if (index_of(table[i].id) != i) return false;
    }
    return true;
}
static_assert(table_in_order(), "the check table lists the checks in CheckId order");

}  // namespace

std::string_view verdict_name(Verdict verdict) {
    switch (verdict) {
        case Verdict::pass:
            return "pass";
        case Verdict::warn:
            return "warn";
        case Verdict::fail:
            return "fail";
        case Verdict::skip:
            return "skip";
    }
    return "skip";
}

const CheckInfo& check_info(CheckId id) { return table.at(index_of(id)); }
std::string_view check_id_name(CheckId id) { return check_info(id).name; }
Unit check_unit(CheckId id) { return check_info(id).unit; }

bool CheckSet::passes() const {
    return std::none_of(values.begin(), values.end(), [](const CheckValue& c) { return c.verdict == Verdict::fail; });
}

void mark_beyond_data(CheckValue& c) {
    c.beyond_data = true;
    if (c.verdict == Verdict::pass) c.verdict = Verdict::warn;
}

}  // namespace coilfit
