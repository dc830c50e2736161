"""Geometric mean distances of rectangles and annuli against quadrature (scipy) and Grover's values."""

import math

import pytest
from scipy import integrate

from conductor_atlas.core.filament_inductance import (annulus_log_gmd, rectangle_log_gmd, rectangle_log_gmd_exact,
                                                      rectangle_log_gmd_far)


def _difference_density(wa, wb):
    # density of u = x_a - x_b for x_a, x_b uniform on widths wa, wb (a trapezoid)
    lo, hi = abs(wa - wb) / 2, (wa + wb) / 2

    def p(u):
        u = abs(u)
        if u <= lo:
            return min(wa, wb) / (wa * wb)
        if u >= hi:
            return 0.0
        return (hi - u) / (wa * wb)
    return p, hi


def quadrature_log_gmd(dx, dy, wa, ha, wb, hb):
    """ln g = int int p_x(u) p_y(v) ln |(dx + u, dy + v)| du dv by scipy's adaptive quadrature."""
    px, ux = _difference_density(wa, wb)
    py, uy = _difference_density(ha, hb)

    def integrand(v, u):
        r2 = (dx + u) ** 2 + (dy + v) ** 2
        return px(u) * py(v) * 0.5 * math.log(r2) if r2 > 0 else 0.0  # r = 0: a point of measure zero
    value, _ = integrate.dblquad(integrand, -ux, ux, -uy, uy, epsabs=1e-11, epsrel=1e-11)  # noqa: kinks warn
    return value


@pytest.mark.filterwarnings("ignore::scipy.integrate.IntegrationWarning")
@pytest.mark.parametrize("placement", [
    (0.0, 0.0, 1.0, 1.0, 1.0, 1.0),      # a square with itself
    (0.0, 0.0, 2.0, 0.3, 2.0, 0.3),      # a flat rectangle with itself
    (1.0, 0.0, 1.0, 1.0, 1.0, 1.0),      # two squares side by side
    (0.7, 0.55, 0.4, 1.1, 1.0, 0.2),     # unequal, offset, touching nowhere
    (0.2, 0.1, 0.4, 1.1, 1.0, 0.2),      # overlapping
    (3.0, -2.0, 0.5, 0.3, 0.2, 0.9),     # near the far-field switch
])
def test_closed_form_matches_quadrature(placement):
    dx, dy, wa, ha, wb, hb = placement
    exact = rectangle_log_gmd_exact(0.0, 0.0, wa, ha, dx, dy, wb, hb)
    # scipy's dblquad on the trapezoid densities (kinks at the trapezoid corners, the log singular
    # where the rectangles overlap): 1e-8 absolute in ln g is what it reaches on these
    assert exact == pytest.approx(quadrature_log_gmd(dx, dy, wa, ha, wb, hb), abs=1e-8)


def test_square_self_gmd_is_maxwells_constant():
    # Grover, Inductance Calculations (1946), ch. 3: the GMD of a square of side s from itself is
    # 0.44705 s (printed to five figures; from memory)
    assert math.exp(rectangle_log_gmd(0.0, 0.0, 2e-3, 2e-3, 0.0, 0.0, 2e-3, 2e-3)) / 2e-3 == pytest.approx(0.44705,
                                                                                                          abs=1e-5)


def test_thin_strip_self_gmd_is_0_2235_of_width():
    # Grover (1946) ch. 3: a thin strip of width b (thickness -> 0) has GMD 0.22313 b = b e^(-3/2)
    # (from memory; the limit is exact: ln g = ln b - 3/2)
    assert rectangle_log_gmd(0, 0, 1.0, 1e-6, 0, 0, 1.0, 1e-6) == pytest.approx(-1.5, abs=1e-5)


@pytest.mark.parametrize("distance", [3.0, 5.0, 8.0, 20.0])
@pytest.mark.parametrize("angle", [0.0, 0.4, 1.2])
def test_far_field_expansion_matches_closed_form(distance, angle):
    # the expansion's omitted term is of order (s / D)^6 with a small coefficient: measured
    # < 5e-6 at the switch D = 3 s (tolerance 1e-5 there, 1e-7 from 5 s); the closed form loses
    # (D / s)^4 1e-16 to cancellation (1e-11 at 20 s)
    dx, dy = distance * math.cos(angle), distance * math.sin(angle)
    far = rectangle_log_gmd_far(0.0, 0.0, 1.0, 0.6, dx, dy, 0.8, 1.0)
    tolerance = 1e-5 if distance < 5.0 else 1e-7
    assert far == pytest.approx(rectangle_log_gmd_exact(0.0, 0.0, 1.0, 0.6, dx, dy, 0.8, 1.0), abs=tolerance)


def test_disk_self_gmd_is_r_exp_minus_quarter():
    # Grover (1946) ch. 3: a circle's area from itself has GMD a e^(-1/4) = 0.7788 a
    assert annulus_log_gmd(0.0, 2.0, 0.0, 2.0) == pytest.approx(math.log(2.0) - 0.25, abs=1e-15)


@pytest.mark.parametrize("rings", [(0.0, 1.0, 1.0, 1.5), (1.0, 1.5, 0.0, 1.0), (0.5, 0.8, 0.5, 0.8),
                                   (2.0, 2.1, 2.0, 2.1)])
def test_annulus_gmd_matches_quadrature(rings):
    a1, a2, b1, b2 = rings
    # ln max(r, s) averaged over both annuli with weights r dr, s ds (scipy dblquad)
    value, _ = integrate.dblquad(lambda s, r: math.log(max(r, s)) * r * s, a1, a2, b1, b2, epsabs=1e-13)
    mean = value / ((a2 ** 2 - a1 ** 2) / 2 * (b2 ** 2 - b1 ** 2) / 2)
    # dblquad reaches ~3e-9 where the integrand has its kink along r = s (the same annulus twice)
    assert annulus_log_gmd(a1, a2, b1, b2) == pytest.approx(mean, abs=1e-8)


def test_annuli_touching_within_rounding_are_still_nested():
    # a mesh's edges (centre +- half-width) can overlap by one rounding error; that pair was once
    # read as "the same annulus" (the GMD matrix lost its symmetry and the AC ratio was 0.5 % off)
    inner_edge = math.nextafter(0.00125, 1.0)  # the inner ring ends one ulp past where the outer begins
    nested = annulus_log_gmd(0.0011, 0.00125, 0.00125, 0.0013)
    assert annulus_log_gmd(0.0011, inner_edge, 0.00125, 0.0013) == pytest.approx(nested, abs=1e-12)
    assert annulus_log_gmd(0.00125, 0.0013, 0.0011, inner_edge) == pytest.approx(nested, abs=1e-12)
