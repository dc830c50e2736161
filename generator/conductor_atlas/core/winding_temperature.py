"""A conductor's temperature from its resistance ratio by the material's own ρ(T), for the resistance
method when the material's resistivity is not linear in temperature.

The resistance method's t2 = (R2/R1)(k + t1) − k assumes ρ linear in T. The standards give k for copper
(234.5) and aluminium (225) in their usual span; for another metal the k from its temperature
coefficient (k = 1/α − t_ref) can be far off: nickel's ρ(T) bends (ferromagnetic below its Curie point,
627 K), and R2/R1 = 3 from 20 °C reads 377 °C by its α but 266 °C by its sourced ρ(T) table. Here t2 is
where the material's model gives ρ(t2) = (R2/R1) ρ(t1), with one model at both ends (no jump where "auto"
would change model), inside that model's span. Thermal expansion (L/A changes by about 1e-5 /K) is
neglected as in the resistance method itself.
"""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.material_models import available_models, resistivity_at, within_model

# the models that carry a curved ρ(T), best first: the sensor standard, the sourced table, the fit to
# it, then the estimates (linear: the k method is the same thing)
CURVED_MODELS = ["callendar-van-dusen", "table", "bloch-gruneisen", "matthiessen", "layers"]
FIRST_STEP = 10.0   # [K] bracketing step from t1 (halved at the model's edge)
LEAST_STEP = 0.01   # [K] the model's edge is found to this
SETTLED = 1e-7      # [K] bisection ends when the bracket is this narrow


# __pragma__ ('nokwargs')
def inside(m, t, key):
    """ρ [ohm m] of m at t [K] by model ``key`` when t lies inside that model's span, else None."""
    if not (t > 0):
        return None
    try:
        found = resistivity_at(m, t, key)
    except CoreError:
        return None
    if not within_model(found):
        return None
    return found["rho"]


def curved_model(m, t1):
    """The first of CURVED_MODELS m has whose span holds t1 [K], or "" for none."""
    have = available_models(m)
    for key in CURVED_MODELS:
        for own in have:
            if own == key and inside(m, t1, key) is not None:
                return key
    return ""


def temperature_for_ratio(m, t1, ratio, key):
    """t2 [K] where model ``key`` of m gives ρ(t2) = ratio · ρ(t1) [t1 in K, ratio = R2/R1], or None when
    the model's span ends first.

    Steps from t1 towards the answer (up for ratio > 1), halving the step at the span's edge, then
    bisects the first bracket. ρ is taken as monotonic in T (metals above a few kelvin).

    Examples
    --------
    Nickel's sourced table (CRC Handbook, row Ni, from memory; piecewise linear): ρ(293 K) = 6.93,
    ρ(500 K) = 17.7, ρ(600 K) = 25.5 µΩ·cm. R2/R1 = 3 from 293 K: 20.79 µΩ·cm, by hand
    500 + 100 (20.79 − 17.7)/(25.5 − 17.7) = 539.62 K:

    >>> ni = {"name": "nickel", "table_t": [293.0, 500.0, 600.0], "table_rho": [6.93e-8, 17.7e-8, 25.5e-8]}
    >>> round(temperature_for_ratio(ni, 293.0, 3.0, "table"), 2)
    539.62
    >>> temperature_for_ratio(ni, 293.0, 5.0, "table") is None
    True
    """
    start = inside(m, t1, key)
    if start is None:
        return None
    target = ratio * start
    if target == start:
        return t1
    step = FIRST_STEP if target > start else -FIRST_STEP
    a = t1
    rho_a = start
    while abs(step) >= LEAST_STEP:
        rho_b = inside(m, a + step, key)
        if rho_b is None:
            step = step / 2.0
            continue
        if (rho_b - target) * (rho_a - target) <= 0:
            return _bisect(m, key, target, a, a + step, rho_a)
        a = a + step
        rho_a = rho_b
    return None


def _bisect(m, key, target, a, b, rho_a):
    # a and b bracket the target (rho_a at a); both inside the model's span
    while abs(b - a) > SETTLED:
        middle = 0.5 * (a + b)
        rho_m = inside(m, middle, key)
        if (rho_m - target) * (rho_a - target) <= 0:
            b = middle
        else:
            a = middle
            rho_a = rho_m
    return 0.5 * (a + b)
# __pragma__ ('kwargs')
