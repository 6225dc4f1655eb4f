#include "io/parts_io.hpp"

#include <algorithm>
#include <cstdlib>
#include <filesystem>
#include <map>

#include <fmt/format.h>

#include "io/spec_io.hpp"

namespace coilfit::io {
namespace {

namespace fs = std::filesystem;

constexpr std::size_t max_table_bytes = 8U << 20U;

// Points lists: [{ "ic": "150mA", "min": 100 }, ...], sorted by current, at least one.
template <typename Point, typename ReadPoint>
std::vector<Point> read_points(ObjectReader& r, const std::string& key, ReadPoint read_point, bool required) {
    std::vector<Point> out;
    const Json* list = r.get(key);
    if (!list) {
        if (required) r.fail_at(key, "missing; expected a list of points");
        return out;
    }
    if (!list->is_array() || list->empty()) r.fail_at(key, "expected a list of one or more points, got " + describe(*list));
    if (list->size() > 64) r.fail_at(key, "more than 64 points");
    for (std::size_t i = 0; i < list->size(); ++i) {
        ObjectReader pr((*list)[i], r.origin(), r.path_of(key) + "[" + std::to_string(i) + "]");
        out.push_back(read_point(pr));
        pr.finish();
    }
    return out;
}

template <typename Point, typename X>
void check_sorted(const ObjectReader& r, const std::string& key, const std::vector<Point>& pts, X x) {
    for (std::size_t i = 1; i < pts.size(); ++i) {
        if (!(x(pts[i]) > x(pts[i - 1]))) {
            r.fail_at(key + "[" + std::to_string(i) + "]", "points must be in order of increasing current");
        }
    }
}

// Plausible ranges of datasheet figures: wide enough for any small-signal to power part, narrow
// enough that a unit slip ("600" amperes for 600 mA) or a stray exponent is caught.
double current(ObjectReader& r, const std::string& key, double value) { return r.within(key, r.positive(key, value), 1e-9, 1e4); }

SaturationPoint read_saturation(ObjectReader& p) {
    SaturationPoint s;
    s.ic_a = current(p, "ic", p.required("ic", Unit::ampere));
    s.ib_a = current(p, "ib", p.required("ib", Unit::ampere));
    s.v_max = p.within("max", p.positive("max", p.required("max", Unit::volt)), 0.001, 10.0);
    if (s.ib_a > s.ic_a) {
        p.fail_at("ib", fmt::format("expected a base current at most the test's ic {} (a saturation test condition), got {}",
                                    format_quantity(s.ic_a, Unit::ampere, 6), format_quantity(s.ib_a, Unit::ampere, 6)));
    }
    return s;
}

// Ids are how specs name parts: printable, not empty, no spaces at either end.
std::string read_id(ObjectReader& r) {
    std::string id = r.required_text("id", 64);
    if (id.empty()) r.fail_at("id", "expected an id such as \"2N4401\", got an empty text");
    if (id.front() == ' ' || id.back() == ' ') r.fail_at("id", "expected an id without spaces at either end, got \"" + id + "\"");
    return id;
}

std::string read_source(ObjectReader& r) {
    auto s = r.text("source", 1000);
    if (!s || s->empty()) r.fail_at("source", "missing; every record says where its values come from");
    return *s;
}

}  // namespace

Bipolar read_bipolar(ObjectReader& r) {
    Bipolar p;
    p.id = read_id(r);
    const std::string kind = r.required_text("kind", 32);
    if (kind == "npn") p.kind = BipolarKind::npn;
    else if (kind == "darlington") p.kind = BipolarKind::darlington;
    else r.fail_at("kind", "expected \"npn\" or \"darlington\", got \"" + kind + "\"");
    p.ic_max_a = r.within("ic_max", r.positive("ic_max", r.required("ic_max", Unit::ampere)), 1e-6, 1e3);
    p.vceo_v = r.within("vceo", r.positive("vceo", r.required("vceo", Unit::volt)), 1.0, 1e4);
    p.hfe_min = read_points<GainPoint>(r, "hfe_min", [](ObjectReader& pr) {
        GainPoint g;
        g.ic_a = current(pr, "ic", pr.required("ic", Unit::ampere));
        // A bipolar transistor's current gain is above 1 (a Darlington's up to about 10^5).
        g.hfe_min = pr.within("min", pr.positive("min", pr.required("min", Unit::number)), 1.0, 1e6);
        if (auto typ = pr.quantity("typ", Unit::number)) {
            g.hfe_typ = pr.within("typ", *typ, 1.0, 1e6);
            if (*typ < g.hfe_min) {
                pr.fail_at("typ", fmt::format("expected a typical gain of at least the minimum {}, got {}",
                                              format_quantity(g.hfe_min, Unit::number, 6), format_quantity(*typ, Unit::number, 6)));
            }
        }
        return g;
    }, true);
    check_sorted(r, "hfe_min", p.hfe_min, [](const GainPoint& g) { return g.ic_a; });
    p.vce_sat = read_points<SaturationPoint>(r, "vce_sat", read_saturation, true);
    check_sorted(r, "vce_sat", p.vce_sat, [](const SaturationPoint& g) { return g.ic_a; });
    p.vbe_sat = read_points<SaturationPoint>(r, "vbe_sat", read_saturation, true);
    check_sorted(r, "vbe_sat", p.vbe_sat, [](const SaturationPoint& g) { return g.ic_a; });
    p.pd_w = r.within("pd", r.positive("pd", r.required("pd", Unit::watt)), 1e-3, 1e3);
    if (auto rth = r.quantity("rth_ja", Unit::kelvin_per_watt)) p.rth_ja_k_per_w = r.within("rth_ja", r.positive("rth_ja", *rth), 0.1, 5000.0);
    p.tj_max_c = r.within("tj_max", r.quantity("tj_max", Unit::celsius).value_or(150.0), 50.0, 250.0);
    p.package = r.text("package", 64).value_or("");
    p.description = r.text("description", 400).value_or("");
    p.source = read_source(r);
    return p;
}

Diode read_diode(ObjectReader& r) {
    Diode d;
    d.id = read_id(r);
    const std::string kind = r.required_text("kind", 32);
    if (kind == "rectifier") d.kind = DiodeKind::rectifier;
    else if (kind == "fast") d.kind = DiodeKind::fast;
    else if (kind == "signal") d.kind = DiodeKind::signal;
    else if (kind == "schottky") d.kind = DiodeKind::schottky;
    else r.fail_at("kind", "expected \"rectifier\", \"fast\", \"signal\" or \"schottky\", got \"" + kind + "\"");
    d.vrrm_v = r.within("vrrm", r.positive("vrrm", r.required("vrrm", Unit::volt)), 1.0, 1e4);
    d.if_avg_a = r.within("if_avg", r.positive("if_avg", r.required("if_avg", Unit::ampere)), 1e-6, 1e3);
    if (auto v = r.quantity("ifrm", Unit::ampere)) d.ifrm_a = current(r, "ifrm", *v);
    if (auto v = r.quantity("ifsm", Unit::ampere)) d.ifsm_a = current(r, "ifsm", *v);
    d.vf = read_points<ForwardPoint>(r, "vf", [](ObjectReader& pr) {
        ForwardPoint f;
        f.if_a = current(pr, "if", pr.required("if", Unit::ampere));
        f.vf_max_v = pr.within("max", pr.required("max", Unit::volt), 0.05, 10.0);
        return f;
    }, true);
    check_sorted(r, "vf", d.vf, [](const ForwardPoint& f) { return f.if_a; });
    if (auto v = r.quantity("vf_low", Unit::volt)) d.vf_low_v = r.within("vf_low", *v, 0.05, 5.0);
    d.package = r.text("package", 64).value_or("");
    d.description = r.text("description", 400).value_or("");
    d.source = read_source(r);
    return d;
}

Zener read_zener(ObjectReader& r) {
    Zener z;
    z.id = read_id(r);
    const std::string kind = r.required_text("kind", 32);
    if (kind != "zener") r.fail_at("kind", "expected \"zener\", got \"" + kind + "\"");
    z.vz_v = r.within("vz", r.positive("vz", r.required("vz", Unit::volt)), 1.0, 1000.0);
    z.tolerance = r.fraction("tolerance", r.quantity("tolerance", Unit::ratio).value_or(0.05), 0.0, 0.5, true);
    z.pd_w = r.within("pd", r.positive("pd", r.required("pd", Unit::watt)), 1e-3, 1e3);
    if (auto v = r.quantity("izt", Unit::ampere)) z.izt_a = current(r, "izt", *v);
    z.package = r.text("package", 64).value_or("");
    z.description = r.text("description", 400).value_or("");
    z.source = read_source(r);
    return z;
}

const Preset* PartsTable::find_preset(std::string_view kind, std::string_view id) const {
    const auto it = std::find_if(presets.begin(), presets.end(),
                                 [&](const Preset& p) { return p.kind == kind && p.id == id; });
    return it == presets.end() ? nullptr : &*it;
}

void parse_parts_text(std::string_view text, const std::string& file, PartsTable& into) {
    const Json doc = parse_json(text, file, max_table_bytes, "a JSON list [ ... ] of part records");
    Origin origin;
    origin.file = file;
    if (!doc.is_array()) fail(origin, "", "expected a JSON list [ ... ] of part records, got " + describe(doc));
    // Read into a copy and commit at the end: a file with an error adds nothing.
    PartsTable table = into;
    // Ids already present (from earlier files) and where they came from.
    std::map<std::string, std::string> ids;
    for (const auto& b : table.catalogue.bipolars) ids[b.id] = "an earlier file";
    for (const auto& d : table.catalogue.diodes) ids[d.id] = "an earlier file";
    for (const auto& z : table.catalogue.zeners) ids[z.id] = "an earlier file";
    for (const auto& p : table.presets) ids[p.id] = "an earlier file";
    constexpr std::string_view kinds = "npn, darlington, rectifier, fast, signal, schottky, zener, coil or pin";
    for (std::size_t i = 0; i < doc.size(); ++i) {
        const std::string path = "[" + std::to_string(i) + "]";
        ObjectReader r(doc[i], origin, path);
        const Json* kind_j = r.get("kind");
        if (!kind_j) r.fail_at("kind", fmt::format("missing; expected {}", kinds));
        if (!kind_j->is_string()) r.fail_at("kind", fmt::format("expected {}, got {}", kinds, describe(*kind_j)));
        const std::string kind = kind_j->get<std::string>();
        std::string id;
        if (kind == "npn" || kind == "darlington") {
            table.catalogue.bipolars.push_back(read_bipolar(r));
            id = table.catalogue.bipolars.back().id;
        } else if (kind == "rectifier" || kind == "fast" || kind == "signal" || kind == "schottky") {
            table.catalogue.diodes.push_back(read_diode(r));
            id = table.catalogue.diodes.back().id;
        } else if (kind == "zener") {
            table.catalogue.zeners.push_back(read_zener(r));
            id = table.catalogue.zeners.back().id;
        } else if (kind == "coil" || kind == "pin") {
            Preset p;
            p.id = read_id(r);
            p.kind = kind;
            p.description = r.text("description", 400).value_or("");
            p.source = read_source(r);
            p.fields = Json::object();
            for (const auto& [k, v] : doc[i].items()) {
                if (k != "id" && k != "kind" && k != "description" && k != "source") {
                    p.fields[k] = v;
                    (void)r.get(k);
                }
            }
            // The preset's fields are checked now, as a spec would read them: a bad preset
            // rejects the table here rather than a spec that uses it later.
            check_preset_fields(p.fields, kind, origin, path);
            table.presets.push_back(std::move(p));
            id = table.presets.back().id;
        } else {
            r.fail_at("kind", fmt::format("unknown kind {}; expected {}", describe(*kind_j), kinds));
        }
        r.finish();
        const auto [it, inserted] = ids.emplace(id, path);
        if (!inserted) r.fail_at("id", "duplicate id \"" + id + "\" (also at " + it->second + ")");
    }
    table.files.push_back(file);
    into = std::move(table);
}

PartsTable load_parts(const std::string& path) {
    PartsTable table;
    std::error_code ec;
    if (fs::is_directory(path, ec)) {
        std::vector<std::string> files;
        for (const auto& entry : fs::directory_iterator(path, ec)) {
            if (entry.is_regular_file() && entry.path().extension() == ".json") files.push_back(entry.path().string());
        }
        if (ec) throw InputError(path + ": cannot list the folder: " + ec.message());
        std::sort(files.begin(), files.end());
        if (files.empty()) throw InputError(path + ": no parts files (*.json) in this folder");
        for (const auto& f : files) parse_parts_text(read_text(f, max_table_bytes), f, table);
    } else if (fs::exists(path, ec)) {
        parse_parts_text(read_text(path, max_table_bytes), path, table);
    } else {
        throw InputError(path + ": no such parts file or folder");
    }
    return table;
}

std::string resolve_parts_path(const std::string& flag) {
    if (!flag.empty()) return flag;
    if (const char* env = std::getenv("COILFIT_PARTS"); env && *env) return env;
    std::error_code ec;
    const fs::path exe = fs::read_symlink("/proc/self/exe", ec);
    if (!ec) {
        const fs::path installed = exe.parent_path().parent_path() / "share" / "coilfit" / "parts";
        if (fs::is_directory(installed, ec)) return installed.string();
    }
    if (fs::is_directory(COILFIT_SOURCE_PARTS_DIR, ec)) return COILFIT_SOURCE_PARTS_DIR;
    return COILFIT_INSTALL_PARTS_DIR;
}

namespace {
Json sat_json(const std::vector<SaturationPoint>& pts) {
    Json a = Json::array();
    for (const auto& p : pts) a.push_back(Json{{"ic", p.ic_a}, {"ib", p.ib_a}, {"max", p.v_max}});
    return a;
}
}  // namespace

Json to_json(const Bipolar& p) {
    Json j;
    j["id"] = p.id;
    j["kind"] = bipolar_kind_name(p.kind);
    j["ic_max"] = p.ic_max_a;
    j["vceo"] = p.vceo_v;
    Json h = Json::array();
    for (const auto& g : p.hfe_min) {
        Json e{{"ic", g.ic_a}, {"min", g.hfe_min}};
        if (g.hfe_typ) e["typ"] = *g.hfe_typ;
        h.push_back(e);
    }
    j["hfe_min"] = h;
    j["vce_sat"] = sat_json(p.vce_sat);
    j["vbe_sat"] = sat_json(p.vbe_sat);
    j["pd"] = p.pd_w;
    j["rth_ja"] = rth_ja(p);
    j["tj_max"] = p.tj_max_c;
    j["package"] = p.package;
    j["description"] = p.description;
    j["source"] = p.source;
    return j;
}

Json to_json(const Diode& p) {
    Json j;
    j["id"] = p.id;
    j["kind"] = diode_kind_name(p.kind);
    j["vrrm"] = p.vrrm_v;
    j["if_avg"] = p.if_avg_a;
    if (p.ifrm_a) j["ifrm"] = *p.ifrm_a;
    if (p.ifsm_a) j["ifsm"] = *p.ifsm_a;
    Json v = Json::array();
    for (const auto& f : p.vf) v.push_back(Json{{"if", f.if_a}, {"max", f.vf_max_v}});
    j["vf"] = v;
    j["vf_low"] = vf_low(p);
    j["package"] = p.package;
    j["description"] = p.description;
    j["source"] = p.source;
    return j;
}

Json to_json(const Zener& p) {
    Json j;
    j["id"] = p.id;
    j["kind"] = "zener";
    j["vz"] = p.vz_v;
    j["tolerance"] = p.tolerance;
    j["pd"] = p.pd_w;
    if (p.izt_a) j["izt"] = *p.izt_a;
    j["package"] = p.package;
    j["description"] = p.description;
    j["source"] = p.source;
    return j;
}

}  // namespace coilfit::io
