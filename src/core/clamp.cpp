#include "coilfit/clamp.hpp"

#include "clamp_math.hpp"

namespace coilfit {

ClampVoltages clamp_voltages(const ClampSpec& clamp, double i0_a, double vz_lo_v, double vz_hi_v, double ln_i0) {
    return clamp_math::voltages(clamp, i0_a, vz_lo_v, vz_hi_v, ln_i0);
}

Decay rl_decay(double l_h, double r_ohm, double vc_v, double i0_a, double i_release_a) {
    return clamp_math::decay(l_h, r_ohm, vc_v, i0_a, i_release_a);
}

double clamp_energy(const Decay& decay, double vc_v, double series_ohm) {
    return clamp_math::energy(decay, vc_v, series_ohm);
}

}  // namespace coilfit
