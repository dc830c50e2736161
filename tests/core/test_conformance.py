"""The measured-versus-expected check: IEC 60228's tables and annex, worked conformance examples.

Every IEC 60228 value below is from memory of IEC 60228:2004 (Tables 1-4, Annex B), as in
data/standards/iec60228.toml; the worked examples are our own scenarios.
"""

import math

import pytest

from conductor_atlas.core import conformance as cf
from conductor_atlas.core.calc_measured_check import calculate as calculate_measured_check
from tests.support.differential_cases import shipped_catalogue

CHECK = {"material": "IACS", "resistance": "", "temperature": "20 °C", "length": "100 m", "size": "2.5 mm2",
         "conductor_class": "2", "model": "auto"}


def run(**fields):
    return calculate_measured_check({**CHECK, **fields}, shipped_catalogue())


def value(outcome, name):
    return outcome["results"][name]["value"]


# Annex B's k_t = (β + 20)/(β + t) against the linear model with the independently published
# coefficients: α20 = 0.00393 /K for annealed copper (IEC 60028) and 0.00403 /K for 1350 aluminium
# (IEC 60889): k = 1/(1 + α20 (t − 20)). β = 234.5 means α20 = 1/254.5 = 0.0039293 (and 1/248 =
# 0.0040323 for 228), so the two differ by about |Δα|·|t − 20| (4e-5 for aluminium at 5 °C): that
# bound, with 10 % to spare, is the tolerance.
@pytest.mark.parametrize("t_c", [5.0, 10.0, 15.0, 23.5, 25.0, 30.0, 35.0])
@pytest.mark.parametrize("beta, alpha20", [(234.5, 0.00393), (228.0, 0.00403)])
def test_annex_b_factor(t_c, beta, alpha20):
    k = cf.iec60228_correction_factor(273.15 + t_c, beta)
    bound = 1.1 * abs(1.0 / (beta + 20.0) - alpha20) * abs(t_c - 20.0) + 1e-12
    assert k == pytest.approx(1.0 / (1.0 + alpha20 * (t_c - 20.0)), rel=bound)
    print(f"k_t({t_c} °C, β={beta}) = {k:.4f}")


def test_annex_b_factor_is_one_at_20_c():
    assert cf.iec60228_correction_factor(293.15, 234.5) == pytest.approx(1.0, rel=1e-15)


def test_annex_b_factor_is_the_material_model_for_iacs_copper():
    # IEC 60028: α20 = 0.00393 /K for annealed copper; Annex B's β = 234.5 means α20 = 1/254.5 =
    # 0.0039293: the two factors may differ by (0.00393 − 0.0039293)·Δt ≈ 1e-5 over 15 K.
    for t_c in (5.0, 15.0, 25.0, 35.0):
        out = run(resistance="0.7 ohm", temperature=f"{t_c} °C")
        assert value(out, "correction_factor") == pytest.approx(value(out, "annex_factor"), rel=2e-5)


def test_margin_and_deviation_arithmetic():
    assert cf.margin_to_limit(7.26, 7.41) == pytest.approx(0.15 / 7.41, rel=1e-12)
    assert cf.margin_to_limit(7.5, 7.41) < 0
    assert cf.relative_deviation(7.0, 6.896) == pytest.approx(0.104 / 6.896, rel=1e-12)
    assert cf.nominal_row([5e-7, 7.5e-7, 1e-6], 7.5e-7) == 1
    assert cf.nominal_row([5e-7, 7.5e-7, 1e-6], 8e-7) == -1


# A worked conformance example per class. Each: the IEC 60228 maximum named beside it, a measured
# R at t over L made up for the example, R20 = R_t·20-°C factor by hand with α20 = 0.00393 (IACS) or
# 0.00403 (1350), and the verdict. Tolerance 1e-9: the same arithmetic, different order.
WORKED = [
    # class, material, size, limit Ω/km (IEC 60228 table, from memory), R measured, t °C, L m, alpha
    ("1", "IACS", "1.5 mm2", 12.1, "1.205 ohm", 24.0, 100.0, 0.00393),   # Table 1, plain copper, 1.5 mm²: 12.1
    ("1", "1350", "16 mm2", 1.91, "0.1902 ohm", 18.0, 100.0, 0.00403),   # Table 1, aluminium, 16 mm²: 1.91
    ("2", "IACS", "2.5 mm2", 7.41, "0.736 ohm", 23.5, 100.0, 0.00393),   # Table 2, plain copper, 2.5 mm²: 7.41
    ("2", "tinned copper", "95 mm2", 0.195, "0.1002 ohm", 22.0, 500.0, 0.00393),  # Table 2, metal-coated, 95: 0.195
    ("2", "1350", "240 mm2", 0.125, "0.1284 ohm", 21.0, 1000.0, 0.00403),  # Table 2, aluminium, 240 mm²: 0.125
    ("5", "IACS", "1.5 mm2", 13.3, "1.345 ohm", 21.0, 100.0, 0.00393),   # Table 3, plain, 1.5 mm²: 13.3
    ("5", "tinned copper", "16 mm2", 1.24, "0.1218 ohm", 19.0, 100.0, 0.00393),  # Table 3, metal-coated, 16: 1.24
    ("6", "IACS", "0.75 mm2", 26.0, "2.66 ohm", 24.0, 100.0, 0.00393),   # Table 4, plain, 0.75 mm²: 26.0
]


@pytest.mark.parametrize("klass, material, size, limit_km, r_text, t_c, length_m, alpha", WORKED)
def test_worked_conformance_example(klass, material, size, limit_km, r_text, t_c, length_m, alpha):
    out = run(material=material, size=size, conductor_class=klass, resistance=r_text, temperature=f"{t_c} °C",
              length=f"{length_m} m")
    assert out["errors"] == {}
    assert value(out, "limit_per_km") == pytest.approx(limit_km, rel=1e-12)
    r_t = float(r_text.split()[0])
    r20_km = r_t / (1.0 + alpha * (t_c - 20.0)) / length_m * 1000.0
    assert value(out, "resistance_per_km_20") == pytest.approx(r20_km, rel=1e-9)
    margin = (limit_km - r20_km) / limit_km
    assert value(out, "verdict") == pytest.approx(margin, rel=1e-9)
    verdict = out["results"]["verdict"]["text"]
    assert verdict.startswith("PASS" if margin >= 0 else "FAIL")
    assert "Table " in verdict and "from memory" in verdict
    print(klass, material, size, verdict)


def test_the_worked_examples_cover_both_verdicts():
    outcomes = [run(material=m, size=s, conductor_class=k, resistance=r, temperature=f"{t} °C", length=f"{L} m")
                for k, m, s, _, r, t, L, _ in WORKED]
    verdicts = {o["results"]["verdict"]["text"][:4] for o in outcomes}
    assert verdicts == {"PASS", "FAIL"}


def test_awg_size_is_compared_with_the_material_without_a_verdict():
    # ASTM B258: 12 AWG nominal diameter 0.0808 in (80.8 mil) = 2.05232 mm; IACS ρ20 = 1/58 µΩ·m
    # (IEC 60028) → 5.2117 Ω/km. Same arithmetic in another order: 1e-12. ASTM B258 lists diameters, not
    # resistance limits: a "maximum" made of the nominal diameter failed a wire 0.02 % above it (0.162 Ω
    # for 100 ft at 25 °C), which the wire's product standard (ASTM B3, with its diameter tolerance) accepts.
    out = run(size="12 AWG", resistance="0.5200 ohm", conductor_class="")
    area = math.pi / 4 * (0.0808 * 0.0254) ** 2
    assert value(out, "expected_per_km") == pytest.approx(1.7241e-8 / area * 1000, rel=1e-12)
    assert "verdict" not in out["results"] and "limit_per_km" not in out["results"]
    assert any("no PASS/FAIL" in w and "ASTM B3" in w for w in out["warnings"])
    near = run(size="12 AWG", resistance="0.162 ohm", length="100 ft", temperature="25 °C", conductor_class="")
    assert "verdict" not in near["results"]
    assert near["results"]["deviation"]["text"].startswith("+0.02 %")


def test_range_is_used_for_the_expected_value():
    # copper-tinned: 97.1-98.2 %IACS (IEC 60228, as in its data file) → ρ from 1/0.982 to 1/0.971 of IACS
    # (1/58 µΩ·m, IEC 60028); 1e-9: the same arithmetic in another order
    cat = shipped_catalogue()
    rec = cat["materials"]["copper-tinned"]
    out = run(material="copper-tinned", size="12 AWG", resistance="0.53 ohm", conductor_class="")
    rho20 = rec["rho_ref"]
    area = math.pi / 4 * (0.0808 * 0.0254) ** 2
    entry = out["results"]["expected_per_km"]
    assert entry["low"] == pytest.approx(1e-6 / 58 * 100 / 98.2 / area * 1000, rel=1e-9)
    assert entry["high"] == pytest.approx(1e-6 / 58 * 100 / 97.1 / area * 1000, rel=1e-9)
    assert entry["low"] < entry["value"] < entry["high"]
    assert entry["value"] == pytest.approx(rho20 / area * 1000, rel=1e-12)


def test_range_propagation_equals_the_calculator_at_the_range_ends():
    """The low/high of the expected value equal the plain calculation with ρ set to each end."""
    cat = shipped_catalogue()
    for mid in ("copper-hard-drawn", "copper-tinned", "aluminium-6101"):
        rec = cat["materials"][mid]
        out = calculate_measured_check({**CHECK, "material": mid, "resistance": "0.7 ohm", "conductor_class": ""}, cat)
        for end, ratio in (("low", rec["rho_low_ratio"]), ("high", rec["rho_high_ratio"])):
            moved = dict(rec, rho_ref=rec["rho_ref"] * ratio, rho_low_ratio=0.0, rho_high_ratio=0.0)
            other = dict(cat, materials={**cat["materials"], mid: moved})
            plain = calculate_measured_check({**CHECK, "material": mid, "resistance": "0.7 ohm", "conductor_class": ""},
                                             other)
            assert out["results"]["expected_per_km"][end] == pytest.approx(value(plain, "expected_per_km"), rel=1e-12)


@pytest.mark.parametrize("fields, words", [
    ({"length": "0.5 m", "resistance": "3.6 mohm"}, "shorter than 1 m"),
    ({"temperature": "35 °C", "resistance": "0.76 ohm"}, "20 ± 10 °C"),
    ({"resistance": "7 ohm"}, "check the material, the length"),
])
def test_warnings_name_their_rule(fields, words):
    out = run(**fields)
    assert out["errors"] == {}
    assert any(words in w for w in out["warnings"]), out["warnings"]


@pytest.mark.parametrize("fields, field, words", [
    ({"size": "3 mm2", "resistance": "1 ohm"}, "size", "nearest: 2.5 mm² or 4 mm²"),
    ({"conductor_class": "4", "resistance": "1 ohm"}, "conductor_class", "enter 1, 2, 5 or 6"),
    ({"resistance": "", }, "resistance", "empty"),
    ({"resistance": "-1 ohm"}, "resistance", "greater than zero"),
])
def test_refusals_say_what_to_type(fields, field, words):
    out = run(**fields)
    assert out["results"] == {}
    assert words in out["errors"][field]


def test_no_column_for_a_material_outside_the_standard():
    out = run(material="copper-hard-drawn", resistance="0.71 ohm")
    assert "verdict" not in out["results"]
    assert any("has no column for Hard-drawn copper" in w for w in out["warnings"])
