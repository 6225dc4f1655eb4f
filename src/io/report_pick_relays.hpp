// pick's relay side rendered: the relay and driver combinations that pass both sides.
#pragma once

#include <string>

#include "coilfit/pick_relays.hpp"
#include "io/json_read.hpp"

namespace coilfit::io {

// At most `per_relay` combinations of each relay are listed (its best first); 0 lists all.
[[nodiscard]] std::string render_relay_pick_text(const RelayPickResult& result, std::size_t per_relay,
                                                 std::size_t width);
[[nodiscard]] Json relay_pick_to_json(const RelayPickResult& result);

}  // namespace coilfit::io
