"""Calculator "sizing" (minimum cross-section for a voltage-drop limit) against worked arithmetic.

A_min = b rho(T) L I / dU, b = 2 (two-wire), 1 (length is the whole conductor) or sqrt 3 (balanced
three-phase, line-to-line drop), rho(T) = 1.7241e-8 (1 + 0.00393 (T - 20 °C)) ohm*m for annealed copper
(IEC 60028); next sizes from IEC 60228 Table 1 and ASTM B258.
"""

import math

import pytest

from conductor_atlas.core.calc_sizing import CAUTION, calculate as calculate_sizing
from tests.support.outcomes import result_value as value

RHO_70 = 1.7241e-8 * (1 + 0.00393 * 50.0)


def run(catalogue, **fields):
    inputs = {"material": "IACS", "length": "30 m", "current": "16 A", "max_drop": "3 %", "supply": "230 V",
              "conductors": "2", "temperature": "70 °C", "model": ""}
    inputs.update(fields)
    return calculate_sizing(inputs, catalogue)


def test_single_phase_worked_example(catalogue):
    # 30 m route, 16 A, 3 % of 230 V = 6.9 V, copper at 70 °C: A = 2 * 2.0629e-8 * 30 * 16 / 6.9 = 2.870 mm²
    out = run(catalogue)
    a_min = 2 * RHO_70 * 30 * 16 / 6.9
    assert value(out, "max_drop") == pytest.approx(6.9, rel=1e-15, abs=0)
    assert value(out, "min_area") == pytest.approx(a_min, rel=1e-12, abs=0)
    assert value(out, "min_area") == pytest.approx(2.870e-6, rel=5e-4, abs=0)
    assert value(out, "next_metric_size") == pytest.approx(4e-6, rel=1e-15, abs=0)
    # 12 AWG = 0.0808 in (ASTM B258) = 3.308 mm² >= 2.870; 13 AWG 0.0720 in = 2.627 mm² is too small
    assert out["results"]["next_awg"]["text"].startswith("12 AWG")
    assert value(out, "next_awg") == pytest.approx(math.pi / 4 * (0.0808 * 0.0254) ** 2, rel=1e-12, abs=0)
    assert value(out, "resistance") == pytest.approx(2 * RHO_70 * 30 / 4e-6, rel=1e-12, abs=0)
    assert value(out, "voltage_drop") == pytest.approx(2 * RHO_70 * 30 * 16 / 4e-6, rel=1e-12, abs=0)
    assert value(out, "voltage_drop") < 6.9
    assert value(out, "voltage_drop_percent") == pytest.approx(100 * 2 * RHO_70 * 30 * 16 / 4e-6 / 230, rel=1e-12,
                                                               abs=0)
    assert value(out, "power_loss") == pytest.approx(16 ** 2 * 2 * RHO_70 * 30 / 4e-6, rel=1e-12, abs=0)
    assert value(out, "voltage_drop_awg") == pytest.approx(2 * RHO_70 * 30 * 16 / value(out, "next_awg"),
                                                           rel=1e-12, abs=0)


def test_three_phase(catalogue):
    # 400 V line-to-line, 3 % = 12 V, 100 m, 63 A: A = sqrt3 * rho * 100 * 63 / 12
    out = run(catalogue, conductors="3-phase", supply="400 V", length="100 m", current="63 A")
    a_min = math.sqrt(3) * RHO_70 * 100 * 63 / 12
    assert value(out, "min_area") == pytest.approx(a_min, rel=1e-12, abs=0)
    area = value(out, "next_metric_size")
    assert area == pytest.approx(25e-6, rel=1e-15, abs=0)  # a_min = 18.76 mm² -> 25 mm²
    assert value(out, "resistance") == pytest.approx(RHO_70 * 100 / area, rel=1e-12, abs=0)
    assert value(out, "power_loss") == pytest.approx(3 * 63 ** 2 * RHO_70 * 100 / area, rel=1e-12, abs=0)
    assert "per phase conductor" in out["results"]["resistance"]["text"]


def test_volt_limit_and_one_conductor(catalogue):
    out = run(catalogue, max_drop="0.5 V", supply="", conductors="1", length="10 m", current="100 A",
              temperature="20 °C")
    assert value(out, "min_area") == pytest.approx(1.7241e-8 * 10 * 100 / 0.5, rel=1e-12, abs=0)
    assert "voltage_drop_percent" not in out["results"]


def test_safety_in_caution_and_every_outcome(catalogue):
    for words in ("voltage drop only", "ampacity", "short-circuit", "mechanical strength", "local electrical code",
                  "licensed practice"):
        assert words in CAUTION
    for fields in ({}, {"conductors": "3-phase"}, {"max_drop": "1 V", "supply": ""}, {"length": "5 km"}):
        out = run(catalogue, **fields)
        assert out["errors"] == {}
        assert any("voltage drop only" in w and "ampacity" in w and "licensed practice" in w for w in out["warnings"])


def test_a_size_far_below_the_current_is_questioned(catalogue):
    # 30 % of 230 V = 69 V over 30 m at 16 A: A_min = 2 * 2.0629e-8 * 30 * 16 / 69 = 0.287 mm², next
    # size 0.5 mm², and 16 A / 0.5 mm² = 32 A/mm² (by hand), over 13 A/mm² (1.5 mm² copper in PVC carrying
    # 19.5 A, IEC 60364-5-52 Table B.52.4, from memory): the drop is met, the note questions the size
    out = run(catalogue, max_drop="30 %")
    assert value(out, "next_metric_size") == pytest.approx(0.5e-6, rel=1e-15, abs=0)
    notes = [w for w in out["warnings"] if "current density at the metric size" in w]
    assert len(notes) == 1 and "32 A/mm²" in notes[0] and "current-rating table" in notes[0], out["warnings"]
    # the worked example above, 16 A in 4 mm² = 4 A/mm²: no note
    assert not any("current density" in w for w in run(catalogue)["warnings"])


def test_beyond_the_tables_warns(catalogue):
    out = run(catalogue, length="5 km", current="400 A")
    assert "next_metric_size" not in out["results"] and "next_awg" not in out["results"]
    assert any("2500 mm²" in w for w in out["warnings"])


@pytest.mark.parametrize("fields, field, words", [
    ({"conductors": "3"}, "conductors", "ambiguous"),
    ({"conductors": "4"}, "conductors", "choose 2"),
    ({"max_drop": "3"}, "max_drop", "needs a unit"),
    ({"max_drop": ""}, "max_drop", "is empty"),
    ({"max_drop": "3 %", "supply": ""}, "supply", "needs the supply voltage"),
    ({"max_drop": "150 %"}, "max_drop", "below 100 %"),
    ({"max_drop": "0 %"}, "max_drop", "above 0 %"),
    ({"max_drop": "300 V"}, "max_drop", "below the supply voltage"),
    ({"max_drop": "3 A"}, "max_drop", "is a current"),
    ({"supply": "-230 V"}, "supply", "greater than zero"),
    ({"length": "-3 m"}, "length", "greater than zero"),
    ({"current": "0 A"}, "current", "greater than zero"),
    ({"current": ""}, "current", "is empty"),
    ({"material": "xx"}, "material", "unknown material"),
])
def test_bad_input_names_the_field(catalogue, fields, field, words):
    out = run(catalogue, **fields)
    assert field in out["errors"], out["errors"]
    assert words in out["errors"][field]
    assert out["results"] == {}
    assert out["warnings"] == [] or not any("voltage drop only" in w for w in out["warnings"])
