// coilfit yield: the statistical pass rate of the sized design (Monte Carlo over the tolerances).
// The numbers come from the core (coilfit/yield.hpp); this file wires the flags and renders.
#include <unistd.h>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdint>
#include <cstdio>
#include <thread>

#include <fmt/format.h>

#include "cli/commands.hpp"
#include "coilfit/yield.hpp"
#include "io/format.hpp"
#include "io/report_io.hpp"

namespace coilfit::cli {
namespace {

constexpr std::string_view yield_schema = "coilfit.yield/1";

// "1 000 000": digits in groups of three, for people.
std::string grouped(std::uint64_t n) {
    std::string digits = std::to_string(n);
    std::string out;
    for (std::size_t i = 0; i < digits.size(); ++i) {
        if (i > 0 && (digits.size() - i) % 3 == 0) out += ' ';
        out += digits[i];
    }
    return out;
}

// A rate in per cent, never rounded up to 100 % or down to 0 % (3 decimals, truncated towards
// the middle) so that "100 %" always means every sample.
std::string percent(double rate) {
    if (rate >= 1.0) return "100 %";
    if (rate <= 0.0) return "0 %";
    const double pct = rate * 100.0;
    const double shown = pct >= 50.0 ? std::floor(pct * 1000.0) / 1000.0 : std::ceil(pct * 1000.0) / 1000.0;
    return fmt::format("{:.3f} %", shown);
}

bool has_typical_gain(const Transistor& t) {
    const auto* part = std::get_if<Bipolar>(&t);
    return part && std::any_of(part->hfe_min.begin(), part->hfe_min.end(),
                               [](const GainPoint& p) { return p.hfe_typ.has_value(); });
}

bool has_typical_rds(const Transistor& t) {
    const auto* part = std::get_if<Mosfet>(&t);
    return part && std::any_of(part->rds_on.begin(), part->rds_on.end(),
                               [](const RdsOnPoint& p) { return p.typ_ohm.has_value(); });
}

// The inputs that vary in this spec, in words.
std::vector<std::string> varied_inputs(const Spec& spec, ConditionsMode mode) {
    std::vector<std::string> v;
    if (mode == ConditionsMode::sampled) {
        if (spec.supply.lo_v() < spec.supply.hi_v()) v.emplace_back("supply.voltage");
        if (spec.ambient.max_c > spec.ambient.min_c) v.emplace_back("ambient");
        if (spec.pin.vdd_tolerance > 0) v.emplace_back("pin.vdd");
    }
    if (spec.coil.tolerance > 0) v.emplace_back("coil.resistance");
    if (spec.bipolar() && spec.base_resistor.tolerance > 0) v.emplace_back("base_resistor.tolerance");
    if (spec.mosfet() && spec.gate_resistor.tolerance > 0) v.emplace_back("gate_resistor.tolerance");
    if (spec.clamp.type == ClampType::diode_zener && spec.clamp.zener && spec.clamp.zener->tolerance > 0) {
        v.emplace_back("clamp.zener");
    }
    if (has_typical_gain(spec.transistor)) v.emplace_back("transistor.hfe");
    if (has_typical_rds(spec.transistor)) v.emplace_back("transistor.rds_on");
    if (spec.clamp.type == ClampType::diode_resistor && spec.clamp.resistor_tolerance > 0)
        v.emplace_back("clamp.resistor");
    return v;
}

// The words for an input in the text report.
std::string_view input_words(std::string_view id) {
    if (id == "supply.voltage") return "supply voltage";
    if (id == "ambient") return "ambient temperature";
    if (id == "pin.vdd") return "pin VDD";
    if (id == "coil.resistance") return "coil resistance";
    if (id == "base_resistor.tolerance") return "base resistor";
    if (id == "clamp.zener") return "zener voltage";
    if (id == "transistor.hfe") return "gain (minimum to typical)";
    if (id == "transistor.rds_on") return "Rds(on) (maximum to typical)";
    if (id == "clamp.resistor") return "clamp resistor";
    return id;
}

std::string design_line(const Spec& spec, const YieldResult& r) {
    std::string s = display_id(origin(spec.transistor));
    if (spec.bipolar() || spec.mosfet()) {
        const bool bipolar = spec.bipolar() != nullptr;
        s += bipolar ? ", base resistor " : ", gate resistor ";
        if (r.design.r_drive_ohm) {
            s += format_quantity(*r.design.r_drive_ohm, Unit::ohm);
            const ESeries series = bipolar ? spec.base_resistor.series : spec.gate_resistor.series;
            s += r.design.resistor_fixed ? " (fixed" : fmt::format(" ({}", eseries_name(series));
            s +=
                fmt::format(", {} %)", (bipolar ? spec.base_resistor.tolerance : spec.gate_resistor.tolerance) * 100.0);
        } else {
            s += "none (no value of the series works)";
        }
    }
    s += ", clamp ";
    s += clamp_type_name(spec.clamp.type);
    if (spec.clamp.diode) s += " " + display_id(*spec.clamp.diode);
    if (spec.clamp.zener && spec.clamp.type == ClampType::diode_zener) s += " + " + display_id(*spec.clamp.zener);
    return s;
}

std::string render_text(const Spec& spec, const YieldResult& r, const io::TextStyle& style, std::size_t width) {
    const YieldSettings& st = r.settings;
    const bool worst_pass = r.design.worst.passes();
    std::string t =
        fmt::format("coilfit yield - {}\n\n", spec.name.empty() ? std::string("unnamed channel") : spec.name);
    auto row = [&t](std::string_view label, const std::string& value) {
        t += "  " + io::pad_right(label, 12) + value + "\n";
    };
    row("design", design_line(spec, r));
    row("worst case", io::paint(worst_pass ? "pass" : "FAIL", worst_pass ? Verdict::pass : Verdict::fail, style) +
                          (worst_pass ? " (every check at its worst corner)" : " (see coilfit size)"));
    row("samples", fmt::format("{}, {} within the tolerances, seed {}", grouped(st.samples),
                               distribution_name(st.distribution), st.seed));
    row("conditions",
        st.conditions == ConditionsMode::worst
            ? std::string("supply, ambient and pin VDD held at each check's worst corner; part spreads drawn")
            : std::string("supply, ambient and pin VDD drawn with the part spreads (--conditions sampled)"));
    const Verdict overall = r.passed == st.samples ? Verdict::pass : Verdict::fail;
    row("pass rate",
        io::paint(percent(r.pass_rate), overall, style) +
            fmt::format("  (95 % interval {} to {}, Wilson score)", percent(r.interval.lo), percent(r.interval.hi)));
    row("failed", fmt::format("{} of {} samples", grouped(st.samples - r.passed), grouped(st.samples)));
    if (!worst_pass && r.passed > 0) {
        t += "  " +
             io::wrap(
                 "The design fails at worst case, yet most parts beat their datasheet limits: this share of units "
                 "works, but no unit is guaranteed to.",
                 width - 2, 2) +
             "\n";
    }
    t += "\n";

    std::vector<std::array<std::string, 3>> rows;
    rows.push_back({"check", "failed", "pass rate"});
    for (const CheckYield& c : r.checks) {
        rows.push_back({std::string(check_id_name(c.id)), grouped(c.failed), percent(c.pass_rate)});
    }
    std::array<std::size_t, 3> w{};
    for (const auto& rw : rows)
        for (std::size_t k = 0; k < rw.size(); ++k) w[k] = std::max(w[k], io::display_width(rw[k]));
    for (std::size_t i = 0; i < rows.size(); ++i) {
        std::string pr = io::pad_left(rows[i][2], w[2]);
        if (i > 0) pr = io::paint(pr, r.checks[i - 1].failed == 0 ? Verdict::pass : Verdict::fail, style);
        t += "  " + io::pad_right(rows[i][0], w[0]) + "   " + io::pad_left(rows[i][1], w[1]) + "   " + pr + "\n";
    }
    t += "\n";
    if (r.most_frequent_failure) {
        const auto it = std::find_if(r.checks.begin(), r.checks.end(),
                                     [&r](const CheckYield& c) { return c.id == *r.most_frequent_failure; });
        t += fmt::format("  Most frequent failure: {}, in {} of {} samples.\n\n",
                         check_id_name(*r.most_frequent_failure), grouped(it->failed), grouped(it->evaluated));
    } else {
        t += "  No sample failed a check.\n\n";
    }

    const std::vector<std::string> varied = varied_inputs(spec, st.conditions);
    std::string varied_list;
    for (std::size_t i = 0; i < varied.size(); ++i) {
        varied_list += i == 0 ? "" : i + 1 == varied.size() ? " and " : ", ";
        varied_list += input_words(varied[i]);
    }
    std::string note = varied.empty() ? std::string("No input has a tolerance here: every sample is the same point.")
                                      : "Each sample draws " + varied_list + " within their bands" +
                                            (st.distribution == Distribution::normal
                                                 ? " (normal, the band's half-width at 3 sigma, truncated at the band)"
                                                 : " (uniform)") +
                                            ".";
    note +=
        " Vce(sat), Vbe(sat) and diode drops stay at their datasheet limits, as in the worst case; the design "
        "(parts and base resistor) is the one coilfit size gives. A rate is an estimate from samples: "
        "the interval says how far the true rate may lie.";
    t += "  " + io::wrap(note, width - 2, 2) + "\n";
    return t;
}

io::Json render_json(const Spec& spec, const YieldResult& r) {
    io::Json j;
    j["schema"] = yield_schema;
    j["tool"] = {{"name", "coilfit"}, {"version", COILFIT_VERSION}};
    j["name"] = spec.name;
    j["samples"] = r.settings.samples;
    j["seed"] = r.settings.seed;
    j["distribution"] = distribution_name(r.settings.distribution);
    j["conditions"] = conditions_mode_name(r.settings.conditions);
    j["passed"] = r.passed;
    j["pass_rate"] = r.pass_rate;
    j["interval"] = io::Json::array({r.interval.lo, r.interval.hi});
    j["confidence"] = 0.95;
    j["worst_case"] = r.design.worst.passes() ? "pass" : "fail";
    io::Json design;
    design["transistor"] = display_id(origin(spec.transistor));  // "inline ID" as in every output
    design["driver"] = transistor_kind_name(spec.transistor);
    design[spec.mosfet() ? "gate_resistor_ohm" : "base_resistor_ohm"] =
        r.design.r_drive_ohm ? io::Json(*r.design.r_drive_ohm) : io::Json(nullptr);
    design["clamp"] = clamp_type_name(spec.clamp.type);
    design["diode"] = spec.clamp.diode ? io::Json(display_id(*spec.clamp.diode)) : io::Json(nullptr);
    design["zener"] = spec.clamp.zener && spec.clamp.type == ClampType::diode_zener
                          ? io::Json(display_id(*spec.clamp.zener))
                          : io::Json(nullptr);
    j["design"] = design;
    io::Json checks = io::Json::array();
    for (const CheckYield& c : r.checks) {
        checks.push_back({{"id", check_id_name(c.id)},
                          {"pass_rate", c.pass_rate},
                          {"failed", c.failed},
                          {"evaluated", c.evaluated}});
    }
    j["checks"] = checks;
    j["most_frequent_failure"] =
        r.most_frequent_failure ? io::Json(check_id_name(*r.most_frequent_failure)) : io::Json(nullptr);
    j["varied"] = varied_inputs(spec, r.settings.conditions);
    return j;
}

// A progress line on stderr, only when stderr is a terminal and the run is long (more than half
// a second); updated at most five times a second and wiped at the end.
class Progress {
public:
    Progress() : enabled_(::isatty(STDERR_FILENO) == 1), start_(std::chrono::steady_clock::now()) {}
    Progress(const Progress&) = delete;
    Progress& operator=(const Progress&) = delete;
    ~Progress() { clear(); }

    void operator()(std::uint64_t done, std::uint64_t total) {
        if (!enabled_ || done >= total) return;
        const auto now = std::chrono::steady_clock::now();
        if (now - start_ < std::chrono::milliseconds(500)) return;
        if (shown_ && now - last_ < std::chrono::milliseconds(200)) return;
        last_ = now;
        shown_ = true;
        const double pct = 100.0 * static_cast<double>(done) / static_cast<double>(total);
        std::fputs(fmt::format("\rcoilfit yield: {:3.0f} % of {} samples", pct, grouped(total)).c_str(), stderr);
        std::fflush(stderr);
    }
    void clear() {
        if (!shown_) return;
        std::fputs("\r\033[K", stderr);
        std::fflush(stderr);
        shown_ = false;
    }

private:
    bool enabled_;
    bool shown_ = false;
    std::chrono::steady_clock::time_point start_;
    std::chrono::steady_clock::time_point last_{};
};

}  // namespace

int run_yield(const YieldOptions& options) {
    const io::PartsTable table = load_table(options.common);
    const Spec spec = io::read_spec(build_spec_document(options.spec), table);
    // Checked before the samples run, so that a clash is reported at once.
    const io::RunInputs inputs = run_inputs(options.spec, table);
    check_outputs(options.common.output, {}, inputs);

    YieldSettings settings;
    settings.samples = options.samples;
    settings.seed = options.seed;
    settings.distribution = options.distribution == "normal" ? Distribution::normal : Distribution::uniform;
    settings.conditions = options.conditions == "sampled" ? ConditionsMode::sampled : ConditionsMode::worst;
    settings.jobs = options.jobs != 0 ? options.jobs : std::max(1U, std::thread::hardware_concurrency());

    YieldResult result;
    {
        Progress progress;
        result =
            run_yield(spec, settings, [&progress](std::uint64_t done, std::uint64_t total) { progress(done, total); });
    }

    std::string text;
    if (options.common.format == "json") {
        text = render_json(spec, result).dump(2) + "\n";
    } else {
        io::TextStyle style;
        style.color = use_color(options.common.output);
        text = render_text(spec, result, style, text_width());
    }
    emit(text, options.common.output, inputs);
    return result.passed == result.settings.samples ? exit_pass : exit_fail;
}

}  // namespace coilfit::cli
