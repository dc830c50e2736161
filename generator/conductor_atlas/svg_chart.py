"""Line charts as inline SVG text: readable without JavaScript, themed by CSS classes only.

A pure function of its inputs: no file I/O, no clock, no randomness, so the same input gives
the same bytes. Used by the render stage for ρ(T) (linear axes) and δ(f) (log-log) charts.

Rules this module keeps:
- Every piece of text (titles, labels, units, series names: they can come from data files)
  is escaped. The chart id is checked to be a plain HTML id.
- Colours come only from class names (``chart-series-N``, ``chart-grid`` ...) styled in the
  "/* charts */" block of templates/static/style.css. Attributes carry only a monochrome
  fallback (``stroke="currentColor"``, ``fill="none"``) so a chart without the stylesheet
  still reads. Series differ by colour, dash pattern and marker shape, so they stay apart
  in greyscale print.
- Points that cannot be drawn (NaN, infinities, values ≤ 0 on a logarithmic axis) are left
  out and counted in the chart's ``<desc>``; nothing non-finite ever reaches a coordinate.
- Tick text uses ``conductor_atlas.core.numfmt`` so it matches the site's tables.
- Not part of the transpiled core: ordinary Python is fine here.

Ticks:
- Linear axis: the step is 1, 2 or 5 × 10ⁿ, the smallest one for which the ticks that cover
  the data (first tick ≤ minimum, last tick ≥ maximum, both multiples of the step) number at
  most 8; this always gives 4 to 8 ticks. The axis runs from the first to the last tick.
- Logarithmic axis: the ends are moved outward to the nearest 1, 2 or 5 × 10ⁿ (50 Hz stays
  50 Hz). Gridlines at every decade; labels at every decade when at most 8 lie inside,
  otherwise at every third decade (the SI-prefix steps: 1 kHz, 1 MHz, 1 GHz), or every
  sixth, ninth ...; the two ends are labelled too unless they would crowd a decade label.
  An axis of at most 2.5 decades gets ticks at 1, 2 and 5 × 10ⁿ instead (at most 8).
  Log tick labels carry SI prefixes (``format_si``: 50 Hz, 1 kHz, 10 µm) when the axis has
  a unit and ``x_prefix``/``y_prefix`` is left True; otherwise plain numbers, and "10ⁿ"
  outside 0.001 … 100 000. Set the flag to False for units that already carry a prefix
  ("µΩ·cm").

Usage (the page wraps the chart in a <figure> with a visible <figcaption>; the <title> and
<desc> are for assistive technology, and the derived table stays the data fallback)::

    from markupsafe import Markup
    from conductor_atlas.svg_chart import Series, line_chart

    svg = line_chart(
        [Series("Handbook table", temps_K, rho_uohm_cm, "points"),
         Series("Linear model (α at 20 °C)", model_T, model_rho, "line")],
        x_label="Temperature", x_unit="K", y_label="Resistivity", y_unit="µΩ·cm",
        title="Resistivity of silver against temperature", chart_id="silver-rho-t")
    html = Markup(svg)      # already escaped; pass it to Jinja as Markup (or |safe)

    line_chart([Series("Copper", freqs_Hz, delta_m, "line")],
               x_label="Frequency", x_unit="Hz", y_label="Skin depth", y_unit="m",
               x_log=True, y_log=True, title="Skin depth against frequency",
               chart_id="copper-skin-depth")
"""

from __future__ import annotations

import math
import re
from dataclasses import dataclass
from html import escape

from conductor_atlas.core.numfmt import format_fixed, format_number, format_si, superscript

__all__ = ["Series", "line_chart", "linear_ticks", "log_ticks", "STYLES"]

STYLES = ("line", "points")

MAX_TICKS = 8
PALETTE_SIZE = 6          # chart-series-0 … chart-series-5 in style.css, then repeats
MARKER_SHAPES = 6         # circle, square, triangle, diamond, down-triangle, cross; dashes cycle by 6 too
FONT = 14                 # px in the SVG's own coordinates
CHAR_W = 0.6 * FONT       # a generous average glyph width for system-ui digits and letters
LEGEND_ROW = 20
LOG_125_SPAN = 2.5        # decades: a log axis this short or shorter gets 1, 2, 5 × 10ⁿ ticks
_ID_RE = re.compile(r"[A-Za-z][A-Za-z0-9_-]*\Z")
_EPS = 1e-9


@dataclass(frozen=True)
class Series:
    """One data series: ``style`` "line" draws a polyline, "points" draws markers."""

    label: str
    xs: tuple[float, ...]
    ys: tuple[float, ...]
    style: str = "line"

    def __post_init__(self) -> None:
        if self.style not in STYLES:
            raise ValueError(f"series {self.label!r}: style must be 'line' or 'points', found {self.style!r}")
        if len(self.xs) != len(self.ys):
            raise ValueError(f"series {self.label!r}: xs has {len(self.xs)} values, ys has {len(self.ys)}")


# ---------------------------------------------------------------------------- ticks

def _decimal(m: int, e: int) -> float:
    """m × 10**e, correctly rounded (no 0.30000000000000004 from 3 * 0.1)."""
    return m * 10.0 ** e if e >= 0 else m / 10.0 ** -e


def linear_ticks(lo: float, hi: float, max_ticks: int = MAX_TICKS) -> list[float]:
    """Tick values for a linear axis covering [lo, hi]: 1-2-5 steps, at most ``max_ticks``.

    The first tick is ≤ lo and the last ≥ hi; the axis should run from the first to the last.
    Equal ends are widened by one unit of their leading digit (5 -> 4 … 6; 0 -> −1 … 1).
    """
    if not (math.isfinite(lo) and math.isfinite(hi)):
        raise ValueError("axis range must be finite")
    if lo > hi:
        lo, hi = hi, lo
    if hi - lo <= abs(hi) * 1e-12:
        pad = 10.0 ** math.floor(math.log10(abs(lo))) if lo != 0 else 1.0
        lo, hi = lo - pad, hi + pad
    e = math.floor(math.log10(hi - lo)) - 2
    while True:
        for m in (1, 2, 5):
            step = _decimal(m, e)
            first = math.floor(lo / step + _EPS)
            last = math.ceil(hi / step - _EPS)
            if last - first + 1 <= max_ticks:
                return [_decimal(i * m, e) for i in range(first, last + 1)]
        e += 1


def _step_decimals(ticks: list[float]) -> int:
    """Decimals needed to write the ticks' step exactly (0.25 -> 2, 5 -> 0)."""
    step = ticks[1] - ticks[0]
    return max(0, -math.floor(math.log10(step) + _EPS))


def _nice_down(v: float) -> float:
    e = math.floor(math.log10(v))
    for m in (5, 2, 1):
        c = _decimal(m, e)
        if c <= v * (1 + _EPS):
            return c
    return _decimal(5, e - 1)


def _nice_up(v: float) -> float:
    e = math.floor(math.log10(v))
    for m in (1, 2, 5, 10):
        c = _decimal(m, e)
        if c >= v * (1 - _EPS):
            return c
    return _decimal(1, e + 1)


def log_ticks(lo: float, hi: float, max_labels: int = MAX_TICKS) -> tuple[float, float, list[tuple[float, bool]]]:
    """Domain and ticks of a logarithmic axis covering [lo, hi] (both > 0).

    Returns (domain_lo, domain_hi, [(value, labelled), ...]) in increasing order; unlabelled
    ticks are decade gridlines between labels. The end labels are added by the layout
    (they depend on the room), see ``_log_axis``.
    """
    if not (lo > 0 and hi > 0 and math.isfinite(lo) and math.isfinite(hi)):
        raise ValueError("a logarithmic axis needs a finite range above 0")
    if lo > hi:
        lo, hi = hi, lo
    if hi <= lo * (1 + 1e-12):
        lo, hi = lo / math.sqrt(10.0), hi * math.sqrt(10.0)
    d_lo, d_hi = _nice_down(lo), _nice_up(hi)
    n0 = math.ceil(math.log10(d_lo) - _EPS)
    n1 = math.floor(math.log10(d_hi) + _EPS)
    decades = list(range(n0, n1 + 1))
    if math.log10(d_hi / d_lo) > LOG_125_SPAN:
        k = 1
        if len(decades) > max_labels:
            k = 3
            while len([n for n in decades if n % k == 0]) > max_labels - 1:
                k += 3
        return d_lo, d_hi, [(_decimal(1, n), n % k == 0) for n in decades]
    ticks = []
    for e in range(math.floor(math.log10(d_lo)) - 1, math.ceil(math.log10(d_hi)) + 1):
        for m in (1, 2, 5):
            v = _decimal(m, e)
            if d_lo * (1 - _EPS) <= v <= d_hi * (1 + _EPS):
                ticks.append((v, True))
    return d_lo, d_hi, ticks


# ---------------------------------------------------------------------------- axes

@dataclass(frozen=True)
class _Axis:
    lo: float
    hi: float
    log: bool
    ticks: tuple[tuple[float, str], ...]      # labelled ticks (value, text)
    minor: tuple[float, ...]                  # unlabelled gridlines

    def frac(self, v: float) -> float:
        if self.log:
            return (math.log10(v) - math.log10(self.lo)) / (math.log10(self.hi) - math.log10(self.lo))
        return (v - self.lo) / (self.hi - self.lo)


def _log_label(v: float, unit: str, prefix: bool) -> str:
    if prefix and unit:
        return format_si(v, unit, 3)
    n = math.log10(v)
    if abs(n - round(n)) < _EPS and (n < -3 or n > 5):
        return "10" + superscript(round(n))
    return format_number(v, 3)


def _value_text(v: float, unit: str, log: bool, prefix: bool) -> str:
    """A data value in the desc: 4 significant digits with its unit."""
    if log and prefix and unit:
        return format_si(v, unit, 4)
    text = format_number(v, 4)
    return f"{text} {unit}" if unit else text


def _linear_axis(lo: float, hi: float) -> _Axis:
    values = linear_ticks(lo, hi)
    decimals = _step_decimals(values)
    biggest = max(abs(values[0]), abs(values[-1]))
    plain = decimals <= 6 and biggest < 1e6
    ticks = tuple((v, format_fixed(v, decimals) if plain else format_number(v, 6)) for v in values)
    return _Axis(values[0], values[-1], False, ticks, ())


def _log_axis(lo: float, hi: float, unit: str, prefix: bool, min_gap: float) -> _Axis:
    """``min_gap``: the least distance, as a fraction of the axis, between an end label and
    the nearest decade label for the end to be labelled."""
    d_lo, d_hi, raw = log_ticks(lo, hi)
    axis = _Axis(d_lo, d_hi, True, (), ())
    labelled = [v for v, lab in raw if lab]
    minor = [v for v, lab in raw if not lab]
    for end in (d_lo, d_hi):
        if any(abs(axis.frac(end) - axis.frac(v)) < 1e-6 for v in labelled):
            continue
        if all(abs(axis.frac(end) - axis.frac(v)) >= min_gap for v in labelled):
            labelled.append(end)
    labelled.sort()
    minor = [v for v in minor if all(abs(axis.frac(v) - axis.frac(t)) > 1e-6 for t in labelled)]
    ticks = tuple((v, _log_label(v, unit, prefix)) for v in labelled)
    return _Axis(d_lo, d_hi, True, ticks, tuple(minor))


def _axis_title(label: str, unit: str, log: bool, prefix: bool) -> str:
    if unit and not (log and prefix):
        return f"{label} ({unit})"
    return label


# ---------------------------------------------------------------------------- drawing

def _n(v: float) -> str:
    """A coordinate with at most one decimal (a tenth of a CSS pixel at full size), no trailing zeros,
    never "-0"."""
    text = f"{v:.1f}".rstrip("0").rstrip(".")
    return "0" if text in ("-0", "") else text


def _text_w(text: str) -> float:
    return len(text) * CHAR_W


def _marker(shape: int, x: float, y: float) -> str:
    """Path data of one marker centred on (x, y).

    Shapes cycle: circle, square, triangle, diamond, downward triangle, cross
    (each about 9 px across, so they stay apart in greyscale).
    """
    if shape == 0:
        return f"M{_n(x - 4)},{_n(y)}a4,4 0 1,0 8,0a4,4 0 1,0 -8,0z"
    if shape == 1:
        return f"M{_n(x - 3.6)},{_n(y - 3.6)}h7.2v7.2h-7.2z"
    if shape == 2:
        return f"M{_n(x)},{_n(y - 4.8)}l4.6,8h-9.2z"
    if shape == 3:
        return f"M{_n(x)},{_n(y - 5)}l5,5l-5,5l-5,-5z"
    if shape == 4:
        return f"M{_n(x)},{_n(y + 4.8)}l4.6,-8h-9.2z"
    return f"M{_n(x - 1.6)},{_n(y - 4.8)}h3.2v3.2h3.2v3.2h-3.2v3.2h-3.2v-3.2h-3.2v-3.2h3.2z"


def _clean(series: Series, x_log: bool, y_log: bool) -> tuple[list[list[tuple[float, float]]], int]:
    """Runs of drawable points (a dropped point breaks a line) and the count dropped."""
    runs: list[list[tuple[float, float]]] = [[]]
    dropped = 0
    for x, y in zip(series.xs, series.ys):
        x, y = float(x), float(y)
        ok = math.isfinite(x) and math.isfinite(y) and (x > 0 or not x_log) and (y > 0 or not y_log)
        if ok:
            runs[-1].append((x, y))
        else:
            dropped += 1
            if runs[-1]:
                runs.append([])
    return [r for r in runs if r], dropped


def _legend_layout(labels: list[str], left: float, right: float) -> list[tuple[float, int]]:
    """(x, row) of each legend item, wrapping at the right edge."""
    out, x, row = [], left, 0
    for label in labels:
        w = 30 + _text_w(label) + 18
        if x > left and x + w - 18 > right:
            x, row = left, row + 1
        out.append((x, row))
        x += w
    return out


def line_chart(series: list[Series] | tuple[Series, ...], *, x_label: str, y_label: str,
               x_unit: str = "", y_unit: str = "", x_log: bool = False, y_log: bool = False,
               title: str, chart_id: str, width: int = 640, height: int = 360,
               x_prefix: bool = True, y_prefix: bool = True,
               x_domain: tuple[float, float] | None = None,
               y_domain: tuple[float, float] | None = None,
               description: str = "") -> str:
    """Render series on shared axes as an inline ``<svg>`` element (a str of escaped markup).

    ``x_domain``/``y_domain`` widen the axis to include those values (e.g. (0, 0) to show
    zero); the axis always covers all drawable data. ``description``, when given, opens the
    ``<desc>``; the ranges of every series follow it. ``chart_id`` must be a plain HTML id
    (a letter, then letters, digits, '-' or '_'); it prefixes the ids of <title> and <desc>.
    """
    if not _ID_RE.match(chart_id):
        raise ValueError(f"chart_id must be a letter followed by letters, digits, '-' or '_'; found {chart_id!r}")
    series = list(series)
    cleaned = [_clean(s, x_log, y_log) for s in series]
    xs = [x for runs, _ in cleaned for run in runs for x, _y in run]
    ys = [y for runs, _ in cleaned for run in runs for _x, y in run]
    for dom, vals, log in ((x_domain, xs, x_log), (y_domain, ys, y_log)):
        if dom is not None:
            vals.extend(v for v in dom if math.isfinite(v) and (v > 0 or not log))
    has_data = any(runs for runs, _ in cleaned)

    def span(vals: list[float], log: bool) -> tuple[float, float]:
        if not vals:
            return (1.0, 10.0) if log else (0.0, 1.0)
        return min(vals), max(vals)

    # -- vertical axis first: its label widths set the left margin
    y_lo, y_hi = span(ys, y_log)
    plot_h_guess = height - 60
    y_axis = _log_axis(y_lo, y_hi, y_unit, y_prefix, 22 / plot_h_guess) if y_log else _linear_axis(y_lo, y_hi)
    y_label_w = max(_text_w(t) for _, t in y_axis.ticks)
    left = 8 + FONT + 10 + y_label_w + 8
    x_lo, x_hi = span(xs, x_log)
    plot_w_guess = width - left - 16
    if x_log:
        widest = max(_text_w(_log_label(v, x_unit, x_prefix)) for v in (x_lo, x_hi, 1000.0))
        x_axis = _log_axis(x_lo, x_hi, x_unit, x_prefix, (widest + 12) / plot_w_guess)
    else:
        x_axis = _linear_axis(x_lo, x_hi)
    right = width - max(12.0, _text_w(x_axis.ticks[-1][1]) / 2 + 8)

    labels = [s.label for s in series]
    legend = _legend_layout(labels, left, right)
    rows = (max(r for _, r in legend) + 1) if legend else 0
    top = 10 + rows * LEGEND_ROW + (6 if rows else 0)
    bottom = height - (FONT + 6 + FONT + 14)

    def px(v: float) -> float:
        return left + x_axis.frac(v) * (right - left)

    def py(v: float) -> float:
        return bottom - y_axis.frac(v) * (bottom - top)

    out: list[str] = []
    a = out.append
    a(f'<svg xmlns="http://www.w3.org/2000/svg" class="chart" role="img" '
      f'aria-labelledby="{chart_id}-title {chart_id}-desc" viewBox="0 0 {width} {height}" '
      f'width="{width}" height="{height}" font-size="{FONT}">')
    a(f'<title id="{chart_id}-title">{escape(title)}</title>')
    a(f'<desc id="{chart_id}-desc">{escape(_summary(series, cleaned, x_label, y_label, x_unit, y_unit, x_log, y_log, x_prefix, y_prefix, description))}</desc>')

    # gridlines and frame
    a('<g fill="none" stroke="currentColor">')
    minor = [f"M{_n(px(v))},{_n(top)}V{_n(bottom)}" for v in x_axis.minor]
    minor += [f"M{_n(left)},{_n(py(v))}H{_n(right)}" for v in y_axis.minor]
    if minor:
        a(f'<path class="chart-grid-minor" d="{"".join(minor)}"/>')
    major = [f"M{_n(px(v))},{_n(top)}V{_n(bottom)}" for v, _ in x_axis.ticks]
    major += [f"M{_n(left)},{_n(py(v))}H{_n(right)}" for v, _ in y_axis.ticks]
    a(f'<path class="chart-grid" d="{"".join(major)}"/>')
    a(f'<rect class="chart-frame" x="{_n(left)}" y="{_n(top)}" width="{_n(right - left)}" height="{_n(bottom - top)}"/>')
    a('</g>')

    # tick labels and axis titles
    a('<g class="chart-text" fill="currentColor">')
    a('<g text-anchor="middle">')
    for v, text in x_axis.ticks:
        a(f'<text x="{_n(px(v))}" y="{_n(bottom + FONT + 4)}">{escape(text)}</text>')
    a(f'<text class="chart-axis-title" x="{_n((left + right) / 2)}" y="{_n(height - 8)}">'
      f'{escape(_axis_title(x_label, x_unit, x_log, x_prefix))}</text>')
    mid = (top + bottom) / 2
    a(f'<text class="chart-axis-title" transform="rotate(-90)" x="{_n(-mid)}" y="{_n(8 + FONT)}">'
      f'{escape(_axis_title(y_label, y_unit, y_log, y_prefix))}</text>')
    if not has_data:
        a(f'<text class="chart-empty" x="{_n((left + right) / 2)}" y="{_n(mid)}">No data to plot</text>')
    a('</g><g text-anchor="end">')
    for v, text in y_axis.ticks:
        a(f'<text x="{_n(left - 6)}" y="{_n(py(v) + FONT * 0.35)}">{escape(text)}</text>')
    a('</g></g>')

    # series and legend
    a('<g fill="none" stroke="currentColor">')
    for i, (s, (runs, _dropped)) in enumerate(zip(series, cleaned)):
        cls = f"chart-series-{i % PALETTE_SIZE}"
        if s.style == "line":
            d = "".join(
                f"M{_n(px(run[0][0]))},{_n(py(run[0][1]))}"
                + ("L" + " ".join(f"{_n(px(x))},{_n(py(y))}" for x, y in run[1:]) if len(run) > 1 else "h0")
                for run in runs)
            if d:
                a(f'<path class="chart-line {cls} chart-dash-{i % MARKER_SHAPES}" d="{d}"/>')
        else:
            d = "".join(_marker(i % MARKER_SHAPES, px(x), py(y)) for run in runs for x, y in run)
            if d:
                a(f'<path class="chart-points {cls}" d="{d}"/>')
    a('</g>')
    if legend:
        a('<g class="chart-legend">')
        for i, (s, (lx, row)) in enumerate(zip(series, legend)):
            cy = 10 + row * LEGEND_ROW + LEGEND_ROW / 2
            cls = f"chart-series-{i % PALETTE_SIZE}"
            if s.style == "line":
                a(f'<path class="chart-line {cls} chart-dash-{i % MARKER_SHAPES}" fill="none" stroke="currentColor" d="M{_n(lx)},{_n(cy)}h24"/>')
            else:
                a(f'<path class="chart-points {cls}" fill="none" stroke="currentColor" d="{_marker(i % MARKER_SHAPES, lx + 12, cy)}"/>')
            a(f'<text class="chart-text" fill="currentColor" x="{_n(lx + 30)}" y="{_n(cy + FONT * 0.35)}">{escape(s.label)}</text>')
        a('</g>')
    a('</svg>')
    return "".join(out)


def _summary(series, cleaned, x_label, y_label, x_unit, y_unit, x_log, y_log, x_prefix, y_prefix,
             description) -> str:
    """The <desc> text: what is plotted against what, each series' ranges, what was left out."""
    scale = {(False, False): "linear axes", (True, True): "logarithmic axes",
             (True, False): "logarithmic horizontal axis", (False, True): "logarithmic vertical axis"}
    parts = []
    if description:
        parts.append(description.rstrip(". ") + ".")
    parts.append(f"{y_label} against {x_label} ({scale[(x_log, y_log)]}).")
    dropped_total = 0
    items = []
    for i, (s, (runs, dropped)) in enumerate(zip(series, cleaned)):
        dropped_total += dropped
        pts = [p for run in runs for p in run]
        name = s.label or f"series {i + 1}"
        kind = "line" if s.style == "line" else "points"
        if not pts:
            items.append(f"{name} ({kind}): no points")
            continue
        xs = [x for x, _ in pts]
        ys = [y for _, y in pts]
        count = f"{len(pts)} point" + ("" if len(pts) == 1 else "s")
        items.append(
            f"{name} ({kind}, {count}): {x_label} {_value_text(min(xs), x_unit, x_log, x_prefix)} to "
            f"{_value_text(max(xs), x_unit, x_log, x_prefix)}, {y_label} "
            f"{_value_text(min(ys), y_unit, y_log, y_prefix)} to {_value_text(max(ys), y_unit, y_log, y_prefix)}")
    if items:
        parts.append("; ".join(items) + ".")
    else:
        parts.append("No data to plot.")
    if dropped_total:
        why = "not finite or not positive on a logarithmic axis" if (x_log or y_log) else "not finite"
        parts.append(f"{dropped_total} point{'s' if dropped_total != 1 else ''} left out ({why}).")
    return " ".join(parts)
