"""Cases that the differential test runs through CPython and through the transpiled core in node.

Each case is (module, function, args). Add cases here when a core function is added; the
test fails when a core module reachable from core/web.py has no case at all.
"""

from __future__ import annotations

import functools
import random

from conductor_atlas.core.units import UNITS
from tests.support.differential_search_cases import search_cases

@functools.lru_cache(maxsize=1)
def shipped_catalogue():
    """The calculators' catalogue of the shipped data set (real records, as the pages embed them).

    Built once per test run and shared: nothing may modify it.
    """
    from conductor_atlas.build import data_folders
    from conductor_atlas.derive import catalogue_of
    from conductor_atlas.load import load_dataset
    return catalogue_of(load_dataset(data_folders()))


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
    cases.extend(scanning_cases())
    return cases


# Texts at every branch of the unit parser's hand-written scanners (typed_text.number_end,
# needs_cleaning, has_lookalikes, has_space): both runtimes must read them alike.
SCANNING_TEXTS = [
    "5", "+5", "-5", "+", "-", ".", ",", ".5", ",5", "5.", "5,", "5.5.5", "5,5.5", "5..5", "1e", "1e5", "1E+5",
    "1e-", "1e+x", "1.e3", ".e3", "-.5e-3 mm", "2,5mm", "2 ,5 mm", "5 .5 mm", "5\u00a0mm", "5\u202fmm",
    "5\u2009mm", "5\u3000mm", "5\u1680mm", "5\u205fmm", "5\u200bmm", "5\u180emm", "5\tmm", "5\nmm",
    "5\rmm", "5\u2028mm", "5\u2029mm", "5\x1cmm", "5\x85mm", "5\x00mm", "5\x7fmm", "\U0001F600 5 mm",
    "5 \U0001F600", "5 mm\U0001F600", "−40 °F", "5 µΩ·cm", "35 mm^2", "35 mm²", "1 m^3", "20 deg C",
    "2.5 sq mm", "250 kcm", "10 ohms", "1 W / ( m * K )", "1 A/ mm2", "3 ppm / K", "  7  ", "", " ",
    # thousands groups and decimal commas (typed_text.grouped_number_text)
    "1,500 ft", "-12,500 m", "1,500,000 m", "1.500.000 m", "12,500.5 m", "1.234,5 m", "1 500 m", "1\u2009500 m",
    "1\u202f500 m", "12 500 000 m", "1 500,5 m", "0,820 m", "1,5 m", "1,5000 m", "1234,567 m", "1.500 m",
    "1,5,5 m", "0 500 m", "1 5000 m", "1,500e3 m", "1,500. m", "1,500.000,5 m",
]


def scanning_cases():
    from conductor_atlas.core.typed_text import normalise_text
    cases = []
    for text in SCANNING_TEXTS:
        cases.append(("conductor_atlas.core.typed_text", "portable_text", [text]))
        cases.append(("conductor_atlas.core.typed_text", "normalise_text", [text]))
        cases.append(("conductor_atlas.core.units", "parse_quantity", [text, "length", "f"]))
        # parse_number and normalise_unit only ever see normalised text (raw control characters
        # are read differently by the two runtimes' patterns, which is why portable_text exists)
        cleaned = normalise_text(text)
        cases.append(("conductor_atlas.core.typed_text", "parse_number", [cleaned, "f"]))
        cases.append(("conductor_atlas.core.units", "normalise_unit", [cleaned]))
        cases.append(("conductor_atlas.core.typed_text", "point_reading_note", [text, "f"]))
        cases.append(("conductor_atlas.core.units", "normalise_unit", [cleaned.lstrip("+-.,0123456789eE")]))
    return cases


def geometry_cases():
    cases = []
    for text in ["35 mm2", "#12", "# 4/0", "4/0", "5/0", "12", "2.5",
                 "12 AWG", "AWG 12", "4/0 AWG", "0000 AWG", "1/0 awg", "56 AWG", "57 AWG", "d 2.5 mm",
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
    catalogue = shipped_catalogue()
    inputs = [
        {"length": "1 km", "size": "10 AWG", "temperature": "20 °C", "current": "10 A"},
        {"length": "35 m", "size": "2.5 mm2", "temperature": "90 degC", "current": "16 A", "frequency": "50 Hz"},
        {"length": "2,5 km", "size": "40 x 5 mm", "temperature": "300 °C", "frequency": "10 kHz"},
        {"length": "100 ft", "size": "4/0 AWG", "temperature": "194 °F", "current": "250 A", "frequency": "400 Hz"},
        {"length": "abc", "size": "5 kg", "temperature": "-300 °C"},
        {"length": "", "size": "", "temperature": "", "current": ""},
        {"length": "1e308 m", "size": "1e-300 mm2"},
        {"length": "-5 m", "size": "d 1.6 mm", "current": "-3 A"},
        {"length": "3 m", "size": "10 ga"},  # read as AWG, and the answer says so
        {"length": "3 m", "size": "2 m2"},  # beyond any conductor: the answer asks about the unit
        {"length": "12 m", "size": "0.5 mm2", "temperature": "-250 °C"},
        {"length": "12 m", "size": "0.5 mm2", "temperature": "4.2 K", "model": "bloch-gruneisen"},
        {"length": "12 m", "size": "0.5 mm2", "temperature": "77 K", "model": "table"},
        {"length": "12 m", "size": "0.5 mm2", "model": "nonsense"},
        {"length": "1 m", "size": "d 1 mm", "temperature": "20 K", "frequency": "1 GHz"},  # anomalous skin effect
        # an overflow is reported on the input that caused it (the current, not the length)
        {"length": "10 m", "size": "2.5 mm2", "current": "1e300 A"},
        {"length": "10 m", "size": "2.5 mm2", "current": "1e300 A", "frequency": "50 Hz"},
        {"length": "1e300 m", "size": "2.5 mm2", "current": "1e300 A"},
    ]
    cases = []
    names = ["IACS", "1350", "Ag", "Cu", "Pt385", "fe", "stainless-304", "film-copper", "coper", "", "copper",
             "Aluminum", "6101", "C17200", "CCS-30", "fe-cr-al", "CCS-40", "CCA-10"]
    for name in names:
        for inp in inputs:
            cases.append(("conductor_atlas.core.calculators", "calculate",
                          ["resistance", {**inp, "material": name}, catalogue]))
        for t in ("20 °C", "77 K", "4.2 K", "75 °C", "500 °C", "1200 K", "-300 °C", "abc"):
            for model in ("auto", "linear", "table", "bloch-gruneisen", "callendar-van-dusen", "matthiessen",
                          "layers"):
                cases.append(("conductor_atlas.core.calculators", "calculate",
                              ["resistivity", {"material": name, "temperature": t, "model": model}, catalogue]))
    cases.append(("conductor_atlas.core.calculators", "calculate", ["nonsense", {}, catalogue]))
    for text in ("Cu", "cu", " IACS ", "annealed copper", "Standard annealed copper", "alu", "", "Xx", "copper",
                 "ALUMINIUM", " aluminum "):
        cases.append(("conductor_atlas.core.lookup", "find_material", [catalogue, text, "material"]))
        cases.append(("conductor_atlas.core.lookup", "trade_word_note", [catalogue, text]))
    for material_id in ("copper", "aluminium", "copper-annealed", "silver"):
        cases.append(("conductor_atlas.core.lookup", "lookup_text", [catalogue, material_id]))
        cases.append(("conductor_atlas.core.trade_words", "link_text", [material_id]))
    # the pruned nearest-name search: unknown names typed a keystroke at a time, several counts
    for text in ("1", "13", "135", "1485.001", "cooper", "alumin", "c1720", "zzzzzzzzzzzzzzzz", "  ni ", "ÅÄ"):
        for count in (0, 1, 5, 12):
            cases.append(("conductor_atlas.core.lookup", "nearest_names", [catalogue, text, count]))
    for text in ("steel", "tinned", "CCS", "copper clad steel", "c", "zirc", "-", "", "brass 70", "Ni Cr"):
        cases.append(("conductor_atlas.core.lookup", "names_with_words", [catalogue, text, 5]))
    for text in ("magnet wire", "busbar", "heater", "shunt", "wire", "", "zzz"):
        cases.append(("conductor_atlas.core.lookup", "materials_used_for", [catalogue, text, 4]))
        cases.append(("conductor_atlas.core.lookup", "find_material", [catalogue, text, "material"]))
    cases.extend(new_calculator_cases(catalogue))
    return cases


def new_calculator_cases(catalogue):
    """The skin-effect, carriers, thin-film, temperature-rise, compare and sizing calculators, called
    through their own modules (so each shipped module has cases) and once each through the registry."""
    cases = []

    def add(name, function, inputs):
        cases.append(("conductor_atlas.core.calc_" + name, "calculate", [inputs, catalogue]))

    for material in ("IACS", "Cu", "1350", "Fe", "ni", "stainless-304", "Pt385", "xx", "", "CCS-40", "CCA-15"):
        for f, size, t in (("50 Hz", "240 mm2", "20 °C"), ("1 MHz", "d 1 mm", "90 °C"), ("10 kHz", "100 x 10 mm", ""),
                           ("400 Hz", "", "77 K"), ("0 Hz", "", ""), ("1e308 Hz", "4/0 AWG", ""), ("-5 Hz", "abc", "x"),
                           ("", "", ""), ("60 Hz", "12 AWG", "-300 °C")):
            add("skin_effect", "", {"material": material, "frequency": f, "size": size, "temperature": t})
    # the mean free path: on record (as recorded, scaled), free-electron (Na, K), none (Ti); ℓ/δ either side of 0.3
    for material in ("Cu", "Ag", "Al", "Na", "K", "titanium", "cobalt"):
        for f, t in (("10 GHz", "295 K"), ("1 GHz", "20 K"), ("100 GHz", ""), ("50 Hz", "4.2 K"),
                     ("1 THz", ""), ("7 THz", ""), ("1.5 THz", "77 K")):
            add("skin_effect", "", {"material": material, "frequency": f, "temperature": t})
    for material in ("Cu", "Ag", "Au", "Al", "Na", "K", "Fe", "W", "IACS", "film-copper", ""):
        for extra in ({}, {"temperature": "77 K"}, {"current_density": "4 A/mm2"}, {"current": "10 A", "size": "1 mm2"},
                      {"current": "10 A"}, {"current": "10 A", "current_density": "1 A/mm2"},
                      {"current_density": "-1 A/mm2"}, {"temperature": "4.2 K", "model": "bloch-gruneisen"},
                      {"size": "2.5 mm2"}):
            add("carriers", "", {"material": material, **extra})
    for material in ("film-copper", "Cu", "W", "film-ruthenium", "Ag", "IACS", "Fe", "xx"):
        for extra in ({"thickness": "20 nm"}, {"thickness": "20 nm", "reflection": "0.3"},
                      {"thickness": "5 nm", "specularity": "0.5", "reflection": "0.4", "grain_size": "10 nm"},
                      {"thickness": "1 um", "specularity": "50 %", "temperature": "77 K"},
                      {"thickness": "20 nm", "specularity": "1"}, {"thickness": "-1 nm"}, {"thickness": ""},
                      {"thickness": "20 nm", "mean_free_path": "10 nm", "grain_size": "5 nm"},
                      {"thickness": "1e-300 m"}, {"thickness": "1e300 m"},
                      {"thickness": "20 nm", "reflection": "0.9", "grain_size": "0.1 nm"}):
            add("thin_film", "", {"material": material, **extra})
    for material, k in (("IACS", ""), ("Cu", ""), ("1350", ""), ("Al", ""), ("Ag", ""), ("cu-ni-55-45", ""),
                        ("steel-low-carbon", ""), ("", "234.5"), ("", "-225 °C"), ("", "234.5 K"), ("", "20 °C"),
                        ("", ""), ("", "abc"), ("", "0"), ("Cu", "235"), ("xx", ""), ("1350", "234.5"),
                        ("IACS", "225"), ("Ag", "100")):
        for r1, t1, r2, coolant in (("10 ohm", "20 °C", "12.5 ohm", ""), ("125 mohm", "25 °C", "160 mohm", "30 °C"),
                                    ("10 ohm", "20 °C", "1 ohm", ""), ("0 ohm", "", "-1 ohm", "abc")):
            add("temperature_rise", "", {"material": material, "k": k, "resistance_cold": r1, "temperature_cold": t1,
                                         "resistance_hot": r2, "coolant": coolant})
    # a curved ρ(T) read backwards (core.winding_temperature): inside and beyond the linear span, the
    # table's end, a sensor curve, an estimate, a ratio no solid winding reaches
    for material in ("ni", "Pt385", "W", "Ag", "phosphor-bronze", "CCS-40", "cu-ni-55-45", "Fe"):
        for r2 in ("1.3 ohm", "3 ohm", "7 ohm", "0.5 ohm", "1 ohm"):
            add("temperature_rise", "", {"material": material, "k": "", "resistance_cold": "1 ohm",
                                         "temperature_cold": "20 °C", "resistance_hot": r2, "coolant": ""})
    wt = "conductor_atlas.core.winding_temperature"
    for material_id in ("nickel", "platinum-pt385", "phosphor-bronze", "copper-annealed"):
        m = catalogue["materials"][material_id]
        cases.append((wt, "curved_model", [m, 293.15]))
        for key in ("table", "callendar-van-dusen", "matthiessen"):
            for ratio in (0.5, 1.0, 1.3, 3.0, 7.0):
                cases.append((wt, "temperature_for_ratio", [m, 293.15, ratio, key]))
    for pair in (("IACS", "1350"), ("Cu", "Ag"), ("IACS", "cca-10"), ("1350", "IACS"), ("IACS", "IACS"),
                 ("IACS", "chromium-zirconium-copper"), ("IACS", "6101"), ("IACS", "xx"), ("", "")):
        for size, t in (("", ""), ("35 mm2", "90 °C"), ("4/0 AWG", ""), ("2000 mm2", ""), ("d 2 mm", "77 K"),
                        ("abc", ""), ("100 x 10 mm", ""), ("40 x 5 mm", "90 °C"), ("0 x 10 mm", "")):
            add("compare", "", {"material": pair[0], "other": pair[1], "size": size, "temperature": t})
    for material in ("IACS", "1350", "Cu", "xx"):
        for extra in ({}, {"max_drop": "6.9 V", "supply": ""}, {"conductors": "3-phase", "supply": "400 V"},
                      {"conductors": "1"}, {"conductors": "3"}, {"max_drop": "3"}, {"max_drop": "3 %", "supply": ""},
                      {"max_drop": "300 V"}, {"length": "20 km", "current": "400 A"}, {"length": "-3 m", "current": "0 A"},
                      {"max_drop": "150 %"}, {"max_drop": "30 %"}, {"length": "1 mm", "current": "1 mA", "max_drop": "10 V"}):
            add("sizing", "", {"material": material, "length": "30 m", "current": "16 A", "max_drop": "3 %",
                               "supply": "230 V", "conductors": "2", "temperature": "70 °C", **extra})
    check = {"material": "IACS", "resistance": "0.736 ohm", "temperature": "23.5 °C", "length": "100 m",
             "size": "2.5 mm2", "conductor_class": "2", "model": "auto"}
    for material in ("IACS", "tinned copper", "1350", "copper-hard-drawn", "6101", "stainless-304", "Pt385", "xx", ""):
        for extra in ({}, {"conductor_class": "1"}, {"conductor_class": "5", "size": "95 mm2", "resistance": "20 mohm"},
                      {"conductor_class": "6", "size": "300 mm2"}, {"conductor_class": "class 2", "size": "3 mm2"},
                      {"size": "12 AWG", "resistance": "0.53 ohm"}, {"size": "d 1.6 mm"}, {"size": "10 ga", "resistance": "0.53 ohm"}, {"size": "40 x 5 mm"},
                      {"conductor_class": ""}, {"conductor_class": "4"}, {"temperature": "45 °C", "length": "0.5 m"},
                      {"temperature": "-300 °C"}, {"resistance": "-1 ohm", "length": "0 m"},
                      {"resistance": "1e308 ohm", "length": "1e-300 m"}, {"size": "10 mm2", "temperature": "4.2 K",
                                                                            "model": "table"}):
            add("measured_check", "", {**check, "material": material, **extra})
    fault = {"material": "IACS", "current": "12 kA", "duration": "0.5 s", "size": "95 mm2", "initial": "90 °C",
             "final": "250 °C", "model": "auto"}
    for material in ("IACS", "Cu", "1350", "Al", "6101", "Ag", "Fe", "stainless-304", "xx"):
        for extra in ({}, {"size": ""}, {"duration": ""}, {"final": ""}, {"final": "", "size": "1 mm2"},
                      {"duration": "10 s", "final": "160 °C"}, {"initial": "300 °C"}, {"current": "0 A"},
                      {"duration": "200 ms", "size": "4/0 AWG", "final": ""}, {"size": "", "final": ""},
                      {"size": "60 x 10 mm", "current": "40 kA"}, {"model": "table", "initial": "20 °C"},
                      {"duration": "", "current": "100 A"}):
            add("short_circuit", "", {**fault, "material": material, **extra})
    # answers with ranges (core.ranges): every ranged material through several calculators
    for material in ("copper-hard-drawn", "copper-tinned", "aluminium-6101", "fe-cr-al"):
        for name, extra in (("resistance", {"length": "100 m", "size": "2.5 mm2", "current": "10 A",
                                            "frequency": "50 Hz"}),
                            ("skin-effect", {"frequency": "1 MHz", "size": "d 1 mm"}),
                            ("short-circuit", {"current": "8 kA", "duration": "0.3 s", "size": "95 mm2",
                                               "initial": "70 °C", "final": ""}),
                            ("sizing", {"length": "30 m", "current": "16 A", "max_drop": "3 %", "supply": "230 V",
                                        "conductors": "2", "temperature": "20 °C"}),
                            ("compare", {"other": "IACS", "size": "35 mm2"})):
            cases.append(("conductor_atlas.core.calculators", "calculate", [name, {"material": material, **extra},
                                                                            catalogue]))
    # both sides of a comparison ranged: four corner runs
    for material, other in (("copper-hard-drawn", "aluminium-6101"), ("aluminium-6101", "copper-tinned")):
        cases.append(("conductor_atlas.core.calculators", "calculate",
                      ["compare", {"material": material, "other": other, "size": "95 mm2"}, catalogue]))
    rg = "conductor_atlas.core.ranges"
    cases.append((rg, "scaled_record", [catalogue["materials"]["copper-hard-drawn"], 1.01]))
    cf = "conductor_atlas.core.conformance"
    for t in (278.15, 293.15, 296.65, 308.15):
        for beta in (234.5, 228.0):
            cases.append((cf, "iec60228_correction_factor", [t, beta]))
    cases.append((cf, "margin_to_limit", [7.26e-3, 7.41e-3]))
    cases.append((cf, "nominal_row", [[5e-7, 7.5e-7, 1e-6, 1.5e-6], 1.0e-6]))
    sc = "conductor_atlas.core.short_circuit"
    for k, beta in ((226e6, 234.5), (148e6, 228.0)):
        cases.append((sc, "iec60949_final_temperature", [12000.0, 0.5, 95e-6, k, beta, 363.15]))
        cases.append((sc, "iec60949_min_area", [12000.0, 0.5, k, beta, 363.15, 523.15]))
        cases.append((sc, "iec60949_max_time", [12000.0, 95e-6, k, beta, 363.15, 523.15]))
    cases.append((sc, "iec60949_k", [3.45e6, 1.7241e-8, 234.5]))
    cases.append((sc, "iec60949_max_time", [1e-300, 95e-6, 226e6, 234.5, 363.15, 523.15]))
    cases.append((sc, "linear_heat_integral", [3.45e6, 1.7241e-8, 0.00393, 293.15, 363.15, 523.15]))
    for name in ("skin-effect", "carriers", "thin-film", "temperature-rise", "compare", "sizing", "measured-check",
                 "short-circuit"):
        cases.append(("conductor_atlas.core.calculators", "calculate", [name, {"material": "Cu"}, catalogue]))
    sz = "conductor_atlas.core.size_effect"
    for kappa in (1e-3, 0.05, 0.5, 3.0, 100.0):
        for p in (0.0, 0.5):
            cases.append((sz, "fuchs_sondheimer_ratio", [kappa, p]))
            for alpha in (1e-6, 0.3, 5.0):
                cases.append((sz, "film_resistivity_ratio", [kappa, p, alpha]))
    cases.append((sz, "mayadas_shatzkes_ratio", [0.7]))
    cases.append((sz, "mayadas_shatzkes_ratio", [20.0]))
    fe = "conductor_atlas.core.carriers"
    for n in (8.47e28, 2.65e28, 1.81e29):
        for fn in ("fermi_energy", "fermi_velocity", "fermi_wavenumber", "plasma_frequency_hz", "rho_lambda_product"):
            cases.append((fe, fn, [n]))
        cases.append((fe, "mean_free_path", [1.7e-8, n]))
        cases.append((fe, "relaxation_time", [1.7e-8, n]))
    pr = "conductor_atlas.core.practice"
    cases.append((pr, "resistance_method_temperature", [10.0, 293.15, 12.5, 234.5]))
    cases.append((pr, "temperature_rise", [10.0, 293.15, 12.5, 298.15, 225.0]))
    cases.append((pr, "voltage_drop_min_area", [1.7241e-8, 16.0, 30.0, 6.9, 2.0]))
    cases.append((pr, "equal_resistance_mass_ratio", [1.7241e-8, 8890.0, 2.8264e-8, 2703.0]))
    mm = "conductor_atlas.core.material_models"
    for name in ("copper", "platinum-pt385", "aluminium-1350", "stainless-304"):
        for t in (4.2, 77.0, 293.15, 600.0):
            cases.append((mm, "resistivity_at", [catalogue["materials"][name], t, "auto"]))
    return cases


def fs_mesh_example():
    """A quarter of a 20 x 3 mm bar cut 3 x 3 (graded), as core.filament_mesh.filament_mesh builds it."""
    from conductor_atlas.core.filament_mesh import filament_mesh
    return filament_mesh([[0.0, 0.01, 0.0, 0.0015, False, True, False, True, 0, 1.7241e-8]], 9.3e-3, 1.0)


def filament_cases():
    """The filament solver and its geometric mean distances (small, fast layouts)."""
    fi = "conductor_atlas.core.filament_inductance"
    fs = "conductor_atlas.core.filament_solver"
    cl = "conductor_atlas.core.complex_linear"
    fm = "conductor_atlas.core.filament_mesh"
    fx = "conductor_atlas.core.filament_matrix"
    cases = []
    for placement in ([0.0, 0.0, 1e-3, 1e-3, 0.0, 0.0, 1e-3, 1e-3], [0.0, 0.0, 2e-3, 5e-4, 1.5e-3, 2e-4, 1e-3, 1e-3],
                      [0.0, 0.0, 1e-3, 1e-3, 4e-3, 3e-3, 1e-3, 2e-3], [0.0, 0.0, 1e-3, 1e-3, 0.05, -0.02, 1e-3, 2e-3]):
        cases.append((fi, "rectangle_log_gmd", placement))
    for placement in ([0.0, 0.0, 1e-3, 1e-3, 0.0, 0.0, 1e-3, 1e-3], [0.0, 0.0, 2e-3, 5e-4, 1.5e-3, 2e-4, 1e-3, 1e-3]):
        cases.append((fi, "rectangle_log_gmd_exact", placement))  # near: where the closed form is used
    cases.append((fi, "rectangle_log_gmd_far", [0.0, 0.0, 1e-3, 1e-3, 0.05, -0.02, 1e-3, 2e-3]))
    cases.append((fi, "far_field_correction", [0.05, -0.02, 1e-3, 1e-3, 1e-3, 2e-3]))
    for uv in ([0.0, 0.0], [1e-3, 0.0], [0.0, 2e-3], [1e-3, 2e-3], [0.3, 1e-5]):
        cases.append((fi, "corner_term", uv))
    for rings in ([0.0, 1e-3, 0.0, 1e-3], [0.0, 1e-3, 1e-3, 2e-3], [1e-3, 2e-3, 0.0, 1e-3], [1e-3, 1.1e-3, 1e-3, 1.1e-3]):
        cases.append((fi, "annulus_log_gmd", rings))
    cases.append((cl, "solve_complex", [[2.0, 1.0, 0.5, 3.0], [0.1, -1.0, 2.0, 0.0], [1.0, 2.0], [0.0, 1.0], 2]))
    cases.append((cl, "solve_complex", [[0.0, 0.0, 0.0, 0.0], [0.0, 0.0, 0.0, 0.0], [1.0, 2.0], [0.0, 1.0], 2]))
    # the symmetric solver reads the packed upper triangle: [a00, a01, a11] for n = 2
    cases.append((cl, "solve_complex_symmetric", [[2.0, 0.5, 3.0], [1.0, -0.3, 2.0], [1.0, 2.0], [0.0, 1.0], 2]))
    cases.append((cl, "solve_complex_symmetric", [[0.0, 0.0, 0.0], [0.0, 0.0, 0.0], [1.0, 2.0], [0.0, 1.0], 2]))
    cases.append((cl, "solve_complex_symmetric", [[1.0, 1.0, 1.0], [0.0, 0.0, 0.0], [1.0, 2.0], [0.0, 1.0], 2]))
    # n = 5: a block of four pivots and a last one alone (a 1 / (1 + |i - j|) kernel, diagonal 2 + k / 2)
    sym_r = []
    sym_i = []
    for i in range(5):
        for j in range(i, 5):
            sym_r.append(2.0 + 0.5 * i if i == j else 0.1 / (1 + j - i))
            sym_i.append(3.0 if i == j else 1.0 / (1 + j - i))
    cases.append((cl, "solve_complex_symmetric", [sym_r, sym_i, [1.0, 0.0, 2.0, 1.0, 1.0], [0.0, 1.0, 0.0, 0.5, 0.0], 5]))
    # n = 10: two blocks of four (the second updated by the first) and a last block of two; same kernel
    sym_r = []
    sym_i = []
    for i in range(10):
        for j in range(i, 10):
            sym_r.append(2.0 + 0.5 * i if i == j else 0.1 / (1 + j - i))
            sym_i.append(3.0 if i == j else 1.0 / (1 + j - i))
    rhs = [1.0, 0.0, 2.0, 1.0, 1.0, -1.0, 0.5, 0.0, 3.0, 1.0]
    cases.append((cl, "solve_complex_symmetric", [sym_r, sym_i, rhs, [0.0, 1.0, 0.0, 0.5, 0.0, 0.0, 1.0, 2.0, 0.0, -0.5], 10]))
    # n = 11: the rows after a block go two at a time, an odd one alone (7 rows after the first block:
    # three pairs and one; 3 after the second: a pair and one), then a last block of three; same kernel
    sym_r = []
    sym_i = []
    for i in range(11):
        for j in range(i, 11):
            sym_r.append(2.0 + 0.5 * i if i == j else 0.1 / (1 + j - i))
            sym_i.append(3.0 if i == j else 1.0 / (1 + j - i))
    rhs = [1.0, 0.0, 2.0, 1.0, 1.0, -1.0, 0.5, 0.0, 3.0, 1.0, -2.0]
    cases.append((cl, "solve_complex_symmetric", [sym_r, sym_i, rhs, [0.0, 1.0, 0.0, 0.5, 0.0, 0.0, 1.0, 2.0, 0.0, -0.5, 1.0], 11]))
    for ij in ([0, 0, 5], [1, 3, 5], [4, 4, 5]):
        cases.append((cl, "packed_index", ij))
    cases.append((cl, "back_substitute", [[2.0, 1.0, 0.0, 1.0], [0.0, 0.5, 0.0, 1.0], [3.0, 1.0], [0.0, 1.0], [0, 2]]))
    cases.append((cl, "back_substitute", [[2.0, 1.0, 1.0], [0.0, 0.5, 1.0], [3.0, 1.0], [0.0, 1.0], [0, 1]]))
    for args in ([0.0, 0.05, False, True, 9.3e-3, 1], [0.0, 0.005, True, True, 9.3e-3, 2], [0.0, 0.1, False, False, 1e-3, 1]):
        cases.append((fm, "graded_cells", args))
    rho = 1.7241e-8
    cases.append((fm, "graded_edges", [0.0, 0.05, False, True, 9.3e-3, 2]))
    cases.append((fm, "graded_edges", [0.0, 0.01, True, True, 1e-3, 1]))
    cases.append((fm, "filament_mesh", [[[0.0, 0.01, 0.0, 0.0015, False, True, False, True, 0, rho]], 9.3e-3, 1.0]))
    cases.append((fm, "filament_mesh", [[[0.0, 0.01, 0.0035, 0.0065, False, True, True, True, 0, rho],
                                         [0.0, 0.01, 0.0, 0.0015, False, True, False, True, 1, rho]], 9.3e-3, 2.0]))
    cases.append((fm, "filament_mesh", [[[0.0, 0.5, 0.0, 0.0015, False, True, False, True, 0, rho]], 1e-5, 1.0]))
    for sym in ([1.0, 1.0], [1.0, -1.0], [0.0, 1.0], [0.0, 0.0]):
        cases.append((fm, "mirror_images", sym))
    # the solver's matrix of a small quarter mesh (edges and filaments as filament_mesh builds them)
    quarter = fs_mesh_example()
    cases.append((fx, "filament_log_gmds", [quarter, 1.0, 1.0]))
    cases.append((fx, "filament_log_gmds", [quarter, 1.0, -1.0]))
    cases.append((fx, "filament_log_gmds", [quarter, 0.0, 0.0]))
    cases.append((fx, "filament_currents", [quarter, 50.0, 1.0, 1.0]))
    cases.append((fx, "filament_currents", [quarter, 400.0, 1.0, -1.0]))
    cases.append((fs, "bar_group_solution", [0.04, 0.005, 1, 0.0, rho, 50.0]))
    cases.append((fs, "bar_group_solution", [0.02, 0.003, 3, 0.005, rho, 50.0]))
    cases.append((fs, "bar_group_solution", [0.02, 0.003, 0, 0.005, rho, 50.0]))
    cases.append((fs, "bar_pair_solution", [0.02, 0.003, 0.01, rho, 60.0]))
    cases.append((fs, "round_layers_solution", [[[9.49e-4, 2.8264e-8], [1e-3, rho]], 1e6]))
    cases.append((fs, "round_layers_solution", [[[5e-3, rho]], 50.0]))
    # the tabulated single bar: inside the grid (power bars, a square bar, a thin strip, turned), outside
    # it (too few or too many skin depths, too thin), an unsettled stencil, bad inputs
    lookup = "conductor_atlas.core.bar_ratio_lookup"
    for args in ([0.1, 0.01, rho, 50.0], [0.2, 0.01, 2.8264e-8, 60.0], [0.04, 0.005, rho, 400.0],
                 [0.01, 0.01, rho, 2e3], [0.02, 0.0005, rho, 1e4], [0.01, 0.1, rho, 50.0], [0.002, 0.001, rho, 50.0],
                 [0.5, 0.01, rho, 400.0], [0.1, 1e-5, rho, 50.0], [0.1, 0.01, rho, 400.0], [0.0, 0.01, rho, 50.0],
                 [0.1, 0.01, rho, -50.0]):
        cases.append((lookup, "tabulated_bar_ratio", args))
    for size, f in (("100 x 10 mm", "50 Hz"), ("40 x 5 mm", "60 Hz"), ("100 x 10 mm", "400 Hz")):
        cases.append(("conductor_atlas.core.calc_skin_effect", "calculate",
                      [{"material": "Cu", "frequency": f, "size": size, "arrangement": "single"}, shipped_catalogue()]))
    rp = "conductor_atlas.core.round_pair"
    # a round go-and-return pair: 50 Hz to 1 MHz, far and near (D = 2.2 a), a wire of 1 mm at 1 GHz
    for args in ([0.01, 0.03, rho, 50.0], [0.01, 0.022, rho, 1e3], [0.01, 0.022, rho, 1e6], [5e-4, 2e-3, rho, 1e9],
                 [0.01, 0.02, rho, 50.0], [0.01, 1.0, rho, 50.0]):
        cases.append((rp, "round_pair_solution", args))
    for arrangement, size, material in (("pair, 30 mm", "d 20 mm", "IACS"), ("pair, 2.2 mm", "d 2 mm", "Cu"),
                                        ("pair, 30 mm", "d 20 mm", "steel-low-carbon"), ("pair, 15 mm", "d 20 mm", "Al"),
                                        ("3 bars, gap 5 mm", "d 20 mm", "Cu"), ("pair, 30 mm", "300 mm2", "Cu"),
                                        ("pair, 3 mm", "d 2 mm", "CCS-40")):
        cases.append(("conductor_atlas.core.calc_skin_effect", "calculate",
                      [{"material": material, "frequency": "1 kHz", "size": size, "arrangement": arrangement},
                       shipped_catalogue()]))
    lr = "conductor_atlas.core.layered_round"
    for x in (1e-3, 0.7, 5.0, 16.0, 40.0, 2500.0):
        cases.append((lr, "kelvin_k_scaled", [x]))
    rho_st = 14.2e-8
    for f in (50.0, 6e4, 1e6, 1e9, 1e13):
        cases.append((lr, "layered_round_resistance_ratio", [4.1e-4, 5e-4, rho_st, 200.0, rho / 0.97, 1.0, f]))
    cases.append((lr, "layered_round_impedance", [0.0, 5e-4, rho_st, 200.0, rho, 1.0, 1e6]))
    cases.append((lr, "layered_round_impedance", [5e-4, 5e-4, rho_st, 200.0, rho, 1.0, 1e6]))
    cases.append((lr, "layered_round_impedance", [6e-4, 5e-4, rho_st, 200.0, rho, 1.0, 1e6]))
    cases.append((lr, "layered_round_dc_resistance", [4.1e-4, 5e-4, rho_st, rho]))
    cases.append((lr, "core_radius_for_cladding_share", [5e-4, 0.328]))
    catalogue = shipped_catalogue()
    for name in ("copper-clad-steel-40", "copper-annealed"):
        cases.append(("conductor_atlas.core.clad_layers", "is_clad", [catalogue["materials"][name]]))
    for text in ("", "single", "3 bars, gap 10 mm", "2 bars gap 5 mm", "pair, 30 mm", "go-and-return 4 cm", "pair at 25 mm",
                 "bars 3", "12 bars, gap 1 mm", "3 bars", "pair", "1 bar", "zig"):
        cases.append(("conductor_atlas.core.ac_layout", "parse_arrangement", [text, "arrangement"]))
    return cases


LIVE_SOLVER_EXTRA = [
    # [calculator, inputs]: bars, groups and pairs either side of what the live solvers take
    ["resistance", {"material": "Cu", "length": "10 m", "size": "30 x 3 mm", "frequency": "50 Hz"}],
    ["resistance", {"material": "Cu", "length": "10 m", "size": "30 x 3 mm", "frequency": ""}],
    ["resistance", {"material": "Cu", "length": "-1 m", "size": "30 x 3 mm", "frequency": "50 Hz"}],
    ["resistance", {"material": "Fe", "length": "10 m", "size": "30 x 3 mm", "frequency": "50 Hz"}],
    ["resistance", {"material": "CCS-40", "length": "10 m", "size": "30 x 3 mm", "frequency": "50 Hz"}],
    ["resistance", {"material": "Cu", "length": "10 m", "size": "30 x 3 mm", "frequency": "1e14 Hz"}],
    ["skin-effect", {"material": "Cu", "frequency": "50 Hz", "size": "30 x 3 mm", "arrangement": "2 bars, gap 3 mm"}],
    ["skin-effect", {"material": "Al", "frequency": "60 Hz", "size": "30 x 3 mm", "arrangement": "pair, 10 mm"}],
    ["skin-effect", {"material": "Al", "frequency": "60 Hz", "size": "30 x 3 mm", "arrangement": "pair, 2 mm"}],
    ["skin-effect", {"material": "Cu", "frequency": "50 Hz", "size": "30 x 3 mm", "arrangement": "3 bars"}],
    ["skin-effect", {"material": "Cu", "frequency": "50 Hz", "size": "30 x 3 mm", "arrangement": "zig"}],
    ["skin-effect", {"material": "Cu", "frequency": "50 Hz", "size": "d 20 mm", "arrangement": "pair, 30 mm"}],
    ["skin-effect", {"material": "Cu", "frequency": "50 Hz", "size": "d 20 mm", "arrangement": "pair, 15 mm"}],
    ["skin-effect", {"material": "Fe", "frequency": "50 Hz", "size": "d 20 mm", "arrangement": "pair, 30 mm"}],
    ["skin-effect", {"material": "Cu", "frequency": "50 Hz", "size": "70 mm2", "arrangement": "pair, 30 mm"}],
    ["skin-effect", {"material": "Fe", "frequency": "50 Hz", "size": "30 x 3 mm", "arrangement": "single"}],
    ["skin-effect", {"material": "CCS-40", "frequency": "50 Hz", "size": "30 x 3 mm", "arrangement": "single"}],
    ["skin-effect", {"material": "nonsense", "frequency": "50 Hz", "size": "30 x 3 mm", "arrangement": "single"}],
    ["skin-effect", {"material": "Cu", "frequency": "0 Hz", "size": "30 x 3 mm", "arrangement": "single"}],
    # single bars outside the tabulated grid (core.bar_ratio_lookup): 48 δ square, under 1.2 δ wide
    ["skin-effect", {"material": "Cu", "frequency": "100 kHz", "size": "10 x 10 mm", "arrangement": "single"}],
    ["skin-effect", {"material": "Cu", "frequency": "50 Hz", "size": "2 x 1 mm", "arrangement": "single"}],
    ["resistance", {"material": "Cu", "length": "10 m", "size": "10 x 10 mm", "frequency": "100 kHz"}],
    ["resistance", {"material": "Cu", "length": "10 m", "size": "2 x 1 mm", "frequency": "50 Hz"}],
    ["skin-effect", {"material": "Cu", "frequency": "50 Hz", "size": "20 x 0.1 mm", "arrangement": "single"}],
    ["skin-effect", {"material": "Al", "frequency": "50 Hz", "size": "100 x 10 mm", "arrangement": "2 bars, gap 10 mm"}],
    ["sizing", {"material": "Cu"}],
]


def live_solver_cases():
    """calculators.needs_live_solver over every resistance and skin-effect input of the other cases
    (through the registry or the calculator's own module) and LIVE_SOLVER_EXTRA; each case is
    [calculator, inputs, catalogue] (tests/core/test_live_solver.py runs the updates themselves)."""
    catalogue = shipped_catalogue()
    found = []
    for module, function, args in calculator_cases() + filament_cases():
        if function != "calculate":
            continue
        if module == "conductor_atlas.core.calculators" and args[0] in ("resistance", "skin-effect"):
            found.append([args[0], args[1], catalogue])
        elif module in ("conductor_atlas.core.calc_resistance", "conductor_atlas.core.calc_skin_effect"):
            found.append([module.rsplit("calc_", 1)[1].replace("_", "-"), args[0], catalogue])
    for name, inputs in LIVE_SOLVER_EXTRA:
        found.append([name, inputs, catalogue])
    return found


def ac_part_cases():
    """The AC part's registry and the resistance calculator's AC results (core.ac_part,
    core.calc_resistance_ac), and the predicate over the calculators' inputs."""
    from conductor_atlas.core.geometry import parse_size
    catalogue = shipped_catalogue()
    cases = [("conductor_atlas.core.ac_part", "part_function", ["no-such-function"]),
             ("conductor_atlas.core.ac_part", "mark_pending", [{"results": {}}])]
    ra = "conductor_atlas.core.calc_resistance_ac"
    for material in ("copper-annealed", "iron", "copper-clad-steel-40"):
        m = catalogue["materials"][material]
        for size in ("100 x 10 mm", "d 20 mm", "2.5 mm2"):
            cases.append((ra, "live_solver_for", [m, 293.15, m["rho_ref"], 50.0, parse_size(size)]))
    for size, f in (("d 20 mm", 50.0), ("d 2 mm", 1e5), ("10 AWG", 400.0)):
        cases.append((ra, "ac_ratio", [{"results": {}, "warnings": [], "sources": []}, parse_size(size), 1.7241e-8, f,
                                       1.0, None]))
    for case in live_solver_cases():
        cases.append(("conductor_atlas.core.calculators", "needs_live_solver", case))
    # the inputs a page warms a calculator with (calc-form.js warmUp), and the update they make
    for name in ("skin-effect", "resistance", "sizing"):
        cases.append(("conductor_atlas.core.calculators", "warm_up_inputs", [name, {"material": "IACS", "size": "240 mm2"}]))
    for name, inputs in (("skin-effect", {"material": "IACS", "frequency": "50 Hz", "size": "100 x 10 mm",
                                          "arrangement": "single", "temperature": "20 °C", "model": "auto"}),
                         ("resistance", {"material": "copper-annealed", "length": "100 m", "size": "100 x 10 mm",
                                         "temperature": "20 °C", "current": "", "frequency": "50 Hz", "model": "auto"})):
        cases.append(("conductor_atlas.core.calculators", "calculate", [name, inputs, catalogue]))
    return cases


def all_cases():
    return (unit_cases() + geometry_cases() + numfmt_cases() + resistance_cases() + calculator_cases()
            + search_cases() + model_cases() + physics_cases() + filament_cases() + ac_part_cases())


def model_cases():
    """Direct cases for the core models the calculators lean on."""
    tm = "conductor_atlas.core.temperature_models"
    sk = "conductor_atlas.core.skin_effect"
    cases = []
    for t in (4.2, 20.0, 77.0, 150.0, 293.15, 600.0, 1200.0):
        cases.append((tm, "bloch_gruneisen_resistivity", [t, 1e-11, 5.5e-8, 330.0]))
        cases.append((tm, "interpolate_table", [t, [20.0, 100.0, 300.0, 600.0], [1e-11, 3.5e-9, 1.7e-8, 3.9e-8]]))
    for n in (2, 10, 20, 100, 1):
        cases.append(("conductor_atlas.core.quadrature", "gauss_legendre", [n]))
    for t in (73.15, 173.15, 273.15, 373.15, 1123.15, 50.0):
        cases.append((tm, "callendar_van_dusen_resistance", [t, 100.0, 3.9083e-3, -5.775e-7, -4.183e-12]))
    for r in (18.5201, 60.0, 100.0, 138.5055, 390.0, -1.0):
        cases.append((tm, "callendar_van_dusen_temperature", [r, 100.0, 3.9083e-3, -5.775e-7, -4.183e-12]))
    for x in (0.0, 1e-3, 0.5, 2.0, 8.0, 16.4, 16.6, 40.0, 300.0, 2000.0, 1e4):
        cases.append((sk, "kelvin_resistance_ratio", [x]))
        cases.append(("conductor_atlas.core.kelvin_functions", "kelvin_scaled", [x]))
    for f in (50.0, 1e3, 1e6, 1e9, 0.0, -5.0):
        cases.append((sk, "skin_depth", [1.7241e-8, f, 1.0]))
        cases.append((sk, "rectangular_bar_resistance_ratio", [0.04, 0.005, 1.7241e-8, f, 1.0]))
    for t in (363.15, 4.2, 0.0, 293.15, 1e4):
        cases.append(("conductor_atlas.core.numfmt", "temperature_text", [t]))
        cases.append(("conductor_atlas.core.numfmt", "celsius_text", [t]))
        cases.append(("conductor_atlas.core.numfmt", "temperature_span_text", [t, t + 200.0]))
    for inputs, field in (({"length": " 1,5 m "}, "length"), ({"length": None}, "length"), ({}, "length"),
                          ({"size": "2.5\u00a0mm²"}, "size")):
        cases.append(("conductor_atlas.core.calc_inputs", "field_text", [inputs, field]))
    for errors in ({}, {"length": "must be greater than zero"}):
        cases.append(("conductor_atlas.core.outcome", "has_errors", [{"errors": errors}]))
    # a keyed record's keys in the order stored (result and field names, not sorted)
    for record in ({}, {"resistance": 1.0, "area": 2.0, "mass": 3.0, "skin_depth": 4.0}, {"z": 0, "a": 1}):
        cases.append(("conductor_atlas.core.outcome", "keys_of", [record]))
        cases.append(("conductor_atlas.core.outcome", "has_keys", [record]))
    for how in ("rho-lambda", "record"):
        cases.append(("conductor_atlas.core.calc_common", "mean_free_path_origin", [{"mean_free_path_how": how}]))
    cases.append(("conductor_atlas.core.calc_inputs", "read_temperature",
                  [{"errors": {}, "warnings": []}, {"temperature": "90 °C"}, "temperature"]))
    return cases


def physics_cases():
    """Direct cases for carriers, size effect, practice and the model selector."""
    fe = "conductor_atlas.core.carriers"
    se = "conductor_atlas.core.size_effect"
    pr = "conductor_atlas.core.practice"
    cases = []
    for n in (2.65e28, 8.47e28, 18.1e28, 0.0, -1.0):
        for fn in ("fermi_wavenumber", "fermi_energy", "fermi_velocity", "plasma_frequency", "rho_lambda_product"):
            cases.append((fe, fn, [n]))
        cases.append((fe, "relaxation_time", [1.7e-8, n]))
        cases.append((fe, "mean_free_path", [1.7e-8, n]))
        cases.append((fe, "drift_velocity", [4e6, n]))
    cases.append((fe, "electron_density", [8960.0, 0.063546, 1.0]))
    cases.append((fe, "wiedemann_franz_thermal_conductivity", [1.7e-8, 293.15]))
    for kappa in (1e-3, 0.1, 1.0, 10.0, 1e3, 0.0):
        for p in (0.0, 0.5, 1.0):
            cases.append((se, "fuchs_sondheimer_ratio", [kappa, p]))
    for alpha in (0.0, 0.01, 0.3, 3.0, -1.0):
        cases.append((se, "mayadas_shatzkes_ratio", [alpha]))
    for kappa, alpha in ((0.5, 0.43), (2.0, 0.1)):
        cases.append((se, "film_resistivity_ratio", [kappa, 0.0, alpha]))
    cases.append((se, "mayadas_shatzkes_alpha", [39.9e-9, 20e-9, 0.3]))
    cases.append((pr, "resistance_method_temperature", [10.0, 293.15, 12.5, 234.5]))
    cases.append((pr, "temperature_rise", [10.0, 293.15, 12.5, 298.15, 234.5]))
    cases.append((pr, "inferred_zero_from_alpha", [0.00393, 293.15]))
    cases.append((pr, "equal_resistance_area_ratio", [1.7241e-8, 2.8264e-8]))
    cases.append((pr, "equal_resistance_diameter_ratio", [1.7241e-8, 2.8264e-8]))
    cases.append((pr, "equal_resistance_mass_ratio", [1.7241e-8, 8890.0, 2.8264e-8, 2703.0]))
    cases.append((pr, "voltage_drop_min_area", [1.7241e-8, 16.0, 30.0, 6.9, 2.0]))
    catalogue = shipped_catalogue()
    for material_id in ("copper", "copper-annealed", "platinum-pt385", "iron", "stainless-304"):
        record = catalogue["materials"][material_id]
        for t in (4.2, 77.0, 293.15, 600.0, 1500.0):
            for model in ("auto", "linear", "table", "bloch-gruneisen", "callendar-van-dusen", "matthiessen"):
                cases.append(("conductor_atlas.core.material_models", "resistivity_at", [record, t, model]))
    return cases
