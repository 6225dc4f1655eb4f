// pick (include/coilfit/pick.hpp): every candidate agrees with sizing it alone; stable ranking.
#include <doctest/doctest.h>

#include "coilfit/report.hpp"

#include <algorithm>

#include "coilfit/pick.hpp"
#include "coilfit/sizing.hpp"
#include "flat_figures.hpp"
#include "support.hpp"

using namespace coilfit;
namespace io = coilfit::io;

namespace {

struct Setup {
    const io::PartsTable& table = test::shipped_table();
    Spec spec;
};

Setup load(const std::string& example) {
    Setup s;
    s.spec = test::load_example(example);
    return s;
}

}  // namespace

TEST_SUITE("pick") {
    TEST_CASE("every candidate pick reports agrees with sizing that combination alone") {
        for (const char* example : {"greenhouse-valve.json", "garage-door.json", "dust-extractor.json"}) {
            CAPTURE(example);
            const Setup s = load(example);
            const PickResult result = pick(s.spec, s.table.catalogue, PickSettings{0, true});
            // Every transistor of every driver kind with every diode; an array channel with its own diode.
            const Catalogue& cat = s.table.catalogue;
            CHECK(result.candidates.size() ==
                  (cat.bipolars.size() + cat.mosfets.size()) * cat.diodes.size() + cat.arrays.size());
            for (const Candidate& c : result.candidates) {
                CAPTURE(c.transistor);
                CAPTURE(c.diode);
                Spec alone = s.spec;
                alone.transistor = *s.table.catalogue.find_transistor(c.transistor);
                // pick gives a transistor of another kind its own kind's forced-gain default.
                if (transistor_kind_name(alone.transistor) != transistor_kind_name(s.spec.transistor))
                    alone.policy.forced_gain.reset();
                if (const ArrayPart* a = alone.array()) {
                    alone.clamp = ClampSpec{};
                    alone.clamp.diode = a->diode;
                } else {
                    alone.clamp.diode = *s.table.catalogue.find_diode(c.diode);
                }
                const SizingReport r = size(alone, s.table.catalogue);
                CHECK(r.verdict == c.verdict);
                CHECK(r.resistor.value_ohm == c.resistor_ohm);
                std::vector<std::string> failed;
                for (const auto& ch : r.checks) {
                    if (ch.verdict == Verdict::fail) failed.push_back(ch.id);
                }
                CHECK(failed == c.failed);
                const Check* worst = r.worst_check();
                REQUIRE(worst != nullptr);
                CHECK(worst->id == c.worst_check);
            }
        }
    }

    TEST_CASE("passing combinations come first, within their data first, ranked by robustness") {
        const Setup s = load("greenhouse-valve.json");
        const PickResult result = pick(s.spec, s.table.catalogue);
        REQUIRE_FALSE(result.candidates.empty());
        CHECK(result.candidates.front().verdict == Verdict::pass);
        CHECK(result.reasons.empty());
        for (std::size_t i = 1; i < result.candidates.size(); ++i) {
            const Candidate& a = result.candidates[i - 1];
            const Candidate& b = result.candidates[i];
            if (a.verdict != b.verdict) {
                CHECK(a.verdict == Verdict::pass);
            } else if (a.beyond_data != b.beyond_data) {
                CHECK_FALSE(a.beyond_data);
            } else if (a.verdict == Verdict::pass) {
                // A bipolar design by its window ratio, another by (1 + its smallest margin)^2.
                const auto r = [](const Candidate& c) {
                    return c.window_ratio ? *c.window_ratio : (1 + c.worst_margin) * (1 + c.worst_margin);
                };
                CHECK(r(a) >= r(b));
                if (r(a) == r(b)) CHECK(a.margin_other >= b.margin_other);
            } else {
                CHECK(a.worst_margin >= b.worst_margin);
            }
        }
    }

    TEST_CASE("one row per transistor: its best diode, the rows and counts of every pair behind it") {
        for (const char* example : {"greenhouse-valve.json", "garage-door.json", "dust-extractor.json"}) {
            CAPTURE(example);
            const Setup s = load(example);
            const Catalogue& cat = s.table.catalogue;
            const PickResult rows = pick(s.spec, cat);
            const PickResult pairs = pick(s.spec, cat, PickSettings{0, true});
            CHECK(rows.candidates.size() == cat.bipolars.size() + cat.mosfets.size() + cat.arrays.size());
            CHECK(rows.evaluations == pairs.candidates.size());
            for (const Candidate& row : rows.candidates) {
                CAPTURE(row.transistor);
                // The row is the first of its transistor's pairs in the full ranking.
                const auto first = std::find_if(pairs.candidates.begin(), pairs.candidates.end(),
                                                [&](const Candidate& p) { return p.transistor == row.transistor; });
                REQUIRE(first != pairs.candidates.end());
                CHECK(first->diode == row.diode);
                CHECK(first->verdict == row.verdict);
                const auto n = std::count_if(pairs.candidates.begin(), pairs.candidates.end(),
                                             [&](const Candidate& p) { return p.transistor == row.transistor; });
                const auto passing = std::count_if(
                    pairs.candidates.begin(), pairs.candidates.end(),
                    [&](const Candidate& p) { return p.transistor == row.transistor && p.verdict == Verdict::pass; });
                CHECK(row.clamps_tried == static_cast<std::size_t>(n));
                CHECK(row.clamps_passing == static_cast<std::size_t>(passing));
            }
        }
    }

    TEST_CASE("--top keeps the best N of the full ranking, and streaming hands over every pair") {
        const Setup s = load("garage-door.json");
        const Catalogue& cat = s.table.catalogue;
        const PickResult all = pick(s.spec, cat, PickSettings{0, true});
        for (const std::size_t top : {std::size_t{1}, std::size_t{7}, std::size_t{40}, all.candidates.size() + 5}) {
            CAPTURE(top);
            const PickResult best = pick(s.spec, cat, PickSettings{top, true});
            REQUIRE(best.candidates.size() == std::min(top, all.candidates.size()));
            CHECK(best.rows == all.candidates.size());
            for (std::size_t i = 0; i < best.candidates.size(); ++i) {
                CHECK(best.candidates[i].transistor == all.candidates[i].transistor);
                CHECK(best.candidates[i].diode == all.candidates[i].diode);
            }
        }
        std::size_t streamed = 0;
        std::size_t passing = 0;
        const PickResult counts = pick_each(s.spec, cat, PickSettings{0, true}, [&](const Candidate& c) {
            ++streamed;
            passing += c.verdict == Verdict::pass ? 1U : 0U;
        });
        CHECK(counts.candidates.empty());
        CHECK(streamed == all.candidates.size());
        CHECK(counts.passing == passing);
    }

    TEST_CASE("the ranking is deterministic") {
        const Setup s = load("dust-extractor.json");
        const PickResult a = pick(s.spec, s.table.catalogue);
        const PickResult b = pick(s.spec, s.table.catalogue);
        REQUIRE(a.candidates.size() == b.candidates.size());
        for (std::size_t i = 0; i < a.candidates.size(); ++i) {
            CHECK(a.candidates[i].transistor == b.candidates[i].transistor);
            CHECK(a.candidates[i].diode == b.candidates[i].diode);
        }
    }

    TEST_CASE("when nothing passes, each family gets one line saying why") {
        Setup s = load("garage-door.json");
        s.spec.supply.voltage_v = 6.0;  // a 12 V relay on a 6 V supply: no driver pulls it in
        const PickResult result = pick(s.spec, s.table.catalogue);
        CHECK(std::none_of(result.candidates.begin(), result.candidates.end(),
                           [](const Candidate& c) { return c.verdict == Verdict::pass; }));
        REQUIRE_FALSE(result.reasons.empty());
        for (const auto& r : result.reasons) CHECK(r.rfind("every ", 0) == 0);
    }

    TEST_CASE("a pin below Vbe(sat) is named as the reason, and a Darlington is not offered for it") {
        Setup s = load("greenhouse-valve.json");
        s.spec.pin.vdd_v = 0.7;  // 0.665 V at its low tolerance: under every Vbe(sat) of the table
        s.spec.pin.voh_v.reset();
        s.spec.pin.voh_current_a.reset();
        const PickResult result = pick(s.spec, s.table.catalogue);
        REQUIRE_FALSE(result.reasons.empty());
        bool bipolar_seen = false;
        for (const auto& r : result.reasons) {
            CAPTURE(r);
            CHECK(r.find("Darlington") == std::string::npos);
            if (r.find("MOSFET part:") != std::string::npos || r.find("array part:") != std::string::npos) continue;
            bipolar_seen = true;
            CHECK(r.find("does not reach their Vbe(sat)") != std::string::npos);
        }
        CHECK(bipolar_seen);
    }

    TEST_CASE("the Darlington family's reason does not suggest a Darlington") {
        Setup s = load("garage-door.json");
        s.spec.pin.max_current_a = 0.00002;  // a 20 uA pin: too little even for a Darlington
        const PickResult result = pick(s.spec, s.table.catalogue);
        bool seen = false;
        for (const auto& r : result.reasons) {
            if (r.rfind("every darlington part: ", 0) != 0) continue;
            seen = true;
            CAPTURE(r);
            CHECK(r.find("Darlington") == std::string::npos);
        }
        CHECK(seen);
    }
}
