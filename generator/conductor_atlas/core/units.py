"""Parse the text a person types into a form field ("2.5 mm", "90 °C", "4/0 AWG") into SI floats.

One table, ``UNITS``, maps each accepted spelling (after ``normalise_unit``) to its kind, its
factor to the SI unit, and an offset (temperatures only: SI = value * factor + offset).
tests/core/test_units.py checks every entry against pint. Conductor sizes (AWG, diameter,
bar "w x t") are parsed in ``conductor_atlas.core.geometry``.

Text is read by plain character scans, not regular expressions: Transcrypt's ``re`` module (re.js,
re.translate.js) was 5.9 kB of the 41 kB gzip calculator bundle (measured on calc-resistance), and
a scan over explicit character sets reads the same in CPython and in JS by construction (their
regex ``\\s``, ``.`` and ``strip`` sets differ).
tests/core/test_text_scanning.py checks each scan against the pattern it replaced.
"""

import math

from conductor_atlas.core.celsius import ZERO_CELSIUS
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
    "time": "s",
}

MIL = 2.54e-5  # [m] 0.001 in; the inch is 0.0254 m exactly (international yard and pound, 1959)
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
    "in": ["length", 0.0254, 0.0],
    "mil": ["length", MIL, 0.0],
    # area
    "m2": ["area", 1.0, 0.0],
    "cm2": ["area", 1e-4, 0.0],
    "mm2": ["area", 1e-6, 0.0],
    "um2": ["area", 1e-12, 0.0],
    "in2": ["area", 0.00064516, 0.0],
    "ft2": ["area", 0.09290304, 0.0],
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


# Every character Python's regex \s matches (the same set as str.isspace()). The scans test
# membership here, so JS reads text as CPython does (JS \s and String.trim() use another set).
SPACE_CHARACTERS = ("\t\n\x0b\x0c\r\x1c\x1d\x1e\x1f \x85\xa0\u1680\u2000\u2001\u2002\u2003\u2004\u2005"
                    "\u2006\u2007\u2008\u2009\u200a\u2028\u2029\u202f\u205f\u3000")


def is_space(ch):
    """True when the one character ``ch`` is in SPACE_CHARACTERS."""
    return SPACE_CHARACTERS.find(ch) >= 0


def space_end(text, i):
    """The index after the run of SPACE_CHARACTERS that starts at ``i`` (``i`` itself for none)."""
    n = len(text)
    while i < n and is_space(text[i]):
        i += 1
    return i


def is_unportable(code):
    """True for the characters CPython's str.strip() and JS's String.trim() treat differently, and
    other controls: C0 controls but tab, LF and CR; DEL to U+009F; U+FEFF (whitespace only to JS)."""
    if code < 32:
        return not (code == 9 or code == 10 or code == 13)
    if code >= 127 and code <= 159:
        return True
    return code == 0xFEFF


def needs_cleaning(text):
    """True when ``text`` holds a character portable_text removes or replaces: a control character
    (tab included, though it is kept), DEL-U+009F, U+FEFF, or a line break (LF, CR, U+2028, U+2029).
    Most typed text holds none, and then portable_text builds no new string."""
    for ch in text:
        code = ord(ch)
        if code < 32 or code == 0xFEFF or code == 0x2028 or code == 0x2029:
            return True
        if code >= 127 and code <= 159:
            return True
    return False


def without_controls(text):
    """``text`` with the characters is_unportable names dropped and each line break (LF, CR,
    U+2028, U+2029) made a space; tabs and everything else kept."""
    out = []
    for i in range(len(text)):
        ch = text[i]
        code = ord(ch)
        if code == 10 or code == 13 or code == 0x2028 or code == 0x2029:
            out.append(" ")
        elif not is_unportable(code):
            out.append(ch)
    return "".join(out)


def portable_text(text):
    """``text`` without control characters and U+FEFF, line breaks as spaces, stripped: the same
    string in both runtimes (no character is left that only one runtime's strip removes), and one
    line, which the scans of this module and of geometry rely on."""
    if not needs_cleaning(text):
        return text.strip()
    return without_controls(text).strip()


def has_lookalikes(text):
    """True when ``text`` holds a character normalise_text may replace: anything beyond ASCII, or "^"."""
    for ch in text:
        if ord(ch) > 126 or ch == "^":
            return True
    return False


def normalise_text(text):
    """Unify the look-alike characters people type: unicode minus, micro, ohm, superscripts."""
    out = portable_text(text)
    if not has_lookalikes(out):
        return out
    out = out.replace("−", "-").replace("–", "-")
    out = out.replace("µ", "u").replace("μ", "u")
    out = out.replace("Ω", "ohm").replace("Ω", "ohm")
    out = out.replace("²", "2").replace("^2", "2").replace("³", "3").replace("^3", "3")
    out = out.replace("°", "deg").replace("·", "*").replace("⋅", "*")
    out = out.replace("\u00a0", " ").replace("\u202f", " ").replace("\u2009", " ")
    return out


def has_space(text):
    """True when ``text`` may hold a character of SPACE_CHARACTERS: anything but printable ASCII
    other than the space. (Without one, joined_spaces would change nothing.)"""
    for ch in text:
        code = ord(ch)
        if code < 33 or code > 126:
            return True
    return False


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


def is_digit(ch):
    return ch >= "0" and ch <= "9"


def is_group_at(text, i):
    """True when text[i] is a space followed by exactly three digits and then no digit: a space
    between thousands ("1 500"; thin and no-break spaces are made spaces by normalise_text)."""
    n = len(text)
    if not (i + 3 < n and text[i] == " "):
        return False
    if not (is_digit(text[i + 1]) and is_digit(text[i + 2]) and is_digit(text[i + 3])):
        return False
    return not (i + 4 < n and is_digit(text[i + 4]))


def number_end(text):
    """Where the number at the start of ``text`` ends; 0 for none.

    Sign; digits, then any run of separated groups: "," or "." with the digits after it (none
    after the last one: "5."), or a space with exactly three digits ("1 500"); or a separator and
    at least one digit (".5"); then an exponent only when it has a digit. What the separators
    mean is decided by grouped_number_text.
    """
    n = len(text)
    i = 0
    if i < n and (text[i] == "+" or text[i] == "-"):
        i += 1
    if i < n and is_digit(text[i]):
        while i < n and is_digit(text[i]):
            i += 1
        going = True
        while going and i < n:
            if text[i] == "." or text[i] == ",":
                i += 1
                while i < n and is_digit(text[i]):
                    i += 1
                going = i < n and is_digit(text[i - 1])
            elif is_group_at(text, i):
                i += 4
            else:
                going = False
    elif i + 1 < n and (text[i] == "." or text[i] == ",") and is_digit(text[i + 1]):
        i += 2
        while i < n and is_digit(text[i]):
            i += 1
    else:
        return 0
    if i < n and (text[i] == "e" or text[i] == "E"):
        j = i + 1
        if j < n and (text[j] == "+" or text[j] == "-"):
            j += 1
        if j < n and is_digit(text[j]):
            while j < n and is_digit(text[j]):
                j += 1
            i = j
    return i


def split_number(text):
    """[number text, rest] for text that starts with a number ("2,5 mm" -> ["2,5", "mm"]); None
    when it does not. The rest starts after the spaces that follow the number.

    What the former pattern ``^(number)\\s*(.*)$`` (number as in number_end) matched, for any
    text: Python's ``.`` stops at a line feed and ``$`` also matches before a final one, so a
    rest with a line feed other than its last character is no match, and a final one is dropped.
    """
    end = number_end(text)
    if end == 0:
        return None
    rest = text[space_end(text, end):]
    line_feed = rest.find("\n")
    if line_feed >= 0:
        if line_feed != len(rest) - 1:
            return None
        rest = rest[0:line_feed]
    return [text[0:end], rest]


def number_pieces(mantissa):
    """[runs of digits, separators between them] of a mantissa such as "1,500.25" ->
    [["1", "500", "25"], [",", "."]] (a leading separator gives a first run "")."""
    runs = []
    separators = []
    current = ""
    for ch in mantissa:
        if is_digit(ch):
            current = current + ch
        else:
            runs.append(current)
            separators.append(ch)
            current = ""
    runs.append(current)
    return [runs, separators]


def leads_a_group(first):
    """True when ``first`` can open a number grouped in thousands: one to three digits, no leading 0."""
    return len(first) >= 1 and len(first) <= 3 and first[0] != "0"


def all_three_digits(runs, start, stop):
    """True when runs[start:stop] all have exactly three digits."""
    for k in range(start, stop):
        if len(runs[k]) != 3:
            return False
    return True


def without_trailing_zeros(digits):
    """"500" -> "5", "250" -> "25", "000" -> "0" (the decimal reading of a three-digit group)."""
    end = len(digits)
    while end > 1 and digits[end - 1] == "0":
        end -= 1
    return digits[0:end]


def ambiguous_group_message(number_text, whole, group, separator):
    """The refusal for "1,500": the two readings and how to write each."""
    as_thousands = whole + group
    as_decimal = whole + "." + without_trailing_zeros(group)
    if separator == ",":
        return ("“" + number_text + "” could be " + as_thousands + " (comma between thousands) or " + as_decimal
                + " (decimal comma): write " + as_thousands + " or " + as_decimal)
    return ("“" + number_text + "” could be " + as_decimal + " (decimal point) or " + as_thousands
            + " (point between thousands): write " + as_decimal + " or " + as_thousands)


def grouped_number_text(number_text, field):
    """The number as Python and JS read it ("1,500,000" -> "1500000", "12,500.5" -> "12500.5",
    "1 500" -> "1500", "0,820" -> "0.820"); a CoreError naming ``field`` when the separators can be
    read two ways or make no number.

    The rule (README, "Typing numbers"): a run of groups of exactly three digits after a first group
    of one to three digits (no leading 0) separated by one kind of mark (",", "." or a space) is
    thousands; a single "," followed by exactly three digits ("1,500", "12,250") could be either
    convention and is refused with both readings, unless the number starts with 0 or has an
    exponent (neither can be grouped); any other single "," or "." is the decimal mark (a "."
    before three digits is read as decimal and point_reading_note says so); a mark after
    thousands groups of another kind is the decimal mark.
    """
    sign = ""
    body = number_text
    if len(body) > 0 and (body[0] == "+" or body[0] == "-"):
        sign = body[0]
        body = body[1:]
    exponent = ""
    for k in range(len(body)):
        if body[k] == "e" or body[k] == "E":
            exponent = body[k:]
            body = body[0:k]
            break
    pieces = number_pieces(body)
    runs = pieces[0]
    separators = pieces[1]
    count = len(separators)
    if count == 0:
        return number_text
    malformed = ("“" + number_text + "” is not a number as written: group thousands by threes with one mark "
                 "(1,500,000, 1.500.000 or 1 500 000) and use one decimal mark (1500.5 or 1500,5)")
    last = separators[count - 1]
    grouping = separators[0]
    grouped = 0
    while grouped < count and separators[grouped] == grouping:
        grouped += 1
    if count == 1 and grouping != " ":
        # one mark: the decimal mark, unless it could be a thousands separator as well
        if grouping == "," and len(exponent) == 0 and leads_a_group(runs[0]) and len(runs[1]) == 3:
            raise CoreError(ambiguous_group_message(number_text, sign + runs[0], runs[1], grouping), field)
        return sign + runs[0] + "." + runs[1] + exponent
    if not leads_a_group(runs[0]) or grouped < count - 1:
        raise CoreError(malformed, field)
    if grouped == count:
        # every mark alike: all of them group thousands ("1,500,000", "1 500")
        if not all_three_digits(runs, 1, count + 1):
            raise CoreError(malformed, field)
        return sign + "".join(runs) + exponent
    # thousands groups, then the other mark as the decimal mark ("12,500.5", "1 500,5")
    if last == " " or not all_three_digits(runs, 1, count):
        raise CoreError(malformed, field)
    return sign + "".join(runs[0:count]) + "." + runs[count] + exponent


def parse_number(text, field):
    """Parse the leading number of ``text``; return [value, rest_of_text].

    Separators are read by grouped_number_text (thousands groups, decimal comma or point; a
    comma before exactly three digits is refused with both readings); a second separator right
    after the number and its spaces ("1. 5", "5 .5") is refused rather than guessed.
    """
    pieces = split_number(text)
    if pieces is None:
        raise CoreError("expected a number first, found “" + text + "”", field)
    number_text = pieces[0]
    rest = pieces[1]
    second = len(rest) >= 2 and (rest[0] == "." or rest[0] == ",") and is_digit(rest[1])
    if second:
        raise CoreError("“" + text + "” mixes a decimal comma and a decimal point, or has two separators; "
                        "write it as 1234.5 or 1234,5", field)
    plain = grouped_number_text(number_text, field)
    value = float(plain)
    if not (value - value == 0):
        raise CoreError("“" + number_text + "” is not a finite number", field)
    return [value, rest]


def point_reading_note(text, field):
    """A note when ``text`` starts with a number whose only mark is a "." before exactly three digits
    ("1.500 m", "9.346 mm"): read with a decimal point, which a reader of the thousands-point
    convention would read as 1500; "" otherwise. The calculators show it with the results."""
    pieces = split_number(normalise_text(text))
    if pieces is None:
        return ""
    number_text = pieces[0]
    if len(number_text) > 0 and (number_text[0] == "+" or number_text[0] == "-"):
        number_text = number_text[1:]
    if number_text.find("e") >= 0 or number_text.find("E") >= 0:
        return ""
    split = number_pieces(number_text)
    runs = split[0]
    if len(split[1]) != 1 or split[1][0] != "." or not leads_a_group(runs[0]) or len(runs[1]) != 3:
        return ""
    return (field + ": “" + number_text + "” is read with a decimal point as " + runs[0] + "."
            + without_trailing_zeros(runs[1]) + "; for " + runs[0] + runs[1] + " write " + runs[0] + runs[1])


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


def quantity_in_si(text, kind, field, default_unit):
    """parse_quantity without the memo (``text`` is a str)."""
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
