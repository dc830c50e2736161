"""The isolated bar's AC/DC ratio read from the tabulated grid (core.bar_ratio_lookup).

The grid's nodes are the filament solver (tests/test_bar_grid.py: current and equal to fresh solves);
here the interpolation between them against direct solves, the finite-element reference and the
high-frequency limit, and the calculator using it only where it holds.
"""

import math
import random

import pytest
from scipy.constants import mu_0 as MU_0

from conductor_atlas.core import bar_ratio_grid as grid
from conductor_atlas.core.ac_layout import TABULATED_METHOD
from conductor_atlas.core.bar_ratio_lookup import tabulated_bar_ratio
from conductor_atlas.core.calc_skin_effect import calculate as calculate_skin_effect
from conductor_atlas.core.filament_solver import bar_group_solution
from tests.support.differential_cases import shipped_catalogue

RHO_CU = 1.7241e-8  # IEC 60028 annealed copper at 20 °C, Ω·m


def delta_of(rho, f):
    return math.sqrt(rho / (math.pi * f * MU_0))  # skin depth with scipy's µ0


def test_interpolation_matches_direct_solves_at_random_points():
    """Seeded random bars inside the grid (log-uniform w/δ from 1.2 to 100, t/δ from 1/13 to w/δ, random f
    and ρ between copper and brass): the tabulated ratio within 0.1 % of the filament solver's own answer
    for the same bar. 0.1 % is the solver's settling tolerance: two settled answers of it (neighbouring
    nodes at other refinement levels) may differ by that much, and the interpolation must not add more
    (measured on 200 such points: 6.2e-5 at worst, median 2.4e-7). Where the direct solve did not
    settle, the tabulated answer says so too (its change at least 0.1 %)."""
    rng = random.Random(2026)
    answered = 0
    for _ in range(24):
        u = rng.uniform(0.3, 6.6)
        v = rng.uniform(-3.7, u)
        rho = rng.uniform(1.6e-8, 7e-8)
        f = 10 ** rng.uniform(1.5, 5)
        d = delta_of(rho, f)
        w, t = d * 2 ** u, d * 2 ** v
        found = tabulated_bar_ratio(w, t, rho, f)
        if found is None:
            continue
        direct = bar_group_solution(w, t, 1, 0.0, rho, f)
        answered += 1
        assert found[0] == pytest.approx(direct["ratio"], rel=1e-3), (u, v, rho, f)
        if not direct["converged"]:  # the page marks the tabulated answer ≈ as it marked the solve's
            assert found[1] >= 1e-3, (u, v, rho, f)
    assert answered >= 16, answered  # most of them (the rest: nodes solved at one level, many δ thick)


@pytest.mark.parametrize("width, thickness, f, fem", [(0.1, 0.01, 50.0, 1.19818), (0.04, 0.005, 50.0, 1.01643),
                                                      (0.02, 0.005, 400.0, 1.16773)])
def test_fem_bars_through_the_calculator(width, thickness, f, fem):
    """The finite-element solutions of tests/support/fem_reference.py (scikit-fem; the values measured in
    tests/core/test_filament_solver.py) now answered from the grid: within 0.3 %, the calculator test's
    tolerance for the 100 x 10 mm bar (0.1 % settling + 0.1 % interpolation, with room); the method
    named as tabulated, its value 0 (no filaments solved for this answer)."""
    out = calculate_skin_effect({"material": "IACS", "frequency": f"{f:g} Hz",
                                 "size": f"{width * 1e3:g} x {thickness * 1e3:g} mm"}, shipped_catalogue())
    assert out["errors"] == {}
    assert out["results"]["ac_dc_ratio"]["value"] == pytest.approx(fem, rel=3e-3)
    assert out["results"]["ac_method"]["text"] == TABULATED_METHOD
    assert out["results"]["ac_method"]["value"] == 0.0
    assert out["warnings"] == [] or not any("filament solution" in w for w in out["warnings"])


@pytest.mark.parametrize("side_over_delta, band", [(10, (1.00, 1.05)), (20, (0.985, 1.005))])
def test_square_bar_toward_wheelers_limit(side_over_delta, band):
    """A square copper bar 10 and 20 skin depths across, read from the grid: within the bands of
    tests/core/test_bar_literature.py around Wheeler's high-frequency limit R_s/(π s) (H. A. Wheeler,
    "Formulas for the skin effect", Proc. IRE 30, 1942; the bands hold the scikit-fem solutions 1.0289
    and 0.9950 of that limit with ±0.01 room). The grid's nodes there did not settle (about 0.2 %), so
    the answer carries that change. At 40 skin depths nodes were solved at one level: no answer."""
    s = 0.01
    delta = s / side_over_delta
    f = RHO_CU / (math.pi * MU_0 * delta * delta)
    found = tabulated_bar_ratio(s, s, RHO_CU, f)
    limit = (RHO_CU / delta) / (math.pi * s)
    assert band[0] <= found[0] * RHO_CU / (s * s) / limit <= band[1]
    assert found[1] >= 1e-3  # marked ≈ on the page, as the direct solve is
    assert tabulated_bar_ratio(s, s, RHO_CU, f * 16.0) is None  # 4 times the skin depths across: 40 or 80


def test_at_a_node_it_is_the_node():
    """On a node the spline passes through the stored value (Catmull-Rom interpolates): a bar of
    2^3 x 2^0 skin depths reads the grid's RATIOS[12][16] to rounding."""
    d = delta_of(RHO_CU, 1000.0)
    found = tabulated_bar_ratio(8.0 * d, 1.0 * d, RHO_CU, 1000.0)
    assert found[0] == pytest.approx(grid.RATIOS[12 - grid.FIRST_U][0 - grid.FIRST_V], rel=1e-9)


def test_turned_bar_reads_the_same():
    """ratio(w, t) = ratio(t, w): the same bar turned by 90 degrees."""
    a = tabulated_bar_ratio(0.1, 0.01, RHO_CU, 50.0)
    b = tabulated_bar_ratio(0.01, 0.1, RHO_CU, 50.0)
    assert a == b


@pytest.mark.parametrize("w_over_delta, t_over_delta", [(1.1, 0.5), (110.0, 1.0), (50.0, 0.07), (1.1, 1.1)])
def test_outside_the_grid_there_is_no_answer(w_over_delta, t_over_delta):
    """Below w/δ = 2^(1/4), above 2^(27/4) = 107.6, below t/δ = 2^(-15/4) = 0.0743 (the 4 x 4 stencil
    must lie in the grid): None, and the calculator solves the bar itself."""
    d = delta_of(RHO_CU, 50.0)
    assert tabulated_bar_ratio(w_over_delta * d, t_over_delta * d, RHO_CU, 50.0) is None


@pytest.mark.parametrize("args", [(0.0, 0.01, RHO_CU, 50.0), (0.1, -0.01, RHO_CU, 50.0), (0.1, 0.01, 0.0, 50.0),
                                  (0.1, 0.01, RHO_CU, 0.0), (float("nan"), 0.01, RHO_CU, 50.0),
                                  (float("inf"), 0.01, RHO_CU, 50.0)])
def test_bad_inputs_get_no_answer(args):
    """The solver says what is wrong with them (core.errors.check_positive); the table stays silent."""
    assert tabulated_bar_ratio(*args) is None


def test_unsettled_answer_keeps_its_mark_and_warning():
    """100 x 10 mm copper at 400 Hz: the solver's budget ends before its answer settles (≈ 2.13, estimated
    change 0.11 %), and so did the grid's nodes around it. The grid's answer is the direct solve's to
    1e-3 (measured 1.1e-4: interpolating the nodes' extrapolated answers), shown as "≈" with a warning
    whose estimated change is at least the direct solve's own (here 0.15 % against 0.11 %)."""
    found = tabulated_bar_ratio(0.1, 0.01, RHO_CU, 400.0)
    direct = bar_group_solution(0.1, 0.01, 1, 0.0, RHO_CU, 400.0)
    assert not direct["converged"]
    assert found[0] == pytest.approx(direct["ratio"], rel=1e-3)
    assert found[1] >= direct["change"]
    out = calculate_skin_effect({"material": "IACS", "frequency": "400 Hz", "size": "100 x 10 mm"},
                                shipped_catalogue())
    assert out["results"]["ac_method"]["text"] == TABULATED_METHOD
    assert out["results"]["ac_dc_ratio"]["text"] == "≈ 2.13"
    assert any("did not settle to 0.1 %" in w and "estimated change up to" in w for w in out["warnings"])


def test_nodes_without_an_error_estimate_go_to_the_solver():
    """10 x 10 mm copper at 100 kHz (48 skin depths square): nodes near it were solved at one level only
    (the budget's filament count reached at once: no estimate of their error), so there is no tabulated
    answer and the calculator solves the bar, saying how many filaments and that it could not refine."""
    assert tabulated_bar_ratio(0.01, 0.01, RHO_CU, 1e5) is None
    out = calculate_skin_effect({"material": "IACS", "frequency": "100 kHz", "size": "10 x 10 mm"},
                                shipped_catalogue())
    method = out["results"]["ac_method"]
    assert method["text"] == "filament solver, " + str(int(method["value"])) + " filaments (isolated bar)"
    assert any("could not be refined" in w for w in out["warnings"])
