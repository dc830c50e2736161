"""Calculator "carriers" against textbook free-electron tables and independent arithmetic.

References: Ashcroft, N. W., Mermin, N. D., Solid State Physics, 1976, Table 2.1 (free-electron
Fermi energies, wave numbers and velocities, printed to 3 figures) and Table 1.3 (Drude relaxation
times, 2 figures); CRC Handbook thermal conductivity of copper (the material's own record);
CODATA constants from scipy.constants for the arithmetic checks (the core uses CODATA 2018, scipy
1.17 CODATA 2022: e, h, k, N_A are exact in both; m_e differs by 1.4e-9 relative, epsilon_0 by 6.8e-10).
"""

import math

import pytest
from scipy import constants

from conductor_atlas.core.calc_carriers import SIDE_FIELDS, calculate as calculate_carriers
from tests.support.outcomes import result_value as value

ME_REL = 3e-9  # m_e (1.4e-9) and epsilon_0 (6.8e-10) differ between CODATA 2018 and 2022


def test_copper_against_ashcroft_mermin_table_2_1(catalogue):
    out = calculate_carriers({"material": "Cu"}, catalogue)
    assert value(out, "electron_density") == 8.47e28  # A&M Table 1.1: 8.47e22 cm^-3 (the record's value)
    # Table 2.1, Cu: E_F = 7.00 eV, k_F = 1.36e8 /cm, v_F = 1.57e8 cm/s (3 figures -> 0.5 %)
    assert value(out, "fermi_energy") / constants.e == pytest.approx(7.00, rel=5e-3, abs=0)
    assert value(out, "fermi_wavenumber") == pytest.approx(1.36e10, rel=5e-3, abs=0)
    assert value(out, "fermi_velocity") == pytest.approx(1.57e6, rel=5e-3, abs=0)
    assert out["results"]["fermi_energy"]["text"] == "7.033 eV"


def test_copper_relaxation_time_at_0_degc(catalogue):
    # A&M Table 1.3: Cu tau = 2.7e-14 s at 273 K (2 figures -> 3 %)
    out = calculate_carriers({"material": "Cu", "temperature": "0 °C"}, catalogue)
    assert value(out, "relaxation_time") == pytest.approx(2.7e-14, rel=0.03, abs=0)


def test_arithmetic_of_every_result(catalogue):
    out = calculate_carriers({"material": "Cu", "current": "10 A", "size": "1 mm2"}, catalogue)
    n = 8.47e28
    rho = value(out, "resistivity")
    e, me, hbar = constants.e, constants.m_e, constants.hbar
    tau = me / (n * e * e * rho)
    kf = (3 * math.pi ** 2 * n) ** (1 / 3)
    assert value(out, "relaxation_time") == pytest.approx(tau, rel=ME_REL, abs=0)
    assert value(out, "fermi_wavenumber") == pytest.approx(kf, rel=1e-14, abs=0)
    assert value(out, "fermi_velocity") == pytest.approx(hbar * kf / me, rel=ME_REL, abs=0)
    assert value(out, "mean_free_path") == pytest.approx(hbar * kf / me * tau, rel=ME_REL, abs=0)
    assert value(out, "mobility") == pytest.approx(e * tau / me, rel=ME_REL, abs=0)
    assert value(out, "rho_lambda") == pytest.approx(hbar * kf / (n * e * e), rel=1e-14, abs=0)
    # J = 10 A / 1 mm² = 1e7 A/m², v_d = J / (n e) = 0.737 mm/s
    assert value(out, "current_density") == pytest.approx(1e7, rel=1e-15, abs=0)
    assert value(out, "drift_velocity") == pytest.approx(1e7 / (n * e), rel=1e-14, abs=0)
    assert value(out, "drift_velocity") == pytest.approx(7.37e-4, rel=1e-3, abs=0)
    omega_p = math.sqrt(n * e * e / (constants.epsilon_0 * me))
    assert value(out, "plasma_frequency") == pytest.approx(omega_p / (2 * math.pi), rel=ME_REL, abs=0)
    lorenz = math.pi ** 2 / 3 * (constants.k / e) ** 2
    assert value(out, "thermal_conductivity_wf") == pytest.approx(lorenz * 293.15 / rho, rel=1e-14, abs=0)


def test_wiedemann_franz_near_the_measured_conductivity(catalogue):
    # Cu at 20 °C: the record's thermal conductivity 401 W/(m·K) (CRC); Wiedemann-Franz with L0 gives
    # 6 % more (A&M Table 2.2 shows measured L of Cu at 273 K 2.23e-8, 9 % below L0) -> within 10 %
    out = calculate_carriers({"material": "Cu"}, catalogue)
    measured = catalogue["materials"]["copper"]["thermal_conductivity"]
    assert value(out, "thermal_conductivity_wf") == pytest.approx(measured, rel=0.10, abs=0)
    assert value(out, "thermal_conductivity_wf") > measured


def test_current_density_field(catalogue):
    out = calculate_carriers({"material": "Ag", "current_density": "4 A/mm2"}, catalogue)
    n = catalogue["materials"]["silver"]["electron_density"]
    assert value(out, "drift_velocity") == pytest.approx(4e6 / (n * constants.e), rel=1e-14, abs=0)


def test_low_temperature_warns_about_wiedemann_franz(catalogue):
    out = calculate_carriers({"material": "Cu", "temperature": "77 K"}, catalogue)
    assert any("Wiedemann–Franz" in w for w in out["warnings"])
    warm = calculate_carriers({"material": "Cu", "temperature": "20 °C"}, catalogue)
    assert value(out, "mean_free_path") > 5 * value(warm, "mean_free_path")  # ρ(77 K) is ~1/8 of ρ(293 K)


@pytest.mark.parametrize("inputs, field, words", [
    ({"material": "IACS"}, "material", "no conduction-electron density is on record for Standard annealed copper"),
    ({"material": "W"}, "material", "no conduction-electron density is on record for Tungsten"),
    ({"material": "xx"}, "material", "unknown material"),
    ({"current": "10 A"}, "size", "needs a cross-section"),
    ({"current": "10 A", "current_density": "1 A/mm2"}, "current", "not both"),
    ({"current_density": "-1 A/mm2"}, "current_density", "must not be negative"),
    ({"current_density": "5 A"}, "current_density", "is a current"),
    ({"current": "-1 A", "size": "1 mm2"}, "current", "must not be negative"),
    ({"temperature": "0 K"}, "temperature", "above absolute zero"),
])
def test_bad_input_names_the_field(catalogue, inputs, field, words):
    base = {"material": "Cu"}
    base.update(inputs)
    out = calculate_carriers(base, catalogue)
    assert field in out["errors"], out["errors"]
    assert words in out["errors"][field]
    if field in SIDE_FIELDS:
        # a bad current, current density or size drops only what needs it: n, τ and ℓ stay
        assert not set(out["results"]) & set(SIDE_FIELDS[field]), out["results"]
        assert "electron_density" in out["results"]
    else:
        assert out["results"] == {}
