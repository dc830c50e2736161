"""Calculator "compare": two materials at equal resistance (area, diameter and mass ratios)."""

from conductor_atlas.core import practice
from conductor_atlas.core.geometry import awg_area, awg_name, diameter_from_area, next_awg, next_metric_size
from conductor_atlas.core.numfmt import format_number, temperature_text
from conductor_atlas.core.outcome import add_result, add_sources, add_warning, check_finite_results, new_outcome
from conductor_atlas.core.calc_inputs import field_text, read_material, read_size, read_temperature
from conductor_atlas.core.calc_common import material_resistivity, resistivity_when_ready
from conductor_atlas.core.calc_resistance import mass_text
from conductor_atlas.core.material_models import MODEL_FIELD_INFO

NAME = "compare"
TITLE = "Compare two materials at equal resistance"
SUMMARY = "Cross-section, diameter and mass another material needs to match a conductor's resistance."
FIELDS = ["material", "other", "size", "temperature", "model"]
DEFAULTS = {"material": "IACS", "other": "1350", "size": "", "temperature": "20 °C", "model": "auto"}
FIELD_INFO = {
    "material": ["Reference material", "id, alias or symbol, e.g. IACS, Cu"],
    "other": ["Other material", "id, alias or symbol, e.g. 1350, CCA-10, 6201"],
    "size": ["Size of the reference conductor (optional)", "e.g. 35 mm², 4/0 AWG, d 2 mm, 40 x 5 mm: adds the "
                                                           "other material's equal-resistance size (for a bar also "
                                                           "its width at the same thickness)"],
    "temperature": ["Temperature of both", "e.g. 20 °C, 90 degC"],
    "model": MODEL_FIELD_INFO,
}
RESULT_LABELS = [
    ["area_ratio", "Area ratio A2/A1 (equal resistance)"], ["diameter_ratio", "Diameter ratio d2/d1"],
    ["mass_ratio", "Mass ratio m2/m1 (equal resistance)"],
    ["conductivity_per_mass_ratio", "Conductivity per mass, other over reference"],
    ["conductivity_ratio", "Conductivity ratio σ2/σ1"],
    ["resistivity", "Resistivity of the reference"], ["resistivity_other", "Resistivity of the other"],
    ["area", "Reference cross-section"], ["area_other", "Equal-resistance cross-section of the other"],
    ["diameter_other", "Equal-resistance diameter of the other (round)"],
    ["bar_width_other", "Equal-resistance bar of the other: its width at the same thickness (DC)"],
    ["next_metric_size", "Next metric size of the other (IEC 60228)"],
    ["next_awg", "Next AWG size of the other (ASTM B258, solid)"],
    ["mass_per_metre", "Mass per metre, reference"], ["mass_per_metre_other", "Mass per metre, other"],
    ["temperature", "Temperature"],
]
# optional input -> the results that need it (the ratios do not depend on the size)
SIDE_FIELDS = {"size": ["area", "area_other", "diameter_other", "bar_width_other", "next_metric_size", "next_awg",
                        "mass_per_metre", "mass_per_metre_other"]}
CAUTION = ("Equal resistance at equal length and temperature only: current rating, terminations, strength and "
           "creep differ between materials. Size real installations to the local electrical code and licensed "
           "practice.")


# __pragma__ ('nokwargs')
def calculate(inputs, catalogue):
    """Equal-resistance comparison of a reference material and another one.

    Fields: material (reference, 1); other (2); size (optional, the reference conductor's size);
    temperature (both, default 20 °C); model (for both).
    A2/A1 = ρ2/ρ1; d2/d1 = sqrt(ρ2/ρ1); m2/m1 = (ρ2 δ2)/(ρ1 δ1) (core.practice); conductivity
    per mass (σ/δ) other over reference = 1 / (m2/m1). With a size: A2 = A1 · ρ2/ρ1 and the next
    IEC 60228 and AWG sizes at or above it (core.geometry). A bar (w x t): also the other material's
    bar of the same thickness and the same DC resistance per length, w2 = w1 · ρ2/ρ1 (equal-resistance
    width; at AC the two bars' AC/DC ratios differ, which the skin-effect calculator gives per bar).
    """
    outcome = new_outcome(NAME, inputs)
    m1 = read_material(outcome, inputs, catalogue, "material")
    m2 = read_material(outcome, inputs, catalogue, "other")
    t = read_temperature(outcome, inputs, "temperature")
    rho1 = resistivity_when_ready(outcome, m1, t, inputs)
    # read after the materials: a bad size is shown under its field and drops only the size results
    size = None
    if len(field_text(inputs, "size")) > 0:
        size = read_size(outcome, inputs, "size")
    if rho1 is None:
        return outcome
    label1 = outcome["model"]
    rho2 = material_resistivity(outcome, m2, t, inputs)
    if rho2 is None:
        return outcome
    outcome["model"] = m1["name"] + ": " + label1 + "; " + m2["name"] + ": " + outcome["model"]
    if m1["id"] == m2["id"]:
        add_warning(outcome, "both fields name the same material, " + m1["name"])
    area_ratio = practice.equal_resistance_area_ratio(rho1, rho2)
    add_result(outcome, "temperature", t, "K", temperature_text(t))
    add_result(outcome, "resistivity", rho1, "Ω·m", format_number(rho1 * 1e8, 5) + " µΩ·cm")
    add_result(outcome, "resistivity_other", rho2, "Ω·m", format_number(rho2 * 1e8, 5) + " µΩ·cm")
    add_result(outcome, "conductivity_ratio", rho1 / rho2, "", format_number(rho1 / rho2, 4) + " ("
               + format_number(100.0 * rho1 / rho2, 4) + " %)")
    add_result(outcome, "area_ratio", area_ratio, "", format_number(area_ratio, 4))
    add_result(outcome, "diameter_ratio", practice.equal_resistance_diameter_ratio(rho1, rho2), "",
               format_number(practice.equal_resistance_diameter_ratio(rho1, rho2), 4))
    with_mass = m1["density"] > 0 and m2["density"] > 0
    if with_mass:
        mass_ratio = practice.equal_resistance_mass_ratio(rho1, m1["density"], rho2, m2["density"])
        add_result(outcome, "mass_ratio", mass_ratio, "", format_number(mass_ratio, 4))
        add_result(outcome, "conductivity_per_mass_ratio", 1.0 / mass_ratio, "", format_number(1.0 / mass_ratio, 4))
        add_sources(outcome, [m1["density_source"], m2["density_source"]])
    else:
        missing = m1["name"]
        if m1["density"] > 0:
            missing = m2["name"]
        add_warning(outcome, "no density is on record for " + missing + ", so the mass comparison is left out")
    if size is not None:
        a1 = size["area"]
        a2 = a1 * area_ratio
        add_result(outcome, "area", a1, "m²", format_number(a1 * 1e6, 4) + " mm² (" + size["label"] + ")")
        add_result(outcome, "area_other", a2, "m²", format_number(a2 * 1e6, 4) + " mm²")
        d2 = diameter_from_area(a2)
        add_result(outcome, "diameter_other", d2, "m", format_number(d2 * 1000.0, 4) + " mm")
        if size["shape"] == "bar":
            add_bar_width(outcome, size, area_ratio)
        else:
            add_standard_sizes(outcome, a2)
        if with_mass:
            add_result(outcome, "mass_per_metre", m1["density"] * a1, "kg/m", mass_text(m1["density"] * a1)
                       + " per metre")
            add_result(outcome, "mass_per_metre_other", m2["density"] * a2, "kg/m", mass_text(m2["density"] * a2)
                       + " per metre")
    check_finite_results(outcome, "size")
    return outcome


def add_standard_sizes(outcome, area):
    """The IEC 60228 and AWG (ASTM B258) sizes at or above ``area`` [m^2], for a round or area size
    (a bar is answered by its equal-resistance width instead: cable sizes do not apply to it).
    57.4 mm² (35 mm² copper as 1350 aluminium) lies between IEC 60228's 50 and 70 mm² and between
    ASTM B258's 1/0 (0.3249 in, 53.49 mm²) and 2/0 (0.3648 in, 67.43 mm²):

    >>> out = new_outcome("compare", {})
    >>> add_standard_sizes(out, 57.4e-6)
    >>> out["results"]["next_metric_size"]["text"], out["results"]["next_awg"]["text"]
    ('70 mm²', '2/0 AWG (67.43 mm²)')
    """
    metric = next_metric_size(area)
    if metric > 0:
        add_result(outcome, "next_metric_size", metric / 1e6, "m²", format_number(metric, 4) + " mm²")
    else:
        add_warning(outcome, "the other material needs more than the largest IEC 60228 size (2500 mm²): use "
                             "parallel conductors")
    gauge = next_awg(area)
    if gauge > -99:
        add_result(outcome, "next_awg", awg_area(gauge), "m²", awg_name(gauge) + " AWG ("
                   + format_number(awg_area(gauge) * 1e6, 4) + " mm²)")
    else:
        add_warning(outcome, "the other material needs more than 4/0 AWG: use kcmil sizes or parallel conductors")
    add_warning(outcome, "standard sizes are nominal areas: a stranded conductor's resistance is set by its "
                         "standard's maximum resistance, so check the chosen size against that table")


def add_bar_width(outcome, size, area_ratio):
    """The other material's bar of the reference bar's thickness at equal DC resistance per length:
    R' = ρ/(w t) is equal when w2 = w1 · ρ2/ρ1 [m] (t unchanged); area_ratio = ρ2/ρ1 [-].

    Examples
    --------
    100 x 10 mm copper (IEC 60028, 0.017241 ohm*mm^2/m) against 1350 aluminium (IEC 60889,
    0.028264 ohm*mm^2/m): 100 mm · 0.028264 / 0.017241 = 163.93 mm by hand:

    >>> from conductor_atlas.core.outcome import new_outcome
    >>> from conductor_atlas.core.geometry import parse_size
    >>> outcome = new_outcome("example", {})
    >>> add_bar_width(outcome, parse_size("100 x 10 mm"), 0.028264 / 0.017241)
    >>> outcome["results"]["bar_width_other"]["text"]
    '163.9 mm'
    """
    w2 = size["width"] * area_ratio
    add_result(outcome, "bar_width_other", w2, "m", format_number(w2 * 1000.0, 4) + " mm")
    add_warning(outcome, "the equal-resistance bar matches at DC only: at AC a bar's resistance rises by its own "
                         "AC/DC ratio, which differs between the two bars (their widths and resistivities differ); "
                         "the skin-effect calculator gives it for each bar at your frequency")
# __pragma__ ('kwargs')
