"""Kelvin functions of order 0 (ber, bei and their derivatives) for real arguments x >= 0.

ber x + i bei x = J_0(x e^(3 pi i / 4)): the functions of the exact skin-effect solution of a round
wire (core.skin_effect.kelvin_resistance_ratio) and, through their exponentially scaled form, of the
two-layer solution (core.layered_round). Power series below KELVIN_SWITCH, Hankel asymptotic
expansions above; pure Python in the Transcrypt subset; CoreError for a negative or non-finite x.

References
----------
1. Abramowitz, M., Stegun, I. A., Handbook of Mathematical Functions, 1964, sec. 9.9 and 9.10.
2. NIST DLMF, sec. 10.17 and 10.61, https://dlmf.nist.gov/10.61.
"""

import math

from conductor_atlas.core.errors import CoreError

_SQRT2 = math.sqrt(2.0)
_INV_SQRT2 = 1.0 / math.sqrt(2.0)

# Below this argument the power series is used, above it the asymptotic expansion.
# Measured against mpmath (40 digits), as a fraction of the envelope exp(x/sqrt 2)/sqrt(2 pi x):
# the series' cancellation error grows like 1e-16 exp(0.29 x) (3e-15 at x = 16.5, 2.5e-12
# at 40), the asymptotic error falls like exp(-2 x) (1.3e-13 at 14, 1.6e-15 at 16.5); they
# cross near 16.5, where both are below 3e-15.
KELVIN_SWITCH = 16.5


# __pragma__ ('nokwargs')
def _kelvin_series(x):
    # A&S 9.9.10, 9.9.11 and their term-by-term derivatives
    q = 0.25 * x * x  # (x/2)^2
    q2 = q * q
    term_r = 1.0  # (-1)^k (x/2)^(4k) / ((2k)!)^2
    term_i = q  # (-1)^k (x/2)^(4k+2) / ((2k+1)!)^2
    ber = 0.0
    bei = 0.0
    berp = 0.0
    beip = 0.0
    k = 0
    while k < 200:
        ber += term_r
        bei += term_i
        # d/dx (x/2)^(2m) = m (x/2)^(2m - 1) = (2m / x) (x/2)^(2m); here 2m = 4k and 4k + 2
        if x > 0.0:
            berp += 4.0 * k * term_r / x
            beip += (4.0 * k + 2.0) * term_i / x
        if abs(term_r) + abs(term_i) <= 1e-17 * (abs(ber) + abs(bei)):
            break
        term_r = -term_r * q2 / ((2.0 * k + 1.0) * (2.0 * k + 2.0)) ** 2
        term_i = -term_i * q2 / ((2.0 * k + 2.0) * (2.0 * k + 3.0)) ** 2
        k += 1
    if x == 0.0:
        beip = 0.0
    return [ber, bei, berp, beip]


def _hankel_sum(nu, x, sign):
    # sum_k (sign i)^k a_k(nu) / z^k with z = x exp(3 pi i / 4), a_k from DLMF 10.17.1;
    # returned as [real, imag]. Stops at the smallest term (asymptotic series).
    mu = 4.0 * nu * nu
    sr = 1.0
    si = 0.0
    a = 1.0
    prev = 1.0
    # one step multiplies by (sign i) / z = sign i exp(-3 pi i / 4) / x
    ang = sign * 0.5 * math.pi - 0.75 * math.pi
    cr = math.cos(ang)
    ci = math.sin(ang)
    pr = 1.0
    pi_ = 0.0
    for k in range(1, 80):
        a = a * (mu - (2.0 * k - 1.0) ** 2) / (8.0 * k * x)
        if abs(a) >= prev:
            break
        prev = abs(a)
        t = pr * cr - pi_ * ci
        pi_ = pr * ci + pi_ * cr
        pr = t
        sr += a * pr
        si += a * pi_
        if abs(a) < 1e-17:
            break
    return [sr, si]


def _bessel_j_scaled(nu, x):
    # exp(-x / sqrt 2) J_nu(z), z = x exp(3 pi i / 4), from J = (H1 + H2) / 2 with the
    # Hankel expansions (DLMF 10.17.5, 10.17.6).
    amp = 0.5 * math.sqrt(2.0 / (math.pi * x))
    # H2 part: sqrt(2/(pi z)) exp(-i w), w = z - nu pi/2 - pi/4 -> modulus exp(x/sqrt2)
    ph2 = x * _INV_SQRT2 + 0.5 * nu * math.pi + 0.25 * math.pi - 0.375 * math.pi
    s2 = _hankel_sum(nu, x, -1.0)
    c2r = math.cos(ph2)
    c2i = math.sin(ph2)
    re = amp * (c2r * s2[0] - c2i * s2[1])
    im = amp * (c2r * s2[1] + c2i * s2[0])
    # H1 part, recessive by exp(-sqrt2 x) after scaling. arg z = 3 pi/4 lies beyond the
    # Stokes line of H2 (arg pi/2), where its expansion has switched on a multiple of the
    # recessive exponential; evaluating at -z (arg -pi/4, J_nu(-z) = (-1)^nu J_nu(z)) avoids
    # that and flips the sign of this term: hence + pi in its phase (measured with mpmath).
    damp = math.exp(-_SQRT2 * x)
    if damp > 0.0:
        ph1 = -x * _INV_SQRT2 - 0.5 * nu * math.pi + 0.375 * math.pi
        s1 = _hankel_sum(nu, x, 1.0)
        c1r = math.cos(ph1)
        c1i = math.sin(ph1)
        re += damp * amp * (c1r * s1[0] - c1i * s1[1])
        im += damp * amp * (c1r * s1[1] + c1i * s1[0])
    return [re, im]


def kelvin_scaled(x):
    """Kelvin functions and derivatives times exp(-x / sqrt 2), which never overflow.

    ber x + i bei x = J_0(x e^(3 pi i / 4)),  ber' x + i bei' x = -e^(3 pi i / 4) J_1(x e^(3 pi i / 4))

    Parameters
    ----------
    x : float
        Real argument, x >= 0, [-]

    Returns
    -------
    values : list
        [ber x, bei x, ber' x, bei' x] each multiplied by exp(-x / sqrt 2)

    Notes
    -----
    Power series (A&S 9.9.10-11) for x < KELVIN_SWITCH, Hankel asymptotic expansions of
    J_0 and J_1 (DLMF 10.17.5-6, both exponentials kept) above. Accuracy, measured against
    mpmath: within 1.1e-12 of the envelope exp(x/sqrt 2)/sqrt(2 pi x) for 0 <= x <= 1e4
    (the error grows with x through the phase x/sqrt 2, whose rounding is 1e-12 at x = 1e4),
    3e-15 for x <= 40. Near a zero of a function the error is absolute on the envelope's
    scale, as it is for any evaluation of an oscillating function.

    References
    ----------
    1. Abramowitz, M., Stegun, I. A., Handbook of Mathematical Functions, 1964, sec. 9.9
       and 9.10.
    2. NIST DLMF, sec. 10.17 and 10.61, https://dlmf.nist.gov/10.61.

    Examples
    --------
    At x = 2: scipy.special.ber, bei, berp, beip times exp(-2 / sqrt 2) give 0.182759160,
    0.236380365, -0.119872869, 0.222941355 (checked while writing this example):

    >>> [round(v, 9) for v in kelvin_scaled(2.0)]
    [0.18275916, 0.236380365, -0.119872869, 0.222941355]
    """
    if not (x - x == 0) or x < 0.0:
        raise CoreError("Kelvin function argument must be a finite number >= 0", "x")
    if x < KELVIN_SWITCH:
        v = _kelvin_series(x)
        s = math.exp(-x * _INV_SQRT2)
        return [v[0] * s, v[1] * s, v[2] * s, v[3] * s]
    j0 = _bessel_j_scaled(0.0, x)
    j1 = _bessel_j_scaled(1.0, x)
    # -e^(3 pi i/4) = (1 - i)/sqrt 2 ; (1 - i)(a + i b) = (a + b) + i (b - a)
    return [j0[0], j0[1], (j1[0] + j1[1]) * _INV_SQRT2, (j1[1] - j1[0]) * _INV_SQRT2]


def kelvin_functions(x):
    """Kelvin functions [ber x, bei x, ber' x, bei' x] of order 0 and real x >= 0.

    Parameters
    ----------
    x : float
        Real argument, [-]

    Returns
    -------
    values : list
        [ber x, bei x, ber' x, bei' x]; above x = 1003.8 they exceed the double range and
        come back as signed infinities (use kelvin_scaled or kelvin_resistance_ratio there).

    Notes
    -----
    See kelvin_scaled for the method and accuracy.

    Examples
    --------
    At x = 2: scipy.special.ber, bei, berp, beip give 0.751734183, 0.972291627, -0.493067125,
    0.917013613 (checked while writing this example):

    >>> [round(v, 9) for v in kelvin_functions(2.0)]
    [0.751734183, 0.972291627, -0.493067125, 0.917013613]
    """
    if not (x - x == 0) or x < 0.0:
        raise CoreError("Kelvin function argument must be a finite number >= 0", "x")
    if x < KELVIN_SWITCH:
        return _kelvin_series(x)
    v = kelvin_scaled(x)
    e = x * _INV_SQRT2
    half = math.exp(0.5 * e) if e < 1400.0 else 0.0
    out = []
    for i in range(4):
        if e < 1400.0:
            out.append(v[i] * half * half)  # two factors: finite wherever the result is
        elif v[i] == 0.0:
            out.append(0.0)
        else:
            out.append(v[i] * 1e308 * 1e308)  # +-inf without math.exp raising in CPython
    return out


def ber(x):
    """Kelvin function ber x (A&S 9.9.10), [-]; x [-] real, >= 0.

    Examples
    --------
    A&S Table 9.12 prints ber 1 = 0.98438178 (from memory; scipy.special.ber agrees):

    >>> round(ber(1.0), 8)
    0.98438178
    """
    return kelvin_functions(x)[0]


def bei(x):
    """Kelvin function bei x (A&S 9.9.11), [-]; x [-] real, >= 0.

    Examples
    --------
    A&S Table 9.12 prints bei 1 = 0.24956604 (from memory; scipy.special.bei agrees):

    >>> round(bei(1.0), 8)
    0.24956604
    """
    return kelvin_functions(x)[1]


def ber_prime(x):
    """Derivative ber' x of the Kelvin function ber, [-]; x [-] real, >= 0.

    Examples
    --------
    scipy.special.berp(2.5) = -0.9435834086 (checked while writing this example):

    >>> round(ber_prime(2.5), 10)
    -0.9435834086
    """
    return kelvin_functions(x)[2]


def bei_prime(x):
    """Derivative bei' x of the Kelvin function bei, [-]; x [-] real, >= 0.

    Examples
    --------
    scipy.special.beip(2.5) = 0.9982688465 (checked while writing this example):

    >>> round(bei_prime(2.5), 10)
    0.9982688465
    """
    return kelvin_functions(x)[3]
# __pragma__ ('kwargs')
