"""Make the README's screenshots, at tablet size (834 × 1112) unless a desktop view is the point:
a material page's resistance calculator with a field being edited (light) and the page's top (dark),
a calculator page, the compare page at 1366 px, and a material page as printed on A4.
Run after `make site`:  .venv/bin/python docs/screenshots.py
"""

from __future__ import annotations

import sys
import threading
from pathlib import Path

from playwright.sync_api import sync_playwright

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT / "generator"))

from conductor_atlas.serve import make_server  # noqa: E402

ARGS = ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking",
        "--disable-component-update", "--disable-sync"]
QUERY = "length=35%20m&size=2.5%20mm2&temperature=70%20%C2%B0C&current=20%20A"
EDIT_LENGTH = "document.querySelector('#in-resistance-length').focus()"
# (file, page, scheme, width, height, script run before the picture, media)
SHOTS = [
    ("material-light.png", f"materials/copper-annealed/index.html?{QUERY}", "light", 834, 1112, EDIT_LENGTH, "screen"),
    ("material-dark.png", f"materials/copper-annealed/index.html?{QUERY}", "dark", 834, 1112, "", "screen"),
    ("calculator.png", f"calculators/resistance/index.html?material=aluminium-1350&{QUERY}", "light", 834, 1112,
     "document.querySelector('#in-resistance-size').focus()", "screen"),
    ("compare.png", "compare/index.html", "light", 1366, 900, "", "screen"),
    ("print.png", "materials/copper-annealed/index.html#ac-dc-ratio", "dark", 703, 1000,
     "document.getElementById('ac-dc-ratio').scrollIntoView()", "print"),
]


def main() -> None:
    site = ROOT / "site"
    server = make_server(site, port=0, quiet=True)
    threading.Thread(target=server.serve_forever, daemon=True).start()
    base = f"http://127.0.0.1:{server.server_address[1]}"
    with sync_playwright() as p:
        browser = p.chromium.launch(executable_path="/usr/bin/chromium", args=ARGS)
        for name, path, scheme, width, height, script, media in SHOTS:
            # no service worker: the pictures show the pages, not the passing "Saving for offline use" line
            context = browser.new_context(viewport={"width": width, "height": height}, color_scheme=scheme,
                                          service_workers="block")
            page = context.new_page()
            page.goto(f"{base}/{path}")
            page.wait_for_timeout(800)
            page.emulate_media(media=media, color_scheme=scheme)
            if script:
                page.evaluate(script)
                page.wait_for_timeout(300)
            page.screenshot(path=str(ROOT / "docs" / name))
            context.close()
            print(f"docs/{name}")
        browser.close()
    server.shutdown()


if __name__ == "__main__":
    main()
