"""AC resistance of a round conductor made of a core and a cladding (copper-clad steel or aluminium).

Exact solution of the diffusion equation in two concentric layers, each with its own resistivity
and permeability. In a layer the axial field E = rho J obeys (1/r) d/dr (r dE/dr) = k^2 E with
k = (1 + i) / delta, so

    core (r < b):         E = A I0(k1 r)
    cladding (b < r < a): E = B I0(k2 r) + C K0(k2 r)

with E and H = (dE/dr) / (i omega mu) continuous at r = b. The internal impedance per length is
Z = E(a) / I, I = 2 pi a H(a), so Z = k2 rho2 / (2 pi a p), p = E'(a) / (k2 E(a)), and
R_ac = Re Z. I0, I1, K0, K1 at z = x e^(i pi/4) are Kelvin functions (ber, bei, ker, kei); they
enter only through ratios of exponentially scaled values, so nothing overflows at any frequency.

Pure Python in the Transcrypt subset (math only, complex numbers as [re, im] pairs); SI floats.

References
----------
1. Ramo, S., Whinnery, J. R., Van Duzer, T., Fields and Waves in Communication Electronics,
   3rd ed., 1994, sec. 5.6 (internal impedance of a round wire; the layered case follows by
   matching E and H at the interface, as in any boundary-value problem of that section).
2. NIST DLMF, sec. 10.25, 10.32.9 (K_nu(z) = int_0^inf exp(-z cosh t) cosh(nu t) dt,
   Re z > 0) and 10.61 (Kelvin functions), https://dlmf.nist.gov/10.
"""

import math

from conductor_atlas.core.errors import CoreError, check_positive
from conductor_atlas.core import skin_effect as skin
from conductor_atlas.core.kelvin_functions import kelvin_scaled

_SQRT2 = math.sqrt(2.0)
_INV_SQRT2 = 1.0 / math.sqrt(2.0)
# Above this x the core's I1/I0 comes from its asymptotic expansion (kelvin_scaled is measured to
# 1.1e-12 of its envelope up to here, core.kelvin_functions)
_LARGE_X = 1e4


def _mul(a, b):
    return [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]]


def _div(a, b):
    d = b[0] * b[0] + b[1] * b[1]
    return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d]


def _sub(a, b):
    return [a[0] - b[0], a[1] - b[1]]


def _add(a, b):
    return [a[0] + b[0], a[1] + b[1]]


def _scale(a, s):
    return [a[0] * s, a[1] * s]


# e^(-i pi/4)
_ROT = [_INV_SQRT2, -_INV_SQRT2]


def kelvin_k_scaled(x):
    """Kelvin functions of the second kind and derivatives times exp(x / sqrt 2).

    ker x + i kei x = K0(x e^(i pi/4)),  ker' x + i kei' x = -e^(i pi/4) K1(x e^(i pi/4))

    Parameters
    ----------
    x : float
        Real argument, x >= 1e-100, [-]

    Returns
    -------
    values : list
        [ker x, kei x, ker' x, kei' x] each multiplied by exp(x / sqrt 2)

    Notes
    -----
    K_nu(z) = int_0^inf exp(-z cosh t) cosh(nu t) dt (DLMF 10.32.9, Re z > 0) by the trapezoidal
    rule. The integrand is entire in t and decays in the strip |Im t| < pi/4, so the rule converges
    like exp(-pi^2 / (2 h)): h = 1/8 leaves 7e-18; for large x the integrand is a complex Gaussian
    of width ~ 1/sqrt(x), hence h <= 0.35 / sqrt(x) (measured: 0.5 left 5e-13 at x = 16). The integral stops where the scaled integrand
    is below exp(-40). No cancellation: the scaled integrand is at most 1 and the value is of the
    same order. Checked against scipy.special (ker, kei, kerp, keip, kve) in the tests.

    Examples
    --------
    At x = 2: scipy.special.ker, kei, kerp, keip times exp(2 / sqrt 2) give -0.171376578, -0.832522155,
    -0.438476463, 0.904124969 (checked while writing this example):

    >>> [round(v, 9) for v in kelvin_k_scaled(2.0)]
    [-0.171376578, -0.832522155, -0.438476463, 0.904124969]
    """
    if not (x - x == 0) or not (x >= 1e-100):
        raise CoreError("Kelvin function argument must be a finite number >= 1e-100", "x")
    s = x * _INV_SQRT2  # Re z = Im z
    h = 0.125
    if 0.35 / math.sqrt(x) < h:
        h = 0.35 / math.sqrt(x)
    y = 1.0 + 40.0 / s  # cosh t at which s (cosh t - 1) = 40
    t_max = math.log(2.0 * y)  # acosh y, for large y
    if y < 1e8:
        t_max = math.log(y + math.sqrt(y * y - 1.0))
    n = math.floor(t_max / h) + 1
    k0 = [0.0, 0.0]
    k1 = [0.0, 0.0]
    for i in range(n + 1):
        t = i * h
        c = math.cosh(t)
        w = h
        if i == 0:
            w = 0.5 * h
        mag = w * math.exp(-s * (c - 1.0))
        ph = -s * c  # exp(-i s cosh t)
        re = mag * math.cos(ph)
        im = mag * math.sin(ph)
        k0[0] += re
        k0[1] += im
        k1[0] += re * c
        k1[1] += im * c
    # the scaling exp(x/sqrt 2) = exp(Re z) was taken out as exp(-s (c - 1)) with the phase kept
    # whole; ker' + i kei' = -e^(i pi/4) K1
    d = _mul([-_INV_SQRT2, -_INV_SQRT2], k1)
    return [k0[0], k0[1], d[0], d[1]]


def _i_ratio_scaled(x):
    # [I0~, I1~] at z = x e^(i pi/4), scaled by exp(-x/sqrt 2); I1 = e^(-i pi/4) (ber' + i bei')
    v = kelvin_scaled(x)
    return [[v[0], v[1]], _mul(_ROT, [v[2], v[3]])]


def _core_ratio(x):
    # I1(z) / I0(z), z = x e^(i pi/4); small x: I1/I0 = z/2 - z^3/16 + ...; large x: asymptotic
    if x > _LARGE_X:
        # 1 - 1/(2z) - 1/(8 z^2) from DLMF 10.40.1 (error of order z^-3)
        inv = [_INV_SQRT2 / x, -_INV_SQRT2 / x]  # 1/z
        inv2 = _mul(inv, inv)
        return [1.0 - 0.5 * inv[0] - 0.125 * inv2[0], -0.5 * inv[1] - 0.125 * inv2[1]]
    if x == 0.0:
        return [0.0, 0.0]
    v = _i_ratio_scaled(x)
    return _div(v[1], v[0])


def layered_round_impedance(core_radius, outer_radius, rho_core, mu_core, rho_clad, mu_clad, f):
    """Internal impedance per length of a round conductor with a core and a cladding.

    Z = k2 rho2 / (2 pi a p),  p = (I1(u_a) - c g K1(u_a)) / (I0(u_a) + c g K0(u_a)) (scaled),
    c = (I1(u_b) - q I0(u_b)) / (K1(u_b) + q K0(u_b)) (scaled), q = (mu2 delta2 / (mu1 delta1)) I1/I0(k1 b),
    g = exp(-sqrt 2 (x_a - x_b)), u = k2 r, x = sqrt 2 r / delta2

    Parameters
    ----------
    core_radius : float
        Core radius b, 0 <= b <= a, [m] (0: no core, b = a: no cladding)
    outer_radius : float
        Outer radius a, [m]
    rho_core, rho_clad : float
        Resistivity of core and cladding, [ohm*m]
    mu_core, mu_clad : float
        Relative permeability of core and cladding, [-] (linear: a single value each)
    f : float
        Frequency, [Hz]

    Returns
    -------
    z : list
        [R, X]: resistance and internal reactance per length, [ohm/m]

    Notes
    -----
    Straight isolated conductor, good-conductor limit (no displacement current), linear media.
    Reduces to the homogeneous Kelvin solution when both layers are equal (checked in the tests).

    Examples
    --------
    With no core (b = 0) it is the homogeneous wire: copper (IEC 60028, 1.7241e-8 ohm*m) of 1 mm
    radius at 50 kHz, R / R_dc = 1.96599068, as scipy.special's ber, bei, berp and beip give at
    x = sqrt(2) a / delta (x = 4.785) by the formula in core.skin_effect.kelvin_resistance_ratio:

    >>> z = layered_round_impedance(0.0, 1e-3, 1.7241e-8, 1.0, 1.7241e-8, 1.0, 50e3)
    >>> round(z[0] / (1.7241e-8 / (math.pi * 1e-6)), 8)
    1.96599068
    """
    check_positive(outer_radius, "outer_radius", "outer radius")
    check_positive(rho_core, "rho_core", "core resistivity")
    check_positive(rho_clad, "rho_clad", "cladding resistivity")
    if not (core_radius >= 0.0) or not (core_radius <= outer_radius):
        raise CoreError("the core radius must lie between 0 and the outer radius", "core_radius")
    a = outer_radius
    b = core_radius
    if b == a:
        # no cladding: the homogeneous wire of the core's material
        rho_clad = rho_core
        mu_clad = mu_core
        b = 0.0
    d2 = skin.skin_depth(rho_clad, f, mu_clad)
    xa = _SQRT2 * a / d2
    if xa < 1e-100:
        raise CoreError("the conductor is too thin against its skin depth to compute an impedance", "outer_radius")
    if xa > 1e8:
        raise CoreError("the conductor is more than 7e7 skin depths across: frequency too high to compute", "f")
    p = [0.0, 0.0]
    g = 0.0
    xb = 0.0
    if b > 0.0:
        xb = _SQRT2 * b / d2
        g = math.exp(-_SQRT2 * (xa - xb))
    if g > 0.0:
        d1 = skin.skin_depth(rho_core, f, mu_core)
        q = _scale(_core_ratio(_SQRT2 * b / d1), mu_clad * d2 / (mu_core * d1))
        ib = _i_ratio_scaled(xb)
        kb = kelvin_k_scaled(xb)
        k0b = [kb[0], kb[1]]
        k1b = _mul([-_INV_SQRT2, _INV_SQRT2], [kb[2], kb[3]])  # K1 = -e^(-i pi/4) (ker' + i kei')
        c = _div(_sub(ib[1], _mul(q, ib[0])), _add(k1b, _mul(q, k0b)))
        ka = kelvin_k_scaled(xa)
        k0a = [ka[0], ka[1]]
        k1a = _mul([-_INV_SQRT2, _INV_SQRT2], [ka[2], ka[3]])
        ia = _i_ratio_scaled(xa)
        cg = _scale(c, g)
        p = _div(_sub(ia[1], _mul(cg, k1a)), _add(ia[0], _mul(cg, k0a)))
    else:
        p = _core_ratio(xa)
    # k2 rho2 = (1 + i) rho2 / delta2
    z = _div([rho_clad / d2, rho_clad / d2], _scale(p, 2.0 * math.pi * a))
    return z


def layered_round_dc_resistance(core_radius, outer_radius, rho_core, rho_clad):
    """DC resistance per length of the two layers in parallel [ohm/m]:
    1 / (pi b^2 / rho_core + pi (a^2 - b^2) / rho_clad).

    Examples
    --------
    A 1 mm wire, 0.8 mm steel core (1.5e-7 ohm*m, illustrative) in copper (1.7241e-8 ohm*m): by hand
    1 / (pi 0.16e-6 / 1.5e-7 + pi 0.09e-6 / 1.7241e-8) = 0.050632 ohm/m:

    >>> round(layered_round_dc_resistance(0.4e-3, 0.5e-3, 1.5e-7, 1.7241e-8), 6)
    0.050632
    """
    check_positive(outer_radius, "outer_radius", "outer radius")
    b = core_radius
    a = outer_radius
    return 1.0 / (math.pi * b * b / rho_core + math.pi * (a * a - b * b) / rho_clad)


def layered_round_resistance_ratio(core_radius, outer_radius, rho_core, mu_core, rho_clad, mu_clad, f):
    """R_ac / R_dc of a round conductor with a core and a cladding (layered_round_impedance's R over
    layered_round_dc_resistance), [-]; exactly 1 where both layers are under 1e-6 skin depths across.

    Examples
    --------
    Both layers copper: the homogeneous wire's 1.96599068 (see layered_round_impedance):

    >>> round(layered_round_resistance_ratio(0.5e-3, 1e-3, 1.7241e-8, 1.0, 1.7241e-8, 1.0, 50e3), 8)
    1.96599068
    """
    check_positive(outer_radius, "outer_radius", "outer radius")
    x_core = _SQRT2 * core_radius / skin.skin_depth(rho_core, f, mu_core)
    x_clad = _SQRT2 * outer_radius / skin.skin_depth(rho_clad, f, mu_clad)
    if x_core < 1e-6 and x_clad < 1e-6:
        return 1.0  # the first correction is of order x^4 / 192 < 1e-26
    z = layered_round_impedance(core_radius, outer_radius, rho_core, mu_core, rho_clad, mu_clad, f)
    return z[0] / layered_round_dc_resistance(core_radius, outer_radius, rho_core, rho_clad)


def core_radius_for_cladding_share(outer_radius, cladding_area_fraction):
    """Core radius b [m] of a wire of outer radius a [m] whose cladding is the given share of the
    cross-section by area: b = a sqrt(1 - share), share in [0, 1].

    Examples
    --------
    A cladding of 36 % of the area leaves a core of sqrt(0.64) = 0.8 of the radius:

    >>> round(core_radius_for_cladding_share(1e-3, 0.36) * 1e3, 12)
    0.8
    """
    if not (cladding_area_fraction >= 0.0) or not (cladding_area_fraction <= 1.0):
        raise CoreError("the cladding share must lie between 0 and 1", "cladding_area_fraction")
    return outer_radius * math.sqrt(1.0 - cladding_area_fraction)
