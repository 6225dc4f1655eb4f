// pick's memory against the size of the parts table: the shipped table plus 0, 1000 and 3000
// generated extra parts (half transistors, half diodes: copies of the table's own records under
// ids of our own, "gen-npn-17", "gen-diode-17", each with its gain or drop moved a little so
// no two rank alike). Each run is a child process; wait4() gives its peak resident set (RSS)
// and the wall time is taken around it. Printed, never asserted: no timed tests.
//
//   coilfit_bench_pick [SPEC]     (default: the benchmark spec, the greenhouse valve)
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include <chrono>
#include <cstdio>
#include <string>

#include "coilfit/pick.hpp"
#include "io/parts_io.hpp"
#include "io/spec_io.hpp"

namespace {

using namespace coilfit;

// The shipped table with `extra` generated parts added.
Catalogue grown(const Catalogue& base, std::size_t extra) {
    Catalogue cat = base;
    for (std::size_t i = 0; i < extra; ++i) {
        const double nudge = 1.0 + 0.2 * static_cast<double>(i % 97) / 97.0;
        if (i % 2 == 0) {
            Bipolar b = base.bipolars[i / 2 % base.bipolars.size()];
            b.id = "gen-npn-" + std::to_string(i);
            for (auto& g : b.hfe_min) g.hfe_min *= nudge;
            cat.bipolars.push_back(std::move(b));
        } else {
            Diode d = base.diodes[i / 2 % base.diodes.size()];
            d.id = "gen-diode-" + std::to_string(i);
            for (auto& f : d.vf) f.vf_max_v /= nudge;
            cat.diodes.push_back(std::move(d));
        }
    }
    return cat;
}

struct Run {
    double seconds = 0;
    long peak_rss_kib = 0;
    std::size_t rows = 0;
};

// Runs pick in a child process so that its peak RSS is its own.
Run measure(const Spec& spec, const Catalogue& cat, const PickSettings& settings) {
    int fd[2];
    if (::pipe(fd) != 0) return {};
    const auto start = std::chrono::steady_clock::now();
    const pid_t pid = ::fork();
    if (pid == 0) {
        ::close(fd[0]);
        std::size_t rows = 0;
        if (settings.all_clamps && settings.top == 0) {
            rows = pick_each(spec, cat, settings, [](const Candidate&) {}).rows;  // streamed, as the CLI prints them
        } else {
            rows = pick(spec, cat, settings).candidates.size();
        }
        const ssize_t n = ::write(fd[1], &rows, sizeof rows);
        ::_exit(n == sizeof rows ? 0 : 1);
    }
    ::close(fd[1]);
    Run r;
    if (::read(fd[0], &r.rows, sizeof r.rows) != sizeof r.rows) r.rows = 0;
    ::close(fd[0]);
    int status = 0;
    rusage usage{};
    ::wait4(pid, &status, 0, &usage);
    r.seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
    r.peak_rss_kib = usage.ru_maxrss;  // kibibytes on Linux
    return r;
}

}  // namespace

int main(int argc, char** argv) {
    const io::PartsTable table = io::load_parts(COILFIT_BENCH_PARTS_DIR);
    const Spec spec = io::read_spec(io::load_spec_document(argc > 1 ? argv[1] : COILFIT_BENCH_SPEC), table);
    std::printf("pick against the table size (peak RSS of the child process that holds the table and picks)\n");
    std::printf("  %-6s %-11s %-26s %10s %10s %10s\n", "extra", "transistors", "mode", "rows", "time", "peak RSS");
    for (const std::size_t extra : {std::size_t{0}, std::size_t{1000}, std::size_t{3000}}) {
        const Catalogue cat = grown(table.catalogue, extra);
        const std::size_t transistors = cat.bipolars.size() + cat.mosfets.size() + cat.arrays.size();
        const struct {
            const char* name;
            PickSettings settings;
        } modes[] = {{"--top 10", {10, false}},
                     {"all rows (one per driver)", {0, false}},
                     {"--all-clamps --top 10", {10, true}},
                     {"--all-clamps (streamed)", {0, true}}};
        for (const auto& m : modes) {
            const Run r = measure(spec, cat, m.settings);
            std::printf("  %-6zu %-11zu %-26s %10zu %8.2f s %7.1f MiB\n", extra, transistors, m.name, r.rows, r.seconds,
                        static_cast<double>(r.peak_rss_kib) / 1024.0);
            std::fflush(stdout);
        }
    }
    return 0;
}
