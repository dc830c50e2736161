"""The filament solver's linear system: the log-GMD matrix of a mesh and the filament currents.

Per unit length the filaments obey (R + j w L) I = V with R_ii = rho / a_i on the diagonal and
L_ij = -(mu_0 / (2 pi)) sum over the mirror images of (image current sign) ln g_ij, g_ij the
geometric mean distance of filament i and filament j's image (core.filament_inductance). The
matrix is complex symmetric with positive definite real and imaginary parts, solved by
core.complex_linear.solve_complex_symmetric.

Pure Python in the Transcrypt subset; a mesh as core.filament_mesh.filament_mesh builds it.
"""

import math

from conductor_atlas.core.complex_linear import solve_complex_symmetric
from conductor_atlas.core.constants import MU_0
from conductor_atlas.core.filament_inductance import FAR_FIELD_RATIO, corner_term, far_field_correction
from conductor_atlas.core.filament_mesh import mirror_images

_pi = math.pi


# __pragma__ ('nokwargs')
def _filled(count, value):
    # a list of count copies of value, grown by chunks (one append per element costs a call each in JS)
    chunk = []
    for k in range(256):
        chunk.append(value)
    out = []
    while len(out) + 256 <= count:
        out.extend(chunk)
    while len(out) < count:
        out.append(value)
    return out


def _edge_differences(edges):
    """[keys, values] of the differences between the edges of one axis, flat lists of 2 n^2 (n edges).

    Entry p * n + r: edge p minus edge r; entry n^2 + p * n + r: edge p minus the mirror image of
    edge n - 1 - r (edge p plus edge n - 1 - r: the mirror images of the edges, in increasing order,
    so that both halves are indexed alike, see _lower_pair). values: the absolute difference [m];
    keys: a number that is the same for equal differences of the same kind (p, q and q, p share
    one), 0 .. n (n + 1) - 1, so that a table indexed by keys holds each corner term once.
    """
    n = len(edges)
    pairs = n * (n + 1) // 2  # unordered pairs of edges: keys 0 .. 2 pairs - 1
    keys = []
    values = []
    for mirrored in range(2):
        for p in range(n):
            for r in range(n):
                q = r
                if mirrored == 1:
                    q = n - 1 - r
                lo = p
                hi = q
                if p > q:
                    lo = q
                    hi = p
                keys.append(mirrored * pairs + lo + hi * (hi + 1) // 2)
                d = edges[p] - edges[q]
                if mirrored == 1:
                    d = edges[p] + edges[q]
                if d < 0.0:
                    d = -d
                values.append(d)
    return [keys, values]


def _lower_pair(p, q, n, mirrored):
    # index in _edge_differences of (lower edge p of one cell, lower edge q of the other or of its
    # mirror image); the cells' other edge pairs follow at + n (upper, lower), + 1 (lower, upper)
    # and + n + 1 (upper, upper). The mirror image of a cell with edges q, q + 1 has its lower edge
    # at mirrored index n - 2 - q.
    if mirrored:
        return n * n + p * n + n - 2 - q
    return p * n + q


def _corner(corners, at, u, v):
    # G(u, v) from the table, computed at its first use (1e300: not yet)
    g = corners[at]
    if g > 1e299:
        g = corner_term(u, v)
        corners[at] = g
    return g


def _corner_row(corners, row, u, v_keys, v_values, k, ny):
    # G(u, v1) - G(u, v2) - G(u, v3) + G(u, v4) over the four y edge pairs from index k
    return (_corner(corners, row + v_keys[k + ny], u, v_values[k + ny])
            - _corner(corners, row + v_keys[k], u, v_values[k])
            - _corner(corners, row + v_keys[k + ny + 1], u, v_values[k + ny + 1])
            + _corner(corners, row + v_keys[k + 1], u, v_values[k + 1]))


def filament_log_gmds(mesh, sym_x, sym_y):
    """sum over the mirror images of (image current sign) ln g_ij for every pair of filaments.

    Parameters
    ----------
    mesh : list
        [filaments, x edges, y edges] as core.filament_mesh.filament_mesh builds it (a filament:
        [x, y, w, h, conductor, rho, i, j], i and j the indices of its lower x and y edges), [m]
    sym_x, sym_y : float
        Mirror symmetry across x = 0 and y = 0: 1 (same current), -1 (opposite), 0 (none)

    Returns
    -------
    logs : list
        n * n floats, row-major, symmetric, [ln m]

    Notes
    -----
    ln g of two cells far apart (centre distance over FAR_FIELD_RATIO times the largest side) by
    the far-field expansion, the ln D of all far images of one pair summed as the log of one
    product; else by the exact closed form (rectangle_log_gmd_exact: 16 corner terms G(u, v), u
    and v differences of the cells' edges), each G tabulated by its pair of edge differences: the
    cells of a tensor mesh share their edges, so each G is computed once. The same values as
    summing core.filament_inductance.rectangle_log_gmd over the images (tests/core/test_filament_solver.py).

    Examples
    --------
    One square cell of 1 mm without images: ln of Maxwell's 0.44705 mm (Grover 1946, ch. 3):

    >>> cell = [[[0.0005, 0.0005, 1e-3, 1e-3, 0, 1.7e-8, 0, 0]], [0.0, 1e-3], [0.0, 1e-3]]
    >>> round(math.exp(filament_log_gmds(cell, 0.0, 0.0)[0]) * 1e3, 5)
    0.44705
    """
    fils = mesh[0]
    n = len(fils)
    images = mirror_images(sym_x, sym_y)
    nx = len(mesh[1])
    ny = len(mesh[2])
    xd = _edge_differences(mesh[1])
    yd = _edge_differences(mesh[2])
    x_keys = xd[0]
    x_values = xd[1]
    y_keys = yd[0]
    y_values = yd[1]
    width = ny * (ny + 1)  # keys per row of the table
    corners = _filled(nx * (nx + 1) * width, 1e300)
    sides = []
    for a in fils:
        side = a[2]
        if a[3] > side:
            side = a[3]
        sides.append(side)
    far2 = FAR_FIELD_RATIO * FAR_FIELD_RATIO
    logs = _filled(n * n, 0.0)
    for i in range(n):
        a = fils[i]
        for j in range(i, n):
            b = fils[j]
            s = sides[i]
            if sides[j] > s:
                s = sides[j]
            m = 0.0
            # the far images' ln D summed as the log of one product of D^2 (one log, not four)
            product = 1.0
            for img in images:
                bx = img[0] * b[0]
                by = img[1] * b[1]
                dx = bx - a[0]
                dy = by - a[1]
                d2 = dx * dx + dy * dy
                if d2 > far2 * s * s:
                    if img[2] > 0.0:
                        product *= d2
                    else:
                        product /= d2
                    m += img[2] * far_field_correction(dx, dy, a[2], a[3], b[2], b[3])
                    continue
                # edge pairs in rectangle_log_gmd_exact's order (upper - lower, lower - lower,
                # upper - upper, lower - upper; signs +, -, -, +)
                kx = _lower_pair(a[6], b[6], nx, img[0] < 0.0)
                ky = _lower_pair(a[7], b[7], ny, img[1] < 0.0)
                total = (_corner_row(corners, x_keys[kx + nx] * width, x_values[kx + nx], y_keys, y_values, ky, ny)
                         - _corner_row(corners, x_keys[kx] * width, x_values[kx], y_keys, y_values, ky, ny)
                         - _corner_row(corners, x_keys[kx + nx + 1] * width, x_values[kx + nx + 1], y_keys, y_values,
                                       ky, ny)
                         + _corner_row(corners, x_keys[kx + 1] * width, x_values[kx + 1], y_keys, y_values, ky, ny))
                m += img[2] * total / (a[2] * a[3] * b[2] * b[3])
            if product != 1.0:
                m += 0.5 * math.log(product)
            logs[i * n + j] = m
            logs[j * n + i] = m
    return logs


def filament_currents(mesh, f, sym_x, sym_y):
    """[real parts, imaginary parts] of the filament currents [A] at a unit voltage drop [V/m] on all.

    Parameters
    ----------
    mesh : list
        [filaments, x edges, y edges] as core.filament_mesh.filament_mesh builds it
    f : float
        Frequency, [Hz]
    sym_x, sym_y : float
        Mirror symmetry across x = 0 and y = 0 (see filament_log_gmds)

    Notes
    -----
    (R + j w L) I = 1 with R_ii = rho / a_i and j w L_ij = -j (w mu_0 / 2 pi) sum_images ln g.

    Examples
    --------
    At a frequency far too low for any skin effect each filament carries its DC current a / rho
    (1 mm^2 of copper: 58.0 A per V/m, to 1 part in 10^6):

    >>> cell = [[[0.0005, 0.0005, 1e-3, 1e-3, 0, 1.7241e-8, 0, 0]], [0.0, 1e-3], [0.0, 1e-3]]
    >>> currents = filament_currents(cell, 1e-3, 0.0, 0.0)
    >>> round(currents[0][0] * 1.7241e-8 / 1e-6, 6), round(currents[0][0], 1)
    (1.0, 58.0)
    """
    fils = mesh[0]
    n = len(fils)
    omega_l = 2.0 * _pi * f * MU_0 / (2.0 * _pi)  # w mu_0 / (2 pi)
    ai = filament_log_gmds(mesh, sym_x, sym_y)
    for k in range(n * n):
        ai[k] = -omega_l * ai[k]
    ar = _filled(n * n, 0.0)
    for i in range(n):
        a = fils[i]
        ar[i * n + i] = a[5] / (a[2] * a[3])
    br = []
    bi = []
    for i in range(n):
        br.append(1.0)
        bi.append(0.0)
    return solve_complex_symmetric(ar, ai, br, bi, n)
# __pragma__ ('kwargs')
