"""Calculator "resistance": a conductor run's resistance, voltage drop, I²R loss and AC resistance."""

import math

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core import resistance as dc
from conductor_atlas.core import skin_effect as skin
from conductor_atlas.core.numfmt import format_number, format_si, temperature_text
from conductor_atlas.core.outcome import (add_error, add_result, add_sources, add_warning, check_finite_results,
                                          new_outcome)
from conductor_atlas.core.geometry import area_text
from conductor_atlas.core.calc_inputs import read_quantity, read_size, require_positive
from conductor_atlas.core.calc_common import (frequency_beyond_dc_conductivity, material_at_temperature, recorded_mean_free_path, warn_if_anomalous,
                                              warn_if_fusing)
from conductor_atlas.core.material_models import MODEL_FIELD_INFO
from conductor_atlas.core.clad_layers import clad_layers_at
from conductor_atlas.core.ac_layout import ac_ratio_for, add_ratio_result

NAME = "resistance"
TITLE = "Resistance of a conductor run"
SUMMARY = "DC and AC resistance, voltage drop, I²R loss and mass of a conductor at its temperature."
FIELDS = ["material", "length", "size", "temperature", "current", "frequency", "model"]
DEFAULTS = {"material": "copper-annealed", "length": "100 m", "size": "2.5 mm2", "temperature": "20 °C",
            "current": "", "frequency": "", "model": "auto"}
# field -> [label, hint]
FIELD_INFO = {
    "material": ["Material", "id, alias or symbol, e.g. IACS, 1350, Cu"],
    "length": ["Conductor length", "e.g. 25 m, 300 ft, 1.2 km. For a two-wire circuit, both conductors."],
    "size": ["Cross-section", "e.g. 2.5 mm², 12 AWG, 4/0 AWG, 250 kcmil, d 1.6 mm, 40 x 5 mm"],
    "temperature": ["Conductor temperature", "e.g. 20 °C, 90 degC, 363 K, 194 °F"],
    "current": ["Current (optional)", "e.g. 16 A, 250 mA"],
    "frequency": ["Frequency (optional)", "e.g. 50 Hz, 400 Hz, 100 kHz: adds skin depth and AC resistance"],
    "model": MODEL_FIELD_INFO,
}
# results shown on the page, in order: [name, label]
RESULT_LABELS = [
    ["resistance", "Resistance"], ["resistance_per_km", "Per kilometre"], ["resistivity", "Resistivity at temperature"],
    ["conductivity", "Conductivity at temperature"], ["temperature", "Temperature"],
    ["area", "Cross-section"], ["mass", "Mass of conductor"], ["voltage_drop", "Voltage drop"],
    ["power_loss", "I²R loss"], ["current_density", "Current density"], ["skin_depth", "Skin depth"],
    ["ac_dc_ratio", "AC/DC ratio"], ["resistance_ac", "AC resistance"], ["power_loss_ac", "I²R loss at AC"],
]
# optional input -> the results that need it: a problem in that field is shown under it and drops only
# these results (the resistance does not depend on the current or the frequency)
SIDE_FIELDS = {"current": ["voltage_drop", "power_loss", "current_density", "power_loss_ac"],
               "frequency": ["skin_depth", "ac_dc_ratio", "resistance_ac", "power_loss_ac"]}
# result -> the input a non-finite value of it comes from, when the results before it are finite
# (outcome.check_finite_results); any other result: "length"
CAUSES = {"area": "size", "voltage_drop": "current", "power_loss": "current", "current_density": "current",
          "skin_depth": "frequency", "ac_dc_ratio": "frequency", "resistance_ac": "frequency",
          "power_loss_ac": "current"}
CAUTION = ("A physics estimate, not an ampacity rating. Size real installations to the local electrical code and "
           "licensed practice.")


# __pragma__ ('nokwargs')
def ac_ratio(outcome, size, rho, f, mu_r, layers):
    """R_ac/R_dc [-] of one isolated conductor of the size's shape at f [Hz] with resistivity rho
    [ohm*m] and relative permeability mu_r [-], with its method in the outcome (core.ac_layout; layers:
    core.clad_layers.clad_layers_at's list for a clad wire, else None).

    Examples
    --------
    A solid round copper wire, d 20 mm at 50 Hz: the Kelvin ratio Re[(z/2) I0(z)/I1(z)],
    z = (1 + j) a/δ, δ = 9.3458 mm, is 1.0267257 with scipy.special.iv; d 2 mm at 100 kHz 2.6616588:

    >>> from conductor_atlas.core.outcome import new_outcome
    >>> from conductor_atlas.core.geometry import parse_size
    >>> outcome = new_outcome("example", {})
    >>> round(ac_ratio(outcome, parse_size("d 20 mm"), 1.7241e-8, 50.0, 1.0, None), 7)
    1.0267257
    >>> round(ac_ratio(outcome, parse_size("d 2 mm"), 1.7241e-8, 1e5, 1.0, None), 7)
    2.6616588
    >>> outcome["results"]["ac_method"]["text"]
    'exact Kelvin-function solution (isolated round wire)'
    """
    return ac_ratio_for(outcome, size, ["single"], rho, f, mu_r, layers)


def mass_text(mass):
    if mass < 1.0:
        return format_si(mass * 1000.0, "g", 4)
    return format_number(mass, 4) + " kg"


def calculate(inputs, catalogue):
    """DC (and optionally AC) resistance of a conductor run.

    Fields: material; length (conductor length, e.g. "50 m": for a two-wire circuit enter both
    conductors); size (geometry.parse_size); temperature (default 20 °C); current (optional);
    frequency (optional: adds skin depth, AC/DC ratio and AC resistance); model (auto, linear,
    table, bloch-gruneisen, callendar-van-dusen).
    R = ρ(T) L / A; U = I R; P = I² R; J = I / A; R_ac = R · (R_ac/R_dc).
    """
    outcome = new_outcome(NAME, inputs)
    length_m = read_quantity(outcome, inputs, "length", "length", True)
    size = read_size(outcome, inputs, "size")
    require_positive(outcome, "length", length_m, "length")
    opening = material_at_temperature(outcome, inputs, catalogue)
    # the optional fields are read after the opening: a problem in one is shown under it and drops
    # only the results that need it (voltage drop, loss, AC), not the resistance
    current = read_quantity(outcome, inputs, "current", "current", False)
    f = read_quantity(outcome, inputs, "frequency", "frequency", False)
    if current is not None and current < 0:
        add_error(outcome, "current", "must not be negative (enter the magnitude)")
        current = None
    if f is not None and f < 0:
        add_error(outcome, "frequency", "must not be negative")
        f = None
    if opening is None:
        return outcome
    m = opening[0]
    t = opening[1]
    rho = opening[2]
    area = size["area"]
    r = dc.resistance(rho, length_m, area)
    add_result(outcome, "temperature", t, "K", temperature_text(t))
    add_result(outcome, "area", area, "m²", area_text(size, area))
    add_result(outcome, "resistivity", rho, "Ω·m", format_number(rho * 1e8, 5) + " µΩ·cm")
    add_result(outcome, "conductivity", 1.0 / rho, "S/m", format_number(1e-6 / rho, 4) + " MS/m")
    add_result(outcome, "resistance", r, "Ω", format_si(r, "Ω", 4))
    add_result(outcome, "resistance_per_km", r / length_m * 1000.0, "Ω/km",
               format_number(r / length_m * 1000.0, 4) + " Ω/km")
    if m["density"] > 0:
        mass = m["density"] * length_m * area
        add_result(outcome, "mass", mass, "kg", mass_text(mass))
        add_sources(outcome, [m["density_source"]])
    if current is not None:
        u = dc.voltage_drop(r, current)
        add_result(outcome, "voltage_drop", u, "V", format_si(u, "V", 4))
        p = dc.power_loss(r, current)
        add_result(outcome, "power_loss", p, "W", format_si(p, "W", 4))
        j = dc.current_density(current, area)
        add_result(outcome, "current_density", j, "A/m²", format_number(j / 1e6, 4) + " A/mm²")
        warn_if_fusing(outcome, current, area)
    if f is not None and f > 0 and not frequency_beyond_dc_conductivity(outcome, m, rho, f, "frequency"):
        if m["mu_r"] > 1.5:
            add_warning(outcome, "relative permeability of " + m["name"] + " is taken as " + format_number(m["mu_r"], 3)
                        + "; in iron, steel and nickel it depends strongly on field strength and frequency")
        layers = clad_layers_at(outcome, m, t)
        try:
            delta = skin.skin_depth(rho, f, m["mu_r"])
            where = ""
            if layers is not None:
                delta = skin.skin_depth(layers[2], f, layers[3])
                where = " in the " + layers[6] + " cladding"
            ratio = ac_ratio(outcome, size, rho, f, m["mu_r"], layers)
        except CoreError as problem:
            add_error(outcome, "frequency", problem.message)  # the DC results stand
            return outcome
        add_result(outcome, "skin_depth", delta, "m", format_si(delta, "m", 4) + where)
        if len(m["mu_source"]) > 0:
            add_sources(outcome, [m["mu_source"]])
        warn_if_anomalous(outcome, recorded_mean_free_path(m, rho, t)[0], delta)
        add_ratio_result(outcome, ratio)
        add_result(outcome, "resistance_ac", r * ratio, "Ω", format_si(r * ratio, "Ω", 4))
        if current is not None:
            p_ac = dc.power_loss(r * ratio, current)
            add_result(outcome, "power_loss_ac", p_ac, "W", format_si(p_ac, "W", 4))
    check_finite_results(outcome, "length", CAUSES)
    return outcome
# __pragma__ ('kwargs')
