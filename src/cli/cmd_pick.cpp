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

}  // namespace

CLI::App* setup_pick(CLI::App& app, PickOptions& options) {
    CLI::App* cmd = app.add_subcommand("pick", "try every transistor (and diode) of the parts table against a spec; list the passing ones first");
    add_spec_options(*cmd, options.spec);
    add_common_options(*cmd, options.common, true);
    cmd->add_option("--top", options.top, "list only the best N combinations, a whole number; 0 (the default) lists all")
        ->check(whole_number(0, 1'000'000'000));
    return cmd;
}

int run_pick(const PickOptions& options) {
    const io::PartsTable table = load_table(options.common);
    const Spec spec = io::read_spec(build_spec_document(options.spec), table);
    const io::RunInputs inputs = run_inputs(options.spec, table);
    check_outputs(options.common.output, {}, inputs);  // before the table is tried
    const PickResult result = pick(spec, table.catalogue);
    const std::size_t n = options.top == 0 ? result.candidates.size() : std::min(options.top, result.candidates.size());
    // A load and no relay: the relays of the table too (src/core/pick_relays.cpp).
    const RelayPickResult relays = pick_relays(spec, table.catalogue, table.relay_records());
    const bool any_pass = (!result.candidates.empty() && result.candidates.front().verdict == Verdict::pass) || !relays.passing.empty();

    std::string text;
    if (options.common.format == "json") {
        io::Json j;
        j["schema"] = pick_schema;
        j["tool"] = {{"name", "coilfit"}, {"version", COILFIT_VERSION}};
        j["name"] = spec.name;
        io::Json list = io::Json::array();
        for (std::size_t i = 0; i < n; ++i) {
            const Candidate& c = result.candidates[i];
            io::Json cj;
            cj["transistor"] = c.transistor;
            cj["diode"] = c.diode.empty() ? io::Json(nullptr) : io::Json(c.diode);
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
            list.push_back(cj);
        }
        j["candidates"] = list;
        j["reasons"] = result.reasons;
        if (picks_relays(spec)) j["relays"] = io::relay_pick_to_json(relays);
        text = j.dump(2) + "\n";
    } else {
        io::TextStyle style;
        style.color = use_color(options.common.output);
        std::vector<std::array<std::string, 7>> rows;
        rows.push_back({"#", "transistor", "diode", "resistor", "worst check", "margin", "verdict"});
        for (std::size_t i = 0; i < n; ++i) {
            const Candidate& c = result.candidates[i];
            rows.push_back({std::to_string(i + 1), c.transistor, c.diode.empty() ? "-" : c.diode,
                            c.driver == "array" ? "built in" : c.resistor_ohm ? format_quantity(*c.resistor_ohm, Unit::ohm) : "none",
                            c.worst_check, c.worst_margin < -9.99 ? std::string("<-999 %") : fmt::format("{:+.0f} %", c.worst_margin * 100.0),
                            c.verdict == Verdict::pass ? "pass" : "FAIL"});
        }
        std::array<std::size_t, 7> w{};
        for (const auto& r : rows)
            for (std::size_t k = 0; k < r.size(); ++k) w[k] = std::max(w[k], io::display_width(r[k]));
        const std::size_t passing = static_cast<std::size_t>(std::count_if(
            result.candidates.begin(), result.candidates.end(), [](const Candidate& c) { return c.verdict == Verdict::pass; }));
        text += fmt::format("coilfit pick - {}: {} of {} combinations pass at worst case\n\n",
                            spec.name.empty() ? std::string("unnamed channel") : spec.name, passing, result.candidates.size());
        for (std::size_t r = 0; r < rows.size(); ++r) {
            std::string line = " ";
            for (std::size_t k = 0; k < rows[r].size(); ++k) {
                const std::string cell = (k == 0 || k == 5) ? io::pad_left(rows[r][k], w[k]) : io::pad_right(rows[r][k], w[k]);
                if (k == 6 && r > 0) line += " " + io::paint(cell, result.candidates[r - 1].verdict, style);
                else line += " " + cell;
            }
            while (!line.empty() && line.back() == ' ') line.pop_back();
            text += line + "\n";
        }
        if (n < result.candidates.size()) text += fmt::format("  ... {} more (--top 0 lists all)\n", result.candidates.size() - n);
        if (!result.reasons.empty()) {
            text += "\nNothing passes:\n";
            for (const auto& r : result.reasons) text += "  - " + io::wrap(r, text_width(), 4) + "\n";
        }
        text += "\nRanked by the smallest margin over all checks; size one with `coilfit size SPEC --transistor ID --diode ID`.\n"
                "Values are typical datasheet limits from memory; confirm against the datasheets in use.\n";
        if (picks_relays(spec)) text += io::render_relay_pick_text(relays, 3, text_width());
    }
    emit(text, options.common.output, inputs);
    return any_pass ? exit_pass : exit_fail;
}

}  // namespace coilfit::cli
