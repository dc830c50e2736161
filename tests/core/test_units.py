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
    "hz": "Hz", "khz": "kHz", "mhz": "MHz", "ghz": "GHz",
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
              "density": "kg/m**3", "temperature_coefficient": "1/K", "thermal_conductivity": "W/(m*K)"}


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
    ("1,234.5 m", "length", "mixes a decimal comma and a decimal point"),
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
