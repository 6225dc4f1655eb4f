#include "pick_reasons.hpp"

#include <algorithm>

namespace coilfit::pick_detail {
namespace {

std::string q(double value, Unit unit) { return format_quantity(value, unit); }

std::string bipolar_drive_reason(const Evaluation& e, const std::string& family, Corner corner) {
    const BipolarCorner& f = std::get<BipolarFigures>(e.drive).at[static_cast<std::size_t>(corner)];
    const std::string at = " at " + q(f.current_a, Unit::ampere);
    // A pin whose lowest VDD does not reach Vbe(sat) drives no base current through any
    // resistor; a Darlington, whose Vbe(sat) is higher still, would not help.
    if (e.conditions.vdd_lo_v <= f.vbe_sat_v) {
        return "the pin's lowest VDD of " + q(e.conditions.vdd_lo_v, Unit::volt) +
               " does not reach their Vbe(sat) of " + q(f.vbe_sat_v, Unit::volt) +
               ", so no base resistor can drive them; a higher pin voltage, a level-shifting "
               "stage or a logic-level MOSFET would";
    }
    if (f.policy_binds) {
        return "the pin can't supply the base current that forced gain " +
               format_quantity(f.forced_gain_policy, Unit::number) + " asks for (" +
               q(f.base_current_required_a, Unit::ampere) + "); " +
               (family == "darlington"
                    ? "a pin or buffer that can source it would, or a logic-level MOSFET"
                    : "a Darlington would, or a logic-level MOSFET, or a pin or buffer that can source it");
    }
    return "the pin can't supply the base current; " + (family == "darlington" ? std::string() : "a Darlington or ") +
           "a part with hFE min of at least " + format_quantity(f.hfe_needed, Unit::number) + at + " would";
}

std::string reason_for(const std::string& check, const Evaluation& e, const Spec& spec, const std::string& family) {
    const CheckValue* v = nullptr;
    for (std::size_t i = 0; i < check_count; ++i) {
        if (check_id_name(static_cast<CheckId>(i)) == check) v = &e.checks.values[i];
    }
    const Corner corner = v ? v->corner : Corner::cold;
    const std::string at = " at " + q(e.coil_current_max_a(), Unit::ampere);
    const bool bipolar = std::holds_alternative<BipolarFigures>(e.drive);
    if (bipolar && (check == "pin.current" || check == "transistor.saturation"))
        return bipolar_drive_reason(e, family, corner);
    if (check == "gate.drive") {
        return "the gate gets only " + q(v->value, Unit::volt) +
               " from this pin, below the lowest gate voltage their Rds(on) is "
               "stated at; a part rated at a lower gate voltage would";
    }
    if (check == "gate.voltage") return "the pin's highest VDD exceeds their Vgs max";
    if (check == "pin.current") return "the pin cannot carry the drive current they need";
    if (check == "input.drive") return "the pin's lowest VDD does not reach the input voltage that guarantees them on";
    if (check == "transistor.current") {
        return "the coil current" + at + " is above " + q(spec.policy.current_derating, Unit::ratio) +
               " of their current rating";
    }
    if (check == "transistor.voltage") {
        return e.clamp.at[0].v.limited ? "the peak " + std::string(e.driver.terminal) + " voltage of " +
                                             q(e.peak_collector_voltage_v(), Unit::volt) + " is above " +
                                             q(spec.policy.voltage_derating, Unit::ratio) + " of their voltage rating"
                                       : "without a clamp no transistor survives turn-off";
    }
    if (check == "transistor.thermal") return "the junction runs too hot at the highest ambient";
    if (check == "coil.operate") {
        return "the coil gets only " + q(v->value, Unit::volt) + " (lowest supply less their " +
               std::string(e.driver.drop_name) + " of " + q(e.driver_at(corner).on_drop_v, Unit::volt) +
               ") but needs " + q(v->limit, Unit::volt) + " to operate when hot";
    }
    if (check == "coil.overvoltage") return "the coil's maximum voltage is exceeded whatever the transistor";
    if (check == "resistor.power") return "the base resistor's power rating is too low for the base current they need";
    if (check.rfind("diode.", 0) == 0 || check == "clamp.power") return "no diode of the table passes " + check;
    if (check == "release.time") return "the release is too slow with this clamp type; try diode_zener";
    return "fails " + check;
}

bool driver_side(const std::string& id) {
    return id.rfind("transistor.", 0) == 0 || id == "pin.current" || id.rfind("gate.", 0) == 0 || id == "input.drive";
}

}  // namespace

void FamilyFailures::add(const Candidate& c, const Evaluation& e) {
    // Word the family's reason by its driver-side failure when there is one.
    std::string key = c.failed.front();
    for (const auto& f : c.failed) {
        if (driver_side(f)) {
            key = f;
            break;
        }
    }
    ++counts_[c.family][key];
    examples_.emplace(c.family + "|" + key, e);
}

std::vector<std::string> FamilyFailures::reasons(const Spec& spec) const {
    std::vector<std::string> out;
    for (const auto& [family, counts] : counts_) {
        const auto most = std::max_element(counts.begin(), counts.end(),
                                           [](const auto& a, const auto& b) { return a.second < b.second; });
        const Evaluation& e = examples_.at(family + "|" + most->first);
        out.push_back("every " + family + " part: " + reason_for(most->first, e, spec, family));
    }
    return out;
}

}  // namespace coilfit::pick_detail
