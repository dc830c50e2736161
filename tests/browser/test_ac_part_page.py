"""In Chromium: a material page loads the AC part of the calculators (static/calc-ac.classic.js) only
when a frequency is typed, says it is loading it meanwhile, then shows the Python core's AC results
(to 1e-12); after one served visit the part also loads with the network cut (service worker). A bar
the solver's tabulated grid answers is answered at once; one it does not is solved after a pause in
typing, announced before it runs. Page weight is
measured in bench/ (`bench/run.py --only weight`), never here."""

from __future__ import annotations

import json

import pytest

from tests.browser.conftest import start_calculator
from conductor_atlas.core.calc_resistance import calculate

pytestmark = pytest.mark.browser

FORM = "form[data-calculator=resistance]"
FIELDS = ["material", "length", "size", "temperature", "current", "frequency", "model"]
PART = "static/calc-ac.classic.js"
AC_RESULTS = ("skin_depth", "ac_dc_ratio", "resistance_ac")

# Type into a field and read the busy line and the AC cell in the same task, so a fast machine
# cannot load the part between the keystroke and the look.
TYPE_AND_LOOK = """([sel, name, text]) => {
    const form = document.querySelector(sel);
    const field = form.querySelector(`[name=${name}]`);
    field.value = text;
    field.dispatchEvent(new Event('input', {bubbles: true}));
    const section = form.closest('section');
    const cell = section.querySelector('[data-result=ac_dc_ratio]');
    return {busy: section.querySelector('[data-busy]').textContent, solving: form.hasAttribute('data-solving'),
            ratio: cell ? cell.dataset.value ?? null : null};
}"""


def form_inputs(pg) -> dict:
    return {name: pg.input_value(f"{FORM} [name={name}]") for name in FIELDS}


def shown_values(pg) -> dict:
    return pg.eval_on_selector_all(
        f"section:has({FORM}) [data-result]", "els => Object.fromEntries(els.map(e => [e.dataset.result, e.dataset.value ?? null]))")


def wait_for_ac(pg) -> dict:
    pg.wait_for_function(
        """(sel) => { const f = document.querySelector(sel);
                      const c = f.closest('section').querySelector('[data-result=ac_dc_ratio]');
                      return c && c.dataset.value !== undefined && !f.hasAttribute('data-solving'); }""",
        arg=FORM, timeout=60000)
    return shown_values(pg)


def assert_core_values(pg) -> None:
    """The page's results equal CPython's with the catalogue the page embeds."""
    shown = wait_for_ac(pg)
    expected = calculate(form_inputs(pg), json.loads(pg.text_content("#calc-catalogue")))
    assert expected["errors"] == {} and "pending" not in expected
    for name in AC_RESULTS:
        assert name in expected["results"], name
    for name, result in expected["results"].items():
        if name in shown:
            assert shown[name] is not None, name
            assert float(shown[name]) == pytest.approx(result["value"], rel=1e-12, abs=0), name
    assert pg.text_content(f"section:has({FORM}) [data-busy]") == ""


def part_requests(pg) -> list[str]:
    found: list[str] = []
    pg.on("request", lambda request: found.append(request.url) if request.url.endswith(PART) else None)
    return found


def test_the_ac_part_loads_when_a_frequency_is_typed(page, served_site):
    pg = page
    requested = part_requests(pg)
    pg.goto(f"{served_site}/materials/copper-annealed/index.html")
    start_calculator(pg)  # the page's own calculator script came late (calc-loader.js): the part links to it
    pg.wait_for_load_state("networkidle")
    assert requested == []          # reading the page does not fetch the AC part
    assert shown_values(pg)["resistance"] is not None
    assert pg.text_content(f"section:has({FORM}) [data-busy]") == ""

    state = pg.evaluate(TYPE_AND_LOOK, [FORM, "frequency", "50 Hz"])
    assert state["ratio"] is None, state            # never a stale or made-up AC value
    assert "Loading the AC calculations" in state["busy"], state
    assert_core_values(pg)
    assert len(requested) == 1

    # loaded once: another frequency is answered at once, with no request
    state = pg.evaluate(TYPE_AND_LOOK, [FORM, "frequency", "400 Hz"])
    assert state["busy"] == "" and state["ratio"] is not None, state
    assert_core_values(pg)

    # a bar inside the solver's tabulated grid (core.bar_ratio_lookup): answered at once
    state = pg.evaluate(TYPE_AND_LOOK, [FORM, "size", "60 x 6 mm"])
    assert not state["solving"] and state["busy"] == "" and state["ratio"] is not None, state
    assert_core_values(pg)
    # a bar under 1.2 skin depths wide is outside it and runs the filament solver: it waits for a
    # pause in typing and says so
    state = pg.evaluate(TYPE_AND_LOOK, [FORM, "size", "3 x 1 mm"])
    assert state["solving"] and "Solving when you pause typing" in state["busy"], state
    assert_core_values(pg)
    assert len(requested) == 1
    assert pg.errors == []


def test_the_ac_part_loads_offline_after_one_visit(browser, served_site):
    context = browser.new_context(service_workers="allow")
    try:
        pg = context.new_page()
        errors: list[str] = []
        pg.on("pageerror", lambda e: errors.append(str(e)))
        pg.goto(f"{served_site}/materials/copper-annealed/index.html")
        # the worker takes control only after storing every file of the site
        pg.wait_for_function("() => navigator.serviceWorker.controller !== null", timeout=60000)
        context.set_offline(True)
        pg = context.new_page()
        pg.on("pageerror", lambda e: errors.append(str(e)))
        pg.goto(f"{served_site}/materials/aluminium/index.html")
        start_calculator(pg)
        pg.fill(f"{FORM} [name=frequency]", "1 kHz")
        assert_core_values(pg)
        assert errors == []
    finally:
        context.close()
