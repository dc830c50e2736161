"""Make the README's screenshots: a material page at tablet width in light and dark, and the
compare page. Run after `make site`:  .venv/bin/python docs/screenshots.py
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
SHOTS = [
    ("material-light.png", "materials/copper-annealed/index.html?length=35%20m&size=2.5%20mm2&temperature=70%20%C2%B0C&current=20%20A", "light", 834),
    ("material-dark.png", "materials/copper-annealed/index.html?length=35%20m&size=2.5%20mm2&temperature=70%20%C2%B0C&current=20%20A", "dark", 834),
    ("compare.png", "compare/index.html", "light", 1180),
]


def main() -> None:
    site = ROOT / "site"
    server = make_server(site, port=0, quiet=True)
    threading.Thread(target=server.serve_forever, daemon=True).start()
    base = f"http://127.0.0.1:{server.server_address[1]}"
    with sync_playwright() as p:
        browser = p.chromium.launch(executable_path="/usr/bin/chromium", args=ARGS)
        for name, path, scheme, width in SHOTS:
            page = browser.new_page(viewport={"width": width, "height": 1400}, color_scheme=scheme)
            page.goto(f"{base}/{path}")
            page.wait_for_timeout(800)
            page.screenshot(path=str(ROOT / "docs" / name))
            page.close()
            print(f"docs/{name}")
        browser.close()
    server.shutdown()


if __name__ == "__main__":
    main()
