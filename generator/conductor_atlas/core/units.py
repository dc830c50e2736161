"""Parse the text a person types into a form field ("2.5 mm", "90 °C", "4/0 AWG") into SI floats.

One table, ``UNITS``, maps each accepted spelling (after ``normalise_unit``) to its kind, its
factor to the SI unit, and an offset (temperatures only: SI = value * factor + offset).
tests/core/test_units.py checks every entry against pint. Conductor sizes (AWG, diameter,
bar "w x t") are parsed in ``conductor_atlas.core.geometry``; the scans of typed text (spaces, controls,
look-alikes) and the reading of the number are in ``core.typed_text``.

Text is read by plain character scans, not regular expressions: Transcrypt's ``re`` module (re.js,
re.translate.js) was 5.9 kB of the 41 kB gzip calculator bundle (measured on calc-resistance), and
a scan over explicit character sets reads the same in CPython and in JS by construction (their
regex ``\\s``, ``.`` and ``strip`` sets differ).
tests/core/test_text_scanning.py checks each scan against the pattern it replaced.
"""

import math

from conductor_atlas.core.celsius import ZERO_CELSIUS
from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.typed_text import parse_number, has_space, is_space, normalise_text, space_end

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
    "time": "s",
}

# The international yard and pound agreement (1959) defines the inch as 0.0254 m and the foot as 0.3048 m
# exactly; the other English units are written from them (each product gives the same float as the
# exact decimal: 0.0254 * 1e-3 is 2.54e-5, 0.0254^2 is 0.00064516, 0.3048^2 is 0.09290304). The inch
# is the one home of that number (core.geometry's AWG diameters read it from here); the foot stays a
# literal in the table below (a module-level name is one more export in every page's bundle).
INCH = 0.0254  # [m]
MIL = INCH * 1e-3  # [m] 0.001 in
CIRCULAR_MIL = math.pi / 4.0 * MIL * MIL  # [m^2] the area of a circle one mil across

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
    "in": ["length", INCH, 0.0],
    "mil": ["length", MIL, 0.0],
    # area
    "m2": ["area", 1.0, 0.0],
    "cm2": ["area", 1e-4, 0.0],
    "mm2": ["area", 1e-6, 0.0],
    "um2": ["area", 1e-12, 0.0],
    "in2": ["area", INCH * INCH, 0.0],
    "ft2": ["area", 0.3048 * 0.3048, 0.0],
    "cmil": ["area", CIRCULAR_MIL, 0.0],
    "kcmil": ["area", 1000.0 * CIRCULAR_MIL, 0.0],
    "mcm": ["area", 1000.0 * CIRCULAR_MIL, 0.0],
    # temperature
    "k": ["temperature", 1.0, 0.0],
    "degc": ["temperature", 1.0, ZERO_CELSIUS],
    "c": ["temperature", 1.0, ZERO_CELSIUS],
    "degf": ["temperature", 5.0 / 9.0, ZERO_CELSIUS - 32.0 * 5.0 / 9.0],  # 32 °F is 0 °C; a °F step is 5/9 K
    "f": ["temperature", 5.0 / 9.0, ZERO_CELSIUS - 32.0 * 5.0 / 9.0],
    # current
    "a": ["current", 1.0, 0.0],
    "ma": ["current", 0.001, 0.0],
    "ka": ["current", 1000.0, 0.0],
    # time (a fault's duration)
    "s": ["time", 1.0, 0.0],
    "ms": ["time", 0.001, 0.0],
    "min": ["time", 60.0, 0.0],
    # frequency
    "hz": ["frequency", 1.0, 0.0],
    "khz": ["frequency", 1e3, 0.0],
    "mhz": ["frequency", 1e6, 0.0],
    "ghz": ["frequency", 1e9, 0.0],
    "thz": ["frequency", 1e12, 0.0],
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
    "Ms": "megasecond",
}

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
    "time": "a time (e.g. 0.5 s, 200 ms)",
}


# __pragma__ ('nokwargs')
def joined_spaces(unit):
    """``unit`` with each run of spaces dropped when a "*" or "/" is next to it and made one "*"
    otherwise ("A / mm2" -> "A/mm2", "ohm  m" -> "ohm*m"): what the former patterns
    \\s*\\*\\s* -> "*", then \\s*/\\s* -> "/", then \\s+ -> "*" gave."""
    out = []
    n = len(unit)
    i = 0
    while i < n:
        if not is_space(unit[i]):
            out.append(unit[i])
            i += 1
            continue
        start = i
        i = space_end(unit, i)
        joined = False
        if start > 0 and (unit[start - 1] == "*" or unit[start - 1] == "/"):
            joined = True
        if i < n and (unit[i] == "*" or unit[i] == "/"):
            joined = True
        if not joined:
            out.append("*")
    return "".join(out)


def normalise_unit(unit_text):
    """Canonical key for UNITS: no spaces, '*' between factors, lower case, 'ohms' -> 'ohm'."""
    unit = unit_text.strip()
    if unit in CASE_SENSITIVE:
        return CASE_SENSITIVE[unit]
    if has_space(unit):
        unit = joined_spaces(unit)
    unit = unit.lower()
    unit = unit.replace("ohms", "ohm")
    unit = unit.replace("deg*c", "degc").replace("deg*f", "degf")
    unit = unit.replace("sq*mm", "mm2").replace("sqmm", "mm2")
    if unit == "kcm":
        unit = "kcmil"
    return unit


def known_units(kind):
    """The accepted spellings for a kind, sorted, for error messages."""
    names = []
    for key in UNITS.keys():
        if UNITS[key][0] == kind:
            names.append(key)
    names.sort()
    return names


# The last text parse_quantity read for each (kind, field, default unit) and what it gave:
# [text, SI value, error message or "", field of the error]. A calculator updates on every
# keystroke in one field, so the other fields' texts are not parsed again. A text always gives
# the same result, so this changes speed only; one entry per key, so it never grows with use.
LAST_PARSED = {}


def recall_field(memo, key, typed):
    """What ``memo`` (LAST_PARSED, geometry.LAST_SIZE) holds for ``typed`` under ``key``: the
    remembered value, None when that text is not the one remembered; a remembered problem is
    raised again as the same CoreError."""
    if key in memo:
        last = memo[key]
        if last[0] == typed:
            if len(last[2]) > 0:
                raise CoreError(last[2], last[3])
            return last[1]
    return None


def remember_field(memo, key, typed, value, problem):
    """Keep what ``typed`` gave under ``key``: ``value``, or the CoreError ``problem`` (else None)."""
    if problem is None:
        memo[key] = [typed, value, "", ""]
    else:
        memo[key] = [typed, None, problem.message, problem.field]
# __pragma__ ('kwargs')


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

    Examples
    --------
    Each against pint (tests/core/test_units.py checks every unit the table knows): 68 degF is
    293.15 K, 1.72 microohm*cm is 1.72e-8 ohm*m, 250 kcmil is 126.677 mm^2:

    >>> round(parse_quantity("68 °F", "temperature"), 9), parse_quantity("1.72 µΩ·cm", "resistivity")
    (293.15, 1.72e-08)
    >>> round(parse_quantity("250 kcmil", "area") * 1e6, 3), round(parse_quantity("2.5", "area", "size", "mm2") * 1e6, 12)
    (126.677, 2.5)
    """
    if text is None:
        raise CoreError("is empty: enter " + KIND_WORDS[kind], field)
    typed = str(text)
    key = kind + "|" + field + "|" + default_unit
    remembered = recall_field(LAST_PARSED, key, typed)
    if remembered is not None:
        return remembered
    try:
        si = quantity_in_si(typed, kind, field, default_unit)
    except CoreError as problem:
        remember_field(LAST_PARSED, key, typed, None, problem)
        raise problem
    remember_field(LAST_PARSED, key, typed, si, None)
    return si


# __pragma__ ('nokwargs')
def quantity_in_si(text, kind, field, default_unit):
    """parse_quantity without the memo (``text`` is a str).

    Examples
    --------
    The international foot is 0.3048 m exactly (NIST SP 811, B.8), as pint has it: 328 ft = 99.9744 m:

    >>> round(quantity_in_si("328 ft", "length", "length", ""), 9)
    99.9744
    """
    cleaned = normalise_text(text)
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
        raise CoreError("“" + text + "” is too large to compute with", field)
    return si
# __pragma__ ('kwargs')
