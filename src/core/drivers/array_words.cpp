// The words of an array channel's checks (numbers in array.cpp).
#include <string>

#include "coilfit/drivers/array.hpp"
#include "coilfit/sizing.hpp"

namespace coilfit {
namespace {

std::string q(double value, Unit unit) { return format_quantity(value, unit); }

}  // namespace

std::string array_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e) {
    const ArrayPart& a = *spec.array();
    const auto& fig = std::get<ArrayFigures>(e.drive);
    const ArrayCorner& f = fig.at[static_cast<std::size_t>(c.corner)];
    const Policy& p = spec.policy;
    const bool ok = c.verdict == Verdict::pass || c.verdict == Verdict::warn;
    switch (id) {
        case CheckId::pin_current:
            return "the pin drives the built-in " + q(a.input_resistor_ohm, Unit::ohm) + " input resistor with up to " +
                   q(c.value, Unit::ampere) + " against its rated output current " + q(c.limit, Unit::ampere) +
                   (ok ? std::string() : ": use a pin that can source it, or an array with a larger input resistor");
        case CheckId::input_drive:
            return "the pin's lowest VDD " + q(c.value, Unit::volt) + " against the input voltage " +
                   q(c.limit, Unit::volt) + " that guarantees the output on at " +
                   q(e.coil_at(c.corner).current_max_a, Unit::ampere) +
                   (ok ? std::string()
                       : ": the channel may not switch fully on; use a pin with a higher supply or a MOSFET array");
        case CheckId::transistor_current:
            return "coil current up to " + q(c.value, Unit::ampere) + " against " + q(c.limit, Unit::ampere) + " (" +
                   q(p.current_derating, Unit::ratio) + " of the channel's Ic max " + q(a.ic_max_a, Unit::ampere) +
                   ")" + (ok ? std::string() : ": use two channels in parallel or a driver rated for it");
        case CheckId::transistor_thermal:
            return "this channel alone heats the package junction to " + q(c.value, Unit::celsius) + " (" +
                   q(f.power_w, Unit::watt) + ") against " + q(c.limit, Unit::celsius) +
                   "; channels on together add up (coilfit board checks the package)";
        default:
            return {};
    }
}

}  // namespace coilfit
