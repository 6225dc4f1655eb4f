// The timing stage: the release time against its limit, the operate time of the current, and
// the switching timing at a frequency (src/method.md "Clamp (flyback) and timing",
// "Switching timing").
#pragma once

#include <array>
#include <string>

#include "coilfit/check.hpp"
#include "coilfit/spec.hpp"

namespace coilfit {

struct TimingCorner {
    bool has_operate = false;
    double operate_time_s = 0;  // the coil current's rise to the operate current (armature travel not included)
    bool operates = true;       // false: the current never reaches the operate current
};

struct TimingFigures {
    std::array<TimingCorner, corner_count> at{};
};

// How switching.timing came out (CheckValue::detail): which of its two conditions binds.
enum class SwitchingCase : std::uint8_t { off_time, on_time, never_operates };

// t_op = tau_on ln(I_final / (I_final - I_op)), tau_on = L / R_hot (closed form, first-order RL);
// infinite when I_final <= I_op.
[[nodiscard]] double operate_time_s(double l_h, double r_hot_ohm, double coil_voltage_min_v, double operate_voltage_v);

struct Evaluation;
[[nodiscard]] std::string timing_message(CheckId id, const CheckValue& c, const Spec& spec, const Evaluation& e);
[[nodiscard]] std::string timing_skip_reason(CheckId id, const Spec& spec);

}  // namespace coilfit
