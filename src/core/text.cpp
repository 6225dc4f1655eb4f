#include "coilfit/text.hpp"

#include <array>
#include <cstdint>

namespace coilfit {
namespace {

unsigned char byte_at(std::string_view s, std::size_t k) { return static_cast<unsigned char>(s[k]); }

// The code point of the well-formed sequence of n bytes at s[i].
char32_t decode(std::string_view s, std::size_t i, std::size_t n) {
    const unsigned char c = byte_at(s, i);
    if (n == 1) return c;
    char32_t cp = n == 2 ? (c & 0x1FU) : n == 3 ? (c & 0x0FU) : (c & 0x07U);
    for (std::size_t k = 1; k < n; ++k) cp = (cp << 6U) | (byte_at(s, i + k) & 0x3FU);
    return cp;
}

void append_hex(std::string& out, std::uint32_t v, int digits) {
    constexpr std::string_view hex = "0123456789abcdef";
    for (int d = digits - 1; d >= 0; --d) out += hex[(v >> (4U * static_cast<unsigned>(d))) & 0xFU];
}

struct Range {
    char32_t lo;
    char32_t hi;
};

// Unicode 15 general category Zs (other than U+0020), Cf, and the characters that render as
// blank (fillers, variation selectors), from the Unicode Character Database.
constexpr std::array<Range, 24> invisible_ranges{{
    {0x00A0, 0x00A0},   {0x00AD, 0x00AD},   {0x034F, 0x034F},   {0x061C, 0x061C},   {0x115F, 0x1160},
    {0x17B4, 0x17B5},   {0x180B, 0x180F},   {0x2000, 0x200F},   {0x2028, 0x202F},   {0x205F, 0x206F},
    {0x2800, 0x2800},   {0x3000, 0x3000},   {0x3164, 0x3164},   {0xFE00, 0xFE0F},   {0xFEFF, 0xFEFF},
    {0xFFA0, 0xFFA0},   {0xFFF9, 0xFFFB},   {0x110BD, 0x110BD}, {0x1BCA0, 0x1BCA3}, {0x1D173, 0x1D17A},
    {0xE0000, 0xE007F}, {0xE0100, 0xE01EF}, {0x0600, 0x0605},   {0x06DD, 0x06DD},
}};

template <typename Pred>
bool any_of_code_points(std::string_view text, Pred pred) {
    for (std::size_t i = 0; i < text.size();) {
        const std::size_t n = utf8_sequence_length(text, i);
        if (n == 0) {
            ++i;
            continue;
        }
        if (pred(decode(text, i, n))) return true;
        i += n;
    }
    return false;
}

}  // namespace

std::size_t utf8_sequence_length(std::string_view s, std::size_t i) {
    const unsigned char c = byte_at(s, i);
    if (c < 0x80) return 1;
    std::size_t n = 0;
    unsigned char lo = 0x80;
    unsigned char hi = 0xBF;
    if (c >= 0xC2 && c <= 0xDF)
        n = 2;
    else if (c >= 0xE0 && c <= 0xEF) {
        n = 3;
        if (c == 0xE0) lo = 0xA0;  // no overlong forms
        if (c == 0xED) hi = 0x9F;  // no UTF-16 surrogates
    } else if (c >= 0xF0 && c <= 0xF4) {
        n = 4;
        if (c == 0xF0) lo = 0x90;
        if (c == 0xF4) hi = 0x8F;  // at most U+10FFFF
    } else {
        return 0;
    }
    if (i + n > s.size()) return 0;
    if (byte_at(s, i + 1) < lo || byte_at(s, i + 1) > hi) return 0;
    for (std::size_t k = 2; k < n; ++k) {
        if (byte_at(s, i + k) < 0x80 || byte_at(s, i + k) > 0xBF) return 0;
    }
    return n;
}

bool is_utf8(std::string_view text) {
    for (std::size_t i = 0; i < text.size();) {
        const std::size_t n = utf8_sequence_length(text, i);
        if (n == 0) return false;
        i += n;
    }
    return true;
}

std::size_t count_characters(std::string_view text) {
    std::size_t count = 0;
    for (std::size_t i = 0; i < text.size(); ++count) {
        const std::size_t n = utf8_sequence_length(text, i);
        i += n == 0 ? 1 : n;
    }
    return count;
}

bool is_bidi_control(char32_t c) {
    // UAX #9, "Explicit Directional Embeddings/Overrides/Isolates" and the implicit marks.
    return c == 0x061C || c == 0x200E || c == 0x200F || (c >= 0x202A && c <= 0x202E) || (c >= 0x2066 && c <= 0x2069);
}

bool is_invisible(char32_t c) {
    for (const Range& r : invisible_ranges) {
        if (c >= r.lo && c <= r.hi) return true;
    }
    return false;
}

bool has_bidi_control(std::string_view text) { return any_of_code_points(text, is_bidi_control); }
bool has_invisible(std::string_view text) { return any_of_code_points(text, is_invisible); }
bool has_control(std::string_view text) {
    for (const char c : text) {
        if (static_cast<unsigned char>(c) < 0x20 || c == 0x7f) return true;
    }
    return any_of_code_points(text, [](char32_t c) { return c >= 0x80 && c <= 0x9F; });
}

std::string escape_text(std::string_view text, std::size_t max_chars, bool quote_marks) {
    std::string out;
    std::size_t shown = 0;
    for (std::size_t i = 0; i < text.size();) {
        if (shown++ >= max_chars) {
            out += "...";
            break;
        }
        const auto u = byte_at(text, i);
        const std::size_t n = utf8_sequence_length(text, i);
        if (n == 0 || u < 0x20 || u == 0x7f) {
            out += "\\x";
            append_hex(out, u, 2);
            ++i;
            continue;
        }
        const char32_t cp = decode(text, i, n);
        if ((cp >= 0x80 && cp <= 0x9F) || is_invisible(cp)) {
            // C1 controls can steer a terminal; invisible characters would pass for a space or nothing.
            out += cp > 0xFFFF ? "\\U" : "\\u";
            append_hex(out, static_cast<std::uint32_t>(cp), cp > 0xFFFF ? 8 : 4);
        } else if (quote_marks && (u == '"' || u == '\\')) {
            out += '\\';
            out += static_cast<char>(u);
        } else {
            out.append(text.substr(i, n));
        }
        i += n;
    }
    return out;
}

}  // namespace coilfit
