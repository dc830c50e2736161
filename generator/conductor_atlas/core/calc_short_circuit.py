"""Calculator "short-circuit": a bare conductor's final temperature, least cross-section and longest time
under a fault current, by the adiabatic heat balance with the material's own ρ(T), IEC 60949 beside it."""

from conductor_atlas.core import short_circuit as sc
from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.geometry import next_metric_size
from conductor_atlas.core.material_models import MODEL_FIELD_INFO, resistivity_at, resistivity_value
from conductor_atlas.core.numfmt import celsius_text, format_fixed, format_number, format_si, temperature_text
from conductor_atlas.core.outcome import (keyed_record, add_error, add_result, add_sources, add_warning, check_finite_results,
                                          has_errors, new_outcome)
from conductor_atlas.core.calc_inputs import (field_text, read_material, read_quantity, read_size,
                                              read_temperature_or_empty, require_positive)
from conductor_atlas.core.calc_temperature_rise import is_copper, is_ec_aluminium

NAME = "short-circuit"
TITLE = "Short-circuit heating of a conductor"
SUMMARY = ("Final temperature, least cross-section or longest time for a fault current, by the adiabatic heat "
           "balance with the material's own ρ(T) and heat capacity; IEC 60949's formula beside it.")
FIELDS = ["material", "current", "duration", "size", "initial", "final", "model"]
DEFAULTS = {"material": "IACS", "current": "12 kA", "duration": "0.5 s", "size": "95 mm2", "initial": "90 °C",
            "final": "250 °C", "model": "auto"}
FIELD_INFO = {
    "material": ["Conductor material", "id, alias or symbol, e.g. IACS, 1350, Cu: needs a specific heat on record"],
    "current": ["Fault current", "r.m.s. over the fault, e.g. 12 kA, 800 A"],
    "duration": ["Fault duration", "e.g. 0.5 s, 200 ms; empty: the longest time the size can carry"],
    "size": ["Cross-section", "e.g. 95 mm², 4/0 AWG, 60 x 10 mm; empty: the least cross-section"],
    "initial": ["Temperature before the fault", "e.g. 90 °C: the conductor's operating temperature"],
    "final": ["Final temperature limit", "your insulation's short-circuit limit, e.g. 160 °C for PVC, 250 °C for "
                                         "XLPE or EPR (common practice (no source): take the figure from the cable "
                                         "standard or maker); empty: the final temperature"],
    "model": MODEL_FIELD_INFO,
}
RESULT_LABELS = [
    ["final_temperature", "Final temperature (heat balance)"], ["final_temperature_iec", "Final temperature (IEC 60949)"],
    ["limit_margin", "Against the final temperature limit"],
    ["min_area", "Least cross-section (heat balance)"], ["min_area_iec", "Least cross-section (IEC 60949)"],
    ["next_size", "Next IEC 60228 nominal size"],
    ["max_time", "Longest time (heat balance)"], ["max_time_iec", "Longest time (IEC 60949)"],
    ["current_density", "Current density"], ["volumetric_heat", "Volumetric heat capacity used"],
]
CAUTION = ("An adiabatic estimate for a bare conductor: all the heat stays in the metal. The protective device's "
           "clearing time, the mechanical forces of the fault current, the insulation and the installation rules of "
           "the local electrical code decide a real installation; defer to licensed practice.")

# Above this the heat lost to the surroundings is no longer small: IEC 60949 treats faults up to
# about 5 s as adiabatic (from memory of its scope); longer ones need its non-adiabatic factor.
ADIABATIC_LIMIT = 5.0  # [s]
# How far above the initial temperature the final-temperature search looks when no melting point is
# on record (our bound: no conductor metal survives 1500 K of rise).
SEARCH_SPAN = 1500.0  # [K]
AGREEMENT = 0.02  # the integrated answer and IEC 60949's formula are expected to agree within 2 %


# __pragma__ ('nokwargs')
def iec_constants(m, catalogue):
    """[K [A*s^0.5/m^2], β [K], "copper" / "aluminium"] of IEC 60949 for the material, or None.

    K and β are IEC 60949:1988 Table I's (from memory): copper 226 A*s^0.5/mm^2 and 234.5 K, aluminium
    148 A*s^0.5/mm^2 and 228 K; other materials have no row (None). Copper and EC aluminium as
    calc_temperature_rise.is_copper and is_ec_aluminium read the record.

    Examples
    --------
    >>> copper = {"id": "copper-annealed", "klass": "conductor-grade"}
    >>> iec_constants(copper, {"aliases": {"cu": "copper-annealed"}})
    [226000000.0, 234.5, 'copper']
    >>> iec_constants({"id": "brass-c26000", "klass": "copper-alloy"}, {"aliases": {}}) is None
    True
    """
    if is_copper(m, catalogue):
        return [sc.IEC60949_K_COPPER, sc.IEC60949_BETA_COPPER, "copper"]
    if is_ec_aluminium(m, catalogue) or m["id"] == "aluminium":
        return [sc.IEC60949_K_ALUMINIUM, sc.IEC60949_BETA_ALUMINIUM, "aluminium"]
    return None


def resistivities(m, points, model):
    """ρ [ohm*m] of m at each temperature [K] of ``points`` by ``model`` (warnings are read separately).

    Examples
    --------
    IEC 60028 copper, ρ = 1.7241e-8 ohm*m (1 + 0.00393 /K (θ − 20 °C)): 2.19831e-8 ohm*m at 90 °C by
    hand (1.7241 · 1.2751 = 2.19840 with α = 0.00393; here α = 1/254.5, IEC 60949's β = 234.5 K, so
    1.7241 · (254.5 + 70) / 254.5 = 2.19831):

    >>> copper = {"name": "copper", "rho_ref": 1.7241e-8, "alpha": 1.0 / 254.5, "t_ref": 293.15,
    ...           "valid_from": 223.15, "valid_to": 573.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0}
    >>> [round(r * 1e8, 5) for r in resistivities(copper, [293.15, 363.15], "linear")]
    [1.7241, 2.19831]
    """
    out = []
    for t in points:
        out.append(resistivity_value(m, t, model))
    return out


def heat_integral_of(m, model, lo, hi, cv):
    """∫ c_v/ρ(θ) dθ from lo to hi [K] with m's own ρ(T) by ``model``, [A^2*s/m^4]; cv [J/(K*m^3)].

    The right side of the adiabatic balance J² t = ∫ c_v/ρ dθ (short_circuit.heat_integral: Simpson's
    rule over short_circuit.integration_points).

    Examples
    --------
    Copper with IEC 60949's constants (c_v = 3.45e6 J/(K*m^3), ρ20 = 1.7241e-8 ohm*m, β = 234.5 K,
    so α = 1/(β + 20)) from 90 °C to 250 °C. IEC 60949's closed form by hand:
    K² ln((θf + β)/(θi + β)) with K² = c_v (β + 20) / ρ20 = 5.0926e16, ln(484.5 / 324.5) = 0.40083,
    giving 2.04130e16 A^2*s/m^4 (K = 225.7 A*s^0.5/mm^2, Table I's 226 rounded):

    >>> copper = {"name": "copper", "rho_ref": 1.7241e-8, "alpha": 1.0 / 254.5, "t_ref": 293.15,
    ...           "valid_from": 223.15, "valid_to": 573.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0}
    >>> '%.5e' % heat_integral_of(copper, "linear", 363.15, 523.15, 3.45e6)
    '2.04130e+16'

    The same sum as sc.heat_integral over resistivities at sc.integration_points, term by term (the
    same floats in the same order, so the same result to the last bit), but without the two lists:
    an update of the calculator takes about eight of these integrals, and in a browser the lists
    and their numbers were the main garbage of a keystroke. As there, every ρ is computed before a
    non-positive one is refused, so a model's own error comes first.

    >>> points = sc.integration_points(363.15, 1356.15)
    >>> listed = sc.heat_integral(resistivities(copper, points, "linear"), 363.15, 1356.15, 3.45e6)
    >>> heat_integral_of(copper, "linear", 363.15, 1356.15, 3.45e6) == listed
    True
    """
    n = sc.SIMPSON_PANELS
    h = (hi - lo) / n
    total = 0.0
    positive = True
    for i in range(n + 1):
        w = sc.simpson_weight(i, n)
        rho = resistivity_value(m, lo + h * i, model)
        if rho > 0:
            total += w / rho
        else:
            positive = False
    if not positive:
        raise CoreError("the resistivity model gives no positive value in this temperature span", "final")
    return cv * total * h / 3.0


def final_temperature(m, model, t_i, target, cv, cap):
    """θf [K] where the heat integral from t_i reaches ``target`` = J² t; -1.0 beyond ``cap``.

    Newton's method on F(θ) = ∫ c_v/ρ dθ − target, whose slope is c_v/ρ(θ), kept inside a
    bisection bracket [lo, hi] (a step that leaves it bisects instead); stops when a step is below
    1e-10 of θ. About five integrals instead of the 35 of bisection alone.

    Examples
    --------
    The inverse of heat_integral_of's example: copper from 90 °C with J² t = 2.04130e16 A^2*s/m^4
    reaches 250 °C (IEC 60949's closed form, solved by hand for θf: (θi + β) e^(J² t / K²) − β
    = 324.5 · 1.49307 − 234.5 = 250.0 °C); a cap below that gives -1.0:

    >>> copper = {"name": "copper", "rho_ref": 1.7241e-8, "alpha": 1.0 / 254.5, "t_ref": 293.15,
    ...           "valid_from": 223.15, "valid_to": 573.15, "cvd_a": 0.0, "table_t": [], "bg_theta": 0.0}
    >>> round(final_temperature(copper, "linear", 363.15, 2.04130e16, 3.45e6, 2000.0) - 273.15, 2)
    250.0
    >>> final_temperature(copper, "linear", 363.15, 2.04130e16, 3.45e6, 473.15)
    -1.0
    """
    if heat_integral_of(m, model, t_i, cap, cv) < target:
        return -1.0
    lo = t_i
    hi = cap
    theta = 0.5 * (lo + hi)
    for i in range(200):
        gap = heat_integral_of(m, model, t_i, theta, cv) - target
        if gap < 0:
            lo = theta
        else:
            hi = theta
        slope = cv / resistivity_value(m, theta, model)
        step = gap / slope
        guess = theta - step
        if not (guess > lo and guess < hi):
            guess = 0.5 * (lo + hi)
        if abs(guess - theta) <= 1e-10 * theta or hi - lo <= 1e-10 * hi:
            return guess
        theta = guess
    return theta


def guard_squares(outcome, current, size):
    """I² and S² enter the heat balance: refuse values whose square underflows or overflows."""
    try:
        if current is not None:
            sc.check_squarable(current, "current", "the fault current")
        if size is not None:
            sc.check_squarable(size["area"], "size", "the cross-section")
    except CoreError as problem:
        add_error(outcome, problem.field, problem.message)


def difference_text(value, reference):
    """"(heat balance −1.23 % from IEC 60949)" style: value against reference, signed percent."""
    d = (value - reference) / reference * 100.0
    sign = "+"
    if d < 0:
        sign = "−"
        d = -d
    return sign + format_fixed(d, 2) + " %"


def calculate(inputs, catalogue):
    """Adiabatic short-circuit heating of a conductor.

    Fields: material; current I; duration t (optional); size S (optional); initial θi;
    final θf (optional); model. Two of duration, size and final are needed:
    size + duration → θf from J² t = ∫ c_v/ρ(θ) dθ (J = I/S), solved for θf;
    duration + final → S = I √(t / ∫…); size + final → t = S² ∫… / I².
    c_v = density · c_p (c_p as recorded, held constant); ρ(θ) by the material's temperature model.
    For copper and aluminium the same answers by IEC 60949: I² t = K² S² ln((θf + β)/(θi + β)).
    """
    outcome = new_outcome(NAME, inputs)
    m = read_material(outcome, inputs, catalogue, "material")
    current = read_quantity(outcome, inputs, "current", "current", True)
    require_positive(outcome, "current", current, "the fault current")
    duration = read_quantity(outcome, inputs, "duration", "time", False)
    if duration is not None:
        require_positive(outcome, "duration", duration, "the duration")
    size = None
    if len(field_text(inputs, "size")) > 0:
        size = read_size(outcome, inputs, "size")
    t_i = read_temperature_or_empty(outcome, inputs, "initial", True, "")
    t_f = read_temperature_or_empty(outcome, inputs, "final", False, "")
    guard_squares(outcome, current, size)
    if has_errors(outcome):
        return outcome
    given = 0
    for thing in [duration, size, t_f]:
        if thing is not None:
            given += 1
    if given < 2:
        for field in ["duration", "size", "final"]:
            if len(field_text(inputs, field)) == 0:
                add_error(outcome, field, "is empty: enter two of duration, cross-section and final temperature")
                return outcome
    if t_f is not None and not (t_f > t_i):
        add_error(outcome, "final", "must lie above the temperature before the fault (" + celsius_text(t_i) + ")")
        return outcome
    if not (m["specific_heat"] > 0 and m["density"] > 0):
        add_error(outcome, "material", "no specific heat and density are on record for " + m["name"]
                  + ": the heat balance needs both (choose a conductor metal, e.g. IACS or 1350)")
        return outcome
    outcome["material"] = m["id"]
    model = field_text(inputs, "model")
    if len(model) == 0:
        model = "auto"
    cap = t_i + SEARCH_SPAN
    if m["melting_point"] > t_i:
        cap = m["melting_point"]
    top = cap
    if t_f is not None:
        top = t_f
    try:
        here = resistivity_at(m, t_i, model)
        resistivity_at(m, top, model)
    except CoreError as problem:
        field = problem.field
        if field == "temperature":
            field = "final"
        add_error(outcome, field, problem.message)
        return outcome
    outcome["model"] = "adiabatic heat balance, ρ(T) by the " + here["label"]
    cv = m["density"] * m["specific_heat"]
    add_sources(outcome, m["rho_sources"])
    add_sources(outcome, [m["density_source"]])
    if len(m["specific_heat_source"]) > 0:
        add_sources(outcome, [m["specific_heat_source"]])
    iec = iec_constants(m, catalogue)
    try:
        worst = compute(outcome, m, model, current, duration, size, t_i, t_f, cv, cap, iec)
    except CoreError as problem:
        field = problem.field
        if len(field) == 0 or field == "temperature":
            field = "final"
        add_error(outcome, field, problem.message)
        outcome["results"] = keyed_record()
        return outcome
    if has_errors(outcome):
        return outcome
    if worst > 0:
        for w in resistivity_at(m, worst, model)["warnings"]:
            add_warning(outcome, w)
    add_result(outcome, "volumetric_heat", cv, "J/(K·m³)", format_number(cv / 1e6, 4) + " MJ/(K·m³) (density × c_p "
               + "at " + celsius_text(m["specific_heat_t"]) + ", held constant)")
    add_warning(outcome, "c_p is held at its recorded value (" + celsius_text(m["specific_heat_t"]) + "); it rises "
                         "with temperature (copper by about 5 % up to 250 °C, from memory), so the heat balance "
                         "slightly overstates the final temperature: on the safe side")
    if duration is not None and duration > ADIABATIC_LIMIT:
        add_warning(outcome, "a fault longer than 5 s is no longer adiabatic (IEC 60949's limit for the adiabatic "
                             "method, from memory): heat lost to the surroundings makes the real temperature lower "
                             "than shown")
    check_finite_results(outcome, "current")
    return outcome


def compute(outcome, m, model, current, duration, size, t_i, t_f, cv, cap, iec):
    """Fill the results for whatever the two or three given quantities allow; the highest temperature the
    answer reaches [K] (for the model's warnings), or -1.0 when an error was recorded."""
    worst = -1.0
    if iec is not None:
        add_sources(outcome, ["iec60949"])
    if size is not None:
        area = size["area"]
        add_result(outcome, "current_density", current / area, "A/m²", format_number(current / area / 1e6, 4)
                   + " A/mm² over " + format_number(area * 1e6, 4) + " mm²")
    if size is not None and duration is not None:
        j = current / size["area"]
        target = j * j * duration
        theta = final_temperature(m, model, t_i, target, cv, cap)
        if theta < 0:
            add_error(outcome, "current", "the conductor would pass " + celsius_text(cap) + " (" + limit_name(m)
                      + ") before the fault ends: it fuses; enter a larger cross-section or a shorter time")
            outcome["results"] = keyed_record()
            return -1.0
        worst = theta
        add_result(outcome, "final_temperature", theta, "K", temperature_text(theta))
        if iec is not None:
            theta_iec = sc.iec60949_final_temperature(current, duration, size["area"], iec[0], iec[1], t_i)
            add_result(outcome, "final_temperature_iec", theta_iec, "K", temperature_text(theta_iec) + ", K = "
                       + format_number(iec[0] / 1e6, 3) + " A·s^½/mm², β = " + format_number(iec[1], 4) + " ("
                       + iec[2] + "); the rise by the heat balance is "
                       + difference_text(theta - t_i, theta_iec - t_i) + " from it")
        if t_f is not None:
            margin = t_f - theta
            words = format_fixed(margin, 1) + " K below the limit of " + celsius_text(t_f)
            if margin < 0:
                words = "FAIL: " + format_fixed(-margin, 1) + " K above the limit of " + celsius_text(t_f)
            add_result(outcome, "limit_margin", margin, "K", words)
    if t_f is not None:
        worst = t_f
        g = heat_integral_of(m, model, t_i, t_f, cv)
        if duration is not None:
            area = current * (duration / g) ** 0.5
            add_result(outcome, "min_area", area, "m²", format_number(area * 1e6, 4) + " mm²")
            if iec is not None:
                area_iec = sc.iec60949_min_area(current, duration, iec[0], iec[1], t_i, t_f)
                add_result(outcome, "min_area_iec", area_iec, "m²", format_number(area_iec * 1e6, 4) + " mm²; the "
                           "heat balance is " + difference_text(area, area_iec) + " from it")
            nominal = next_metric_size(area)
            if nominal > 0:
                add_result(outcome, "next_size", nominal * 1e-6, "m²", format_number(nominal, 4)
                           + " mm² (the next nominal size up; check its real resistance and the cable standard)")
        if size is not None:
            t_max = g * size["area"] * size["area"] / (current * current)
            add_result(outcome, "max_time", t_max, "s", time_text(t_max))
            if iec is not None:
                t_iec = sc.iec60949_max_time(current, size["area"], iec[0], iec[1], t_i, t_f)
                add_result(outcome, "max_time_iec", t_iec, "s", time_text(t_iec) + "; the heat balance is "
                           + difference_text(t_max, t_iec) + " from it")
            if t_max > ADIABATIC_LIMIT:
                add_warning(outcome, "the longest time, " + time_text(t_max) + ", is beyond 5 s, where the heat "
                            "balance is no longer adiabatic (IEC 60949's limit for the adiabatic method, from "
                            "memory): heat lost to the surroundings meanwhile lets the real conductor carry the "
                            "current longer than shown")
    return worst


def time_text(seconds):
    """A duration [s] in SI prefixes, with hours beside it from one hour up ("18.28 ks (5.08 h)"): a
    kilosecond is not how anyone reads a long time."""
    text = format_si(seconds, "s", 4)
    if seconds >= 3600.0:
        text = text + " (" + format_number(seconds / 3600.0, 3) + " h)"
    return text


def limit_name(m):
    if m["melting_point"] > 0:
        return "its melting point"
    return "the search's upper bound"
# __pragma__ ('kwargs')
