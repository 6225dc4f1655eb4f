#include <fmt/format.h>

#include "cli/commands.hpp"
#include "coilfit/pick.hpp"
#include "coilfit/pick_relays.hpp"
#include "io/format.hpp"
#include "io/report_io.hpp"
#include "io/report_pick_relays.hpp"

namespace coilfit::cli {
namespace {

constexpr std::string_view pick_schema = "coilfit.pick/1";

std::string margin_words(double m) { return m < -9.99 ? std::string("<-999 %") : fmt::format("{:+.0f} %", m * 100.0); }

io::Json candidate_json(const Candidate& c, bool all_clamps) {
    io::Json cj;
    cj["transistor"] = c.transistor;
    cj["diode"] = c.diode.empty() ? io::Json(nullptr) : io::Json(c.diode);
    if (!all_clamps) {
        cj["clamps_tried"] = c.clamps_tried;
        cj["clamps_passing"] = c.clamps_passing;
    }
    const bool bipolar = c.driver == "npn" || c.driver == "darlington";
    cj["driver"] = c.driver;
    cj["base_resistor_ohm"] = bipolar && c.resistor_ohm ? io::Json(*c.resistor_ohm) : io::Json(nullptr);
    if (c.driver == "nmos") cj["gate_resistor_ohm"] = c.resistor_ohm ? io::Json(*c.resistor_ohm) : io::Json(nullptr);
    cj["verdict"] = verdict_name(c.verdict);
    cj["worst_check"] = c.worst_check;
    cj["worst_margin"] = c.worst_margin;
    cj["window_ratio"] = c.window_ratio ? io::Json(*c.window_ratio) : io::Json(nullptr);
    cj["beyond_data"] = c.beyond_data;
    cj["family"] = c.family;
    cj["failed_checks"] = c.failed;
    return cj;
}

// One row of the text table: #, transistor, clamp diode, resistor, worst check, margin, verdict.
std::array<std::string, 7> row_cells(std::size_t rank, const Candidate& c, bool all_clamps) {
    // An array channel clamps through its own diode to the common pin.
    std::string diode = c.driver == "array" ? std::string("built in") : c.diode.empty() ? std::string("-") : c.diode;
    if (!all_clamps && c.driver != "array" && c.clamps_tried > 1) diode += fmt::format(" (best of {})", c.clamps_tried);
    return {rank ? std::to_string(rank) : std::string(),
            c.transistor,
            diode,
            c.driver == "array" ? "built in"
            : c.resistor_ohm    ? format_quantity(*c.resistor_ohm, Unit::ohm)
                                : "none",
            c.worst_check,
            margin_words(c.worst_margin),
            c.verdict == Verdict::pass ? "pass" : "FAIL"};
}

const std::array<std::string, 7> header{"#",           "transistor", "clamp diode", "resistor",
                                        "worst check", "margin",     "verdict"};

// The rows as a table fitted to the width: aligned columns, or each row on two lines when narrow.
// Streamed rows come in batches: `at_least` keeps the columns of every batch aligned and
// `with_header` prints the header with the first only.
std::string table_text(const std::vector<std::array<std::string, 7>>& rows, const std::vector<Verdict>& verdicts,
                       const io::TextStyle& style, const std::array<std::size_t, 7>& at_least = {},
                       bool with_header = true) {
    std::array<std::size_t, 7> w = at_least;
    for (std::size_t k = 0; k < 7; ++k) w[k] = std::max(w[k], io::display_width(header[k]));
    for (const auto& r : rows)
        for (std::size_t k = 0; k < r.size(); ++k) w[k] = std::max(w[k], io::display_width(r[k]));
    std::size_t total = 1;
    for (const std::size_t x : w) total += x + 1;
    std::string out;
    if (total > style.width) {
        for (std::size_t i = 0; i < rows.size(); ++i) {
            const auto& r = rows[i];
            out += fmt::format("  {}{} {}\n    {}, {}, worst {} {}\n", r[0].empty() ? "" : r[0] + ". ", r[1],
                               io::paint(r[6], verdicts[i], style), r[2], r[3], r[4], r[5]);
        }
        return out;
    }
    const auto line = [&](const std::array<std::string, 7>& r, const Verdict* v) {
        std::string s = " ";
        for (std::size_t k = 0; k < r.size(); ++k) {
            const std::string cell = (k == 0 || k == 5) ? io::pad_left(r[k], w[k]) : io::pad_right(r[k], w[k]);
            s += " " + (k == 6 && v ? io::paint(cell, *v, style) : cell);
        }
        while (!s.empty() && s.back() == ' ') s.pop_back();
        return s + "\n";
    };
    if (with_header) out += line(header, nullptr);
    for (std::size_t i = 0; i < rows.size(); ++i) out += line(rows[i], &verdicts[i]);
    return out;
}

std::string footer(const PickResult& result, const PickOptions& options) {
    std::string text;
    if (!result.reasons.empty()) {
        text += "\nNothing passes:\n";
        for (const auto& r : result.reasons) text += "  - " + io::wrap(r, text_width(), 4) + "\n";
    }
    std::string words = options.all_clamps
                            ? "Each transistor with each diode of the table"
                            : "One row per transistor with its best clamp diode (--all-clamps lists every pair)";
    words += (options.all_clamps && options.top == 0)
                 ? "; each transistor's pairs ranked among themselves."
                 : "; ranked by robustness, then the smallest margin over all checks.";
    const std::size_t width = text_width();
    text +=
        "\n" + io::wrap(words, width, 0) + "\n" +
        io::wrap("Size one with `coilfit size SPEC --transistor ID --diode ID`.", width, 0) + "\n" +
        io::wrap("Values are typical datasheet limits from memory; confirm against the datasheets in use.", width, 0) +
        "\n";
    return text;
}

std::string title(const Spec& spec) { return spec.name.empty() ? std::string("unnamed channel") : spec.name; }

}  // namespace

namespace {

// Where pick writes: standard output as it goes, or a file replaced whole at the end.
struct Output {
    std::string path;
    io::RunInputs inputs;
    std::string buffer;
    void put(const std::string& text) {
        if (path.empty())
            emit(text, "");
        else
            buffer += text;
    }
    void finish() const {
        if (!path.empty()) emit(buffer, path, inputs);
    }
};

io::Json head_json(const Spec& spec, const PickSettings& settings) {
    io::Json j;
    j["schema"] = pick_schema;
    j["tool"] = {{"name", "coilfit"}, {"version", COILFIT_VERSION}};
    j["name"] = spec.name;
    j["all_clamps"] = settings.all_clamps;
    return j;
}

std::string summary_words(const PickResult& result, const PickSettings& settings) {
    const std::string what =
        settings.all_clamps ? "transistor and diode pairs" : "transistors (each with its best clamp diode)";
    return fmt::format("{} of {} {} pass at worst case", result.passing, result.rows, what);
}

// Ranked rows (one per transistor, or the best --top N), printed once they are all known.
std::string ranked_text(const Spec& spec, const PickResult& result, const PickOptions& options,
                        const io::TextStyle& style) {
    std::vector<std::array<std::string, 7>> rows;
    std::vector<Verdict> verdicts;
    for (const Candidate& c : result.candidates) {
        rows.push_back(row_cells(rows.size() + 1, c, options.all_clamps));
        verdicts.push_back(c.verdict);
    }
    PickSettings settings;
    settings.all_clamps = options.all_clamps;
    std::string text =
        io::wrap(fmt::format("coilfit pick - {}: {}", title(spec), summary_words(result, settings)), style.width, 2) +
        "\n\n";
    text += table_text(rows, verdicts, style);
    if (result.candidates.size() < result.rows)
        text += fmt::format("  ... {} more (--top 0 lists all)\n", result.rows - result.candidates.size());
    return text + footer(result, options);
}

// Every pair of the table, written as the rows are made (JSON too): nothing is kept.
PickResult run_stream(const Spec& spec, const io::PartsTable& table, const PickSettings& settings,
                      const PickOptions& options, const io::TextStyle& style, Output& out) {
    const bool json = options.common.format == "json";
    // Fixed columns for the batches: the longest ids of the table.
    std::array<std::size_t, 7> widths{0, 10, 11, 8, 21, 7, 7};
    for (const auto& b : table.catalogue.bipolars) widths[1] = std::max(widths[1], io::display_width(b.id));
    for (const auto& m : table.catalogue.mosfets) widths[1] = std::max(widths[1], io::display_width(m.id));
    for (const auto& a : table.catalogue.arrays) widths[1] = std::max(widths[1], io::display_width(a.id));
    for (const auto& d : table.catalogue.diodes) widths[2] = std::max(widths[2], io::display_width(d.id));
    std::vector<std::array<std::string, 7>> rows;
    std::vector<Verdict> verdicts;
    bool first = true;
    const auto flush = [&] {
        if (!rows.empty()) out.put(table_text(rows, verdicts, style, widths, first));
        first = first && rows.empty();
        rows.clear();
        verdicts.clear();
    };
    if (json) {
        const std::string head = head_json(spec, settings).dump(2);
        out.put(head.substr(0, head.size() - 2) + ",\n  \"candidates\": [");
    } else {
        out.put(io::wrap(fmt::format("coilfit pick - {}: every pair, in table order", title(spec)), style.width, 2) +
                "\n\n");
    }
    PickResult result = pick_each(spec, table.catalogue, settings, [&](const Candidate& c) {
        if (json) {
            std::string item = candidate_json(c, true).dump(2);
            for (std::size_t at = item.find('\n'); at != std::string::npos; at = item.find('\n', at + 1))
                item.insert(at + 1, "    ");
            out.put(std::string(first ? "\n    " : ",\n    ") + item);
            first = false;
            return;
        }
        rows.push_back(row_cells(0, c, true));
        verdicts.push_back(c.verdict);
        if (rows.size() == 64) flush();  // a batch at a time
    });
    if (json) {
        const std::string tail =
            io::Json{{"rows", result.rows}, {"passing", result.passing}, {"reasons", result.reasons}}.dump(2);
        out.put(std::string(first ? "]," : "\n  ],") + tail.substr(1) + "\n");
    } else {
        flush();
        out.put("\n" + summary_words(result, settings) + ".\n" + footer(result, options));
    }
    return result;
}

}  // namespace

int run_pick(const PickOptions& options) {
    const io::PartsTable table = load_table(options.common);
    const Spec spec = io::read_spec(build_spec_document(options.spec), table);
    const io::RunInputs inputs = run_inputs(options.spec, table);
    check_outputs(options.common.output, {}, inputs);  // before the table is tried
    PickSettings settings;
    settings.top = options.top;
    settings.all_clamps = options.all_clamps;
    io::TextStyle style;
    style.color = use_color(options.common.output);
    style.width = text_width();
    Output out{options.common.output, inputs, {}};
    PickResult result;
    bool relay_passes = false;  // a relay and driver of the table pass both sides
    if (settings.all_clamps && settings.top == 0) {
        result = run_stream(spec, table, settings, options, style, out);
    } else {
        result = pick(spec, table.catalogue, settings);
        // A load and no relay: the relays of the table too (src/core/pick_relays.cpp).
        const RelayPickResult relays = pick_relays(spec, table.catalogue, table.relay_records());
        relay_passes = !relays.passing.empty();
        if (options.common.format == "json") {
            io::Json j = head_json(spec, settings);
            j["rows"] = result.rows;
            j["passing"] = result.passing;
            io::Json list = io::Json::array();
            for (const Candidate& c : result.candidates) list.push_back(candidate_json(c, settings.all_clamps));
            j["candidates"] = std::move(list);
            j["reasons"] = result.reasons;
            if (picks_relays(spec)) j["relays"] = io::relay_pick_to_json(relays);
            out.put(j.dump(2) + "\n");
        } else {
            std::string text = ranked_text(spec, result, options, style);
            if (picks_relays(spec)) text += io::render_relay_pick_text(relays, 3, style.width);
            out.put(text);
        }
    }
    out.finish();
    return result.passing > 0 || relay_passes ? exit_pass : exit_fail;
}

}  // namespace coilfit::cli
