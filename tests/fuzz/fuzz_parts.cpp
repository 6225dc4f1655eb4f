// Fuzzes parts-table loading: a table file is read whole or rejected whole (the table it was
// added to stays as it was); every record read sizes a design without NaN or infinity.
#include <cstddef>
#include <cstdint>
#include <string>
#include <string_view>

#include "fuzz_common.hpp"

namespace {

using namespace coilfit;

// A table that already holds one record, as when a second file of a folder is read.
const io::PartsTable& base_table() {
    static const io::PartsTable t = [] {
        io::PartsTable b;
        io::parse_parts_text(R"([{ "id": "QBASE", "kind": "npn", "ic_max": "600mA", "vceo": "40V",
            "hfe_min": [{ "ic": "150mA", "min": 100 }], "vce_sat": [{ "ic": "150mA", "ib": "15mA", "max": "0.4V" }],
            "vbe_sat": [{ "ic": "150mA", "ib": "15mA", "max": "0.95V" }], "pd": "625mW", "source": "fuzz base" }])",
                             "base.json", b);
        return b;
    }();
    return t;
}

const io::SpecDocument& example() {
    static const io::SpecDocument d = io::load_spec_document(COILFIT_FUZZ_EXAMPLE);
    return d;
}

// The example spec read against the shipped table; the fuzzed records replace its parts.
const Spec& example_spec() {
    static const Spec s = io::read_spec(example(), fuzz::table());
    return s;
}

bool same_size(const io::PartsTable& a, const io::PartsTable& b) {
    return a.catalogue.bipolars.size() == b.catalogue.bipolars.size() &&
           a.catalogue.diodes.size() == b.catalogue.diodes.size() &&
           a.catalogue.zeners.size() == b.catalogue.zeners.size() && a.presets.size() == b.presets.size() &&
           a.files.size() == b.files.size();
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::string_view text(reinterpret_cast<const char*>(data), size);
    io::PartsTable t = base_table();
    try {
        io::parse_parts_text(text, "fuzz.json", t);
    } catch (const InputError& e) {
        fuzz::check_message(e.what(), "fuzz.json");
        if (!same_size(t, base_table())) fuzz::finding("a rejected table file left records behind", e.what());
        return 0;
    }
    // Zener ids show in the clamp options: make them plain labels before scanning the text.
    Catalogue catalogue = t.catalogue;
    for (std::size_t i = 0; i < catalogue.zeners.size(); ++i) catalogue.zeners[i].id = "Z" + std::to_string(i);

    constexpr std::size_t most = 3;  // records of each kind sized per input
    for (std::size_t i = 0; i < t.catalogue.bipolars.size() && i < most; ++i) {
        Spec s = example_spec();
        s.transistor = t.catalogue.bipolars[i];
        fuzz::check_outputs(s, catalogue, false);
    }
    for (std::size_t i = 0; i < t.catalogue.diodes.size() && i < most; ++i) {
        Spec s = example_spec();
        s.clamp.diode = t.catalogue.diodes[i];
        fuzz::check_outputs(s, catalogue, false);
    }
    for (std::size_t i = 0; i < t.catalogue.zeners.size() && i < most; ++i) {
        Spec s = example_spec();
        s.clamp.type = ClampType::diode_zener;
        s.clamp.zener = t.catalogue.zeners[i];
        fuzz::check_outputs(s, catalogue, false);
    }
    // Presets were checked when the table was read; a spec starting from one is read again
    // as a whole (a preset may leave required fields to the spec, then it is an input error).
    for (std::size_t i = 0; i < t.presets.size() && i < most; ++i) {
        io::SpecDocument d = example();
        const io::Preset& p = t.presets[i];
        d.doc[p.kind] = io::Json::object({{"preset", p.id}});
        try {
            fuzz::check_outputs(io::read_spec(d, t), catalogue, false);
        } catch (const InputError& e) {
            fuzz::check_message(e.what(), "");
        }
    }
    return 0;
}
