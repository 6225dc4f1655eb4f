// Sizes one channel in code with the installed core library (no parts table, no JSON: the parts
// are written inline) and checks two figures against outside references. Exit 0 when they hold.
#include <cmath>
#include <cstdio>

#include <coilfit/report.hpp>

namespace {

coilfit::Spec lab_valve_spec() {
    coilfit::Spec spec;
    spec.name = "consumer: lab valve manifold, valve 3";
    spec.supply.voltage_v = 12.0;
    spec.supply.tolerance = 0.10;
    spec.ambient = {0.0, 50.0};
    spec.coil.rated_voltage_v = 12.0;
    spec.coil.resistance_ohm = 400.0;
    spec.coil.tolerance = 0.10;
    spec.coil.reference_temp_c = 20.0;
    spec.pin.vdd_v = 3.3;
    spec.pin.vdd_tolerance = 0.05;
    spec.pin.max_current_a = 8e-3;

    // Typical datasheet limits of the generic 2N4401 and 1N4148 registrations, from memory; to be
    // verified against the datasheet in use.
    coilfit::Bipolar q;
    q.id = "2N4401";
    q.source = "typical datasheet limits from memory";
    q.kind = coilfit::BipolarKind::npn;
    q.ic_max_a = 0.6;
    q.vceo_v = 40.0;
    q.hfe_min = {{1e-4, 20}, {1e-3, 40}, {1e-2, 80}, {0.15, 100}, {0.5, 40}};
    q.vce_sat = {{0.15, 0.015, 0.4}, {0.5, 0.05, 0.75}};
    q.vbe_sat = {{0.15, 0.015, 0.95}, {0.5, 0.05, 1.2}};
    q.pd_w = 0.625;
    q.rth_ja_k_per_w = 200.0;
    spec.transistor = q;

    coilfit::Diode d;
    d.id = "1N4148";
    d.source = "typical datasheet limits from memory";
    d.kind = coilfit::DiodeKind::signal;
    d.vrrm_v = 100.0;
    d.if_avg_a = 0.15;
    d.ifrm_a = 0.45;
    d.vf = {{0.01, 1.0}, {0.15, 1.25}};
    spec.clamp.type = coilfit::ClampType::diode;
    spec.clamp.diode = d;
    spec.base_resistor.series = coilfit::ESeries::e24;
    return spec;
}

bool near(double a, double b, double rel) { return std::fabs(a - b) <= rel * std::fabs(b); }

}  // namespace

int main() {
    const coilfit::SizingReport report = coilfit::size(lab_valve_spec(), coilfit::Catalogue{});
    int failures = 0;

    // The coldest, lowest coil resistance: R20 (1 - tolerance) (1 + 0.00393/K (0 °C - 20 °C)),
    // copper's coefficient at 20 °C from IEC 60028: 400 * 0.9 * 0.9214 = 331.70 ohm.
    const auto r_cold = report.quantity("coil_resistance_cold_ohm");
    const double r_cold_expected = 400.0 * 0.9 * (1.0 + 0.00393 * (0.0 - 20.0));
    if (!r_cold || !near(*r_cold, r_cold_expected, 1e-6)) {
        std::printf("coil_resistance_cold_ohm %g, expected %g (IEC 60028)\n", r_cold.value_or(-1), r_cold_expected);
        ++failures;
    }

    // The chosen base resistor is a value of the E24 series (IEC 60063's table, typed in here).
    constexpr int e24[] = {10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30,
                           33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91};
    const auto rb = report.resistor.value_ohm;
    bool in_e24 = false;
    if (rb && *rb > 0) {
        const double decade = std::pow(10.0, std::floor(std::log10(*rb)) - 1.0);
        const double mantissa = *rb / decade;  // 10 <= mantissa < 100
        for (const int m : e24) in_e24 = in_e24 || std::fabs(mantissa - m) < 1e-6 * m;
    }
    if (!in_e24) {
        std::printf("base resistor %g ohm is not an E24 value (IEC 60063)\n", rb.value_or(-1));
        ++failures;
    }

    // The report's verdict is the same as its checks': pass when none fails.
    bool any_fail = false;
    for (const coilfit::Check& c : report.checks) any_fail = any_fail || c.verdict == coilfit::Verdict::fail;
    if ((report.verdict == coilfit::Verdict::pass) == any_fail) {
        std::printf("verdict disagrees with the checks\n");
        ++failures;
    }
    std::printf("%s: base resistor %g ohm (E24), coil %g ohm cold, %zu checks, %s\n", report.spec.name.c_str(),
                rb.value_or(0), r_cold.value_or(0), report.checks.size(), failures == 0 ? "figures hold" : "FAILED");
    return failures == 0 ? 0 : 1;
}
