"""The bad-data corpus (tests/bad_data/): each broken input gives its own clear message naming the
file and the field, all problems of a run are printed together, the build exits 1 with no
traceback, and the site already in the output folder is left byte-for-byte as it was.

Each corpus file lists the lines the loader must print for it as ``# expect: field: message``.
Cases that cannot sensibly be committed (a huge file, a directory, a broken symlink, a link
loop, a named pipe, one id in two overlay folders) are made in a temporary folder here.
"""

from __future__ import annotations

import hashlib
import os
import shutil
import subprocess
import sys
from pathlib import Path

import pytest

from conductor_atlas.atlas_errors import DataError
from conductor_atlas.load import load_dataset
from conductor_atlas.paths import DATA_DIR, PROJECT_ROOT
from conductor_atlas.schema import MAX_FILE_BYTES

CORPUS = Path(__file__).resolve().parent / "bad_data"
MATERIAL_CASES = sorted((CORPUS / "materials").glob("*.toml"))

VALID = """schema = 1
id = "{id}"
name = "Valid overlay material {id} (invented for a test)"
class = "copper-alloy"
summary = "Invented for a test; not a real material."

[properties.resistivity]
value = "2.1 uohm*cm"
temperature = "20 degC"
source = "iec60028"
locator = "invented for a test"
"""


def expectations(path: Path) -> list[str]:
    """The ``# expect:`` lines of a corpus file (the non-UTF-8 case is read as Latin-1)."""
    raw = path.read_bytes()
    try:
        text = raw.decode("utf-8")
    except UnicodeDecodeError:
        text = raw.decode("latin-1")
    return [line[len("# expect: "):] for line in text.splitlines() if line.startswith("# expect: ")]


def problems_of(folders: list[Path]) -> list[str]:
    with pytest.raises(DataError) as caught:
        load_dataset(folders)
    return caught.value.problems


def tree_hash(folder: Path) -> str:
    """One SHA-256 over every file's relative path and bytes, in sorted order."""
    digest = hashlib.sha256()
    for path in sorted(p for p in folder.rglob("*")):
        rel = path.relative_to(folder).as_posix()
        digest.update(rel.encode() + b"\0")
        if path.is_file():
            digest.update(path.read_bytes())
        digest.update(b"\0")
    return digest.hexdigest()


def fs_cases(folder: Path) -> dict[str, str]:
    """Make the file-system cases in ``folder``; return file name -> the message it must give."""
    folder.mkdir(parents=True, exist_ok=True)
    huge = folder / "huge.toml"
    with open(huge, "wb") as out:
        out.write(b"schema = 1\n")
        line = b"# padding to make a file larger than a material file may be\n"
        while out.tell() <= MAX_FILE_BYTES:
            out.write(line)
    size = huge.stat().st_size
    (folder / "a-folder.toml").mkdir()
    (folder / "dangling.toml").symlink_to(folder / "no-such-target.toml")
    (folder / "loop.toml").symlink_to(folder / "loop.toml")
    os.mkfifo(folder / "pipe.toml")
    return {
        "huge.toml": f"is {size} bytes; a material file may be at most {MAX_FILE_BYTES} bytes",
        "a-folder.toml": "is a directory, expected a .toml file",
        "dangling.toml": "is a broken link",
        "loop.toml": "is a symbolic link loop (a link that leads back to itself)",
        "pipe.toml": "is not a regular file (a device, pipe or socket), expected a .toml file",
    }


@pytest.fixture(autouse=True)
def at_project_root(monkeypatch):
    """Messages show paths relative to the working folder; the expectations assume the checkout root."""
    monkeypatch.chdir(PROJECT_ROOT)


def test_corpus_covers_every_failure_mode():
    names = {p.stem for p in MATERIAL_CASES}
    for required in ("malformed-toml", "wrong-dimension", "missing-unit", "negative-value", "zero-value",
                     "nan-text", "inf-text", "toml-nan", "below-absolute-zero", "table-not-increasing",
                     "unknown-source", "duplicate-id", "duplicate-alias", "non-utf8"):
        assert required in names
    for path in MATERIAL_CASES + [CORPUS / "sources.toml"]:
        assert expectations(path), f"{path.name} states no expected message"


@pytest.mark.parametrize("path", MATERIAL_CASES, ids=lambda p: p.stem)
def test_each_case_alone_gives_its_message(tmp_path, path):
    folder = tmp_path / "shop"
    folder.mkdir()
    shutil.copyfile(path, folder / path.name)
    found = problems_of([DATA_DIR, folder])
    expected = expectations(path)
    for words in expected:
        assert any(f"{path.name}: {words}" in line for line in found), (words, found)
    # one clear message per failure: nothing else is reported for the file
    assert len(found) == len(expected), found


def test_bibliography_cases(tmp_path):
    folder = tmp_path / "shop"
    folder.mkdir()
    shutil.copyfile(CORPUS / "sources.toml", folder / "sources.toml")
    (folder / "ok.toml").write_text(VALID.format(id="ok-overlay"), encoding="utf-8")
    found = problems_of([DATA_DIR, folder])
    expected = expectations(CORPUS / "sources.toml")
    for words in expected:
        assert any(f"sources.toml: {words}" in line for line in found), (words, found)
    assert len(found) == len(expected), found


def test_file_system_cases(tmp_path):
    folder = tmp_path / "shop"
    messages = fs_cases(folder)
    found = problems_of([DATA_DIR, folder])
    for name, words in messages.items():
        assert any(f"{name}: {words}" in line for line in found), (name, found)
    assert len(found) == len(messages), found


def test_same_id_in_two_overlay_folders_names_both_files(tmp_path):
    first, second = tmp_path / "shop-a", tmp_path / "shop-b"
    for folder in (first, second):
        folder.mkdir()
        (folder / "twin.toml").write_text(VALID.format(id="twin-alloy"), encoding="utf-8")
    found = problems_of([DATA_DIR, first, second])
    assert found == [f"{second / 'twin.toml'}: id: \"twin-alloy\" clashes with the id of {first / 'twin.toml'}"]


@pytest.mark.skipif(os.geteuid() == 0, reason="root reads a file whatever its mode")
def test_unreadable_file(tmp_path):
    folder = tmp_path / "shop"
    folder.mkdir()
    locked = folder / "locked.toml"
    locked.write_text(VALID.format(id="locked"), encoding="utf-8")
    locked.chmod(0)
    try:
        found = problems_of([DATA_DIR, folder])
    finally:
        locked.chmod(0o644)
    assert found == [f"{locked}: cannot be read (Permission denied)"]


def test_whole_corpus_in_one_build(tmp_path):
    """Every case at once through the command line: all reported, exit 1, old site untouched."""
    from conductor_atlas.build import build

    out = tmp_path / "site"
    build(out)
    before = tree_hash(out)
    siblings = sorted(p.name for p in tmp_path.iterdir())

    overlay = tmp_path / "overlay"
    shutil.copytree(CORPUS, overlay)
    fs_messages = fs_cases(overlay / "materials")
    second = tmp_path / "second"
    second.mkdir()
    (second / "bad-wrong-dimension-again.toml").write_text(
        VALID.format(id="bad-wrong-dimension").replace('"2.1 uohm*cm"', '"1.7 kg"'), encoding="utf-8")

    result = subprocess.run([sys.executable, "-m", "conductor_atlas", "build", "--data", str(overlay),
                             "--data", str(second), "--out", str(out)],
                            capture_output=True, text=True, cwd=PROJECT_ROOT, timeout=300)
    assert result.returncode == 1
    assert "Traceback" not in result.stderr and "Traceback" not in result.stdout
    lines = result.stderr.splitlines()
    expected = []
    for path in MATERIAL_CASES:
        expected.extend(f"{path.name}: {words}" for words in expectations(path))
    expected.extend(f"sources.toml: {words}" for words in expectations(CORPUS / "sources.toml"))
    expected.extend(f"{name}: {words}" for name, words in fs_messages.items())
    expected.append('bad-wrong-dimension-again.toml: properties.resistivity.value: expected a value in ohm * m')
    missing = [words for words in expected if not any(words in line for line in lines)]
    assert missing == [], "\n".join(missing) + "\n--- stderr ---\n" + result.stderr
    problem_lines = [line for line in lines if not line.endswith("nothing was built")]
    assert len(problem_lines) == len(expected), result.stderr
    assert all(line.startswith("conductor-atlas: ") for line in lines)
    assert lines[-1] == f"conductor-atlas: {len(expected)} problem(s) found; nothing was built"
    # the previous site is byte-for-byte as it was, and no staging folder was left beside it
    assert tree_hash(out) == before
    assert sorted(p.name for p in tmp_path.iterdir()) == sorted(siblings + ["overlay", "second"])
