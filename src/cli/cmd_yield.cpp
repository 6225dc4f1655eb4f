// Placeholder until the yield command lands (issue: statistical yield).
#include "cli/commands.hpp"

namespace coilfit::cli {

CLI::App* setup_yield(CLI::App& app, YieldOptions& options) {
    CLI::App* cmd = app.add_subcommand("yield", "statistical pass rate over the tolerances (Monte Carlo)");
    add_spec_options(*cmd, options.spec);
    add_common_options(*cmd, options.common, true);
    return cmd;
}

int run_yield(const YieldOptions&) { throw InputError("yield: not available in this build"); }

}  // namespace coilfit::cli
