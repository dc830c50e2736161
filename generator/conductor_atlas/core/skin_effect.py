"""Skin effect: skin depth, surface resistance and AC/DC resistance ratios.

Exact for an isolated round wire (Kelvin-function solution; the functions themselves are in
core.kelvin_functions), a documented approximation for
rectangular bars and strips, and the IEC 60287-1-1 cable formula as a practical cross-check.
Proximity effect (neighbouring conductors) is not included anywhere in this module.

Magnetic conductors: mu_r is an argument. For iron, steel and nickel it depends strongly on
the field strength (hence on the current), on the frequency and on the material's history;
a single mu_r gives an order-of-magnitude answer only, and the wire's internal inductance and
hysteresis loss are not modelled.

Pure Python in the Transcrypt subset; SI floats in and out; CoreError for impossible inputs.
"""

import math

from conductor_atlas.core.constants import MU_0
from conductor_atlas.core.errors import CoreError, check_positive
from conductor_atlas.core.kelvin_functions import kelvin_scaled

_SQRT2 = math.sqrt(2.0)


def skin_depth(rho, f, mu_r=1.0):
    """Skin depth of a good conductor.

    delta = sqrt(rho / (pi f mu_0 mu_r))

    Parameters
    ----------
    rho : float
        Resistivity, [ohm*m]
    f : float
        Frequency, [Hz]
    mu_r : float, optional
        Relative permeability, [-] (see the module note on magnetic conductors)

    Returns
    -------
    delta : float
        Depth at which the current density falls to 1/e, [m]

    Notes
    -----
    Good-conductor limit (displacement current neglected): valid while
    f << 1 / (2 pi epsilon_0 rho), i.e. up to far above optical frequencies for metals.
    Copper at 60 Hz: 8.4 mm; at 1 MHz: 66 um.

    References
    ----------
    1. Ramo, S., Whinnery, J. R., Van Duzer, T., Fields and Waves in Communication
       Electronics, 3rd ed., 1994, sec. 3.16, eq. 3.16(7).

    Examples
    --------
    IEC 60028 copper (1.7241e-8 ohm*m) at 60 Hz and at 1 MHz: 8.53 mm and 66.1 um, the 8.5 mm and
    66 um of handbook skin-depth tables for copper (from memory):

    >>> round(skin_depth(1.7241e-8, 60.0) * 1e3, 2), round(skin_depth(1.7241e-8, 1e6) * 1e6, 1)
    (8.53, 66.1)
    """
    check_positive(rho, "rho", "resistivity")
    check_positive(f, "f", "frequency")
    check_positive(mu_r, "mu_r", "relative permeability")
    delta = math.sqrt(rho / (math.pi * f * MU_0 * mu_r))
    if not (delta > 0.0):
        # pi f mu_0 mu_r overflows to infinity near f = 1e308 Hz, and delta would be 0
        raise CoreError("frequency is too high to compute a skin depth", "f")
    return delta


def surface_resistance(rho, f, mu_r=1.0):
    """Surface resistance of a conductor much thicker than its skin depth.

    R_s = rho / delta = sqrt(pi f mu_0 mu_r rho)

    Parameters
    ----------
    rho : float
        Resistivity, [ohm*m]
    f : float
        Frequency, [Hz]
    mu_r : float, optional
        Relative permeability, [-]

    Returns
    -------
    R_s : float
        Surface resistance, [ohm] (per square)

    References
    ----------
    1. Ramo, Whinnery & Van Duzer 1994, sec. 3.16, eq. 3.16(9).

    Examples
    --------
    Copper at 1 GHz: 8.25 mohm per square, as microwave texts list for copper (about 8.2 mohm, from
    memory):

    >>> round(surface_resistance(1.7241e-8, 1e9) * 1e3, 2)
    8.25
    """
    return rho / skin_depth(rho, f, mu_r)


# __pragma__ ('nokwargs')
def kelvin_resistance_ratio(x):
    """AC/DC resistance ratio of an isolated solid round wire, as a function of x.

    R_ac / R_dc = (x / 2) (ber x bei' x - bei x ber' x) / (ber' x^2 + bei' x^2),
    x = sqrt(2) a / delta

    Parameters
    ----------
    x : float
        sqrt(2) times radius over skin depth, [-]

    Returns
    -------
    ratio : float
        R_ac / R_dc, [-]

    Notes
    -----
    Evaluated with the exp(-x/sqrt 2)-scaled functions, so it is finite for every x. Limits:
    1 + x^4 / 192 for small x; x / (2 sqrt 2) + 1/4 + 3 / (16 sqrt 2 x) for large x
    (that is a / (2 delta) + 1/4 + 3 delta / (32 a)). Measured against mpmath: < 2e-13
    relative for 1e-3 <= x <= 1e4; above x = 1e4 the large-x limit is returned.
    Solid, straight, isolated, non-magnetic or linear-magnetic wire; no proximity effect.

    References
    ----------
    1. Ramo, Whinnery & Van Duzer 1994, sec. 5.6 (internal impedance of a round wire).
    2. NIST DLMF, sec. 10.61 (Kelvin functions).

    Examples
    --------
    x = 30: the printed formula with scipy.special's ber, bei, berp, beip gives 10.8610141427
    (checked while writing this example); the large-x limit 30 / (2 sqrt 2) + 1/4 + 3 / (16 sqrt 2 30)
    = 10.8610 agrees to 4e-7:

    >>> round(kelvin_resistance_ratio(30.0), 10)
    10.8610141427
    """
    if not (x - x == 0) or x < 0.0:
        raise CoreError("x must be a finite number >= 0", "x")
    if x == 0.0:
        return 1.0
    if x > 1e4:
        # the scaled series loses accuracy beyond x ~ 1e5 (1e-9 relative at 1e8, the wrong sign
        # from 1e17); the three-term limit above agrees with it to 2e-13 at x = 1e4, and its
        # omitted term is of order 1 / x ** 2
        return x / (2.0 * _SQRT2) + 0.25 + 3.0 / (16.0 * _SQRT2 * x)
    v = kelvin_scaled(x)
    return 0.5 * x * (v[0] * v[3] - v[1] * v[2]) / (v[2] * v[2] + v[3] * v[3])
# __pragma__ ('kwargs')


def round_wire_resistance_ratio(radius, rho, f, mu_r=1.0):
    """AC/DC resistance ratio of an isolated solid round wire (exact Kelvin solution).

    R_ac / R_dc = kelvin_resistance_ratio(sqrt(2) a / delta), delta = skin_depth(rho, f, mu_r)

    Parameters
    ----------
    radius : float
        Wire radius a, [m]
    rho : float
        Resistivity, [ohm*m]
    f : float
        Frequency, [Hz]
    mu_r : float, optional
        Relative permeability, [-]

    Returns
    -------
    ratio : float
        R_ac / R_dc, [-]

    Examples
    --------
    Copper wire of 2 mm diameter at 50 kHz (x = 4.785): 1.96599068, as the printed formula gives with
    scipy.special's Kelvin functions at that x (checked while writing this example):

    >>> round(round_wire_resistance_ratio(1e-3, 1.7241e-8, 50e3), 8)
    1.96599068
    """
    check_positive(radius, "radius", "radius")
    return kelvin_resistance_ratio(_SQRT2 * radius / skin_depth(rho, f, mu_r))


# __pragma__ ('nokwargs')
def _plate_factor(u):
    # (u/2)(sinh u + sin u)/(cosh u - cos u), written without cancellation or overflow
    if u < 2.0:
        u2 = u * u
        u4 = u2 * u2
        num = 0.0  # sum u^(4k+1)/(4k+1)!  = (sinh u + sin u)/2
        den = 0.0  # sum u^(4k+2)/(4k+2)!  = (cosh u - cos u)/2
        tn = u
        td = 0.5 * u2
        for k in range(12):
            num += tn
            den += td
            tn = tn * u4 / ((4.0 * k + 2.0) * (4.0 * k + 3.0) * (4.0 * k + 4.0) * (4.0 * k + 5.0))
            td = td * u4 / ((4.0 * k + 3.0) * (4.0 * k + 4.0) * (4.0 * k + 5.0) * (4.0 * k + 6.0))
        return 0.5 * u * num / den
    q = math.exp(-u)
    return 0.5 * u * (1.0 - q * q + 2.0 * q * math.sin(u)) / (1.0 + q * q - 2.0 * q * math.cos(u))
# __pragma__ ('kwargs')


def plate_resistance_ratio(thickness, rho, f, mu_r=1.0):
    """AC/DC resistance ratio of a wide flat conductor (plate or strip, edges neglected).

    R_ac / R_dc = (u / 2) (sinh u + sin u) / (cosh u - cos u),  u = t / delta

    Parameters
    ----------
    thickness : float
        Thickness t, [m]
    rho : float
        Resistivity, [ohm*m]
    f : float
        Frequency, [Hz]
    mu_r : float, optional
        Relative permeability, [-]

    Returns
    -------
    ratio : float
        R_ac / R_dc, [-]

    Notes
    -----
    Exact one-dimensional solution for a plate carrying its own current, field equal and
    opposite on the two faces (equivalently Re[(k t/2) coth(k t/2)], k = (1 + i)/delta).
    Limits: 1 + u^4/180 at low frequency, t / (2 delta) at high frequency. Neglects the
    edges, so it applies to strips with width >> thickness; the extra edge current of a
    real isolated strip makes its true resistance higher at high frequency.

    References
    ----------
    1. Dowell, P. L., "Effects of eddy currents in transformer windings", Proc. IEE 113,
       1387 (1966), doi:10.1049/piee.1966.0236 (the single-layer case of its eq. for F).

    Examples
    --------
    A copper plate two skin depths thick (u = 2): (u / 2)(sinh u + sin u)/(cosh u - cos u) with
    Python's math.sinh and friends gives 1.0856357 (by hand):

    >>> t = 2.0 * skin_depth(1.7241e-8, 1e4)
    >>> round(plate_resistance_ratio(t, 1.7241e-8, 1e4), 7)
    1.0856357
    """
    check_positive(thickness, "thickness", "thickness")
    return _plate_factor(thickness / skin_depth(rho, f, mu_r))


def rectangular_bar_resistance_ratio(width, thickness, rho, f, mu_r=1.0):
    """Approximate AC/DC resistance ratio of an isolated rectangular bar or strip.

    R_ac / R_dc = w t / A_eff,  A_eff = w t - (w - d_w)(t - d_t),
    d_t = t / F(t / delta),  d_w = w / F(w / delta),  F = plate ratio (plate_resistance_ratio)

    Parameters
    ----------
    width : float
        Width w, [m]
    thickness : float
        Thickness t, [m]
    rho : float
        Resistivity, [ohm*m]
    f : float
        Frequency, [Hz]
    mu_r : float, optional
        Relative permeability, [-]

    Returns
    -------
    ratio : float
        R_ac / R_dc, [-]

    Notes
    -----
    Our own construction (no single source; the effective-perimeter idea behind Wheeler's
    surface-impedance view, ref. 1): each pair of opposite faces conducts over the effective
    depth of an exact plate of that size (ref. 2), and the bar is the frame between the
    outline and the unreached core. Limits it meets: DC (ratio 1 + O((t/delta)^4)); the wide
    strip w >> t (the exact plate result); high frequency, A_eff -> 2 delta (w + t) - 4 delta^2
    i.e. R_ac -> rho / (2 delta (w + t)) with the corners counted once. Accuracy beyond those
    limits is not established here: it ignores the current crowding at edges and corners,
    which raises the true high-frequency resistance of an isolated bar (for thin strips by
    tens of percent), so read the result as a lower estimate. Proximity effect is excluded.

    References
    ----------
    1. Wheeler, H. A., "Formulas for the skin effect", Proc. IRE 30, 412 (1942),
       doi:10.1109/JRPROC.1942.232015.
    2. Dowell, P. L., Proc. IEE 113, 1387 (1966), doi:10.1049/piee.1966.0236.

    Examples
    --------
    A 40 x 5 mm copper bar at 1 MHz meets its high-frequency limit w t / (2 delta (w + t) - 4 delta^2)
    = 33.7259 (delta = 66.08 um); a 100 x 10 mm bar at 50 Hz is within 0.6 % of DC:

    >>> round(rectangular_bar_resistance_ratio(0.04, 0.005, 1.7241e-8, 1e6), 4)
    33.7259
    >>> round(rectangular_bar_resistance_ratio(0.1, 0.01, 1.7241e-8, 50.0), 4)
    1.0059
    """
    check_positive(width, "width", "width")
    check_positive(thickness, "thickness", "thickness")
    delta = skin_depth(rho, f, mu_r)
    d_t = thickness / _plate_factor(thickness / delta)
    d_w = width / _plate_factor(width / delta)
    a_eff = width * thickness - (width - d_w) * (thickness - d_t)
    return width * thickness / a_eff


def iec60287_skin_effect_factor(f, R_dc, k_s=1.0):
    """Skin-effect factor y_s of IEC 60287-1-1 for a cable conductor.

    x_s^2 = 8 pi f 1e-7 k_s / R'
    y_s = x_s^4 / (192 + 0.8 x_s^4)                  for 0 < x_s <= 2.8
    y_s = -0.136 - 0.0177 x_s + 0.0563 x_s^2         for 2.8 < x_s <= 3.8
    y_s = 0.354 x_s - 0.733                          for x_s > 3.8
    R_ac = R' (1 + y_s + y_p)

    Parameters
    ----------
    f : float
        Supply frequency, [Hz]
    R_dc : float
        DC resistance R' of the conductor per unit length at its operating temperature,
        [ohm/m]
    k_s : float, optional
        Conductor construction factor, [-]; 1 for round solid or stranded conductors
        (IEC 60287-1-1 Table 2 lists the others)

    Returns
    -------
    y_s : float
        Skin-effect factor, [-]

    Notes
    -----
    The first branch is the standard's formula for x_s <= 2.8, the usual case at power
    frequencies; the two further branches are quoted from memory of the same clause.
    Written with mu_0 = 4 pi 1e-7, so with k_s = 1 x_s equals the Kelvin x of a solid round
    conductor. Measured against the exact Kelvin ratio: R'(1 + y_s) is within 0.11 % of the
    exact R_ac for x_s <= 2.8, and within 0.5 % on the other branches up to x_s = 30.

    References
    ----------
    1. IEC 60287-1-1:2006, Electric cables - Calculation of the current rating - Part 1-1,
       clause 2.1.2 and Table 2.

    Examples
    --------
    A 300 mm^2 copper conductor at 90 degC (R' = 7.31e-5 ohm/m by IEC 60028's linear model) at 50 Hz:
    x_s^2 = 1.715 and y_s = x_s^4 / (192 + 0.8 x_s^4) = 0.01513 (by hand):

    >>> r_dc = 1.7241e-8 * (1.0 + 0.00393 * 70.0) / 300e-6
    >>> round(iec60287_skin_effect_factor(50.0, r_dc), 5)
    0.01513
    """
    check_positive(f, "f", "frequency")
    check_positive(R_dc, "R_dc", "resistance per unit length")
    check_positive(k_s, "k_s", "k_s")
    xs2 = 8.0 * math.pi * f * 1e-7 * k_s / R_dc
    xs = math.sqrt(xs2)
    if xs <= 2.8:
        x4 = xs2 * xs2
        return x4 / (192.0 + 0.8 * x4)
    if xs <= 3.8:
        return -0.136 - 0.0177 * xs + 0.0563 * xs2
    return 0.354 * xs - 0.733
