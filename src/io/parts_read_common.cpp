#include "io/parts_read_common.hpp"

namespace coilfit::io::records {

double current(ObjectReader& r, const std::string& key, double value) {
    return r.within(key, r.positive(key, value), 1e-9, 1e4);
}

double voltage(ObjectReader& r, const std::string& key, double lo, double hi) {
    return r.within(key, r.positive(key, r.required(key, Unit::volt)), lo, hi);
}

std::string read_id(ObjectReader& r) {
    std::string id = r.required_text("id", 64);
    if (id.empty()) r.fail_at("id", "expected an id such as \"2N4401\", got an empty text");
    if (id.front() == ' ' || id.back() == ' ')
        r.fail_at("id", "expected an id without spaces at either end, got \"" + printable(id) + "\"");
    // An id with a no-break or zero-width space would look like another part's id.
    if (has_invisible(id))
        r.fail_at("id", "expected an id without invisible characters, got \"" + printable(id) + "\"");
    return id;
}

void read_origin(ObjectReader& r, PartOrigin& o, RecordPlace place) {
    o.package = r.text("package", 64).value_or("");
    o.description = r.text("description", 400).value_or("");
    auto s = r.text("source", 1000);
    if (place == RecordPlace::table && (!s || s->empty())) {
        r.fail_at("source", "missing; every record says where its values come from");
    }
    o.source = s.value_or("");
    o.inline_record = place == RecordPlace::inline_spec;
}

void origin_json(const PartOrigin& o, Json& j) {
    j["package"] = o.package;
    j["description"] = o.description;
    j["source"] = o.source;
    if (o.inline_record) {
        // Labelled as in every other output, so that it never passes for the table's record.
        j["inline"] = true;
        j["label"] = display_id(o);
    }
}

void read_thermal(ObjectReader& r, double& pd_w, std::optional<double>& rth, double& tj_max_c) {
    pd_w = r.within("pd", r.positive("pd", r.required("pd", Unit::watt)), 1e-3, 1e3);
    if (auto v = r.quantity("rth_ja", Unit::kelvin_per_watt))
        rth = r.within("rth_ja", r.positive("rth_ja", *v), 0.1, 5000.0);
    tj_max_c = r.within("tj_max", r.quantity("tj_max", Unit::celsius).value_or(150.0), 50.0, 250.0);
}

std::vector<CurrentPoint> read_current_points(ObjectReader& r, const std::string& key) {
    auto pts = read_points<CurrentPoint>(
        r, key,
        [](ObjectReader& pr) {
            CurrentPoint p;
            p.ic_a = current(pr, "ic", pr.required("ic", Unit::ampere));
            p.v_max = pr.within("max", pr.positive("max", pr.required("max", Unit::volt)), 0.001, 20.0);
            return p;
        },
        true);
    check_sorted(r, key, pts, [](const CurrentPoint& p) { return p.ic_a; });
    return pts;
}

Json current_points_json(const std::vector<CurrentPoint>& pts) {
    Json a = Json::array();
    for (const auto& p : pts) a.push_back(Json{{"ic", p.ic_a}, {"max", p.v_max}});
    return a;
}

std::vector<ForwardPoint> read_forward_points(ObjectReader& r, const std::string& key) {
    auto pts = read_points<ForwardPoint>(
        r, key,
        [](ObjectReader& pr) {
            ForwardPoint f;
            f.if_a = current(pr, "if", pr.required("if", Unit::ampere));
            f.vf_max_v = pr.within("max", pr.required("max", Unit::volt), 0.05, 10.0);
            return f;
        },
        true);
    check_sorted(r, key, pts, [](const ForwardPoint& f) { return f.if_a; });
    return pts;
}

}  // namespace coilfit::io::records
