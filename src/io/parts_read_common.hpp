// Internal to the record readers: points lists, ids, sources and plausible ranges.
#pragma once

#include <string>
#include <vector>

#include <fmt/format.h>

#include "io/parts_read.hpp"

namespace coilfit::io::records {

// Points lists: [{ "ic": "150mA", "min": 100 }, ...], at least one, at most 64.
template <typename Point, typename ReadPoint>
std::vector<Point> read_points(ObjectReader& r, const std::string& key, ReadPoint read_point, bool required) {
    std::vector<Point> out;
    const Json* list = r.get(key);
    if (!list) {
        if (required) r.fail_at(key, "missing; expected a list of points");
        return out;
    }
    if (!list->is_array() || list->empty())
        r.fail_at(key, "expected a list of one or more points, got " + describe(*list));
    if (list->size() > 64) r.fail_at(key, "more than 64 points");
    for (std::size_t i = 0; i < list->size(); ++i) {
        ObjectReader pr((*list)[i], r.origin(), r.path_of(key) + "[" + std::to_string(i) + "]");
        out.push_back(read_point(pr));
        pr.finish();
    }
    return out;
}

template <typename Point, typename X>
void check_sorted(const ObjectReader& r, const std::string& key, const std::vector<Point>& pts, X x,
                  const char* what = "current") {
    for (std::size_t i = 1; i < pts.size(); ++i) {
        if (!(x(pts[i]) > x(pts[i - 1]))) {
            r.fail_at(key + "[" + std::to_string(i) + "]",
                      fmt::format("points must be in order of increasing {}", what));
        }
    }
}

// Plausible ranges of datasheet figures: wide enough for any small-signal to power part, narrow
// enough that a unit slip ("600" amperes for 600 mA) or a stray exponent is caught.
double current(ObjectReader& r, const std::string& key, double value);
double voltage(ObjectReader& r, const std::string& key, double lo, double hi);  // required, positive
// Ids are how specs name parts: printable, not empty, no spaces at either end.
std::string read_id(ObjectReader& r);
// The origin fields: id, package, description, source (required for a table record).
void read_origin(ObjectReader& r, PartOrigin& o, RecordPlace place);
void origin_json(const PartOrigin& o, Json& j);
// Thermal fields: pd, rth_ja, tj_max.
void read_thermal(ObjectReader& r, double& pd_w, std::optional<double>& rth, double& tj_max_c);
// A list of {ic, max} voltage points (vin_on, an array's Vce(sat)).
std::vector<CurrentPoint> read_current_points(ObjectReader& r, const std::string& key);
Json current_points_json(const std::vector<CurrentPoint>& pts);
// A diode's forward-voltage points.
std::vector<ForwardPoint> read_forward_points(ObjectReader& r, const std::string& key);

}  // namespace coilfit::io::records
