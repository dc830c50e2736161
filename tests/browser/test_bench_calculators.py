"""In Chromium: the measured-check and short-circuit pages give the Python core's numbers and texts,
show the verdict and the cautions, and refuse bad input under its field."""

from __future__ import annotations

import pytest

from conductor_atlas.core.calculators import CALCULATORS, calculate
from tests.support.outcomes import in_field_words

pytestmark = pytest.mark.browser


def result_values(pg):
    return pg.eval_on_selector_all(
        "[data-result]", "els => Object.fromEntries(els.map(e => [e.dataset.result, e.dataset.value ?? null]))")


CASES = [
    ("measured-check", {"material": "IACS", "resistance": "0.736 ohm", "temperature": "23.5 °C", "length": "100 m",
                        "size": "2.5 mm2", "conductor_class": "2"}, "verdict", "PASS"),
    ("measured-check", {"material": "tinned copper", "resistance": "0.1002 ohm", "temperature": "22 °C",
                        "length": "500 m", "size": "95 mm2", "conductor_class": "2"}, "verdict", "FAIL"),
    ("measured-check", {"material": "copper-tinned", "resistance": "0.53 ohm", "temperature": "20 °C",
                        "length": "100 m", "size": "12 AWG", "conductor_class": ""}, "expected_per_km", "range"),
    ("short-circuit", {"material": "IACS", "current": "12 kA", "duration": "0.5 s", "size": "95 mm2",
                       "initial": "90 °C", "final": "250 °C"}, "final_temperature_iec", "β = 234.5"),
    ("short-circuit", {"material": "1350", "current": "12 kA", "duration": "0.5 s", "size": "",
                       "initial": "90 °C", "final": "250 °C"}, "min_area_iec", "from it"),
]


@pytest.mark.parametrize("name, inputs, key, words", CASES)
def test_page_matches_python(page, served_site, catalogue, name, inputs, key, words):
    page.goto(f"{served_site}/calculators/{name}/index.html")
    page.wait_for_selector("html.calc-ready")
    for field, text in inputs.items():
        page.fill(f"#in-{name}-{field}", text)
    page.locator(f"#in-{name}-material").blur()
    page.wait_for_timeout(300)
    expected = calculate(name, inputs | {"model": "auto"}, catalogue)
    assert expected["errors"] == {}
    shown = result_values(page)
    for result_name, result in expected["results"].items():
        assert shown[result_name] is not None, f"{result_name} has no data-value"
        assert float(shown[result_name]) == pytest.approx(result["value"], rel=1e-12, abs=0)
        assert page.text_content(f"[data-result={result_name}]") == result["text"]
    assert words in page.text_content(f"[data-result={key}]")
    warnings = page.text_content(f"#calc-{name} .calc-warnings")
    for w in expected["warnings"]:
        assert in_field_words(w, CALCULATORS[name]) in warnings
    assert "licensed practice" in page.text_content("body") or name == "measured-check"
    assert page.errors == []


@pytest.mark.parametrize("name, field, text, words", [
    ("measured-check", "conductor_class", "4", "enter 1, 2, 5 or 6"),
    ("measured-check", "size", "3 mm2", "nearest: 2.5 mm² or 4 mm²"),
    ("short-circuit", "duration", "5 kg", "unknown unit"),
])
def test_bad_input_is_refused_under_its_field(page, served_site, name, field, text, words):
    page.goto(f"{served_site}/calculators/{name}/index.html")
    page.wait_for_selector("html.calc-ready")
    page.fill(f"#in-{name}-{field}", text)
    page.locator(f"#in-{name}-{field}").blur()
    page.wait_for_timeout(300)
    assert words in page.text_content(f"#in-{name}-{field}-error")
    body = page.text_content("body")
    assert "NaN" not in body and "undefined" not in body
    assert page.errors == []


def test_a_ranged_material_shows_its_ends(page, served_site, catalogue):
    inputs = {"material": "copper-hard-drawn", "length": "100 m", "size": "2.5 mm2", "temperature": "20 °C"}
    page.goto(f"{served_site}/calculators/resistance/index.html")
    page.wait_for_selector("html.calc-ready")
    for field, text in inputs.items():
        page.fill(f"#in-resistance-{field}", text)
    page.locator("#in-resistance-material").blur()
    page.wait_for_timeout(300)
    expected = calculate("resistance", inputs, catalogue)["results"]["resistance"]
    cell = page.locator("[data-result=resistance]")
    assert float(cell.get_attribute("data-low")) == pytest.approx(expected["low"], rel=1e-12, abs=0)
    assert float(cell.get_attribute("data-high")) == pytest.approx(expected["high"], rel=1e-12, abs=0)
    assert cell.text_content() == expected["text"] and "(range " in expected["text"]
    assert page.errors == []
