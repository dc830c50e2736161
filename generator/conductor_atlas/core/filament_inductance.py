"""Geometric mean distances of rectangles and annuli: the inductances of 2-D current filaments.

Per unit length, the partial (self or mutual) inductance of two straight parallel filaments of
uniform current density is

    L_ij = -(mu_0 / (2 pi)) ln g_ij  (+ a constant that a 2-D problem carrying its return
                                      current, or a fixed total current, never sees)

where ln g_ij, the logarithm of the geometric mean distance (GMD), is the mean of ln r over
every pair of points of the two cross-sections. This module returns ln g for

- two axis-parallel rectangles (any sizes, any positions, the same rectangle twice for the
  self term): exact four-fold integral of ln r in closed form, and a far-field expansion where
  the closed form would lose digits to cancellation;
- two concentric annuli (the rings of a round conductor whose current depends on radius only).

Pure Python in the Transcrypt subset; SI floats in, ln of metres out.
"""

import math

_log = math.log
_atan = math.atan

# Above this centre distance over the larger rectangle's largest side the far-field expansion
# is used. The closed form sums 16 terms of size ~D^4 ln D for a result of size s^4 ln D
# (s = rectangle side), losing (D/s)^4 of the 1e-16 rounding; the expansion's first omitted
# term is of order (s/D)^6: at the switch (D/s = 3) it is below 5e-6 absolute in ln g (measured on
# 300 random pairs against the closed form; 1e-5 at 2.5, 5e-5 at 2), which moves an AC/DC ratio by
# less than 1e-6, far below the mesh's 0.1 %. Measured also against scipy's quadrature in
# tests/core/test_filament_inductance.py.
FAR_FIELD_RATIO = 3.0


# __pragma__ ('nokwargs')
def _corner(x, y):
    # G with d^4 G / (dx^2 dy^2) = ln sqrt(x^2 + y^2): Hoer & Love 1965 eq. for the GMD of two
    # rectangles (from memory), checked here by differentiation (sympy) and quadrature (tests).
    # G is even in x and in y, so x, y >= 0 are passed.
    x2 = x * x
    y2 = y * y
    g = -25.0 / 48.0 * x2 * y2
    r2 = x2 + y2
    if r2 > 0.0:
        g += (x2 * y2 / 4.0 - (x2 * x2 + y2 * y2) / 24.0) * 0.5 * _log(r2)
    if x > 0.0 and y > 0.0:
        g += x2 * x * y / 6.0 * _atan(y / x) + x * y2 * y / 6.0 * _atan(x / y)
    return g


def corner_term(u, v):
    """G(u, v) [m^4 ln m] of rectangle_log_gmd_exact's closed form, for u, v >= 0 [m] (the filament
    solver tabulates these per pair of cell edges).

    G = -25/48 u²v² + (u²v²/4 - (u⁴ + v⁴)/24) ln √(u² + v²) + u³v/6 atan(v/u) + uv³/6 atan(u/v).
    By hand: G(2, 0) = -(16/24) ln 2 = -0.462098; G(1, 1) = -25/48 + (1/6)(ln 2)/2 + (1/3)(π/4)
    = -0.201272:

    >>> round(corner_term(2.0, 0.0), 6), round(corner_term(1.0, 1.0), 6)
    (-0.462098, -0.201272)
    """
    return _corner(u, v)


def _double_sum_pairs(xa1, xa2, xb1, xb2):
    # the four differences of the edges with the signs of the double integral over both intervals
    return [[abs(xa2 - xb1), 1.0], [abs(xa1 - xb1), -1.0], [abs(xa2 - xb2), -1.0], [abs(xa1 - xb2), 1.0]]


def rectangle_log_gmd_exact(xa, ya, wa, ha, xb, yb, wb, hb):
    """ln of the geometric mean distance of two axis-parallel rectangles, by the closed form.

    ln g = (1 / (A_a A_b)) sum_{i,j} s_i s_j G(u_i, v_j),
    G(x, y) = (x^2 y^2 / 4 - x^4 / 24 - y^4 / 24) ln r + (x^3 y / 6) atan(y / x)
              + (x y^3 / 6) atan(x / y) - 25 x^2 y^2 / 48,   r = sqrt(x^2 + y^2)

    Parameters
    ----------
    xa, ya : float
        Centre of rectangle a, [m]
    wa, ha : float
        Width (along x) and height (along y) of rectangle a, [m]
    xb, yb, wb, hb : float
        The same for rectangle b, [m]

    Returns
    -------
    ln_g : float
        Natural logarithm of the GMD, [ln m]

    Notes
    -----
    u_i runs over the four differences of the x-edges of a and b (signs +, -, -, +), v_j likewise
    in y; the sum is the four-fold integral of ln r, each pair of intervals integrated twice with
    the second antiderivative. Exact for every placement, including overlap and the rectangle
    with itself (a square of side s: ln g = ln s + ln 0.44705..., Maxwell's 0.447 s). Loses
    digits when the rectangles are far apart compared with their size: use rectangle_log_gmd.

    References
    ----------
    1. Hoer, C., Love, C., "Exact inductance equations for rectangular conductors with
       applications to more complicated geometries", J. Res. NBS 69C (2), 127-137 (1965),
       eq. (14) and (20) (from memory; the formula here is re-derived and tested).
    2. Grover, F. W., Inductance Calculations, Dover 1946, ch. 3 (geometric mean distances).

    Examples
    --------
    A square with itself: GMD = 0.447049 s, Maxwell's 0.44705 s (Grover 1946, ch. 3; from memory):

    >>> round(math.exp(rectangle_log_gmd_exact(0.0, 0.0, 1.0, 1.0, 0.0, 0.0, 1.0, 1.0)), 6)
    0.447049
    """
    xs = _double_sum_pairs(xa - 0.5 * wa, xa + 0.5 * wa, xb - 0.5 * wb, xb + 0.5 * wb)
    ys = _double_sum_pairs(ya - 0.5 * ha, ya + 0.5 * ha, yb - 0.5 * hb, yb + 0.5 * hb)
    total = 0.0
    for i in range(4):
        u = xs[i][0]
        su = xs[i][1]
        for j in range(4):
            total += su * ys[j][1] * _corner(u, ys[j][0])
    return total / (wa * ha * wb * hb)


def rectangle_log_gmd_far(xa, ya, wa, ha, xb, yb, wb, hb):
    """ln of the GMD of two rectangles far apart: the multipole expansion of ln r to 4th order.

    ln g = ln D + (1/2) f_xx (m2x - m2y) + (1/24) f_xxxx (m4x - 6 m2x m2y + m4y),
    f_xx = (dy^2 - dx^2) / D^4,  f_xxxx = -6 (dx^4 - 6 dx^2 dy^2 + dy^4) / D^8,
    m2x = (wa^2 + wb^2) / 12,  m4x = (wa^4 + wb^4) / 80 + wa^2 wb^2 / 24  (likewise in y)

    Parameters and result as rectangle_log_gmd_exact; (dx, dy) is the centre offset, D its length.

    Notes
    -----
    Taylor expansion of the harmonic function ln r about the centre offset, averaged over the
    difference of two uniform distributions (its odd moments vanish, and ln r being harmonic
    makes f_yy = -f_xx and f_yyyy = -f_xxyy = f_xxxx). Error of order (s / D)^6, s the largest side.

    Examples
    --------
    Two 1 mm squares 10 mm apart: the expansion and the closed form agree to 3e-11; both lie
    8e-7 above ln(10 mm), the GMD of two points (by hand, ln 0.01 = -4.6051702):

    >>> far = rectangle_log_gmd_far(0.0, 0.0, 1e-3, 1e-3, 0.01, 0.0, 1e-3, 1e-3)
    >>> exact = rectangle_log_gmd_exact(0.0, 0.0, 1e-3, 1e-3, 0.01, 0.0, 1e-3, 1e-3)
    >>> abs(far - exact) < 3e-11, round(far, 7)
    (True, -4.6051694)
    """
    dx = xb - xa
    dy = yb - ya
    return 0.5 * _log(dx * dx + dy * dy) + far_field_correction(dx, dy, wa, ha, wb, hb)


def far_field_correction(dx, dy, wa, ha, wb, hb):
    """ln g - ln D of rectangle_log_gmd_far [-]: its terms beyond the centre distance D.

    dx, dy: centre offset [m]; wa, ha, wb, hb: the rectangles' sides [m]. (The filament solver
    adds the ln D of several mirror images as the log of one product.)

    Two equal squares of side a on a line at distance D: the second moments cancel and the fourth
    give a⁴ / (120 D⁴) (by hand: m4 - 6 m2x m2y + m4 = 2a⁴/15 - a⁴/6 = -a⁴/30, times -6/D⁴ / 24);
    a = 1, D = 10: 8.3333e-07:

    >>> round(far_field_correction(10.0, 0.0, 1.0, 1.0, 1.0, 1.0) * 1e7, 4)
    8.3333
    """
    dx2 = dx * dx
    dy2 = dy * dy
    d2 = dx2 + dy2
    m2x = (wa * wa + wb * wb) / 12.0
    m2y = (ha * ha + hb * hb) / 12.0
    m4x = (wa * wa * wa * wa + wb * wb * wb * wb) / 80.0 + wa * wa * wb * wb / 24.0
    m4y = (ha * ha * ha * ha + hb * hb * hb * hb) / 80.0 + ha * ha * hb * hb / 24.0
    fxx = (dy2 - dx2) / (d2 * d2)
    fxxxx = -6.0 * (dx2 * dx2 - 6.0 * dx2 * dy2 + dy2 * dy2) / (d2 * d2 * d2 * d2)
    return 0.5 * fxx * (m2x - m2y) + fxxxx * (m4x - 6.0 * m2x * m2y + m4y) / 24.0


def rectangle_log_gmd(xa, ya, wa, ha, xb, yb, wb, hb):
    """ln of the GMD of two axis-parallel rectangles [ln m]: exact closed form near, expansion far.

    Arguments as rectangle_log_gmd_exact (centres and sides, [m]). The far-field expansion is used
    where the centre distance exceeds FAR_FIELD_RATIO times the largest side of either rectangle.

    Examples
    --------
    The square with itself by the closed form (Maxwell's 0.44705 s), two small squares far apart by
    the expansion (their centre distance, 1 m):

    >>> round(math.exp(rectangle_log_gmd(0.0, 0.0, 0.01, 0.01, 0.0, 0.0, 0.01, 0.01)) / 0.01, 5)
    0.44705
    >>> abs(rectangle_log_gmd(0.0, 0.0, 1e-3, 1e-3, 1.0, 0.0, 1e-3, 1e-3)) < 1e-9
    True
    """
    dx = xb - xa
    dy = yb - ya
    s = wa
    if ha > s:
        s = ha
    if wb > s:
        s = wb
    if hb > s:
        s = hb
    if dx * dx + dy * dy > FAR_FIELD_RATIO * FAR_FIELD_RATIO * s * s:
        return rectangle_log_gmd_far(xa, ya, wa, ha, xb, yb, wb, hb)
    return rectangle_log_gmd_exact(xa, ya, wa, ha, xb, yb, wb, hb)


def _ring_moment(a, b):
    # integral of r ln r dr from a to b: [r^2 ln r / 2 - r^2 / 4]
    lb = 0.0
    la = 0.0
    if b > 0.0:
        lb = 0.5 * b * b * _log(b)
    if a > 0.0:
        la = 0.5 * a * a * _log(a)
    return lb - la - 0.25 * (b * b - a * a)


def _cubic_moment(a, b):
    # integral of r^3 ln r dr from a to b: [r^4 ln r / 4 - r^4 / 16]
    lb = 0.0
    la = 0.0
    if b > 0.0:
        lb = 0.25 * b * b * b * b * _log(b)
    if a > 0.0:
        la = 0.25 * a * a * a * a * _log(a)
    return lb - la - (b * b * b * b - a * a * a * a) / 16.0
# __pragma__ ('kwargs')


def annulus_log_gmd(a1, a2, b1, b2):
    """ln of the GMD of two concentric annuli a1 <= r <= a2 and b1 <= r <= b2 that do not overlap
    (one inside the other, or the same annulus twice), [ln m].

    The mean of ln |p - q| over the angle between two points at radii r and s is ln max(r, s)
    (Gauss's mean value for the harmonic ln r), so

    ln g = int int ln max(r, s) r s dr ds / (int r dr int s ds).

    Parameters
    ----------
    a1, a2 : float
        Inner and outer radius of annulus a, [m] (a1 = 0: a disk)
    b1, b2 : float
        Inner and outer radius of annulus b, [m]

    Returns
    -------
    ln_g : float
        [ln m]. A disk of radius R with itself: ln R - 1/4 (GMD = R e^(-1/4), Grover 1946 ch. 3).

    References
    ----------
    1. Grover, F. W., Inductance Calculations, Dover 1946, ch. 3: the GMD of a point from a ring
       (outside it: its centre distance; inside: the ring's radius) and of an area from itself.

    Examples
    --------
    A disk of 1 mm radius with itself: GMD = e^(-1/4) mm = 0.7788 mm (Grover 1946, ch. 3); a disk
    inside a ring of radii 2 and 3 mm: by hand (b2^2 ln b2 - b1^2 ln b1) / (b2^2 - b1^2) - 1/2 =
    -5.98477 (the ring's mean of ln r, by Gauss's mean value):

    >>> round(math.exp(annulus_log_gmd(0.0, 1e-3, 0.0, 1e-3)) * 1e3, 4)
    0.7788
    >>> round(annulus_log_gmd(0.0, 1e-3, 2e-3, 3e-3), 5)
    -5.98477
    """
    na = 0.5 * (a2 * a2 - a1 * a1)
    nb = 0.5 * (b2 * b2 - b1 * b1)
    # which is inside is decided by the midpoints, not by a2 <= b1: edges that a mesh computes as
    # centre +- half-width can overlap by a rounding error
    if a1 + a2 < b1 + b2:
        return _ring_moment(b1, b2) / nb
    if b1 + b2 < a1 + a2:
        return _ring_moment(a1, a2) / na
    # the same annulus [a, b] twice: 2 int_a^b r ln r (r^2 - a^2) / 2 dr over na^2
    a = a1
    return (_cubic_moment(a, a2) - a * a * _ring_moment(a, a2)) / (na * na)
