"""AC resistance of bars, bar groups and go-and-return pairs by the 2-D filament method.

The partial-inductance (filament) method: each conductor's cross-section is cut into rectangular
filaments, each carrying a uniform current density; per unit length

    (R + j w L) I = V,   R_ii = rho / a_i,   L_ij = -(mu_0 / (2 pi)) ln g_ij

with g_ij the geometric mean distance of filaments i and j (core.filament_inductance) and V the
voltage drop per length, the same on every filament of one conductor (or of one group of bars
joined at their ends). The AC resistance is the dissipated power over the squared current,
R_ac = sum R_ii |I_i|^2 / |sum I_i|^2. Mirror symmetry is used where the layout has it (a
single bar or a group is solved on a quarter, a go-and-return pair on a half of one conductor),
the mesh is stretched toward the surfaces (cells of 0.4 skin depth there at the first level),
and it is refined level by level until the ratio's estimated change, the Richardson correction
between two levels, is below 0.1 %; the answer is the extrapolated ratio and says how many
filaments the finest level used.

Non-magnetic conductors (mu_r = 1) only: the filament method takes the field as in free space.
Every conductor is straight, long and parallel to the others (2-D). Pure Python in the
Transcrypt subset; SI floats in and out; CoreError for impossible inputs.

References
----------
1. Weeks, W. T., Wu, L. L.-H., McAllister, M. F., Singh, A., "Resistive and inductive skin
   effect in rectangular conductors", IBM J. Res. Dev. 23 (6), 652-660 (1979) (the method).
2. Hoer, C., Love, C., J. Res. NBS 69C, 127 (1965); Grover, F. W., Inductance Calculations,
   1946 (the geometric mean distances; see core.filament_inductance).
"""

import math

from conductor_atlas.core.constants import MU_0
from conductor_atlas.core.complex_linear import solve_complex, solve_complex_symmetric
from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.filament_inductance import (FAR_FIELD_RATIO, annulus_log_gmd, corner_term,
                                                      far_field_correction)

_sqrt = math.sqrt
_pi = math.pi

# Mesh: along each side of a conductor the cells follow a fixed exponential stretching from a
# fine end (a surface) inward, the same map at every level, with n0 * level cells: n0 is set so
# that the cells at a surface are FINE_DEPTH * min(delta, span) wide at level 1, and the largest
# cell is at most MAX_STRETCH times the smallest. A fixed map refined uniformly makes the error
# fall smoothly as 1 / level^2, which the extrapolation (_extrapolate) relies on.
FINE_DEPTH = 0.4
MAX_STRETCH = 1e6
# more cells than this along one side at level 1 means a conductor hundreds of skin depths across
# (about 500 delta for a bar face): refused, the dense solve would not finish on a page
MAX_CELLS_PER_SIDE = 24
# the mesh stops growing here: the last level still below it is the answer, flagged unconverged
MAX_FILAMENTS = 300
MAX_LEVEL = 8
# bars refine level by level (half levels, tried, broke the smooth 1 / level^2 fall that the
# extrapolation needs: ceil(n0 * 1.5) cells are not 1.5 times finer)
LEVEL_STEP = 1.0
TOLERANCE = 1e-3
RING_FIRST_LEVEL = 2


def _check_positive(x, field, what):
    if not (x - x == 0) or x <= 0.0:
        raise CoreError(what + " must be a finite number above 0", field)


def skin_depth_mu0(rho, f):
    """delta = sqrt(rho / (pi f mu_0)) [m] of a non-magnetic conductor (rho [ohm m], f [Hz]).

    Examples
    --------
    IEC 60028 copper at 50 Hz: 9.35 mm, the same as core.skin_effect.skin_depth with mu_r = 1 (and the
    9.3 mm of handbook tables for copper at 50 Hz, from memory):

    >>> round(skin_depth_mu0(1.7241e-8, 50.0) * 1e3, 2)
    9.35
    """
    return _sqrt(rho / (_pi * f * MU_0))


# __pragma__ ('nokwargs')
def _stretched(lo, span, fine_at_lo, delta, level):
    # edges of n0 * level cells over lo..lo + span, exponentially stretched away from the fine end
    d = delta
    if span < d:
        d = span
    stretch = span / d
    if stretch > MAX_STRETCH:
        stretch = MAX_STRETCH
    beta = math.log(stretch)
    if beta > 1e-6:
        first = span * beta / (stretch - 1.0)  # width at the fine end of a map of unit cell count
    else:
        first = span
    n0 = math.ceil(first / (FINE_DEPTH * d) - 1e-9)
    if n0 < 2:
        n0 = 2
    if n0 > MAX_CELLS_PER_SIDE:
        raise CoreError("the conductor is " + str(math.floor(span / delta)) + " skin depths across: more than the "
                        "filament solver resolves on a page; use a lower frequency or see the surface resistance",
                        "frequency")
    n = math.ceil(n0 * level - 1e-9)
    edges = []
    for k in range(n + 1):
        s = k / n
        if beta > 1e-6:
            u = (math.exp(beta * s) - 1.0) / (stretch - 1.0)
        else:
            u = s
        if k == n:
            u = 1.0  # the far end exactly (exp(beta) - 1 over stretch - 1 is 1 only to a last bit)
        if fine_at_lo:
            edges.append(lo + span * u)
        else:
            edges.append(lo + span * (1.0 - u))
    if not fine_at_lo:
        edges.reverse()
    return edges


def graded_edges(lo, hi, fine_lo, fine_hi, delta, level):
    """Cell edges [m] from lo to hi, fine at the ends marked fine (see graded_cells)."""
    edges = []
    if fine_lo and fine_hi:
        mid = 0.5 * (lo + hi)
        first = _stretched(lo, mid - lo, True, delta, level)
        second = _stretched(mid, hi - mid, False, delta, level)
        for x in first:
            edges.append(x)
        for k in range(1, len(second)):
            edges.append(second[k])
    else:
        edges = _stretched(lo, hi - lo, fine_lo or not fine_hi, delta, level)
    return edges


def graded_cells(lo, hi, fine_lo, fine_hi, delta, level):
    """Cells [[centre, size], ...] covering lo..hi [m], fine at the ends marked fine.

    Exponential stretching from each fine end (both: each half from its own end), the same map at
    every level with the cell count proportional to level (see FINE_DEPTH).

    Examples
    --------
    The cells cover lo..hi exactly, the finest at the fine end:

    >>> cells = graded_cells(0.0, 1e-3, True, False, 1e-4, 1)
    >>> round(sum([c[1] for c in cells]) * 1e3, 12), cells[0][1] < cells[len(cells) - 1][1]
    (1.0, True)
    """
    edges = graded_edges(lo, hi, fine_lo, fine_hi, delta, level)
    cells = []
    for k in range(len(edges) - 1):
        cells.append([0.5 * (edges[k] + edges[k + 1]), edges[k + 1] - edges[k]])
    return cells


def _shared_edges(all_edges, edges):
    # offset of edges in all_edges: an earlier identical run is reused (bars of a group share their
    # x edges), else they are appended
    n = len(edges)
    start = 0
    while start + n <= len(all_edges):
        same = True
        for k in range(n):
            if all_edges[start + k] != edges[k]:
                same = False
                break
        if same:
            return start
        start += n
    start = len(all_edges)
    for x in edges:
        all_edges.append(x)
    return start


def _filaments(blocks, delta, level):
    # blocks: [x_lo, x_hi, y_lo, y_hi, fine x_lo, fine x_hi, fine y_lo, fine y_hi, conductor, rho]
    # -> [filaments, x edges, y edges]; a filament is [x, y, w, h, conductor, rho, i, j], i and j the
    # indices of its lower x and y edges (its upper edges are i + 1 and j + 1)
    out = []
    x_edges = []
    y_edges = []
    for b in blocks:
        xs = graded_edges(b[0], b[1], b[4], b[5], delta, level)
        ys = graded_edges(b[2], b[3], b[6], b[7], delta, level)
        xo = _shared_edges(x_edges, xs)
        yo = _shared_edges(y_edges, ys)
        for i in range(len(xs) - 1):
            for j in range(len(ys) - 1):
                out.append([0.5 * (xs[i] + xs[i + 1]), 0.5 * (ys[j] + ys[j + 1]), xs[i + 1] - xs[i], ys[j + 1] - ys[j],
                            b[8], b[9], xo + i, yo + j])
    return [out, x_edges, y_edges]


def _images(sym_x, sym_y):
    # mirror images [sign x, sign y, current sign] including the filament itself
    out = [[1.0, 1.0, 1.0]]
    if sym_x != 0:
        out.append([-1.0, 1.0, sym_x])
    if sym_y != 0:
        out.append([1.0, -1.0, sym_y])
    if sym_x != 0 and sym_y != 0:
        out.append([-1.0, -1.0, sym_x * sym_y])
    return out


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

    Entry p * n + q: edge p minus edge q; entry n^2 + p * n + q: edge p minus the mirror image of
    edge q (edge p plus edge q). values: the absolute difference [m]; keys: a number that is the
    same for equal differences of the same kind (p, q and q, p share one), 0 .. n (n + 1) - 1, so
    that a table indexed by keys holds each corner term once.
    """
    n = len(edges)
    pairs = n * (n + 1) // 2  # unordered pairs of edges: keys 0 .. 2 pairs - 1
    keys = []
    values = []
    for mirrored in range(2):
        for p in range(n):
            for q in range(n):
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


def _corner_row(corners, row, u, v_keys, v_values, k1, k2, k3, k4):
    # G(u, v1) - G(u, v2) - G(u, v3) + G(u, v4), each G from the table row (computed once)
    g1 = corners[row + v_keys[k1]]
    if g1 > 1e299:
        g1 = corner_term(u, v_values[k1])
        corners[row + v_keys[k1]] = g1
    g2 = corners[row + v_keys[k2]]
    if g2 > 1e299:
        g2 = corner_term(u, v_values[k2])
        corners[row + v_keys[k2]] = g2
    g3 = corners[row + v_keys[k3]]
    if g3 > 1e299:
        g3 = corner_term(u, v_values[k3])
        corners[row + v_keys[k3]] = g3
    g4 = corners[row + v_keys[k4]]
    if g4 > 1e299:
        g4 = corner_term(u, v_values[k4])
        corners[row + v_keys[k4]] = g4
    return g1 - g2 - g3 + g4


def filament_log_gmds(mesh, sym_x, sym_y):
    """sum over the mirror images of (image current sign) ln g_ij for every pair of filaments.

    Parameters
    ----------
    mesh : list
        [filaments, x edges, y edges] as _filaments builds it (a filament: [x, y, w, h, conductor,
        rho, i, j], i and j the indices of its lower x and y edges), [m]
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
    """
    fils = mesh[0]
    n = len(fils)
    images = _images(sym_x, sym_y)
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
                # edge pairs in rectangle_log_gmd_exact's order (a's upper - b's lower, lower - lower,
                # upper - upper, lower - upper; signs +, -, -, +); an image's lower edge is the
                # mirror of b's upper edge
                p = a[6]
                q = b[6]
                if img[0] > 0.0:
                    x1 = (p + 1) * nx + q
                    x2 = p * nx + q
                    x3 = (p + 1) * nx + q + 1
                    x4 = p * nx + q + 1
                else:
                    x1 = nx * nx + (p + 1) * nx + q + 1
                    x2 = nx * nx + p * nx + q + 1
                    x3 = nx * nx + (p + 1) * nx + q
                    x4 = nx * nx + p * nx + q
                p = a[7]
                q = b[7]
                if img[1] > 0.0:
                    y1 = (p + 1) * ny + q
                    y2 = p * ny + q
                    y3 = (p + 1) * ny + q + 1
                    y4 = p * ny + q + 1
                else:
                    y1 = ny * ny + (p + 1) * ny + q + 1
                    y2 = ny * ny + p * ny + q + 1
                    y3 = ny * ny + (p + 1) * ny + q
                    y4 = ny * ny + p * ny + q
                total = (_corner_row(corners, x_keys[x1] * width, x_values[x1], y_keys, y_values, y1, y2, y3, y4)
                         - _corner_row(corners, x_keys[x2] * width, x_values[x2], y_keys, y_values, y1, y2, y3, y4)
                         - _corner_row(corners, x_keys[x3] * width, x_values[x3], y_keys, y_values, y1, y2, y3, y4)
                         + _corner_row(corners, x_keys[x4] * width, x_values[x4], y_keys, y_values, y1, y2, y3, y4))
                m += img[2] * total / (a[2] * a[3] * b[2] * b[3])
            if product != 1.0:
                m += 0.5 * math.log(product)
            logs[i * n + j] = m
            logs[j * n + i] = m
    return logs


def _solve_filaments(mesh, f, sym_x, sym_y):
    # currents [ir, ii] of the filaments at a unit voltage drop per length on all of them:
    # R_ii = rho / a_i on the diagonal, j w L_ij = -j (w mu_0 / 2 pi) sum_images ln g
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


def _same_sign_images(sym_x, sym_y):
    count = 0
    for img in _images(sym_x, sym_y):
        if img[2] > 0:
            count += 1
    return count


def _conductor_sums(fils, currents, conductors):
    # per conductor of the reduced domain: [current re, current im, power at unit |I| scale, area]
    sums = []
    for k in range(conductors):
        sums.append([0.0, 0.0, 0.0, 0.0])
    xr = currents[0]
    xi = currents[1]
    for i in range(len(fils)):
        a = fils[i]
        s = sums[a[4]]
        area = a[2] * a[3]
        s[0] += xr[i]
        s[1] += xi[i]
        s[2] += a[5] / area * (xr[i] * xr[i] + xi[i] * xi[i])
        s[3] += area
    return sums


def _refine(blocks, conductors, rho, f, sym_x, sym_y, weights):
    """Solve at growing levels until the group's ratio changes < TOLERANCE; returns the solution.

    weights[k]: how many copies of reduced conductor k the positive-current group holds.
    """
    delta = skin_depth_mu0(rho, f)
    copies = _same_sign_images(sym_x, sym_y)
    images = len(_images(sym_x, sym_y))
    previous = -1.0
    best = None
    level = 1.0
    while level <= MAX_LEVEL:
        mesh = _filaments(blocks, delta, level)
        fils = mesh[0]
        if len(fils) > MAX_FILAMENTS and best is not None:
            break
        sums = _conductor_sums(fils, _solve_filaments(mesh, f, sym_x, sym_y), conductors)
        ir = 0.0
        ii = 0.0
        power = 0.0
        area = 0.0
        for k in range(conductors):
            ir += weights[k] * sums[k][0]
            ii += weights[k] * sums[k][1]
            power += weights[k] * sums[k][2]
            area += weights[k] * sums[k][3]
        ratio = power / (ir * ir + ii * ii) / (rho / area)
        shares = []
        for k in range(conductors):
            shares.append(_kept(math.sqrt(sums[k][0] * sums[k][0] + sums[k][1] * sums[k][1])
                                / math.sqrt(ir * ir + ii * ii)))
        estimate = _extrapolate(previous, ratio, level - LEVEL_STEP, level)
        best = {"ratio": estimate[0], "shares": shares, "filaments": len(fils) * images, "level": level,
                "change": estimate[1], "converged": estimate[1] < TOLERANCE, "copies": copies}
        if estimate[1] < TOLERANCE:
            break
        previous = ratio
        level += 1
    return best


def _kept(x):
    # A ratio or share kept to 1e-9: far below the method's 0.1 %, and above what the two runtimes'
    # last-bit differences in log and atan become after the dense solve (measured up to 3e-11
    # relative for a bar 75 skin depths across, where the filament currents largely cancel)
    return math.floor(x * 1e9 + 0.5) / 1e9


def _extrapolate(coarse, fine, coarse_level, level):
    """[ratio, estimated relative error of the finer level] from two successive levels.

    The cells shrink as 1 / level and the error of uniform-current filaments falls as the square
    of the cell size (measured: the ratio approaches the finite-element value from below as
    1 / level^2 on the bars of tests/core/test_filament_solver.py), so Richardson's extrapolation
    R = R_L + (R_L - R_K) K^2 / (L^2 - K^2) (K the coarser level) removes the leading error term;
    the size of that correction is the estimated error of the finer level. First level: no
    estimate (1.0).
    """
    if not (coarse > 0):
        return [_kept(fine), 1.0]
    lo = coarse_level * coarse_level
    correction = (fine - coarse) * lo / (level * level - lo)
    result = _kept(fine + correction)
    # the estimate is a difference of two close ratios: kept to 1e-9, the digits both runtimes share
    return [result, math.floor(abs(correction) / result * 1e9 + 0.5) / 1e9]


def _check_inputs(width, thickness, rho, f):
    _check_positive(width, "width", "width")
    _check_positive(thickness, "thickness", "thickness")
    _check_positive(rho, "rho", "resistivity")
    _check_positive(f, "f", "frequency")


def bar_group_solution(width, thickness, count, gap, rho, f):
    """AC/DC ratio of n equal bars per phase side by side (wide faces facing), joined at the ends.

    Parameters
    ----------
    width, thickness : float
        Width w and thickness t of each bar, [m] (the bars are stacked along t)
    count : int
        Number of bars n (1: a single isolated bar), 1..8
    gap : float
        Clear gap between neighbouring bars' faces, [m] (ignored for n = 1)
    rho : float
        Resistivity, [ohm*m]
    f : float
        Frequency, [Hz]

    Returns
    -------
    solution : dict
        "ratio": the group's R_ac over its DC resistance rho / (n w t), [-];
        "shares": each bar's |I_k| / |I| from the outermost bar to the middle (the other half mirrors),
        [-]; "filaments": the filament count of the whole cross-section at the answer's level;
        "level", "change" (relative change from the previous level), "converged" (change < 0.1 %).

    Notes
    -----
    Isolated group (no return conductor nearby, the phases far away), non-magnetic, straight.
    Solved on a quarter of the cross-section (mirror symmetry across both axes of the group).

    Examples
    --------
    One 100 x 10 mm copper bar at 50 Hz: 1.198, as the scikit-fem solution of the same section gives
    (1.19818, tests/core/test_filament_solver.py; about 1.2 in busbar handbooks' skin-effect charts):

    >>> round(bar_group_solution(0.1, 0.01, 1, 0.0, 1.7241e-8, 50.0)["ratio"], 3)
    1.198
    """
    _check_inputs(width, thickness, rho, f)
    if not (count >= 1 and count <= 8 and math.floor(count) == count):
        raise CoreError("the number of bars must be a whole number from 1 to 8", "count")
    if count > 1:
        if not (gap - gap == 0) or gap <= 0.0:
            raise CoreError("the gap between bars must be a finite length above 0", "gap")
    pitch = thickness + gap
    blocks = []
    weights = []
    half = width / 2.0
    k = count - 1
    # bars above the middle, outermost first: centre y_k = (k - (n - 1)/2) pitch
    while 2 * k > count - 1:
        yc = (k - (count - 1) / 2.0) * pitch
        blocks.append([0.0, half, yc - thickness / 2.0, yc + thickness / 2.0, False, True, True, True,
                       len(blocks), rho])
        weights.append(4.0)
        k -= 1
    if count % 2 == 1:
        blocks.append([0.0, half, 0.0, thickness / 2.0, False, True, False, True, len(blocks), rho])
        weights.append(4.0)
    solution = _refine(blocks, len(blocks), rho, f, 1.0, 1.0, weights)
    # a bar above the middle is two mirrored halves in the full group, the middle bar four quarters
    shares = []
    for i in range(len(blocks)):
        if count % 2 == 1 and i == len(blocks) - 1:
            shares.append(4.0 * solution["shares"][i])
        else:
            shares.append(2.0 * solution["shares"][i])
    solution["shares"] = shares
    return solution


def bar_pair_solution(width, thickness, spacing, rho, f):
    """AC/DC ratio of each bar of a go-and-return pair, wide faces facing at a centre distance.

    Parameters
    ----------
    width, thickness : float
        Width w and thickness t of each bar, [m]
    spacing : float
        Centre distance of the two bars, [m], more than t (along the thickness)
    rho, f : float
        Resistivity [ohm*m] and frequency [Hz]

    Returns
    -------
    solution : dict
        As bar_group_solution; "ratio" is one bar's R_ac over rho / (w t) (proximity and skin
        effect together); the loop's resistance is twice one bar's.

    Notes
    -----
    Solved on a quarter: mirror across the width's centre line (same current) and across the
    plane between the bars (opposite current).

    Examples
    --------
    A go-and-return pair of 100 x 10 mm copper bars at 30 mm centres, 50 Hz: 1.086 per bar, as the
    scikit-fem solution gives (1.08606, tests/core/test_filament_solver.py):

    >>> round(bar_pair_solution(0.1, 0.01, 0.03, 1.7241e-8, 50.0)["ratio"], 3)
    1.086
    """
    _check_inputs(width, thickness, rho, f)
    if not (spacing - spacing == 0) or spacing <= thickness:
        raise CoreError("the centre distance must be more than the bar's thickness", "spacing")
    yc = spacing / 2.0
    blocks = [[0.0, width / 2.0, yc - thickness / 2.0, yc + thickness / 2.0, False, True, True, True, 0, rho]]
    solution = _refine(blocks, 1, rho, f, 1.0, -1.0, [2.0])
    solution["shares"] = [1.0]
    return solution


def round_layers_solution(layers, f):
    """AC/DC ratio of a round conductor of concentric non-magnetic layers (the filaments are rings).

    Parameters
    ----------
    layers : list
        [[outer radius [m], rho [ohm*m]], ...] from the centre outward
    f : float
        Frequency, [Hz]

    Returns
    -------
    solution : dict
        "ratio": R_ac over the DC resistance 1 / sum(A_k / rho_k); "filaments": the ring count;
        "level", "change", "converged" as bar_group_solution.

    Notes
    -----
    An isolated round conductor's current depends on the radius only, so its filaments are
    rings, with the exact GMDs of annuli (core.filament_inductance.annulus_log_gmd). Used for
    clad wire with a non-magnetic core (copper-clad aluminium) and, in the tests, to check the
    method against the exact Kelvin solution of a solid wire.

    Examples
    --------
    A solid 2 mm copper wire at 50 kHz: within 1e-5 (relative) of the exact Kelvin ratio 1.965991 (the
    formula with scipy.special's ber, bei, berp, beip; see core.skin_effect.round_wire_resistance_ratio):

    >>> solution = round_layers_solution([[1e-3, 1.7241e-8]], 50e3)
    >>> abs(solution["ratio"] / 1.965991 - 1.0) < 1e-5, solution["converged"]
    (True, True)
    """
    _check_positive(f, "f", "frequency")
    inner = 0.0
    for layer in layers:
        _check_positive(layer[1], "rho", "resistivity")
        if not (layer[0] > inner):
            raise CoreError("layer radii must increase outward", "radius")
        inner = layer[0]
    conductance = 0.0
    inner = 0.0
    for layer in layers:
        conductance += _pi * (layer[0] * layer[0] - inner * inner) / layer[1]
        inner = layer[0]
    previous = -1.0
    best = None
    # rings are cheap (a 1-D mesh): start finer, where the error falls smoothly as 1 / level^2
    level = RING_FIRST_LEVEL
    while level <= RING_FIRST_LEVEL + MAX_LEVEL:
        rings = []
        inner = 0.0
        for layer in layers:
            delta = skin_depth_mu0(layer[1], f)
            for c in graded_cells(inner, layer[0], inner > 0.0, True, delta, level):
                rings.append([c[0] - 0.5 * c[1], c[0] + 0.5 * c[1], layer[1]])
            inner = layer[0]
        ratio = _ring_ratio(rings, f, conductance)
        estimate = _extrapolate(previous, ratio, level - 1.0, level)
        best = {"ratio": estimate[0], "filaments": len(rings), "level": level, "change": estimate[1],
                "converged": estimate[1] < TOLERANCE}
        if estimate[1] < TOLERANCE or len(rings) > MAX_FILAMENTS:
            break
        previous = ratio
        level += 1
    return best


def _ring_ratio(rings, f, conductance):
    n = len(rings)
    omega_l = f * MU_0  # w mu_0 / (2 pi)
    ar = []
    ai = []
    for k in range(n * n):
        ar.append(0.0)
        ai.append(0.0)
    for i in range(n):
        a = rings[i]
        ar[i * n + i] = a[2] / (_pi * (a[1] * a[1] - a[0] * a[0]))
        for j in range(i, n):
            b = rings[j]
            m = -omega_l * annulus_log_gmd(a[0], a[1], b[0], b[1])
            ai[i * n + j] = m
            ai[j * n + i] = m
    br = []
    bi = []
    for i in range(n):
        br.append(1.0)
        bi.append(0.0)
    x = solve_complex(ar, ai, br, bi, n)
    ir = 0.0
    ii = 0.0
    power = 0.0
    for i in range(n):
        ir += x[0][i]
        ii += x[1][i]
        r_ring = rings[i][2] / (_pi * (rings[i][1] * rings[i][1] - rings[i][0] * rings[i][0]))
        power += r_ring * (x[0][i] * x[0][i] + x[1][i] * x[1][i])
    return power / (ir * ir + ii * ii) * conductance
