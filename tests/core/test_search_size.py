"""A conductor size typed into the search answers with the size (core/search_size.py).

Values: ASTM B258 (standard nominal diameters of solid round AWG wire): 4/0 = 0.4600 in = 11.684 mm,
12 AWG = 0.0808 in = 2.0523 mm (areas π d²/4: 107.22 and 3.3081 mm²); 250 kcmil = 250 000 circular mils,
one circular mil being π/4 mil² (NEC Chapter 9 Table 8 lists 250 kcmil as 127 mm²): 126.68 mm², the
diameter of a solid round of that area 0.500 in = 12.70 mm. Shown to 4 significant digits.
"""

import math

import pytest

from conductor_atlas.core.search import search_entries
from conductor_atlas.core.search_size import size_result

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
    size with other words, a filter or an unreadable size are searched as text."""
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
