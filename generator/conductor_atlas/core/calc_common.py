"""Steps shared by several calculators: the opening (material, temperature, ρ by the model asked) and
the mean free path on record; the fusing-current warning."""

import math

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.carriers import relaxation_time
from conductor_atlas.core.material_models import resistivity_at, resistivity_or_none
from conductor_atlas.core.numfmt import format_number, format_si, temperature_text
from conductor_atlas.core.outcome import add_error, add_sources, add_warning, has_errors
from conductor_atlas.core.units import INCH
from conductor_atlas.core.calc_inputs import field_text, read_material, read_temperature


# __pragma__ ('nokwargs')
def material_resistivity(outcome, m, t, inputs):
    """ρ [ohm*m] of m at t [K] by the model asked in inputs["model"] ("auto" by default), or None
    (the model's error under its field). The model's warnings, sources and label go into the outcome.

    Examples
    --------
    IEC 60028 copper (1.7241e-8 ohm*m at 20 °C, α = 0.00393 /K): at 90 °C
    1.7241e-8 · (1 + 0.00393 · 70) = 2.19840e-8 ohm*m by hand; a tablet's "Linear" reads as "linear":

    >>> from conductor_atlas.core.outcome import new_outcome
    >>> copper = {"name": "copper", "rho_ref": 1.7241e-8, "alpha": 0.00393, "t_ref": 293.15,
    ...           "valid_from": 223.15, "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0,
    ...           "rho_sources": ["iec60028"], "melting_point": 1357.77}
    >>> outcome = new_outcome("example", {"model": "Linear"})
    >>> round(material_resistivity(outcome, copper, 363.15, outcome["inputs"]) * 1e8, 5), outcome["sources"]
    (2.1984, ['iec60028'])
    >>> material_resistivity(outcome, copper, 363.15, {"model": "table"}), outcome["errors"]["model"]
    (None, 'no sourced ρ(T) table is on record for copper')
    """
    model = field_text(inputs, "model").lower()  # a tablet capitalises the first letter: "Linear"
    if len(model) == 0:
        model = "auto"
    try:
        found = resistivity_at(m, t, model)
    except CoreError as problem:
        field = problem.field
        if len(field) == 0:
            field = "temperature"
        add_error(outcome, field, problem.message)
        return None
    for w in found["warnings"]:
        add_warning(outcome, w)
    add_sources(outcome, m["rho_sources"])
    warn_if_molten(outcome, m, t)
    outcome["model"] = found["label"]
    return found["rho"]


# Preece (1884): a bare wire in still air fuses at I = a · d^1.5; for copper a = 10244 A/in^1.5, i.e.
# 80.0 A/mm^1.5 (W. H. Preece, Proc. R. Soc. London 36, 464, 1884; constant from memory of the paper's
# table). Used for every material as a marker of "far past fusing": copper has the highest constant of
# the common conductor metals, so for others the warning comes late, never early.
PREECE_COPPER = 10244.0 / math.pow(INCH, 1.5)  # [A/m^1.5]


def warn_if_fusing(outcome, current, area):
    """Warn when ``current`` [A] exceeds Preece's fusing current of a bare copper wire of the same
    cross-section ``area`` [m^2] (round: d = sqrt(4A/π)): I = a d^1.5, a = 10244 A/in^1.5.

    Examples
    --------
    1 mm²: d = 1.1284 mm, and 10244 A/in^1.5 is 10244 / 25.4^1.5 = 80.02 A/mm^1.5, so Preece's current
    is 80.02 · 1.1284^1.5 = 95.9 A by hand:

    >>> from conductor_atlas.core.outcome import new_outcome
    >>> outcome = new_outcome("example", {})
    >>> warn_if_fusing(outcome, 95.0, 1e-6); len(outcome["warnings"])
    0
    >>> warn_if_fusing(outcome, 97.0, 1e-6); outcome["warnings"][0][:75]
    'a current of 97 A is above the fusing current of a bare copper wire of this'
    >>> "(95.9 A by Preece" in outcome["warnings"][0]
    True
    """
    d = math.sqrt(4.0 * area / math.pi)
    fusing = PREECE_COPPER * math.pow(d, 1.5)
    if current > fusing:
        add_warning(outcome, "a current of " + format_si(current, "A", 3) + " is above the fusing current of a bare "
                    "copper wire of this cross-section in air (" + format_si(fusing, "A", 3) + " by Preece's rule, "
                    "I = 80.0 A/mm^1.5 · d^1.5, Preece 1884, constant from memory): the conductor would melt, so results "
                    "that assume it flows steadily (loss, voltage drop, drift) cannot be reached")


def warn_if_molten(outcome, m, t):
    """Warn when t [K] is above the melting point on record for m: no solid conductor exists there."""
    if m["melting_point"] > 0 and t > m["melting_point"]:
        add_warning(outcome, temperature_text(t) + " is above the melting point of " + m["name"] + " ("
                    + temperature_text(m["melting_point"]) + "): there is no solid conductor at this temperature, "
                    "and the number shown is only the model carried past its end")
# __pragma__ ('kwargs')


def material_at_temperature(outcome, inputs, catalogue, check=None):
    """The opening of a one-material calculator, called once it has read its own fields: [m, t, ρ] or None.

    Reads the material (field "material") and the temperature [K] (field "temperature", 20 °C when
    empty); ``check(outcome, m)``, when given, may add errors about the material found (say, a
    property it lacks). Then resistivity_when_ready. A calculator returns the outcome as it is on None.
    """
    m = read_material(outcome, inputs, catalogue, "material")
    t = read_temperature(outcome, inputs, "temperature")
    if m is not None and check is not None:
        check(outcome, m)
    rho = resistivity_when_ready(outcome, m, t, inputs)
    if rho is None:
        return None
    return [m, t, rho]


# __pragma__ ('nokwargs')
def resistivity_when_ready(outcome, m, t, inputs):
    """None when any field of the outcome has a problem; otherwise records m as the outcome's material
    and returns ρ [ohm*m] of m at t [K] by the model asked in the "model" field (material_resistivity:
    its warnings and label go into the outcome), or None when no model reaches t."""
    if has_errors(outcome):
        return None
    outcome["material"] = m["id"]
    return material_resistivity(outcome, m, t, inputs)


def recorded_mean_free_path_temperature(m):
    """The temperature [K] the record's mean free path holds at (the reference temperature if unsaid)."""
    if m["mean_free_path_t"] > 0:
        return m["mean_free_path_t"]
    return m["t_ref"]


def mean_free_path_origin(m):
    """Where the record's mean free path comes from, in words: "on record", or "from ρ·ℓ on record"
    (derive.own_mean_free_path: a recorded ρ·ℓ product over the reference resistivity)."""
    if m["mean_free_path_how"] == "rho-lambda":
        return "from ρ·ℓ on record"
    return "on record"


def recorded_mean_free_path(m, rho, t):
    """The mean free path on record for m, carried to temperature t [K] where ρ = rho: [ℓ [m], how].

    ℓ(t) = ℓ_rec · ρ(t_rec) / ρ(t), the product ρ·ℓ being a property of the Fermi surface alone
    (Gall, J. Appl. Phys. 119, 085101, 2016, eq. 1). ``how`` is "as recorded" (t within 0.5 K of the
    record's temperature), "scaled" (by ρ·ℓ = const), "unscaled" (no model reaches the record's
    temperature) or "none" (no record; ℓ is then -1.0).

    Examples
    --------
    Copper with ℓ = 39 nm on record at 20 °C (Gall 2016, Table 1: 39.9 nm; rounded here), at 100 °C
    with the linear ρ of IEC 60028: 39 nm / (1 + 0.00393 · 80) = 29.67 nm by hand:

    >>> copper = {"name": "copper", "rho_ref": 1.7241e-8, "alpha": 0.00393, "t_ref": 293.15,
    ...           "valid_from": 223.15, "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0,
    ...           "mean_free_path": 39e-9, "mean_free_path_t": 293.15}
    >>> found = recorded_mean_free_path(copper, 1.7241e-8 * (1.0 + 0.00393 * 80.0), 373.15)
    >>> round(found[0] * 1e9, 2), found[1]
    (29.67, 'scaled')
    >>> recorded_mean_free_path(copper, 1.7241e-8, 293.15)[1]
    'as recorded'
    """
    if not (m["mean_free_path"] > 0):
        return [-1.0, "none"]
    t_mfp = recorded_mean_free_path_temperature(m)
    if abs(t - t_mfp) <= 0.5:
        return [m["mean_free_path"], "as recorded"]
    then = resistivity_or_none(m, t_mfp)
    if then is not None and then["rho"] > 0:
        return [m["mean_free_path"] * then["rho"] / rho, "scaled"]
    return [m["mean_free_path"], "unscaled"]


# Where ℓ/δ passes this, the page says the classical δ and Rs no longer hold. The classical theory
# needs ℓ ≪ δ and breaks down once ℓ is comparable to δ (Reuter & Sondheimer, Proc. R. Soc. A 195,
# 336, 1948; Chambers, Proc. R. Soc. A 215, 481, 1952); 0.3 as the edge of "comparable" is our
# choice, not a published figure.
ANOMALOUS_PATH_RATIO = 0.3


def warn_if_anomalous(outcome, mfp, delta):
    """Warn when the mean free path mfp [m] (≤ 0: unknown) exceeds ANOMALOUS_PATH_RATIO · δ [m] (δ > 0)."""
    if not (mfp > ANOMALOUS_PATH_RATIO * delta):
        return
    add_warning(outcome, "the electrons' mean free path (" + format_si(mfp, "m", 3) + ") is "
                + format_number(mfp / delta, 3) + " δ: the classical skin depth assumes ℓ much shorter than δ. "
                "Where ℓ is comparable to δ or longer (the anomalous skin effect: low temperature, high "
                "frequency) the real surface resistance is higher than shown and stops falling with ρ")


# The skin depth and AC resistance take the conductivity at its DC value. In the Drude picture the
# conductivity at angular frequency w is sigma0 / (1 - i w tau) (Ashcroft & Mermin, Solid State
# Physics, eq. 1.29), so the DC value holds while w tau << 1. Refusing above w tau = 1 and cautioning
# above w tau = 0.1 (where |sigma| is 0.5 % below sigma0) are our own lines, not published figures.
DRUDE_REFUSE_OMEGA_TAU = 1.0
DRUDE_CAUTION_OMEGA_TAU = 0.1
# Without an electron density there is no tau: 1 THz (the far infrared) is our own line. There
# silver, whose tau is the longest of the metals at 273 K (4.0e-14 s; copper 2.7e-14 s), reaches
# w tau = 0.25 (Ashcroft & Mermin Table 1.3, from memory); alloys, with shorter tau, stay below that.
UNKNOWN_TAU_LIMIT_HZ = 1e12


def frequency_beyond_dc_conductivity(outcome, m, rho, f, field):
    """True (and an error on field) when f [Hz] is too high for the DC conductivity 1/rho [ohm*m] of m.

    omega tau with tau = m_e / (n e^2 rho) (carriers.relaxation_time; n = m["electron_density"]):
    refused above DRUDE_REFUSE_OMEGA_TAU, a warning above DRUDE_CAUTION_OMEGA_TAU; with no n on record,
    refused above UNKNOWN_TAU_LIMIT_HZ.

    Examples
    --------
    Copper, n = 8.47e28 /m^3 (Ashcroft & Mermin Table 1.1), ρ = 1.7241e-8 ohm*m: τ = m_e / (n e² ρ)
    = 2.430e-14 s with scipy.constants' m_e and e, so ωτ = 1 at f = 1 / (2πτ) = 6.55 THz and ωτ = 0.153
    at 1 THz (cautioned, above 0.1); 10 THz is refused:

    >>> from conductor_atlas.core.outcome import new_outcome
    >>> copper = {"name": "copper", "electron_density": 8.47e28}
    >>> outcome = new_outcome("example", {})
    >>> frequency_beyond_dc_conductivity(outcome, copper, 1.7241e-8, 1e12, "frequency")
    False
    >>> outcome["warnings"][0][:28]
    'at this frequency ωτ = 0.153'
    >>> frequency_beyond_dc_conductivity(outcome, copper, 1.7241e-8, 1e13, "frequency")
    True
    >>> outcome["errors"]["frequency"][-30:]
    'type a frequency below 6.5 THz'
    """
    n = m["electron_density"]
    if n > 0 and rho > 0:
        tau = relaxation_time(rho, n)
        omega_tau = 2.0 * math.pi * f * tau
        f_limit = DRUDE_REFUSE_OMEGA_TAU / (2.0 * math.pi * tau)
        if omega_tau > DRUDE_REFUSE_OMEGA_TAU:
            add_error(outcome, field, "too high for " + m["name"] + ": its electrons' relaxation time "
                      "(Drude, τ = " + format_si(tau, "s", 3) + ") gives ωτ = " + format_number(omega_tau, 3)
                      + ", and the skin depth here holds only where ωτ ≪ 1; type a frequency below "
                      + format_si(f_limit, "Hz", 2))
            return True
        if omega_tau > DRUDE_CAUTION_OMEGA_TAU:
            add_warning(outcome, "at this frequency ωτ = " + format_number(omega_tau, 3) + " (Drude τ = "
                        + format_si(tau, "s", 3) + "): the conductivity of " + m["name"]
                        + " is no longer its DC value, so read δ and the AC resistance as rough")
        return False
    if f > UNKNOWN_TAU_LIMIT_HZ:
        add_error(outcome, field, "too high: above " + format_si(UNKNOWN_TAU_LIMIT_HZ, "Hz", 2)
                  + " (the far infrared) a metal's conductivity is no longer its DC value, and "
                  + m["name"] + " has no electron density on record to say where it stops; type a "
                  "frequency up to " + format_si(UNKNOWN_TAU_LIMIT_HZ, "Hz", 2))
        return True
    return False
# __pragma__ ('kwargs')
