// Each subcommand: an options struct, setup_X(CLI::App&, XOptions&) and run_X(const XOptions&).
#pragma once

#include <CLI/CLI.hpp>

#include "cli/common.hpp"

namespace coilfit::cli {

struct SizeOptions {
    SpecOptions spec;
    CommonOptions common;
    bool strict = false;
    std::string netlist;  // --netlist FILE
    std::string plot;     // --plot FILE.svg
};
CLI::App* setup_size(CLI::App& app, SizeOptions& options);
int run_size(const SizeOptions& options);

struct PartsOptions {
    CommonOptions common;
    std::string kind;  // npn, darlington, diode kinds, zener, coil, pin; or an id
    std::string id;
};
CLI::App* setup_parts(CLI::App& app, PartsOptions& options);
int run_parts(const PartsOptions& options);

struct PickOptions {
    SpecOptions spec;
    CommonOptions common;
    std::size_t top = 0;  // 0: all
};
CLI::App* setup_pick(CLI::App& app, PickOptions& options);
int run_pick(const PickOptions& options);

struct YieldOptions {
    SpecOptions spec;
    CommonOptions common;
    std::uint64_t samples = 100000;
    std::uint64_t seed = 1;
    std::string distribution = "uniform";
    std::string conditions = "worst";  // worst | sampled
    unsigned jobs = 0;  // 0: all cores
};
CLI::App* setup_yield(CLI::App& app, YieldOptions& options);
int run_yield(const YieldOptions& options);

}  // namespace coilfit::cli
