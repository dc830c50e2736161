"""The data edition on every page, CSV and JSON of a table, and the page of what changed."""

from __future__ import annotations

import csv
import io
import json
import re

from conductor_atlas.build import data_folders
from conductor_atlas.edition import TOKEN, Previous, changes, current_edition, data_digest


def edition_of(built_site) -> str:
    home = (built_site / "index.html").read_text(encoding="utf-8")
    return re.search(r'data-edition="([^"]+)"', home).group(1)


def test_the_edition_is_a_date_and_a_digest_of_the_data_files():
    edition = current_edition(data_folders())
    assert re.fullmatch(r"(\d{4}-\d{2}-\d{2}|undated)", edition.date)
    assert re.fullmatch(r"[0-9a-f]{10}", edition.digest)
    assert edition.digest == data_digest(data_folders())


def test_a_data_edit_changes_the_digest(tmp_path):
    folder = tmp_path / "data"
    (folder / "materials").mkdir(parents=True)
    (folder / "materials" / "x.toml").write_text("a = 1\n", encoding="utf-8")
    before = data_digest([folder])
    (folder / "materials" / "x.toml").write_text("a = 2\n", encoding="utf-8")
    assert data_digest([folder]) != before


def test_every_page_csv_and_table_json_names_the_edition(built_site):
    edition = edition_of(built_site)
    assert re.fullmatch(r"\S+ · [0-9a-f]{10}", edition)
    for path in built_site.rglob("*"):
        if path.suffix in (".html", ".csv", ".json") and path.is_file():
            assert TOKEN not in path.read_text(encoding="utf-8"), path
    pages = list(built_site.rglob("*.html"))
    assert pages and all(edition in p.read_text(encoding="utf-8") for p in pages)
    table = built_site / "materials" / "copper-annealed" / "resistivity-temperature"
    rows = list(csv.DictReader(io.StringIO(table.with_suffix(".csv").read_text(encoding="utf-8"))))
    assert {r["data_edition"] for r in rows} == {edition}
    assert json.loads(table.with_suffix(".json").read_text(encoding="utf-8"))["data_edition"] == edition
    listing = json.loads((built_site / "materials.json").read_text(encoding="utf-8"))
    assert listing["data_edition"] == edition and len(listing["materials"]) >= 54


def test_changes_are_added_changed_and_removed():
    previous = Previous("old", {"a/x": "1 Ω·m", "b/y": "2 K", "c/z": "3 K"})
    found = changes(previous, {"a/x": "1 Ω·m", "b/y": "2.5 K", "d/w": "4 K"})
    assert found == {"added": [("d/w", "", "4 K")], "changed": [("b/y", "2 K", "2.5 K")],
                     "removed": [("c/z", "3 K", "")]}


def test_the_changes_page_lists_the_tin_correction(built_site):
    """The previous edition (data/previous-edition.toml) had tin at 11.5 µΩ·cm at 273 K."""
    page = (built_site / "changes" / "index.html").read_text(encoding="utf-8")
    row = re.search(r"<tr><th scope=\"row\"><a [^>]*>tin/resistivity</a></th>.*?</tr>", page).group(0)
    assert "1.15×10⁻⁷ Ω·m at 273 K" in row and "1.1×10⁻⁷ Ω·m at 293.15 K" in row
