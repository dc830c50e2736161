"""Calculators: text inputs in, results with units and readable text out.

The same functions serve the web forms (through the transpiled JS) and ``conductor-atlas calc``.
Each takes ``inputs`` (field name -> text the person typed) and ``material`` (a flat dict made
by conductor_atlas.derive.calc_material) and returns a dict:

    {"calculator": name, "inputs": {...}, "results": {name: {"value": SI float, "unit": str,
     "text": str}}, "warnings": [str], "errors": {field: message}, "sources": [str]}

A field that cannot be read puts a message under ``errors[field]`` and no results are given;
nothing raises to the caller for bad input.
"""

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.units import parse_quantity
from conductor_atlas.core.geometry import parse_size
from conductor_atlas.core.numfmt import format_si, format_number, format_fixed
from conductor_atlas.core import resistance as dc

CALCULATOR_FIELDS = {
    "resistance": ["length", "size", "temperature", "current"],
}

FIELD_DEFAULTS = {
    "resistance": {"length": "100 m", "size": "2.5 mm2", "temperature": "20 °C", "current": ""},
}


def new_outcome(name, inputs, material):
    """An empty outcome record for calculator ``name``."""
    copied = {}
    for key in inputs.keys():
        copied[key] = inputs[key]
    sources = []
    if "sources" in material:
        for s in material["sources"]:
            sources.append(s)
    return {
        "calculator": name,
        "material": material["id"],
        "inputs": copied,
        "results": {},
        "warnings": [],
        "errors": {},
        "sources": sources,
    }


def add_result(outcome, name, value, unit, text):
    """Store one result (SI value, SI unit symbol, text a person reads)."""
    outcome["results"][name] = {"value": value, "unit": unit, "text": text}


def field_text(inputs, field):
    """The text typed in ``field``, or "" when the field is absent."""
    if field in inputs:
        value = inputs[field]
        if value is None:
            return ""
        return str(value).strip()
    return ""


def read_field(outcome, inputs, field, kind, required):
    """Parse one field; on failure record the message under errors[field] and return None."""
    text = field_text(inputs, field)
    if len(text) == 0 and not required:
        return None
    try:
        return parse_quantity(text, kind, field)
    except CoreError as problem:
        outcome["errors"][field] = problem.message
        return None


def kelvin_text(t):
    """A temperature in K as text a person reads: "90 °C (363.15 K)"."""
    return format_fixed(t - 273.15, 1) + " °C (" + format_fixed(t, 2) + " K)"


def temperature_warnings(material, t):
    """Warnings when T lies outside the span where the material's linear model holds."""
    warnings = []
    low = material["valid_from"]
    high = material["valid_to"]
    if t < low or t > high:
        warnings.append(
            "temperature " + kelvin_text(t) + " is outside the span where the linear model holds for "
            + material["name"] + " (" + kelvin_text(low) + " to " + kelvin_text(high) + ")")
    return warnings


def calculate_resistance(inputs, material):
    """DC resistance of a conductor run, with voltage drop and I²R loss at a current.

    Fields: length (conductor length, e.g. "50 m"; for a two-wire circuit enter the length of
    both conductors), size (see geometry.parse_size), temperature (default 20 °C),
    current (optional). Model: linear ρ(T) around the material's reference temperature.
    """
    outcome = new_outcome("resistance", inputs, material)
    length_m = read_field(outcome, inputs, "length", "length", True)
    size = None
    try:
        size = parse_size(field_text(inputs, "size"), "size")
    except CoreError as problem:
        outcome["errors"]["size"] = problem.message
    temperature = read_field(outcome, inputs, "temperature", "temperature", False)
    if temperature is None and not ("temperature" in outcome["errors"]):
        temperature = 293.15
    current = read_field(outcome, inputs, "current", "current", False)
    if length_m is not None and not (length_m > 0):
        outcome["errors"]["length"] = "must be greater than zero"
    if temperature is not None and not (temperature > 0):
        outcome["errors"]["temperature"] = "must be above absolute zero (−273.15 °C)"
    if current is not None and current < 0:
        outcome["errors"]["current"] = "must not be negative (enter the magnitude)"
    if len(outcome["errors"].keys()) > 0:
        return outcome
    try:
        rho = dc.resistivity_linear(temperature, material["rho_ref"], material["alpha"], material["t_ref"])
    except CoreError as problem:
        outcome["errors"]["temperature"] = problem.message
        return outcome
    area = size["area"]
    r = dc.resistance(rho, length_m, area)
    if not (r - r == 0):
        outcome["errors"]["length"] = "the result is too large to compute; check length and size"
        return outcome
    for w in temperature_warnings(material, temperature):
        outcome["warnings"].append(w)
    add_result(outcome, "temperature", temperature, "K", kelvin_text(temperature))
    add_result(outcome, "area", area, "m²", format_number(area * 1e6, 4) + " mm²")
    add_result(outcome, "resistivity", rho, "Ω·m", format_number(rho * 1e8, 5) + " µΩ·cm")
    add_result(outcome, "resistance", r, "Ω", format_si(r, "Ω", 4))
    add_result(outcome, "resistance_per_km", r / length_m * 1000.0, "Ω/km",
               format_number(r / length_m * 1000.0, 4) + " Ω/km")
    if material["density"] > 0:
        mass = material["density"] * length_m * area
        mass_text = format_number(mass, 4) + " kg"
        if mass < 1.0:
            mass_text = format_si(mass * 1000.0, "g", 4)
        add_result(outcome, "mass", mass, "kg", mass_text)
    if current is not None:
        add_result(outcome, "voltage_drop", dc.voltage_drop(r, current), "V",
                   format_si(dc.voltage_drop(r, current), "V", 4))
        add_result(outcome, "power_loss", dc.power_loss(r, current), "W",
                   format_si(dc.power_loss(r, current), "W", 4))
        j = dc.current_density(current, area)
        add_result(outcome, "current_density", j, "A/m²", format_number(j / 1e6, 4) + " A/mm²")
    return outcome


CALCULATORS = {
    "resistance": calculate_resistance,
}


def calculate(name, inputs, material):
    """Run calculator ``name``; an unknown name is reported under errors["calculator"]."""
    if not (name in CALCULATORS):
        outcome = new_outcome(name, inputs, material)
        outcome["errors"]["calculator"] = "unknown calculator “" + name + "”"
        return outcome
    return CALCULATORS[name](inputs, material)
