#include "io/spec_io.hpp"

#include <fmt/format.h>

namespace coilfit::io {
namespace {

constexpr double absolute_zero_c = -273.15;

std::string pct(double x) { return fmt::format("{:g} %", x * 100.0); }
std::string volts(double v) { return format_quantity(v, Unit::volt, 6); }

// A field the spec needs; a preset may leave it to the spec (partial).
std::optional<double> needed(ObjectReader& r, const std::string& key, Unit unit, bool partial) {
    if (partial) return r.quantity(key, unit);
    return r.required(key, unit);
}

// Reads a part field that is either a table id or an inline record.
template <typename Part, typename Find, typename ReadInline>
Part read_part(ObjectReader& parent, const std::string& key, Find find, ReadInline read_inline,
               std::string_view what, const PartsTable& table) {
    const Json* v = parent.get(key);
    if (!v) parent.fail_at(key, fmt::format("missing; expected {} id from the parts table or an inline record", what));
    if (v->is_string()) {
        const auto& id = v->get_ref<const Json::string_t&>();
        if (const Part* p = find(table.catalogue, id)) return *p;
        parent.fail_at(key, fmt::format("no {} \"{}\" in the parts table ({}); `coilfit parts` lists it",
                                        what, describe(*v).substr(1, describe(*v).size() - 2),
                                        table.files.empty() ? std::string("empty") : fmt::format("{} files", table.files.size())));
    }
    if (v->is_object()) {
        ObjectReader r(*v, parent.origin(), parent.path_of(key));
        Part p = read_inline(r);
        r.finish();
        return p;
    }
    parent.fail_at(key, fmt::format("expected {} id such as a text in quotes, or an inline record, got {}", what, describe(*v)));
}

// Starts from a preset's fields (if "preset" is given), then the spec's own fields win.
Json with_preset(const Json& obj, const std::string& kind, const PartsTable& table, const Origin& origin,
                 const std::string& path) {
    if (!obj.is_object() || !obj.contains("preset")) return obj;
    const Json& id = obj.at("preset");
    if (!id.is_string()) fail(origin, path + ".preset", "expected a preset id in quotes, got " + describe(id));
    const Preset* p = table.find_preset(kind, id.get<std::string>());
    if (!p) {
        fail(origin, path + ".preset", fmt::format("no {} preset {} in the parts table; `coilfit parts {}` lists them", kind,
                                                   describe(id), kind));
    }
    Json merged = p->fields;
    for (const auto& [k, v] : obj.items()) merged[k] = v;
    return merged;
}

void read_supply(ObjectReader& r, Spec& s) {
    s.supply.voltage_v = r.within("voltage", r.positive("voltage", r.required("voltage", Unit::volt)), 0.1, 1000.0);
    if (auto t = r.quantity("tolerance", Unit::ratio)) {
        s.supply.tolerance = r.fraction("tolerance", *t, 0.0, 0.5, true);
    } else {
        s.defaults_used.push_back("supply.tolerance " + pct(s.supply.tolerance));
    }
}

// Plausible temperatures: ambient -100 °C to 250 °C; the coil's reference temperature (where
// its resistance was measured) -55 °C to 125 °C. Together they keep the copper factor
// 1 + alpha (T - T_ref) above 0.1, so no coil resistance comes out zero or negative.
double temperature(ObjectReader& r, const std::string& key, double value, double lo = -100.0, double hi = 250.0) {
    if (value < absolute_zero_c) {
        r.fail_at(key, fmt::format("expected a temperature above absolute zero (-273.15 °C), got {}",
                                   format_quantity(value, Unit::celsius)));
    }
    return r.within(key, value, lo, hi);
}

void read_ambient(ObjectReader& r, Spec& s) {
    if (auto v = r.quantity("min", Unit::celsius)) s.ambient.min_c = temperature(r, "min", *v);
    else s.defaults_used.push_back(fmt::format("ambient.min {:g} °C", s.ambient.min_c));
    if (auto v = r.quantity("max", Unit::celsius)) s.ambient.max_c = temperature(r, "max", *v);
    else s.defaults_used.push_back(fmt::format("ambient.max {:g} °C", s.ambient.max_c));
    if (s.ambient.min_c > s.ambient.max_c) {
        r.fail_at("min", fmt::format("expected at most ambient.max {}, got {}", format_quantity(s.ambient.max_c, Unit::celsius),
                                     format_quantity(s.ambient.min_c, Unit::celsius)));
    }
}

void read_coil(ObjectReader& r, Spec& s, bool partial = false) {
    CoilSpec& c = s.coil;
    if (partial && r.has("preset")) r.fail_at("preset", "expected no preset inside a preset");
    if (auto p = r.text("preset", 64)) c.preset = *p;
    if (auto v = needed(r, "rated_voltage", Unit::volt, partial)) {
        c.rated_voltage_v = r.within("rated_voltage", r.positive("rated_voltage", *v), 0.1, 1000.0);
    }
    if (auto v = needed(r, "resistance", Unit::ohm, partial)) {
        c.resistance_ohm = r.within("resistance", r.positive("resistance", *v), 0.01, 1e7);
    }
    if (auto v = r.quantity("tolerance", Unit::ratio)) c.tolerance = r.fraction("tolerance", *v, 0.0, 0.5, true);
    else s.defaults_used.push_back("coil.tolerance " + pct(c.tolerance) + " (common practice)");
    if (auto v = r.quantity("reference_temp", Unit::celsius)) c.reference_temp_c = temperature(r, "reference_temp", *v, -55.0, 125.0);
    else s.defaults_used.push_back(fmt::format("coil.reference_temp {:g} °C", c.reference_temp_c));
    if (auto v = r.quantity("must_operate", Unit::ratio)) {
        c.must_operate = r.fraction("must_operate", r.positive("must_operate", *v), 0.0, 1.0, true);
    } else {
        s.defaults_used.push_back("coil.must_operate " + pct(c.must_operate) + " of rated voltage (typical relay data)");
    }
    if (auto v = r.quantity("must_release", Unit::ratio)) c.must_release = r.fraction("must_release", *v, 0.0, 1.0, false);
    else s.defaults_used.push_back("coil.must_release " + pct(c.must_release) + " of rated voltage (typical relay data)");
    const bool both_levels = !partial || (r.has("must_operate") && r.has("must_release"));
    if (both_levels && c.must_release >= c.must_operate) {
        // Name the field the user wrote: must_operate when must_release is the default.
        if (!r.has("must_release")) {
            r.fail_at("must_operate", fmt::format("expected above coil.must_release {} (the default; give coil.must_release), got {}",
                                                  pct(c.must_release), pct(c.must_operate)));
        }
        r.fail_at("must_release", fmt::format("expected below coil.must_operate {}, got {}", pct(c.must_operate), pct(c.must_release)));
    }
    if (auto v = r.quantity("self_heating", Unit::kelvin)) c.self_heating_k = r.within("self_heating", *v, 0.0, 200.0);
    else s.defaults_used.push_back("coil.self_heating 0 K");
    if (auto v = r.quantity("inductance", Unit::henry)) c.inductance_h = r.within("inductance", r.positive("inductance", *v), 1e-6, 1e4);
    if (auto v = r.quantity("max_voltage", Unit::volt)) {
        c.max_voltage_v = r.within("max_voltage", r.positive("max_voltage", *v), 0.1, 1000.0);
        // Below the rated voltage is a typo: the coil could not be run at its own rating.
        if ((!partial || r.has("rated_voltage")) && *c.max_voltage_v < c.rated_voltage_v) {
            r.fail_at("max_voltage", fmt::format("expected at least coil.rated_voltage {}, got {}", volts(c.rated_voltage_v),
                                                 volts(*c.max_voltage_v)));
        }
    }
    if (auto v = r.quantity("max_release_time", Unit::second)) {
        c.max_release_time_s = r.within("max_release_time", r.positive("max_release_time", *v), 1e-6, 100.0);
    }
}

void read_pin(ObjectReader& r, Spec& s, bool partial = false) {
    PinSpec& p = s.pin;
    if (partial && r.has("preset")) r.fail_at("preset", "expected no preset inside a preset");
    if (auto v = r.text("preset", 64)) p.preset = *v;
    if (auto v = needed(r, "vdd", Unit::volt, partial)) p.vdd_v = r.within("vdd", r.positive("vdd", *v), 0.5, 60.0);
    if (auto v = r.quantity("vdd_tolerance", Unit::ratio)) p.vdd_tolerance = r.fraction("vdd_tolerance", *v, 0.0, 0.5, true);
    else s.defaults_used.push_back("pin.vdd_tolerance " + pct(p.vdd_tolerance));
    if (auto v = needed(r, "max_current", Unit::ampere, partial)) {
        p.max_current_a = r.within("max_current", r.positive("max_current", *v), 1e-6, 10.0);
    }
    if (auto v = r.quantity("voh", Unit::volt)) {
        if (!(*v > 0)) r.fail_at("voh", fmt::format("expected a voltage greater than zero, got {}", volts(*v)));
        if ((!partial || r.has("vdd")) && *v > p.vdd_v) {
            r.fail_at("voh", fmt::format("expected at most pin.vdd {}, got {}", volts(p.vdd_v), volts(*v)));
        }
        p.voh_v = *v;
    }
    if (auto v = r.quantity("voh_current", Unit::ampere)) p.voh_current_a = r.within("voh_current", r.positive("voh_current", *v), 1e-6, 10.0);
    if (!partial) {
        if (p.voh_v && !p.voh_current_a) r.fail_at("voh_current", "missing; pin.voh needs the current it is rated at, such as \"8mA\"");
        if (p.voh_current_a && !p.voh_v) r.fail_at("voh", "missing; pin.voh_current needs the voltage rated at it, such as \"2.9V\"");
    }
}

void read_clamp(ObjectReader& r, Spec& s, const PartsTable& table) {
    ClampSpec& c = s.clamp;
    const auto type = r.text("type", 32);
    if (!type) {
        s.defaults_used.push_back("clamp.type diode");
    } else if (*type == "diode") c.type = ClampType::diode;
    else if (*type == "diode_zener") c.type = ClampType::diode_zener;
    else if (*type == "diode_resistor") c.type = ClampType::diode_resistor;
    else if (*type == "none") c.type = ClampType::none;
    else r.fail_at("type", "expected \"diode\", \"diode_zener\", \"diode_resistor\" or \"none\", got " + describe(*r.get("type")));
    const auto find_d = [](const Catalogue& cat, const std::string& id) { return cat.find_diode(id); };
    const auto find_z = [](const Catalogue& cat, const std::string& id) { return cat.find_zener(id); };
    if (c.type != ClampType::none) {
        c.diode = read_part<Diode>(r, "diode", find_d, read_diode, "diode", table);
    } else if (r.has("diode")) {
        r.fail_at("diode", "given, but clamp.type is \"none\"");
    }
    if (c.type == ClampType::diode_zener) {
        if (!r.has("zener")) r.fail_at("zener", "missing; a diode_zener clamp needs a zener id or an inline zener record");
        c.zener = read_part<Zener>(r, "zener", find_z, read_zener, "zener", table);
    } else if (r.has("zener")) {
        r.fail_at("zener", fmt::format("given, but clamp.type is \"{}\"; use \"diode_zener\"", clamp_type_name(c.type)));
    }
    if (c.type == ClampType::diode_resistor) {
        if (!r.has("resistor")) r.fail_at("resistor", "missing; a diode_resistor clamp needs a resistance such as \"470R\"");
        c.resistor_ohm = r.within("resistor", r.positive("resistor", r.required("resistor", Unit::ohm)), 0.01, 1e6);
    } else if (r.has("resistor")) {
        r.fail_at("resistor", fmt::format("given, but clamp.type is \"{}\"; use \"diode_resistor\"", clamp_type_name(c.type)));
    }
}

void read_base_resistor(ObjectReader& r, Spec& s) {
    BaseResistorSpec& b = s.base_resistor;
    if (auto name = r.text("series", 16)) {
        const auto series = eseries_from_name(*name);
        if (!series) r.fail_at("series", "expected one of E3, E6, E12, E24, E48, E96, E192, got " + describe(*r.get("series")));
        b.series = *series;
    } else {
        s.defaults_used.push_back("base_resistor.series E24");
    }
    if (auto v = r.quantity("tolerance", Unit::ratio)) {
        b.tolerance = r.fraction("tolerance", *v, 0.0, 0.5, true);
    } else {
        b.tolerance = eseries_tolerance(b.series);
        s.defaults_used.push_back(fmt::format("base_resistor.tolerance {} (usual for {})", pct(b.tolerance), eseries_name(b.series)));
    }
    if (auto v = r.quantity("power_rating", Unit::watt)) b.power_rating_w = r.within("power_rating", r.positive("power_rating", *v), 1e-3, 100.0);
    else s.defaults_used.push_back("base_resistor.power_rating 0.125 W");
    if (auto v = r.quantity("value", Unit::ohm)) b.value_ohm = r.within("value", r.positive("value", *v), 0.1, 1e9);
}

void read_policy(ObjectReader& r, Spec& s) {
    Policy& p = s.policy;
    std::vector<std::string> defaulted;
    if (auto v = r.quantity("forced_gain", Unit::number)) p.forced_gain = r.within("forced_gain", r.positive("forced_gain", *v), 0.1, 1e5);
    else defaulted.push_back(s.transistor.kind == BipolarKind::darlington ? "forced gain at the part's Vce(sat) test ratio" : "forced gain 10");
    // Overdrive below 1 would drive the base with less than the minimum gain needs.
    if (auto v = r.quantity("overdrive", Unit::number)) p.overdrive = r.within("overdrive", r.positive("overdrive", *v), 1.0, 100.0);
    else defaulted.push_back("overdrive 2");
    if (auto v = r.quantity("current_derating", Unit::ratio)) p.current_derating = r.fraction("current_derating", r.positive("current_derating", *v), 0.0, 1.0, true);
    else defaulted.push_back("current derating 75 %");
    if (auto v = r.quantity("voltage_derating", Unit::ratio)) p.voltage_derating = r.fraction("voltage_derating", r.positive("voltage_derating", *v), 0.0, 1.0, true);
    else defaulted.push_back("voltage derating 75 %");
    if (auto v = r.quantity("junction_margin", Unit::kelvin)) p.junction_margin_k = r.within("junction_margin", *v, 0.0, 200.0);
    else defaulted.push_back("junction margin 25 K");
    if (auto v = r.quantity("power_derating", Unit::ratio)) p.power_derating = r.fraction("power_derating", r.positive("power_derating", *v), 0.0, 1.0, true);
    else defaulted.push_back("power derating 50 %");
    if (auto v = r.quantity("vbe_low", Unit::volt)) p.vbe_low_v = r.within("vbe_low", *v, 0.0, 2.0);
    else defaulted.push_back("Vbe low 0.6 V");
    if (!defaulted.empty()) {
        std::string all;
        for (const auto& d : defaulted) all += (all.empty() ? "" : ", ") + d;
        s.defaults_used.push_back("policy: " + all);
    }
}

}  // namespace

SpecDocument parse_spec_text(std::string_view text, const std::string& file) {
    SpecDocument d;
    d.origin.file = file;
    d.doc = parse_json(text, file, max_spec_bytes, "a JSON object { \"schema\": \"coilfit.spec/1\", ... }");
    if (!d.doc.is_object()) fail(d.origin, "", "expected a JSON object { \"schema\": \"coilfit.spec/1\", ... }, got " + describe(d.doc));
    return d;
}

void check_preset_fields(const Json& fields, const std::string& kind, const Origin& origin, const std::string& path) {
    Spec scratch;
    ObjectReader r(fields, origin, path);
    if (kind == "coil") read_coil(r, scratch, true);
    else read_pin(r, scratch, true);
    r.finish();
}

SpecDocument load_spec_document(const std::string& path) {
    const std::string label = path == "-" ? "<stdin>" : path;
    return parse_spec_text(read_text(path, max_spec_bytes), label);
}

SpecDocument flags_only_document() {
    SpecDocument d;
    d.origin.file = "command line";
    d.origin.flags_only = true;
    d.doc = Json::object();
    d.doc["schema"] = spec_schema;
    return d;
}

void set_field(SpecDocument& d, const std::string& dotted_path, Json value, const std::string& flag) {
    Json* node = &d.doc;
    std::size_t start = 0;
    std::string path;
    while (true) {
        const auto dot = dotted_path.find('.', start);
        const std::string key = dotted_path.substr(start, dot == std::string::npos ? std::string::npos : dot - start);
        path += (path.empty() ? "" : ".") + key;
        if (dot == std::string::npos) {
            (*node)[key] = std::move(value);
            break;
        }
        Json& child = (*node)[key];
        if (child.is_null()) child = Json::object();
        // A table id given in the file ("transistor": "2N4401") replaced by a nested flag is
        // not possible; a string where an object is needed is reported by the reader.
        if (!child.is_object()) fail(d.origin, path, "expected a JSON object here to set " + flag + " into, got " + describe(child));
        node = &child;
        start = dot + 1;
    }
    d.origin.flags[dotted_path] = flag;
}

Spec read_spec(const SpecDocument& d, const PartsTable& table) {
    Spec s;
    ObjectReader top(d.doc, d.origin, "");
    const Json* schema = top.get("schema");
    if (!schema) top.fail_at("schema", fmt::format("missing; expected \"{}\"", spec_schema));
    if (!schema->is_string() || schema->get<std::string>() != spec_schema) {
        top.fail_at("schema", fmt::format("expected \"{}\" (the schema this coilfit reads), got {}", spec_schema, describe(*schema)));
    }
    s.name = top.text("name", 200).value_or("");

    auto section = [&](const std::string& key, bool required) -> const Json* {
        const Json* j = top.get(key);
        // Flags alone: read a missing section as empty, so that the message names the first
        // missing field and its flag ("supply.voltage: missing; ... (give --supply)").
        static const Json empty = Json::object();
        if (!j && required && d.origin.flags_only) return &empty;
        if (!j && required) {
            const char* example = key == "supply" ? R"({ "voltage": "12V", "tolerance": "10%" })"
                                  : key == "coil" ? R"({ "rated_voltage": "12V", "resistance": "400R", ... } or { "preset": ID })"
                                  : key == "pin"  ? R"({ "vdd": "3.3V", "max_current": "8mA", ... } or { "preset": ID })"
                                                  : R"({ "type": "diode", "diode": ID })";
            top.fail_at(key, fmt::format("missing; expected an object such as {}", example));
        }
        return j;
    };

    if (const Json* j = section("supply", true)) {
        ObjectReader r(*j, d.origin, "supply");
        read_supply(r, s);
        r.finish();
    }
    if (const Json* j = section("ambient", false)) {
        ObjectReader r(*j, d.origin, "ambient");
        read_ambient(r, s);
        r.finish();
    } else {
        s.defaults_used.push_back(fmt::format("ambient {:g} °C to {:g} °C", s.ambient.min_c, s.ambient.max_c));
    }
    if (const Json* j = section("coil", true)) {
        const Json merged = with_preset(*j, "coil", table, d.origin, "coil");
        ObjectReader r(merged, d.origin, "coil");
        read_coil(r, s);
        r.finish();
    }
    if (const Json* j = section("pin", true)) {
        const Json merged = with_preset(*j, "pin", table, d.origin, "pin");
        ObjectReader r(merged, d.origin, "pin");
        read_pin(r, s);
        r.finish();
    }
    s.transistor = read_part<Bipolar>(
        top, "transistor", [](const Catalogue& cat, const std::string& id) { return cat.find_bipolar(id); }, read_bipolar,
        "transistor", table);
    if (const Json* j = section("clamp", true)) {
        ObjectReader r(*j, d.origin, "clamp");
        read_clamp(r, s, table);
        r.finish();
    }
    if (const Json* j = section("base_resistor", false)) {
        ObjectReader r(*j, d.origin, "base_resistor");
        read_base_resistor(r, s);
        r.finish();
    } else {
        s.base_resistor.tolerance = eseries_tolerance(s.base_resistor.series);
        s.defaults_used.push_back("base_resistor: E24 series, 5 % tolerance, 0.125 W");
    }
    if (auto v = top.quantity("pulldown", Unit::ohm)) s.pulldown_ohm = top.within("pulldown", top.positive("pulldown", *v), 1.0, 1e9);
    if (const Json* j = section("policy", false)) {
        ObjectReader r(*j, d.origin, "policy");
        read_policy(r, s);
        r.finish();
    } else {
        Json empty = Json::object();
        ObjectReader r(empty, d.origin, "policy");
        read_policy(r, s);
    }
    if (const Json* j = section("switching", false)) {
        ObjectReader r(*j, d.origin, "switching");
        if (auto f = r.quantity("frequency", Unit::hertz)) s.switching_frequency_hz = r.within("frequency", r.positive("frequency", *f), 1e-9, 1e4);
        r.finish();
    }
    if (const Json* j = section("load", false)) {
        ObjectReader r(*j, d.origin, "load");
        LoadSpec load;
        load.voltage_v = r.within("voltage", r.non_negative("voltage", r.required("voltage", Unit::volt)), 0.0, 1e5);
        const std::string kind = r.text("kind", 16).value_or("ac");
        if (kind == "ac") load.kind = LoadKind::ac;
        else if (kind == "dc") load.kind = LoadKind::dc;
        else r.fail_at("kind", "expected \"ac\" or \"dc\", got \"" + kind + "\"");
        if (auto i = r.quantity("current", Unit::ampere)) load.current_a = r.within("current", r.non_negative("current", *i), 0.0, 1e4);
        r.finish();
        s.load = load;
    }
    top.finish();
    // The base resistor must be able to carry the pin at all: VDD above Vbe low.
    return s;
}

namespace {
template <typename T>
Json opt(const std::optional<T>& v) {
    return v ? Json(*v) : Json(nullptr);
}
}  // namespace

Json spec_to_json(const Spec& s) {
    Json j;
    j["schema"] = spec_schema;
    j["name"] = s.name;
    j["supply"] = {{"voltage", s.supply.voltage_v}, {"tolerance", s.supply.tolerance}};
    j["ambient"] = {{"min", s.ambient.min_c}, {"max", s.ambient.max_c}};
    Json coil;
    if (!s.coil.preset.empty()) coil["preset"] = s.coil.preset;
    coil["rated_voltage"] = s.coil.rated_voltage_v;
    coil["resistance"] = s.coil.resistance_ohm;
    coil["tolerance"] = s.coil.tolerance;
    coil["reference_temp"] = s.coil.reference_temp_c;
    coil["must_operate"] = s.coil.must_operate;
    coil["must_release"] = s.coil.must_release;
    coil["self_heating"] = s.coil.self_heating_k;
    if (s.coil.inductance_h) coil["inductance"] = *s.coil.inductance_h;
    if (s.coil.max_voltage_v) coil["max_voltage"] = *s.coil.max_voltage_v;
    if (s.coil.max_release_time_s) coil["max_release_time"] = *s.coil.max_release_time_s;
    j["coil"] = coil;
    Json pin;
    if (!s.pin.preset.empty()) pin["preset"] = s.pin.preset;
    pin["vdd"] = s.pin.vdd_v;
    pin["vdd_tolerance"] = s.pin.vdd_tolerance;
    if (s.pin.voh_v) pin["voh"] = *s.pin.voh_v;
    if (s.pin.voh_current_a) pin["voh_current"] = *s.pin.voh_current_a;
    pin["max_current"] = s.pin.max_current_a;
    j["pin"] = pin;
    j["transistor"] = to_json(s.transistor);
    Json clamp;
    clamp["type"] = clamp_type_name(s.clamp.type);
    if (s.clamp.diode) clamp["diode"] = to_json(*s.clamp.diode);
    if (s.clamp.zener) clamp["zener"] = to_json(*s.clamp.zener);
    if (s.clamp.resistor_ohm) clamp["resistor"] = *s.clamp.resistor_ohm;
    j["clamp"] = clamp;
    Json rb;
    rb["series"] = eseries_name(s.base_resistor.series);
    rb["tolerance"] = s.base_resistor.tolerance;
    rb["power_rating"] = s.base_resistor.power_rating_w;
    if (s.base_resistor.value_ohm) rb["value"] = *s.base_resistor.value_ohm;
    j["base_resistor"] = rb;
    j["pulldown"] = opt(s.pulldown_ohm);
    Json policy;
    policy["forced_gain"] = opt(s.policy.forced_gain);
    policy["overdrive"] = s.policy.overdrive;
    policy["current_derating"] = s.policy.current_derating;
    policy["voltage_derating"] = s.policy.voltage_derating;
    policy["junction_margin"] = s.policy.junction_margin_k;
    policy["power_derating"] = s.policy.power_derating;
    policy["vbe_low"] = s.policy.vbe_low_v;
    j["policy"] = policy;
    j["switching"] = {{"frequency", opt(s.switching_frequency_hz)}};
    if (s.load) {
        j["load"] = {{"voltage", s.load->voltage_v}, {"kind", s.load->kind == LoadKind::ac ? "ac" : "dc"},
                     {"current", opt(s.load->current_a)}};
    } else {
        j["load"] = nullptr;
    }
    return j;
}

}  // namespace coilfit::io
