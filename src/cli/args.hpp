// The command line: every subcommand's flags, the help screens and the usage errors. args.cpp is
// the one translation unit that includes the argument library (CLI11, header-only on Debian),
// so it is compiled once.
#pragma once

#include <optional>

#include "cli/commands.hpp"

namespace coilfit::cli {

enum class Command { size, parts, pick, yield, board };

struct Invocation {
    Command command = Command::size;
    SizeOptions size;
    PartsOptions parts;
    PickOptions pick;
    YieldOptions yield;
    BoardOptions board;
};

// Reads argv into `into`. Returns an exit code when the run ends here: 0 after --help or
// --version, 2 after a usage error (one line on stderr, "coilfit: error: ..." with a hint);
// nothing when a command is to run.
[[nodiscard]] std::optional<int> parse_command_line(int argc, char** argv, Invocation& into);

}  // namespace coilfit::cli
