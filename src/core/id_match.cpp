#include "coilfit/id_match.hpp"

#include <algorithm>
#include <numeric>

namespace coilfit {

std::string fold_case(std::string_view s) {
    std::string out(s);
    for (char& c : out) {
        if (c >= 'A' && c <= 'Z') c = static_cast<char>(c - 'A' + 'a');
    }
    return out;
}

std::size_t edit_distance(std::string_view a_in, std::string_view b_in) {
    // Wagner-Fischer, one row (closed-form dynamic programme of the Levenshtein distance).
    const std::string a = fold_case(a_in);
    const std::string b = fold_case(b_in);
    std::vector<std::size_t> row(b.size() + 1);
    std::iota(row.begin(), row.end(), std::size_t{0});
    for (std::size_t i = 1; i <= a.size(); ++i) {
        std::size_t diagonal = row[0];
        row[0] = i;
        for (std::size_t j = 1; j <= b.size(); ++j) {
            const std::size_t up = row[j];
            row[j] = std::min({row[j] + 1, row[j - 1] + 1, diagonal + (a[i - 1] == b[j - 1] ? 0U : 1U)});
            diagonal = up;
        }
    }
    return row[b.size()];
}

IdMatch match_id(std::string_view wanted, const std::vector<std::string>& ids) {
    IdMatch m;
    if (std::find(ids.begin(), ids.end(), wanted) != ids.end()) {
        m.id = std::string(wanted);
        return m;
    }
    const std::string folded = fold_case(wanted);
    for (const auto& id : ids) {
        if (fold_case(id) == folded) m.ambiguous.push_back(id);
    }
    if (m.ambiguous.size() == 1) {
        m.id = m.ambiguous.front();
        m.ambiguous.clear();
    }
    return m;
}

std::vector<std::string> nearest_ids(std::string_view wanted, const std::vector<std::string>& ids, std::size_t n) {
    std::vector<std::pair<std::size_t, std::string>> scored;
    scored.reserve(ids.size());
    for (const auto& id : ids) scored.emplace_back(edit_distance(wanted, id), id);
    std::sort(scored.begin(), scored.end());
    // Only ids within half the typed length (at least 2 edits) are offered: "NOPE" has no near id.
    const std::size_t within = std::max<std::size_t>(2, wanted.size() / 2);
    std::vector<std::string> out;
    for (std::size_t i = 0; i < scored.size() && i < n && scored[i].first <= within; ++i)
        out.push_back(scored[i].second);
    return out;
}

}  // namespace coilfit
