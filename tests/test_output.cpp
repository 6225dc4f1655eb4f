// The output routine (src/io/output.hpp) as a property: whatever output paths a run is given
// (regular files, links to them, links to inputs, dangling links, a FIFO, a folder, the inputs
// themselves, new names), nothing but the intended file ever changes, no temporary stays
// behind, and a clash is refused before anything is written. The reference is the contract
// stated in output.hpp (and issue 17); the paths are drawn from a fixed seed, so every run
// tries the same cases. Scratch files live in the build tree, made by the test itself.
#include <doctest/doctest.h>

#include <fcntl.h>
#include <sys/stat.h>
#include <sys/wait.h>
#include <unistd.h>

#include <csignal>
#include <filesystem>
#include <fstream>
#include <map>
#include <random>
#include <string>
#include <vector>

#include "coilfit/quantity.hpp"
#include "io/output.hpp"

namespace fs = std::filesystem;
namespace io = coilfit::io;

namespace {

struct Entry {
    char type = '?';  // f file, l link, p FIFO, d folder
    unsigned mode = 0;
    std::string data;  // a file's content or a link's target
    bool operator==(const Entry&) const = default;
};
using Snapshot = std::map<std::string, Entry>;

std::string slurp(const fs::path& p) {
    std::ifstream in(p, std::ios::binary);
    return {std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>()};
}

void put(const fs::path& p, const std::string& text, unsigned mode) {
    std::ofstream(p, std::ios::binary) << text;
    fs::permissions(p, static_cast<fs::perms>(mode));
}

Snapshot snapshot(const fs::path& root) {
    Snapshot s;
    for (auto it = fs::recursive_directory_iterator(root); it != fs::recursive_directory_iterator(); ++it) {
        struct stat st {};
        REQUIRE(::lstat(it->path().c_str(), &st) == 0);
        Entry e;
        e.mode = st.st_mode & 07777;
        if (S_ISLNK(st.st_mode)) {
            e.type = 'l';
            e.data = fs::read_symlink(it->path()).string();
        } else if (S_ISFIFO(st.st_mode)) {
            e.type = 'p';
        } else if (S_ISDIR(st.st_mode)) {
            e.type = 'd';
        } else {
            e.type = 'f';
            e.data = slurp(it->path());
        }
        s[it->path().lexically_relative(root).string()] = e;
    }
    return s;
}

// One output path of the world below and what writing to it must do.
struct Candidate {
    std::string path;    // relative to the scratch folder
    std::string target;  // the file that must receive the content ("" for the FIFO)
    bool refused;        // an input or a folder: an error, nothing written
};

// The world: two inputs, plain files of several modes, links of every sort, a FIFO, a folder.
const std::vector<Candidate>& candidates() {
    static const std::vector<Candidate> c = {
        {"a.txt", "a.txt", false},
        {"./a.txt", "a.txt", false},
        {"b.txt", "b.txt", false},
        {"sub/c.txt", "sub/c.txt", false},
        {"sub/../b.txt", "b.txt", false},
        {"la", "a.txt", false},
        {"lsub", "sub/c.txt", false},
        {"sub/lup", "b.txt", false},
        {"ldangling", "sub/new.txt", false},
        {"fresh.txt", "fresh.txt", false},
        {"sub/fresh2.txt", "sub/fresh2.txt", false},
        {"pipe", "", false},
        {"spec.json", "", true},
        {"./spec.json", "", true},
        {"parts.json", "", true},
        {"lspec", "", true},
        {"sub/../parts.json", "", true},
        {"sub", "", true},
        {"lsubdir", "", true},
    };
    return c;
}

// Builds the world afresh in root; returns a reader of the FIFO (opened first, so that writing
// does not wait).
int build_world(const fs::path& root) {
    fs::remove_all(root);
    fs::create_directories(root / "sub");
    put(root / "spec.json", "{ \"schema\": \"coilfit.spec/1\" }\n", 0644);
    put(root / "parts.json", "[]\n", 0644);
    put(root / "a.txt", "old a\n", 0644);
    put(root / "b.txt", "old b\n", 0600);
    put(root / "sub/c.txt", "old c\n", 0640);
    fs::create_symlink("a.txt", root / "la");
    fs::create_symlink("sub/c.txt", root / "lsub");
    fs::create_symlink("../b.txt", root / "sub/lup");
    fs::create_symlink("sub/new.txt", root / "ldangling");
    fs::create_symlink("spec.json", root / "lspec");
    fs::create_symlink("sub", root / "lsubdir");
    REQUIRE(::mkfifo((root / "pipe").c_str(), 0644) == 0);
    const int reader = ::open((root / "pipe").c_str(), O_RDONLY | O_NONBLOCK);
    REQUIRE(reader >= 0);
    return reader;
}

std::string drain(int fd) {
    std::string out;
    char buf[4096];
    ssize_t n = 0;
    while ((n = ::read(fd, buf, sizeof buf)) > 0) out.append(buf, static_cast<std::size_t>(n));
    return out;
}

// Checks that only `written` (target -> content) changed between before and after; a new
// target takes the umask's mode, an old one keeps its mode.
void check_only(const Snapshot& before, const Snapshot& after, const std::map<std::string, std::string>& written) {
    for (const auto& [name, e] : after) {
        CAPTURE(name);
        const auto w = written.find(name);
        const auto b = before.find(name);
        if (w == written.end()) {
            REQUIRE(b != before.end());  // nothing new but the intended files: no temporary left
            CHECK(e == b->second);
            continue;
        }
        CHECK(e.type == 'f');
        CHECK(e.data == w->second);
        if (b != before.end()) {
            CHECK(e.mode == b->second.mode);
        } else {
            CHECK(e.mode == 0640U);  // umask 027 below
        }
    }
    for (const auto& [name, e] : before) {
        CAPTURE(name);
        CHECK(after.count(name) == 1);
    }
}

// Runs the outputs as a command would (check them all, then write each) and checks the result.
void try_outputs(const fs::path& root, const std::vector<const Candidate*>& outs) {
    const int reader = build_world(root);
    const io::RunInputs inputs = {(root / "spec.json").string(), (root / "parts.json").string()};
    std::vector<io::OutputTarget> targets;
    std::vector<std::string> contents;
    for (std::size_t i = 0; i < outs.size(); ++i) {
        targets.push_back({i == 0 ? "--output" : "--netlist", (root / outs[i]->path).string()});
        contents.push_back("content " + std::to_string(i) + " for " + outs[i]->path + "\n");
    }
    bool refused = false;
    for (const Candidate* c : outs) refused = refused || c->refused;
    // Two outputs clash when they reach the same file (the FIFO counts as one too).
    const bool clash = outs.size() == 2 && (outs[0]->target == outs[1]->target) && !refused;
    const Snapshot before = snapshot(root);
    std::map<std::string, std::string> written;
    std::string to_pipe;
    try {
        io::check_outputs(targets, inputs);
        for (std::size_t i = 0; i < outs.size(); ++i) {
            io::write_output(targets[i], contents[i], inputs);
            if (outs[i]->target.empty())
                to_pipe += contents[i];
            else
                written[outs[i]->target] = contents[i];
        }
        CHECK_FALSE(refused);
        CHECK_FALSE(clash);
    } catch (const coilfit::InputError& e) {
        CAPTURE(e.what());
        CHECK((refused || clash));
        CHECK(written.empty());
    }
    check_only(before, snapshot(root), written);
    CHECK(drain(reader) == to_pipe);
    ::close(reader);
}

fs::path scratch(const char* name) { return fs::absolute(fs::path("output-test-scratch") / name); }

}  // namespace

TEST_SUITE("output") {
    TEST_CASE("random output paths: nothing but the intended file ever changes") {
        const mode_t old_mask = ::umask(027);
        const fs::path root = scratch("property");
        std::mt19937 rng(17);  // fixed seed: the same paths every run
        const auto& c = candidates();
        for (int i = 0; i < 150; ++i) {
            const Candidate* one = &c[rng() % c.size()];
            CAPTURE(one->path);
            try_outputs(root, {one});
        }
        for (int i = 0; i < 150; ++i) {
            const Candidate* a = &c[rng() % c.size()];
            const Candidate* b = &c[rng() % c.size()];
            CAPTURE(a->path);
            CAPTURE(b->path);
            try_outputs(root, {a, b});
        }
        // Every candidate on its own, so that none depends on the draw.
        for (const Candidate& one : c) try_outputs(root, {&one});
        fs::remove_all(root);
        ::umask(old_mask);
    }

    TEST_CASE("SIGTERM or SIGINT between writing and renaming removes the temporary; the old file stays") {
        for (const int sig : {SIGTERM, SIGINT}) {
            const fs::path root = scratch("signal");
            fs::remove_all(root);
            fs::create_directories(root);
            put(root / "report.txt", "old report\n", 0644);
            const pid_t child = ::fork();
            REQUIRE(child >= 0);
            if (child == 0) {
                std::signal(sig, SIG_DFL);  // as in the program: the signal ends it (not doctest's handler)
                io::output_testing::set_before_rename([sig] { ::raise(sig); });
                try {
                    io::write_output({"--output", (root / "report.txt").string()}, "new report\n", {});
                } catch (...) {
                }
                ::_exit(0);  // reached only when the signal did not end the process
            }
            int status = 0;
            REQUIRE(::waitpid(child, &status, 0) == child);
            CHECK(WIFSIGNALED(status));
            CHECK(WTERMSIG(status) == sig);
            std::vector<std::string> names;
            for (const auto& e : fs::directory_iterator(root)) names.push_back(e.path().filename().string());
            CHECK(names == std::vector<std::string>{"report.txt"});
            CHECK(slurp(root / "report.txt") == "old report\n");
            fs::remove_all(root);
        }
    }

    TEST_CASE("a 250-byte file name gets a temporary within NAME_MAX") {
        const fs::path root = scratch("long");
        fs::remove_all(root);
        fs::create_directories(root);
        const std::string name(250, 'n');
        io::write_output({"--output", (root / name).string()}, "x\n", {});
        CHECK(slurp(root / name) == "x\n");
        // A name of 255 bytes in multi-byte characters: the temporary's cut keeps whole characters.
        std::string wide;
        while (wide.size() + 2 <= 254) wide += "\xc3\xa9";
        io::write_output({"--output", (root / wide).string()}, "y\n", {});
        CHECK(slurp(root / wide) == "y\n");
        std::size_t n = 0;
        for ([[maybe_unused]] const auto& e : fs::directory_iterator(root)) ++n;
        CHECK(n == 2);
        fs::remove_all(root);
    }
}
