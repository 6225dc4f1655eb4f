// Reading JSON with field paths in every message:
//   spec.json: coil.resistance: expected a resistance such as "400R", got "fourty"
// nlohmann/json stays in src/io; everything leaving here is a core struct or an InputError.
#pragma once

#include <map>
#include <optional>
#include <set>
#include <string>
#include <string_view>
#include <vector>

#include <nlohmann/json.hpp>

#include "coilfit/quantity.hpp"
#include "coilfit/text.hpp"

namespace coilfit::io {

using Json = nlohmann::ordered_json;

// Where a value came from: the file label for messages and, per field path, the command-line
// flag that overrode it (so that a bad flag is named as a flag).
struct Origin {
    std::string file;                          // "spec.json", "<stdin>", "parts/bipolar.json"
    std::map<std::string, std::string> flags;  // "supply.voltage" -> "--supply"
    // A spec made of flags alone: a missing field's message names the flag that gives it,
    // from flag_names (every field the command line can set -> its flag).
    bool flags_only = false;
    std::map<std::string, std::string> flag_names;
    // A document assembled from several places of one file (a board's channel: the board's
    // sections, its defaults and the channel's own fields): per field path, where the file wrote
    // it ("coil" -> "channels[2].coil"); a path under a listed one keeps its tail. A path not
    // listed is named under path_prefix ("channels[2].").
    std::map<std::string, std::string> written_at;
    std::string path_prefix;

    // Where the file wrote a field: the longest listed path that is the field or holds it, with
    // the rest of the field's path kept; else the field under path_prefix.
    [[nodiscard]] std::string file_path(const std::string& field) const {
        if (written_at.empty() && path_prefix.empty()) return field;
        for (std::size_t end = field.size(); end > 0; --end) {
            if (end < field.size() && field[end] != '.' && field[end] != '[') continue;
            const auto it = written_at.find(field.substr(0, end));
            if (it != written_at.end()) return it->second + field.substr(end);
        }
        if (field.empty() && !path_prefix.empty() && path_prefix.back() == '.') {
            return path_prefix.substr(0, path_prefix.size() - 1);
        }
        return path_prefix + field;
    }
};

[[noreturn]] void fail(const Origin& origin, const std::string& path, const std::string& what);

// Parses JSON text; rejects empty documents, documents over max_bytes, nested deeper than 64
// levels, with invalid UTF-8, numbers out of range or duplicate keys, and says where.
// `expected` names what the document should hold, for the message about an empty file.
[[nodiscard]] Json parse_json(std::string_view text, const std::string& file, std::size_t max_bytes,
                              std::string_view expected = "a JSON object");
// Reads a whole file (or standard input for "-"), at most max_bytes.
[[nodiscard]] std::string read_text(const std::string& path, std::size_t max_bytes);

// A JSON object read key by key. finish() rejects keys nobody asked for, naming the first.
class ObjectReader {
public:
    ObjectReader(const Json& j, const Origin& origin, std::string path);

    [[nodiscard]] bool has(const std::string& key) const;
    [[nodiscard]] const Json* get(const std::string& key);  // nullptr when absent or null
    [[nodiscard]] std::string path_of(const std::string& key) const;
    [[noreturn]] void fail_at(const std::string& key, const std::string& what) const;

    // A quantity (number in SI, or a string with unit); checks it is finite. The reader keeps
    // the unit per key, so that the range checks below word their messages in it.
    [[nodiscard]] std::optional<double> quantity(const std::string& key, Unit unit);
    [[nodiscard]] double required(const std::string& key, Unit unit);
    // A text in quotes: valid UTF-8, no control characters, at most max_len bytes.
    [[nodiscard]] std::optional<std::string> text(const std::string& key, std::size_t max_len = 200);
    [[nodiscard]] std::string required_text(const std::string& key, std::size_t max_len = 200);

    // Range checks, naming the field and what was expected:
    //   "expected a resistance greater than zero, got -3 Ω"
    //   "expected a ratio from 0 % to below 100 %, got 120 %"
    //   "expected a voltage from 100 mV to 1 kV, got 2 kV"
    double positive(const std::string& key, double value) const;
    double non_negative(const std::string& key, double value) const;
    double fraction(const std::string& key, double value, double lo, double hi, bool hi_inclusive) const;
    double within(const std::string& key, double value, double lo, double hi) const;

    void finish() const;
    [[nodiscard]] const Origin& origin() const { return origin_; }
    [[nodiscard]] const std::string& path() const { return path_; }

private:
    const Json& j_;
    const Origin& origin_;
    std::string path_;
    std::set<std::string> used_;
    std::map<std::string, Unit> units_;    // unit of each quantity read, for messages
    std::set<std::string> plain_numbers_;  // keys given as JSON numbers (no unit written)

    [[nodiscard]] std::string show(const std::string& key, double value) const;
    [[nodiscard]] std::string noun(const std::string& key) const;
};

// Describes a JSON value briefly for messages: "\"fourty\"", "true", "an object", ...
[[nodiscard]] std::string describe(const Json& j);

// Text made safe for a one-line message: the one escaping function (coilfit/text.hpp), so that
// bytes that are not UTF-8 and controls show as \xNN, invisible and bidi characters as \uNNNN;
// cut after max_chars characters with "...". Use it wherever input is echoed.
[[nodiscard]] inline std::string printable(std::string_view text, std::size_t max_chars = 40) {
    return escape_text(text, max_chars);
}
using coilfit::is_utf8;

}  // namespace coilfit::io
