// `coilfit parts relay|contactor [ID]`: the relay and contactor records of the table.
#pragma once

#include <string>
#include <vector>

#include "io/parts_io.hpp"

namespace coilfit::cli {

// Adds the records that match kind ("", "relay" or "contactor") and id (empty: all) to `json`
// (each record as read: coil fields and contacts) and `rows` (a header row first); returns how many.
std::size_t list_relays(const io::PartsTable& table, const std::string& kind, const std::string& id, io::Json& json,
                        std::vector<std::vector<std::string>>& rows);

}  // namespace coilfit::cli
