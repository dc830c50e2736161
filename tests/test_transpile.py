"""The transpile stage: our Transcrypt launcher writes what plain Transcrypt writes (but Transcrypt's
math module without keyword-argument handling, with the same answers), and a build that fails stops
its background transpile and leaves no scratch folder."""

from __future__ import annotations

import json
import shutil
import subprocess
import sys
from pathlib import Path

import pytest

from conductor_atlas import transpile
from conductor_atlas.atlas_errors import BuildError


def _js_files(folder: Path) -> dict[str, bytes]:
    return {p.name: transpile.normalise(p.read_bytes()) for p in sorted(folder.glob("*.js"))}


# math functions and arguments whose results plain Transcrypt's math.js and ours must share exactly
# (Math.log and friends are deterministic in one node; the arguments cover each function with keyword
# handling in the plain build, log with and without its base, and isclose with keywords)
MATH_PROBE = """
const plain = await import(process.argv[2]);
const ours = await import(process.argv[3]);
const calls = [['log', [2.5]], ['log', [1e-300]], ['log', [8.0, 2.0]], ['log', [1000.0, 10.0]], ['log2', [3.0]],
  ['log10', [1000.0]], ['expm1', [1e-3]], ['log1p', [0.5]], ['degrees', [1.0]], ['radians', [90.0]],
  ['copysign', [2.0, -0.5]], ['exp', [0.7]], ['atan', [0.3]], ['sqrt', [2.0]]];
const rows = calls.map(([f, args]) => [f, plain[f](...args), ours[f](...args)]);
const kw = {__kwargtrans__: null, rel_tol: 0.1};
rows.push(['isclose', plain.isclose(1.0, 1.05, kw), ours.isclose(1.0, 1.05, kw)]);
console.log(JSON.stringify(rows));
"""


def _transcrypt_plain_and_ours(tmp_path: Path) -> tuple[Path, Path]:
    # Reference: Transcrypt 3.9.5 run as its authors ship it (`python -m transcrypt`), same flags.
    plain, ours = tmp_path / "plain" / "js", tmp_path / "ours" / "js"
    plain.mkdir(parents=True)
    ours.mkdir(parents=True)
    command = [sys.executable, "-m", "transcrypt", *transpile.FLAGS, "-xp", str(transpile.PACKAGE_DIR.parent),
               "-od", str(plain), str(transpile.ENTRY)]
    subprocess.run(command, check=True, capture_output=True, cwd=str(plain.parent))
    transpile.run_transcrypt(ours)
    return plain, ours


def test_launcher_output_is_plain_transcrypt_but_math_without_keywords(tmp_path):
    plain, ours = _transcrypt_plain_and_ours(tmp_path)
    expected, produced = _js_files(plain), _js_files(ours)
    assert sorted(produced) == sorted(expected)
    assert set(transpile.expected_files()) <= set(produced)
    # every module of the core and the runtime: byte-identical
    differing = [name for name in expected if produced[name] != expected[name]]
    assert differing == ["math.js"]
    # math.js: the keyword-argument prologue is gone but in isclose, which asks for it itself
    prologue = '.hasOwnProperty ("__kwargtrans__")) {\n\t\t\tvar __allkwargs0__'
    plain_math, our_math = expected["math.js"].decode(), produced["math.js"].decode()
    assert plain_math.count(prologue) == 9
    assert our_math.count(prologue) == 1
    assert "export var isclose" in our_math.split(prologue)[0]
    assert "export var log = function (x, base) {\n\treturn " in our_math
    # and every function gives the same answer in node
    if shutil.which("node") is None:
        pytest.skip("node is not installed")
    for folder in (plain, ours):
        (folder / "package.json").write_text('{"type": "module"}')
    probe = tmp_path / "probe.mjs"
    probe.write_text(MATH_PROBE)
    result = subprocess.run(["node", str(probe), str(plain / "math.js"), str(ours / "math.js")],
                            check=True, capture_output=True, text=True)
    rows = json.loads(result.stdout)
    assert len(rows) == 15
    assert [row for row in rows if row[1] != row[2]] == []


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
