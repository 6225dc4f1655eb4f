// Shared wiring of the subcommands: spec flags, output, colour. No engineering here.
#pragma once

#include <string>
#include <utility>
#include <vector>

#include <CLI/CLI.hpp>

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
    std::vector<std::string> storage;                 // one slot per flag, bound to CLI11
};

struct CommonOptions {
    std::string parts_path;  // --parts; else $COILFIT_PARTS; else the installed table
    std::string format = "text";
    std::string output;      // --output FILE: written atomically
};

// Adds SPEC and every spec-field flag (--supply, --coil-resistance, ...) to a subcommand.
void add_spec_options(CLI::App& app, SpecOptions& options);
void add_common_options(CLI::App& app, CommonOptions& options, bool with_output);

// The spec document: the file (or "-" for stdin, or nothing) with the flags applied.
[[nodiscard]] io::SpecDocument build_spec_document(const SpecOptions& options);
[[nodiscard]] io::PartsTable load_table(const CommonOptions& options);

// Writes text to stdout, or atomically to a file (temporary file in the same folder, then
// rename), so that a failed run never leaves half a report.
void emit(const std::string& text, const std::string& output_path);
// Colour only on a terminal, never with NO_COLOR or when writing a file.
[[nodiscard]] bool use_color(const std::string& output_path);
// Width of the text outputs: COLUMNS, else the terminal's (TIOCGWINSZ on standard output), else
// 100; at least 40.
[[nodiscard]] std::size_t text_width();

}  // namespace coilfit::cli
