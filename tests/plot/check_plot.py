#!/usr/bin/python3
"""Checks `coilfit size --plot`: the SVG is well-formed XML, draws every clamp option the report
lists, and shows the report's own figures (initial coil current, release current and release
time, peak collector voltage, derated limit), read back off the drawing through the axis ranges
the panels carry. With --render it also opens the SVG in headless chromium, takes a screenshot
and checks the picture: its size, that it is not blank, that every curve's colour is on it.

  check_plot.py COILFIT SPEC OUTDIR [--render]

Standard library only (the PNG is read with zlib). Exit 77 (ctest: skipped) when --render is
asked and no chromium is installed.
"""
import json
import os
import shutil
import struct
import subprocess
import sys
import xml.etree.ElementTree as ET
import zlib

SKIP = 77
NS = {"svg": "http://www.w3.org/2000/svg"}
failures = []


def expect(ok, what):
    if not ok:
        failures.append(what)
    return ok


def near(a, b, tol):
    return abs(a - b) <= tol


# ---- the drawing ----------------------------------------------------------------------------

class Panel:
    def __init__(self, el):
        self.x, self.y = float(el.get("x")), float(el.get("y"))
        self.w, self.h = float(el.get("width")), float(el.get("height"))
        self.t0, self.t1 = float(el.get("data-t-from")), float(el.get("data-t-to"))
        self.lo, self.hi = float(el.get("data-lo")), float(el.get("data-hi"))

    def point(self, px, py):
        """Pixel to (time, value)."""
        t = self.t0 + (px - self.x) / self.w * (self.t1 - self.t0)
        v = self.lo + (self.y + self.h - py) / self.h * (self.hi - self.lo)
        return t, v

    def value_at_y(self, py):
        return self.point(self.x, py)[1]


def polyline_points(el, panel):
    pts = []
    for pair in el.get("points").split():
        px, py = (float(c) for c in pair.split(","))
        pts.append(panel.point(px, py))
    return pts


def crossing_time(pts, level):
    """First time a falling curve reaches `level` (linear between points)."""
    for (ta, va), (tb, vb) in zip(pts, pts[1:]):
        if va >= level >= vb and va != vb:
            return ta + (va - level) / (va - vb) * (tb - ta)
    return None


def check_svg(svg_path, report):
    root = ET.parse(svg_path).getroot()  # raises on XML that is not well-formed
    expect(root.tag == "{http://www.w3.org/2000/svg}svg", "the root element is not <svg>")
    width, height = int(float(root.get("width"))), int(float(root.get("height")))
    page = root.find("svg:rect[@id='page']", NS)
    # An opaque white page of its own: the same picture on a light or a dark viewer.
    expect(page is not None and page.get("fill", "").lower() in ("#ffffff", "#fff", "white")
           and float(page.get("width")) >= width and float(page.get("height")) >= height,
           "no opaque white page behind the drawing")
    panels = {p.get("id"): Panel(p) for p in root.findall("svg:rect[@class='panel']", NS)}
    if not expect(set(panels) == {"panel-current", "panel-voltage"}, f"panels {sorted(panels)}"):
        return None
    cur, vol = panels["panel-current"], panels["panel-voltage"]
    curves = root.findall("svg:polyline[@class='curve']", NS)
    options = [o for o in report["clamp_options"] if o.get("release_time_s") is not None]
    expect(len(curves) == 2 * len(options), f"{len(curves)} curves for {len(options)} clamp options")
    labels = {c.get("data-option") for c in curves}
    expect(labels == {o["clamp"] for o in options}, f"curves {sorted(labels)} for options {[o['clamp'] for o in options]}")
    text = " ".join("".join(t.itertext()) for t in root.iter("{http://www.w3.org/2000/svg}text"))
    for unit in ("A)", "V)", "s)"):
        expect(unit in text, f"no axis title in {unit[0]}")

    q = report["quantities"]
    i0, i_rel = q["coil_current_max_a"], q["release_current_a"]
    limit = next(c["limit"] for c in report["checks"] if c["id"] == "transistor.voltage")
    span_t = cur.t1 - cur.t0
    markers = root.findall("svg:line[@class='marker']", NS)
    marker_values = sorted([cur.value_at_y(float(m.get("y1"))) for m in markers[:1]] +
                           [vol.value_at_y(float(m.get("y1"))) for m in markers[1:2]])
    expect(len(markers) == 2 and near(marker_values[0], i_rel, 0.005 * cur.hi) and near(marker_values[1], limit, 0.005 * vol.hi),
           f"markers at {marker_values}, expected the release current {i_rel} A and the derated limit {limit} V")
    by_label = {o["clamp"]: o for o in options}
    colours = set()
    for c in curves:
        o = by_label.get(c.get("data-option"))
        if o is None:
            continue
        colours.add(c.get("stroke").lower())
        in_current = all(cur.y - 3 <= float(p.split(",")[1]) <= cur.y + cur.h + 3 for p in c.get("points").split())
        if in_current:
            pts = polyline_points(c, cur)
            start = next(v for t, v in pts if t >= 0)
            expect(near(start, i0, 0.005 * cur.hi), f"{o['clamp']}: current starts at {start} A, the report's highest is {i0} A")
            t_rel = crossing_time(pts, i_rel)
            expect(t_rel is not None and near(t_rel, o["release_time_s"], 0.005 * span_t),
                   f"{o['clamp']}: crosses the release current at {t_rel} s, the report gives {o['release_time_s']} s")
        else:
            pts = polyline_points(c, vol)
            peak = max(v for t, v in pts)
            expect(near(peak, o["peak_collector_voltage_v"], 0.005 * vol.hi),
                   f"{o['clamp']}: peaks at {peak} V, the report gives {o['peak_collector_voltage_v']} V")
    return width, height, colours, (cur, vol)


# ---- the screenshot -------------------------------------------------------------------------

def read_png(path):
    """(width, height, rows of (r, g, b)) of an 8-bit RGB or RGBA PNG (ISO/IEC 15948)."""
    with open(path, "rb") as f:
        data = f.read()
    if data[:8] != b"\x89PNG\r\n\x1a\n":
        raise ValueError("not a PNG file")
    pos, idat, ihdr = 8, b"", None
    while pos < len(data):
        length, kind = struct.unpack(">I4s", data[pos:pos + 8])
        body = data[pos + 8:pos + 8 + length]
        if kind == b"IHDR":
            ihdr = struct.unpack(">IIBBBBB", body)
        elif kind == b"IDAT":
            idat += body
        elif kind == b"IEND":
            break
        pos += 12 + length
    width, height, depth, colour_type, _, _, interlace = ihdr
    if depth != 8 or colour_type not in (2, 6) or interlace != 0:
        raise ValueError(f"unexpected PNG format: depth {depth}, colour type {colour_type}, interlace {interlace}")
    bpp = 3 if colour_type == 2 else 4
    raw = zlib.decompress(idat)
    stride = width * bpp
    rows, prev, pos = [], bytearray(stride), 0
    for _ in range(height):
        filt, line = raw[pos], bytearray(raw[pos + 1:pos + 1 + stride])
        pos += 1 + stride
        for i in range(stride):
            a = line[i - bpp] if i >= bpp else 0
            b = prev[i]
            c = prev[i - bpp] if i >= bpp else 0
            if filt == 1:
                line[i] = (line[i] + a) & 255
            elif filt == 2:
                line[i] = (line[i] + b) & 255
            elif filt == 3:
                line[i] = (line[i] + (a + b) // 2) & 255
            elif filt == 4:
                p = a + b - c
                pa, pb, pc = abs(p - a), abs(p - b), abs(p - c)
                line[i] = (line[i] + (a if pa <= pb and pa <= pc else b if pb <= pc else c)) & 255
        rows.append([tuple(line[k:k + 3]) for k in range(0, stride, bpp)])
        prev = line
    return width, height, rows


def hex_rgb(h):
    h = h.lstrip("#")
    return tuple(int(h[k:k + 2], 16) for k in (0, 2, 4))


def check_render(svg_path, outdir, width, height, colours, panels):
    chromium = os.environ.get("CHROMIUM") or shutil.which("chromium") or shutil.which("chromium-browser")
    if not chromium:
        print("SKIP: no chromium to render the plot in (apt-get install -y chromium)")
        sys.exit(SKIP)
    png = os.path.join(outdir, os.path.basename(svg_path)[:-4] + ".png")
    if os.path.exists(png):
        os.remove(png)
    cmd = [chromium, "--headless", "--no-sandbox", "--disable-gpu", "--hide-scrollbars", "--no-first-run",
           "--force-device-scale-factor=1", f"--user-data-dir={os.path.join(outdir, 'chromium-profile')}",
           f"--window-size={width},{height}", f"--screenshot={png}", "file://" + os.path.abspath(svg_path)]
    p = subprocess.run(cmd, capture_output=True, text=True, timeout=120)
    if not expect(os.path.exists(png), f"chromium wrote no screenshot (exit {p.returncode}): {p.stderr[-400:]}"):
        return
    w, h, rows = read_png(png)
    expect((w, h) == (width, height), f"screenshot is {w}x{h}, expected {width}x{height}")
    pixels = [px for row in rows for px in row]
    inked = sum(1 for r, g, b in pixels if min(r, g, b) < 235)
    share = inked / len(pixels)
    expect(0.02 < share < 0.6, f"{share:.1%} of the picture is drawn on: blank or flooded")
    expect(len(set(pixels)) > 40, f"only {len(set(pixels))} colours: nothing rendered")
    expect(all(v >= 250 for v in rows[h - 3][w - 3]), f"bottom-right corner {rows[h - 3][w - 3]} is not the white page")
    for colour in sorted(colours):
        want = hex_rgb(colour)
        found = 0
        for panel in panels:  # inside the panels only: the legend's swatches do not count
            for y in range(int(panel.y), min(h, int(panel.y + panel.h))):
                for px in rows[y][int(panel.x):min(w, int(panel.x + panel.w))]:
                    if max(abs(px[k] - want[k]) for k in range(3)) <= 14:
                        found += 1
        expect(found >= 40, f"curve colour {colour}: {found} pixels in the panels")
    print(f"rendered {w}x{h}: {share:.1%} inked, {len(set(pixels))} colours, {len(colours)} curve colours found")


def main(argv):
    if len(argv) < 4:
        print(__doc__)
        return 2
    coilfit, spec, outdir = argv[1:4]
    render = "--render" in argv[4:]
    os.makedirs(outdir, exist_ok=True)
    svg = os.path.join(outdir, os.path.splitext(os.path.basename(spec))[0] + ".svg")
    if os.path.exists(svg):
        os.remove(svg)
    p = subprocess.run([coilfit, "size", spec, "--format", "json", "--plot", svg], capture_output=True, text=True)
    if p.returncode not in (0, 1):
        print(f"coilfit size exited {p.returncode}: {p.stderr.strip()}")
        return 1
    report = json.loads(p.stdout)
    checked = check_svg(svg, report)
    if checked and render and not failures:
        check_render(svg, outdir, *checked)
    for f in failures:
        print("FAIL:", f)
    if not failures:
        print(f"{os.path.basename(svg)}: well-formed, {len(report['clamp_options'])} clamp options, figures agree with the report")
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
