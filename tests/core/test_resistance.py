"""DC resistance against IEC 60028 and published wire-table values."""

import pytest

from conductor_atlas.core import resistance as dc
from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.geometry import awg_area


def test_iacs_resistivity_is_one_fifty_eighth():
    # IEC 60028: 1/58 Ω·mm²/m = 0.017241 Ω·mm²/m at 20 °C (printed to 5 significant figures)
    assert dc.IACS_RESISTIVITY * 1e6 == pytest.approx(0.017241, abs=5e-7)
    assert dc.iacs_percent(dc.IACS_RESISTIVITY) == pytest.approx(100.0, rel=1e-15)


def test_inferred_zero_temperature_of_copper():
    # IEC 60028: α20 = 0.00393 = 1/254.45 per K -> zero at 20 − 254.45 = −234.45 °C; the trade
    # rounds this to the 234.5 used by the resistance method (IEC 60034-1 Annex, from memory).
    assert dc.inferred_zero_temperature(0.00393, 293.15) - 273.15 == pytest.approx(-234.45, abs=0.01)


def test_ten_awg_copper_per_km():
    # 10 AWG solid annealed copper at 20 °C: 3.277 Ω/km, from R = ρ/A with ASTM B258 area
    # 5.261 mm² and IEC 60028 ρ; wire tables print 3.277 Ω/km (ASTM B258 area, common practice).
    # Tolerance: the printed 4 significant figures.
    r = dc.resistance(1.7241e-8, 1000.0, awg_area(10))
    assert r == pytest.approx(3.277, abs=0.0005)


def test_aluminium_1350_resistivity_from_iacs():
    # IEC 60889: 61.0 %IACS = 0.028264 Ω·mm²/m at 20 °C. The standard divides the rounded
    # 0.017241 by 0.61 (= 0.0282639); exact 1/58 gives 0.0282646. rel 3e-5 covers that rounding.
    assert dc.resistivity_from_iacs(61.0) * 1e6 == pytest.approx(0.028264, rel=3e-5)


def test_copper_at_ninety_degrees():
    # linear model, IEC 60028 α: 1.7241 × (1 + 0.00393 × 70) = 2.1984 µΩ·cm (hand calculation)
    assert dc.resistivity_linear(363.15, 1.7241e-8, 0.00393, 293.15) == pytest.approx(2.19840e-8, rel=2e-5)


def test_voltage_drop_and_loss():
    # Ohm's and Joule's laws: 0.5 Ω at 10 A -> 5 V and 50 W
    assert dc.voltage_drop(0.5, 10.0) == 5.0
    assert dc.power_loss(0.5, 10.0) == 50.0


def test_linear_model_refuses_absolute_zero():
    with pytest.raises(CoreError) as caught:
        dc.resistivity_linear(0.0, 1.7e-8, 0.0039, 293.15)
    assert "absolute zero" in caught.value.message


def test_linear_model_refuses_negative_resistivity():
    with pytest.raises(CoreError) as caught:
        dc.resistivity_linear(20.0, 1.7e-8, 0.0039, 293.15)  # far below −234 °C
    assert "non-positive" in caught.value.message
