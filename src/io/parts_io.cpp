#include "io/parts_io.hpp"

#include <algorithm>
#include <cstdlib>
#include <filesystem>
#include <map>

#include <fmt/format.h>

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

SaturationPoint read_saturation(ObjectReader& p) {
    SaturationPoint s;
    s.ic_a = p.positive("ic", p.required("ic", Unit::ampere));
    s.ib_a = p.positive("ib", p.required("ib", Unit::ampere));
    s.v_max = p.within("max", p.required("max", Unit::volt), 0.001, 10.0);
    if (s.ib_a > s.ic_a) p.fail_at("ib", "a base current above the collector current is not a saturation test condition");
    return s;
}

std::string read_source(ObjectReader& r) {
    auto s = r.text("source", 1000);
    if (!s || s->empty()) r.fail_at("source", "missing; every record says where its values come from");
    return *s;
}

}  // namespace

Bipolar read_bipolar(ObjectReader& r) {
    Bipolar p;
    p.id = r.required_text("id", 64);
    const std::string kind = r.required_text("kind", 32);
    if (kind == "npn") p.kind = BipolarKind::npn;
    else if (kind == "darlington") p.kind = BipolarKind::darlington;
    else r.fail_at("kind", "expected \"npn\" or \"darlington\", got \"" + kind + "\"");
    p.ic_max_a = r.positive("ic_max", r.required("ic_max", Unit::ampere));
    p.vceo_v = r.positive("vceo", r.required("vceo", Unit::volt));
    p.hfe_min = read_points<GainPoint>(r, "hfe_min", [](ObjectReader& pr) {
        GainPoint g;
        g.ic_a = pr.positive("ic", pr.required("ic", Unit::ampere));
        g.hfe_min = pr.within("min", pr.positive("min", pr.required("min", Unit::number)), 1e-3, 1e6);
        if (auto typ = pr.quantity("typ", Unit::number)) {
            if (*typ < g.hfe_min) pr.fail_at("typ", "the typical gain must not be below the minimum");
            g.hfe_typ = pr.within("typ", *typ, 1e-3, 1e6);
        }
        return g;
    }, true);
    check_sorted(r, "hfe_min", p.hfe_min, [](const GainPoint& g) { return g.ic_a; });
    p.vce_sat = read_points<SaturationPoint>(r, "vce_sat", read_saturation, true);
    check_sorted(r, "vce_sat", p.vce_sat, [](const SaturationPoint& g) { return g.ic_a; });
    p.vbe_sat = read_points<SaturationPoint>(r, "vbe_sat", read_saturation, true);
    check_sorted(r, "vbe_sat", p.vbe_sat, [](const SaturationPoint& g) { return g.ic_a; });
    p.pd_w = r.positive("pd", r.required("pd", Unit::watt));
    if (auto rth = r.quantity("rth_ja", Unit::kelvin_per_watt)) p.rth_ja_k_per_w = r.positive("rth_ja", *rth);
    p.tj_max_c = r.within("tj_max", r.quantity("tj_max", Unit::celsius).value_or(150.0), 50.0, 250.0);
    p.package = r.text("package", 64).value_or("");
    p.description = r.text("description", 400).value_or("");
    p.source = read_source(r);
    return p;
}

Diode read_diode(ObjectReader& r) {
    Diode d;
    d.id = r.required_text("id", 64);
    const std::string kind = r.required_text("kind", 32);
    if (kind == "rectifier") d.kind = DiodeKind::rectifier;
    else if (kind == "fast") d.kind = DiodeKind::fast;
    else if (kind == "signal") d.kind = DiodeKind::signal;
    else if (kind == "schottky") d.kind = DiodeKind::schottky;
    else r.fail_at("kind", "expected \"rectifier\", \"fast\", \"signal\" or \"schottky\", got \"" + kind + "\"");
    d.vrrm_v = r.positive("vrrm", r.required("vrrm", Unit::volt));
    d.if_avg_a = r.positive("if_avg", r.required("if_avg", Unit::ampere));
    if (auto v = r.quantity("ifrm", Unit::ampere)) d.ifrm_a = r.positive("ifrm", *v);
    if (auto v = r.quantity("ifsm", Unit::ampere)) d.ifsm_a = r.positive("ifsm", *v);
    d.vf = read_points<ForwardPoint>(r, "vf", [](ObjectReader& pr) {
        ForwardPoint f;
        f.if_a = pr.positive("if", pr.required("if", Unit::ampere));
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
    z.id = r.required_text("id", 64);
    const std::string kind = r.required_text("kind", 32);
    if (kind != "zener") r.fail_at("kind", "expected \"zener\", got \"" + kind + "\"");
    z.vz_v = r.within("vz", r.positive("vz", r.required("vz", Unit::volt)), 1.0, 1000.0);
    z.tolerance = r.fraction("tolerance", r.quantity("tolerance", Unit::ratio).value_or(0.05), 0.0, 0.5, true);
    z.pd_w = r.positive("pd", r.required("pd", Unit::watt));
    if (auto v = r.quantity("izt", Unit::ampere)) z.izt_a = r.positive("izt", *v);
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
    const Json doc = parse_json(text, file, max_table_bytes);
    Origin origin{file, {}};
    if (!doc.is_array()) fail(origin, "", "expected a JSON list [ ... ] of part records, got " + describe(doc));
    // Ids already present (from earlier files) and where they came from.
    std::map<std::string, std::string> ids;
    for (const auto& b : into.catalogue.bipolars) ids[b.id] = "an earlier file";
    for (const auto& d : into.catalogue.diodes) ids[d.id] = "an earlier file";
    for (const auto& z : into.catalogue.zeners) ids[z.id] = "an earlier file";
    for (const auto& p : into.presets) ids[p.id] = "an earlier file";
    for (std::size_t i = 0; i < doc.size(); ++i) {
        const std::string path = "[" + std::to_string(i) + "]";
        ObjectReader r(doc[i], origin, path);
        const Json* kind_j = r.get("kind");
        if (!kind_j || !kind_j->is_string()) r.fail_at("kind", "missing; expected npn, darlington, rectifier, fast, signal, schottky, zener, coil or pin");
        const std::string kind = kind_j->get<std::string>();
        std::string id;
        if (kind == "npn" || kind == "darlington") {
            into.catalogue.bipolars.push_back(read_bipolar(r));
            id = into.catalogue.bipolars.back().id;
        } else if (kind == "rectifier" || kind == "fast" || kind == "signal" || kind == "schottky") {
            into.catalogue.diodes.push_back(read_diode(r));
            id = into.catalogue.diodes.back().id;
        } else if (kind == "zener") {
            into.catalogue.zeners.push_back(read_zener(r));
            id = into.catalogue.zeners.back().id;
        } else if (kind == "coil" || kind == "pin") {
            Preset p;
            p.id = r.required_text("id", 64);
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
            into.presets.push_back(std::move(p));
            id = into.presets.back().id;
        } else {
            r.fail_at("kind", "unknown kind \"" + kind + "\"; expected npn, darlington, rectifier, fast, signal, schottky, zener, coil or pin");
        }
        r.finish();
        if (id.empty()) r.fail_at("id", "must not be empty");
        const auto [it, inserted] = ids.emplace(id, path);
        if (!inserted) r.fail_at("id", "duplicate id \"" + id + "\" (also at " + it->second + ")");
    }
    into.files.push_back(file);
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
