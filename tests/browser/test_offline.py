"""In Chromium: after one served visit the whole site reads with the network off; a rebuild swaps caches."""

from __future__ import annotations

import shutil
import threading
from pathlib import Path
from urllib.parse import quote

import pytest

from conductor_atlas.offline import ICON_SIZES, WORKER, service_worker
from conductor_atlas.publish import MARKER
from conductor_atlas.serve import make_server
from tests.browser.conftest import start_calculator
from tests.support.icons import render

pytestmark = pytest.mark.browser

CACHES = "async () => { const out = {}; for (const n of await caches.keys()) out[n] = (await (await caches.open(n)).keys()).map(r => r.url); return out; }"


def result_values(page) -> dict[str, str | None]:
    return page.eval_on_selector_all(
        "[data-result]", "els => Object.fromEntries(els.map(e => [e.dataset.result, e.dataset.value ?? null]))")


def site_files(folder: Path) -> list[str]:
    """What the worker stores: every file but the marker, the worker and search-index.js (for file:// only)."""
    return sorted(p.relative_to(folder).as_posix() for p in folder.rglob("*")
                  if p.is_file() and p.name != MARKER and p.as_posix() != (folder / WORKER).as_posix()
                  and p.as_posix() != (folder / "search-index.js").as_posix())


def open_and_wait_for_worker(page, url: str) -> dict[str, list[str]]:
    """Open ``url``, wait until a service worker controls it (it activates only after precaching)."""
    page.goto(url)
    page.wait_for_function("() => navigator.serviceWorker.controller !== null", timeout=30_000)
    return page.evaluate(CACHES)


@pytest.fixture()
def context(browser):
    ctx = browser.new_context(service_workers="allow")
    errors: list[str] = []
    ctx.errors = errors
    ctx.on("page", lambda pg: (pg.on("pageerror", lambda e: errors.append(str(e))),
                               pg.on("console", lambda m: errors.append(m.text) if m.type == "error" else None)))
    yield ctx
    ctx.close()


def test_whole_site_precached_then_read_offline(context, served_site, built_site):
    page = context.new_page()
    caches = open_and_wait_for_worker(page, f"{served_site}/index.html")
    assert len(caches) == 1
    (name, urls), = caches.items()
    expected = {f"{served_site}/{p}" for p in site_files(built_site)}
    assert set(urls) == expected, f"missing {sorted(expected - set(urls))[:5]}, extra {sorted(set(urls) - expected)[:5]}"
    assert len(expected) > 100

    inputs = {"length": "35 m", "size": "2.5 mm2", "temperature": "90 °C", "current": "16 A"}
    permalink = (f"{served_site}/materials/copper-annealed/index.html?"
                 + "&".join(f"{k}={quote(v)}" for k, v in inputs.items()))
    page.goto(permalink)
    page.wait_for_selector("html.calc-ready")
    online_values = result_values(page)
    assert online_values.get("voltage_drop"), f"the permalink computed nothing online: {online_values}"

    context.set_offline(True)
    # three other pages, one as a directory address
    page.goto(f"{served_site}/references/index.html")
    assert page.locator("h1").first.text_content().strip() == "References"
    page.goto(f"{served_site}/materials/silver/")
    assert "Silver" in page.locator("h1").text_content()
    assert page.locator("table.card tbody tr").count() >= 3
    page.goto(f"{served_site}/materials/aluminium-1350/index.html#resistivity-temperature")
    assert page.locator("#resistivity-temperature table tbody tr").count() > 5
    assert page.evaluate("getComputedStyle(document.body).backgroundColor") != "rgba(0, 0, 0, 0)"  # CSS came

    # a calculator permalink: the page, its script and the core all come from the cache, and give
    # the numbers the same permalink gave online (that those equal the Python core is
    # test_calculator_page's job)
    page.goto(permalink)
    page.wait_for_selector("html.calc-ready")
    offline_values = result_values(page)
    assert offline_values == online_values

    # a CSV download, fetched from the page as a browser would
    csv = page.evaluate("fetch('resistivity-temperature.csv').then(r => r.ok ? r.text() : 'HTTP ' + r.status)")
    assert csv == (built_site / "materials/copper-annealed/resistivity-temperature.csv").read_text(encoding="utf-8")
    with page.expect_download() as info:
        page.click("a[href='resistivity-temperature.csv']")
    assert Path(info.value.path()).read_bytes() == \
        (built_site / "materials/copper-annealed/resistivity-temperature.csv").read_bytes()

    # an address that is not part of the site gets a plain sentence, not a browser error page
    page.goto(f"{served_site}/no-such-page.html")
    assert "not part of the saved site" in page.text_content("body")
    context.errors[:] = [e for e in context.errors if "503" not in e]  # the sentence above comes with a 503
    assert context.errors == []


@pytest.fixture()
def own_site(built_site, tmp_path):
    """A copy of the built site on its own server, so the test can publish a changed build into it."""
    folder = tmp_path / "site"
    shutil.copytree(built_site, folder)
    server = make_server(folder, port=0, quiet=True)
    thread = threading.Thread(target=server.serve_forever, daemon=True)
    thread.start()
    yield folder, f"http://127.0.0.1:{server.server_address[1]}"
    server.shutdown()
    server.server_close()


def test_rebuild_brings_a_new_cache_and_drops_the_old(context, own_site):
    folder, url = own_site
    page = context.new_page()
    before = open_and_wait_for_worker(page, f"{url}/index.html")
    (old_name,) = before

    # a rebuild that changes one page: rewrite that page, and sw.js exactly as the build makes it
    index = folder / "index.html"
    index.write_bytes(index.read_bytes().replace(b"</main>", b"<p id=rebuilt>New build.</p></main>"))
    files = {p: (folder / p).read_bytes() for p in site_files(folder) + ["search-index.js"]}
    (folder / WORKER).write_bytes(service_worker(files))

    page.evaluate("navigator.serviceWorker.getRegistration().then(r => r.update())")
    for _ in range(300):  # the new worker precaches, activates, then deletes the old cache
        after = page.evaluate(CACHES)
        if old_name not in after and len(after) == 1:
            break
        page.wait_for_timeout(100)
    (new_name,) = after
    assert new_name != old_name and new_name.rsplit(" ", 1)[0] == old_name.rsplit(" ", 1)[0]
    context.set_offline(True)
    page.goto(f"{url}/index.html")
    assert page.locator("#rebuilt").text_content() == "New build."
    assert context.errors == []


@pytest.mark.parametrize("size", ICON_SIZES)
def test_committed_png_icons_match_the_svg(browser, size):
    """Chromium decodes the committed PNG and a fresh rendering of the SVG; the pixels must agree."""
    from conductor_atlas.paths import STATIC_DIR
    import base64
    fresh = base64.b64encode(render(browser, size)).decode()
    committed = base64.b64encode((STATIC_DIR / f"icons/atlas-{size}.png").read_bytes()).decode()
    page = browser.new_page()
    try:
        worst = page.evaluate("""async ([a, b, size]) => {
          const pixels = async (data) => {
            const img = new Image(); img.src = 'data:image/png;base64,' + data; await img.decode();
            if (img.naturalWidth !== size || img.naturalHeight !== size) return null;
            const c = new OffscreenCanvas(size, size); const g = c.getContext('2d'); g.drawImage(img, 0, 0);
            return g.getImageData(0, 0, size, size).data;
          };
          const p = await pixels(a), q = await pixels(b);
          if (!p || !q) return -1;
          let worst = 0;
          for (let i = 0; i < p.length; i++) worst = Math.max(worst, Math.abs(p[i] - q[i]));
          return worst;
        }""", [fresh, committed, size])
    finally:
        page.close()
    assert worst != -1, f"atlas-{size}.png is not {size}x{size}"
    # anti-aliasing may differ by a step or two between Chromium builds; a changed drawing differs by ~100+
    assert worst <= 16, f"atlas-{size}.png no longer matches atlas.svg: run .venv/bin/python -m tests.support.icons"


def test_every_page_reads_from_file_urls(browser, built_site):
    """A folder copied to a laptop: every page opens from file:// without an error (a module script
    would be refused there, with a console error), tables are present, and each calculator starts
    (the build's classic bundle, bundle.py). Features that need the served copy say so."""
    context = browser.new_context()
    page = context.new_page()
    errors: list[str] = []
    page.on("pageerror", lambda e: errors.append(f"{page.url}: uncaught {e}"))
    page.on("console", lambda m: errors.append(f"{page.url}: {m.text}") if m.type == "error" else None)
    pages = sorted(p for p in built_site.rglob("*.html"))
    calculators = 0
    for path in pages:
        page.goto(path.as_uri(), wait_until="load")
        assert page.evaluate("document.documentElement.classList.contains('from-file')"), path
        assert page.locator(".from-file-note").is_visible(), f"{path}: no note about serving the site"
        assert page.locator("script[type=module]").count() == 0, f"{path}: a module script cannot run from file://"
        if page.locator("form[data-calculator]").count():
            start_calculator(page, timeout=10_000)
            assert not page.locator(".calculator .needs-server").first.is_visible()
            calculators += 1
    context.close()
    assert len(pages) > 3 and calculators > 0
    assert errors == [], "\n".join(errors[:20])
