"""How long one search takes, in CPython and in node on the transpiled core (a benchmark, not a test).

    .venv/bin/python bench/search_speed.py [--scale N]

Builds the search index from the shipped data (rendered pages included) or, with --scale N, from
N - 1 renamed copies of every shipped material besides (bench/dataset.py; the site-wide pages are
the shipped ones), prepares it as the build does, writes it as search-index.json and runs each
query many times: in CPython, and in node on the transpiled core exactly as the browser does
(parse the file, make its top level a dict, search). Prints the file size, the time to prepare
(build side) and to parse (browser side), and per query the first run and the median in ms.
The first run matters too: the browser times a handful of runs, before the JIT has settled.
"""

from __future__ import annotations

import argparse
import gzip
import json
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

from conductor_atlas import __version__
from conductor_atlas.build import data_folders
from conductor_atlas.core.search import search
from conductor_atlas.core.search_prepare import prepare_index
from conductor_atlas.derive import derive
from conductor_atlas.load import load_dataset
from conductor_atlas.paths import TEMPLATES_DIR
from conductor_atlas.render import Renderer
from conductor_atlas.search_index_file import build_index, index_json, shipped_index
from conductor_atlas.transpile import transpile_core

sys.path.insert(0, str(Path(__file__).resolve().parent))
from dataset import scaled_copies  # noqa: E402  (bench/ is not a package)

# the four (bench/run.py times these in Chromium), then typing, typos, filters, misses
QUERIES = ["copper", "C17200", "nickl chrom", "resistivity < 3 uohm*cm",
           "c", "co", "cop", "cooper", "nickle", "aluminum", "skin depth copper", "A91350",
           "iacs > 90", "copper alloy, iacs > 50", "zzzz qqqq"]
REPEAT = 30

NODE_RUNNER = r"""
import {dict} from './org.transcrypt.__runtime__.js';
import {search} from './conductor_atlas.core.search.js';
import {readFileSync} from 'fs';
const queries = JSON.parse(readFileSync('queries.json', 'utf8'));
let t0 = performance.now();
const index = dict(JSON.parse(readFileSync('search-index.json', 'utf8')));
const parse = performance.now() - t0;
const out = {parse, queries: {}};
for (const q of queries) {
  const times = [];
  for (let i = 0; i < REPEAT; i++) { t0 = performance.now(); search(index, q, 8); times.push(performance.now() - t0); }
  const first = times[0];
  times.sort((a, b) => a - b);
  out.queries[q] = {first, median: times[Math.floor(times.length / 2)]};
}
process.stdout.write(JSON.stringify(out));
"""


def entries_for(scale: int) -> tuple[list[dict], int]:
    shipped = load_dataset(data_folders())
    titles = Renderer(TEMPLATES_DIR, __version__).render_site(shipped, derive(shipped)).titles
    if scale <= 1:
        return build_index(shipped, derive(shipped), titles)["entries"], len(shipped.materials)
    with tempfile.TemporaryDirectory() as folder:
        extra = scaled_copies(Path(folder) / "copies", scale)
        dataset = load_dataset(data_folders([extra]))
    site_pages = {path: title for path, title in titles.items() if not path.startswith("materials/")}
    return build_index(dataset, derive(dataset), site_pages)["entries"], len(dataset.materials)


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    parser.add_argument("--scale", type=int, default=1, help="data set size as a multiple of the shipped one")
    args = parser.parse_args()
    entries, materials = entries_for(args.scale)
    start = time.perf_counter()
    prepared = prepare_index(entries)
    prepare_ms = 1000 * (time.perf_counter() - start)
    raw = index_json(shipped_index({"materials": materials, "entries": entries}))
    print(f"index: {materials} materials, {len(entries)} entries, {len(raw)} bytes, "
          f"{len(gzip.compress(raw, compresslevel=6, mtime=0))} gzip")
    print(f"CPython prepare (build side): {prepare_ms:.0f} ms")
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
        (work / "search-index.json").write_bytes(raw)
        (work / "queries.json").write_text(json.dumps(QUERIES))
        (work / "run.mjs").write_text(NODE_RUNNER.replace("REPEAT", str(REPEAT)))
        result = subprocess.run(["node", "run.mjs"], cwd=work, capture_output=True, text=True)
        if result.returncode != 0:
            print(result.stderr, file=sys.stderr)
            return 1
        node = json.loads(result.stdout)
    print(f"node parse (browser side, no preparation): {node['parse']:.0f} ms")
    print(f"{'query':32} {'CPython ms':>11} {'node first':>11} {'node median':>12}")
    for query in QUERIES:
        timing = node["queries"][query]
        print(f"{query:32} {python_ms[query]:11.2f} {timing['first']:11.2f} {timing['median']:12.2f}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
