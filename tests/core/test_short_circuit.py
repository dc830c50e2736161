"""Short-circuit heating: the integrated adiabatic heat balance against IEC 60949's formula.

IEC 60949:1988 constants (from memory of the standard, as the issue gives them): copper K = 226
A·s^½/mm², β = 234.5 K; aluminium K = 148, β = 228. Behind them (also from memory): volumetric
heat capacity 3.45e6 J/(K·m³) copper, 2.5e6 aluminium; ρ20 = 1.7241e-8 and 2.8264e-8 Ω·m.
"""

import math

import pytest

from conductor_atlas.core import short_circuit as sc
from conductor_atlas.core.calc_short_circuit import calculate as calculate_short_circuit
from tests.support.differential_cases import shipped_catalogue

FAULT = {"material": "IACS", "current": "12 kA", "duration": "0.5 s", "size": "95 mm2", "initial": "90 °C",
         "final": "250 °C", "model": "auto"}


def run(**fields):
    return calculate_short_circuit({**FAULT, **fields}, shipped_catalogue())


def value(outcome, name):
    return outcome["results"][name]["value"]


@pytest.mark.parametrize("cv, rho20, beta, k_printed", [(3.45e6, 1.7241e-8, 234.5, 226.0),
                                                         (2.5e6, 2.8264e-8, 228.0, 148.0)])
def test_k_from_its_material_constants(cv, rho20, beta, k_printed):
    # IEC 60949 prints K to three digits: half a unit of the last digit, 0.5/148 = 0.34 %
    assert sc.iec60949_k(cv, rho20, beta) / 1e6 == pytest.approx(k_printed, abs=0.5)


def test_simpson_integral_equals_the_closed_form_for_linear_rho():
    # 64 Simpson panels on 1/(a + bθ) over 90-250 °C: error ~ h⁴ f'''' ≪ 1e-9 (measured ~1e-12)
    rho_ref, alpha, t_ref = 1.7241e-8, 0.00393, 293.15
    lo, hi = 363.15, 523.15
    rhos = [rho_ref * (1 + alpha * (t - t_ref)) for t in sc.integration_points(lo, hi)]
    numeric = sc.heat_integral(rhos, lo, hi, 3.45e6)
    assert numeric == pytest.approx(sc.linear_heat_integral(3.45e6, rho_ref, alpha, t_ref, lo, hi), rel=1e-9)


def test_iec_formula_is_the_heat_balance_with_its_own_constants():
    # With ρ linear through β and c_v = K² ρ20 /(β + 20), the integral IS the standard's formula:
    # the least area by both must agree to the integration error (1e-9).
    beta, k = 234.5, 226e6
    rho20 = 1.7241e-8
    cv = k * k * rho20 / (beta + 20.0)
    alpha = 1.0 / (beta + 20.0)
    g = sc.linear_heat_integral(cv, rho20, alpha, 293.15, 363.15, 523.15)
    area = 12000.0 * math.sqrt(0.5 / g)
    assert area == pytest.approx(sc.iec60949_min_area(12000.0, 0.5, k, beta, 363.15, 523.15), rel=1e-9)


# The check: the heat balance with the material data (ρ(T) and α from IEC 60028 / IEC
# 60889, c_p from the CRC table at 25 °C, density) and IEC 60949's formula agree within 2 % for
# copper and aluminium over the standard's range (initial 20-90 °C, final 140-250 °C, faults up to
# 5 s). Compared: the least cross-section, i.e. the K of I·√t = K·S that the standard is built on.
# Measured: copper +0.2 … +0.6 %, aluminium +1.3 … +1.5 % (the data's c_v of aluminium, 2.43e6
# J/(K·m³), is 3 % below the standard's 2.5e6).
RANGE = [(ti, tf, t) for ti in (20.0, 70.0, 90.0) for tf in (140.0, 160.0, 200.0, 250.0) for t in (0.1, 1.0, 5.0)]


@pytest.mark.parametrize("material", ["IACS", "1350"])
def test_least_area_agrees_with_iec60949_within_2_percent(material):
    worst = 0.0
    for ti, tf, t in RANGE:
        out = run(material=material, size="", initial=f"{ti} °C", final=f"{tf} °C", duration=f"{t} s")
        assert out["errors"] == {}
        d = value(out, "min_area") / value(out, "min_area_iec") - 1.0
        worst = max(worst, abs(d))
        assert abs(d) < 0.02, (ti, tf, t, d)
    print(material, f"worst least-area difference {worst * 100:.2f} %")


@pytest.mark.parametrize("material", ["IACS", "1350"])
def test_final_temperature_and_time_follow(material):
    """The final temperature from the integral puts back the I²t it came from; the longest time for
    the size at that final temperature is the fault's duration (round trip through the bisection)."""
    out = run(material=material, final="")
    theta = value(out, "final_temperature")
    back = run(material=material, duration="", final=f"{theta - 273.15} °C")
    assert value(back, "max_time") == pytest.approx(0.5, rel=1e-7)
    print(material, out["results"]["final_temperature"]["text"], "|", out["results"]["final_temperature_iec"]["text"])


def test_final_temperature_against_iec_copper():
    # 12 kA for 0.5 s on 95 mm² copper from 90 °C. IEC 60949 (2):
    # θf = (90 + 234.5)·exp(12000²·0.5/(226²·95²)) − 234.5 = 144.86 °C; the heat balance with the
    # data's c_v (1 % below the standard's) gives a rise about 1 % larger.
    out = run()
    iec = (90 + 234.5) * math.exp(12000 ** 2 * 0.5 / (226 ** 2 * 95 ** 2)) - 234.5
    assert value(out, "final_temperature_iec") - 273.15 == pytest.approx(iec, rel=1e-12)
    rise = value(out, "final_temperature") - 273.15 - 90
    assert rise == pytest.approx(iec - 90, rel=0.02)


@pytest.mark.parametrize("fields, field, words", [
    ({"size": "", "final": ""}, "size", "enter two of duration"),
    ({"final": "80 °C"}, "final", "above the temperature before the fault"),
    ({"material": "stainless-304"}, "material", "no specific heat"),
    ({"size": "1 mm2", "final": ""}, "current", "it fuses"),
    ({"duration": "-1 s"}, "duration", "greater than zero"),
    ({"duration": "5 kg"}, "duration", "unknown unit"),
])
def test_refusals_say_what_to_type(fields, field, words):
    out = run(**fields)
    assert out["results"] == {}
    assert words in out["errors"][field], out["errors"]


def test_cautions_and_long_faults():
    out = run(duration="10 s", final="", current="3 kA")
    assert any("longer than 5 s" in w for w in out["warnings"])
    assert any("c_p is held" in w for w in out["warnings"])
    assert "iec60949" in out["sources"] and "crc-heat-capacity-elements" in out["sources"]


def test_a_conductor_grade_fuses_at_its_own_solidus():
    """Standard annealed copper (C11000) stops at its solidus, 1065 °C (ASM Handbook Vol. 2, C11000 data
    sheet, from memory): before its file had no melting point and the search ran on to 1590 °C ("the
    search's upper bound")."""
    out = run(size="10 mm2", current="200 kA", duration="1 s", final="")
    assert "1065.0 °C (its melting point)" in out["errors"]["current"]
    assert shipped_catalogue()["materials"]["copper-annealed"]["melting_point"] == pytest.approx(1065.0 + 273.15)


def test_a_longest_time_beyond_the_adiabatic_range_says_so():
    """100 A in 95 mm² copper, 90 -> 250 °C: IEC 60949's t = K² S² ln((θf + β)/(θi + β)) / I² with
    K = 226, β = 234.5 gives 18.48 ks = 5.13 h by hand, far beyond the adiabatic range; before, the
    answer showed "18.28 ks" with no word that heat lost meanwhile makes the real time longer."""
    out = run(current="100 A", duration="")
    by_hand = 226.0 ** 2 * 95.0 ** 2 * math.log((250 + 234.5) / (90 + 234.5)) / 100.0 ** 2
    assert value(out, "max_time_iec") == pytest.approx(by_hand, rel=1e-9)
    assert "(5.08 h)" in out["results"]["max_time"]["text"]  # the heat balance's 18.28 ks
    assert any("longest time" in w and "beyond 5 s" in w for w in out["warnings"]), out["warnings"]
    short = run(current="12 kA", duration="")  # 0.294 s: inside the range, no such note
    assert not any("beyond 5 s" in w for w in short["warnings"])
    assert "h)" not in short["results"]["max_time"]["text"]


@pytest.mark.parametrize("model", ["auto", "linear", "table", "bloch-gruneisen"])
def test_the_integral_without_lists_is_the_listed_one_to_the_bit(model):
    # calc_short_circuit.heat_integral_of sums Simpson's terms as it goes instead of building the
    # temperature and ρ lists: the same floats in the same order, so equality is exact (no tolerance);
    # the spans reach each material's solidus, across the auto model's switch from linear to table
    from conductor_atlas.core.calc_short_circuit import heat_integral_of, resistivities
    from conductor_atlas.core.errors import CoreError

    def listed(m, lo, hi, cv):
        return sc.heat_integral(resistivities(m, sc.integration_points(lo, hi), model), lo, hi, cv)

    compared = 0
    for m in shipped_catalogue()["materials"].values():
        if not (m["specific_heat"] > 0 and m["density"] > 0):
            continue
        cv = m["density"] * m["specific_heat"]
        for lo, hi in [(293.15, 523.15), (363.15, m["melting_point"] if m["melting_point"] > 400 else 1000.0)]:
            try:
                expected = listed(m, lo, hi, cv)
            except CoreError as problem:
                with pytest.raises(CoreError) as raised:
                    heat_integral_of(m, model, lo, hi, cv)
                assert (raised.value.field, raised.value.message) == (problem.field, problem.message)
                continue
            assert heat_integral_of(m, model, lo, hi, cv) == expected
            compared += 1
    assert compared >= 20  # the shipped data have about forty metals with a specific heat
