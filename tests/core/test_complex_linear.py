"""The dense complex solvers of core/complex_linear.py against numpy.linalg.solve (LAPACK zgesv)."""

import math
import random

import numpy as np
import pytest

from conductor_atlas.core.complex_linear import packed_index, solve_complex, solve_complex_symmetric
from conductor_atlas.core.errors import CoreError


def filament_like(n, seed):
    """A matrix of the filament method's class: positive diagonal real part (R) and -ln of the distances
    of random points in a 100 mm x 10 mm bar as imaginary part (the self term a small-cell value)."""
    rng = random.Random(seed)
    pts = [(rng.random() * 0.1, rng.random() * 0.01) for _ in range(n)]
    ar = [0.0] * (n * n)
    ai = [0.0] * (n * n)
    for i in range(n):
        ar[i * n + i] = 0.05 + rng.random()
        for j in range(n):
            d = math.hypot(pts[i][0] - pts[j][0], pts[i][1] - pts[j][1]) if i != j else 1e-4
            ai[i * n + j] = -math.log(d)
    return ar, ai


def packed(full, n):
    """The upper triangle of a row-major n x n list, packed row by row (the symmetric solver's input)."""
    return [full[i * n + j] for i in range(n) for j in range(i, n)]


def test_packed_index_counts_the_upper_triangle_row_by_row():
    n = 5
    order = [(i, j) for i in range(n) for j in range(i, n)]
    assert [packed_index(i, j, n) for i, j in order] == list(range(n * (n + 1) // 2))


# every remainder of n / 4: the elimination takes its pivots four at a time (the last block holds
# n % 4 of them when that is not 0); the rows after a block go two at a time, an odd one alone (n = 5:
# one row after the first block, 11: seven, 13: nine and five)
@pytest.mark.parametrize("n, seed", [(1, 0), (2, 4), (5, 6), (6, 7), (7, 1), (8, 5), (11, 8), (13, 9), (60, 2),
                                     (150, 3)])
def test_symmetric_solver_matches_lapack(n, seed):
    # tolerance 1e-12 relative to the largest component: LDL^T without pivoting on this class has a
    # growth factor below 3 (Higham 1998), measured error 1.5e-14 at n = 120
    ar, ai = filament_like(n, seed)
    a = np.array(ar).reshape(n, n) + 1j * np.array(ai).reshape(n, n)
    b = np.array([1.0 + 0.5j * (k % 3) for k in range(n)])
    ref = np.linalg.solve(a, b)
    x = solve_complex_symmetric(packed(ar, n), packed(ai, n), list(b.real), list(b.imag), n)
    got = np.array(x[0]) + 1j * np.array(x[1])
    assert np.abs(got - ref).max() <= 1e-12 * np.abs(ref).max()
    # the general solver agrees too (the filament solver used it before)
    y = solve_complex(list(ar), list(ai), list(b.real), list(b.imag), n)
    assert np.abs(np.array(y[0]) + 1j * np.array(y[1]) - ref).max() <= 1e-12 * np.abs(ref).max()


def test_symmetric_solver_refuses_a_zero_pivot():
    with pytest.raises(CoreError):
        solve_complex_symmetric([0.0, 0.0, 0.0], [0.0, 0.0, 0.0], [1.0, 2.0], [0.0, 1.0], 2)


def test_symmetric_solver_refuses_a_zero_second_pivot():
    # [[1, 1], [1, 1]] is singular: the second pivot of the pair, 1 - 1 * 1 / 1, is zero
    with pytest.raises(CoreError):
        solve_complex_symmetric([1.0, 1.0, 1.0], [0.0, 0.0, 0.0], [1.0, 2.0], [0.0, 1.0], 2)


def test_symmetric_solver_refuses_a_pivot_zeroed_by_a_whole_block():
    # the 5 x 5 identity with a_04 = a_40 = 1 is singular: once the first block of four pivots has
    # updated row 4, its pivot is 1 - 1 * 1 / 1 = 0 (by hand)
    ar = [1.0, 0.0, 0.0, 0.0, 1.0, 1.0, 0.0, 0.0, 0.0, 1.0, 0.0, 0.0, 1.0, 0.0, 1.0]
    with pytest.raises(CoreError):
        solve_complex_symmetric(ar, [0.0] * 15, [1.0] * 5, [0.0] * 5, 5)
