"""Reference checks for conductor_atlas.core.temperature_models.

References: scipy.integrate.quad and scipy.special.zeta for the Bloch-Grueneisen integral;
IEC 60751:2008 clause 4.2 and Table 1 for Callendar-Van Dusen (Table 1 values quoted from
memory, as noted beside each); numpy.interp for the table interpolation.
"""

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy import integrate, special

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core import temperature_models as tm
from tests.support.approx import approx


def _bg_integrand(x, n):
    # x^n / ((e^x - 1)(1 - e^-x)), as printed (Ziman 1960 eq. 9.5.15), stable form
    return x ** n * np.exp(-x) / (-np.expm1(-x)) ** 2


def _quad_reference(n, z):
    # adaptive quad, split so each piece is smooth and well scaled
    pts = [0.0] + [p for p in (1.0, 5.0, 20.0, 60.0) if p < z] + [min(z, 200.0)]
    total = 0.0
    for a, b in zip(pts[:-1], pts[1:]):
        total += integrate.quad(_bg_integrand, a, b, args=(n,), epsabs=0.0, epsrel=2e-14,
                                limit=200)[0]
    return total


# ---------------------------------------------------------------- Bloch-Grueneisen

@pytest.mark.parametrize("n", [3.0, 4.0, 5.0])
@pytest.mark.parametrize("z", [1e-4, 0.01, 0.3, 1.0, 2.5, 7.0, 15.0, 40.0, 100.0, 1e3])
def test_bg_integral_against_quad(n, z):
    # scipy.integrate.quad at epsrel 2e-14 (its floor is 50 eps); 1e-12 relative is the accuracy the core promises.
    assert tm.bloch_gruneisen_integral(n, z) == approx(_quad_reference(n, z), rel=1e-12)


@pytest.mark.parametrize("n", [2.0, 3.0, 4.0, 5.0, 7.0])
def test_bg_integral_limit_is_factorial_times_zeta(n):
    # J_n(inf) = n! zeta(n) (Ziman 1960 sec. 9.5; J_5(inf) = 124.4313306...).
    # scipy.special.zeta and gamma; the tail beyond z = 1e3 is ~1e-400, so 1e-13.
    expected = special.gamma(n + 1.0) * special.zeta(n)
    assert tm.bloch_gruneisen_integral(n, 1e3) == approx(expected, rel=1e-13)


def test_bg_integral_small_z_series():
    # integrand = x^3 (1 - x^2/12 + x^4/240 ...) -> J_5(z) = z^4/4 - z^6/72 + z^8/1920;
    # at z = 0.01 the next term (~z^10) is below 1e-20 relative.
    z = 0.01
    series = z ** 4 / 4.0 - z ** 6 / 72.0 + z ** 8 / 1920.0
    assert tm.bloch_gruneisen_integral(5.0, z) == approx(series, rel=1e-14)


def test_bg_low_temperature_t5_law():
    # rho - rho0 -> 5! zeta(5) A (T/Theta)^5 for T << Theta; at T = Theta/100 the missing
    # tail of J_5 is ~ z^5 e^-z with z = 100, i.e. 1e-33 relative.
    rho0, A, theta = 1e-10, 5e-8, 340.0
    T = 3.4
    expected = rho0 + 120.0 * special.zeta(5.0) * A * (T / theta) ** 5
    assert tm.bloch_gruneisen_resistivity(T, rho0, A, theta) == approx(expected,
                                                                              rel=1e-12)


def test_bg_high_temperature_slope():
    # rho - rho0 -> A [ (T/Theta)/4 - (Theta/T)/72 + ... ]; the next term is
    # (Theta/T)^3 / 1920 ~ 5e-7 relative at T = 10 Theta, so rel 1e-8 would be too tight
    # for a two-term check: use 1e-6.
    A, theta = 5e-8, 300.0
    T = 3000.0
    expected = A * ((T / theta) / 4.0 - (theta / T) / 72.0)
    assert tm.bloch_gruneisen_resistivity(T, 0.0, A, theta) == approx(expected, rel=1e-6)


def test_bg_matthiessen_phonon_part_independent_of_rho0():
    # Matthiessen's rule: the temperature-dependent part does not depend on the impurity part.
    a = tm.bloch_gruneisen_resistivity(150.0, 0.0, 4e-8, 320.0)
    b = tm.bloch_gruneisen_resistivity(150.0, 3e-9, 4e-8, 320.0)
    assert b - a == approx(3e-9, rel=1e-9)


def test_bg_copper_room_temperature_ratio():
    # Copper, from memory: Matula 1979, J. Phys. Chem. Ref. Data 8, 1147, Table for Cu,
    # rho = 1.543 uOhm*cm at 273.15 K and 1.725 at 300 K (ratio 1.118); Theta = 343 K
    # (Kittel ISSP Table 5.1, Debye temperature, from memory). Bloch-Grueneisen gives 1.1145;
    # 1 % covers the values from memory and the residual part.
    theta = 343.0
    A = tm.bloch_gruneisen_coefficient(273.15, 1.543e-8, 0.0, theta)
    ratio = tm.bloch_gruneisen_resistivity(300.0, 0.0, A, theta) / 1.543e-8
    assert ratio == approx(1.725 / 1.543, rel=0.01)


def test_bg_coefficient_inverts_resistivity():
    A = tm.bloch_gruneisen_coefficient(293.15, 1.7e-8, 1e-10, 330.0)
    assert tm.bloch_gruneisen_resistivity(293.15, 1e-10, A, 330.0) == approx(1.7e-8,
                                                                                   rel=1e-14)


def test_bg_rejects_nonpositive_temperature():
    with pytest.raises(CoreError, match="above 0 K") as info:
        tm.bloch_gruneisen_resistivity(0.0, 1e-10, 5e-8, 340.0)
    assert info.value.field == "T"


def test_bg_warnings():
    assert tm.bg_warnings(300.0, 340.0) == []
    assert "Theta/20" in tm.bg_warnings(10.0, 340.0)[0]
    assert "2 Theta" in tm.bg_warnings(1000.0, 340.0)[0]


def test_residual_resistivity_from_rrr():
    # Definition RRR = rho(273 K) / rho(4.2 K): RRR 100 from 1.543e-8 gives 1.543e-10.
    assert tm.residual_resistivity_from_rrr(1.543e-8, 100.0) == approx(1.543e-10,
                                                                              rel=1e-15)
    with pytest.raises(CoreError, match="ratio must be above 0") as info:
        tm.residual_resistivity_from_rrr(1.543e-8, 0.0)
    assert info.value.field == "rrr"


# ---------------------------------------------------------------- Callendar-Van Dusen

@pytest.mark.parametrize("t_c, printed", [
    # IEC 60751:2008 Table 1 (Pt100), values as the brief quotes them to 4 decimals.
    (100.0, 138.5055),
    (-200.0, 18.5201),
])
def test_cvd_pt100_four_decimals(t_c, printed):
    # printed to 0.1 mOhm: half a unit of the last digit
    assert tm.callendar_van_dusen_resistance(t_c + 273.15, 100.0) == approx(printed,
                                                                                   abs=5e-5)


@pytest.mark.parametrize("t_c, printed", [
    # IEC 60751:2008 Table 1 (Pt100), two decimals; quoted from memory.
    (-100.0, 60.26), (0.0, 100.00), (200.0, 175.86), (300.0, 212.05),
    (500.0, 280.98), (850.0, 390.48),
])
def test_cvd_pt100_table(t_c, printed):
    # printed to 0.01 ohm: half a unit of the last digit
    assert tm.callendar_van_dusen_resistance(t_c + 273.15, 100.0) == approx(printed,
                                                                                   abs=0.005)


def test_cvd_inverse_of_printed_value():
    # 138.5055 ohm (IEC 60751 Table 1) -> 100 degC; the printed rounding (5e-5 ohm) over the
    # slope 0.379 ohm/K is 1.3e-4 K.
    assert tm.callendar_van_dusen_temperature(138.5055, 100.0) == approx(373.15,
                                                                                abs=1.5e-4)
    assert tm.callendar_van_dusen_temperature(18.5201, 100.0) == approx(73.15, abs=3e-4)


@settings(max_examples=300, deadline=None)
@given(st.floats(min_value=-200.0, max_value=850.0))
def test_cvd_inverse_roundtrip(t_c):
    # The inverse must undo the forward equation on the whole IEC range; 1e-9 K is far below
    # any thermometer's resolution and well above double rounding (~1e-13 K).
    T = t_c + 273.15
    R = tm.callendar_van_dusen_resistance(T, 100.0)
    assert tm.callendar_van_dusen_temperature(R, 100.0) == approx(T, abs=1e-9)


def test_cvd_errors_and_warnings():
    with pytest.raises(CoreError, match="resistance must be above 0 ohm") as info:
        tm.callendar_van_dusen_temperature(-1.0, 100.0)
    assert info.value.field == "R"
    assert tm.cvd_warnings(300.0) == []
    assert "-200 to 850 degC" in tm.cvd_warnings(1200.0)[0]
    assert len(tm.cvd_warnings(50.0)) == 1


# ---------------------------------------------------------------- table interpolation

TEMPS = [77.0, 200.0, 273.15, 300.0, 400.0]
RHOS = [0.21e-8, 1.05e-8, 1.54e-8, 1.72e-8, 2.39e-8]


@pytest.mark.parametrize("T", [77.0, 100.0, 250.0, 273.15, 299.0, 400.0])
def test_interpolate_matches_numpy(T):
    # numpy.interp implements the same piecewise-linear rule inside the table.
    assert tm.interpolate_table(T, TEMPS, RHOS) == approx(np.interp(T, TEMPS, RHOS),
                                                                 rel=1e-14)
    assert not tm.is_extrapolated(T, TEMPS)
    assert tm.table_warnings(T, TEMPS) == []


def test_extrapolation_extends_end_segment_and_warns():
    slope = (RHOS[4] - RHOS[3]) / (TEMPS[4] - TEMPS[3])
    assert tm.interpolate_table(500.0, TEMPS, RHOS) == approx(RHOS[4] + 100.0 * slope,
                                                                     rel=1e-14)
    assert tm.is_extrapolated(500.0, TEMPS)
    assert tm.table_warnings(500.0, TEMPS) == [
        "extrapolated above the highest temperature in the table"]
    assert tm.table_warnings(20.0, TEMPS) == [
        "extrapolated below the lowest temperature in the table"]


def test_table_validation():
    with pytest.raises(CoreError, match="must increase strictly; point 2"):
        tm.interpolate_table(100.0, [1.0, 2.0, 2.0], [1.0, 2.0, 3.0])
    with pytest.raises(CoreError, match="table has 2 temperatures but 3 values"):
        tm.interpolate_table(100.0, [1.0, 2.0], [1.0, 2.0, 3.0])
    assert math.isfinite(tm.interpolate_table(1.5, [1.0, 2.0], [1.0, 2.0]))
