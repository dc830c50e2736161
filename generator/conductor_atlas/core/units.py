"""Parse the text a person types into a form field ("2.5 mm", "90 °C", "4/0 AWG") into SI floats.

One table, ``UNITS``, maps each accepted spelling (after ``normalise_unit``) to its kind, its
factor to the SI unit, and an offset (temperatures only: SI = value * factor + offset).
tests/core/test_units.py checks every entry against pint. Conductor sizes (AWG, diameter,
bar "w x t") are parsed in ``conductor_atlas.core.geometry``.
"""

import re

from conductor_atlas.core.errors import CoreError

# kind -> SI unit symbol shown in messages and results
SI_UNIT = {
    "length": "m",
    "area": "m²",
    "temperature": "K",
    "current": "A",
    "frequency": "Hz",
    "voltage": "V",
    "resistance": "Ω",
    "resistivity": "Ω·m",
    "power": "W",
    "current_density": "A/m²",
    "mass": "kg",
    "density": "kg/m³",
    "ratio": "",
    "temperature_coefficient": "1/K",
    "thermal_conductivity": "W/(m·K)",
}

# normalised spelling -> [kind, factor, offset]; offset only for temperatures
UNITS = {
    # length
    "m": ["length", 1.0, 0.0],
    "km": ["length", 1000.0, 0.0],
    "cm": ["length", 0.01, 0.0],
    "mm": ["length", 0.001, 0.0],
    "um": ["length", 1e-6, 0.0],
    "nm": ["length", 1e-9, 0.0],
    "ft": ["length", 0.3048, 0.0],
    "in": ["length", 0.0254, 0.0],
    "mil": ["length", 2.54e-5, 0.0],
    # area
    "m2": ["area", 1.0, 0.0],
    "cm2": ["area", 1e-4, 0.0],
    "mm2": ["area", 1e-6, 0.0],
    "um2": ["area", 1e-12, 0.0],
    "in2": ["area", 0.00064516, 0.0],
    "ft2": ["area", 0.09290304, 0.0],
    # 1 circular mil = (pi/4) * (1 mil)^2 = (pi/4) * 6.4516e-10 m^2
    "cmil": ["area", 5.067074790974977e-10, 0.0],
    "kcmil": ["area", 5.067074790974977e-07, 0.0],
    "mcm": ["area", 5.067074790974977e-07, 0.0],
    # temperature
    "k": ["temperature", 1.0, 0.0],
    "degc": ["temperature", 1.0, 273.15],
    "c": ["temperature", 1.0, 273.15],
    "degf": ["temperature", 5.0 / 9.0, 273.15 - 32.0 * 5.0 / 9.0],
    "f": ["temperature", 5.0 / 9.0, 273.15 - 32.0 * 5.0 / 9.0],
    # current
    "a": ["current", 1.0, 0.0],
    "ma": ["current", 0.001, 0.0],
    "ka": ["current", 1000.0, 0.0],
    # frequency
    "hz": ["frequency", 1.0, 0.0],
    "khz": ["frequency", 1e3, 0.0],
    "mhz": ["frequency", 1e6, 0.0],
    "ghz": ["frequency", 1e9, 0.0],
    # voltage
    "v": ["voltage", 1.0, 0.0],
    "mv": ["voltage", 0.001, 0.0],
    "kv": ["voltage", 1000.0, 0.0],
    # resistance
    "ohm": ["resistance", 1.0, 0.0],
    "mohm": ["resistance", 0.001, 0.0],
    "uohm": ["resistance", 1e-6, 0.0],
    "kohm": ["resistance", 1000.0, 0.0],
    # resistivity
    "ohm*m": ["resistivity", 1.0, 0.0],
    "nohm*m": ["resistivity", 1e-9, 0.0],
    "uohm*cm": ["resistivity", 1e-8, 0.0],
    "uohm*m": ["resistivity", 1e-6, 0.0],
    "ohm*mm2/m": ["resistivity", 1e-6, 0.0],
    # power
    "w": ["power", 1.0, 0.0],
    "mw": ["power", 0.001, 0.0],
    "kw": ["power", 1000.0, 0.0],
    # current density
    "a/m2": ["current_density", 1.0, 0.0],
    "a/mm2": ["current_density", 1e6, 0.0],
    "a/cm2": ["current_density", 1e4, 0.0],
    # density (search filters such as "density < 3 g/cm3")
    "kg/m3": ["density", 1.0, 0.0],
    "g/cm3": ["density", 1000.0, 0.0],
    # temperature coefficient of resistance ("alpha > 0.004 1/K"); a kelvin step equals a degC step
    "1/k": ["temperature_coefficient", 1.0, 0.0],
    "1/degc": ["temperature_coefficient", 1.0, 0.0],
    "ppm/k": ["temperature_coefficient", 1e-6, 0.0],
    # thermal conductivity ("thermal conductivity > 300 W/(m·K)")
    "w/(m*k)": ["thermal_conductivity", 1.0, 0.0],
    "w/m/k": ["thermal_conductivity", 1.0, 0.0],
    # plain ratios
    "%": ["ratio", 0.01, 0.0],
}

# Case matters for a few prefixes (mA vs MA does not arise, but mHz vs MHz, mohm vs Mohm do);
# these spellings are matched case-sensitively before the case-insensitive table above.
CASE_SENSITIVE = {
    "MHz": "mhz",
    "mHz": "millihertz",
    "MW": "megawatt",
    "Mohm": "megaohm",
    "MA": "megaampere",
    "MV": "megavolt",
    "Mm": "megametre",
}

NUMBER_PATTERN = re.compile(r"^([+-]?(?:[0-9]+(?:[.,][0-9]*)?|[.,][0-9]+)(?:[eE][+-]?[0-9]+)?)\s*(.*)$")

KIND_WORDS = {
    "length": "a length (e.g. 25 m, 2.5 mm, 100 ft)",
    "area": "a cross-section (e.g. 35 mm², 250 kcmil)",
    "temperature": "a temperature (e.g. 20 °C, 293.15 K, 68 °F)",
    "current": "a current (e.g. 16 A, 250 mA)",
    "frequency": "a frequency (e.g. 50 Hz, 1 MHz)",
    "voltage": "a voltage (e.g. 230 V)",
    "resistance": "a resistance (e.g. 12.5 mΩ, 0.8 ohm)",
    "resistivity": "a resistivity (e.g. 1.72 µΩ·cm, 1.72e-8 Ω·m)",
    "power": "a power (e.g. 10 W)",
    "current_density": "a current density (e.g. 4 A/mm²)",
    "ratio": "a ratio (e.g. 3 % or 0.03)",
    "density": "a density (e.g. 8.9 g/cm³, 2700 kg/m³)",
    "temperature_coefficient": "a temperature coefficient (e.g. 0.0039 1/K, 3900 ppm/K)",
    "thermal_conductivity": "a thermal conductivity (e.g. 400 W/(m·K))",
}


# Characters CPython's str.strip() and JS's String.trim() treat differently (C0/C1 controls such
# as \x1c-\x1f and \x85 are whitespace only to Python, U+FEFF only to JS): dropped before any strip
UNPORTABLE_CHARACTERS = r"[\x00-\x08\x0b\x0c\x0e-\x1f\x7f-\x9f\ufeff]"
# Patterns are compiled once: Transcrypt's re translates a pattern to JS on every uncompiled call,
# which was most of a calculator update in the browser.
UNPORTABLE_PATTERN = re.compile(UNPORTABLE_CHARACTERS)
LINE_BREAKS = re.compile(r"[\n\r\u2028\u2029]")
SPACED_STAR = re.compile(r"\s*\*\s*")
SPACED_SLASH = re.compile(r"\s*/\s*")
SPACES = re.compile(r"\s+")
SECOND_SEPARATOR = re.compile(r"^[.,][0-9]")


def portable_text(text):
    """``text`` without control characters and U+FEFF, line breaks as spaces, stripped: the same
    string in both runtimes (JS regex ``.`` also stops at \\r, U+2028 and U+2029; Python's only at \\n)."""
    return LINE_BREAKS.sub(" ", UNPORTABLE_PATTERN.sub("", text)).strip()


def normalise_text(text):
    """Unify the look-alike characters people type: unicode minus, micro, ohm, superscripts."""
    out = portable_text(text)
    out = out.replace("−", "-").replace("–", "-")
    out = out.replace("µ", "u").replace("μ", "u")
    out = out.replace("Ω", "ohm").replace("Ω", "ohm")
    out = out.replace("²", "2").replace("^2", "2").replace("³", "3").replace("^3", "3")
    out = out.replace("°", "deg").replace("·", "*").replace("⋅", "*")
    out = out.replace("\u00a0", " ").replace("\u202f", " ")
    return out


def normalise_unit(unit_text):
    """Canonical key for UNITS: no spaces, '*' between factors, lower case, 'ohms' -> 'ohm'."""
    unit = unit_text.strip()
    if unit in CASE_SENSITIVE:
        return CASE_SENSITIVE[unit]
    unit = SPACED_STAR.sub("*", unit)
    unit = SPACED_SLASH.sub("/", unit)
    unit = SPACES.sub("*", unit)
    unit = unit.lower()
    unit = unit.replace("ohms", "ohm")
    unit = unit.replace("deg*c", "degc").replace("deg*f", "degf")
    unit = unit.replace("sq*mm", "mm2").replace("sqmm", "mm2")
    if unit == "kcm":
        unit = "kcmil"
    return unit


def parse_number(text, field):
    """Parse the leading number of ``text``; return [value, rest_of_text].

    A decimal comma is accepted when it is the only separator ("2,5 mm"); a number with both
    a comma and a point ("1,234.5") is refused as ambiguous rather than guessed.
    """
    match = NUMBER_PATTERN.match(text)
    if match is None:
        raise CoreError("expected a number first, found “" + text + "”", field)
    number_text = match.group(1)
    rest = match.group(2)
    if SECOND_SEPARATOR.match(rest) is not None:
        raise CoreError("“" + text + "” mixes a decimal comma and a decimal point, or has two separators; "
                        "write it as 1234.5 or 1234,5", field)
    if number_text.find(",") >= 0:
        if number_text.find(".") >= 0:
            raise CoreError("“" + number_text + "” mixes a decimal comma and a decimal point", field)
        number_text = number_text.replace(",", ".")
    value = float(number_text)
    if not (value - value == 0):
        raise CoreError("“" + number_text + "” is not a finite number", field)
    return [value, rest]


def known_units(kind):
    """The accepted spellings for a kind, sorted, for error messages."""
    names = []
    for key in UNITS.keys():
        if UNITS[key][0] == kind:
            names.append(key)
    names.sort()
    return names


def parse_quantity(text, kind, field="", default_unit=""):
    """Parse "value unit" text into a float in the SI unit of ``kind``.

    text : str
        What the person typed, e.g. "2,5 mm", "90 °C", "1.72 µΩ·cm".
    kind : str
        One of the keys of SI_UNIT ("length", "area", "temperature", ...).
    field : str
        The form field or option name, carried by the error so the page can mark it.
    default_unit : str
        Unit assumed when only a number is typed; "" means a unit is required
        (except for "ratio", which is dimensionless).

    Raises CoreError (with ``field``) for an empty field, a missing or unknown unit, a unit of
    another kind, or a number that is not finite.
    """
    if text is None:
        raise CoreError("is empty: enter " + KIND_WORDS[kind], field)
    cleaned = normalise_text(str(text))
    if len(cleaned) == 0:
        raise CoreError("is empty: enter " + KIND_WORDS[kind], field)
    parts = parse_number(cleaned, field)
    value = parts[0]
    unit_text = parts[1].strip()
    if len(unit_text) == 0:
        if len(default_unit) > 0:
            unit_text = default_unit
        elif kind == "ratio":
            return value
        else:
            raise CoreError("needs a unit: enter " + KIND_WORDS[kind], field)
    key = normalise_unit(unit_text)
    if not (key in UNITS):
        raise CoreError(
            "unknown unit “" + unit_text + "”; for " + KIND_WORDS[kind] + " use one of: "
            + ", ".join(known_units(kind)), field)
    entry = UNITS[key]
    if entry[0] != kind:
        raise CoreError(
            "“" + unit_text + "” is " + KIND_WORDS[entry[0]].split(" (")[0]
            + ", but this field needs " + KIND_WORDS[kind], field)
    si = value * entry[1] + entry[2]
    if not (si - si == 0):
        raise CoreError("“" + str(text) + "” is too large to compute with", field)
    return si
