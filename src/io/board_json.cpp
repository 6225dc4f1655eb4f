// A board report as JSON (schema "coilfit.board-report/1"): the board's checks in the shape of a
// report's checks, with what they are about and the set of channels they were taken at, and
// every channel's whole report (schema "coilfit.report/1") inside.
#include <cmath>

#include "io/board_io.hpp"

namespace coilfit::io {
namespace {

Json names_of(const Board& board, const std::vector<std::size_t>& set) {
    Json out = Json::array();
    for (const std::size_t i : set) out.push_back(board.channels[i].spec.name);
    return out;
}

Json simultaneity_json(const Board& board) {
    const Simultaneity& s = board.simultaneous;
    Json j;
    j["rule"] = s.all() ? "all" : "limited";
    j["words"] = simultaneity_words(board);
    if (s.max_on) j["max_on"] = *s.max_on;
    if (!s.groups.empty()) {
        Json groups = Json::array();
        for (const auto& g : s.groups) groups.push_back(names_of(board, g));
        j["groups"] = groups;
    }
    return j;
}

Json channel_json(const BoardReport& report, std::size_t i) {
    const BoardChannel& ch = report.board.channels[i];
    const SizingReport& r = report.channels[i];
    Json j;
    j["name"] = ch.spec.name;
    j["pin"] = ch.pin;
    j["port"] = ch.port ? Json(report.board.mcu.ports[*ch.port].name) : Json(nullptr);
    j["package"] = ch.package.empty() ? Json(nullptr) : Json(ch.package);
    j["driver"] = transistor_kind_name(ch.spec.transistor);
    j["transistor"] = origin(ch.spec.transistor).id;
    j["verdict"] = verdict_name(r.verdict);
    j["report"] = report_to_json(r);
    return j;
}

}  // namespace

Json board_report_to_json(const BoardReport& report) {
    const Board& board = report.board;
    Json j;
    j["schema"] = board_report_schema;
    j["tool"] = {{"name", "coilfit"}, {"version", COILFIT_VERSION}};
    j["name"] = board.name;
    j["verdict"] = verdict_name(report.verdict);
    j["simultaneous"] = simultaneity_json(board);
    Json checks = Json::array();
    for (const BoardCheck& c : report.checks) {
        Json cj = check_to_json(c.check);
        cj["subject"] = c.subject;
        cj["set"] = names_of(board, c.set);
        checks.push_back(cj);
    }
    j["checks"] = checks;
    Json q = Json::object();
    for (const auto& e : report.quantities) {
        if (std::isfinite(e.value)) q[e.key] = e.value;
    }
    j["quantities"] = q;
    j["notes"] = report.notes;
    j["cautions"] = report.cautions;
    Json channels = Json::array();
    for (std::size_t i = 0; i < report.channels.size(); ++i) channels.push_back(channel_json(report, i));
    j["channels"] = channels;
    return j;
}

}  // namespace coilfit::io
