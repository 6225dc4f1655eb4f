// Matching a part id the way people type it: exactly, else case-insensitively when that names
// one part; an unknown id is answered with the nearest ids by edit distance.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace coilfit {

// ASCII case folding (ids are registrations such as 2N4401 and our own ASCII names).
[[nodiscard]] std::string fold_case(std::string_view s);
// Levenshtein distance (insertions, deletions, substitutions each cost 1), on folded text.
[[nodiscard]] std::size_t edit_distance(std::string_view a, std::string_view b);

struct IdMatch {
    std::optional<std::string> id;       // the id matched (exactly, or the one case-insensitive match)
    std::vector<std::string> ambiguous;  // several ids equal to it but for case
};
[[nodiscard]] IdMatch match_id(std::string_view wanted, const std::vector<std::string>& ids);
// Up to n ids nearest to wanted, nearest first (ties by id), each within max(2, half the
// length of wanted) edits.
[[nodiscard]] std::vector<std::string> nearest_ids(std::string_view wanted, const std::vector<std::string>& ids,
                                                   std::size_t n = 3);

}  // namespace coilfit
