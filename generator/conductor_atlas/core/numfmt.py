"""Portable number formatting: the same text in CPython and in the transpiled JavaScript.

Transcrypt drops f-string format specs and mangles ``%`` and ``str.format``, so numbers are
formatted here with string operations only. Both runtimes print a float as its shortest
round-trip decimal (``repr`` in Python, ``Number.prototype.toString`` in JS); only the layout
differs ("1e-08" vs "1e-8", "2.0" vs "2"). ``decimal_digits`` reads either layout into
(sign, digits, exponent), and everything else is done on those digits, so the output is
byte-identical in both runtimes.
"""

import math

from conductor_atlas.core.celsius import ZERO_CELSIUS
from conductor_atlas.core.errors import CoreError

SUPERSCRIPT_DIGITS = "⁰¹²³⁴⁵⁶⁷⁸⁹"

SI_PREFIXES = [
    [-15, "f"], [-12, "p"], [-9, "n"], [-6, "µ"], [-3, "m"], [0, ""],
    [3, "k"], [6, "M"], [9, "G"], [12, "T"],
]


# __pragma__ ('nokwargs')
def is_finite(x):
    """True when x is a real, finite number (JS has no math.isfinite under Transcrypt)."""
    return x - x == 0


def decimal_digits(x):
    """Split a finite float into [sign, digits, exponent] with x = sign * 0.d1d2d3... * 10**exponent.

    ``digits`` has no leading or trailing zeros ("0" for zero, with exponent 1).
    Raises CoreError for NaN and infinities (their text differs between the runtimes).
    """
    if not is_finite(x):
        raise CoreError("not a finite number")
    text = str(x)
    sign = 1
    if text[0] == "-":
        sign = -1
        text = text[1:]
    exponent_part = 0
    epos = text.find("e")
    if epos < 0:
        epos = text.find("E")
    if epos >= 0:
        exponent_text = text[epos + 1:]
        if exponent_text[0] == "+":
            exponent_text = exponent_text[1:]
        exponent_part = parse_int_text(exponent_text)
        text = text[:epos]
    dot = text.find(".")
    if dot < 0:
        int_part = text
        frac_part = ""
    else:
        int_part = text[:dot]
        frac_part = text[dot + 1:]
    digits = int_part + frac_part
    point = len(int_part) + exponent_part
    # strip leading zeros (each moves the decimal point left by one)
    start = 0
    while start < len(digits) and digits[start] == "0":
        start += 1
    digits = digits[start:]
    point -= start
    end = len(digits)
    while end > 0 and digits[end - 1] == "0":
        end -= 1
    digits = digits[:end]
    if len(digits) == 0:
        return [1, "0", 1]
    return [sign, digits, point]


def parse_int_text(text):
    """Parse an optionally signed decimal integer string without int() (32-bit wrap in JS)."""
    negative = False
    if len(text) > 0 and text[0] == "-":
        negative = True
        text = text[1:]
    value = 0
    for ch in text:
        value = value * 10 + "0123456789".find(ch)
    if negative:
        return -value
    return value


def round_digits(digits, point, sig):
    """Round a digit string to ``sig`` significant digits, half away from zero.

    Returns [digits, point]; the digit string has exactly ``sig`` characters.
    """
    if len(digits) <= sig:
        padded = digits
        while len(padded) < sig:
            padded = padded + "0"
        return [padded, point]
    head = digits[:sig]
    if "56789".find(digits[sig]) >= 0:
        chars = []
        for ch in head:
            chars.append(ch)
        i = sig - 1
        carry = True
        while carry and i >= 0:
            d = "0123456789".find(chars[i]) + 1
            if d == 10:
                chars[i] = "0"
                i -= 1
            else:
                chars[i] = "0123456789"[d]
                carry = False
        head = "".join(chars)
        if carry:
            head = "1" + head[:sig - 1]
            point += 1
    return [head, point]


def trim_fraction(text):
    """Drop trailing zeros after a decimal point ("1.500" -> "1.5", "2.000" -> "2")."""
    if text.find(".") < 0:
        return text
    end = len(text)
    while end > 0 and text[end - 1] == "0":
        end -= 1
    if end > 0 and text[end - 1] == ".":
        end -= 1
    return text[:end]


def place_point(digits, point):
    """Write digits (0.d1d2... * 10**point) in positional notation."""
    if point <= 0:
        zeros = ""
        for _ in range(-point):
            zeros = zeros + "0"
        return "0." + zeros + digits
    if point >= len(digits):
        tail = ""
        for _ in range(point - len(digits)):
            tail = tail + "0"
        return digits + tail
    return digits[:point] + "." + digits[point:]


def superscript(n):
    """Integer exponent as Unicode superscript ("-8" -> "⁻⁸")."""
    text = str(n)
    out = ""
    for ch in text:
        if ch == "-":
            out = out + "⁻"
        else:
            out = out + SUPERSCRIPT_DIGITS["0123456789".find(ch)]
    return out
# __pragma__ ('kwargs')


def format_number(x, sig=4, keep_zeros=False):
    """Format x with ``sig`` significant digits.

    Positional notation for 1e-4 <= |x| < 1e6, otherwise "m×10ⁿ" (Unicode superscript).
    Trailing zeros are dropped unless ``keep_zeros`` (a table column of fixed precision).
    Non-finite input gives "—" so that no "NaN" ever reaches a page.
    """
    if not is_finite(x):
        return "—"
    if x == 0:
        return "0"
    parts = decimal_digits(x)
    sign = parts[0]
    rounded = round_digits(parts[1], parts[2], sig)
    digits = rounded[0]
    point = rounded[1]
    prefix = ""
    if sign < 0:
        prefix = "−"
    if point >= -3 and point <= 6:
        body = place_point(digits, point)
        if not keep_zeros:
            body = trim_fraction(body)
        return prefix + body
    mantissa = place_point(digits, 1)
    if not keep_zeros:
        mantissa = trim_fraction(mantissa)
    return prefix + mantissa + "×10" + superscript(point - 1)


def format_plain(x, sig=6):
    """Machine-readable text: ASCII digits, "e" exponent, '-' sign (CSV cells, data-value)."""
    if not is_finite(x):
        return ""
    if x == 0:
        return "0"
    parts = decimal_digits(x)
    rounded = round_digits(parts[1], parts[2], sig)
    digits = rounded[0]
    point = rounded[1]
    prefix = ""
    if parts[0] < 0:
        prefix = "-"
    if point >= -3 and point <= 15:
        return prefix + trim_fraction(place_point(digits, point))
    return prefix + trim_fraction(place_point(digits, 1)) + "e" + str(point - 1)


# __pragma__ ('nokwargs')
def format_fixed(x, decimals):
    """Format x with a fixed number of decimals (e.g. temperatures in a table)."""
    if not is_finite(x):
        return "—"
    scale = math.pow(10, decimals)
    if abs(x) * scale >= 1e15:
        return format_number(x, 6)
    n = math.floor(abs(x) * scale + 0.5)
    text = str(n)
    while len(text) <= decimals:
        text = "0" + text
    if decimals > 0:
        text = text[:len(text) - decimals] + "." + text[len(text) - decimals:]
    if x < 0 and n != 0:
        return "−" + text
    return text
# __pragma__ ('kwargs')


def format_si(x, unit, sig=4):
    """Format with an SI prefix chosen so the mantissa lies in [1, 1000): 0.01724 Ω -> "17.24 mΩ"."""
    if not is_finite(x):
        return "—"
    if x == 0:
        return "0 " + unit
    parts = decimal_digits(x)
    rounded = round_digits(parts[1], parts[2], sig)
    exp10 = rounded[1] - 1
    chosen = SI_PREFIXES[0]
    for entry in SI_PREFIXES:
        if entry[0] <= exp10:
            chosen = entry
    if exp10 < SI_PREFIXES[0][0] or exp10 >= 15:
        return format_number(x, sig) + " " + unit
    scaled = x / math.pow(10, chosen[0])
    return format_number(scaled, sig) + " " + chosen[1] + unit


# __pragma__ ('nokwargs')
def celsius_text(t):
    """A temperature t [K] in degrees Celsius to one decimal, t − 273.15 K (the zero of Celsius,
    core.celsius): "90.0 °C". The one home of the core's temperature texts.

    Examples
    --------
    >>> celsius_text(363.15), celsius_text(4.2), celsius_text(0.0)
    ('90.0 °C', '−269.0 °C', '−273.2 °C')
    """
    return format_fixed(t - ZERO_CELSIUS, 1) + " °C"


def temperature_text(t):
    """A temperature t [K] as text a person reads: "90.0 °C (363.15 K)" (celsius_text, then kelvin).

    Examples
    --------
    >>> temperature_text(363.15)
    '90.0 °C (363.15 K)'
    """
    return celsius_text(t) + " (" + format_fixed(t, 2) + " K)"


def temperature_span_text(t_low, t_high):
    """A span of temperatures [K] as a person reads it: temperature_text of both ends, "to" between.

    Examples
    --------
    >>> temperature_span_text(223.15, 423.15)
    '−50.0 °C (223.15 K) to 150.0 °C (423.15 K)'
    """
    return temperature_text(t_low) + " to " + temperature_text(t_high)
# __pragma__ ('kwargs')
