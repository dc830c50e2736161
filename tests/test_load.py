"""The loader: the shipped data validates; each broken rule gives its message with file and field."""

from __future__ import annotations

import shutil
from pathlib import Path

import pytest

from conductor_atlas.atlas_errors import DataError
from conductor_atlas.load import load_dataset
from conductor_atlas.paths import DATA_DIR

GOOD = """schema = 1
id = "test-alloy"
name = "Test alloy (invented for a test)"
class = "copper-alloy"
aliases = ["TA-1"]
summary = "Invented for a test; not a real material."

[properties.resistivity]
value = "{rho}"
temperature = "20 degC"
source = "{source}"
locator = "invented"

[properties.temperature_coefficient]
value = "0.0035 1/K"
temperature = "20 degC"
source = "iec60028"
locator = "invented"
"""


def shop(tmp_path: Path, text: str, name: str = "test-alloy.toml") -> Path:
    folder = tmp_path / "shop"
    folder.mkdir(exist_ok=True)
    (folder / name).write_text(text, encoding="utf-8")
    return folder


def problems_of(folders) -> list[str]:
    with pytest.raises(DataError) as caught:
        load_dataset(folders)
    return caught.value.problems


def test_shipped_data_validates():
    dataset = load_dataset([DATA_DIR])
    assert len(dataset.materials) >= 3
    cu = dataset.by_id("copper-annealed")
    # IEC 60028: 1/58 Ω·mm²/m at 20 °C, read through pint into SI
    assert cu.get("resistivity").si == pytest.approx(1.7241e-8, rel=1e-12)
    assert cu.get("resistivity").temperature == pytest.approx(293.15)


def test_overlay_folder_adds_a_material(tmp_path):
    folder = shop(tmp_path, GOOD.format(rho="2.1 uohm*cm", source="iec60028"))
    dataset = load_dataset([DATA_DIR, folder])
    assert dataset.by_id("test-alloy").get("resistivity").si == pytest.approx(2.1e-8)


@pytest.mark.parametrize("rho, source, words", [
    ("1.7 kg", "iec60028", "properties.resistivity.value: expected a value in ohm * m, found \"1.7 kg\""),
    ("1.7", "iec60028", "has no unit"),
    ("-1.7e-8 ohm*m", "iec60028", "expected resistivity between"),
    ("nan ohm*m", "iec60028", "expected a number then a unit"),
    ("1e999 ohm*m", "iec60028", "expected a finite number"),
    ("2.1 uohm*cm", "nowhere-2020", "unknown source key \"nowhere-2020\""),
])
def test_bad_values_are_named(tmp_path, rho, source, words):
    folder = shop(tmp_path, GOOD.format(rho=rho, source=source))
    found = problems_of([DATA_DIR, folder])
    assert any("test-alloy.toml" in p and words in p for p in found), found


def test_all_problems_reported_together(tmp_path):
    folder = shop(tmp_path, GOOD.format(rho="1.7 kg", source="nowhere"))
    (folder / "broken.toml").write_text("schema = 1\nid = [", encoding="utf-8")
    found = problems_of([DATA_DIR, folder])
    assert any("broken.toml: is not valid TOML" in p for p in found)
    assert any("unknown source key" in p for p in found)
    assert any("expected a value in ohm * m" in p for p in found)


def test_duplicate_alias_across_folders_names_both_files(tmp_path):
    text = GOOD.format(rho="2.1 uohm*cm", source="iec60028").replace('aliases = ["TA-1"]', 'aliases = ["iacs"]')
    folder = shop(tmp_path, text)
    found = problems_of([DATA_DIR, folder])
    assert any("test-alloy.toml: aliases" in p and "clashes with" in p and "copper-annealed.toml" in p
               for p in found), found


def test_non_utf8_file(tmp_path):
    folder = tmp_path / "shop"
    folder.mkdir()
    (folder / "latin1.toml").write_bytes("name = \"Kupfer gegl\xfcht\"\n".encode("latin-1"))
    assert any("latin1.toml: is not UTF-8" in p for p in problems_of([DATA_DIR, folder]))


def test_falling_table_of_a_pure_metal(tmp_path):
    text = GOOD.format(rho="2.1 uohm*cm", source="iec60028").replace('class = "copper-alloy"', 'class = "pure-metal"')
    text += ('\n[resistivity_table]\ntemperature_unit = "K"\nresistivity_unit = "uohm*cm"\nsource = "iec60028"\n'
             'locator = "invented"\npoints = [[273, 1.5], [293, 1.4]]\n')
    found = problems_of([DATA_DIR, shop(tmp_path, text)])
    assert any("resistivity_table.points[1]" in p and "must rise with temperature" in p for p in found), found


def test_missing_folder(tmp_path):
    found = problems_of([DATA_DIR, tmp_path / "absent"])
    assert any("absent: is not a folder" in p for p in found)


def test_uses_are_read_and_a_search_spelling_is_shown_once():
    # the data file lists "bus bars" beside "busbars" so that both spellings find copper; the page
    # lists the use once
    cu = load_dataset([DATA_DIR]).by_id("copper-annealed")
    assert "busbars" in cu.uses and "bus bars" in cu.uses
    shown = cu.shown_uses()
    assert "busbars" in shown and "bus bars" not in shown
    assert len(shown) == len(cu.uses) - 1
