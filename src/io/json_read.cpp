#include "io/json_read.hpp"

#include <array>
#include <cerrno>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <iostream>
#include <iterator>
#include <sstream>

#include <fmt/format.h>

namespace coilfit::io {

void fail(const Origin& origin, const std::string& field, const std::string& what) {
    const auto flag = origin.flags.find(field);
    if (flag != origin.flags.end()) throw InputError(flag->second + ": " + what);
    const std::string path = origin.file_path(field);
    std::string msg = origin.file;
    if (!path.empty()) msg += (msg.empty() ? "" : ": ") + path;
    if (origin.flags_only && what.rfind("missing", 0) == 0) {
        if (const auto name = origin.flag_names.find(field); name != origin.flag_names.end()) {
            throw InputError(msg + ": " + what + " (give " + name->second + ")");
        }
    }
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
            if (escaped)
                escaped = false;
            else if (c == '\\')
                escaped = true;
            else if (c == '"')
                in_string = false;
            continue;
        }
        if (c == '"')
            in_string = true;
        else if (c == '[' || c == '{') {
            if (++depth > max_depth) {
                throw InputError(file + ": nested deeper than " + std::to_string(max_depth) + " levels");
            }
        } else if ((c == ']' || c == '}') && depth > 0)
            --depth;
    }
}

// 1-based line and column of a byte offset.
std::pair<std::size_t, std::size_t> line_column(std::string_view text, std::size_t offset) {
    std::size_t line = 1;
    std::size_t col = 1;
    const std::size_t upto = std::min(offset, text.size());
    for (std::size_t i = 0; i < upto; ++i) {
        if (text[i] == '\n') {
            ++line;
            col = 1;
        } else {
            ++col;
        }
    }
    return {line, col};
}

// Tracks where the parser is (object keys, list positions) to name a duplicate key's path.
class KeyTracker {
public:
    void start(bool object) { frames_.push_back(Frame{object, {}, {}, 0}); }
    void end() {
        if (!frames_.empty()) frames_.pop_back();
        next();
    }
    void value() { next(); }
    void key(const std::string& k) {
        if (frames_.empty()) return;
        Frame& f = frames_.back();
        f.key = k;
        if (!f.keys.insert(k).second && duplicate_.empty()) duplicate_ = path();
    }
    [[nodiscard]] const std::string& duplicate() const { return duplicate_; }

private:
    struct Frame {
        bool object = true;
        std::set<std::string> keys;
        std::string key;
        std::size_t index = 0;
    };
    void next() {
        if (!frames_.empty() && !frames_.back().object) ++frames_.back().index;
    }
    [[nodiscard]] std::string path() const {
        std::string p;
        for (const Frame& f : frames_) {
            if (f.object)
                p += (p.empty() ? "" : ".") + printable(f.key, 40);
            else
                p += "[" + std::to_string(f.index) + "]";
        }
        return p;
    }
    std::vector<Frame> frames_;
    std::string duplicate_;
};

// A plain number for a message: "10", "0.1", "1e-07".
std::string plain(double v) { return fmt::format("{:g}", v); }

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
    const std::string shown = printable(path, 4096);
    if (std::error_code ec; std::filesystem::is_directory(path, ec)) throw InputError(shown + ": a folder, not a file");
    errno = 0;
    std::ifstream in(path, std::ios::binary);
    if (!in) {
        const int err = errno;
        if (err == EACCES) throw InputError(shown + ": cannot open the file (permission denied)");
        if (err == ELOOP) throw InputError(shown + ": cannot open the file (a symbolic link loop)");
        throw InputError(shown + ": cannot open the file");
    }
    read_stream(in, shown);
    if (in.bad()) throw InputError(shown + ": cannot read the file");
    return data;
}

Json parse_json(std::string_view text, const std::string& file, std::size_t max_bytes, std::string_view expected) {
    if (text.size() > max_bytes) {
        throw InputError(fmt::format("{}: larger than {} bytes; this is not a coilfit file", file, max_bytes));
    }
    std::size_t first = 0;
    while (first < text.size() && std::isspace(static_cast<unsigned char>(text[first]))) ++first;
    if (first == text.size()) throw InputError(fmt::format("{}: the file is empty; expected {}", file, expected));
    check_depth(text, file);
    // Duplicate keys: nlohmann keeps the last silently; detect them with a callback.
    KeyTracker keys;
    const auto cb = [&keys](int, nlohmann::json::parse_event_t event, Json& parsed) {
        using E = nlohmann::json::parse_event_t;
        switch (event) {
            case E::object_start:
                keys.start(true);
                break;
            case E::array_start:
                keys.start(false);
                break;
            case E::object_end:
            case E::array_end:
                keys.end();
                break;
            case E::key:
                keys.key(parsed.get_ref<const std::string&>());
                break;
            case E::value:
                keys.value();
                break;
        }
        return true;
    };
    Json j;
    try {
        j = Json::parse(text.begin(), text.end(), cb);
    } catch (const nlohmann::json::parse_error& e) {
        // e.byte is 1-based; turn it into line:column.
        const auto [line, col] = line_column(text, e.byte > 0 ? e.byte - 1 : 0);
        std::string what = e.what();
        // "[json.exception.parse_error.101] parse error at line 1, column 2: syntax error while
        // parsing value - invalid literal; last read: 'x'" -> keep the part after "- ".
        const auto dash = what.find(" - ");
        std::string reason = dash == std::string::npos ? std::string("invalid JSON") : what.substr(dash + 3);
        const auto last = reason.find("; last read");
        if (last != std::string::npos) reason = reason.substr(0, last);
        throw InputError(fmt::format("{}:{}:{}: not valid JSON: {}", file, line, col, printable(reason, 80)));
    } catch (const nlohmann::json::exception& e) {
        // A number too large for a double: "number overflow parsing '1e400'". Find it for the
        // line and column.
        const std::string what = e.what();
        const auto open = what.find('\'');
        const auto close = what.rfind('\'');
        if (open != std::string::npos && close > open) {
            const std::string number = what.substr(open + 1, close - open - 1);
            const auto at = text.find(number);
            const auto [line, col] = line_column(text, at == std::string_view::npos ? 0 : at);
            throw InputError(fmt::format("{}:{}:{}: not valid JSON: the number {} is out of range", file, line, col,
                                         printable(number, 40)));
        }
        throw InputError(fmt::format("{}: not valid JSON", file));
    }
    if (!keys.duplicate().empty()) {
        throw InputError(fmt::format("{}: {}: the key appears twice in one object", file, keys.duplicate()));
    }
    return j;
}

std::string describe(const Json& j) {
    switch (j.type()) {
        case Json::value_t::string:
            return "\"" + printable(j.get_ref<const Json::string_t&>(), 40) + "\"";
        case Json::value_t::boolean:
            return j.get<bool>() ? "true" : "false";
        case Json::value_t::null:
            return "null";
        case Json::value_t::object:
            return "an object";
        case Json::value_t::array:
            return "a list";
        default:
            return printable(j.dump(), 40);
    }
}

ObjectReader::ObjectReader(const Json& j, const Origin& origin, std::string path)
    : j_(j), origin_(origin), path_(std::move(path)) {
    if (!j_.is_object()) {
        io::fail(origin_, path_.empty() ? std::string() : path_, "expected a JSON object { ... }, got " + describe(j_));
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
    units_[key] = unit;
    if (!v) return std::nullopt;
    double value = 0;
    if (v->is_number()) {
        value = v->get<double>();
        plain_numbers_.insert(key);
    } else if (v->is_string()) {
        const auto& text = v->get_ref<const Json::string_t&>();
        if (unit == Unit::ratio && text.find('%') == std::string::npos) plain_numbers_.insert(key);
        try {
            value = parse_quantity(text, unit);
        } catch (const InputError& e) {
            fail_at(key, e.what());
        }
    } else {
        fail_at(key,
                fmt::format("expected {} such as \"{}\", got {}", unit_noun(unit), unit_example(unit), describe(*v)));
    }
    if (!std::isfinite(value)) fail_at(key, fmt::format("expected {}, got a number out of range", unit_noun(unit)));
    if (value == 0) value = 0.0;  // no "-0" in reports
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
    // Texts reach terminals and JSON reports: only UTF-8 (a flag's value is not checked by the
    // JSON parser), no control characters, no bidi controls (they make a name read as another);
    // the length is in characters, not bytes.
    if (!is_utf8(s)) fail_at(key, "expected UTF-8 text, got \"" + printable(s) + "\"");
    const std::size_t chars = count_characters(s);
    if (chars > max_len) fail_at(key, fmt::format("expected a text of at most {} characters, got {}", max_len, chars));
    if (has_bidi_control(s))
        fail_at(key, "expected a text without bidirectional controls, got \"" + printable(s) + "\"");
    if (has_control(s)) fail_at(key, "expected a text without control characters, got \"" + printable(s) + "\"");
    return s;
}

std::string ObjectReader::required_text(const std::string& key, std::size_t max_len) {
    auto v = text(key, max_len);
    if (!v) fail_at(key, "missing; expected a text in quotes");
    return *v;
}

std::string ObjectReader::noun(const std::string& key) const {
    const auto it = units_.find(key);
    return std::string(unit_noun(it == units_.end() ? Unit::number : it->second));
}

std::string ObjectReader::show(const std::string& key, double value) const {
    const auto it = units_.find(key);
    const Unit unit = it == units_.end() ? Unit::number : it->second;
    return format_quantity(value, unit, 6);
}

double ObjectReader::positive(const std::string& key, double value) const {
    if (!(value > 0)) fail_at(key, fmt::format("expected {} greater than zero, got {}", noun(key), show(key, value)));
    return value;
}

double ObjectReader::non_negative(const std::string& key, double value) const {
    if (!(value >= 0)) fail_at(key, fmt::format("expected {} of zero or more, got {}", noun(key), show(key, value)));
    return value;
}

double ObjectReader::fraction(const std::string& key, double value, double lo, double hi, bool hi_inclusive) const {
    const bool ok = value >= lo && (hi_inclusive ? value <= hi : value < hi);
    if (!ok) {
        // 10 written as a plain number means 1000 %: say how to write a percentage.
        const bool hint = value > 1 && plain_numbers_.count(key) > 0;
        fail_at(key, fmt::format("expected {} from {} to {}{}, got {}{}", noun(key),
                                 format_quantity(lo, Unit::ratio, 6), hi_inclusive ? "" : "below ",
                                 format_quantity(hi, Unit::ratio, 6), format_quantity(value, Unit::ratio, 6),
                                 hint ? fmt::format(" (a plain number is a fraction: write \"{}%\" or {})",
                                                    plain(value), plain(value / 100))
                                      : std::string()));
    }
    return value;
}

double ObjectReader::within(const std::string& key, double value, double lo, double hi) const {
    if (!(value >= lo && value <= hi)) {
        fail_at(key, fmt::format("expected {} from {} to {}, got {}", noun(key), show(key, lo), show(key, hi),
                                 show(key, value)));
    }
    return value;
}

void ObjectReader::finish() const {
    for (const auto& [key, value] : j_.items()) {
        if (used_.count(key) == 0) {
            std::string known;
            for (const auto& k : used_) known += (known.empty() ? "" : ", ") + k;
            io::fail(origin_, path_of(printable(key, 40)), "unknown key (expected one of: " + known + ")");
        }
    }
}

}  // namespace coilfit::io
