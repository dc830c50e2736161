"""How long the filament solver takes, in CPython and in node on the transpiled core (a benchmark).

    .venv/bin/python bench/filament_speed.py [--repeat N]

Runs the AC-resistance cases the skin-effect calculator solves (a single bar, a bar group, a
go-and-return pair of bars or of round wires, a clad round wire) through the core in CPython and in node, the same code the
page runs, and prints a table: filament count, level reached, CPython ms and node ms (first run
and median, wall clock and the process's CPU time). The browser targets (single bar <= 100 ms,
three-bar group <= 300 ms at x4 CPU throttling) are compared with 4 x the node CPU-time median,
printed beside; a throttled page runs about 4 x slower than node on this machine's CPU (that factor
is the throttling, not a measurement). CPU time, not wall clock: on a shared machine (load above
the CPU count) the wall clock of a solve is mostly the wait for a CPU; the load average is printed.
"""

from __future__ import annotations

import argparse
import json
import os
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

from conductor_atlas.core import filament_solver as fs
from conductor_atlas.core import round_pair as rp
from conductor_atlas.transpile import transpile_core

RHO_CU = 1.7241e-8  # IEC 60028 annealed copper at 20 °C, ohm m
RHO_AL = 2.8264e-8  # IEC 60889 hard aluminium at 20 °C, ohm m
# [label, function, args, browser target ms or None]
CASES = [
    ["bar 100x10 mm Cu 50 Hz", "bar_group_solution", [0.1, 0.01, 1, 0.0, RHO_CU, 50.0], 100],
    ["bar 40x5 mm Cu 50 Hz", "bar_group_solution", [0.04, 0.005, 1, 0.0, RHO_CU, 50.0], 100],
    ["bar 200x10 mm Cu 400 Hz", "bar_group_solution", [0.2, 0.01, 1, 0.0, RHO_CU, 400.0], 100],
    # the slowest single bar seen on the page: three levels, 288 filaments per quarter at the last
    ["bar 100x10 mm Cu 400 Hz", "bar_group_solution", [0.1, 0.01, 1, 0.0, RHO_CU, 400.0], 100],
    ["bar 20x5 mm Cu 10 kHz", "bar_group_solution", [0.02, 0.005, 1, 0.0, RHO_CU, 1e4], 100],
    ["2 x 100x10 mm gap 10 mm 50 Hz", "bar_group_solution", [0.1, 0.01, 2, 0.01, RHO_CU, 50.0], 300],
    ["3 x 100x10 mm gap 10 mm 50 Hz", "bar_group_solution", [0.1, 0.01, 3, 0.01, RHO_CU, 50.0], 300],
    # the slowest group seen on the page: many skin depths across, 378 filaments per quarter at level 1
    ["3 x 100x10 mm gap 10 mm 100 kHz", "bar_group_solution", [0.1, 0.01, 3, 0.01, RHO_CU, 1e5], 300],
    ["pair 100x10 mm at 30 mm 50 Hz", "bar_pair_solution", [0.1, 0.01, 0.03, RHO_CU, 50.0], 100],
    ["CCA 2 mm, 1 MHz (rings)", "round_layers_solution", [[[0.000949, RHO_AL], [0.001, RHO_CU]], 1e6], 100],
    # round go-and-return pairs (core/round_pair.py, harmonics instead of filaments): the slowest are
    # near-touching wires at many skin depths (128 harmonics)
    ["round pair d 20 mm at 30 mm 50 Hz", "round_pair_solution", [0.01, 0.03, RHO_CU, 50.0], 100],
    ["round pair d 20 mm at 22 mm 1 kHz", "round_pair_solution", [0.01, 0.022, RHO_CU, 1e3], 100],
    ["round pair d 20 mm at 21 mm 1 MHz", "round_pair_solution", [0.01, 0.021, RHO_CU, 1e6], 100],
]

NODE_RUNNER = r"""
import * as fs0 from './conductor_atlas.core.filament_solver.js';
import * as rp from './conductor_atlas.core.round_pair.js';
const fs = {...fs0, ...rp};
import {readFileSync} from 'fs';
const cases = JSON.parse(readFileSync('cases.json', 'utf8'));
const out = [];
for (const c of cases) {
  const times = [], cpu = [];
  for (let i = 0; i < REPEAT; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    fs[c[1]](...c[2]);
    times.push(performance.now() - t0);
    const used = process.cpuUsage(c0);
    cpu.push((used.user + used.system) / 1000);
  }
  const first = times[0];
  times.sort((a, b) => a - b);
  cpu.sort((a, b) => a - b);
  out.push({first, median: times[Math.floor(times.length / 2)], cpu: cpu[Math.floor(cpu.length / 2)]});
}
process.stdout.write(JSON.stringify(out));
"""


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    parser.add_argument("--repeat", type=int, default=5)
    args = parser.parse_args()
    python = []
    for case in CASES:
        start = time.perf_counter()
        solution = getattr(rp if case[1] == "round_pair_solution" else fs, case[1])(*case[2])
        python.append([1000 * (time.perf_counter() - start), solution])
    with tempfile.TemporaryDirectory() as folder:
        work = Path(folder)
        for rel, content in transpile_core().items():
            (work / rel[3:]).write_bytes(content)
        (work / "package.json").write_text('{"type": "module"}\n')
        (work / "cases.json").write_text(json.dumps(CASES))
        (work / "run.mjs").write_text(NODE_RUNNER.replace("REPEAT", str(args.repeat)))
        result = subprocess.run(["node", "run.mjs"], cwd=work, capture_output=True, text=True)
        if result.returncode != 0:
            print(result.stderr, file=sys.stderr)
            return 1
        node = json.loads(result.stdout)
    load = os.getloadavg()[0] if hasattr(os, "getloadavg") else float("nan")
    print(f"load average (1 min) {load:.2f} on {os.cpu_count()} CPUs; x4 ms = 4 x the node CPU-time median")
    print(f"{'case':34} {'ratio':>8} {'filaments':>9} {'level':>5} {'CPython ms':>10} {'node first':>10} "
          f"{'node med':>9} {'node cpu':>9} {'x4 ms':>7} {'target':>6}")
    for case, (ms, solution), timing in zip(CASES, python, node):
        if "harmonics" in solution:  # a round pair: the harmonic count in the filament column, no level
            solution = {**solution, "filaments": solution["harmonics"], "level": 0}
        x4 = 4 * timing["cpu"]
        verdict = "ok" if x4 <= case[3] else "OVER"
        print(f"{case[0]:34} {solution['ratio']:8.4f} {solution['filaments']:9.0f} {solution['level']:5.0f} {ms:10.0f} "
              f"{timing['first']:10.1f} {timing['median']:9.1f} {timing['cpu']:9.1f} {x4:7.0f} {case[3]:4d} {verdict}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
