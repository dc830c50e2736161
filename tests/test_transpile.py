"""The transpile stage: our Transcrypt launcher writes what plain Transcrypt writes, and a build
that fails stops its background transpile and leaves no scratch folder."""

from __future__ import annotations

import subprocess
import sys
from pathlib import Path

import pytest

from conductor_atlas import transpile
from conductor_atlas.atlas_errors import BuildError


def _js_files(folder: Path) -> dict[str, bytes]:
    return {p.name: transpile.normalise(p.read_bytes()) for p in sorted(folder.glob("*.js"))}


def test_launcher_output_is_byte_identical_to_plain_transcrypt(tmp_path):
    # Reference: Transcrypt 3.9.5 run as its authors ship it (`python -m transcrypt`), same flags.
    plain, ours = tmp_path / "plain" / "js", tmp_path / "ours" / "js"
    plain.mkdir(parents=True)
    ours.mkdir(parents=True)
    command = [sys.executable, "-m", "transcrypt", *transpile.FLAGS, "-xp", str(transpile.PACKAGE_DIR.parent),
               "-od", str(plain), str(transpile.ENTRY)]
    subprocess.run(command, check=True, capture_output=True, cwd=str(plain.parent))
    transpile.run_transcrypt(ours)
    expected, produced = _js_files(plain), _js_files(ours)
    assert sorted(produced) == sorted(expected)
    assert set(transpile.expected_files()) <= set(produced)
    differing = [name for name in expected if produced[name] != expected[name]]
    assert differing == []


def test_pending_transpile_closed_early_leaves_no_scratch(tmp_path):
    with transpile.PendingTranspile(tmp_path) as pending:
        assert pending.process is not None  # empty cache: Transcrypt was started
    assert pending.process is None
    assert list((tmp_path / "transpile").iterdir()) == []


def test_failed_transcrypt_reports_its_output(tmp_path, monkeypatch):
    monkeypatch.setattr(transpile, "transcrypt_command",
                        lambda out_dir: [sys.executable, "-c", "import sys; print('boom in core'); sys.exit(3)"])
    with pytest.raises(BuildError, match=r"exit 3\)[\s\S]*boom in core"):
        transpile.transpile_core(tmp_path)
    assert list((tmp_path / "transpile").iterdir()) == []
