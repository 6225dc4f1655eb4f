// Shared wiring of the subcommands: spec document, output, colour, width. No engineering here,
// and no argument library (args.cpp is the one file that sees it).
#pragma once

#include <string>
#include <utility>
#include <vector>

#include "io/output.hpp"
#include "io/parts_io.hpp"
#include "io/spec_io.hpp"

namespace coilfit::cli {

// Exit codes (architecture doc): 0 pass, 1 a check failed, 2 bad usage or input.
inline constexpr int exit_pass = 0;
inline constexpr int exit_fail = 1;
inline constexpr int exit_bad_input = 2;

// The spec file and the flags that override its fields (or make up a whole spec).
struct SpecOptions {
    std::string spec_path;                                     // empty: the spec is given by flags only
    std::vector<std::pair<std::string, std::string>> values;   // (spec field path, value) in flag order
    std::vector<std::pair<std::string, std::string>> flag_of;  // (spec field path, flag name)
    std::vector<std::string> storage;                          // one slot per flag, bound by args.cpp
};

struct CommonOptions {
    std::string parts_path;  // --parts; else $COILFIT_PARTS; else the installed table
    std::string format = "text";
    std::string output;  // --output FILE (io/output.hpp); empty: standard output
};

// The spec document: the file (or "-" for stdin, or nothing) with the flags applied.
[[nodiscard]] io::SpecDocument build_spec_document(const SpecOptions& options);
[[nodiscard]] io::PartsTable load_table(const CommonOptions& options);

// The files this run reads: the spec (unless standard input) and every file of the parts table.
// No output may replace one of them (io/output.hpp).
[[nodiscard]] io::RunInputs run_inputs(const SpecOptions& spec, const io::PartsTable& table);
// Checks the run's outputs (--output and, for size, --netlist and --plot; empty: not asked for)
// against its inputs and each other before anything is written.
void check_outputs(const std::string& output_path, const std::string& netlist_path, const io::RunInputs& inputs,
                   const std::string& plot_path = {});
// Writes one output through io::write_output: an empty path or "-" is standard output; a file
// is replaced atomically, a device or FIFO written directly (io/output.hpp).
void emit(const std::string& text, const std::string& output_path, const io::RunInputs& inputs = {},
          const std::string& flag = "--output");
// An error message as printed: whatever input it echoes is already escaped where it was
// written; this escapes the rest (io::printable), so nothing raw ever reaches the terminal.
[[nodiscard]] std::string message_line(const std::string& what);
// Colour only on a terminal, never with NO_COLOR or when writing a file.
[[nodiscard]] bool use_color(const std::string& output_path);
// Width of the text outputs: COLUMNS, else the terminal's (TIOCGWINSZ on standard output), else
// 100; at least 40.
[[nodiscard]] std::size_t text_width();

}  // namespace coilfit::cli
