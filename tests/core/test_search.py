"""core.search: folding, typo tolerance, ranking, and filters whose units are checked against pint.

The typo cases are the misspellings engineers actually type (US spelling, swapped letters, a doubled
vowel); the filter thresholds are converted with pint, independently of our unit table.
"""

from __future__ import annotations

import pint
import pytest

from conductor_atlas.build import data_folders
from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.search import search
from conductor_atlas.core.search_filters import parse_filter, split_clauses
from conductor_atlas.core.search_prepare import prepare_index
from conductor_atlas.core.search_text import compact, fold_text, osa_distance, token_match, tokens, typo_budget
from conductor_atlas.derive import derive
from conductor_atlas.load import load_dataset
from conductor_atlas.search_index_file import build_index

UREG = pint.UnitRegistry()


@pytest.fixture(scope="module")
def entries():
    dataset = load_dataset(data_folders())
    return build_index(dataset, derive(dataset), {})["entries"]


@pytest.fixture(scope="module")
def index(entries):
    return prepare_index(entries)


def first_ids(index, query, n=1):
    return [r["id"] for r in search(index, query, n)["results"]]


# --- text -----------------------------------------------------------------------------------

@pytest.mark.parametrize("text, folded", [
    ("Crème Brûlée", "creme brulee"),
    ("ÆØÅ ß", "aeoa ss"),
    ("µΩ·cm²", "uohm·cm2"),      # micro sign
    ("μΩ·cm²", "uohm·cm2"),      # Greek mu: the same
    ("Ωhm", "ohmhm"),            # U+2126 ohm sign lower-cases to ω like U+03A9
    ("ρ α", "rho alpha"),
    ("e\u0301te\u0301", "ete"),   # combining acute accents (decomposed input) are dropped
])
def test_fold_text(text, folded):
    assert fold_text(text) == folded


def test_tokens_and_compact_ignore_punctuation():
    assert tokens("Cu-Ni 55/45 (CuNi44)") == ["cu", "ni", "55", "45", "cuni44"]
    assert compact("CCA-10") == compact("cca 10") == "cca10"


@pytest.mark.parametrize("a, b, distance", [
    ("kitten", "sitting", 3),     # the textbook Levenshtein example (OSA agrees: no swaps)
    ("ca", "ac", 1),              # one adjacent swap
    ("nickle", "nickel", 1),
    ("cooper", "copper", 1),
    ("aluminum", "aluminium", 1),
    ("", "abc", 3),
    ("abc", "abc", 0),
])
def test_osa_distance_known_values(a, b, distance):
    assert osa_distance(a, b, 10) == distance
    # with a smaller limit it stops early and reports limit + 1
    if distance > 0:
        assert osa_distance(a, b, distance - 1) == distance


def test_typo_budget_grows_with_word_length():
    assert [typo_budget(n) for n in (1, 3, 4, 7, 8, 12)] == [0, 0, 1, 1, 2, 2]


def test_designations_are_never_fuzzy():
    assert token_match("1351", "1350")[0] == 0
    assert token_match("c17201", "c17200")[0] == 0
    assert token_match("c172", "c17200")[0] > 0     # a prefix still helps while typing


# --- typo tolerance and ranking on the shipped data -----------------------------------------

@pytest.mark.parametrize("query, expected", [
    ("copper", "copper"),
    ("COPPER", "copper"),
    ("cooper", "copper"),
    ("coper", "copper"),
    ("nickle", "nickel"),
    ("nikel", "nickel"),
    ("aluminum", "aluminium"),     # US spelling is an alias
    ("Aluminum", "aluminium"),
    ("aluminim", "aluminium"),     # a dropped letter
    ("alumínium", "aluminium"),    # a stray accent
    ("tungstne", "tungsten"),      # swapped letters
    ("wolfram", "tungsten"),
    ("w", "tungsten"),             # chemical symbol: exact alias
    ("C17200", "beryllium-copper"),
    ("c17200", "beryllium-copper"),
    ("A91350", "aluminium-1350"),  # UNS number
    ("AA1350", "aluminium-1350"),
    ("S30400", "stainless-304"),
    ("1.4301", "stainless-304"),   # EN material number
    ("cca 10", "copper-clad-aluminium-10"),
    ("CCA-10", "copper-clad-aluminium-10"),
    ("ni-cr 80/20", "ni-cr-80-20"),
])
def test_first_result(index, query, expected):
    assert first_ids(index, query) == [expected]


def test_exact_alias_outranks_fuzzy_and_prefix(index):
    results = search(index, "aluminum", 10)["results"]
    assert results[0]["id"] == "aluminium"
    assert results[0]["score"] > 2 * results[1]["score"]
    assert results[0]["snippet"].startswith("Also known as")


def test_one_letter_starts_the_titles(index):
    # the first keystroke in the header box: materials whose name starts with it come first
    # (common practice for type-ahead lists, no source); a symbol that is a whole alias still wins
    for letter in "cnsat":
        titles = [r["title"] for r in search(index, letter, 8)["results"]]
        starts = [t.lower().startswith(letter) for t in titles]
        assert len(titles) == 8 and starts[0] and starts == sorted(starts, reverse=True), (letter, titles)
    assert first_ids(index, "n") == ["nickel"]
    assert first_ids(index, "w") == ["tungsten"]
    assert first_ids(index, "k") == ["potassium"]


def test_short_exact_word_drops_its_fuzzy_neighbours(index):
    # "gold" exists, so words one typo away ("cold", "bold") are not offered as matches
    titles = [r["title"] for r in search(index, "gold", 0)["results"]]
    assert all("old" not in t.lower() or "gold" in t.lower() for t in titles)


def test_every_word_must_match_or_a_note_says_so(index):
    out = search(index, "uns a91350", 5)
    assert out["results"][0]["id"] == "aluminium-1350"
    assert "closest" in out["note"]


def test_tables_and_properties_are_found(index):
    out = search(index, "skin depth copper", 3)
    assert out["results"][0]["id"] == "copper/skin-depth"
    assert out["results"][0]["url"] == "materials/copper/index.html#skin-depth"
    debye = search(index, "copper debye", 1)["results"][0]
    assert debye["id"] == "copper" and debye["snippet"].startswith("Debye temperature")


def test_empty_and_punctuation_only_queries(index):
    for query in ("", "   ", "·;,", None):
        out = search(index, query, 5)
        assert out["results"] == [] and out["errors"] == []


# --- filters: thresholds converted by pint ---------------------------------------------------

def si(value, unit, target):
    return UREG.Quantity(value, unit).to(target).magnitude


@pytest.mark.parametrize("clause, prop, op, expected", [
    ("resistivity < 3 µΩ·cm", "rho_20", "<", si(3, "microohm*cm", "ohm*m")),
    ("resistivity < 3 μΩ*cm", "rho_20", "<", si(3, "microohm*cm", "ohm*m")),
    ("rho <= 2e-8 ohm m", "rho_20", "<=", 2e-8),
    ("resistivity < 3", "rho_20", "<", si(3, "microohm*cm", "ohm*m")),        # bare number: the card unit
    ("density < 3 g/cm3", "density", "<", si(3, "g/cm**3", "kg/m**3")),
    ("density < 3000 kg/m³", "density", "<", 3000.0),
    ("density ≤ 3", "density", "<=", si(3, "g/cm**3", "kg/m**3")),
    ("iacs > 90", "iacs_20", ">", si(90, "percent", "dimensionless")),
    ("iacs > 90 %IACS", "iacs_20", ">", si(90, "percent", "dimensionless")),
    ("%IACS ≥ 97 %", "iacs_20", ">=", si(97, "percent", "dimensionless")),
    ("alpha > 0.004", "temperature_coefficient", ">", si(0.004, "1/K", "1/K")),
    ("α > 3900 ppm/K", "temperature_coefficient", ">", si(3900, "ppm/K", "1/K")),
    ("tcr > 0.004 1/°C", "temperature_coefficient", ">", si(0.004, "1/delta_degC", "1/K")),
    ("mean free path > 20 nm", "mean_free_path", ">", si(20, "nm", "m")),
    ("mfp >= 0,02 um", "mean_free_path", ">=", si(0.02, "um", "m")),             # decimal comma
    ("thermal conductivity > 300 W/(m·K)", "thermal_conductivity", ">", 300.0),
    ("melting point > 1500", "melting_point", ">", si(1500, "degC", "K")),      # bare number in °C
    ("melting point > 2000 K", "melting_point", ">", 2000.0),
    ("resistivty < 2", "rho_20", "<", si(2, "microohm*cm", "ohm*m")),           # typo in the property
])
def test_filter_reads_the_number_with_units(clause, prop, op, expected):
    parsed = parse_filter(clause)["filter"]
    assert parsed["property"] == prop
    assert parsed["op"] == op
    # one multiplication each side (pint's factor vs our table): agreement to a few ulp
    assert parsed["value"] == pytest.approx(expected, rel=1e-12, abs=0)


def test_filter_results_obey_the_threshold(index, entries):
    by_id = {e["id"]: e for e in entries}
    limit = si(3, "microohm*cm", "ohm*m")
    out = search(index, "resistivity < 3 µΩ·cm", 0)
    ids = [r["id"] for r in out["results"]]
    expected = sorted(e["id"] for e in entries if e["kind"] == "material" and e["props"]["rho_20"] < limit)
    assert sorted(ids) == expected
    values = [by_id[i]["props"]["rho_20"] for i in ids]
    assert values == sorted(values)            # "<" lists the lowest first
    assert out["filters"][0]["text"] == "resistivity at 20 °C < 3 µΩ·cm (3×10⁻⁸ Ω·m)"


def test_iacs_filter_keeps_copper_and_silver_not_aluminium(index):
    ids = [r["id"] for r in search(index, "iacs > 90", 0)["results"]]
    # IEC 60028: annealed copper is 100 %IACS; high-purity aluminium is about 65 %IACS
    assert "copper-annealed" in ids and "silver" in ids and "copper" in ids
    assert not any(i.startswith("aluminium") for i in ids)


def test_filters_combine_with_text_and_each_other(index, entries):
    out = search(index, "copper alloy, iacs > 50", 0)
    assert out["results"] and all(r["id"] in {e["id"] for e in entries if e.get("class_title") == "Copper alloys"}
                                  for r in out["results"])
    both = search(index, "melting point > 1500 °C and density < 10", 0)
    assert len(both["filters"]) == 2
    by_id = {e["id"]: e for e in entries}
    for r in both["results"]:
        props = by_id[r["id"]]["props"]
        assert props["melting_point"] > 1773.15 and props["density"] < 10000.0


def test_equal_means_within_one_percent(index, entries):
    ids = {r["id"] for r in search(index, "density = 2.7 g/cm3", 0)["results"]}
    expected = {e["id"] for e in entries if e["kind"] == "material" and "density" in e["props"]
                and abs(e["props"]["density"] - 2700.0) <= 27.0}
    assert ids == expected and "aluminium" in ids


def test_split_clauses_keeps_decimal_commas():
    assert split_clauses("iacs > 90; density < 3, copper") == ["iacs > 90", "density < 3", "copper"]
    assert split_clauses("rho < 2,5 uohm*cm and iacs > 1") == ["rho < 2,5 uohm*cm", "iacs > 1"]


# --- bad filters give messages, not exceptions -------------------------------------------------

@pytest.mark.parametrize("query, words", [
    ("<img src=x onerror=alert(1)>", "name a property before “<”"),
    ("> 5", "name a property before “>”"),
    ("foo > 3", "“foo” is not a property search can filter on"),
    ("iacs >", "put a number after “>”"),
    ("iacs > abc", "expected a number first, found “abc”"),
    ("iacs > 50 kg", "“kg” is not a unit of conductivity at 20 °C; use %IACS"),
    ("density < 3 ohm", "“ohm” is not a unit of density; use g/cm3, kg/m3"),
    ("rrr > 5 K", "which is a plain number"),
    ("iacs > 90 > 80", "one comparison per clause"),
    ("iacs > 1e999", "not a finite number"),
    ("mfp > 1,2.5 nm", "is not a number as written"),
])
def test_bad_filter_is_a_message(index, query, words):
    out = search(index, query, 5)
    assert out["results"] == []
    assert len(out["errors"]) == 1
    assert words in out["errors"][0]
    assert out["errors"][0].startswith("“" + query.strip() + "”: ")


def test_parse_filter_raises_core_error_with_the_field():
    with pytest.raises(CoreError) as caught:
        parse_filter("foo > 3")
    assert caught.value.field == "q"


def test_a_filter_names_the_materials_it_cannot_compare(index, entries):
    """A material with no recorded density is not silently dropped by "density < 3": the note
    names it (the copper-clad steels carry no density). Read from the index, not hard-coded."""
    lacking = sorted(e["title"] for e in entries if e["kind"] == "material" and "density" not in e["props"])
    assert lacking  # the shipped data has some
    out = search(index, "density < 3", 0)
    assert f"Not listed: {len(lacking)} material" in out["note"]
    assert "no recorded density" in out["note"] and lacking[0] in out["note"]
    # a material that has the property is listed, not named in the note
    assert "Aluminium (high purity)" not in out["note"]
