#include "io/format.hpp"

#include <cctype>
#include <sstream>
#include <vector>

namespace coilfit::io {

std::size_t display_width(std::string_view s) {
    std::size_t n = 0;
    for (const char c : s) {
        if ((static_cast<unsigned char>(c) & 0xC0U) != 0x80U) ++n;  // count lead bytes only
    }
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
            if (unit_like && after_number) words.back() += " " + w;
            else words.push_back(w);
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
