"""Size effect: why thin films and fine-grained conductors conduct worse than bulk metal.

Models: Fuchs-Sondheimer (diffuse surface scattering in a film), Mayadas-Shatzkes (grain
boundary scattering), and Mayadas-Shatzkes' combined film expression with both. All take the
bulk mean free path l (see conductor_atlas.core.carriers.mean_free_path, or
rho_lambda_product / rho) and return the ratio rho_film / rho_bulk.

The integrals use composite Gauss-Legendre rules (conductor_atlas.core.quadrature) on
panels graded geometrically toward the boundary layers: 20 points per panel for the single
Fuchs-Sondheimer integral, 10 per panel for the double integral of the combined model (on
panels that halve toward a boundary layer a 10-point rule already converges to rounding).
Pure Python in the Transcrypt subset; SI floats in and out; CoreError for impossible inputs.
"""

import math

from conductor_atlas.core.errors import CoreError, check_positive
from conductor_atlas.core.quadrature import GL_NODES, GL_WEIGHTS, gauss_legendre

_HALF_PI = 0.5 * math.pi

# 10-point rule for the combined model's double integral. On panels that halve toward a
# boundary layer the nearest singularity lies >= 1 panel width beyond the panel, so the rule's
# error is ~(3 + sqrt 8)^-20 ~ 5e-16 of the panel's share; measured against the 20-point rule
# on 168 (kappa, p, alpha) points over 1e-3..100 x {0, 0.5, 0.9} x 1e-3..10: 1.2e-13 relative
# worst, at a fifth of the cost. The combined model also stops halving earlier: at 5 % of the
# boundary-layer scale in theta, 3 % in phi (measured on the same points: 2.6e-13 worst
# against the 20-point rule with 0.6 of the integrand evaluations; stopping at 10 % loses 4e-11).
_GL10 = gauss_legendre(10)
_GL10_NODES = _GL10[0]
_GL10_WEIGHTS = _GL10[1]
_MS_THETA_FLOOR = 0.05
_MS_PHI_FLOOR = 0.03

# math's functions held in module names: in the transpiled JS each `math.sin` is a property getter
# on the module object (measured in node: a quarter of a thin-film update went to those getters,
# and without them film_resistivity_ratio takes 0.4 ms instead of 2.1 ms)
_sin = math.sin
_cos = math.cos
_exp = math.exp


# __pragma__ ('nokwargs')
def _check(kappa, p):
    check_positive(kappa, "kappa", "thickness over mean free path")
    if not (p >= 0.0 and p < 1.0):
        raise CoreError("specularity must be at least 0 and below 1", "p")
# __pragma__ ('kwargs')


def _graded_edges(lo_scale, hi_scale, lo_floor=0.01, hi_floor=0.01):
    # panel edges on [0, pi/2], halving toward 0 down to lo_floor * lo_scale and toward pi/2
    # down to hi_floor * hi_scale (each scale clipped to [1e-12, 1])
    lo = lo_scale
    if lo > 1.0:
        lo = 1.0
    if lo < 1e-12:
        lo = 1e-12
    hi = hi_scale
    if hi > 1.0:
        hi = 1.0
    if hi < 1e-12:
        hi = 1e-12
    left = [0.0]
    w = 0.25 * math.pi
    tiny = []
    while w > lo_floor * lo:
        tiny.append(w)
        w = 0.5 * w
    for i in range(len(tiny)):
        left.append(tiny[len(tiny) - 1 - i])
    w = 0.25 * math.pi
    while w > hi_floor * hi:
        w = 0.5 * w
        left.append(_HALF_PI - w)
    left.append(_HALF_PI)
    return left


# __pragma__ ('nokwargs')
def _outer_edges(alpha):
    # the combined model's phi integrand is smooth (even in phi) at phi = 0; its only
    # boundary layer is at phi = pi/2, of width ~alpha: one panel [0, pi/4], then halving
    # toward pi/2 as in _graded_edges
    # phi near pi/2 carries weight ~cos^2 phi, so for tiny alpha grading stops at 1e-4 from
    # pi/2 (measured as for _ms_inner)
    layer = alpha
    if layer < 0.003:
        layer = 0.003
    edges = [0.0]
    for x in _graded_edges(1.0, layer, 0.01, _MS_PHI_FLOOR):
        if x >= 0.25 * math.pi:
            edges.append(x)
    return edges
# __pragma__ ('kwargs')


def _integrate(func, args, edges, nodes=None, weights=None):
    if nodes is None:
        nodes = GL_NODES
        weights = GL_WEIGHTS
    total = 0.0
    for k in range(len(edges) - 1):
        half = 0.5 * (edges[k + 1] - edges[k])
        mid = edges[k] + half
        part = 0.0
        for i in range(len(nodes)):
            part += weights[i] * func(mid + half * nodes[i], args)
        total += half * part
    return total


# __pragma__ ('nokwargs')
def _fs_integral(kappa, p):
    # integral from 1 to inf of (1/t^3 - 1/t^5)(1 - e^(-kappa t))/(1 - p e^(-kappa t)) dt;
    # with t = 1/sin(theta): (1/t^3 - 1/t^5) dt -> sin(theta) cos^3(theta) d(theta) on [0, pi/2].
    # The 20-point rule on graded panels, written out in one loop (no function call per node:
    # each costs ~1 us in the transpiled JS)
    edges = _graded_edges(kappa, 1.0)
    total = 0.0
    for k in range(len(edges) - 1):
        half = 0.5 * (edges[k + 1] - edges[k])
        mid = edges[k] + half
        part = 0.0
        for i in range(len(GL_NODES)):
            theta = mid + half * GL_NODES[i]
            u = _sin(theta)
            if u > 0.0:
                s = _cos(theta)
                e = _exp(-kappa / u)
                part += GL_WEIGHTS[i] * (u * s * s * s * (1.0 - e) / (1.0 - p * e))
        total += half * part
    return total
# __pragma__ ('kwargs')


def fuchs_sondheimer_ratio(kappa, p=0.0):
    """Thin-film resistivity ratio, Fuchs-Sondheimer (exact integral form).

    rho_0 / rho_f = 1 - (3 / (2 kappa)) (1 - p) integral_1^inf (1/t^3 - 1/t^5)
                    (1 - e^(-kappa t)) / (1 - p e^(-kappa t)) dt,   kappa = d / l

    Parameters
    ----------
    kappa : float
        Film thickness over bulk mean free path d / l, [-]
    p : float, optional
        Specularity: fraction of electrons reflected specularly at a surface, 0 <= p < 1,
        [-]; p = 0 (fully diffuse) is the usual assumption for real films

    Returns
    -------
    ratio : float
        rho_film / rho_bulk, [-]

    Notes
    -----
    Evaluated with t = 1 / sin(theta) and graded Gauss-Legendre panels; agrees with
    scipy.integrate.quad to 1e-12 for 1e-3 <= kappa <= 1e3. Thick films: rho_f / rho_0 ->
    1 + 3 (1 - p) / (8 kappa) (kappa >> 1; for p = 0 it is 6 % low at kappa = 1, 1.5 % at
    kappa = 3, 0.14 % at kappa = 10, measured). Thin films (kappa << 1): rho_f / rho_0 -> 4 / (3 kappa ln(1/kappa)) for p = 0.
    Both surfaces share one p; free-electron (spherical Fermi surface) theory; the film is
    taken as uniform and single-crystal (add grain boundaries with the combined model).

    References
    ----------
    1. Fuchs, K., Proc. Camb. Phil. Soc. 34, 100 (1938), doi:10.1017/S0305004100019952.
    2. Sondheimer, E. H., Adv. Phys. 1, 1 (1952), doi:10.1080/00018735200101151, eq. 9 and
       the limits eq. 10-11.

    Examples
    --------
    A film as thick as the mean free path, fully diffuse surfaces: scipy.integrate.quad on the
    printed integral gives 1.4622948844691 (checked while writing this example):

    >>> round(fuchs_sondheimer_ratio(1.0), 10)
    1.4622948845
    """
    _check(kappa, p)
    inner = _fs_integral(kappa, p)
    return 1.0 / (1.0 - 1.5 / kappa * (1.0 - p) * inner)


def fuchs_sondheimer_thick_film_ratio(kappa, p=0.0):
    """Thick-film limit of Fuchs-Sondheimer, rho_f / rho_0 = 1 + 3 (1 - p) / (8 kappa).

    Parameters
    ----------
    kappa : float
        Film thickness over bulk mean free path d / l, kappa >> 1, [-]
    p : float, optional
        Specularity, [-]

    Returns
    -------
    ratio : float
        rho_film / rho_bulk, [-]

    References
    ----------
    1. Sondheimer 1952, Adv. Phys. 1, 1, eq. 11.

    Examples
    --------
    kappa = 10, p = 0: 1 + 3/80 = 1.0375, within 0.14 % of the exact 1.03896 (scipy.integrate.quad
    on Sondheimer's integral, checked while writing this example):

    >>> fuchs_sondheimer_thick_film_ratio(10.0)
    1.0375
    """
    _check(kappa, p)
    return 1.0 + 3.0 * (1.0 - p) / (8.0 * kappa)


# __pragma__ ('nokwargs')
def mayadas_shatzkes_alpha(mean_free_path, grain_size, R):
    """Grain-boundary parameter of Mayadas-Shatzkes, alpha = (l / D) R / (1 - R).

    Parameters
    ----------
    mean_free_path : float
        Bulk mean free path l, [m]
    grain_size : float
        Mean grain diameter D (distance between boundaries), [m]
    R : float
        Reflection coefficient of a grain boundary, 0 <= R < 1, [-]

    Returns
    -------
    alpha : float
        [-]

    References
    ----------
    1. Mayadas, A. F., Shatzkes, M., Phys. Rev. B 1, 1382 (1970),
       doi:10.1103/PhysRevB.1.1382, eq. 5.

    Examples
    --------
    Copper's 39 nm mean free path (Gall 2016, Table I), 40 nm grains, R = 0.3: by hand
    (39/40)(0.3/0.7) = 0.41786:

    >>> round(mayadas_shatzkes_alpha(39e-9, 40e-9, 0.3), 5)
    0.41786
    """
    check_positive(mean_free_path, "mean_free_path", "mean free path")
    check_positive(grain_size, "grain_size", "grain size")
    if not (R >= 0.0 and R < 1.0):
        raise CoreError("reflection coefficient must be at least 0 and below 1", "R")
    return mean_free_path / grain_size * R / (1.0 - R)


def _ms_bracket(alpha):
    # 1/3 - alpha/2 + alpha^2 - alpha^3 ln(1 + 1/alpha); for alpha >= 2 its expansion
    # sum_j (-1)^(j+1) / ((j + 3) alpha^j), which avoids the cancellation
    if alpha < 2.0:
        return 1.0 / 3.0 - 0.5 * alpha + alpha * alpha - alpha ** 3 * math.log(1.0 + 1.0 / alpha)
    total = 0.0
    term = 1.0
    sign = 1.0
    for j in range(1, 80):
        term = term / alpha
        total += sign * term / (j + 3.0)
        sign = -sign
        if term < 1e-18:
            break
    return total


def mayadas_shatzkes_ratio(alpha):
    """Grain-boundary resistivity ratio, Mayadas-Shatzkes.

    rho_0 / rho_g = 3 [1/3 - alpha/2 + alpha^2 - alpha^3 ln(1 + 1/alpha)]

    Parameters
    ----------
    alpha : float
        Grain-boundary parameter (mayadas_shatzkes_alpha), alpha >= 0, [-]

    Returns
    -------
    ratio : float
        rho_grains / rho_bulk, [-]

    Notes
    -----
    Small alpha: 1 + 1.5 alpha; large alpha: 4 alpha / 3. Assumes boundaries perpendicular
    to the current, spaced D on average (Gaussian spread), a delta-function potential
    (one R for all boundaries) and a spherical Fermi surface.

    References
    ----------
    1. Mayadas, A. F., Shatzkes, M., Phys. Rev. B 1, 1382 (1970),
       doi:10.1103/PhysRevB.1.1382, eq. 8 and the limits eq. 9.

    Examples
    --------
    alpha = 1: by hand 1 / (3 (1/3 - 1/2 + 1 - ln 2)) = 2.37779; alpha = 0.01 near the small-alpha
    limit 1 + 1.5 alpha = 1.015:

    >>> round(mayadas_shatzkes_ratio(1.0), 5), round(mayadas_shatzkes_ratio(0.01), 4)
    (2.37779, 1.0149)
    """
    if not (alpha >= 0.0) or not (alpha - alpha == 0):
        raise CoreError("alpha must be a finite number >= 0", "alpha")
    if alpha == 0.0:
        return 1.0
    return 1.0 / (3.0 * _ms_bracket(alpha))


def _ms_inner(kappa, p, c, alpha):
    # the theta integral of the Fuchs-Sondheimer integrand (_fs_integral) with the grain factor
    # (c s / (c s + alpha))^2 (c = cos(phi), s = cos(theta)) on the 10-point rule, written out in
    # one loop, without a function call per node (each call costs ~1 us in the transpiled JS,
    # which made a film update take ~50 ms in node)
    # theta near pi/2 (s -> 0) carries weight ~s^3 ds, so for tiny alpha grading stops at
    # s ~ 1.5e-3 (measured: no change above 3e-13 for 1e-3 <= kappa <= 100, alpha >= 1e-7)
    layer = alpha / c
    if layer < 0.03:
        layer = 0.03
    edges = _graded_edges(kappa, layer, _MS_THETA_FLOOR, _MS_THETA_FLOOR)
    total = 0.0
    for k in range(len(edges) - 1):
        half = 0.5 * (edges[k + 1] - edges[k])
        mid = edges[k] + half
        part = 0.0
        for i in range(10):
            theta = mid + half * _GL10_NODES[i]
            u = _sin(theta)
            s = _cos(theta)
            cs = c * s
            if u > 0.0 and cs > 0.0:
                g = cs / (cs + alpha)  # H = 1 + alpha / (cos(phi) sqrt(1 - 1/t^2)) = 1 / g
                e = _exp(-kappa * (1.0 / g) / u)
                part += _GL10_WEIGHTS[i] * (u * s * s * s * g * g * (1.0 - e) / (1.0 - p * e))
        total += half * part
    return total


def _ms_phi_integrand(phi, args):
    c = _cos(phi)
    if c <= 0.0:
        return 0.0
    return c * c * _ms_inner(args[0], args[1], c, args[2])


def film_resistivity_ratio(kappa, p, alpha):
    """Film resistivity ratio with surface and grain-boundary scattering (Mayadas-Shatzkes).

    rho_0 / rho_f = 3 [1/3 - alpha/2 + alpha^2 - alpha^3 ln(1 + 1/alpha)]
        - (6 / (pi kappa)) (1 - p) integral_0^(pi/2) dphi integral_1^inf dt
          (cos^2 phi / H^2) (1/t^3 - 1/t^5) (1 - e^(-kappa t H)) / (1 - p e^(-kappa t H)),
    H = 1 + alpha / (cos phi sqrt(1 - 1/t^2))

    Parameters
    ----------
    kappa : float
        Film thickness over bulk mean free path d / l, [-]
    p : float
        Surface specularity, 0 <= p < 1, [-]
    alpha : float
        Grain-boundary parameter (mayadas_shatzkes_alpha), [-]

    Returns
    -------
    ratio : float
        rho_film / rho_bulk, [-]

    Notes
    -----
    The published combined expression, not a Matthiessen-like sum of the two ratios (which
    over-counts: the two mechanisms act on the same electrons). Reduces to
    fuchs_sondheimer_ratio at alpha = 0 and to mayadas_shatzkes_ratio as kappa -> inf.
    Double integral with graded 10-point Gauss-Legendre panels (~1.4e4 integrand evaluations
    on average, about 3 ms in CPython and 0.4 ms in node, measured): agrees with nested
    scipy.integrate.quad on the printed form to 1.1e-12 for 1e-2 <= kappa <= 1e2,
    1e-2 <= alpha <= 10, p in {0, 0.5} (measured).

    References
    ----------
    1. Mayadas, A. F., Shatzkes, M., Phys. Rev. B 1, 1382 (1970),
       doi:10.1103/PhysRevB.1.1382, eq. 10.

    Examples
    --------
    kappa = 1, p = 0, alpha = 0.5: nested scipy.integrate.quad on the printed form gives
    2.12067230439447 (checked while writing this example):

    >>> round(film_resistivity_ratio(1.0, 0.0, 0.5), 10)
    2.1206723044
    """
    _check(kappa, p)
    if not (alpha >= 0.0) or not (alpha - alpha == 0):
        raise CoreError("alpha must be a finite number >= 0", "alpha")
    if alpha == 0.0:
        return fuchs_sondheimer_ratio(kappa, p)
    grains = 3.0 * _ms_bracket(alpha)
    surface = _integrate(_ms_phi_integrand, [kappa, p, alpha], _outer_edges(alpha),
                         _GL10_NODES, _GL10_WEIGHTS)
    return 1.0 / (grains - 6.0 / (math.pi * kappa) * (1.0 - p) * surface)
# __pragma__ ('kwargs')
