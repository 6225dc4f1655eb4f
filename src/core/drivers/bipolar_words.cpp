// The words of the bipolar driver's checks (numbers in bipolar.cpp).
#include <string>

#include "coilfit/drivers/bipolar.hpp"
#include "coilfit/sizing.hpp"

namespace coilfit {
namespace {

std::string q(double value, Unit unit) { return format_quantity(value, unit); }
std::string n(double value) { return format_quantity(value, Unit::number); }

std::string saturation(const CheckValue& c, const Spec& spec, const BipolarCorner& f) {
    const Policy& p = spec.policy;
    const std::string target = "the target " + n(f.beta_target) + " = min(forced gain " + n(f.forced_gain_policy) +
                               ", hFE min " + n(f.hfe_min) + " / overdrive " + n(p.overdrive) + ")";
    if (c.detail == static_cast<std::uint8_t>(BipolarCase::no_resistor)) {
        return "no resistor of the " + std::string(eseries_name(spec.base_resistor.series)) +
               " series drives the base hard enough: the pin at " +
               q(spec.pin.vdd_v * (1 - spec.pin.vdd_tolerance), Unit::volt) + " less Vbe(sat) " +
               q(f.vbe_sat_v, Unit::volt) + " cannot deliver " + q(f.base_current_required_a, Unit::ampere) +
               "; use a higher-gain transistor or a buffer";
    }
    if (c.detail == static_cast<std::uint8_t>(BipolarCase::no_base_current)) {
        return "the base gets no current at the low corner (the pull-down takes it all): the transistor does not "
               "switch "
               "on; use a smaller base resistor or a larger pull-down";
    }
    std::string m = "worst-case forced gain Ic/Ib " + n(f.forced_gain_worst) + " against " + target;
    if (c.verdict == Verdict::fail) m += ": the transistor may not saturate; use a smaller base resistor";
    if (c.verdict == Verdict::warn && f.vce_sat_not_guaranteed) {
        m += "; Vce(sat) is specified at Ic/Ib = " + n(f.vce_sat_test_ratio) +
             " and is not guaranteed at this looser drive";
    }
    return m;
}

std::string pin_current(const CheckValue& c, bool ok, const Spec& spec, const BipolarCorner& f) {
    const double vdd_lo = spec.pin.vdd_v * (1 - spec.pin.vdd_tolerance);
    if (c.detail == static_cast<std::uint8_t>(BipolarCase::pin_below_vbe)) {
        // No gain helps when the pin's own voltage does not reach Vbe(sat).
        return "the pin's lowest VDD " + q(vdd_lo, Unit::volt) + " does not reach Vbe(sat) " +
               q(f.vbe_sat_v, Unit::volt) +
               ": no base resistor and no gain can switch this transistor on; use a pin with a higher supply or a "
               "buffer";
    }
    if (c.detail == static_cast<std::uint8_t>(BipolarCase::no_resistor)) {
        return "no base resistor can be chosen, so the pin cannot drive this transistor; a part with hFE of at least " +
               n(f.hfe_needed) + " at " + q(f.current_a, Unit::ampere) + " would";
    }
    std::string m = "the pin sources up to " + q(c.value, Unit::ampere) + " at " +
                    q(spec.pin.vdd_v * (1 + spec.pin.vdd_tolerance), Unit::volt) + " against its limit " +
                    q(c.limit, Unit::ampere);
    if (!ok) {
        m += ": the base resistor must be at least " + q(f.base_resistor_min_ohm, Unit::ohm) +
             " for the pin but at most " + q(f.base_resistor_max_ohm, Unit::ohm) + " to saturate the transistor";
        if (f.policy_binds) {
            // The forced-gain policy, not the part's gain, sets the base current.
            m += "; the forced gain " + n(f.forced_gain_policy) +
                 " sets the base current, so more hFE does not help: use a Darlington, a pin or buffer that can "
                 "source " +
                 q(c.value, Unit::ampere) + ", or a looser policy.forced_gain (Vce(sat) is then not guaranteed)";
        } else {
            m += "; use a transistor with hFE min of at least " + n(f.hfe_needed) + " at " +
                 q(f.current_a, Unit::ampere) + " (a Darlington, say), or a pin or buffer that can source " +
                 q(c.value, Unit::ampere);
        }
    }
    return m;
}

}  // namespace

std::string bipolar_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e) {
    const auto& figures = std::get<BipolarFigures>(e.drive);
    const BipolarCorner& f = figures.at[static_cast<std::size_t>(c.corner)];
    const Bipolar& tr = *spec.bipolar();
    const Policy& p = spec.policy;
    const bool ok = c.verdict == Verdict::pass || c.verdict == Verdict::warn;
    switch (id) {
        case CheckId::transistor_current:
            return "coil current up to " + q(c.value, Unit::ampere) + " against " + q(c.limit, Unit::ampere) + " (" +
                   q(p.current_derating, Unit::ratio) + " of Ic max " + q(tr.ic_max_a, Unit::ampere) + ")" +
                   (ok ? std::string()
                       : ": choose a transistor rated for at least " + q(c.value / p.current_derating, Unit::ampere));
        case CheckId::transistor_saturation:
            return saturation(c, spec, f);
        case CheckId::transistor_thermal:
            return "junction up to " + q(c.value, Unit::celsius) + " at " + q(f.thermal_ambient_c, Unit::celsius) +
                   " ambient (" + q(f.transistor_power_w, Unit::watt) + " at " + q(rth_ja(tr), Unit::kelvin_per_watt) +
                   ") against " + q(c.limit, Unit::celsius) + " (Tj max less " + q(p.junction_margin_k, Unit::kelvin) +
                   ")" + (ok ? std::string() : ": use a transistor in a larger package or with a lower Vce(sat)");
        case CheckId::pin_current:
            return pin_current(c, ok, spec, f);
        case CheckId::resistor_power:
            return "the base resistor dissipates up to " + q(c.value, Unit::watt) + " against " +
                   q(c.limit, Unit::watt) + " (" + q(p.power_derating, Unit::ratio) + " of " +
                   q(spec.base_resistor.power_rating_w, Unit::watt) + ")" +
                   (ok ? std::string() : ": use a resistor with a higher power rating");
        default:
            return {};
    }
}

}  // namespace coilfit
