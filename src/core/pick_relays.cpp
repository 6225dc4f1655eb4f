// pick over the relays of the table: an outer loop that calls pick() once per relay record.
#include "coilfit/pick_relays.hpp"

#include <algorithm>

namespace coilfit {
namespace {

// Why a relay's best combination fails: its failed checks, contact checks first.
std::string reason_for(const RelayRecord& relay, const PickResult& r) {
    if (r.candidates.empty()) return display_id(relay) + ": no transistor of the table to try";
    const Candidate& best = r.candidates.front();
    std::vector<std::string> failed = best.failed;
    std::stable_partition(failed.begin(), failed.end(),
                          [](const std::string& id) { return id.rfind("contact.", 0) == 0; });
    std::string words;
    for (std::size_t i = 0; i < failed.size() && i < 3; ++i) words += (i ? ", " : "") + failed[i];
    return display_id(relay) + ": even its best combination (" + best.transistor + ") fails " + words;
}

}  // namespace

bool picks_relays(const Spec& spec) { return spec.load.has_value() && !spec.relay.has_value(); }

Spec with_relay(const Spec& spec, const RelayRecord& relay) {
    Spec s = spec;
    s.coil = relay.coil;
    s.coil.preset.clear();
    if (!s.coil.max_release_time_s) s.coil.max_release_time_s = spec.coil.max_release_time_s;
    if (!s.coil.self_heating_k && !s.coil.thermal_resistance_k_per_w) s.coil.self_heating_k = spec.coil.self_heating_k;
    s.relay = static_cast<const RelayPart&>(relay);
    return s;
}

RelayPickResult pick_relays(const Spec& spec, const Catalogue& catalogue, const std::vector<RelayRecord>& relays) {
    RelayPickResult out;
    if (!picks_relays(spec)) return out;
    for (const RelayRecord& relay : relays) {
        // Without contact ratings nothing shows that the contacts side passes.
        if (!relay.contacts) continue;
        ++out.relays_tried;
        const PickResult r = pick(with_relay(spec, relay), catalogue);
        out.combinations += r.candidates.size();
        bool any = false;
        for (const Candidate& c : r.candidates) {
            if (c.verdict != Verdict::pass) continue;
            any = true;
            out.passing.push_back({relay.id, relay.kind, relay.contacts->form, c});
        }
        if (!any) out.reasons.push_back(reason_for(relay, r));
    }
    return out;
}

}  // namespace coilfit
