"""How long one search takes, in CPython and in node on the transpiled core (a benchmark, not a test).

    .venv/bin/python bench/search_speed.py

Builds the index from the shipped data (rendered pages included), prepares it once, then runs each
query many times and prints the median per query in milliseconds.
"""

from __future__ import annotations

import json
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

from conductor_atlas import __version__
from conductor_atlas.build import data_folders
from conductor_atlas.core.search import prepare_index, search
from conductor_atlas.derive import derive
from conductor_atlas.load import load_dataset
from conductor_atlas.paths import TEMPLATES_DIR
from conductor_atlas.render import Renderer
from conductor_atlas.search_index import build_index
from conductor_atlas.transpile import transpile_core

QUERIES = ["c", "co", "cop", "copper", "cooper", "nickle", "aluminum", "skin depth copper", "A91350",
           "iacs > 90", "resistivity < 3 µΩ·cm", "copper alloy, iacs > 50", "zzzz qqqq"]
REPEAT = 30

NODE_RUNNER = r"""
import {dict} from './org.transcrypt.__runtime__.js';
import {prepare_index, search} from './conductor_atlas.core.search.js';
import {readFileSync} from 'fs';
const data = JSON.parse(readFileSync('index.json', 'utf8'));
const queries = JSON.parse(readFileSync('queries.json', 'utf8'));
function toPy(v) {
  if (Array.isArray(v)) return v.map(toPy);
  if (v !== null && typeof v === 'object') { const o = {}; for (const k of Object.keys(v)) o[k] = toPy(v[k]); return dict(o); }
  return v;
}
let t0 = performance.now();
const index = prepare_index(toPy(data.entries));
const prepare = performance.now() - t0;
const out = {prepare, queries: {}};
for (const q of queries) {
  const times = [];
  for (let i = 0; i < REPEAT; i++) { t0 = performance.now(); search(index, q, 8); times.push(performance.now() - t0); }
  times.sort((a, b) => a - b);
  out.queries[q] = times[Math.floor(times.length / 2)];
}
process.stdout.write(JSON.stringify(out));
"""


def main() -> int:
    dataset = load_dataset(data_folders())
    views = derive(dataset)
    pages = Renderer(TEMPLATES_DIR, __version__).render_site(dataset, views)
    index = build_index(dataset, views, pages)
    raw = json.dumps(index, ensure_ascii=False, sort_keys=True, separators=(",", ":")).encode()
    print(f"index: {len(index['entries'])} entries, {len(raw)} bytes")
    start = time.perf_counter()
    prepared = prepare_index(index["entries"])
    print(f"CPython prepare: {1000 * (time.perf_counter() - start):.1f} ms")
    python_ms = {}
    for query in QUERIES:
        times = []
        for _ in range(REPEAT):
            start = time.perf_counter()
            search(prepared, query, 8)
            times.append(time.perf_counter() - start)
        python_ms[query] = 1000 * statistics.median(times)
    with tempfile.TemporaryDirectory() as folder:
        work = Path(folder)
        for rel, content in transpile_core().items():
            (work / rel[3:]).write_bytes(content)
        (work / "package.json").write_text('{"type": "module"}\n')
        (work / "index.json").write_bytes(raw)
        (work / "queries.json").write_text(json.dumps(QUERIES))
        (work / "run.mjs").write_text(NODE_RUNNER.replace("REPEAT", str(REPEAT)))
        result = subprocess.run(["node", "run.mjs"], cwd=work, capture_output=True, text=True)
        if result.returncode != 0:
            print(result.stderr, file=sys.stderr)
            return 1
        node = json.loads(result.stdout)
    print(f"node prepare: {node['prepare']:.1f} ms")
    print(f"{'query':32} {'CPython ms':>11} {'node ms':>9}")
    for query in QUERIES:
        print(f"{query:32} {python_ms[query]:11.2f} {node['queries'][query]:9.2f}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
