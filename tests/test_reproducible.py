"""Two builds of the same input are byte-identical, whatever the clock, hash seed or output path.

Each build runs in its own process (``python -m conductor_atlas build``) with a different
PYTHONHASHSEED, so any output that depends on set or dict iteration order of strings shows up,
and a different SOURCE_DATE_EPOCH, so any date taken from the clock shows up too (the site
shows no build date today; if one is added it must come from SOURCE_DATE_EPOCH, and then this
test must compare builds made with the same epoch).
"""

from __future__ import annotations

import datetime
import hashlib
import os
import re
import subprocess
import sys
from pathlib import Path

import pytest

from conductor_atlas.paths import PROJECT_ROOT

# Transcrypt's own first line is "// Transcrypt'ed from Python, 2025-01-01 12:00:00" (shared notes)
TRANSCRYPT_TIMESTAMP = re.compile(rb"Transcrypt'ed from Python, \d{4}-\d{2}-\d{2}")


def file_hashes(folder: Path) -> dict[str, str]:
    return {p.relative_to(folder).as_posix(): hashlib.sha256(p.read_bytes()).hexdigest()
            for p in sorted(folder.rglob("*")) if p.is_file()}


def tree_digest(hashes: dict[str, str]) -> str:
    return hashlib.sha256("".join(f"{k}\0{v}\n" for k, v in sorted(hashes.items())).encode()).hexdigest()


def build_in_process(out: Path, hash_seed: str, epoch: str) -> None:
    # each build gets its own empty cache, so neither reads what the other made (see cache.py)
    env = dict(os.environ, PYTHONHASHSEED=hash_seed, SOURCE_DATE_EPOCH=epoch, TZ="UTC",
               CONDUCTOR_ATLAS_CACHE=str(out.parent / "build-cache"))
    result = subprocess.run([sys.executable, "-m", "conductor_atlas", "build", "--out", str(out)],
                            capture_output=True, text=True, cwd=PROJECT_ROOT, env=env, timeout=600)
    assert result.returncode == 0, result.stderr


@pytest.fixture(scope="module")
def two_builds(tmp_path_factory):
    first = tmp_path_factory.mktemp("repro-a") / "site"
    second = tmp_path_factory.mktemp("repro-b") / "published-elsewhere"
    build_in_process(first, "1", "0")
    build_in_process(second, "4242", "1700000000")
    return first, second


def test_two_builds_are_byte_identical(two_builds):
    first, second = two_builds
    a, b = file_hashes(first), file_hashes(second)
    assert len(a) > 50
    assert sorted(a) == sorted(b), f"file lists differ: {sorted(set(a) ^ set(b))[:20]}"
    differing = [name for name in a if a[name] != b[name]]
    assert differing == [], f"{len(differing)} files differ between two builds: {differing[:20]}"
    print(f"two builds, {len(a)} files, tree sha256 {tree_digest(a)} == {tree_digest(b)}")


def test_no_build_time_date_or_path_in_the_site(two_builds):
    first, second = two_builds
    today = datetime.datetime.now(datetime.timezone.utc).date()
    dates = {d.isoformat().encode() for d in (today, today - datetime.timedelta(days=1))}
    dates |= {d.strftime("%d %B %Y").encode() for d in (today, today - datetime.timedelta(days=1))}
    epoch_dates = [b"1970-01-01", b"2023-11-14"]  # the two SOURCE_DATE_EPOCH values used above
    # the data edition ("<date> · <digest>") names the date of the newest committed data change,
    # which comes from the git history, not from the build time: it may be today, and is allowed
    edition_label = re.compile(rb"\d{4}-\d{2}-\d{2} \xc2\xb7 [0-9a-f]{10}")
    leaks = []
    for path in sorted(first.rglob("*")):
        if not path.is_file():
            continue
        content = edition_label.sub(b"", path.read_bytes())
        rel = path.relative_to(first).as_posix()
        for needle in sorted(dates) + epoch_dates:
            if needle in content:
                leaks.append(f"{rel}: contains the date {needle.decode()}")
        if TRANSCRYPT_TIMESTAMP.search(content):
            leaks.append(f"{rel}: keeps Transcrypt's timestamp line")
        for folder in (first, second, PROJECT_ROOT):
            if str(folder).encode() in content:
                leaks.append(f"{rel}: contains the build path {folder}")
    assert leaks == []


def test_transpiled_modules_start_with_the_normalised_line(two_builds):
    first, _ = two_builds
    modules = sorted((first / "js").glob("*.js"))
    assert modules
    for path in modules:
        line = path.read_bytes().split(b"\n", 1)[0]
        if line.startswith(b"// Transcrypt"):
            assert line == b"// Transcrypt'ed from Python: conductor_atlas core", (path.name, line)
