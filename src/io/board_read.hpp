// Internal to the board reader: the pieces board_read.cpp and board_read_channels.cpp share.
#pragma once

#include <map>
#include <string>

#include "io/board_io.hpp"

namespace coilfit::io::board_read {

// The spec document every channel starts from (schema, supply, ambient, pin from the mcu), with
// where the board file wrote each of its fields.
struct Base {
    Json doc = Json::object();
    std::map<std::string, std::string> written_at;
};

// Writes `from` over `into` at `path`: objects merge key by key, anything else replaces. Records
// where the file wrote each value (`source`) and forgets the places of what it replaced.
void overlay(Json& into, const Json& from, const std::string& path, const std::string& source,
             std::map<std::string, std::string>& written_at);

// Reads `channels` into board.channels (every repeat of `count`, its pin, port and package).
void read_channels(ObjectReader& top, const BoardDocument& d, const PartsTable& table, const Base& base,
                   const Json* defaults, Board& board);

}  // namespace coilfit::io::board_read
