#include <iostream>

#include "cli/commands.hpp"
#include "coilfit/sizing.hpp"
#include "io/netlist.hpp"
#include "io/plot_svg.hpp"
#include "io/report_io.hpp"

namespace coilfit::cli {

int run_size(const SizeOptions& options) {
    const io::PartsTable table = load_table(options.common);
    const Spec spec = io::read_spec(build_spec_document(options.spec), table);
    const SizingReport report = size(spec, table.catalogue);
    // Every output is checked against the inputs and the others before any is written.
    const io::RunInputs inputs = run_inputs(options.spec, table);
    check_outputs(options.common.output, options.netlist, inputs, options.plot);
    // Built before anything is written, so a design that cannot be simulated or drawn writes nothing.
    const std::string netlist = options.netlist.empty() ? std::string() : io::spice_netlist(report);
    const std::string plot = options.plot.empty() ? std::string() : io::turn_off_svg(report);
    if (!options.netlist.empty()) emit(netlist, options.netlist, inputs, "--netlist");
    if (!options.plot.empty()) emit(plot, options.plot, inputs, "--plot");
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
    emit(text, options.common.output, inputs);
    if (report.verdict == Verdict::fail) return exit_fail;
    if (options.strict && report.has_warnings) return exit_fail;
    return exit_pass;
}

}  // namespace coilfit::cli
