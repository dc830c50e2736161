"""Markup in a material file renders as inert text; pages run only the site's own scripts.

An overlay material (built with --data into a temporary folder) carries raw HTML, <script> tags,
event-handler attributes, a javascript: link and "</script>" in its notes, name, aliases and
summary. Every HTML page of that build is parsed with html.parser: the only <script> elements
are module scripts with a same-site src and application/json data blocks; no element has an
on* attribute or a javascript: URL; the injected text comes back as text, character for
character; and each JSON block still parses and carries the name exactly.
"""

from __future__ import annotations

import json
import re
from html.parser import HTMLParser
from pathlib import Path
from urllib.parse import urlsplit

import pytest

from conductor_atlas.paths import STATIC_DIR

EVIL_NAME = 'Evil </script><script>alert("name")</script> <b onmouseover="alert(1)">bold</b> & co'
EVIL_ALIAS = '<img src=x onerror=alert("alias")>'
EVIL_SUMMARY = '"><script>alert("summary")</script><iframe src="https://example.invalid/"></iframe>'
EVIL_NOTES = """First paragraph with <script>alert("notes")</script> inside.

<div onclick="alert('div')">raw <em>HTML</em> block</div>

A [harmless-looking link](javascript:alert('link')) and ![picture](javascript:alert('img')).

<style>body { display: none }</style> and an &lt;already escaped&gt; entity and </script> alone.
"""

MATERIAL = f'''schema = 1
id = "evil-alloy"
name = {json.dumps(EVIL_NAME)}
class = "copper-alloy"
aliases = [{json.dumps(EVIL_ALIAS)}]
summary = {json.dumps(EVIL_SUMMARY)}
notes = {json.dumps(EVIL_NOTES)}

[properties.resistivity]
value = "2.1 uohm*cm"
temperature = "20 degC"
source = "iec60028"
locator = "invented for a test"

[properties.temperature_coefficient]
value = "0.0035 1/K"
temperature = "20 degC"
source = "iec60028"
locator = "invented for a test"
'''

CSP_NAME = "content-security-policy"


class Page(HTMLParser):
    """Collects scripts, CSP metas, every tag with its attributes, and the text (script bodies apart)."""

    def __init__(self) -> None:
        super().__init__(convert_charrefs=True)
        self.scripts: list[dict] = []
        self.csp: list[str] = []
        self.tags: list[tuple[str, dict]] = []
        self.text: list[str] = []
        self._script: dict | None = None

    def handle_starttag(self, tag, attrs):
        attributes = {k: (v or "") for k, v in attrs}
        self.tags.append((tag, attributes))
        if tag == "script":
            self._script = {"attrs": attributes, "body": ""}
        if tag == "meta" and attributes.get("http-equiv", "").lower() == CSP_NAME:
            self.csp.append(attributes.get("content", ""))

    def handle_startendtag(self, tag, attrs):
        self.handle_starttag(tag, attrs)
        if tag == "script":
            self.handle_endtag(tag)

    def handle_endtag(self, tag):
        if tag == "script" and self._script is not None:
            self.scripts.append(self._script)
            self._script = None

    def handle_data(self, data):
        if self._script is not None:
            self._script["body"] += data
        else:
            self.text.append(data)


def parse(path: Path) -> Page:
    page = Page()
    page.feed(path.read_text(encoding="utf-8"))
    page.close()
    return page


def same_site(url: str) -> bool:
    parts = urlsplit(url)
    return not parts.scheme and not parts.netloc and not url.startswith("//") and url.strip() != ""


def html_pages(site: Path) -> list[Path]:
    return sorted(site.rglob("*.html"))


def script_problems(site: Path) -> list[str]:
    """Every <script> of every page has a same-site src and no body, or is an application/json block."""
    problems = []
    for path in html_pages(site):
        rel = path.relative_to(site).as_posix()
        for script in parse(path).scripts:
            attrs, body = script["attrs"], script["body"]
            kind = attrs.get("type", "").strip().lower()
            if kind == "application/json":
                try:
                    json.loads(body)
                except ValueError as exc:
                    problems.append(f"{rel}: a JSON block does not parse ({exc}): {body[:80]!r}")
                continue
            if "src" not in attrs:
                problems.append(f"{rel}: inline script: {body[:80]!r}")
            elif not same_site(attrs["src"]):
                problems.append(f"{rel}: script from another origin: {attrs['src']}")
            elif body.strip():
                problems.append(f"{rel}: script with src also has a body")
            elif kind not in ("module", ""):
                problems.append(f"{rel}: script of unexpected type {kind!r}")
    return problems


@pytest.fixture(scope="module")
def evil_site(tmp_path_factory):
    from conductor_atlas.build import build
    base = tmp_path_factory.mktemp("injection")
    overlay = base / "shop"
    overlay.mkdir()
    (overlay / "evil-alloy.toml").write_text(MATERIAL, encoding="utf-8")
    out = base / "site"
    build(out, [overlay])
    return out


def test_material_page_shows_markup_as_text(evil_site):
    page_path = evil_site / "materials" / "evil-alloy" / "index.html"
    page = parse(page_path)
    text = "".join(page.text)
    for injected in (EVIL_NAME, EVIL_ALIAS, EVIL_SUMMARY):
        assert injected in text, f"not shown as text: {injected!r}"
    for fragment in ('<script>alert("notes")</script>', "<div onclick=\"alert('div')\">", "<style>body",
                     "</script> alone"):
        assert fragment in text, f"note fragment not shown as text: {fragment!r}"
    injected_tags = {"img", "iframe", "b", "style", "em"}
    found = sorted({tag for tag, _ in page.tags} & injected_tags)
    # the templates use none of these; any one here came from the material file
    assert found == [], f"markup from the material file became elements: {found}"


def test_no_event_handlers_or_javascript_urls(evil_site):
    problems = []
    for path in html_pages(evil_site):
        rel = path.relative_to(evil_site).as_posix()
        for tag, attrs in parse(path).tags:
            for name, value in attrs.items():
                if name.startswith("on"):
                    problems.append(f"{rel}: <{tag} {name}=...>")
                if name in ("href", "src", "action", "formaction", "xlink:href") and \
                        re.sub(r"[\s\x00-\x1f]", "", value).lower().startswith(("javascript:", "vbscript:", "data:text")):
                    problems.append(f"{rel}: <{tag} {name}={value!r}>")
    assert problems == []


def test_every_script_is_same_site_or_json(evil_site):
    assert script_problems(evil_site) == []


def test_json_block_survives_a_closing_script_tag_in_the_name(evil_site):
    page = parse(evil_site / "materials" / "evil-alloy" / "index.html")
    blocks = [json.loads(s["body"]) for s in page.scripts if s["attrs"].get("type") == "application/json"]
    assert blocks, "the calculator's material block is missing"
    raw = (evil_site / "materials" / "evil-alloy" / "index.html").read_text(encoding="utf-8")
    # the only "</script" in the page source close real script elements
    assert raw.lower().count("</script") == len(page.scripts)

    def names_in(value):
        if isinstance(value, dict):
            for k, v in value.items():
                if k == "name" and isinstance(v, str):
                    yield v
                yield from names_in(v)
        elif isinstance(value, list):
            for v in value:
                yield from names_in(v)

    assert any(EVIL_NAME in names for block in blocks for names in names_in(block)), blocks


def test_every_page_carries_a_self_only_script_policy(evil_site):
    problems = []
    for path in html_pages(evil_site):
        rel = path.relative_to(evil_site).as_posix()
        policies = parse(path).csp
        if len(policies) != 1:
            problems.append(f"{rel}: {len(policies)} Content-Security-Policy metas")
            continue
        directives = {}
        for part in policies[0].split(";"):
            words = part.split()
            if words:
                directives[words[0].lower()] = [w.lower() for w in words[1:]]
        scripts = directives.get("script-src", directives.get("default-src"))
        if scripts != ["'self'"]:
            problems.append(f"{rel}: script-src is {scripts}, expected only 'self'")
        if directives.get("default-src") != ["'self'"]:
            problems.append(f"{rel}: default-src is {directives.get('default-src')}")
        if directives.get("object-src") != ["'none'"]:
            problems.append(f"{rel}: object-src is {directives.get('object-src')}")
    assert problems == []


def test_shipped_site_scripts_are_same_site_or_json(built_site):
    assert html_pages(built_site)
    assert script_problems(built_site) == []


def test_static_scripts_never_insert_text_as_html():
    """The page glue (calculators, search) writes with textContent, never as markup."""
    sinks = re.compile(r"\.(innerHTML|outerHTML)\s*[+]?=|insertAdjacentHTML|document\.write|\beval\(|new Function\(")
    found = []
    for path in sorted(STATIC_DIR.rglob("*.js")):
        for number, line in enumerate(path.read_text(encoding="utf-8").splitlines(), 1):
            if sinks.search(line):
                found.append(f"{path.name}:{number}: {line.strip()}")
    assert found == []


@pytest.mark.parametrize("notes, shown", [
    ("Keep `R < 1 mΩ & dry` at the joint.", "R < 1 mΩ & dry"),
    ("Example:\n\n    if r < limit && ok:\n        pass\n", "if r < limit && ok:\n    pass\n"),
    ("``<b>not bold</b> &amp;``", "<b>not bold</b> &amp;"),
])
def test_code_in_notes_is_escaped_once(notes, shown):
    """`<` and `&` inside Markdown code spans and blocks were shown as "&lt;" and "&amp;" (the
    source was escaped before Markdown, which escapes code again); a reader sees them as typed."""
    from conductor_atlas.markdown_notes import markdown_safe

    class Code(HTMLParser):
        def __init__(self):
            super().__init__(convert_charrefs=True)
            self.inside, self.text, self.tags = 0, [], []

        def handle_starttag(self, tag, attrs):
            self.tags.append(tag)
            self.inside += tag == "code"

        def handle_endtag(self, tag):
            self.inside -= tag == "code"

        def handle_data(self, data):
            if self.inside:
                self.text.append(data)

    code = Code()
    code.feed(markdown_safe(notes))
    assert "".join(code.text) == shown
    assert "b" not in code.tags


def test_raw_html_and_entities_in_notes_stay_text():
    from conductor_atlas.markdown_notes import markdown_safe
    html = markdown_safe('<div onclick="x()">raw <em>HTML</em></div> and <!-- a comment --> & more')
    assert "<div" not in html and "<em>" not in html and "<!--" not in html
    assert "&lt;div onclick=" in html and "&amp; more" in html
