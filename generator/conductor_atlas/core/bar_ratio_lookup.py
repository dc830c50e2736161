"""An isolated flat bar's AC/DC ratio read from the filament solver's tabulated grid.

The ratio R_ac / R_dc of one straight, isolated, non-magnetic bar (width w, thickness t [m],
resistivity rho [ohm*m], frequency f [Hz]) depends only on w / delta and t / delta,
delta = sqrt(rho / (pi f mu_0)) [m]. core.bar_ratio_grid holds the filament solver's answer
(core.filament_solver.bar_group_solution, the page's budget and 0.1 % settling rule) at quarter
octaves of u = log2(w / delta) = 0 .. 7 and v = log2(t / delta) = -4 .. u (the ratio is symmetric in
w and t). Between the nodes, L = ln(R_ac / R_dc - 1) is interpolated by cubic Catmull-Rom splines
along u and along v (a 4 x 4 stencil):

    L(s) = (2 L1 + (L2 - L0) s + (2 L0 - 5 L1 + 4 L2 - L3) s^2 + (3 L1 - L0 - 3 L2 + L3) s^3) / 2

with s in [0, 1) between nodes 1 and 2. Within 0.1 % of a direct solve inside the grid
(tests/core/test_bar_ratio_lookup.py: seeded random points, 6.2e-5 at worst of 200; the largest
differences are where the solver's own level of refinement changes between neighbouring nodes).

Where the solver's budget ended before a node settled to 0.1 % (bars more than about 2 skin depths
thick and 19 wide), the node holds the solver's extrapolated answer and its estimated change, as the
page would show it: the interpolated ratio then carries the stencil's largest estimated change, which
the caller shows (an "≈" answer and a warning, as for a direct solve that did not settle). Measured on
the 67 unsettled cells of the material pages' bar table: the tabulated answer within 1.4e-4 of the
direct solve (under a tenth of the solve's own estimated change), and the stencil's largest change at
least the solve's own (tests/test_bar_grid.py).

Range: the stencil must lie in the grid, so 1.19 <= w / delta <= 107.6 and 1/13.5 <= t / delta;
outside it, or where any of the 16 nodes was refused or not refined past its first level (no estimate
of its error), there is no tabulated answer (None) and the caller solves the bar itself. Pure Python
in the Transcrypt subset.
"""

import math

from conductor_atlas.core import bar_ratio_grid as grid
from conductor_atlas.core.skin_effect import skin_depth

UNREFINED = 1.0  # the change of a node solved at one level only (or refused): no estimate of its error
_LN2 = math.log(2.0)


# __pragma__ ('nokwargs')
def _node(a, b):
    # [ratio, change] of the node at u = a, v = b steps; the grid holds v <= u (swap: same bar turned)
    if b > a:
        c = a
        a = b
        b = c
    return [grid.RATIOS[a - grid.FIRST_U][b - grid.FIRST_V], grid.CHANGES[a - grid.FIRST_U][b - grid.FIRST_V]]


def _cubic(p0, p1, p2, p3, s):
    # Catmull-Rom spline through p1 (s = 0) and p2 (s = 1)
    return 0.5 * (2.0 * p1 + (p2 - p0) * s + (2.0 * p0 - 5.0 * p1 + 4.0 * p2 - p3) * s * s
                  + (3.0 * p1 - p0 - 3.0 * p2 + p3) * s * s * s)


def tabulated_bar_ratio(width, thickness, rho, f):
    """[R_ac / R_dc [-], largest estimated change of the stencil's nodes [-]] of an isolated bar, or None.

    Parameters
    ----------
    width, thickness : float
        The bar's sides, [m] (either order)
    rho : float
        Resistivity, [ohm*m]
    f : float
        Frequency, [Hz]

    Returns
    -------
    [ratio, change] inside the grid, change the largest estimated change of the 16 nodes used (below
    core.filament_solver.TOLERANCE, 1e-3, where all settled); None outside the grid (too small or
    too large in skin depths), where a node was refused or solved at one level only, or for inputs
    that are not finite and positive (the caller's solver says what is wrong).

    Examples
    --------
    100 x 10 mm copper at 50 Hz: 1.198, the direct solve's 1.198178 (filament_solver's example) and
    the scikit-fem solution's 1.19818 (tests/support/fem_reference.py):

    >>> round(tabulated_bar_ratio(0.1, 0.01, 1.7241e-8, 50.0)[0], 4)
    1.1982

    A 2 mm wire-like strip at 50 Hz is less than a skin depth across (below the grid): None

    >>> tabulated_bar_ratio(0.002, 0.001, 1.7241e-8, 50.0) is None
    True
    """
    if not (width > 0.0 and thickness > 0.0 and rho > 0.0 and f > 0.0):
        return None
    if not (width - width == 0 and thickness - thickness == 0 and rho - rho == 0 and f - f == 0):
        return None
    if thickness > width:
        c = width
        width = thickness
        thickness = c
    delta = skin_depth(rho, f, 1.0)
    x = math.log(width / delta) / _LN2 * grid.STEPS_PER_OCTAVE
    y = math.log(thickness / delta) / _LN2 * grid.STEPS_PER_OCTAVE
    i = math.floor(x)
    j = math.floor(y)
    if i - 1 < grid.FIRST_U or i + 2 > grid.LAST_U or j - 1 < grid.FIRST_V:
        return None
    s = x - i
    r = y - j
    worst = 0.0
    along_v = []
    for a in range(i - 1, i + 3):
        logs = []
        for b in range(j - 1, j + 3):
            node = _node(a, b)
            if not (node[1] < UNREFINED and node[0] > 1.0):
                return None
            if node[1] > worst:
                worst = node[1]
            logs.append(math.log(node[0] - 1.0))
        along_v.append(_cubic(logs[0], logs[1], logs[2], logs[3], r))
    return [1.0 + math.exp(_cubic(along_v[0], along_v[1], along_v[2], along_v[3], s)), worst]
# __pragma__ ('kwargs')
