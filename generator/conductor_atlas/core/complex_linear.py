"""A small dense complex linear solver, complex numbers held as pairs of float lists.

Pure Python in the Transcrypt subset (JS has no complex type): a matrix is two flat lists (real
and imaginary parts), a vector two lists of n floats. A general matrix is row-major, n * n floats;
a symmetric one is its upper triangle, packed row by row (packed_index): n (n + 1) / 2 floats.
"""

from conductor_atlas.core.errors import CoreError


# __pragma__ ('nokwargs')
def solve_complex(ar, ai, br, bi, n):
    """Solve (ar + i ai) x = (br + i bi) by Gaussian elimination with partial pivoting.

    Parameters
    ----------
    ar, ai : list
        Real and imaginary parts of the n x n matrix, row-major, n * n floats each; overwritten
    br, bi : list
        Real and imaginary parts of the right-hand side, n floats each; overwritten
    n : int
        Order of the system

    Returns
    -------
    x : list
        [xr, xi], the real and imaginary parts of the solution

    Notes
    -----
    Row pivoting on the largest modulus in the column (Golub & Van Loan, Matrix Computations,
    4th ed., 2013, algorithm 3.4.1); about (8/3) n^3 real multiplications and additions. Raises
    CoreError for a matrix that is singular to working precision.

    Examples
    --------
    diag(1 + i, 2) x = (2, 4i) gives x = (1 - i, 2i); the swap matrix [[0, 1], [1, 0]] needs the
    row pivot and gives x = (5, 3) for (3, 5):

    >>> solve_complex([1.0, 0.0, 0.0, 2.0], [1.0, 0.0, 0.0, 0.0], [2.0, 0.0], [0.0, 4.0], 2)
    [[1.0, 0.0], [-1.0, 2.0]]
    >>> solve_complex([0.0, 1.0, 1.0, 0.0], [0.0, 0.0, 0.0, 0.0], [3.0, 5.0], [0.0, 0.0], 2)[0]
    [5.0, 3.0]
    """
    for k in range(n):
        # pivot: largest |a_ik| for i >= k
        p = k
        best = -1.0
        for i in range(k, n):
            m = ar[i * n + k] * ar[i * n + k] + ai[i * n + k] * ai[i * n + k]
            if m > best:
                best = m
                p = i
        if not (best > 0.0):
            raise CoreError("the filament system is singular", "")
        if p != k:
            for j in range(k, n):
                t = ar[k * n + j]
                ar[k * n + j] = ar[p * n + j]
                ar[p * n + j] = t
                t = ai[k * n + j]
                ai[k * n + j] = ai[p * n + j]
                ai[p * n + j] = t
            t = br[k]
            br[k] = br[p]
            br[p] = t
            t = bi[k]
            bi[k] = bi[p]
            bi[p] = t
        # 1 / pivot
        kk = k * n + k
        inv_r = ar[kk] / best
        inv_i = -ai[kk] / best
        for i in range(k + 1, n):
            row = i * n
            fr0 = ar[row + k]
            fi0 = ai[row + k]
            if fr0 == 0.0 and fi0 == 0.0:
                continue
            fr = fr0 * inv_r - fi0 * inv_i
            fi = fr0 * inv_i + fi0 * inv_r
            top = k * n
            for j in range(k + 1, n):
                ur = ar[top + j]
                ui = ai[top + j]
                ar[row + j] -= fr * ur - fi * ui
                ai[row + j] -= fr * ui + fi * ur
            br[i] -= fr * br[k] - fi * bi[k]
            bi[i] -= fr * bi[k] + fi * br[k]
    rows = []
    for i in range(n):
        rows.append(i * n)
    return back_substitute(ar, ai, br, bi, rows)
# __pragma__ ('kwargs')


# __pragma__ ('nokwargs')
def packed_index(i, j, n):
    """Index of entry (i, j), i <= j, of an n x n matrix's upper triangle packed row by row: row i
    starts at i n - i (i - 1) / 2 and holds columns i .. n - 1.

    Examples
    --------
    Row 0 holds 3 entries of a 3 x 3 matrix, row 1 two, row 2 one (by counting):

    >>> packed_index(0, 2, 3), packed_index(1, 1, 3), packed_index(2, 2, 3)
    (2, 3, 5)
    """
    return i * n - i * (i - 1) // 2 + j - i


def _inverse_pivot(ar, ai, kk):
    # [re, im] of 1 / a_kk; CoreError for a zero pivot
    best = ar[kk] * ar[kk] + ai[kk] * ai[kk]
    if not (best > 0.0):
        raise CoreError("the filament system is singular", "")
    return [ar[kk] / best, -ai[kk] / best]


def _reduce_row(ar, ai, br, bi, rows, p, q, inverse):
    # row q minus (a_pq / a_pp) times row p, over the stored columns q .. n - 1 of row q and the
    # right-hand side (inverse: [re, im] of 1 / a_pp)
    n = len(rows)
    top = rows[p]
    fr0 = ar[top + q]
    fi0 = ai[top + q]
    fr = fr0 * inverse[0] - fi0 * inverse[1]
    fi = fr0 * inverse[1] + fi0 * inverse[0]
    row = rows[q]
    for j in range(q, n):
        ar[row + j] -= fr * ar[top + j] - fi * ai[top + j]
        ai[row + j] -= fr * ai[top + j] + fi * ar[top + j]
    br[q] -= fr * br[p] - fi * bi[p]
    bi[q] -= fr * bi[p] + fi * br[p]


def _multipliers(ar, ai, rows, k, inverses, i, f):
    # f = [re, im] of l_ip = a_(k+p)i / a_(k+p)(k+p) for the pivots p = 0 .. 3 of the block at k
    # (a_(k+p)i = a_i(k+p): symmetric, read from the pivot's row); inverses: [re, im] of the 1 / a_pp
    for p in range(4):
        at = rows[k + p] + i
        f[2 * p] = ar[at] * inverses[2 * p] - ai[at] * inverses[2 * p + 1]
        f[2 * p + 1] = ar[at] * inverses[2 * p + 1] + ai[at] * inverses[2 * p]


def _reduce_rhs(br, bi, k, f, i):
    # b_i -= l_i0 b_k + l_i1 b_(k+1) + l_i2 b_(k+2) + l_i3 b_(k+3) (f: the multipliers of row i)
    br[i] -= (f[0] * br[k] - f[1] * bi[k] + f[2] * br[k + 1] - f[3] * bi[k + 1]
              + f[4] * br[k + 2] - f[5] * bi[k + 2] + f[6] * br[k + 3] - f[7] * bi[k + 3])
    bi[i] -= (f[0] * bi[k] + f[1] * br[k] + f[2] * bi[k + 1] + f[3] * br[k + 1]
              + f[4] * bi[k + 2] + f[5] * br[k + 2] + f[6] * bi[k + 3] + f[7] * br[k + 3])


def _reduce_by_block(ar, ai, rows, k, f, i, start, stop):
    # a_ij -= l_i0 a_kj + l_i1 a_(k+1)j + l_i2 a_(k+2)j + l_i3 a_(k+3)j for j = start .. stop - 1
    t0 = rows[k]
    t1 = rows[k + 1]
    t2 = rows[k + 2]
    t3 = rows[k + 3]
    f0r = f[0]
    f0i = f[1]
    f1r = f[2]
    f1i = f[3]
    f2r = f[4]
    f2i = f[5]
    f3r = f[6]
    f3i = f[7]
    row = rows[i]
    for j in range(start, stop):
        u0r = ar[t0 + j]
        u0i = ai[t0 + j]
        u1r = ar[t1 + j]
        u1i = ai[t1 + j]
        u2r = ar[t2 + j]
        u2i = ai[t2 + j]
        u3r = ar[t3 + j]
        u3i = ai[t3 + j]
        ar[row + j] -= (f0r * u0r - f0i * u0i + f1r * u1r - f1i * u1i
                        + f2r * u2r - f2i * u2i + f3r * u3r - f3i * u3i)
        ai[row + j] -= (f0r * u0i + f0i * u0r + f1r * u1i + f1i * u1r
                        + f2r * u2i + f2i * u2r + f3r * u3i + f3i * u3r)


def _reduce_two_by_block(ar, ai, rows, k, f, g, i):
    # _reduce_by_block for rows i (multipliers f) and i + 1 (g) together, columns i + 1 .. n - 1: each
    # pivot row entry is read once for both rows (the same sums, in the same order, as one row at a time)
    n = len(rows)
    t0 = rows[k]
    t1 = rows[k + 1]
    t2 = rows[k + 2]
    t3 = rows[k + 3]
    f0r = f[0]
    f0i = f[1]
    f1r = f[2]
    f1i = f[3]
    f2r = f[4]
    f2i = f[5]
    f3r = f[6]
    f3i = f[7]
    g0r = g[0]
    g0i = g[1]
    g1r = g[2]
    g1i = g[3]
    g2r = g[4]
    g2i = g[5]
    g3r = g[6]
    g3i = g[7]
    row = rows[i]
    row2 = rows[i + 1]
    for j in range(i + 1, n):
        u0r = ar[t0 + j]
        u0i = ai[t0 + j]
        u1r = ar[t1 + j]
        u1i = ai[t1 + j]
        u2r = ar[t2 + j]
        u2i = ai[t2 + j]
        u3r = ar[t3 + j]
        u3i = ai[t3 + j]
        ar[row + j] -= (f0r * u0r - f0i * u0i + f1r * u1r - f1i * u1i
                        + f2r * u2r - f2i * u2i + f3r * u3r - f3i * u3i)
        ai[row + j] -= (f0r * u0i + f0i * u0r + f1r * u1i + f1i * u1r
                        + f2r * u2i + f2i * u2r + f3r * u3i + f3i * u3r)
        ar[row2 + j] -= (g0r * u0r - g0i * u0i + g1r * u1r - g1i * u1i
                         + g2r * u2r - g2i * u2i + g3r * u3r - g3i * u3i)
        ai[row2 + j] -= (g0r * u0i + g0i * u0r + g1r * u1i + g1i * u1r
                         + g2r * u2i + g2i * u2r + g3r * u3i + g3i * u3r)


def solve_complex_symmetric(ar, ai, br, bi, n):
    """Solve (ar + i ai) x = (br + i bi) for a complex symmetric matrix (A = A^T, not Hermitian)
    whose real and imaginary parts are both positive definite, by symmetric Gaussian elimination
    without pivoting (LDL^T) on its packed upper triangle.

    Parameters
    ----------
    ar, ai : list
        Real and imaginary parts of the matrix's upper triangle, packed row by row (packed_index),
        n (n + 1) / 2 floats each; overwritten
    br, bi : list
        Real and imaginary parts of the right-hand side, n floats each; overwritten
    n : int
        Order of the system

    Returns
    -------
    x : list
        [xr, xi], the real and imaginary parts of the solution

    Notes
    -----
    About half the work of solve_complex ((4/3) n^3 real multiplications and additions). Without
    pivoting it is stable for this class: for complex symmetric A = B + i C with B and C symmetric
    positive definite the growth factor of Gaussian elimination without pivoting is below 3
    (Higham, N. J., "Factorizing complex symmetric matrices with positive definite real and imaginary
    parts", Math. Comp. 67, 1591-1599, 1998). The filament matrices are of this class: R is a positive
    diagonal, and -ln|x - y| is a positive definite kernel on a domain of diameter below 1 m
    (logarithmic capacity below 1). Raises CoreError for a zero pivot.

    The pivots are taken four at a time: the block's rows k + 1 .. k + 3 are reduced by the block's
    earlier pivots (_reduce_row), then every later row i by all four in one pass,
    a_ij -= l_i0 a_kj + l_i1 a_(k+1)j + l_i2 a_(k+2)j + l_i3 a_(k+3)j with l_ip = a_(k+p)i / a_(k+p)(k+p)
    (a_(k+p)i = a_i(k+p): symmetric, read from the pivot's row). That is the same elimination, its
    updates grouped: each remaining entry is read and written once per four pivots instead of once per
    pivot (in node 1.7 times faster for n = 378 than two pivots at a time: best CPU time of 24 runs
    34.8 -> 19.5 ms; the additions are grouped differently, so the last bits may differ). The later
    rows go two at a time (_reduce_two_by_block): each entry of the four pivot rows is read once for
    both, with the same sums in the same order as one row at a time (the same bits); in node 1.3 to
    2 times faster than one row at a time for n = 378. The row starts are running sums of the row
    lengths: packed_index's halving gave the JIT a float where it expected an integer index.

    Examples
    --------
    [[2 + i, 1], [1, 3 + 2i]] x = [1, i]: x = [(8 - 9i) / 29, (4 + 10i) / 29] (Cramer's rule by hand,
    determinant 3 + 7i); the packed upper triangle is [a00, a01, a11]:

    >>> x = solve_complex_symmetric([2.0, 1.0, 3.0], [1.0, 0.0, 2.0], [1.0, 0.0], [0.0, 1.0], 2)
    >>> [round(v * 29.0, 9) for v in x[0]], [round(v * 29.0, 9) for v in x[1]]
    ([8.0, 4.0], [-9.0, 10.0])
    """
    # rows[i] + j is the index of entry (i, j), j >= i: row i starts at packed_index(i, 0, n), which is
    # row i - 1's start plus its n - (i - 1) entries (sums of integers: no division)
    rows = []
    at = 0
    for i in range(n):
        rows.append(at - i)
        at += n - i
    # the multipliers of the rows being reduced: [l_i0 re, im, l_i1 re, im, ..] (_multipliers)
    f = [0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0]
    g = [0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0]
    k = 0
    while k < n:
        last = k + 4
        if last > n:
            last = n
        # the block's pivots and its own rows; inverses: [re, im] of each 1 / a_pp, one after the other
        inverses = []
        for p in range(k, last):
            inverse = _inverse_pivot(ar, ai, rows[p] + p)
            inverses.append(inverse[0])
            inverses.append(inverse[1])
            for q in range(p + 1, last):
                _reduce_row(ar, ai, br, bi, rows, p, q, inverse)
        if last == n:
            break
        # every later row by the four pivots in one pass, two rows at a time (each pivot row entry read
        # once for both)
        i = last
        while i < n:
            _multipliers(ar, ai, rows, k, inverses, i, f)
            _reduce_rhs(br, bi, k, f, i)
            if i + 1 < n:
                _multipliers(ar, ai, rows, k, inverses, i + 1, g)
                _reduce_rhs(br, bi, k, g, i + 1)
                # entry (i, i), which row i + 1 does not have, then both rows from column i + 1
                _reduce_by_block(ar, ai, rows, k, f, i, i, i + 1)
                _reduce_two_by_block(ar, ai, rows, k, f, g, i)
                i += 2
            else:
                _reduce_by_block(ar, ai, rows, k, f, i, i, n)
                i += 1
        k = last
    return back_substitute(ar, ai, br, bi, rows)
# __pragma__ ('kwargs')


# __pragma__ ('nokwargs')
def back_substitute(ar, ai, br, bi, rows):
    """Solve U x = b for an upper triangular U = (ar + i ai) and b = br + i bi: the last step of both
    eliminations. Entry (i, j), j >= i, of U is at index rows[i] + j (rows[i] = i n for a row-major
    square, whose part below the diagonal is not read; packed_index(i, 0, n) for a packed triangle).

    Returns [xr, xi]. The diagonal must be nonzero (the eliminations check their pivots).

    Examples
    --------
    [[2, 1], [0, 1 + i]] x = [3, 1 + i] by hand: x2 = 1, x1 = (3 - 1) / 2 = 1; the same triangle
    square (rows 0 and 2) and packed (rows 0 and 1):

    >>> back_substitute([2.0, 1.0, 0.0, 1.0], [0.0, 0.0, 0.0, 1.0], [3.0, 1.0], [0.0, 1.0], [0, 2])
    [[1.0, 1.0], [0.0, 0.0]]
    >>> back_substitute([2.0, 1.0, 1.0], [0.0, 0.0, 1.0], [3.0, 1.0], [0.0, 1.0], [0, 1])
    [[1.0, 1.0], [0.0, 0.0]]
    """
    n = len(rows)
    # x_i is set at step i and read only at the steps after it: copies of b (one slice each in the
    # transpiled code) hold the places
    xr = br[:]
    xi = bi[:]
    i = n - 1
    while i >= 0:
        sr = br[i]
        si = bi[i]
        row = rows[i]
        for j in range(i + 1, n):
            sr -= ar[row + j] * xr[j] - ai[row + j] * xi[j]
            si -= ar[row + j] * xi[j] + ai[row + j] * xr[j]
        d = ar[row + i] * ar[row + i] + ai[row + i] * ai[row + i]
        xr[i] = (sr * ar[row + i] + si * ai[row + i]) / d
        xi[i] = (si * ar[row + i] - sr * ai[row + i]) / d
        i -= 1
    return [xr, xi]
# __pragma__ ('kwargs')
