"""An independent finite-element solution of the 2-D eddy-current problem (scikit-fem), for the tests.

Magnetic vector potential A_z (time-harmonic, exp(j w t)) in the plane of the cross-section:

    -div((1 / mu) grad A) + j w sigma A = sigma E     (E: the applied field in each conductor)

with A = 0 on a far box (its distance is 12 times the conductors' extent, so the multipole terms it
disturbs are of order (1/12)^4 of the near field). The problem is linear in E, so it is solved once
for a unit E in each conductor (+1 in all, or +1 / -1 for a go-and-return pair), and the total
current is then imposed by scaling: E = I / I(E = 1). The current density is J = sigma (E - j w A),
R_ac = (int |J|^2 / sigma) / |I|^2 per unit length and per conductor.

This is a different discretisation (second-order triangles over the whole plane, a weak form) from
the core's filament method (uniform-current rectangles with exact integral inductances), so the two
share no code and no approximation. Round conductors with a radial structure (layers, mu_r) are
solved as a 1-D axisymmetric problem on the radius.
"""

from __future__ import annotations

import math

import numpy as np
from scipy.constants import mu_0
from scipy.sparse.linalg import spsolve
from skfem import Basis, BilinearForm, ElementLineP2, ElementTriP2, LinearForm, MeshLine, MeshTri, condense
from skfem.helpers import dot, grad


def _graded(a, b, fine_a, fine_b, h_fine, growth=1.25, h_max=None):
    """Node coordinates from a to b, h_fine at the ends marked fine, growing by ``growth``."""
    span = b - a
    h_max = h_max if h_max is not None else span / 4
    sizes_a, sizes_b = [], []
    h_a = h_fine if fine_a else h_max
    h_b = h_fine if fine_b else h_max
    covered = 0.0
    while covered < span:
        if h_a <= h_b:
            sizes_a.append(h_a)
            covered += h_a
            h_a = min(h_a * growth, h_max)
        else:
            sizes_b.append(h_b)
            covered += h_b
            h_b = min(h_b * growth, h_max)
    sizes = np.array(sizes_a + sizes_b[::-1])
    sizes *= span / sizes.sum()
    return a + np.concatenate([[0.0], np.cumsum(sizes)])


def _axis(intervals, delta, extent):
    """Graded nodes along one axis: fine at every conductor face, coarse outside to +-12 extent."""
    h_fine = min(delta, extent) / 12.0
    edges = sorted({e for iv in intervals for e in iv})
    far = 12.0 * extent
    nodes = [_graded(-far, edges[0], False, True, h_fine, 1.3, far / 3)]
    for left, right in zip(edges[:-1], edges[1:]):
        inside = any(lo <= left and right <= hi for lo, hi in intervals)
        h_max = min(delta / 2.0, (right - left) / 4) if inside else (right - left) / 4
        nodes.append(_graded(left, right, True, True, h_fine, 1.2, max(h_max, h_fine))[1:])
    nodes.append(_graded(edges[-1], far, True, False, h_fine, 1.3, far / 3)[1:])
    return np.concatenate(nodes)


def bars_ac_ratio(bars, rho, f, signs=None):
    """AC/DC ratio of each conductor of a set of rectangular bars (mu_r = 1), by FEM.

    bars: [(x_centre, y_centre, width, height)] in m; signs: +1 / -1 applied field per bar (all +1:
    one group in parallel; +1, -1: a go-and-return pair). Bars with the same sign form one group at
    one voltage (the returned "group" ratio is the group's R_ac over its DC resistance).
    Returns {"group": ratio of the +1 group, "shares": |I_k| / |I_group|, "ratios": per bar}.
    """
    signs = signs or [1] * len(bars)
    delta = math.sqrt(rho / (math.pi * f * mu_0))
    extent = max(max(abs(x) + w / 2, abs(y) + h / 2) for x, y, w, h in bars)
    xs = _axis([(x - w / 2, x + w / 2) for x, y, w, h in bars], delta, extent)
    ys = _axis([(y - h / 2, y + h / 2) for x, y, w, h in bars], delta, extent)
    mesh = MeshTri.init_tensor(xs, ys)
    centres = mesh.p[:, mesh.t].mean(axis=1)
    owner = np.full(mesh.t.shape[1], -1)
    for k, (x, y, w, h) in enumerate(bars):
        inside = (np.abs(centres[0] - x) < w / 2) & (np.abs(centres[1] - y) < h / 2)
        owner[inside] = k
    areas = [w * h for x, y, w, h in bars]
    return _conductor_ratios(mesh, owner, signs, areas, rho, f)


def _conductor_ratios(mesh, owner, signs, areas, rho, f):
    """Solve on a triangle mesh whose element k belongs to conductor owner[k] (-1: air).

    areas: each conductor's cross-section on the mesh [m^2] (its DC resistance is rho / area).
    """
    sigma = 1.0 / rho
    omega = 2 * math.pi * f
    basis = Basis(mesh, ElementTriP2())
    sig = np.where(owner >= 0, sigma, 0.0)
    applied = np.array([signs[k] if k >= 0 else 0.0 for k in owner])
    sig_q = basis.interpolate(basis.zeros()).value * 0 + sig[:, None]
    app_q = sig_q * 0 + applied[:, None]

    @BilinearForm
    def stiffness(u, v, w):
        return dot(grad(u), grad(v)) / mu_0

    @BilinearForm
    def mass(u, v, w):
        return w["s"] * u * v

    @LinearForm
    def load(v, w):
        return w["s"] * w["e"] * v

    K = stiffness.assemble(basis)
    M = mass.assemble(basis, s=sig_q)
    b = load.assemble(basis, s=sig_q, e=app_q)
    system = (K + 1j * omega * M).tocsr()
    A = np.zeros(basis.N, dtype=complex)
    boundary = basis.get_dofs().flatten()
    interior = np.setdiff1d(np.arange(basis.N), boundary)
    A[interior] = spsolve(system[interior][:, interior].tocsc(), b[interior].astype(complex))
    # J = sigma (E - j w A) at the quadrature points, integrated per conductor
    a_q = basis.interpolate(A).value
    j_q = sig_q * (app_q - 1j * omega * a_q)
    dx = basis.dx
    currents, powers = [], []
    for k in range(len(areas)):
        sel = owner == k
        currents.append(np.sum(j_q[sel] * dx[sel]))
        powers.append(np.sum(np.abs(j_q[sel]) ** 2 / sigma * dx[sel]))
    ratios = [powers[k] / abs(currents[k]) ** 2 / (rho / areas[k]) for k in range(len(areas))]
    group = [k for k in range(len(areas)) if signs[k] > 0]
    i_group = sum(currents[k] for k in group)
    p_group = sum(powers[k] for k in group)
    r_dc_group = rho / sum(areas[k] for k in group)
    return {"group": p_group / abs(i_group) ** 2 / r_dc_group,
            "shares": [abs(currents[k]) / abs(i_group) for k in group], "ratios": ratios,
            "nodes": basis.N}


def _ring_radii(a, h_fine, h_in, outer, h_out):
    """Radii of the node rings of a round conductor: h_fine at r = a on both sides, growing by 1.2
    to h_in inside (down to the centre) and to h_out outside (up to ``outer``)."""
    inside = _graded(0.0, a, False, True, h_fine, 1.2, h_in)
    outside = _graded(a, outer, True, False, h_fine, 1.2, h_out)
    return np.concatenate([inside[1:], outside[1:]])


def round_pair_ac_ratio(radius, spacing, rho, f, around=256, fine=10.0, far_factor=60.0):
    """AC/DC ratio of each wire of a go-and-return pair of solid round wires (mu_r = 1), by FEM.

    The mesh is a Delaunay triangulation (scipy.spatial) of node rings concentric with each wire
    (``around`` nodes on the surface ring and on the rings near it, radial spacing min(delta, a) /
    ``fine`` at the surface, growing inward and outward) and of a graded grid outside the rings up
    to the far box. The surface is the polygon of the ``around`` nodes on r = a; each wire's DC
    resistance is taken with that polygon's area, so the ratio is the polygon's own (the polygon's
    perimeter is short of the circle's by pi^2 / (6 around^2), 2.5e-5 at 256).
    """
    from scipy.spatial import Delaunay

    delta = math.sqrt(rho / (math.pi * f * mu_0))
    gap = spacing - 2 * radius
    h_fine = min(delta, radius) / fine
    outer = radius + min(0.45 * gap, radius)
    h_arc = 2 * math.pi * radius / around
    radii = _ring_radii(radius, h_fine, max(min(delta / 2, radius / 8), h_fine), outer, max(h_arc, h_fine))
    points = []
    centres = [(-spacing / 2, 0.0), (spacing / 2, 0.0)]
    for cx, cy in centres:
        points.append([[cx, cy]])
        for k, r in enumerate(radii):
            # the surface ring and the rings near it share the surface's node angles (the polygon's
            # edges are then Delaunay edges); far from it the count follows the radial spacing
            step = radii[k] - radii[k - 1] if k > 0 else r
            count = around if r >= radius - 4 * h_arc else max(8, min(around, math.ceil(2 * math.pi * r / (2 * step))))
            angles = 2 * math.pi * np.arange(count) / count
            points.append(np.column_stack([cx + r * np.cos(angles), cy + r * np.sin(angles)]))
    # the grid outside the rings: spacing h_out at the rings' bounding box, growing to the far box
    # (far_factor times the pair's extent: A = 0 there acts as image currents whose transverse field
    # at the wires is about (extent / far)^2 of the other wire's, and the proximity loss goes as
    # that field squared; at 12 extents, as for bars, it took 1.5 % off the proximity part)
    h_out = max(h_arc, h_fine)
    far = far_factor * (spacing / 2 + radius)
    box_x = spacing / 2 + outer
    xs = np.concatenate([_graded(-far, -box_x, False, True, h_out, 1.3, far / 3),
                         _graded(-box_x, box_x, True, True, h_out, 1.15, max(h_out, outer / 3))[1:],
                         _graded(box_x, far, True, False, h_out, 1.3, far / 3)[1:]])
    ys = np.concatenate([_graded(-far, -outer, False, True, h_out, 1.3, far / 3),
                         _graded(-outer, outer, True, True, h_out, 1.15, max(h_out, outer / 3))[1:],
                         _graded(outer, far, True, False, h_out, 1.3, far / 3)[1:]])
    gx, gy = np.meshgrid(xs, ys)
    grid = np.column_stack([gx.ravel(), gy.ravel()])
    keep = np.ones(len(grid), dtype=bool)
    for cx, cy in centres:
        keep &= np.hypot(grid[:, 0] - cx, grid[:, 1] - cy) > outer + 0.5 * h_out
    points.append(grid[keep])
    nodes = np.concatenate(points)
    triangles = Delaunay(nodes).simplices
    mesh = MeshTri(nodes.T.copy(), triangles.T.copy())
    centroids = mesh.p[:, mesh.t].mean(axis=1)
    owner = np.full(mesh.t.shape[1], -1)
    for k, (cx, cy) in enumerate(centres):
        owner[np.hypot(centroids[0] - cx, centroids[1] - cy) < radius] = k
    polygon = 0.5 * around * radius ** 2 * math.sin(2 * math.pi / around)
    p = mesh.p[:, mesh.t]
    tri_area = 0.5 * np.abs((p[0, 1] - p[0, 0]) * (p[1, 2] - p[1, 0]) - (p[0, 2] - p[0, 0]) * (p[1, 1] - p[1, 0]))
    for k in range(2):
        meshed = tri_area[owner == k].sum()
        # every triangle of a wire lies inside its surface polygon: else the mesh does not follow it
        assert abs(meshed - polygon) < 1e-9 * polygon, (meshed, polygon)
    return _conductor_ratios(mesh, owner, [1, -1], [polygon, polygon], rho, f)


def layered_round_ac_ratio(layers, f, n_per_delta=12):
    """AC/DC ratio of a round conductor made of concentric layers, by 1-D axisymmetric FEM.

    layers: [(outer_radius [m], rho [ohm m], mu_r)] from the centre outward. Outside the
    conductor nothing needs solving: with the total current imposed, the field at the surface is
    fixed (B = mu_0 I / (2 pi a)), so the weak form takes it as a natural boundary condition:
    -(1/r) d/dr (r / mu  dA/dr) + j w sigma A = sigma E with A(0) regular.
    """
    omega = 2 * math.pi * f
    edges = [0.0] + [outer for outer, _, _ in layers]
    nodes = []
    for k, (outer, rho, mu_r) in enumerate(layers):
        inner = edges[k]
        delta = math.sqrt(rho / (math.pi * f * mu_0 * mu_r))
        h = min(delta, outer - inner) / n_per_delta
        nodes.append(_graded(inner, outer, k > 0, True, h, 1.1, max(delta / 2, h))[(1 if k else 0):])
    r = np.concatenate(nodes)
    mesh = MeshLine(r)
    basis = Basis(mesh, ElementLineP2())
    centres = mesh.p[0, mesh.t].mean(axis=0)
    sig = np.zeros(len(centres))
    nu = np.zeros(len(centres))
    for k, (outer, rho, mu_r) in enumerate(layers):
        sel = (centres > edges[k]) & (centres < outer)
        sig[sel] = 1.0 / rho
        nu[sel] = 1.0 / (mu_0 * mu_r)
    zero_q = basis.interpolate(basis.zeros()).value * 0
    sig_q = zero_q + sig[:, None]
    nu_q = zero_q + nu[:, None]

    @BilinearForm
    def stiffness(u, v, w):
        rr = w.x[0]
        return w["nu"] * u.grad[0] * v.grad[0] * rr

    @BilinearForm
    def mass(u, v, w):
        return w["s"] * u * v * w.x[0]

    K = stiffness.assemble(basis, nu=nu_q)
    M = mass.assemble(basis, s=sig_q)
    system = (K + 1j * omega * M).tocsc()
    # natural condition at the surface: r nu dA/dr = -I / (2 pi) (Ampere, B = -dA/dr); the weak
    # form's boundary term moves it to the right-hand side as -I / (2 pi) at r = a. With the
    # total current set this way the applied field E is a gauge (A + c with E + j w c gives the
    # same J), so E = 0 and J = -j w sigma A.
    rhs = np.zeros(basis.N, dtype=complex)
    rhs[int(np.argmax(basis.doflocs[0]))] = -1.0 / (2 * math.pi)
    a_total = spsolve(system, rhs)
    ring = basis.dx * basis.global_coordinates().value[0] * 2 * math.pi
    j = -1j * omega * sig_q * basis.interpolate(a_total).value
    rho_q = np.where(sig_q > 0, 1.0 / np.where(sig_q > 0, sig_q, 1.0), 0.0)
    power = np.sum(np.abs(j) ** 2 * rho_q * ring)
    total_current = np.sum(j * ring)
    conductance = sum(math.pi * (outer ** 2 - edges[k] ** 2) / rho for k, (outer, rho, _) in enumerate(layers))
    return {"ratio": power / abs(total_current) ** 2 * conductance, "current": total_current}
