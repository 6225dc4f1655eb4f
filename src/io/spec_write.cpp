// The resolved spec back to JSON, every value in SI numbers (the report's "input").
#include "io/spec_io.hpp"

namespace coilfit::io {
namespace {

template <typename T>
Json opt(const std::optional<T>& v) {
    return v ? Json(*v) : Json(nullptr);
}

Json supply_json(const SupplySpec& s) {
    Json j;
    if (s.voltage_v > 0) j["voltage"] = s.voltage_v;
    if (s.min_v || s.max_v) {
        j["min"] = s.lo_v();
        j["max"] = s.hi_v();
    } else {
        j["tolerance"] = s.tolerance;
    }
    if (s.transient_max_v) j["transient_max"] = *s.transient_max_v;
    return j;
}

Json coil_json(const CoilSpec& c) {
    Json coil;
    if (!c.preset.empty()) coil["preset"] = c.preset;
    coil["rated_voltage"] = c.rated_voltage_v;
    coil["resistance"] = c.resistance_ohm;
    coil["tolerance"] = c.tolerance;
    coil["reference_temp"] = c.reference_temp_c;
    coil["must_operate"] = c.must_operate;
    coil["must_release"] = c.must_release;
    if (c.must_operate_temp_c) coil["must_operate_temp"] = *c.must_operate_temp_c;
    if (c.thermal_resistance_k_per_w)
        coil["thermal_resistance"] = *c.thermal_resistance_k_per_w;
    else
        coil["self_heating"] = c.self_heating_k.value_or(defaults::self_heating_k);
    if (c.max_temperature_c) coil["max_temperature"] = *c.max_temperature_c;
    if (c.inductance_h) coil["inductance"] = *c.inductance_h;
    if (c.max_voltage_v) coil["max_voltage"] = *c.max_voltage_v;
    if (c.max_release_time_s) coil["max_release_time"] = *c.max_release_time_s;
    return coil;
}

Json pin_json(const PinSpec& p) {
    Json pin;
    if (!p.preset.empty()) pin["preset"] = p.preset;
    pin["vdd"] = p.vdd_v;
    pin["vdd_tolerance"] = p.vdd_tolerance;
    if (p.voh_v) pin["voh"] = *p.voh_v;
    if (p.voh_current_a) pin["voh_current"] = *p.voh_current_a;
    if (p.voh_vdd_v) pin["voh_vdd"] = *p.voh_vdd_v;
    pin["max_current"] = p.max_current_a;
    return pin;
}

Json clamp_json(const ClampSpec& c) {
    Json clamp;
    clamp["type"] = clamp_type_name(c.type);
    if (c.diode) clamp["diode"] = to_json(*c.diode);
    if (c.zener) clamp["zener"] = to_json(*c.zener);
    if (c.tvs) clamp["tvs"] = to_json(*c.tvs);
    if (c.resistor_ohm) {
        clamp["resistor"] = *c.resistor_ohm;
        clamp["resistor_tolerance"] = c.resistor_tolerance;
        clamp["resistor_power"] = c.resistor_power_w;
    }
    return clamp;
}

Json policy_json(const Policy& p) {
    Json policy;
    policy["forced_gain"] = opt(p.forced_gain);
    policy["overdrive"] = p.overdrive;
    policy["current_derating"] = p.current_derating;
    policy["voltage_derating"] = p.voltage_derating;
    policy["junction_margin"] = p.junction_margin_k;
    policy["power_derating"] = p.power_derating;
    policy["vbe_low"] = p.vbe_low_v;
    return policy;
}

}  // namespace

Json spec_to_json(const Spec& s) {
    Json j;
    j["schema"] = spec_schema;
    j["name"] = s.name;
    j["supply"] = supply_json(s.supply);
    j["ambient"] = {{"min", s.ambient.min_c}, {"max", s.ambient.max_c}};
    j["coil"] = coil_json(s.coil);
    j["pin"] = pin_json(s.pin);
    j["transistor"] = to_json(s.transistor);
    j["clamp"] = clamp_json(s.clamp);
    if (s.bipolar()) {
        Json rb;
        rb["series"] = eseries_name(s.base_resistor.series);
        rb["tolerance"] = s.base_resistor.tolerance;
        rb["power_rating"] = s.base_resistor.power_rating_w;
        if (s.base_resistor.value_ohm) rb["value"] = *s.base_resistor.value_ohm;
        rb["choose"] = s.base_resistor.choose == ResistorChoice::centred ? "centred" : "largest";
        j["base_resistor"] = rb;
    }
    if (s.mosfet()) {
        Json rg;
        rg["series"] = eseries_name(s.gate_resistor.series);
        rg["tolerance"] = s.gate_resistor.tolerance;
        if (s.gate_resistor.value_ohm) rg["value"] = *s.gate_resistor.value_ohm;
        j["gate_resistor"] = rg;
        j["pulldown"] = s.pulldown_ohm.value_or(defaults::nmos_pulldown_ohm);
    } else {
        j["pulldown"] = opt(s.pulldown_ohm);
    }
    j["policy"] = policy_json(s.policy);
    j["switching"] = {{"frequency", opt(s.switching.frequency_hz)}, {"duty", s.switching.duty}};
    if (s.load) {
        const LoadSpec& l = *s.load;
        j["load"] = {{"voltage", l.voltage_v},
                     {"type", l.kind == LoadKind::ac ? "ac" : "dc"},
                     {"kind", load_class_name(l.load_class)},
                     {"current", opt(l.current_a)},
                     {"inrush", opt(load_inrush_a(l))},
                     {"power_factor", opt(l.power_factor)},
                     {"time_constant", opt(l.time_constant_s)}};
    } else {
        j["load"] = nullptr;
    }
    j["relay"] = s.relay ? to_json(*s.relay) : Json(nullptr);
    return j;
}

}  // namespace coilfit::io
