// Readers of the spec sections that a parts-table preset may also hold (coil, pin). Both the
// spec reader and the table reader use them, so neither depends on the other.
#pragma once

#include <string>
#include <vector>

#include "coilfit/spec.hpp"
#include "io/json_read.hpp"

namespace coilfit::io {

// Reads a coil or pin section into spec (partial: a preset may leave required fields to the
// spec that uses it). Defaults the method filled in are added to `defaults` as phrases.
void read_coil(ObjectReader& r, CoilSpec& coil, std::vector<std::string>& defaults, bool partial = false);
void read_pin(ObjectReader& r, PinSpec& pin, std::vector<std::string>& defaults, bool partial = false);

// Checks the fields of a coil or pin preset as a spec reads them, except that fields a spec
// must give may be left to the spec; the parts table calls it so that a bad preset rejects the
// table when it is loaded, naming the table file and the record.
void check_preset_fields(const Json& fields, const std::string& kind, const Origin& origin, const std::string& path);

// A temperature within plausible bounds (ambient -100 °C to 250 °C by default), above absolute zero.
double temperature(ObjectReader& r, const std::string& key, double value, double lo = -100.0, double hi = 250.0);
// "10 %" for the notes.
[[nodiscard]] std::string percent_words(double fraction);

}  // namespace coilfit::io
