// The bipolar driver's numbers (src/method.md "Bipolar drivers"); its words are in
// bipolar_words.cpp.
#include "coilfit/drivers/bipolar.hpp"

#include <algorithm>
#include <cmath>

#include "../curves.hpp"
#include "coilfit/eseries.hpp"

namespace coilfit {
namespace {

// Device data are 25 °C values (src/method.md "Bipolar drivers", Temperature).
constexpr double data_temp_c = 25.0;
constexpr double kelvin_offset = 273.15;
// Vbe falls about 2 mV/K (common practice: the junction's -2 mV/K coefficient).
constexpr double vbe_tempco_v_per_k = 0.002;
// The gain temperature exponent of common small-signal models, from memory.
constexpr double hfe_exponent_default = 1.5;

// hFE_min(T) = hFE_min(25 °C) (T/298.15 K)^x below 25 °C; above it the 25 °C value.
double gain_temperature_factor(const Bipolar& part, double ambient_c) {
    if (!(ambient_c < data_temp_c)) return 1.0;
    return std::pow((ambient_c + kelvin_offset) / (data_temp_c + kelvin_offset),
                    part.hfe_temp_exponent.value_or(hfe_exponent_default));
}

double forced_gain_policy(const Spec& spec, const Bipolar& part, double test_ratio) {
    if (spec.policy.forced_gain) return *spec.policy.forced_gain;
    // Common practice: datasheets specify Vce(sat) at Ic/Ib = 10, the textbook ratio for hard
    // saturation. Darlingtons are specified at their own, much higher ratio (e.g. 250 or 1000).
    if (part.kind == BipolarKind::darlington) return test_ratio;
    return defaults::forced_gain_npn;
}

}  // namespace

BipolarDriver prepare_bipolar(const Spec& spec, const Bipolar& part, double pin_r_out_ohm) {
    BipolarDriver d;
    d.part = &part;
    d.derated_ic_a = spec.policy.current_derating * part.ic_max_a;
    d.derated_vceo_v = spec.policy.voltage_derating * part.vceo_v;
    d.tj_limit_c = part.tj_max_c - spec.policy.junction_margin_k;
    d.rth_k_per_w = rth_ja(part);
    d.resistor_power_limit_w = spec.policy.power_derating * spec.base_resistor.power_rating_w;
    d.pin_r_out_ohm = pin_r_out_ohm;
    d.internal_rbe_ohm = part.r_be_internal_ohm.value_or(0.0);
    const double ambients[2] = {spec.ambient.min_c, spec.ambient.max_c};
    for (std::size_t k = 0; k < 2; ++k) {
        d.gain_ta_c[k] = ambients[k];
        d.gain_factor[k] = gain_temperature_factor(part, ambients[k]);
    }
    return d;
}

void bipolar_corner(const BipolarDriver& d, const Spec& spec, const Conditions& c, const DriveInput& in, double rb_ohm,
                    bool all, BipolarCorner& f, DriverCorner& common, CheckSet& checks) {
    const Bipolar& tr = *d.part;
    const Policy& policy = spec.policy;
    const double i = in.current_a;
    // One log of the operating current serves every table lookup below.
    const double ln_i = in.ln_current;
    f.current_a = i;
    f.thermal_ambient_c = in.thermal_ambient_c;
    f.vce_lookup = curves::vce_sat_at(tr, i, ln_i);
    f.vce_sat_v = f.vce_lookup.value;
    f.hfe_lookup = curves::hfe_min_at(tr, i, ln_i);
    f.vbe_lookup = curves::vbe_sat_at(tr, i, ln_i);
    // Temperature: hFE_min(T) = hFE_min(25 °C) (T/298.15 K)^x below 25 °C; Vbe(sat) max rises and
    // Vbe low falls by 2 mV/K away from 25 °C; Vce(sat) stays at its 25 °C limit.
    const double below_25 = std::max(0.0, data_temp_c - in.ambient_c);
    const double above_25 = std::max(0.0, in.ambient_c - data_temp_c);
    const double gain_factor = in.ambient_c == d.gain_ta_c[0]   ? d.gain_factor[0]
                               : in.ambient_c == d.gain_ta_c[1] ? d.gain_factor[1]
                                                                : gain_temperature_factor(tr, in.ambient_c);
    f.hfe_min = f.hfe_lookup.value * gain_factor;
    f.hfe = f.hfe_min;
    if (c.hfe_position > 0) {
        const double typ = curves::hfe_typ_at(tr, i, ln_i).value * gain_factor;
        f.hfe = f.hfe_min + c.hfe_position * (std::max(typ, f.hfe_min) - f.hfe_min);
    }
    f.vbe_sat_v = f.vbe_lookup.value + vbe_tempco_v_per_k * below_25;
    f.vbe_low_v = policy.vbe_low_v - vbe_tempco_v_per_k * above_25;
    f.vce_sat_test_ratio = curves::vce_sat_test_ratio(tr, i, ln_i);
    f.forced_gain_policy = forced_gain_policy(spec, tr, f.vce_sat_test_ratio);
    // beta_target = min(beta_forced, hFE_min / k)
    f.beta_target = std::min(f.forced_gain_policy, f.hfe / policy.overdrive);
    f.policy_binds = f.forced_gain_policy * policy.overdrive <= f.hfe;
    f.base_current_required_a = i / f.beta_target;
    f.vce_sat_not_guaranteed = f.beta_target > f.vce_sat_test_ratio * (1.0 + 1e-9);
    // The pull-down (and a Darlington's internal base-emitter resistor) draws Vbe/R from the base.
    f.pulldown_current_a = (spec.pulldown_ohm ? f.vbe_sat_v / *spec.pulldown_ohm : 0.0) +
                           (d.internal_rbe_ohm > 0 ? f.vbe_sat_v / d.internal_rbe_ohm : 0.0);
    if (all) {
        // The minimum gain this pin can serve: k I_max / I_pin (common practice).
        f.hfe_needed = policy.overdrive * i / spec.pin.max_current_a;
        // Rb_max = [(VDD_lo - Vbe_sat) / (Ib_req + Vbe_sat/Rbe) - R_out] / (1 + tb)
        f.base_resistor_max_ohm =
            ((c.vdd_lo_v - f.vbe_sat_v) / (f.base_current_required_a + f.pulldown_current_a) - d.pin_r_out_ohm) /
            c.rb_hi_factor;
        // Rb_min = (VDD_hi - Vbe_low) / (I_pin_limit (1 - tb))
        f.base_resistor_min_ohm = (c.vdd_hi_v - f.vbe_low_v) / (spec.pin.max_current_a * c.rb_lo_factor);
    }
    checks.set(CheckId::transistor_current, at_most(i, d.derated_ic_a));

    // The thermal check's own corner may carry another current (src/method.md: the hot corner).
    const double i_th = in.thermal_current_a;
    const Lookup vce_th_lookup = i_th == i ? f.vce_lookup : curves::vce_sat_at(tr, i_th, ln_not_set);
    const double vce_th = vce_th_lookup.value;
    if (rb_ohm > 0) {
        // Lowest base current: VDD_lo, Vbe(sat) max, Rb at +tb, behind R_out, less the pull-down.
        f.base_current_min_a =
            (c.vdd_lo_v - f.vbe_sat_v) / (rb_ohm * c.rb_hi_factor + d.pin_r_out_ohm) - f.pulldown_current_a;
        f.saturates = f.base_current_min_a > 0;
        // Highest pin current: VDD_hi, Vbe low, Rb at -tb, R_out = 0.
        f.pin_current_max_a = std::max(0.0, c.vdd_hi_v - f.vbe_low_v) / (rb_ohm * c.rb_lo_factor);
        f.resistor_power_w = f.pin_current_max_a * f.pin_current_max_a * rb_ohm * c.rb_lo_factor;
        CheckValue sat = failed_without_value(f.beta_target);
        sat.detail = static_cast<std::uint8_t>(BipolarCase::no_base_current);
        if (f.saturates) {
            f.forced_gain_worst = i / f.base_current_min_a;
            sat = at_most(f.forced_gain_worst, f.beta_target);
            if (sat.verdict == Verdict::pass && f.vce_sat_not_guaranteed) sat.verdict = Verdict::warn;
        }
        // Data limits: hFE beyond its points on either side, or Vbe(sat) above its highest point.
        if (f.hfe_lookup.side != Side::within || f.vbe_lookup.side == Side::above) mark_beyond_data(sat);
        checks.set(CheckId::transistor_saturation, sat);
        checks.set(CheckId::pin_current, at_most(f.pin_current_max_a, spec.pin.max_current_a));
        checks.set(CheckId::resistor_power, at_most(f.resistor_power_w, d.resistor_power_limit_w));
        // Steady-state dissipation P = Vce(sat) Ic + Vbe(sat) Ib, the whole pin current taken as
        // base current (the pull-down's share ignored, which errs high).
        f.transistor_power_w = vce_th * i_th + f.vbe_sat_v * f.pin_current_max_a;
    } else {
        const auto no_resistor = static_cast<std::uint8_t>(BipolarCase::no_resistor);
        CheckValue sat = failed_without_value(f.beta_target);
        sat.detail = no_resistor;
        checks.set(CheckId::transistor_saturation, sat);
        CheckValue pin = failed_without_value(spec.pin.max_current_a);
        pin.detail = f.vbe_sat_v >= c.vdd_lo_v ? static_cast<std::uint8_t>(BipolarCase::pin_below_vbe) : no_resistor;
        checks.set(CheckId::pin_current, pin);
        // Without base drive nothing flows; the thermal figure is taken at full coil current.
        f.transistor_power_w = vce_th * i_th;
    }
    f.junction_temp_c = in.thermal_ambient_c + f.transistor_power_w * d.rth_k_per_w;
    CheckValue thermal = at_most(f.junction_temp_c, d.tj_limit_c);
    if (vce_th_lookup.side == Side::above || (rb_ohm > 0 && f.vbe_lookup.side == Side::above))
        mark_beyond_data(thermal);
    checks.set(CheckId::transistor_thermal, thermal);

    common.on_drop_v = f.vce_sat_v;
    common.drop_beyond_data = f.vce_lookup.side == Side::above;
    common.coil_voltage_min_v = c.vs_lo_v - f.vce_sat_v;
    common.pin_current_max_a = f.pin_current_max_a;
    common.power_w = f.transistor_power_w;
    common.junction_c = f.junction_temp_c;
}

std::optional<double> choose_base_resistor(const Spec& spec, const BipolarFigures& f) {
    if (spec.base_resistor.value_ohm) return spec.base_resistor.value_ohm;
    if (!(f.window_max_ohm > 0)) return std::nullopt;
    if (spec.base_resistor.choose == ResistorChoice::centred && f.window_min_ohm > 0 &&
        f.window_min_ohm <= f.window_max_ohm) {
        // The series value nearest the window's geometric middle sqrt(Rb_min Rb_max), kept inside.
        const double mid = std::sqrt(f.window_min_ohm * f.window_max_ohm);
        const auto nearest = eseries_nearest(mid, spec.base_resistor.series);
        if (nearest && *nearest <= f.window_max_ohm && *nearest >= f.window_min_ohm) return nearest;
    }
    return eseries_floor(f.window_max_ohm, spec.base_resistor.series);
}

}  // namespace coilfit
