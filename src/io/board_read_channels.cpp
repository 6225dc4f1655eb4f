// The channels of a board file: each entry's spec assembled from the board's sections, the
// defaults and its own fields, read by the spec reader; then its pins, port and array package.
#include <cctype>
#include <cmath>
#include <map>
#include <optional>

#include <fmt/format.h>

#include "io/board_read.hpp"
#include "io/spec_io.hpp"

namespace coilfit::io::board_read {
namespace {

std::string in_quotes(const std::string& s) { return describe(Json(s)); }

// The pins of an entry: a list of `count` names, or one name whose trailing number counts up
// ("PA1" with count 3: PA1, PA2, PA3; "P07": P07, P08, ...).
std::vector<std::string> pins_of(ObjectReader& r, const Json& pin, std::size_t count) {
    std::vector<std::string> out;
    if (pin.is_array()) {
        if (pin.size() != count) {
            r.fail_at("pin", fmt::format("expected {} pin name{} (count {}), got {}", count, count == 1 ? "" : "s",
                                         count, pin.size()));
        }
        for (std::size_t k = 0; k < pin.size(); ++k) {
            if (!pin[k].is_string() || pin[k].get<std::string>().empty()) {
                r.fail_at("pin[" + std::to_string(k) + "]",
                          "expected a pin name such as \"PA0\", got " + describe(pin[k]));
            }
            out.push_back(pin[k].get<std::string>());
        }
        return out;
    }
    const std::string name = pin.get<std::string>();
    if (count == 1) return {name};
    std::size_t digits = 0;
    while (digits < name.size() && digits < 6 &&
           std::isdigit(static_cast<unsigned char>(name[name.size() - 1 - digits])) != 0)
        ++digits;
    if (digits == 0) {
        r.fail_at("pin", fmt::format("{} has no number to count {} pins on from; give a list of {} pin names",
                                     in_quotes(name), count, count));
    }
    const std::string stem = name.substr(0, name.size() - digits);
    const std::size_t first = std::stoul(name.substr(name.size() - digits));
    for (std::size_t k = 0; k < count; ++k) {
        std::string number = std::to_string(first + k);
        if (number.size() < digits) number.insert(0, digits - number.size(), '0');
        out.push_back(stem + number);
    }
    return out;
}

// The pin field: a name, a list of names, or an object { "name": ..., pin ratings that override the mcu's }.
Json pin_field(ObjectReader& r, Json& overrides) {
    const Json* pin = r.get("pin");
    if (!pin)
        r.fail_at("pin", "missing; expected the MCU pin's name, such as \"PA0\" (every channel has a pin of its own)");
    if (pin->is_object()) {
        if (!pin->contains("name") || !pin->at("name").is_string()) {
            r.fail_at("pin.name",
                      "missing; expected the MCU pin's name, such as \"PA0\", beside the pin's own ratings");
        }
        overrides = *pin;
        overrides.erase("name");
        return pin->at("name");
    }
    if (pin->is_array() || (pin->is_string() && !pin->get<std::string>().empty())) return *pin;
    r.fail_at("pin", "expected the MCU pin's name, such as \"PA0\", got " + describe(*pin));
}

bool names_array(const Json& transistor, const PartsTable& table) {
    if (transistor.is_string()) return table.catalogue.find_array(transistor.get<std::string>()) != nullptr;
    return transistor.is_object() && transistor.contains("kind") && transistor.at("kind") == "array";
}

struct Entry {
    std::string name;
    std::vector<std::string> pins;
    std::optional<std::size_t> port;
    std::string package;
    bool own_supply = false;
    Spec spec;
};

std::optional<std::size_t> port_field(ObjectReader& r, const Board& board) {
    const auto port = r.text("port", 40);
    const auto& ports = board.mcu.ports;
    std::string names;
    for (const PortSpec& p : ports) names += (names.empty() ? "" : ", ") + p.name;
    if (!port) {
        if (ports.empty()) return std::nullopt;
        r.fail_at("port", "missing; expected one of the mcu's ports (" + names + ")");
    }
    if (ports.empty()) r.fail_at("port", "names a port, but the mcu lists none; give mcu.ports, or leave the port out");
    for (std::size_t k = 0; k < ports.size(); ++k) {
        if (ports[k].name == *port) return k;
    }
    r.fail_at("port", "expected one of the mcu's ports (" + names + "), got " + in_quotes(*port));
}

// One entry of `channels`: its board fields, and its spec read from the assembled document.
Entry read_entry(const Json& ch, const std::string& at, const BoardDocument& d, const PartsTable& table,
                 const Base& base, const Json* defaults, const Board& board) {
    if (!ch.is_object())
        fail(d.origin, at,
             "expected a channel such as { \"name\": \"K1 pump\", \"pin\": \"PA0\", ... }, got " + describe(ch));
    ObjectReader r(ch, d.origin, at);
    Entry e;
    std::size_t count = 1;
    if (r.has("count")) {
        const double v = *r.quantity("count", Unit::number);
        if (v != std::floor(v) || v < 1 || v > static_cast<double>(max_board_channels)) {
            r.fail_at("count", fmt::format("expected a whole number of channels from 1 to {}, got {}",
                                           max_board_channels, format_quantity(v, Unit::number, 6)));
        }
        count = static_cast<std::size_t>(v);
    }
    Json pin_overrides = Json::object();
    const Json pin = pin_field(r, pin_overrides);
    e.pins = pins_of(r, pin, count);
    e.name = r.text("name", 200).value_or(e.pins.front());
    e.port = port_field(r, board);
    // The channel's own fields over the defaults over the board's sections.
    SpecDocument doc;
    doc.doc = base.doc;
    doc.origin = d.origin;
    doc.origin.written_at = base.written_at;
    doc.origin.path_prefix = at + ".";
    Json own = ch;
    for (const char* key : {"pin", "port", "count", "package"}) own.erase(key);  // the board's keys, not the spec's
    if (defaults) {
        Json fill = *defaults;
        // An array channel clamps through its built-in diode: the defaults' clamp is for the
        // discrete channels, unless the channel names a clamp itself.
        const Json& transistor = own.contains("transistor") ? own["transistor"] : fill.value("transistor", Json());
        if (names_array(transistor, table) && !own.contains("clamp")) fill.erase("clamp");
        for (const char* key : {"schema", "name"}) {
            if (fill.contains(key))
                fail(d.origin, std::string("defaults.") + key,
                     "not a default: every channel has its own; give it in the channel");
        }
        overlay(doc.doc, fill, "", "defaults", doc.origin.written_at);
    }
    overlay(doc.doc, own, "", at, doc.origin.written_at);
    if (!pin_overrides.empty()) overlay(doc.doc["pin"], pin_overrides, "pin", at + ".pin", doc.origin.written_at);
    doc.doc["schema"] = spec_schema;
    doc.doc["name"] = e.name;
    e.own_supply = ch.contains("supply");
    e.spec = read_spec(doc, table);
    if (const auto package = r.text("package", 40)) {
        if (!e.spec.array()) {
            r.fail_at("package", "only a transistor-array channel has a package; this channel's transistor is " +
                                     std::string(transistor_kind_name(e.spec.transistor)) + " " +
                                     origin(e.spec.transistor).id);
        }
        e.package = *package;
    } else if (e.spec.array()) {
        e.package = e.name;  // its repeats on one package of their own
    }
    return e;
}

// Channels on one array package must be of one part and no more than it has.
void check_packages(const Board& board, const BoardDocument& d, const std::vector<std::string>& places) {
    std::map<std::string, std::pair<std::size_t, std::size_t>> seen;  // package -> (first channel, channels so far)
    for (std::size_t i = 0; i < board.channels.size(); ++i) {
        const BoardChannel& ch = board.channels[i];
        if (ch.package.empty()) continue;
        auto [it, added] = seen.emplace(ch.package, std::make_pair(i, std::size_t{0}));
        const BoardChannel& first = board.channels[it->second.first];
        const ArrayPart& part = *first.spec.array();
        if (origin(ch.spec.transistor).id != part.id) {
            fail(d.origin, places[i] + ".package",
                 fmt::format("{} is an {} (channel {}); this channel's transistor is {}", ch.package, part.id,
                             first.spec.name, origin(ch.spec.transistor).id));
        }
        if (++it->second.second > static_cast<std::size_t>(part.channels)) {
            fail(d.origin, places[i] + ".package",
                 fmt::format("{} would carry {} channels, but {} has {}; name another package for the rest", ch.package,
                             it->second.second, part.id, part.channels));
        }
    }
}

}  // namespace

void read_channels(ObjectReader& top, const BoardDocument& d, const PartsTable& table, const Base& base,
                   const Json* defaults, Board& board) {
    const Json* list = top.get("channels");
    if (!list)
        top.fail_at(
            "channels",
            "missing; expected a list of channels such as [ { \"name\": \"K1 pump\", \"pin\": \"PA0\", ... } ]");
    if (!list->is_array() || list->empty()) {
        top.fail_at("channels",
                    "expected a list of one or more channels such as [ { \"name\": \"K1 pump\", \"pin\": \"PA0\", ... "
                    "} ], got " +
                        (list->is_array() ? std::string("an empty list") : describe(*list)));
    }
    std::map<std::string, std::size_t> pin_owner;   // pin -> channel
    std::map<std::string, std::size_t> name_owner;  // a channel's or an entry's name -> entry
    std::vector<std::string> places;                // channel -> its entry's place in the file
    for (std::size_t k = 0; k < list->size(); ++k) {
        const std::string at = "channels[" + std::to_string(k) + "]";
        Entry e = read_entry((*list)[k], at, d, table, base, defaults, board);
        // Names pick channels (--channel, simultaneous.groups): each names one entry.
        std::vector<std::string> names{e.name};
        for (std::size_t r = 0; e.pins.size() > 1 && r < e.pins.size(); ++r)
            names.push_back(e.name + " #" + std::to_string(r + 1));
        for (const std::string& name : names) {
            if (const auto [it, added] = name_owner.emplace(name, k); !added && it->second != k) {
                fail(d.origin, at + ".name",
                     fmt::format(
                         "{} is already the name of a channel of channels[{}]; give every channel a name of its own",
                         in_quotes(name), it->second));
            }
        }
        if (board.channels.size() + e.pins.size() > max_board_channels) {
            fail(d.origin, at + ".count",
                 fmt::format("the board would have more than {} channels", max_board_channels));
        }
        for (std::size_t r = 0; r < e.pins.size(); ++r) {
            BoardChannel ch;
            ch.spec = e.spec;
            ch.spec.name = e.pins.size() > 1 ? e.name + " #" + std::to_string(r + 1) : e.name;
            ch.pin = e.pins[r];
            ch.port = e.port;
            ch.package = e.package;
            ch.entry = k;
            ch.entry_name = e.name;
            ch.repeat = r;
            ch.repeats = e.pins.size();
            ch.board_supply = !e.own_supply;
            if (const auto [it, added] = pin_owner.emplace(ch.pin, board.channels.size()); !added) {
                const BoardChannel& other = board.channels[it->second];
                const std::string field =
                    (*list)[k].at("pin").is_array() ? at + ".pin[" + std::to_string(r) + "]" : at + ".pin";
                fail(d.origin, field,
                     fmt::format("{} is already the pin of {} ({})", in_quotes(ch.pin), other.spec.name,
                                 places[it->second]));
            }
            board.channels.push_back(std::move(ch));
            places.push_back(at);
        }
    }
    check_packages(board, d, places);
}

}  // namespace coilfit::io::board_read
