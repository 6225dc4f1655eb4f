// Board files (schema "coilfit.board/1"): the board-wide sections, the MCU and the simultaneity
// rule; the channels are read in board_read_channels.cpp.
#include <cmath>
#include <map>
#include <set>

#include <fmt/format.h>

#include "io/board_read.hpp"
#include "io/spec_io.hpp"

namespace coilfit::io {
namespace board_read {

// "a.b" from "a" and "b".
std::string joined(const std::string& path, const std::string& key) {
    std::string out = path;
    out += '.';
    out += key;
    return out;
}

void overlay(Json& into, const Json& from, const std::string& path, const std::string& source,
             std::map<std::string, std::string>& written_at) {
    if (into.is_object() && from.is_object() && !path.empty()) {
        written_at[path] = source;
        for (const auto& [key, value] : from.items()) {
            overlay(into[key], value, joined(path, key), joined(source, key), written_at);
        }
        return;
    }
    if (path.empty()) {  // the document itself: its keys, each from `source`
        for (const auto& [key, value] : from.items()) {
            overlay(into[key], value, key, source.empty() ? key : joined(source, key), written_at);
        }
        return;
    }
    into = from;
    // What was under `path` is gone with the value it replaced.
    for (auto it = written_at.lower_bound(path); it != written_at.end() && it->first.rfind(path, 0) == 0;) {
        const char next = it->first.size() > path.size() ? it->first[path.size()] : '\0';
        if (next == '.' || next == '[')
            it = written_at.erase(it);
        else
            ++it;
    }
    written_at[path] = source;
}

}  // namespace board_read

namespace {

using board_read::Base;

const char* mcu_example =
    R"({ "vdd": "3.3V", "pin": { "max_current": "8mA" }, "ports": [ { "name": "PA", "current_max": "40mA" } ] })";

double current_limit(ObjectReader& r, const std::string& key, double value) {
    return r.within(key, r.positive(key, value), 1e-6, 1e4);
}

std::vector<PortSpec> read_ports(ObjectReader& mcu, const Json& list) {
    if (!list.is_array()) {
        mcu.fail_at("ports",
                    "expected a list of ports such as [ { \"name\": \"PA\", \"current_max\": \"40mA\" } ], got " +
                        describe(list));
    }
    std::vector<PortSpec> ports;
    std::map<std::string, std::size_t> seen;
    for (std::size_t k = 0; k < list.size(); ++k) {
        const std::string at = mcu.path_of("ports[" + std::to_string(k) + "]");
        if (!list[k].is_object()) {
            fail(mcu.origin(), at,
                 "expected a port such as { \"name\": \"PA\", \"current_max\": \"40mA\" }, got " + describe(list[k]));
        }
        ObjectReader r(list[k], mcu.origin(), at);
        PortSpec p;
        p.name = r.required_text("name", 40);
        if (p.name.empty()) r.fail_at("name", "expected a port name such as \"PA\", got \"\"");
        if (const auto [it, added] = seen.emplace(p.name, k); !added) {
            r.fail_at("name", fmt::format("port {} is listed twice (also at mcu.ports[{}])", describe(Json(p.name)),
                                          it->second));
        }
        if (auto v = r.quantity("current_max", Unit::ampere)) p.current_max_a = current_limit(r, "current_max", *v);
        r.finish();
        ports.push_back(std::move(p));
    }
    return ports;
}

// The mcu section: its ports and package limit into the board, its pin ratings into the base
// document's pin section (mcu.vdd and mcu.vdd_tolerance are the pin's vdd and vdd_tolerance).
void read_mcu(ObjectReader& top, const Origin& origin, Board& board, Base& base) {
    const Json* mcu = top.get("mcu");
    if (!mcu) top.fail_at("mcu", std::string("missing; expected an object such as ") + mcu_example);
    if (!mcu->is_object())
        top.fail_at("mcu", std::string("expected an object such as ") + mcu_example + ", got " + describe(*mcu));
    ObjectReader r(*mcu, origin, "mcu");
    Json pin = Json::object();
    base.written_at["pin"] = "mcu.pin";
    if (const Json* p = r.get("pin")) {
        if (!p->is_object()) {
            r.fail_at("pin",
                      "expected the pins' ratings such as { \"max_current\": \"8mA\", \"voh\": \"2.9V\", "
                      "\"voh_current\": \"8mA\" }, got " +
                          describe(*p));
        }
        pin = *p;
    }
    for (const char* key : {"vdd", "vdd_tolerance"}) {
        const Json* v = r.get(key);
        if (!v) continue;
        if (pin.contains(key))
            r.fail_at(std::string("pin.") + key, std::string("given with mcu.") + key + "; give it once");
        pin[key] = *v;
        base.written_at[std::string("pin.") + key] = std::string("mcu.") + key;
    }
    base.doc["pin"] = pin;
    if (const Json* ports = r.get("ports")) board.mcu.ports = read_ports(r, *ports);
    if (auto v = r.quantity("package_current_max", Unit::ampere)) {
        board.mcu.package_current_max_a = current_limit(r, "package_current_max", *v);
    }
    r.finish();
}

void read_supply(ObjectReader& top, Board& board, Base& base) {
    const char* example = R"({ "voltage": "24V", "tolerance": "10%", "current_max": "2A" })";
    const Json* supply = top.get("supply");
    if (!supply) top.fail_at("supply", std::string("missing; expected an object such as ") + example);
    if (!supply->is_object())
        top.fail_at("supply", std::string("expected an object such as ") + example + ", got " + describe(*supply));
    Json fields = *supply;
    {
        // current_max is the board's; the rest is every channel's supply (read by the spec reader).
        ObjectReader r(*supply, top.origin(), "supply");
        if (auto v = r.quantity("current_max", Unit::ampere))
            board.supply_current_max_a = current_limit(r, "current_max", *v);
        fields.erase("current_max");
    }
    base.doc["supply"] = fields;
    base.written_at["supply"] = "supply";
}

// The whole number at `key` within [lo, hi].
std::size_t whole_number(ObjectReader& r, const std::string& key, double lo, double hi, const std::string& what) {
    const double v = *r.quantity(key, Unit::number);
    if (v != std::floor(v) || v < lo || v > hi) {
        r.fail_at(key, fmt::format("expected {} from {:g} to {:g}, got {}", what, lo, hi,
                                   format_quantity(v, Unit::number, 6)));
    }
    return static_cast<std::size_t>(v);
}

// The channels a name in a group stands for: an entry's name (every repeat), a channel's own
// name or its pin.
std::vector<std::size_t> channels_named(const Board& board, const std::string& name) {
    std::vector<std::size_t> out;
    for (std::size_t i = 0; i < board.channels.size(); ++i) {
        const BoardChannel& ch = board.channels[i];
        if (ch.entry_name == name || ch.spec.name == name || ch.pin == name) out.push_back(i);
    }
    return out;
}

std::vector<std::vector<std::size_t>> read_groups(ObjectReader& r, const Json& groups, const Board& board) {
    const std::string example = R"([ [ "K1 pump", "K2 zone 1" ], [ "K3 zone 2" ] ])";
    if (!groups.is_array() || groups.empty())
        r.fail_at("groups",
                  "expected a list of groups of channel names such as " + example + ", got " + describe(groups));
    std::vector<std::vector<std::size_t>> out;
    std::map<std::size_t, std::size_t> group_of;
    for (std::size_t g = 0; g < groups.size(); ++g) {
        const std::string at = r.path_of("groups[" + std::to_string(g) + "]");
        if (!groups[g].is_array() || groups[g].empty()) {
            fail(r.origin(), at,
                 "expected a list of channel names (or pins) such as [ \"K1 pump\", \"PA3\" ], got " +
                     describe(groups[g]));
        }
        std::set<std::size_t> members;
        for (std::size_t k = 0; k < groups[g].size(); ++k) {
            const Json& name = groups[g][k];
            const std::string place = at + "[" + std::to_string(k) + "]";
            if (!name.is_string())
                fail(r.origin(), place, "expected a channel name or pin in quotes, got " + describe(name));
            const std::vector<std::size_t> found = channels_named(board, name.get<std::string>());
            if (found.empty()) fail(r.origin(), place, "no channel or pin named " + describe(name) + " on this board");
            for (const std::size_t i : found) {
                if (const auto [it, added] = group_of.emplace(i, g); !added && it->second != g) {
                    fail(r.origin(), place,
                         fmt::format("{} is already in simultaneous.groups[{}]; a channel belongs to one group at most",
                                     board.channels[i].spec.name, it->second));
                }
                members.insert(i);
            }
        }
        out.emplace_back(members.begin(), members.end());
    }
    return out;
}

Simultaneity read_simultaneous(ObjectReader& top, const Board& board) {
    Simultaneity s;
    const Json* j = top.get("simultaneous");
    const char* expected = R"(expected "all", { "max_on": N } or { "groups": [ [ names ], ... ] })";
    if (!j) return s;
    if (j->is_string()) {
        if (j->get<std::string>() != "all")
            top.fail_at("simultaneous", std::string(expected) + ", got " + describe(*j));
        return s;
    }
    if (!j->is_object()) top.fail_at("simultaneous", std::string(expected) + ", got " + describe(*j));
    ObjectReader r(*j, top.origin(), "simultaneous");
    if (r.has("max_on"))
        s.max_on = whole_number(r, "max_on", 1, static_cast<double>(max_board_channels), "a whole number of channels");
    if (const Json* g = r.get("groups")) s.groups = read_groups(r, *g, board);
    r.finish();
    return s;
}

}  // namespace

BoardDocument parse_board_text(std::string_view text, const std::string& file) {
    BoardDocument d;
    d.origin.file = file;
    const char* expected = "a JSON object { \"schema\": \"coilfit.board/1\", ... }";
    d.doc = parse_json(text, file, max_board_bytes, expected);
    if (!d.doc.is_object()) fail(d.origin, "", std::string("expected ") + expected + ", got " + describe(d.doc));
    return d;
}

BoardDocument load_board_document(const std::string& path) {
    const std::string label = path == "-" ? "<stdin>" : path;
    return parse_board_text(read_text(path, max_board_bytes), label);
}

Board read_board(const BoardDocument& d, const PartsTable& table) {
    Board board;
    ObjectReader top(d.doc, d.origin, "");
    const Json* schema = top.get("schema");
    if (!schema) top.fail_at("schema", fmt::format("missing; expected \"{}\"", board_schema));
    if (!schema->is_string() || schema->get<std::string>() != board_schema) {
        const bool spec = schema->is_string() && schema->get<std::string>() == spec_schema;
        top.fail_at("schema", fmt::format("expected \"{}\" (the schema this coilfit reads), got {}{}", board_schema,
                                          describe(*schema), spec ? "; a spec file is sized with `coilfit size`" : ""));
    }
    board.name = top.text("name", 200).value_or("");
    Base base;
    base.doc["schema"] = spec_schema;
    read_supply(top, board, base);
    if (const Json* ambient = top.get("ambient")) {
        base.doc["ambient"] = *ambient;
        base.written_at["ambient"] = "ambient";
    }
    read_mcu(top, d.origin, board, base);
    const Json* defaults = top.get("defaults");
    if (defaults && !defaults->is_object()) {
        top.fail_at("defaults",
                    "expected an object of spec fields for every channel, such as { \"clamp\": { \"type\": \"diode\", "
                    "\"diode\": \"1N4148\" } }, got " +
                        describe(*defaults));
    }
    // Unknown keys first: a misspelt section is named before anything is read from the channels.
    (void)top.get("channels");
    (void)top.get("simultaneous");
    top.finish();
    board_read::read_channels(top, d, table, base, defaults, board);
    board.simultaneous = read_simultaneous(top, board);
    // The board's own supply and ambient, for its words: those of a channel that keeps them.
    board.supply = board.channels.front().spec.supply;
    board.ambient = board.channels.front().spec.ambient;
    for (const BoardChannel& ch : board.channels) {
        if (!ch.board_supply) continue;
        board.supply = ch.spec.supply;
        board.ambient = ch.spec.ambient;
        break;
    }
    return board;
}

}  // namespace coilfit::io
