"""The pipeline end to end: pages and downloads exist, publish is atomic and refuses foreign folders."""

from __future__ import annotations

import csv
import io
import json

import shutil

import pytest

from conductor_atlas.build import build
from conductor_atlas.errors import BuildError, DataError
from conductor_atlas.publish import MARKER, publish


def test_site_has_home_material_pages_and_downloads(built_site):
    assert (built_site / "index.html").is_file()
    assert (built_site / "references" / "index.html").is_file()
    for material_id in ("copper-annealed", "aluminium-1350", "silver"):
        page = (built_site / "materials" / material_id / "index.html").read_text(encoding="utf-8")
        assert 'data-calculator="resistance"' in page
        assert "not ampacity ratings" in page.lower() or "not an ampacity rating" in page.lower()
    home = (built_site / "index.html").read_text(encoding="utf-8")
    assert "materials/copper-annealed/index.html" in home
    assert (built_site / "js" / "conductor_atlas.core.calculators.js").is_file()
    assert (built_site / "js" / "org.transcrypt.__runtime__.js").is_file()


def test_resistivity_table_csv_matches_iec60028(built_site):
    rows = list(csv.DictReader(io.StringIO(
        (built_site / "materials" / "copper-annealed" / "resistivity-temperature.csv").read_text(encoding="utf-8"))))
    at20 = next(r for r in rows if r["row_id"] == "t-20c")
    # IEC 60028: 1.7241 µΩ·cm and exactly 100 %IACS at 20 °C (printed to 5 figures)
    assert float(at20["Resistivity [µΩ·cm]"]) == pytest.approx(1.7241, abs=5e-5)
    assert float(at20["Conductivity [%IACS]"]) == pytest.approx(100.0, abs=0.005)
    data = json.loads((built_site / "materials" / "copper-annealed" / "resistivity-temperature.json").read_text())
    assert data["sources"] == ["iec60028"]
    assert [r["row_id"] for r in data["rows"]] == [r["row_id"] for r in rows]


def test_transpiled_modules_have_no_timestamp(built_site):
    first = (built_site / "js" / "conductor_atlas.core.units.js").read_text(encoding="utf-8").splitlines()[0]
    assert "20" not in first  # the timestamp line is normalised for repeatable builds


def test_failed_build_leaves_previous_site(tmp_path):
    out = tmp_path / "site"
    publish({"index.html": b"old"}, out)
    bad = tmp_path / "bad"
    bad.mkdir()
    (bad / "x.toml").write_text("schema = 1\nid = [\n", encoding="utf-8")
    with pytest.raises(DataError):
        build(out, [bad])
    assert (out / "index.html").read_bytes() == b"old"


def test_publish_refuses_a_foreign_folder(tmp_path):
    out = tmp_path / "documents"
    out.mkdir()
    (out / "thesis.txt").write_text("precious")
    with pytest.raises(BuildError) as caught:
        publish({"index.html": b"x"}, out)
    assert "refusing to replace" in str(caught.value)
    assert (out / "thesis.txt").read_text() == "precious"


def test_publish_replaces_its_own_site(tmp_path):
    out = tmp_path / "site"
    publish({"a.html": b"1"}, out)
    publish({"b.html": b"2"}, out)
    assert not (out / "a.html").exists()
    assert (out / "b.html").read_bytes() == b"2"
    assert (out / MARKER).is_file()
    assert sorted(p.name for p in tmp_path.iterdir() if not p.name.endswith(".lock")) == [".site.published.json",
                                                                                          "site"]


def test_publish_clears_leftovers_of_a_killed_build(tmp_path):
    out = tmp_path / "site"
    publish({"a.html": b"1"}, out)
    (tmp_path / ".site.new-99999" / "x").mkdir(parents=True)
    (tmp_path / ".site.old-99999").mkdir()
    publish({"b.html": b"2"}, out)
    assert sorted(p.name for p in tmp_path.iterdir() if not p.name.endswith(".lock")) == [".site.published.json",
                                                                                          "site"]


SITE = {"index.html": b"<p>home</p>", "static/a.js": b"var a = 1;", "materials/x/index.html": b"<p>x</p>"}


def test_publishing_the_same_files_again_writes_nothing(tmp_path):
    out = tmp_path / "site"
    assert publish(SITE, out).written
    inode = (out / "index.html").stat().st_ino
    again = publish(dict(SITE), out)
    assert again == (out.resolve(), False)
    assert (out / "index.html").stat().st_ino == inode      # the very same file, not a rewritten copy
    changed = dict(SITE, **{"index.html": b"<p>home!</p>"})
    assert publish(changed, out).written
    assert (out / "index.html").read_bytes() == b"<p>home!</p>"


@pytest.mark.parametrize("touch", ["edit", "add", "remove", "record", "folder"])
def test_a_site_touched_by_hand_is_written_again(tmp_path, touch):
    out = tmp_path / "site"
    publish(SITE, out)
    if touch == "edit":      # same size, other bytes, a later modification time
        (out / "static/a.js").write_bytes(b"var a = 2;")
    elif touch == "add":
        (out / "materials/x/notes.txt").write_text("mine")
    elif touch == "remove":
        (out / "materials/x/index.html").unlink()
    elif touch == "record":  # an unreadable record
        (tmp_path / ".site.published.json").write_text("{not json")
    else:                    # the whole site deleted, its record left beside it
        shutil.rmtree(out)
    assert publish(SITE, out).written
    on_disk = {p.relative_to(out).as_posix(): p.read_bytes() for p in out.rglob("*") if p.is_file()}
    assert on_disk == dict(SITE, **{MARKER: (out / MARKER).read_bytes()})
