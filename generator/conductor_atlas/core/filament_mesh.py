"""The filament solver's meshes: graded cells along a side and the filaments of a set of blocks.

Along each side of a conductor the cells follow a fixed exponential stretching from a fine end (a
surface) inward, the same map at every level, with n0 * level cells: n0 is set so that the cells at
a surface are FINE_DEPTH * min(delta, span) wide at level 1, and the largest cell is at most
MAX_STRETCH times the smallest. A fixed map refined uniformly makes the error fall smoothly as
1 / level^2, which the solver's extrapolation (core.filament_solver) relies on.

A block is a rectangle of one conductor, [x_lo, x_hi, y_lo, y_hi, fine x_lo, fine x_hi, fine y_lo,
fine y_hi, conductor, rho]; its filaments form a tensor mesh, and blocks with the same edges along
an axis share them (the bars of a group share their x edges), so the matrix assembly
(core.filament_matrix) can tabulate its terms per pair of edges.

Pure Python in the Transcrypt subset; SI floats in and out; CoreError for a conductor too many skin
depths across.
"""

import math

from conductor_atlas.core.errors import CoreError

FINE_DEPTH = 0.4
MAX_STRETCH = 1e6
# more cells than this along one side at level 1 means a conductor hundreds of skin depths across
# (about 500 delta for a bar face): refused, the dense solve would not finish on a page
MAX_CELLS_PER_SIDE = 24


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
    """Cell edges [m] from lo to hi [m], fine at the ends marked fine (see graded_cells).

    Examples
    --------
    Fine at both ends: each half is stretched from its own end, so the edges are symmetric about
    the middle (10 mm at 1 mm skin depth, level 1: twice 6 cells, the middle edge at 5 mm):

    >>> edges = graded_edges(0.0, 0.01, True, True, 1e-3, 1)
    >>> len(edges), round(edges[6] * 1e3, 12), round((edges[1] + edges[11]) * 1e3, 9)
    (13, 5.0, 10.0)
    """
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


def filament_mesh(blocks, delta, level):
    """[filaments, x edges, y edges] of the blocks' graded tensor meshes at a level.

    Parameters
    ----------
    blocks : list
        [[x_lo, x_hi, y_lo, y_hi, fine x_lo, fine x_hi, fine y_lo, fine y_hi, conductor, rho], ...]:
        rectangles [m], which of their sides are surfaces (fine), the conductor's index, its
        resistivity [ohm*m]
    delta : float
        Skin depth, [m]
    level : float
        Refinement level, 1, 2, ... (cells per side proportional to it)

    Returns
    -------
    mesh : list
        [filaments, x edges, y edges]; a filament is [x, y, w, h, conductor, rho, i, j]: its centre
        and sides [m], its conductor and resistivity, and i and j the indices of its lower x and y
        edges in the edge lists (its upper edges are i + 1 and j + 1)

    Examples
    --------
    A quarter of a 20 x 3 mm bar at a 9.3 mm skin depth: 3 x 3 cells that fill its 15 mm^2 (by hand):

    >>> mesh = filament_mesh([[0.0, 0.01, 0.0, 0.0015, False, True, False, True, 0, 1.7241e-8]], 9.3e-3, 1)
    >>> len(mesh[0]), len(mesh[1]), len(mesh[2]), round(sum([f[2] * f[3] for f in mesh[0]]) * 1e6, 9)
    (9, 4, 4, 15.0)
    """
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


def mirror_images(sym_x, sym_y):
    """[[sign x, sign y, current sign], ...]: the filament itself and its mirror images.

    sym_x, sym_y: mirror symmetry across x = 0 and y = 0, 1 (same current), -1 (opposite) or 0 (none).

    Examples
    --------
    A bar of a go-and-return pair (same current across x = 0, opposite across y = 0):

    >>> mirror_images(1.0, -1.0)
    [[1.0, 1.0, 1.0], [-1.0, 1.0, 1.0], [1.0, -1.0, -1.0], [-1.0, -1.0, -1.0]]
    """
    out = [[1.0, 1.0, 1.0]]
    if sym_x != 0:
        out.append([-1.0, 1.0, sym_x])
    if sym_y != 0:
        out.append([1.0, -1.0, sym_y])
    if sym_x != 0 and sym_y != 0:
        out.append([-1.0, -1.0, sym_x * sym_y])
    return out
# __pragma__ ('kwargs')
