// The words of the nmos driver's checks (numbers in mosfet.cpp).
#include <string>

#include "coilfit/drivers/mosfet.hpp"
#include "coilfit/sizing.hpp"

namespace coilfit {
namespace {

std::string q(double value, Unit unit) { return format_quantity(value, unit); }

std::string gate_drive(const CheckValue& c, bool ok, const Mosfet& m, const MosfetCorner& f) {
    if (c.detail == static_cast<std::uint8_t>(GateCase::no_rds_point) || !ok) {
        return "Rds(on) is not specified at or below the " + q(c.value, Unit::volt) +
               " this pin guarantees at the gate (lowest VDD through the gate resistor, threshold risen when cold); "
               "the lowest gate voltage with a stated Rds(on) is " +
               q(c.limit, Unit::volt) + ". Vgs(th) max " + q(m.vgs_th_max_v, Unit::volt) +
               " is a small-current threshold, not an on-state: use a part rated at a lower gate voltage, or a pin "
               "with a higher supply";
    }
    const RdsOnPoint& pt = m.rds_on[static_cast<std::size_t>(f.rds_point)];
    return "the gate gets at least " + q(c.value, Unit::volt) + "; Rds(on) max " + q(pt.max_ohm, Unit::ohm) +
           " is stated at " + q(pt.vgs_v, Unit::volt) + " (lowest stated " + q(c.limit, Unit::volt) + ")";
}

std::string pin_current(const CheckValue& c, bool ok, const Spec& spec, const MosfetFigures& fig) {
    if (c.detail == static_cast<std::uint8_t>(GateCase::no_resistor)) {
        return "no gate resistor of the " + std::string(eseries_name(spec.gate_resistor.series)) +
               " series keeps the pin within its limit";
    }
    const bool dc = c.detail == static_cast<std::uint8_t>(GateCase::pulldown_dc);
    std::string m = std::string(dc ? "the pull-down draws up to " : "charging the gate, the pin sources up to ") +
                    q(c.value, Unit::ampere) + " against its rated output current " + q(c.limit, Unit::ampere);
    if (!ok) m += ": use a gate resistor of at least " + q(fig.gate_resistor_min_ohm, Unit::ohm);
    return m;
}

}  // namespace

std::string mosfet_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e) {
    const auto& fig = std::get<MosfetFigures>(e.drive);
    const MosfetCorner& f = fig.at[static_cast<std::size_t>(c.corner)];
    const Mosfet& m = *spec.mosfet();
    const Policy& p = spec.policy;
    const bool ok = c.verdict == Verdict::pass || c.verdict == Verdict::warn;
    switch (id) {
        case CheckId::gate_drive:
            return gate_drive(c, ok, m, f);
        case CheckId::gate_voltage:
            return "the gate sees up to " + q(c.value, Unit::volt) + " against Vgs max " + q(c.limit, Unit::volt) +
                   (ok ? std::string() : ": use a part with a higher gate rating or divide the gate drive");
        case CheckId::pin_current:
            return pin_current(c, ok, spec, fig);
        case CheckId::transistor_current:
            return "coil current up to " + q(c.value, Unit::ampere) + " against " + q(c.limit, Unit::ampere) + " (" +
                   q(p.current_derating, Unit::ratio) + " of Id max " + q(m.id_max_a, Unit::ampere) + ")" +
                   (ok ? std::string()
                       : ": choose a MOSFET rated for at least " + q(c.value / p.current_derating, Unit::ampere));
        case CheckId::transistor_thermal:
            if (!c.has_value) {
                return "thermal runaway: Rds(on) rises with temperature faster than the package sheds the heat (I^2 "
                       "Rds(on) "
                       "tc RthJA >= 1); use a part with a lower Rds(on) or a larger package";
            }
            return "junction up to " + q(c.value, Unit::celsius) + " (" + q(f.thermal.power_w, Unit::watt) +
                   ", Rds(on) " + q(f.thermal.rds_ohm, Unit::ohm) + " hot, " + q(rth_ja(m), Unit::kelvin_per_watt) +
                   ") against " + q(c.limit, Unit::celsius) + " (Tj max less " + q(p.junction_margin_k, Unit::kelvin) +
                   ")" + (ok ? std::string() : ": use a part with a lower Rds(on) or a larger package");
        default:
            return {};
    }
}

}  // namespace coilfit
