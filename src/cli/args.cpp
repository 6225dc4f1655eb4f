// The command line, wired with CLI11. This is the only file that includes it: the library is
// header-only on Debian, and one translation unit compiles it once. Help screens are ours
// (help.cpp); this file only reads the options out of the library for them.
#include "cli/args.hpp"

#include <algorithm>
#include <cstdint>
#include <iostream>

#include <CLI/CLI.hpp>

#include "cli/help.hpp"
#include "cli/spec_flags.hpp"
#include "io/json_read.hpp"

namespace coilfit::cli {
namespace {

const std::string general_group = "General";

// Accepts only plain decimal digits within [min, max]: CLI11 alone would wrap "-1" round into a
// huge unsigned value and clamp an overflow silently.
CLI::Validator whole_number(std::uint64_t min, std::uint64_t max) {
    return CLI::Validator(
        [min, max](std::string& s) -> std::string {
            const bool digits = !s.empty() && s.size() <= 20 &&
                                std::all_of(s.begin(), s.end(), [](char ch) { return ch >= '0' && ch <= '9'; });
            std::uint64_t v = 0;
            bool overflow = false;
            for (char ch : s) {
                const auto d = static_cast<std::uint64_t>(ch - '0');
                if (!digits) break;
                if (v > (UINT64_MAX - d) / 10) overflow = true;
                v = v * 10 + d;
            }
            if (!digits || overflow || v < min || v > max) {
                return "expected a whole number from " + std::to_string(min) + " to " + std::to_string(max) +
                       ", got \"" + io::printable(s) + "\"";
            }
            return std::string();
        },
        "");
}

// A file name: anything but an empty text (an empty --parts must not fall back to the default).
CLI::Validator file_name() {
    return CLI::Validator(
        [](std::string& s) {
            return s.empty() ? std::string("expected a file name, got an empty text") : std::string();
        },
        "");
}

// One of a few words, in our wording ("expected text or json, got \"xml\"").
CLI::Validator one_of(const std::vector<std::string>& words) {
    return CLI::Validator(
        [words](std::string& s) -> std::string {
            if (std::find(words.begin(), words.end(), s) != words.end()) return std::string();
            return "expected " + list_words(words) + ", got \"" + io::printable(s) + "\"";
        },
        "");
}

void add_spec_options(CLI::App& app, SpecOptions& options) {
    app.add_option("SPEC", options.spec_path,
                   "spec file (coilfit.spec/1), or - for standard input; the Spec flags override its fields, "
                   "and without a file they give the whole spec");
    const auto flags = spec_flags();
    options.storage.resize(flags.size());
    for (std::size_t i = 0; i < flags.size(); ++i) {
        const SpecFlag& f = flags[i];
        auto* opt = app.add_option(f.flag, options.storage[i], f.help)
                        ->group(std::string(spec_flag_group(f.path)))
                        ->type_name(f.value)
                        ->default_str(f.def)
                        ->multi_option_policy(CLI::MultiOptionPolicy::TakeLast);
        const std::string path = f.path;
        const std::string flag = f.flag;
        opt->each([&options, path, flag](const std::string& value) {
            options.values.emplace_back(path, value);
            options.flag_of.emplace_back(path, flag);
        });
    }
    // Unsetting from the command line: the file's pull-down (or a preset's) is removed.
    app.add_flag_callback(
           "--no-pulldown",
           [&options] {
               options.values.emplace_back("pulldown", "none");
               options.flag_of.emplace_back("pulldown", "--no-pulldown");
           },
           "no base-emitter pull-down, whatever the file gives (a bipolar driver's; an nmos gate keeps one)")
        ->group(std::string(spec_flag_group("pulldown")));
}

void add_common_options(CLI::App& app, CommonOptions& options, bool with_output) {
    app.add_option("--parts", options.parts_path, "parts table file or folder (never empty)")
        ->group(general_group)
        ->check(file_name())
        ->type_name("PATH")
        ->default_str("$COILFIT_PARTS, else the installed table");
    app.add_option("--format", options.format, "output format")
        ->group(general_group)
        ->type_name("text|json")
        ->default_str("text")
        ->check(one_of({"text", "json"}));
    if (with_output) {
        app.add_option("-o,--output", options.output,
                       "write to FILE instead of standard output (- is standard output; a file is replaced atomically, "
                       "a device or FIFO written; never an input of the run)")
            ->group(general_group)
            ->type_name("FILE")
            ->check(file_name());
    }
}

CLI::App* setup_size(CLI::App& app, SizeOptions& options) {
    CLI::App* cmd = app.add_subcommand("size",
                                       "Size and check one driver channel at worst case. Flags override the "
                                       "spec file's fields; without a file they give the whole spec.");
    cmd->add_flag("--strict", options.strict, "warnings fail too (exit 1)")->group("Size");
    cmd->add_flag("--brief", options.brief, "text: only the verdict, the design and the failing or warning checks")
        ->group("Size");
    cmd->add_option("--netlist", options.netlist,
                    "also write a SPICE netlist of the sized circuit to FILE (written like --output)")
        ->group("Size")
        ->type_name("FILE")
        ->check(file_name());
    cmd->add_option(
           "--plot", options.plot,
           "also draw the turn-off transient of every clamp option (coil current and collector voltage against "
           "time) into FILE.svg (written like --output); needs coil.inductance")
        ->group("Size")
        ->type_name("FILE.svg")
        ->check(file_name());
    add_common_options(*cmd, options.common, true);
    add_spec_options(*cmd, options.spec);
    return cmd;
}

CLI::App* setup_pick(CLI::App& app, PickOptions& options) {
    CLI::App* cmd = app.add_subcommand("pick",
                                       "Try every transistor (and diode) of the parts table against a spec; "
                                       "list the combinations, passing ones first, most robust first.");
    cmd->add_option("--top", options.top, "list only the best N rows, a whole number")
        ->group("Pick")
        ->type_name("N")
        ->default_str("0: all")
        ->check(whole_number(0, 1'000'000'000));
    cmd->add_flag("--all-clamps", options.all_clamps,
                  "a row for every transistor and diode pair, not one per transistor")
        ->group("Pick");
    add_common_options(*cmd, options.common, true);
    add_spec_options(*cmd, options.spec);
    return cmd;
}

CLI::App* setup_yield(CLI::App& app, YieldOptions& options) {
    CLI::App* cmd = app.add_subcommand(
        "yield",
        "Statistical pass rate of the sized design over the part spreads (Monte Carlo); exit 0 when every "
        "sample passed, 1 when any failed, 2 on bad input.");
    const std::string group = "Yield";
    cmd->add_option("--samples", options.samples, "number of samples")
        ->group(group)
        ->type_name("N")
        ->default_str("100000")
        ->check(whole_number(1, 1'000'000'000'000));
    cmd->add_option("--seed", options.seed,
                    "seed of the random numbers, 0 to 2^64-1; the same seed gives the same result")
        ->group(group)
        ->type_name("S")
        ->default_str("1")
        ->check(whole_number(0, UINT64_MAX));
    cmd->add_option("--distribution", options.distribution,
                    "uniform within each tolerance, or normal with the tolerance at 3 sigma, cut off there")
        ->group(group)
        ->type_name("uniform|normal")
        ->default_str("uniform")
        ->check(one_of({"uniform", "normal"}));
    cmd->add_option("--conditions", options.conditions,
                    "worst: hold supply, ambient and pin VDD at each check's worst corner and draw only part "
                    "spreads; sampled: draw them too")
        ->group(group)
        ->type_name("worst|sampled")
        ->default_str("worst")
        ->check(one_of({"worst", "sampled"}));
    cmd->add_option("-j,--jobs", options.jobs, "threads to use; the result does not depend on it")
        ->group(group)
        ->type_name("J")
        ->default_str("0: all cores")
        ->check(whole_number(0, 4096));
    add_common_options(*cmd, options.common, true);
    add_spec_options(*cmd, options.spec);
    return cmd;
}

CLI::App* setup_parts(CLI::App& app, PartsOptions& options) {
    CLI::App* cmd = app.add_subcommand("parts", "List the parts table, or show one part or preset in full.");
    cmd->add_option("KIND", options.kind,
                    "a kind, singular or plural: transistor, npn, darlington, nmos (mosfet), array, diode, rectifier, "
                    "fast, signal, schottky, zener, tvs, coil, pin, preset, relay or contactor; or a part id");
    cmd->add_option("ID", options.id, "a part id to show in full (case does not matter when the id is unique)");
    add_common_options(*cmd, options.common, false);
    return cmd;
}

CLI::App* setup_board(CLI::App& app, BoardOptions& options) {
    CLI::App* cmd = app.add_subcommand("board",
                                       "Size every channel of a board file and check the limits they share (port, "
                                       "package, supply, array package) at the worst set of channels on at once.");
    cmd->add_option("BOARD", options.board_path, "board file (coilfit.board/1), or - for standard input")->required();
    const std::string group = "Board";
    cmd->add_flag("--brief", options.brief, "the channel lines, the checks that fail or warn, and the verdict")
        ->group(group);
    cmd->add_flag("--strict", options.strict, "warnings fail too (exit 1)")->group(group);
    cmd->add_option("--channel", options.channel,
                    "print one channel's full report (its name, its pin, or an entry's name)")
        ->group(group)
        ->type_name("NAME");
    add_common_options(*cmd, options.common, true);
    return cmd;
}

// "coilfit size" for a subcommand, "coilfit" for the program.
std::string command_path(const CLI::App* app) {
    return app->get_parent() == nullptr ? std::string("coilfit") : "coilfit " + app->get_name();
}

// Our help screen, from what the library holds.
class HelpFormatter : public CLI::Formatter {
public:
    std::string make_help(const CLI::App* app, std::string /*name*/, CLI::AppFormatMode /*mode*/) const override {
        HelpScreen screen;
        screen.description = app->get_description();
        const auto positionals = app->get_options([](const CLI::Option* o) { return o->get_positional(); });
        screen.usage = command_path(app);
        if (app->get_parent() == nullptr) {
            screen.usage += " COMMAND [options]";
            HelpGroup commands{"Commands", {}};
            for (const CLI::App* sub : app->get_subcommands([](const CLI::App*) { return true; })) {
                commands.items.push_back({sub->get_name(), "", first_sentence(sub->get_description()), ""});
            }
            screen.groups.push_back(commands);
            screen.footer =
                "Exit codes: 0 every check passed (warnings allowed), 1 a check failed, 2 bad usage or input.\n"
                "`coilfit COMMAND --help` lists a command's options; `man coilfit` describes the spec and board files.";
        } else {
            for (const CLI::Option* p : positionals) screen.usage += " [" + p->get_name() + "]";
            screen.usage += " [options]";
        }
        if (!positionals.empty()) {
            HelpGroup args{"Arguments", {}};
            for (const CLI::Option* p : positionals)
                args.items.push_back({p->get_name(), "", p->get_description(), ""});
            screen.groups.push_back(args);
        }
        add_option_groups(app, screen);
        return render_help(screen, text_width());
    }

private:
    static std::string first_sentence(const std::string& s) {
        const std::size_t end = s.find(". ");
        std::string out = end == std::string::npos ? s : s.substr(0, end);
        const std::size_t semicolon = out.find("; ");
        if (semicolon != std::string::npos) out.resize(semicolon);
        if (!out.empty() && out.back() == '.') out.pop_back();
        if (!out.empty()) out[0] = static_cast<char>(std::tolower(static_cast<unsigned char>(out[0])));
        return out;
    }

    static HelpItem item_of(const CLI::Option* o) {
        std::string names;
        for (const std::string& s : o->get_snames()) names += "-" + s + ", ";
        for (const std::string& l : o->get_lnames()) names += "--" + l + ", ";
        if (names.size() >= 2) names.resize(names.size() - 2);
        const bool flag = o->get_type_size_max() == 0;
        return {names, flag ? "" : o->get_type_name(), o->get_description(), o->get_default_str()};
    }

    // Groups in the order their first option was added (the command's own options first); the
    // help flag closes the General group.
    static void add_option_groups(const CLI::App* app, HelpScreen& screen) {
        const CLI::Option* help = app->get_help_ptr();
        const CLI::Option* version = app->get_option_no_throw("--version");
        const auto options = app->get_options(
            [help, version](const CLI::Option* o) { return !o->get_positional() && o != help && o != version; });
        std::vector<HelpGroup> groups;
        for (const CLI::Option* o : options) {
            auto it = std::find_if(groups.begin(), groups.end(),
                                   [o](const HelpGroup& g) { return g.title == o->get_group(); });
            if (it == groups.end()) it = groups.insert(groups.end(), HelpGroup{o->get_group(), {}});
            it->items.push_back(item_of(o));
        }
        if (help != nullptr) {
            auto it =
                std::find_if(groups.begin(), groups.end(), [](const HelpGroup& g) { return g.title == general_group; });
            if (it == groups.end()) it = groups.insert(groups.end(), HelpGroup{general_group, {}});
            it->items.push_back(item_of(help));
            if (version != nullptr) it->items.push_back(item_of(version));
        }
        for (HelpGroup& g : groups) screen.groups.push_back(std::move(g));
    }
};

std::vector<std::string> subcommand_names(const CLI::App& app) {
    std::vector<std::string> names;
    for (const CLI::App* sub : app.get_subcommands([](const CLI::App*) { return true; }))
        names.push_back(sub->get_name());
    return names;
}

// The usage error in our words, for the command that was being read. `extras` are the words no
// option took, in the order given.
std::string usage_message(const CLI::ParseError& e, const CLI::App* sub, const std::vector<std::string>& extras) {
    if (dynamic_cast<const CLI::ExtrasError*>(&e) != nullptr && !extras.empty()) {
        const std::string& word = extras.front();
        if (word.starts_with("-") && sub != nullptr) {
            std::vector<std::string> flags;
            for (const CLI::Option* o : sub->get_options()) {
                for (const std::string& l : o->get_lnames()) flags.push_back("--" + l);
            }
            const std::string bare = word.substr(0, word.find('='));
            const std::string near = nearest_word(bare, flags);
            return "unknown option " + bare + (near.empty() ? "" : "; did you mean " + near + "?");
        }
        return "unexpected argument \"" + word + "\"";
    }
    std::string what = e.what();
    if (dynamic_cast<const CLI::ArgumentMismatch*>(&e) != nullptr) {
        const std::size_t colon = what.find(": ");
        return (colon == std::string::npos ? what : what.substr(0, colon)) + ": expected a value";
    }
    return what;  // ValidationError, ConversionError, RequiredError: "--flag: what was wrong"
}

}  // namespace

std::optional<int> parse_command_line(int argc, char** argv, Invocation& into) {
    CLI::App app{
        "Sizes and checks the transistor driver, drive resistor and flyback clamp of a relay, contactor, "
        "solenoid or valve coil on a microcontroller pin, at worst case."};
    app.formatter(std::make_shared<HelpFormatter>());
    app.set_help_flag("-h,--help", "show this help")->group(general_group);
    app.set_version_flag("--version", std::string("coilfit ") + COILFIT_VERSION, "print the version")
        ->group(general_group);
    app.require_subcommand(1);
    // One rule for repeated options, set before any is added so that every option of every
    // subcommand inherits it: the last value given wins (README, "Usage").
    app.option_defaults()->multi_option_policy(CLI::MultiOptionPolicy::TakeLast);

    const std::vector<std::pair<CLI::App*, Command>> commands{
        {setup_size(app, into.size), Command::size},    {setup_pick(app, into.pick), Command::pick},
        {setup_yield(app, into.yield), Command::yield}, {setup_board(app, into.board), Command::board},
        {setup_parts(app, into.parts), Command::parts},
    };
    for (const auto& [cmd, id] : commands) cmd->get_help_ptr()->description("show this help")->group(general_group);

    // A first word that is no command: say so, and which command it may have meant.
    const std::vector<std::string> names = subcommand_names(app);
    if (const std::string problem = first_word_problem(names, argc, argv); !problem.empty()) {
        std::cerr << "coilfit: error: " << problem << " (see coilfit --help)\n";
        return exit_bad_input;
    }

    try {
        app.parse(argc, argv);
    } catch (const CLI::CallForHelp&) {
        std::cout << app.help();
        return exit_pass;
    } catch (const CLI::CallForVersion& e) {
        std::cout << e.what() << "\n";
        return exit_pass;
    } catch (const CLI::ParseError& e) {
        const CLI::App* sub = nullptr;
        for (const auto& [cmd, id] : commands) {
            if (cmd->parsed()) sub = cmd;
        }
        if (sub == nullptr && e.get_name() == "RequiredError") {
            std::cerr << "coilfit: error: no command given; expected " << list_words(names)
                      << " (see coilfit --help)\n";
            return exit_bad_input;
        }
        std::vector<std::string> extras = app.remaining(true);
        std::cerr << "coilfit: error: " << usage_message(e, sub, extras) << " (see " << command_path(sub ? sub : &app)
                  << " --help)\n";
        return exit_bad_input;
    }
    for (const auto& [cmd, id] : commands) {
        if (cmd->parsed()) {
            into.command = id;
            return std::nullopt;
        }
    }
    return exit_bad_input;
}

}  // namespace coilfit::cli
