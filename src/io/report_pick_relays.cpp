// pick's relay side as text and as JSON.
#include "io/report_pick_relays.hpp"

#include <array>
#include <cmath>

#include <fmt/format.h>

#include "io/format.hpp"

namespace coilfit::io {
namespace {

std::string margin_text(double m) { return m < -9.99 ? std::string("<-999 %") : fmt::format("{:+.0f} %", m * 100.0); }

std::string resistor_text(const Candidate& c) {
    if (c.driver == "array") return "built in";
    return c.resistor_ohm ? format_quantity(*c.resistor_ohm, Unit::ohm) : std::string("none");
}

}  // namespace

std::string render_relay_pick_text(const RelayPickResult& result, std::size_t per_relay, std::size_t width) {
    std::string out = fmt::format(
        "\nRelays of the table for this load: {} of {} relay and driver combinations pass both sides "
        "({} records with contact ratings)\n\n",
        result.passing.size(), result.combinations, result.relays_tried);
    std::vector<std::array<std::string, 7>> rows;
    rows.push_back({"relay", "kind", "transistor", "diode", "resistor", "worst check", "margin"});
    std::string last;
    std::size_t shown = 0;
    std::size_t hidden = 0;
    for (const RelayCandidate& r : result.passing) {
        shown = r.relay == last ? shown + 1 : 1;
        last = r.relay;
        if (per_relay != 0 && shown > per_relay) {
            ++hidden;
            continue;
        }
        const Candidate& c = r.driver;
        rows.push_back({shown == 1 ? r.relay : std::string(),
                        shown == 1 ? std::string(relay_kind_name(r.kind)) : std::string(), c.transistor,
                        c.diode.empty() ? "-" : c.diode, resistor_text(c), c.worst_check, margin_text(c.worst_margin)});
    }
    std::array<std::size_t, 7> w{};
    for (const auto& row : rows)
        for (std::size_t k = 0; k < row.size(); ++k) w[k] = std::max(w[k], display_width(row[k]));
    if (rows.size() > 1) {
        for (const auto& row : rows) {
            std::string line = " ";
            for (std::size_t k = 0; k < row.size(); ++k)
                line += " " + (k == 6 ? pad_left(row[k], w[k]) : pad_right(row[k], w[k]));
            while (!line.empty() && line.back() == ' ') line.pop_back();
            out += line + "\n";
        }
    }
    if (hidden)
        out += fmt::format("  ... {} more combinations (the best {} of each relay are listed)\n", hidden, per_relay);
    if (!result.reasons.empty()) {
        out += "\nRelays with no passing combination:\n";
        for (const auto& r : result.reasons) out += "  - " + wrap(r, width, 4) + "\n";
    }
    out +=
        "\nSize one with `coilfit size SPEC --relay ID --transistor ID --diode ID`; the relay records hold values "
        "typical "
        "of their class, from memory: use the ratings of the relay in use.\n";
    return out;
}

Json relay_pick_to_json(const RelayPickResult& result) {
    Json list = Json::array();
    for (const RelayCandidate& r : result.passing) {
        const Candidate& c = r.driver;
        Json j;
        j["relay"] = r.relay;
        j["kind"] = relay_kind_name(r.kind);
        j["form"] = r.form;
        j["transistor"] = c.transistor;
        j["driver"] = c.driver;
        j["diode"] = c.diode.empty() ? Json(nullptr) : Json(c.diode);
        j["resistor_ohm"] = c.resistor_ohm ? Json(*c.resistor_ohm) : Json(nullptr);
        j["worst_check"] = c.worst_check;
        j["worst_margin"] = std::isfinite(c.worst_margin) ? Json(c.worst_margin) : Json(nullptr);
        list.push_back(j);
    }
    Json out;
    out["relays_tried"] = result.relays_tried;
    out["combinations"] = result.combinations;
    out["passing"] = list;
    out["reasons"] = result.reasons;
    return out;
}

}  // namespace coilfit::io
