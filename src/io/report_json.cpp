#include <cmath>

#include "io/report_contact_io.hpp"
#include "io/report_io.hpp"
#include "io/spec_io.hpp"

namespace coilfit::io {
namespace {

Json number_or_null(const std::optional<double>& v) { return v && std::isfinite(*v) ? Json(*v) : Json(nullptr); }

}  // namespace

Json check_to_json(const Check& c) {
    Json cj;
    cj["id"] = c.id;
    cj["verdict"] = verdict_name(c.verdict);
    cj["value"] = number_or_null(c.value);
    cj["limit"] = number_or_null(c.limit);
    cj["unit"] = unit_symbol(c.unit);
    cj["margin"] = number_or_null(c.margin);
    cj["message"] = c.message;
    if (c.verdict == Verdict::skip)
        cj["reason"] = c.reason;
    else
        cj["corner"] = c.corner == Corner::cold ? "cold" : "hot";
    if (c.beyond_data) cj["beyond_data"] = true;
    return cj;
}

Json report_to_json(const SizingReport& report) {
    const Spec& spec = report.spec;
    Json j;
    j["schema"] = report_schema;
    j["tool"] = {{"name", "coilfit"}, {"version", COILFIT_VERSION}};
    j["verdict"] = verdict_name(report.verdict);
    j["input"] = spec_to_json(spec);
    Json q = Json::object();
    for (const auto& e : report.quantities) {
        if (std::isfinite(e.value)) q[e.key] = e.value;
    }
    j["quantities"] = q;
    Json checks = Json::array();
    for (const auto& c : report.checks) checks.push_back(check_to_json(c));
    j["checks"] = checks;
    j["notes"] = report.notes;
    j["cautions"] = report.cautions;
    Json options = Json::array();
    for (const auto& o : report.clamp_options) {
        Json oj;
        oj["clamp"] = o.label;
        oj["peak_collector_voltage_v"] = o.peak_collector_v;
        oj["release_time_s"] = number_or_null(o.release_time_s);
        oj["clamp_energy_j"] = o.clamp_energy_j;
        oj["within_rating"] = o.within_rating;
        if (!o.failed_check.empty()) oj["fails"] = o.failed_check;
        oj["chosen"] = o.chosen;
        options.push_back(oj);
    }
    const ResistorReport& rr = report.resistor;
    if (!rr.kind.empty()) {
        Json resistor;
        resistor["value_ohm"] = number_or_null(rr.value_ohm);
        resistor["series"] = eseries_name(rr.series);
        resistor["tolerance"] = rr.tolerance;
        if (rr.power_rating_w) resistor["power_rating_w"] = *rr.power_rating_w;
        resistor["fixed"] = rr.fixed;
        j[rr.kind == "gate resistor" ? "gate_resistor" : "base_resistor"] = resistor;
    }
    j["driver"] = transistor_kind_name(spec.transistor);
    j["clamp_options"] = options;
    if (report.contact) j["contact"] = contact_to_json(*report.contact);
    return j;
}

}  // namespace coilfit::io
