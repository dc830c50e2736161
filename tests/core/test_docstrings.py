"""The core's docstrings are checked, not hoped for: their ``>>>`` examples run as doctests, every unit
written in brackets (``[ohm*m]``, ``[A*s^0.5/m^2]``, ``[-]`` for a pure number) is one pint reads, written in one notation (pint's text form), and
the modules listed in EXAMPLES_REQUIRED carry an example on every public function.

Transcrypt drops docstrings, so none of this reaches the pages.
"""

from __future__ import annotations

import ast
import doctest
import importlib
import pathlib
import re

import pint
import pytest

CORE = pathlib.Path(__file__).resolve().parents[2] / "generator" / "conductor_atlas" / "core"
MODULES = sorted(p.stem for p in CORE.glob("*.py") if p.stem != "__init__")

# The physics modules: every public function has a runnable example (None), or the listed ones do where
# the module also holds functions that are not formulas (text of sizes, record predicates, labels).
EXAMPLES_REQUIRED = {
    "resistance": None, "quadrature": None, "short_circuit": None, "practice": None, "conformance": None,
    "size_effect": None, "carriers": None, "skin_effect": None, "kelvin_functions": None,
    "temperature_models": None, "layered_round": None, "clad_layers": None, "search_size": None,
    "round_pair": None, "errors": None, "trade_words": None,
    "winding_temperature": ["temperature_for_ratio"],
    "geometry": ["awg_number", "awg_name", "awg_diameter_exact", "awg_diameter", "awg_area", "round_area",
                 "diameter_from_area", "next_metric_size", "next_awg", "parse_size", "size_from_text"],
    "material_models": ["cvd_ratio", "choose_model", "resistivity_or_none", "within_model", "resistivity_at",
                        "local_temperature_coefficient", "model_key", "model_rho", "resistivity_value"],
    "units": ["parse_quantity", "quantity_in_si"],
    # the calculators' physics helpers (their readers, texts and calculate() are checked by the calculator tests)
    "calc_common": ["material_resistivity", "warn_if_fusing", "recorded_mean_free_path",
                    "frequency_beyond_dc_conductivity"],
    "calc_short_circuit": ["iec_constants", "resistivities", "heat_integral_of", "final_temperature"],
    "calc_resistance_ac": ["ac_ratio"],
    "calc_skin_effect": ["half_thickness", "mean_free_path_check"],
    "calc_thin_film": ["bulk_mean_free_path"],
    "calc_temperature_rise": ["material_k"],
    "calc_compare": ["add_bar_width", "add_standard_sizes"],
    "ac_layout": ["add_ratio_result"],
    "filament_inductance": None,
    "filament_mesh": None, "filament_matrix": None,
    "filament_solver": ["bar_group_solution", "bar_pair_solution", "round_layers_solution"],
    "complex_linear": None, "bar_ratio_lookup": None,
}

# A unit in brackets: after a space, a parenthesis or the line start, no space inside. Data-shape
# descriptions ("[str]", '["single"]', "[...]") and ``code`` are not units.
BRACKET = re.compile(r"(?:(?<=\s)|(?<=^)|(?<=\())\[([^\[\]\s]+)\]", re.M)
CODE_SPAN = re.compile(r"``.*?``", re.S)
NOT_UNITS = {"str", "unit", "kind", "word", "number", "float"}
UREG = pint.UnitRegistry()


def docstrings(module_name: str):
    """(qualified name, docstring) of the module, its classes and functions."""
    tree = ast.parse((CORE / f"{module_name}.py").read_text(encoding="utf-8"))
    for node in ast.walk(tree):
        if isinstance(node, (ast.Module, ast.FunctionDef, ast.ClassDef)):
            doc = ast.get_docstring(node)
            if doc:
                yield getattr(node, "name", module_name), doc


def bracket_units(doc: str) -> list[str]:
    # the ``>>>`` examples and their printed answers are code and data (a list ['iec60028']), not prose
    prose = "".join(part for part in doctest.DocTestParser().parse(doc) if isinstance(part, str))
    text = CODE_SPAN.sub("", prose)
    return [u for u in BRACKET.findall(text)
            if u not in NOT_UNITS and '"' not in u and any(ch.isalpha() or ch in "%-" for ch in u) and u != "..."]


@pytest.mark.parametrize("module_name", MODULES)
def test_doctests_pass(module_name):
    module = importlib.import_module(f"conductor_atlas.core.{module_name}")
    result = doctest.testmod(module, optionflags=doctest.ELLIPSIS | doctest.NORMALIZE_WHITESPACE, verbose=False)
    assert result.failed == 0, f"{result.failed} of {result.attempted} examples failed in core/{module_name}.py"


@pytest.mark.parametrize("module_name", sorted(EXAMPLES_REQUIRED))
def test_every_public_function_has_an_example(module_name):
    tree = ast.parse((CORE / f"{module_name}.py").read_text(encoding="utf-8"))
    functions = {node.name: node for node in tree.body if isinstance(node, ast.FunctionDef) and not node.name.startswith("_")}
    wanted = EXAMPLES_REQUIRED[module_name] or sorted(functions)
    assert set(wanted) <= set(functions), f"core/{module_name}.py has no {sorted(set(wanted) - set(functions))}"
    missing = [name for name in wanted if ">>>" not in (ast.get_docstring(functions[name]) or "")]
    assert missing == [], f"core/{module_name}.py: no >>> example in {missing}"


@pytest.mark.parametrize("module_name", MODULES)
def test_units_in_brackets_are_units_pint_reads(module_name):
    bad = []
    for name, doc in docstrings(module_name):
        for unit in bracket_units(doc):
            if unit == "-":  # a pure number
                continue
            if not unit.isascii():  # one notation: pint's text form ("ohm*m", "m^2"), as typed
                bad.append(f"{name}: [{unit}] (write it as pint's text, e.g. ohm*m, m^2, A*s^0.5)")
                continue
            try:
                UREG.parse_units(unit)
            except (pint.errors.UndefinedUnitError, pint.errors.DefinitionSyntaxError, ValueError,
                    AttributeError, TypeError) as error:
                bad.append(f"{name}: [{unit}] ({type(error).__name__})")
    assert bad == [], f"core/{module_name}.py: " + "; ".join(bad)


def test_the_scan_finds_the_units_it_should():
    # the scanner itself, on text written for it: units found, data shapes and code left alone
    doc = 'R = ρ L / A, [ohm].  rho [ohm*m], area [m^2], ratio [-]; returns ["single"] or [str]; ``x[0-9]``'
    assert bracket_units(doc) == ["ohm", "ohm*m", "m^2", "-"]
    example = "rho [ohm*m]\n\n>>> sources(x) [0]\n['iec60028']\n\nthen [K]\n"
    assert bracket_units(example) == ["ohm*m", "K"]
