"""Build-time Bloch–Grüneisen fit: the vectorised integral equals the core's, and the fit recovers
known parameters.

References: scipy.integrate.quad (adaptive QUADPACK) for J_n(z); J_5(∞) = 5! ζ(5) = 124.4313306…
(Ziman, Electrons and Phonons, 1960, sec. 9.5), with ζ from scipy.special.zeta.
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from scipy import integrate, special

from conductor_atlas.core.temperature_models import bloch_gruneisen_integral, bloch_gruneisen_resistivity
from conductor_atlas.fits import bg_integral, fit_bloch_gruneisen, phonon_basis

Z = np.logspace(-6, 3, 181)


@pytest.mark.parametrize("n", [2.0, 3.0, 5.0, 7.5, 10.0])
def test_vectorised_integral_equals_the_core(n):
    # Same panels, nodes and weights as the core; only the summation order differs, so the two agree
    # to a few ulps: 1e-13 relative leaves a 400× margin over double rounding (2.2e-16).
    core = np.array([bloch_gruneisen_integral(n, float(z)) for z in Z])
    assert np.allclose(bg_integral(n, Z), core, rtol=1e-13, atol=0.0)


@pytest.mark.parametrize("z", [0.01, 0.5, 1.0, 3.0, 17.0, 80.0])
def test_vectorised_integral_against_quadpack(z):
    # QUADPACK's own error estimate is below 1e-12 relative here; 1e-11 allows for it.
    reference, _ = integrate.quad(lambda x: x ** 5 / ((math.exp(x) - 1.0) * (1.0 - math.exp(-x))), 0.0, z,
                                  epsabs=0.0, epsrel=1e-13, limit=200)
    assert bg_integral(5.0, np.array([z]))[0] == pytest.approx(reference, rel=1e-11)


def test_vectorised_integral_saturates_at_n_factorial_zeta():
    assert bg_integral(5.0, np.array([1e4]))[0] == pytest.approx(120.0 * special.zeta(5.0), rel=1e-14)


def test_fit_recovers_parameters_of_a_curve_made_by_the_core():
    # A synthetic curve (not data): ρ0 = 2e-11 Ω·m, A = 7e-8 Ω·m, Θ = 330 K, sampled 10–600 K. The fit's
    # golden-section search stops at 1e-5 of its bracket (~70 K wide), so Θ is good to ~1e-3 K.
    temperatures = [10.0, 20.0, 40.0, 60.0, 80.0, 100.0, 150.0, 200.0, 273.15, 300.0, 400.0, 500.0, 600.0]
    rho = [bloch_gruneisen_resistivity(t, 2e-11, 7e-8, 330.0) for t in temperatures]
    fit = fit_bloch_gruneisen(temperatures, rho, theta_guess=343.0)
    assert fit is not None
    assert fit.theta == pytest.approx(330.0, abs=0.01)
    assert fit.a == pytest.approx(7e-8, rel=1e-4)
    assert fit.rho0 == pytest.approx(2e-11, rel=1e-2)
    assert fit.worst < 1e-4


def test_phonon_basis_is_the_bloch_gruneisen_shape():
    t = np.array([50.0, 300.0])
    expected = [(x / 330.0) ** 5 * bloch_gruneisen_integral(5.0, 330.0 / x) for x in t]
    assert np.allclose(phonon_basis(t, 330.0), expected, rtol=1e-13)
