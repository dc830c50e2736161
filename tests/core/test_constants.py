"""Check the core's constants against scipy.constants' CODATA 2018 table.

The core uses CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021)). scipy >= 1.15
publishes CODATA 2022 in ``scipy.constants.physical_constants`` but still ships the 2018
table as ``scipy.constants._codata._physical_constants_2018``; that private table is the
reference here. Exact constants must agree to the last bit; derived ones (hbar, epsilon_0)
to a few ulp, because the core computes them from their defining relations.
"""

import pytest
import scipy.constants as sc

from conductor_atlas.core import celsius
from conductor_atlas.core import constants as k
from tests.support.approx import approx


try:
    from scipy.constants._codata import _physical_constants_2018 as CODATA_2018
except ImportError:  # pragma: no cover - only if scipy drops the old table
    CODATA_2018 = None

needs_2018 = pytest.mark.skipif(CODATA_2018 is None,
                                reason="this scipy no longer ships the CODATA 2018 table")


@needs_2018
def test_reference_table_is_codata_2018():
    # Guard that the private table really is the 2018 edition: mu_0 printed as
    # 1.256 637 062 12e-6 N/A^2 in CODATA 2018 (2022 prints 1.256 637 061 27e-6).
    assert CODATA_2018["vacuum mag. permeability"][0] == 1.25663706212e-6


@pytest.mark.parametrize("name, scipy_name", [
    ("ELEMENTARY_CHARGE", "elementary charge"),
    ("PLANCK", "Planck constant"),
    ("BOLTZMANN", "Boltzmann constant"),
    ("AVOGADRO", "Avogadro constant"),
    ("ELECTRON_MASS", "electron mass"),
    ("MU_0", "vacuum mag. permeability"),
    ("SPEED_OF_LIGHT", "speed of light in vacuum"),
    ("ELECTRON_VOLT", "electron volt"),
    ("BOHR_RADIUS", "Bohr radius"),
])
@needs_2018
def test_tabulated_constants_equal_codata_2018(name, scipy_name):
    # CODATA 2018 via scipy's 2018 table: typed in identically, so equal.
    assert getattr(k, name) == CODATA_2018[scipy_name][0]


@pytest.mark.parametrize("name, scipy_name", [
    ("ELECTRON_MASS", "electron mass"),
    ("MU_0", "vacuum mag. permeability"),
    ("BOHR_RADIUS", "Bohr radius"),
    ("EPSILON_0", "vacuum electric permittivity"),
])
def test_measured_constants_close_to_current_codata(name, scipy_name):
    # Against scipy's current edition (CODATA 2022 in scipy 1.17): the 2018 -> 2022 revisions
    # are below 2e-9 relative (mu_0: 6.8e-10, m_e: 1.4e-9), far under anything a conductor
    # calculation resolves; a typo in a digit would exceed it.
    assert getattr(k, name) == approx(sc.physical_constants[scipy_name][0], rel=2e-9)


@pytest.mark.parametrize("name, scipy_name", [
    ("HBAR", "reduced Planck constant"),
    ("EPSILON_0", "vacuum electric permittivity"),
])
@needs_2018
def test_derived_constants_match_codata_2018(name, scipy_name):
    # Computed from h (resp. mu_0 and c); CODATA prints 10-11 digits, so 1e-10 relative
    # covers rounding of the printed value while still catching any wrong formula.
    assert getattr(k, name) == approx(CODATA_2018[scipy_name][0], rel=1e-10)


def test_zero_celsius():
    # scipy.constants.zero_Celsius = 273.15 K (definition of the Celsius scale).
    assert celsius.ZERO_CELSIUS == sc.zero_Celsius
    assert celsius.TWENTY_CELSIUS == sc.zero_Celsius + 20.0
