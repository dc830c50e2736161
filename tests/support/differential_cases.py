"""Cases that the differential test runs through CPython and through the transpiled core in node.

Each case is (module, function, args). Add cases here when a core function is added; the
test fails when a core module reachable from core/web.py has no case at all.
"""

from __future__ import annotations

import random

from conductor_atlas.core.units import UNITS

COPPER = {"id": "copper-annealed", "name": "Standard annealed copper", "rho_ref": 1.7241e-8, "alpha": 0.00393,
          "t_ref": 293.15, "valid_from": 223.15, "valid_to": 473.15, "density": 8890.0, "sources": ["iec60028"]}
ALUMINIUM = {"id": "aluminium-1350", "name": "Conductor aluminium 1350", "rho_ref": 2.8264556e-8,
             "alpha": 0.00403, "t_ref": 293.15, "valid_from": 223.15, "valid_to": 423.15, "density": 2703.0,
             "sources": ["iec60889"]}


def unit_cases():
    cases = []
    for spelling, entry in sorted(UNITS.items()):
        for number in ("1", "2,5", "-0.125", "3.3e-3", "7e5"):
            cases.append(("conductor_atlas.core.units", "parse_quantity", [f"{number} {spelling}", entry[0], "f"]))
    for text, kind in [("", "length"), ("abc", "length"), ("5", "length"), ("5 kg", "length"), ("5 A", "length"),
                       ("1,234.5 m", "length"), ("1e999 m", "length"), ("  12   mm ", "length"),
                       ("90 °C", "temperature"), ("−40 °F", "temperature"), ("1.72 µΩ·cm", "resistivity"),
                       ("35 mm²", "area"), ("1 Mohm", "resistance"), ("3 %", "ratio"), ("0.5", "ratio")]:
        cases.append(("conductor_atlas.core.units", "parse_quantity", [text, kind, "field"]))
    return cases


def geometry_cases():
    cases = []
    for text in ["35 mm2", "12 AWG", "AWG 12", "4/0 AWG", "0000 AWG", "1/0 awg", "56 AWG", "57 AWG", "d 2.5 mm",
                 "ø 1,6 mm", "40 x 5 mm", "5x40 mm", "250 kcmil", "", "abc", "3 m", "-3 mm2", "40 x 5"]:
        cases.append(("conductor_atlas.core.geometry", "parse_size", [text, "size"]))
    for n in range(-3, 57):
        cases.append(("conductor_atlas.core.geometry", "awg_diameter", [n]))
    for area in [0.4e-6, 3.1e-6, 2.5e-6, 95e-6, 3000e-6]:
        cases.append(("conductor_atlas.core.geometry", "next_metric_size", [area]))
        cases.append(("conductor_atlas.core.geometry", "next_awg", [area]))
    return cases


def numfmt_cases():
    rng = random.Random(7)
    values = [0.0, 1.0, -1.0, 1.7241e-8, 0.00393, 58.0, 99.996, 999.95, 1e21, 1e-7, 123456789.0, 5e-324,
              1.7976931348623157e308, 0.1 + 0.2, 2.5, 0.125, 1e16, 1e-5, float("nan"), float("inf")]
    values += [rng.uniform(1, 10) * 10 ** rng.randint(-15, 15) * rng.choice([1, -1]) for _ in range(400)]
    cases = []
    for x in values:
        for sig in (1, 3, 4, 6):
            cases.append(("conductor_atlas.core.numfmt", "format_number", [x, sig]))
        cases.append(("conductor_atlas.core.numfmt", "format_plain", [x, 8]))
        cases.append(("conductor_atlas.core.numfmt", "format_si", [x, "Ω", 4]))
        cases.append(("conductor_atlas.core.numfmt", "format_fixed", [x, 2]))
        cases.append(("conductor_atlas.core.numfmt", "decimal_digits", [x]))
    return cases


def resistance_cases():
    cases = []
    for t in (223.15, 293.15, 363.15, 473.15):
        cases.append(("conductor_atlas.core.resistance", "resistivity_linear", [t, 1.7241e-8, 0.00393, 293.15]))
    cases.append(("conductor_atlas.core.resistance", "resistivity_linear", [0.0, 1.7241e-8, 0.00393, 293.15]))
    cases.append(("conductor_atlas.core.resistance", "iacs_percent", [2.8264e-8]))
    cases.append(("conductor_atlas.core.resistance", "resistivity_from_iacs", [61.0]))
    return cases


def calculator_cases():
    inputs = [
        {"length": "1 km", "size": "10 AWG", "temperature": "20 °C", "current": "10 A"},
        {"length": "35 m", "size": "2.5 mm2", "temperature": "90 degC", "current": "16 A"},
        {"length": "2,5 km", "size": "40 x 5 mm", "temperature": "300 °C"},
        {"length": "100 ft", "size": "4/0 AWG", "temperature": "194 °F", "current": "250 A"},
        {"length": "abc", "size": "5 kg", "temperature": "-300 °C"},
        {"length": "", "size": "", "temperature": "", "current": ""},
        {"length": "1e308 m", "size": "1e-300 mm2"},
        {"length": "-5 m", "size": "d 1.6 mm", "current": "-3 A"},
        {"length": "12 m", "size": "0.5 mm2", "temperature": "-250 °C"},
    ]
    cases = []
    for material in (COPPER, ALUMINIUM):
        for inp in inputs:
            cases.append(("conductor_atlas.core.calculators", "calculate", ["resistance", inp, material]))
    cases.append(("conductor_atlas.core.calculators", "calculate", ["nonsense", {}, COPPER]))
    return cases


def all_cases():
    return unit_cases() + geometry_cases() + numfmt_cases() + resistance_cases() + calculator_cases()
