// Which parts of the table would work? Sizes the spec afresh with every transistor of every
// driver kind (and, for diode clamps, every diode) and ranks the combinations (src/method.md
// "Bipolar drivers", "Data limits"): passing first; within their data before beyond it; then by
// robustness, most robust first: a bipolar design by its base resistor window ratio Rb_max/Rb_min
// and then by the smallest margin of its checks other than saturation (a resistor at the
// window's edge makes the saturation margin small by construction); a design without a window
// ranks as the ratio (1 + m)^2 its smallest margin m would give a centred resistor; then by lower
// pin current, then by ids, so the order is stable and deterministic.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "coilfit/check.hpp"
#include "coilfit/parts.hpp"
#include "coilfit/spec.hpp"

namespace coilfit {

struct Candidate {
    std::string transistor;
    std::string driver;                 // npn, darlington, nmos, array
    std::string diode;                  // empty for clamp "none"
    std::string family;                 // "small-signal", "medium-power", "darlington", ...
    std::optional<double> resistor_ohm;  // base or gate resistor
    Verdict verdict = Verdict::fail;    // pass | fail
    std::string worst_check;            // id of the check with the smallest margin
    double worst_margin = 0;
    std::optional<double> window_ratio;  // bipolar: Rb_max / Rb_min
    double margin_other = 0;            // the smallest margin of the checks other than saturation
    bool beyond_data = false;           // a check used a part value beyond the part's data
    double pin_current_max_a = 0;
    std::vector<std::string> failed;    // ids of failed checks
};

struct PickResult {
    std::vector<Candidate> candidates;  // best first
    // When nothing passes: one line per transistor family saying why.
    std::vector<std::string> reasons;
};

// The family used to group reasons.
[[nodiscard]] std::string transistor_family(const Transistor& part);

[[nodiscard]] PickResult pick(const Spec& spec, const Catalogue& catalogue);

}  // namespace coilfit
