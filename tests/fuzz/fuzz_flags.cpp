// Fuzzes command-line overrides: each input line sets one spec field of the example spec, as
// a flag would (its first byte picks the field, the rest is the value, any bytes at all: a
// flag's value has not been through the JSON parser). Then read, size and report as fuzz_spec.
#include <cstddef>
#include <cstdint>
#include <string>
#include <string_view>

#include "fuzz_common.hpp"

namespace {

using namespace coilfit;

// The field paths the command line can set (src/cli/common.cpp).
constexpr std::string_view fields[] = {"name",
                                       "supply.voltage",
                                       "supply.tolerance",
                                       "ambient.min",
                                       "ambient.max",
                                       "coil.preset",
                                       "coil.rated_voltage",
                                       "coil.resistance",
                                       "coil.tolerance",
                                       "coil.reference_temp",
                                       "coil.must_operate",
                                       "coil.must_release",
                                       "coil.inductance",
                                       "coil.self_heating",
                                       "coil.max_voltage",
                                       "coil.max_release_time",
                                       "pin.preset",
                                       "pin.vdd",
                                       "pin.vdd_tolerance",
                                       "pin.voh",
                                       "pin.voh_current",
                                       "pin.max_current",
                                       "transistor",
                                       "clamp.type",
                                       "clamp.diode",
                                       "clamp.zener",
                                       "clamp.resistor",
                                       "base_resistor.series",
                                       "base_resistor.tolerance",
                                       "base_resistor.power_rating",
                                       "base_resistor.value",
                                       "pulldown",
                                       "policy.forced_gain",
                                       "policy.overdrive",
                                       "policy.current_derating",
                                       "policy.voltage_derating",
                                       "policy.junction_margin",
                                       "policy.power_derating",
                                       "policy.vbe_low",
                                       "switching.frequency",
                                       "load.voltage",
                                       "load.kind",
                                       "load.current",
                                       "load.type",
                                       "load.inrush",
                                       "load.power_factor",
                                       "load.time_constant",
                                       "relay"};
constexpr std::size_t field_count = sizeof(fields) / sizeof(fields[0]);

const io::SpecDocument& example() {
    static const io::SpecDocument d = io::load_spec_document(COILFIT_FUZZ_EXAMPLE);
    return d;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::string_view text(reinterpret_cast<const char*>(data), size);
    io::SpecDocument d = example();
    Spec spec;
    try {
        std::size_t start = 0;
        while (start < text.size()) {
            std::size_t end = text.find('\n', start);
            if (end == std::string_view::npos) end = text.size();
            const std::string_view line = text.substr(start, end - start);
            start = end + 1;
            if (line.empty()) continue;
            const std::string path(fields[static_cast<unsigned char>(line[0]) % field_count]);
            io::set_field(d, path, std::string(line.substr(1)), "--flag-" + std::to_string(path.size()));
        }
        spec = io::read_spec(d, fuzz::table());
    } catch (const InputError& e) {
        fuzz::check_message(e.what(), "");
        const std::string_view m = e.what();
        if (m.substr(0, 7) != "--flag-" && m.substr(0, d.origin.file.size()) != d.origin.file) {
            fuzz::finding("error message names neither the flag nor the file", m);
        }
        return 0;
    }
    fuzz::check_outputs(spec, fuzz::table().catalogue, false);
    return 0;
}
