"""The character scans of the unit and size parsers and of search give exactly what the regular
expressions they replaced gave (checked against Python's own ``re``), and the hand-written fast
paths of the material look-up give what the plain algorithms give (a full sort, the classic
Levenshtein examples).

The core has no ``re`` (Transcrypt's module was 5.9 kB of the 41 kB gzip calculator bundle), so
the former patterns live here, as the reference. The scans run in the browser transpiled:
``test_the_scans_read_alike_in_node`` sends the same generated texts through node.
"""

import random
import re

import pytest
from hypothesis import example, given, settings, strategies as st

from conductor_atlas.core import geometry, lookup, search_text, text_match, typed_text, units
from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.geometry import parse_size

# --- the former definitions (units.py, geometry.py and search.py compiled these) -------------------
# ... extended since by groups: "1,500,000", "12,500.5", "1 500" (a space and exactly three digits);
# what the separators mean is typed_text.grouped_number_text's job, checked in test_units.py
NUMBER_PATTERN = re.compile(r"^([+-]?(?:[0-9]+(?:[.,][0-9]+| [0-9]{3}(?![0-9]))*[.,]?|[.,][0-9]+)(?:[eE][+-]?[0-9]+)?)"
                            r"\s*(.*)$")
UNPORTABLE_PATTERN = re.compile(r"[\x00-\x08\x0b\x0c\x0e-\x1f\x7f-\x9f\ufeff]")
LINE_BREAKS = re.compile(r"[\n\r\u2028\u2029]")
SPACED_STAR = re.compile(r"\s*\*\s*")
SPACED_SLASH = re.compile(r"\s*/\s*")
SPACES = re.compile(r"\s+")
SECOND_SEPARATOR = re.compile(r"^[.,][0-9]")
ZEROS = re.compile(r"^0+$")
DIGITS = re.compile(r"^[0-9]+$")
AWG_FIRST = re.compile(r"^(?:awg|ga)\s*#?\s*([0-9/]+)$", re.IGNORECASE)
AWG_LAST = re.compile(r"^#?\s*([0-9/]+)\s*(?:awg|ga)$", re.IGNORECASE)
BARE_GAUGE = re.compile(r"#\s*([0-9/]+)|(4/0|3/0|2/0|1/0)")  # used with fullmatch
FORMER_DIAMETER = re.compile(r"^(?:d|dia|diameter|ø|⌀|Ø)\s*=?\s*(.+)$", re.IGNORECASE)
BAR = re.compile(r"^([0-9.,eE+-]+)\s*[x×*]\s*([0-9.,eE+-]+)\s*(.*)$")
NON_ASCII = re.compile(r"[^\x00-\x7f]")
# ... and one corrected: FORMER_DIAMETER tried "d" first, so "dia 2.5 mm" gave "ia 2.5 mm" (refused,
# though the module docstring has always offered "dia"); the scan tries the longest word first
DIAMETER = re.compile(r"^(?:diameter|dia|d|ø|⌀|Ø)\s*=?\s*(.+)$", re.IGNORECASE)
# ---------------------------------------------------------------------------------------------------

# characters around every branch of the scans: digits, signs, separators, exponents, the spaces
# both runtimes' \s share, the ones only one of them has, line breaks, look-alikes, astral
PIECES = list("0123456789+-.,eE xX*/^%\t\n\r") + [
    "mm", "m", "°C", "µΩ·cm", "²", "³", "\u00a0", "\u202f", "\u2009", "\u3000", "\u1680", "\u205f", "\ufeff",
    "\x1c", "\x85", "\u2028", "\u2029", "−", "–", "Ω", "Ω", "ohm", "AWG", "k", "Hz", "\U0001F600", "\x00",
    "\x7f", "deg C", "sq mm", "kcm", "MHz", "Mohm", "A/mm2", "ppm/K", "1/K", "\u180e", "\u200b", "^2"]
TEXTS = st.lists(st.sampled_from(PIECES), max_size=8).map("".join)

# the size words in the cases Python's re.IGNORECASE takes (İ and ı for i, Kelvin sign K for k),
# the size separators and everything the number and space pieces above hold
SIZE_PIECES = PIECES + [
    "awg", "Awg", "aWG", "ga", "GA", "Ga", "#", "/", "4/0", "0000", "00", "12", "d", "D", "dia", "DIA", "dİa",
    "dıa", "diameter", "DiAmEtEr", "ø", "Ø", "⌀", "=", "×", "X", "*", "\u212a", "i", "İ", "ı", "a", "g",
    "w", "\x0b", "\x0c", "\x1f", "\u2000", "\u200a", "\u2007", "\u3000"]

EDGE_TEXTS = [
    "", " ", "\t", "\n", "5", "5\n", "5 \n", "5 mm\n", "5\nmm", "5 mm\nx", "5 mm\n\n", "5\n\n", "\n5", "5\t\tmm",
    "5\u2028mm", "5\x85mm", "5\x1cmm", ".", ",5", "5,", "1e", "1e+", "1e5mm", "+.5e-3", "-", "1,2.5", "1. 5",
    "awg", "AWG12", "awg 12", "AWG #12", "awg# 12", "ga4/0", "GA 4/0", "12awg", "#12 AWG", "# 12 ga", "12 ga",
    "12 gaa", "awg 12 x", "awg12/", "awg//", "#awg 12", "12\tAWG", "AWG\u00a012", "12\u3000ga",
    "d", "D", "d ", "d=", "d =", "d = ", "d =  ", "d= x", "d2 mm", "D 2 mm", "d=2 mm", "d = 2 mm", "dia 2.5 mm",
    "diameter 2.5 mm", "DIA 1 mm", "dİa 1 mm", "dıa 1 mm", "ø", "ø2 mm", "Ø 2mm", "⌀ 2 mm", "⌀=1,6 mm", "øø",
    "40 x 5 mm", "40x5mm", "40×5 mm", "40*5 mm", "40 X 5 mm", "40 x 5", "40 x", "x 5 mm", "1e1x2e0 mm",
    "40 x 5 mm\t", "40 x5\u2009mm", "4,0x5.0 mm", "--x++ mm", "40 xx 5 mm", "40 x 5 x 3 mm",
    "0", "00", "000", "0000", "0000000", "1", "12", "123", "1234", "4/0", "5/0", "0/0", "1/0",
    "A / mm2", "ohm  m", "ohm * m", " * ", "/", " / ", "a \t* b", "a * / b", "a / * b", "\u2028m",
    "\ufeff5 mm", "\x005 mm", "😀", "5 😀", "d 😀", "😀 x 5 mm", "ÄÖ", "µ",
]


def generated(pieces, count, seed):
    """``count`` texts of up to 10 pieces drawn from ``pieces`` (a fixed seed: any seed would do,
    fixed so a failure repeats)."""
    draw = random.Random(seed)
    return ["".join(draw.choice(pieces) for _ in range(draw.randint(0, 10))) for _ in range(count)]


NUMBER_TEXTS = EDGE_TEXTS + generated(PIECES, 20000, 1)
SIZE_TEXTS = EDGE_TEXTS + generated(SIZE_PIECES, 20000, 2)
# the geometry scans read one stripped line: what size_from_text hands them (normalise_text then strip)
ONE_LINE_TEXTS = sorted({t.replace("\n", " ").strip() for t in SIZE_TEXTS})


def groups_of(pattern, text):
    match = pattern.match(text)
    return None if match is None else list(match.groups())


def regex_parse_number(text, field):
    """parse_number as it read with NUMBER_PATTERN (the definition the scan follows)."""
    match = NUMBER_PATTERN.match(text)
    if match is None:
        raise CoreError("expected a number first, found “" + text + "”", field)
    number_text, rest = match.group(1), match.group(2)
    if SECOND_SEPARATOR.match(rest) is not None:
        raise CoreError("“" + text + "” mixes a decimal comma and a decimal point, or has two separators; "
                        "write it as 1234.5 or 1234,5", field)
    value = float(typed_text.grouped_number_text(number_text, field))
    if value - value != 0:
        # the number as it was typed ("1,e310"), not as it was read ("1.e310"): the user finds it
        raise CoreError("“" + number_text + "” is not a finite number", field)
    return [value, rest]


def regex_portable_text(text):
    return LINE_BREAKS.sub(" ", UNPORTABLE_PATTERN.sub("", text)).strip()


def regex_joined_spaces(unit):
    return SPACES.sub("*", SPACED_SLASH.sub("/", SPACED_STAR.sub("*", unit)))


def regex_normalise_unit(unit_text):
    """normalise_unit with its three space patterns always applied."""
    unit = unit_text.strip()
    if unit in units.CASE_SENSITIVE:
        return units.CASE_SENSITIVE[unit]
    unit = regex_joined_spaces(unit)
    unit = unit.lower().replace("ohms", "ohm").replace("deg*c", "degc").replace("deg*f", "degf")
    unit = unit.replace("sq*mm", "mm2").replace("sqmm", "mm2")
    return "kcmil" if unit == "kcm" else unit


def regex_awg_number(name):
    """awg_number as it read with ZEROS and DIGITS."""
    text = name.strip()
    if text in geometry.AWG_NAMES:
        return geometry.AWG_NAMES.index(text) - 3
    if ZEROS.match(text) is not None:
        return 1 - len(text)
    if DIGITS.match(text) is None or len(text) > 3:
        raise CoreError("“" + name + "” is not an AWG gauge (use 4/0 … 56)", "size")
    return int(text)


def regex_size_from_text(text, field):
    """size_from_text as it read with the former patterns."""
    compact = typed_text.normalise_text(text).strip()
    awg = AWG_FIRST.match(compact) or AWG_LAST.match(compact)
    if awg is None:
        awg = BARE_GAUGE.fullmatch(compact)  # "#12", "# 4/0", a bare "4/0" (the gauge sign; N/0 is only AWG)
    if awg is not None:
        n = regex_awg_number(awg.group(1) or awg.group(2)) if awg.re is BARE_GAUGE else regex_awg_number(awg.group(1))
        d = geometry.awg_diameter(n)
        return geometry.size_record("round", geometry.awg_area(n), geometry.awg_name(n) + " AWG", d, 0.0, 0.0)
    diameter = DIAMETER.match(compact)
    if diameter is not None:
        d = units.parse_quantity(diameter.group(1), "length", field)
        if not (d > 0):
            raise CoreError("diameter must be greater than zero", field)
        area = geometry.usable_area(geometry.round_area(d), field)
        return geometry.size_record("round", area, "ø " + diameter.group(1).strip(), d, 0.0, 0.0)
    bar = BAR.match(compact)
    if bar is not None:
        unit = bar.group(3).strip()
        if len(unit) == 0:
            raise CoreError("needs a unit for the bar, e.g. 40 x 5 mm", field)
        w = units.parse_quantity(bar.group(1) + " " + unit, "length", field)
        t = units.parse_quantity(bar.group(2) + " " + unit, "length", field)
        if not (w > 0 and t > 0):
            raise CoreError("bar width and thickness must be greater than zero", field)
        return geometry.size_record("bar", geometry.usable_area(w * t, field), compact, 0.0, max(w, t), min(w, t))
    if re.fullmatch(r"[0-9]+", compact):
        raise CoreError("“" + compact + "” needs a unit: write " + compact + " mm² for an area or " + compact
                        + " AWG for a gauge (d " + compact + " mm for a diameter)", field)
    area = units.parse_quantity(compact, "area", field)
    if not (area > 0):
        raise CoreError("cross-section must be greater than zero", field)
    return geometry.size_record("area", area, compact, geometry.diameter_from_area(area), 0.0, 0.0)


def outcome_of(function, *args):
    try:
        return ("value", function(*args))
    except CoreError as problem:
        return ("error", problem.message, problem.field)


def mismatches(scan, reference, texts):
    """The texts (at most 5) where ``scan`` and ``reference`` differ, with both answers."""
    found = []
    for text in texts:
        got, want = scan(text), reference(text)
        if got != want:
            found.append((text, got, want))
            if len(found) == 5:
                break
    return found


# --- units -------------------------------------------------------------------------------------------

def test_space_characters_are_what_regex_s_matches():
    # Python's re \s over every code point
    matched = [chr(c) for c in range(0x110000) if re.match(r"\s", chr(c)) is not None]
    assert matched == list(typed_text.SPACE_CHARACTERS)


def test_has_space_flags_every_character_regex_s_matches():
    assert [chr(c) for c in range(0x10000) if re.match(r"\s", chr(c)) and not typed_text.has_space(chr(c))] == []


def test_split_number_gives_the_groups_of_number_pattern():
    assert mismatches(typed_text.split_number, lambda t: groups_of(NUMBER_PATTERN, t), NUMBER_TEXTS) == []


def test_parse_number_reads_as_number_pattern_did():
    assert mismatches(lambda t: outcome_of(typed_text.parse_number, t, "f"),
                      lambda t: outcome_of(regex_parse_number, t, "f"), NUMBER_TEXTS) == []


def test_the_text_cleaners_give_what_the_patterns_gave():
    assert mismatches(typed_text.without_controls, lambda t: LINE_BREAKS.sub(" ", UNPORTABLE_PATTERN.sub("", t)),
                      SIZE_TEXTS) == []
    assert mismatches(typed_text.portable_text, regex_portable_text, SIZE_TEXTS) == []
    assert mismatches(units.joined_spaces, regex_joined_spaces, SIZE_TEXTS) == []
    assert mismatches(units.normalise_unit, regex_normalise_unit, SIZE_TEXTS) == []
    # the geometry scans are handed normalised text: one line, whatever was typed
    assert [t for t in SIZE_TEXTS if "\n" in typed_text.normalise_text(t)] == []


@settings(max_examples=3000, deadline=None)
@given(TEXTS)
@example("1,e310")  # an overflow typed with a decimal comma: the message quotes it as typed
def test_parse_number_scans_as_number_pattern_matches(text):
    assert outcome_of(typed_text.parse_number, text, "f") == outcome_of(regex_parse_number, text, "f")


@settings(max_examples=3000, deadline=None)
@given(TEXTS)
def test_fast_paths_of_the_text_cleaners_change_nothing(text):
    slow_portable = regex_portable_text(text)
    assert typed_text.portable_text(text) == slow_portable
    slow = slow_portable
    for old, new in [("−", "-"), ("–", "-"), ("µ", "u"), ("μ", "u"), ("Ω", "ohm"), ("Ω", "ohm"), ("²", "2"),
                     ("^2", "2"), ("³", "3"), ("^3", "3"), ("°", "deg"), ("·", "*"), ("⋅", "*"),
                     ("\u00a0", " "), ("\u202f", " "), ("\u2009", " ")]:
        slow = slow.replace(old, new)
    assert typed_text.normalise_text(text) == slow
    assert units.normalise_unit(text) == regex_normalise_unit(text)


# --- geometry ----------------------------------------------------------------------------------------

def test_awg_gauge_text_gives_the_group_of_the_awg_patterns():
    def reference(text):
        match = AWG_FIRST.match(text) or AWG_LAST.match(text)
        return None if match is None else match.group(1)
    assert mismatches(geometry.awg_gauge_text, reference, ONE_LINE_TEXTS) == []


def test_diameter_text_gives_the_group_of_the_diameter_pattern():
    def reference(text):
        match = DIAMETER.match(text)
        return None if match is None else match.group(1)
    assert mismatches(geometry.diameter_text, reference, ONE_LINE_TEXTS) == []


def test_the_corrected_diameter_pattern_differs_only_after_dia():
    # the same group, or the former one is the corrected one with "ia"/"iameter" left in front
    def differs(text):
        former, now = groups_of(FORMER_DIAMETER, text), groups_of(DIAMETER, text)
        if former == now:
            return False
        return not (now is not None and former is not None and re.match(r"(?i)dia", text)
                    and former[0].endswith(now[0]) and len(former[0]) > len(now[0]))
    assert [t for t in ONE_LINE_TEXTS if differs(t)] == []
    assert groups_of(FORMER_DIAMETER, "dia 2.5 mm") == ["ia 2.5 mm"]
    assert geometry.diameter_text("dia 2.5 mm") == "2.5 mm"
    assert geometry.diameter_text("Diameter=2.5 mm") == "2.5 mm"


def test_bar_parts_gives_the_groups_of_the_bar_pattern():
    assert mismatches(geometry.bar_parts, lambda t: groups_of(BAR, t), ONE_LINE_TEXTS) == []


def test_awg_number_reads_as_the_zeros_and_digits_patterns_did():
    gauges = ["".join(random.Random(k).choice("0123456789/ \t") for _ in range(k % 6)) for k in range(3000)]
    assert mismatches(lambda t: outcome_of(geometry.awg_number, t), lambda t: outcome_of(regex_awg_number, t),
                      EDGE_TEXTS + gauges) == []


def test_sizes_read_as_with_the_patterns():
    # the whole of parse_size (without its memo) on raw text, line breaks and controls included
    assert mismatches(lambda t: outcome_of(geometry.size_from_text, t, "s"),
                      lambda t: outcome_of(regex_size_from_text, t, "s"), SIZE_TEXTS) == []


# --- search ------------------------------------------------------------------------------------------

def test_is_ascii_is_the_non_ascii_pattern_finding_nothing():
    assert mismatches(search_text.is_ascii, lambda t: NON_ASCII.search(t) is None, SIZE_TEXTS) == []
    assert [c for c in range(0x10000) if search_text.is_ascii(chr(c)) != (c < 128)] == []


# --- both runtimes -----------------------------------------------------------------------------------

def scan_calls():
    """[module, function, args] for each scan on the edge cases and 1,500 generated texts (raw:
    line breaks and controls included, except for the one-line geometry scans)."""
    u, g, s = "conductor_atlas.core.units", "conductor_atlas.core.geometry", "conductor_atlas.core.search_text"
    t = "conductor_atlas.core.typed_text"
    calls = []
    for text in EDGE_TEXTS + generated(SIZE_PIECES, 1500, 3):
        for function in ("split_number", "without_controls", "portable_text"):
            calls.append([t, function, [text]])
        calls.append([u, "joined_spaces", [text]])
        # normalise_unit strips first, and the runtimes' strip differs on raw controls (\x85,
        # U+FEFF): it is only ever handed normalised text
        calls.append([u, "normalise_unit", [typed_text.normalise_text(text)]])
        calls.append([t, "parse_number", [text, "f"]])
        calls.append([s, "is_ascii", [text]])
        line = text.replace("\n", " ").strip()
        for function in ("awg_gauge_text", "diameter_text", "bar_parts"):
            calls.append([g, function, [line]])
        calls.append([g, "size_from_text", [text, "s"]])
    return calls


def test_the_scans_read_alike_in_node(node_core):
    from tests.test_differential import differences, run_python
    calls = scan_calls()
    node = node_core.call_many([{"module": m, "function": f, "args": a} for m, f, a in calls])
    problems = []
    for (module, function, args), js in zip(calls, node):
        found = differences(run_python(module, function, args), js)
        if found:
            problems.append(function + repr(args) + ": " + "; ".join(found))
    assert len(node) == len(calls)
    assert problems[:10] == [], str(len(problems)) + " differ"


# --- memo and look-up --------------------------------------------------------------------------------

def test_a_field_read_again_gives_the_same_value_or_message():
    first = outcome_of(units.parse_quantity, "2,5 mm", "length", "a")
    other = outcome_of(units.parse_quantity, "7 kg", "length", "b")
    assert first == ("value", 0.0025)
    assert other[0] == "error" and other[2] == "b"
    # the same texts again, interleaved with another field and another kind of the same field
    assert outcome_of(units.parse_quantity, "3 A", "current", "a") == ("value", 3.0)
    assert outcome_of(units.parse_quantity, "2,5 mm", "length", "a") == first
    assert outcome_of(units.parse_quantity, "7 kg", "length", "b") == other
    assert outcome_of(units.parse_quantity, "2,5 mm", "length", "a", "m") == first
    assert outcome_of(units.parse_quantity, "2,5", "length", "a", "mm") == ("value", 0.0025)
    assert outcome_of(units.parse_quantity, "2,5", "length", "a") == (
        "error", "needs a unit: enter " + units.KIND_WORDS["length"], "a")


def test_a_size_read_again_gives_the_same_record_or_message():
    assert parse_size("4/0 AWG", "s1")["area"] == parse_size("4/0 AWG", "s1")["area"]
    bad = outcome_of(parse_size, "99 AWG", "s2")
    assert bad[0] == "error" and bad[1] == outcome_of(parse_size, "99 AWG", "s2")[1]
    # an AWG problem names the field "size" whatever field asked (as before the memo)
    assert bad[2] == outcome_of(parse_size, "99 AWG", "s2")[2] == "size"


def edit_distance(a, b):
    return search_text.osa_distance(a, b, 1000000)


def test_edit_distance_classic_examples():
    # Levenshtein (1966) distance; the textbook pairs (no adjacent swaps in them, so OSA agrees)
    assert edit_distance("kitten", "sitting") == 3
    assert edit_distance("flaw", "lawn") == 2
    assert edit_distance("", "abc") == 3
    assert edit_distance("abc", "abc") == 0
    assert edit_distance("ab", "ba") == 1  # OSA: one swap of adjacent letters


@settings(max_examples=500, deadline=None)
@given(st.text("abc01", max_size=7), st.text("abc01", max_size=7), st.integers(0, 8))
def test_edit_distance_within_is_exact_up_to_its_limit(a, b, limit):
    exact = edit_distance(a, b)
    cut = search_text.osa_distance(a, b, limit)
    assert cut == exact if exact <= limit else cut > limit


def full_sort_nearest(catalogue, text, count):
    """nearest_names by sorting every id and alias by (distance, name), then dropping repeats."""
    wanted = text_match.name_key(text)
    scored = [(edit_distance(wanted, i), i) for i in catalogue["materials"]]
    scored += [(edit_distance(wanted, a), catalogue["display_aliases"][a]) for a in catalogue["aliases"]]
    names = []
    for _, name in sorted(scored):
        if name not in names:
            names.append(name)
        if len(names) >= count:
            break
    return names


@settings(max_examples=300, deadline=None)
@given(st.text("abcdeilnoprstu0123456789-. ", max_size=12), st.sampled_from([0, 1, 2, 5, 12, 500]))
def test_nearest_names_is_the_full_sort(catalogue, text, count):
    assert lookup.nearest_names(catalogue, text, count) == full_sort_nearest(catalogue, text, count)


def test_nearest_names_when_an_id_is_also_an_alias():
    small = {"materials": {"cu": {}, "al": {}, "x1": {}},
             "aliases": {"cu": "cu", "copper": "cu", "al1": "AL1"},
             "display_aliases": {"cu": "Cu", "copper": "Copper", "al1": "AL1"}}
    for text in ["c", "cu", "zz", "al", "", "copper", "x"]:
        for count in (0, 1, 2, 3, 5, 9):
            assert lookup.nearest_names(small, text, count) == full_sort_nearest(small, text, count)
