"""Calculator "sizing": the smallest cross-section that keeps the voltage drop within a limit."""

import math

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core import practice
from conductor_atlas.core.resistance import current_density
from conductor_atlas.core.geometry import awg_area, awg_name, next_awg, next_metric_size
from conductor_atlas.core.text_match import name_key
from conductor_atlas.core.numfmt import format_number, format_si, temperature_text
from conductor_atlas.core.outcome import (has_keys, add_error, add_result, add_warning, check_finite_results, has_errors,
                                          new_outcome)
from conductor_atlas.core.calc_inputs import field_text, read_quantity, require_positive
from conductor_atlas.core.calc_common import material_at_temperature, warn_if_fusing
from conductor_atlas.core.typed_text import parse_number, normalise_text
from conductor_atlas.core.units import parse_quantity
from conductor_atlas.core.material_models import MODEL_FIELD_INFO

NAME = "sizing"
TITLE = "Conductor size for a voltage-drop limit"
SUMMARY = "Smallest cross-section, and the next metric and AWG size, that keep the voltage drop within a limit."
FIELDS = ["material", "length", "current", "max_drop", "supply", "conductors", "temperature", "model"]
DEFAULTS = {"material": "IACS", "length": "30 m", "current": "16 A", "max_drop": "3 %", "supply": "230 V",
            "conductors": "2", "temperature": "70 °C", "model": "auto"}
FIELD_INFO = {
    "material": ["Material", "id, alias or symbol, e.g. IACS, 1350"],
    "length": ["Route length (one way)", "e.g. 30 m, 100 ft: the distance from supply to load"],
    "current": ["Current", "e.g. 16 A"],
    "max_drop": ["Allowed voltage drop", "a voltage (e.g. 6.9 V) or a percentage of the supply (e.g. 3 %)"],
    "supply": ["Supply voltage", "e.g. 230 V, 400 V, 24 V: needed with a percentage"],
    "conductors": ["Circuit", "2: two-wire DC or single-phase (out and back); 1: the length is already the whole "
                              "conductor; 3-phase: balanced three-phase, line-to-line drop (√3)"],
    "temperature": ["Conductor temperature", "the operating temperature at full load, e.g. 70 °C"],
    "model": MODEL_FIELD_INFO,
}
RESULT_LABELS = [
    ["min_area", "Minimum cross-section"], ["next_metric_size", "Next metric size (IEC 60228)"],
    ["next_awg", "Next AWG size (ASTM B258, solid)"], ["resistance", "Resistance at the metric size"],
    ["voltage_drop", "Voltage drop at the metric size"], ["voltage_drop_percent", "Voltage drop at the metric size, %"],
    ["power_loss", "I²R loss at the metric size"], ["voltage_drop_awg", "Voltage drop at the AWG size"],
    ["max_drop", "Allowed voltage drop"], ["resistivity", "Resistivity at temperature"],
    ["temperature", "Temperature"],
]
# optional input -> the results that need it: a problem in that field is shown under it and drops only these
SIDE_FIELDS = {"supply": ["voltage_drop_percent"]}
CAUTION = ("Sizes for voltage drop only: not for current rating (ampacity and heating), short-circuit withstand or "
           "mechanical strength, which often need a larger size. Resistive drop only (no reactance). Installations "
           "follow the local electrical code and licensed practice.")
SAFETY = ("sized for voltage drop only, not for current rating (ampacity, heating), short-circuit withstand or "
          "mechanical strength; installations follow the local electrical code and licensed practice")

# [A/m²] a current density at the metric size above this is questioned: above what installed building
# wiring carries (1.5 mm² copper in PVC, reference method C: 19.5 A, 13 A/mm², IEC 60364-5-52 Table
# B.52.4, from memory; larger sizes carry less per mm²). The threshold itself is ours (no source).
DENSITY_CAUTION = 15e6
DENSITY_NOTE = ("is above what installed building wiring carries (about 13 A/mm² for 1.5 mm² copper in PVC, "
                "IEC 60364-5-52 Table B.52.4, from memory; larger sizes carry less): the size that meets the drop "
                "is likely too small for the current; check it against a current-rating table for the cable and "
                "its installation")

THREE_PHASE = ["3-phase", "3 phase", "3phase", "3ph", "3~", "three-phase", "three phase", "3-phase ac"]
TWO_WIRE = ["2", "2-wire", "2 wire", "two-wire", "dc", "single-phase", "single phase", "1-phase", "1 phase"]
ONE_WIRE = ["1", "1-wire", "total"]


# __pragma__ ('nokwargs')
def read_conductors(outcome, inputs):
    """The circuit of the "conductors" field, or None with errors["conductors"] set.

    [drop factor, description, conductors in the resistance shown, conductors carrying I²R]:
    two-wire [2, .., 2, 2]; whole length [1, .., 1, 1]; balanced three-phase [√3, .., 1, 3]
    (line-to-line drop √3 I R of one phase conductor; three conductors dissipate).
    """
    text = name_key(field_text(inputs, "conductors"))
    if len(text) == 0:
        text = "2"
    for name in THREE_PHASE:
        if text == name:
            return [math.sqrt(3.0), "balanced three-phase, line-to-line drop (factor √3)", 1.0, 3.0]
    for name in TWO_WIRE:
        if text == name:
            return [2.0, "two conductors, out and back", 2.0, 2.0]
    for name in ONE_WIRE:
        if text == name:
            return [1.0, "the length is the whole conductor", 1.0, 1.0]
    if text == "3":
        add_error(outcome, "conductors", "“3” is ambiguous: for a balanced three-phase circuit enter 3-phase; "
                                         "otherwise 1 or 2")
        return None
    add_error(outcome, "conductors", "choose 2 (two-wire DC or single-phase), 1 (length is the whole conductor) or "
                                     "3-phase; found “" + field_text(inputs, "conductors") + "”")
    return None


def read_max_drop(outcome, inputs, supply, supply_problem):
    """The allowed drop [V] from "3 V" or "3 %" (with the supply); None with errors set. A percentage
    with no usable supply puts ``supply_problem`` (or "is empty") under the supply field."""
    text = field_text(inputs, "max_drop")
    if len(text) == 0:
        add_error(outcome, "max_drop", "is empty: enter a voltage (e.g. 6.9 V) or a percentage of the supply "
                                       "(e.g. 3 %)")
        return None
    try:
        parts = parse_number(normalise_text(text), "max_drop")
        unit = parts[1].strip()
        if len(unit) == 0:
            raise CoreError("needs a unit: a voltage (e.g. 6.9 V) or a percentage of the supply (e.g. 3 %)",
                            "max_drop")
        if unit == "%" or unit.lower() == "percent" or unit.lower() == "pct":
            fraction = parts[0] / 100.0
            if not (fraction > 0 and fraction < 1.0):
                raise CoreError("a percentage must be above 0 % and below 100 %", "max_drop")
            if supply is None:
                if len(supply_problem) > 0:
                    add_error(outcome, "supply", supply_problem)
                else:
                    add_error(outcome, "supply", "is empty: a percentage drop needs the supply voltage (e.g. 230 V)")
                return None
            return fraction * supply
        drop = parse_quantity(text, "voltage", "max_drop")
    except CoreError as problem:
        message = problem.message
        if message.find("unknown unit") == 0:
            message = "unknown unit “" + unit + "”: enter a voltage (e.g. 6.9 V, 500 mV) or a percentage of the " \
                "supply (e.g. 3 %)"
        add_error(outcome, "max_drop", message)
        return None
    if not (drop > 0):
        add_error(outcome, "max_drop", "must be greater than zero")
        return None
    if supply is not None and not (drop < supply):
        add_error(outcome, "max_drop", "must be below the supply voltage (" + format_si(supply, "V", 4) + ")")
        return None
    return drop


def calculate(inputs, catalogue):
    """Minimum cross-section for a voltage-drop limit, and the next standard sizes.

    Fields: material; length (one-way route length L); current I; max_drop (a voltage, or a
    percentage of the supply); supply (voltage, needed with a percentage); conductors (2, 1 or
    3-phase: factor 2, 1 or √3); temperature (operating, default 20 °C if empty); model.
    A_min = factor · ρ(T) · L · I / ΔU_max (core.practice); the next IEC 60228 and AWG sizes at
    or above A_min (core.geometry); at the metric size: R = factor_R ρ L / A, ΔU = factor ρ L I / A.
    """
    outcome = new_outcome(NAME, inputs)
    route = read_quantity(outcome, inputs, "length", "length", True)
    require_positive(outcome, "length", route, "the route length")
    current = read_quantity(outcome, inputs, "current", "current", True)
    require_positive(outcome, "current", current, "the current")
    # the supply is needed only with a percentage drop: with a voltage, a problem in it is shown under it
    # and drops only the drop in percent (SIDE_FIELDS)
    read_supply = new_outcome(NAME, inputs)
    supply = read_quantity(read_supply, inputs, "supply", "voltage", False)
    if supply is not None and not (supply > 0):
        add_error(read_supply, "supply", "must be greater than zero")
        supply = None
    supply_problem = ""
    if "supply" in read_supply["errors"]:
        supply_problem = read_supply["errors"]["supply"]
    drop = read_max_drop(outcome, inputs, supply, supply_problem)
    circuit = read_conductors(outcome, inputs)
    opening = material_at_temperature(outcome, inputs, catalogue)
    if len(supply_problem) > 0:
        add_error(outcome, "supply", supply_problem)
    if opening is None:
        return outcome
    t = opening[1]
    rho = opening[2]
    factor = circuit[0]
    try:
        a_min = practice.voltage_drop_min_area(rho, current, route, drop, factor)
    except CoreError as problem:
        add_error(outcome, "length", problem.message)
        return outcome
    if not (a_min > 0) or not (a_min - a_min == 0):
        add_error(outcome, "length", "the inputs are too extreme to compute a finite cross-section; check the values")
        return outcome
    add_result(outcome, "temperature", t, "K", temperature_text(t))
    add_result(outcome, "resistivity", rho, "Ω·m", format_number(rho * 1e8, 5) + " µΩ·cm")
    drop_text = format_si(drop, "V", 4)
    if supply is not None:
        drop_text = drop_text + " (" + format_number(100.0 * drop / supply, 3) + " % of " + format_si(supply, "V", 4) \
            + ")"
    add_result(outcome, "max_drop", drop, "V", drop_text)
    add_result(outcome, "min_area", a_min, "m²", format_number(a_min * 1e6, 4) + " mm²")
    metric = next_metric_size(a_min)
    if metric > 0:
        area = metric / 1e6
        r = circuit[2] * rho * route / area
        u = factor * rho * route * current / area
        p = circuit[3] * current * current * rho * route / area
        add_result(outcome, "next_metric_size", area, "m²", format_number(metric, 4) + " mm²")
        r_text = format_si(r, "Ω", 4)
        if circuit[3] > circuit[2]:
            r_text = r_text + " per phase conductor"
        elif circuit[2] > 1.5:
            r_text = r_text + " out and back"
        add_result(outcome, "resistance", r, "Ω", r_text)
        u_text = format_si(u, "V", 4)
        if supply is not None:
            add_result(outcome, "voltage_drop_percent", 100.0 * u / supply, "%",
                       format_number(100.0 * u / supply, 3) + " %")
        add_result(outcome, "voltage_drop", u, "V", u_text)
        add_result(outcome, "power_loss", p, "W", format_si(p, "W", 4))
        density = current_density(current, area)
        if density > DENSITY_CAUTION:
            add_warning(outcome, "the current density at the metric size, " + format_number(density / 1e6, 3)
                        + " A/mm², " + DENSITY_NOTE)
        warn_if_fusing(outcome, current, area)
    else:
        add_warning(outcome, "the minimum cross-section exceeds the largest IEC 60228 size (2500 mm²): split the run "
                             "into parallel conductors or allow more drop")
    gauge = next_awg(a_min)
    if gauge > -99:
        a_awg = awg_area(gauge)
        add_result(outcome, "next_awg", a_awg, "m²", awg_name(gauge) + " AWG (" + format_number(a_awg * 1e6, 4)
                   + " mm²)")
        u_awg = factor * rho * route * current / a_awg
        add_result(outcome, "voltage_drop_awg", u_awg, "V", format_si(u_awg, "V", 4))
        warn_if_fusing(outcome, current, a_awg)
    else:
        add_warning(outcome, "the minimum cross-section exceeds 4/0 AWG: use kcmil sizes or parallel conductors")
    add_warning(outcome, "circuit: " + circuit[1] + "; resistive drop only (reactance and power factor not "
                                                   "included)")
    add_warning(outcome, SAFETY)
    check_finite_results(outcome, "length")
    if not has_keys(outcome["results"]):
        outcome["warnings"] = []
    return outcome
# __pragma__ ('kwargs')
