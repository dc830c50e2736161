"""Reference checks for conductor_atlas.core.quadrature: numpy's Gauss-Legendre rule (Golub-Welsch)."""

import numpy as np
import pytest

from conductor_atlas.core import quadrature as q
from conductor_atlas.core.errors import CoreError


def test_gauss_legendre_matches_numpy():
    # numpy.polynomial.legendre.leggauss (Golub-Welsch); both are ~1e-15 accurate, so
    # 1e-14 absolute on nodes and weights (weights <= 0.16 for n = 20).
    x, w = np.polynomial.legendre.leggauss(20)
    assert np.allclose(q.GL_NODES, x, rtol=0, atol=1e-14)
    assert np.allclose(q.GL_WEIGHTS, w, rtol=0, atol=1e-14)


@pytest.mark.parametrize("n", [2, 10, 37, 100])
def test_gauss_legendre_rules_of_other_orders_match_numpy(n):
    # the 10-point rule is the film integrals' (core.size_effect); same tolerance and reason as above
    x, w = np.polynomial.legendre.leggauss(n)
    nodes, weights = q.gauss_legendre(n)
    assert np.allclose(nodes, x, rtol=0, atol=1e-14)
    assert np.allclose(weights, w, rtol=0, atol=1e-14)


def test_gauss_legendre_order_checked():
    with pytest.raises(CoreError, match="between 2 and 100"):
        q.gauss_legendre(1)
