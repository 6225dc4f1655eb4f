// The sets of channels a board allows on at once, and the worst of them for a sum
// (src/method.md "Boards": "the board checks take the worst allowed set").
#include <algorithm>
#include <numeric>

#include "coilfit/board.hpp"

namespace coilfit {
namespace {

// The group each channel belongs to (groups.size() for none).
std::vector<std::size_t> group_of(const Simultaneity& s, std::size_t n) {
    std::vector<std::size_t> g(n, s.groups.size());
    for (std::size_t k = 0; k < s.groups.size(); ++k) {
        for (const std::size_t i : s.groups[k]) {
            if (i < n) g[i] = k;
        }
    }
    return g;
}

// The best set within a pool of candidates: every contributing channel, or the largest max_on
// of them (ties to the earlier channel).
WorstSet best_in_pool(const Simultaneity& s, const std::vector<double>& w, std::vector<std::size_t> pool) {
    pool.erase(std::remove_if(pool.begin(), pool.end(), [&](std::size_t i) { return !(w[i] > 0); }), pool.end());
    if (s.max_on && pool.size() > *s.max_on) {
        std::stable_sort(pool.begin(), pool.end(), [&](std::size_t a, std::size_t b) { return w[a] > w[b]; });
        pool.resize(*s.max_on);
        std::sort(pool.begin(), pool.end());
    }
    WorstSet out;
    for (const std::size_t i : pool) out.sum += w[i];
    out.on = std::move(pool);
    return out;
}

}  // namespace

bool allowed(const Simultaneity& s, const std::vector<bool>& on) {
    const std::size_t count = static_cast<std::size_t>(std::count(on.begin(), on.end(), true));
    if (s.max_on && count > *s.max_on) return false;
    const std::vector<std::size_t> g = group_of(s, on.size());
    std::size_t seen = s.groups.size();
    for (std::size_t i = 0; i < on.size(); ++i) {
        if (!on[i] || g[i] == s.groups.size()) continue;
        if (seen != s.groups.size() && seen != g[i]) return false;  // two groups on together
        seen = g[i];
    }
    return true;
}

WorstSet worst_allowed_set(const Simultaneity& s, const std::vector<double>& weights) {
    const std::size_t n = weights.size();
    if (s.groups.empty()) {
        std::vector<std::size_t> all(n);
        std::iota(all.begin(), all.end(), std::size_t{0});
        return best_in_pool(s, weights, std::move(all));
    }
    // Groups exclude each other: the channels in no group, with at most one group. With weights
    // never negative a group adds to the free channels' sum, so the best pool holds one group
    // (or none, when every group is empty of contributions).
    const std::vector<std::size_t> g = group_of(s, n);
    std::vector<std::size_t> ungrouped;
    for (std::size_t i = 0; i < n; ++i) {
        if (g[i] == s.groups.size()) ungrouped.push_back(i);
    }
    WorstSet best = best_in_pool(s, weights, ungrouped);
    for (std::size_t k = 0; k < s.groups.size(); ++k) {
        std::vector<std::size_t> pool = ungrouped;
        for (std::size_t i = 0; i < n; ++i) {
            if (g[i] == k) pool.push_back(i);
        }
        std::sort(pool.begin(), pool.end());
        WorstSet candidate = best_in_pool(s, weights, std::move(pool));
        if (candidate.sum > best.sum) best = std::move(candidate);
    }
    return best;
}

}  // namespace coilfit
