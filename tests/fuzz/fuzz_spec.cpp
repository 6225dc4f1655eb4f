// Fuzzes the whole path from bytes to report: parse_spec_text -> read_spec (against the shipped
// parts table, loaded once) -> size -> JSON and text reports (and pick over the table).
#include <cstddef>
#include <cstdint>
#include <string_view>

#include "fuzz_common.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::string_view text(reinterpret_cast<const char*>(data), size);
    const coilfit::io::PartsTable& table = coilfit::fuzz::table();
    coilfit::Spec spec;
    try {
        spec = coilfit::io::read_spec(coilfit::io::parse_spec_text(text, "fuzz.json"), table);
    } catch (const coilfit::InputError& e) {
        coilfit::fuzz::check_message(e.what(), "fuzz.json");
        return 0;
    }
    // pick sizes every transistor and diode of the table (some 280 designs): only for a
    // quarter of the inputs, chosen by the input itself, to keep the run fast.
    const bool with_pick = size > 0 && data[size - 1] % 4 == 0;
    coilfit::fuzz::check_outputs(spec, table.catalogue, with_pick);
    return 0;
}
