// The text report's layout (src/io/report_text*.cpp): widths, the words of an impossible window,
// margins as ratios, skipped reasons, each caution once, --brief, and display widths.
#include <doctest/doctest.h>

#include <sstream>

#include "coilfit/report.hpp"
#include "io/format.hpp"
#include "io/report_io.hpp"
#include "io/report_text_parts.hpp"
#include "support.hpp"

using namespace coilfit;
namespace io = coilfit::io;

namespace {

std::vector<std::string> lines_of(const std::string& text) {
    std::vector<std::string> out;
    std::istringstream in(text);
    for (std::string l; std::getline(in, l);) out.push_back(l);
    return out;
}

std::size_t count(const std::string& text, const std::string& what) {
    std::size_t n = 0;
    for (auto at = text.find(what); at != std::string::npos; at = text.find(what, at + 1)) ++n;
    return n;
}

SizingReport report_of(const std::string& example) {
    return size(test::load_example(example), test::shipped_table().catalogue);
}

// Wide enough that no phrase is wrapped, for finding words.
io::TextStyle unwrapped() {
    io::TextStyle style;
    style.width = 1000;
    return style;
}

}  // namespace

TEST_SUITE("report_text") {
    TEST_CASE("display widths follow the terminal's: wide characters take two columns, combining marks none") {
        // Unicode East Asian Width: CJK ideographs are Wide (2 columns); U+0301 combines (0).
        CHECK(io::display_width("2N4401") == 6);
        CHECK(io::display_width("4.7 kΩ") == 6);
        CHECK(io::display_width("継電器") == 6);
        CHECK(io::display_width("e\u0301") == 1);
        CHECK(io::display_width("\u200b") == 0);  // zero-width space
        CHECK(io::pad_right("継電器", 8) == "継電器  ");
        CHECK(io::pad_left("µA", 4) == "  µA");
    }

    TEST_CASE("frequencies below 1 Hz read plainly, not as millihertz") {
        CHECK(format_quantity(0.1, Unit::hertz) == "0.1 Hz");
        CHECK(format_quantity(0.002, Unit::hertz) == "0.002 Hz");
        CHECK(format_quantity(1.0, Unit::hertz) == "1 Hz");
        CHECK(format_quantity(1e-4, Unit::hertz) == "100 µHz");
        CHECK(format_quantity(2500.0, Unit::hertz) == "2.5 kHz");
    }

    TEST_CASE("every line of every example fits the width, from 40 to 160 columns") {
        for (const char* name : {"greenhouse-valve.json", "dust-extractor.json", "garage-door.json",
                                 "lab-valve-manifold.json", "greenhouse-vent.json"}) {
            const SizingReport r = report_of(name);
            for (std::size_t width : {40U, 50U, 60U, 80U, 100U, 120U, 160U}) {
                CAPTURE(name);
                CAPTURE(width);
                io::TextStyle style;
                style.width = width;
                for (const auto& line : lines_of(io::render_text(r, style))) {
                    CAPTURE(line);
                    CHECK(io::display_width(line) <= width);
                }
            }
        }
    }

    TEST_CASE("the verdict comes first, then the design, then the checks") {
        const std::string text = io::render_text(report_of("garage-door.json"), io::TextStyle{});
        const auto lines = lines_of(text);
        REQUIRE(lines.size() > 4);
        CHECK(lines[1] == "Result: FAIL: 1 of 10 checks fail; worst: pin.current.");
        CHECK(text.find("Design") < text.find("Checks"));
        CHECK(text.find("Checks") < text.find("Inputs as understood"));
        CHECK(count(text, "Result:") == 1);
    }

    TEST_CASE("an impossible resistor window is said in words") {
        // The garage door's 4 mA pin: hand-worked in the README, the pin needs at least 1.3 kΩ
        // while saturation at the worst corner needs at most 569 Ω.
        const std::string text = io::render_text(report_of("garage-door.json"), unwrapped());
        CHECK(text.find("no resistor fits: the pin limit needs at least 1.3 kΩ, saturation needs at most 569 Ω") !=
              std::string::npos);
        CHECK(text.find("(pin limit) to") == std::string::npos);
    }

    TEST_CASE("a margin far below -100 % is also given as the ratio of value to limit") {
        Check c;
        c.value = 3.77;
        c.limit = 1.0;
        c.margin = -2.77;  // (limit - value) / limit
        CHECK(io::text::margin_text(c) == "-277 % (3.8x)");
        c.margin = 0.12;
        CHECK(io::text::margin_text(c) == "+12 %");
        c.value = 150.0;
        c.margin = -149.0;
        CHECK(io::text::margin_text(c) == "<-999 % (150x)");
    }

    TEST_CASE("skipped checks say why; failing ones what to change; each caution once") {
        const std::string text = io::render_text(report_of("garage-door.json"), unwrapped());
        CHECK(text.find("skipped: give switching.frequency to estimate the clamp's average power") !=
              std::string::npos);
        CHECK(text.find("fix: the base resistor must be at least 1.3 kΩ") != std::string::npos);
        CHECK(count(text, "licensed practice") == 1);
        // The forced-gain policy sets the base current: no "needs hFE" advice beside "more hFE does not help".
        CHECK(text.find("more hFE does not help") != std::string::npos);
        CHECK(text.find("needs hFE min of at least") == std::string::npos);
        CHECK(text.find("may source") == std::string::npos);
        CHECK(text.find("rated output current 4 mA") != std::string::npos);
    }

    TEST_CASE("--brief: the verdict, the design and the failing or warning checks in at most 12 lines") {
        Spec spec = test::load_example("greenhouse-valve.json");
        spec.coil.resistance_ohm = 2.0;  // eight checks fail
        const SizingReport r = size(spec, test::shipped_table().catalogue);
        io::TextStyle style;
        style.brief = true;
        const std::string text = io::render_text(r, style);
        const auto lines = lines_of(text);
        CHECK(lines.size() <= 12);
        CHECK(lines[1].rfind("Result: FAIL", 0) == 0);
        CHECK(lines[2].rfind("Design: 2N4401", 0) == 0);
        CHECK(text.find("FAIL transistor.current: 7.96 A against 450 mA") != std::string::npos);
        CHECK(text.find("pass ") == std::string::npos);
    }
}
