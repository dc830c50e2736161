"""Build-time fits of model parameters to sourced tables (numpy least squares).

Only parameters are computed here; the formulas themselves are the core's
(conductor_atlas.core.temperature_models), so the browser evaluates exactly what was fitted.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from conductor_atlas.core.quadrature import GL_NODES, GL_WEIGHTS
from conductor_atlas.core.temperature_models import bloch_gruneisen_resistivity

_NODES = np.asarray(GL_NODES)
_WEIGHTS = np.asarray(GL_WEIGHTS)


@dataclass(frozen=True)
class BlochGruneisenFit:
    """ρ(T) = ρ0 + A (T/Θ)^5 J5(Θ/T) fitted to a table; worst relative deviation over its points."""

    rho0: float
    a: float
    theta: float
    t_min: float
    t_max: float
    worst: float      # max |ρ_fit/ρ_table − 1| over the fitted points
    worst_at: float   # temperature of that point [K]
    points: int


def _bg_integrand(n: float, x: np.ndarray) -> np.ndarray:
    """x^n / (4 sinh²(x/2)): the core's ``_bg_integrand`` (same series below x = 1), on arrays."""
    small = x < 1.0
    y2 = (0.5 * np.where(small, x, 0.0)) ** 2
    s = 1.0 + y2 / 6.0 * (1.0 + y2 / 20.0 * (1.0 + y2 / 42.0 * (1.0 + y2 / 72.0 * (
        1.0 + y2 / 110.0 * (1.0 + y2 / 156.0 * (1.0 + y2 / 210.0))))))
    q = np.exp(-np.where(small, 1.0, x))
    large = np.where(small, 1.0, x) ** n * q / ((1.0 - q) * (1.0 - q))
    return np.where(small, x ** (n - 2.0) / (s * s), large)


def bg_integral(n: float, z: np.ndarray) -> np.ndarray:
    """J_n(z) for an array of z > 0 by the core's rule (``bloch_gruneisen_integral``), vectorised.

    The same composite 20-point Gauss–Legendre panels of width ≤ 6 up to min(z, 60 + 5 n), so the
    values equal the core's to rounding (tests/test_fits.py: ≤ 1e-13 relative); only the
    summation order differs. Used by the fit, which evaluates it for ~40 trial Θ per material.
    """
    z = np.asarray(z, dtype=float)
    top = np.minimum(z, 60.0 + 5.0 * n)
    panels = np.ceil(top / 6.0)
    out = np.empty_like(top)
    for count in np.unique(panels):
        pick = panels == count
        h = top[pick] / count
        half = 0.5 * h
        starts = np.arange(int(count))[None, :] * h[:, None]                    # (points, panels)
        x = (starts + half[:, None])[:, :, None] + half[:, None, None] * _NODES  # (points, panels, nodes)
        out[pick] = half * (_bg_integrand(n, x) @ _WEIGHTS).sum(axis=1)
    return out


def phonon_basis(temperatures: np.ndarray, theta: float) -> np.ndarray:
    """(T/Θ)^5 J5(Θ/T) for each T, with the core's integration rule."""
    t = np.asarray(temperatures, dtype=float)
    return (t / theta) ** 5 * bg_integral(5.0, theta / t)


def fit_bloch_gruneisen(temperatures, resistivities, theta_guess: float) -> BlochGruneisenFit | None:
    """Fit ρ0 ≥ 0, A > 0 and Θ to a ρ(T) table by relative least squares.

    For each trial Θ (a 12-point scan of 0.5…1.6 × the Debye temperature, then golden-section
    refinement), ρ0 and A solve a
    linear least-squares problem weighted by 1/ρ_i (so cryogenic points count as much as hot
    ones); the Θ with the smallest weighted residual wins. Returns None for fewer than 5 points
    or an unphysical result (A ≤ 0).
    """
    t = np.asarray(temperatures, dtype=float)
    rho = np.asarray(resistivities, dtype=float)
    if len(t) < 5:
        return None
    w = 1.0 / rho

    def solve(theta: float):
        g = phonon_basis(t, theta)
        design = np.column_stack([np.ones_like(t), g]) * w[:, None]
        coef, *_ = np.linalg.lstsq(design, rho * w, rcond=None)
        rho0, a = float(coef[0]), float(coef[1])
        if rho0 < 0:
            rho0 = 0.0
            a = float(np.dot(g * w, rho * w) / np.dot(g * w, g * w))
        resid = (rho0 + a * g) / rho - 1.0
        return float(np.sum(resid ** 2)), rho0, a

    # coarse scan for the basin, then golden-section refinement inside the bracketing cells
    grid = np.linspace(0.5 * theta_guess, 1.6 * theta_guess, 12)
    scores = [solve(th)[0] for th in grid]
    k = int(np.argmin(scores))
    lo, hi = float(grid[max(k - 1, 0)]), float(grid[min(k + 1, len(grid) - 1)])
    ratio = (5 ** 0.5 - 1) / 2
    a_, b_ = hi - ratio * (hi - lo), lo + ratio * (hi - lo)
    fa, fb = solve(a_)[0], solve(b_)[0]
    for _ in range(24):  # bracket shrinks by 0.618 each step: 24 steps -> 1e-5 of its width
        if fa < fb:
            hi, b_, fb = b_, a_, fa
            a_ = hi - ratio * (hi - lo)
            fa = solve(a_)[0]
        else:
            lo, a_, fa = a_, b_, fb
            b_ = lo + ratio * (hi - lo)
            fb = solve(b_)[0]
    theta = 0.5 * (lo + hi)
    _, rho0, a = solve(theta)
    if not a > 0:
        return None
    fitted = np.array([bloch_gruneisen_resistivity(float(x), rho0, a, theta) for x in t])
    dev = np.abs(fitted / rho - 1.0)
    i = int(np.argmax(dev))
    return BlochGruneisenFit(rho0=rho0, a=a, theta=theta, t_min=float(t[0]), t_max=float(t[-1]),
                             worst=float(dev[i]), worst_at=float(t[i]), points=len(t))
