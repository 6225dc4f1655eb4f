// Internal to the core: the stage functions sizing.cpp sequences, with one overload per driver
// kind, so that evaluate() chooses the kind once (one visit) and everything after runs on the
// concrete type.
#pragma once

#include <optional>

#include "coilfit/sizing.hpp"

namespace coilfit::stages {

// --- per driver kind ---

// The driver's names and ratings for the stages after it.
void describe_driver(const BipolarDriver& d, const Spec& spec, double r_drive_ohm, DriverCommon& out);
void describe_driver(const MosfetDriver& d, const Spec& spec, double r_drive_ohm, DriverCommon& out);
void describe_driver(const ArrayDriver& d, const Spec& spec, double r_drive_ohm, DriverCommon& out);

// The corner's drive input; a kind may take another current or ambient for a check.
inline DriveInput drive_input(const BipolarDriver&, const CoilFigures&, const Conditions&, std::size_t,
                              const DriveInput& in) {
    return in;
}
inline DriveInput drive_input(const MosfetDriver&, const CoilFigures&, const Conditions&, std::size_t,
                              const DriveInput& in) {
    return in;
}
inline DriveInput drive_input(const ArrayDriver&, const CoilFigures&, const Conditions&, std::size_t,
                              const DriveInput& in) {
    return in;
}

inline void drive_corner(const BipolarDriver& d, const Spec& spec, const Conditions& c, const DriveInput& in, double r,
                         bool all, BipolarCorner& f, DriverCorner& common, CheckSet& checks) {
    bipolar_corner(d, spec, c, in, r, all, f, common, checks);
}
inline void drive_corner(const MosfetDriver& d, const Spec& spec, const Conditions& c, const DriveInput& in, double r,
                         bool all, MosfetCorner& f, DriverCorner& common, CheckSet& checks) {
    mosfet_corner(d, spec, c, in, r, all, f, common, checks);
}
inline void drive_corner(const ArrayDriver& d, const Spec& spec, const Conditions& c, const DriveInput& in, double,
                         bool, ArrayCorner& f, DriverCorner& common, CheckSet& checks) {
    array_corner(d, spec, c, in, f, common, checks);
}

// Design-level figures once both corners are known (e.g. the base resistor window).
void design_figures(const BipolarDriver& d, const Spec& spec, const Conditions& c, double r, BipolarFigures& f);
void design_figures(const MosfetDriver& d, const Spec& spec, const Conditions& c, double r, MosfetFigures& f);
void design_figures(const ArrayDriver& d, const Spec& spec, const Conditions& c, double r, ArrayFigures& f);

[[nodiscard]] std::optional<double> choose_drive_resistor(const Prepared& p, const Conditions& c);
[[nodiscard]] bool drive_resistor_fixed(const Spec& spec);

// --- shared ---

// The pin as a Thevenin source: R_out = (VDD_voh - VOH) / IOH.
[[nodiscard]] double pin_output_resistance(const Spec& spec);

void prepare_clamp(const Spec& spec, Prepared& p);
// The clamp at one corner: clamp voltages, peak, decay, the clamp's and the diode's checks and
// transistor.voltage.
void clamp_corner(const Prepared& p, const Conditions& c, double i0_a, double ln_i0, double ambient_c,
                  double r_coil_cold_ohm, double release_current_a, const DriverCommon& driver, bool all,
                  ClampCorner& out, CheckSet& checks);
// release.time, switching.timing and the operate time at one corner.
void timing_corner(const Spec& spec, const CoilCorner& coil, const DriverCorner& driver, const ClampCorner& clamp,
                   bool all, TimingCorner& out, CheckSet& checks);

}  // namespace coilfit::stages
