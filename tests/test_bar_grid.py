"""The single-bar grid the skin-effect calculator reads (conductor_atlas.bar_grid -> core/bar_ratio_grid.py).

Its nodes are the core's filament solver (checked against scikit-fem and the Kelvin solution in
tests/core/test_filament_solver.py, against the busbar literature in tests/core/test_bar_literature.py);
here: the stored grid was made by the solver as it is now, its nodes are that solver's answers, and
read through core.bar_ratio_lookup it agrees with the exact solutions of the material pages' bar table.
"""

import math
import random

import pytest

from conductor_atlas import bar_grid, bar_table
from conductor_atlas.core import bar_ratio_grid as grid
from conductor_atlas.core import filament_solver
from conductor_atlas.core.bar_ratio_lookup import tabulated_bar_ratio

HINT = "run: .venv/bin/python -m conductor_atlas.bar_grid --write --jobs 2 (about 10 CPU minutes)"


def test_stored_grid_is_current():
    """Made by the solver as it is now (the digest of bar_table.SOLVER_FILES' code), over the range the
    generator names: else the page would interpolate answers another solver gave."""
    assert grid.SOLVER_DIGEST == bar_table.solver_digest(), "the solver changed since bar_ratio_grid.py; " + HINT
    assert (grid.STEPS_PER_OCTAVE, grid.FIRST_U, grid.LAST_U, grid.FIRST_V) == (
        bar_grid.STEPS_PER_OCTAVE, bar_grid.FIRST_U, bar_grid.LAST_U, bar_grid.FIRST_V), HINT
    rows = bar_grid.node_steps()
    assert [len(r) for r in grid.RATIOS] == [len(r) for r in rows] == [len(r) for r in grid.CHANGES]


def test_the_nodes_are_solved_at_their_skin_depth():
    """δ of the generator's ρ and f is 1 mm (scipy-free: the core's skin_depth; δ = √(ρ/(π f µ0)) solved
    for f), so node (u, v) is a bar 2^u x 2^v mm."""
    from conductor_atlas.core.skin_effect import skin_depth
    assert skin_depth(bar_grid.RHO, bar_grid.FREQUENCY, 1.0) == pytest.approx(bar_grid.DELTA, rel=1e-14)
    assert bar_grid.node_size(8, -4) == pytest.approx((4e-3, 0.5e-3), rel=1e-15)


def test_stored_nodes_equal_fresh_solves():
    """Seeded cheap nodes (thin bars, t/δ <= 1, under 0.2 s each) solved again: identical to the stored
    ones, ratio and change (the generator stores the solver's numbers, kept to 1e-9)."""
    picks = random.Random(14).sample([s for row in bar_grid.node_steps() for s in row if s[1] <= 0], 6)
    for iu, iv in picks:
        stored = (grid.RATIOS[iu - grid.FIRST_U][iv - grid.FIRST_V], grid.CHANGES[iu - grid.FIRST_U][iv - grid.FIRST_V])
        assert stored == bar_grid.solve_node((iu, iv)), (iu, iv)


def test_refused_nodes_are_never_settled():
    """A node the solver refuses is stored as ratio 0, change 1: the lookup never uses it."""
    for row_r, row_c in zip(grid.RATIOS, grid.CHANGES):
        for ratio, change in zip(row_r, row_c):
            assert ratio > 1.0 or change >= 1.0
            assert ratio > 1.0 or ratio == 0.0


def test_grid_agrees_with_the_bar_tables_exact_solutions():
    """Every stored cell of the material pages' bar table (bar_ratios.json: exact solves of 12 sizes x 3
    frequencies x 14 materials) that the grid answers. Where the solve settled: within 0.1 % (the
    solver's own settling tolerance, which bounds how far two settled answers of it may lie apart;
    measured 4.8e-5 at worst). Where it did not (10 mm bars at 400 Hz): within a quarter of the solve's
    own estimated change (measured 0.09 of it, 1.3e-4 at most), and the grid's estimated change at least
    the solve's, so the page's "≈" and warning never say less than a direct solve would."""
    settled = unsettled = 0
    for key, solution in bar_table.stored_solutions().items():
        w, t, rho, f = (float(x) for x in key.split("|"))
        found = tabulated_bar_ratio(w, t, rho, f)
        if found is None:
            continue
        if solution[4]:
            settled += 1
            assert found[0] == pytest.approx(solution[0], rel=1e-3), key
        else:
            unsettled += 1
            assert abs(found[0] / solution[0] - 1.0) <= 0.25 * solution[3], key
            assert found[1] >= solution[3], key
    # every cell but those whose neighbouring nodes were solved at one level only
    assert settled >= 400 and unsettled >= 60, (settled, unsettled)
