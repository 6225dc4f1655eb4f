// Shared checks of the fuzz targets: what must hold for every input, valid or not.
//
// - Bad input ends in one InputError whose message is one line of printable UTF-8 that names
//   where it came from; nothing else escapes (an escaping exception aborts the fuzzer).
// - Good input gives a report with no NaN or infinity anywhere: every number of the JSON
//   report is finite, the JSON dumps and parses back, and the text report never prints
//   "nan", "inf" or "n/a" (format_quantity's word for a non-finite value).
#pragma once

#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <string>
#include <string_view>

#include "coilfit/pick.hpp"
#include "coilfit/sizing.hpp"
#include "io/json_read.hpp"
#include "io/parts_io.hpp"
#include "io/report_io.hpp"
#include "io/spec_io.hpp"

namespace coilfit::fuzz {

[[noreturn]] inline void finding(std::string_view what, std::string_view detail) {
    std::fprintf(stderr, "FUZZ FINDING: %.*s\n%.*s\n", static_cast<int>(what.size()), what.data(),
                 static_cast<int>(detail.size()), detail.data());
    std::abort();
}

// The shipped parts table, loaded once.
inline const io::PartsTable& table() {
    static const io::PartsTable t = io::load_parts(COILFIT_FUZZ_PARTS_DIR);
    return t;
}

// An input error's message: one line, printable UTF-8, not empty, naming its origin.
inline void check_message(std::string_view message, std::string_view origin) {
    if (message.empty()) finding("empty error message", "");
    if (message.size() > 1000) finding("error message longer than 1000 bytes", message);
    if (!io::is_utf8(message)) finding("error message is not UTF-8", message);
    if (io::printable(message, message.size()) != message) finding("error message holds control characters", message);
    if (!origin.empty() && message.substr(0, origin.size()) != origin)
        finding("error message does not name its origin", message);
}

inline bool is_word_char(char c) {
    return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || c == '_';
}

// Finds "nan", "inf" or "infinity" (any case) as a whole word, and "n/a".
inline void check_text(std::string_view text, std::string_view what) {
    if (text.find("n/a") != std::string_view::npos) finding("non-finite value printed as n/a", text);
    std::string lower(text);
    for (char& c : lower) {
        if (c >= 'A' && c <= 'Z') c = static_cast<char>(c - 'A' + 'a');
    }
    for (const std::string_view word : {"nan", "inf", "infinity"}) {
        for (std::size_t at = lower.find(word); at != std::string::npos; at = lower.find(word, at + 1)) {
            const bool starts = at == 0 || !is_word_char(lower[at - 1]);
            const std::size_t end = at + word.size();
            const bool ends = end >= lower.size() || !is_word_char(lower[end]);
            if (starts && ends) finding(what, text);
        }
    }
}

// Every number of a JSON document is finite.
inline void check_json_numbers(const io::Json& j, const std::string& path) {
    if (j.is_number_float() && !std::isfinite(j.get<double>())) finding("non-finite number in the JSON report", path);
    if (j.is_object()) {
        for (const auto& [k, v] : j.items()) check_json_numbers(v, path + "." + k);
    } else if (j.is_array()) {
        for (std::size_t i = 0; i < j.size(); ++i) check_json_numbers(j[i], path + "[" + std::to_string(i) + "]");
    }
}

// Labels the user typed (names, ids, packages) could spell "nan": replace them before the
// text is scanned. They are labels only; no figure depends on them.
inline Spec without_labels(Spec spec) {
    spec.name = "channel";
    spec.coil.preset.clear();
    spec.pin.preset.clear();
    spec.transistor.id = "Q";
    spec.transistor.package = "P";
    spec.transistor.description.clear();
    if (spec.clamp.diode) {
        spec.clamp.diode->id = "D";
        spec.clamp.diode->package = "P";
    }
    if (spec.clamp.zener) {
        spec.clamp.zener->id = "Z";
        spec.clamp.zener->package = "P";
    }
    return spec;
}

// Sizes a valid spec and checks every output; with_pick also ranks the whole table.
inline void check_outputs(const Spec& original, const Catalogue& catalogue, bool with_pick) {
    const Spec spec = without_labels(original);
    const SizingReport report = size(spec, catalogue);
    const io::Json j = io::report_to_json(report, spec);
    check_json_numbers(j, "report");
    const std::string dumped = j.dump(2);  // throws on invalid UTF-8
    (void)io::Json::parse(dumped);
    io::TextStyle style;
    style.width = 100;
    check_text(io::render_text(report, spec, style), "nan or inf in the text report");
    for (const Check& c : report.checks) {
        for (const auto& v : {c.value, c.limit, c.margin}) {
            if (v && !std::isfinite(*v)) finding("non-finite check figure", c.id);
        }
    }
    if (with_pick) {
        const PickResult picked = pick(spec, catalogue);
        for (const Candidate& c : picked.candidates) {
            if (!std::isfinite(c.worst_margin) || !std::isfinite(c.pin_current_max_a))
                finding("non-finite pick figure", c.transistor);
            if (c.base_resistor_ohm && !std::isfinite(*c.base_resistor_ohm))
                finding("non-finite pick resistor", c.transistor);
        }
        for (const std::string& r : picked.reasons) check_text(r, "nan or inf in a pick reason");
    }
}

}  // namespace coilfit::fuzz
