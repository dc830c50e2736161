"""The build cache (conductor_atlas.cache): a build from the cache is the build without it, byte for
byte, and editing one material file remakes that material and the site-wide pages only."""

from __future__ import annotations

import shutil
from pathlib import Path

import pytest

from conductor_atlas import cache
from conductor_atlas.build import assemble, build, data_folders
from conductor_atlas.load import load_dataset
from conductor_atlas.paths import DATA_DIR

SITE_PARTS = ["site:data", "site:listings", "site:search-index"]


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
    """A --data folder with one material: copper under a new id and alias."""
    folder = tmp_path / "shop" / "materials"
    folder.mkdir(parents=True)
    text = (DATA_DIR / "materials" / "copper.toml").read_text(encoding="utf-8")
    lines = []
    for line in text.splitlines():
        if line.startswith("id = "):
            line = 'id = "shop-copper"'
        elif line.startswith("aliases = "):
            line = 'aliases = ["shop Cu"]'
        lines.append(line)
    (folder / "shop-copper.toml").write_text("\n".join(lines) + "\n", encoding="utf-8")
    return folder.parent


def test_cached_build_equals_uncached_build(tmp_path, own_cache, extra_folder):
    first = build(tmp_path / "a", [extra_folder])
    assert "material:shop-copper" in cache.LAST_STATS["made"]
    second = build(tmp_path / "b", [extra_folder])
    assert cache.LAST_STATS["made"] == [], "nothing changed, yet the build made parts again"
    assert len(cache.LAST_STATS["reused"]) == first.materials + len(SITE_PARTS)
    uncached = assemble(load_dataset(data_folders([extra_folder])))  # no cache at all
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
    assert len(cache.LAST_STATS["made"]) == report.materials + len(SITE_PARTS)
    shutil.rmtree(own_cache)
