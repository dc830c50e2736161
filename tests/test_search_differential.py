"""Search in node on the shipped search-index.json, as the browser runs it, against CPython: same results.

The browser parses the built file and hands it to the transpiled core with only its top level made
a dict; node does exactly that here. Hundreds of queries made from the index's own words (whole,
cut short, with a typo, in pairs, after a filter) must give the same ids, order, snippets, notes,
totals and scores (1e-12 relative) in both runtimes, for the popup's and the search page's limit.
"""

from __future__ import annotations

import json
import random
import subprocess

import pytest

from conductor_atlas.core.search import search
from tests.test_differential import differences

RUNNER = r"""
import {dict} from './org.transcrypt.__runtime__.js';
import {search} from './conductor_atlas.core.search.js';
import {readFileSync} from 'fs';
const index = dict(JSON.parse(readFileSync('search-index.json', 'utf8')));
const queries = JSON.parse(readFileSync('queries.json', 'utf8'));
const out = [];
for (const [query, limit] of queries) out.push(search(index, query, limit));
process.stdout.write(JSON.stringify(out));
"""

LIMITS = (8, 60)
FILTERS = ["iacs > 50", "density < 9", "rho < 5 uohm*cm", "alpha > 0.003", "melting point > 1000 °C"]


def typo(rng: random.Random, word: str) -> str:
    """The word with one swap, drop, wrong or extra letter (what fast typing on a tablet gives)."""
    if len(word) < 3:
        return word
    i = rng.randrange(len(word) - 1)
    kind = rng.randrange(4)
    if kind == 0:
        return word[:i] + word[i + 1] + word[i] + word[i + 2:]
    if kind == 1:
        return word[:i] + word[i + 1:]
    if kind == 2:
        return word[:i] + rng.choice("aeiourstnl") + word[i + 1:]
    return word[:i] + rng.choice("aeiourstnl") + word[i:]


def make_queries(vocabulary: list[str], count: int) -> list[str]:
    rng = random.Random(20261202)
    queries = ["copper", "C17200", "nickl chrom", "resistivity < 3 uohm*cm", "c", "co", "alumin", "aluminum alloy",
               "skin depth copper", "copper alloy, iacs > 50", "1.4301", "the of", "zzzz qqqq",
               # designations of open standards (issue 13): each finds its material first
               "C11000", "ETP", "Cu-ETP", "OF", "Cu-OF", "C10100", "C10200", "A91350", "EC", "CW004A", "6101-T6"]
    while len(queries) < count:
        word = rng.choice(vocabulary)
        kind = rng.randrange(6)
        if kind == 0:
            queries.append(word)
        elif kind == 1:
            queries.append(word[:rng.randrange(1, len(word) + 1)])
        elif kind == 2:
            queries.append(typo(rng, word))
        elif kind == 3:
            queries.append(word + " " + typo(rng, rng.choice(vocabulary)))
        elif kind == 4:
            queries.append(rng.choice(FILTERS) + ", " + word)
        else:
            queries.append(typo(rng, word)[:rng.randrange(2, 8)] + " " + rng.choice(vocabulary)[:3])
    return queries


@pytest.fixture(scope="module")
def shipped(built_site):
    return json.loads((built_site / "search-index.json").read_text(encoding="utf-8"))


def test_node_and_cpython_search_the_shipped_index_alike(node_core, built_site, shipped, tmp_path):
    # node_core: skips (or fails in CI) without node; the modules run are the built site's own js/
    for path in (built_site / "js").glob("*.js"):
        (tmp_path / path.name).write_bytes(path.read_bytes())
    (tmp_path / "package.json").write_text('{"type": "module"}\n')
    (tmp_path / "search-index.json").write_bytes((built_site / "search-index.json").read_bytes())
    calls = [[query, limit] for query in make_queries(shipped["vocabulary"], 400) for limit in LIMITS]
    (tmp_path / "queries.json").write_text(json.dumps(calls, ensure_ascii=False), encoding="utf-8")
    (tmp_path / "runner.mjs").write_text(RUNNER, encoding="utf-8")
    result = subprocess.run(["node", "runner.mjs"], cwd=tmp_path, capture_output=True, text=True, timeout=300)
    assert result.returncode == 0, result.stderr[-3000:]
    in_node = json.loads(result.stdout)
    assert len(in_node) == len(calls)
    problems = []
    found_some = 0
    for (query, limit), js in zip(calls, in_node):
        py = search(shipped, query, limit)
        found_some += len(py["results"]) > 0
        for problem in differences(py, js, f"search({query!r}, {limit})")[:2]:
            problems.append(problem)
    assert problems == [], f"{len(problems)} differences:\n" + "\n".join(problems[:30])
    # the queries exercise the index (most find something), not only the "nothing matches" path
    assert found_some > 0.6 * len(calls)
