"""The round go-and-return pair (core.round_pair) against scipy, the Kelvin solution, the thin-skin
limit and an independent finite-element solution of the same pair (tests/support/fem_reference.py).
"""

import math

import pytest
from scipy.constants import mu_0
from scipy.special import ive

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.round_pair import _ratios, round_pair_solution
from conductor_atlas.core.skin_effect import kelvin_resistance_ratio

RHO_CU = 1.7241e-8  # annealed copper at 20 °C, IEC 60028 (100 % IACS), ohm m


def frequency_for_x(x, radius, rho=RHO_CU):
    """The frequency at which x = sqrt(2) a / delta (delta = sqrt(rho / (pi f mu_0)), scipy's mu_0)."""
    delta = math.sqrt(2.0) * radius / x
    return rho / (math.pi * mu_0 * delta ** 2)


@pytest.mark.parametrize("x", [1e-3, 0.5, 3.0, 30.0, 300.0, 3000.0, 1e5])
def test_bessel_ratios_match_scipy(x):
    # rho_n = I_n(z) / I_(n-1)(z) at z = (1 + j) x against scipy.special.ive (AMOS, exponentially
    # scaled: the scaling cancels in the ratio); measured worst 7e-15 relative
    z = complex(x, x)
    got = _ratios(x, x, 40)
    for n in (1, 2, 5, 17, 40):
        expected = ive(n, z) / ive(n - 1, z)
        assert abs(complex(got[n][0], got[n][1]) - expected) <= 1e-13 * abs(expected)


@pytest.mark.parametrize("x", [0.5, 1.5, 3.0, 7.0, 20.0, 100.0])
def test_far_apart_is_the_isolated_kelvin_wire(x):
    # the check (a): at D = 1000 a the other wire's field at this one is 1e-3 of the own field,
    # so the proximity part is of order (a / D)^2 = 1e-6 of the ratio; tolerance 1e-5. The Kelvin
    # ratio is the core's exact solution (Ramo, Whinnery & Van Duzer 1994, sec. 5.6)
    a = 0.004
    solution = round_pair_solution(a, 1000 * a, RHO_CU, frequency_for_x(x, a))
    kelvin = kelvin_resistance_ratio(x)
    assert solution["ratio"] == pytest.approx(kelvin, rel=1e-5)
    assert solution["isolated"] == pytest.approx(kelvin, rel=1e-9)
    assert solution["ratio"] > solution["isolated"]  # the proximity effect only adds loss
    assert solution["converged"]


@pytest.mark.parametrize("half_spacing", [1.1, 1.25, 1.5, 3.0])
def test_thin_skin_limit_of_a_two_wire_line(half_spacing):
    # Published limit (from memory): with the skin depth far below the radius, each wire of a
    # two-wire line has R = R_s / (2 pi a) * (D / 2a) / sqrt((D / 2a)^2 - 1) per length (the surface
    # current of two cylinders follows their image line charges; the factor is coth of the bipolar
    # coordinate of the surface), i.e. a proximity factor over the isolated wire of
    # (D / 2a) / sqrt((D / 2a)^2 - 1). At x = 1e4 (delta = 1.4e-4 a) the corrections of order
    # delta / a times the near-contact field gradient are below 3e-3 at D = 2.2 a (measured 1.6e-3)
    # and below 2e-4 from D = 3 a: tolerance 3e-3.
    a = 0.004
    solution = round_pair_solution(a, 2 * half_spacing * a, RHO_CU, frequency_for_x(1e4, a))
    limit = half_spacing / math.sqrt(half_spacing ** 2 - 1.0)
    assert solution["ratio"] / solution["isolated"] == pytest.approx(limit, rel=3e-3)
    assert solution["converged"]


def test_low_frequency_proximity_grows_as_f_squared():
    # Derived here (no published value at hand): at small x, t_n -> 0, so the other wire's field is
    # E_n = -u^n / n, and with rho_n ~ (z / 2n)(1 - z^2 / (4n(n+1))) harmonic n adds
    # u^(2n) x^4 / (8 n^2 (n + 1)) (u = a / D): the proximity part grows as f^2 (x^4). Checked at
    # x = 0.2 and 0.4, where the next order changes it by 6e-4 (measured); tolerance 2e-3.
    a = 0.004
    u = 1.0 / 3.0
    parts = []
    for x in (0.2, 0.4):
        solution = round_pair_solution(a, a / u, RHO_CU, frequency_for_x(x, a))
        parts.append(solution["ratio"] - solution["isolated"])
    assert parts[1] / parts[0] == pytest.approx(16.0, rel=2e-3)
    leading = sum(u ** (2 * n) * 0.2 ** 4 / (8 * n * n * (n + 1)) for n in range(1, 30))
    assert parts[0] == pytest.approx(leading, rel=2e-3)


@pytest.mark.parametrize("spacing, field", [(0.02, "spacing"), (0.01, "spacing"), (float("nan"), "spacing")])
def test_touching_or_overlapping_wires_are_refused(spacing, field):
    with pytest.raises(CoreError) as problem:
        round_pair_solution(0.01, spacing, RHO_CU, 50.0)
    assert problem.value.field == field
    assert "more than the wire's diameter" in problem.value.message


def test_nearly_touching_wires_at_many_skin_depths_say_they_did_not_settle():
    # D = 2.0002 a: the harmonic series converges as (2a / D)^(2N), too slowly for 128 harmonics
    solution = round_pair_solution(0.01, 0.020002, RHO_CU, 1e6)
    assert not solution["converged"]
    assert solution["harmonics"] == 128


# --- against the finite-element reference (the check (b)) ------------------------------
# The project's ratio within 1 % of the FEM ratio (the tolerance). Measured on this machine
# (FEM with 192 surface nodes, radial step min(delta, a) / 8 at the surface, far box at 60 extents):
#   d 20 mm, D 22 mm, 50 Hz (x 1.52): 1.090523 vs FEM 1.090449 (+6.8e-5)
#   d 20 mm, D 22 mm, 1 kHz (x 6.77): 4.471993 vs FEM 4.470624 (+3.1e-4)
#   d 20 mm, D 30 mm, 50 Hz:          1.059782 vs FEM 1.059734 (+4.5e-5)
#   d 20 mm, D 30 mm, 1 kHz:          3.310907 vs FEM 3.310213 (+2.1e-4; with the far box at 12
#                                     extents, as for bars, FEM gave 3.3026: the box's image currents)
@pytest.mark.fem
@pytest.mark.parametrize("spacing, f", [(0.022, 50.0), (0.022, 1e3), (0.03, 50.0), (0.03, 1e3)])
def test_round_pair_matches_fem(spacing, f):
    from tests.support.fem_reference import round_pair_ac_ratio
    fem = round_pair_ac_ratio(0.01, spacing, RHO_CU, f, around=192, fine=8.0)
    solution = round_pair_solution(0.01, spacing, RHO_CU, f)
    assert fem["ratios"][0] == pytest.approx(fem["ratios"][1], rel=1e-4)  # the FEM's own symmetry
    assert solution["ratio"] == pytest.approx(fem["ratios"][0], rel=1e-2)
    # and tighter than the issue asks: the FEM's discretisation error, measured 3e-4 at 1 kHz
    assert solution["ratio"] == pytest.approx(fem["ratios"][0], rel=2e-3)
