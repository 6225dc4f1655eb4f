// fmt support for coilfit's quantity type: fmt::format("{}", Quantity{0.0231, Unit::ampere})
// prints "23.1 mA"; "{:4}" asks for four significant digits.
#pragma once

#include <fmt/format.h>

#include "coilfit/quantity.hpp"

template <>
struct fmt::formatter<coilfit::Quantity> {
    int significant = 3;

    constexpr auto parse(format_parse_context& ctx) -> decltype(ctx.begin()) {
        auto it = ctx.begin();
        if (it != ctx.end() && *it >= '1' && *it <= '9') {
            significant = *it - '0';
            ++it;
        }
        if (it != ctx.end() && *it != '}') throw format_error("invalid format for a coilfit quantity");
        return it;
    }

    template <typename FormatContext>
    auto format(const coilfit::Quantity& q, FormatContext& ctx) const -> decltype(ctx.out()) {
        const std::string s = coilfit::format_quantity(q.value, q.unit, significant);
        return fmt::format_to(ctx.out(), "{}", s);
    }
};

namespace coilfit::io {

// Number of terminal columns a UTF-8 string takes: wide (CJK, fullwidth, emoji) code points take
// two, combining and zero-width ones none, the rest one.
[[nodiscard]] std::size_t display_width(std::string_view s);
// Pads s with spaces on the right (or left) to a display width.
[[nodiscard]] std::string pad_right(std::string_view s, std::size_t width);
[[nodiscard]] std::string pad_left(std::string_view s, std::size_t width);
// Word-wraps text that starts at column `indent` (the caller printed the prefix) so that no line
// passes `width` columns; continuation lines are indented by `indent` spaces.
[[nodiscard]] std::string wrap(std::string_view text, std::size_t width, std::size_t indent);

}  // namespace coilfit::io
