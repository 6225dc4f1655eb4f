// A board report as text: one line per channel, the board's checks with the set each was taken
// at, then the details of what fails or warns only, the notes, the cautions (once) and the verdict.
#include <fmt/format.h>

#include "io/board_io.hpp"
#include "io/format.hpp"
#include "io/report_text_parts.hpp"

namespace coilfit::io {
namespace {

std::string qf(double v, Unit u) { return format_quantity(v, u); }

std::string margin_text(const std::optional<double>& m) {
    if (!m) return "";
    if (*m < -9.99) return "<-999 %";
    return fmt::format("{:+.0f} %", *m * 100.0);
}

using text::verdict_word;

// A table: rows of cells, the last cell the verdict (painted), columns padded to their widest.
struct Table {
    std::vector<std::vector<std::string>> rows;
    std::vector<Verdict> verdicts;  // per row after the header; the header's is skip
    std::vector<bool> right;        // right-aligned columns

    std::string render(const TextStyle& style, std::size_t verdict_column) const {
        std::vector<std::size_t> w(rows.front().size(), 0);
        for (const auto& r : rows) {
            for (std::size_t c = 0; c < r.size(); ++c) w[c] = std::max(w[c], display_width(r[c]));
        }
        std::string out;
        for (std::size_t i = 0; i < rows.size(); ++i) {
            std::string line;
            for (std::size_t c = 0; c < rows[i].size(); ++c) {
                const bool last = c + 1 == rows[i].size();
                std::string cell = right[c] ? pad_left(rows[i][c], w[c])
                                   : last   ? rows[i][c]
                                            : pad_right(rows[i][c], w[c]);
                if (c == verdict_column && i > 0) cell = paint(cell, verdicts[i - 1], style);
                line += "  " + cell;
            }
            while (!line.empty() && line.back() == ' ') line.pop_back();
            out += line + "\n";
        }
        return out;
    }
};

// The check a channel's line shows: a failed one (the worst of them) or the one with the least margin.
const Check* shown_check(const SizingReport& r) {
    const Check* worst = nullptr;
    for (const Check& c : r.checks) {
        if (c.verdict == Verdict::fail && (!worst || c.margin.value_or(-1) < worst->margin.value_or(-1))) worst = &c;
    }
    return worst ? worst : r.worst_check();
}

std::string resistor_cell(const SizingReport& r) {
    if (r.resistor.kind.empty()) return "built in";
    if (!r.resistor.value_ohm) return "none fits";
    return qf(*r.resistor.value_ohm, Unit::ohm) + (r.resistor.kind == "gate resistor" ? " (gate)" : "");
}

std::string channel_table(const BoardReport& report, const TextStyle& style) {
    Table t;
    t.rows.push_back({"channel", "pin", "driver", "resistor", "worst check", "", "verdict"});
    t.right = {false, false, false, true, false, true, false};
    for (std::size_t i = 0; i < report.channels.size(); ++i) {
        const BoardChannel& ch = report.board.channels[i];
        const SizingReport& r = report.channels[i];
        const Check* w = shown_check(r);
        std::string driver = origin(ch.spec.transistor).id;
        if (!ch.package.empty()) driver += " (" + ch.package + ")";
        t.rows.push_back({ch.spec.name, ch.pin, driver, resistor_cell(r), w ? w->id : "-",
                          w ? margin_text(w->margin) : "", verdict_word(r.verdict)});
        t.verdicts.push_back(r.verdict == Verdict::pass && r.has_warnings ? Verdict::warn : r.verdict);
    }
    return t.render(style, 6);
}

// The set for the table: its words, or a count when they would not fit (a check's message has them all).
std::string short_set(const Board& board, const std::vector<std::size_t>& set) {
    std::string words = set_words(board, set);
    if (display_width(words) <= 48) return words;
    return fmt::format("{} of {} channels", set.size(), board.channels.size());
}

std::string board_check_table(const BoardReport& report, const TextStyle& style, bool brief) {
    Table t;
    t.rows.push_back({"check", "subject", "value", "limit", "margin", "verdict", "channels on"});
    t.right = {false, false, true, true, true, false, false};
    for (const BoardCheck& b : report.checks) {
        const Check& c = b.check;
        if (brief && c.verdict != Verdict::fail && c.verdict != Verdict::warn) continue;
        t.rows.push_back({c.id, b.subject, c.value ? qf(*c.value, c.unit) : "", c.limit ? qf(*c.limit, c.unit) : "",
                          margin_text(c.margin), verdict_word(c.verdict), short_set(report.board, b.set)});
        t.verdicts.push_back(c.verdict);
    }
    if (t.rows.size() == 1) return "  (none fails or warns)\n";
    return t.render(style, 5);
}

// What fails or warns: the board's checks, then each channel's (repeats of one entry once).
std::string details(const BoardReport& report, const TextStyle& style) {
    std::string out;
    for (const BoardCheck& b : report.checks) {
        const Check& c = b.check;
        if (c.verdict != Verdict::fail && c.verdict != Verdict::warn) continue;
        const std::string label = c.id + " (" + b.subject + ")";
        out += "  " + paint(label, c.verdict, style) + "  " + wrap(c.message, style.width, display_width(label) + 4) +
               "\n";
    }
    for (std::size_t i = 0; i < report.channels.size(); ++i) {
        const BoardChannel& ch = report.board.channels[i];
        if (ch.repeat > 0) continue;
        const std::string who =
            ch.repeats > 1 ? ch.entry_name + " (each of " + std::to_string(ch.repeats) + ")" : ch.spec.name;
        for (const Check& c : report.channels[i].checks) {
            if (c.verdict != Verdict::fail && c.verdict != Verdict::warn) continue;
            const std::string label = who + ": " + c.id;
            out += "  " + paint(label, c.verdict, style) + "  " +
                   wrap(c.message, style.width, display_width(label) + 4) + "\n";
        }
    }
    return out;
}

std::string result_line(const BoardReport& report, const TextStyle& style) {
    std::size_t warns = 0;
    for (const BoardCheck& b : report.checks) warns += b.check.verdict == Verdict::warn ? 1U : 0U;
    for (const SizingReport& r : report.channels) {
        for (const Check& c : r.checks) warns += c.verdict == Verdict::warn ? 1U : 0U;
    }
    if (report.verdict == Verdict::pass) {
        return paint("Result: PASS", warns ? Verdict::warn : Verdict::pass, style) +
               (warns ? fmt::format(" with {} warning{}: every channel and every board check holds at worst case; read "
                                    "the warnings.\n",
                                    warns, warns == 1 ? "" : "s")
                      : std::string(": every channel and every board check holds at worst case.\n"));
    }
    std::vector<std::string> failed;
    for (const BoardCheck& b : report.checks) {
        if (b.check.verdict == Verdict::fail) failed.push_back(b.check.id + " (" + b.subject + ")");
    }
    std::vector<std::size_t> channels;
    for (std::size_t i = 0; i < report.channels.size(); ++i) {
        if (report.channels[i].verdict == Verdict::fail) channels.push_back(i);
    }
    if (channels.size() == 1)
        failed.push_back(report.board.channels[channels.front()].spec.name);
    else if (!channels.empty())
        failed.push_back(set_words(report.board, channels));
    std::string list;
    for (std::size_t k = 0; k < failed.size(); ++k) list += (k ? "; " : "") + failed[k];
    const std::size_t boards = report.failed_board_checks();
    std::string what;
    if (boards) what = fmt::format("{} board check{} failed", boards, boards == 1 ? "" : "s");
    if (!channels.empty())
        what +=
            fmt::format("{}{} channel{} failed", boards ? ", " : "", channels.size(), channels.size() == 1 ? "" : "s");
    if (boards && channels.empty()) what += " (every channel passes on its own)";
    const std::string head = "Result: FAIL";
    return paint(head, Verdict::fail, style) + wrap(": " + what + ": " + list + ".", style.width, head.size()) + "\n";
}

}  // namespace

std::string render_board_text(const BoardReport& report, const TextStyle& style, bool brief) {
    const Board& board = report.board;
    std::string out = fmt::format("coilfit {} - board: {}\n\n", COILFIT_VERSION,
                                  board.name.empty() ? std::string("unnamed board") : board.name);
    out += fmt::format("Channels ({}, each sized and checked on its own)\n", report.channels.size());
    out += channel_table(report, style) + "\n";
    out += brief ? "Board checks that fail or warn\n"
                 : "Board checks (each at the allowed set of channels on at once that is worst for it)\n";
    out += board_check_table(report, style, brief) + "\n";
    if (!brief) {
        const std::string found = details(report, style);
        if (!found.empty()) out += "What fails or warns\n" + found + "\n";
        out += "Notes\n";
        for (const auto& n : report.notes) out += "  - " + wrap(n, style.width, 4) + "\n";
        for (const BoardCheck& b : report.checks) {
            if (b.check.verdict == Verdict::skip)
                out += "  - " + wrap(b.check.id + " (" + b.subject + "): " + b.check.reason, style.width, 4) + "\n";
        }
        out += "  - " + wrap("`coilfit board BOARD --channel NAME` prints a channel's full report", style.width, 4) +
               "\n\n";
    }
    out += "Cautions\n";
    for (const auto& c : report.cautions) out += "  ! " + wrap(c, style.width, 4) + "\n";
    out += "\n" + result_line(report, style);
    return out;
}

}  // namespace coilfit::io
