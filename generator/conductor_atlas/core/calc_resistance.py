"""Calculator "resistance": a conductor run's resistance, voltage drop, I²R loss and AC resistance."""

from conductor_atlas.core import resistance as dc
from conductor_atlas.core.numfmt import format_number, format_si, temperature_text
from conductor_atlas.core.outcome import (add_error, add_result, add_sources, add_warning, check_finite_results,
                                          new_outcome)
from conductor_atlas.core.geometry import area_text
from conductor_atlas.core.calc_inputs import field_text, read_quantity, read_size, require_positive
from conductor_atlas.core.calc_common import frequency_beyond_dc_conductivity, material_at_temperature, warn_if_fusing
from conductor_atlas.core.material_models import MODEL_FIELD_INFO
from conductor_atlas.core.ac_part import mark_pending, part_function
# The frequency results live in the AC part (core.ac_part), which registers them when imported. CPython
# imports it here, so the terminal and the tables always have it; the transpiler skips the import, and
# a material page loads the part (static/calc-ac.js) when a frequency is first typed.
# __pragma__ ('skip')
import conductor_atlas.core.calc_resistance_ac  # noqa: F401,E402  (registers "resistance-ac")
# __pragma__ ('noskip')

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
        add_ac_results = part_function("resistance-ac")
        if add_ac_results is None:
            mark_pending(outcome)  # the page loads the AC part and runs this update again
        elif not add_ac_results(outcome, m, t, rho, f, size, r, current):
            return outcome  # the frequency's message is under its field; the DC results stand
    check_finite_results(outcome, "length", CAUSES)
    return outcome


def needs_live_solver(inputs, catalogue):
    """True when calculate(inputs, catalogue) would run the live filament solver (a bar size with a
    frequency; core.ac_layout.needs_live_solver decides), so a page can wait for a pause in typing
    before it runs. False while the AC part is not loaded (the update then solves nothing).
    The fields are read in the order that leaves most keystrokes after one or two cheap checks.

    Examples
    --------
    >>> catalogue = {"materials": {}, "aliases": {}}
    >>> needs_live_solver({"material": "copper", "length": "1 m", "size": "100 x 10 mm", "frequency": ""}, catalogue)
    False
    """
    live_solver_for = part_function("resistance-live-solver")
    if live_solver_for is None or len(field_text(inputs, "frequency")) == 0:
        return False  # no AC part, or no frequency: most keystrokes stop here, before any record is made
    scratch = new_outcome(NAME, inputs)
    f = read_quantity(scratch, inputs, "frequency", "frequency", False)
    if f is None or not (f > 0):
        return False
    size = read_size(scratch, inputs, "size")
    if size is None or size["shape"] != "bar":
        return False
    length_m = read_quantity(scratch, inputs, "length", "length", True)
    require_positive(scratch, "length", length_m, "length")
    opening = material_at_temperature(scratch, inputs, catalogue)
    if opening is None or frequency_beyond_dc_conductivity(scratch, opening[0], opening[2], f, "frequency"):
        return False
    return live_solver_for(opening[0], opening[1], opening[2], f, size)
# __pragma__ ('kwargs')
