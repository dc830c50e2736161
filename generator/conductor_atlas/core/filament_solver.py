"""AC resistance of bars, bar groups and go-and-return pairs by the 2-D filament method.

The partial-inductance (filament) method: each conductor's cross-section is cut into rectangular
filaments, each carrying a uniform current density; per unit length

    (R + j w L) I = V,   R_ii = rho / a_i,   L_ij = -(mu_0 / (2 pi)) ln g_ij

with g_ij the geometric mean distance of filaments i and j (core.filament_inductance) and V the
voltage drop per length, the same on every filament of one conductor (or of one group of bars
joined at their ends). The AC resistance is the dissipated power over the squared current,
R_ac = sum R_ii |I_i|^2 / |sum I_i|^2. Mirror symmetry is used where the layout has it (a
single bar or a group is solved on a quarter, a go-and-return pair on a half of one conductor),
the mesh is stretched toward the surfaces (cells of 0.4 skin depth there at the first level;
core.filament_mesh), the system assembled and solved by core.filament_matrix, and the mesh is
refined level by level until the ratio's estimated change, the Richardson correction
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

from conductor_atlas.core.complex_linear import solve_complex
from conductor_atlas.core.constants import MU_0
from conductor_atlas.core.errors import CoreError, check_positive
from conductor_atlas.core.filament_inductance import annulus_log_gmd
from conductor_atlas.core.filament_matrix import filament_currents
from conductor_atlas.core.filament_mesh import filament_mesh, graded_cells, mirror_images
from conductor_atlas.core.skin_effect import skin_depth

_pi = math.pi

# the mesh stops growing here: the last level still below it is the answer, flagged unconverged
MAX_FILAMENTS = 300
MAX_LEVEL = 8
# bars refine level by level (half levels, tried, broke the smooth 1 / level^2 fall that the
# extrapolation needs: ceil(n0 * 1.5) cells are not 1.5 times finer)
LEVEL_STEP = 1.0
TOLERANCE = 1e-3
RING_FIRST_LEVEL = 2


def _same_sign_images(sym_x, sym_y):
    count = 0
    for img in mirror_images(sym_x, sym_y):
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
    delta = skin_depth(rho, f, 1.0)
    copies = _same_sign_images(sym_x, sym_y)
    images = len(mirror_images(sym_x, sym_y))
    previous = -1.0
    best = None
    level = 1.0
    while level <= MAX_LEVEL:
        mesh = filament_mesh(blocks, delta, level)
        fils = mesh[0]
        if len(fils) > MAX_FILAMENTS and best is not None:
            break
        sums = _conductor_sums(fils, filament_currents(mesh, f, sym_x, sym_y), conductors)
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
    check_positive(width, "width", "width")
    check_positive(thickness, "thickness", "thickness")
    check_positive(rho, "rho", "resistivity")
    check_positive(f, "f", "frequency")


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
    check_positive(f, "f", "frequency")
    inner = 0.0
    for layer in layers:
        check_positive(layer[1], "rho", "resistivity")
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
            delta = skin_depth(layer[1], f, 1.0)
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
