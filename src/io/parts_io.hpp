// The parts table on disk: JSON files of records, one reader per kind (parts_read.hpp).
#pragma once

#include <string>
#include <vector>

#include "coilfit/parts.hpp"
#include "io/json_read.hpp"
#include "io/parts_read.hpp"

namespace coilfit::io {

// A coil or pin preset: named defaults a spec can start from ("preset": "pcb-relay-12v-360mw").
struct Preset {
    std::string id;
    std::string kind;  // "coil" | "pin"
    std::string description;
    std::string source;
    Json fields;  // the spec fields it supplies, as written
};

struct PartsTable {
    Catalogue catalogue;
    std::vector<Preset> presets;
    std::vector<RelayEntry> relays;  // relay and contactor records
    std::vector<std::string> files;  // the files read, in order

    [[nodiscard]] const Preset* find_preset(std::string_view kind, std::string_view id) const;
    [[nodiscard]] const RelayEntry* find_relay(std::string_view id) const;
    // The relay records alone, for pick.
    [[nodiscard]] std::vector<RelayRecord> relay_records() const;
};

// Reads a file or every *.json file of a folder (by name). Any error rejects the whole table.
[[nodiscard]] PartsTable load_parts(const std::string& path);
// Parses one file's text (for tests: no files needed).
void parse_parts_text(std::string_view text, const std::string& file, PartsTable& into);

// Where the table is read from: --parts, else $COILFIT_PARTS, else the installed data folder
// (<prefix>/share/coilfit/parts next to the program), else the source tree's parts/.
[[nodiscard]] std::string resolve_parts_path(const std::string& flag);

}  // namespace coilfit::io
