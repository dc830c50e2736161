"""The exact two-layer round conductor (core.layered_round) against scipy.special, its own limits,
the filament solver and an independent finite-element solution; and clad wire in the calculators.

Outside references: scipy.special's Kelvin functions (ker, kei, kerp, keip: Zhang & Jin's
algorithms) and its complex modified Bessel function kve (AMOS); the FEM reference of
tests/support/fem_reference.py (scikit-fem, second-order elements on the radius).
"""

import math

import numpy as np
import pytest
import scipy.special as sp
from scipy.constants import mu_0

from conductor_atlas.core.calc_resistance import calculate as calculate_resistance
from conductor_atlas.core.calc_skin_effect import calculate as calculate_skin_effect
from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.filament_solver import round_layers_solution
from conductor_atlas.core.layered_round import (core_radius_for_cladding_share, kelvin_k_scaled,
                                                layered_round_dc_resistance, layered_round_impedance,
                                                layered_round_resistance_ratio)
from conductor_atlas.core.material_models import resistivity_at
from conductor_atlas.core.skin_effect import kelvin_resistance_ratio, round_wire_resistance_ratio

RHO_CU = 1.7241e-8  # annealed copper at 20 °C, IEC 60028 (100 % IACS), ohm m
RHO_CU_HD = RHO_CU / 0.97  # hard-drawn copper, 97 %IACS (IEC 60028 / ASTM B1, from memory)
RHO_STEEL = 14.2e-8  # AISI 1008 at 20 °C, ASM Handbook vol. 1 (from memory, as in the data set)
RHO_AL = 1.7241e-8 / 0.618  # 1350-O, 61.8 %IACS (ASTM B609, from memory, as in the data set)


def value(out, key):
    return out["results"][key]["value"]


def scipy_kelvin_k_scaled(x):
    """[ker, kei, ker', kei'] exp(x/sqrt 2) from scipy: ker etc. below x = 5, above from kve (K_nu(z) e^z,
    AMOS) at z = x e^(i pi/4), with ker' + i kei' = -e^(i pi/4) K1 (DLMF 10.61.4). (scipy's ker family
    drifts to 2e-11 of the envelope near x = 8, where kve stays at 1e-15: see the test below.)"""
    if x < 5.0:
        e = math.exp(x / math.sqrt(2.0))
        return [sp.ker(x) * e, sp.kei(x) * e, sp.kerp(x) * e, sp.keip(x) * e]
    z = x * np.exp(1j * np.pi / 4)
    k0 = sp.kve(0, z) * np.exp(-1j * z.imag)
    d = -np.exp(1j * np.pi / 4) * sp.kve(1, z) * np.exp(-1j * z.imag)
    return [k0.real, k0.imag, d.real, d.imag]


@pytest.mark.parametrize("x", [1e-4, 1e-3, 0.01, 0.1, 0.5, 1.0, 2.0, 3.7, 5.0, 8.0, 12.0, 16.0, 19.9, 20.0,
                               35.0, 100.0, 1000.0, 1e4])
def test_kelvin_k_matches_scipy(x):
    # tolerance: 2e-13 of the largest of the four values (the envelope); measured worst 4.6e-14 (x = 3000
    # against kve, where the phase x/sqrt 2 cosh t rounds at 1e-13); an oscillating function near a zero
    # can only be compared on its envelope's scale
    ours = kelvin_k_scaled(x)
    ref = scipy_kelvin_k_scaled(x)
    scale = max(abs(r) for r in ref)
    for a, b in zip(ours, ref):
        assert abs(a - b) <= 2e-13 * scale


@pytest.mark.parametrize("x", [5.0, 8.0, 12.0, 19.0])
def test_scipy_ker_family_and_kve_agree(x):
    # the two scipy routes to the same functions agree to 1e-10 of the envelope (so the switch above is
    # a choice of the more accurate one, not of a different function)
    e = math.exp(x / math.sqrt(2.0))
    direct = [sp.ker(x) * e, sp.kei(x) * e, sp.kerp(x) * e, sp.keip(x) * e]
    z = x * np.exp(1j * np.pi / 4)
    k0 = sp.kve(0, z) * np.exp(-1j * z.imag)
    d = -np.exp(1j * np.pi / 4) * sp.kve(1, z) * np.exp(-1j * z.imag)
    for a, b in zip(direct, [k0.real, k0.imag, d.real, d.imag]):
        assert abs(a - b) <= 1e-10 * max(abs(v) for v in direct)


def test_kelvin_k_refuses_zero_and_nan():
    for x in (0.0, 1e-101, -1.0, float("nan"), float("inf")):
        with pytest.raises(CoreError):
            kelvin_k_scaled(x)


@pytest.mark.parametrize("f", [50.0, 1e3, 1e5, 1e6, 1e8, 1e10])
@pytest.mark.parametrize("core", [0.0, 1e-4, 0.35e-3, 0.5e-3])
def test_equal_layers_are_the_homogeneous_kelvin_wire(f, core):
    # the check: both layers equal -> the exact Kelvin ratio (Ramo, Whinnery & Van Duzer 1994,
    # sec. 5.6); the algebra is exact, so only rounding is left (measured 4e-16)
    ratio = layered_round_resistance_ratio(core, 0.5e-3, RHO_CU, 1.0, RHO_CU, 1.0, f)
    assert ratio == pytest.approx(round_wire_resistance_ratio(0.5e-3, RHO_CU, f), rel=1e-12)


def test_magnetic_equal_layers_are_the_magnetic_kelvin_wire():
    ratio = layered_round_resistance_ratio(3e-3, 5e-3, RHO_STEEL, 200.0, RHO_STEEL, 200.0, 50.0)
    assert ratio == pytest.approx(round_wire_resistance_ratio(5e-3, RHO_STEEL, 50.0, 200.0), rel=1e-12)


def test_internal_reactance_of_a_thin_wire_is_mu0_over_8pi():
    # low-frequency internal inductance of a round wire: mu_0 / (8 pi) per metre (Ramo et al. 1994, sec. 5.6)
    f = 10.0
    z = layered_round_impedance(0.2e-3, 0.5e-3, RHO_CU, 1.0, RHO_CU, 1.0, f)
    assert z[1] / (2 * math.pi * f) == pytest.approx(mu_0 / (8 * math.pi), rel=1e-6)


def test_dc_limit_is_the_layers_in_parallel():
    # at low frequency the current divides by conductance: R -> 1 / sum(A_k / rho_k); x^4-small correction
    r = layered_round_impedance(0.4e-3, 0.5e-3, RHO_STEEL, 200.0, RHO_CU_HD, 1.0, 1e-3)[0]
    g = math.pi * 0.4e-3 ** 2 / RHO_STEEL + math.pi * (0.5e-3 ** 2 - 0.4e-3 ** 2) / RHO_CU_HD
    assert r == pytest.approx(1.0 / g, rel=1e-12)
    assert layered_round_dc_resistance(0.4e-3, 0.5e-3, RHO_STEEL, RHO_CU_HD) == pytest.approx(1.0 / g, rel=1e-15)


@pytest.mark.parametrize("f", [1e8, 1e9, 1e10])
def test_thick_cladding_is_the_copper_wire(f):
    # the copper-tube limit: once the cladding is many skin depths thick (90 um; copper's delta is 6.7 um at
    # 100 MHz) the core carries nothing and the resistance is that of a solid copper wire of the same radius;
    # the core's share falls like exp(-2 t / delta) = 1e-12 at 100 MHz
    a = 0.5e-3
    b = core_radius_for_cladding_share(a, 0.328)
    r = layered_round_impedance(b, a, RHO_STEEL, 200.0, RHO_CU_HD, 1.0, f)[0]
    solid = round_wire_resistance_ratio(a, RHO_CU_HD, f) * RHO_CU_HD / (math.pi * a * a)
    assert r == pytest.approx(solid, rel=1e-11)
    # and both approach the surface-resistance form rho / (2 pi a delta) (Ramo et al. 1994, eq. 5.6(13))
    delta = math.sqrt(RHO_CU_HD / (math.pi * f * mu_0))
    assert r == pytest.approx(RHO_CU_HD / (2 * math.pi * a * delta), rel=0.6 * delta / a + 1e-9)


@pytest.mark.parametrize("f", [1e3, 1e5, 1e6, 1e7, 1e8])
def test_clad_aluminium_matches_the_filament_rings(f):
    # the check: the exact solution against the filament solver (rings, core.filament_solver) for
    # copper-clad aluminium (mu_r = 1); the ring solver converges to 0.1 %, so 0.2 % is the tolerance
    a = 0.8e-3
    b = core_radius_for_cladding_share(a, 0.10)
    exact = layered_round_resistance_ratio(b, a, RHO_AL, 1.0, RHO_CU, 1.0, f)
    rings = round_layers_solution([[b, RHO_AL], [a, RHO_CU]], f)
    assert exact == pytest.approx(rings["ratio"], rel=2e-3)


@pytest.mark.fem
@pytest.mark.parametrize("f", [50.0, 6e4, 1e6, 1e7])
def test_copper_clad_steel_matches_fem(f):
    # the independent 1-D axisymmetric FEM (tests/support/fem_reference.py): CCS 40 % 1 mm, steel core
    # mu_r 200; measured agreement 2e-7 at 1 MHz, 6e-7 at 10 MHz; tolerance 1e-5 (the FEM's mesh error)
    from tests.support.fem_reference import layered_round_ac_ratio
    a = 0.5e-3
    b = core_radius_for_cladding_share(a, 0.328)
    exact = layered_round_resistance_ratio(b, a, RHO_STEEL, 200.0, RHO_CU_HD, 1.0, f)
    fem = layered_round_ac_ratio([(b, RHO_STEEL, 200.0), (a, RHO_CU_HD, 1.0)], f)["ratio"]
    assert exact == pytest.approx(fem, rel=1e-5)


def test_a_vanishing_wire_is_dc_not_an_overflow():
    # found by the calculator fuzz: a 1e-308 mm2 clad wire overflowed the integration range
    assert layered_round_resistance_ratio(1e-160, 1.1e-160, RHO_STEEL, 200.0, RHO_CU, 1.0, 50.0) == 1.0
    assert kelvin_k_scaled(1e-100)[0] == pytest.approx(sp.ker(1e-100), rel=1e-13)


def test_refuses_a_core_larger_than_the_wire():
    with pytest.raises(CoreError):
        layered_round_impedance(2e-3, 1e-3, RHO_STEEL, 200.0, RHO_CU, 1.0, 50.0)
    with pytest.raises(CoreError):
        core_radius_for_cladding_share(1e-3, 1.5)


# ---- clad wire in the calculators (the shipped data set)

CLAD = ["copper-clad-steel-40", "copper-clad-steel-30", "copper-clad-aluminium-10", "copper-clad-aluminium-15"]


@pytest.mark.parametrize("material", CLAD)
def test_layer_shares_give_the_grade_conductivity(catalogue, material):
    # the recorded cladding share with the layers' own 20 °C resistivities reproduces the grade's %IACS
    # (ASTM B227 grades 30/40, ASTM B566 classes 10A/15A) by the parallel rule of mixtures within 0.2 %
    # (the shares are rounded to three decimals)
    m = catalogue["materials"][material]
    t = 293.15
    share = m["layer_share"]
    core = resistivity_at(m["layer_core"], t, "auto")["rho"]
    clad = resistivity_at(m["layer_cladding"], t, "auto")["rho"]
    mixture = 1.0 / (share / clad + (1.0 - share) / core)
    assert mixture == pytest.approx(resistivity_at(m, t, "auto")["rho"], rel=2e-3)


def test_ccs_at_one_megahertz_is_the_two_layer_answer(catalogue):
    # the finding: CCS 40 % 1 mm at 1 MHz was 146.1 mOhm/m by the averaged resistivity; the two-layer
    # solution (FEM-checked above) gives 84.4 mOhm/m, near a solid annealed copper wire's 88.8 mOhm/m
    out = calculate_skin_effect({"material": "CCS-40", "frequency": "1 MHz", "size": "d 1 mm"}, catalogue)
    assert "two-layer" in out["results"]["ac_method"]["text"]
    m = catalogue["materials"]["copper-clad-steel-40"]
    a = 0.5e-3
    b = core_radius_for_cladding_share(a, m["layer_share"])
    ratio = layered_round_resistance_ratio(b, a, m["layer_core"]["rho_ref"], m["layer_core"]["mu_r"],
                                           resistivity_at(m["layer_cladding"], 293.15, "auto")["rho"], 1.0, 1e6)
    assert value(out, "ac_dc_ratio") == pytest.approx(ratio, rel=1e-12)
    assert value(out, "resistance_ac") == pytest.approx(0.08439, rel=2e-3)
    averaged = value(out, "resistance") * round_wire_resistance_ratio(a, value(out, "resistivity"), 1e6)
    assert averaged > 0.14  # what the page used to show
    # the skin depth shown is the copper cladding's
    assert value(out, "skin_depth") == pytest.approx(math.sqrt(RHO_CU / (math.pi * 1e6 * mu_0)), rel=1e-6)
    assert "cladding" in out["results"]["skin_depth"]["text"]


def test_ccs_at_mains_frequency_is_near_dc(catalogue):
    out = calculate_resistance({"material": "CCS-40", "frequency": "50 Hz", "size": "d 1 mm", "length": "1 m"},
                               catalogue)
    assert value(out, "ac_dc_ratio") == pytest.approx(1.0, abs=1e-3)
    assert "two-layer" in out["results"]["ac_method"]["text"]


@pytest.mark.parametrize("calculate, field", [(calculate_skin_effect, "size"), (calculate_resistance, "frequency")])
def test_clad_bar_is_refused_not_averaged(catalogue, calculate, field):
    out = calculate({"material": "CCA-10", "frequency": "1 MHz", "size": "10 x 1 mm", "length": "1 m"}, catalogue)
    assert "ac_dc_ratio" not in out["results"]
    assert "round wire only" in out["errors"][field]
    assert "resistance" in out["results"] or "skin_depth" in out["results"]


def test_clad_pair_is_refused(catalogue):
    out = calculate_skin_effect({"material": "CCS-30", "frequency": "1 MHz", "size": "d 1 mm",
                                 "arrangement": "pair, 30 mm"}, catalogue)
    assert "ac_dc_ratio" not in out["results"]
    assert "arrangement" in out["errors"]
