#include <fmt/format.h>
#include <fmt/ranges.h>

#include "cli/commands.hpp"
#include "cli/parts_relays.hpp"
#include "coilfit/id_match.hpp"
#include "io/format.hpp"
#include "io/parts_text.hpp"

namespace coilfit::cli {
namespace {

using io::pad_right;

std::string q(double v, Unit u) { return format_quantity(v, u); }

// A plain aligned table: header row, then rows; each row stacked as "header: value" lines when
// the table is wider than the screen.
std::string table_text(const std::vector<std::vector<std::string>>& rows) {
    std::vector<std::size_t> w;
    for (const auto& r : rows) {
        if (w.size() < r.size()) w.resize(r.size(), 0);
        for (std::size_t i = 0; i < r.size(); ++i) w[i] = std::max(w[i], io::display_width(r[i]));
    }
    std::size_t total = 1;
    for (const std::size_t x : w) total += x + 1;
    std::string out;
    if (total > text_width() && !rows.empty()) {
        for (std::size_t k = 1; k < rows.size(); ++k) {
            out += "  " + rows[k][0] + "\n";
            for (std::size_t i = 1; i < rows[k].size() && i < rows[0].size(); ++i) {
                out += "    " + io::wrap(rows[0][i] + ": " + rows[k][i], text_width(), 6) + "\n";
            }
        }
        return out;
    }
    for (const auto& r : rows) {
        std::string line = " ";
        for (std::size_t i = 0; i < r.size(); ++i) line += " " + (i + 1 < r.size() ? pad_right(r[i], w[i]) : r[i]);
        out += line + "\n";
    }
    return out;
}

// The groups of the listing, in order: title, JSON key, header row.
enum Group : std::size_t { g_bipolar, g_mosfet, g_array, g_diode, g_zener, g_tvs, g_preset, g_relay, group_count };
struct GroupInfo {
    const char* title;
    const char* json_key;
    std::vector<std::string> header;
};
const GroupInfo& group_info(Group g) {
    static const GroupInfo info[group_count] = {
        {"Transistors", "transistors", {"id", "kind", "Ic max", "Vceo", "hFE min (at Ic)", "Pd", "package"}},
        {"N-MOSFETs", "mosfets", {"id", "Id max", "Vds max", "Vgs(th)", "Rds(on) max (at Vgs)", "Pd", "package"}},
        {"Transistor arrays", "arrays", {"id", "channels", "Ic max", "Vceo", "input", "Pd", "package"}},
        {"Diodes", "diodes", {"id", "kind", "VRRM", "IF(AV)", "peak", "Vf max (at IF)"}},
        {"Zeners", "zeners", {"id", "Vz", "tolerance", "Pd", "package"}},
        {"TVS", "tvs", {"id", "standoff", "breakdown", "Vc (at Ipp)", "Ppk", "package"}},
        {"Presets", "presets", {"id", "kind", "description"}},
        {"Relays and contactors", "relays", {"id", "kind", "coil", "form", "AC", "DC", "make"}},
    };
    return info[g];
}

// One record of the table: its group, kind, id, JSON form and listing row.
struct Entry {
    Group group;
    std::string kind;
    std::string id;
    io::Json json;
    std::vector<std::string> row;
};

std::vector<Entry> transistor_entries(const Catalogue& cat) {
    std::vector<Entry> out;
    for (const auto& b : cat.bipolars) {
        std::string gains;
        for (const auto& g : b.hfe_min)
            gains += (gains.empty() ? "" : ", ") + q(g.hfe_min, Unit::number) + " at " + q(g.ic_a, Unit::ampere);
        const std::string kind(bipolar_kind_name(b.kind));
        out.push_back({g_bipolar,
                       kind,
                       b.id,
                       io::to_json(b),
                       {b.id, kind, q(b.ic_max_a, Unit::ampere), q(b.vceo_v, Unit::volt), gains, q(b.pd_w, Unit::watt),
                        b.package}});
    }
    for (const auto& m : cat.mosfets) {
        std::string rds;
        for (const auto& r : m.rds_on)
            rds += (rds.empty() ? "" : ", ") + q(r.max_ohm, Unit::ohm) + " at " + q(r.vgs_v, Unit::volt);
        out.push_back({g_mosfet,
                       "nmos",
                       m.id,
                       io::to_json(m),
                       {m.id, q(m.id_max_a, Unit::ampere), q(m.vds_max_v, Unit::volt),
                        q(m.vgs_th_min_v, Unit::volt) + " to " + q(m.vgs_th_max_v, Unit::volt), rds,
                        q(m.pd_w, Unit::watt), m.package}});
    }
    for (const auto& a : cat.arrays) {
        out.push_back({g_array,
                       "array",
                       a.id,
                       io::to_json(a),
                       {a.id, std::to_string(a.channels), q(a.ic_max_a, Unit::ampere), q(a.vceo_v, Unit::volt),
                        q(a.input_resistor_ohm, Unit::ohm), q(a.pd_w, Unit::watt), a.package}});
    }
    return out;
}

std::vector<Entry> clamp_entries(const Catalogue& cat) {
    std::vector<Entry> out;
    for (const auto& d : cat.diodes) {
        const std::string peak = d.ifrm_a   ? q(*d.ifrm_a, Unit::ampere) + " rep."
                                 : d.ifsm_a ? q(*d.ifsm_a, Unit::ampere) + " surge"
                                            : "-";
        std::string vf;
        for (const auto& f : d.vf)
            vf += (vf.empty() ? "" : ", ") + q(f.vf_max_v, Unit::volt) + " at " + q(f.if_a, Unit::ampere);
        const std::string kind(diode_kind_name(d.kind));
        out.push_back({g_diode,
                       kind,
                       d.id,
                       io::to_json(d),
                       {d.id, kind, q(d.vrrm_v, Unit::volt), q(d.if_avg_a, Unit::ampere), peak, vf}});
    }
    for (const auto& z : cat.zeners) {
        out.push_back({g_zener,
                       "zener",
                       z.id,
                       io::to_json(z),
                       {z.id, q(z.vz_v, Unit::volt), q(z.tolerance, Unit::ratio), q(z.pd_w, Unit::watt), z.package}});
    }
    for (const auto& t : cat.tvs) {
        out.push_back({g_tvs,
                       "tvs",
                       t.id,
                       io::to_json(t),
                       {t.id, q(t.vrwm_v, Unit::volt), q(t.vbr_min_v, Unit::volt) + " to " + q(t.vbr_max_v, Unit::volt),
                        q(t.vc_v, Unit::volt) + " at " + q(t.ipp_a, Unit::ampere), q(t.ppk_w, Unit::watt), t.package}});
    }
    return out;
}

std::vector<Entry> all_entries(const io::PartsTable& table) {
    std::vector<Entry> out = transistor_entries(table.catalogue);
    for (auto& e : clamp_entries(table.catalogue)) out.push_back(std::move(e));
    for (const auto& p : table.presets) {
        io::Json pj = {{"id", p.id}, {"kind", p.kind}, {"description", p.description}};
        for (const auto& [k, v] : p.fields.items()) pj[k] = v;
        pj["source"] = p.source;
        out.push_back({g_preset,
                       p.kind,
                       p.id,
                       pj,
                       {p.id, p.kind, p.description.substr(0, 70) + (p.description.size() > 70 ? "..." : "")}});
    }
    // Relay and contactor records (cli/parts_relays.cpp): one row each, its kind in the second cell.
    io::Json relays = io::Json::array();
    std::vector<std::vector<std::string>> rows;
    list_relays(table, "", "", relays, rows);
    for (std::size_t i = 0; i < relays.size(); ++i) {
        const std::vector<std::string>& row = rows[i + 1];
        out.push_back({g_relay, row[1], row[0], relays[i], row});
    }
    return out;
}

// The kind words `parts` takes, singular or plural, in any case: the record kinds, the groups
// (transistor, diode, preset) and "mosfet". Empty when the word is not one.
std::string kind_word(const std::string& word) {
    std::string w = fold_case(word);
    static const std::vector<std::pair<std::string, std::string>> words{{"transistor", "transistor"},
                                                                        {"npn", "npn"},
                                                                        {"darlington", "darlington"},
                                                                        {"nmos", "nmos"},
                                                                        {"mosfet", "nmos"},
                                                                        {"array", "array"},
                                                                        {"diode", "diode"},
                                                                        {"rectifier", "rectifier"},
                                                                        {"fast", "fast"},
                                                                        {"signal", "signal"},
                                                                        {"schottky", "schottky"},
                                                                        {"schottkie", "schottky"},
                                                                        {"zener", "zener"},
                                                                        {"tvs", "tvs"},
                                                                        {"coil", "coil"},
                                                                        {"pin", "pin"},
                                                                        {"preset", "preset"},
                                                                        {"relay", "relay"},
                                                                        {"contactor", "contactor"}};
    for (const auto& [name, kind] : words) {
        if (w == name || w == name + "s" || w == name + "es") return kind;
    }
    return {};
}

bool kind_matches(const Entry& e, const std::string& kind) {
    if (kind.empty() || kind == e.kind) return true;
    if (kind == "transistor") return e.group == g_bipolar || e.group == g_mosfet || e.group == g_array;
    if (kind == "diode") return e.group == g_diode;
    if (kind == "preset") return e.group == g_preset;
    return false;
}

constexpr const char* kind_list =
    "transistor, npn, darlington, nmos (mosfet), array, diode, rectifier, fast, signal, schottky, zener, tvs, coil, "
    "pin, preset, "
    "relay or contactor";

}  // namespace

namespace {

std::string listing_text(const std::vector<const Entry*>& shown, const io::PartsTable& table) {
    std::string text;
    for (std::size_t g = 0; g < group_count; ++g) {
        std::vector<std::vector<std::string>> rows{group_info(static_cast<Group>(g)).header};
        for (const Entry* e : shown) {
            if (e->group == g) rows.push_back(e->row);
        }
        if (rows.size() > 1)
            text += fmt::format("{} ({})\n", group_info(static_cast<Group>(g)).title, rows.size() - 1) +
                    table_text(rows) + "\n";
    }
    text += "Values are typical datasheet limits from memory; confirm against the datasheet of the part in use.\n";
    text += "Read from: ";
    for (std::size_t i = 0; i < table.files.size(); ++i) text += (i ? ", " : "") + io::printable(table.files[i], 4096);
    return text + "\n";
}

}  // namespace

int run_parts(const PartsOptions& options) {
    const io::PartsTable table = load_table(options.common);
    const std::vector<Entry> entries = all_entries(table);
    std::string kind = options.kind.empty() ? std::string() : kind_word(options.kind);
    std::string id = options.id;
    if (!options.kind.empty() && kind.empty()) {
        if (!id.empty())
            throw InputError("parts: unknown kind \"" + io::printable(options.kind) + "\"; expected " + kind_list);
        id = options.kind;  // `coilfit parts 2N4401`
    }
    std::vector<const Entry*> shown;
    for (const Entry& e : entries) {
        if (kind_matches(e, kind)) shown.push_back(&e);
    }
    if (!id.empty()) {
        std::vector<std::string> ids;
        ids.reserve(shown.size());
        for (const Entry* e : shown) ids.push_back(e->id);
        const IdMatch m = match_id(id, ids);
        if (!m.id) {
            const std::string what =
                m.ambiguous.empty()
                    ? fmt::format("no part or preset \"{}\" in the table; nearest: {}", io::printable(id),
                                  fmt::join(nearest_ids(id, ids), ", "))
                    : fmt::format("\"{}\" names {} parts that differ only in case: {}; give the id exactly",
                                  io::printable(id), m.ambiguous.size(), fmt::join(m.ambiguous, ", "));
            throw InputError("parts: " + what);
        }
        std::erase_if(shown, [&](const Entry* e) { return e->id != *m.id; });
    }
    if (options.common.format == "json") {
        io::Json out = io::Json::object();
        out["schema"] = "coilfit.parts/1";
        out["tool"] = {{"name", "coilfit"}, {"version", COILFIT_VERSION}};
        for (std::size_t g = 0; g < group_count; ++g) {
            io::Json list = io::Json::array();
            for (const Entry* e : shown) {
                if (e->group == g) list.push_back(e->json);
            }
            out[group_info(static_cast<Group>(g)).json_key] = list;
        }
        emit(out.dump(2) + "\n", "");
        return exit_pass;
    }
    if (!id.empty()) {
        std::string text;
        for (const Entry* e : shown) text += io::part_text(e->json, text_width());
        text +=
            "Values are typical datasheet limits from memory; confirm against the datasheet of the part in use.\n"
            "The record as the parts table writes it: coilfit parts " +
            shown.front()->id + " --format json\n";
        emit(text, "");
        return exit_pass;
    }
    emit(listing_text(shown, table), "");
    return exit_pass;
}

}  // namespace coilfit::cli
