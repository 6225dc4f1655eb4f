// Each subcommand: an options struct and run_X(const XOptions&). The flags that fill the structs
// live in args.cpp, the one file that sees the argument library.
#pragma once

#include <cstdint>
#include <string>

#include "cli/common.hpp"

namespace coilfit::cli {

struct SizeOptions {
    SpecOptions spec;
    CommonOptions common;
    bool strict = false;
    bool brief = false;   // --brief: verdict, design, failing and warning checks
    std::string netlist;  // --netlist FILE
    std::string plot;     // --plot FILE.svg
};
int run_size(const SizeOptions& options);

struct PartsOptions {
    CommonOptions common;
    std::string kind;  // npn, darlington, diode kinds, zener, coil, pin; or an id
    std::string id;
};
int run_parts(const PartsOptions& options);

struct PickOptions {
    SpecOptions spec;
    CommonOptions common;
    std::size_t top = 0;      // 0: all
    bool all_clamps = false;  // --all-clamps: every transistor and diode pair
};
int run_pick(const PickOptions& options);

struct YieldOptions {
    SpecOptions spec;
    CommonOptions common;
    std::uint64_t samples = 100000;
    std::uint64_t seed = 1;
    std::string distribution = "uniform";
    std::string conditions = "worst";  // worst | sampled
    unsigned jobs = 0;                 // 0: all cores
};
int run_yield(const YieldOptions& options);

struct BoardOptions {
    std::string board_path;
    CommonOptions common;
    bool brief = false;
    bool strict = false;
    std::string channel;  // --channel NAME: that channel's full report
};
int run_board(const BoardOptions& options);

}  // namespace coilfit::cli
