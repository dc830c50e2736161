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

    The pivots are taken two at a time: row k + 1 is reduced by pivot k, then every later row by
    both pivots in one pass (a_ij -= f a_kj + g a_(k+1)j), which reads and writes each remaining
    entry once per two pivots instead of once per pivot (the same arithmetic, grouped; with the
    packed half of the matrix, in node about 1.5 times faster for n = 288 than one pivot at a time
    on the full square).

    Examples
    --------
    [[2 + i, 1], [1, 3 + 2i]] x = [1, i]: x = [(8 - 9i) / 29, (4 + 10i) / 29] (Cramer's rule by hand,
    determinant 3 + 7i); the packed upper triangle is [a00, a01, a11]:

    >>> x = solve_complex_symmetric([2.0, 1.0, 3.0], [1.0, 0.0, 2.0], [1.0, 0.0], [0.0, 1.0], 2)
    >>> [round(v * 29.0, 9) for v in x[0]], [round(v * 29.0, 9) for v in x[1]]
    ([8.0, 4.0], [-9.0, 10.0])
    """
    # rows[i] + j is the index of entry (i, j), j >= i
    rows = []
    for i in range(n):
        rows.append(packed_index(i, 0, n))
    k = 0
    while k < n:
        top = rows[k]
        inverse = _inverse_pivot(ar, ai, top + k)
        inv_r = inverse[0]
        inv_i = inverse[1]
        if k + 1 == n:
            break
        # row k + 1 by pivot k alone
        fr0 = ar[top + k + 1]
        fi0 = ai[top + k + 1]
        fr = fr0 * inv_r - fi0 * inv_i
        fi = fr0 * inv_i + fi0 * inv_r
        nxt = rows[k + 1]
        for j in range(k + 1, n):
            ar[nxt + j] -= fr * ar[top + j] - fi * ai[top + j]
            ai[nxt + j] -= fr * ai[top + j] + fi * ar[top + j]
        br[k + 1] -= fr * br[k] - fi * bi[k]
        bi[k + 1] -= fr * bi[k] + fi * br[k]
        inverse = _inverse_pivot(ar, ai, nxt + k + 1)
        jnv_r = inverse[0]
        jnv_i = inverse[1]
        # every later row i by both pivots: multipliers f = a_ki / a_kk, g = a_(k+1)i / a_(k+1)(k+1)
        for i in range(k + 2, n):
            fr0 = ar[top + i]  # a_ik = a_ki (symmetric): read from row k
            fi0 = ai[top + i]
            gr0 = ar[nxt + i]
            gi0 = ai[nxt + i]
            if fr0 == 0.0 and fi0 == 0.0 and gr0 == 0.0 and gi0 == 0.0:
                continue
            fr = fr0 * inv_r - fi0 * inv_i
            fi = fr0 * inv_i + fi0 * inv_r
            gr = gr0 * jnv_r - gi0 * jnv_i
            gi = gr0 * jnv_i + gi0 * jnv_r
            row = rows[i]
            for j in range(i, n):
                ur = ar[top + j]
                ui = ai[top + j]
                vr = ar[nxt + j]
                vi = ai[nxt + j]
                ar[row + j] -= fr * ur - fi * ui + gr * vr - gi * vi
                ai[row + j] -= fr * ui + fi * ur + gr * vi + gi * vr
            br[i] -= fr * br[k] - fi * bi[k] + gr * br[k + 1] - gi * bi[k + 1]
            bi[i] -= fr * bi[k] + fi * br[k] + gr * bi[k + 1] + gi * br[k + 1]
        k += 2
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
    xr = []
    xi = []
    for i in range(n):
        xr.append(0.0)
        xi.append(0.0)
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
