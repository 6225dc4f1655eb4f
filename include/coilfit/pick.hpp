// Which parts of the table would work? Sizes the spec afresh with every transistor of every
// driver kind (and, for diode clamps, every diode) and ranks the combinations (src/method.md
// "Bipolar drivers", "Data limits"): passing first; within their data before beyond it; then by
// robustness, most robust first: a bipolar design by its base resistor window ratio Rb_max/Rb_min
// and then by the smallest margin of its checks other than saturation (a resistor at the
// window's edge makes the saturation margin small by construction); a design without a window
// ranks as the ratio (1 + m)^2 its smallest margin m would give a centred resistor; then by lower
// pin current, then by ids, so the order is stable and deterministic.
//
// One row per driver: each transistor is tried with every diode of the table (the clamp part
// rarely decides a design) and shown with its best one; PickSettings::all_clamps gives a row per
// transistor and diode pair. pick keeps only the rows it returns: a bounded heap of `top` rows,
// or every row when top is 0 (one per transistor); pick_each hands rows over as they are made,
// in table order, keeping none (for listing every pair of a large table).
#pragma once

#include <cstddef>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "coilfit/check.hpp"
#include "coilfit/parts.hpp"
#include "coilfit/spec.hpp"

namespace coilfit {

struct Candidate {
    std::string transistor;
    std::string driver;                  // npn, darlington, nmos, array
    std::string diode;                   // empty for clamp "none"
    std::string family;                  // "small-signal", "medium-power", "darlington", ...
    std::optional<double> resistor_ohm;  // base or gate resistor
    Verdict verdict = Verdict::fail;     // pass | fail
    std::string worst_check;             // id of the check with the smallest margin
    double worst_margin = 0;
    std::optional<double> window_ratio;  // bipolar: Rb_max / Rb_min
    double margin_other = 0;             // the smallest margin of the checks other than saturation
    bool beyond_data = false;            // a check used a part value beyond the part's data
    double pin_current_max_a = 0;
    std::vector<std::string> failed;  // ids of failed checks
    std::size_t clamps_tried = 1;     // diodes tried behind this transistor (1 with all_clamps)
    std::size_t clamps_passing = 0;   // of which pass
};

struct PickSettings {
    std::size_t top = 0;      // keep only the best N rows (0: every row)
    bool all_clamps = false;  // a row per transistor and diode pair, not one per transistor
};

struct PickResult {
    std::vector<Candidate> candidates;  // best first
    // When nothing passes: one line per transistor family saying why.
    std::vector<std::string> reasons;
    std::size_t rows = 0;         // rows there were, before `top` cut them
    std::size_t passing = 0;      // of which pass
    std::size_t evaluations = 0;  // designs sized (transistor and diode pairs)
};

// Ranks two rows: true when a comes before b (the order above).
[[nodiscard]] bool ranks_before(const Candidate& a, const Candidate& b);

// The family used to group reasons.
[[nodiscard]] std::string transistor_family(const Transistor& part);

// Every row, one per transistor with its best diode, best first.
[[nodiscard]] PickResult pick(const Spec& spec, const Catalogue& catalogue);
[[nodiscard]] PickResult pick(const Spec& spec, const Catalogue& catalogue, const PickSettings& settings);
// Rows as they are made, transistor by transistor in table order (each transistor's pairs
// ranked among themselves with all_clamps); settings.top is not used. The result holds no
// candidates, only the counts and the reasons.
PickResult pick_each(const Spec& spec, const Catalogue& catalogue, const PickSettings& settings,
                     const std::function<void(const Candidate&)>& row);

}  // namespace coilfit
