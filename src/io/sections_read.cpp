#include "io/sections_read.hpp"

#include <fmt/format.h>

#include "io/plausible.hpp"

namespace coilfit::io {
namespace {

constexpr double absolute_zero_c = -273.15;

std::string volts(double v) { return format_quantity(v, Unit::volt, 6); }

// A field the spec needs; a preset may leave it to the spec (partial).
std::optional<double> needed(ObjectReader& r, const std::string& key, Unit unit, bool partial) {
    if (partial) return r.quantity(key, unit);
    return r.required(key, unit);
}

void read_operate_levels(ObjectReader& r, CoilSpec& c, std::vector<std::string>& defaults, bool partial) {
    if (auto v = r.quantity("must_operate", Unit::ratio)) {
        c.must_operate = r.fraction("must_operate", r.positive("must_operate", *v), 0.0, 1.0, true);
    } else {
        defaults.push_back("coil.must_operate " + percent_words(c.must_operate) +
                           " of rated voltage (typical relay data)");
    }
    if (auto v = r.quantity("must_release", Unit::ratio))
        c.must_release = r.fraction("must_release", *v, 0.0, 1.0, false);
    else
        defaults.push_back("coil.must_release " + percent_words(c.must_release) +
                           " of rated voltage (typical relay data)");
    const bool both_levels = !partial || (r.has("must_operate") && r.has("must_release"));
    if (both_levels && c.must_release >= c.must_operate) {
        // Name the field the user wrote: must_operate when must_release is the default.
        if (!r.has("must_release")) {
            r.fail_at("must_operate",
                      fmt::format("expected above coil.must_release {} (the default; give coil.must_release), got {}",
                                  percent_words(c.must_release), percent_words(c.must_operate)));
        }
        r.fail_at("must_release", fmt::format("expected below coil.must_operate {}, got {}",
                                              percent_words(c.must_operate), percent_words(c.must_release)));
    }
    if (auto v = r.quantity("must_operate_temp", Unit::celsius))
        c.must_operate_temp_c = temperature(r, "must_operate_temp", *v, -55.0, 200.0);
}

void read_heating(ObjectReader& r, CoilSpec& c) {
    if (auto v = r.quantity("self_heating", Unit::kelvin)) c.self_heating_k = r.within("self_heating", *v, 0.0, 200.0);
    if (auto v = r.quantity("thermal_resistance", Unit::kelvin_per_watt)) {
        if (c.self_heating_k) r.fail_at("thermal_resistance", "given with coil.self_heating; give one of the two");
        c.thermal_resistance_k_per_w = r.within("thermal_resistance", r.positive("thermal_resistance", *v), 0.1, 1e4);
    }
    if (auto v = r.quantity("max_temperature", Unit::celsius))
        c.max_temperature_c = temperature(r, "max_temperature", *v, 20.0, 250.0);
}

// The rated coil current, rated voltage over resistance, must be a plausible coil current: a
// resistance typed in kΩ as a plain number ("0.4" for 400 Ω) gives tens of amperes.
void coil_current(const ObjectReader& r, const CoilSpec& c) {
    const PlausibleRange& range = plausible_range(Plausible::coil_current);
    const double i = c.rated_voltage_v / c.resistance_ohm;
    if (i >= range.lo && i <= range.hi) return;
    const PlausibleRange& res = plausible_range(Plausible::coil_resistance);
    const PlausibleRange as_current{Plausible::coil_resistance, res.noun, Unit::ohm, c.rated_voltage_v / range.hi,
                                    c.rated_voltage_v / range.lo};
    const std::string hint = plausible_suggestion(c.resistance_ohm, as_current);
    r.fail_at("resistance",
              fmt::format("{} across {} is {}, not a plausible coil current ({} to {}){}",
                          format_quantity(c.rated_voltage_v, Unit::volt, 6),
                          format_quantity(c.resistance_ohm, Unit::ohm, 6), format_quantity(i, Unit::ampere),
                          format_quantity(range.lo, Unit::ampere), format_quantity(range.hi, Unit::ampere),
                          hint.empty() ? std::string() : "; did you mean " + hint + "?"));
}

}  // namespace

std::string percent_words(double x) { return fmt::format("{:g} %", x * 100.0); }

double temperature(ObjectReader& r, const std::string& key, double value, double lo, double hi) {
    if (value < absolute_zero_c) {
        r.fail_at(key, fmt::format("expected a temperature above absolute zero (-273.15 °C), got {}",
                                   format_quantity(value, Unit::celsius)));
    }
    return r.within(key, value, lo, hi);
}

void read_coil(ObjectReader& r, CoilSpec& c, std::vector<std::string>& defaults, bool partial) {
    if (partial && r.has("preset")) r.fail_at("preset", "expected no preset inside a preset");
    if (auto p = r.text("preset", 64)) c.preset = *p;
    if (auto v = needed(r, "rated_voltage", Unit::volt, partial)) {
        c.rated_voltage_v = plausible(r, "rated_voltage", r.positive("rated_voltage", *v), Plausible::supply_voltage);
    }
    if (auto v = needed(r, "resistance", Unit::ohm, partial))
        c.resistance_ohm = plausible(r, "resistance", r.positive("resistance", *v), Plausible::coil_resistance);
    if (!partial || (r.has("rated_voltage") && r.has("resistance"))) coil_current(r, c);
    if (auto v = r.quantity("tolerance", Unit::ratio))
        c.tolerance = r.fraction("tolerance", *v, 0.0, 0.5, true);
    else
        defaults.push_back("coil.tolerance " + percent_words(c.tolerance) + " (common practice)");
    if (auto v = r.quantity("reference_temp", Unit::celsius))
        c.reference_temp_c = temperature(r, "reference_temp", *v, -55.0, 125.0);
    else
        defaults.push_back(fmt::format("coil.reference_temp {:g} °C", c.reference_temp_c));
    read_operate_levels(r, c, defaults, partial);
    read_heating(r, c);
    if (!c.self_heating_k && !c.thermal_resistance_k_per_w) defaults.push_back("coil.self_heating 0 K");
    if (auto v = r.quantity("inductance", Unit::henry))
        c.inductance_h = r.within("inductance", r.positive("inductance", *v), 1e-6, 1e4);
    if (auto v = r.quantity("max_voltage", Unit::volt)) {
        c.max_voltage_v = plausible(r, "max_voltage", r.positive("max_voltage", *v), Plausible::supply_voltage);
        // Below the rated voltage is a typo: the coil could not be run at its own rating.
        if ((!partial || r.has("rated_voltage")) && *c.max_voltage_v < c.rated_voltage_v) {
            r.fail_at("max_voltage", fmt::format("expected at least coil.rated_voltage {}, got {}",
                                                 volts(c.rated_voltage_v), volts(*c.max_voltage_v)));
        }
    }
    if (auto v = r.quantity("max_release_time", Unit::second)) {
        c.max_release_time_s = r.within("max_release_time", r.positive("max_release_time", *v), 1e-6, 100.0);
    }
}

void read_pin(ObjectReader& r, PinSpec& p, std::vector<std::string>& defaults, bool partial) {
    if (partial && r.has("preset")) r.fail_at("preset", "expected no preset inside a preset");
    if (auto v = r.text("preset", 64)) p.preset = *v;
    if (auto v = needed(r, "vdd", Unit::volt, partial))
        p.vdd_v = plausible(r, "vdd", r.positive("vdd", *v), Plausible::pin_voltage);
    if (auto v = r.quantity("vdd_tolerance", Unit::ratio))
        p.vdd_tolerance = r.fraction("vdd_tolerance", *v, 0.0, 0.5, true);
    else
        defaults.push_back("pin.vdd_tolerance " + percent_words(p.vdd_tolerance));
    if (auto v = needed(r, "max_current", Unit::ampere, partial)) {
        p.max_current_a = plausible(r, "max_current", r.positive("max_current", *v), Plausible::pin_current);
    }
    if (auto v = r.quantity("voh", Unit::volt)) {
        if (!(*v > 0)) r.fail_at("voh", fmt::format("expected a voltage greater than zero, got {}", volts(*v)));
        if ((!partial || r.has("vdd")) && *v > p.vdd_v) {
            r.fail_at("voh", fmt::format("expected at most pin.vdd {}, got {}", volts(p.vdd_v), volts(*v)));
        }
        p.voh_v = *v;
    }
    if (auto v = r.quantity("voh_current", Unit::ampere))
        p.voh_current_a = plausible(r, "voh_current", r.positive("voh_current", *v), Plausible::pin_current);
    if (auto v = r.quantity("voh_vdd", Unit::volt))
        p.voh_vdd_v = plausible(r, "voh_vdd", r.positive("voh_vdd", *v), Plausible::pin_voltage);
    if (!partial) {
        if (p.voh_v && !p.voh_current_a)
            r.fail_at("voh_current", "missing; pin.voh needs the current it is rated at, such as \"8mA\"");
        if (p.voh_current_a && !p.voh_v)
            r.fail_at("voh", "missing; pin.voh_current needs the voltage rated at it, such as \"2.9V\"");
        if (p.voh_vdd_v && p.voh_v && *p.voh_v > *p.voh_vdd_v) {
            r.fail_at("voh",
                      fmt::format("expected at most pin.voh_vdd {}, got {}", volts(*p.voh_vdd_v), volts(*p.voh_v)));
        }
    }
}

void check_preset_fields(const Json& fields, const std::string& kind, const Origin& origin, const std::string& path) {
    Spec scratch;
    ObjectReader r(fields, origin, path);
    if (kind == "coil")
        read_coil(r, scratch.coil, scratch.defaults_used, true);
    else
        read_pin(r, scratch.pin, scratch.defaults_used, true);
    r.finish();
}

}  // namespace coilfit::io
