// One reader per record kind of the parts table, shared by the table and by inline records in a
// spec ("transistor": { ... }); and each record back to JSON (SI numbers).
//
// A record read from the table needs a `source`; an inline record needs none and is labelled
// "inline ID" in every output.
#pragma once

#include "coilfit/parts.hpp"
#include "coilfit/spec.hpp"
#include "io/json_read.hpp"

namespace coilfit::io {

// Whether a record comes from the table (source required) or is written inline in a spec.
enum class RecordPlace { table, inline_spec };

[[nodiscard]] Bipolar read_bipolar(ObjectReader& r, RecordPlace place = RecordPlace::table);
[[nodiscard]] Mosfet read_mosfet(ObjectReader& r, RecordPlace place = RecordPlace::table);
[[nodiscard]] ArrayPart read_array(ObjectReader& r, RecordPlace place = RecordPlace::table);
[[nodiscard]] Diode read_diode(ObjectReader& r, RecordPlace place = RecordPlace::table);
[[nodiscard]] Zener read_zener(ObjectReader& r, RecordPlace place = RecordPlace::table);
[[nodiscard]] Tvs read_tvs(ObjectReader& r, RecordPlace place = RecordPlace::table);
// A relay or contactor record (parts_read_relay.cpp): the coil fields as written, which a spec's
// `coil` beside its `relay` overrides, and the record read (an inline record's coil may leave
// fields to the spec's `coil`).
struct RelayEntry {
    RelayRecord record;
    Json coil_fields = Json::object();
};
[[nodiscard]] RelayEntry read_relay(ObjectReader& r, const Json& record, RecordPlace place = RecordPlace::table);
[[nodiscard]] Json to_json(const RelayPart& p);
// A transistor of any kind, by its `kind` (npn, darlington, nmos, array).
[[nodiscard]] Transistor read_transistor(ObjectReader& r, RecordPlace place = RecordPlace::table);

[[nodiscard]] Json to_json(const Bipolar& p);
[[nodiscard]] Json to_json(const Mosfet& p);
[[nodiscard]] Json to_json(const ArrayPart& p);
[[nodiscard]] Json to_json(const Diode& p);
[[nodiscard]] Json to_json(const Zener& p);
[[nodiscard]] Json to_json(const Tvs& p);
[[nodiscard]] Json to_json(const Transistor& p);

}  // namespace coilfit::io
