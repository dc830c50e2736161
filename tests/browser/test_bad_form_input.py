"""In Chromium: bad text typed into the resistance form gives a message on that field, and no
"NaN", "Infinity" or "undefined" ever shows on the page.

The fields are read from the page (every text input of the form), so new fields are covered.
Each bad text goes into one field while the others keep their defaults; the field's error slot
(``#<input id>-error``) must show a message once the field is left, and the input must be marked
aria-invalid. A required field's error blanks the resistance; an optional field that the
calculator lists in SIDE_FIELDS (current, frequency) keeps the resistance shown and blanks only the
results it feeds.
"""

from __future__ import annotations

import pytest

from conductor_atlas.core.calc_resistance import SIDE_FIELDS
from tests.browser.conftest import start_calculator

pytestmark = pytest.mark.browser

FORM = 'form[data-calculator="resistance"]'
FORBIDDEN = ("NaN", "Infinity", "undefined")

# Wrong in any field, whatever quantity it expects (a word, a unit alone, a number that is not
# finite, a comma read two ways, misplaced separators, a unit no field takes, junk, markup;
# "1,234.5 m" is no longer here: it reads one way, as thousands)
BAD_EVERYWHERE = ["abc", "5 kg", "m", "1e309 m", "NaN m", "Infinity", "1,500 m", "1.2.3 m", "--5 m", "💥", "5 m m",
                  "<b>5</b> m", "a" * 300]
# Not errors everywhere, but extreme: whatever the page shows must still be a number or a message
EXTREME = {
    "length": ["1e308 m", "1e-320 m", "0 m", "-5 m", "1e308 km"],
    "size": ["d 1e-200 mm", "1e308 x 1e308 mm", "1e-330 mm2", "0 mm2", "AWG 99", "1e308 mm2"],
    "temperature": ["1e308 K", "-273.16 °C", "0 K", "-1e308 °C", "1e308 °F"],
    "current": ["1e308 A", "-1 A", "1e-300 A", "1e308 kA"],
    "frequency": ["0 Hz", "1e308 GHz", "-50 Hz", "1e-300 Hz"],
}


def visible_text_without(pg, typed):
    """The page's rendered text, with the person's own typing (echoed in messages) taken out."""
    return pg.inner_text("body").replace(typed, "")


def test_bad_text_in_each_field_names_that_field(page, served_site):
    page.goto(f"{served_site}/materials/copper-annealed/index.html")
    start_calculator(page)
    fields = page.eval_on_selector_all(f"{FORM} input[type=text][name]",
                                       "els => els.map(e => [e.name, e.id, e.value])")
    assert len(fields) >= 4
    failures = []
    checked = 0
    for name, input_id, default in fields:
        selector = f"{FORM} input[name={name}]"
        for text in BAD_EVERYWHERE:
            page.fill(selector, text)
            page.locator(selector).blur()  # a field's message shows once the person leaves it
            message = page.text_content(f"#{input_id}-error") or ""
            if not message.strip():
                failures.append(f"{name}={text[:30]!r}: no message in #{input_id}-error")
            if page.get_attribute(selector, "aria-invalid") != "true":
                failures.append(f"{name}={text[:30]!r}: input not marked aria-invalid")
            shown = page.text_content("[data-result=resistance]") != "—"
            if name in SIDE_FIELDS:
                if not shown:
                    failures.append(f"{name}={text[:30]!r}: the resistance is blanked by an optional field")
                for fed in SIDE_FIELDS[name]:
                    slot = page.query_selector(f"[data-result={fed}]")
                    if slot is not None and slot.text_content() != "—":
                        failures.append(f"{name}={text[:30]!r}: {fed} is shown despite the error")
            elif shown:
                failures.append(f"{name}={text[:30]!r}: a resistance is shown despite the error")
            body = visible_text_without(page, text)
            for word in FORBIDDEN:
                if word in body:
                    failures.append(f"{name}={text[:30]!r}: page shows {word!r}")
            checked += 1
        for text in EXTREME.get(name, []):
            page.fill(selector, text)
            page.locator(selector).blur()
            message = (page.text_content(f"#{input_id}-error") or "").strip()
            value = page.get_attribute("[data-result=resistance]", "data-value")
            if not message and value is None and not any(
                    (page.text_content(f"#{other_id}-error") or "").strip() for _, other_id, _ in fields):
                failures.append(f"{name}={text!r}: neither a message nor a resistance")
            body = visible_text_without(page, text)
            for word in FORBIDDEN:
                if word in body:
                    failures.append(f"{name}={text!r}: page shows {word!r}")
            checked += 1
        page.fill(selector, default)
        if (page.text_content(f"#{input_id}-error") or "").strip():
            failures.append(f"{name}: the message stays after the default {default!r} is restored")
    assert checked > 50
    assert failures == [], "\n".join(failures)
    assert page.errors == []
