"""The form-input unit parser, checked against pint for every spelling it accepts."""

import pint
import pytest

from conductor_atlas.core.errors import CoreError
from conductor_atlas.core.units import SI_UNIT, UNITS, parse_quantity

UREG = pint.UnitRegistry()

# Our spelling -> the same unit in pint's vocabulary, and the SI unit of its kind in pint.
PINT_NAME = {
    "m": "m", "km": "km", "cm": "cm", "mm": "mm", "um": "um", "nm": "nm", "ft": "ft", "in": "inch", "mil": "thou",
    "m2": "m**2", "cm2": "cm**2", "mm2": "mm**2", "um2": "um**2", "in2": "inch**2", "ft2": "ft**2",
    "cmil": "circular_mil", "kcmil": "kilocircular_mil", "mcm": "kilocircular_mil",
    "k": "K", "degc": "degC", "c": "degC", "degf": "degF", "f": "degF",
    "a": "A", "ma": "mA", "ka": "kA",
    "s": "s", "ms": "ms", "min": "min",
    "hz": "Hz", "khz": "kHz", "mhz": "MHz", "ghz": "GHz", "thz": "THz",
    "v": "V", "mv": "mV", "kv": "kV",
    "ohm": "ohm", "mohm": "milliohm", "uohm": "microohm", "kohm": "kiloohm",
    "ohm*m": "ohm*m", "nohm*m": "nanoohm*m", "uohm*cm": "microohm*cm", "uohm*m": "microohm*m",
    "ohm*mm2/m": "ohm*mm**2/m",
    "w": "W", "mw": "mW", "kw": "kW",
    "a/m2": "A/m**2", "a/mm2": "A/mm**2", "a/cm2": "A/cm**2",
    "%": "percent",
    "kg/m3": "kg/m**3", "g/cm3": "g/cm**3",
    "1/k": "1/K", "1/degc": "1/delta_degC", "ppm/k": "ppm/K",
    "w/(m*k)": "W/(m*K)", "w/m/k": "W/m/K",
}
SI_IN_PINT = {"length": "m", "area": "m**2", "temperature": "K", "current": "A", "frequency": "Hz",
              "voltage": "V", "resistance": "ohm", "resistivity": "ohm*m", "power": "W",
              "current_density": "A/m**2", "ratio": "dimensionless",
              "density": "kg/m**3", "temperature_coefficient": "1/K", "thermal_conductivity": "W/(m*K)",
              "time": "s"}


def test_every_unit_has_a_pint_counterpart():
    assert sorted(UNITS) == sorted(PINT_NAME)


@pytest.mark.parametrize("spelling", sorted(UNITS))
@pytest.mark.parametrize("number", [0.5, 37.0, -12.25])
def test_unit_agrees_with_pint(spelling, number):
    kind = UNITS[spelling][0]
    ours = parse_quantity(f"{number} {spelling}", kind)
    reference = UREG.Quantity(number, PINT_NAME[spelling]).to(SI_IN_PINT[kind]).magnitude
    # pint and we both apply one factor (and one offset for temperatures): agreement to a few ulp
    assert ours == pytest.approx(reference, rel=1e-12, abs=1e-12 * abs(reference) + 1e-300)


@pytest.mark.parametrize("text, kind, expected", [
    ("2,5 mm", "length", 0.0025),            # decimal comma
    ("2.5mm", "length", 0.0025),             # no space
    ("35 mm²", "area", 35e-6),               # superscript
    ("35 mm^2", "area", 35e-6),
    ("90 °C", "temperature", 363.15),
    ("90 degC", "temperature", 363.15),
    ("194 °F", "temperature", 363.15),
    ("363.15 K", "temperature", 363.15),
    ("1.72 µΩ·cm", "resistivity", 1.72e-8),
    ("1.72 μΩ*cm", "resistivity", 1.72e-8),  # Greek mu, not micro sign
    ("12.5 mΩ", "resistance", 0.0125),
    ("−5 m", "length", -5.0),                # Unicode minus
    ("1 MHz", "frequency", 1e6),
    ("250 kcmil", "area", 250 * 5.067074790974977e-7),
    ("3 %", "ratio", 0.03),
    ("0.03", "ratio", 0.03),
])
def test_forms_people_type(text, kind, expected):
    assert parse_quantity(text, kind) == pytest.approx(expected, rel=1e-12)


@pytest.mark.parametrize("text, kind, words", [
    ("", "length", "is empty"),
    ("abc", "length", "expected a number first"),
    ("5", "length", "needs a unit"),
    ("5 kg", "length", "unknown unit “kg”"),
    ("5 A", "length", "is a current"),
    ("1,2.5 m", "length", "is not a number as written"),
    ("1e999 m", "length", "not a finite number"),
    ("1 Mohm", "resistance", "unknown unit"),   # mega is not offered: refuse rather than read milli
    ("5 MA", "current", "unknown unit"),
])
def test_bad_input_names_the_problem(text, kind, words):
    with pytest.raises(CoreError) as caught:
        parse_quantity(text, kind, "length")
    assert words in caught.value.message
    assert caught.value.field == "length"


def test_every_kind_has_an_si_symbol():
    assert {entry[0] for entry in UNITS.values()} <= set(SI_UNIT)


# --- thousands separators and decimal commas (issue 13 item 1; the rule is in README "Typing numbers") ---
# Each expected value is the reading both conventions agree on (exact in binary or the nearest
# float of the decimal text, so == is the right comparison: the parser builds the same decimal text).
@pytest.mark.parametrize("text, metres", [
    ("1,500,000 m", 1500000.0),     # groups of three after a short first group: thousands
    ("1.500.000 m", 1500000.0),
    ("12,500.5 m", 12500.5),        # thousands groups, then the other mark as decimal
    ("1.234,5 m", 1234.5),
    ("1 500 m", 1500.0),            # a space between thousands
    ("1\u2009500 m", 1500.0),       # thin space
    ("1\u202f500 m", 1500.0),       # narrow no-break space
    ("1\u00a0500 m", 1500.0),       # no-break space
    ("12 500 000 m", 12500000.0),
    ("1 500,5 m", 1500.5),
    ("0,820 m", 0.82),              # a leading 0 cannot open a thousands group: decimal comma
    ("1,5 m", 1.5),
    ("1,5000 m", 1.5),              # four digits after the comma: not a group
    ("1234,567 m", 1234.567),       # a first group of four digits: not grouped
    ("1.500 m", 1.5),               # decimal point (with a note, see below)
])
def test_grouped_and_decimal_comma_numbers(text, metres):
    assert parse_quantity(text, "length", "length") == metres


@pytest.mark.parametrize("text, words", [
    ("1,500 ft", "“1,500” could be 1500 (comma between thousands) or 1.5 (decimal comma): write 1500 or 1.5"),
    ("12,500 m", "“12,500” could be 12500 (comma between thousands) or 12.5 (decimal comma): write 12500 or 12.5"),
    ("-1,250 m", "write -1250 or -1.25"),
    ("1,5,5 m", "is not a number as written"),
    ("1,500.000,5 m", "is not a number as written"),
    ("0 500 m", "is not a number as written"),
])
def test_a_number_read_two_ways_is_refused_with_both_readings(text, words):
    with pytest.raises(CoreError) as caught:
        parse_quantity(text, "length", "length")
    assert words in caught.value.message
    assert caught.value.field == "length"


def test_a_point_before_three_digits_is_read_as_decimal_and_said():
    from conductor_atlas.core.typed_text import point_reading_note
    assert point_reading_note("1.500 m", "length") == ("length: “1.500” is read with a decimal point as 1.5; "
                                                       "for 1500 write 1500")
    for plain in ["1.5 m", "0.500 m", "1500 m", "1.5000 m", "1.500e3 m", "1,500,000 m", "abc"]:
        assert point_reading_note(plain, "length") == ""


def test_english_units_are_the_exact_decimals_of_their_definitions():
    # NIST SP 811 (2008), B.8: 1 in = 0.0254 m and 1 ft = 0.3048 m exactly (1959 agreement), so
    # 1 mil = 2.54e-5 m, 1 in² = 6.4516e-4 m², 1 ft² = 9.290304e-2 m² exactly. units.py writes them as
    # relations (MIL = INCH * 1e-3, INCH * INCH, 0.3048 * 0.3048); each must give the float of the exact
    # decimal, not one a last bit away (INCH / 1000 would be 2.5399999999999997e-05), so that sizes in
    # mil and in² read the same as before and in both runtimes. Tolerance: none (the same float).
    assert UNITS["in"][1] == 0.0254 and UNITS["ft"][1] == 0.3048
    assert UNITS["mil"][1] == 2.54e-5
    assert UNITS["in2"][1] == 0.00064516
    assert UNITS["ft2"][1] == 0.09290304
