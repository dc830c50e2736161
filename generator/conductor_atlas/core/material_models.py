"""Resistivity of a catalogue material at a temperature, by the model that fits there.

A catalogue record (conductor_atlas.derive.calc_record) may carry any of: the linear α model
(rho_ref, alpha, t_ref, valid_from, valid_to), a sourced ρ(T) table (table_t, table_rho), a
Bloch–Grüneisen fit to that table (bg_rho0, bg_a, bg_theta, bg_t_min, bg_t_max, bg_worst), and
Callendar–Van Dusen coefficients (cvd_a, cvd_b, cvd_c) for platinum sensor metals, a Matthiessen
estimate from a base metal (mt_t, mt_drho, mt_base) and, for clad wire, ρ(T) of its two layers
conducting in parallel (cl_t, cl_rho, cl_fraction, cl_names: derive.clad_layers_table).

``resistivity_at`` returns {"rho": [ohm*m], "model": key, "label": text, "warnings": [...]};
"auto" picks, in order: Callendar–Van Dusen inside −200…850 °C (the defining equation of a
platinum sensor metal wins over its mean α); linear inside its span;
the table inside its range (interpolated, flagged); the Bloch–Grüneisen fit inside its fitted
range; else the nearest model with a warning. Never silent outside a model's range.
"""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core import resistance as dc
from conductor_atlas.core import temperature_models as tm
from conductor_atlas.core.numfmt import format_number, temperature_span_text, temperature_text

MODEL_LABELS = {
    "linear": "linear temperature-coefficient model",
    "table": "interpolation of the sourced ρ(T) table",
    "bloch-gruneisen": "Bloch–Grüneisen fit to the sourced ρ(T) table",
    "callendar-van-dusen": "Callendar–Van Dusen equation (IEC 60751)",
    "reference": "the reference value only (no temperature model on record)",
    "matthiessen": "estimated by Matthiessen's rule",
    "layers": "layers in parallel",
}

MODEL_CHOICES = ["auto", "linear", "table", "bloch-gruneisen", "callendar-van-dusen", "matthiessen", "layers"]

# The "model" field of every calculator form: [label, hint]
MODEL_FIELD_INFO = ["Temperature model", "auto, linear, table, bloch-gruneisen, callendar-van-dusen, matthiessen or layers "
                    "(any case; the models of the chosen material are listed when another is typed)"]


# Every function from here on has no keyword-argument prologue in its JS (none has a default
# argument): the ρ of an integral's every temperature (the short-circuit heat balance evaluates ρ
# at 65 points per integral) and resistivity_at, which each calculator update calls a few times.
# Call them with positional arguments only (tests/core/test_subset.py).
# __pragma__ ('nokwargs')
def has_linear(m):
    return m["alpha"] != 0


def has_table(m):
    return len(m["table_t"]) >= 2


def has_bg(m):
    return m["bg_theta"] > 0


def has_cvd(m):
    return m["cvd_a"] > 0


def has_matthiessen(m):
    return len(m["mt_t"]) >= 2


def in_matthiessen_span(m, t):
    return has_matthiessen(m) and t >= m["mt_t"][0] and t <= m["mt_t"][len(m["mt_t"]) - 1]


def matthiessen_label(m):
    """"estimated by Matthiessen's rule from <base> (<span>)"."""
    return (MODEL_LABELS["matthiessen"] + " from " + m["mt_base"] + ", valid "
            + temperature_span_text(m["mt_t"][0], m["mt_t"][len(m["mt_t"]) - 1]))


def has_layers(m):
    return len(m["cl_t"]) >= 2


def in_layers_span(m, t):
    return has_layers(m) and t >= m["cl_t"][0] and t <= m["cl_t"][len(m["cl_t"]) - 1]


def layers_label(m):
    """"layers in parallel: 20.3 % <outer> by area over a core of <core>, valid <span>"."""
    return (MODEL_LABELS["layers"] + ": " + format_number(m["cl_fraction"] * 100.0, 3) + " % " + m["cl_names"][0]
            + " by area over a core of " + m["cl_names"][1] + ", valid "
            + temperature_span_text(m["cl_t"][0], m["cl_t"][len(m["cl_t"]) - 1]))


def in_linear_span(m, t):
    return t >= m["valid_from"] and t <= m["valid_to"]


def in_table(m, t):
    return has_table(m) and t >= m["table_t"][0] and t <= m["table_t"][len(m["table_t"]) - 1]


def in_bg_range(m, t):
    return has_bg(m) and t >= m["bg_t_min"] and t <= m["bg_t_max"]


def in_cvd_range(t):
    return t >= 73.15 and t <= 1123.15




def available_models(m):
    """The model keys this material supports."""
    out = []
    if has_linear(m):
        out.append("linear")
    if has_cvd(m):
        out.append("callendar-van-dusen")
    if has_table(m):
        out.append("table")
    if has_bg(m):
        out.append("bloch-gruneisen")
    if has_matthiessen(m):
        out.append("matthiessen")
    if has_layers(m):
        out.append("layers")
    return out


# what each model needs, for the message that explains why it is not offered for a material
MODEL_NEEDS = {
    "linear": "no temperature coefficient on record",
    "table": "no sourced ρ(T) table on record",
    "bloch-gruneisen": "no ρ(T) table to fit",
    "callendar-van-dusen": "not a platinum sensor metal",
    "matthiessen": "no base metal on record",
    "layers": "not a clad wire",
}


def model_choice_message(m, model):
    """The models there are for m, and why the others are not: for an unknown model name."""
    have = available_models(m)
    text = "unknown model “" + model + "”; for " + m["name"] + " choose auto"
    for key in have:
        text = text + ", " + key
    missing = []
    for key in MODEL_CHOICES:
        if key != "auto" and not (key in have):
            missing.append(key + " (" + MODEL_NEEDS[key] + ")")
    if len(missing) > 0:
        text = text + "; not available: " + ", ".join(missing)
    return text


def cvd_ratio(m, t):
    """R(T)/R(T_ref) of the Callendar–Van Dusen equation with the material's coefficients.

    Examples
    --------
    IEC 60751's coefficients with T_ref = 0 degC: R(100 degC) / R0 = 1.385055, a Pt100's 138.51 ohm in
    IEC 60751 Table 1 (from memory):

    >>> pt = {"cvd_a": 3.9083e-3, "cvd_b": -5.775e-7, "cvd_c": -4.183e-12, "t_ref": 273.15}
    >>> round(cvd_ratio(pt, 373.15), 6)
    1.385055
    """
    r_t = tm.callendar_van_dusen_resistance(t, 1.0, m["cvd_a"], m["cvd_b"], m["cvd_c"])
    r_ref = tm.callendar_van_dusen_resistance(m["t_ref"], 1.0, m["cvd_a"], m["cvd_b"], m["cvd_c"])
    return r_t / r_ref


# (positional arguments only, as above)
def choose_model(m, t):
    """The model "auto" uses at temperature t [K].

    Examples
    --------
    A record with only the linear model (IEC 60028 copper; a partial record, enough for this choice):

    >>> copper = {"name": "annealed copper", "rho_ref": 1.7241e-8, "alpha": 0.00393, "t_ref": 293.15,
    ...           "valid_from": 223.15, "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0}
    >>> choose_model(copper, 363.15)
    'linear'
    """
    if has_cvd(m) and in_cvd_range(t):
        return "callendar-van-dusen"
    if has_linear(m) and in_linear_span(m, t):
        return "linear"
    if in_table(m, t):
        return "table"
    if in_bg_range(m, t):
        return "bloch-gruneisen"
    if has_layers(m):
        return "layers"
    if has_bg(m):
        return "bloch-gruneisen"
    if has_table(m):
        return "table"
    if has_linear(m):
        return "linear"
    if has_matthiessen(m):
        return "matthiessen"
    return "reference"




def resistivity_or_none(m, t):
    """The "auto" model's answer at t [K] (resistivity_at's record: "rho" [ohm*m], "model", "label",
    "warnings"), or None where no model reaches t: for tables, charts and estimates that leave a gap
    or fall back instead of showing a message.

    Examples
    --------
    >>> copper = {"name": "annealed copper", "rho_ref": 1.7241e-8, "alpha": 0.00393, "t_ref": 293.15,
    ...           "valid_from": 223.15, "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0}
    >>> round(resistivity_or_none(copper, 363.15)["rho"] * 1e8, 4)
    2.1984
    """
    try:
        return resistivity_at(m, t, "auto")
    except CoreError:
        return None


def within_model(found):
    """True when an answer of resistivity_at lies inside its model: no warnings, or only the standing
    note that a Matthiessen's-rule or parallel-layer value is an estimate (those models raise outside
    their spans). Tables
    and charts show such rows, naming the model; any other warning (extrapolation) leaves a gap.

    Examples
    --------
    >>> copper = {"name": "annealed copper", "rho_ref": 1.7241e-8, "alpha": 0.00393, "t_ref": 293.15,
    ...           "valid_from": 223.15, "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0}
    >>> within_model(resistivity_at(copper, 363.15, "auto")), within_model(resistivity_at(copper, 573.15, "linear"))
    (True, False)
    """
    if found is None:
        return False
    if len(found["warnings"]) == 0:
        return True
    return (found["model"] == "matthiessen" or found["model"] == "layers") and len(found["warnings"]) == 1


# (positional arguments only, as above)
def model_key(m, t, model):
    """The model key ``model`` stands for at temperature t [K]: "auto" (or empty) is choose_model's pick.

    Examples
    --------
    >>> copper = {"name": "annealed copper", "rho_ref": 1.7241e-8, "alpha": 0.00393, "t_ref": 293.15,
    ...           "valid_from": 223.15, "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0}
    >>> model_key(copper, 363.15, "auto"), model_key(copper, 363.15, ""), model_key(copper, 363.15, "table")
    ('linear', 'linear', 'table')
    """
    if model == "auto" or len(model) == 0:
        return choose_model(m, t)
    return model


def resistivity_value(m, t, model):
    """ρ [ohm*m] of material record ``m`` at temperature t [K] with ``model`` (or "auto"): the "rho" of
    resistivity_at without its label and warnings, for loops that need only the number (an integral
    over temperature). Raises the same CoreError as resistivity_at.

    Examples
    --------
    The same number as resistivity_at (IEC 60028 copper at 90 degC, 2.1984e-8 ohm*m by hand), here
    outside the linear model's span too, where resistivity_at adds a warning:

    >>> copper = {"name": "annealed copper", "rho_ref": 1.7241e-8, "alpha": 0.00393, "t_ref": 293.15,
    ...           "valid_from": 223.15, "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0}
    >>> round(resistivity_value(copper, 363.15, "auto") * 1e8, 4)
    2.1984
    >>> resistivity_value(copper, 573.15, "linear") == resistivity_at(copper, 573.15, "linear")["rho"]
    True
    """
    if not (t > 0):
        raise CoreError("must be above absolute zero (−273.15 °C)", "temperature")
    return model_rho(m, t, model_key(m, t, model), model)


def model_rho(m, t, key, model):
    """ρ [ohm*m] of m at t [K] by model ``key`` (resolved, not "auto"); ``model`` is the name typed, for
    the message when no model has that name. Raises CoreError (field "model" or "temperature") when the
    model is not on record for m or does not reach t.

    Examples
    --------
    Linear, IEC 60028 copper at 90 °C: 1.7241e-8 · (1 + 0.00393 · 70) = 2.19840e-8 ohm*m by hand.
    Callendar–Van Dusen with IEC 60751's coefficients and ρ0 of platinum 1.05e-7 ohm*m (an example
    value): ρ(100 °C) = 1.385055 ρ0, a Pt100's 138.5055 ohm over 100 ohm (IEC 60751 Table 1, from
    memory):

    >>> copper = {"name": "annealed copper", "rho_ref": 1.7241e-8, "alpha": 0.00393, "t_ref": 293.15,
    ...           "valid_from": 223.15, "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0}
    >>> round(model_rho(copper, 363.15, "linear", "linear") * 1e8, 5)
    2.1984
    >>> pt = {"name": "platinum", "rho_ref": 1.05e-7, "t_ref": 273.15, "cvd_a": 3.9083e-3, "cvd_b": -5.775e-7,
    ...       "cvd_c": -4.183e-12}
    >>> round(model_rho(pt, 373.15, "callendar-van-dusen", "auto") / 1.05e-7, 6)
    1.385055
    """
    if key == "linear":
        if not has_linear(m):
            raise CoreError("no temperature coefficient is on record for " + m["name"], "model")
        if not (1.0 + m["alpha"] * (t - m["t_ref"]) > 0):
            raise CoreError(linear_floor_message(m, t), "temperature")
        return dc.resistivity_linear(t, m["rho_ref"], m["alpha"], m["t_ref"])
    if key == "table":
        if not has_table(m):
            raise CoreError("no sourced ρ(T) table is on record for " + m["name"], "model")
        rho = tm.interpolate_table(t, m["table_t"], m["table_rho"])
        if not (rho > 0):
            raise CoreError("the table cannot be extrapolated this far (it gives no positive resistivity)", "temperature")
        return rho
    if key == "bloch-gruneisen":
        if not has_bg(m):
            raise CoreError("no Bloch–Grüneisen fit is available for " + m["name"], "model")
        return tm.bloch_gruneisen_resistivity(t, m["bg_rho0"], m["bg_a"], m["bg_theta"])
    if key == "callendar-van-dusen":
        if not has_cvd(m):
            raise CoreError("no Callendar–Van Dusen coefficients are on record for " + m["name"], "model")
        return m["rho_ref"] * cvd_ratio(m, t)
    if key == "matthiessen":
        if not has_matthiessen(m):
            raise CoreError("no base metal is on record for " + m["name"] + ", so Matthiessen's rule cannot be applied",
                            "model")
        if not in_matthiessen_span(m, t):
            raise CoreError("the estimate for " + m["name"] + " by Matthiessen's rule spans only "
                            + temperature_span_text(m["mt_t"][0], m["mt_t"][len(m["mt_t"]) - 1])
                            + " (the base metal's sourced table)", "temperature")
        return m["rho_ref"] + tm.interpolate_table(t, m["mt_t"], m["mt_drho"])
    if key == "layers":
        if not has_layers(m):
            raise CoreError(m["name"] + " is not a clad wire with its layers on record", "model")
        if not in_layers_span(m, t):
            raise CoreError("the parallel-layer model of " + m["name"] + " spans only "
                            + temperature_span_text(m["cl_t"][0], m["cl_t"][len(m["cl_t"]) - 1])
                            + " (where both layers' own models hold)", "temperature")
        return tm.interpolate_table(t, m["cl_t"], m["cl_rho"])
    if key == "reference":
        if abs(t - m["t_ref"]) > 0.5:
            raise CoreError("no temperature model is on record for " + m["name"] + "; only "
                            + temperature_text(m["t_ref"]) + " can be computed", "temperature")
        return m["rho_ref"]
    raise CoreError(model_choice_message(m, model), "model")




def linear_floor_message(m, t):
    """Why the linear model of m gives no resistivity at t [K] (1 + α (t − t_ref) ≤ 0, far below its
    span) and what to type instead: another model on record that reaches there, or a temperature in
    the linear model's span.

    Examples
    --------
    >>> film = {"name": "a film", "rho_ref": 1.68e-8, "alpha": 0.0039, "t_ref": 293.15, "valid_from": 223.15,
    ...         "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0, "mt_t": [], "cl_t": []}
    >>> linear_floor_message(film, 4.0).endswith("no other ρ(T) model is on record for it: enter a temperature in that span")
    True
    """
    text = ("the linear model of " + m["name"] + " gives no positive resistivity at " + temperature_text(t)
            + " (it holds from " + temperature_span_text(m["valid_from"], m["valid_to"]) + ")")
    others = []
    for key in available_models(m):
        if key != "linear":
            others.append(key)
    if len(others) > 0:
        return text + ": choose the model " + " or ".join(others) + " for this temperature"
    return text + ", and no other ρ(T) model is on record for it: enter a temperature in that span"


def model_warnings(m, t, key):
    """What the answer of model ``key`` at t [K] must say beside its value: outside a model's span, an
    interpolated or extrapolated table, an estimate (Matthiessen's rule, layers in parallel)."""
    warnings = []
    if key == "linear":
        if not in_linear_span(m, t):
            warnings.append("temperature " + temperature_text(t) + " is outside the span where the linear model holds for "
                            + m["name"] + " (" + temperature_span_text(m["valid_from"], m["valid_to"]) + ")")
    elif key == "table":
        for w in tm.table_warnings(t, m["table_t"]):
            warnings.append("ρ(T) table of " + m["name"] + ": " + w)
    elif key == "bloch-gruneisen":
        if not in_bg_range(m, t):
            warnings.append("temperature " + temperature_text(t) + " is outside the range the Bloch–Grüneisen fit of "
                            + m["name"] + " was fitted over (" + temperature_span_text(m["bg_t_min"], m["bg_t_max"])
                            + ")")
    elif key == "callendar-van-dusen":
        for w in tm.cvd_warnings(t):
            warnings.append(w)
    elif key == "matthiessen":
        warnings.append("ρ of " + m["name"] + " at " + temperature_text(t) + " is an estimate: its value at "
                        + temperature_text(m["t_ref"]) + " plus the change of " + m["mt_base"]
                        + " (Matthiessen's rule; alloying adds a nearly constant part to ρ). Check against the "
                        "supplier's data where it matters")
    elif key == "layers":
        if abs(t - m["t_ref"]) > 0.5:
            warnings.append("ρ of " + m["name"] + " at " + temperature_text(t) + " is an estimate: "
                            + m["cl_names"][0] + " and a core of " + m["cl_names"][1]
                            + " conducting in parallel, with the area fraction that gives the grade's value at "
                            + temperature_text(m["t_ref"]) + "; the layers of a real wire may be other grades than these")
    return warnings


def resistivity_at(m, t, model):
    """Resistivity of material record ``m`` at temperature t [K] with ``model`` (or "auto"):
    {"rho": [ohm*m], "model": key, "label": text, "warnings": [...]}.

    Raises CoreError (field "model" or "temperature") when the asked model is not on record or
    the temperature is impossible.

    Examples
    --------
    IEC 60028 copper (1.7241e-8 ohm*m, 0.00393 /K at 20 degC) at 90 degC: by hand
    1.7241e-8 (1 + 0.00393 x 70) = 2.1984e-8 ohm*m:

    >>> copper = {"name": "annealed copper", "rho_ref": 1.7241e-8, "alpha": 0.00393, "t_ref": 293.15,
    ...           "valid_from": 223.15, "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0}
    >>> found = resistivity_at(copper, 363.15, "auto")
    >>> round(found["rho"] * 1e8, 4), found["model"], found["warnings"]
    (2.1984, 'linear', [])
    """
    if not (t > 0):
        raise CoreError("must be above absolute zero (−273.15 °C)", "temperature")
    key = model_key(m, t, model)
    rho = model_rho(m, t, key, model)
    label = MODEL_LABELS[key]
    if key == "matthiessen":
        label = matthiessen_label(m)
    elif key == "layers":
        label = layers_label(m)
    return model_answer(rho, key, label, model_warnings(m, t, key))


# resistivity_at's answer is read by key only (by the core, the pages and JSON): in JS a plain object
# (the jsiter region), not a Transcrypt dict, whose eighteen hidden methods cost more to attach than
# the rest of a linear model's answer (see core.outcome). Never call keys()/items() on it in the core.
# __pragma__ ('jsiter')
def model_answer(rho, key, label, warnings):
    """{"rho": [ohm*m], "model": key, "label": text, "warnings": [str]}: resistivity_at's answer.

    Examples
    --------
    >>> model_answer(1.7241e-8, "linear", "linear temperature-coefficient model", [])["model"]
    'linear'
    """
    return {"rho": rho, "model": key, "label": label, "warnings": warnings}
# __pragma__ ('nojsiter')


COEFFICIENT_STEP = 0.5  # [K] half-width of the central difference for the local coefficient


def local_temperature_coefficient(m, t, model):
    """Local temperature coefficient α(T) = (dρ/dT)/ρ(T), [1/K], or None.

    dρ/dT by a central difference of ±0.5 K with one model throughout: ``model``, or for "auto"
    the model "auto" picks at t (so the difference never straddles two models). None when that
    model has no temperature dependence ("reference": only a value at one temperature is on
    record) or cannot be evaluated at t ± 0.5 K. Returns [alpha, warnings of the three evaluations].

    Examples
    --------
    The linear model's alpha at 90 degC is alpha_20 / (1 + alpha_20 x 70) = 0.00393 / 1.2751 =
    0.0030821 /K (by hand):

    >>> copper = {"name": "annealed copper", "rho_ref": 1.7241e-8, "alpha": 0.00393, "t_ref": 293.15,
    ...           "valid_from": 223.15, "valid_to": 473.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0}
    >>> alpha, warnings = local_temperature_coefficient(copper, 363.15, "auto")
    >>> round(alpha, 7), warnings
    (0.0030821, [])
    """
    key = model_key(m, t, model)
    if key == "reference" or not (t > COEFFICIENT_STEP):
        return [None, []]
    try:
        below = resistivity_at(m, t - COEFFICIENT_STEP, key)
        here = resistivity_at(m, t, key)
        above = resistivity_at(m, t + COEFFICIENT_STEP, key)
    except CoreError:
        return [None, []]
    warnings = []
    for found in [below, here, above]:
        for w in found["warnings"]:
            warnings.append(w)
    alpha = (above["rho"] - below["rho"]) / (2.0 * COEFFICIENT_STEP) / here["rho"]
    return [alpha, warnings]
# __pragma__ ('kwargs')
