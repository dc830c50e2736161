"""Gauss-Legendre quadrature: the nodes and weights the core's integrals use.

Used by the Bloch-Grueneisen integral (core.temperature_models) and the film integrals
(core.size_effect). Pure Python in the Transcrypt subset (math only).
"""

import math

from conductor_atlas.core.errors import CoreError


# __pragma__ ('nokwargs')
def legendre_with_slope(n, x):
    """[P_n(x), P_n'(x)] for |x| < 1 by the three-term recurrence (n + 1) P_{n+1} = (2n + 1) x P_n - n P_{n-1}
    and P_n' = n (x P_n - P_{n-1}) / (x^2 - 1) (Abramowitz & Stegun eqs. 22.7.10 and 22.8.5).
    
    P_2(x) = (3x² − 1)/2, P_2'(x) = 3x; at x = 0.5: −0.125 and 1.5.
    
    >>> legendre_with_slope(2, 0.5)
    [-0.125, 1.5]
    """
    p0 = 1.0
    p1 = x
    for j in range(2, n + 1):
        p2 = ((2 * j - 1) * x * p1 - (j - 1) * p0) / j
        p0 = p1
        p1 = p2
    return [p1, n * (x * p1 - p0) / (x * x - 1.0)]


def gauss_legendre(n):
    """Nodes and weights of the n-point Gauss-Legendre rule on [-1, 1].

    Roots of the Legendre polynomial P_n found by Newton's iteration on the three-term
    recurrence (n + 1) P_{n+1} = (2n + 1) x P_n - n P_{n-1}, started from the Tricomi-type
    guess cos(pi (i + 0.75) / (n + 0.5)); weights w_i = 2 / ((1 - x_i^2) P_n'(x_i)^2).

    Parameters
    ----------
    n : int
        Number of points, 2 <= n <= 100, [-]

    Returns
    -------
    rule : list
        [nodes, weights], two lists of n floats, nodes ascending.

    References
    ----------
    1. Abramowitz, M., Stegun, I. A., Handbook of Mathematical Functions, 1964, eq. 25.4.29
       and Table 25.4 (nodes and weights to 15 digits).

    Examples
    --------
    The 2-point rule is ±1/√3 with weights 1 (Table 25.4); 5 points integrate e^x over [-1, 1]
    (exactly e − 1/e = 2.3504023873) to 8 decimals:

    >>> nodes, weights = gauss_legendre(2)
    >>> [round(x, 12) for x in nodes], [round(w, 12) for w in weights]
    ([-0.57735026919, 0.57735026919], [1.0, 1.0])
    >>> nodes, weights = gauss_legendre(5)
    >>> round(sum(w * math.exp(x) for x, w in zip(nodes, weights)), 8)
    2.35040239
    """
    if n < 2 or n > 100:
        raise CoreError("Gauss-Legendre order must be between 2 and 100", "n")
    nodes = []
    weights = []
    for i in range(n):
        x = math.cos(math.pi * (i + 0.75) / (n + 0.5))
        for _ in range(100):
            value_slope = legendre_with_slope(n, x)
            dx = value_slope[0] / value_slope[1]
            x = x - dx
            if abs(dx) <= 1e-16:
                break
        # re-evaluate the derivative at the converged root for the weight
        dp = legendre_with_slope(n, x)[1]
        nodes.append(-x)
        weights.append(2.0 / ((1.0 - x * x) * dp * dp))
    return [nodes, weights]
# __pragma__ ('kwargs')


# the 20-point rule on [-1, 1]
_GL20 = gauss_legendre(20)
GL_NODES = _GL20[0]
GL_WEIGHTS = _GL20[1]
