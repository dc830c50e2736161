"""In Chromium: the site says whether this device keeps it for use without a network.

- Served over plain http from another machine (not localhost), browsers give no service worker: the
  pages say so and what to do (https, or the copied folder).
- Served over https with a certificate the user supplies (`conductor-atlas serve --cert --key`), or
  on localhost, the service worker stores every file and the pages show the progress (files stored
  of total) and then "saved for offline use, edition …".
- A URL trimmed to a folder (/materials/, /static/) shows a page, online and offline.
"""

from __future__ import annotations

import re
import threading

import pytest

from conductor_atlas.offline import precache_list
from conductor_atlas.serve import make_server
from tests.conftest import CHROMIUM, CHROMIUM_ARGS
from tests.test_serve import non_loopback_address, self_signed

pytestmark = pytest.mark.browser

WORKSHOP = "workshop.test"   # a name of our own for the workshop machine, resolved to this one

# Every text the status line shows, in order (the service worker's messages arrive after load)
RECORD_STATUS = """document.addEventListener('DOMContentLoaded', () => {
  const line = document.getElementById('offline-status');
  window.statusSeen = [];
  if (line) new MutationObserver(() => window.statusSeen.push(line.textContent))
    .observe(line, {childList: true, characterData: true, subtree: true});
});"""


@pytest.fixture(scope="module")
def workshop_browser(browser):
    """A second Chromium in which WORKSHOP is this machine, and which accepts the test's self-signed
    certificate (a tablet's user accepts it once, or installs it)."""
    other = browser.browser_type.launch(
        executable_path=CHROMIUM,
        args=[*CHROMIUM_ARGS, f"--host-resolver-rules=MAP {WORKSHOP} 127.0.0.1", "--ignore-certificate-errors"])
    yield other
    other.close()


def serving(server):
    threading.Thread(target=server.serve_forever, daemon=True).start()
    return server.server_address[1]


def stored_files(built_site) -> int:
    files = {p.relative_to(built_site).as_posix(): b"" for p in built_site.rglob("*") if p.is_file()}
    return len(precache_list({p: b for p, b in files.items() if not p.startswith(".")}))


def edition_of(built_site) -> str:
    return re.search(r"const EDITION = '([^']+)'", (built_site / "sw.js").read_text()).group(1)


def test_plain_http_from_another_machine_says_it_is_not_kept(workshop_browser, built_site):
    server = make_server(built_site, port=0, host="0.0.0.0", quiet=True)
    port = serving(server)
    try:
        address = non_loopback_address() or WORKSHOP
        context = workshop_browser.new_context(viewport={"width": 834, "height": 1112}, service_workers="allow")
        page = context.new_page()
        page.goto(f"http://{address}:{port}/materials/copper-annealed/index.html")
        page.wait_for_load_state("load")
        assert page.evaluate("window.isSecureContext") is False
        note = page.locator(".not-secure-note")
        assert note.is_visible()
        text = note.text_content()
        assert "Not kept for offline use" in text and "https" in text and "copy the site folder" in text
        assert note.bounding_box()["y"] < 1112, "the notice is below the fold"
        assert page.evaluate("'serviceWorker' in navigator") is False
        assert page.locator("#offline-status").text_content() == ""
        context.close()
    finally:
        server.shutdown()
        server.server_close()


def test_localhost_shows_no_notice(page, served_site):
    page.goto(f"{served_site}/index.html")
    assert not page.locator(".not-secure-note").is_visible()


def test_progress_then_saved_with_edition_then_offline(browser, served_site, built_site):
    context = browser.new_context(viewport={"width": 834, "height": 1112}, service_workers="allow")
    context.add_init_script(RECORD_STATUS)
    page = context.new_page()
    errors = []
    page.on("pageerror", lambda e: errors.append(str(e)))
    page.goto(f"{served_site}/index.html")
    page.wait_for_selector("#offline-status[data-state=saved]", timeout=60_000)
    total = stored_files(built_site)
    seen = page.evaluate("window.statusSeen")
    progress = [re.search(r"(\d+) of (\d+) files stored", s) for s in seen]
    counts = [(int(m.group(1)), int(m.group(2))) for m in progress if m]
    assert counts, f"no progress was shown: {seen[:5]}"
    assert {t for _, t in counts} == {total}, f"total {total} expected, saw {counts[:5]}"
    assert [s for s, _ in counts] == sorted(s for s, _ in counts) and counts[-1][0] == total
    final = page.locator("#offline-status").text_content()
    assert f"Saved for offline use, edition {edition_of(built_site)}" in final
    assert page.locator("#offline-status").is_visible()

    other = context.new_page()                   # a later page asks the worker: still saved
    other.goto(f"{served_site}/materials/silver/index.html")
    other.wait_for_selector("#offline-status[data-state=saved]", timeout=10_000)

    context.set_offline(True)
    other.goto(f"{served_site}/materials/")
    assert other.locator("h1").text_content() == "Materials"
    assert other.locator("main a[href$='materials/silver/index.html']").count() == 1
    other.goto(f"{served_site}/static/")
    assert "nothing in it to read" in other.locator("main").text_content()
    context.close()
    assert errors == []


def test_https_with_a_supplied_certificate_keeps_the_site(workshop_browser, built_site, tmp_path):
    cert, key = self_signed(tmp_path, WORKSHOP)
    server = make_server(built_site, port=0, host="0.0.0.0", quiet=True, cert=cert, key=key)
    port = serving(server)
    try:
        context = workshop_browser.new_context(viewport={"width": 834, "height": 1112}, service_workers="allow",
                                               ignore_https_errors=True)
        page = context.new_page()
        page.goto(f"https://{WORKSHOP}:{port}/index.html")
        assert page.evaluate("window.isSecureContext") is True
        assert not page.locator(".not-secure-note").is_visible()
        page.wait_for_selector("#offline-status[data-state=saved]", timeout=60_000)
        assert edition_of(built_site) in page.locator("#offline-status").text_content()
        context.set_offline(True)
        page.goto(f"https://{WORKSHOP}:{port}/materials/silver/")
        assert "Silver" in page.locator("h1").text_content()
        context.close()
    finally:
        server.shutdown()
        server.server_close()
