"""The pipeline end to end: pages and downloads exist, publish is atomic and refuses foreign folders."""

from __future__ import annotations

import csv
import io
import json
import subprocess
import sys
import time

import shutil

import pytest

from conductor_atlas.build import build
from conductor_atlas.atlas_errors import BuildError, DataError
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


# --- the swap: no moment without a site (a reader never gets 404, a crash never leaves none) ---

NEW_SITE = {"index.html": b"<p>home, rebuilt</p>", "static/a.js": b"var a = 2;", "materials/y/index.html": b"<p>y</p>"}

# Run in a child process: publish NEW_SITE, but stop for good right after the first step of the swap
# that touches the output folder (a rename of it, or the exchange), telling the parent which step.
PAUSE_AT_SWAP = """
import os, sys, time
from pathlib import Path
from conductor_atlas import publish

out, signal = sys.argv[1], Path(sys.argv[2])
def pause_after(step, name):
    def paused(*args):
        result = step(*args)
        if out in (os.fspath(args[0]), os.fspath(args[1])):
            signal.write_text(name)
            time.sleep(300)
        return result
    return paused
os.rename = pause_after(os.rename, "rename")
if hasattr(publish, "exchange"):
    publish.exchange = pause_after(publish.exchange, "exchange")
publish.publish({0}, Path(out))
"""


def site_files(out):
    return {p.relative_to(out).as_posix(): p.read_bytes() for p in out.rglob("*") if p.is_file()}


def test_a_publish_killed_at_the_swap_leaves_a_whole_site(tmp_path):
    """kill -9 at the swap: the folder holds the old site or the new one, whole, at every moment.
    Before the one-step swap, the pause came after rename(out, old): no site at all."""
    out = (tmp_path / "site").resolve()
    publish(SITE, out)
    marker = {MARKER: (out / MARKER).read_bytes()}
    old, new = dict(SITE, **marker), dict(NEW_SITE, **marker)
    signal = tmp_path / "at-the-swap"
    child = subprocess.Popen([sys.executable, "-c", PAUSE_AT_SWAP.format(repr(NEW_SITE)), str(out), str(signal)])
    try:
        deadline = time.monotonic() + 120
        while not signal.exists() and child.poll() is None and time.monotonic() < deadline:
            time.sleep(0.05)
        assert signal.exists(), "the child never reached the swap"
        assert site_files(out) in (old, new)          # what a reader sees while the swap is under way
        if sys.platform.startswith("linux"):
            assert signal.read_text() == "exchange"   # the one-step swap, not the two-rename fallback
    finally:
        child.kill()
        child.wait()
    assert site_files(out) in (old, new)              # and what is left after the crash
    publish(NEW_SITE, out)                            # the next build clears what the killed one left
    assert site_files(out) == new
    assert sorted(p.name for p in tmp_path.iterdir() if p.name.startswith(".site.")) == [".site.lock",
                                                                                         ".site.published.json"]


def test_publish_falls_back_to_two_renames_where_the_exchange_is_missing(tmp_path, monkeypatch):
    from conductor_atlas import publish as publish_module
    monkeypatch.setattr(publish_module, "exchange", lambda first, second: False)
    out = tmp_path / "site"
    publish(SITE, out)
    publish(NEW_SITE, out)
    assert site_files(out) == dict(NEW_SITE, **{MARKER: (out / MARKER).read_bytes()})
    assert sorted(p.name for p in tmp_path.iterdir()) == [".site.lock", ".site.published.json", "site"]


@pytest.mark.skipif(not sys.platform.startswith("linux"), reason="renameat2 is Linux only")
def test_exchange_swaps_two_folders(tmp_path):
    from conductor_atlas.publish import exchange
    (tmp_path / "a").mkdir()
    (tmp_path / "a" / "f").write_text("a")
    (tmp_path / "b").mkdir()
    (tmp_path / "b" / "f").write_text("b")
    assert exchange(tmp_path / "a", tmp_path / "b")
    assert (tmp_path / "a" / "f").read_text() == "b" and (tmp_path / "b" / "f").read_text() == "a"


def test_leftover_clean_up_matches_only_its_own_folder(tmp_path):
    """--out "x[ab]": the clean-up once globbed ".x[ab].new-*" and deleted the staging and old
    folders of the outputs "xa" and "xb" (a build running beside it lost its staging folder)."""
    others = [tmp_path / ".xa.new-4242", tmp_path / ".xb.old-4242", tmp_path / ".x[ab].new-7.new-8",
              tmp_path / ".x[ab].news-1"]
    for folder in others:
        folder.mkdir()
        (folder / "keep").write_text("another output's file")
    (tmp_path / ".x[ab].new-99999").mkdir()      # its own leftovers go
    (tmp_path / ".x[ab].old-99999").mkdir()
    publish(SITE, tmp_path / "x[ab]")
    assert all((folder / "keep").is_file() for folder in others)
    assert not (tmp_path / ".x[ab].new-99999").exists() and not (tmp_path / ".x[ab].old-99999").exists()


def test_every_source_a_page_cites_is_listed_on_it(built_site):
    """Before: the "Sources used on this page" list held only the material record's sources, so a
    table's own source (ASTM B258 for the AWG table on every page; IEC 60028 and others on some) was
    linked beside the table but missing from the page's list a reader copies into a design note."""
    import re
    for page in sorted((built_site / "materials").glob("*/index.html")):
        html = page.read_text(encoding="utf-8")
        body, _, listed_part = html.partition('<section id="sources"')
        assert listed_part, f"{page}: no sources section"
        cited = set(re.findall(r'references/index\.html#src-([\w.-]+)"', body))
        listed = set(re.findall(r'references/index\.html#src-([\w.-]+)"', listed_part))
        assert cited <= listed, f"{page.parent.name}: cited but not listed: {sorted(cited - listed)}"
