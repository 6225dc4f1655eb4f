// One part record as people read it: labelled fields with units ("Vceo  40 V", "hFE min  20 at
// 100 µA, 40 at 1 mA"), from the record's JSON form (to_json or a preset's fields).
#pragma once

#include <string>

#include "io/json_read.hpp"

namespace coilfit::io {

[[nodiscard]] std::string part_text(const Json& record, std::size_t width);

}  // namespace coilfit::io
