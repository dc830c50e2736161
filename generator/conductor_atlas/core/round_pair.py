"""AC resistance of each conductor of a go-and-return pair of solid round wires (proximity effect).

Exact solution of the 2-D eddy-current problem of two parallel non-magnetic cylinders of radius a
at centre distance D carrying +I and -I, by cylindrical harmonics (the multipole method):

- inside a conductor the current density is J = sum_n alpha_n I_n(m r) cos(n theta),
  m = (1 + j) / delta (modified Bessel functions of a complex argument);
- outside, the vector potential is each conductor's own line current and multipoles
  b_n r^-n cos(n theta), plus the other conductor's field re-expanded about this centre in
  regular harmonics e_n r^n cos(n theta) (Graf's addition theorem for r^-k cos(k theta));
- A and dA/dr are continuous at r = a (mu_r = 1), which gives each harmonic's reflection
  b_n = t_n a^(2n) e_n, t_n = 2 n rho_n / z - 1, z = m a, rho_n = I_n(z) / I_(n-1)(z).

With u = a / D and E_n, B_n the harmonics normalised by (mu_0 I / 2 pi) a^-n and a^n, the other
conductor (the mirror image, current reversed) gives the linear system

    E_n + sum_k C(n + k - 1, n) u^(n + k) t_k E_k = -u^n / n        (n, k = 1 .. N)

whose coefficients are below (2u)^(n + k) / 2 <= 1/2. The loss per length comes from the
Poynting flux through the surface, harmonic by harmonic (the surface impedance of harmonic n is
z^2 rho_n / (z - n rho_n) / (sigma a)):

    R_ac / R_dc = Re(z / rho_1) / 2 + sum_n n^2 |E_n|^2 Re(z^2 rho_n conj(z - n rho_n)) / |z|^2

The first term is the isolated wire's Kelvin ratio (Re[(z/2) I_0(z) / I_1(z)]); the sum is the
proximity effect. The ratios rho_n come from the backward recurrence
rho_n = 1 / (2n / z + rho_(n+1)) (Gauss's continued fraction), which neither overflows nor loses
digits at any z. N is doubled from 8 until the ratio changes by less than 1e-10 (relative).

Pure Python in the Transcrypt subset; SI floats in and out; CoreError for impossible inputs.

References
----------
1. Smythe, W. R., Static and Dynamic Electricity, 3rd ed., 1968, sec. 10.12 (eddy currents in
   cylinders, harmonics of a cylinder in a transverse field) (from memory; re-derived here).
2. NIST DLMF, sec. 10.23 (Graf's addition theorem), 10.29.1 (recurrences of I_n),
   10.33 (continued fraction of I_n / I_(n-1)).
3. Arnold, A. H. M., "The alternating-current resistance of parallel conductors of circular
   cross-section", J. IEE 77, 49-58 (1935) (the problem; from memory).
"""

import math

from conductor_atlas.core.complex_linear import solve_complex
from conductor_atlas.core.constants import MU_0
from conductor_atlas.core.errors import CoreError, check_positive

# harmonic counts tried: 8, 16, 32, 64, 128; the answer is the first that agrees with the one
# before to this relative change
FIRST_HARMONICS = 8
MAX_HARMONICS = 128
TOLERANCE = 1e-10
# the accuracy the answer is kept to: far below any use, above the two runtimes' last-bit
# differences after the dense solve
_KEEP = 1e9


# __pragma__ ('nokwargs')
def _ratios(zr, zi, count):
    """[[Re rho_n, Im rho_n] for n = 0 .. count], rho_n = I_n(z) / I_(n-1)(z) (rho_0 unused).

    Backward recurrence rho_n = 1 / (2n / z + rho_(n+1)) from rho = 0 at an order beyond both
    count and |z| (the continued fraction has converged there to the last bit: checked against
    scipy.special.ive in tests/core/test_round_pair.py for |z| from 1e-3 to 1e5).
    """
    size = math.sqrt(zr * zr + zi * zi)
    start = count + math.floor(size) + 60 + math.floor(8.0 * math.sqrt(size))
    # 1 / z
    iz_r = zr / (size * size)
    iz_i = -zi / (size * size)
    out = []
    for k in range(count + 1):
        out.append([0.0, 0.0])
    rr = 0.0
    ri = 0.0
    n = start
    while n >= 1:
        dr = 2.0 * n * iz_r + rr
        di = 2.0 * n * iz_i + ri
        d = dr * dr + di * di
        rr = dr / d
        ri = -di / d
        if n <= count:
            out[n] = [rr, ri]
        n -= 1
    return out


def _ratio_at(zr, zi, u, count, rho):
    # R_ac / R_dc with count harmonics
    # t_n = 2 n rho_n / z - 1
    size2 = zr * zr + zi * zi
    tr = [0.0]
    ti = [0.0]
    for n in range(1, count + 1):
        # rho_n / z = rho_n conj(z) / |z|^2
        qr = (rho[n][0] * zr + rho[n][1] * zi) / size2
        qi = (rho[n][1] * zr - rho[n][0] * zi) / size2
        tr.append(2.0 * n * qr - 1.0)
        ti.append(2.0 * n * qi)
    # the system E_n + sum_k c_nk t_k E_k = -u^n / n, c_nk = C(n + k - 1, n) u^(n + k)
    ar = []
    ai = []
    for k in range(count * count):
        ar.append(0.0)
        ai.append(0.0)
    br = []
    bi = []
    power_u = 1.0
    for n in range(1, count + 1):
        power_u *= u
        br.append(-power_u / n)
        bi.append(0.0)
    # c_0k = u^k; c_nk = c_(n-1)k (n + k - 1) / n u
    for k in range(1, count + 1):
        c = math.pow(u, k)
        for n in range(1, count + 1):
            c = c * (n + k - 1) / n * u
            at = (n - 1) * count + (k - 1)
            ar[at] = c * tr[k]
            ai[at] = c * ti[k]
    for n in range(count):
        ar[n * count + n] += 1.0
    e = solve_complex(ar, ai, br, bi, count)
    # isolated wire: Re(z / rho_1) / 2
    d1 = rho[1][0] * rho[1][0] + rho[1][1] * rho[1][1]
    total = 0.5 * (zr * rho[1][0] + zi * rho[1][1]) / d1
    # z^2
    z2r = zr * zr - zi * zi
    z2i = 2.0 * zr * zi
    for n in range(1, count + 1):
        er = e[0][n - 1]
        ei = e[1][n - 1]
        # w = z^2 rho_n conj(z - n rho_n)
        pr = z2r * rho[n][0] - z2i * rho[n][1]
        pim = z2r * rho[n][1] + z2i * rho[n][0]
        cr = zr - n * rho[n][0]
        ci = -(zi - n * rho[n][1])
        total += n * n * (er * er + ei * ei) * (pr * cr - pim * ci) / size2
    return total
# __pragma__ ('kwargs')


def round_pair_solution(radius, spacing, rho, f):
    """AC/DC ratio of each solid round wire of a go-and-return pair (skin and proximity effect).

    Parameters
    ----------
    radius : float
        Radius a of each wire, [m]
    spacing : float
        Centre distance D of the two wires, [m], more than 2 a (the wires do not touch)
    rho : float
        Resistivity, [ohm*m]
    f : float
        Frequency, [Hz]

    Returns
    -------
    solution : dict
        "ratio": one wire's R_ac over rho / (pi a^2), [-] (the loop's resistance is twice one
        wire's); "isolated": the same wire alone (Kelvin), [-]; "harmonics": the harmonic count N
        of the answer; "change": relative change from N / 2 harmonics; "converged": change below
        1e-10 within 128 harmonics.

    Notes
    -----
    Exact for straight, parallel, solid, non-magnetic wires with equal and opposite currents and
    no other conductor near (the module's docstring gives the method). At large spacing it tends
    to the isolated wire's Kelvin ratio; as the skin depth falls the proximity factor tends to
    (D / 2a) / sqrt((D / 2a)^2 - 1). The harmonic series converges as (2a / D)^(2N): near-touching
    wires (D below about 2.1 a) at many skin depths may not settle, flagged by "converged".

    Examples
    --------
    d 20 mm copper (IEC 60028, 1.7241e-8 ohm*m) at 30 mm centres, 50 Hz. The isolated wire's Kelvin
    ratio Re[(z/2) I0(z)/I1(z)], z = (1 + j) a/δ, is 1.0267257 with scipy.special.iv; an independent
    finite-element solution of the pair (scikit-fem, tests/support/fem_reference.py) gives 1.059734
    (tests/core/test_round_pair.py):

    >>> s = round_pair_solution(0.01, 0.03, 1.7241e-8, 50.0)
    >>> round(s["ratio"], 4), round(s["isolated"], 4)
    (1.0598, 1.0267)
    """
    check_positive(radius, "radius", "radius")
    check_positive(rho, "rho", "resistivity")
    check_positive(f, "f", "frequency")
    if not (spacing - spacing == 0) or spacing <= 2.0 * radius:
        raise CoreError("the centre distance must be more than the wire's diameter", "spacing")
    delta = math.sqrt(rho / (math.pi * f * MU_0))
    # z = m a = (1 + j) a / delta
    zr = radius / delta
    zi = radius / delta
    u = radius / spacing
    ratios = _ratios(zr, zi, MAX_HARMONICS)
    d1 = ratios[1][0] * ratios[1][0] + ratios[1][1] * ratios[1][1]
    isolated = 0.5 * (zr * ratios[1][0] + zi * ratios[1][1]) / d1
    count = FIRST_HARMONICS
    previous = _ratio_at(zr, zi, u, count, ratios)
    change = 1.0
    while count < MAX_HARMONICS:
        count = 2 * count
        ratio = _ratio_at(zr, zi, u, count, ratios)
        change = abs(ratio - previous) / ratio
        previous = ratio
        if change < TOLERANCE:
            break
    return {"ratio": _kept(previous), "isolated": _kept(isolated), "harmonics": count,
            "change": math.floor(change * _KEEP + 0.5) / _KEEP, "converged": change < TOLERANCE}


def _kept(x):
    return math.floor(x * _KEEP + 0.5) / _KEEP
