// Internal to pick: one line per family of parts saying why none of them passes.
#pragma once

#include <map>
#include <string>
#include <vector>

#include "coilfit/pick.hpp"
#include "coilfit/sizing.hpp"

namespace coilfit::pick_detail {

class FamilyFailures {
public:
    // Counts the candidate's first failure (its driver-side one when it has one) for its family.
    void add(const Candidate& c, const Evaluation& e);
    // "every small-signal part: ..." for each family, worded by its most frequent failure.
    [[nodiscard]] std::vector<std::string> reasons(const Spec& spec) const;

private:
    std::map<std::string, std::map<std::string, int>> counts_;
    std::map<std::string, Evaluation> examples_;  // family|check -> one evaluation to word it
};

}  // namespace coilfit::pick_detail
