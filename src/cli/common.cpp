#include "cli/common.hpp"

#include <sys/ioctl.h>
#include <unistd.h>

#include <algorithm>
#include <cstdio>
#include <cstdlib>
#include <iostream>

#include <fmt/format.h>

namespace coilfit::cli {
namespace {

struct SpecFlag {
    const char* flag;
    const char* path;
    const char* help;
};

// Our own flag names; each sets one field of the spec (coilfit.spec/1).
constexpr SpecFlag spec_flags[] = {
    {"--name", "name", "channel name for the report"},
    {"--supply", "supply.voltage", "coil supply voltage, e.g. 12V"},
    {"--supply-tolerance", "supply.tolerance", "supply tolerance, e.g. 10% (default 10%)"},
    {"--supply-min", "supply.min", "lowest supply of an asymmetric band, e.g. 9V (with --supply-max)"},
    {"--supply-max", "supply.max", "highest supply of an asymmetric band, e.g. 16V (with --supply-min)"},
    {"--transient-max", "supply.transient_max", "highest transient on the rail, e.g. 40V"},
    {"--ambient-min", "ambient.min", "lowest ambient, e.g. -20C (default 0C)"},
    {"--ambient-max", "ambient.max", "highest ambient, e.g. 50C (default 70C)"},
    {"--coil-preset", "coil.preset", "start the coil from a preset of the parts table"},
    {"--coil-voltage", "coil.rated_voltage", "coil rated voltage, e.g. 12V"},
    {"--coil-resistance", "coil.resistance", "coil resistance at its reference temperature, e.g. 400R"},
    {"--coil-tolerance", "coil.tolerance", "coil resistance tolerance, e.g. 10%"},
    {"--coil-reference-temp", "coil.reference_temp", "temperature of the coil resistance figure, e.g. 20C"},
    {"--must-operate", "coil.must_operate", "must-operate voltage in % of rated, e.g. 75%"},
    {"--must-release", "coil.must_release", "must-release voltage in % of rated, e.g. 10%"},
    {"--coil-inductance", "coil.inductance", "coil inductance, armature energised, e.g. 0.9H"},
    {"--self-heating", "coil.self_heating", "coil winding rise above ambient, e.g. 15K (default 0K)"},
    {"--coil-thermal-resistance", "coil.thermal_resistance", "winding to ambient, e.g. 60K/W: the rise from its own power"},
    {"--coil-max-temperature", "coil.max_temperature", "insulation class limit, e.g. 130C: checks coil.thermal"},
    {"--must-operate-temp", "coil.must_operate_temp", "coil temperature the must-operate is stated at (default the reference)"},
    {"--coil-max-voltage", "coil.max_voltage", "highest continuous coil voltage, e.g. 15.6V"},
    {"--max-release-time", "coil.max_release_time", "longest acceptable release time, e.g. 10ms"},
    {"--pin-preset", "pin.preset", "start the pin from a preset of the parts table"},
    {"--pin-vdd", "pin.vdd", "pin supply (VDD), e.g. 3.3V"},
    {"--pin-vdd-tolerance", "pin.vdd_tolerance", "pin supply tolerance, e.g. 5%"},
    {"--pin-voh", "pin.voh", "guaranteed output high voltage at --pin-voh-current, e.g. 2.9V"},
    {"--pin-voh-current", "pin.voh_current", "current of the VOH rating, e.g. 8mA"},
    {"--pin-voh-vdd", "pin.voh_vdd", "the pin supply VOH is stated at (default the lowest VDD)"},
    {"--pin-max-current", "pin.max_current", "the pin's rated output current, e.g. 8mA"},
    {"--transistor", "transistor", "transistor id from the parts table (npn, darlington, nmos or array), e.g. 2N4401"},
    {"--clamp", "clamp.type", "clamp: diode, diode_zener, diode_resistor, diode_tvs or none"},
    {"--diode", "clamp.diode", "clamp diode id, e.g. 1N4148"},
    {"--zener", "clamp.zener", "zener id for a diode_zener clamp"},
    {"--tvs", "clamp.tvs", "TVS id for a diode_tvs clamp"},
    {"--clamp-resistor", "clamp.resistor", "resistor of a diode_resistor clamp, e.g. 470R"},
    {"--clamp-resistor-tolerance", "clamp.resistor_tolerance", "its tolerance (default 5%)"},
    {"--clamp-resistor-power", "clamp.resistor_power", "its power rating (default 0.25W)"},
    {"--series", "base_resistor.series", "E-series of the base resistor: E3 .. E192"},
    {"--resistor-tolerance", "base_resistor.tolerance", "base resistor tolerance, e.g. 1%"},
    {"--resistor-power", "base_resistor.power_rating", "base resistor power rating, e.g. 0.25W"},
    {"--base-resistor", "base_resistor.value", "fix the base resistor and check it, e.g. 1k2"},
    {"--choose", "base_resistor.choose", "largest (default) or centred: the base resistor in its window"},
    {"--gate-resistor", "gate_resistor.value", "fix the gate resistor of an nmos driver and check it, e.g. 470R"},
    {"--gate-series", "gate_resistor.series", "E-series of the gate resistor (default E24)"},
    {"--gate-tolerance", "gate_resistor.tolerance", "gate resistor (and pull-down) tolerance (default 5%)"},
    {"--pulldown", "pulldown", "base-emitter or gate-source pull-down, e.g. 47k (nmos default 100k)"},
    {"--forced-gain", "policy.forced_gain", "forced gain Ic/Ib for saturation (default 10)"},
    {"--overdrive", "policy.overdrive", "base drive over minimum gain (default 2)"},
    {"--current-derating", "policy.current_derating", "transistor current derating (default 75%)"},
    {"--voltage-derating", "policy.voltage_derating", "transistor and diode voltage derating (default 75%)"},
    {"--junction-margin", "policy.junction_margin", "margin below Tj max (default 25K)"},
    {"--power-derating", "policy.power_derating", "resistor and zener power derating (default 50%)"},
    {"--vbe-low", "policy.vbe_low", "lowest Vbe, for the highest pin current (default 0.6V)"},
    {"--frequency", "switching.frequency", "switching frequency, e.g. 1Hz"},
    {"--duty", "switching.duty", "on-time share of the switching period (default 50%)"},
    {"--load-voltage", "load.voltage", "voltage the contacts switch, e.g. 230V"},
    {"--load-kind", "load.kind", "kind of load: resistive, inductive, motor, lamp, capacitive, solenoid, transformer (or ac, dc)"},
    {"--load-current", "load.current", "current the contacts switch, e.g. 2A"},
    {"--relay", "relay", "relay or contactor id from the parts table: fills the coil and the contacts"},
    {"--load-type", "load.type", "ac or dc: what the contacts switch"},
    {"--load-inrush", "load.inrush", "the load's inrush, in amperes (48A) or times the steady current (6x)"},
    {"--load-power-factor", "load.power_factor", "power factor of an AC load, e.g. 0.8"},
    {"--load-time-constant", "load.time_constant", "L/R of a DC load, e.g. 20ms"},
};
constexpr std::size_t spec_flag_count = sizeof(spec_flags) / sizeof(spec_flags[0]);

}  // namespace

void add_spec_options(CLI::App& app, SpecOptions& options) {
    app.add_option("spec", options.spec_path, "spec file (coilfit.spec/1), or - for standard input; optional when flags give the whole spec");
    options.storage.resize(spec_flag_count);
    for (std::size_t i = 0; i < spec_flag_count; ++i) {
        const SpecFlag& f = spec_flags[i];
        auto* opt = app.add_option(f.flag, options.storage[i], f.help)
                        ->group("Spec fields (override the file)")
                        ->multi_option_policy(CLI::MultiOptionPolicy::TakeLast);
        const std::string path = f.path;
        const std::string flag = f.flag;
        opt->each([&options, path, flag](const std::string& value) {
            options.values.emplace_back(path, value);
            options.flag_of.emplace_back(path, flag);
        });
    }
    // Unsetting from the command line: the file's pull-down (or a preset's) is removed.
    app.add_flag_callback(
           "--no-pulldown",
           [&options] {
               options.values.emplace_back("pulldown", "none");
               options.flag_of.emplace_back("pulldown", "--no-pulldown");
           },
           "no base-emitter pull-down, whatever the file gives (a bipolar driver's; an nmos gate keeps one)")
        ->group("Spec fields (override the file)");
}

void add_common_options(CLI::App& app, CommonOptions& options, bool with_output) {
    app.add_option("--parts", options.parts_path, "parts table file or folder (default: $COILFIT_PARTS, else the installed table)")
        ->check(file_name());
    app.add_option("--format", options.format, "output format: text or json")->check(CLI::IsMember({"text", "json"}));
    if (with_output) {
        app.add_option("--output,-o", options.output,
                       "write the report to FILE instead of standard output (- is standard output; a file is replaced "
                       "atomically, a device or FIFO written; never an input of the run)")
            ->check(file_name());
    }
}

io::SpecDocument build_spec_document(const SpecOptions& options) {
    io::SpecDocument d = options.spec_path.empty() ? io::flags_only_document() : io::load_spec_document(options.spec_path);
    if (options.spec_path.empty() && options.values.empty()) {
        throw InputError("no spec: give a spec file (or - for standard input), or the spec fields as flags (see --help)");
    }
    for (const SpecFlag& f : spec_flags) d.origin.flag_names.emplace(f.path, f.flag);
    for (std::size_t i = 0; i < options.values.size(); ++i) {
        io::set_field(d, options.values[i].first, options.values[i].second, options.flag_of[i].second);
    }
    return d;
}

io::PartsTable load_table(const CommonOptions& options) {
    return io::load_parts(io::resolve_parts_path(options.parts_path));
}

io::RunInputs run_inputs(const SpecOptions& spec, const io::PartsTable& table) {
    io::RunInputs in;
    if (!spec.spec_path.empty() && spec.spec_path != "-") in.push_back(spec.spec_path);
    in.insert(in.end(), table.files.begin(), table.files.end());
    return in;
}

void check_outputs(const std::string& output_path, const std::string& netlist_path, const io::RunInputs& inputs,
                   const std::string& plot_path) {
    io::check_outputs({{"--output", output_path.empty() ? "-" : output_path}, {"--netlist", netlist_path}, {"--plot", plot_path}},
                      inputs);
}

void emit(const std::string& text, const std::string& output_path, const io::RunInputs& inputs, const std::string& flag) {
    std::cout.flush();
    io::write_output({flag, output_path.empty() ? "-" : output_path}, text, inputs);
}

CLI::Validator whole_number(std::uint64_t min, std::uint64_t max) {
    return CLI::Validator(
        [min, max](std::string& s) -> std::string {
            const bool digits = !s.empty() && s.size() <= 20 &&
                                std::all_of(s.begin(), s.end(), [](char ch) { return ch >= '0' && ch <= '9'; });
            std::uint64_t v = 0;
            bool overflow = false;
            for (char ch : s) {
                const auto d = static_cast<std::uint64_t>(ch - '0');
                if (!digits) break;
                if (v > (UINT64_MAX - d) / 10) overflow = true;
                v = v * 10 + d;
            }
            if (!digits || overflow || v < min || v > max) {
                return fmt::format("expected a whole number from {} to {}, got \"{}\"", min, max, io::printable(s));
            }
            return std::string();
        },
        "");
}


CLI::Validator file_name() {
    return CLI::Validator([](std::string& s) { return s.empty() ? std::string("expected a file name, got an empty text") : std::string(); },
                          "");
}

std::string message_line(const std::string& what) { return io::printable(what, what.size()); }

bool use_color(const std::string& output_path) {
    if (!output_path.empty() && output_path != "-") return false;
    if (const char* nc = std::getenv("NO_COLOR"); nc && *nc) return false;
    if (const char* term = std::getenv("TERM"); term && std::string(term) == "dumb") return false;
    return ::isatty(STDOUT_FILENO) == 1;
}

std::size_t text_width() {
    // COLUMNS first (the user's explicit choice), then the terminal's own width, else 100; never
    // below 40 columns, the narrowest the text layouts fit.
    constexpr long narrowest = 40;
    if (const char* c = std::getenv("COLUMNS"); c && *c) {
        char* end = nullptr;
        const long n = std::strtol(c, &end, 10);
        if (end && *end == '\0' && n > 0) return static_cast<std::size_t>(std::clamp(n, narrowest, 1000L));
    }
    if (::isatty(STDOUT_FILENO) == 1) {
        winsize ws{};
        if (::ioctl(STDOUT_FILENO, TIOCGWINSZ, &ws) == 0 && ws.ws_col > 0) {
            return static_cast<std::size_t>(std::max<long>(ws.ws_col, narrowest));
        }
    }
    return 100;
}

}  // namespace coilfit::cli
