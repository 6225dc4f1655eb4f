// Part records and the catalogue that holds them: one record type per kind of part
// (src/method.md, "The circuit"; the table on disk is read in src/io/parts_*.cpp).
//
// Records hold datasheet limits in SI units. Characteristic tables (minimum gain, Vce(sat),
// Vbe(sat), forward drop, ...) are lists of points; a value between points is interpolated
// linearly on log(current); outside them the nearest point is used and the lookup says on which
// side the operating point lay, so that the stage using it can apply the direction rule of
// src/method.md "Data limits".
#pragma once

#include <limits>
#include <optional>
#include <string>
#include <string_view>
#include <variant>
#include <vector>

namespace coilfit {

// ln of a point's current, filled by precompute_logs() so that interpolation needs no log of
// the table's own currents; NaN (not filled) means "compute it when needed".
inline constexpr double ln_not_set = std::numeric_limits<double>::quiet_NaN();

// Where a record came from: the parts table, or written inline in a spec (no source needed;
// the report labels it "inline ID").
struct PartOrigin {
    std::string id;
    std::string package;
    std::string description;
    std::string source;
    bool inline_record = false;
};

// "2N4401", or "inline 2N4401" for a record written in the spec.
[[nodiscard]] std::string display_id(const PartOrigin& part);

// --- bipolar transistors (npn, darlington) ---------------------------------------------------

enum class BipolarKind { npn, darlington };

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

struct Bipolar : PartOrigin {
    BipolarKind kind = BipolarKind::npn;
    double ic_max_a = 0;
    double vceo_v = 0;
    std::vector<GainPoint> hfe_min;
    std::vector<SaturationPoint> vce_sat;
    std::vector<SaturationPoint> vbe_sat;
    double pd_w = 0;
    std::optional<double> rth_ja_k_per_w;  // when absent: (tj_max - 25 °C) / pd
    double tj_max_c = 150;
    std::optional<double> hfe_temp_exponent;  // x_h of hFE(T) = hFE(25 °C) (T/298.15 K)^x_h
    std::optional<double> r_be_internal_ohm;  // a Darlington's base-emitter resistor inside
};

// --- N-channel MOSFETs (nmos) ------------------------------------------------------------------

struct RdsOnPoint {  // Rds(on) guaranteed at a gate voltage and drain current, 25 °C
    double vgs_v = 0;
    double id_a = 0;
    double max_ohm = 0;
    std::optional<double> typ_ohm;
};

struct Mosfet : PartOrigin {
    double vds_max_v = 0;
    double id_max_a = 0;  // continuous, 25 °C
    double vgs_max_v = 0;
    double vgs_th_min_v = 0;
    double vgs_th_max_v = 0;
    std::vector<RdsOnPoint> rds_on;               // sorted by vgs
    std::optional<double> rds_on_tempco_per_k;    // default 0.6 %/K
    std::optional<double> vgs_th_tempco_v_per_k;  // magnitude used; default 4 mV/K
    double qg_c = 0;                              // total gate charge
    std::optional<double> vplateau_v;             // Miller plateau; default Vgs(th) max + 1 V
    double pd_w = 0;
    std::optional<double> rth_ja_k_per_w;
    double tj_max_c = 150;
    std::optional<double> ear_j;  // repetitive avalanche energy
};

// --- diodes ----------------------------------------------------------------------------------

enum class DiodeKind { rectifier, fast, signal, schottky };

struct ForwardPoint {
    double if_a = 0;
    double vf_max_v = 0;
    double ln_if = ln_not_set;
};

struct Diode : PartOrigin {
    DiodeKind kind = DiodeKind::rectifier;
    double vrrm_v = 0;
    double if_avg_a = 0;
    std::optional<double> ifrm_a;  // repetitive peak forward current
    std::optional<double> ifsm_a;  // non-repetitive surge current (quoted, never a limit)
    std::vector<ForwardPoint> vf;
    std::optional<double> vf_low_v;  // low forward drop for timing; default by kind
};

// --- transistor arrays (array) ---------------------------------------------------------------

struct CurrentPoint {  // a voltage limit at a current: vin_on, Vce(sat) of an array channel
    double ic_a = 0;
    double v_max = 0;
    double ln_ic = ln_not_set;
};

enum class ArrayStructure { darlington, mosfet };

struct ArrayPart : PartOrigin {
    ArrayStructure structure = ArrayStructure::darlington;
    int channels = 7;
    double input_resistor_ohm = 0;
    std::optional<double> input_resistor_tolerance;  // default 20 %
    std::vector<CurrentPoint> vin_on;
    std::vector<CurrentPoint> vce_sat;
    double ic_max_a = 0;  // per channel
    double vceo_v = 0;
    Diode diode;      // the built-in clamp diode to the common pin
    double pd_w = 0;  // package
    std::optional<double> rth_ja_k_per_w;
    double tj_max_c = 150;
    std::optional<double> ic_total_max_a;
};

// --- zeners and TVS --------------------------------------------------------------------------

struct PulsePoint {  // non-repetitive surge rating: peak power at an equivalent pulse width
    double width_s = 0;
    double power_w = 0;
};

struct Zener : PartOrigin {
    double vz_v = 0;
    double tolerance = 0.05;
    double pd_w = 0;
    std::optional<double> izt_a;
    std::optional<double> zzt_ohm;            // dynamic impedance at izt
    std::optional<double> vz_tempco_v_per_k;  // absolute drift (a relative one times vz)
    std::vector<PulsePoint> pulse;            // sorted by width
};

struct Tvs : PartOrigin {
    double vrwm_v = 0;                    // standoff
    double vbr_min_v = 0, vbr_max_v = 0;  // breakdown at 1 mA
    double vc_v = 0;                      // clamping voltage at ipp
    double ipp_a = 0;
    double ppk_w = 0;  // peak pulse power at ppk_width
    double ppk_width_s = 1e-3;
};

// --- the transistor a spec names: its kind selects the driver ----------------------------------

using Transistor = std::variant<Bipolar, Mosfet, ArrayPart>;

[[nodiscard]] std::string_view bipolar_kind_name(BipolarKind kind);        // "npn", "darlington"
[[nodiscard]] std::string_view diode_kind_name(DiodeKind kind);            // "rectifier", ...
[[nodiscard]] std::string_view transistor_kind_name(const Transistor& t);  // npn, darlington, nmos, array
[[nodiscard]] const PartOrigin& origin(const Transistor& t);

// --- lookups ---------------------------------------------------------------------------------

// Where an operating point lay against a part's points.
enum class Side : unsigned char { within, below, above };

// A looked-up value and whether the operating point lay outside the part's points.
struct Lookup {
    double value = 0;
    bool outside = false;
    Side side = Side::within;
};

// Minimum gain at Ic (interpolated on log Ic); typical where the part gives typical values.
[[nodiscard]] Lookup hfe_min_at(const Bipolar& part, double ic_a, double ln_ic = ln_not_set);
[[nodiscard]] Lookup hfe_typ_at(const Bipolar& part, double ic_a, double ln_ic = ln_not_set);
[[nodiscard]] Lookup vce_sat_at(const Bipolar& part, double ic_a, double ln_ic = ln_not_set);
[[nodiscard]] Lookup vbe_sat_at(const Bipolar& part, double ic_a, double ln_ic = ln_not_set);
[[nodiscard]] Lookup vf_max_at(const Diode& part, double if_a, double ln_if = ln_not_set);
[[nodiscard]] Lookup curve_at(const std::vector<CurrentPoint>& points, double ic_a, double ln_ic = ln_not_set);
// The forced gain Ic/Ib at which the part's Vce(sat) is specified nearest to ic_a.
[[nodiscard]] double vce_sat_test_ratio(const Bipolar& part, double ic_a, double ln_ic = ln_not_set);
// Fills the points' ln(current) fields: a speed-up for callers that evaluate one part many
// times (yield, pick); results are the same with or without it.
void precompute_logs(Bipolar& part);
void precompute_logs(Diode& part);
void precompute_logs(ArrayPart& part);
// The low forward drop used for timing: the part's vf_low, else 0.6 V silicon, 0.3 V Schottky.
[[nodiscard]] double vf_low(const Diode& part);
// Junction-to-ambient thermal resistance, from rth_ja or derived from pd and tj_max at 25 °C.
[[nodiscard]] double rth_ja(const Bipolar& part);
[[nodiscard]] double rth_ja(const Mosfet& part);
[[nodiscard]] double rth_ja(const ArrayPart& part);

// The parts table: every record, in file order.
struct Catalogue {
    std::vector<Bipolar> bipolars;
    std::vector<Mosfet> mosfets;
    std::vector<ArrayPart> arrays;
    std::vector<Diode> diodes;
    std::vector<Zener> zeners;
    std::vector<Tvs> tvs;

    [[nodiscard]] const Bipolar* find_bipolar(std::string_view id) const;
    [[nodiscard]] const Mosfet* find_mosfet(std::string_view id) const;
    [[nodiscard]] const ArrayPart* find_array(std::string_view id) const;
    [[nodiscard]] const Diode* find_diode(std::string_view id) const;
    [[nodiscard]] const Zener* find_zener(std::string_view id) const;
    [[nodiscard]] const Tvs* find_tvs(std::string_view id) const;
    // A transistor of any kind by id.
    [[nodiscard]] std::optional<Transistor> find_transistor(std::string_view id) const;
};

}  // namespace coilfit
