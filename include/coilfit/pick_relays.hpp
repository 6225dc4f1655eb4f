// Which relay of the table, with which driver? When a spec gives a load and no relay, pick also
// tries every relay and contactor record with contact ratings: the record's coil and contacts
// replace the spec's coil, and the usual pick runs per relay. A combination is listed when it
// passes both sides: the coil and driver checks and the contact checks.
#pragma once

#include <string>
#include <vector>

#include "coilfit/pick.hpp"
#include "coilfit/spec.hpp"

namespace coilfit {

struct RelayCandidate {
    std::string relay;
    RelayKind kind = RelayKind::relay;
    std::string form;
    Candidate driver;  // the driver and clamp of this combination, as pick ranks them
};

struct RelayPickResult {
    std::vector<RelayCandidate> passing;  // relay order of the table, each relay's best first
    std::size_t relays_tried = 0;         // records with contact ratings
    std::size_t combinations = 0;         // relay and driver combinations evaluated
    // Relays with no passing combination, one line each saying why (the first failing checks).
    std::vector<std::string> reasons;
};

// Whether pick tries the relays for this spec: a load and no relay.
[[nodiscard]] bool picks_relays(const Spec& spec);

// The spec with a relay record's coil and contacts in place of its own coil; the spec's
// max_release_time (the application's requirement) and self_heating (often measured in place)
// stay where the record gives none, as with `--relay` on a spec file.
[[nodiscard]] Spec with_relay(const Spec& spec, const RelayRecord& relay);

[[nodiscard]] RelayPickResult pick_relays(const Spec& spec, const Catalogue& catalogue,
                                          const std::vector<RelayRecord>& relays);

}  // namespace coilfit
