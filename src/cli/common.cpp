#include "cli/common.hpp"

#include <sys/ioctl.h>
#include <unistd.h>

#include <algorithm>
#include <cstdio>
#include <cstdlib>
#include <iostream>

#include "io/json_read.hpp"

#include "cli/spec_flags.hpp"

namespace coilfit::cli {

io::SpecDocument build_spec_document(const SpecOptions& options) {
    io::SpecDocument d =
        options.spec_path.empty() ? io::flags_only_document() : io::load_spec_document(options.spec_path);
    if (options.spec_path.empty() && options.values.empty()) {
        throw InputError(
            "no spec: give a spec file (or - for standard input), or the spec fields as flags (see --help)");
    }
    for (const SpecFlag& f : spec_flags()) d.origin.flag_names.emplace(f.path, f.flag);
    for (std::size_t i = 0; i < options.values.size(); ++i) {
        io::set_field(d, options.values[i].first, options.values[i].second, options.flag_of[i].second);
    }
    return d;
}

io::PartsTable load_table(const CommonOptions& options) {
    return io::load_parts(io::resolve_parts_path(options.parts_path));
}

io::RunInputs run_inputs(const SpecOptions& spec, const io::PartsTable& table) {
    io::RunInputs in;
    if (!spec.spec_path.empty() && spec.spec_path != "-") in.push_back(spec.spec_path);
    in.insert(in.end(), table.files.begin(), table.files.end());
    return in;
}

void check_outputs(const std::string& output_path, const std::string& netlist_path, const io::RunInputs& inputs,
                   const std::string& plot_path) {
    io::check_outputs(
        {{"--output", output_path.empty() ? "-" : output_path}, {"--netlist", netlist_path}, {"--plot", plot_path}},
        inputs);
}

void emit(const std::string& text, const std::string& output_path, const io::RunInputs& inputs,
          const std::string& flag) {
    std::cout.flush();
    io::write_output({flag, output_path.empty() ? "-" : output_path}, text, inputs);
}

std::string message_line(const std::string& what) { return io::printable(what, what.size()); }

bool use_color(const std::string& output_path) {
    if (!output_path.empty() && output_path != "-") return false;
    if (const char* nc = std::getenv("NO_COLOR"); nc && *nc) return false;
    if (const char* term = std::getenv("TERM"); term && std::string(term) == "dumb") return false;
    return ::isatty(STDOUT_FILENO) == 1;
}

std::size_t text_width() {
    // COLUMNS first (the user's explicit choice), then the terminal's own width, else 100; never
    // below 40 columns, the narrowest the text layouts fit.
    constexpr long narrowest = 40;
    if (const char* c = std::getenv("COLUMNS"); c && *c) {
        char* end = nullptr;
        const long n = std::strtol(c, &end, 10);
        if (end && *end == '\0' && n > 0) return static_cast<std::size_t>(std::clamp(n, narrowest, 1000L));
    }
    if (::isatty(STDOUT_FILENO) == 1) {
        winsize ws{};
        if (::ioctl(STDOUT_FILENO, TIOCGWINSZ, &ws) == 0 && ws.ws_col > 0) {
            return static_cast<std::size_t>(std::max<long>(ws.ws_col, narrowest));
        }
    }
    return 100;
}

}  // namespace coilfit::cli
