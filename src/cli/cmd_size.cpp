#include <iostream>

#include "cli/commands.hpp"
#include "coilfit/sizing.hpp"
#include "io/netlist.hpp"
#include "io/report_io.hpp"

namespace coilfit::cli {

CLI::App* setup_size(CLI::App& app, SizeOptions& options) {
    CLI::App* cmd = app.add_subcommand("size", "size and check one driver channel at worst case");
    add_spec_options(*cmd, options.spec);
    add_common_options(*cmd, options.common, true);
    cmd->add_flag("--strict", options.strict, "warnings fail too (exit 1)");
    cmd->add_flag("--brief", options.brief, "text: only the verdict, the design and the failing or warning checks");
    cmd->add_option("--netlist", options.netlist, "also write a SPICE netlist of the sized circuit to FILE");
    return cmd;
}

int run_size(const SizeOptions& options) {
    const io::PartsTable table = load_table(options.common);
    const Spec spec = io::read_spec(build_spec_document(options.spec), table);
    const SizingReport report = size(spec, table.catalogue);
    if (!options.netlist.empty()) {
        // Built before anything is written, so a design that cannot be simulated writes nothing.
        emit(io::spice_netlist(report), options.netlist);
    }
    std::string text;
    if (options.common.format == "json") {
        text = io::report_to_json(report).dump(2) + "\n";
    } else {
        io::TextStyle style;
        style.color = use_color(options.common.output);
        style.width = text_width();
        style.brief = options.brief;
        text = io::render_text(report, style);
    }
    emit(text, options.common.output);
    if (report.verdict == Verdict::fail) return exit_fail;
    if (options.strict && report.has_warnings) return exit_fail;
    return exit_pass;
}

}  // namespace coilfit::cli
