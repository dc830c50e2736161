"""A small dense complex linear solver, complex numbers held as pairs of float lists.

Pure Python in the Transcrypt subset (JS has no complex type): a matrix is two flat row-major
lists (real and imaginary parts) of n * n floats, a vector two lists of n floats.
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
    return back_substitute(ar, ai, br, bi, n)
# __pragma__ ('kwargs')


# __pragma__ ('nokwargs')
def solve_complex_symmetric(ar, ai, br, bi, n):
    """Solve (ar + i ai) x = (br + i bi) for a complex symmetric matrix (A = A^T, not Hermitian)
    whose real and imaginary parts are both positive definite, by symmetric Gaussian elimination
    without pivoting (LDL^T), working on the upper triangle only.

    Parameters and return as solve_complex; only the upper triangle (j >= i) of the matrix is read.

    Notes
    -----
    About half the work of solve_complex ((4/3) n^3 real multiplications and additions). Without
    pivoting it is stable for this class: for complex symmetric A = B + i C with B and C symmetric
    positive definite the growth factor of Gaussian elimination without pivoting is below 3
    (Higham, N. J., "Factorizing complex symmetric matrices with positive definite real and imaginary
    parts", Math. Comp. 67, 1591-1599, 1998). The filament matrices are of this class: R is a positive
    diagonal, and -ln|x - y| is a positive definite kernel on a domain of diameter below 1 m
    (logarithmic capacity below 1). Raises CoreError for a zero pivot.
    """
    for k in range(n):
        kk = k * n + k
        best = ar[kk] * ar[kk] + ai[kk] * ai[kk]
        if not (best > 0.0):
            raise CoreError("the filament system is singular", "")
        inv_r = ar[kk] / best
        inv_i = -ai[kk] / best
        top = k * n
        for i in range(k + 1, n):
            fr0 = ar[top + i]  # a_ik = a_ki (symmetric): read from row k
            fi0 = ai[top + i]
            if fr0 == 0.0 and fi0 == 0.0:
                continue
            fr = fr0 * inv_r - fi0 * inv_i
            fi = fr0 * inv_i + fi0 * inv_r
            row = i * n
            for j in range(i, n):
                ur = ar[top + j]
                ui = ai[top + j]
                ar[row + j] -= fr * ur - fi * ui
                ai[row + j] -= fr * ui + fi * ur
            br[i] -= fr * br[k] - fi * bi[k]
            bi[i] -= fr * bi[k] + fi * br[k]
    return back_substitute(ar, ai, br, bi, n)
# __pragma__ ('kwargs')


# __pragma__ ('nokwargs')
def back_substitute(ar, ai, br, bi, n):
    """Solve U x = b for the upper triangle U of (ar + i ai) (row-major, n * n; the part below the
    diagonal is not read) and b = br + i bi: the last step of both eliminations.

    Returns [xr, xi]. The diagonal must be nonzero (the eliminations check their pivots).

    Examples
    --------
    [[2, 1], [0, 1 + i]] x = [3, 1 + i] by hand: x2 = 1, x1 = (3 - 1) / 2 = 1:

    >>> back_substitute([2.0, 1.0, 0.0, 1.0], [0.0, 0.0, 0.0, 1.0], [3.0, 1.0], [0.0, 1.0], 2)
    [[1.0, 1.0], [0.0, 0.0]]
    """
    xr = []
    xi = []
    for i in range(n):
        xr.append(0.0)
        xi.append(0.0)
    i = n - 1
    while i >= 0:
        sr = br[i]
        si = bi[i]
        row = i * n
        for j in range(i + 1, n):
            sr -= ar[row + j] * xr[j] - ai[row + j] * xi[j]
            si -= ar[row + j] * xi[j] + ai[row + j] * xr[j]
        d = ar[row + i] * ar[row + i] + ai[row + i] * ai[row + i]
        xr[i] = (sr * ar[row + i] + si * ai[row + i]) / d
        xi[i] = (si * ar[row + i] - sr * ai[row + i]) / d
        i -= 1
    return [xr, xi]
# __pragma__ ('kwargs')
