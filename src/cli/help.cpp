#include "cli/help.hpp"

#include <algorithm>

#include "coilfit/id_match.hpp"
#include "io/format.hpp"
#include "io/json_read.hpp"

namespace coilfit::cli {
namespace {

constexpr std::size_t indent = 2;
constexpr std::size_t gap = 3;            // between an option's names and its text
constexpr std::size_t widest_names = 30;  // longer names put their text on the next line

std::string item_label(const HelpItem& item) { return item.value.empty() ? item.names : item.names + " " + item.value; }

std::string item_text(const HelpItem& item) {
    return item.def.empty() ? item.text : item.text + " (default " + item.def + ")";
}

}  // namespace

std::string render_help(const HelpScreen& screen, std::size_t width) {
    width = std::max<std::size_t>(width, 60);
    std::string out = "Usage: " + io::wrap(screen.usage, width, 7) + "\n";
    if (!screen.description.empty()) out += "\n" + io::wrap(screen.description, width, 0) + "\n";

    // One column for the texts of all groups, so that the screen reads as one table.
    std::size_t column = 0;
    for (const HelpGroup& g : screen.groups) {
        for (const HelpItem& item : g.items) {
            const std::size_t w = io::display_width(item_label(item));
            if (w <= widest_names) column = std::max(column, w);
        }
    }
    column = std::min(indent + column + gap, width / 2);

    for (const HelpGroup& g : screen.groups) {
        if (g.items.empty()) continue;
        out += "\n" + g.title + "\n";
        for (const HelpItem& item : g.items) {
            const std::string label = item_label(item);
            std::string line(indent, ' ');
            line += label;
            const std::size_t used = indent + io::display_width(label);
            if (used + gap > column) {
                out += line + "\n";
                line.assign(column, ' ');
            } else {
                line.append(column - used, ' ');
            }
            out += line + io::wrap(item_text(item), width, column) + "\n";
        }
    }
    if (!screen.footer.empty()) {
        out += "\n";
        std::size_t start = 0;
        while (start <= screen.footer.size()) {  // one wrapped paragraph per line of the footer
            const std::size_t end = std::min(screen.footer.find('\n', start), screen.footer.size());
            out += io::wrap(std::string_view(screen.footer).substr(start, end - start), width, 0) + "\n";
            start = end + 1;
        }
    }
    return out;
}

std::string nearest_word(std::string_view word, std::span<const std::string> candidates) {
    // A word cut short ("--supply-tol", "yie") means the one candidate it starts.
    std::string prefix_of;
    std::size_t starts = 0;
    for (const std::string& c : candidates) {
        if (word.size() >= 2 && c.starts_with(word)) {
            prefix_of = c;
            ++starts;
        }
    }
    if (starts == 1) return prefix_of;
    std::string best;
    std::size_t best_distance = std::max<std::size_t>(1, word.size() / 3) + 1;
    for (const std::string& c : candidates) {
        const std::size_t d = edit_distance(word, c);
        if (d < best_distance) {
            best_distance = d;
            best = c;
        }
    }
    return best;
}

std::string list_words(const std::vector<std::string>& words) {
    std::string list;
    for (std::size_t i = 0; i < words.size(); ++i)
        list += (i == 0 ? "" : i + 1 == words.size() ? " or " : ", ") + words[i];
    return list;
}

std::string first_word_problem(const std::vector<std::string>& names, int argc, char** argv) {
    if (argc < 2 || argv[1][0] == '\0') return "no command given; expected " + list_words(names);
    const std::string first = argv[1];
    if (first.starts_with("-") && first != "-h" && first != "--help" && first != "--version") {
        return "unknown option " + io::printable(first) + "; a command comes first: " + list_words(names);
    }
    if (!first.starts_with("-") && std::find(names.begin(), names.end(), first) == names.end()) {
        const std::string near = nearest_word(first, names);
        return "unknown command \"" + io::printable(first) + "\"; " +
               (near.empty() ? "expected " + list_words(names) : "did you mean " + near + "?");
    }
    return {};
}

}  // namespace coilfit::cli
