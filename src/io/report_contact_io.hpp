// The contact side of a report (src/method.md "Contact side"), rendered: its text section and
// its JSON object. Empty text and no object when the report has no contact side.
#pragma once

#include <string>

#include "coilfit/report.hpp"
#include "io/json_read.hpp"
#include "io/report_io.hpp"

namespace coilfit::io {

[[nodiscard]] std::string render_contact_text(const SizingReport& report, const TextStyle& style);
[[nodiscard]] Json contact_to_json(const ContactReport& contact);

}  // namespace coilfit::io
