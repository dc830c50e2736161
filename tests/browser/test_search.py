"""In Chromium, with the keyboard only: the header search box and the search page of a served build."""

from __future__ import annotations

import pytest
from playwright.sync_api import expect

pytestmark = pytest.mark.browser

BOX = "form[data-search=popup] input[name=q]"
OPTIONS = "form[data-search=popup] [role=option]"


def focus_search(pg, served_site):
    pg.goto(f"{served_site}/index.html")
    pg.wait_for_selector("html.search-ready")
    # reach the box as a keyboard user does: Tab from the top of the page
    for _ in range(12):
        pg.keyboard.press("Tab")
        if pg.evaluate("document.activeElement && document.activeElement.name === 'q'"):
            return
    pytest.fail("the search box cannot be reached with Tab")


def titles(pg, selector=OPTIONS):
    return pg.eval_on_selector_all(selector + " .site-search-title", "els => els.map(e => e.textContent)")


def test_typo_arrow_enter_opens_the_material(page, served_site):
    focus_search(page, served_site)
    page.keyboard.type("cooper")
    page.wait_for_selector(OPTIONS)
    box = page.locator(BOX)
    assert box.get_attribute("role") == "combobox"
    assert box.get_attribute("aria-expanded") == "true"
    assert titles(page)[0] == "Copper (high purity)"
    page.keyboard.press("ArrowDown")
    active = box.get_attribute("aria-activedescendant")
    assert active and page.get_attribute(f"#{active}", "aria-selected") == "true"
    assert page.errors == []
    with page.expect_navigation():
        page.keyboard.press("Enter")
    assert page.url.endswith("/materials/copper/index.html")
    assert page.text_content("h1").strip() == "Copper (high purity)"


def test_arrow_keys_move_and_escape_clears(page, served_site):
    focus_search(page, served_site)
    page.keyboard.type("nickle")
    page.wait_for_selector(OPTIONS)
    box = page.locator(BOX)
    page.keyboard.press("ArrowDown")
    page.keyboard.press("ArrowDown")
    second = box.get_attribute("aria-activedescendant")
    page.keyboard.press("ArrowUp")
    first = box.get_attribute("aria-activedescendant")
    assert first != second and first.endswith("-0") and second.endswith("-1")
    assert titles(page)[0] == "Nickel (high purity)"
    page.keyboard.press("Escape")
    assert box.input_value() == ""
    assert box.get_attribute("aria-expanded") == "false"
    assert page.locator(OPTIONS).count() == 0


def test_filter_with_units_lists_high_conductivity_metals(page, served_site):
    focus_search(page, served_site)
    page.keyboard.type("iacs > 90")
    page.wait_for_selector(OPTIONS)
    shown = titles(page)
    # IEC 60028 defines annealed copper as 100 %IACS; silver's handbook resistivity (about 1.59 µΩ·cm) is
    # about 108 %IACS and high-purity aluminium's (about 2.65 µΩ·cm) about 65 %IACS
    assert "Silver (high purity)" in shown
    assert "Standard annealed copper" in shown
    assert not any("luminium" in t for t in shown)
    assert "conductivity at 20 °C > 90 %IACS" in page.text_content("form[data-search=popup] .site-search-message")
    # the live region tells a screen reader how many results there are
    expect(page.locator("form[data-search=popup] [role=status]")).to_contain_text("results. First: ")


def test_search_page_filter_density(page, served_site):
    page.goto(f"{served_site}/search/index.html?q=" + "density%20%3C%203%20g%2Fcm3")
    page.wait_for_selector("form[data-search=page] [role=option]")
    shown = titles(page, "form[data-search=page] [role=option]")
    # CRC Handbook: Al 2.70, Mg 1.74, Be 1.85 g/cm3 are below 3; copper 8.96 is not
    assert "Aluminium (high purity)" in shown and "Magnesium (high purity)" in shown
    assert not any(t.startswith("Copper") for t in shown)
    assert page.locator(".search-needs-server").is_hidden()
    assert page.errors == []


def test_typed_markup_is_never_rendered(page, served_site):
    focus_search(page, served_site)
    hostile = "<img src=x onerror=alert(1)>"
    page.keyboard.type(hostile)
    message = page.locator("form[data-search=popup] .site-search-message")
    message.wait_for(state="visible")
    # the typed text comes back in the message, as text
    assert hostile in message.text_content()
    assert "name a property before" in message.text_content()
    assert page.locator("header img, form img, main img").count() == 0
    page.keyboard.press("Escape")
    page.keyboard.type('copper <b id="typed-bold">x</b>')
    page.wait_for_timeout(200)
    assert page.locator("#typed-bold").count() == 0
    assert page.errors == []


def test_bad_filter_gives_a_message(page, served_site):
    focus_search(page, served_site)
    page.keyboard.type("density < 3 ohm")
    message = page.locator("form[data-search=popup] .site-search-message")
    message.wait_for(state="visible")
    assert "“ohm” is not a unit of density; use g/cm3, kg/m3" in message.text_content()
    body = page.text_content("body")
    assert "NaN" not in body and "undefined" not in body


def test_search_works_from_file_urls(browser, built_site):
    """A copied folder opened as files cannot fetch search-index.json: the header box and the search
    page load search-index.js instead, and find what the served site finds."""
    context = browser.new_context()
    pg = context.new_page()
    errors: list[str] = []
    pg.on("pageerror", lambda e: errors.append(str(e)))
    pg.on("console", lambda m: errors.append(m.text) if m.type == "error" else None)
    pg.goto((built_site / "materials" / "copper" / "index.html").as_uri(), wait_until="load")
    box = pg.locator("form[data-search=popup] input[name=q]")
    box.click()
    pg.keyboard.type("nickl chrom")
    first = pg.locator("form[data-search=popup] [role=option]").first
    first.wait_for(state="visible")
    assert "Nickel-chromium 80/20" in first.text_content()
    pg.keyboard.press("ArrowDown")
    with pg.expect_navigation():
        pg.keyboard.press("Enter")
    assert pg.url.endswith("/materials/ni-cr-80-20/index.html")
    pg.goto((built_site / "search" / "index.html").as_uri() + "?q=iacs%20%3E%2090", wait_until="load")
    pg.locator("form[data-search=page] [role=option]").first.wait_for(state="visible")
    assert pg.locator(".search-needs-server").is_hidden()
    assert errors == []
    # without JavaScript the search page points to the home page's list of every material
    plain = browser.new_context(java_script_enabled=False).new_page()
    plain.goto((built_site / "search" / "index.html").as_uri())
    assert plain.locator(".search-needs-server").is_visible()
    plain.goto((built_site / "index.html").as_uri())
    count = len(list((built_site / "materials").glob("*/index.html")))
    assert plain.locator("#materials a[href*='materials/']").count() >= count
    plain.context.close()
    context.close()


def test_typing_after_clearing_refills_the_same_list_in_place(page, served_site):
    """After the box is emptied (the list's items go), the next query's results go into the
    items and text nodes already made, with the core's titles and no item left over from before."""
    focus_search(page, served_site)
    page.keyboard.type("copper")
    page.wait_for_selector(OPTIONS)
    page.evaluate("() => { window.firstTitle = document.querySelector("
                  "'form[data-search=popup] [role=option] .site-search-title').firstChild; }")
    page.fill(BOX, "")
    assert page.locator(OPTIONS).count() == 0
    page.fill(BOX, "nickl chrom")
    page.wait_for_selector(OPTIONS)
    shown = titles(page)
    assert shown[0] == "Nickel-chromium 80/20 heating alloy"
    assert page.evaluate("() => document.querySelector("
                         "'form[data-search=popup] [role=option] .site-search-title').firstChild === window.firstTitle")
    page.fill(BOX, "C17200")
    page.wait_for_selector(OPTIONS)
    assert titles(page)[0] == "Beryllium copper (C17200, Cu-2Be)"
    assert len(titles(page)) == page.evaluate("() => document.querySelectorAll("
                                              "'form[data-search=popup] .site-search-results > li').length")
    assert page.errors == []
