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


# __pragma__ ('nokwargs')
def iec60228_correction_factor(temperature, beta):
    """IEC 60228 Annex B temperature correction factor to 20 °C.

    k_t = (β + 20) / (β + t),   R20 = k_t · R_t   (t in °C)

    temperature : float  Conductor temperature at the measurement, [K]
    beta : float         Reciprocal of the coefficient at 0 °C, [K]: 234.5 copper, 228 aluminium

    Valid where the linear R(t) holds (copper and aluminium, about −50 to +200 °C).
    Source: IEC 60228:2004, Annex B (formula and constants from memory).

    Examples
    --------
    Copper measured at 25 degC: 254.5 / 259.5 = 0.98073, printed as 0.980 in IEC 60228 Annex B's
    table of factors (from memory):

    >>> round(iec60228_correction_factor(298.15, 234.5), 5)
    0.98073
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

    Examples
    --------
    Copper by its linear model (IEC 60028: 1.7241e-8 ohm*m, 0.00393 /K at 20 degC) at 25 degC,
    rho = 1.7241e-8 x 1.01965: the same 0.9807 as IEC 60228 Annex B's factor for copper:

    >>> round(correction_factor(1.7241e-8, 1.7241e-8 * (1.0 + 0.00393 * 5.0)), 4)
    0.9807
    """
    if not (rho_20 > 0 and rho_t > 0):
        raise CoreError("resistivities must be above zero", "temperature")
    return rho_20 / rho_t


def resistance_per_length(resistance, sample_length):
    """Resistance per unit length R' = R / L, [ohm/m].  resistance [ohm], sample_length [m].

    Examples
    --------
    0.736 ohm over a 100 m sample: 7.36 ohm/km, under the 7.41 ohm/km that IEC 60228 Table 1 allows
    a 2.5 mm^2 class 1 plain copper conductor (from memory):

    >>> round(resistance_per_length(0.736, 100.0) * 1e3, 2)
    7.36
    """
    if not (sample_length > 0):
        raise CoreError("the sample length must be above zero", "length")
    return resistance / sample_length


def relative_deviation(value, reference):
    """(value − reference) / reference, [-]: +0.02 is 2 % above the reference.

    Examples
    --------
    7.36 ohm/km against 7.41 ohm/km: 0.67 % below:

    >>> round(relative_deviation(7.36, 7.41) * 100.0, 2)
    -0.67
    """
    if not (reference > 0):
        raise CoreError("the reference must be above zero", "")
    return (value - reference) / reference


def margin_to_limit(value, limit):
    """How far below a maximum a value lies, as a fraction of the maximum, [-].

    margin = (limit − value) / limit: +0.05 passes with 5 % to spare, −0.02 fails by 2 %.

    Examples
    --------
    7.36 ohm/km under a maximum of 7.41 ohm/km passes with 0.67 % to spare:

    >>> round(margin_to_limit(7.36, 7.41) * 100.0, 2)
    0.67
    """
    if not (limit > 0):
        raise CoreError("the limit must be above zero", "")
    return (limit - value) / limit


def nominal_row(areas, area):
    """Index of the row whose nominal area equals ``area`` [m^2] (within 1e-6 relative), or -1.

    areas : list of float  Nominal areas of a standard's table, increasing, [m^2]

    Examples
    --------
    >>> nominal_row([1.5e-6, 2.5e-6, 4e-6], 2.5e-6), nominal_row([1.5e-6, 2.5e-6, 4e-6], 3e-6)
    (1, -1)
    """
    for i in range(len(areas)):
        if abs(areas[i] - area) <= 1e-6 * areas[i]:
            return i
    return -1


def neighbour_rows(areas, area):
    """The nominal areas [m^2] just below and above ``area`` (-1.0 where there is none): [below, above].

    Examples
    --------
    >>> neighbour_rows([1.5e-6, 2.5e-6, 4e-6], 3e-6)
    [2.5e-06, 4e-06]
    """
    below = -1.0
    above = -1.0
    for a in areas:
        if a < area:
            below = a
        elif above < 0:
            above = a
    return [below, above]
# __pragma__ ('kwargs')
