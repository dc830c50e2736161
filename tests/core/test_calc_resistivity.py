"""Calculator "resistivity" and the local temperature coefficient, against the standards' numbers."""

import pytest

from conductor_atlas.core.calc_resistivity import calculate as calculate_resistivity
from conductor_atlas.core.material_models import local_temperature_coefficient
from tests.support.outcomes import result_value as value


def test_annealed_copper_at_90_degc(catalogue):
    # IEC 60028: ρ20 = 1/58 µΩ·m, α20 = 0.00393 /K; linear model: 1.7241 × (1 + 0.00393 × 70) = 2.1984 µΩ·cm
    out = calculate_resistivity({"material": "IACS", "temperature": "90 °C"}, catalogue)
    assert value(out, "resistivity") * 1e8 == pytest.approx(2.1984, abs=5e-5)
    assert value(out, "iacs_percent") == pytest.approx(100.0 / (1 + 0.00393 * 70), rel=1e-4)


def test_local_coefficient_at_20_degc_is_the_standard_alpha(catalogue):
    # the linear model's slope over ρ(20 °C) is α20 itself: 0.00393 /K (IEC 60028), exact up to rounding
    out = calculate_resistivity({"material": "IACS", "temperature": "20 °C"}, catalogue)
    assert value(out, "temperature_coefficient") == pytest.approx(0.00393, rel=1e-9, abs=0)


def test_pt385_follows_callendar_van_dusen(catalogue):
    # IEC 60751 Table 1: Pt100 is 100 Ω at 0 °C and 138.5055 Ω at 100 °C, so ρ(100 °C)/ρ(0 °C) = 1.385055
    hot = value(calculate_resistivity({"material": "Pt385", "temperature": "100 °C"}, catalogue), "resistivity")
    cold = value(calculate_resistivity({"material": "Pt385", "temperature": "0 °C"}, catalogue), "resistivity")
    assert hot / cold == pytest.approx(1.385055, abs=5e-7)


def test_no_coefficient_claimed_without_a_temperature_model(catalogue):
    # every shipped material now has a temperature model, so 304 stainless is stripped of its coefficient
    # here: with only a 20 °C value on record the calculator gives ρ there, and no α at all
    from conductor_atlas.core.ranges import catalogue_with
    record = dict(catalogue["materials"]["stainless-304"], alpha=0.0)
    stripped = catalogue_with(catalogue, record)
    out = calculate_resistivity({"material": "stainless-304", "temperature": "20 °C"}, stripped)
    assert value(out, "resistivity") > 0
    assert "temperature_coefficient" not in out["results"]
    assert local_temperature_coefficient(record, 293.15, "auto") == [None, []]
    assert calculate_resistivity({"material": "stainless-304", "temperature": "75 °C"}, stripped)["errors"][
        "temperature"].startswith("no temperature model is on record for Stainless steel 304")


def test_bad_temperature_names_the_field(catalogue):
    out = calculate_resistivity({"material": "Cu", "temperature": "5 kg"}, catalogue)
    assert "temperature" in out["errors"] and out["results"] == {}


def test_linear_model_far_below_its_span_says_what_to_type(catalogue):
    # IEC 60028's α = 0.00393 /K puts copper's linear ρ at zero near −234.5 °C, so at 4 K it has none;
    # before, the refusal named neither the model's span nor the models that do reach 4 K
    out = calculate_resistivity({"material": "Cu", "temperature": "4 K", "model": "linear"},
                                catalogue)
    message = out["errors"]["temperature"]
    assert "holds from −50.0 °C" in message and "choose the model table or bloch-gruneisen" in message
