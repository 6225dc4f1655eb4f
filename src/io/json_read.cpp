#include "io/json_read.hpp"

#include <cmath>
#include <cstdio>
#include <fstream>
#include <iostream>
#include <iterator>
#include <sstream>

#include <fmt/format.h>

namespace coilfit::io {

void fail(const Origin& origin, const std::string& path, const std::string& what) {
    const auto flag = origin.flags.find(path);
    if (flag != origin.flags.end()) throw InputError(flag->second + ": " + what);
    std::string msg = origin.file;
    if (!path.empty()) msg += (msg.empty() ? "" : ": ") + path;
    throw InputError(msg + ": " + what);
}

namespace {

constexpr std::size_t max_depth = 64;

// Checks nesting depth before parsing: a recursive parser must not meet 100 000 brackets.
void check_depth(std::string_view text, const std::string& file) {
    std::size_t depth = 0;
    bool in_string = false;
    bool escaped = false;
    for (const char c : text) {
        if (in_string) {
            if (escaped) escaped = false;
            else if (c == '\\') escaped = true;
            else if (c == '"') in_string = false;
            continue;
        }
        if (c == '"') in_string = true;
        else if (c == '[' || c == '{') {
            if (++depth > max_depth) {
                throw InputError(file + ": nested deeper than " + std::to_string(max_depth) + " levels");
            }
        } else if ((c == ']' || c == '}') && depth > 0) --depth;
    }
}

std::string shorten(std::string s, std::size_t n) {
    if (s.size() > n) s = s.substr(0, n) + "...";
    for (auto& c : s) {
        const auto u = static_cast<unsigned char>(c);
        if (u < 0x20 || u == 0x7f || u >= 0x80) c = '?';
    }
    return s;
}

}  // namespace

std::string read_text(const std::string& path, std::size_t max_bytes) {
    std::string data;
    auto read_stream = [&](std::istream& in, const std::string& label) {
        std::array<char, 65536> buf{};
        while (in) {
            in.read(buf.data(), static_cast<std::streamsize>(buf.size()));
            data.append(buf.data(), static_cast<std::size_t>(in.gcount()));
            if (data.size() > max_bytes) {
                throw InputError(fmt::format("{}: larger than {} bytes; this is not a coilfit file", label, max_bytes));
            }
        }
    };
    if (path == "-") {
        read_stream(std::cin, "<stdin>");
        return data;
    }
    std::ifstream in(path, std::ios::binary);
    if (!in) throw InputError(path + ": cannot open the file");
    read_stream(in, path);
    if (in.bad()) throw InputError(path + ": cannot read the file");
    return data;
}

Json parse_json(std::string_view text, const std::string& file, std::size_t max_bytes) {
    if (text.size() > max_bytes) {
        throw InputError(fmt::format("{}: larger than {} bytes; this is not a coilfit file", file, max_bytes));
    }
    std::size_t first = 0;
    while (first < text.size() && std::isspace(static_cast<unsigned char>(text[first]))) ++first;
    if (first == text.size()) throw InputError(file + ": the file is empty; expected a JSON object");
    check_depth(text, file);
    try {
        // Duplicate keys: nlohmann keeps the last silently; detect them with a callback.
        std::vector<std::set<std::string>> seen;
        std::string duplicate;
        const auto cb = [&](int depth, nlohmann::json::parse_event_t event, Json& parsed) {
            const auto d = static_cast<std::size_t>(depth);
            if (event == nlohmann::json::parse_event_t::object_start) {
                // Keys of this object arrive one level deeper than its start.
                if (seen.size() <= d + 1) seen.resize(d + 2);
                seen[d + 1].clear();
            } else if (event == nlohmann::json::parse_event_t::key) {
                if (seen.size() <= d) seen.resize(d + 1);
                const auto& key = parsed.get_ref<const std::string&>();
                if (!seen[d].insert(key).second && duplicate.empty()) duplicate = key;
            }
            return true;
        };
        Json j = Json::parse(text.begin(), text.end(), cb);
        if (!duplicate.empty()) throw InputError(file + ": key \"" + shorten(duplicate, 40) + "\" appears twice in one object");
        return j;
    } catch (const nlohmann::json::parse_error& e) {
        // e.byte is 1-based; turn it into line:column.
        std::size_t line = 1;
        std::size_t col = 1;
        const std::size_t upto = std::min<std::size_t>(e.byte > 0 ? e.byte - 1 : 0, text.size());
        for (std::size_t i = 0; i < upto; ++i) {
            if (text[i] == '\n') {
                ++line;
                col = 1;
            } else {
                ++col;
            }
        }
        std::string what = e.what();
        // "[json.exception.parse_error.101] parse error at line 1, column 2: syntax error while
        // parsing value - invalid literal; last read: 'x'" -> keep the part after "- ".
        const auto dash = what.find(" - ");
        std::string reason = dash == std::string::npos ? std::string("invalid JSON") : what.substr(dash + 3);
        const auto last = reason.find("; last read");
        if (last != std::string::npos) reason = reason.substr(0, last);
        throw InputError(fmt::format("{}:{}:{}: not valid JSON: {}", file, line, col, shorten(reason, 80)));
    }
}

std::string describe(const Json& j) {
    switch (j.type()) {
    case Json::value_t::string: {
        const auto& s = j.get_ref<const Json::string_t&>();
        std::string out = "\"";
        std::size_t n = 0;
        for (const char c : s) {
            if (++n > 40) {
                out += "...";
                break;
            }
            const auto u = static_cast<unsigned char>(c);
            out += (u < 0x20 || u == 0x7f) ? '?' : c;
        }
        return out + "\"";
    }
    case Json::value_t::boolean: return j.get<bool>() ? "true" : "false";
    case Json::value_t::null: return "null";
    case Json::value_t::object: return "an object";
    case Json::value_t::array: return "a list";
    default: return shorten(j.dump(), 40);
    }
}

ObjectReader::ObjectReader(const Json& j, const Origin& origin, std::string path)
    : j_(j), origin_(origin), path_(std::move(path)) {
    if (!j_.is_object()) {
        io::fail(origin_, path_.empty() ? std::string() : path_,
                 "expected a JSON object { ... }, got " + describe(j_));
    }
}

bool ObjectReader::has(const std::string& key) const { return j_.contains(key) && !j_.at(key).is_null(); }

const Json* ObjectReader::get(const std::string& key) {
    used_.insert(key);
    const auto it = j_.find(key);
    if (it == j_.end() || it->is_null()) return nullptr;
    return &*it;
}

std::string ObjectReader::path_of(const std::string& key) const {
    if (path_.empty()) return key;
    if (!key.empty() && key.front() == '[') return path_ + key;
    return path_ + "." + key;
}

void ObjectReader::fail_at(const std::string& key, const std::string& what) const {
    io::fail(origin_, path_of(key), what);
}

std::optional<double> ObjectReader::quantity(const std::string& key, Unit unit) {
    const Json* v = get(key);
    if (!v) return std::nullopt;
    double value = 0;
    if (v->is_number()) {
        value = v->get<double>();
    } else if (v->is_string()) {
        try {
            value = parse_quantity(v->get_ref<const Json::string_t&>(), unit);
        } catch (const InputError& e) {
            fail_at(key, e.what());
        }
    } else {
        fail_at(key, fmt::format("expected {} such as \"{}\", got {}", unit_noun(unit), unit_example(unit), describe(*v)));
    }
    if (!std::isfinite(value)) fail_at(key, fmt::format("expected {}, got a number out of range", unit_noun(unit)));
    return value;
}

double ObjectReader::required(const std::string& key, Unit unit) {
    auto v = quantity(key, unit);
    if (!v) fail_at(key, fmt::format("missing; expected {} such as \"{}\"", unit_noun(unit), unit_example(unit)));
    return *v;
}

std::optional<std::string> ObjectReader::text(const std::string& key, std::size_t max_len) {
    const Json* v = get(key);
    if (!v) return std::nullopt;
    if (!v->is_string()) fail_at(key, "expected a text in quotes, got " + describe(*v));
    const auto& s = v->get_ref<const Json::string_t&>();
    if (s.size() > max_len) fail_at(key, fmt::format("longer than {} characters", max_len));
    return s;
}

std::string ObjectReader::required_text(const std::string& key, std::size_t max_len) {
    auto v = text(key, max_len);
    if (!v) fail_at(key, "missing");
    return *v;
}

double ObjectReader::positive(const std::string& key, double value) const {
    if (!(value > 0)) fail_at(key, "must be greater than zero, got " + fmt::format("{:g}", value));
    return value;
}

double ObjectReader::non_negative(const std::string& key, double value) const {
    if (value < 0) fail_at(key, "must not be negative, got " + fmt::format("{:g}", value));
    return value;
}

double ObjectReader::fraction(const std::string& key, double value, double lo, double hi, bool hi_inclusive) const {
    const bool ok = value >= lo && (hi_inclusive ? value <= hi : value < hi);
    if (!ok) {
        fail_at(key, fmt::format("must be from {:g} % to {}{:g} %, got {:g} %", lo * 100,
                                 hi_inclusive ? "" : "below ", hi * 100, value * 100));
    }
    return value;
}

double ObjectReader::within(const std::string& key, double value, double lo, double hi) const {
    if (value < lo || value > hi) fail_at(key, fmt::format("must be from {:g} to {:g}, got {:g}", lo, hi, value));
    return value;
}

void ObjectReader::finish() const {
    for (const auto& [key, value] : j_.items()) {
        if (used_.count(key) == 0) {
            std::string known;
            for (const auto& k : used_) known += (known.empty() ? "" : ", ") + k;
            io::fail(origin_, path_of(key), "unknown key (expected one of: " + known + ")");
        }
    }
}

}  // namespace coilfit::io
