#include "io/parts_io.hpp"

#include <sys/stat.h>
#include <unistd.h>

#include <algorithm>
#include <cerrno>
#include <cstdlib>
#include <cstring>
#include <filesystem>
#include <map>

#include <fmt/format.h>

#include "io/parts_read_common.hpp"
#include "io/sections_read.hpp"

namespace coilfit::io {
namespace {

namespace fs = std::filesystem;

constexpr std::size_t max_table_bytes = 8U << 20U;
// All files of a parts folder together (the shipped table is about 60 kB).
constexpr std::size_t max_folder_bytes = 32U << 20U;

std::string folder_too_large(const std::string& shown) {
    return fmt::format(
        "{}: the parts files of this folder are larger than {} bytes together; this is not a coilfit parts table",
        shown, max_folder_bytes);
}

// What is wrong with an entry, in words: "a symbolic link loop", "cannot be read (permission denied)".
std::string entry_problem(int err) {
    if (err == ELOOP) return "a symbolic link loop";
    if (err == EACCES) return "cannot be read (permission denied)";
    std::string s = std::strerror(err);
    if (!s.empty() && s[0] >= 'A' && s[0] <= 'Z') s[0] = static_cast<char>(s[0] - 'A' + 'a');
    return "cannot be read (" + s + ")";
}

struct FolderFile {
    std::string path;
    std::uintmax_t size = 0;
};

// The *.json files of a parts folder, by name. Every entry named *.json must be a readable
// regular file (or a link to one): a dangling link, a loop, a folder or a device so named is an
// error that names it, never skipped in silence.
std::vector<FolderFile> folder_files(const std::string& dir) {
    std::error_code ec;
    fs::directory_iterator it(dir, ec);
    if (ec) throw InputError(printable(dir, 4096) + ": cannot list the folder (" + entry_problem(ec.value()) + ")");
    std::vector<FolderFile> files;
    for (; it != fs::directory_iterator(); it.increment(ec)) {
        const fs::path p = it->path();
        if (p.extension() != ".json") continue;
        const std::string name = p.string();
        const std::string shown = printable(name, 4096);
        struct stat st {};
        if (::stat(name.c_str(), &st) != 0) {
            const int err = errno;
            if (err == ENOENT)
                throw InputError(shown +
                                 ": a symbolic link to nothing in the parts folder; remove it or fix its target");
            throw InputError(shown + ": " + entry_problem(err) + " in the parts folder");
        }
        if (S_ISDIR(st.st_mode))
            throw InputError(shown + ": a folder named *.json in the parts folder; parts files are files");
        if (!S_ISREG(st.st_mode)) throw InputError(shown + ": not a regular file, in the parts folder");
        if (::access(name.c_str(), R_OK) != 0)
            throw InputError(shown + ": " + entry_problem(errno) + " in the parts folder");
        files.push_back({name, static_cast<std::uintmax_t>(st.st_size)});
    }
    if (ec) throw InputError(printable(dir, 4096) + ": cannot list the folder (" + entry_problem(ec.value()) + ")");
    std::sort(files.begin(), files.end(), [](const FolderFile& a, const FolderFile& b) { return a.path < b.path; });
    return files;
}

}  // namespace

const Preset* PartsTable::find_preset(std::string_view kind, std::string_view id) const {
    const auto it =
        std::find_if(presets.begin(), presets.end(), [&](const Preset& p) { return p.kind == kind && p.id == id; });
    return it == presets.end() ? nullptr : &*it;
}

const RelayEntry* PartsTable::find_relay(std::string_view id) const {
    const auto it = std::find_if(relays.begin(), relays.end(), [&](const RelayEntry& r) { return r.record.id == id; });
    return it == relays.end() ? nullptr : &*it;
}

std::vector<RelayRecord> PartsTable::relay_records() const {
    std::vector<RelayRecord> out;
    out.reserve(relays.size());
    for (const RelayEntry& r : relays) out.push_back(r.record);
    return out;
}

namespace {

constexpr std::string_view known_kinds =
    "npn, darlington, nmos, array, rectifier, fast, signal, schottky, zener, tvs, coil, pin, relay or contactor";

Preset read_preset(ObjectReader& r, const Json& record, const std::string& kind, const Origin& origin,
                   const std::string& path) {
    Preset p;
    p.id = records::read_id(r);
    p.kind = kind;
    p.description = r.text("description", 400).value_or("");
    const auto source = r.text("source", 1000);
    if (!source || source->empty()) r.fail_at("source", "missing; every record says where its values come from");
    p.source = *source;
    p.fields = Json::object();
    for (const auto& [k, v] : record.items()) {
        if (k != "id" && k != "kind" && k != "description" && k != "source") {
            p.fields[k] = v;
            (void)r.get(k);
        }
    }
    // The preset's fields are checked now, as a spec would read them: a bad preset rejects the
    // table here rather than a spec that uses it later.
    check_preset_fields(p.fields, kind, origin, path);
    return p;
}

// Reads one record into the table by its kind; returns its id.
std::string read_record(ObjectReader& r, const Json& record, const std::string& kind, const Origin& origin,
                        const std::string& path, PartsTable& table) {
    Catalogue& cat = table.catalogue;
    if (kind == "npn" || kind == "darlington") return cat.bipolars.emplace_back(read_bipolar(r)).id;
    if (kind == "nmos") return cat.mosfets.emplace_back(read_mosfet(r)).id;
    if (kind == "array") return cat.arrays.emplace_back(read_array(r)).id;
    if (kind == "rectifier" || kind == "fast" || kind == "signal" || kind == "schottky")
        return cat.diodes.emplace_back(read_diode(r)).id;
    if (kind == "zener") return cat.zeners.emplace_back(read_zener(r)).id;
    if (kind == "tvs") return cat.tvs.emplace_back(read_tvs(r)).id;
    if (kind == "coil" || kind == "pin")
        return table.presets.emplace_back(read_preset(r, record, kind, origin, path)).id;
    if (kind == "relay" || kind == "contactor") return table.relays.emplace_back(read_relay(r, record)).record.id;
    r.fail_at("kind", fmt::format("unknown kind \"{}\"; expected {}", printable(kind), known_kinds));
}

template <typename T>
void note_ids(const std::vector<T>& records, std::map<std::string, std::string>& ids) {
    for (const auto& rec : records) ids[rec.id] = "an earlier file";
}

}  // namespace

void parse_parts_text(std::string_view text, const std::string& file, PartsTable& into) {
    Origin origin;
    origin.file = printable(file, 4096);  // a file name echoed in messages, escaped
    const Json doc = parse_json(text, origin.file, max_table_bytes, "a JSON list [ ... ] of part records");
    if (!doc.is_array()) fail(origin, "", "expected a JSON list [ ... ] of part records, got " + describe(doc));
    // Read into a copy and commit at the end: a file with an error adds nothing.
    PartsTable table = into;
    // Ids already present (from earlier files) and where they came from: unique across kinds.
    std::map<std::string, std::string> ids;
    const Catalogue& cat = table.catalogue;
    note_ids(cat.bipolars, ids);
    note_ids(cat.mosfets, ids);
    note_ids(cat.arrays, ids);
    note_ids(cat.diodes, ids);
    note_ids(cat.zeners, ids);
    note_ids(cat.tvs, ids);
    note_ids(table.presets, ids);
    for (const RelayEntry& rel : table.relays) ids[rel.record.id] = "an earlier file";
    for (std::size_t i = 0; i < doc.size(); ++i) {
        const std::string path = "[" + std::to_string(i) + "]";
        ObjectReader r(doc[i], origin, path);
        const Json* kind_j = r.get("kind");
        if (!kind_j) r.fail_at("kind", fmt::format("missing; expected {}", known_kinds));
        if (!kind_j->is_string()) r.fail_at("kind", fmt::format("expected {}, got {}", known_kinds, describe(*kind_j)));
        const std::string id = read_record(r, doc[i], kind_j->get<std::string>(), origin, path, table);
        r.finish();
        const auto [it, inserted] = ids.emplace(id, path);
        if (!inserted) r.fail_at("id", "duplicate id \"" + printable(id) + "\" (also at " + it->second + ")");
    }
    table.files.push_back(file);
    into = std::move(table);
}

PartsTable load_parts(const std::string& path) {
    PartsTable table;
    const std::string shown = printable(path, 4096);
    if (path.empty()) throw InputError("the parts table: expected a file or folder name, got an empty text");
    struct stat st {};
    if (::stat(path.c_str(), &st) != 0) {
        const int err = errno;
        struct stat lst {};
        if (err == ENOENT && ::lstat(path.c_str(), &lst) == 0 && S_ISLNK(lst.st_mode)) {
            throw InputError(shown + ": a symbolic link to nothing (its target does not exist)");
        }
        if (err == ENOENT || err == ENOTDIR) throw InputError(shown + ": no such parts file or folder");
        throw InputError(shown + ": " + entry_problem(err));
    }
    if (!S_ISDIR(st.st_mode)) {
        parse_parts_text(read_text(path, max_table_bytes), path, table);
        return table;
    }
    const std::vector<FolderFile> files = folder_files(path);
    if (files.empty()) throw InputError(shown + ": no parts files (*.json) in this folder");
    std::uintmax_t total = 0;
    for (const auto& f : files) total += f.size;
    if (total > max_folder_bytes) throw InputError(folder_too_large(shown));
    std::size_t read = 0;
    for (const auto& f : files) {
        std::string text = read_text(f.path, max_table_bytes);
        read += text.size();  // what was read, not what stat said: a file may grow
        if (read > max_folder_bytes) throw InputError(folder_too_large(shown));
        parse_parts_text(text, f.path, table);
    }
    return table;
}

std::string resolve_parts_path(const std::string& flag) {
    if (!flag.empty()) return flag;
    if (const char* env = std::getenv("COILFIT_PARTS"); env && *env) return env;
    std::error_code ec;
    const fs::path exe = fs::read_symlink("/proc/self/exe", ec);
    if (!ec) {
        // COILFIT_RELATIVE_PARTS_DIR: the data folder seen from the installed bin/ ("../share/coilfit/parts").
        const fs::path installed = (exe.parent_path() / COILFIT_RELATIVE_PARTS_DIR).lexically_normal();
        if (fs::is_directory(installed, ec)) return installed.string();
    }
    if (fs::is_directory(COILFIT_SOURCE_PARTS_DIR, ec)) return COILFIT_SOURCE_PARTS_DIR;
    return COILFIT_INSTALL_PARTS_DIR;
}

}  // namespace coilfit::io
