// Every file coilfit writes goes through here (--output, --netlist; later --plot, board --output).
//
//   "-"                        standard output
//   not a regular file         a device, FIFO or /dev/stdout: opened and written, never replaced
//   a regular file (or none)   replaced atomically: a temporary made with mkstemp (O_EXCL) in
//                              the same folder, the old file's mode kept, fsync, rename, fsync of
//                              the folder; SIGINT/SIGTERM remove the temporary
//   a symbolic link            written through: the file it points to is replaced, the link stays
//   a folder                   an error
//
// Before anything is written, every output of a run is checked against the run's inputs and
// against the other outputs (same device and inode when the file exists, else the same
// normalised path): a run never overwrites what it reads, nor one output with another.
#pragma once

#include <functional>
#include <string>
#include <string_view>
#include <vector>

namespace coilfit::io {

// One file a run writes: the flag that names it (for messages) and its path.
struct OutputTarget {
    std::string flag;  // "--output", "--netlist"
    std::string path;  // "-" for standard output; empty: this output is not asked for
};

// The files a run reads (spec, board, the parts table's files); "-" (standard input) and empty
// entries are ignored.
using RunInputs = std::vector<std::string>;

// Throws InputError when an output is an input, two outputs are the same file, or an output
// names a folder. Call it once with every output of the run before writing the first.
void check_outputs(const std::vector<OutputTarget>& outputs, const RunInputs& inputs);

// Writes content to target.path as described above, after checking it against inputs (so a
// caller that writes one file needs nothing else). Throws InputError naming the file; on any
// failure the old file is left as it was and no temporary remains.
void write_output(const OutputTarget& target, std::string_view content, const RunInputs& inputs);

namespace output_testing {
// Called between the write of the temporary and its rename (tests: a signal at the worst
// moment). Empty by default.
void set_before_rename(std::function<void()> hook);
}  // namespace output_testing

}  // namespace coilfit::io
