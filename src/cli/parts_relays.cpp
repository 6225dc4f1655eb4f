#include "cli/parts_relays.hpp"

namespace coilfit::cli {
namespace {

std::string q(double v, Unit u) { return format_quantity(v, u); }

std::string rating_words(const std::optional<ContactRating>& r) {
    return r ? q(r->current_a, Unit::ampere) + " at " + q(r->voltage_v, Unit::volt) : std::string("-");
}

}  // namespace

std::size_t list_relays(const io::PartsTable& table, const std::string& kind, const std::string& id, io::Json& json,
                        std::vector<std::vector<std::string>>& rows) {
    if (rows.empty()) rows.push_back({"id", "kind", "coil", "form", "AC", "DC", "make"});
    std::size_t found = 0;
    for (const io::RelayEntry& e : table.relays) {
        const RelayRecord& r = e.record;
        if ((!kind.empty() && relay_kind_name(r.kind) != kind) || (!id.empty() && r.id != id)) continue;
        ++found;
        io::Json j = io::to_json(static_cast<const RelayPart&>(r));
        for (const auto& [k, v] : e.coil_fields.items()) j[k] = v;
        json.push_back(j);
        const Contacts* c = r.contacts ? &*r.contacts : nullptr;
        rows.push_back({r.id, std::string(relay_kind_name(r.kind)),
                        q(r.coil.rated_voltage_v, Unit::volt) + " " + q(r.coil.resistance_ohm, Unit::ohm),
                        c ? c->form : "-", c ? rating_words(c->ac) : "-", c ? rating_words(c->dc) : "-",
                        c && c->make_current_a ? q(*c->make_current_a, Unit::ampere) : "-"});
    }
    return found;
}

}  // namespace coilfit::cli
