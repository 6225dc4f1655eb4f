// coilfit board BOARD: sizes every channel of a board file and checks the limits they share.
#include "cli/commands.hpp"
#include "coilfit/board.hpp"
#include "io/board_io.hpp"
#include "io/report_io.hpp"

namespace coilfit::cli {
namespace {

// The channel --channel names: a channel's name, its pin, or an entry's name (its first repeat).
const BoardChannel& find_channel(const Board& board, const std::string& name, const std::string& file) {
    for (const BoardChannel& ch : board.channels) {
        if (ch.spec.name == name || ch.pin == name) return ch;
    }
    for (const BoardChannel& ch : board.channels) {
        if (ch.entry_name == name) return ch;
    }
    std::string names;
    for (const BoardChannel& ch : board.channels) {
        if (ch.repeat == 0) names += (names.empty() ? "" : ", ") + ch.entry_name;
    }
    throw InputError("--channel: no channel or pin named \"" + name + "\" on " + file + " (its channels: " + names +
                     ")");
}

int exit_code(Verdict verdict, bool warnings, bool strict) {
    if (verdict == Verdict::fail) return exit_fail;
    if (strict && warnings) return exit_fail;
    return exit_pass;
}

}  // namespace

int run_board(const BoardOptions& options) {
    const io::PartsTable table = load_table(options.common);
    const io::BoardDocument doc = io::load_board_document(options.board_path);
    const Board board = io::read_board(doc, table);
    // The board file and the table are inputs: no output may replace them (io/output.hpp).
    io::RunInputs inputs;
    if (options.board_path != "-") inputs.push_back(options.board_path);
    inputs.insert(inputs.end(), table.files.begin(), table.files.end());
    check_outputs(options.common.output, {}, inputs);
    io::TextStyle style;
    style.color = use_color(options.common.output);
    style.width = text_width();
    const bool json = options.common.format == "json";
    if (!options.channel.empty()) {
        const SizingReport report = size(find_channel(board, options.channel, doc.origin.file).spec, table.catalogue);
        emit(json ? io::report_to_json(report).dump(2) + "\n" : io::render_text(report, style), options.common.output,
             inputs);
        return exit_code(report.verdict, report.has_warnings, options.strict);
    }
    const BoardReport report = size_board(board, table.catalogue);
    emit(json ? io::board_report_to_json(report).dump(2) + "\n" : io::render_board_text(report, style, options.brief),
         options.common.output, inputs);
    return exit_code(report.verdict, report.has_warnings, options.strict);
}

}  // namespace coilfit::cli
