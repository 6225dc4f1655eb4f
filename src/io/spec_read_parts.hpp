// Internal to the spec reader: the transistor and clamp fields (table ids or inline records) and
// the driver's and operation's sections.
#pragma once

#include "coilfit/spec.hpp"
#include "io/parts_io.hpp"
#include "io/spec_io.hpp"

namespace coilfit::io::spec_parts {

[[nodiscard]] Transistor read_transistor_field(ObjectReader& top, const PartsTable& table);
// The spec's `relay` (a table id or an inline record); none when the spec gives no relay.
[[nodiscard]] std::optional<RelayEntry> read_relay_field(ObjectReader& top, const PartsTable& table);
void read_clamp(ObjectReader& r, Spec& s, const PartsTable& table);
// base_resistor, gate_resistor, pulldown, policy.
void read_drive_sections(ObjectReader& top, const SpecDocument& d, Spec& s);
// switching, load (after the relay: the inrush default is noted when the contacts are checked).
void read_operation_sections(ObjectReader& top, const SpecDocument& d, Spec& s);

}  // namespace coilfit::io::spec_parts
