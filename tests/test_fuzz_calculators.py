"""Every calculator, fed arbitrary text and extreme numbers, in CPython and in node.

Property (for every registered calculator, so new ones are covered without editing this file):
an outcome either has results, each a finite number whose text shows no "NaN", "Infinity",
"undefined", "nan" or "inf", or it has no results and a non-empty message under
``errors[field]`` for an input field of that calculator. The one exception: an optional field
that the calculator lists in ``SIDE_FIELDS`` may carry an error beside results, provided none of
the results that field feeds is shown (a current without unit leaves the resistance standing but
drops the voltage drop). Nothing raises, and the transpiled core
in node gives the same outcome as CPython (numbers to 1e-12 relative, text exact; the same
tolerance and reason as tests/test_differential.py).

The Python property runs under hypothesis with shrinking. For node, the examples are drawn once
by hypothesis with a fixed seed (``derandomize=True``) and sent in one batch, because starting a
node process per example would take minutes.
"""

from __future__ import annotations

import math
import re

import pytest
from hypothesis import HealthCheck, Phase, given, settings
from hypothesis import strategies as st

from conductor_atlas.build import data_folders
from conductor_atlas.core.calculators import CALCULATOR_MODULES, CALCULATORS, calculate
from conductor_atlas.core.units import UNITS
from conductor_atlas.derive import calc_catalogue, catalogue_of
from conductor_atlas.load import load_dataset
from tests.support.node_core import encode
from tests.test_differential import differences

NODE_EXAMPLES_PER_CALCULATOR = 400
PYTHON_EXAMPLES_PER_CALCULATOR = 300

# Text that must never reach a page (a formatter or a JS runtime leaking a non-number)
FORBIDDEN_WORDS = ("NaN", "Infinity", "undefined", "nan", "inf", "null", "None", "[object")

# Inputs people really type wrong, named in the task: empty, words, negative, overflowing,
# a unit of the wrong kind, zero frequency, a unit alone, mixed separators, unicode junk.
HAND_PICKED = [
    "", " ", "abc", "-5 m", "1e308 m", "1e308 km", "-1e308 m", "5 kg", "0 Hz", "0", "-0 m", "m", "mm",
    "mm2", "Hz", "A", "°C", "K", "AWG", "d", "ø", "x", "1,234.5 m", "1.234,5 m", "1,2,3 m", "1..2 m",
    "1,5 m", ",5 mm", ".5 mm", "5,", "1e m", "e5 m", "--5 m", "+-5 m", "5 m m", "5 m²", "5 ohm", "NaN m",
    "nan", "inf A", "Infinity m", "-inf °C", "1e309 m", "1e-320 m", "1e-400 m", "4.9e-324 m", "∞ m",
    "½ m", "٣ m", "５ m", "5\u00a0m", "5\u202fmm", "5\tm", "5\nm", "\x00", "💥", "𝟓 m", "5 µm", "5 μm",
    "2.5 mm²", "1e308 mm2", "1e-308 mm2", "1e-330 mm2", "1e308 x 1e308 mm", "1e-200 x 1e-200 mm",
    "0 x 5 mm", "5 x mm", "x 5 mm", "5 x 5", "d 0 mm", "d -1 mm", "d 1e-200 mm", "d 1e200 m", "d 1e308 km",
    "AWG 99", "AWG -3", "AWG 0/0", "AWG 5/0", "AWG //", "0000000 AWG", "1e5 AWG", "99999999999999999999 AWG",
    "-1e308 °C", "1e308 K", "-273.15 °C", "-273.16 °C", "-459.67 °F", "0 K", "1e308 °F", "1e308 A", "-1 A",
    "1e-300 A", "0 A", "1e308 kA", "1e308 MHz", "0 GHz", "-50 Hz", "1e308 Hz", "1e308 GHz", "5 MHz",
    "<script>alert(1)</script>", "\" onmouseover=\"x", "'; DROP TABLE", "%s%s%n", "{}", "[]", "__proto__",
    "constructor", "toString", "1" * 400 + " m", "9" * 400 + " m", "0." + "0" * 400 + "1 m", "a" * 5000,
    "5 " + "m" * 3000, "−5 m", "–5 m", "5 Ω", "5 mΩ", "5 MΩ",
]

NUMBER_TEXT = st.one_of(
    st.floats(allow_nan=True, allow_infinity=True).map(repr),
    st.floats(min_value=-1e-300, max_value=1e-300).map(repr),
    st.integers(min_value=-10**30, max_value=10**30).map(str),
    st.sampled_from(["1e308", "1e309", "-1e308", "1e-324", "0", "-0", "0.0", "1,5", "1.5", "1,234.5", "1.234,5",
                     ".5", "5.", ",5", "1e+308", "1E-9", "12", "2,5", "00012", "4/0", "2/0"]),
)
UNIT_TEXT = st.one_of(
    st.sampled_from(sorted(UNITS)),
    st.sampled_from(["", " ", "mm²", "°C", "°F", "degC", "µΩ·cm", "Ω", "AWG", "awg", "kcmil", "MCM", "sq mm", "kg",
                     "Hz", "MHz", "mHz", "x 5 mm", "× 2 mm", "mm mm", "m/s", "K K", "ft²", "in²", "m^2"]),
    st.text(max_size=6),
)
FIELD_TEXT = st.one_of(
    st.sampled_from(HAND_PICKED),
    st.builds(lambda n, sep, u: n + sep + u, NUMBER_TEXT, st.sampled_from(["", " ", "  ", "\u00a0"]), UNIT_TEXT),
    st.builds(lambda a, b, u: a + " x " + b + " " + u, NUMBER_TEXT, NUMBER_TEXT, UNIT_TEXT),
    st.builds(lambda p, n, u: p + n + " " + u, st.sampled_from(["d ", "ø", "dia ", "AWG ", "#"]), NUMBER_TEXT, UNIT_TEXT),
    st.text(max_size=40),
    st.text(alphabet=st.characters(codec="utf-8"), min_size=200, max_size=3000),
)


@pytest.fixture(scope="module")
def catalogues():
    """One single-material catalogue per shipped material (what a material page embeds), by id.

    One material per call keeps the node batch small; the material field still gets fuzzed text.
    """
    dataset = load_dataset(data_folders())
    full = catalogue_of(dataset)
    by_id = {m.id: m for m in dataset.materials}
    # with the conductor-standard tables, so the measured-check's standard path is fuzzed too
    return [(mid, calc_catalogue([record], [by_id[mid]], dataset.limits))
            for mid, record in sorted(full["materials"].items())]


def default_inputs(name, material_id):
    """The form's defaults, with the material field (if any) naming ``material_id``."""
    defaults = CALCULATORS[name].DEFAULTS
    inputs = {f: defaults.get(f, "") for f in CALCULATORS[name].FIELDS}
    if "material" in inputs:
        inputs["material"] = material_id
    return inputs


def inputs_strategy(name, catalogues):
    """(inputs, catalogue) for calculator ``name``: each field its default or fuzzed text."""

    @st.composite
    def draw(draw_from):
        material_id, catalogue = draw_from(st.sampled_from(catalogues))
        inputs = {}
        for field, default in default_inputs(name, material_id).items():
            inputs[field] = draw_from(st.one_of(st.just(default), st.just(default), FIELD_TEXT))
        return inputs, catalogue

    return draw()


def shows_non_number(text):
    """True when ``text`` holds a leaked non-number: NaN, Infinity, undefined, ... anywhere, or
    "nan"/"inf" as a word (so "inferred" is fine)."""
    if any(word in text for word in FORBIDDEN_WORDS if word not in ("nan", "inf")):
        return True
    return re.search(r"(?<![A-Za-z])(nan|inf)(?![A-Za-z])", text) is not None


def leaked(text, typed):
    """Words of FORBIDDEN_WORDS[:3] in ``text`` that the person did not type themselves.

    A message may quote the input back ("expected a number first, found “NaN m”"); it may not
    produce a non-number of its own.
    """
    return [w for w in FORBIDDEN_WORDS[:3] if w in text and not any(w in t for t in typed)]


def problems_with(name, outcome):
    """What breaks the property in one outcome (an empty list when it holds)."""
    found = []
    typed = [str(v) for v in outcome["inputs"].values()]
    fields = set(CALCULATORS[name].FIELDS)
    errors = outcome["errors"]
    for key, message in errors.items():
        if key not in fields:
            found.append(f"error under {key!r}, which is not an input field of {name}")
        if not isinstance(message, str) or not message.strip():
            found.append(f"errors[{key!r}] is not a message: {message!r}")
        elif leaked(message, typed):
            found.append(f"errors[{key!r}] shows a non-number: {message!r}")
    side_fields = getattr(CALCULATORS[name], "SIDE_FIELDS", {})
    if errors and outcome["results"]:
        # allowed only for optional fields declared in SIDE_FIELDS, and without the results they feed
        if any(key not in side_fields for key in errors):
            found.append(f"both errors {sorted(errors)} and results {sorted(outcome['results'])}")
        for key in errors:
            fed = [r for r in side_fields.get(key, []) if r in outcome["results"]]
            if fed:
                found.append(f"error under {key!r} but results that need it are shown: {fed}")
    if not errors and not outcome["results"]:
        found.append("neither results nor an error")
    for key, result in outcome["results"].items():
        value = result["value"]
        if isinstance(value, bool) or not isinstance(value, (int, float)) or not math.isfinite(value):
            found.append(f"results[{key!r}].value is {value!r}")
        text = result["text"]
        if not isinstance(text, str) or not text.strip() or shows_non_number(text):
            found.append(f"results[{key!r}].text is {text!r}")
        if isinstance(text, str) and text.strip().startswith("—"):
            found.append(f"results[{key!r}].text is a placeholder {text!r} for value {value!r}")
    for warning in outcome["warnings"]:
        if not isinstance(warning, str) or leaked(warning, typed):
            found.append(f"warning shows a non-number: {warning!r}")
    return found


def collect(strategy, count):
    """``count`` examples of ``strategy``, the same ones on every run (derandomised)."""
    found = []

    @settings(max_examples=count, database=None, derandomize=True, phases=[Phase.generate],
              suppress_health_check=list(HealthCheck), deadline=None)
    @given(strategy)
    def gather(example):
        found.append(example)

    gather()
    return found


def test_every_registered_module_keeps_the_calculator_contract():
    """One registry: each module in CALCULATOR_MODULES is found under its own NAME, runs through
    ``calculate``, and describes every field it reads (the fuzzing below draws from FIELDS)."""
    assert len(CALCULATORS) == len(CALCULATOR_MODULES) >= 1, "two calculator modules share a NAME"
    for module in CALCULATOR_MODULES:
        assert CALCULATORS[module.NAME] is module
        assert callable(module.calculate), module.__name__
        assert set(module.FIELDS) == set(module.FIELD_INFO), module.__name__
        assert set(module.DEFAULTS) <= set(module.FIELDS), module.__name__
        labels = {key for key, _ in module.RESULT_LABELS}
        for field, fed in getattr(module, "SIDE_FIELDS", {}).items():
            assert field in module.FIELDS, (module.__name__, field)
            assert set(fed) <= labels, (module.__name__, field, set(fed) - labels)


def hand_picked_cases(catalogues):
    """Each hand-picked text in each field alone (the others at their defaults), every calculator."""
    cases = []
    for name in sorted(CALCULATORS):
        for field in CALCULATORS[name].FIELDS:
            for text in HAND_PICKED:
                material_id, catalogue = catalogues[len(cases) % len(catalogues)]
                inputs = default_inputs(name, material_id)
                inputs[field] = text
                cases.append((name, inputs, catalogue))
    return cases


def test_hand_picked_inputs_in_every_field(catalogues):
    """Each hand-picked bad text in each field alone (others at their defaults), in CPython."""
    failures = []
    for name, inputs, catalogue in hand_picked_cases(catalogues):
        short = {k: v[:40] for k, v in inputs.items()}
        try:
            outcome = calculate(name, inputs, catalogue)
        except Exception as exc:  # the property is "never raises"; collect every case that does
            failures.append(f"{name} {short!r}: raised {type(exc).__name__}: {exc}")
            continue
        for problem in problems_with(name, outcome):
            failures.append(f"{name} {short!r}: {problem}")
    assert failures == [], f"{len(failures)} failures:\n" + "\n".join(failures[:40])


@pytest.mark.parametrize("name", sorted(CALCULATORS))
def test_property_in_python(name, catalogues):
    @settings(max_examples=PYTHON_EXAMPLES_PER_CALCULATOR, deadline=None, derandomize=True, database=None,
              suppress_health_check=[HealthCheck.too_slow])
    @given(case=inputs_strategy(name, catalogues))
    def check(case):
        inputs, catalogue = case
        outcome = calculate(name, inputs, catalogue)
        assert problems_with(name, outcome) == []

    check()


@pytest.mark.node
def test_python_and_node_agree_on_fuzzed_inputs(node_core, catalogues):
    """One node batch: hand-picked texts per field plus hypothesis examples, every calculator."""
    cases = hand_picked_cases(catalogues)
    for name in sorted(CALCULATORS):
        for inputs, catalogue in collect(inputs_strategy(name, catalogues), NODE_EXAMPLES_PER_CALCULATOR):
            cases.append((name, inputs, catalogue))
    calls = [{"module": "conductor_atlas.core.calculators", "function": "calculate", "args": [n, i, m]}
             for n, i, m in cases]
    node_results = node_core.call_many(calls)
    assert len(node_results) == len(cases)
    failures = []
    per_calculator = {}
    for (name, inputs, material), js in zip(cases, node_results):
        per_calculator[name] = per_calculator.get(name, 0) + 1
        short = {k: v[:40] for k, v in inputs.items()}
        py = calculate(name, inputs, material)
        for problem in problems_with(name, py):
            failures.append(f"python {name} {short!r}: {problem}")
        if "error" in js:
            failures.append(f"node raised for {name} {short!r}: {js['error']}")
            continue
        for problem in problems_with(name, js["ok"]):
            failures.append(f"node {name} {short!r}: {problem}")
        for diff in differences(encode(py), js["ok"])[:3]:
            failures.append(f"python and node differ for {name} {short!r}: {diff}")
    print(f"fuzz examples run in node and CPython per calculator: {per_calculator}")
    assert failures == [], f"{len(failures)} failures in {len(cases)} cases:\n" + "\n".join(failures[:40])
