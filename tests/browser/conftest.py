"""Browser fixtures shared by the Chromium tests (the browser itself is in tests/conftest.py)."""

from __future__ import annotations

import pytest


def open_page(browser, width: int, height: int):
    """A fresh context and page that collects console errors and uncaught exceptions in ``.errors``."""
    context = browser.new_context(viewport={"width": width, "height": height})
    pg = context.new_page()
    errors: list[str] = []
    pg.on("pageerror", lambda e: errors.append(str(e)))
    pg.on("console", lambda m: errors.append(m.text) if m.type == "error" else None)
    pg.errors = errors
    return context, pg


@pytest.fixture()
def page(browser):
    """A desktop-ish page, 900 × 1200."""
    context, pg = open_page(browser, 900, 1200)
    yield pg
    context.close()


@pytest.fixture()
def tablet_page(browser):
    """A 10-11" tablet in portrait, 834 × 1112."""
    context, pg = open_page(browser, 834, 1112)
    yield pg
    context.close()


def start_calculator(pg, timeout: float = 30000) -> None:
    """Scroll the page's calculator into view and wait until it has started. A material page loads its
    calculator's script only when the calculator comes near the view (static/calc-loader.js), as a
    reader scrolling to it does; a calculator page has it from the start."""
    pg.locator("section.calculator").first.scroll_into_view_if_needed()
    pg.wait_for_selector("html.calc-ready", state="attached", timeout=timeout)
