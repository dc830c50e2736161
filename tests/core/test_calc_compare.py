"""Calculator "compare" (equal resistance at equal length) against worked arithmetic.

A2/A1 = rho2/rho1, d2/d1 = sqrt(rho2/rho1), m2/m1 = (rho2 density2)/(rho1 density1). Published anchors:
IEC 60028 annealed copper 1.7241 µΩ·cm (100 %IACS), IEC 60889 hard-drawn 1350 aluminium 61.0 %IACS
(the records carry 0.028264 Ω·mm²/m, 1.6e-5 from 1.7241/0.61), densities 8890 and 2703 kg/m³; next
sizes from IEC 60228 Table 1 and ASTM B258 (2/0 AWG: 0.3648 in).
"""

import math

import pytest

from conductor_atlas.core.calc_compare import SIDE_FIELDS, calculate as calculate_compare
from conductor_atlas.core.calculators import calculate
from tests.support.outcomes import result_value as value

RHO_CU = 1.7241e-8


def test_copper_against_ec_aluminium(catalogue):
    out = calculate_compare({"material": "IACS", "other": "1350"}, catalogue)
    rho_al = catalogue["materials"]["aluminium-1350"]["rho_ref"]
    assert value(out, "area_ratio") == pytest.approx(rho_al / RHO_CU, rel=1e-15, abs=0)
    # 61.0 %IACS -> A2/A1 = 1/0.610 = 1.639; the record is 1.6e-5 from it -> 1e-4
    assert value(out, "area_ratio") == pytest.approx(1 / 0.610, rel=1e-4, abs=0)
    assert value(out, "diameter_ratio") == pytest.approx(math.sqrt(rho_al / RHO_CU), rel=1e-15, abs=0)
    mass = rho_al * 2703.0 / (RHO_CU * 8890.0)
    assert value(out, "mass_ratio") == pytest.approx(mass, rel=1e-12, abs=0)
    # "half the mass for the same resistance" (core/practice.py note): 0.4985
    assert value(out, "mass_ratio") == pytest.approx(0.50, rel=0.01, abs=0)
    assert value(out, "conductivity_per_mass_ratio") == pytest.approx(1 / mass, rel=1e-12, abs=0)
    assert value(out, "conductivity_ratio") == pytest.approx(0.610, rel=1e-4, abs=0)


def test_with_a_size_gives_the_other_size(catalogue):
    # 35 mm² copper -> 35 * 1.6394 = 57.38 mm² aluminium -> next IEC 60228 size 70 mm²; AWG: 1/0 is
    # 53.5 mm², 2/0 (0.3648 in) is 67.43 mm² -> 2/0
    out = calculate_compare({"material": "IACS", "other": "1350", "size": "35 mm2"}, catalogue)
    a2 = 35e-6 * value(out, "area_ratio")
    assert value(out, "area_other") == pytest.approx(a2, rel=1e-15, abs=0)
    assert value(out, "next_metric_size") == pytest.approx(70e-6, rel=1e-15, abs=0)
    assert out["results"]["next_awg"]["text"].startswith("2/0 AWG")
    assert value(out, "next_awg") == pytest.approx(math.pi / 4 * (0.3648 * 0.0254) ** 2, rel=1e-12, abs=0)
    assert value(out, "diameter_other") == pytest.approx(math.sqrt(4 * a2 / math.pi), rel=1e-15, abs=0)
    assert value(out, "mass_per_metre") == pytest.approx(8890.0 * 35e-6, rel=1e-12, abs=0)
    assert value(out, "mass_per_metre_other") / value(out, "mass_per_metre") == pytest.approx(
        value(out, "mass_ratio"), rel=1e-12, abs=0)


def test_hot_comparison_uses_each_coefficient(catalogue):
    # at 90 °C: rho = rho20 (1 + alpha (70 K)); copper alpha 0.00393, 1350 alpha 0.00403
    out = calculate_compare({"material": "IACS", "other": "1350", "temperature": "90 °C"}, catalogue)
    rho_al = catalogue["materials"]["aluminium-1350"]["rho_ref"]
    expected = rho_al * (1 + 0.00403 * 70) / (RHO_CU * (1 + 0.00393 * 70))
    assert value(out, "area_ratio") == pytest.approx(expected, rel=1e-12, abs=0)


def test_too_big_for_the_tables_warns(catalogue):
    out = calculate_compare({"material": "IACS", "other": "1350", "size": "2000 mm2"}, catalogue)
    assert "next_metric_size" not in out["results"] and "next_awg" not in out["results"]
    assert any("2500 mm²" in w for w in out["warnings"])
    assert any("4/0 AWG" in w for w in out["warnings"])


def test_missing_density_leaves_mass_out(catalogue):
    out = calculate_compare({"material": "IACS", "other": "copper-clad-steel-30"}, catalogue)
    assert "mass_ratio" not in out["results"]
    assert any("no density is on record" in w for w in out["warnings"])


def test_same_material_is_ratio_one(catalogue):
    out = calculate_compare({"material": "Cu", "other": "cu"}, catalogue)
    assert value(out, "area_ratio") == 1.0
    assert any("same material" in w for w in out["warnings"])


@pytest.mark.parametrize("fields, field, words", [
    ({"other": "xx"}, "other", "unknown material"),
    ({"other": ""}, "other", "is empty"),
    ({"material": ""}, "material", "is empty"),
    ({"size": "5 kg"}, "size", "unknown unit"),
    ({"temperature": "abc"}, "temperature", "expected a number first"),
    ({"model": "table"}, "model", "no sourced ρ(T) table"),
])
def test_bad_input_names_the_field(catalogue, fields, field, words):
    inputs = {"material": "IACS", "other": "1350", "size": "", "temperature": ""}
    inputs.update(fields)
    out = calculate_compare(inputs, catalogue)
    assert field in out["errors"], out["errors"]
    assert words in out["errors"][field]
    if field in SIDE_FIELDS:
        # a bad size drops only the size answers: the ratios of the two materials stay
        assert not set(out["results"]) & set(SIDE_FIELDS[field]), out["results"]
        assert "conductivity_ratio" in out["results"], out["results"]
    else:
        assert out["results"] == {}


def test_bar_gets_an_equal_resistance_bar_of_the_same_thickness(catalogue):
    """100 x 10 mm annealed copper against 1350 aluminium at 20 °C: R' = ρ/(w t) equal at equal t gives
    w2 = w1 ρ2/ρ1 = 100 mm / 0.610 = 163.9 mm (IEC 60028 100 %IACS, IEC 60889 61.0 %IACS: the records carry
    0.028264 Ω·mm²/m, 1.6e-5 from 1.7241/0.61, so 1e-4), beside the round size, with the DC-only caution."""
    out = calculate_compare({"material": "IACS", "other": "1350", "size": "100 x 10 mm"}, catalogue)
    rho_al = catalogue["materials"]["aluminium-1350"]["rho_ref"]
    assert value(out, "bar_width_other") == pytest.approx(0.1 * rho_al / RHO_CU, rel=1e-15, abs=0)
    assert value(out, "bar_width_other") == pytest.approx(0.1 / 0.610, rel=1e-4, abs=0)
    assert out["results"]["bar_width_other"]["text"] == "163.9 mm"
    # the bar's resistance per metre equals the reference's: ρ2/(w2 t) = ρ1/(w1 t)
    assert rho_al / (value(out, "bar_width_other") * 0.01) == pytest.approx(RHO_CU / (0.1 * 0.01), rel=1e-14)
    assert "diameter_other" in out["results"]
    assert any("DC only" in w and "skin-effect" in w for w in out["warnings"])
    # cable sizes (IEC 60228, AWG) do not apply to a bar: no next size, no "more than 4/0 AWG" caution
    assert "next_metric_size" not in out["results"] and "next_awg" not in out["results"]
    assert not any("AWG" in w or "stranded" in w for w in out["warnings"])


def test_bar_width_at_temperature_and_with_a_range(catalogue):
    """At 90 °C each material's own coefficient (IEC 60028 copper 0.00393 /K, 1350 0.00403 /K), the
    width scales as the area does; 6101 carries its recorded %IACS range (55.0-59.5 %IACS, ASTM B317)
    into the width's low and high ends."""
    out = calculate_compare({"material": "IACS", "other": "1350", "size": "40 x 5 mm", "temperature": "90 °C"},
                            catalogue)
    assert value(out, "bar_width_other") == pytest.approx(0.04 * value(out, "area_ratio"), rel=1e-15, abs=0)
    # core.ranges runs the calculator at both ends of the range (calculators.calculate)
    ranged = calculate("compare", {"material": "IACS", "other": "6101", "size": "40 x 5 mm"}, catalogue)
    width = ranged["results"]["bar_width_other"]
    # %IACS converts with 100 %IACS = 1/58 MS/m (IEC 60028), the copper record is 1.7241 µΩ·cm
    rho_6101 = [1.0 / (58e6 * 0.595), 1.0 / (58e6 * 0.550)]  # 59.5 and 55.0 %IACS (the record's value)
    assert width["low"] == pytest.approx(0.04 * rho_6101[0] / RHO_CU, rel=1e-12)
    assert width["high"] == pytest.approx(0.04 * rho_6101[1] / RHO_CU, rel=1e-12)
    assert width["text"] == "72.73 mm (range 67.23 mm – 72.73 mm)"


def test_round_size_gives_no_bar_width(catalogue):
    out = calculate_compare({"material": "IACS", "other": "1350", "size": "35 mm2"}, catalogue)
    assert "bar_width_other" not in out["results"]
    assert not any("DC only" in w for w in out["warnings"])


def test_bad_bar_drops_only_the_size_answers(catalogue):
    out = calculate_compare({"material": "IACS", "other": "1350", "size": "0 x 10 mm"}, catalogue)
    assert "size" in out["errors"]
    assert "bar_width_other" not in out["results"] and "conductivity_ratio" in out["results"]
