"""A bare conductor heated by a fault current with no time to lose heat (the adiabatic case).

Heat balance per unit volume while the current density J flows:
    ρ(θ) J² dt = c_v(θ) dθ   ⇒   J² t = ∫ c_v(θ)/ρ(θ) dθ  from θi to θf     (1)
This module integrates (1) with any ρ(θ) (a function of the temperature [K]) and a volumetric heat
capacity c_v = density · c_p held constant, and gives IEC 60949's closed form beside it:
    I² t = K² S² ln((θf + β)/(θi + β))                                              (2)
which is (1) for ρ linear in θ (ρ = ρ20 (β + θ)/(β + 20)) and c_v constant, K² = c_v (β + 20)/ρ20.

SI floats in and out (temperatures in K; (2) converts to °C internally), the Transcrypt subset,
CoreError for impossible inputs. Not a cable rating: the insulation, the protective device and the
mechanical forces decide a real installation.
"""

import math

from conductor_atlas.core.celsius import ZERO_CELSIUS
from conductor_atlas.core.errors import CoreError, check_positive

# IEC 60949:1988, Table I (from memory of the standard): K [A*s^0.5/mm^2] and β [K] per conductor
# material, for θ in °C in (2). Converted to SI here: K [A*s^0.5/m^2] = K [A*s^0.5/mm^2] · 1e6.
IEC60949_K_COPPER = 226.0e6
IEC60949_BETA_COPPER = 234.5
IEC60949_K_ALUMINIUM = 148.0e6
IEC60949_BETA_ALUMINIUM = 228.0

SIMPSON_PANELS = 64  # even; Simpson's rule on 1/ρ over ≤ 1000 K is far below 1e-6 relative for linear ρ


# __pragma__ ('nokwargs')
def check_squarable(x, field, what):
    """CoreError unless x is finite, above 0, and x² neither underflows to 0 nor overflows (I², S² appear).

    
    >>> check_squarable(1e200, 'current', 'the current')
    Traceback (most recent call last):
    ...
    conductor_atlas.core.errors.CoreError: the current is too small or too large to compute with
    """
    check_positive(x, field, what)
    square = x * x
    if not (square > 0) or not (square - square == 0):
        raise CoreError(what + " is too small or too large to compute with", field)


def iec60949_final_temperature(current, time_s, area, k, beta, theta_i):
    """Final temperature after an adiabatic short circuit by IEC 60949's formula (2).

    θf = (θi + β) · exp(I² t / (K² S²)) − β

    current : float  Fault current I (r.m.s. over the duration), [A]
    time_s : float   Duration t, [s]
    area : float     Conductor cross-section S, [m^2]
    k : float        K of the conductor material, [A*s^0.5/m^2] (copper 226e6, aluminium 148e6)
    beta : float     β of the conductor material, [K] (copper 234.5, aluminium 228)
    theta_i : float  Initial temperature, [K]

    Returns θf [K]. Source: IEC 60949:1988, clause 3 (from memory).
    Validity: adiabatic (no heat lost during the fault), about t ≤ 5 s; c_v and the linear ρ of (2).

    Example: 10 kA for 1 s in 95 mm² copper starting at 90 °C ends near 168.6 °C:

    >>> round(iec60949_final_temperature(10e3, 1.0, 95e-6, 226e6, 234.5, 363.15) - 273.15, 1)
    168.6
    """
    check_squarable(current, "current", "the current")
    check_squarable(time_s, "duration", "the duration")
    check_squarable(area, "size", "the cross-section")
    check_squarable(k, "k", "K")
    ti = theta_i - ZERO_CELSIUS
    if not (ti + beta > 0):
        raise CoreError("the initial temperature lies below −β", "initial")
    x = current * current * time_s / (k * k * area * area)
    return (ti + beta) * math.exp(x) - beta + ZERO_CELSIUS


def iec60949_min_area(current, time_s, k, beta, theta_i, theta_f):
    """Smallest cross-section that keeps the final temperature at θf, by IEC 60949's formula (2).

    S = I √t / (K √ln((θf + β)/(θi + β))),  [m^2]. Arguments as iec60949_final_temperature;
    theta_f [K] above theta_i.

    Example: 10 kA for 1 s in copper from 90 °C to 250 °C needs 69.89 mm²:

    >>> round(iec60949_min_area(10e3, 1.0, 226e6, 234.5, 363.15, 523.15) * 1e6, 2)
    69.89
    """
    check_squarable(current, "current", "the current")
    check_squarable(time_s, "duration", "the duration")
    return current * math.sqrt(time_s) / (k * math.sqrt(iec60949_log_ratio(beta, theta_i, theta_f)))


def iec60949_max_time(current, area, k, beta, theta_i, theta_f):
    """Longest duration a cross-section carries I from θi to θf, IEC 60949 (2): t = K² S² ln(…)/I², [s].

    >>> round(iec60949_max_time(10e3, 95e-6, 226e6, 234.5, 363.15, 523.15), 2)   # 95 mm² Cu, 90 → 250 °C
    1.85
    """
    check_squarable(current, "current", "the current")
    check_squarable(area, "size", "the cross-section")
    return k * k * area * area * iec60949_log_ratio(beta, theta_i, theta_f) / (current * current)


def iec60949_log_ratio(beta, theta_i, theta_f):
    """ln((θf + β)/(θi + β)) with θ in °C (θi, θf given in K), [-].

    >>> round(iec60949_log_ratio(234.5, 363.15, 523.15), 5)   # ln(484.5 / 324.5)
    0.40083
    """
    ti = theta_i - ZERO_CELSIUS
    tf = theta_f - ZERO_CELSIUS
    if not (ti + beta > 0):
        raise CoreError("the initial temperature lies below −β", "initial")
    if not (tf > ti):
        raise CoreError("the final temperature must lie above the initial one", "final")
    return math.log((tf + beta) / (ti + beta))


def iec60949_k(volumetric_heat, rho_20, beta):
    """IEC 60949's K from material data: K = √(c_v (β + 20) / ρ20), [A*s^0.5/m^2].

    volumetric_heat : float  c_v, [J/(K*m^3)] (copper 3.45e6, aluminium 2.5e6 in IEC 60949)
    rho_20 : float           Resistivity at 20 °C, [ohm*m]
    beta : float             [K]
    Example: copper, √(3.45e6 · 254.5 / 1.7241e-8) = 225.7e6 (the standard rounds to 226).

    >>> round(iec60949_k(3.45e6, 1.7241e-8, 234.5) / 1e6, 1)
    225.7
    """
    check_squarable(volumetric_heat, "material", "the volumetric heat capacity")
    check_squarable(rho_20, "material", "the resistivity")
    return math.sqrt(volumetric_heat * (beta + 20.0) / rho_20)


def heat_integral(rho_values, theta_lo, theta_hi, volumetric_heat):
    """∫ c_v / ρ(θ) dθ from θlo to θhi by Simpson's rule, [A^2*s/m^4] (the right side of (1)).

    rho_values : list of float  ρ [ohm*m] at the SIMPSON_PANELS + 1 equally spaced temperatures
                                integration_points(theta_lo, theta_hi) gives
    theta_lo, theta_hi : float  Limits, [K]
    volumetric_heat : float     c_v, [J/(K*m^3)], held constant

    Example: copper with the linear ρ of IEC 60028 from 90 °C to 250 °C; equals the closed form
    linear_heat_integral to 1e-9:

    >>> points = integration_points(363.15, 523.15)
    >>> rho = [1.7241e-8 * (1.0 + 0.00393 * (t - 293.15)) for t in points]
    >>> exact = linear_heat_integral(3.45e6, 1.7241e-8, 0.00393, 293.15, 363.15, 523.15)
    >>> abs(heat_integral(rho, 363.15, 523.15, 3.45e6) / exact - 1.0) < 1e-9
    True
    """
    n = len(rho_values) - 1
    if n < 2 or n % 2 != 0:
        raise CoreError("Simpson's rule needs an even number of panels", "")
    h = (theta_hi - theta_lo) / n
    total = 0.0
    for i in range(n + 1):
        w = simpson_weight(i, n)
        rho = rho_values[i]
        if not (rho > 0):
            raise CoreError("the resistivity model gives no positive value in this temperature span", "final")
        total += w / rho
    return volumetric_heat * total * h / 3.0


def simpson_weight(i, n):
    """Simpson's weight of point i of n panels (n even): 1 at the ends, 4 at odd points, 2 between.

    >>> [simpson_weight(i, 4) for i in range(5)]
    [1.0, 4.0, 2.0, 4.0, 1.0]
    """
    if i == 0 or i == n:
        return 1.0
    if i % 2 == 1:
        return 4.0
    return 2.0


def integration_points(theta_lo, theta_hi):
    """The SIMPSON_PANELS + 1 equally spaced temperatures [K] heat_integral expects ρ at.

    >>> points = integration_points(363.15, 523.15)
    >>> len(points), points[0], points[64]
    (65, 363.15, 523.15)
    """
    points = []
    h = (theta_hi - theta_lo) / SIMPSON_PANELS
    for i in range(SIMPSON_PANELS + 1):
        points.append(theta_lo + h * i)
    return points


def linear_heat_integral(volumetric_heat, rho_ref, alpha, t_ref, theta_lo, theta_hi):
    """The closed form of heat_integral for ρ = ρref (1 + α (θ − θref)), [A^2*s/m^4]:

    c_v / (ρref α) · ln(ρ(θhi) / ρ(θlo))   (the check on the numerical integral)

    >>> '%.5e' % linear_heat_integral(3.45e6, 1.7241e-8, 0.00393, 293.15, 363.15, 523.15)
    '2.04117e+16'
    """
    rho_lo = rho_ref * (1.0 + alpha * (theta_lo - t_ref))
    rho_hi = rho_ref * (1.0 + alpha * (theta_hi - t_ref))
    return volumetric_heat / (rho_ref * alpha) * math.log(rho_hi / rho_lo)
# __pragma__ ('kwargs')
