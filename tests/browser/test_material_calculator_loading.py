"""In Chromium: a material page loads its calculator's script (static/calc-resistance.classic.js, most
of a first visit's bytes) only when the calculator is about to be used (static/calc-loader.js): when it
comes near the view, on a touch or focus inside it, at once for an address that points into it or
carries its inputs, and at once where IntersectionObserver is missing. A script that cannot be loaded
is said in words, and tried again on the next touch. The results, once loaded, are the Python core's
(to 1e-12). How many bytes this saves is measured in bench/ (`bench/run.py --only weight`)."""

from __future__ import annotations

import json
from urllib.parse import quote

import pytest

from conductor_atlas.core.calc_resistance import calculate
from tests.browser.conftest import open_page

pytestmark = pytest.mark.browser

PAGE = "materials/copper-annealed/index.html"
SCRIPT = "static/calc-resistance.classic.js"
FORM = "form[data-calculator=resistance]"
FIELDS = ["material", "length", "size", "temperature", "current", "frequency", "model"]


def script_requests(pg) -> list[str]:
    found: list[str] = []
    pg.on("request", lambda request: found.append(request.url) if request.url.endswith(SCRIPT) else None)
    return found


def results(pg) -> dict:
    return pg.eval_on_selector_all(
        f"section:has({FORM}) [data-result]",
        "els => Object.fromEntries(els.map(e => [e.dataset.result, [e.textContent, e.dataset.value ?? null]]))")


def busy_line(pg) -> str:
    return pg.text_content(f"section:has({FORM}) [data-busy]")


def wait_for_busy_line(pg, part: str) -> None:
    """Until the results' status line holds ``part`` ("" : until it is empty)."""
    pg.wait_for_function("([sel, part]) => { const t = document.querySelector(sel).closest('section')"
                         ".querySelector('[data-busy]').textContent; return part ? t.includes(part) : t === ''; }",
                         arg=[FORM, part], timeout=30000)


def assert_core_results(pg) -> None:
    """Every result shown equals CPython's for the form's inputs and the catalogue the page embeds."""
    inputs = {name: pg.input_value(f"{FORM} [name={name}]") for name in FIELDS}
    expected = calculate(inputs, json.loads(pg.text_content("#calc-catalogue")))
    assert expected["errors"] == {}
    shown = results(pg)
    assert shown["resistance"][1] is not None
    for name, result in expected["results"].items():
        if name in shown:
            assert float(shown[name][1]) == pytest.approx(result["value"], rel=1e-12, abs=0), name
            assert shown[name][0] == result["text"], name


@pytest.fixture()
def small_page(browser):
    """A phone-sized view (390 × 844): the calculator is more than two views down on a material page."""
    context, pg = open_page(browser, 390, 844)
    yield pg
    context.close()


def test_the_script_loads_when_the_calculator_comes_near_and_answers_as_the_core(small_page, served_site):
    pg = small_page
    requested = script_requests(pg)
    pg.goto(f"{served_site}/{PAGE}", wait_until="networkidle")
    assert requested == []                       # reading the top of the page does not fetch it
    assert pg.evaluate("document.documentElement.classList.contains('calc-ready')") is False
    assert {text for text, _ in results(pg).values()} == {"—"}   # the results wait, empty, as before
    assert not pg.locator(".calculator .needs-server").is_visible()  # scripts run: no "needs JavaScript"
    # a reader scrolling down: about one view above the calculator, it is fetched
    top = pg.evaluate("document.querySelector('section.calculator').getBoundingClientRect().top + scrollY")
    pg.evaluate("(y) => window.scrollTo(0, y)", top - 1.5 * 844)
    pg.wait_for_selector("html.calc-ready", state="attached", timeout=30000)
    assert len(requested) == 1
    wait_for_busy_line(pg, "")
    assert_core_results(pg)
    pg.fill(f"{FORM} [name=length]", "250 m")    # and it follows typing
    assert_core_results(pg)
    assert len(requested) == 1 and pg.errors == []


@pytest.mark.parametrize("address", ["#calc-resistance",
                                     "?length=" + quote("35 m") + "&size=" + quote("2.5 mm2")])
def test_an_address_for_the_calculator_loads_it_at_once(small_page, served_site, address):
    pg = small_page
    # IntersectionObserver that never reports: only the address can have asked for the script
    pg.add_init_script("window.IntersectionObserver = class { observe() {} disconnect() {} };")
    pg.goto(f"{served_site}/{PAGE}{address}")
    pg.wait_for_selector("html.calc-ready", state="attached", timeout=30000)
    if address.startswith("?"):
        assert pg.input_value(f"{FORM} [name=length]") == "35 m"
    assert_core_results(pg)
    assert pg.errors == []


def test_a_focus_in_the_form_loads_it(small_page, served_site):
    pg = small_page
    pg.add_init_script("window.IntersectionObserver = class { observe() {} disconnect() {} };")
    requested = script_requests(pg)
    pg.goto(f"{served_site}/{PAGE}", wait_until="networkidle")
    assert requested == []
    # focus without scrolling (a keyboard reader tabbing in, or a screen reader's form mode)
    pg.evaluate(f"document.querySelector('{FORM} [name=length]').focus({{preventScroll: true}})")
    pg.wait_for_selector("html.calc-ready", state="attached", timeout=30000)
    assert len(requested) == 1
    assert_core_results(pg)
    assert pg.errors == []


def test_without_intersection_observer_it_loads_at_once(small_page, served_site):
    pg = small_page
    pg.add_init_script("delete window.IntersectionObserver;")
    pg.goto(f"{served_site}/{PAGE}")
    pg.wait_for_selector("html.calc-ready", state="attached", timeout=30000)
    assert_core_results(pg)
    assert pg.errors == []


def test_a_script_that_cannot_be_loaded_is_said_and_tried_again(browser, served_site):
    context, pg = open_page(browser, 390, 844)
    try:
        # offline on a first visit, with no stored copy: the request fails
        pg.route(f"**/{SCRIPT}", lambda route: route.abort("internetdisconnected"))
        pg.goto(f"{served_site}/{PAGE}")
        pg.locator("section.calculator").scroll_into_view_if_needed()
        wait_for_busy_line(pg, "could not be loaded")
        assert "The calculator could not be loaded" in busy_line(pg)
        assert pg.locator(f"section:has({FORM}) [data-busy]").is_visible()
        assert {text for text, _ in results(pg).values()} == {"—"}   # never a made-up number
        # the network is back; the next touch of the form tries again
        pg.unroute(f"**/{SCRIPT}")
        pg.click(f"{FORM} [name=length]")
        pg.wait_for_selector("html.calc-ready", state="attached", timeout=30000)
        wait_for_busy_line(pg, "")
        assert_core_results(pg)
        # the failed request is the browser's own console line; nothing else went wrong
        assert [e for e in pg.errors if "net::ERR_INTERNET_DISCONNECTED" not in e and "Failed to load resource" not in e] == []
    finally:
        context.close()
