#include "cli/common.hpp"

#include <sys/ioctl.h>
#include <unistd.h>

#include <algorithm>
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <iostream>

#include "cli/spec_flags.hpp"

namespace coilfit::cli {

io::SpecDocument build_spec_document(const SpecOptions& options) {
    io::SpecDocument d = options.spec_path.empty() ? io::flags_only_document() : io::load_spec_document(options.spec_path);
    if (options.spec_path.empty() && options.values.empty()) {
        throw InputError("no spec: give a spec file (or - for standard input), or the spec fields as flags (see --help)");
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

void emit(const std::string& text, const std::string& output_path) {
    if (output_path.empty()) {
        std::cout << text;
        std::cout.flush();
        if (!std::cout) throw InputError("cannot write to standard output");
        return;
    }
    namespace fs = std::filesystem;
    const fs::path target(output_path);
    fs::path dir = target.parent_path();
    if (dir.empty()) dir = ".";
    const fs::path tmp = dir / (target.filename().string() + ".tmp." + std::to_string(::getpid()));
    {
        std::ofstream out(tmp, std::ios::binary | std::ios::trunc);
        if (!out) throw InputError(output_path + ": cannot write here (" + dir.string() + ")");
        out << text;
        out.flush();
        if (!out) {
            out.close();
            std::error_code ec;
            fs::remove(tmp, ec);
            throw InputError(output_path + ": writing failed; nothing was written");
        }
    }
    std::error_code ec;
    fs::rename(tmp, target, ec);
    if (ec) {
        fs::remove(tmp, ec);
        throw InputError(output_path + ": cannot replace the file: " + ec.message());
    }
}

bool use_color(const std::string& output_path) {
    if (!output_path.empty()) return false;
    if (const char* nc = std::getenv("NO_COLOR"); nc && *nc) return false;
    if (const char* term = std::getenv("TERM"); term && std::string(term) == "dumb") return false;
    return ::isatty(STDOUT_FILENO) == 1;
}

std::size_t text_width() {
    if (const char* c = std::getenv("COLUMNS")) {
        const long n = std::strtol(c, nullptr, 10);
        if (n >= 60 && n <= 300) return static_cast<std::size_t>(n);
    }
    winsize ws{};
    if (::isatty(STDOUT_FILENO) == 1 && ::ioctl(STDOUT_FILENO, TIOCGWINSZ, &ws) == 0 && ws.ws_col > 0) {
        return std::clamp<std::size_t>(ws.ws_col, 60, 300);
    }
    return 100;
}

}  // namespace coilfit::cli
