"""bench/run.py still runs end to end (quick mode: one run, ×2 scale, one calculator).

This checks that the benchmark works and reports every figure, not how fast anything is: no
timing is asserted here (the targets are judged by `make bench`, see README "Benchmarks").
"""

from __future__ import annotations

import json
import os
import shutil
import subprocess
import sys
from pathlib import Path

import pytest

from conductor_atlas.paths import PROJECT_ROOT

IN_CI = os.environ.get("CI") == "true"


def test_quick_benchmark_runs_and_reports_every_figure(tmp_path):
    browser = Path("/usr/bin/chromium").exists() and shutil.which("chromium") is not None
    if not browser and IN_CI:
        pytest.fail("Debian's chromium is required in CI (apt-get install chromium)")
    out = tmp_path / "results.json"
    command = [sys.executable, str(PROJECT_ROOT / "bench" / "run.py"), "--quick", "--out", str(out)]
    if not browser:
        command.append("--no-browser")
    result = subprocess.run(command, capture_output=True, text=True, cwd=PROJECT_ROOT, timeout=1800)
    assert result.returncode == 0, result.stderr[-3000:]
    data = json.loads(out.read_text(encoding="utf-8"))
    names = [row["figure"] for row in data["figures"]]
    expected = ["render-and-write floor", "cold build (empty cache)", "warm build (nothing changed)",
                "rebuild after editing copper.toml", "×2 peak memory", "total site"]
    if browser:
        expected += ["first visit materials/copper/index.html", "next page materials/aluminium/index.html",
                     "input→result laid out, floor (no core)"]
    for name in expected:
        assert name in names, f"{name!r} missing from the benchmark's figures: {names}"
        assert name in result.stdout, f"{name!r} missing from the printed table"
    for row in data["figures"]:
        if row["target"]:
            assert row["status"] in ("PASS", "MISS"), row
    # the quick build really built the shipped set, and the one-file edit was seen by the cache
    assert data["build"]["materials"] >= 40
    assert data["build"]["changed_remade"], "the rebuild after an edit reported nothing remade"
    if browser:
        calculators = [row for row in data["figures"] if row["figure"].startswith("calculator ")]
        assert len(calculators) == 1 and calculators[0]["value"] is not None, calculators
        # the same-writes floor replayed that calculator's texts on a copy of its section
        writes = [row for row in data["figures"] if row["figure"].startswith("same writes, no core")]
        assert len(writes) == 1 and writes[0]["value"] is not None, writes
        assert data["browser"]["weight"]["first"]["requests"] >= 3


def test_the_rebuild_scope_counts_the_materials_made_from_the_edited_one():
    """Phosphor bronze and beryllium copper take ρ(T) from copper by Matthiessen's rule (temperature_base
    in their files), and the clad wires from their layers: editing copper.toml rightly remakes them, and the
    bench's "only what depends on it" check called that a MISS."""
    sys.path.insert(0, str(PROJECT_ROOT / "bench"))
    try:
        import run as bench_run
    finally:
        sys.path.pop(0)
    assert bench_run.dependents_of("copper") == {"copper", "phosphor-bronze", "beryllium-copper"}
    assert {"copper-clad-steel-40", "copper-clad-aluminium-10"} <= bench_run.dependents_of("copper-annealed")
    assert bench_run.dependents_of("silver") == {"silver"}
