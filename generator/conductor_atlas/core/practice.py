"""Shop-floor formulas: winding temperature by the resistance method, equal-resistance
comparison of two materials, and the minimum cross-section for a voltage-drop limit.

Temperatures are in kelvin at every interface; the resistance-method constant k is the
(positive) magnitude of the inferred zero-resistance temperature below 0 degC, in kelvin
(234.5 for copper). Choosing the next standard conductor size belongs to the geometry
module; this one returns areas. Pure Python in the Transcrypt subset; CoreError for
impossible inputs.
"""

from conductor_atlas.core.celsius import ZERO_CELSIUS
from conductor_atlas.core.errors import CoreError, check_positive

# Inferred zero-resistance temperature below 0 degC, [K]. From memory: IEEE Std 118 and
# IEEE Std 112 use 234.5 for copper (100 % IACS) and 225 for aluminium (EC grade, ~62 % IACS);
# IEC 60034-1 (clause on the resistance method) rounds copper to 235 and uses 225 for
# aluminium.
K_COPPER = 234.5
K_ALUMINIUM = 225.0


# __pragma__ ('nokwargs')
def inferred_zero_from_alpha(alpha, T_ref):
    """Resistance-method constant k from a material's temperature coefficient.

    k = 1 / alpha - t_ref   (t_ref in degC; the linear R(t) extrapolates to zero at t = -k)

    Parameters
    ----------
    alpha : float
        Temperature coefficient of resistance at T_ref, [1/K]
    T_ref : float
        Reference temperature of alpha, [K]

    Returns
    -------
    k : float
        Magnitude of the inferred zero below 0 degC, [K]

    Notes
    -----
    Annealed copper, alpha_20 = 0.00393 /K (IEC 60028 standard annealed copper): k = 234.5.

    Examples
    --------
    IEC 60028 annealed copper, alpha = 0.00393 /K at 20 degC: 1/0.00393 - 20 = 234.45, the 234.5 of
    IEEE Std 118 and IEC 60034-1 (from memory):

    >>> round(inferred_zero_from_alpha(0.00393, 293.15), 1)
    234.5
    """
    check_positive(alpha, "alpha", "temperature coefficient")
    check_positive(T_ref, "T_ref", "reference temperature")
    return 1.0 / alpha - (T_ref - ZERO_CELSIUS)
# __pragma__ ('kwargs')


def resistance_method_temperature(R1, T1, R2, k=K_COPPER):
    """Winding temperature from its resistance rise (the resistance method).

    t2 = (R2 / R1)(k + t1) - k   (t in degC; here T = t + 273.15 in and out)

    Parameters
    ----------
    R1 : float
        Cold resistance, measured at T1, [ohm]
    T1 : float
        Winding temperature at the cold measurement, [K]
    R2 : float
        Hot resistance, [ohm]
    k : float, optional
        Inferred zero below 0 degC, [K]; 234.5 for copper, 225 for aluminium, or
        inferred_zero_from_alpha for another material

    Returns
    -------
    T2 : float
        Mean winding temperature at the hot measurement, [K]

    Notes
    -----
    Gives the mean temperature of the winding (hot spots are higher). Assumes a linear R(T)
    between the two states, good for copper and aluminium from -50 to 200 degC.

    References
    ----------
    1. IEC 60034-1, Rotating electrical machines - Rating and performance, clause on
       determining winding temperature by the resistance method (from memory).
    2. IEEE Std 118, Standard test code for resistance measurement (from memory).

    Examples
    --------
    A copper winding of 10 ohm at 20 degC reading 12.5 ohm hot: by hand with the IEC 60034-1 form,
    t2 = 1.25 (234.5 + 20) - 234.5 = 83.625 degC:

    >>> round(resistance_method_temperature(10.0, 293.15, 12.5, 234.5) - 273.15, 3)
    83.625
    """
    check_positive(R1, "R1", "cold resistance")
    check_positive(R2, "R2", "hot resistance")
    check_positive(T1, "T1", "temperature")
    check_positive(k, "k", "k")
    t1 = T1 - ZERO_CELSIUS
    if not (k + t1 > 0.0):
        raise CoreError("cold temperature lies below the inferred zero -k", "T1")
    return (R2 / R1) * (k + t1) - k + ZERO_CELSIUS


def temperature_rise(R1, T1, R2, T_coolant, k=K_COPPER):
    """Temperature rise of a winding over its coolant by the resistance method.

    dtheta = (R2 - R1) / R1 (k + t1) + t1 - t_a

    Parameters
    ----------
    R1 : float
        Cold resistance at T1, [ohm]
    T1 : float
        Winding temperature at the cold measurement, [K]
    R2 : float
        Hot resistance, [ohm]
    T_coolant : float
        Coolant (ambient) temperature at the end of the test, [K]
    k : float, optional
        Inferred zero below 0 degC, [K]

    Returns
    -------
    rise : float
        Temperature rise, [K]

    References
    ----------
    1. IEC 60034-1, clause on the resistance method (from memory).

    Examples
    --------
    The winding above (83.625 degC by hand) over 25 degC coolant: a rise of 58.625 K:

    >>> round(temperature_rise(10.0, 293.15, 12.5, 298.15, 234.5), 3)
    58.625
    """
    check_positive(T_coolant, "T_coolant", "coolant temperature")
    return resistance_method_temperature(R1, T1, R2, k) - T_coolant


# __pragma__ ('nokwargs')
def equal_resistance_area_ratio(rho1, rho2):
    """Cross-section ratio A2 / A1 for equal resistance at equal length: A2/A1 = rho2/rho1.

    Parameters
    ----------
    rho1 : float
        Resistivity of the reference material, [ohm*m]
    rho2 : float
        Resistivity of the candidate, [ohm*m]

    Returns
    -------
    ratio : float
        A2 / A1, [-]

    Examples
    --------
    Aluminium 1350 (ASTM B230, 61 %IACS: 2.8264e-8 ohm*m) for annealed copper (IEC 60028,
    1.7241e-8 ohm*m): 100/61 = 1.639, the trade's "about 1.6 times the area":

    >>> round(equal_resistance_area_ratio(1.7241e-8, 2.8264e-8), 3)
    1.639
    """
    check_positive(rho1, "rho1", "resistivity")
    check_positive(rho2, "rho2", "resistivity")
    return rho2 / rho1


def equal_resistance_diameter_ratio(rho1, rho2):
    """Diameter ratio d2 / d1 of round conductors for equal resistance: sqrt(rho2 / rho1).

    Parameters
    ----------
    rho1 : float
        Resistivity of the reference material, [ohm*m]
    rho2 : float
        Resistivity of the candidate, [ohm*m]

    Returns
    -------
    ratio : float
        d2 / d1, [-]

    Examples
    --------
    The same pair: sqrt(100/61) = 1.280:

    >>> round(equal_resistance_diameter_ratio(1.7241e-8, 2.8264e-8), 3)
    1.28
    """
    return equal_resistance_area_ratio(rho1, rho2) ** 0.5


def equal_resistance_mass_ratio(rho1, density1, rho2, density2):
    """Mass ratio m2 / m1 for equal resistance at equal length: (rho2 d2) / (rho1 d1).

    Parameters
    ----------
    rho1 : float
        Resistivity of the reference material, [ohm*m]
    density1 : float
        Mass density of the reference material, [kg/m^3]
    rho2 : float
        Resistivity of the candidate, [ohm*m]
    density2 : float
        Mass density of the candidate, [kg/m^3]

    Returns
    -------
    ratio : float
        m2 / m1, [-]

    Notes
    -----
    EC aluminium against annealed copper: about 0.50 (half the mass for the same
    resistance, with 1.64 times the area).

    Examples
    --------
    The same pair with IEC 60028 copper's 8890 kg/m^3 and aluminium 1350's 2705 kg/m^3 (ASTM B230,
    from memory): 1.639 x 2705 / 8890 = 0.499, half the mass:

    >>> round(equal_resistance_mass_ratio(1.7241e-8, 8890.0, 2.8264e-8, 2705.0), 3)
    0.499
    """
    check_positive(density1, "density1", "density")
    check_positive(density2, "density2", "density")
    return equal_resistance_area_ratio(rho1, rho2) * density2 / density1
# __pragma__ ('kwargs')


def voltage_drop_min_area(rho, current, route_length, max_drop, wires=2.0):
    """Smallest cross-section that keeps the resistive voltage drop within a limit.

    A_min = wires * rho * L * I / dV_max

    Parameters
    ----------
    rho : float
        Resistivity at the operating temperature, [ohm*m]
    current : float
        Current, [A]
    route_length : float
        One-way route length L, [m]
    max_drop : float
        Allowed voltage drop, [V]
    wires : float, optional
        Conductor length per unit route length, [-]: 2 for a two-wire DC or single-phase
        circuit (out and back), 1 when route_length is already the whole conductor
        length, sqrt(3) for the line-to-line drop of a balanced three-phase circuit

    Returns
    -------
    A : float
        Minimum conductor cross-section, [m^2]

    Notes
    -----
    Resistive drop only: no reactance or power factor, no skin effect; pick rho at the
    conductor's operating temperature. A physics estimate, not an installation rule: the
    next standard size and the current rating follow the local electrical code.

    Examples
    --------
    16 A over a 25 m two-wire copper run within 3 % of 230 V (6.9 V): by hand
    2 x 1.7241e-8 x 25 x 16 / 6.9 = 1.999e-6 m^2, so 2.5 mm^2 is the next standard size:

    >>> round(voltage_drop_min_area(1.7241e-8, 16.0, 25.0, 6.9) * 1e6, 3)
    1.999
    """
    check_positive(rho, "rho", "resistivity")
    check_positive(current, "current", "current")
    check_positive(route_length, "route_length", "route length")
    check_positive(max_drop, "max_drop", "allowed voltage drop")
    check_positive(wires, "wires", "wires")
    return wires * rho * route_length * current / max_drop
