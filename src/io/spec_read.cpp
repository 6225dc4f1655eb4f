// Spec files (schema "coilfit.spec/1") and command-line overrides into a validated Spec.
#include <fmt/format.h>
#include <fmt/ranges.h>

#include "coilfit/id_match.hpp"

#include "io/parts_read.hpp"
#include "io/plausible.hpp"
#include "io/sections_read.hpp"
#include "io/spec_io.hpp"
#include "io/spec_read_parts.hpp"

namespace coilfit::io {
namespace {

std::string volts(double v) { return format_quantity(v, Unit::volt, 6); }

// Starts from a preset's fields (if "preset" is given), then the spec's own fields win.
Json with_preset(const Json& obj, const std::string& kind, const PartsTable& table, const Origin& origin,
                 const std::string& path) {
    if (!obj.is_object() || !obj.contains("preset")) return obj;
    const Json& id = obj.at("preset");
    if (!id.is_string()) fail(origin, path + ".preset", "expected a preset id in quotes, got " + describe(id));
    std::vector<std::string> ids;
    for (const Preset& pr : table.presets) {
        if (pr.kind == kind) ids.push_back(pr.id);
    }
    const IdMatch m = match_id(id.get<std::string>(), ids);
    const Preset* p = m.id ? table.find_preset(kind, *m.id) : nullptr;
    if (!p) {
        const auto near = nearest_ids(id.get<std::string>(), ids);
        fail(
            origin, path + ".preset",
            fmt::format("no {} preset {} in the parts table{}; `coilfit parts {}` lists them", kind, describe(id),
                        near.empty() ? std::string() : "; nearest: " + fmt::format("{}", fmt::join(near, ", ")), kind));
    }
    Json merged = p->fields;
    for (const auto& [k, v] : obj.items()) merged[k] = v;
    return merged;
}

void read_supply(ObjectReader& r, Spec& s) {
    SupplySpec& sup = s.supply;
    const bool band = r.has("min") || r.has("max");
    if (band) {
        // An asymmetric band (a vehicle's 9 V to 16 V): min and max; the nominal is optional.
        sup.min_v = plausible(r, "min", r.positive("min", r.required("min", Unit::volt)), Plausible::supply_voltage);
        sup.max_v = plausible(r, "max", r.positive("max", r.required("max", Unit::volt)), Plausible::supply_voltage);
        if (*sup.min_v > *sup.max_v) {
            r.fail_at("min",
                      fmt::format("expected at most supply.max {}, got {}", volts(*sup.max_v), volts(*sup.min_v)));
        }
        if (r.has("tolerance"))
            r.fail_at("tolerance", "given with supply.min and supply.max; give the band or a tolerance");
        if (auto v = r.quantity("voltage", Unit::volt)) {
            sup.voltage_v = plausible(r, "voltage", r.positive("voltage", *v), Plausible::supply_voltage);
            if (sup.voltage_v < *sup.min_v || sup.voltage_v > *sup.max_v) {
                r.fail_at("voltage", fmt::format("expected a nominal within supply.min {} to supply.max {}, got {}",
                                                 volts(*sup.min_v), volts(*sup.max_v), volts(sup.voltage_v)));
            }
        }
        sup.tolerance = 0;
    } else {
        sup.voltage_v = plausible(r, "voltage", r.positive("voltage", r.required("voltage", Unit::volt)),
                                  Plausible::supply_voltage);
        if (auto t = r.quantity("tolerance", Unit::ratio))
            sup.tolerance = r.fraction("tolerance", *t, 0.0, 0.5, true);
        else
            s.defaults_used.push_back("supply.tolerance " + percent_words(sup.tolerance));
    }
    if (auto v = r.quantity("transient_max", Unit::volt)) {
        sup.transient_max_v = r.within("transient_max", r.positive("transient_max", *v), 0.1, 1e4);
        if (*sup.transient_max_v < sup.hi_v()) {
            r.fail_at("transient_max", fmt::format("expected at least the highest supply {}, got {}", volts(sup.hi_v()),
                                                   volts(*sup.transient_max_v)));
        }
    }
}

void read_ambient(ObjectReader& r, Spec& s) {
    if (auto v = r.quantity("min", Unit::celsius))
        s.ambient.min_c = temperature(r, "min", *v);
    else
        s.defaults_used.push_back(fmt::format("ambient.min {:g} °C", s.ambient.min_c));
    if (auto v = r.quantity("max", Unit::celsius))
        s.ambient.max_c = temperature(r, "max", *v);
    else
        s.defaults_used.push_back(fmt::format("ambient.max {:g} °C", s.ambient.max_c));
    if (s.ambient.min_c > s.ambient.max_c) {
        r.fail_at("min", fmt::format("expected at most ambient.max {}, got {}",
                                     format_quantity(s.ambient.max_c, Unit::celsius),
                                     format_quantity(s.ambient.min_c, Unit::celsius)));
    }
}

// A section the spec needs; with flags alone, a missing one reads as empty so that the message
// names the first missing field and its flag ("supply.voltage: missing; ... (give --supply)").
const Json* section(ObjectReader& top, const SpecDocument& d, const std::string& key, bool required) {
    const Json* j = top.get(key);
    static const Json empty = Json::object();
    if (!j && required && d.origin.flags_only) return &empty;
    if (!j && required) {
        const char* example = key == "supply" ? R"({ "voltage": "12V", "tolerance": "10%" })"
                              : key == "coil"
                                  ? R"({ "rated_voltage": "12V", "resistance": "400R", ... } or { "preset": ID })"
                              : key == "pin" ? R"({ "vdd": "3.3V", "max_current": "8mA", ... } or { "preset": ID })"
                                             : R"({ "type": "diode", "diode": ID })";
        top.fail_at(key, fmt::format("missing; expected an object such as {}", example));
    }
    return j;
}

template <typename Read>
void read_section(ObjectReader& top, const SpecDocument& d, const std::string& key, bool required, Read read) {
    if (const Json* j = section(top, d, key, required)) {
        ObjectReader r(*j, d.origin, key);
        read(r);
        r.finish();
    }
}

}  // namespace

SpecDocument parse_spec_text(std::string_view text, const std::string& file) {
    SpecDocument d;
    d.origin.file = printable(file, 4096);  // a file name echoed in messages, escaped
    d.doc = parse_json(text, d.origin.file, max_spec_bytes, "a JSON object { \"schema\": \"coilfit.spec/1\", ... }");
    if (!d.doc.is_object())
        fail(d.origin, "", "expected a JSON object { \"schema\": \"coilfit.spec/1\", ... }, got " + describe(d.doc));
    return d;
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

namespace {

// A flag that changes the clamp's type replaces the file's type-specific fields instead of
// tripping over them ("--clamp none" on a file that names a diode): fields the new type does
// not take are dropped unless a flag of this run set them.
void prune_clamp_fields(SpecDocument& d, const std::string& type) {
    Json* clamp = d.doc.contains("clamp") && d.doc["clamp"].is_object() ? &d.doc["clamp"] : nullptr;
    if (!clamp) return;
    auto keeps = [&type](const std::string& key) {
        if (key == "type") return true;
        if (key == "diode") return type != "none";
        if (key == "zener") return type == "diode_zener";
        if (key == "tvs") return type == "diode_tvs";
        if (key == "resistor" || key == "resistor_tolerance" || key == "resistor_power")
            return type == "diode_resistor";
        return true;
    };
    std::vector<std::string> drop;
    for (const auto& [key, value] : clamp->items()) {
        if (!keeps(key) && d.origin.flags.count("clamp." + key) == 0) drop.push_back(key);
    }
    for (const auto& key : drop) clamp->erase(key);
}

// Fields that exclude each other: a flag setting one replaces the file's other (an asymmetric
// band from --supply-min on a file with a tolerance, --coil-thermal-resistance on a file with
// self_heating), unless a flag of this run set it.
void prune_exclusive(SpecDocument& d, const std::string& dotted_path) {
    static const std::pair<const char*, const char*> exclusive[] = {
        {"supply.min", "supply.tolerance"},
        {"supply.max", "supply.tolerance"},
        {"supply.tolerance", "supply.min"},
        {"supply.tolerance", "supply.max"},
        {"coil.thermal_resistance", "coil.self_heating"},
        {"coil.self_heating", "coil.thermal_resistance"},
    };
    for (const auto& [set, drop] : exclusive) {
        if (dotted_path != set || d.origin.flags.count(drop) != 0) continue;
        const std::string path = drop;
        const auto dot = path.find('.');
        Json* section = d.doc.contains(path.substr(0, dot)) ? &d.doc[path.substr(0, dot)] : nullptr;
        if (section && section->is_object()) section->erase(path.substr(dot + 1));
    }
}

// A relay given by flag replaces the file's coil: the fields that describe the coil itself go
// (a flag of this run that set one stays); the application's own (self_heating,
// max_release_time) stay beside the relay.
void prune_coil_fields(SpecDocument& d) {
    Json* coil = d.doc.contains("coil") && d.doc["coil"].is_object() ? &d.doc["coil"] : nullptr;
    if (!coil) return;
    std::vector<std::string> drop;
    for (const auto& [key, value] : coil->items()) {
        if (key != "self_heating" && key != "max_release_time" && d.origin.flags.count("coil." + key) == 0)
            drop.push_back(key);
    }
    for (const auto& key : drop) coil->erase(key);
}

}  // namespace

void set_field(SpecDocument& d, const std::string& dotted_path, Json value, const std::string& flag) {
    if (dotted_path == "clamp.type" && value.is_string()) prune_clamp_fields(d, value.get<std::string>());
    prune_exclusive(d, dotted_path);
    if (dotted_path == "relay") prune_coil_fields(d);
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
        if (!child.is_object())
            fail(d.origin, path, "expected a JSON object here to set " + flag + " into, got " + describe(child));
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
        top.fail_at("schema", fmt::format("expected \"{}\" (the schema this coilfit reads), got {}", spec_schema,
                                          describe(*schema)));
    }
    s.name = top.text("name", 200).value_or("");
    read_section(top, d, "supply", true, [&](ObjectReader& r) { read_supply(r, s); });
    if (top.has("ambient")) {
        read_section(top, d, "ambient", false, [&](ObjectReader& r) { read_ambient(r, s); });
    } else {
        (void)top.get("ambient");
        s.defaults_used.push_back(fmt::format("ambient {:g} °C to {:g} °C", s.ambient.min_c, s.ambient.max_c));
    }
    if (auto relay = spec_parts::read_relay_field(top, table)) {
        // The relay's coil fields, then the spec's `coil` fields beside it win.
        Json merged = relay->coil_fields;
        if (const Json* j = top.get("coil")) {
            if (!j->is_object())
                fail(d.origin, "coil", "expected an object of coil fields beside relay, got " + describe(*j));
            if (j->contains("preset"))
                fail(d.origin, "coil.preset", "given with relay; the relay's record fills the coil");
            for (const auto& [k, v] : j->items()) merged[k] = v;
        }
        ObjectReader r(merged, d.origin, "coil");
        read_coil(r, s.coil, s.defaults_used);
        r.finish();
        s.relay = static_cast<const RelayPart&>(relay->record);
    } else if (const Json* j = section(top, d, "coil", true)) {
        const Json merged = with_preset(*j, "coil", table, d.origin, "coil");
        ObjectReader r(merged, d.origin, "coil");
        read_coil(r, s.coil, s.defaults_used);
        r.finish();
    }
    if (const Json* j = section(top, d, "pin", true)) {
        const Json merged = with_preset(*j, "pin", table, d.origin, "pin");
        ObjectReader r(merged, d.origin, "pin");
        read_pin(r, s.pin, s.defaults_used);
        r.finish();
    }
    s.transistor = spec_parts::read_transistor_field(top, table);
    // An array channel clamps through its built-in diode unless the spec names a clamp.
    if (s.array() && !top.has("clamp")) {
        (void)top.get("clamp");
        s.clamp.diode = s.array()->diode;
        s.defaults_used.push_back(
            "clamp: the array's built-in diode to its common pin (tie the common pin to the coil supply)");
    } else {
        read_section(top, d, "clamp", true, [&](ObjectReader& r) { spec_parts::read_clamp(r, s, table); });
    }
    spec_parts::read_drive_sections(top, d, s);
    spec_parts::read_operation_sections(top, d, s);
    top.finish();
    return s;
}

}  // namespace coilfit::io
