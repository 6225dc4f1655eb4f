// Text that came from input, made safe to echo: UTF-8 checks, character counts and the one
// escaping function every message uses (src/io's printable() is this function). Standard
// library only, so that the core's own messages (quantity parsing) escape the same way.
#pragma once

#include <cstddef>
#include <string>
#include <string_view>

namespace coilfit {

// Length of the well-formed UTF-8 sequence starting at s[i] (RFC 3629: no overlong forms, no
// surrogates, at most U+10FFFF), 0 when it is not one.
[[nodiscard]] std::size_t utf8_sequence_length(std::string_view s, std::size_t i);
// True when text is well-formed UTF-8.
[[nodiscard]] bool is_utf8(std::string_view text);
// Characters (code points) in text; a byte that is not UTF-8 counts as one.
[[nodiscard]] std::size_t count_characters(std::string_view text);

// Unicode bidirectional controls (UAX #9: ALM, LRM, RLM, LRE..RLO, LRI..PDI): they reorder what
// a terminal shows, so a name holding one can read as something else.
[[nodiscard]] bool is_bidi_control(char32_t c);
// Characters that show as nothing or as a plain space: no-break and other spaces, zero-width
// characters, format characters, fillers, variation selectors, tags (and the bidi controls).
[[nodiscard]] bool is_invisible(char32_t c);
[[nodiscard]] bool has_bidi_control(std::string_view text);
// C0 controls, DEL and C1 controls (U+0080..U+009F).
[[nodiscard]] bool has_control(std::string_view text);
[[nodiscard]] bool has_invisible(std::string_view text);

// The escaping every message uses for echoed input: bytes that are not UTF-8 and C0 controls
// (and DEL) become \xNN, C1 controls and invisible or bidi characters \uNNNN (\UNNNNNNNN above
// U+FFFF); with quote_marks, " and \ get a backslash too. The text is cut after max_chars
// characters with "..." (never inside a character).
[[nodiscard]] std::string escape_text(std::string_view text, std::size_t max_chars = 40, bool quote_marks = false);

}  // namespace coilfit
