#include "io/parts_text.hpp"

#include <utility>
#include <vector>

#include <fmt/format.h>

#include "io/format.hpp"

namespace coilfit::io {
namespace {

struct Field {
    const char* key;
    const char* label;
    Unit unit;
};

// Trade names of the record fields (the parts table's own keys), with their units.
constexpr Field fields[] = {
    {"ic_max", "Ic max", Unit::ampere},
    {"ic_total_max", "Ic total max", Unit::ampere},
    {"vceo", "Vceo", Unit::volt},
    {"vds_max", "Vds max", Unit::volt},
    {"id_max", "Id max", Unit::ampere},
    {"vgs_max", "Vgs max", Unit::volt},
    {"vgs_th", "Vgs(th)", Unit::volt},
    {"rds_on_tempco", "Rds(on) tempco", Unit::per_kelvin},
    {"vgs_th_tempco", "Vgs(th) tempco", Unit::volt_per_kelvin},
    {"qg", "gate charge Qg", Unit::coulomb},
    {"ear", "avalanche energy EAR", Unit::joule},
    {"pd", "Pd", Unit::watt},
    {"rth_ja", "RθJA", Unit::kelvin_per_watt},
    {"tj_max", "Tj max", Unit::celsius},
    {"hfe_temp_exponent", "hFE temperature exponent", Unit::number},
    {"channels", "channels", Unit::number},
    {"input_resistor", "input resistor", Unit::ohm},
    {"input_resistor_tolerance", "input resistor tolerance", Unit::ratio},
    {"vrrm", "VRRM", Unit::volt},
    {"if_avg", "IF(AV)", Unit::ampere},
    {"if_max", "IF max", Unit::ampere},
    {"ifrm", "IFRM (repetitive)", Unit::ampere},
    {"ifsm", "IFSM (surge)", Unit::ampere},
    {"vf_low", "Vf low", Unit::volt},
    {"vz", "Vz", Unit::volt},
    {"tolerance", "tolerance", Unit::ratio},
    {"izt", "test current Izt", Unit::ampere},
    {"zzt", "impedance Zzt", Unit::ohm},
    {"vz_tempco", "Vz tempco", Unit::volt_per_kelvin},
    {"vrwm", "standoff VRWM", Unit::volt},
    {"vbr", "breakdown", Unit::volt},
    {"vc", "clamping Vc", Unit::volt},
    {"ipp", "at Ipp", Unit::ampere},
    {"ppk", "Ppk", Unit::watt},
    {"ppk_width", "Ppk pulse width", Unit::second},
};

// Point lists: how one point reads.
std::string point_words(const std::string& list, const Json& p) {
    const auto num = [&](const char* k) { return p.contains(k) && p[k].is_number() ? p[k].get<double>() : 0.0; };
    const auto q = [](double v, Unit u) { return format_quantity(v, u); };
    if (list == "hfe_min") return q(num("min"), Unit::number) + " at " + q(num("ic"), Unit::ampere);
    if (list == "rds_on") {
        return q(num("max"), Unit::ohm) +
               (p.contains("typ") ? " (typ " + q(num("typ"), Unit::ohm) + ")" : std::string()) + " at Vgs " +
               q(num("vgs"), Unit::volt) + ", " + q(num("id"), Unit::ampere);
    }
    if (list == "pulse") return q(num("power"), Unit::watt) + " for " + q(num("width"), Unit::second);
    if (list == "vf") return q(num("max"), Unit::volt) + " at " + q(num("if"), Unit::ampere);
    // vce_sat, vbe_sat, vin_on: a voltage at a collector current (and base current).
    return q(num("max"), Unit::volt) + " at " + q(num("ic"), Unit::ampere) +
           (p.contains("ib") ? " (Ib " + q(num("ib"), Unit::ampere) + ")" : std::string());
}

const char* list_label(const std::string& key) {
    if (key == "hfe_min") return "hFE min";
    if (key == "vce_sat") return "Vce(sat) max";
    if (key == "vbe_sat") return "Vbe(sat) max";
    if (key == "vin_on") return "input on, max";
    if (key == "rds_on") return "Rds(on) max";
    if (key == "pulse") return "surge";
    if (key == "vf") return "Vf max";
    return nullptr;
}

std::string value_words(const std::string& key, const Json& v) {
    for (const Field& f : fields) {
        if (key != f.key) continue;
        if (v.is_number()) return format_quantity(v.get<double>(), f.unit);
        if (v.is_object() && v.contains("min") && v.contains("max")) {
            return format_quantity(v["min"].get<double>(), f.unit) + " to " +
                   format_quantity(v["max"].get<double>(), f.unit);
        }
    }
    if (v.is_string()) return v.get<std::string>();
    if (v.is_boolean()) return v.get<bool>() ? "yes" : "no";
    if (v.is_array() && list_label(key)) {
        std::string out;
        for (const auto& p : v) out += (out.empty() ? "" : ", ") + point_words(key, p);
        return out;
    }
    return v.dump();
}

std::string label_of(const std::string& key) {
    for (const Field& f : fields) {
        if (key == f.key) return f.label;
    }
    if (const char* l = list_label(key)) return l;
    return key;
}

}  // namespace

std::string part_text(const Json& record, std::size_t width) {
    std::vector<std::pair<std::string, std::string>> rows;
    for (const auto& [key, v] : record.items()) {
        if (key == "id" || key == "kind" || key == "description" || key == "source" || key == "inline") continue;
        if (key == "diode" && v.is_object()) {
            // An array's built-in clamp diode.
            for (const auto& [dk, dv] : v.items())
                rows.emplace_back("clamp diode " + label_of(dk), value_words(dk, dv));
            continue;
        }
        if (v.is_string() && v.get<std::string>().empty()) continue;
        rows.emplace_back(label_of(key), value_words(key, v));
    }
    std::size_t lw = 6;
    for (const auto& r : rows) lw = std::max(lw, display_width(r.first));
    lw = std::min<std::size_t>(lw, 24);
    const std::string kind =
        record.contains("kind") && record["kind"].is_string() ? record["kind"].get<std::string>() : "";
    std::string out = record.value("id", std::string()) + (kind.empty() ? "" : " (" + kind + ")") + "\n";
    if (record.contains("description") && record["description"].is_string() &&
        !record["description"].get<std::string>().empty()) {
        out += "  " + wrap(record["description"].get<std::string>(), width, 2) + "\n";
    }
    for (const auto& [label, text] : rows) out += "  " + pad_right(label, lw) + "  " + wrap(text, width, lw + 4) + "\n";
    if (record.contains("source") && record["source"].is_string()) {
        out += "  " + pad_right("source", lw) + "  " + wrap(record["source"].get<std::string>(), width, lw + 4) + "\n";
    }
    return out;
}

}  // namespace coilfit::io
