// Shared wiring of the subcommands: spec flags, output, colour. No engineering here.
#pragma once

#include <string>
#include <utility>
#include <vector>

#include "io/parts_io.hpp"
#include "io/spec_io.hpp"

namespace coilfit::cli {

// Exit codes (architecture doc): 0 pass, 1 a check failed, 2 bad usage or input.
inline constexpr int exit_pass = 0;
inline constexpr int exit_fail = 1;
inline constexpr int exit_bad_input = 2;

// The spec file and the flags that override its fields (or make up a whole spec).
struct SpecOptions {
    std::string spec_path;                            // empty: the spec is given by flags only
    std::vector<std::pair<std::string, std::string>> values;  // (spec field path, value) in flag order
    std::vector<std::pair<std::string, std::string>> flag_of;  // (spec field path, flag name)
    std::vector<std::string> storage;                          // one slot per flag, bound by args.cpp
};

struct CommonOptions {
    std::string parts_path;  // --parts; else $COILFIT_PARTS; else the installed table
    std::string format = "text";
    std::string output;      // --output FILE: written atomically
};

// The spec document: the file (or "-" for stdin, or nothing) with the flags applied.
[[nodiscard]] io::SpecDocument build_spec_document(const SpecOptions& options);
[[nodiscard]] io::PartsTable load_table(const CommonOptions& options);

// Writes text to stdout, or atomically to a file (temporary file in the same folder, then
// rename), so that a failed run never leaves half a report.
void emit(const std::string& text, const std::string& output_path);
// Colour only on a terminal, never with NO_COLOR or when writing a file.
[[nodiscard]] bool use_color(const std::string& output_path);
// Terminal width for wrapping: COLUMNS, else the terminal's (standard output's) width, else 100;
// never under 60.
[[nodiscard]] std::size_t text_width();

}  // namespace coilfit::cli
