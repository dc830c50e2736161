"""Reference checks for conductor_atlas.core.practice.

Worked numbers are computed by hand in the comments from the formulas as printed in
IEC 60034-1 / IEEE Std 118 (resistance method, quoted from memory) and from the standard
material values of IEC 60028 (annealed copper: rho_20 = 1/58 ohm*mm^2/m, alpha_20 = 0.00393 /K)
and IEC 60889 (hard-drawn aluminium: rho_20 = 0.028264 ohm*mm^2/m), also from memory.
"""

import math

import pytest

from conductor_atlas.core import practice as pr
from conductor_atlas.core.errors import CoreError
from tests.support.approx import approx


def test_resistance_method_worked_example():
    # 10.00 ohm at 20 degC, 12.00 ohm hot, copper k = 234.5:
    # t2 = 1.2 * 254.5 - 234.5 = 70.9 degC exactly
    T2 = pr.resistance_method_temperature(10.0, 293.15, 12.0)
    assert T2 - 273.15 == approx(70.9, abs=1e-9)


def test_resistance_method_iec_copper_constant():
    # IEC 60034-1 uses 235 for copper: t2 = 1.2 * 255 - 235 = 71.0 degC
    T2 = pr.resistance_method_temperature(10.0, 293.15, 12.0, 235.0)
    assert T2 - 273.15 == approx(71.0, abs=1e-9)


def test_temperature_rise():
    # same winding, coolant at 25 degC at the end of the test: rise = 70.9 - 25 = 45.9 K
    rise = pr.temperature_rise(10.0, 293.15, 12.0, 298.15)
    assert rise == approx(45.9, abs=1e-9)


def test_inferred_zero_from_copper_alpha():
    # IEC 60028 annealed copper alpha_20 = 0.00393 /K: k = 254.45 - 20 = 234.45, i.e. the
    # 234.5 of IEEE Std 118 to its printed 4 figures (0.05 K).
    assert pr.inferred_zero_from_alpha(0.00393, 293.15) == approx(234.5, abs=0.05)


def test_resistance_method_consistent_with_linear_model():
    # Any material: with k from alpha, the method inverts R2 = R1 (1 + alpha (t2 - t1))
    # when alpha is referred to t1 (linear model, exact)
    alpha, t1, t2 = 0.00403, 20.0, 85.0
    R1 = 1.0
    R2 = R1 * (1.0 + alpha * (t2 - t1))
    k = pr.inferred_zero_from_alpha(alpha, t1 + 273.15)
    assert pr.resistance_method_temperature(R1, t1 + 273.15, R2, k) == approx(t2 + 273.15,
                                                                             rel=1e-14)


def test_equal_resistance_aluminium_vs_copper():
    # IEC 60889 aluminium 0.028264 vs IEC 60028 copper 1/58 = 0.017241 ohm*mm^2/m:
    # area ratio 1.6393, diameter ratio 1.2804; densities 2703 and 8890 kg/m^3 (the same
    # standards, from memory) -> mass ratio 1.6393 * 2703 / 8890 = 0.4984 (4 figures)
    rho_cu = 1.0 / 58.0 * 1e-6
    rho_al = 0.028264e-6
    assert pr.equal_resistance_area_ratio(rho_cu, rho_al) == approx(1.6393, abs=5e-5)
    assert pr.equal_resistance_diameter_ratio(rho_cu, rho_al) == approx(1.2804, abs=5e-5)
    assert pr.equal_resistance_mass_ratio(rho_cu, 8890.0, rho_al, 2703.0) == approx(0.4984,
                                                                                  abs=5e-5)


def test_voltage_drop_min_area():
    # 20 A over a 30 m route, two-wire, copper 1.7241e-8 ohm*m, 3 % of 230 V = 6.9 V:
    # A = 2 * 1.7241e-8 * 30 * 20 / 6.9 = 2.9984e-6 m^2 (3.00 mm^2), by hand
    A = pr.voltage_drop_min_area(1.7241e-8, 20.0, 30.0, 6.9)
    assert A == approx(2.9984e-6, rel=5e-5)
    # given total conductor length: half of it
    assert pr.voltage_drop_min_area(1.7241e-8, 20.0, 30.0, 6.9, 1.0) == approx(A / 2.0,
                                                                                rel=1e-15)
    # three-phase line-to-line: sqrt(3) instead of 2
    assert pr.voltage_drop_min_area(1.7241e-8, 20.0, 30.0, 6.9, math.sqrt(3.0)) == approx(
        A * math.sqrt(3.0) / 2.0, rel=1e-15)


def test_invalid_inputs():
    with pytest.raises(CoreError, match="cold resistance must be a finite number above 0") as e:
        pr.resistance_method_temperature(0.0, 293.15, 12.0)
    assert e.value.field == "R1"
    with pytest.raises(CoreError, match="below the inferred zero") as e:
        pr.resistance_method_temperature(1.0, 20.0, 2.0)
    assert e.value.field == "T1"
    with pytest.raises(CoreError, match="allowed voltage drop") as e:
        pr.voltage_drop_min_area(1.7e-8, 10.0, 10.0, 0.0)
    assert e.value.field == "max_drop"
