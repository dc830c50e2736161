"""In Chromium: printed pages keep every table whole on A4, in the light palette, with units beside
their numbers; a row link lands with its table's column headings and the row's first column in view;
wide tables use the window's width and show that they scroll; small text (hints, notes, units) is
readable: at least 16 CSS px and the WCAG 2.2 AA contrast for text (4.5:1, success criterion 1.4.3).
"""

from __future__ import annotations

import io
import re
import unicodedata

import pytest

from tests.browser.conftest import open_page

pytestmark = pytest.mark.browser

A4_MARGIN_MM = 12                                   # style.css @page
A4_CONTENT_PX = (210 - 2 * A4_MARGIN_MM) / 25.4 * 96  # the printable width of A4 in CSS px (96 per inch)
AA_TEXT = 4.5                                       # WCAG 2.2 SC 1.4.3, normal-size text
READABLE_PX = 16                                    # our floor for hints and notes on a tablet

UNIT_AFTER_NUMBER = r"(\d[\d.,/]*) (mm²|AWG|kcmil|°C|Hz|kHz|MHz|µm|nm|mm)(?![\w²])"

PRINTED = ["materials/copper-annealed/index.html", "materials/aluminium-1350/index.html",
           "materials/ni-cr-80-20/index.html", "compare/index.html"]

# Each table's width against the page's, and the text of every column heading (units included)
TABLE_FIT = """() => Array.from(document.querySelectorAll('table')).filter((t) => t.getClientRects().length)
  .map((t) => ({id: (t.closest('section') || t).id, width: t.scrollWidth,
                right: t.getBoundingClientRect().right,
                headings: Array.from(t.tHead ? t.tHead.rows[0].cells : [])
                  .filter((c) => c.getClientRects().length && c.innerText.trim())
                  .map((c) => c.innerText.trim())}))"""


@pytest.mark.parametrize("path", PRINTED)
def test_every_table_prints_whole_on_a4(browser, served_site, built_site, path):
    if not (built_site / path).is_file():
        pytest.skip(f"{path} is not in this build")
    from pypdf import PdfReader
    context, pg = open_page(browser, round(A4_CONTENT_PX), 1100)
    pg.goto(f"{served_site}/{path}")
    pg.emulate_media(media="print")
    tables = pg.evaluate(TABLE_FIT)
    assert tables
    cut = [f"{t['id']}: {t['width']} px wide, right edge {t['right']:.0f}" for t in tables
           if t["width"] > A4_CONTENT_PX + 0.5 or t["right"] > A4_CONTENT_PX + 0.5]
    assert cut == [], f"tables wider than A4's {A4_CONTENT_PX:.0f} px:\n" + "\n".join(cut)

    # the PDF itself, as Chromium prints it: every column heading's words are on the paper, and no
    # number is parted from its unit at a line end ("1.5" / "mm²")
    pdf = pg.pdf(format="A4", print_background=False, prefer_css_page_size=True)
    # NFKC: the PDF's ligatures ("ﬁ") read as their letters
    text = unicodedata.normalize("NFKC", "\n".join(page.extract_text() for page in PdfReader(io.BytesIO(pdf)).pages))
    flat = re.sub(r"\s+", " ", text.replace("\u00a0", " "))
    for table in tables:
        for heading in table["headings"]:
            for word in re.sub(r"\s+", " ", heading).split(" "):
                word = unicodedata.normalize("NFKC", word.strip(",;:()"))
                assert word in flat, f"{path} {table['id']}: heading word {word!r} is not on the printed page"
    printed = text.replace("\u00a0", " ")
    cells = pg.eval_on_selector_all("td, th", "els => els.map(e => e.innerText)")
    quantities = {m.group(1) + " " + m.group(2) for cell in cells
                  for m in re.finditer(UNIT_AFTER_NUMBER, cell.replace("\u00a0", " "))}
    assert quantities, f"{path}: no number with a unit in any table"
    parted = sorted(q for q in quantities if unicodedata.normalize("NFKC", q) not in printed)
    assert parted == [], f"{path}: printed with the unit parted from its number: {parted[:5]}"
    context.close()


PALETTE = """() => {
  const rgb = (s) => (s.match(/[\\d.]+/g) || []).slice(0, 4).map(Number);
  const lum = (c) => { const f = (v) => { v /= 255; return v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4; };
    return 0.2126 * f(c[0]) + 0.7152 * f(c[1]) + 0.0722 * f(c[2]); };
  const out = [];
  for (const el of document.querySelectorAll('main *, .masthead *, .colophon *')) {
    if (!el.getClientRects().length || ![...el.childNodes].some((n) => n.nodeType === 3 && n.textContent.trim())) continue;
    const c = rgb(getComputedStyle(el).color);
    const ratio = (1.05) / (lum(c) + 0.05);          // against the white paper
    if (ratio < 4.5) out.push(el.tagName + '.' + el.className + ' ' + getComputedStyle(el).color + ' ' + ratio.toFixed(2));
  }
  return {background: getComputedStyle(document.body).backgroundColor, faint: out.slice(0, 20)};
}"""


def test_print_uses_the_light_palette_in_dark_mode(browser, served_site):
    context = browser.new_context(viewport={"width": 834, "height": 1112}, color_scheme="dark")
    pg = context.new_page()
    pg.goto(f"{served_site}/materials/copper-annealed/index.html")
    pg.emulate_media(media="print", color_scheme="dark")
    found = pg.evaluate(PALETTE)
    assert found["background"] in ("rgb(255, 255, 255)", "rgba(0, 0, 0, 0)"), found["background"]
    assert found["faint"] == [], "text too faint on paper:\n" + "\n".join(found["faint"])
    context.close()


# Where a row lands: its table's column headings and the row's first cell must be in the window,
# the row not under the headings
LANDING = """id => {
  const row = document.getElementById(id);
  const wrap = row.closest('.table-wrap');
  const head = row.closest('table').tHead.rows[0].cells[0].getBoundingClientRect();   // sticky cells
  const first = row.cells[0].getBoundingClientRect();
  const box = wrap.getBoundingClientRect();
  const within = (r) => r.top >= -0.5 && r.bottom <= innerHeight + 0.5;
  return {head: within(head), row: within(first) && first.top >= head.bottom - 0.5,
          firstColumn: first.left >= box.left - 0.5 && first.right <= box.right + 0.5 && first.left >= 0,
          scrollY: scrollY};
}"""


@pytest.mark.parametrize("path, table", [("materials/copper-annealed/index.html", "resistivity-temperature"),
                                         ("materials/copper-annealed/index.html", None),
                                         ("compare/index.html", "all-materials")])
def test_row_link_lands_with_column_headings_and_first_column(tablet_page, served_site, path, table):
    pg = tablet_page
    pg.goto(f"{served_site}/{path}")
    if table is None:                               # the last derived table of the page
        table = pg.eval_on_selector_all("section.derived", "els => els[els.length - 1].id")
    rows = pg.eval_on_selector_all(f"#{table} tbody tr[id]", "els => els.map(e => e.id)")
    assert len(rows) > 3
    row = rows[len(rows) * 2 // 3]                  # well down a long table
    pg.goto(f"{served_site}/{path}#{row}")          # a link from a design note
    pg.wait_for_timeout(300)
    where = pg.evaluate(LANDING, row)
    assert where == {**where, "head": True, "row": True, "firstColumn": True}, where
    # tapping the row's "#" (the last column of a wide table) keeps the first column in view
    pg.goto(f"{served_site}/{path}")
    pg.locator(f"#{rows[len(rows) // 2]} a.row-link").click()
    pg.wait_for_timeout(300)
    where = pg.evaluate(LANDING, rows[len(rows) // 2])
    assert where == {**where, "head": True, "row": True, "firstColumn": True}, where
    assert pg.errors == []


SCROLLERS = """() => Array.from(document.querySelectorAll('.table-wrap')).map((w) => ({
  id: (w.closest('section') || w).id, overflows: w.scrollWidth > w.clientWidth + 1,
  hint: Array.from(w.parentElement.querySelectorAll('.scroll-hint')).some((h) => h.getClientRects().length > 0)}))"""


def test_compare_table_uses_the_width_of_a_desktop(browser, served_site):
    context, pg = open_page(browser, 1366, 900)
    pg.goto(f"{served_site}/compare/index.html")
    pg.wait_for_timeout(200)
    wraps = {w["id"]: w for w in pg.evaluate(SCROLLERS)}
    assert not wraps["all-materials"]["overflows"], "the compare table is cut off at 1366 px"
    assert not wraps["all-materials"]["hint"]
    context.close()


def test_wide_tables_say_they_scroll(tablet_page, served_site):
    pg = tablet_page
    overflowing = 0
    for path in ("compare/index.html", "materials/copper-annealed/index.html"):
        pg.goto(f"{served_site}/{path}")
        pg.wait_for_timeout(200)
        for wrap in pg.evaluate(SCROLLERS):
            assert wrap["hint"] == wrap["overflows"], f"{path} {wrap}"
            overflowing += wrap["overflows"]
    assert overflowing >= 1          # the compare table does not fit 834 px: its hint shows


def test_compare_page_does_not_tie_sorting_to_a_server(browser, built_site):
    context = browser.new_context()
    pg = context.new_page()
    pg.goto((built_site / "compare" / "index.html").as_uri())
    assert "With the site served" not in pg.locator("main").text_content()
    first = pg.locator("#compare-table tbody tr").first.get_attribute("id")
    pg.locator("#compare-table thead th").first.locator("button").click()   # sorts from a folder too
    assert pg.locator("#compare-table tbody tr").first.get_attribute("id") != first
    context.close()


SMALL_TEXT = """selector => {
  const rgb = (s) => (s.match(/[\\d.]+/g) || []).map(Number);
  const lum = (c) => { const f = (v) => { v /= 255; return v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4; };
    return 0.2126 * f(c[0]) + 0.7152 * f(c[1]) + 0.0722 * f(c[2]); };
  const background = (el) => { for (let e = el; e; e = e.parentElement) { const c = rgb(getComputedStyle(e).backgroundColor);
      if (c.length === 3 || (c.length === 4 && c[3] > 0.99)) return c; } return [255, 255, 255]; };
  return Array.from(document.querySelectorAll(selector)).filter((el) => el.getClientRects().length && el.textContent.trim())
    .map((el) => { const s = getComputedStyle(el); const a = lum(rgb(s.color)); const b = lum(background(el));
      return {what: el.className || el.tagName, size: parseFloat(s.fontSize),
              contrast: (Math.max(a, b) + 0.05) / (Math.min(a, b) + 0.05)}; });
}"""

SMALL = (".field small, .note, .calc-sources, .calc-model, .model, .unit, .caution, figcaption, .m-facts, "
         ".calc-results dt, .key-results dt, .ref-note, .ref-kind, .material-class")


@pytest.mark.parametrize("scheme", ["light", "dark"])
def test_hints_and_notes_are_readable(browser, served_site, scheme):
    context = browser.new_context(viewport={"width": 834, "height": 1112}, color_scheme=scheme)
    pg = context.new_page()
    poor, seen = [], 0
    for path in ("materials/copper-annealed/index.html", "calculators/resistance/index.html",
                 "calculators/thin-film/index.html", "compare/index.html", "references/index.html", "index.html"):
        pg.goto(f"{served_site}/{path}")
        pg.wait_for_timeout(100)
        for item in pg.evaluate(SMALL_TEXT, SMALL):
            seen += 1
            if item["size"] < READABLE_PX - 0.05 or item["contrast"] < AA_TEXT:
                poor.append(f"{path} {item['what']}: {item['size']:.1f} px, contrast {item['contrast']:.2f}")
    context.close()
    assert seen > 50
    assert sorted(set(poor)) == [], "\n".join(sorted(set(poor))[:30])
