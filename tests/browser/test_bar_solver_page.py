"""In Chromium at ×4 CPU throttling (a tablet): typing never waits for the skin-effect calculator's
bar solver. The core says before an update whether it would run the filament solver
(core.calculators.needs_live_solver), so the very first keystroke that makes a bar group answer waits
for a pause in typing, with the busy line saying so (a single bar the solver's tabulated grid answers
does not wait); the result then shown is the Python core's to 1e-12, and a round size is answered at
once again. Behaviour only: no time is asserted here (the timings are in bench/: `bench/run.py --only
bar-solver`)."""

from __future__ import annotations

import pytest

from conductor_atlas.core.calculators import calculate

pytestmark = pytest.mark.browser

FIELDS = ["material", "frequency", "size", "arrangement", "temperature", "model"]


def form_inputs(pg) -> dict:
    return {name: pg.input_value(f"form[data-calculator=skin-effect] [name={name}]") for name in FIELDS}


def settled_values(pg) -> dict:
    pg.wait_for_selector("form[data-calculator=skin-effect]:not([data-solving])", state="attached", timeout=90000)
    return pg.eval_on_selector_all(
        "[data-result]", "els => Object.fromEntries(els.map(e => [e.dataset.result, e.dataset.value ?? null]))")


def assert_core_values(pg, catalogue) -> None:
    shown = settled_values(pg)
    expected = calculate("skin-effect", form_inputs(pg), catalogue)
    assert expected["errors"] == {}
    assert expected["results"]["resistance_ac"]["value"] > 0
    for name, result in expected["results"].items():
        if name in shown:
            assert shown[name] is not None, name
            assert float(shown[name]) == pytest.approx(result["value"], rel=1e-12, abs=0), name


# Type into a field and look at the form in the same task in the page, so a loaded machine cannot let
# the pause end between the keystroke and the look.
TYPE_AND_LOOK = """([sel, name, text]) => {
    const f = document.querySelector(sel);
    const field = f.querySelector(`[name=${name}]`);
    field.value = text;
    field.dispatchEvent(new Event('input', {bubbles: true}));
    const cell = f.closest('section').querySelector('[data-result=ac_dc_ratio]');
    return {solving: f.getAttribute('data-solving'), busy: document.querySelector('[data-busy]').textContent,
            ratio: cell.dataset.value ?? null};
}"""


def test_bar_solves_wait_for_a_pause_and_say_so(tablet_page, served_site, catalogue):
    pg = tablet_page
    cdp = pg.context.new_cdp_session(pg)
    cdp.send("Emulation.setCPUThrottlingRate", {"rate": 4})
    pg.goto(f"{served_site}/calculators/skin-effect/index.html")
    pg.wait_for_selector("html.calc-ready", state="attached", timeout=60000)
    form = "form[data-calculator=skin-effect]"
    busy = "[data-busy]"
    # a round conductor: immediate, nothing said
    assert pg.get_attribute(form, "data-solving") is None
    assert pg.text_content(busy) == ""
    pg.fill(f"{form} [name=frequency]", "400 Hz")
    assert pg.get_attribute(form, "data-solving") is None

    # a single bar the solver's tabulated grid answers (core.bar_ratio_lookup): at once, nothing said
    round_ratio = pg.get_attribute("[data-result=ac_dc_ratio]", "data-value")
    state = pg.evaluate(TYPE_AND_LOOK, [form, "size", "100 x 10 mm"])
    assert state["solving"] is None and state["busy"] == "", state
    assert state["ratio"] is not None and state["ratio"] != round_ratio, state
    assert_core_values(pg, catalogue)
    bar_ratio = pg.get_attribute("[data-result=ac_dc_ratio]", "data-value")

    # the first keystroke that makes a three-bar group answer is not solved at once: the page says it will be
    state = pg.evaluate(TYPE_AND_LOOK, [form, "arrangement", "3 bars, gap 10 mm"])
    assert state["solving"] == "" and "Solving when you pause typing" in state["busy"], state
    assert state["ratio"] == bar_ratio, state  # the old answer stands until the solve
    assert_core_values(pg, catalogue)
    state = pg.evaluate(TYPE_AND_LOOK, [form, "frequency", "60 Hz"])
    assert state["solving"] == "" and "Solving" in state["busy"], state
    assert_core_values(pg, catalogue)
    assert pg.text_content(busy) == ""

    # the change event on leaving the field changes no input: no second solve is started
    pg.focus(f"{form} [name=size]")
    assert pg.get_attribute(form, "data-solving") is None

    # back to a round size: answered at once, in the keystroke's own task
    pg.fill(f"{form} [name=arrangement]", "single")
    assert_core_values(pg, catalogue)
    state = pg.evaluate(TYPE_AND_LOOK, [form, "size", "240 mm2"])
    assert state["solving"] is None and state["busy"] == "", state
    assert_core_values(pg, catalogue)
    pg.fill(f"{form} [name=frequency]", "400 Hz")
    assert pg.get_attribute(form, "data-solving") is None
    assert_core_values(pg, catalogue)
    assert pg.errors == []


def test_the_warm_up_changes_nothing_on_the_page(page, served_site, catalogue):
    # calc-form.js runs the core's warm-up inputs (a bar size: core.calculators.warm_up_inputs) once
    # when the form starts and drops the outcome: the page shows the answer for its own fields, the
    # address stays as opened, and the next keystroke is answered for what the fields hold
    pg = page
    pg.goto(f"{served_site}/calculators/skin-effect/index.html")
    pg.wait_for_selector("html.calc-ready", state="attached", timeout=60000)
    assert pg.evaluate("() => window.location.search") == ""
    assert form_inputs(pg)["size"] == "240 mm2"
    assert_core_values(pg, catalogue)
    assert pg.get_attribute("[data-result=bar_share]", "data-value") is None
    method = pg.text_content("[data-result=ac_method]")
    assert "Kelvin" in method, method
    pg.fill("form[data-calculator=skin-effect] [name=frequency]", "60 Hz")
    assert_core_values(pg, catalogue)
    assert "Kelvin" in pg.text_content("[data-result=ac_method]")
    pg.wait_for_timeout(400)  # the address follows 250 ms after the last keystroke
    assert "size=240+mm2" in pg.evaluate("() => window.location.search")
    assert pg.errors == []
