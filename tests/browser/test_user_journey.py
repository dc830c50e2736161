"""A user's walk through the served site in Chromium: home → search → material → table row deep
link → calculator permalink, checking what a person sees at each step."""

from __future__ import annotations

from urllib.parse import quote

import pytest

from conductor_atlas.core.calculators import calculate

pytestmark = pytest.mark.browser


def test_home_search_material_row_and_permalink(tablet_page, served_site, catalogue):
    page = tablet_page
    # 1. home: lists the classes, the calculators and the caution
    page.goto(f"{served_site}/index.html")
    assert page.text_content("h1").strip() == "Conductor Atlas"
    assert page.locator("#materials .material-list li").count() >= 40
    from conductor_atlas.core.calculators import calculator_names
    assert page.locator("#calculators li").count() == len(calculator_names())   # every calculator, once
    assert "not ampacity ratings" in page.text_content(".intro .caution")

    # 2. search with a typo, pick the first hit with the keyboard
    page.wait_for_selector("html.search-ready")
    box = page.locator("form[data-search=popup] input[name=q]")
    box.click()
    page.keyboard.type("aluminum 1350")
    page.wait_for_selector("form[data-search=popup] [role=option]")
    first = page.text_content("form[data-search=popup] [role=option] .site-search-title")
    assert "1350" in first
    page.keyboard.press("ArrowDown")
    with page.expect_navigation():
        page.keyboard.press("Enter")
    assert "/materials/aluminium-1350" in page.url

    # 3. the material page: sourced property card and a derived table with the 90 °C row
    assert page.text_content("h1").strip().startswith("Conductor aluminium 1350")
    card = page.text_content("#properties table")
    assert "61" in card and "iec60889" in card
    row = page.locator("#resistivity-temperature--t-90c")
    assert row.count() == 1
    # linear model, IEC 60889 α = 0.00403 /K at 20 °C: ρ(90 °C) = 2.8265 × (1 + 0.00403 × 70) = 3.6238 µΩ·cm
    assert row.locator("td").nth(2).text_content() == "3.6238"

    # 4. the row's own link: following it scrolls to and highlights that row
    href = row.locator("a.row-link").get_attribute("href")
    assert href == "#resistivity-temperature--t-90c"
    page.goto(page.url.split("#")[0] + href)
    assert page.evaluate("document.querySelector(':target') && document.querySelector(':target').id") == \
        "resistivity-temperature--t-90c"
    assert page.locator("#resistivity-temperature--t-90c").is_visible()

    # 5. a calculator permalink reopens the calculation, with the numbers of the Python core
    inputs = {"material": "1350", "length": "120 m", "size": "95 mm2", "temperature": "75 °C", "current": "150 A"}
    query = "&".join(f"{k}={quote(v)}" for k, v in inputs.items())
    page.goto(f"{served_site}/calculators/resistance/index.html?{query}")
    page.wait_for_selector("html.calc-ready")
    expected = calculate("resistance", inputs, catalogue)
    assert expected["errors"] == {}
    for name in ("resistance", "voltage_drop", "power_loss"):
        cell = page.locator(f"[data-result={name}]")
        assert float(cell.get_attribute("data-value")) == pytest.approx(expected["results"][name]["value"],
                                                                        rel=1e-12, abs=0)
        assert cell.text_content() == expected["results"][name]["text"]
    assert page.input_value("input[name=material]") == "1350"
    assert "not an ampacity rating" in page.text_content(".calculator .caution")
    assert page.errors == []


def test_compare_page_sorts_by_a_column(tablet_page, served_site):
    page = tablet_page
    page.goto(f"{served_site}/compare/index.html")
    page.wait_for_selector("table.sortable .sort-button")
    first_by_rho = page.text_content("#compare-table tbody tr:first-child th a")
    assert "Silver" in first_by_rho  # lowest resistivity at 20 °C of the shipped metals
    page.click("th[data-sort-key=density] .sort-button")
    densities = page.eval_on_selector_all(
        "#compare-table tbody td:nth-child(5)", "tds => tds.map(td => td.dataset.sort).filter(v => v !== undefined)")
    values = [float(v) for v in densities]
    assert values == sorted(values)
    assert page.errors == []


def test_compare_link_opens_two_materials_with_their_chart(tablet_page, served_site, catalogue):
    page = tablet_page
    inputs = {"material": "IACS", "other": "1350", "size": "35 mm2"}
    query = "&".join(f"{k}={quote(v)}" for k, v in inputs.items())
    page.goto(f"{served_site}/compare/index.html?{query}")
    page.wait_for_selector("html.calc-ready")
    expected = calculate("compare", {**inputs, "temperature": "20 °C"}, catalogue)
    assert expected["errors"] == {}
    # IEC 60889 / IEC 60028: equal resistance needs 1/0.610 = 1.64 times the copper area in 1350
    shown = float(page.get_attribute("[data-result=area_ratio]", "data-value"))
    assert shown == pytest.approx(expected["results"]["area_ratio"]["value"], rel=1e-12, abs=0)
    assert shown == pytest.approx(1 / 0.610, rel=2e-3)
    chart = page.locator("#compare-chart")
    assert chart.is_visible()
    assert chart.locator("path.chart-line").count() == 2
    legend = chart.locator("svg text").all_text_contents()
    assert "Standard annealed copper" in legend and any("1350" in t for t in legend)
    assert page.errors == []


def test_compare_link_with_a_bar_gives_the_equal_resistance_bar(tablet_page, served_site, catalogue):
    """A bar size on the compare page: the other material's width at the same thickness, the core's value,
    and the DC-only caution. IEC 60028 / IEC 60889: 100 mm / 0.610 = 163.9 mm of 1350 for 100 x 10 mm copper."""
    page = tablet_page
    inputs = {"material": "IACS", "other": "1350", "size": "100 x 10 mm"}
    page.goto(f"{served_site}/compare/index.html?" + "&".join(f"{k}={quote(v)}" for k, v in inputs.items()))
    page.wait_for_selector("html.calc-ready")
    expected = calculate("compare", {**inputs, "temperature": "20 °C"}, catalogue)
    shown = float(page.get_attribute("[data-result=bar_width_other]", "data-value"))
    assert shown == pytest.approx(expected["results"]["bar_width_other"]["value"], rel=1e-12, abs=0)
    assert shown == pytest.approx(0.1 / 0.610, rel=2e-4)
    assert "163.9 mm" in page.text_content("[data-result=bar_width_other]")
    assert "DC only" in page.text_content("body")
    assert page.get_attribute("[data-result=diameter_other]", "data-value") is not None
    assert page.errors == []


def test_row_link_copies_the_address(browser, served_site):
    context = browser.new_context(permissions=["clipboard-read", "clipboard-write"])
    page = context.new_page()
    page.goto(f"{served_site}/materials/copper-annealed/index.html")
    page.click("#resistivity-temperature--t-90c a.row-link")
    page.wait_for_selector("#copy-link-status:not(:empty)")
    copied = page.evaluate("navigator.clipboard.readText()")
    assert copied.endswith("/materials/copper-annealed/index.html#resistivity-temperature--t-90c")
    context.close()
