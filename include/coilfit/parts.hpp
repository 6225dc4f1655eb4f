// Part records (transistors, diodes, zeners) and the catalogue that holds them.
//
// Records hold datasheet limits in SI units. Characteristic tables (minimum gain, Vce(sat),
// Vbe(sat), forward drop) are lists of points; a value between points is interpolated linearly
// on log(current), a value outside them takes the nearest point and is flagged so the report
// can say so (architecture doc, "Part records").
#pragma once

#include <limits>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace coilfit {

enum class BipolarKind { npn, darlington };

// ln of a point's current, filled by precompute_logs() so that interpolation needs no log of
// the table's own currents; NaN (not filled) means "compute it when needed".
inline constexpr double ln_not_set = std::numeric_limits<double>::quiet_NaN();

struct GainPoint {
    double ic_a = 0;
    double hfe_min = 0;
    std::optional<double> hfe_typ;  // typical gain at this current, when the datasheet gives one
    double ln_ic = ln_not_set;
};

struct SaturationPoint {  // Vce(sat) or Vbe(sat) maximum at a test condition Ic, Ib
    double ic_a = 0;
    double ib_a = 0;
    double v_max = 0;
    double ln_ic = ln_not_set;
};

struct Bipolar {
    std::string id;
    BipolarKind kind = BipolarKind::npn;
    double ic_max_a = 0;
    double vceo_v = 0;
    std::vector<GainPoint> hfe_min;
    std::vector<SaturationPoint> vce_sat;
    std::vector<SaturationPoint> vbe_sat;
    double pd_w = 0;
    std::optional<double> rth_ja_k_per_w;  // when absent: (tj_max - 25 °C) / pd
    double tj_max_c = 150;
    std::string package;
    std::string description;
    std::string source;
};

enum class DiodeKind { rectifier, fast, signal, schottky };

struct ForwardPoint {
    double if_a = 0;
    double vf_max_v = 0;
    double ln_if = ln_not_set;
};

struct Diode {
    std::string id;
    DiodeKind kind = DiodeKind::rectifier;
    double vrrm_v = 0;
    double if_avg_a = 0;
    std::optional<double> ifrm_a;  // repetitive peak forward current
    std::optional<double> ifsm_a;  // non-repetitive surge current
    std::vector<ForwardPoint> vf;
    std::optional<double> vf_low_v;  // low forward drop for timing; default by kind
    std::string package;
    std::string description;
    std::string source;
};

struct Zener {
    std::string id;
    double vz_v = 0;
    double tolerance = 0.05;
    double pd_w = 0;
    std::optional<double> izt_a;
    std::string package;
    std::string description;
    std::string source;
};

[[nodiscard]] std::string_view bipolar_kind_name(BipolarKind kind);  // "npn", "darlington"
[[nodiscard]] std::string_view diode_kind_name(DiodeKind kind);      // "rectifier", ...

// A looked-up value and whether the operating point lay outside the part's points.
struct Lookup {
    double value = 0;
    bool outside = false;
};

// Minimum gain at Ic (interpolated on log Ic).
[[nodiscard]] Lookup hfe_min_at(const Bipolar& part, double ic_a);
// Typical gain at Ic where the part gives typical values; otherwise the minimum.
[[nodiscard]] Lookup hfe_typ_at(const Bipolar& part, double ic_a);
[[nodiscard]] Lookup vce_sat_at(const Bipolar& part, double ic_a);
[[nodiscard]] Lookup vbe_sat_at(const Bipolar& part, double ic_a);
// The same lookups given ln(Ic) too, so that one log serves every lookup at one current.
[[nodiscard]] Lookup hfe_min_at(const Bipolar& part, double ic_a, double ln_ic);
[[nodiscard]] Lookup hfe_typ_at(const Bipolar& part, double ic_a, double ln_ic);
[[nodiscard]] Lookup vce_sat_at(const Bipolar& part, double ic_a, double ln_ic);
[[nodiscard]] Lookup vbe_sat_at(const Bipolar& part, double ic_a, double ln_ic);
[[nodiscard]] Lookup vf_max_at(const Diode& part, double if_a, double ln_if);
// Fills the points' ln(current) fields: a speed-up for callers that evaluate one part many
// times (yield, pick); results are the same with or without it.
void precompute_logs(Bipolar& part);
void precompute_logs(Diode& part);
// The forced gain Ic/Ib at which the part's Vce(sat) is specified nearest to ic_a.
[[nodiscard]] double vce_sat_test_ratio(const Bipolar& part, double ic_a);
[[nodiscard]] double vce_sat_test_ratio(const Bipolar& part, double ic_a, double ln_ic);
// Maximum forward drop at a current.
[[nodiscard]] Lookup vf_max_at(const Diode& part, double if_a);
// The low forward drop used for timing: the part's vf_low, else 0.6 V silicon, 0.3 V Schottky.
[[nodiscard]] double vf_low(const Diode& part);
// Junction-to-ambient thermal resistance, from rth_ja or derived from pd and tj_max at 25 °C.
[[nodiscard]] double rth_ja(const Bipolar& part);

// The parts table: every record, in file order.
struct Catalogue {
    std::vector<Bipolar> bipolars;
    std::vector<Diode> diodes;
    std::vector<Zener> zeners;

    [[nodiscard]] const Bipolar* find_bipolar(std::string_view id) const;
    [[nodiscard]] const Diode* find_diode(std::string_view id) const;
    [[nodiscard]] const Zener* find_zener(std::string_view id) const;
};

}  // namespace coilfit
