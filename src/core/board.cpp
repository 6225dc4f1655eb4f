// Sizes a board: every channel on its own, then the limits the channels share, each at the worst
// allowed set of channels on at once (src/method.md "Boards: many channels, one supply, one MCU").
#include "coilfit/board.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <map>

#include "board_parts.hpp"

namespace coilfit {
namespace {

// What one channel adds to the board's sums while it is on (sizing.hpp assumption 1: the highest
// of each over the channel's corners, as its report gives them).
board::Load load_of(const SizingReport& r) {
    const Evaluation& e = r.sized.worst;
    board::Load l;
    l.pin_a = std::max(e.driver_at(Corner::cold).pin_current_max_a, e.driver_at(Corner::hot).pin_current_max_a);
    l.coil_a = e.coil_current_max_a();
    for (std::size_t k = 0; k < corner_count; ++k) {
        l.power_w[k] = e.driver.at[k].power_w;
        l.power_beyond[k] = e.driver.at[k].drop_beyond_data;
    }
    return l;
}

// The same spec apart from its name: the repeats of one entry of the board file.
bool same_entry(const BoardChannel& a, const BoardChannel& b) { return a.entry == b.entry; }

Check to_check(CheckId id, const CheckValue& c, std::string message) {
    Check out;
    out.id = std::string(check_id_name(id));
    out.verdict = c.verdict;
    out.unit = check_unit(id);
    out.corner = c.corner;
    out.beyond_data = c.beyond_data;
    if (c.has_value && std::isfinite(c.value)) out.value = c.value;
    if (std::isfinite(c.limit)) out.limit = c.limit;
    if (const double m = c.margin(); std::isfinite(m)) out.margin = m;
    out.message = std::move(message);
    return out;
}

Check skipped(CheckId id, std::string reason) {
    Check out;
    out.id = std::string(check_id_name(id));
    out.unit = check_unit(id);
    out.verdict = Verdict::skip;
    out.reason = reason;
    out.message = std::move(reason);
    return out;
}

// One sum checked against an optional limit (a board's budgets are upper limits).
BoardCheck sum_check(const board::Context& ctx, CheckId id, std::string subject, const std::vector<double>& weights,
                     const std::optional<double>& limit) {
    BoardCheck b;
    b.subject = std::move(subject);
    const WorstSet set = worst_allowed_set(ctx.board.simultaneous, weights);
    b.set = set.on;
    if (!limit) {
        b.check = skipped(id, board::skip_reason(ctx, id, b.subject, set));
    } else {
        const CheckValue c = at_most(set.sum, *limit);
        b.check = to_check(id, c, board::message(ctx, id, b.subject, c, set, weights));
    }
    return b;
}

std::vector<BoardCheck> mcu_checks(const board::Context& ctx) {
    const Board& board = ctx.board;
    std::vector<BoardCheck> out;
    const std::size_t n = board.channels.size();
    for (std::size_t p = 0; p < board.mcu.ports.size(); ++p) {
        std::vector<double> w(n, 0.0);
        bool used = false;
        for (std::size_t i = 0; i < n; ++i) {
            if (board.channels[i].port != p) continue;
            w[i] = ctx.loads[i].pin_a;
            used = true;
        }
        // A port without channels has nothing to check.
        if (used)
            out.push_back(sum_check(ctx, CheckId::port_current, "port " + board.mcu.ports[p].name, w,
                                    board.mcu.ports[p].current_max_a));
    }
    std::vector<double> pins(n);
    for (std::size_t i = 0; i < n; ++i) pins[i] = ctx.loads[i].pin_a;
    out.push_back(sum_check(ctx, CheckId::package_current, "MCU package", pins, board.mcu.package_current_max_a));
    // The coil currents and (assumption 2) the drive currents, of the channels on the board's supply.
    std::vector<double> supply(n, 0.0);
    for (std::size_t i = 0; i < n; ++i) {
        if (board.channels[i].board_supply) supply[i] = ctx.loads[i].coil_a + ctx.loads[i].pin_a;
    }
    out.push_back(sum_check(ctx, CheckId::supply_current, "supply", supply, board.supply_current_max_a));
    return out;
}

// array.power at both ambient corners (each with the channels' dissipation there), the worse kept.
BoardCheck array_power_check(const board::Context& ctx, const board::Package& pkg) {
    const std::size_t n = ctx.board.channels.size();
    std::array<CheckValue, corner_count> c{};
    std::array<WorstSet, corner_count> sets{};
    std::array<double, corner_count> ta{pkg.ambient_lo_c, pkg.ambient_hi_c};
    for (std::size_t k = 0; k < corner_count; ++k) {
        std::vector<double> w(n, 0.0);
        for (const std::size_t i : pkg.channels) w[i] = ctx.loads[i].power_w[k];
        sets[k] = worst_allowed_set(ctx.board.simultaneous, w);
        // Tj = Ta + sum(P) RthJA <= Tj max - margin, and sum(P) <= Pd: the power the package may
        // dissipate at this ambient is the smaller of Pd and (Tj max - margin - Ta) / RthJA.
        const double limit = std::min(pkg.part->pd_w, (pkg.tj_limit_c - ta[k]) / pkg.rth_k_per_w);
        c[k] = at_most(sets[k].sum, limit);
        c[k].corner = static_cast<Corner>(k);
        for (const std::size_t i : sets[k].on) {
            if (ctx.loads[i].power_beyond[k]) mark_beyond_data(c[k]);  // src/method.md "Data limits"
        }
    }
    const std::size_t k = &worse(c[0], c[1], false) == &c[0] ? 0 : 1;
    BoardCheck b;
    b.subject = "array " + pkg.name;
    b.set = sets[k].on;
    b.check = to_check(CheckId::array_power, c[k], board::array_power_message(ctx, pkg, c[k], sets[k], ta[k]));
    return b;
}

std::vector<BoardCheck> array_checks(const board::Context& ctx) {
    std::vector<BoardCheck> out;
    const std::size_t n = ctx.board.channels.size();
    for (const board::Package& pkg : ctx.packages) {
        out.push_back(array_power_check(ctx, pkg));
        std::vector<double> w(n, 0.0);
        for (const std::size_t i : pkg.channels) w[i] = ctx.loads[i].coil_a;
        std::optional<double> limit;
        if (pkg.part->ic_total_max_a) limit = pkg.current_derating * *pkg.part->ic_total_max_a;
        out.push_back(sum_check(ctx, CheckId::array_current, "array " + pkg.name, w, limit));
    }
    return out;
}

std::vector<board::Package> packages_of(const Board& board) {
    std::vector<board::Package> out;
    std::map<std::string, std::size_t> index;
    for (std::size_t i = 0; i < board.channels.size(); ++i) {
        const BoardChannel& ch = board.channels[i];
        const ArrayPart* part = ch.spec.array();
        if (!part || ch.package.empty()) continue;
        auto [it, added] = index.emplace(ch.package, out.size());
        if (added) {
            board::Package p;
            p.name = ch.package;
            p.part = part;
            p.rth_k_per_w = rth_ja(*part);
            p.tj_limit_c = part->tj_max_c - ch.spec.policy.junction_margin_k;
            p.current_derating = ch.spec.policy.current_derating;
            p.ambient_lo_c = ch.spec.ambient.min_c;
            p.ambient_hi_c = ch.spec.ambient.max_c;
            out.push_back(p);
        }
        board::Package& p = out[it->second];
        p.channels.push_back(i);
        p.ambient_lo_c = std::max(p.ambient_lo_c, ch.spec.ambient.min_c);
        p.ambient_hi_c = std::max(p.ambient_hi_c, ch.spec.ambient.max_c);
    }
    return out;
}

}  // namespace

std::size_t BoardReport::failed_channels() const {
    return static_cast<std::size_t>(std::count_if(channels.begin(), channels.end(),
                                                  [](const SizingReport& r) { return r.verdict == Verdict::fail; }));
}

std::size_t BoardReport::failed_board_checks() const {
    return static_cast<std::size_t>(std::count_if(
        checks.begin(), checks.end(), [](const BoardCheck& c) { return c.check.verdict == Verdict::fail; }));
}

BoardReport size_board(const Board& board, const Catalogue& catalogue) {
    BoardReport r;
    r.board = board;
    r.channels.reserve(board.channels.size());
    for (std::size_t i = 0; i < board.channels.size(); ++i) {
        const BoardChannel& ch = board.channels[i];
        if (i > 0 && same_entry(board.channels[i - 1], ch)) {
            // A repeat of the entry before: the same spec under another name, sized once.
            r.channels.push_back(r.channels.back());
            r.channels.back().spec.name = ch.spec.name;
        } else {
            r.channels.push_back(size(ch.spec, catalogue));
        }
    }
    board::Context ctx{r.board, {}, packages_of(r.board)};
    for (const SizingReport& c : r.channels) ctx.loads.push_back(load_of(c));
    r.checks = mcu_checks(ctx);
    for (BoardCheck& c : array_checks(ctx)) r.checks.push_back(std::move(c));
    bool failed = r.failed_channels() > 0 || r.failed_board_checks() > 0;
    for (const SizingReport& c : r.channels) r.has_warnings = r.has_warnings || c.has_warnings;
    for (const BoardCheck& c : r.checks) r.has_warnings = r.has_warnings || c.check.verdict == Verdict::warn;
    r.verdict = failed ? Verdict::fail : Verdict::pass;
    r.quantities = board::quantities(ctx);
    r.notes = board::notes(ctx);
    for (const SizingReport& c : r.channels) {
        for (const std::string& caution : c.cautions) {
            if (std::find(r.cautions.begin(), r.cautions.end(), caution) == r.cautions.end())
                r.cautions.push_back(caution);
        }
    }
    return r;
}

}  // namespace coilfit
