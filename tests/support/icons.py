"""Render the site's SVG icon to the PNG sizes the web app manifest lists, with Debian's Chromium.

The PNGs are committed (the build needs no image library); re-run this after editing the SVG:

    .venv/bin/python -m tests.support.icons

``tests/browser/test_offline.py`` checks that the committed PNGs still match the SVG.
"""

from __future__ import annotations

import base64
from pathlib import Path

from conductor_atlas.offline import ICON_SIZES, ICON_SVG
from conductor_atlas.paths import STATIC_DIR

ICONS_DIR = STATIC_DIR / "icons"


def svg_page(size: int) -> str:
    data = base64.b64encode((STATIC_DIR / ICON_SVG).read_bytes()).decode("ascii")
    return (f"<!doctype html><html><body style='margin:0'><img id='icon' width='{size}' height='{size}' "
            f"src='data:image/svg+xml;base64,{data}'></body></html>")


def render(browser, size: int) -> bytes:
    page = browser.new_page(viewport={"width": size, "height": size})
    try:
        page.set_content(svg_page(size))
        page.wait_for_function("document.getElementById('icon').complete")
        return page.screenshot(clip={"x": 0, "y": 0, "width": size, "height": size}, type="png")
    finally:
        page.close()


def main() -> None:
    from playwright.sync_api import sync_playwright
    from tests.conftest import CHROMIUM, CHROMIUM_ARGS
    with sync_playwright() as p:
        browser = p.chromium.launch(executable_path=CHROMIUM, args=CHROMIUM_ARGS)
        for size in ICON_SIZES:
            target = ICONS_DIR / f"atlas-{size}.png"
            target.write_bytes(render(browser, size))
            print(f"wrote {target} ({target.stat().st_size} bytes)")
        browser.close()


if __name__ == "__main__":
    main()
