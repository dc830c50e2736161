"""Verification status per value: the record, `check`'s table, the material pages, the site page."""

from __future__ import annotations

import dataclasses
import re

import pytest

from conductor_atlas.build import data_folders, load_with_record
from conductor_atlas.cli import main
from conductor_atlas.verification import KINDS, statuses, summary


@pytest.fixture(scope="module")
def dataset():
    return load_with_record(data_folders())


def test_a_recorded_value_is_verified_and_names_its_datasets(dataset):
    copper = dataset.by_id("copper")
    status = statuses(dataset, copper, dataset.verification)["density"]
    assert status.kind == "verified"
    assert "mendeleev 1.3.0" in status.text and "periodictable 2.1.0" in status.text


def test_a_changed_value_is_no_longer_verified(dataset):
    """The record holds the number it checked: 8.96 g/cm³ edited to 8.97 falls back to "from memory"."""
    copper = dataset.by_id("copper")
    edited = dataclasses.replace(copper.get("density"), si=8970.0)
    changed = dataclasses.replace(copper, properties={**copper.properties, "density": edited})
    assert statuses(dataset, changed, dataset.verification)["density"].kind == "memory"


def test_the_counts_add_up_to_every_value(dataset):
    rows, totals = summary(dataset, dataset.verification)
    values = sum(len(m.properties) + (m.table is not None) for m in dataset.materials)
    assert sum(totals.values()) == values
    assert set(totals) == set(KINDS)
    # every value entry of the record that still matches is counted as verified (the copper table too)
    assert totals["verified"] >= 140


def test_check_prints_the_table_per_material_and_in_total(capsys, dataset):
    assert main(["check"]) == 0
    out = capsys.readouterr().out
    rows, totals = summary(dataset, dataset.verification)
    total_line = next(line for line in out.splitlines() if line.startswith("total "))
    assert [int(x) for x in total_line.split()[1:]] == [totals[k] for k in KINDS] + [sum(totals.values())]
    assert re.search(r"^copper\s+\d+", out, re.MULTILINE)
    assert "share: verified against independent data" in out


def test_pages_show_the_status_beside_each_value(built_site):
    page = (built_site / "materials" / "copper" / "index.html").read_text(encoding="utf-8")
    row = re.search(r'<tr id="prop-density">.*?</tr>', page, re.DOTALL).group(0)
    assert "verified: agrees with" in row and "from memory" not in row
    unverified = re.search(r'<tr id="prop-valence">.*?</tr>', page, re.DOTALL).group(0)
    assert "from memory, not cross-checked" in unverified
    summary_page = (built_site / "verification" / "index.html").read_text(encoding="utf-8")
    assert 'id="proof-copper"' in summary_page and 'id="proof-total"' in summary_page
    assert "mendeleev 1.3.0" in summary_page
