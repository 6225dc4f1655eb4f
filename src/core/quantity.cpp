#include "coilfit/quantity.hpp"

#include "coilfit/text.hpp"

#include <algorithm>
#include <array>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <optional>
#include <string>

namespace coilfit {
namespace {

struct UnitInfo {
    std::string_view noun;
    std::string_view symbol;
    std::string_view key_suffix;
    std::string_view example;
};

UnitInfo info(Unit unit) {
    switch (unit) {
        case Unit::ratio:
            return {"a ratio", "", "", "10%"};
        case Unit::number:
            return {"a number", "", "", "10"};
        case Unit::volt:
            return {"a voltage", "V", "_v", "12V"};
        case Unit::ampere:
            return {"a current", "A", "_a", "25mA"};
        case Unit::ohm:
            return {"a resistance", "Ω", "_ohm", "400R"};
        case Unit::watt:
            return {"a power", "W", "_w", "360mW"};
        case Unit::henry:
            return {"an inductance", "H", "_h", "0.9H"};
        case Unit::second:
            return {"a time", "s", "_s", "10ms"};
        case Unit::hertz:
            return {"a frequency", "Hz", "_hz", "1Hz"};
        case Unit::joule:
            return {"an energy", "J", "_j", "5mJ"};
        case Unit::coulomb:
            return {"a charge", "C", "_coulomb", "1mC"};
        case Unit::celsius:
            return {"a temperature", "°C", "_c", "50C"};
        case Unit::kelvin:
            return {"a temperature difference", "K", "_k", "25K"};
        case Unit::kelvin_per_watt:
            return {"a thermal resistance", "K/W", "_k_per_w", "200K/W"};
        case Unit::per_kelvin:
            return {"a temperature coefficient", "/K", "_per_k", "0.6%/K"};
        case Unit::volt_per_kelvin:
            return {"a voltage temperature coefficient", "V/K", "_v_per_k", "-4mV/K"};
        case Unit::farad:
            return {"a capacitance", "F", "_f", "100nF"};
    }
    return {"a value", "", "", "1"};
}

// Unit symbols people type, longest first so that "K/W" wins over "K".
struct Symbol {
    std::string_view text;
    Unit unit;
};
constexpr std::array symbols{
    Symbol{"°C/W", Unit::kelvin_per_watt},
    Symbol{"K/W", Unit::kelvin_per_watt},
    Symbol{"V/°C", Unit::volt_per_kelvin},
    Symbol{"V/K", Unit::volt_per_kelvin},
    Symbol{"V/C", Unit::volt_per_kelvin},
    Symbol{"/°C", Unit::per_kelvin},
    Symbol{"/K", Unit::per_kelvin},
    Symbol{"/C", Unit::per_kelvin},
    Symbol{"C/W", Unit::kelvin_per_watt},
    Symbol{"ohms", Unit::ohm},
    Symbol{"ohm", Unit::ohm},
    Symbol{"Ohm", Unit::ohm},
    Symbol{"\xCE\xA9", Unit::ohm},
    Symbol{"\xE2\x84\xA6", Unit::ohm},
    Symbol{"Hz", Unit::hertz},
    Symbol{"°C", Unit::celsius},
    Symbol{"V", Unit::volt},
    Symbol{"A", Unit::ampere},
    Symbol{"R", Unit::ohm},
    Symbol{"W", Unit::watt},
    Symbol{"H", Unit::henry},
    Symbol{"s", Unit::second},
    Symbol{"J", Unit::joule},
    Symbol{"C", Unit::celsius},
    Symbol{"K", Unit::kelvin},
};

std::optional<Unit> match_symbol(std::string_view text) {
    for (const auto& s : symbols) {
        if (text == s.text) return s.unit;
    }
    return std::nullopt;
}

struct Prefix {
    std::string_view text;
    double factor;
};
constexpr std::array prefixes{
    Prefix{"p", 1e-12}, Prefix{"n", 1e-9}, Prefix{"u", 1e-6}, Prefix{"\xC2\xB5", 1e-6}, Prefix{"\xCE\xBC", 1e-6},
    Prefix{"m", 1e-3},  Prefix{"k", 1e3},  Prefix{"M", 1e6},  Prefix{"G", 1e9},
};

std::string_view trim(std::string_view s) {
    const auto not_space = [](char c) { return c != ' ' && c != '\t' && c != '\n' && c != '\r'; };
    while (!s.empty() && !not_space(s.front())) s.remove_prefix(1);
    while (!s.empty() && !not_space(s.back())) s.remove_suffix(1);
    return s;
}

bool is_digit(char c) { return c >= '0' && c <= '9'; }

// Shows the offending text in a message, escaped as every message escapes input
// (coilfit/text.hpp): binary garbage, controls and invisible characters never reach a terminal raw.
std::string quoted(std::string_view text) { return "\"" + escape_text(text, 40, true) + "\""; }

[[noreturn]] void fail(Unit expected, std::string_view text, std::string_view why = {}) {
    std::string msg = "expected ";
    msg += info(expected).noun;
    msg += " such as \"";
    msg += info(expected).example;
    msg += "\", got ";
    msg += text.empty() ? std::string("an empty string") : quoted(text);
    if (!why.empty()) {
        msg += " (";
        msg += why;
        msg += ")";
    }
    throw InputError(msg);
}

// IEC 60062 resistance code: digits, one multiplier letter in place of the decimal point,
// digits ("4k7", "2R2", "R47", "1M0"). Returns nullopt when the text is not of that form.
std::optional<double> parse_rkm(std::string_view s) {
    std::size_t letter = std::string_view::npos;
    double factor = 1.0;
    for (std::size_t i = 0; i < s.size(); ++i) {
        if (is_digit(s[i])) continue;
        if (letter != std::string_view::npos) return std::nullopt;
        switch (s[i]) {
            case 'R':
            case 'r':
                factor = 1.0;
                break;
            case 'k':
            case 'K':
                factor = 1e3;
                break;
            case 'M':
                factor = 1e6;
                break;
            case 'G':
                factor = 1e9;
                break;
            case 'm':
                factor = 1e-3;
                break;
            default:
                return std::nullopt;
        }
        letter = i;
    }
    if (letter == std::string_view::npos || letter + 1 >= s.size()) return std::nullopt;
    const std::string whole(s.substr(0, letter).empty() ? std::string_view("0") : s.substr(0, letter));
    const std::string number = whole + "." + std::string(s.substr(letter + 1));
    double value = 0.0;
    const auto [ptr, ec] = std::from_chars(number.data(), number.data() + number.size(), value);
    if (ec != std::errc() || ptr != number.data() + number.size()) return std::nullopt;
    return value * factor;
}

}  // namespace

namespace {

// Rounds to `significant` digits and prints without trailing zeros.
std::string plain_number(double v, int significant) {
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.*g", significant, v);
    std::string s(buf);
    if (s.find('e') != std::string::npos && std::abs(v) >= 1 && std::abs(v) < 1e15) {
        // %g chose exponent form (e.g. 1e+03): print fixed instead (far outside the
        // prefixes, keep the exponent).
        std::snprintf(buf, sizeof buf, "%.0f", v);
        s = buf;
    }
    return s;
}

}  // namespace

std::string format_quantity(double value, Unit unit, int significant) {
    if (!std::isfinite(value)) return "n/a";
    significant = std::clamp(significant, 1, 12);
    switch (unit) {
        case Unit::ratio:
            // 100 x a value near the largest double overflows: print the fraction then.
            if (!std::isfinite(value * 100.0)) return plain_number(value, significant);
            return plain_number(value * 100.0, significant) + " %";
        case Unit::number:
            return plain_number(value, significant);
        case Unit::celsius: {
            if (std::abs(value) >= 1e15) return plain_number(value, significant) + " °C";
            char buf[64];
            std::snprintf(buf, sizeof buf, "%.1f", value);
            return std::string(buf) + " °C";
        }
        case Unit::kelvin:
            return plain_number(value, significant) + " K";
        case Unit::kelvin_per_watt:
            return plain_number(value, significant) + " K/W";
        case Unit::per_kelvin:
            if (!std::isfinite(value * 100.0)) return plain_number(value, significant) + " /K";
            return plain_number(value * 100.0, significant) + " %/K";
        default:
            break;
    }
    // A frequency below 1 Hz reads plainly ("0.1 Hz"): "100 mHz" is misread as megahertz.
    if (unit == Unit::hertz && std::abs(value) >= 1e-3 && std::abs(value) < 1.0) {
        return plain_number(value, significant) + " Hz";
    }
    static constexpr std::array<std::pair<double, std::string_view>, 8> steps{
        {{1e9, "G"}, {1e6, "M"}, {1e3, "k"}, {1.0, ""}, {1e-3, "m"}, {1e-6, "µ"}, {1e-9, "n"}, {1e-12, "p"}}};
    const double mag = std::abs(value);
    std::size_t pick = 3;  // no prefix for zero, nor far outside the prefixes (1e+20 V)
    if (mag > 0 && mag < 1e15 && mag >= 1e-15) {
        pick = steps.size() - 1;
        for (std::size_t i = 0; i < steps.size(); ++i) {
            // Round first, so that 999.96 becomes 1 k rather than 1000.
            const double scaled = mag / steps[i].first;
            const double p10 = std::pow(10.0, significant - 1 - static_cast<int>(std::floor(std::log10(scaled))));
            if (std::round(scaled * p10) / p10 >= 1.0) {
                pick = i;
                break;
            }
        }
    }
    const double scaled = value / steps[pick].first;
    return plain_number(scaled, significant) + " " + std::string(steps[pick].second) + std::string(info(unit).symbol);
}

std::string_view unit_noun(Unit unit) { return info(unit).noun; }
std::string_view unit_symbol(Unit unit) { return info(unit).symbol; }
std::string_view unit_key_suffix(Unit unit) { return info(unit).key_suffix; }
std::string_view unit_example(Unit unit) { return info(unit).example; }

namespace {

// The number at the start of s: optional sign, digits with at most one point, optional
// exponent. Sets `end` to the first character after it.
double read_number(std::string_view s, std::string_view text, Unit expected, std::size_t& end) {
    std::size_t i = 0;
    bool negative = false;
    if (s[i] == '+' || s[i] == '-') {
        negative = s[i] == '-';
        ++i;
    }
    const std::size_t number_start = i;
    std::size_t digits = 0;
    bool point = false;
    while (i < s.size() && (is_digit(s[i]) || (s[i] == '.' && !point))) {
        if (s[i] == '.')
            point = true;
        else
            ++digits;
        ++i;
    }
    if (digits == 0) fail(expected, text);
    if (i < s.size() && (s[i] == 'e' || s[i] == 'E')) {
        std::size_t j = i + 1;
        if (j < s.size() && (s[j] == '+' || s[j] == '-')) ++j;
        if (j < s.size() && is_digit(s[j])) {
            while (j < s.size() && is_digit(s[j])) ++j;
            i = j;
        }
    }
    double value = 0.0;
    const std::string number(s.substr(number_start, i - number_start));
    const auto [ptr, ec] = std::from_chars(number.data(), number.data() + number.size(), value);
    if (ec != std::errc() || ptr != number.data() + number.size()) fail(expected, text, "out of range");
    end = i;
    return negative ? -value : value;
}

struct Suffix {
    double factor = 1.0;
    std::optional<Unit> unit;  // the unit the suffix names, if it names one
};

// What follows the number: "%", "%/K", a unit symbol, an SI prefix with or without a symbol.
Suffix read_suffix(std::string_view rest, std::string_view text, Unit expected) {
    Suffix out;
    if (rest.empty()) return out;
    if (rest == "%") {
        if (expected != Unit::ratio) fail(expected, text, "a percentage");
        return {0.01, Unit::ratio};
    }
    if (rest == "%/K" || rest == "%/°C" || rest == "%/C") return {0.01, Unit::per_kelvin};
    if (expected == Unit::ohm && rest.front() == 'K' &&
        (rest.size() == 1 || match_symbol(rest.substr(1)) == Unit::ohm)) {
        // "33K" and "2.2KΩ" for kilo-ohms are common on resistor labels.
        out.factor = 1e3;
        if (rest.size() > 1) out.unit = Unit::ohm;
        return out;
    }
    if (const auto plain = match_symbol(rest)) return {1.0, plain};
    for (const auto& p : prefixes) {
        if (rest.substr(0, p.text.size()) != p.text) continue;
        const std::string_view after = rest.substr(p.text.size());
        if (after.empty()) return {p.factor, std::nullopt};
        if (const auto u = match_symbol(after)) return {p.factor, u};
    }
    fail(expected, text);
}

}  // namespace

double parse_quantity(std::string_view text, Unit expected) {
    const std::string_view s = trim(text);
    if (s.empty()) fail(expected, text);
    if (count_characters(s) > 64) {
        throw InputError("expected " + std::string(info(expected).noun) + " such as \"" +
                         std::string(info(expected).example) + "\", got a text of " +
                         std::to_string(count_characters(s)) + " characters");
    }

    if (expected == Unit::ohm) {
        if (const auto rkm = parse_rkm(s)) {
            if (!std::isfinite(*rkm)) fail(expected, text, "out of range");
            return *rkm;
        }
    }

    std::size_t end = 0;
    const double value = read_number(s, text, expected, end);
    const std::string_view rest = trim(s.substr(end));
    const Suffix suffix = read_suffix(rest, text, expected);
    std::optional<Unit> found = suffix.unit;
    // "C" is a coulomb where a charge is expected ("1.5nC"), a temperature elsewhere.
    if (found == Unit::celsius && expected == Unit::coulomb && (rest.back() == 'C') &&
        rest.find("°") == std::string_view::npos) {
        found = Unit::coulomb;
    }
    if (found && *found != expected) {
        fail(expected, text, info(*found).noun);
    }
    if (suffix.factor != 1.0 &&
        (expected == Unit::celsius || expected == Unit::kelvin || expected == Unit::number ||
         (expected == Unit::ratio && !found) || (expected == Unit::per_kelvin && found != Unit::per_kelvin))) {
        fail(expected, text, "no prefix here");
    }
    const double result = value * suffix.factor;
    if (!std::isfinite(result)) fail(expected, text, "out of range");
    return result == 0 ? 0.0 : result;  // "-0" reads as 0
}

}  // namespace coilfit
