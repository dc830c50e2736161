"""Resistivity and resistance as functions of temperature, beyond the linear model.

Models: Bloch-Grueneisen with Matthiessen's rule (metals, from a residual resistivity and a
Debye-like temperature), Callendar-Van Dusen (platinum resistance thermometers, IEC 60751)
and its inverse, and piecewise-linear interpolation of a tabulated rho(T). The linear
alpha model lives in ``conductor_atlas.core.resistance``.

Every model returns a float; ``*_warnings`` functions return a list of strings for inputs
outside a model's range; impossible inputs (T <= 0 K, negative resistance, malformed tables)
raise CoreError. Temperatures are in kelvin at every interface. Pure Python in the
Transcrypt subset (math only), so it runs unchanged in the browser.
"""

import math

from conductor_atlas.core.celsius import ZERO_CELSIUS
from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.quadrature import GL_NODES, GL_WEIGHTS


# __pragma__ ('nokwargs')
def _finite(x):
    return x - x == 0


def _check_temperature(T, field):
    if not _finite(T) or T <= 0.0:
        raise CoreError("temperature must be a finite number above 0 K", field)


# --------------------------------------------------------------------------------------
# Bloch-Grueneisen


def _bg_integrand(n, x):
    # x^n / ((e^x - 1)(1 - e^-x)) = x^n / (4 sinh^2(x/2)), written without cancellation
    if x < 1.0:
        y = 0.5 * x
        y2 = y * y
        # sinh(y)/y by its series; y < 0.5 so the dropped y^16/17! term is < 1e-19
        s = 1.0 + y2 / 6.0 * (1.0 + y2 / 20.0 * (1.0 + y2 / 42.0 * (1.0 + y2 / 72.0 * (
            1.0 + y2 / 110.0 * (1.0 + y2 / 156.0 * (1.0 + y2 / 210.0))))))
        return x ** (n - 2.0) / (s * s)
    q = math.exp(-x)
    return x ** n * q / ((1.0 - q) * (1.0 - q))


def bloch_gruneisen_integral(n, z):
    """Bloch-Grueneisen transport integral J_n(z).

    J_n(z) = integral from 0 to z of x^n / ((e^x - 1)(1 - e^-x)) dx

    Parameters
    ----------
    n : float
        Exponent, 2 <= n <= 10; n = 5 for electron-phonon scattering in the Bloch-Grueneisen
        formula (n = 3 is Wilson's s-d interband form), [-]
    z : float
        Upper limit, z = Theta / T, z > 0, [-]

    Returns
    -------
    J : float
        Integral value, [-]

    Notes
    -----
    Composite 20-point Gauss-Legendre rule on panels of width <= 6 up to min(z, 60 + 5 n);
    beyond that the integrand (~ x^n e^-x) contributes less than 1e-16 relative, so
    J_n(z) = J_n(inf) = n! zeta(n) to double precision (J_5(inf) = 124.4313306...).
    Small z: J_n(z) ~ z^(n-1) / (n-1). Measured against mpmath to < 1e-14 relative
    for 1e-6 <= z <= 1e3.

    References
    ----------
    1. Grueneisen, E., Ann. Phys. 408, 530 (1933), doi:10.1002/andp.19334080504.
    2. Ziman, J. M., Electrons and Phonons, Oxford 1960, sec. 9.5 (eq. 9.5.15).

    Examples
    --------
    J_5(inf) = 5! zeta(5) = 124.4313306172 (scipy.special.zeta); J_5(3) = 12.7705576910 by
    scipy.integrate.quad on the printed integrand (checked while writing this example):

    >>> round(bloch_gruneisen_integral(5.0, 1000.0), 10), round(bloch_gruneisen_integral(5.0, 3.0), 10)
    (124.4313306172, 12.770557691)
    """
    if not _finite(n) or n < 2.0 or n > 10.0:
        raise CoreError("Bloch-Grueneisen exponent must be between 2 and 10", "n")
    if not (z > 0.0):
        raise CoreError("Bloch-Grueneisen upper limit must be above 0", "z")
    top = 60.0 + 5.0 * n
    if z < top:
        top = z
    panels = math.ceil(top / 6.0)
    h = top / panels
    total = 0.0
    for k in range(panels):
        a = k * h
        half = 0.5 * h
        mid = a + half
        part = 0.0
        for i in range(len(GL_NODES)):
            part += GL_WEIGHTS[i] * _bg_integrand(n, mid + half * GL_NODES[i])
        total += half * part
    return total


def residual_resistivity_from_rrr(rho_ref, rrr):
    """Residual resistivity rho_0 from a residual resistivity ratio.

    rho_0 = rho_ref / RRR,  RRR = rho(T_ref) / rho(4.2 K)

    Parameters
    ----------
    rho_ref : float
        Resistivity at the ratio's reference temperature (273.15 K or 293 K or 300 K, as the
        source states), [ohm*m]
    rrr : float
        Residual resistivity ratio, [-]

    Returns
    -------
    rho0 : float
        Residual (impurity and defect) resistivity, [ohm*m]

    Notes
    -----
    Takes rho(4.2 K) as rho_0, i.e. neglects the phonon part at 4.2 K (below 1e-4 of rho_0
    for RRR < 1000 in copper). Annealed OFHC copper has RRR of roughly 100 to 2000.

    Examples
    --------
    Copper of RRR 100 from 1.7241e-8 ohm*m at 20 degC (IEC 60028): 1.7241e-10 ohm*m:

    >>> '%.5g' % residual_resistivity_from_rrr(1.7241e-8, 100.0)
    '1.7241e-10'
    """
    if not _finite(rho_ref) or rho_ref <= 0.0:
        raise CoreError("resistivity must be above 0", "rho_ref")
    if not _finite(rrr) or rrr <= 0.0:
        raise CoreError("residual resistivity ratio must be above 0", "rrr")
    return rho_ref / rrr


def bloch_gruneisen_resistivity(T, rho0, A, theta):
    """Resistivity of a metal by Bloch-Grueneisen with Matthiessen's rule.

    rho(T) = rho_0 + A (T / Theta)^5 J_5(Theta / T)

    Parameters
    ----------
    T : float
        Temperature, [K]
    rho0 : float
        Residual resistivity (Matthiessen: temperature-independent impurity part), [ohm*m]
    A : float
        Electron-phonon coefficient, [ohm*m]; the high-temperature slope is
        d rho / dT -> A / (4 Theta)
    theta : float
        Bloch-Grueneisen (resistive Debye) temperature, [K]

    Returns
    -------
    rho : float
        Resistivity, [ohm*m]

    Notes
    -----
    Low T: rho - rho_0 -> 5! zeta(5) A (T/Theta)^5 = 124.43 A (T/Theta)^5. High T:
    rho - rho_0 -> A (T/Theta) / 4 - A / 72 (Theta/T) ... Holds for simple and noble metals
    (Cu, Ag, Au, Al, Na) from a few K to about 2 Theta; see bg_warnings.

    References
    ----------
    1. Bloch, F., Z. Phys. 59, 208 (1930), doi:10.1007/BF01341426.
    2. Grueneisen, E., Ann. Phys. 408, 530 (1933), doi:10.1002/andp.19334080504.
    3. Matthiessen, A., Vogt, C., Ann. Phys. 198, 19 (1864).

    Examples
    --------
    With rho_0 = 0 and A = 1, at T = 10 Theta the high-temperature expansion of the Notes gives
    10/4 - 1/720 = 2.498611 (the next term, of order (Theta/T)^3, moves the sixth decimal):

    >>> round(bloch_gruneisen_resistivity(3430.0, 0.0, 1.0, 343.0), 6)
    2.498612
    """
    _check_temperature(T, "T")
    _check_temperature(theta, "theta")
    r = T / theta
    if r > 1e50:
        # r ** 5 would overflow (CPython raises, JS gives Infinity); here the high-T expansion
        # in the Notes is exact to double precision (the next term is of order 1 / r ** 3)
        return rho0 + A * (r / 4.0 - 1.0 / (72.0 * r))
    return rho0 + A * r ** 5 * bloch_gruneisen_integral(5.0, 1.0 / r)


def bloch_gruneisen_coefficient(T_ref, rho_ref, rho0, theta):
    """Coefficient A of the Bloch-Grueneisen formula from one measured point.

    A = (rho_ref - rho_0) / ((T_ref / Theta)^5 J_5(Theta / T_ref))

    Parameters
    ----------
    T_ref : float
        Temperature of the measured point, [K]
    rho_ref : float
        Resistivity at T_ref, [ohm*m]
    rho0 : float
        Residual resistivity, [ohm*m]
    theta : float
        Bloch-Grueneisen temperature, [K]

    Returns
    -------
    A : float
        Coefficient for bloch_gruneisen_resistivity, [ohm*m]

    Examples
    --------
    The coefficient that puts a copper-like metal (Theta = 343 K, rho_0 = 1.7e-11 ohm*m) on IEC 60028's
    1.7241e-8 ohm*m at 20 degC gives that value back:

    >>> A = bloch_gruneisen_coefficient(293.15, 1.7241e-8, 1.7e-11, 343.0)
    >>> round(bloch_gruneisen_resistivity(293.15, 1.7e-11, A, 343.0) * 1e8, 10)
    1.7241
    """
    _check_temperature(T_ref, "T_ref")
    _check_temperature(theta, "theta")
    r = T_ref / theta
    return (rho_ref - rho0) / (r ** 5 * bloch_gruneisen_integral(5.0, 1.0 / r))


def bg_warnings(T, theta):
    """Warnings for a Bloch-Grueneisen evaluation at T with Bloch-Grueneisen temperature theta.

    Returns
    -------
    warnings : list
        Strings, empty when T is inside the range the model is normally fitted over.

    Examples
    --------
    >>> bg_warnings(293.15, 343.0)
    []
    >>> len(bg_warnings(10.0, 343.0)), len(bg_warnings(800.0, 343.0))
    (1, 1)
    """
    out = []
    if not (T > 0.0) or not (theta > 0.0):
        out.append("temperature and Bloch-Grueneisen temperature must be above 0 K")
        return out
    if T < 0.05 * theta:
        out.append("below about Theta/20 the phonon term is tiny; electron-electron, "
                   "magnetic-impurity and size effects, which the model lacks, can dominate")
    if T > 2.0 * theta:
        out.append("above about 2 Theta thermal expansion, anharmonicity and thermal "
                   "vacancies raise the resistivity above the model's linear rise")
    return out
# __pragma__ ('kwargs')


# --------------------------------------------------------------------------------------
# Callendar-Van Dusen (IEC 60751)

CVD_A = 3.9083e-3  # [1/K], IEC 60751:2008 clause 4.2
CVD_B = -5.775e-7  # [1/K^2], IEC 60751:2008 clause 4.2
CVD_C = -4.183e-12  # [1/K^4], IEC 60751:2008 clause 4.2, used below 0 degC only


def callendar_van_dusen_resistance(T, R0, A=CVD_A, B=CVD_B, C=CVD_C):
    """Resistance of a platinum resistance thermometer (Callendar-Van Dusen equation).

    R(t) = R0 [1 + A t + B t^2 + C (t - 100) t^3]   for -200 degC <= t < 0 degC
    R(t) = R0 [1 + A t + B t^2]                     for 0 degC <= t <= 850 degC
    with t = T - 273.15 in degC.

    Parameters
    ----------
    T : float
        Temperature, [K]
    R0 : float
        Resistance at 0 degC (100 ohm for a Pt100), [ohm]
    A : float, optional
        Coefficient, [1/K]; IEC 60751 value 3.9083e-3
    B : float, optional
        Coefficient, [1/K^2]; IEC 60751 value -5.775e-7
    C : float, optional
        Coefficient, [1/K^4]; IEC 60751 value -4.183e-12

    Returns
    -------
    R : float
        Resistance, [ohm]

    Notes
    -----
    Defined for -200 to 850 degC (73.15 to 1123.15 K); outside that the polynomial is
    extrapolated (see cvd_warnings). Pt100: 138.5055 ohm at 100 degC, 18.5201 ohm at
    -200 degC.

    References
    ----------
    1. IEC 60751:2008, Industrial platinum resistance thermometers and platinum temperature
       sensors, clause 4.2 (equations 1 and 2) and Table 1.
    2. Callendar, H. L., Phil. Trans. R. Soc. A 178, 161 (1887); Van Dusen, M. S.,
       J. Am. Chem. Soc. 47, 326 (1925), doi:10.1021/ja01679a007.

    Examples
    --------
    A Pt100 at 100 degC and at -200 degC: 138.5055 ohm and 18.5201 ohm, as IEC 60751 Table 1 prints
    (138.51 and 18.52 ohm, from memory):

    >>> round(callendar_van_dusen_resistance(373.15, 100.0), 4), round(callendar_van_dusen_resistance(73.15, 100.0), 4)
    (138.5055, 18.5201)
    """
    _check_temperature(T, "T")
    if not _finite(R0) or R0 <= 0.0:
        raise CoreError("R0 must be above 0 ohm", "R0")
    t = T - ZERO_CELSIUS
    if t < 0.0:
        return R0 * (1.0 + A * t + B * t * t + C * (t - 100.0) * t * t * t)
    return R0 * (1.0 + A * t + B * t * t)


def callendar_van_dusen_temperature(R, R0, A=CVD_A, B=CVD_B, C=CVD_C):
    """Temperature of a platinum resistance thermometer from its resistance (inverse CVD).

    R >= R0:  t = 2 (R/R0 - 1) / (A + sqrt(A^2 + 4 B (R/R0 - 1)))
              (the root of R0 [1 + A t + B t^2] = R, rearranged to avoid cancellation)
    R < R0:   Newton iteration on R0 [1 + A t + B t^2 + C (t - 100) t^3] = R, started at
              the quadratic root; converges to < 1e-12 K in 3-5 steps over -200..0 degC.

    Parameters
    ----------
    R : float
        Measured resistance, [ohm]
    R0 : float
        Resistance at 0 degC, [ohm]
    A, B, C : float, optional
        Coefficients as for callendar_van_dusen_resistance, [1/K], [1/K^2], [1/K^4]

    Returns
    -------
    T : float
        Temperature, [K]

    Notes
    -----
    Valid for R between R(-200 degC) and R(850 degC); check the result with cvd_warnings.

    References
    ----------
    1. IEC 60751:2008, clause 4.2.

    Examples
    --------
    The two IEC 60751 points back (t in degC):

    >>> round(callendar_van_dusen_temperature(138.5055, 100.0) - 273.15, 6)
    100.0
    >>> round(callendar_van_dusen_temperature(18.5201, 100.0) - 273.15, 3)
    -200.0
    """
    if not _finite(R) or R <= 0.0:
        raise CoreError("resistance must be above 0 ohm", "R")
    if not _finite(R0) or R0 <= 0.0:
        raise CoreError("R0 must be above 0 ohm", "R0")
    w = R / R0 - 1.0
    disc = A * A + 4.0 * B * w
    if disc < 0.0:
        raise CoreError("resistance is above the maximum of the Callendar-Van Dusen curve",
                        "R")
    t = 2.0 * w / (A + math.sqrt(disc))
    if w < 0.0:
        for _ in range(50):
            f = A * t + B * t * t + C * (t - 100.0) * t * t * t - w
            df = A + 2.0 * B * t + C * (4.0 * t - 300.0) * t * t
            dt = f / df
            t = t - dt
            if abs(dt) <= 1e-13 * (1.0 + abs(t)):
                break
    T = t + ZERO_CELSIUS
    if not (T > 0.0):
        raise CoreError("resistance is below what the Callendar-Van Dusen curve reaches above "
                        "0 K", "R")
    return T


# __pragma__ ('nokwargs')
def cvd_warnings(T):
    """Warnings for a Callendar-Van Dusen evaluation at T [K] (range -200..850 degC).

    Examples
    --------
    >>> cvd_warnings(373.15), len(cvd_warnings(1200.0))
    ([], 1)
    """
    out = []
    t = T - ZERO_CELSIUS
    if t < -200.0 or t > 850.0:
        out.append("IEC 60751 defines the Callendar-Van Dusen equation for -200 to 850 degC "
                   "(73.15 to 1123.15 K); this temperature is outside it")
    return out


# --------------------------------------------------------------------------------------
# Tabulated rho(T)


def _check_table(temperatures, values):
    if len(temperatures) != len(values):
        raise CoreError("table has " + str(len(temperatures)) + " temperatures but "
                        + str(len(values)) + " values", "table")
    if len(temperatures) < 2:
        raise CoreError("table needs at least 2 points", "table")
    for i in range(1, len(temperatures)):
        if not (temperatures[i] > temperatures[i - 1]):
            raise CoreError("table temperatures must increase strictly; point " + str(i)
                            + " does not", "table")


def interpolate_table(T, temperatures, values):
    """Piecewise-linear interpolation of a tabulated property, e.g. rho(T).

    y(T) = y_i + (y_{i+1} - y_i) (T - T_i) / (T_{i+1} - T_i),  T_i <= T <= T_{i+1}

    Parameters
    ----------
    T : float
        Temperature, [K]
    temperatures : list
        Table temperatures, strictly increasing, [K]
    values : list
        Tabulated values at those temperatures (e.g. resistivity, [ohm*m])

    Returns
    -------
    y : float
        Interpolated value, in the table's unit

    Notes
    -----
    Outside the table the end segment is extended linearly; table_warnings and
    is_extrapolated report it.

    Examples
    --------
    Halfway between two points, by hand: (1.543 + 1.725) / 2 = 1.634 (uohm*cm; copper at 0 and
    25 degC, illustrative values):

    >>> interpolate_table(285.65, [273.15, 298.15], [1.543, 1.725])
    1.634
    """
    _check_table(temperatures, values)
    if not _finite(T):
        raise CoreError("temperature must be a finite number", "T")
    last = len(temperatures) - 1
    i = 0
    while i < last - 1 and T > temperatures[i + 1]:
        i += 1
    t0 = temperatures[i]
    t1 = temperatures[i + 1]
    return values[i] + (values[i + 1] - values[i]) * (T - t0) / (t1 - t0)


def is_extrapolated(T, temperatures):
    """True when T lies outside [temperatures[0], temperatures[-1]].

    Examples
    --------
    >>> is_extrapolated(300.0, [273.15, 298.15]), is_extrapolated(280.0, [273.15, 298.15])
    (True, False)
    """
    return T < temperatures[0] or T > temperatures[len(temperatures) - 1]


def table_warnings(T, temperatures):
    """Warnings for interpolate_table at T: a message when it extrapolates.

    Messages carry no numbers, so CPython and JS give identical text (str() of a float
    differs between the two runtimes).

    Examples
    --------
    >>> table_warnings(300.0, [273.15, 298.15])
    ['extrapolated above the highest temperature in the table']
    """
    out = []
    lo = temperatures[0]
    hi = temperatures[len(temperatures) - 1]
    if T < lo:
        out.append("extrapolated below the lowest temperature in the table")
    if T > hi:
        out.append("extrapolated above the highest temperature in the table")
    return out
# __pragma__ ('kwargs')
