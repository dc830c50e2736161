"""Calculator "temperature-rise": a winding's temperature from its resistance rise (the resistance method)."""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core import practice
from conductor_atlas.core.celsius import ZERO_CELSIUS
from conductor_atlas.core.text_match import name_key
from conductor_atlas.core.numfmt import celsius_text, format_fixed, format_number, is_finite, temperature_text
from conductor_atlas.core.outcome import (keys_of, add_error, add_result, add_sources, add_warning, check_finite_results, has_errors,
                                          new_outcome)
from conductor_atlas.core.calc_inputs import field_text, read_material, read_quantity, require_positive
from conductor_atlas.core.typed_text import parse_number, normalise_text
from conductor_atlas.core.units import normalise_unit, parse_quantity
from conductor_atlas.core.material_models import choose_model, in_linear_span, MODEL_LABELS, resistivity_at
from conductor_atlas.core.winding_temperature import curved_model, temperature_for_ratio

NAME = "temperature-rise"
TITLE = "Winding temperature by the resistance method"
SUMMARY = "Mean temperature and temperature rise of a winding from its cold and hot resistance."
FIELDS = ["material", "resistance_cold", "temperature_cold", "resistance_hot", "coolant", "k"]
DEFAULTS = {"material": "IACS", "resistance_cold": "10 ohm", "temperature_cold": "20 °C", "resistance_hot": "12.5 ohm",
            "coolant": "", "k": ""}
FIELD_INFO = {
    "material": ["Winding material", "id, alias or symbol, e.g. IACS, Cu, 1350; may stay empty when k is given"],
    "resistance_cold": ["Cold resistance R1", "e.g. 10 Ω, 125 mΩ, measured with the winding at a known temperature"],
    "temperature_cold": ["Winding temperature at R1", "e.g. 20 °C: the winding (not just the room) must be at it"],
    "resistance_hot": ["Hot resistance R2", "e.g. 12.5 Ω, measured at the end of the heat run"],
    "coolant": ["Coolant temperature (optional)", "ambient or coolant at the end of the test, e.g. 25 °C; empty: "
                                                  "the rise is over the cold temperature"],
    "k": ["k (optional)", "inferred zero-resistance temperature below 0 °C, as a plain number: 234.5 means "
                          "−234.5 °C (or type −234.5 °C); empty: from the material"],
}
RESULT_LABELS = [
    ["temperature_hot", "Mean winding temperature (hot)"], ["temperature_rise", "Temperature rise"],
    ["resistance_ratio", "Resistance ratio R2/R1"], ["k", "k used"],
]
# optional input -> the results that need it: a problem in that field is shown under it and drops only these
SIDE_FIELDS = {"coolant": ["temperature_rise"]}
CAUTION = ("The resistance method gives the mean winding temperature; hot spots run hotter. Measure R1 with the "
           "winding at a uniform, known temperature and R2 as soon as possible after switching off.")

SMALL_CHANGE = ("the resistance of {name} changes little with temperature (α below 0.001 /K), so small measurement "
                "errors in R1 and R2 give large temperature errors")
# [K] tungsten's melting point, the highest of the metals (3422 °C; CRC Handbook, melting points of
# the elements, from memory): no winding is solid above it, whatever the material's record lacks
HIGHEST_MELTING_POINT = 3695.15
# span where the linear R(T) behind the method is good for copper and aluminium (core.practice)
LINEAR_FROM = ZERO_CELSIUS - 50.0
LINEAR_TO = ZERO_CELSIUS + 200.0
# a typed k more than this fraction away from the material's own k is questioned (our threshold, no
# source: wider than IEC 60034-1's rounding of copper's 234.5 to 235, 0.2 %; copper's k against EC
# aluminium's, 234.5 against 225, is 4 %)
K_MISMATCH = 0.02
STANDARD_K = "IEEE Std 118, IEC 60034-1"  # where copper's 234.5 and EC aluminium's 225 come from


# __pragma__ ('nokwargs')
def read_k(outcome, inputs):
    """k [K] typed in the "k" field, or None when empty (or wrong: then errors["k"] is set).

    A plain number is the magnitude of the inferred zero below 0 °C ("234.5"); a temperature
    must be below 0 °C ("−234.5 °C", "−390.1 °F"). "234.5 K" is refused as ambiguous.
    """
    text = field_text(inputs, "k")
    if len(text) == 0:
        return None
    try:
        parts = parse_number(normalise_text(text), "k")
        unit = parts[1].strip()
        if len(unit) == 0:
            k = parts[0]
        else:
            if normalise_unit(unit) == "k":
                raise CoreError("in kelvin is ambiguous: enter k as a plain number (234.5 for copper) or as the "
                                "temperature in °C (−234.5 °C)", "k")
            t = parse_quantity(text, "temperature", "k")
            if not (t < ZERO_CELSIUS):
                raise CoreError("as a temperature must lie below 0 °C (copper: −234.5 °C); as a plain number "
                                "it is the magnitude (234.5)", "k")
            k = ZERO_CELSIUS - t
    except CoreError as problem:
        add_error(outcome, "k", problem.message)
        return None
    if not (k > 0):
        add_error(outcome, "k", "must be above 0 (copper 234.5, EC aluminium 225)")
        return None
    if not (k < 1e6):
        add_error(outcome, "k", "is implausibly large; for copper it is 234.5, for EC aluminium 225")
        return None
    return k


def is_copper(m, catalogue):
    """Copper conductors (not clad wire, not alloys): the standard k = 234.5 applies."""
    if not (m["klass"] == "conductor-grade" or m["klass"] == "pure-metal"):
        return False
    if "cu" in catalogue["aliases"] and catalogue["aliases"]["cu"] == m["id"]:
        return True
    return m["id"].find("copper") >= 0 and m["id"].find("clad") < 0


def is_ec_aluminium(m, catalogue):
    """EC (1350) conductor aluminium: the standard k = 225 applies."""
    if m["klass"] != "conductor-grade":
        return False
    if m["id"].find("aluminium-1350") == 0:
        return True
    key = name_key("EC aluminium")
    return key in catalogue["aliases"] and catalogue["aliases"][key] == m["id"]


def material_k(outcome, m, catalogue):
    """k [K] for the material, with a warning that says where it comes from; None on error.

    Copper 234.5 and EC aluminium 225 (IEEE Std 118, IEC 60034-1; from memory); any other material
    with a positive α at t_ref: k = 1/α − t_ref, t_ref in °C (practice.inferred_zero_from_alpha).

    Examples
    --------
    A copper alloy with α = 0.0039 /K at 20 °C: k = 1/0.0039 − 20 = 236.41 by hand:

    >>> from conductor_atlas.core.outcome import new_outcome
    >>> catalogue = {"aliases": {"cu": "copper-annealed"}}
    >>> copper = {"id": "copper-annealed", "klass": "conductor-grade", "name": "annealed copper"}
    >>> alloy = {"id": "copper-alloy-x", "klass": "copper-alloy", "name": "alloy X", "alpha": 0.0039,
    ...          "t_ref": 293.15, "alpha_source": "demo (invented)"}
    >>> outcome = new_outcome("example", {})
    >>> material_k(outcome, copper, catalogue), round(material_k(outcome, alloy, catalogue), 2)
    (234.5, 236.41)
    """
    own = material_k_value(m, catalogue)
    if own is None:
        add_error(outcome, "material", "no positive temperature coefficient is on record for " + m["name"]
                  + "; enter k")
        return None
    k = own[0]
    if own[1] == STANDARD_K:
        if is_copper(m, catalogue):
            add_warning(outcome, "k = 234.5 for copper, as IEEE Std 118 and IEEE Std 112 use it; IEC 60034-1 rounds "
                                 "it to 235 (from memory); enter k to use another value")
        else:
            add_warning(outcome, "k = 225 for EC aluminium, as IEEE Std 118, IEEE Std 112 and IEC 60034-1 use it "
                                 "(from memory); enter k to use another value")
        add_sources(outcome, ["ieee118", "iec60034-1"])
        return k
    add_sources(outcome, [m["alpha_source"]])
    add_warning(outcome, "k = " + format_number(k, 4) + " from the temperature coefficient of " + m["name"] + " (α = "
                + format_number(m["alpha"], 4) + " /K at " + celsius_text(m["t_ref"])
                + "): k = 1/α − t_ref; the standards give k for copper and aluminium only")
    if m["alpha"] < 1e-3:
        add_warning(outcome, SMALL_CHANGE.replace("{name}", m["name"]))
    return k


def material_k_value(m, catalogue):
    """[k [K], where it comes from] that material m alone gives (material_k adds its notes):
    copper 234.5 and EC aluminium 225 from the standards (STANDARD_K), else 1/α − t_ref; None without a
    positive α.

    Examples
    --------
    >>> catalogue = {"aliases": {"cu": "copper-annealed"}}
    >>> material_k_value({"id": "copper-annealed", "klass": "conductor-grade", "name": "annealed copper"}, catalogue)
    [234.5, 'IEEE Std 118, IEC 60034-1']
    >>> alloy = {"id": "copper-alloy-x", "klass": "copper-alloy", "name": "alloy X", "alpha": 0.0039, "t_ref": 293.15}
    >>> round(material_k_value(alloy, catalogue)[0], 2)
    236.41
    """
    if is_copper(m, catalogue):
        return [practice.K_COPPER, STANDARD_K]
    if is_ec_aluminium(m, catalogue):
        return [practice.K_ALUMINIUM, STANDARD_K]
    if not (m["alpha"] > 0):
        return None
    return [practice.inferred_zero_from_alpha(m["alpha"], m["t_ref"]), "1/α − t_ref from its temperature coefficient"]


def note_k_mismatch(outcome, k, m, catalogue, r1, t1, r2, t2):
    """A typed k that is not the named material's (copper's 234.5 kept for an aluminium winding): say
    so, with the material's k. For copper and EC aluminium, also the temperature their standard k
    gives, t2 = (R2/R1)(k + t1) − k; for other materials, that leaving k empty uses their own ρ(T)
    (what this calculator does then: their curve, or k from α). Differences up to K_MISMATCH pass
    quietly (IEC 60034-1 rounds copper's 234.5 to 235)."""
    own = material_k_value(m, catalogue)
    if own is None or not (abs(k - own[0]) > K_MISMATCH * own[0]):
        return
    text = ("the k entered is not the k of " + m["name"] + ", which is " + format_number(own[0], 5)
            + " (" + own[1] + ")")
    if own[1] != STANDARD_K:
        add_warning(outcome, text + "; leave k empty to use the material's own resistivity data")
        return
    try:
        t2_own = practice.resistance_method_temperature(r1, t1, r2, own[0])
    except CoreError:
        t2_own = -1.0
    if t2_own > 0 and is_finite(t2_own) and abs(t2_own - t2) >= 0.05:
        text = (text + ": with it the winding would be at " + celsius_text(t2_own) + ", "
                + format_fixed(abs(t2_own - t2), 1) + " K " + ("higher" if t2_own > t2 else "lower"))
    add_warning(outcome, text + "; check the winding's material and k")


def add_temperatures(outcome, t1, t2, r1, r2, coolant, coolant_bad):
    """The hot temperature, the rise (over the coolant, or over t1 without one) and R2/R1."""
    base = t1
    if coolant is not None:
        base = coolant
    rise = t2 - base
    add_result(outcome, "temperature_hot", t2, "K", temperature_text(t2))
    if coolant is not None:
        add_result(outcome, "temperature_rise", rise, "K", format_fixed(rise, 1) + " K over the coolant ("
                   + celsius_text(coolant) + ")")
    elif not coolant_bad:  # (a bad coolant leaves the rise out; the message is under the field)
        add_result(outcome, "temperature_rise", rise, "K", format_fixed(rise, 1) + " K over the cold temperature ("
                   + celsius_text(t1) + ")")
    add_result(outcome, "resistance_ratio", r2 / r1, "", format_number(r2 / r1, 5))


def melting_limit(m):
    """[K] The highest temperature a solid winding of material ``m`` can have: its melting point
    (solidus) on record, else tungsten's, the highest of the metals (``m`` None or without one)."""
    if m is not None and m["melting_point"] > 0:
        return m["melting_point"]
    return HIGHEST_MELTING_POINT


def melting_text(m):
    """The melting point ``melting_limit`` uses, as the refusals name it: "Nickel (high purity),
    1454.9 °C" or "any metal, tungsten's 3422 °C"."""
    if m is not None and m["melting_point"] > 0:
        return m["name"] + ", " + celsius_text(m["melting_point"])
    return "any metal, tungsten's " + celsius_text(HIGHEST_MELTING_POINT)


def by_material_curve(outcome, m, t1, r1, r2, coolant, coolant_bad):
    """The answer by the material's own curved ρ(T) (core.winding_temperature) for a material the
    standards give no k for, where its linear model (k = 1/α − t_ref) does not hold at both ends (as
    the resistivity calculator's "auto" would not use it); True when it answered, False to go on with
    k from α (a warning says why when the material has a curve that does not reach)."""
    k = None
    linear = None
    if m["alpha"] > 0:
        k = practice.inferred_zero_from_alpha(m["alpha"], m["t_ref"])
        linear = practice.resistance_method_temperature(r1, t1, r2, k)
        # inside the temperature coefficient's span at both ends the k method is the material's own
        # linear model (what the resistivity calculator uses there too)
        if choose_model(m, t1) == "linear" and in_linear_span(m, linear):
            return False
    key = curved_model(m, t1)
    if len(key) == 0:
        return False
    label = MODEL_LABELS[key]
    t2 = temperature_for_ratio(m, t1, r2 / r1, key)
    if t2 is None:
        add_warning(outcome, "R2/R1 = " + format_number(r2 / r1, 4) + " reaches beyond the span of " + m["name"]
                    + "'s " + label + ": the linear method with k from α is used instead, an extrapolation")
        return False
    outcome["material"] = m["id"]
    outcome["model"] = "resistance method by the material's ρ(T): ρ(t2) = (R2/R1) ρ(t1), " + label
    add_temperatures(outcome, t1, t2, r1, r2, coolant, coolant_bad)
    add_sources(outcome, m["rho_sources"])
    for note in resistivity_at(m, t2, key)["warnings"]:
        add_warning(outcome, note)  # the model's standing note (an estimate), if any
    if linear is not None:
        if abs(linear - t2) >= 0.5:
            add_warning(outcome, "the linear method with k = " + format_number(k, 4) + " from α (the slope at "
                        + celsius_text(m["t_ref"]) + ") would give " + celsius_text(linear) + "; " + m["name"]
                        + "'s " + label + " gives " + celsius_text(t2))
    if abs(t2 - t1) > 0 and abs(r2 / r1 - 1.0) / abs(t2 - t1) < 1e-3:
        add_warning(outcome, SMALL_CHANGE.replace("{name}", m["name"]))
    if r2 < r1:
        add_warning(outcome, "R2 is below R1: the winding was colder at the second measurement")
    check_finite_results(outcome, "resistance_hot")
    return True


def calculate(inputs, catalogue):
    """Winding temperature and rise from a cold and a hot resistance measurement.

    Fields: material (optional when k is given); resistance_cold R1; temperature_cold t1;
    resistance_hot R2; coolant t_a (optional); k (optional: a plain number is the magnitude
    below 0 °C, e.g. "234.5" = −234.5 °C; or a temperature below 0 °C).
    t2 = (R2/R1)(k + t1) − k; rise = t2 − t_a, or t2 − t1 without a coolant temperature
    (core.practice). k from the material when empty: 234.5 for copper conductors, 225 for EC
    aluminium, else 1/α − t_ref from the material's own temperature coefficient.
    """
    outcome = new_outcome(NAME, inputs)
    k = read_k(outcome, inputs)
    m = None
    if len(field_text(inputs, "material")) > 0:
        m = read_material(outcome, inputs, catalogue, "material")
    elif len(field_text(inputs, "k")) == 0:
        add_error(outcome, "material", "is empty: name the winding material (e.g. Cu, 1350) or enter k")
    r1 = read_quantity(outcome, inputs, "resistance_cold", "resistance", True)
    require_positive(outcome, "resistance_cold", r1, "the cold resistance")
    t1 = read_quantity(outcome, inputs, "temperature_cold", "temperature", True)
    if t1 is not None and not (t1 > 0):
        add_error(outcome, "temperature_cold", "must be above absolute zero (−273.15 °C)")
    elif t1 is not None and t1 > melting_limit(m):
        add_error(outcome, "temperature_cold", "is above the melting point of " + melting_text(m)
                  + ": a winding is solid metal; check the temperature and its unit")
    r2 = read_quantity(outcome, inputs, "resistance_hot", "resistance", True)
    require_positive(outcome, "resistance_hot", r2, "the hot resistance")
    # the coolant temperature feeds only the rise: a problem in it is shown under it (SIDE_FIELDS)
    coolant = read_quantity(outcome, inputs, "coolant", "temperature", False)
    if coolant is not None and not (coolant > 0):
        add_error(outcome, "coolant", "must be above absolute zero (−273.15 °C)")
        coolant = None
    coolant_bad = "coolant" in outcome["errors"]
    for field in keys_of(outcome["errors"]):
        if field != "coolant":
            return outcome
    if k is None and not is_copper(m, catalogue) and not is_ec_aluminium(m, catalogue):
        curved = by_material_curve(outcome, m, t1, r1, r2, coolant, coolant_bad)
        if curved:
            return outcome
    if k is None:
        k = material_k(outcome, m, catalogue)
        if k is None:
            return outcome
    else:
        add_warning(outcome, "k = " + format_number(k, 5) + " as entered (inferred zero at "
                    + format_number(-k, 5) + " °C)")
    if m is not None:
        outcome["material"] = m["id"]
    if not (k + t1 - ZERO_CELSIUS > 0):
        add_error(outcome, "temperature_cold", "lies below the inferred zero-resistance temperature −k = "
                  + format_number(-k, 5) + " °C")
        return outcome
    try:
        t2 = practice.resistance_method_temperature(r1, t1, r2, k)
    except CoreError as problem:
        add_error(outcome, "resistance_hot", problem.message)
        return outcome
    if not (t2 > 0):
        add_error(outcome, "resistance_hot", "R2/R1 = " + format_number(r2 / r1, 4) + " would put the winding below "
                  "absolute zero; check the two resistances and their units")
        return outcome
    if t2 > melting_limit(m):
        add_error(outcome, "resistance_hot", "R2/R1 = " + format_number(r2 / r1, 4) + " would put the winding at "
                  + celsius_text(t2) + ", above the melting point of " + melting_text(m)
                  + ": check the two resistances, their units and the material")
        return outcome
    outcome["model"] = "resistance method, t2 = (R2/R1)(k + t1) − k"
    add_temperatures(outcome, t1, t2, r1, r2, coolant, coolant_bad)
    add_result(outcome, "k", k, "K", format_number(k, 5) + " (inferred zero at " + format_number(-k, 5) + " °C)")
    if t2 < LINEAR_FROM or t2 > LINEAR_TO:
        add_warning(outcome, "the hot temperature lies outside −50 to 200 °C, where the linear R(T) behind the method "
                             "is good for copper and aluminium")
    if r2 < r1:
        add_warning(outcome, "R2 is below R1: the winding was colder at the second measurement")
    if m is not None and len(field_text(inputs, "k")) > 0:
        note_k_mismatch(outcome, k, m, catalogue, r1, t1, r2, t2)
    check_finite_results(outcome, "resistance_hot")
    return outcome
# __pragma__ ('kwargs')
