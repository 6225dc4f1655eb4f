// Help screens in coilfit's own layout, and the "did you mean" of usage errors. Plain data in,
// text out: args.cpp (the one file that sees the argument library) fills a HelpScreen.
#pragma once

#include <cstddef>
#include <span>
#include <string>
#include <string_view>
#include <vector>

namespace coilfit::cli {

struct HelpItem {
    std::string names;  // "-o, --output" or "SPEC"
    std::string value;  // "FILE", "text|json", "" for a flag
    std::string text;
    std::string def;  // the default, "" for none
};

struct HelpGroup {
    std::string title;
    std::vector<HelpItem> items;
};

struct HelpScreen {
    std::string usage;  // "coilfit size [SPEC] [options]"
    std::string description;
    std::vector<HelpGroup> groups;
    std::string footer;
};

// Usage line, description, then one block per group, separated by blank lines; every line fits
// `width` columns (descriptions wrap under their own column).
[[nodiscard]] std::string render_help(const HelpScreen& screen, std::size_t width);

// The candidate a mistyped word most likely meant: the only one it is the start of, else the
// nearest within an edit distance of a third of its length (at least 1); "" when none is near.
// "a, b or c".
[[nodiscard]] std::string list_words(const std::vector<std::string>& words);
// What is wrong with the first word of the command line (no command, an option before the
// command, an unknown command with the nearest one); empty when it names a command or asks for
// help or the version.
[[nodiscard]] std::string first_word_problem(const std::vector<std::string>& names, int argc, char** argv);
[[nodiscard]] std::string nearest_word(std::string_view word, std::span<const std::string> candidates);

}  // namespace coilfit::cli
