// The words of the clamp stage's checks (numbers in clamp.cpp).
#include <cmath>
#include <string>

#include "coilfit/clamp.hpp"
#include "coilfit/sizing.hpp"

namespace coilfit {
namespace {

std::string q(double value, Unit unit) { return format_quantity(value, unit); }

std::string transistor_voltage(const CheckValue& c, bool ok, const Spec& spec, const Evaluation& e) {
    const DriverCommon& d = e.driver;
    const Policy& p = spec.policy;
    if (!e.clamp_at(c.corner).v.limited) {
        return "no clamp: at turn-off the " + std::string(d.terminal) +
               " voltage is limited only by breakdown, and the stored energy 1/2 L I^2" +
               (spec.coil.inductance_h ? " (" + q(e.clamp.stored_energy_j, Unit::joule) + ")" : std::string()) +
               " goes into the transistor; fit a diode across the coil";
    }
    return "peak " + std::string(d.terminal) + " voltage " + q(c.value, Unit::volt) + " at turn-off against " +
           q(c.limit, Unit::volt) + " (" + q(p.voltage_derating, Unit::ratio) + " of " + std::string(d.rating_name) +
           " " + q(d.rated_voltage_v, Unit::volt) + ")" +
           (ok ? std::string()
               : ": use a lower clamp voltage or a transistor with " + std::string(d.rating_name) + " of at least " +
                     q(c.value / p.voltage_derating, Unit::volt));
}

}  // namespace

std::string clamp_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e) {
    const Policy& p = spec.policy;
    const bool ok = c.verdict == Verdict::pass || c.verdict == Verdict::warn;
    switch (id) {
        case CheckId::transistor_voltage:
            return transistor_voltage(c, ok, spec, e);
        case CheckId::diode_voltage:
            return "the diode blocks up to " + q(c.value, Unit::volt) + " against " + q(c.limit, Unit::volt) + " (" +
                   q(p.voltage_derating, Unit::ratio) + " of VRRM " +
                   q(spec.clamp.diode ? spec.clamp.diode->vrrm_v : 0.0, Unit::volt) + ")" +
                   (ok ? std::string() : ": use a diode with a higher reverse voltage rating");
        case CheckId::diode_current:
            if (c.detail == static_cast<std::uint8_t>(DiodeCurrentCase::average)) {
                return "the clamp carries " + q(c.value, Unit::ampere) + " on average at " +
                       q(spec.switching.frequency_hz.value_or(0), Unit::hertz) +
                       " against the diode's average rating " + q(c.limit, Unit::ampere) +
                       (ok ? std::string() : ": use a larger diode or switch less often");
            }
            return "the diode takes the whole coil current " + q(c.value, Unit::ampere) + " at turn-off against its " +
                   (spec.clamp.diode && spec.clamp.diode->ifrm_a ? "repetitive peak rating IFRM "
                                                                 : "average rating IF(AV) ") +
                   q(c.limit, Unit::ampere) +
                   (ok ? std::string() : ": use a diode with a higher repetitive peak current rating");
        case CheckId::clamp_pulse:
            if (c.detail == static_cast<std::uint8_t>(PulseCase::avalanche)) {
                if (!c.has_value)
                    return "no clamp and the supply reaches the MOSFET's Vds max: it avalanches with no limit; fit a "
                           "clamp";
                return "no clamp: each turn-off drives " + q(c.value, Unit::joule) +
                       " of avalanche energy into the MOSFET against " + q(c.limit, Unit::joule) + " (" +
                       q(p.power_derating, Unit::ratio) + " of its repetitive rating EAR)" +
                       (ok ? std::string("; a clamp diode is still the gentler choice")
                           : std::string(": fit a clamp diode across the coil"));
            }
            {
                const ClampCorner& k = e.clamp_at(c.corner);
                const std::string part =
                    c.detail == static_cast<std::uint8_t>(PulseCase::tvs) ? "the TVS" : "the zener";
                const std::string pulse = "each turn-off drives " + q(k.pulse_peak_w, Unit::watt) + " peak into " +
                                          part + " for an equivalent " + q(k.pulse_width_s, Unit::second) + " (" +
                                          q(k.pulse_energy_j, Unit::joule) + ")";
                if (c.detail == static_cast<std::uint8_t>(PulseCase::unrated)) {
                    return pulse + ", and the record gives no pulse rating: confirm that the part stands it repeatedly";
                }
                return pulse + " against " + q(c.limit, Unit::watt) + " (" + q(p.pulse_derating, Unit::ratio) +
                       " of its surge rating " + q(k.pulse_rating_w, Unit::watt) + " at that width, scaled as t^-1/2)" +
                       (ok ? std::string() : ": use a larger zener or a TVS rated for the pulse");
            }
        case CheckId::clamp_power:
            return "the clamp dissipates " + q(c.value, Unit::watt) + " on average at " +
                   q(spec.switching.frequency_hz.value_or(0), Unit::hertz) + " against " + q(c.limit, Unit::watt) +
                   (ok ? std::string() : ": use a larger clamp part or switch less often");
        default:
            return {};
    }
}

std::string clamp_skip_reason(CheckId id, const Spec& spec) {
    switch (id) {
        case CheckId::transistor_voltage:
            return "not checked: without a clamp the drain avalanches at its breakdown; clamp.pulse checks the energy "
                   "against the part's avalanche rating";
        case CheckId::diode_voltage:
        case CheckId::diode_current:
            return "not checked: there is no clamp diode";
        case CheckId::clamp_power:
            if (spec.clamp.type == ClampType::none) return "not checked: there is no clamp";
            if (!spec.coil.inductance_h) return "not checked: give coil.inductance to estimate the clamp energy";
            return "not checked: give switching.frequency to estimate the clamp's average power";
        case CheckId::clamp_pulse:
            if (spec.clamp.type != ClampType::diode_zener && spec.clamp.type != ClampType::diode_tvs) {
                return "not checked: only a zener or TVS clamp takes a pulse rating";
            }
            return "not checked: give coil.inductance to estimate the pulse each turn-off drives into the clamp";
        default:
            return "not checked";
    }
}

}  // namespace coilfit
