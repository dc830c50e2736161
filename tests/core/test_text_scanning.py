"""The hand-written fast paths of the unit parser and the material look-up give exactly what the
patterns and the plain algorithms they stand in for give (checked against Python's own ``re``,
a full sort, and the classic Levenshtein examples).

The browser runs the same code transpiled; tests/test_differential.py checks it there with the
scanning cases of tests/support/differential_cases.py.
"""

import re

from hypothesis import given, settings, strategies as st

from conductor_atlas.core import lookup, units
from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.geometry import parse_size

# characters around every branch of the scanners: digits, signs, separators, exponents, the
# spaces both runtimes' \s share, the ones only one of them has, line breaks, look-alikes, astral
PIECES = list("0123456789+-.,eE xX*/^%\t\n\r") + [
    "mm", "m", "°C", "µΩ·cm", "²", "³", "\u00a0", "\u202f", "\u2009", "\u3000", "\u1680", "\u205f", "\ufeff",
    "\x1c", "\x85", "\u2028", "\u2029", "−", "–", "Ω", "Ω", "ohm", "AWG", "k", "Hz", "\U0001F600", "\x00",
    "\x7f", "deg C", "sq mm", "kcm", "MHz", "Mohm", "A/mm2", "ppm/K", "1/K", "\u180e", "\u200b", "^2"]
TEXTS = st.lists(st.sampled_from(PIECES), max_size=8).map("".join)


def regex_parse_number(text, field):
    """parse_number as it reads with NUMBER_PATTERN alone (the definition the scanner follows)."""
    match = units.NUMBER_PATTERN.match(text)
    if match is None:
        raise CoreError("expected a number first, found “" + text + "”", field)
    number_text, rest = match.group(1), match.group(2)
    if units.SECOND_SEPARATOR.match(rest) is not None:
        raise CoreError("“" + text + "” mixes a decimal comma and a decimal point, or has two separators; "
                        "write it as 1234.5 or 1234,5", field)
    if "," in number_text:
        if "." in number_text:
            raise CoreError("“" + number_text + "” mixes a decimal comma and a decimal point", field)
        number_text = number_text.replace(",", ".")
    value = float(number_text)
    if value - value != 0:
        raise CoreError("“" + number_text + "” is not a finite number", field)
    return [value, rest]


def regex_normalise_unit(unit_text):
    """normalise_unit with its three space patterns always applied."""
    unit = unit_text.strip()
    if unit in units.CASE_SENSITIVE:
        return units.CASE_SENSITIVE[unit]
    unit = units.SPACES.sub("*", units.SPACED_SLASH.sub("/", units.SPACED_STAR.sub("*", unit)))
    unit = unit.lower().replace("ohms", "ohm").replace("deg*c", "degc").replace("deg*f", "degf")
    unit = unit.replace("sq*mm", "mm2").replace("sqmm", "mm2")
    return "kcmil" if unit == "kcm" else unit


def outcome_of(function, *args):
    try:
        return ("value", function(*args))
    except CoreError as problem:
        return ("error", problem.message, problem.field)


def test_space_characters_are_what_regex_s_matches_outside_needs_cleaning():
    # Python's re: \s over every BMP character that needs_cleaning lets through
    matched = {chr(c) for c in range(0x10000)
               if not units.needs_cleaning(chr(c)) and re.match(r"\s", chr(c)) is not None}
    assert matched == set(units.SPACE_CHARACTERS)


def test_has_space_flags_every_character_regex_s_matches():
    assert [chr(c) for c in range(0x10000) if re.match(r"\s", chr(c)) and not units.has_space(chr(c))] == []


@settings(max_examples=3000, deadline=None)
@given(TEXTS)
def test_parse_number_scans_as_number_pattern_matches(text):
    assert outcome_of(units.parse_number, text, "f") == outcome_of(regex_parse_number, text, "f")


@settings(max_examples=3000, deadline=None)
@given(TEXTS)
def test_fast_paths_of_the_text_cleaners_change_nothing(text):
    slow_portable = units.LINE_BREAKS.sub(" ", units.UNPORTABLE_PATTERN.sub("", text)).strip()
    assert units.portable_text(text) == slow_portable
    slow = slow_portable
    for old, new in [("−", "-"), ("–", "-"), ("µ", "u"), ("μ", "u"), ("Ω", "ohm"), ("Ω", "ohm"), ("²", "2"),
                     ("^2", "2"), ("³", "3"), ("^3", "3"), ("°", "deg"), ("·", "*"), ("⋅", "*"),
                     ("\u00a0", " "), ("\u202f", " ")]:
        slow = slow.replace(old, new)
    assert units.normalise_text(text) == slow
    assert units.normalise_unit(text) == regex_normalise_unit(text)


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


def test_edit_distance_classic_examples():
    # Levenshtein (1966) distance; the textbook pairs
    assert lookup.edit_distance("kitten", "sitting") == 3
    assert lookup.edit_distance("flaw", "lawn") == 2
    assert lookup.edit_distance("", "abc") == 3
    assert lookup.edit_distance("abc", "abc") == 0


@settings(max_examples=500, deadline=None)
@given(st.text("abc01", max_size=7), st.text("abc01", max_size=7), st.integers(0, 8))
def test_edit_distance_within_is_exact_up_to_its_limit(a, b, limit):
    exact = lookup.edit_distance(a, b)
    cut = lookup.edit_distance_within(a, b, limit)
    assert cut == exact if exact <= limit else cut > limit


def full_sort_nearest(catalogue, text, count):
    """nearest_names by sorting every id and alias by (distance, name), then dropping repeats."""
    wanted = lookup.fold(text)
    scored = [(lookup.edit_distance(wanted, i), i) for i in catalogue["materials"]]
    scored += [(lookup.edit_distance(wanted, a), catalogue["display_aliases"][a]) for a in catalogue["aliases"]]
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
