#include "io/spec_read_parts.hpp"

#include <fmt/format.h>
#include <fmt/ranges.h>

#include "coilfit/id_match.hpp"

#include "io/plausible.hpp"
#include "io/sections_read.hpp"

namespace coilfit::io::spec_parts {
namespace {

std::string pct(double x) { return percent_words(x); }

std::string table_size(const PartsTable& table) {
    return table.files.empty() ? std::string("empty") : fmt::format("{} files", table.files.size());
}

template <typename T>
std::vector<std::string> ids_of(const std::vector<T>& parts) {
    std::vector<std::string> out;
    out.reserve(parts.size());
    for (const auto& p : parts) out.push_back(p.id);
    return out;
}

// Reads a part field that is either a table id or an inline record. An id matches exactly, else
// case-insensitively when that names one part; an unknown id is answered with the nearest ids.
template <typename Part, typename Find, typename ReadInline>
Part read_part(ObjectReader& parent, const std::string& key, Find find, ReadInline read_inline, std::string_view what,
               const PartsTable& table, const std::vector<std::string>& ids, std::string_view kind_word) {
    const Json* v = parent.get(key);
    if (!v) parent.fail_at(key, fmt::format("missing; expected {} id from the parts table or an inline record", what));
    if (v->is_string()) {
        const auto& id = v->get_ref<const Json::string_t&>();
        const IdMatch m = match_id(id, ids);
        if (m.id) {
            if (auto p = find(table.catalogue, *m.id)) return *p;
        }
        if (!m.ambiguous.empty()) {
            parent.fail_at(key, fmt::format("\"{}\" names {} parts that differ only in case: {}; give the id exactly",
                                            printable(id), m.ambiguous.size(), fmt::join(m.ambiguous, ", ")));
        }
        const auto near = nearest_ids(id, ids);
        parent.fail_at(
            key,
            fmt::format("no {} \"{}\" in the parts table ({}){}; `coilfit parts {}` lists them", what, printable(id),
                        table_size(table),
                        near.empty() ? std::string() : fmt::format("; nearest: {}", fmt::join(near, ", ")), kind_word));
    }
    if (v->is_object()) {
        ObjectReader r(*v, parent.origin(), parent.path_of(key));
        Part p = read_inline(r, RecordPlace::inline_spec);
        r.finish();
        return p;
    }
    parent.fail_at(
        key, fmt::format("expected {} id such as a text in quotes, or an inline record, got {}", what, describe(*v)));
}

void read_base_resistor(ObjectReader& r, Spec& s) {
    BaseResistorSpec& b = s.base_resistor;
    if (auto name = r.text("series", 16)) {
        const auto series = eseries_from_name(*name);
        if (!series)
            r.fail_at("series", "expected one of E3, E6, E12, E24, E48, E96, E192, got " + describe(*r.get("series")));
        b.series = *series;
    } else {
        s.defaults_used.push_back("base_resistor.series E24");
    }
    if (auto v = r.quantity("tolerance", Unit::ratio)) {
        b.tolerance = r.fraction("tolerance", *v, 0.0, 0.5, true);
    } else {
        b.tolerance = eseries_tolerance(b.series);
        s.defaults_used.push_back(
            fmt::format("base_resistor.tolerance {} (usual for {})", pct(b.tolerance), eseries_name(b.series)));
    }
    if (auto v = r.quantity("power_rating", Unit::watt))
        b.power_rating_w = r.within("power_rating", r.positive("power_rating", *v), 1e-3, 100.0);
    else
        s.defaults_used.push_back("base_resistor.power_rating " +
                                  format_quantity(defaults::base_resistor_power_w, Unit::watt));
    if (auto v = r.quantity("value", Unit::ohm))
        b.value_ohm = plausible(r, "value", r.positive("value", *v), Plausible::base_resistor);
    if (auto c = r.text("choose", 16)) {
        if (*c == "largest")
            b.choose = ResistorChoice::largest;
        else if (*c == "centred" || *c == "centered")
            b.choose = ResistorChoice::centred;
        else
            r.fail_at("choose", "expected \"largest\" or \"centred\", got " + describe(*r.get("choose")));
    }
}

void read_gate_resistor(ObjectReader& r, Spec& s) {
    GateResistorSpec& g = s.gate_resistor;
    if (auto name = r.text("series", 16)) {
        const auto series = eseries_from_name(*name);
        if (!series)
            r.fail_at("series", "expected one of E3, E6, E12, E24, E48, E96, E192, got " + describe(*r.get("series")));
        g.series = *series;
    }
    if (auto v = r.quantity("tolerance", Unit::ratio))
        g.tolerance = r.fraction("tolerance", *v, 0.0, 0.5, true);
    else
        g.tolerance = eseries_tolerance(g.series);
    if (auto v = r.quantity("value", Unit::ohm))
        g.value_ohm = plausible(r, "value", r.positive("value", *v), Plausible::gate_resistor);
}

void read_policy(ObjectReader& r, Spec& s) {
    Policy& p = s.policy;
    const bool bipolar = s.bipolar() != nullptr;
    std::vector<std::string> defaulted;
    if (auto v = r.quantity("forced_gain", Unit::number))
        p.forced_gain = r.within("forced_gain", r.positive("forced_gain", *v), 0.1, 1e5);
    else if (bipolar)
        defaulted.push_back(s.bipolar()->kind == BipolarKind::darlington
                                ? "forced gain at the part's Vce(sat) test ratio"
                                : "forced gain 10");
    // Overdrive below 1 would drive the base with less than the minimum gain needs.
    if (auto v = r.quantity("overdrive", Unit::number))
        p.overdrive = r.within("overdrive", r.positive("overdrive", *v), 1.0, 100.0);
    else if (bipolar)
        defaulted.push_back(fmt::format("overdrive {:g}", defaults::overdrive));
    auto ratio = [&](const char* key, double& field, const char* words) {
        if (auto v = r.quantity(key, Unit::ratio))
            field = r.fraction(key, r.positive(key, *v), 0.0, 1.0, true);
        else
            defaulted.push_back(fmt::format("{} {}", words, pct(field)));
    };
    ratio("current_derating", p.current_derating, "current derating");
    ratio("voltage_derating", p.voltage_derating, "voltage derating");
    if (auto v = r.quantity("junction_margin", Unit::kelvin))
        p.junction_margin_k = r.within("junction_margin", *v, 0.0, 200.0);
    else
        defaulted.push_back(fmt::format("junction margin {:g} K", p.junction_margin_k));
    ratio("power_derating", p.power_derating, "power derating");
    if (auto v = r.quantity("vbe_low", Unit::volt))
        p.vbe_low_v = r.within("vbe_low", *v, 0.0, 2.0);
    else if (bipolar)
        defaulted.push_back(fmt::format("Vbe low {:g} V", p.vbe_low_v));
    if (!defaulted.empty()) {
        std::string all;
        for (const auto& d : defaulted) all += (all.empty() ? "" : ", ") + d;
        s.defaults_used.push_back("policy: " + all);
    }
}

// load.inrush: amperes ("48A") or a multiple of the steady current ("6x").
void read_inrush(ObjectReader& r, LoadSpec& load) {
    const Json* j = r.get("inrush");
    if (!j) return;
    if (j->is_string()) {
        std::string t = j->get<std::string>();
        if (!t.empty() && (t.back() == 'x' || t.back() == 'X')) {
            t.pop_back();
            double m = 0;
            try {
                m = parse_quantity(t, Unit::number);
            } catch (const InputError&) {
                r.fail_at(
                    "inrush",
                    "expected a current such as \"48A\" or a multiple of the steady current such as \"6x\", got " +
                        describe(*j));
            }
            load.inrush_multiple = r.within("inrush", m, 1.0, 1000.0);
            return;
        }
    }
    load.inrush_a = r.within("inrush", r.positive("inrush", *r.quantity("inrush", Unit::ampere)), 1e-6, 1e5);
    if (load.current_a && *load.inrush_a < *load.current_a) {
        r.fail_at("inrush", fmt::format("expected at least load.current {}, got {}",
                                        format_quantity(*load.current_a, Unit::ampere, 6),
                                        format_quantity(*load.inrush_a, Unit::ampere, 6)));
    }
}

LoadSpec read_load(ObjectReader& r, std::vector<std::string>& defaults) {
    LoadSpec load;
    load.voltage_v = r.within("voltage", r.non_negative("voltage", r.required("voltage", Unit::volt)), 0.0, 1e5);
    const auto type = r.text("type", 16);
    if (type && *type == "ac")
        load.kind = LoadKind::ac;
    else if (type && *type == "dc")
        load.kind = LoadKind::dc;
    else if (type)
        r.fail_at("type", "expected \"ac\" or \"dc\", got \"" + printable(*type) + "\"");
    if (const auto kind = r.text("kind", 16)) {
        if (*kind == "ac" || *kind == "dc") {
            // Edition 1: `kind` was AC or DC.
            if (type)
                r.fail_at("kind",
                          "expected the kind of load beside load.type (resistive, inductive, motor, lamp, capacitive, "
                          "solenoid or transformer), got \"" +
                              *kind + "\"");
            load.kind = *kind == "ac" ? LoadKind::ac : LoadKind::dc;
        } else if (const auto c = load_class_from_name(*kind)) {
            load.load_class = *c;
            load.class_given = true;
            if (!type) defaults.emplace_back("load.type ac");
        } else {
            r.fail_at("kind",
                      "expected resistive, inductive, motor, lamp, capacitive, solenoid or transformer (or \"ac\" or "
                      "\"dc\"), got \"" +
                          printable(*kind) + "\"");
        }
    }
    if (auto i = r.quantity("current", Unit::ampere))
        load.current_a = r.within("current", r.non_negative("current", *i), 0.0, 1e4);
    read_inrush(r, load);
    if (auto v = r.quantity("power_factor", Unit::ratio)) {
        if (load.kind != LoadKind::ac)
            r.fail_at("power_factor", "given for a DC load; give load.time_constant (its L/R) instead");
        load.power_factor = r.fraction("power_factor", r.positive("power_factor", *v), 0.0, 1.0, true);
    }
    if (auto v = r.quantity("time_constant", Unit::second)) {
        if (load.kind != LoadKind::dc)
            r.fail_at("time_constant", "given for an AC load; give load.power_factor instead");
        load.time_constant_s = r.within("time_constant", r.positive("time_constant", *v), 1e-6, 100.0);
    }
    return load;
}

// "pulldown": a resistance, or "none" (--no-pulldown) for a bipolar driver without one; an
// nmos gate always has one (src/method.md "MOSFET drivers": it holds the gate low in reset).
void read_pulldown(ObjectReader& top, Spec& s) {
    if (const Json* j = top.get("pulldown"); j && j->is_string() && j->get_ref<const Json::string_t&>() == "none") {
        if (s.mosfet()) {
            top.fail_at("pulldown",
                        fmt::format("\"none\", but an nmos gate needs a pull-down to hold it low while the pin floats "
                                    "(default {}); give a resistance such as \"100k\"",
                                    format_quantity(defaults::nmos_pulldown_ohm, Unit::ohm)));
        }
        return;
    }
    if (auto v = top.quantity("pulldown", Unit::ohm))
        s.pulldown_ohm = plausible(top, "pulldown", top.positive("pulldown", *v), Plausible::pulldown);
}

std::vector<std::string> transistor_ids(const Catalogue& cat) {
    std::vector<std::string> out = ids_of(cat.bipolars);
    for (auto&& v : {ids_of(cat.mosfets), ids_of(cat.arrays)}) out.insert(out.end(), v.begin(), v.end());
    return out;
}

// The inrush default by kind, noted once the contacts are checked or the kind is given.
void note_inrush_default(const Spec& s, std::vector<std::string>& defaults) {
    const LoadSpec& load = *s.load;
    if (load.inrush_a || load.inrush_multiple || !(load.class_given || s.relay)) return;
    const InrushDefault d = default_inrush(load.load_class, load.kind == LoadKind::ac);
    std::string words = fmt::format("load.inrush {:g} x steady for a {} load ({}", d.multiple,
                                    load_class_name(load.load_class), d.what);
    if (d.duration_s > 0) words += ", about " + format_quantity(d.duration_s, Unit::second);
    defaults.push_back(words + "; common practice, from memory): confirm for the real load");
}

}  // namespace

Transistor read_transistor_field(ObjectReader& top, const PartsTable& table) {
    return read_part<Transistor>(
        top, "transistor", [](const Catalogue& cat, const std::string& id) { return cat.find_transistor(id); },
        [](ObjectReader& r, RecordPlace place) { return read_transistor(r, place); }, "transistor", table,
        transistor_ids(table.catalogue), "transistors");
}

std::optional<RelayEntry> read_relay_field(ObjectReader& top, const PartsTable& table) {
    const Json* v = top.get("relay");
    if (!v) return std::nullopt;
    if (v->is_string()) {
        const auto& id = v->get_ref<const Json::string_t&>();
        if (const RelayEntry* e = table.find_relay(id)) return *e;
        top.fail_at(
            "relay",
            fmt::format("no relay or contactor \"{}\" in the parts table ({}); `coilfit parts relay` lists them",
                        printable(id), table_size(table)));
    }
    if (v->is_object()) {
        ObjectReader r(*v, top.origin(), top.path_of("relay"));
        RelayEntry e = read_relay(r, *v, RecordPlace::inline_spec);
        r.finish();
        return e;
    }
    top.fail_at("relay", "expected a relay id such as a text in quotes, or an inline record, got " + describe(*v));
}

void read_clamp(ObjectReader& r, Spec& s, const PartsTable& table) {
    ClampSpec& c = s.clamp;
    const auto type = r.text("type", 32);
    if (!type)
        s.defaults_used.push_back("clamp.type diode");
    else if (*type == "diode")
        c.type = ClampType::diode;
    else if (*type == "diode_zener")
        c.type = ClampType::diode_zener;
    else if (*type == "diode_resistor")
        c.type = ClampType::diode_resistor;
    else if (*type == "diode_tvs")
        c.type = ClampType::diode_tvs;
    else if (*type == "none")
        c.type = ClampType::none;
    else
        r.fail_at("type", "expected \"diode\", \"diode_zener\", \"diode_resistor\", \"diode_tvs\" or \"none\", got " +
                              describe(*r.get("type")));
    const auto find_d = [](const Catalogue& cat, const std::string& id) { return cat.find_diode(id); };
    const auto find_z = [](const Catalogue& cat, const std::string& id) { return cat.find_zener(id); };
    const auto find_t = [](const Catalogue& cat, const std::string& id) { return cat.find_tvs(id); };
    const auto inline_d = [](ObjectReader& pr, RecordPlace place) { return read_diode(pr, place); };
    const auto inline_z = [](ObjectReader& pr, RecordPlace place) { return read_zener(pr, place); };
    const auto inline_t = [](ObjectReader& pr, RecordPlace place) { return read_tvs(pr, place); };
    if (c.type != ClampType::none) {
        if (s.array() && !r.has("diode")) {
            c.diode = s.array()->diode;  // the array's built-in diode
        } else {
            c.diode = read_part<Diode>(r, "diode", find_d, inline_d, "diode", table, ids_of(table.catalogue.diodes),
                                       "diodes");
        }
    } else if (r.has("diode")) {
        r.fail_at("diode", "given, but clamp.type is \"none\"");
    }
    auto only_for = [&](const char* key, ClampType needs, const char* type_name) {
        if (c.type != needs && r.has(key)) {
            r.fail_at(key,
                      fmt::format("given, but clamp.type is \"{}\"; use \"{}\"", clamp_type_name(c.type), type_name));
        }
    };
    if (c.type == ClampType::diode_zener) {
        if (!r.has("zener"))
            r.fail_at("zener", "missing; a diode_zener clamp needs a zener id or an inline zener record");
        c.zener =
            read_part<Zener>(r, "zener", find_z, inline_z, "zener", table, ids_of(table.catalogue.zeners), "zeners");
    }
    only_for("zener", ClampType::diode_zener, "diode_zener");
    if (c.type == ClampType::diode_tvs) {
        if (!r.has("tvs")) r.fail_at("tvs", "missing; a diode_tvs clamp needs a TVS id or an inline TVS record");
        c.tvs = read_part<Tvs>(r, "tvs", find_t, inline_t, "TVS", table, ids_of(table.catalogue.tvs), "tvs");
    }
    only_for("tvs", ClampType::diode_tvs, "diode_tvs");
    if (c.type == ClampType::diode_resistor) {
        if (!r.has("resistor"))
            r.fail_at("resistor", "missing; a diode_resistor clamp needs a resistance such as \"470R\"");
        c.resistor_ohm = plausible(r, "resistor", r.positive("resistor", r.required("resistor", Unit::ohm)),
                                   Plausible::clamp_resistor);
        if (auto v = r.quantity("resistor_tolerance", Unit::ratio))
            c.resistor_tolerance = r.fraction("resistor_tolerance", *v, 0.0, 0.5, true);
        if (auto v = r.quantity("resistor_power", Unit::watt))
            c.resistor_power_w = r.within("resistor_power", r.positive("resistor_power", *v), 1e-3, 100.0);
    }
    only_for("resistor", ClampType::diode_resistor, "diode_resistor");
    only_for("resistor_tolerance", ClampType::diode_resistor, "diode_resistor");
    only_for("resistor_power", ClampType::diode_resistor, "diode_resistor");
}

void read_drive_sections(ObjectReader& top, const SpecDocument& d, Spec& s) {
    if (const Json* j = top.get("base_resistor")) {
        ObjectReader r(*j, d.origin, "base_resistor");
        read_base_resistor(r, s);
        r.finish();
    } else {
        s.base_resistor.tolerance = eseries_tolerance(s.base_resistor.series);
        if (s.bipolar()) s.defaults_used.push_back("base_resistor: E24 series, 5 % tolerance, 0.125 W");
    }
    if (const Json* j = top.get("gate_resistor")) {
        ObjectReader r(*j, d.origin, "gate_resistor");
        read_gate_resistor(r, s);
        r.finish();
    } else {
        s.gate_resistor.tolerance = eseries_tolerance(s.gate_resistor.series);
        if (s.mosfet()) s.defaults_used.push_back("gate_resistor: E24 series, 5 % tolerance");
    }
    read_pulldown(top, s);
    const Json* policy = top.get("policy");
    const Json empty = Json::object();
    ObjectReader r(policy ? *policy : empty, d.origin, "policy");
    read_policy(r, s);
    r.finish();
}

void read_operation_sections(ObjectReader& top, const SpecDocument& d, Spec& s) {
    if (const Json* j = top.get("switching")) {
        ObjectReader r(*j, d.origin, "switching");
        if (auto f = r.quantity("frequency", Unit::hertz))
            s.switching.frequency_hz = r.within("frequency", r.positive("frequency", *f), 1e-9, 1e4);
        if (auto v = r.quantity("duty", Unit::ratio))
            s.switching.duty = r.fraction("duty", r.positive("duty", *v), 0.0, 1.0, false);
        r.finish();
    }
    if (const Json* j = top.get("load")) {
        ObjectReader r(*j, d.origin, "load");
        s.load = read_load(r, s.defaults_used);
        r.finish();
        note_inrush_default(s, s.defaults_used);
    }
}

}  // namespace coilfit::io::spec_parts
