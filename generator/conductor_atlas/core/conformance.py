"""A measured conductor resistance against what it should be: correction to 20 °C, resistance per
length, the limit row of a conductor standard and the margin to it.

The standard tables themselves are data (data/standards/*.toml, read by conductor_atlas.standards
and handed to the calculators as catalogue["limits"]); this module only does the arithmetic. SI
floats in and out, the Transcrypt subset, CoreError for impossible inputs.
"""

from conductor_atlas.core.celsius import TWENTY_CELSIUS, ZERO_CELSIUS
from conductor_atlas.core.errors import CoreError

# IEC 60228:2004 Annex B: the temperature correction factor to 20 °C, k_t = (β + 20)/(β + t) with
# β = 234.5 for copper and 228 for aluminium (from memory of the annex; the factors rest on
# α20 = 1/254.5 ≈ 0.00393 /K and 1/248 ≈ 0.00403 /K).
IEC60228_BETA_COPPER = 234.5
IEC60228_BETA_ALUMINIUM = 228.0
REFERENCE_TEMPERATURE = TWENTY_CELSIUS  # [K] the temperature conductor limits are given at


def iec60228_correction_factor(temperature, beta):
    """IEC 60228 Annex B temperature correction factor to 20 °C.

    k_t = (β + 20) / (β + t),   R20 = k_t · R_t   (t in °C)

    temperature : float  Conductor temperature at the measurement, [K]
    beta : float         Reciprocal of the coefficient at 0 °C, [K]: 234.5 copper, 228 aluminium

    Valid where the linear R(t) holds (copper and aluminium, about −50 to +200 °C).
    Source: IEC 60228:2004, Annex B (formula and constants from memory).
    Example: copper at 25 °C: 254.5 / 259.5 = 0.980732.
    """
    t = temperature - ZERO_CELSIUS
    if not (beta + t > 0):
        raise CoreError("the temperature lies below the inferred zero-resistance temperature −β", "temperature")
    return (beta + 20.0) / (beta + t)


def correction_factor(rho_20, rho_t):
    """Factor that takes a resistance measured at t to 20 °C with a material's own ρ(T) model.

    k = ρ(20 °C) / ρ(t),   R20 = k · R_t

    rho_20 : float  Resistivity of the material at 20 °C, [ohm*m]
    rho_t : float   Resistivity at the measurement temperature, [ohm*m]

    Assumes the sample's length and area do not change with temperature (thermal expansion,
    about 17e-6 /K for copper, moves R by under 0.02 % per 10 K and is left out, as the
    standards' correction factors leave it out).
    """
    if not (rho_20 > 0 and rho_t > 0):
        raise CoreError("resistivities must be above zero", "temperature")
    return rho_20 / rho_t


def resistance_per_length(resistance, sample_length):
    """Resistance per unit length R' = R / L, [ohm/m].  resistance [ohm], sample_length [m]."""
    if not (sample_length > 0):
        raise CoreError("the sample length must be above zero", "length")
    return resistance / sample_length


def relative_deviation(value, reference):
    """(value − reference) / reference, [-]: +0.02 is 2 % above the reference."""
    if not (reference > 0):
        raise CoreError("the reference must be above zero", "")
    return (value - reference) / reference


def margin_to_limit(value, limit):
    """How far below a maximum a value lies, as a fraction of the maximum, [-].

    margin = (limit − value) / limit: +0.05 passes with 5 % to spare, −0.02 fails by 2 %.
    """
    if not (limit > 0):
        raise CoreError("the limit must be above zero", "")
    return (limit - value) / limit


def nominal_row(areas, area):
    """Index of the row whose nominal area equals ``area`` [m^2] (within 1e-6 relative), or -1.

    areas : list of float  Nominal areas of a standard's table, increasing, [m^2]
    """
    for i in range(len(areas)):
        if abs(areas[i] - area) <= 1e-6 * areas[i]:
            return i
    return -1


def neighbour_rows(areas, area):
    """The nominal areas [m^2] just below and above ``area`` (-1.0 where there is none): [below, above]."""
    below = -1.0
    above = -1.0
    for a in areas:
        if a < area:
            below = a
        elif above < 0:
            above = a
    return [below, above]
