// Board files (schema "coilfit.board/1") into a validated Board, and the board's renderers.
//
// A board file holds the sections every channel shares (supply, ambient, the MCU's pins, ports
// and package), `defaults` (spec fields that fill every channel) and `channels`: each a spec
// without the board-wide sections (it may override them) plus `pin`, `port`, `count` and, for an
// array channel, `package`. Each channel is read by the spec reader from a document assembled
// out of those places; a message names the place in the board file a bad field came from
// ("board.json: defaults.clamp.diode: ...", "board.json: channels[2].coil.resistance: ...").
#pragma once

#include <string>

#include "coilfit/board.hpp"
#include "io/json_read.hpp"
#include "io/parts_io.hpp"
#include "io/report_io.hpp"

namespace coilfit::io {

inline constexpr std::string_view board_schema = "coilfit.board/1";
inline constexpr std::string_view board_report_schema = "coilfit.board-report/1";
inline constexpr std::size_t max_board_bytes = 4U << 20U;
inline constexpr std::size_t max_board_channels = 1024;  // after `count` repeats them

struct BoardDocument {
    Json doc = Json::object();
    Origin origin;
};

[[nodiscard]] BoardDocument parse_board_text(std::string_view text, const std::string& file);
// Reads a board file, or standard input for "-".
[[nodiscard]] BoardDocument load_board_document(const std::string& path);
[[nodiscard]] Board read_board(const BoardDocument& d, const PartsTable& table);

// JSON "coilfit.board-report/1": every channel's report (report_to_json) inside.
[[nodiscard]] Json board_report_to_json(const BoardReport& report);

// Text: a line per channel, the board's checks, then details only of what fails or warns.
// brief: the channel lines, the board checks that fail or warn, the cautions and the verdict.
[[nodiscard]] std::string render_board_text(const BoardReport& report, const TextStyle& style, bool brief);

}  // namespace coilfit::io
