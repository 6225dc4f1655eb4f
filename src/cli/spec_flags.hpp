// The spec-field flags (--supply, --coil-resistance, ...): one per field of coilfit.spec/1, in
// the order of the spec's sections. Plain data, shared by the command line (args.cpp) and the
// spec document builder (common.cpp).
#pragma once

#include <span>
#include <string_view>

namespace coilfit::cli {

struct SpecFlag {
    const char* flag;   // "--supply"
    const char* path;   // "supply.voltage"
    const char* value;  // the value's name in the help: VOLTAGE, PERCENT, ID, ...
    const char* help;
    const char* def;  // the default the method uses when the field is absent ("" none)
};

[[nodiscard]] std::span<const SpecFlag> spec_flags();
// The help group of a field, by its section: "Spec: supply and ambient", "Spec: coil", ...
[[nodiscard]] std::string_view spec_flag_group(std::string_view path);

}  // namespace coilfit::cli
