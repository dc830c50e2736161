"""Tabulate the isolated flat bar's AC/DC ratio over w/δ and t/δ for the page (core/bar_ratio_grid.py).

An isolated non-magnetic bar's ratio depends on its width and thickness only through w/δ and t/δ
(δ = √(ρ/(π f μ0)): the filament solver's meshes are graded in units of δ, and the ratio is
dimensionless; checked to 2e-9 by solving the same w/δ, t/δ at different ρ and f). So one table over
u = log2(w/δ) and v = log2(t/δ) serves every material and frequency, and the skin-effect calculator
reads it (core/bar_ratio_lookup.py) instead of solving on each keystroke.

Each node is ``core.filament_solver.bar_group_solution(w, t, 1, 0, ρ, f)``: the call, budget and 0.1 %
settling rule of the page, at δ = 1 mm (ρ of annealed copper, f chosen for δ). Only t <= w is solved
(the ratio is symmetric in w and t: the same bar turned by 90 degrees). Stored per node: the ratio
and the solver's estimated change of its last refinement step (the node settled when it is below
``filament_solver.TOLERANCE``); a node the solver refuses (hundreds of δ across) is stored as
ratio 0, change 1 (never settled). Stamped with the digest of the solver's code
(``bar_table.solver_digest``); tests/test_bar_grid.py fails while the stored grid is stale.

Range (in quarter octaves): u = 0 .. 7 (w/δ = 1 .. 128), v = -4 .. u (t/δ = 1/16 .. w/δ). The upper end
covers power bars: 200 x 10 mm copper at 400 Hz is w/δ = 61 (u = 5.9), and a 10 x 10 mm bar at 100 kHz
w/δ = 48 (u = 5.6), with one node to spare for the interpolation's stencil and room for wider strips.
Below w/δ = 1 the live solver is fast (two levels of about 150 filaments, 1 ms in node) and stays in use;
below t/δ = 1/16 (foil) too.

    python -m conductor_atlas.bar_grid --write [--jobs N]
"""

from __future__ import annotations

import argparse
import math
import sys
import time
from concurrent.futures import ProcessPoolExecutor
from pathlib import Path

from conductor_atlas.bar_table import CORE_DIR, solver_digest
from conductor_atlas.core import filament_solver
from conductor_atlas.core.constants import MU_0
from conductor_atlas.core.errors import CoreError

MODULE = CORE_DIR / "bar_ratio_grid.py"
STEPS_PER_OCTAVE = 4
FIRST_U = 0    # steps: u = log2(w/δ) = (FIRST_U + i) / STEPS_PER_OCTAVE for row i
LAST_U = 28
FIRST_V = -16  # steps: v = log2(t/δ) = (FIRST_V + j) / STEPS_PER_OCTAVE, j = 0 .. FIRST_U + i - FIRST_V
RHO = 1.7241e-8  # IEC 60028 annealed copper at 20 °C [Ω·m]; any ρ gives the same ratios at the same w/δ, t/δ
DELTA = 1e-3     # the skin depth the nodes are solved at [m]
FREQUENCY = RHO / (math.pi * MU_0 * DELTA * DELTA)  # [Hz], about 4.37 kHz


def node_size(iu: int, iv: int) -> tuple[float, float]:
    """(w, t) [m] of the node at u = iu / 4, v = iv / 4 (steps), at δ = DELTA."""
    return DELTA * 2.0 ** (iu / STEPS_PER_OCTAVE), DELTA * 2.0 ** (iv / STEPS_PER_OCTAVE)


def solve_node(steps: tuple[int, int]) -> tuple[float, float]:
    """(ratio, change) of one node; (0.0, 1.0) where the solver refuses the bar."""
    width, thickness = node_size(*steps)
    try:
        s = filament_solver.bar_group_solution(width, thickness, 1, 0.0, RHO, FREQUENCY)
    except CoreError:
        return 0.0, 1.0
    return s["ratio"], s["change"]


def node_steps() -> list[list[tuple[int, int]]]:
    """Rows of (u steps, v steps), one row per u, v from FIRST_V up to u."""
    return [[(iu, iv) for iv in range(FIRST_V, iu + 1)] for iu in range(FIRST_U, LAST_U + 1)]


def module_text(ratios: list[list[float]], changes: list[list[float]], digest: str) -> str:
    def rows(values):
        return "[\n" + "".join("    [" + ", ".join(repr(float(x)) for x in row) + "],\n" for row in values) + "]"
    return f'''"""AC/DC ratios of an isolated non-magnetic flat bar over w/δ and t/δ (generated data: do not edit).

Made by ``python -m conductor_atlas.bar_grid --write`` (generator/conductor_atlas/bar_grid.py), which
solves every node with core.filament_solver.bar_group_solution (the page's budget and 0.1 % settling
rule); read through core.bar_ratio_lookup. Node (i, j): u = log2(w/δ) = (FIRST_U + i) / STEPS_PER_OCTAVE,
v = log2(t/δ) = (FIRST_V + j) / STEPS_PER_OCTAVE, j = 0 .. FIRST_U + i - FIRST_V (t <= w; the ratio is
symmetric in w and t). RATIOS: R_ac / R_dc [-] (0 where the solver refuses the bar); CHANGES: the
solver's estimated relative change of its last refinement step [-] (settled below 1e-3; 1 where refused
or not refined). SOLVER_DIGEST: bar_table.solver_digest() of the solver code that made them.
"""

SOLVER_DIGEST = "{digest}"
STEPS_PER_OCTAVE = {STEPS_PER_OCTAVE}
FIRST_U = {FIRST_U}
LAST_U = {LAST_U}
FIRST_V = {FIRST_V}

RATIOS = {rows(ratios)}

CHANGES = {rows(changes)}
'''


def write_module(jobs: int) -> int:
    started = time.time()
    cpu = time.process_time()
    steps = node_steps()
    flat = [s for row in steps for s in row]
    with ProcessPoolExecutor(max_workers=jobs) as pool:
        solved = dict(zip(flat, pool.map(solve_node, flat, chunksize=4)))
    ratios = [[solved[s][0] for s in row] for row in steps]
    changes = [[solved[s][1] for s in row] for row in steps]
    MODULE.write_text(module_text(ratios, changes, solver_digest()), encoding="utf-8")
    unsettled = sum(1 for s in flat if solved[s][1] >= filament_solver.TOLERANCE)
    print(f"wrote {len(flat)} nodes ({unsettled} not settled to 0.1 %) to {MODULE} in {time.time() - started:.0f} s "
          f"wall ({jobs} processes; this process {time.process_time() - cpu:.1f} CPU s)")
    return 0


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description="Solve the single-bar AC/DC grid again and write core/bar_ratio_grid.py.")
    parser.add_argument("--write", action="store_true", help="rewrite core/bar_ratio_grid.py")
    parser.add_argument("--jobs", type=int, default=1, help="processes to solve in (default 1)")
    args = parser.parse_args(argv)
    if not args.write:
        parser.print_help()
        return 2
    return write_module(max(1, args.jobs))


if __name__ == "__main__":
    sys.exit(main())
