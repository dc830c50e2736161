"""Calculator "temperature-rise" (the resistance method) against worked arithmetic.

t2 = (R2/R1)(k + t1) - k with k = 234.5 for copper and 225 for EC aluminium (IEEE Std 118 /
IEEE Std 112; IEC 60034-1 uses 235 for copper; from memory, as core/practice.py records), or
k = 1/alpha - t_ref from a material's own coefficient. Each expected value below is the
formula worked by hand; temperatures go through K and back, so agreement is to ~1e-13 K.
"""

import json
import subprocess
import sys

import pytest
from scipy.constants import zero_Celsius

from conductor_atlas.core.calc_temperature_rise import calculate as calculate_temperature_rise
from tests.support.outcomes import result_value as value

T0 = zero_Celsius  # 273.15 K, scipy.constants (the definition of the Celsius scale)


def run(catalogue, **fields):
    inputs = {"material": "IACS", "resistance_cold": "10 ohm", "temperature_cold": "20 °C",
              "resistance_hot": "12.5 ohm", "coolant": "", "k": ""}
    inputs.update(fields)
    return calculate_temperature_rise(inputs, catalogue)


def test_worked_example_copper(catalogue):
    # R1 = 10.0 ohm at 20 °C, R2 = 12.5 ohm, copper: t2 = 1.25 * 254.5 - 234.5 = 83.625 °C
    out = run(catalogue)
    assert value(out, "temperature_hot") == pytest.approx(83.625 + T0, rel=0, abs=1e-9)
    assert value(out, "temperature_rise") == pytest.approx(63.625, rel=0, abs=1e-9)
    assert value(out, "k") == 234.5
    assert out["results"]["temperature_hot"]["text"] == "83.6 °C (356.78 K)"
    assert any("234.5" in w and "IEEE Std 118" in w and "IEC 60034-1" in w for w in out["warnings"])


def test_rise_over_coolant(catalogue):
    # same winding, coolant 25 °C at the end of the test: rise = 83.625 - 25 = 58.625 K
    out = run(catalogue, coolant="25 °C")
    assert value(out, "temperature_rise") == pytest.approx(58.625, rel=0, abs=1e-9)
    assert "over the coolant" in out["results"]["temperature_rise"]["text"]


def test_milliohm_winding_with_fahrenheit(catalogue):
    # 125 mΩ at 68 °F (= 20 °C), 150 mΩ hot: t2 = 1.2 * 254.5 - 234.5 = 70.9 °C
    out = run(catalogue, resistance_cold="125 mΩ", temperature_cold="68 °F", resistance_hot="150 mohm")
    assert value(out, "temperature_hot") == pytest.approx(70.9 + T0, rel=0, abs=1e-9)


def test_ec_aluminium_uses_225(catalogue):
    # 1350: t2 = 1.25 * 245 - 225 = 81.25 °C
    out = run(catalogue, material="1350")
    assert value(out, "k") == 225.0
    assert value(out, "temperature_hot") == pytest.approx(81.25 + T0, rel=0, abs=1e-9)


@pytest.mark.parametrize("material", ["Cu", "copper-hard-drawn", "copper-oxygen-free", "tinned copper"])
def test_copper_conductors_use_234_5(catalogue, material):
    assert value(run(catalogue, material=material), "k") == 234.5


def test_standard_k_matches_the_copper_coefficient(catalogue):
    # IEC 60028 annealed copper alpha_20 = 0.00393 /K gives 1/alpha - 20 = 234.45, within 0.1 K of 234.5
    record = catalogue["materials"]["copper-annealed"]
    assert 1.0 / record["alpha"] - 20.0 == pytest.approx(234.5, rel=0, abs=0.1)


def test_other_material_uses_its_alpha(catalogue):
    # silver alpha = 0.0038 /K at 20 °C: k = 1/0.0038 - 20 = 243.157...; t2 = 1.25 (k + 20) - k
    out = run(catalogue, material="Ag")
    k = 1.0 / 0.0038 - 20.0
    assert value(out, "k") == pytest.approx(k, rel=1e-14, abs=0)
    assert value(out, "temperature_hot") == pytest.approx(1.25 * (k + 20.0) - k + T0, rel=1e-14, abs=0)
    assert any("from the temperature coefficient" in w for w in out["warnings"])


def test_clad_wire_is_not_treated_as_copper(catalogue):
    out = run(catalogue, material="cca-10")
    assert value(out, "k") == pytest.approx(1.0 / catalogue["materials"]["copper-clad-aluminium-10"]["alpha"] - 20.0,
                                            rel=1e-14, abs=0)


@pytest.mark.parametrize("k_text, k", [("235", 235.0), ("234,5", 234.5), ("-225 °C", 225.0), ("−234.5 °C", 234.5)])
def test_typed_k(catalogue, k_text, k):
    out = run(catalogue, material="", k=k_text)
    assert value(out, "k") == pytest.approx(k, rel=1e-13, abs=0)
    assert value(out, "temperature_hot") == pytest.approx(1.25 * (k + 20.0) - k + T0, rel=1e-13, abs=0)
    assert out["material"] == ""


def test_copper_k_kept_for_an_aluminium_winding_is_questioned(catalogue):
    # k = 234.5 (copper) typed for EC aluminium 1350, whose k is 225 (IEEE Std 118, IEC 60034-1):
    # the answer stays with the typed k, t2 = 1.25 * 254.5 - 234.5 = 83.625 °C, and the note gives the
    # material's: 1.25 * 245 - 225 = 81.25 °C, 2.375 K lower (both by hand)
    out = run(catalogue, material="1350", k="234.5")
    assert value(out, "temperature_hot") == pytest.approx(83.625 + T0, rel=0, abs=1e-9)
    notes = [w for w in out["warnings"] if "the k entered is not the k of" in w]
    assert len(notes) == 1, out["warnings"]
    assert "225 (IEEE Std 118, IEC 60034-1)" in notes[0]
    assert "81.3 °C" in notes[0] and "2.4 K lower" in notes[0]


def test_aluminium_k_typed_for_copper_says_higher(catalogue):
    # k = 225 typed for copper (234.5): 81.25 °C typed against 83.625 °C, 2.4 K higher
    notes = [w for w in run(catalogue, material="IACS", k="225")["warnings"] if "the k entered is not the k of" in w]
    assert len(notes) == 1 and "83.6 °C" in notes[0] and "2.4 K higher" in notes[0], notes


@pytest.mark.parametrize("material, k_text", [("IACS", "235"), ("IACS", "234.5"), ("1350", "225"), ("", "225")])
def test_a_k_within_rounding_or_without_material_passes_quietly(catalogue, material, k_text):
    # IEC 60034-1 rounds copper's 234.5 to 235 (0.2 %): no note; nor when no material is named
    out = run(catalogue, material=material, k=k_text)
    assert not any("the k entered is not the k of" in w for w in out["warnings"]), out["warnings"]


def test_a_typed_k_far_from_another_materials_alpha_points_to_its_own_data(catalogue):
    # silver: 1/α − t_ref = 1/0.0038 − 20 = 243.16 against a typed 100: no standard k to compare
    # temperatures with, so the note says to leave k empty (the material's own ρ(T) is used then)
    notes = [w for w in run(catalogue, material="Ag", k="100")["warnings"] if "the k entered is not the k of" in w]
    assert len(notes) == 1 and "243.16" in notes[0] and "leave k empty" in notes[0], notes


def test_resistance_alloy_warns(catalogue):
    out = run(catalogue, material="cu-ni-55-45", resistance_hot="10.01 ohm")
    assert any("changes little with temperature" in w for w in out["warnings"])


@pytest.mark.parametrize("fields, field, words", [
    ({"material": "", "k": ""}, "material", "or enter k"),
    ({"material": "coper"}, "material", "unknown material"),
    ({"material": "cu-mn-ni"}, "material", "no positive temperature coefficient"),
    ({"k": "234.5 K"}, "k", "in kelvin is ambiguous"),
    ({"k": "20 °C"}, "k", "must lie below 0 °C"),
    ({"k": "0"}, "k", "must be above 0"),
    ({"k": "abc"}, "k", "expected a number first"),
    ({"resistance_cold": "0 ohm"}, "resistance_cold", "greater than zero"),
    ({"resistance_cold": "10"}, "resistance_cold", "needs a unit"),
    ({"resistance_hot": "12 V"}, "resistance_hot", "is a voltage"),
    ({"temperature_cold": ""}, "temperature_cold", "is empty"),
    ({"temperature_cold": "-260 °C"}, "temperature_cold", "below the inferred zero"),
    ({"coolant": "-300 °C"}, "coolant", "absolute zero"),
])
def test_bad_input_names_the_field(catalogue, fields, field, words):
    out = run(catalogue, **fields)
    assert field in out["errors"], out["errors"]
    assert words in out["errors"][field]
    if field == "coolant":  # an optional field that feeds only the rise (SIDE_FIELDS)
        assert "temperature_rise" not in out["results"] and "temperature_hot" in out["results"]
    else:
        assert out["results"] == {}


def test_command_line_json():
    result = subprocess.run([sys.executable, "-m", "conductor_atlas", "calc", "temperature-rise", "--material", "Cu",
                             "--resistance-cold", "10 ohm", "--temperature-cold", "20 degC",
                             "--resistance-hot", "12.5 ohm", "--json"], capture_output=True, text=True)
    assert result.returncode == 0, result.stderr
    payload = json.loads(result.stdout)
    assert payload["results"]["temperature_hot"]["value"] == pytest.approx(356.775, rel=0, abs=1e-9)
    bad = subprocess.run([sys.executable, "-m", "conductor_atlas", "calc", "temperature-rise", "--k", "234.5 K"],
                         capture_output=True, text=True)
    assert bad.returncode == 1
    assert "--k: in kelvin is ambiguous" in bad.stderr
    assert "Traceback" not in bad.stderr


# --- a material whose ρ(T) is not linear over the span: its own model, inverted (core.winding_temperature)

# Nickel's resistivity table as the data file records it (CRC Handbook, "Electrical resistivity of pure
# metals", row Ni, from memory): T [K] -> ρ [µΩ·cm]
NICKEL_CRC = [(293, 6.93), (298, 7.12), (300, 7.2), (400, 11.8), (500, 17.7), (600, 25.5), (700, 32.1), (800, 35.5),
              (900, 38.6)]


def test_nickel_far_above_its_linear_span_reads_its_table(catalogue):
    """Before: R2/R1 = 3 from 20 °C read 377.1 °C by k = 1/α − 20 (α = 0.0056 /K, the slope at 20 °C), while
    nickel's own table puts that ratio near 267 °C (the table bends below the Curie point, 627 K).
    Expected by hand with numpy's piecewise-linear interpolation of the CRC points (the model is piecewise
    linear too, so agreement is to the bisection's 1e-7 K)."""
    import numpy as np
    temps, rhos = zip(*NICKEL_CRC)
    start = np.interp(T0 + 20.0, temps, rhos)
    expected = np.interp(3.0 * start, rhos, temps)      # ρ rises with T here, so the table inverts
    assert expected == pytest.approx(539.83, abs=0.01)
    out = run(catalogue, material="Ni", resistance_cold="1 ohm", resistance_hot="3 ohm")
    assert value(out, "temperature_hot") == pytest.approx(expected, rel=0, abs=1e-6)
    assert "k" not in out["results"]
    assert "table" in out["model"] and "ρ(t2) = (R2/R1) ρ(t1)" in out["model"]
    assert any("would give 377.1 °C" in w for w in out["warnings"])  # the linear method, shown beside it


def test_a_platinum_sensor_reads_the_iec_60751_curve(catalogue):
    """IEC 60751 Table 1 (from memory): a Pt100 reads 138.5055 Ω at 100 °C over 100 Ω at 0 °C."""
    out = run(catalogue, material="Pt385", resistance_cold="100 ohm", temperature_cold="0 °C",
              resistance_hot="138.5055 ohm")
    assert value(out, "temperature_hot") == pytest.approx(T0 + 100.0, rel=0, abs=1e-3)
    assert "Callendar" in out["model"]


def test_inside_the_linear_span_the_k_method_stays(catalogue):
    # nickel, R2/R1 = 1.3: k = 1/0.0056 − 20 = 158.571 -> t2 = 1.3 · 178.571 − 158.571 = 73.571 °C, inside −50..150 °C
    out = run(catalogue, material="Ni", resistance_cold="1 ohm", resistance_hot="1.3 ohm")
    k = 1.0 / 0.0056 - 20.0
    assert value(out, "k") == pytest.approx(k, rel=1e-12)
    assert value(out, "temperature_hot") == pytest.approx(1.3 * (k + 20.0) - k + T0, rel=1e-12)


def test_beyond_the_table_it_falls_back_and_says_so(catalogue):
    # nickel's table ends at 900 K (38.6 µΩ·cm, 5.6 times its 20 °C value): R2/R1 = 7 cannot be read from it
    out = run(catalogue, material="Ni", resistance_cold="1 ohm", resistance_hot="7 ohm")
    assert any("beyond the span" in w and "extrapolation" in w for w in out["warnings"])
    assert "k" in out["results"]


@pytest.mark.parametrize("material, r2", [("cu-ni-55-45", "13 ohm"), ("", "300 ohm")])
def test_a_ratio_no_solid_winding_can_reach_is_refused(catalogue, material, r2):
    """Before: a resistance alloy (α 1e-5 /K) with R2/R1 = 1.3 read 30 020 °C. Above tungsten's melting point
    (3422 °C, the highest of the metals; CRC Handbook, from memory) no winding is solid: refused under R2."""
    out = run(catalogue, material=material, k="234.5" if material == "" else "", resistance_cold="10 ohm",
              resistance_hot=r2)
    assert "melting point" in out["errors"]["resistance_hot"]
    assert out["results"] == {}


@pytest.mark.parametrize("material, k, t1, limit", [
    ("Ni", "", "1500 °C", "1454.9 °C"),  # nickel: 1728 K in data/materials/nickel.toml (CRC Handbook, from memory)
    ("", "234.5", "4000 °C", "3422.0 °C"),  # no material: tungsten's 3422 °C, the highest of the metals (CRC, from memory)
])
def test_a_cold_temperature_above_melting_is_refused_under_that_field(catalogue, material, k, t1, limit):
    """Before: nickel with t1 = 1500 °C was refused under R2 ("would put the winding at ... °C"), which
    sent the user to the wrong field; the mistake is the cold temperature."""
    out = run(catalogue, material=material, k=k, temperature_cold=t1, resistance_cold="1 ohm",
              resistance_hot="1 ohm")
    assert "melting point" in out["errors"]["temperature_cold"]
    assert limit in out["errors"]["temperature_cold"]
    assert "resistance_hot" not in out["errors"]
    assert out["results"] == {}
