"""Conductor cross-sections: AWG (ASTM B258), metric nominal sizes (IEC 60228), round wire,
rectangular bar, and the text forms people type for a size.

Size text accepted by ``parse_size``:
    "35 mm2", "35 mm²", "250 kcmil"    an area
    "12 AWG", "AWG 12", "4/0 AWG"      an AWG gauge (solid round wire, ASTM B258 nominal diameter);
    "#12", "4/0"                       also AWG: the gauge sign, and N/0, which no other size uses
    "d 2.5 mm", "ø2.5 mm", "dia 2.5 mm"  a round wire by diameter
    "40 x 5 mm", "40x5 mm"             a rectangular bar, width x thickness (one unit for both)

The text is read by character scans (no ``re``: see conductor_atlas.core.units), each giving what
the regular expression it replaced gave; tests/core/test_text_scanning.py checks them against it.
"""

import math

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.numfmt import format_number
from conductor_atlas.core.typed_text import normalise_text, space_end
from conductor_atlas.core.units import INCH, parse_quantity, recall_field, remember_field


# IEC 60228:2004 Table 1/2 nominal cross-sectional areas, mm² (the standard specifies a maximum
# resistance per size, not an exact area; the nominal area is a label).
IEC60228_SIZES_MM2 = [
    0.5, 0.75, 1.0, 1.5, 2.5, 4.0, 6.0, 10.0, 16.0, 25.0, 35.0, 50.0, 70.0, 95.0, 120.0,
    150.0, 185.0, 240.0, 300.0, 400.0, 500.0, 630.0, 800.0, 1000.0, 1200.0, 1400.0, 1600.0,
    1800.0, 2000.0, 2500.0,
]

AWG_NAMES = ["4/0", "3/0", "2/0", "1/0"]

DIGITS = "0123456789"
GAUGE_CHARACTERS = "0123456789/"
BAR_NUMBER_CHARACTERS = "0123456789.,eE+-"
BAR_TIMES = "x×*"  # lower-case x only, as before
AWG_WORDS = ["awg", "ga"]
# in the order they are tried, longest first: the first word that is followed by something wins
# (the former pattern tried "d" first, so "dia 2.5 mm" read "ia 2.5 mm" and was refused)
DIAMETER_WORDS = ["diameter", "dia", "d", "ø", "⌀"]
# the characters Python's re.IGNORECASE takes for each letter of those words
LETTER_FORMS = {"a": "aA", "w": "wW", "g": "gG", "d": "dD", "i": "iIİı", "m": "mM", "e": "eE", "t": "tT",
                "r": "rR", "ø": "øØ", "⌀": "⌀"}


# __pragma__ ('nokwargs')
def all_in(text, characters):
    """True when ``text`` is not empty and each of its characters is one of ``characters``."""
    if len(text) == 0:
        return False
    for i in range(len(text)):
        if characters.find(text[i]) < 0:
            return False
    return True


def run_end(text, i, characters):
    """The index after the run of ``characters`` that starts at ``i`` (``i`` itself for none)."""
    n = len(text)
    while i < n and characters.find(text[i]) >= 0:
        i += 1
    return i


def word_at(text, i, word):
    """True when ``text`` holds ``word`` (lower case, letters of LETTER_FORMS) at index ``i``,
    in any case."""
    if i + len(word) > len(text):
        return False
    for k in range(len(word)):
        if LETTER_FORMS[word[k]].find(text[i + k]) < 0:
            return False
    return True


def awg_gauge_text(text):
    """The gauge in "AWG 12", "awg #4/0", "ga12", "12 AWG", "#4/0 ga" (``text`` stripped); None
    for other text. What the former patterns ``^(?:awg|ga)\\s*#?\\s*([0-9/]+)$`` and
    ``^#?\\s*([0-9/]+)\\s*(?:awg|ga)$`` (IGNORECASE) matched on text with no line feed."""
    n = len(text)
    for word in AWG_WORDS:
        if word_at(text, 0, word):
            i = space_end(text, len(word))
            if i < n and text[i] == "#":
                i = space_end(text, i + 1)
            j = run_end(text, i, GAUGE_CHARACTERS)
            if j > i and j == n:
                return text[i:j]
    i = 0
    if n > 0 and text[0] == "#":
        i = 1
    i = space_end(text, i)
    j = run_end(text, i, GAUGE_CHARACTERS)
    if j == i:
        return None
    k = space_end(text, j)
    for word in AWG_WORDS:
        if word_at(text, k, word) and k + len(word) == n:
            return text[i:j]
    return None


def bare_gauge_text(text):
    """The gauge of an AWG size typed without the word: "#12", "# 4/0" (the gauge sign) or a bare
    "4/0", "3/0", "2/0", "1/0" (no other size is written N/0); None for other text, "12" included
    (12 mm² or 12 AWG: the caller asks for a unit)."""
    n = len(text)
    i = 0
    if n > 0 and text[0] == "#":
        i = space_end(text, 1)
    j = run_end(text, i, GAUGE_CHARACTERS)
    if j == i or j != n:
        return None
    gauge = text[i:j]
    if i > 0:
        return gauge
    for name in AWG_NAMES:
        if gauge == name:
            return gauge
    return None


def diameter_text(text):
    """The diameter after "diameter", "dia", "d", "ø" or "⌀" and an optional "=" ("dia 2.5 mm",
    "ø=1,6 mm"); None for other text. What the pattern ``^(?:diameter|dia|d|ø|⌀|Ø)\\s*=?\\s*(.+)$``
    (IGNORECASE) matches on text with no line feed, backtracking included: "d =" gives "=", and
    "d" is no match."""
    n = len(text)
    for word in DIAMETER_WORDS:
        if word_at(text, 0, word):
            start = len(word)
            i = space_end(text, start)
            if i < n and text[i] == "=":
                i = space_end(text, i + 1)
            if i < n:
                return text[i:n]
            if n > start:
                return text[n - 1:n]
    return None


def bar_parts(text):
    """[width, thickness, unit] of a bar such as "40 x 5 mm", "40×5mm", "1e1*2 mm" (the unit is
    what follows, possibly ""); None for other text. What the former pattern
    ``^([0-9.,eE+-]+)\\s*[x×*]\\s*([0-9.,eE+-]+)\\s*(.*)$`` matched on text with no line feed."""
    n = len(text)
    i = run_end(text, 0, BAR_NUMBER_CHARACTERS)
    if i == 0:
        return None
    k = space_end(text, i)
    if k >= n or BAR_TIMES.find(text[k]) < 0:
        return None
    m = space_end(text, k + 1)
    j = run_end(text, m, BAR_NUMBER_CHARACTERS)
    if j == m:
        return None
    return [text[0:i], text[m:j], text[space_end(text, j):n]]


def awg_number(name):
    """AWG gauge text -> gauge number n ("4/0" -> -3, "1/0" -> 0, "0000" -> -3, "12" -> 12).

    Examples
    --------
    >>> awg_number("4/0"), awg_number("0000"), awg_number("1/0"), awg_number("12")
    (-3, -3, 0, 12)
    """
    text = name.strip()
    for i in range(len(AWG_NAMES)):
        if text == AWG_NAMES[i]:
            return i - 3
    if all_in(text, "0"):
        return 1 - len(text)
    if not all_in(text, DIGITS) or len(text) > 3:
        raise CoreError("“" + name + "” is not an AWG gauge (use 4/0 … 56)", "size")
    n = 0
    for ch in text:
        n = n * 10 + DIGITS.find(ch)
    return n


def awg_name(n):
    """Gauge number -> text (-3 -> "4/0", 0 -> "1/0", -6 -> "7/0", 12 -> "12").

    Examples
    --------
    >>> awg_name(-3), awg_name(0), awg_name(12)
    ('4/0', '1/0', '12')
    """
    if n <= 0:
        return str(1 - n) + "/0"
    return str(n)


def awg_diameter_exact(n):
    """Diameter of AWG gauge n from the defining geometric series, [m].

    d_n = 0.005 in * 92**((36 - n) / 39)   (ASTM B258-18, section 4; 4/0 is n = -3)

    Examples
    --------
    4/0 is the series' start, 0.46 in = 11.684 mm exactly (ASTM B258):

    >>> round(awg_diameter_exact(-3) * 1e3, 9)
    11.684
    """
    return 0.005 * INCH * math.pow(92.0, (36.0 - n) / 39.0)


def awg_diameter(n):
    """ASTM B258 nominal diameter of AWG gauge n, [m].

    The exact series value rounded to the nearest 0.1 mil (0.0001 in), as the standard's table
    gives it for gauges 4/0 to 56 (e.g. 4/0: 0.4600 in, 10: 0.1019 in, 30: 0.0100 in).

    Examples
    --------
    AWG 10: 0.1019 in (101.9 mil), as ASTM B258's table prints (from memory):

    >>> round(awg_diameter(10) / 0.0254 * 1e3, 6)
    101.9
    """
    if n < -3 or n > 56:
        raise CoreError("AWG gauges run from 4/0 to 56; found " + awg_name(n), "size")
    mils = awg_diameter_exact(n) / (INCH / 1000.0)
    rounded_mils = math.floor(mils * 10.0 + 0.5) / 10.0
    return rounded_mils * INCH / 1000.0


def awg_area(n):
    """Cross-section of a solid round AWG wire from its nominal diameter, [m^2]: A = π d² / 4.

    Examples
    --------
    AWG 10: 5.261 mm^2, as ASTM B258's table prints (10 380 cmil; from memory):

    >>> round(awg_area(10) * 1e6, 3)
    5.261
    """
    d = awg_diameter(n)
    return math.pi * d * d / 4.0


def round_area(diameter):
    """Area of a round conductor, A = π d² / 4 [m^2]; diameter [m].

    Examples
    --------
    A 1.6 mm wire: pi 1.6^2 / 4 = 2.0106 mm^2 (by hand):

    >>> round(round_area(1.6e-3) * 1e6, 4)
    2.0106
    """
    return math.pi * diameter * diameter / 4.0


def diameter_from_area(area):
    """Diameter of the round conductor of a given area, d = sqrt(4 A / π) [m]; area [m^2].

    Examples
    --------
    2.5 mm^2 solid: sqrt(10 / pi) = 1.784 mm (by hand):

    >>> round(diameter_from_area(2.5e-6) * 1e3, 3)
    1.784
    """
    return math.sqrt(4.0 * area / math.pi)


def size_record(shape, area, label, diameter, width, thickness):
    """A conductor size as a plain dict (crosses into JS as an object)."""
    return {
        "shape": shape,
        "area": area,
        "label": label,
        "diameter": diameter,
        "width": width,
        "thickness": thickness,
    }


def area_text(size, area):
    """The cross-section area [m^2] as a person reads it, in mm², followed by the size as it was read
    when it was not typed as an area: "3.308 mm² (12 AWG)", "1000 mm² (100 x 10 mm)", "35 mm²"."""
    text = format_number(area * 1e6, 4) + " mm²"
    if size["shape"] != "area":
        text = text + " (" + size["label"] + ")"
    return text


def usable_area(area, field):
    """``area`` [m^2] when it is finite and above zero; a CoreError naming ``field`` otherwise.

    A diameter or bar side that parses can still give an area that overflows to infinity
    ("d 1e200 m") or underflows to zero ("d 1e-200 mm"); either would reach R = ρL/A.
    """
    if not (area - area == 0):
        raise CoreError("the cross-section is too large to compute with", field)
    if not (area > 0):
        raise CoreError("the cross-section is too small to compute with (it rounds to zero)", field)
    return area
# __pragma__ ('kwargs')


# The last text parse_size read for each field and what it gave, kept by units.remember_field
# as for units.LAST_PARSED (one entry per field, speed only). Callers only read the record, so handing out the same one again is safe.
LAST_SIZE = {}


def parse_size(text, field="size"):
    """Parse a conductor size (see module docstring) into a size record with SI values: "shape",
    "area" [m^2], "label", "diameter", "width", "thickness" [m] (0.0 where the shape has none).

    Raises CoreError naming ``field`` for anything it cannot read or that is not positive.

    Examples
    --------
    12 AWG is 80.8 mil = 2.05232 mm in ASTM B258's table, so π d²/4 = 3.3081 mm² by hand; a bar's
    area is width times thickness; 250 kcmil is 126.677 mm² with pint:

    >>> s = parse_size("12 AWG")
    >>> s["shape"], round(s["diameter"] * 1e3, 5), round(s["area"] * 1e6, 4)
    ('round', 2.05232, 3.3081)
    >>> s = parse_size("100 x 10 mm")
    >>> s["shape"], round(s["area"] * 1e6, 9), s["width"], s["thickness"]
    ('bar', 1000.0, 0.1, 0.01)
    >>> round(parse_size("250 kcmil")["area"] * 1e6, 3)
    126.677
    """
    if text is None or len(str(text).strip()) == 0:
        raise CoreError("is empty: enter a size (e.g. 2.5 mm², 12 AWG, d 1.6 mm, 40 x 5 mm)", field)
    typed = str(text)
    remembered = recall_field(LAST_SIZE, field, typed)
    if remembered is not None:
        return remembered
    try:
        size = size_from_text(typed, field)
    except CoreError as problem:
        remember_field(LAST_SIZE, field, typed, None, problem)
        raise problem
    remember_field(LAST_SIZE, field, typed, size, None)
    return size


# __pragma__ ('nokwargs')
def size_from_text(text, field):
    """parse_size without the memo (``text`` is a non-empty str).

    Examples
    --------
    4/0 AWG is 0.4600 in = 11.684 mm (ASTM B258), π d²/4 = 107.219 mm² by hand; "d 1.6 mm" a round
    wire of π 1.6²/4 = 2.0106 mm²:

    >>> s = size_from_text("4/0 AWG", "size")
    >>> s["label"], round(s["diameter"] * 1e3, 6), round(s["area"] * 1e6, 3)
    ('4/0 AWG', 11.684, 107.219)
    >>> s = size_from_text("d 1.6 mm", "size")
    >>> s["label"], round(s["area"] * 1e6, 4)
    ('ø 1.6 mm', 2.0106)
    """
    raw = normalise_text(text)
    compact = raw.strip()
    gauge = awg_gauge_text(compact)
    if gauge is None:
        gauge = bare_gauge_text(compact)
    if gauge is not None:
        n = awg_number(gauge)
        d = awg_diameter(n)
        return size_record("round", awg_area(n), awg_name(n) + " AWG", d, 0.0, 0.0)
    diameter = diameter_text(compact)
    if diameter is not None:
        d = parse_quantity(diameter, "length", field)
        if not (d > 0):
            raise CoreError("diameter must be greater than zero", field)
        return size_record("round", usable_area(round_area(d), field), "ø " + diameter.strip(), d, 0.0, 0.0)
    bar = bar_parts(compact)
    if bar is not None:
        unit = bar[2].strip()
        if len(unit) == 0:
            raise CoreError("needs a unit for the bar, e.g. 40 x 5 mm", field)
        w = parse_quantity(bar[0] + " " + unit, "length", field)
        t = parse_quantity(bar[1] + " " + unit, "length", field)
        if not (w > 0 and t > 0):
            raise CoreError("bar width and thickness must be greater than zero", field)
        wide = w
        thin = t
        if t > w:
            wide = t
            thin = w
        return size_record("bar", usable_area(w * t, field), compact, 0.0, wide, thin)
    if len(compact) > 0 and run_end(compact, 0, "0123456789") == len(compact):
        # a bare whole number: a gauge to some, square millimetres to others
        raise CoreError("“" + compact + "” needs a unit: write " + compact + " mm² for an area or " + compact
                        + " AWG for a gauge (d " + compact + " mm for a diameter)", field)
    area = parse_quantity(compact, "area", field)
    if not (area > 0):
        raise CoreError("cross-section must be greater than zero", field)
    return size_record("area", area, compact, diameter_from_area(area), 0.0, 0.0)


# Above this cross-section [m^2] (100 000 mm², forty times the largest IEC 60228 size) a size is
# beyond any cable or busbar: most likely a unit typed wrong (m² for mm²), so the answer asks. Our
# bound (no source): the largest IEC 60228 size, 2500 mm², is from Table 1/2.
LARGEST_PLAUSIBLE_AREA = 0.1


# __pragma__ ('nokwargs')
def size_reading_note(text, size, field):
    """A note on how the size text ``text`` (read by parse_size as ``size``) was read, shown with
    the results; "" when there is nothing to say:

    - a gauge written "ga" is read as AWG (what US wire catalogues mean by it); a British (SWG) or
      sheet-metal gauge of the same number is another diameter, so the note says which was used;
    - a cross-section above 100 000 mm² (LARGEST_PLAUSIBLE_AREA) is beyond any real conductor.

    Examples
    --------
    10 AWG is 0.1019 in = 2.588 mm (ASTM B258-18, Table 1):

    >>> note = size_reading_note("10 ga", parse_size("10 ga"), "size")
    >>> note[:25], note[note.find("("):note.find(")") + 1]
    ('size: “10 ga” is read as ', '(ASTM B258, ø 2.588 mm)')
    >>> size_reading_note("10 AWG", parse_size("10 AWG"), "size")
    ''
    """
    compact = normalise_text(text).strip()
    if awg_gauge_text(compact) is not None and compact.lower().find("awg") < 0:
        return (field + ": “" + compact + "” is read as " + size["label"] + " (ASTM B258, ø "
                + format_number(size["diameter"] * 1e3, 4) + " mm); a British (SWG) or sheet-metal gauge of "
                "the same number is another size: for one of those, type its diameter or thickness in mm")
    if size["area"] > LARGEST_PLAUSIBLE_AREA:
        return (field + ": " + format_number(size["area"] * 1e6, 4) + " mm² is far beyond any cable or "
                "busbar (IEC 60228 sizes end at 2500 mm²): check the unit")
    return ""


def next_metric_size(area):
    """Smallest IEC 60228 nominal size (mm², as a float) whose nominal area is >= area [m^2].

    Returns -1.0 when the area exceeds the largest listed size.

    Examples
    --------
    1.999 mm^2 needed: 2.5 mm^2 is the next size of the IEC 60228 series (1.5, 2.5, 4, ...):

    >>> next_metric_size(1.999e-6), next_metric_size(1e-2)
    (2.5, -1.0)
    """
    needed = area * 1e6
    for size in IEC60228_SIZES_MM2:
        if size >= needed * (1.0 - 1e-12):
            return size
    return -1.0


def next_awg(area):
    """Largest AWG gauge number (thinnest wire) whose nominal area is >= area [m^2].

    Returns -99 when even 4/0 is too small (use kcmil sizes or parallel conductors).

    Examples
    --------
    2.0 mm^2 needed: AWG 14 (2.08 mm^2 by ASTM B258) is the thinnest gauge that has it:

    >>> next_awg(2.0e-6), next_awg(5e-4)
    (14, -99)
    """
    n = 56
    while n >= -3:
        if awg_area(n) >= area * (1.0 - 1e-12):
            return n
        n -= 1
    return -99
# __pragma__ ('kwargs')
