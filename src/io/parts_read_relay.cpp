// Reader of relay and contactor records (src/method.md "Contact side"): the coil fields of a
// coil preset, with the contacts beside them.
#include "io/parts_read_common.hpp"
#include "io/sections_read.hpp"

namespace coilfit::io {
namespace {

using namespace records;

// Fields of the record itself; every other field is the coil's.
bool record_field(const std::string& key) {
    return key == "id" || key == "kind" || key == "description" || key == "source" || key == "package" ||
           key == "contacts";
}

ContactRating read_rating(ObjectReader& parent, const std::string& key, double v_lo, double i_lo) {
    const Json* j = parent.get(key);
    ObjectReader r(*j, parent.origin(), parent.path_of(key));
    ContactRating out;
    out.voltage_v = r.within("voltage", r.positive("voltage", r.required("voltage", Unit::volt)), v_lo, 1e4);
    out.current_a = r.within("current", r.positive("current", r.required("current", Unit::ampere)), i_lo, 1e4);
    r.finish();
    return out;
}

std::vector<BreakingPoint> read_breaking(ObjectReader& r) {
    auto pts = read_points<BreakingPoint>(
        r, "dc_breaking",
        [](ObjectReader& pr) {
            BreakingPoint p;
            p.voltage_v = pr.within("voltage", pr.positive("voltage", pr.required("voltage", Unit::volt)), 1.0, 1e4);
            p.current_a = pr.within("current", pr.positive("current", pr.required("current", Unit::ampere)), 1e-3, 1e4);
            return p;
        },
        false);
    check_sorted(
        r, "dc_breaking", pts, [](const BreakingPoint& p) { return p.voltage_v; }, "voltage");
    // A breaking curve falls with voltage: a rising point is a unit slip or a swapped pair.
    for (std::size_t i = 1; i < pts.size(); ++i) {
        if (pts[i].current_a > pts[i - 1].current_a) {
            r.fail_at(
                "dc_breaking[" + std::to_string(i) + "]",
                fmt::format("expected a current of at most the point before ({}), got {}: the breaking current falls "
                            "as the voltage rises",
                            format_quantity(pts[i - 1].current_a, Unit::ampere, 6),
                            format_quantity(pts[i].current_a, Unit::ampere, 6)));
        }
    }
    return pts;
}

Contacts read_contacts(ObjectReader& r) {
    Contacts c;
    c.form = r.text("form", 32).value_or("");
    if (r.get("ac")) c.ac = read_rating(r, "ac", 1.0, 1e-3);
    if (r.get("dc")) c.dc = read_rating(r, "dc", 1.0, 1e-3);
    if (!c.ac && !c.dc)
        r.fail_at("ac",
                  "missing; contacts need an AC or a DC rating (or both), such as { \"voltage\": \"250V\", "
                  "\"current\": \"10A\" }");
    c.dc_breaking = read_breaking(r);
    if (auto v = r.quantity("make_current", Unit::ampere))
        c.make_current_a = r.within("make_current", r.positive("make_current", *v), 1e-3, 1e5);
    if (r.get("min_load")) c.min_load = read_rating(r, "min_load", 1e-3, 1e-9);
    return c;
}

}  // namespace

RelayEntry read_relay(ObjectReader& r, const Json& record, RecordPlace place) {
    RelayEntry e;
    RelayRecord& rel = e.record;
    rel.id = read_id(r);
    const std::string kind =
        place == RecordPlace::table ? r.required_text("kind", 32) : r.text("kind", 32).value_or("relay");
    if (kind == "relay")
        rel.kind = RelayKind::relay;
    else if (kind == "contactor")
        rel.kind = RelayKind::contactor;
    else
        r.fail_at("kind", "expected \"relay\" or \"contactor\", got \"" + printable(kind) + "\"");
    for (const auto& [key, value] : record.items()) {
        if (record_field(key)) continue;
        e.coil_fields[key] = value;
        (void)r.get(key);
    }
    {
        // The coil fields as a spec's coil reads them; a table record gives the whole coil.
        ObjectReader cr(e.coil_fields, r.origin(), r.path());
        std::vector<std::string> defaults;
        if (e.coil_fields.contains("preset")) cr.fail_at("preset", "expected no preset inside a relay record");
        read_coil(cr, rel.coil, defaults, place == RecordPlace::inline_spec);
        cr.finish();
    }
    if (const Json* cj = r.get("contacts")) {
        ObjectReader cr(*cj, r.origin(), r.path_of("contacts"));
        rel.contacts = read_contacts(cr);
        cr.finish();
    }
    read_origin(r, rel, place);
    return e;
}

Json to_json(const RelayPart& p) {
    Json j;
    j["id"] = p.id;
    j["kind"] = relay_kind_name(p.kind);
    origin_json(p, j);
    if (!p.contacts) {
        j["contacts"] = nullptr;
        return j;
    }
    const Contacts& c = *p.contacts;
    Json cj;
    cj["form"] = c.form;
    auto rating = [](const std::optional<ContactRating>& r) {
        return r ? Json{{"voltage", r->voltage_v}, {"current", r->current_a}} : Json(nullptr);
    };
    cj["ac"] = rating(c.ac);
    cj["dc"] = rating(c.dc);
    Json curve = Json::array();
    for (const auto& b : c.dc_breaking) curve.push_back(Json{{"voltage", b.voltage_v}, {"current", b.current_a}});
    cj["dc_breaking"] = curve;
    cj["make_current"] = c.make_current_a ? Json(*c.make_current_a) : Json(nullptr);
    cj["min_load"] = rating(c.min_load);
    j["contacts"] = cj;
    return j;
}

}  // namespace coilfit::io
