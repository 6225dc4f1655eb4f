// Fuzzes the whole path from bytes to report: parse_spec_text -> read_spec (against the shipped
// parts table, loaded once) -> size -> JSON and text reports (and, for some inputs, pick over
// the table or a short yield run).
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <string_view>

#include "coilfit/yield.hpp"
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
    const unsigned last = size > 0 ? data[size - 1] : 0U;
    const bool with_pick = last % 4 == 0;
    coilfit::fuzz::check_outputs(spec, table.catalogue, with_pick);
    if (last % 4 == 1) {
        // A short Monte Carlo run: every sample lies inside the worst-case box.
        coilfit::YieldSettings settings;
        settings.samples = 64;
        settings.seed = last;
        settings.distribution = last % 8 == 1 ? coilfit::Distribution::uniform : coilfit::Distribution::normal;
        settings.jobs = 1;
        const coilfit::YieldResult y = coilfit::run_yield(spec, settings);
        if (!std::isfinite(y.pass_rate) || !std::isfinite(y.interval.lo) || !std::isfinite(y.interval.hi)) {
            coilfit::fuzz::finding("non-finite yield figure", "");
        }
        if (y.passed > settings.samples || y.interval.lo > y.pass_rate + 1e-12 || y.pass_rate > y.interval.hi + 1e-12) {
            coilfit::fuzz::finding("inconsistent yield figures", "");
        }
        for (const auto& c : y.checks) {
            if (!std::isfinite(c.pass_rate) || c.failed > c.evaluated)
                coilfit::fuzz::finding("bad yield check figure", "");
        }
    }
    return 0;
}
