// ngspice (the Debian package `ngspice`, an independent circuit simulator) as a reference for the
// report: the netlist of src/io/netlist.cpp is run with `ngspice -b` and its .meas results are
// compared with the report's coil current, peak collector voltage and release time.
//
// Agreement asked for (issue 7, src/method.md "Clamp (flyback) and timing"): coil current within
// 2 %; peak and release time on the safe side of the simulation: the report's figure not below
// the simulated one by more than 1 %, and above it by no more than 0.5 V (peak) and 10 %
// (release time). ngspice is a CI dependency (.ci/run installs it): without it these tests FAIL.
#include <doctest/doctest.h>

#include "coilfit/report.hpp"

#include <unistd.h>

#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <map>
#include <sstream>
#include <string>
#include <utility>

#include "coilfit/sizing.hpp"
#include "flat_figures.hpp"
#include "io/netlist.hpp"
#include "io/parts_io.hpp"
#include "io/spec_io.hpp"
#include "support.hpp"

using namespace coilfit;
using doctest::Approx;

namespace {

const io::PartsTable& table() { return test::shipped_table(); }

Spec spec_from(const std::string& json) {
    return io::read_spec(io::parse_spec_text(json, "spice-design.json"), table());
}

// Designs of our own, small and large coils, each clamp option.
// 5 V pilot relay of a lab valve manifold, 70 ohm, 0.2 H, plain 1N4148.
const char* lab_relay_diode = R"({ "schema": "coilfit.spec/1", "name": "lab valve manifold pilot relay, diode",
  "supply": { "voltage": "5V", "tolerance": "10%" }, "ambient": { "min": "0C", "max": "40C" },
  "coil": { "rated_voltage": "5V", "resistance": "70R", "tolerance": "10%", "inductance": "0.2H" },
  "pin": { "preset": "cmos-5v-20ma" }, "transistor": "2N4401",
  "clamp": { "type": "diode", "diode": "1N4148" },
  "base_resistor": { "power_rating": "0.25W" }, "pulldown": "10k" })";
// The same relay with a Schottky clamp.
const char* lab_relay_schottky = R"({ "schema": "coilfit.spec/1", "name": "lab valve manifold pilot relay, Schottky",
  "supply": { "voltage": "5V", "tolerance": "10%" }, "ambient": { "min": "0C", "max": "40C" },
  "coil": { "rated_voltage": "5V", "resistance": "70R", "tolerance": "10%", "inductance": "0.2H" },
  "pin": { "preset": "cmos-5v-20ma" }, "transistor": "2N4401",
  "clamp": { "type": "diode", "diode": "1N5819" },
  "base_resistor": { "power_rating": "0.25W" }, "pulldown": "10k" })";
// 12 V greenhouse irrigation valve relay, 400 ohm, 0.9 H: plain diode, and diode + 12 V zener.
const char* valve_relay_diode = R"({ "schema": "coilfit.spec/1", "name": "greenhouse valve relay, diode",
  "supply": { "voltage": "12V", "tolerance": "10%" }, "ambient": { "min": "0C", "max": "50C" },
  "coil": { "rated_voltage": "12V", "resistance": "400R", "tolerance": "10%", "inductance": "0.9H" },
  "pin": { "vdd": "3.3V", "vdd_tolerance": "5%", "voh": "2.9V", "voh_current": "8mA", "max_current": "8mA" },
  "transistor": "2N4401", "clamp": { "type": "diode", "diode": "1N4148" }, "pulldown": "47k" })";
const char* valve_relay_zener = R"({ "schema": "coilfit.spec/1", "name": "greenhouse valve relay, zener",
  "supply": { "voltage": "12V", "tolerance": "10%" }, "ambient": { "min": "0C", "max": "50C" },
  "coil": { "rated_voltage": "12V", "resistance": "400R", "tolerance": "10%", "inductance": "0.9H" },
  "pin": { "vdd": "3.3V", "vdd_tolerance": "5%", "voh": "2.9V", "voh_current": "8mA", "max_current": "8mA" },
  "transistor": "2N4401", "clamp": { "type": "diode_zener", "diode": "1N4148", "zener": "1N4742A" }, "pulldown": "47k" })";
// 24 V workshop dust-extractor interlock relay, 1.1 kohm, 3.3 H, diode + 680 ohm.
const char* interlock_relay_resistor =
    R"({ "schema": "coilfit.spec/1", "name": "dust-extractor interlock relay, resistor",
  "supply": { "voltage": "24V", "tolerance": "10%" }, "ambient": { "min": "-10C", "max": "40C" },
  "coil": { "rated_voltage": "24V", "resistance": "1k1", "tolerance": "10%", "inductance": "3.3H" },
  "pin": { "preset": "cmos-3v3-8ma" }, "transistor": "MPSA06",
  "clamp": { "type": "diode_resistor", "diode": "1N4148", "resistor": "680R" }, "pulldown": "47k" })";
// 24 V garage door opener motor contactor, 150 ohm, 5 H, Darlington: plain 1N4001, and + 15 V zener.
const char* door_contactor_diode = R"({ "schema": "coilfit.spec/1", "name": "garage door contactor, diode",
  "supply": { "voltage": "24V", "tolerance": "10%" }, "ambient": { "min": "-20C", "max": "40C" },
  "coil": { "rated_voltage": "24V", "resistance": "150R", "tolerance": "10%", "inductance": "5H" },
  "pin": { "preset": "cmos-5v-4ma" }, "transistor": "TIP120",
  "clamp": { "type": "diode", "diode": "1N4001" }, "pulldown": "10k" })";
const char* door_contactor_zener = R"({ "schema": "coilfit.spec/1", "name": "garage door contactor, zener",
  "supply": { "voltage": "24V", "tolerance": "10%" }, "ambient": { "min": "-20C", "max": "40C" },
  "coil": { "rated_voltage": "24V", "resistance": "150R", "tolerance": "10%", "inductance": "5H" },
  "pin": { "preset": "cmos-5v-4ma" }, "transistor": "TIP120",
  "clamp": { "type": "diode_zener", "diode": "1N4001", "zener": "1N4744A" }, "pulldown": "10k" })";

// Logic-level N-MOSFET drivers (issue: nmos cross-check), designs of our own:
// 12 V greenhouse vent relay, 270 ohm, 0.54 H, on a 3.3 V pin through a SOT-23 30 V part.
const char* vent_relay_nmos = R"({ "schema": "coilfit.spec/1", "name": "greenhouse vent relay, nmos",
  "supply": { "voltage": "12V", "tolerance": "10%" }, "ambient": { "min": "-10C", "max": "55C" },
  "coil": { "rated_voltage": "12V", "resistance": "270R", "tolerance": "10%", "inductance": "0.54H" },
  "pin": { "preset": "cmos-3v3-8ma" }, "transistor": "nmos-sot23-30v-4a",
  "clamp": { "type": "diode", "diode": "1N4148" } })";
// 24 V poultry-house vent solenoid, 48 ohm, 0.4 H, a DPAK logic-level part, diode + 12 V zener.
const char* poultry_solenoid_nmos = R"({ "schema": "coilfit.spec/1", "name": "poultry-house vent solenoid, nmos",
  "supply": { "voltage": "24V", "tolerance": "10%" }, "ambient": { "min": "-5C", "max": "45C" },
  "coil": { "rated_voltage": "24V", "resistance": "48R", "tolerance": "7%", "inductance": "0.4H" },
  "pin": { "preset": "cmos-5v-20ma" }, "transistor": "nmos-dpak-logic-60v-30a",
  "clamp": { "type": "diode_zener", "diode": "1N4004", "zener": "1N4742A" } })";
// 5 V lab valve pilot relay, 70 ohm, 0.2 H, on a BSS138 from a 5 V pin, Schottky clamp.
const char* lab_relay_nmos = R"({ "schema": "coilfit.spec/1", "name": "lab valve pilot relay, nmos",
  "supply": { "voltage": "5V", "tolerance": "5%" }, "ambient": { "min": "10C", "max": "40C" },
  "coil": { "rated_voltage": "5V", "resistance": "70R", "tolerance": "10%", "inductance": "0.2H" },
  "pin": { "preset": "cmos-5v-20ma" }, "transistor": "BSS138",
  "clamp": { "type": "diode", "diode": "1N5819" } })";

bool ngspice_found() { return std::system("command -v ngspice > /dev/null 2>&1") == 0; }

// Runs `ngspice -b` on the netlist and returns its .meas results by name.
std::map<std::string, double> run_ngspice(const std::string& netlist, const std::string& tag) {
    namespace fs = std::filesystem;
    const fs::path file =
        fs::temp_directory_path() / ("coilfit-spice-" + tag + "-" + std::to_string(::getpid()) + ".cir");
    {
        std::ofstream out(file);
        out << netlist;
    }
    const std::string command = "ngspice -b '" + file.string() + "' 2>&1";
    std::string output;
    if (FILE* pipe = ::popen(command.c_str(), "r")) {
        char buffer[4096];
        std::size_t n = 0;
        while ((n = std::fread(buffer, 1, sizeof buffer, pipe)) > 0) output.append(buffer, n);
        ::pclose(pipe);
    }
    std::error_code ec;
    fs::remove(file, ec);
    std::map<std::string, double> meas;
    std::istringstream lines(output);
    std::string line;
    while (std::getline(lines, line)) {
        std::istringstream words(line);
        std::string name, eq;
        double value = 0;
        if (words >> name >> eq >> value && eq == "=") meas[name] = value;
    }
    INFO("ngspice output:\n" << output);
    CHECK(meas.count(std::string(io::meas_coil_current)) == 1);
    CHECK(meas.count(std::string(io::meas_peak_collector)) == 1);
    CHECK(meas.count(std::string(io::meas_release_time)) == 1);
    return meas;
}

struct Compared {
    double report_current_a = 0, sim_current_a = 0;
    double report_peak_v = 0, sim_peak_v = 0;
    double report_release_s = 0, sim_release_s = 0;
    double supply_high_v = 0;
};

// Exports the netlist of a design, simulates it and checks the report against the simulation.
// release_long: how much longer than the simulation the report's release may be. The method
// holds a zener at its bottom tolerance for timing and credits none of its rise with current
// (Zzt (I - Izt)), which the simulated zener has: far above Izt the estimate errs long by more.
Compared check_against_ngspice(const Spec& spec, const std::string& tag, double release_long = 1.10) {
    Compared c;
    REQUIRE_MESSAGE(ngspice_found(), "ngspice not found: install the Debian package ngspice (CI installs it)");
    const SizingReport report = size(spec, table().catalogue);
    const Sized sized = size_numbers(spec);
    const auto meas = run_ngspice(io::spice_netlist(report), tag);
    c.supply_high_v = sized.conditions.vs_hi_v;
    c.report_current_a = report.quantity("coil_current_max_a").value_or(0);
    c.report_peak_v = report.quantity("peak_collector_voltage_v").value_or(0);
    c.report_release_s = report.quantity("release_time_s").value_or(0);
    c.sim_current_a = meas.count("coil_current_on") ? meas.at("coil_current_on") : 0;
    c.sim_peak_v = meas.count("peak_collector") ? meas.at("peak_collector") : 0;
    c.sim_release_s = meas.count("release_time") ? meas.at("release_time") : 0;
    INFO(spec.name << ": current " << c.report_current_a << " A (ngspice " << c.sim_current_a << "), peak "
                   << c.report_peak_v << " V (ngspice " << c.sim_peak_v << "), release " << c.report_release_s
                   << " s (ngspice " << c.sim_release_s << ")");
    // Reference: ngspice transient of the exported netlist.
    CHECK(c.report_current_a == Approx(c.sim_current_a).epsilon(0.02));
    CHECK(c.report_peak_v >= 0.99 * c.sim_peak_v);
    CHECK(c.report_peak_v <= c.sim_peak_v + 0.5);
    CHECK(c.report_release_s >= 0.99 * c.sim_release_s);
    CHECK(c.report_release_s <= release_long * c.sim_release_s);
    return c;
}

Compared check_design(const char* json, const std::string& tag, double release_long = 1.10) {
    return check_against_ngspice(spec_from(json), tag, release_long);
}

}  // namespace

TEST_SUITE("spice") {
    TEST_CASE("ngspice agrees with the report for a 5 V 70 ohm relay with a plain diode") {
        check_design(lab_relay_diode, "lab-diode");
    }

    TEST_CASE("ngspice agrees with the report for a 5 V 70 ohm relay with a Schottky diode") {
        check_design(lab_relay_schottky, "lab-schottky");
    }

    TEST_CASE("ngspice agrees with the report for a 12 V 400 ohm relay with a plain diode") {
        check_design(valve_relay_diode, "valve-diode");
    }

    TEST_CASE("ngspice agrees with the report for a 12 V 400 ohm relay with a diode and a 12 V zener") {
        check_design(valve_relay_zener, "valve-zener");
    }

    TEST_CASE("ngspice agrees with the report for a 24 V 1.1 kohm relay with a diode and a 680 ohm resistor") {
        check_design(interlock_relay_resistor, "interlock-resistor");
    }

    TEST_CASE("ngspice agrees with the report for a 24 V 150 ohm 5 H contactor with a plain diode") {
        check_design(door_contactor_diode, "door-diode");
    }

    TEST_CASE("ngspice agrees with the report for a 24 V 150 ohm 5 H contactor with a diode and a 15 V zener") {
        check_design(door_contactor_zener, "door-zener");
    }

    TEST_CASE("diode + resistor at both resistor tolerances: the peak copy at +t, the timing copy at -t") {
        // The clamp resistor's tolerance (edition 2): its high end sets the peak, its low end the
        // release; each copy of the netlist carries its own, and ngspice agrees with both.
        std::string json = interlock_relay_resistor;
        json.replace(json.find(R"("resistor": "680R")"), 18, R"("resistor": "680R", "resistor_tolerance": "10%")");
        const Spec spec = spec_from(json);
        const SizingReport report = size(spec, table().catalogue);
        const std::string netlist = io::spice_netlist(report);
        CHECK(netlist.find("rs_p k_p vs 748") != std::string::npos);
        CHECK(netlist.find("rs_r k_r vs 612") != std::string::npos);
        check_against_ngspice(spec, "resistor-10pct");
    }

    TEST_CASE("ngspice agrees with the report for a 12 V relay on a logic-level MOSFET and a 3.3 V pin") {
        check_design(vent_relay_nmos, "vent-nmos");
    }

    TEST_CASE("ngspice agrees with the report for a 24 V solenoid on a DPAK MOSFET with a diode and a 12 V zener") {
        // 0.66 A through a 12 V zener with Zzt 9 ohm (Izt 21 mA): the simulated zener sits 5.7 V
        // above its bottom tolerance at I0, which the method does not credit (release errs long).
        check_design(poultry_solenoid_nmos, "poultry-nmos", 1.20);
    }

    TEST_CASE("ngspice agrees with the report for a 5 V relay on a BSS138 with a Schottky diode") {
        check_design(lab_relay_nmos, "lab-nmos");
    }

    TEST_CASE(
        "ngspice agrees with the report for a 12 V relay on a transistor-array channel, Darlington and MOSFET class") {
        // One array channel as its input resistor and a Darlington pair (or a level-1 NMOS for
        // the MOSFET class), clamped by the built-in diode. The report's highest coil current
        // neglects the on-voltage (sizing.hpp assumption 4), which a Darlington cannot: the
        // simulation must lie below it, and Ohm's law with the simulated on-voltage must give the
        // simulated current within 2 %; the on-voltage itself must stay within the data's Vce(sat)
        // maximum that the report takes off the coil's voltage (for a Darlington at least one Vbe,
        // about 0.6 V, common practice). Peak and release with the tolerances of the other designs.
        REQUIRE_MESSAGE(ngspice_found(), "ngspice not found: install the Debian package ngspice (CI installs it)");
        const std::string base = R"({ "schema": "coilfit.spec/1", "name": "greenhouse zone valve relay, array channel",
          "supply": { "voltage": "12V", "tolerance": "5%" }, "ambient": { "min": "0C", "max": "50C" },
          "coil": { "preset": "pcb-relay-12v-360mw", "inductance": "0.9H" },
          "pin": { "vdd": "3.3V", "vdd_tolerance": "5%", "voh": "2.9V", "voh_current": "8mA", "max_current": "8mA" },
          "transistor": "ARRAY" })";
        for (const std::string id : {"array-7ch-darlington-50v", "array-8ch-mosfet-50v"}) {
            std::string json = base;
            json.replace(json.find("ARRAY"), 5, id);
            const Spec spec = spec_from(json);
            const SizingReport report = size(spec, table().catalogue);
            const std::string netlist = io::spice_netlist(report);
            // 2.7 kOhm at +20 % (the default) or at the MOSFET class's +30 %.
            const bool darlington = id.find("darlington") != std::string::npos;
            CHECK(netlist.find(darlington ? "rin_r pin_r b_r 3240" : "rin_r pin_r b_r 3510") != std::string::npos);
            const auto meas = run_ngspice(netlist, "array-" + id);
            REQUIRE(meas.count(std::string(io::meas_output_on)) == 1);
            const Evaluation& e = report.sized.worst;
            const double r_cold = e.coil.at[0].r_cold_ohm;
            const double v_on = meas.at(std::string(io::meas_output_on));
            const double sim_i = meas.at("coil_current_on");
            const double report_i = report.quantity("coil_current_max_a").value_or(0);
            const double peak = report.quantity("peak_collector_voltage_v").value_or(0);
            const double release = report.quantity("release_time_s").value_or(0);
            INFO(id << ": current " << report_i << " A (ngspice " << sim_i << ", on-voltage " << v_on << " V), peak "
                    << peak << " V (ngspice " << meas.at("peak_collector") << "), release " << release << " s (ngspice "
                    << meas.at("release_time") << ")");
            CHECK(report_i >= 0.99 * sim_i);
            CHECK((report.sized.conditions.vs_hi_v - v_on) / r_cold == Approx(sim_i).epsilon(0.02));
            CHECK(v_on <= e.driver_at(Corner::cold).on_drop_v);
            if (darlington) CHECK(v_on >= 0.6);
            CHECK(peak >= 0.99 * meas.at("peak_collector"));
            CHECK(peak <= meas.at("peak_collector") + 0.5);
            CHECK(release >= 0.99 * meas.at("release_time"));
            CHECK(release <= 1.10 * meas.at("release_time"));
        }
    }

    TEST_CASE("at -40 °C with SPICE's own gain law (XTB) the chosen base resistor still saturates the transistor") {
        // ngspice at .options temp=-40 with the part's 25 °C gain and XTB = 1.5 (TNOM 25 °C): the
        // simulator's BF(T) = BF (T/TNOM)^XTB is the method's gain law, and its own Is(T) lowers
        // Vbe about 2 mV/K; the clamp diodes stay at 27 °C. If the report's cold corner holds,
        // the simulated coil current is the saturated one (within 2 %) and the timing agrees.
        REQUIRE_MESSAGE(ngspice_found(), "ngspice not found: install the Debian package ngspice (CI installs it)");
        std::string cold = valve_relay_diode;
        cold.replace(cold.find(R"("min": "0C")"), 11, R"("min": "-40C")");
        const Spec spec = spec_from(cold);
        const SizingReport report = size(spec, table().catalogue);
        io::NetlistOptions options;
        options.device_temperature = true;
        const std::string netlist = io::spice_netlist(report, options);
        CHECK(netlist.find("temp=-40") != std::string::npos);
        CHECK(netlist.find("xtb=1.5") != std::string::npos);
        const auto meas = run_ngspice(netlist, "cold-xtb");
        const double current = report.quantity("coil_current_max_a").value_or(0);
        INFO("report " << current << " A, ngspice at -40 C " << meas.at("coil_current_on") << " A");
        CHECK(current == Approx(meas.at("coil_current_on")).epsilon(0.02));
        CHECK(report.quantity("release_time_s").value_or(0) >= 0.99 * meas.at("release_time"));
        CHECK(report.quantity("peak_collector_voltage_v").value_or(0) >= 0.99 * meas.at("peak_collector"));
    }

    TEST_CASE("ngspice agrees with the report for every example with a coil inductance") {
        namespace fs = std::filesystem;
        for (const auto& entry : fs::directory_iterator(COILFIT_TEST_EXAMPLES_DIR)) {
            if (entry.path().extension() != ".json") continue;
            if (entry.path().stem().string().find("-board") != std::string::npos) continue;  // coilfit board files
            const Spec spec = io::read_spec(io::load_spec_document(entry.path().string()), table());
            if (!spec.coil.inductance_h || spec.clamp.type == ClampType::none || !size_numbers(spec).r_drive_ohm)
                continue;
            INFO(entry.path().string());
            check_against_ngspice(spec, "example-" + entry.path().stem().string());
        }
    }

    TEST_CASE("with a plain diode the simulated collector peaks about one diode drop above the supply") {
        // Common practice, no single source: a diode clamp holds the collector one drop above the supply,
        // about 0.6 V to 1.2 V for silicon and 0.2 V to 0.6 V for a Schottky diode.
        for (const char* json : {lab_relay_diode, valve_relay_diode, door_contactor_diode}) {
            const Compared c = check_design(json, "one-drop");
            CHECK(c.sim_peak_v - c.supply_high_v >= 0.6);
            CHECK(c.sim_peak_v - c.supply_high_v <= 1.25);
        }
        const Compared s = check_design(lab_relay_schottky, "one-drop-schottky");
        CHECK(s.sim_peak_v - s.supply_high_v >= 0.2);
        CHECK(s.sim_peak_v - s.supply_high_v <= 0.6);
    }

    TEST_CASE("a zener clamp shortens the simulated release roughly in the ratio the closed form gives") {
        // Common practice, no single source: the release shortens with the clamp voltage as
        // tau ln((I0 + Vc/R)/(I_rel + Vc/R)) says; the simulated ratio within 10 % of the closed form's.
        const std::pair<const char*, const char*> pairs[] = {{valve_relay_diode, valve_relay_zener},
                                                             {door_contactor_diode, door_contactor_zener}};
        for (const auto& [diode, zener] : pairs) {
            const Compared d = check_design(diode, "ratio-diode");
            const Compared z = check_design(zener, "ratio-zener");
            REQUIRE(z.sim_release_s > 0);
            REQUIRE(z.report_release_s > 0);
            const double closed_form = d.report_release_s / z.report_release_s;
            const double simulated = d.sim_release_s / z.sim_release_s;
            CHECK(closed_form > 1.5);
            CHECK(simulated == Approx(closed_form).epsilon(0.10));
        }
    }
}
