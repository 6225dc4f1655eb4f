// The ranges a design must work over (src/method.md "Corners"). The worst case takes every
// band; a Monte Carlo sample collapses the part spreads (and, when conditions are sampled, the
// operating conditions too) to one point each (lo == hi). Samples vary parts and conditions,
// never the design's choices (the resistor's nominal value, the parts).
#pragma once

#include "coilfit/spec.hpp"

namespace coilfit {

struct Conditions {
    // operating conditions
    double vs_lo_v = 0, vs_hi_v = 0;    // supply
    double vs_transient_v = 0;          // highest transient on the rail (0: none given)
    double ta_lo_c = 0, ta_hi_c = 0;    // ambient
    double vdd_lo_v = 0, vdd_hi_v = 0;  // pin supply
    // part spreads
    double r_coil_lo_ohm = 0, r_coil_hi_ohm = 0;  // coil resistance at its reference temperature
    double rb_lo_factor = 1, rb_hi_factor = 1;    // base or gate resistor (and pull-down): 1 -+ tb
    double rs_lo_factor = 1, rs_hi_factor = 1;    // clamp resistor: 1 -+ its tolerance
    double vz_lo_v = 0, vz_hi_v = 0;              // zener voltage band (its tolerance)
    double hfe_position = 0;                      // 0: minimum gain; 1: typical gain
    double rds_position = 0;                      // 0: Rds(on) maximum; 1: typical
};

[[nodiscard]] Conditions worst_case_conditions(const Spec& spec);

}  // namespace coilfit
