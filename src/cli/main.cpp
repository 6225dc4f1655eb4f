// coilfit: worst-case sizing of a transistor coil driver on a microcontroller pin.
// main only wires the subcommands; each lives in its own file.
#include <exception>
#include <iostream>

#include "cli/commands.hpp"

int main(int argc, char** argv) {
    using namespace coilfit::cli;
    CLI::App app{"coilfit: sizes and checks a transistor driver for a relay, contactor, solenoid or valve coil on a "
                 "microcontroller pin, at worst case.\nExit codes: 0 every check passed, 1 a check failed, 2 bad usage or input."};
    app.set_version_flag("--version", std::string("coilfit ") + COILFIT_VERSION);
    app.require_subcommand(1);
    // One rule for repeated options, set before any is added so that every option of every
    // subcommand inherits it: the last value given wins (README, "Usage").
    app.option_defaults()->multi_option_policy(CLI::MultiOptionPolicy::TakeLast);

    SizeOptions size_options;
    PartsOptions parts_options;
    PickOptions pick_options;
    YieldOptions yield_options;
    CLI::App* size_cmd = setup_size(app, size_options);
    CLI::App* parts_cmd = setup_parts(app, parts_options);
    CLI::App* pick_cmd = setup_pick(app, pick_options);
    CLI::App* yield_cmd = setup_yield(app, yield_options);

    try {
        app.parse(argc, argv);
    } catch (const CLI::ParseError& e) {
        const int code = app.exit(e);  // prints help, version or the usage error
        return code == 0 ? exit_pass : exit_bad_input;
    }

    try {
        if (size_cmd->parsed()) return run_size(size_options);
        if (parts_cmd->parsed()) return run_parts(parts_options);
        if (pick_cmd->parsed()) return run_pick(pick_options);
        if (yield_cmd->parsed()) return run_yield(yield_options);
    } catch (const coilfit::InputError& e) {
        std::cerr << "coilfit: error: " << message_line(e.what()) << "\n";
        return exit_bad_input;
    } catch (const std::exception& e) {
        std::cerr << "coilfit: error: " << message_line(e.what()) << "\n";
        return exit_bad_input;
    } catch (...) {
        // Nothing escapes main (style.md, "Errors").
        std::cerr << "coilfit: error: an unexpected internal error\n";
        return exit_bad_input;
    }
    return exit_bad_input;
}
