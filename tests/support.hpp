// Shared test fixtures: the shipped parts table (loaded once) and the shipped examples.
#pragma once

#include <string>

#include "coilfit/spec.hpp"
#include "io/parts_io.hpp"
#include "io/spec_io.hpp"

namespace coilfit::test {

// The parts table under parts/, read once for the whole test run.
inline const io::PartsTable& shipped_table() {
    static const io::PartsTable table = io::load_parts(COILFIT_TEST_PARTS_DIR);
    return table;
}

// A spec file read against the shipped table.
inline Spec load_spec_file(const std::string& path) {
    return io::read_spec(io::load_spec_document(path), shipped_table());
}

// One of examples/*.json by file name.
inline Spec load_example(const std::string& name) {
    return load_spec_file(std::string(COILFIT_TEST_EXAMPLES_DIR) + "/" + name);
}

}  // namespace coilfit::test
