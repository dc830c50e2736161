"""CPython and the transpiled core in node give the same answers (1e-12 relative, text exact)."""

from __future__ import annotations

import importlib
import math

import pytest

from conductor_atlas.core.errors import CoreError
from conductor_atlas.transpile import core_modules
from tests.support.differential_cases import all_cases
from tests.support.node_core import encode

REL = 1e-12  # plain arithmetic is bit-identical; exp/log/pow differ by 1-3 ulp (shared notes)


def run_python(module, function, args):
    fn = getattr(importlib.import_module(module), function)
    try:
        return {"ok": encode(fn(*args))}
    except CoreError as problem:
        return {"error": problem.message, "core": True}


def differences(py, js, where="result"):
    """A list of human-readable differences between two decoded results."""
    if isinstance(py, bool) or isinstance(js, bool):
        return [] if py == js else [f"{where}: {py!r} != {js!r}"]
    if isinstance(py, (int, float)) and isinstance(js, (int, float)):
        if py == js or math.isclose(py, js, rel_tol=REL, abs_tol=0.0):
            return []
        return [f"{where}: python {py!r} vs node {js!r}"]
    if isinstance(py, dict) and isinstance(js, dict):
        if set(py) != set(js):
            return [f"{where}: keys differ: python {sorted(py)} vs node {sorted(js)}"]
        out = []
        for key in py:
            out.extend(differences(py[key], js[key], f"{where}.{key}"))
        return out
    if isinstance(py, list) and isinstance(js, list):
        if len(py) != len(js):
            return [f"{where}: lengths differ {len(py)} vs {len(js)}: {py!r} vs {js!r}"]
        out = []
        for i, (a, b) in enumerate(zip(py, js)):
            out.extend(differences(a, b, f"{where}[{i}]"))
        return out
    return [] if py == js else [f"{where}: python {py!r} vs node {js!r}"]


def test_python_and_node_agree(node_core):
    cases = all_cases()
    calls = [{"module": m, "function": f, "args": a} for m, f, a in cases]
    node_results = node_core.call_many(calls)
    assert len(node_results) == len(cases)
    problems = []
    for (module, function, args), js in zip(cases, node_results):
        py = run_python(module, function, args)
        found = differences(py, js)
        if found:
            shown = repr(tuple(args))
            shown = shown if len(shown) < 300 else shown[:300] + "…"
            problems.append(f"{module}.{function}{shown}: " + "; ".join(found[:3]))
    assert problems == [], f"{len(problems)} of {len(cases)} cases differ:\n" + "\n".join(problems[:40])


def test_every_shipped_core_module_has_cases():
    covered = {m for m, _, _ in all_cases()}
    # a case of calculate(NAME, ...) exercises that calculator's module
    covered |= {"conductor_atlas.core.calc_" + args[0].replace("-", "_")
                for m, f, args in all_cases() if m == "conductor_atlas.core.calculators" and f == "calculate"}
    # constants, celsius and bar_ratio_grid (numbers only, read by bar_ratio_lookup's cases) hold no functions;
    # errors holds CoreError and check_positive, which every model calls
    shipped = set(core_modules()) - {"conductor_atlas.core.errors", "conductor_atlas.core.constants",
                                     "conductor_atlas.core.celsius", "conductor_atlas.core.bar_ratio_grid"}
    assert shipped - covered == set(), "core modules with no differential case: " + ", ".join(sorted(shipped - covered))
