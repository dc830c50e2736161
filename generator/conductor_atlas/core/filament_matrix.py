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
from conductor_atlas.core.filament_inductance import FAR_FIELD_RATIO, corner_term
from conductor_atlas.core.filament_mesh import mirror_images

_pi = math.pi
_log = math.log  # bound once: in the transpiled code math.log is a module attribute read per call


# __pragma__ ('nokwargs')
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


def _near_sum(table, kx, ky):
    # sum_a sum_b s_a s_b G(u_a, v_b) of a near pair: the four x edge pairs at kx + x_steps[a], the
    # four y edge pairs at ky + y_steps[b] (see _lower_pair), signs +, -, -, + in
    # rectangle_log_gmd_exact's order (added in the order of the unrolled sum it replaced: the same
    # bits). The y keys are looked up once per pair, the sum over b written out (in node 5 % less
    # assembly time than a loop over y_steps). table: [G rows, unset row, x keys, x values, y keys, y values, x_steps, y_steps, signs,
    # x edge count, y edge count] (_edge_differences' keys and values). G is kept in a row per x key,
    # made (a copy of the unset row, 1e300) at its first use, an entry per y key, computed at its
    # first use: the near pairs touch few x keys (122 of 650 for a 100 x 10 mm quarter at 400 Hz,
    # level 3), and a table of them all (118,300 entries there) took a third of the assembly's time
    # in node. One call per near pair: in node its 16 lookups cost less than four calls of four.
    rows = table[0]
    x_keys = table[2]
    x_values = table[3]
    y_keys = table[4]
    y_values = table[5]
    x_steps = table[6]
    signs = table[8]
    # the four y edge pairs (y_steps: ny, 0, ny + 1, 1), the same for the four x edge pairs
    ny = table[10]
    ky0 = ky + ny
    ky2 = ky + ny + 1
    ky3 = ky + 1
    y0 = y_keys[ky0]
    y1 = y_keys[ky]
    y2 = y_keys[ky2]
    y3 = y_keys[ky3]
    total = 0.0
    for a in range(4):
        kxa = kx + x_steps[a]
        row = rows[x_keys[kxa]]
        if row is None:
            row = table[1][:]
            rows[x_keys[kxa]] = row
        g0 = row[y0]
        if g0 > 1e299:
            g0 = corner_term(x_values[kxa], y_values[ky0])
            row[y0] = g0
        g1 = row[y1]
        if g1 > 1e299:
            g1 = corner_term(x_values[kxa], y_values[ky])
            row[y1] = g1
        g2 = row[y2]
        if g2 > 1e299:
            g2 = corner_term(x_values[kxa], y_values[ky2])
            row[y2] = g2
        g3 = row[y3]
        if g3 > 1e299:
            g3 = corner_term(x_values[kxa], y_values[ky3])
            row[y3] = g3
        # signs +, -, -, +: the bits of adding s_b G one after the other from 0
        part = g0 - g1 - g2 + g3
        total += signs[a] * part
    return total


def _row_logs(logs, i, cells, images, table):
    # appends to logs, for j = i .. n - 1, the sum over the images of (image current sign) ln g of
    # filaments i and j; cells: [x, y, w, h, w^2, h^2, largest side, x edge index, y edge index] of
    # every filament (flat lists). Most pairs are far: the far branch is the inner loop, written with
    # plain floats (no call, no list made per pair)
    xs = cells[0]
    ys = cells[1]
    ws = cells[2]
    hs = cells[3]
    w2s = cells[4]
    h2s = cells[5]
    sides = cells[6]
    xi = cells[7]
    yi = cells[8]
    n = len(xs)
    count = len(images)
    xa = xs[i]
    ya = ys[i]
    wa2 = w2s[i]
    ha2 = h2s[i]
    far2 = FAR_FIELD_RATIO * FAR_FIELD_RATIO
    for j in range(i, n):
        s = sides[i]
        if sides[j] > s:
            s = sides[j]
        limit = far2 * s * s
        near = 0.0
        far = 0
        # far images: the product of their D^2 (signed powers), and the sums of the signed
        # derivative factors of far_field_correction, (dy^2 - dx^2) / D^4 and
        # (dx^4 - 6 dx^2 dy^2 + dy^4) / D^8
        product = 1.0
        second = 0.0
        fourth = 0.0
        for k in range(count):
            img = images[k]
            sign = img[2]
            dx = img[0] * xs[j] - xa
            dy = img[1] * ys[j] - ya
            dx2 = dx * dx
            dy2 = dy * dy
            d2 = dx2 + dy2
            if d2 > limit:
                far += 1
                q = 1.0 / (d2 * d2)
                if sign > 0.0:
                    product *= d2
                else:
                    product /= d2
                second += sign * (dy2 - dx2) * q
                fourth += sign * (dx2 * dx2 - 6.0 * dx2 * dy2 + dy2 * dy2) * q * q
            else:
                # edge pairs in rectangle_log_gmd_exact's order (upper - lower, lower - lower,
                # upper - upper, lower - upper; signs +, -, -, +)
                kx = _lower_pair(xi[i], xi[j], table[9], img[0] < 0.0)
                ky = _lower_pair(yi[i], yi[j], table[10], img[1] < 0.0)
                near += sign * _near_sum(table, kx, ky)
        m = 0.0
        if far < count:
            m = near / (ws[i] * hs[i] * ws[j] * hs[j])
        if far > 0:
            # far_field_correction's moments of the pair (the same for every image)
            wb2 = w2s[j]
            hb2 = h2s[j]
            m2x = (wa2 + wb2) / 12.0
            m2y = (ha2 + hb2) / 12.0
            m4x = (wa2 * wa2 + wb2 * wb2) / 80.0 + wa2 * wb2 / 24.0
            m4y = (ha2 * ha2 + hb2 * hb2) / 80.0 + ha2 * hb2 / 24.0
            m += (0.5 * _log(product) + 0.5 * second * (m2x - m2y)
                  - 0.25 * fourth * (m4x - 6.0 * m2x * m2y + m4y))
        logs.append(m)


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
        The upper triangle of the symmetric n x n matrix, packed row by row (entry (i, j), i <= j,
        at core.complex_linear.packed_index(i, j, n)): n (n + 1) / 2 floats, [ln m]

    Notes
    -----
    ln g of two cells far apart (centre distance over FAR_FIELD_RATIO times the largest side) by
    the far-field expansion (core.filament_inductance.far_field_correction); its moments depend
    on the two cells' sides only, so the images' derivative terms are summed first and the moments
    applied once per pair, and the ln D of all far images is the log of one product. Near images
    by the exact closed form (rectangle_log_gmd_exact: 16 corner terms G(u, v), u and v differences
    of the cells' edges), each G tabulated by its pair of edge differences: the cells of a tensor
    mesh share their edges, so each G is computed once. The same values as summing
    core.filament_inductance.rectangle_log_gmd over the images, to rounding
    (tests/core/test_filament_solver.py). Most pairs of a mesh are far: the far branch is the
    inner loop, written with plain floats (no call, no list made per pair).

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
    # the table of G: a row per x key (made at its first use), an entry per y key
    unset = []
    for k in range(ny * (ny + 1)):
        unset.append(1e300)
    rows = []
    for k in range(nx * (nx + 1)):
        rows.append(None)
    table = [rows, unset, xd[0], xd[1], yd[0], yd[1], [nx, 0, nx + 1, 1], [ny, 0, ny + 1, 1],
             [1.0, -1.0, -1.0, 1.0], nx, ny]
    # the filaments' numbers as flat lists: centre, sides, squared sides, largest side, edge indices
    cells = [[], [], [], [], [], [], [], [], []]
    for a in fils:
        side = a[2]
        if a[3] > side:
            side = a[3]
        numbers = [a[0], a[1], a[2], a[3], a[2] * a[2], a[3] * a[3], side, a[6], a[7]]
        for k in range(9):
            cells[k].append(numbers[k])
    logs = []
    for i in range(n):
        _row_logs(logs, i, cells, images, table)
    return logs


def _impedances(fils, logs, omega_l):
    # [real, imaginary] parts of R + j w L, packed as logs: R_ii = rho / a_i on the diagonal, 0 off it;
    # w L_ij = -omega_l logs_ij (omega_l = w mu_0 / (2 pi)), written over logs. A function of its own:
    # the page runs it once per level, and a long loop in such a function ran in node's interpreter
    # on every call
    n = len(fils)
    ar = logs[:]
    at = 0
    for i in range(n):
        # row i of the packed triangle starts at its diagonal entry
        a = fils[i]
        ar[at] = a[5] / (a[2] * a[3])
        logs[at] = -omega_l * logs[at]
        at += 1
        for j in range(i + 1, n):
            ar[at] = 0.0
            logs[at] = -omega_l * logs[at]
            at += 1
    return [ar, logs]


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
    system = _impedances(fils, filament_log_gmds(mesh, sym_x, sym_y), omega_l)
    br = []
    bi = []
    for i in range(n):
        br.append(1.0)
        bi.append(0.0)
    ar = system[0]
    ai = system[1]
    return solve_complex_symmetric(ar, ai, br, bi, n)
# __pragma__ ('kwargs')
