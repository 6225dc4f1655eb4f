#include "io/format.hpp"

#include <cctype>
#include <sstream>
#include <vector>

namespace coilfit::io {

namespace {

// Decodes one UTF-8 sequence at s[i] (input is valid UTF-8: readers reject the rest); returns its
// code point and advances i. A stray byte counts as one column.
char32_t next_code_point(std::string_view s, std::size_t& i) {
    const auto b = [&](std::size_t k) { return static_cast<unsigned char>(s[k]); };
    const unsigned char c = b(i);
    std::size_t n = c < 0x80 ? 1 : (c >> 5U) == 0x6 ? 2 : (c >> 4U) == 0xE ? 3 : (c >> 3U) == 0x1E ? 4 : 1;
    if (i + n > s.size()) n = 1;
    char32_t cp = n == 1 ? c : n == 2 ? (c & 0x1FU) : n == 3 ? (c & 0x0FU) : (c & 0x07U);
    for (std::size_t k = 1; k < n; ++k) cp = (cp << 6U) | (b(i + k) & 0x3FU);
    i += n;
    return cp;
}

// Columns of one code point, after Unicode's East Asian Width (wide and fullwidth: 2) and the
// zero-width marks (combining marks, zero-width space and joiners, variation selectors: 0), the
// rule terminals follow (as wcwidth does).
std::size_t code_point_width(char32_t cp) {
    struct Range {
        char32_t lo, hi;
    };
    static constexpr Range zero[] = {{0x0300, 0x036F},  {0x0483, 0x0489}, {0x0591, 0x05BD}, {0x0610, 0x061A},
                                     {0x064B, 0x065F},  {0x200B, 0x200F}, {0x202A, 0x202E}, {0x2060, 0x2064},
                                     {0x20D0, 0x20FF},  {0xFE00, 0xFE0F}, {0xFE20, 0xFE2F}, {0xFEFF, 0xFEFF},
                                     {0xE0100, 0xE01EF}};
    static constexpr Range wide[] = {{0x1100, 0x115F},   {0x231A, 0x231B},   {0x2E80, 0x303E},  {0x3041, 0x33FF},
                                     {0x3400, 0x4DBF},   {0x4E00, 0x9FFF},   {0xA000, 0xA4CF},  {0xAC00, 0xD7A3},
                                     {0xF900, 0xFAFF},   {0xFE30, 0xFE4F},   {0xFF00, 0xFF60},  {0xFFE0, 0xFFE6},
                                     {0x1F300, 0x1F64F}, {0x1F900, 0x1F9FF}, {0x20000, 0x3FFFD}};
    for (const Range& r : zero) {
        if (cp >= r.lo && cp <= r.hi) return 0;
    }
    for (const Range& r : wide) {
        if (cp >= r.lo && cp <= r.hi) return 2;
    }
    return 1;
}

}  // namespace

std::size_t display_width(std::string_view s) {
    std::size_t n = 0;
    for (std::size_t i = 0; i < s.size();) n += code_point_width(next_code_point(s, i));
    return n;
}

std::string pad_right(std::string_view s, std::size_t width) {
    std::string out(s);
    const std::size_t w = display_width(s);
    if (w < width) out.append(width - w, ' ');
    return out;
}

std::string pad_left(std::string_view s, std::size_t width) {
    const std::size_t w = display_width(s);
    std::string out = w < width ? std::string(width - w, ' ') : std::string();
    out += s;
    return out;
}

std::string wrap(std::string_view text, std::size_t width, std::size_t indent) {
    // Words, with a unit kept on the line of its number ("3.46 V", "475 mV", "10 %").
    std::vector<std::string> words;
    {
        std::istringstream in{std::string(text)};
        std::string w;
        while (in >> w) {
            const bool unit_like = display_width(w) <= 4 && w.find_first_of("0123456789") == std::string::npos;
            const bool after_number = !words.empty() && !words.back().empty() &&
                                      std::isdigit(static_cast<unsigned char>(words.back().back())) != 0;
            if (unit_like && after_number)
                words.back() += " " + w;
            else
                words.push_back(w);
        }
    }
    std::string out;
    // The caller has printed `indent` columns before the text; every line ends by `width`.
    std::size_t col = indent;
    bool line_empty = true;
    for (const std::string& word : words) {
        const std::size_t w = display_width(word);
        if (!line_empty && col + 1 + w > width) {
            out += '\n';
            out.append(indent, ' ');
            col = indent;
        } else if (!line_empty) {
            out += ' ';
            ++col;
        }
        out += word;
        col += w;
        line_empty = false;
    }
    return out;
}

}  // namespace coilfit::io
