"""In Chromium at tablet and phone sizes: the calculators can be used with a finger and an on-screen
keyboard. The key results stay in view beside the field being edited, a field's message waits until
the person stops typing, inputs ask for the right keyboard, and every control a finger points at is
at least 44 × 44 CSS px (WCAG 2.2 success criterion 2.5.5, target size, enhanced).
"""

from __future__ import annotations

import pytest

from tests.browser.conftest import open_page, start_calculator

pytestmark = pytest.mark.browser

TARGET_PX = 44  # WCAG 2.2 SC 2.5.5 (AAA): a pointer target of at least 44 by 44 CSS pixels

# (width, height): a 10-11" tablet in portrait, the same with an on-screen keyboard taking ~45 % of
# the height (the window a resizing keyboard leaves), a phone, and the phone with its keyboard up
SIZES = [(834, 1112), (834, 620), (390, 844), (390, 460)]


def calculator_paths(built_site) -> list[str]:
    pages = sorted(p.parent.name for p in (built_site / "calculators").glob("*/index.html"))
    return [f"calculators/{name}/index.html" for name in pages] + ["materials/copper-annealed/index.html"]


# Where is everything, after focusing one field (the browser scrolls it into view, as a tap does)?
LAYOUT = """input => {
  const inside = (r) => r.top >= 0 && r.left >= 0 && r.bottom <= innerHeight && r.right <= innerWidth;
  const onTop = (el) => { const r = el.getBoundingClientRect();
    const hit = document.elementFromPoint(r.left + r.width / 2, r.top + r.height / 2);
    return hit !== null && (hit === el || el.contains(hit)); };
  const section = input.closest('section');
  // a phone shows fewer key results (the first two): those it shows must be in view
  const keys = Array.from(section.querySelectorAll('[data-key-result]')).filter((k) => k.getClientRects().length > 0);
  return {
    field: inside(input.getBoundingClientRect()) && onTop(input),
    keys: keys.map((k) => ({name: k.dataset.keyResult, text: k.textContent,
                            full: section.querySelector('[data-result="' + k.dataset.keyResult + '"]').textContent,
                            seen: inside(k.getBoundingClientRect()) && onTop(k)})),
  };
}"""


@pytest.mark.parametrize("width, height", SIZES)
def test_key_results_stay_in_view_with_the_focused_field(browser, served_site, built_site, width, height):
    context, pg = open_page(browser, width, height)
    problems, checked = [], 0
    for path in calculator_paths(built_site):
        pg.goto(f"{served_site}/{path}")
        start_calculator(pg)
        inputs = pg.locator("form[data-calculator] input[type=text]")
        for i in range(inputs.count()):
            box = inputs.nth(i)
            box.focus()
            pg.keyboard.press("End")
            pg.keyboard.type(" ")        # a keystroke, as when editing; the results update
            pg.keyboard.press("Backspace")
            where = box.evaluate(LAYOUT)
            name = box.get_attribute("name")
            if not where["field"]:
                problems.append(f"{path} {name}: the focused field is out of view or covered")
            if len(where["keys"]) < 2:
                problems.append(f"{path}: {len(where['keys'])} key results shown, at least two expected")
            for key in where["keys"]:
                if not key["seen"]:
                    problems.append(f"{path} {name}: key result {key['name']} out of view or covered")
                if key["text"].replace("\u00a0", " ") != key["full"]:   # the strip keeps units with numbers
                    problems.append(f"{path}: key result {key['name']} shows {key['text']!r}, "
                                    f"the results {key['full']!r}")
            checked += 1
    context.close()
    assert checked > 30
    assert problems == [], "\n".join(problems[:30])
    assert pg.errors == []


def test_key_results_show_values_on_the_default_inputs(tablet_page, served_site, built_site):
    for path in calculator_paths(built_site):
        tablet_page.goto(f"{served_site}/{path}")
        start_calculator(tablet_page)
        shown = tablet_page.eval_on_selector_all("[data-key-result]", "els => els.map(e => e.textContent)")
        assert shown and shown[0] != "—", f"{path}: the first key result is empty on the default inputs: {shown}"


def test_calculator_pages_do_not_repeat_their_title(tablet_page, served_site, built_site):
    for path in calculator_paths(built_site)[:-1]:
        tablet_page.goto(f"{served_site}/{path}")
        title = tablet_page.locator("h1").text_content().strip()
        others = tablet_page.eval_on_selector_all(
            "main h2, main h3", "els => els.map(e => e.textContent.replace('#', '').trim())")
        assert title not in others, f"{path}: the title {title!r} is repeated as a heading"


ERROR_LOG = """() => { window.messagesSeen = [];
  new MutationObserver(() => { const t = document.querySelector('#in-resistance-length-error').textContent;
    if (t) window.messagesSeen.push(t); })
  .observe(document.querySelector('#in-resistance-length-error'), {childList: true, characterData: true, subtree: true});
}"""


def test_field_message_waits_until_typing_stops(tablet_page, served_site):
    pg = tablet_page
    pg.goto(f"{served_site}/calculators/resistance/index.html")
    pg.wait_for_selector("html.calc-ready")
    pg.evaluate(ERROR_LOG)
    field = pg.locator("#in-resistance-length")
    field.click()
    field.press("Control+a")
    field.press("Delete")
    # typing "50 m" at a brisk but human pace (120 ms a key): "5", "50", "50 " are not messages yet
    field.press_sequentially("50 m", delay=120)
    resistance = pg.locator("[data-result=resistance]")
    assert resistance.text_content() != "—"                   # the results follow every keystroke
    first = float(resistance.get_attribute("data-value"))
    assert pg.evaluate("window.messagesSeen") == [], "a message showed while the length was being typed"

    field.press_sequentially("0", delay=0)                    # 50 m -> 50 m0: not a length
    assert pg.locator("#in-resistance-length-error").text_content() == ""
    assert resistance.text_content() == "—"                   # results update as today: no answer
    pg.wait_for_timeout(1500)                                 # a pause: the field is judged
    assert pg.locator("#in-resistance-length-error").text_content().strip() != ""
    assert field.get_attribute("aria-invalid") == "true"

    field.press("Backspace")                                  # right again: the message goes at once
    assert pg.locator("#in-resistance-length-error").text_content() == ""
    assert float(resistance.get_attribute("data-value")) == first

    field.press("Control+a")
    field.press_sequentially("5", delay=0)
    field.press("Tab")                                        # leaving the field judges it at once
    assert pg.locator("#in-resistance-length-error").text_content().strip() != ""
    assert pg.errors == []


def test_inputs_ask_for_a_plain_keyboard(tablet_page, served_site, built_site):
    for path in calculator_paths(built_site):
        tablet_page.goto(f"{served_site}/{path}")
        attrs = tablet_page.eval_on_selector_all(
            "form[data-calculator] input[type=text]",
            "els => els.map(e => [e.name, e.getAttribute('autocapitalize'), e.getAttribute('autocorrect'),"
            " e.getAttribute('spellcheck'), e.getAttribute('inputmode')])")
        assert attrs
        for name, capitalize, correct, spell, mode in attrs:
            assert (capitalize, correct, spell) == ("off", "off", "false"), f"{path} {name}"
            # a fraction from 0 to 1 takes the decimal pad; quantities are typed with their unit and
            # materials by name, so they need the letters
            assert mode == ("decimal" if name in ("specularity", "reflection") else "text"), f"{path} {name}: {mode}"


# Everything a finger points at: links and buttons that stand alone (not words inside a sentence of
# running text, which WCAG exempts), lists of sources, table controls (row links, source links, a cite control),
# contents and heading links, form controls.
TARGETS = """() => {
  // a link inside a sentence of a paragraph is running text; paragraphs that are rows of controls
  // (a table's model and source line, downloads, breadcrumb, more calculators) are not
  const sentence = (el) => { const p = el.closest('p');
    return p !== null && !p.matches('.model, .downloads, .more-calcs, .breadcrumb')
           && p.textContent.trim().length >= el.textContent.trim().length + 20; };
  const prose = (el) => el.closest('.notes, .lede, .caution, .from-file-note, .calc-problems, .calc-warnings') || sentence(el);
  const all = Array.from(document.querySelectorAll(
    'main a[href], main button, main input:not([type=hidden]), main select, .masthead a, .masthead button, .masthead input'));
  return all.filter((el) => !prose(el) && el.getClientRects().length > 0
                            && getComputedStyle(el).visibility !== 'hidden' && !el.closest('[hidden]'))
    .map((el) => { const r = el.getBoundingClientRect();
      return {what: el.tagName.toLowerCase() + (el.className ? '.' + el.className : '') + ' ' +
                    (el.textContent || el.name || '').trim().slice(0, 30),
              width: r.width, height: r.height}; });
}"""

TARGET_PAGES = ["index.html", "materials/copper-annealed/index.html", "materials/aluminium-1350/index.html",
                "compare/index.html", "calculators/index.html", "calculators/resistance/index.html",
                "references/index.html", "methods/index.html", "search/index.html"]


def test_touch_targets_are_at_least_44_px(tablet_page, served_site):
    small, measured = [], 0
    for path in TARGET_PAGES:
        tablet_page.goto(f"{served_site}/{path}")
        tablet_page.wait_for_timeout(200)
        for target in tablet_page.evaluate(TARGETS):
            measured += 1
            # 0.5 px: layout rounds sub-pixel sizes (a 44 px box can measure 43.99)
            if target["width"] < TARGET_PX - 0.5 or target["height"] < TARGET_PX - 0.5:
                small.append(f"{path}: {target['what']!r} {target['width']:.0f}×{target['height']:.0f}")
    assert measured > 300
    assert small == [], f"{len(small)} small targets:\n" + "\n".join(small[:40])
