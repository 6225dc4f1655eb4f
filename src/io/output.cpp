#include "io/output.hpp"

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <algorithm>
#include <atomic>
#include <cerrno>
#include <climits>
#include <csignal>
#include <cstring>
#include <filesystem>
#include <optional>

#include "coilfit/quantity.hpp"
#include "coilfit/text.hpp"

namespace coilfit::io {
namespace {

namespace fs = std::filesystem;

std::string shown(const std::string& path) { return escape_text(path, 4096); }

// "permission denied": the system's words for errno, in lower case as in our messages.
std::string reason(int err) {
    std::string s = std::strerror(err);
    if (!s.empty() && s[0] >= 'A' && s[0] <= 'Z' && (s.size() < 2 || !(s[1] >= 'A' && s[1] <= 'Z')))
        s[0] = static_cast<char>(s[0] - 'A' + 'a');
    return s;
}

// --- the temporary file of the moment, for the signal handler --------------------------------
// A fixed buffer and a flag: the handler may only call async-signal-safe functions (unlink,
// signal, raise), never allocate.
char temp_path[PATH_MAX + 1];
volatile std::sig_atomic_t temp_set = 0;
std::function<void()> before_rename;

// The handlers in place before ours, restored when the temporary is gone (and by the signal,
// so that it then does what it did before: end the program, or whatever a caller set up).
constexpr int caught[] = {SIGINT, SIGTERM, SIGHUP};
struct sigaction previous[3];

int caught_index(int sig) {
    for (int i = 0; i < 3; ++i) {
        if (caught[i] == sig) return i;
    }
    return 0;
}

extern "C" void remove_temp_and_die(int sig) {
    if (temp_set) ::unlink(temp_path);
    temp_set = 0;
    ::sigaction(sig, &previous[caught_index(sig)], nullptr);
    std::raise(sig);
}

void register_temp(const std::string& path) {
    temp_set = 0;
    std::atomic_signal_fence(std::memory_order_seq_cst);
    std::memcpy(temp_path, path.c_str(), std::min(path.size() + 1, sizeof(temp_path)));
    temp_path[PATH_MAX] = '\0';
    std::atomic_signal_fence(std::memory_order_seq_cst);
    temp_set = 1;
    for (int i = 0; i < 3; ++i) {
        struct sigaction sa {};
        sa.sa_handler = remove_temp_and_die;
        sigemptyset(&sa.sa_mask);
        ::sigaction(caught[i], &sa, &previous[i]);
        if (previous[i].sa_handler == SIG_IGN) ::sigaction(caught[i], &previous[i], nullptr);  // nohup: stays ignored
    }
}

// Holds SIGINT, SIGTERM and SIGHUP back for its lifetime: between creating the temporary and
// registering it, and between renaming it and forgetting it, a signal must wait.
class SignalsHeld {
public:
    SignalsHeld() {
        sigset_t set;
        sigemptyset(&set);
        for (const int sig : caught) sigaddset(&set, sig);
        ::sigprocmask(SIG_BLOCK, &set, &old_);
    }
    ~SignalsHeld() { ::sigprocmask(SIG_SETMASK, &old_, nullptr); }
    SignalsHeld(const SignalsHeld&) = delete;
    SignalsHeld& operator=(const SignalsHeld&) = delete;

private:
    sigset_t old_{};
};

void clear_temp() {
    for (int i = 0; i < 3; ++i) ::sigaction(caught[i], &previous[i], nullptr);
    temp_set = 0;
    std::atomic_signal_fence(std::memory_order_seq_cst);
}

// --- what a path is ---------------------------------------------------------------------------

bool is_stdout(const std::string& path) { return path == "-"; }

// The identity of an existing file (device and inode, links followed), else nothing.
std::optional<std::pair<dev_t, ino_t>> identity(const std::string& path) {
    struct stat st {};
    if (is_stdout(path)) {
        if (::fstat(STDOUT_FILENO, &st) != 0) return std::nullopt;
    } else if (::stat(path.c_str(), &st) != 0) {
        return std::nullopt;
    }
    return std::make_pair(st.st_dev, st.st_ino);
}

// The path made absolute and normal, links resolved as far as they exist.
std::string normalised(const std::string& path) {
    std::error_code ec;
    const fs::path abs = fs::absolute(path, ec);
    if (ec) return path;
    const fs::path p = fs::weakly_canonical(abs, ec);
    return ec ? abs.lexically_normal().string() : p.string();
}

bool same_file(const std::string& a, const std::string& b) {
    if (is_stdout(a) || is_stdout(b)) {
        if (is_stdout(a) && is_stdout(b)) return true;
    }
    const auto ia = identity(a);
    const auto ib = identity(b);
    if (ia && ib) return *ia == *ib;
    if (ia || ib) return false;
    return normalised(a) == normalised(b);
}

// Follows symbolic links to the file they name (which may not exist yet), at most 40 links deep
// (Linux's own limit). Throws on a loop. `via_proc`: a link on the way lies in /proc or /dev/fd
// (/dev/stdout, /proc/self/fd/N): it names an open file, not a path to replace.
struct LinkTarget {
    std::string path;
    bool via_proc = false;
};

bool proc_like(const std::string& p) { return p.rfind("/proc/", 0) == 0 || p.rfind("/dev/fd/", 0) == 0; }

LinkTarget link_target(const std::string& path) {
    LinkTarget t{path, proc_like(path)};
    for (int hops = 0; hops <= 40; ++hops) {
        struct stat st {};
        if (::lstat(t.path.c_str(), &st) != 0 || !S_ISLNK(st.st_mode)) return t;
        std::error_code ec;
        const fs::path to = fs::read_symlink(t.path, ec);
        if (ec) throw InputError(shown(path) + ": cannot read the symbolic link: " + reason(ec.value()));
        t.path = to.is_absolute() ? to.string() : (fs::path(t.path).parent_path() / to).string();
        t.via_proc = t.via_proc || proc_like(t.path);
    }
    throw InputError(shown(path) + ": a symbolic link loop; give a file name");
}

void write_all(int fd, std::string_view content, const std::string& path) {
    std::size_t done = 0;
    while (done < content.size()) {
        const ssize_t n = ::write(fd, content.data() + done, content.size() - done);
        if (n < 0 && errno == EINTR) continue;
        if (n <= 0) throw InputError(shown(path) + ": writing failed: " + reason(n < 0 ? errno : EIO));
        done += static_cast<std::size_t>(n);
    }
}

void write_stdout(std::string_view content) {
    std::fflush(stdout);
    write_all(STDOUT_FILENO, content, "<stdout>");
}

// A device, FIFO or terminal: opened and written, never created, truncated or replaced.
void write_direct(const std::string& path, std::string_view content, bool append = false) {
    int fd = -1;
    do fd = ::open(path.c_str(), O_WRONLY | O_NOCTTY | O_CLOEXEC | (append ? O_APPEND : 0));
    while (fd < 0 && errno == EINTR);
    if (fd < 0) throw InputError(shown(path) + ": cannot write here: " + reason(errno));
    try {
        write_all(fd, content, path);
    } catch (...) {
        ::close(fd);
        throw;
    }
    if (::close(fd) != 0 && errno != EINTR) throw InputError(shown(path) + ": writing failed: " + reason(errno));
}

// The temporary's name in the target's folder: ".NAME.coilfit-XXXXXX", NAME shortened (never
// inside a UTF-8 character) so that the whole stays within NAME_MAX.
std::string temp_template(const fs::path& target) {
    constexpr std::string_view suffix = ".coilfit-XXXXXX";
    std::string name = target.filename().string();
    const std::size_t room = NAME_MAX - 1 - suffix.size();
    if (name.size() > room) {
        std::size_t cut = room;
        while (cut > 0 && (static_cast<unsigned char>(name[cut]) & 0xC0U) == 0x80U) --cut;
        name.resize(cut);
    }
    const fs::path dir = target.parent_path();
    return (dir.empty() ? fs::path(".") : dir).string() + "/." + name + std::string(suffix);
}

void sync_folder(const fs::path& dir) {
    const int fd = ::open((dir.empty() ? fs::path(".") : dir).c_str(), O_RDONLY | O_DIRECTORY | O_CLOEXEC);
    if (fd < 0) return;
    (void)::fsync(fd);  // best effort: some file systems refuse fsync on folders
    ::close(fd);
}

// Replaces (or creates) the regular file `target` through a temporary in its folder.
void replace_atomically(const std::string& shown_as, const std::string& target, std::string_view content,
                        const struct stat* old) {
    const fs::path t(target);
    std::string tmpl = temp_template(t);
    int fd = -1;
    {
        const SignalsHeld held;
        fd = ::mkstemp(tmpl.data());  // O_CREAT | O_EXCL, mode 0600: no planted link is followed
        if (fd < 0) {
            const fs::path dir = t.parent_path().empty() ? fs::path(".") : t.parent_path();
            throw InputError(shown(shown_as) + ": cannot write here (" + shown(dir.string()) + ": " + reason(errno) +
                             ")");
        }
        register_temp(tmpl);
    }
    const auto fail = [&](const std::string& what, int err) {
        ::close(fd);
        ::unlink(tmpl.c_str());
        clear_temp();
        throw InputError(shown(shown_as) + ": " + what + ": " + reason(err) + "; the file was not changed");
    };
    try {
        write_all(fd, content, shown_as);
    } catch (const InputError&) {
        fail("writing failed", errno ? errno : EIO);
    }
    mode_t mode = 0;
    if (old) {
        mode = old->st_mode & 07777;
        // Keeps the owner where we may (root), else at least the group where we belong to it.
        if (::fchown(fd, old->st_uid, old->st_gid) != 0) (void)::fchown(fd, static_cast<uid_t>(-1), old->st_gid);
    } else {
        const mode_t mask = ::umask(0);
        ::umask(mask);
        mode = 0666 & ~mask;
    }
    if (::fchmod(fd, mode) != 0) fail("cannot set the file's mode", errno);
    if (::fsync(fd) != 0) fail("writing failed", errno);
    if (::close(fd) != 0) {
        ::unlink(tmpl.c_str());
        clear_temp();
        throw InputError(shown(shown_as) + ": writing failed: " + reason(errno) + "; the file was not changed");
    }
    if (before_rename) before_rename();
    {
        const SignalsHeld held;
        if (::rename(tmpl.c_str(), target.c_str()) != 0) {
            const int err = errno;
            ::unlink(tmpl.c_str());
            clear_temp();
            throw InputError(shown(shown_as) + ": cannot replace the file: " + reason(err) +
                             "; the file was not changed");
        }
        clear_temp();
    }
    sync_folder(t.parent_path());
}

void check_one(const OutputTarget& out, const RunInputs& inputs) {
    if (out.path.empty() || is_stdout(out.path)) return;
    struct stat st {};
    if (::stat(out.path.c_str(), &st) == 0 && S_ISDIR(st.st_mode)) {
        throw InputError(out.flag + ": " + shown(out.path) + " is a folder; give a file name");
    }
    for (const std::string& in : inputs) {
        if (in.empty() || in == "-") continue;
        if (same_file(out.path, in)) {
            const std::string also = in == out.path ? std::string() : " (the same file as " + shown(in) + ")";
            throw InputError(out.flag + ": " + shown(out.path) + " is an input of this run" + also +
                             "; coilfit never writes over what it reads");
        }
    }
}

}  // namespace

void check_outputs(const std::vector<OutputTarget>& outputs, const RunInputs& inputs) {
    for (std::size_t i = 0; i < outputs.size(); ++i) {
        check_one(outputs[i], inputs);
        for (std::size_t k = 0; k < i; ++k) {
            if (outputs[i].path.empty() || outputs[k].path.empty()) continue;
            if (same_file(outputs[i].path, outputs[k].path)) {
                throw InputError(outputs[i].flag + ": " + shown(outputs[i].path) + " is also the file of " +
                                 outputs[k].flag + "; give each output its own file");
            }
        }
    }
}

void write_output(const OutputTarget& target, std::string_view content, const RunInputs& inputs) {
    check_one(target, inputs);
    const std::string& path = target.path;
    if (path.empty()) throw InputError(target.flag + ": expected a file name, got an empty text");
    if (is_stdout(path)) return write_stdout(content);
    struct stat st {};
    if (::stat(path.c_str(), &st) != 0) {
        const int err = errno;
        if (err == ELOOP) throw InputError(shown(path) + ": a symbolic link loop; give a file name");
        if (err != ENOENT) throw InputError(shown(path) + ": cannot write here: " + reason(err));
        // Not there yet (or a link to a file not there yet): created through a temporary.
        return replace_atomically(path, link_target(path).path, content, nullptr);
    }
    if (!S_ISREG(st.st_mode)) return write_direct(path, content);
    const LinkTarget resolved = link_target(path);
    if (resolved.via_proc) {
        // A regular file behind /dev/stdout or /proc/self/fd/N: the open file itself, appended to
        // (a shell's `>` left it empty, `>>` wants the end).
        if (path == "/dev/stdout" || path == "/proc/self/fd/1" || path == "/dev/fd/1") return write_stdout(content);
        return write_direct(path, content, true);
    }
    replace_atomically(path, resolved.path, content, &st);
}

namespace output_testing {
void set_before_rename(std::function<void()> hook) { before_rename = std::move(hook); }
}  // namespace output_testing

}  // namespace coilfit::io
