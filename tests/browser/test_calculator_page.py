"""In Chromium: a material page's calculator gives the same numbers as the Python core."""

from __future__ import annotations

from urllib.parse import quote

import pytest

from conductor_atlas.core import calc_resistance
from conductor_atlas.core.calculators import calculate
from tests.browser.conftest import start_calculator
from tests.support.outcomes import in_field_words

pytestmark = pytest.mark.browser


def result_values(pg):
    return pg.eval_on_selector_all(
        "[data-result]", "els => Object.fromEntries(els.map(e => [e.dataset.result, e.dataset.value ?? null]))")


CASES = [
    ("copper-annealed", {"length": "1 km", "size": "10 AWG", "temperature": "20 °C", "current": "10 A"}),
    ("aluminium-1350", {"length": "350 ft", "size": "4/0 AWG", "temperature": "75 °C", "current": "180 A"}),
    ("silver", {"length": "2,5 m", "size": "d 0.8 mm", "temperature": "90 degC", "current": "2 A"}),
]


@pytest.mark.parametrize("material_id, inputs", CASES)
def test_typed_inputs_match_python(page, served_site, catalogue, material_id, inputs):
    page.goto(f"{served_site}/materials/{material_id}/index.html")
    start_calculator(page)
    for name, text in inputs.items():
        page.fill(f"input[name={name}]", text)
    expected = calculate("resistance", {**inputs, "material": material_id}, catalogue)
    assert expected["errors"] == {}
    shown = result_values(page)
    for name, result in expected["results"].items():
        if name not in shown:
            continue
        assert shown[name] is not None, f"{name} has no data-value"
        assert float(shown[name]) == pytest.approx(result["value"], rel=1e-12, abs=0)
        assert page.text_content(f"[data-result={name}]") == result["text"]
    assert "resistance" in shown and shown["resistance"] is not None
    # the inputs are mirrored in the URL so a link reopens the calculation (after a short pause in typing)
    page.wait_for_timeout(500)
    for name, text in inputs.items():
        assert quote(text, safe="").replace("%20", "+") in page.url or quote(text) in page.url
    assert page.errors == []


def test_the_address_is_written_once_per_pause(page, served_site):
    # replaceState is a same-document navigation (it held a throttled tablet page for several ms):
    # leaving the field after the pause, or typing back to what the address says, writes nothing more
    page.goto(f"{served_site}/materials/copper-annealed/index.html")
    start_calculator(page)
    page.evaluate("""() => { window.addressWrites = 0; const replace = history.replaceState.bind(history);
                             history.replaceState = (...args) => { window.addressWrites += 1; replace(...args); }; }""")
    page.fill("input[name=length]", "35 m")
    page.wait_for_timeout(600)  # the address follows 250 ms after the last keystroke
    assert "length=35+m" in page.url
    assert page.evaluate("window.addressWrites") == 1
    page.locator("input[name=length]").blur()  # the change event: the same address
    page.fill("input[name=length]", "36 m")
    page.fill("input[name=length]", "35 m")  # back to what the address says
    page.wait_for_timeout(600)
    page.locator("input[name=length]").blur()
    assert page.evaluate("window.addressWrites") == 1
    page.fill("input[name=length]", "40 m")
    page.wait_for_timeout(600)
    assert "length=40+m" in page.url and page.evaluate("window.addressWrites") == 2
    assert page.errors == []


def test_permalink_reopens_the_calculation(page, served_site, catalogue):
    inputs = {"length": "35 m", "size": "2.5 mm2", "temperature": "90 °C", "current": "16 A"}
    query = "&".join(f"{k}={quote(v)}" for k, v in inputs.items())
    page.goto(f"{served_site}/materials/copper-annealed/index.html?{query}")
    page.wait_for_selector("html.calc-ready")
    expected = calculate("resistance", {**inputs, "material": "copper-annealed"}, catalogue)
    shown = result_values(page)
    assert float(shown["voltage_drop"]) == pytest.approx(expected["results"]["voltage_drop"]["value"], rel=1e-12, abs=0)
    assert page.input_value("input[name=temperature]") == "90 °C"


def test_bad_input_names_the_field(page, served_site):
    page.goto(f"{served_site}/materials/copper-annealed/index.html")
    start_calculator(page)
    page.fill("input[name=size]", "5 kg")
    page.locator("input[name=size]").blur()  # judged on leaving the field (or after a pause)
    assert "unknown unit" in page.text_content("#in-resistance-size-error")
    assert page.get_attribute("input[name=size]", "aria-invalid") == "true"
    assert page.text_content("[data-result=resistance]") == "—"
    body = page.text_content("body")
    assert "NaN" not in body and "undefined" not in body
    assert page.errors == []


def test_file_url_reads_and_calculates(browser, built_site, catalogue):
    """From file:// module scripts are refused; the build's classic bundle (bundle.py) still runs."""
    context = browser.new_context()
    pg = context.new_page()
    errors = []
    pg.on("pageerror", lambda e: errors.append(str(e)))
    pg.on("console", lambda m: errors.append(m.text) if m.type == "error" else None)
    inputs = {"length": "35 m", "size": "2.5 mm2", "temperature": "90 °C", "current": "16 A"}
    query = "&".join(f"{k}={quote(v)}" for k, v in inputs.items())
    pg.goto((built_site / "materials" / "copper-annealed" / "index.html").as_uri() + "?" + query)
    pg.wait_for_selector("html.calc-ready")
    assert not pg.locator(".needs-server").is_visible()
    expected = calculate("resistance", {**inputs, "material": "copper-annealed"}, catalogue)
    assert float(result_values(pg)["voltage_drop"]) == pytest.approx(
        expected["results"]["voltage_drop"]["value"], rel=1e-12)
    note = pg.locator(".from-file-note")  # the service worker needs the served copy, and says so
    assert note.is_visible() and "conductor-atlas serve" in note.text_content()
    assert pg.locator("#resistivity-temperature table tbody tr").count() > 5
    assert errors == []
    context.close()


def test_an_update_changes_texts_in_place_and_keeps_the_warnings_list_in_step(page, served_site, catalogue):
    """A keystroke writes each changed result into the text node already shown (no new nodes for the
    browser to style and lay out again), and the warnings list follows the core's warnings item by
    item, also when one appears and goes again (the decimal-point note of "110.001 m")."""
    page.goto(f"{served_site}/calculators/resistance/index.html")
    page.wait_for_selector("html.calc-ready")
    page.evaluate("() => { window.shownNode = document.querySelector('[data-result=resistance]').firstChild; }")
    inputs = {"material": "copper-annealed", "size": "2.5 mm2", "temperature": "20 °C", "current": "",
              "frequency": "", "model": "auto"}
    for length in ["110.001 m", "100 m", "110.001 m", "7 km"]:
        page.fill("#in-resistance-length", length)
        expected = calculate("resistance", inputs | {"length": length}, catalogue)
        assert page.text_content("[data-result=resistance]") == expected["results"]["resistance"]["text"]
        assert page.evaluate("() => document.querySelector('[data-result=resistance]').firstChild === window.shownNode")
        items = page.eval_on_selector_all("#calc-resistance .calc-warnings li", "els => els.map((e) => e.textContent)")
        assert items == [in_field_words(text, calc_resistance) for text in expected["warnings"]]
        assert page.is_visible("#calc-resistance .calc-warnings") == bool(expected["warnings"])
    assert page.errors == []


@pytest.mark.parametrize("address, starts", [
    # the core's note begins "size: “10 ga” is read as 10 AWG" (its field name, as the command line's --size)
    ("calculators/resistance/index.html?size=10%20ga", "Cross-section: “10 ga” is read as 10 AWG"),
    # and "resistance_cold: “1.500” is read with a decimal point as 1.5"
    ("calculators/temperature-rise/index.html?resistance_cold=1.500%20ohm",
     "Cold resistance R1: “1.500” is read with a decimal point as 1.5"),
])
def test_a_note_about_a_field_names_it_by_its_label(page, served_site, address, starts):
    page.goto(f"{served_site}/{address}")
    page.wait_for_selector("html.calc-ready", state="attached")
    notes = page.eval_on_selector_all(".calc-warnings li", "els => els.map(e => e.textContent)")
    assert any(note.startswith(starts) for note in notes), notes
    assert not any(note.startswith(("size:", "resistance_cold:")) for note in notes), notes
    assert page.errors == []
