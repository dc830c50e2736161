"""The build cache (conductor_atlas.cache): a build from the cache is the build without it, byte for
byte, and editing one material file remakes that material and the site-wide pages only."""

from __future__ import annotations

import shutil
from pathlib import Path

import pytest

from conductor_atlas import cache
from conductor_atlas.build import assemble, build, data_folders, load_with_record
from conductor_atlas.load import load_dataset
from conductor_atlas.paths import DATA_DIR

SITE_PARTS = ["site:data", "site:listings", "site:search-index"]   # remade when any material changes
SCRIPT_PARTS = ["site:classic-bundles"]                             # remade only when a script changes


def site_files(folder: Path) -> dict[str, bytes]:
    return {p.relative_to(folder).as_posix(): p.read_bytes() for p in sorted(folder.rglob("*"))
            if p.is_file() and p.name != ".conductor-atlas-site"}


@pytest.fixture()
def own_cache(tmp_path, monkeypatch):
    """build() with its cache in a fresh folder (the transpiled core still comes from the usual one)."""
    folder = tmp_path / "cache"
    monkeypatch.setattr("conductor_atlas.build.CACHE_DIR", folder)
    return folder


@pytest.fixture()
def extra_folder(tmp_path):
    """A --data folder with one material: copper under a new id, alias and name (a shipped name is
    refused by the loader's clash check)."""
    folder = tmp_path / "shop" / "materials"
    folder.mkdir(parents=True)
    text = (DATA_DIR / "materials" / "copper.toml").read_text(encoding="utf-8")
    lines = []
    for line in text.splitlines():
        if line.startswith("id = "):
            line = 'id = "shop-copper"'
        elif line.startswith("aliases = "):
            line = 'aliases = ["shop Cu"]'
        elif line.startswith("name = "):
            line = 'name = "Shop copper (demo copy of the copper file)"'
        lines.append(line)
    (folder / "shop-copper.toml").write_text("\n".join(lines) + "\n", encoding="utf-8")
    return folder.parent


def test_cached_build_equals_uncached_build(tmp_path, own_cache, extra_folder):
    first = build(tmp_path / "a", [extra_folder])
    assert "material:shop-copper" in cache.LAST_STATS["made"]
    second = build(tmp_path / "b", [extra_folder])
    assert cache.LAST_STATS["made"] == [], "nothing changed, yet the build made parts again"
    assert len(cache.LAST_STATS["reused"]) == first.materials + len(SITE_PARTS) + len(SCRIPT_PARTS)
    uncached = assemble(load_with_record(data_folders([extra_folder])))  # no cache at all
    on_disk = site_files(second.out)
    assert sorted(on_disk) == sorted(uncached)
    assert [p for p in uncached if uncached[p] != on_disk[p]] == []


def test_one_edited_material_remakes_only_what_depends_on_it(tmp_path, own_cache, extra_folder):
    build(tmp_path / "site", [extra_folder])
    path = extra_folder / "materials" / "shop-copper.toml"
    text = path.read_text(encoding="utf-8")
    path.write_text(text.replace("\nsummary = \"", "\nsummary = \"Edited. ", 1), encoding="utf-8")
    report = build(tmp_path / "site", [extra_folder])
    assert sorted(cache.LAST_STATS["made"]) == sorted(["material:shop-copper"] + SITE_PARTS)
    page = (report.out / "materials" / "shop-copper" / "index.html").read_text(encoding="utf-8")
    assert "Edited. " in page


def test_a_damaged_entry_is_made_again(tmp_path, own_cache, extra_folder):
    build(tmp_path / "site", [extra_folder])
    entries = sorted((own_cache / "build").rglob("*.pickle"))
    assert entries
    for entry in entries:
        entry.write_bytes(b"not a pickle")
    report = build(tmp_path / "site", [extra_folder])
    assert len(cache.LAST_STATS["made"]) == report.materials + len(SITE_PARTS) + len(SCRIPT_PARTS)
    shutil.rmtree(own_cache)


def test_prune_removes_least_recently_used_entries_but_none_this_build_used(tmp_path):
    import os
    store = cache.BuildCache(tmp_path)
    paths = {}
    for i in range(6):  # entry i holds (i + 1) kB, and was last used at time 1e6 + i
        store.get(f"old:{i}", b"k", lambda i=i: bytes(1000) * (i + 1))
        paths[i] = store._path(f"old:{i}", b"k")
        os.utime(paths[i], (1_000_000 + i, 1_000_000 + i))
    fresh = cache.BuildCache(tmp_path)
    assert fresh.get("old:0", b"k", lambda: b"never made") == bytes(1000)  # the oldest, read again now
    removed = fresh.prune(limit_bytes=8000)
    # about 21 kB in all; oldest first, skipping old:0 (used by this build): old:1 … old:4 go, leaving 7 kB
    assert sorted(removed) == sorted(paths[i] for i in (1, 2, 3, 4))
    assert sorted(fresh.folder.glob("*/*.pickle")) == sorted([paths[0], paths[5]])


def test_old_transpiled_cores_are_pruned(tmp_path):
    import os
    from conductor_atlas import transpile
    folder = tmp_path / "transpile"
    for i in range(6):
        done = folder / f"core{i}"
        done.mkdir(parents=True)
        (done / "COMPLETE").write_text("x\n")
        os.utime(done / "COMPLETE", (1_000_000 + i, 1_000_000 + i))
    unfinished = folder / "scratch"
    unfinished.mkdir()
    transpile.prune_transpiled(folder, keep=folder / "core0", newest=2)
    assert sorted(p.name for p in folder.iterdir()) == ["core0", "core4", "core5", "scratch"]


def test_code_edited_during_a_build_leaves_nothing_in_the_cache(tmp_path, own_cache, extra_folder, monkeypatch):
    """A build reads the code's version when it starts, but rendered with modules imported before: a
    file edited in that window (seen: a test run going while a calculator's summary was edited) stored
    pages of the old code under the new version, and every later build served the old summary. The
    version is read again at the end; when it moved, what the build stored is removed."""
    versions = iter([b"version at the start", b"version after an edit", b"version after an edit"])
    monkeypatch.setattr(cache, "code_version", lambda: next(versions))
    build(tmp_path / "site", [extra_folder])
    assert list((own_cache / "build").rglob("*.pickle")) == []
    monkeypatch.setattr(cache, "code_version", lambda: b"version after an edit")
    report = build(tmp_path / "site", [extra_folder])
    assert len(cache.LAST_STATS["made"]) == report.materials + len(SITE_PARTS) + len(SCRIPT_PARTS)
    assert list((own_cache / "build").rglob("*.pickle")) != []
