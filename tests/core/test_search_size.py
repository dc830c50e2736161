"""A conductor size typed into the search answers with the size (core/search_size.py).

Values: ASTM B258 (standard nominal diameters of solid round AWG wire): 4/0 = 0.4600 in = 11.684 mm,
12 AWG = 0.0808 in = 2.0523 mm (areas π d²/4: 107.22 and 3.3081 mm²); 250 kcmil = 250 000 circular mils,
one circular mil being π/4 mil² (NEC Chapter 9 Table 8 lists 250 kcmil as 127 mm²): 126.68 mm², the
diameter of a solid round of that area 0.500 in = 12.70 mm. Shown to 4 significant digits.
"""

import math

import pytest

from conductor_atlas.core.search import search_entries
from conductor_atlas.core.search_size import size_result, size_split
from conductor_atlas.core.trade_words import link_text

ENTRIES = [
    {"id": "cu-ni-55-45", "kind": "material", "title": "Copper-nickel 55/45 resistance alloy",
     "url": "materials/cu-ni-55-45/index.html", "summary": "A copper-nickel alloy."},
    {"id": "copper-annealed", "kind": "material", "title": "Standard annealed copper",
     "url": "materials/copper-annealed/index.html", "summary": "100 %IACS."},
]


@pytest.mark.parametrize("typed, title", [
    ("4/0", "4/0 AWG: 107.2 mm², ø 11.68 mm"),          # ASTM B258: 0.4600 in
    ("12 AWG", "12 AWG: 3.308 mm², ø 2.052 mm"),        # ASTM B258: 0.0808 in
    ("#12", "12 AWG: 3.308 mm², ø 2.052 mm"),
    ("250 kcmil", "250 kcmil: 126.7 mm², ø 12.7 mm as solid round"),
    ("2.5 mm²", "2.5 mm²: ø 1.784 mm as solid round"),  # √(4 · 2.5 / π) = 1.7841 mm
    ("100 x 10 mm", "100 x 10 mm: 1000 mm²"),
    ("d 1.6 mm", "ø 1.6 mm: 2.011 mm²"),                # π 1.6² / 4 = 2.0106 mm²
])
def test_a_size_answers_with_its_area_and_diameter(typed, title):
    assert size_result(typed)["title"] == title


def test_the_printed_values_follow_from_the_standard_diameters():
    """The titles above, recomputed from ASTM B258's inches and the circular mil's definition."""
    assert math.pi / 4 * (0.4600 * 25.4) ** 2 == pytest.approx(107.2, abs=0.05)
    assert math.pi / 4 * (0.0808 * 25.4) ** 2 == pytest.approx(3.308, abs=0.0005)
    kcmil_mm2 = 250e3 * math.pi / 4 * (0.0254e-3 * 1e3) ** 2
    assert kcmil_mm2 == pytest.approx(126.7, abs=0.05)


@pytest.mark.parametrize("typed", ["copper", "12", "", "   ", "iacs > 90", "4/0 copper", "0 AWG x", "1e400 mm²"])
def test_anything_else_gives_no_size(typed):
    """A bare number is a gauge to some and mm² to others (the calculators refuse it and say so); a
    filter or an unreadable size is searched as text; a size with other words is split first (below)."""
    assert size_result(typed) is None


def test_the_size_comes_first_and_links_the_calculator_with_the_size():
    outcome = search_entries(ENTRIES, "4/0", 8)
    first = outcome["results"][0]
    assert first["kind"] == "size"
    assert first["url"] == "calculators/resistance/index.html?size=4/0 AWG"
    assert outcome["total"] == len(outcome["results"])


def test_the_size_counts_within_the_limit():
    outcome = search_entries(ENTRIES * 5, "4/0", 3)
    assert len(outcome["results"]) <= 3
    assert outcome["results"][0]["kind"] == "size"


def test_a_name_with_digits_is_still_a_name():
    outcome = search_entries(ENTRIES, "55/45", 8)
    assert outcome["results"][0]["id"] == "cu-ni-55-45"


@pytest.mark.parametrize("typed, parts", [
    ("4/0 copper", ["4/0", "copper"]),
    ("copper 4/0", ["4/0", "copper"]),
    ("12 AWG aluminium", ["12 AWG", "aluminium"]),
    ("copper wire 2.5 mm²", ["2.5 mm²", "copper wire"]),
    ("100 x 10 mm aluminium", ["100 x 10 mm", "aluminium"]),
    ("4/0", ["4/0", ""]),
    ("aluminium 6101", None),   # a designation's number is not a size (no unit)
    ("cu-ni 55/45", None),
    ("copper", None),
])
def test_a_size_typed_with_other_words_is_split_off(typed, parts):
    assert size_split(typed) == parts


@pytest.fixture(scope="module")
def shipped_entries():
    from conductor_atlas.build import data_folders
    from conductor_atlas.derive import derive
    from conductor_atlas.load import load_dataset
    from conductor_atlas.search_index_file import build_index
    dataset = load_dataset(data_folders())
    return build_index(dataset, derive(dataset), {})["entries"]


@pytest.mark.parametrize("typed, material", [
    ("4/0 copper", "copper-annealed"),        # the trade word, read as the calculators read it (core.trade_words)
    ("copper 4/0", "copper-annealed"),
    ("2.5 mm² aluminium", "aluminium-1350"),
    ("100 x 10 mm oxygen-free copper", "copper-oxygen-free"),  # not a trade word: the best hit
    ("12 AWG tinned copper", None),
])
def test_a_size_with_a_material_opens_the_calculator_with_both(shipped_entries, typed, material):
    """Before: "4/0 copper" listed Copper-nickel 55/45 first (the size's digits matched its name) and
    "2.5 mm² copper" found only that alloy. Now the size comes first, the rest is searched alone, and the
    size result opens the calculator with the material (named in its text)."""
    outcome = search_entries(shipped_entries, typed, 6)
    size = outcome["results"][0]
    assert size["kind"] == "size"
    assert outcome["results"][1]["id"] != "cu-ni-55-45"
    rest = size_split(typed)[1]
    assert [r["id"] for r in outcome["results"][1:]] == [r["id"] for r in search_entries(shipped_entries, rest, 5)["results"]]
    if material is None:
        material = outcome["results"][1]["id"]
    assert size["url"].endswith("&material=" + link_text(material))
    title = [e["title"] for e in shipped_entries if e["id"] == material][0]
    assert title in size["snippet"]


def test_words_that_name_no_material_first_leave_the_calculators_default(shipped_entries):
    outcome = search_entries(shipped_entries, "4/0 AWG wire", 6)
    assert outcome["results"][0]["url"] == "calculators/resistance/index.html?size=4/0 AWG"
