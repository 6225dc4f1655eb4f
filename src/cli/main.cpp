// coilfit: worst-case sizing of a transistor coil driver on a microcontroller pin.
// main reads the command line (args.cpp) and runs the command; each lives in its own file.
#include <exception>
#include <iostream>

#include "cli/args.hpp"

int main(int argc, char** argv) {
    using namespace coilfit::cli;
    Invocation invocation;
    try {
        if (const auto done = parse_command_line(argc, argv, invocation)) return *done;
        switch (invocation.command) {
            case Command::size:
                return run_size(invocation.size);
            case Command::parts:
                return run_parts(invocation.parts);
            case Command::pick:
                return run_pick(invocation.pick);
            case Command::yield:
                return run_yield(invocation.yield);
            case Command::board:
                return run_board(invocation.board);
        }
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
