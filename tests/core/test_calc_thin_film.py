"""Calculator "thin-film" against scipy.integrate on the printed integrals and their limits.

References: Sondheimer, E. H., Adv. Phys. 1, 1 (1952), eq. 9 (Fuchs-Sondheimer) and its
thick-film limit eq. 11; Mayadas, A. F., Shatzkes, M., Phys. Rev. B 1, 1382 (1970), eq. 5 and 10.
The quad references are those of tests/core/test_size_effect.py (the printed forms).
"""

import pytest

from conductor_atlas.core.calc_resistivity import calculate as calculate_resistivity
from conductor_atlas.core.calc_thin_film import calculate as calculate_thin_film
from tests.core.test_size_effect import _combined_reference, _fs_reference
from tests.support.outcomes import result_value as value


def test_fuchs_sondheimer_with_a_typed_mean_free_path(catalogue):
    # d = l = 39 nm -> kappa = 1; the core agrees with quad to ~1e-13 (test_size_effect) -> 1e-11
    out = calculate_thin_film({"material": "film-copper", "thickness": "39 nm", "mean_free_path": "39 nm",
                               "specularity": "0"}, catalogue)
    ratio = _fs_reference(1.0, 0.0)
    assert value(out, "thickness_ratio") == pytest.approx(1.0, rel=1e-15, abs=0)
    assert value(out, "film_ratio") == pytest.approx(ratio, rel=1e-11, abs=0)
    rho = value(out, "resistivity")
    assert value(out, "film_resistivity") == pytest.approx(rho * ratio, rel=1e-11, abs=0)
    assert value(out, "sheet_resistance") == pytest.approx(rho * ratio / 39e-9, rel=1e-11, abs=0)
    assert "grain_parameter" not in out["results"]


def test_specularity_as_percent(catalogue):
    out = calculate_thin_film({"material": "film-copper", "thickness": "10 nm", "mean_free_path": "40 nm",
                               "specularity": "50 %"}, catalogue)
    assert value(out, "film_ratio") == pytest.approx(_fs_reference(0.25, 0.5), rel=1e-11, abs=0)


def test_thick_film_limit(catalogue):
    # Sondheimer eq. 11: 1 + 3/(8 kappa); error O(kappa^-2), at kappa = 1000 measured 1.4e-7 -> 2e-7
    out = calculate_thin_film({"material": "film-copper", "thickness": "40 um", "mean_free_path": "40 nm"}, catalogue)
    assert value(out, "film_ratio") == pytest.approx(1 + 3 / 8000, rel=2e-7, abs=0)


def test_grain_boundaries_default_grain_size(catalogue):
    # D = d = 20 nm, l = 40 nm, R = 0.3: alpha = (l/D) R/(1-R) = 6/7 (MS eq. 5); kappa = 0.5;
    # nested quad on MS eq. 10 agrees with the core to 1.1e-12 (test_size_effect) -> 1e-10
    out = calculate_thin_film({"material": "film-copper", "thickness": "20 nm", "mean_free_path": "40 nm",
                               "reflection": "0.3"}, catalogue)
    alpha = 2.0 * 0.3 / 0.7
    assert value(out, "grain_parameter") == pytest.approx(alpha, rel=1e-15, abs=0)
    assert value(out, "film_ratio") == pytest.approx(_combined_reference(0.5, 0.0, alpha), rel=1e-10, abs=0)
    assert any("grain size taken equal to the film thickness" in w for w in out["warnings"])


def test_grain_size_given(catalogue):
    out = calculate_thin_film({"material": "film-copper", "thickness": "40 nm", "mean_free_path": "40 nm",
                               "reflection": "0.5", "grain_size": "20 nm", "specularity": "0.5"}, catalogue)
    assert value(out, "grain_parameter") == pytest.approx(2.0, rel=1e-15, abs=0)
    assert value(out, "film_ratio") == pytest.approx(_combined_reference(1.0, 0.5, 2.0), rel=1e-10, abs=0)
    assert not any("grain size taken equal" in w for w in out["warnings"])


def test_record_mean_free_path_scaled_with_rho_lambda(catalogue):
    # film-copper carries l = 39.9 nm at 295 K (Gall 2016); at 77 K l = 39.9 nm * rho(295 K) / rho(77 K)
    record = catalogue["materials"]["film-copper"]
    out = calculate_thin_film({"material": "film-copper", "thickness": "100 nm", "temperature": "77 K"}, catalogue)
    rho_295 = calculate_resistivity({"material": "film-copper", "temperature": "295 K"}, catalogue)
    rho_77 = calculate_resistivity({"material": "film-copper", "temperature": "77 K"}, catalogue)
    expected = record["mean_free_path"] * rho_295["results"]["resistivity"]["value"] / \
        rho_77["results"]["resistivity"]["value"]
    assert value(out, "mean_free_path") == pytest.approx(expected, rel=1e-14, abs=0)
    assert any("ρ·ℓ held constant" in w for w in out["warnings"])


def test_record_mean_free_path_unscaled_when_no_model_reaches_its_temperature(catalogue):
    # a copy of film-copper whose l is dated 2 K, where its linear ρ(T) gives ρ <= 0 (a CoreError):
    # no ρ·ℓ scaling is possible, so the recorded l is used as it stands, with a warning
    import copy
    edited = copy.deepcopy(catalogue)
    record = edited["materials"]["film-copper"]
    record["mean_free_path_t"] = 2.0
    out = calculate_thin_film({"material": "film-copper", "thickness": "20 nm"}, edited)
    assert value(out, "mean_free_path") == record["mean_free_path"]
    assert any("is used unscaled: no resistivity model reaches that temperature" in w for w in out["warnings"])
    assert not any("held constant" in w for w in out["warnings"])


def test_free_electron_mean_free_path_when_none_is_recorded(catalogue):
    out = calculate_thin_film({"material": "Na", "thickness": "50 nm"}, catalogue)
    assert value(out, "mean_free_path") > 0
    assert any("free-electron value" in w for w in out["warnings"])


def test_thinner_is_worse(catalogue):
    ratios = [value(calculate_thin_film({"material": "film-copper", "thickness": d}, catalogue), "film_ratio")
              for d in ("5 nm", "20 nm", "100 nm", "1 um")]
    assert ratios == sorted(ratios, reverse=True)
    assert ratios[-1] > 1.0


@pytest.mark.parametrize("inputs, field, words", [
    ({"specularity": "1"}, "specularity", "at least 0 and below 1"),
    ({"specularity": "-0.1"}, "specularity", "at least 0 and below 1"),
    ({"reflection": "1.5"}, "reflection", "at least 0 and below 1"),
    ({"thickness": "-1 nm"}, "thickness", "greater than zero"),
    ({"thickness": ""}, "thickness", "is empty"),
    ({"thickness": "20 A"}, "thickness", "is a current"),
    ({"grain_size": "0 nm", "reflection": "0.3"}, "grain_size", "greater than zero"),
    ({"mean_free_path": "-3 nm"}, "mean_free_path", "greater than zero"),
    ({"material": "titanium"}, "mean_free_path", "no mean free path is on record for Titanium (high purity)"),
    ({"thickness": "1e-300 m"}, "thickness", "thinner than one atomic layer"),
    ({"thickness": "0.05 nm"}, "thickness", "thinner than one atomic layer"),
    ({"thickness": "1e308 km"}, "thickness", "too large"),
    ({"thickness": "1 nm", "mean_free_path": "1 m"}, "mean_free_path", "is below 1×10⁻⁶"),
])
def test_bad_input_names_the_field(catalogue, inputs, field, words):
    base = {"material": "film-copper", "thickness": "20 nm"}
    base.update(inputs)
    out = calculate_thin_film(base, catalogue)
    assert field in out["errors"], out["errors"]
    assert words in out["errors"][field]
    assert out["results"] == {}


@pytest.mark.parametrize("thickness, cautioned", [("0.3 nm", True), ("4.9 nm", True), ("5 nm", False), ("20 nm", False)])
def test_a_film_a_few_atomic_layers_thick_is_cautioned(catalogue, thickness, cautioned):
    """Before: a 0.3 nm copper film read 56.3 µΩ·cm with no caution beyond the mean free path's scaling. Below
    about 5 nm roughness, continuity and quantum confinement set ρ (common practice (no source); the methods
    page says the same)."""
    out = calculate_thin_film({"material": "Cu", "thickness": thickness}, catalogue)
    assert out["errors"] == {}
    assert any("few atomic layers" in w for w in out["warnings"]) == cautioned


def test_a_film_with_only_the_linear_model_gives_its_span_at_4_k(catalogue):
    # film-copper carries only a temperature coefficient: at 4 K the refusal gives the span to type in
    out = calculate_thin_film({"material": "film-copper", "thickness": "20 nm", "temperature": "4 K"}, catalogue)
    message = out["errors"]["temperature"]
    assert "holds from −50.0 °C (223.15 K) to 200.0 °C (473.15 K)" in message
    assert "enter a temperature in that span" in message


def test_a_grain_smaller_than_an_atomic_layer_is_questioned(catalogue):
    # copper's (111) layer spacing is 0.209 nm (a = 0.3615 nm, Kittel ch. 1): a 0.1 nm grain is no grain
    fields = {"material": "film-copper", "thickness": "20 nm", "reflection": "0.3"}
    small = calculate_thin_film({**fields, "grain_size": "0.1 nm"}, catalogue)
    assert any("smaller than one atomic layer" in w and "check the unit" in w for w in small["warnings"])
    usual = calculate_thin_film({**fields, "grain_size": "30 nm"}, catalogue)
    assert not any("atomic layer" in w for w in usual["warnings"])
