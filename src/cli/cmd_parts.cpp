#include <fmt/format.h>

#include "cli/commands.hpp"
#include "cli/parts_relays.hpp"
#include "io/format.hpp"

namespace coilfit::cli {
namespace {

using io::pad_right;

constexpr std::string_view parts_schema = "coilfit.parts/1";

std::string q(double v, Unit u) { return format_quantity(v, u); }

// A plain aligned table: header row, then rows.
std::string table_text(const std::vector<std::vector<std::string>>& rows) {
    std::vector<std::size_t> w;
    for (const auto& r : rows) {
        if (w.size() < r.size()) w.resize(r.size(), 0);
        for (std::size_t i = 0; i < r.size(); ++i) w[i] = std::max(w[i], io::display_width(r[i]));
    }
    std::string out;
    for (const auto& r : rows) {
        std::string line = " ";
        for (std::size_t i = 0; i < r.size(); ++i) line += " " + (i + 1 < r.size() ? pad_right(r[i], w[i]) : r[i]);
        out += line + "\n";
    }
    return out;
}

bool diode_kind_matches(const Diode& d, const std::string& kind) {
    return kind.empty() || kind == "diode" || kind == diode_kind_name(d.kind);
}

}  // namespace

CLI::App* setup_parts(CLI::App& app, PartsOptions& options) {
    CLI::App* cmd = app.add_subcommand("parts", "list the parts table, or show one part");
    cmd->add_option("kind", options.kind,
                    "npn, darlington, nmos, array, transistor, diode, rectifier, fast, signal, schottky, zener, tvs, coil, pin, relay or contactor; or a part id");
    cmd->add_option("id", options.id, "a part id to show in full");
    add_common_options(*cmd, options.common, false);
    return cmd;
}

int run_parts(const PartsOptions& options) {
    const io::PartsTable table = load_table(options.common);
    const Catalogue& cat = table.catalogue;
    static const std::vector<std::string> kinds{"npn", "darlington", "nmos", "array", "transistor", "diode", "rectifier",
                                                "fast", "signal", "schottky", "zener", "tvs", "coil", "pin", "relay", "contactor"};
    std::string kind = options.kind;
    std::string id = options.id;
    if (!kind.empty() && std::find(kinds.begin(), kinds.end(), kind) == kinds.end()) {
        if (!id.empty()) throw InputError("parts: unknown kind \"" + io::printable(kind) + "\"; expected one of npn, darlington, nmos, array, transistor, diode, rectifier, fast, signal, schottky, zener, tvs, coil, pin, relay, contactor");
        id = kind;  // `coilfit parts 2N4401`
        kind.clear();
    }
    const bool want_bipolar = kind.empty() || kind == "npn" || kind == "darlington" || kind == "transistor";
    const bool want_zener = kind.empty() || kind == "zener";
    const bool want_mosfet = kind.empty() || kind == "nmos" || kind == "transistor";
    const bool want_array = kind.empty() || kind == "array" || kind == "transistor";
    const bool want_tvs = kind.empty() || kind == "tvs";
    const bool want_preset = kind.empty() || kind == "coil" || kind == "pin";

    io::Json out = io::Json::object();
    io::Json bip = io::Json::array();
    io::Json dio = io::Json::array();
    io::Json zen = io::Json::array();
    io::Json pre = io::Json::array();
    io::Json mos = io::Json::array();
    io::Json arr = io::Json::array();
    io::Json tvs = io::Json::array();
    std::vector<std::vector<std::string>> mos_rows{{"id", "Id max", "Vds max", "Vgs(th)", "Rds(on) max (at Vgs)", "Pd", "package"}};
    std::vector<std::vector<std::string>> arr_rows{{"id", "channels", "Ic max", "Vceo", "input", "Pd", "package"}};
    std::vector<std::vector<std::string>> tvs_rows{{"id", "standoff", "breakdown", "Vc (at Ipp)", "Ppk", "package"}};
    std::vector<std::vector<std::string>> bip_rows{{"id", "kind", "Ic max", "Vceo", "hFE min (at Ic)", "Pd", "package"}};
    std::vector<std::vector<std::string>> dio_rows{{"id", "kind", "VRRM", "IF(AV)", "peak", "Vf max (at IF)"}};
    std::vector<std::vector<std::string>> zen_rows{{"id", "Vz", "tolerance", "Pd", "package"}};
    std::vector<std::vector<std::string>> pre_rows{{"id", "kind", "description"}};
    std::size_t found = 0;

    for (const auto& b : cat.bipolars) {
        if (!want_bipolar || (!id.empty() && b.id != id)) continue;
        if ((kind == "npn" || kind == "darlington") && bipolar_kind_name(b.kind) != kind) continue;
        ++found;
        bip.push_back(io::to_json(b));
        std::string gains;
        for (const auto& g : b.hfe_min) gains += (gains.empty() ? "" : ", ") + format_quantity(g.hfe_min, Unit::number) + " at " + q(g.ic_a, Unit::ampere);
        bip_rows.push_back({b.id, std::string(bipolar_kind_name(b.kind)), q(b.ic_max_a, Unit::ampere), q(b.vceo_v, Unit::volt), gains,
                            q(b.pd_w, Unit::watt), b.package});
    }
    for (const auto& m : cat.mosfets) {
        if (!want_mosfet || (!id.empty() && m.id != id)) continue;
        ++found;
        mos.push_back(io::to_json(m));
        std::string rds;
        for (const auto& r : m.rds_on) rds += (rds.empty() ? "" : ", ") + q(r.max_ohm, Unit::ohm) + " at " + q(r.vgs_v, Unit::volt);
        mos_rows.push_back({m.id, q(m.id_max_a, Unit::ampere), q(m.vds_max_v, Unit::volt),
                            q(m.vgs_th_min_v, Unit::volt) + " to " + q(m.vgs_th_max_v, Unit::volt), rds, q(m.pd_w, Unit::watt), m.package});
    }
    for (const auto& a : cat.arrays) {
        if (!want_array || (!id.empty() && a.id != id)) continue;
        ++found;
        arr.push_back(io::to_json(a));
        arr_rows.push_back({a.id, std::to_string(a.channels), q(a.ic_max_a, Unit::ampere), q(a.vceo_v, Unit::volt),
                            q(a.input_resistor_ohm, Unit::ohm), q(a.pd_w, Unit::watt), a.package});
    }
    for (const auto& t : cat.tvs) {
        if (!want_tvs || (!id.empty() && t.id != id)) continue;
        ++found;
        tvs.push_back(io::to_json(t));
        tvs_rows.push_back({t.id, q(t.vrwm_v, Unit::volt), q(t.vbr_min_v, Unit::volt) + " to " + q(t.vbr_max_v, Unit::volt),
                            q(t.vc_v, Unit::volt) + " at " + q(t.ipp_a, Unit::ampere), q(t.ppk_w, Unit::watt), t.package});
    }
    for (const auto& d : cat.diodes) {
        if (!(kind.empty() || diode_kind_matches(d, kind)) || (!id.empty() && d.id != id)) continue;
        if (kind == "npn" || kind == "darlington" || kind == "nmos" || kind == "array" || kind == "transistor" || kind == "zener" ||
            kind == "tvs" || kind == "coil" || kind == "pin" || kind == "relay" || kind == "contactor") {
            continue;
        }
        ++found;
        dio.push_back(io::to_json(d));
        const std::string peak = d.ifrm_a ? q(*d.ifrm_a, Unit::ampere) + " rep." : d.ifsm_a ? q(*d.ifsm_a, Unit::ampere) + " surge" : "-";
        std::string vf;
        for (const auto& f : d.vf) vf += (vf.empty() ? "" : ", ") + q(f.vf_max_v, Unit::volt) + " at " + q(f.if_a, Unit::ampere);
        dio_rows.push_back({d.id, std::string(diode_kind_name(d.kind)), q(d.vrrm_v, Unit::volt), q(d.if_avg_a, Unit::ampere), peak, vf});
    }
    for (const auto& z : cat.zeners) {
        if (!want_zener || (!id.empty() && z.id != id)) continue;
        ++found;
        zen.push_back(io::to_json(z));
        zen_rows.push_back({z.id, q(z.vz_v, Unit::volt), q(z.tolerance, Unit::ratio), q(z.pd_w, Unit::watt), z.package});
    }
    for (const auto& p : table.presets) {
        if (!want_preset || (!kind.empty() && p.kind != kind) || (!id.empty() && p.id != id)) continue;
        ++found;
        io::Json pj = {{"id", p.id}, {"kind", p.kind}, {"description", p.description}};
        for (const auto& [k, v] : p.fields.items()) pj[k] = v;
        pj["source"] = p.source;
        pre.push_back(pj);
        pre_rows.push_back({p.id, p.kind, p.description.substr(0, 70) + (p.description.size() > 70 ? "..." : "")});
    }
    io::Json rel = io::Json::array();
    std::vector<std::vector<std::string>> rel_rows;
    if (kind.empty() || kind == "relay" || kind == "contactor") found += list_relays(table, kind, id, rel, rel_rows);
    if (!id.empty() && found == 0) throw InputError("parts: no part or preset \"" + io::printable(id) + "\" in the table");

    if (options.common.format == "json") {
        out["schema"] = parts_schema;
        out["tool"] = {{"name", "coilfit"}, {"version", COILFIT_VERSION}};
        out["transistors"] = bip;
        out["diodes"] = dio;
        out["mosfets"] = mos;
        out["arrays"] = arr;
        out["zeners"] = zen;
        out["tvs"] = tvs;
        out["presets"] = pre;
        out["relays"] = rel;
        emit(out.dump(2) + "\n", "");
        return exit_pass;
    }
    std::string text;
    if (!id.empty()) {
        // One part in full: its record as JSON is the clearest full view.
        for (const auto* list : {&bip, &mos, &arr, &dio, &zen, &tvs, &pre, &rel}) {
            for (const auto& r : *list) text += r.dump(2) + "\n";
        }
        emit(text, "");
        return exit_pass;
    }
    if (bip_rows.size() > 1) text += fmt::format("Transistors ({})\n", bip_rows.size() - 1) + table_text(bip_rows) + "\n";
    if (mos_rows.size() > 1) text += fmt::format("N-MOSFETs ({})\n", mos_rows.size() - 1) + table_text(mos_rows) + "\n";
    if (arr_rows.size() > 1) text += fmt::format("Transistor arrays ({})\n", arr_rows.size() - 1) + table_text(arr_rows) + "\n";
    if (dio_rows.size() > 1) text += fmt::format("Diodes ({})\n", dio_rows.size() - 1) + table_text(dio_rows) + "\n";
    if (zen_rows.size() > 1) text += fmt::format("Zeners ({})\n", zen_rows.size() - 1) + table_text(zen_rows) + "\n";
    if (tvs_rows.size() > 1) text += fmt::format("TVS ({})\n", tvs_rows.size() - 1) + table_text(tvs_rows) + "\n";
    if (pre_rows.size() > 1) text += fmt::format("Presets ({})\n", pre_rows.size() - 1) + table_text(pre_rows) + "\n";
    if (rel_rows.size() > 1) text += fmt::format("Relays and contactors ({})\n", rel_rows.size() - 1) + table_text(rel_rows) + "\n";
    text += "Values are typical datasheet limits from memory; confirm against the datasheet of the part in use.\n";
    text += "Read from: ";
    for (std::size_t i = 0; i < table.files.size(); ++i) text += (i ? ", " : "") + io::printable(table.files[i], 4096);
    text += "\n";
    emit(text, "");
    return exit_pass;
}

}  // namespace coilfit::cli
