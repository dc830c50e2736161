"""The conductor-standard tables: the shipped file validates and reaches the catalogue; each broken
rule of a standards file gives its message with file and field."""

from __future__ import annotations

from pathlib import Path

import pytest

from conductor_atlas.build import data_folders
from conductor_atlas.derive import catalogue_of
from conductor_atlas.atlas_errors import DataError
from conductor_atlas.load import load_dataset
from conductor_atlas.paths import DATA_DIR

GOOD = """schema = 1
kind = "maximum-resistance"
id = "shop-limits"
title = "Shop limits (invented for a test)"
source = "iec60228"
temperature = "20 degC"
area_unit = "mm^2"
resistance_unit = "ohm/km"

[conductors.plain-copper]
name = "plain copper"
materials = ["copper-annealed"]

[[limits]]
class = "2"
conductor = "plain-copper"
locator = "invented"
rows = [[1.0, 18.1], [1.5, 12.1]]
"""


def with_standard(tmp_path: Path, text: str) -> list[Path]:
    folder = tmp_path / "shop" / "standards"
    folder.mkdir(parents=True)
    (folder / "limits.toml").write_text(text, encoding="utf-8")
    return data_folders([tmp_path / "shop"])


def test_shipped_tables_reach_the_catalogue():
    catalogue = catalogue_of(load_dataset(data_folders()))
    keys = {(t["klass"], t["conductor"]) for t in catalogue["limits"]}
    # IEC 60228 classes 1, 2, 5, 6; plain and metal-coated copper; aluminium in classes 1 and 2
    assert keys == {(k, c) for k in "1256" for c in ("plain-copper", "metal-coated-copper")} | {
        ("1", "aluminium"), ("2", "aluminium")}
    two = next(t for t in catalogue["limits"] if t["klass"] == "2" and t["conductor"] == "plain-copper")
    # IEC 60228 Table 2, plain copper, 2.5 mm²: 7.41 Ω/km (from memory) = 7.41e-3 Ω/m at 2.5e-6 m²
    i = two["areas"].index(pytest.approx(2.5e-6, rel=1e-12))
    assert two["limits"][i] == pytest.approx(7.41e-3, rel=1e-12)


def test_a_good_shop_file_loads(tmp_path):
    dataset = load_dataset(with_standard(tmp_path, GOOD))
    assert any(t.standard == "shop-limits" for t in dataset.limits)


@pytest.mark.parametrize("old, new, words", [
    ('kind = "maximum-resistance"', 'kind = "minimum"', "kind: expected one of maximum-resistance"),
    ('materials = ["copper-annealed"]', 'materials = ["unobtainium"]', 'no material has the id "unobtainium"'),
    ('rows = [[1.0, 18.1], [1.5, 12.1]]', 'rows = [[1.0, 18.1], [1.5, 19.0]]', "areas must increase and resistances fall"),
    ('class = "2"', 'class = "3"', "limits[0].class: expected one of 1, 2, 5, 6"),
    ('resistance_unit = "ohm/km"', 'resistance_unit = "kg"', 'resistance_unit: expected a unit such as "ohm/km"'),
    ('source = "iec60228"', 'source = "nowhere"', 'unknown source key "nowhere"'),
    ('locator = "invented"', 'locator = "invented"\ncolour = "red"', "limits[0].colour: unknown key"),
    ('rows = [[1.0, 18.1], [1.5, 12.1]]', 'rows = [[1.0, -18.1]]', "two positive numbers"),
])
def test_each_broken_rule_names_file_and_field(tmp_path, old, new, words):
    assert old in GOOD
    with pytest.raises(DataError) as caught:
        load_dataset(with_standard(tmp_path, GOOD.replace(old, new)))
    text = "\n".join(caught.value.problems)
    assert "limits.toml" in text and words in text, text


def test_a_class_and_column_given_twice(tmp_path):
    block = GOOD[GOOD.index("[[limits]]"):]
    with pytest.raises(DataError) as caught:
        load_dataset(with_standard(tmp_path, GOOD + "\n" + block))
    assert "class 2 plain-copper is given twice" in "\n".join(caught.value.problems)


def test_shipped_file_is_where_the_docs_say():
    assert (DATA_DIR / "standards" / "iec60228.toml").is_file()
