// coilfit benchmarks: prints the figures of the README's "Performance" section.
//
//   one sizing evaluation (ns)      evaluate() of the benchmark spec at worst case
//   yield samples per second        count_samples() on one core (draw, collapse, evaluate, tally)
//   pick over the table (ms)        pick() with every transistor and diode of parts/
//   one-shot `coilfit size` (ms)    a whole process: start, read table and spec, size, print;
//                                   against starting /bin/true (the cost of any process)
//   64-channel board (ms)           size_board() of tests/data/board_64.json: every channel sized
//                                   and the board's shared checks (issue 14: goal under 20 ms),
//                                   and the same with reading the board file
//
// Goals (issue 6): evaluation well under 1 us, at least 5 million yield samples a second on one
// core, pick under 50 ms. This program reports; it fails nothing. On a shared machine run it with
// --benchmark_repetitions=5: the summary takes the fastest repetition of each benchmark.
#include <fcntl.h>
#include <spawn.h>
#include <sys/wait.h>
#include <unistd.h>

#include <benchmark/benchmark.h>

#include <cstdio>
#include <map>
#include <stdexcept>
#include <string>
#include <thread>
#include <vector>

#include "coilfit/board.hpp"
#include "coilfit/pick.hpp"
#include "coilfit/sizing.hpp"
#include "coilfit/yield.hpp"
#include "io/board_io.hpp"
#include "io/parts_io.hpp"
#include "io/spec_io.hpp"

extern char** environ;

namespace {

using namespace coilfit;

struct Fixture {
    io::PartsTable table = io::load_parts(COILFIT_BENCH_PARTS_DIR);
    // Prepared as yield prepares its own copy: the parts' ln(current) points filled once.
    Spec spec = [this] {
        Spec s = io::read_spec(io::load_spec_document(COILFIT_BENCH_SPEC), table);
        precompute_logs(s);
        return s;
    }();
    Sized design = size_numbers(spec);
    Prepared prepared = prepare(spec);
};

const Fixture& fixture() {
    static const Fixture f;
    return f;
}

constexpr std::uint64_t yield_batch = 1U << 16;

void bm_evaluate(benchmark::State& state) {
    const Fixture& f = fixture();
    const double rb = f.design.r_drive_ohm.value_or(0.0);
    for (auto _ : state) {
        Evaluation e = evaluate(f.prepared, f.design.conditions, rb);
        benchmark::DoNotOptimize(e);
    }
}
BENCHMARK(bm_evaluate)->Name("sizing/evaluate")->Unit(benchmark::kNanosecond);

void bm_yield(benchmark::State& state, Distribution distribution, ConditionsMode conditions) {
    const Fixture& f = fixture();
    YieldSettings settings;
    settings.distribution = distribution;
    settings.conditions = conditions;
    const double rb = f.design.r_drive_ohm.value_or(0.0);
    std::uint64_t first = 0;
    for (auto _ : state) {
        YieldCounts c = count_samples(f.prepared, f.design.conditions, rb, settings, first, first + yield_batch);
        benchmark::DoNotOptimize(c);
        first += yield_batch;
    }
    state.SetItemsProcessed(static_cast<std::int64_t>(state.iterations()) * static_cast<std::int64_t>(yield_batch));
}
// The default: conditions held at each check's worst corner (both ambient corners per sample).
BENCHMARK_CAPTURE(bm_yield, uniform, Distribution::uniform, ConditionsMode::worst)
    ->Name("yield/one_core/uniform")
    ->Unit(benchmark::kMillisecond);
BENCHMARK_CAPTURE(bm_yield, normal, Distribution::normal, ConditionsMode::worst)
    ->Name("yield/one_core/normal")
    ->Unit(benchmark::kMillisecond);
// --conditions sampled (edition 1's yield): one ambient per sample.
BENCHMARK_CAPTURE(bm_yield, sampled, Distribution::uniform, ConditionsMode::sampled)
    ->Name("yield/one_core/uniform_sampled")
    ->Unit(benchmark::kMillisecond);

void bm_yield_all_cores(benchmark::State& state) {
    const Fixture& f = fixture();
    YieldSettings settings;
    settings.samples = 1U << 22;
    settings.jobs = std::max(1U, std::thread::hardware_concurrency());
    for (auto _ : state) {
        YieldResult r = run_yield(f.spec, settings);
        benchmark::DoNotOptimize(r);
    }
    state.SetItemsProcessed(static_cast<std::int64_t>(state.iterations()) *
                            static_cast<std::int64_t>(settings.samples));
    state.counters["jobs"] = settings.jobs;
}
BENCHMARK(bm_yield_all_cores)->Name("yield/all_cores")->Unit(benchmark::kMillisecond)->UseRealTime();

void bm_pick(benchmark::State& state) {
    const Fixture& f = fixture();
    std::size_t combinations = 0;
    for (auto _ : state) {
        PickResult r = pick(f.spec, f.table.catalogue);
        combinations = r.candidates.size();
        benchmark::DoNotOptimize(r);
    }
    state.counters["combinations"] = static_cast<double>(combinations);
}
BENCHMARK(bm_pick)->Name("pick/whole_table")->Unit(benchmark::kMillisecond);

// Starts a program with stdout and stderr to /dev/null and waits for it.
void run_process(const std::vector<std::string>& argv) {
    std::vector<char*> args;
    for (const std::string& a : argv) args.push_back(const_cast<char*>(a.c_str()));
    args.push_back(nullptr);
    posix_spawn_file_actions_t actions;
    posix_spawn_file_actions_init(&actions);
    posix_spawn_file_actions_addopen(&actions, STDOUT_FILENO, "/dev/null", O_WRONLY, 0);
    posix_spawn_file_actions_addopen(&actions, STDERR_FILENO, "/dev/null", O_WRONLY, 0);
    pid_t pid = 0;
    const int rc = posix_spawn(&pid, args[0], &actions, nullptr, args.data(), environ);
    posix_spawn_file_actions_destroy(&actions);
    if (rc != 0) throw std::runtime_error("cannot start " + argv[0]);
    int status = 0;
    waitpid(pid, &status, 0);
    if (!WIFEXITED(status) || WEXITSTATUS(status) > 1) throw std::runtime_error(argv[0] + " did not run cleanly");
}

void bm_process_size(benchmark::State& state) {
    const std::vector<std::string> argv{COILFIT_BENCH_EXE, "size", COILFIT_BENCH_SPEC, "--parts",
                                        COILFIT_BENCH_PARTS_DIR};
    for (auto _ : state) run_process(argv);
}
BENCHMARK(bm_process_size)->Name("process/coilfit_size")->Unit(benchmark::kMillisecond)->UseRealTime();

// The 64-channel board: 64 entries of their own (no repeat is sized once for another).
struct BoardFixture {
    io::PartsTable table = io::load_parts(COILFIT_BENCH_PARTS_DIR);
    io::BoardDocument document = io::load_board_document(COILFIT_BENCH_BOARD);
    Board board = io::read_board(document, table);
};

const BoardFixture& board_fixture() {
    static const BoardFixture f;
    return f;
}

void bm_board(benchmark::State& state) {
    const BoardFixture& f = board_fixture();
    for (auto _ : state) {
        BoardReport r = size_board(f.board, f.table.catalogue);
        benchmark::DoNotOptimize(r);
    }
    state.counters["channels"] = static_cast<double>(f.board.channels.size());
}
BENCHMARK(bm_board)->Name("board/size_64")->Unit(benchmark::kMillisecond);

void bm_board_read(benchmark::State& state) {
    const BoardFixture& f = board_fixture();
    for (auto _ : state) {
        BoardReport r = size_board(io::read_board(f.document, f.table), f.table.catalogue);
        benchmark::DoNotOptimize(r);
    }
}
BENCHMARK(bm_board_read)->Name("board/read_and_size_64")->Unit(benchmark::kMillisecond);

void bm_process_board(benchmark::State& state) {
    const std::vector<std::string> argv{COILFIT_BENCH_EXE, "board", COILFIT_BENCH_BOARD, "--parts",
                                        COILFIT_BENCH_PARTS_DIR};
    for (auto _ : state) run_process(argv);
}
BENCHMARK(bm_process_board)->Name("process/coilfit_board_64")->Unit(benchmark::kMillisecond)->UseRealTime();

void bm_process_true(benchmark::State& state) {
    const std::vector<std::string> argv{"/bin/true"};
    for (auto _ : state) run_process(argv);
}
BENCHMARK(bm_process_true)->Name("process/bin_true")->Unit(benchmark::kMillisecond)->UseRealTime();

// Keeps the console output and remembers each benchmark's time per iteration in seconds.
class SummaryReporter : public benchmark::ConsoleReporter {
public:
    void ReportRuns(const std::vector<Run>& runs) override {
        ConsoleReporter::ReportRuns(runs);
        for (const Run& r : runs) {
            if (r.run_type != Run::RT_Iteration || r.error_occurred) continue;
            // Wall time where several threads or processes take part, else this thread's CPU time
            // (the machine may be shared).
            const std::string name = r.run_name.function_name;
            const bool wall = name.rfind("process/", 0) == 0 || name.rfind("yield/all_cores", 0) == 0;
            const double t = wall ? r.GetAdjustedRealTime() : r.GetAdjustedCPUTime();
            // With --benchmark_repetitions the fastest repetition counts: on a shared machine it
            // is the one least disturbed by other work.
            const double sec = t / benchmark::GetTimeUnitMultiplier(r.time_unit);
            const auto it = seconds.find(name);
            if (it == seconds.end() || sec < it->second) seconds[name] = sec;
            for (const auto& [key, counter] : r.counters) counters[name + "." + key] = counter.value;
        }
    }
    std::map<std::string, double> seconds;
    std::map<std::string, double> counters;
};

}  // namespace

int main(int argc, char** argv) {
    benchmark::Initialize(&argc, argv);
    if (benchmark::ReportUnrecognizedArguments(argc, argv)) return 1;
    SummaryReporter reporter;
    benchmark::RunSpecifiedBenchmarks(&reporter);
    benchmark::Shutdown();

    const auto& s = reporter.seconds;
    auto has = [&s](const char* name) { return s.count(name) != 0; };
    std::printf("\ncoilfit benchmark summary (%u hardware threads)\n", std::thread::hardware_concurrency());
    if (has("sizing/evaluate")) std::printf("  one sizing evaluation        %8.0f ns\n", s.at("sizing/evaluate") * 1e9);
    if (has("yield/one_core/uniform"))
        std::printf("  yield, one core, uniform     %8.2f million samples/s\n",
                    static_cast<double>(yield_batch) / s.at("yield/one_core/uniform") / 1e6);
    if (has("yield/one_core/uniform_sampled"))
        std::printf("  yield, one core, sampled     %8.2f million samples/s (--conditions sampled)\n",
                    static_cast<double>(yield_batch) / s.at("yield/one_core/uniform_sampled") / 1e6);
    if (has("yield/one_core/normal"))
        std::printf("  yield, one core, normal      %8.2f million samples/s\n",
                    static_cast<double>(yield_batch) / s.at("yield/one_core/normal") / 1e6);
    if (has("yield/all_cores"))
        std::printf("  yield, all cores, uniform    %8.2f million samples/s\n",
                    static_cast<double>(1U << 22) / s.at("yield/all_cores") / 1e6);
    if (has("pick/whole_table"))
        std::printf("  pick over the table          %8.2f ms (%.0f combinations)\n", s.at("pick/whole_table") * 1e3,
                    reporter.counters["pick/whole_table.combinations"]);
    if (has("board/size_64"))
        std::printf("  64-channel board, one shot   %8.2f ms (goal under 20 ms)\n", s.at("board/size_64") * 1e3);
    if (has("board/read_and_size_64"))
        std::printf("  the same, reading the file   %8.2f ms\n", s.at("board/read_and_size_64") * 1e3);
    if (has("process/coilfit_board_64"))
        std::printf("  coilfit board, one process   %8.2f ms (64 channels)\n", s.at("process/coilfit_board_64") * 1e3);
    if (has("process/coilfit_size") && has("process/bin_true")) {
        std::printf("  coilfit size, one process    %8.2f ms\n", s.at("process/coilfit_size") * 1e3);
        std::printf("  /bin/true, one process       %8.2f ms\n", s.at("process/bin_true") * 1e3);
        std::printf("  ratio                        %8.1f x\n",
                    s.at("process/coilfit_size") / s.at("process/bin_true"));
    }
    return 0;
}
