"""The "cite" buttons: a plain-text citation of a table or a row, over http and from file://."""

from __future__ import annotations

import json
import re

import pytest

from tests.browser.conftest import open_page

pytestmark = pytest.mark.browser


def edition_of(built_site) -> str:
    home = (built_site / "index.html").read_text(encoding="utf-8")
    return re.search(r'data-edition="([^"]+)"', home).group(1)


def check_row_citation(text: str, edition: str, link_start: str) -> None:
    # IEC 60028: annealed copper is 1.7241 µΩ·cm at 20 °C (the row t-20c of the table)
    assert text.startswith("Standard annealed copper: Resistivity vs temperature, one row")
    assert "Temperature = 20 °C; Temperature = 293.15 K" in text
    assert "1.7241" in text and "µΩ·cm" in text
    assert "Model: " in text and "Sources: [iec60028]" in text
    assert f"data edition {edition}" in text
    link = text.splitlines()[-1]
    assert link.startswith("Link: " + link_start) and link.endswith("#resistivity-temperature--t-20c")


def test_row_and_table_citations_over_http(browser, served_site, built_site):
    context, page = open_page(browser, 900, 1200)
    context.grant_permissions(["clipboard-read", "clipboard-write"], origin=served_site)
    page.goto(f"{served_site}/materials/copper-annealed/index.html", wait_until="load")
    page.click("#resistivity-temperature--t-20c button.cite")
    page.wait_for_function("() => document.getElementById('cite-output') && document.getElementById('cite-output').value")
    text = page.eval_on_selector("#cite-output", "e => e.value")
    check_row_citation(text, edition_of(built_site), served_site)
    assert page.evaluate("navigator.clipboard.readText()") == text
    page.click("#resistivity-temperature button.cite[data-cite='table']")
    # the output is written once the clipboard has taken the text (a promise): wait for the new text. A
    # predicate as a function: the page's CSP (script-src 'self') refuses the eval that Playwright's
    # polling of a bare expression needs, which only shows when the first check is not already true
    page.wait_for_function("() => document.getElementById('cite-output').value.indexOf(' rows; columns') >= 0")
    table_text = page.eval_on_selector("#cite-output", "e => e.value")
    assert "rows; columns: Temperature [°C]" in table_text and table_text.endswith("#resistivity-temperature")
    # a 44 px touch target
    box = page.locator("#resistivity-temperature--t-20c button.cite").bounding_box()
    assert box["height"] >= 44 and box["width"] >= 44
    assert page.errors == []
    context.close()


def test_row_citation_from_a_copied_folder(browser, built_site):
    context, page = open_page(browser, 900, 1200)
    path = built_site / "materials" / "copper-annealed" / "index.html"
    page.goto(path.as_uri(), wait_until="load")
    page.click("#resistivity-temperature--t-20c button.cite")
    page.wait_for_function("() => document.getElementById('cite-output') && document.getElementById('cite-output').value")
    text = page.eval_on_selector("#cite-output", "e => e.value")
    check_row_citation(text, edition_of(built_site), "file://")
    assert page.errors == []
    context.close()


def test_the_model_line_is_the_tables_model_and_validity(page, served_site, built_site):
    """cite.js reads the model from the table's model paragraph (the page carries it once): the line
    equals the model and validity the table's JSON download gives, for every table of the page."""
    page.goto(f"{served_site}/materials/aluminium/index.html", wait_until="load")
    ids = page.eval_on_selector_all("section[data-cite-material]", "els => els.map(e => e.id)")
    assert len(ids) >= 5
    for table_id in ids:
        page.click(f"#{table_id} button.cite[data-cite='table']")
        # the citation is written once the clipboard has answered (asynchronous)
        page.wait_for_function("(id) => { const out = document.getElementById('cite-output');"
                               " return out && out.value.endsWith('#' + id); }", arg=table_id)
        text = page.eval_on_selector("#cite-output", "e => e.value")
        data = json.loads((built_site / "materials" / "aluminium" / f"{table_id}.json").read_text(encoding="utf-8"))
        expected = " ".join(f"Model: {data['model']}. {data['validity']}".split())
        assert expected in text.splitlines(), (table_id, text)
    assert page.errors == []


def test_every_row_gets_its_link_and_cite_cell(page, served_site):
    """cite.js makes each data row's last cell ("#" link to the row, cite button) and its column's
    heading, which the page does not carry: every row then has as many cells as the heading row, and
    its link points at the row itself."""
    page.goto(f"{served_site}/materials/aluminium/index.html", wait_until="load")
    found = page.evaluate("""() => [...document.querySelectorAll('section[data-cite-material] table.data')].map((t) => {
        const heads = t.tHead.rows[0].cells.length;
        const bad = [...t.tBodies[0].rows].filter((r) => {
          const last = r.cells[r.cells.length - 1];
          const link = last.querySelector('a.row-link');
          return r.cells.length !== heads || !link || link.getAttribute('href') !== '#' + r.id
            || link.getAttribute('aria-label') !== 'Link to this row' || !last.querySelector('button.cite[data-cite=row]');
        }).map((r) => r.id);
        return [t.closest('section').id, t.tBodies[0].rows.length, t.tHead.rows[0].lastElementChild.className, bad];
    })""")
    assert len(found) >= 5
    for table_id, rows, last_head, bad in found:
        assert rows > 0 and last_head == "link-col" and bad == [], (table_id, bad[:5])
    assert page.errors == []
