"""Generated material files through `check` and the build; random request lines through `serve`.

hypothesis writes valid TOML material files with random fields, units and magnitudes (most values
plausible, some wild), and each goes through `conductor-atlas check --data` in process. Either
check refuses it, exit 1, with every problem line naming the file (no line twice), or it passes,
and then the build's derivation and rendering of that material (its page and downloads, and the
site-wide listings and search index over it and one shipped material) must succeed and every file
must pass cheap page checks: UTF-8, HTML that parses, no NaN / Infinity / undefined shown, JSON
with finite numbers only, CSV with no non-finite number. Never a traceback.

`serve` gets random request lines over loopback: an HTTP status line back for any non-blank line,
never a 500 and never an error inside the server.

Examples: FUZZ_DATA_EXAMPLES (default 200) and FUZZ_SERVE_EXAMPLES (default 300), e.g.
    FUZZ_DATA_EXAMPLES=5000 FUZZ_SERVE_EXAMPLES=5000 .venv/bin/python -m pytest -q tests/test_fuzz_data.py
"""

from __future__ import annotations

import contextlib
import csv
import io
import json
import math
import os
import re
import socket
import tempfile
import threading
import traceback
from html.parser import HTMLParser
from pathlib import Path

import pytest
from hypothesis import HealthCheck, event, given, settings
from hypothesis import strategies as st

from conductor_atlas import __version__
from conductor_atlas.cli import main
from conductor_atlas.derive import derive_material
from conductor_atlas.load import load_dataset
from conductor_atlas.model import DataSet
from conductor_atlas.paths import DATA_DIR, TEMPLATES_DIR
from conductor_atlas.render import Renderer
from conductor_atlas.schema import CLASSES, PROPERTIES
from conductor_atlas.search_index_file import search_index_files

DATA_EXAMPLES = int(os.environ.get("FUZZ_DATA_EXAMPLES", "200"))
SERVE_EXAMPLES = int(os.environ.get("FUZZ_SERVE_EXAMPLES", "300"))
FUZZ_SETTINGS = dict(deadline=None, derandomize=True, database=None,
                     suppress_health_check=[HealthCheck.too_slow, HealthCheck.data_too_large])

# ---------------------------------------------------------------- generated material files

# unit texts a person might type, for any property: right, wrong dimension, offset, odd
UNITS = ["ohm*m", "uohm*cm", "nohm*m", "ohm*mm**2/m", "percent", "%", "1/K", "ppm/K", "kg/m**3", "g/cm**3",
         "kg/mol", "g/mol", "", "K", "degC", "degF", "mK", "W/(m*K)", "m", "nm", "angstrom", "ohm*m**2",
         "Pa", "MPa", "1/K**2", "1/K**4", "kg", "furlong", "parsec", "1/m**3", "1/cm**3", "meter / second"]
TEMPERATURES = ["20 degC", "0 degC", "293.15 K", "77 K", "4.2 K", "300 K", "-40 degC", "1000 degC", "68 degF",
                "-273.15 degC", "0 K", "1e308 K", "1e-300 K", "abc", "20"]
KEYS = ["iec60028"]  # a source key the shipped bibliography has
TEXT = st.text(max_size=40)
PRINTABLE = st.text(st.characters(blacklist_categories=("Cc", "Cf", "Cn", "Co", "Cs", "Zl", "Zp")), max_size=40)


def si_value(name: str) -> st.SearchStrategy[str]:
    """A value of property ``name`` in its own SI unit, inside its schema range (log-uniform)."""
    spec = PROPERTIES[name]
    if spec.low > 0:
        exponent = st.floats(math.log10(spec.low), math.log10(spec.high))
        number = exponent.map(lambda e: 10.0 ** e)
    else:
        number = st.floats(spec.low, spec.high)
    return number.map(lambda x: f"{x:.6g} {spec.unit.replace(' ', '')}")


WILD_NUMBER = st.one_of(st.floats(allow_nan=False, allow_infinity=False), st.integers(-10**30, 10**30),
                        st.sampled_from([0, -0.0, 1e308, -1e308, 5e-324, 1e-300]))
WILD_VALUE = st.one_of(st.builds(lambda x, u: f"{x} {u}".strip(), WILD_NUMBER, st.sampled_from(UNITS)),
                       TEXT, st.integers(), st.booleans(), st.floats())


def value_text(name: str) -> st.SearchStrategy:
    return mostly(si_value(name), WILD_VALUE, 6)


def mostly(good: st.SearchStrategy, bad: st.SearchStrategy, one_in: int = 12) -> st.SearchStrategy:
    """``good``, and ``bad`` about once in ``one_in`` draws: each file has few mistakes, so many build."""
    # hypothesis favours the ends of a range, so "bad" is a value from its middle
    return st.integers(0, 2 * one_in).flatmap(lambda i: bad if i == one_in else good)


GOOD_TEMPERATURES = st.sampled_from(TEMPERATURES[:6])
SPAN = st.sampled_from([("-50 degC", "150 degC"), ("0 degC", "100 degC"), ("200 K", "400 K"), ("20 degC", "1000 degC")])


@st.composite
def record(draw, name: str) -> dict:
    out = {"value": draw(value_text(name)),
           "source": draw(mostly(st.just(KEYS[0]), st.sampled_from(["no-such-source", "", "Bad Key"]))),
           "locator": draw(mostly(st.just("invented for a test"), st.one_of(TEXT, st.integers())))}
    if PROPERTIES[name].needs_temperature or draw(st.booleans()):
        temperature = draw(mostly(GOOD_TEMPERATURES, st.sampled_from(TEMPERATURES + [None])))
        if temperature is not None:
            out["temperature"] = temperature
    if draw(st.integers(0, 5)) == 0:
        out[draw(st.sampled_from(["min", "max"]))] = draw(value_text(name))
    if draw(st.integers(0, 3)) == 0:
        out["valid_from"], out["valid_to"] = draw(mostly(SPAN, st.tuples(*[st.sampled_from(TEMPERATURES)] * 2)))
    if draw(st.integers(0, 5)) == 0:
        out["note"] = draw(mostly(st.one_of(PRINTABLE, st.just("from memory")), st.integers()))
    return out


@st.composite
def resistivity_table(draw) -> dict:
    size = draw(mostly(st.integers(2, 12), st.integers(0, 1)))
    start = draw(st.floats(2.0, 400.0))
    steps = draw(st.lists(st.floats(0.5, 300.0), min_size=size, max_size=size))
    rho0 = draw(st.floats(0.01, 100.0))
    temps, t = [], start
    for step in steps:
        temps.append(round(t, 3))
        t += step
    rhos = sorted(round(rho0 * (1 + 0.004 * (x - start)), 6) for x in temps)
    points = [[a, b] for a, b in zip(temps, rhos)]
    if draw(st.integers(0, 5)) == 0:   # wild points: any numbers, any order
        points = draw(st.lists(st.lists(WILD_NUMBER, min_size=2, max_size=2), max_size=8))
    return {"temperature_unit": draw(mostly(st.just("K"), st.sampled_from(["degC", "degF", "m"]))),
            "resistivity_unit": draw(mostly(st.sampled_from(["uohm*cm", "nohm*m"]), st.sampled_from(["ohm*m", "kg"]))),
            "source": KEYS[0], "locator": "invented for a test", "points": points}


@st.composite
def material(draw) -> dict:
    names = draw(st.lists(st.sampled_from(sorted(PROPERTIES)), max_size=6, unique=True))
    base = draw(st.sampled_from(["resistivity", "conductivity_iacs"]))
    if base not in names and draw(mostly(st.just(True), st.just(False))):
        names.append(base)
    if draw(st.integers(0, 19)) == 0:
        names.append(draw(TEXT))           # an unknown property
    doc = {"schema": draw(mostly(st.just(1), st.one_of(st.integers(), TEXT), 30)),
           "id": draw(mostly(st.from_regex(r"fuzz-[a-z0-9]{1,8}", fullmatch=True), TEXT, 20)),
           "name": draw(mostly(PRINTABLE.map(lambda t: "Fuzz alloy " + t), TEXT, 20)),
           "class": draw(mostly(st.sampled_from(sorted(CLASSES)), TEXT, 30)),
           "summary": "Invented for a test; " + draw(mostly(PRINTABLE, TEXT, 20))}
    if draw(st.booleans()):
        doc["aliases"] = draw(st.lists(st.from_regex(r"FZ-[A-Z0-9]{1,6}", fullmatch=True), max_size=3, unique=True))
    if draw(st.booleans()):
        doc["notes"] = draw(st.text(alphabet=st.sampled_from(list("ab <>&`*_[]()#\n-:\\|!\"'=;/")), max_size=80))
    doc["properties"] = {name: draw(record(name)) if name in PROPERTIES else {"value": "1"} for name in names}
    if draw(st.integers(0, 3)) == 0:
        doc["resistivity_table"] = draw(resistivity_table())
    return doc


def toml_string(text: str) -> str:
    """A TOML basic string: quote, backslash and control characters escaped (TOML 1.0, "String")."""
    out = []
    for ch in text:
        if ch in '"\\':
            out.append("\\" + ch)
        elif ord(ch) < 0x20 or ch == "\x7f":
            out.append(f"\\u{ord(ch):04X}")
        else:
            out.append(ch)
    return '"' + "".join(out) + '"'


def toml_value(v) -> str:
    """A TOML literal: numbers, strings, inline tables and arrays."""
    if isinstance(v, bool):
        return "true" if v else "false"
    if isinstance(v, int):
        return str(v)
    if isinstance(v, float):
        if math.isnan(v):
            return "nan"
        if math.isinf(v):
            return "inf" if v > 0 else "-inf"
        return repr(v)
    if isinstance(v, str):
        return toml_string(v)
    if isinstance(v, list):
        return "[" + ", ".join(toml_value(x) for x in v) + "]"
    return "{" + ", ".join(f"{toml_string(k)} = {toml_value(x)}" for k, x in v.items()) + "}"


def toml_text(doc: dict) -> str:
    return "".join(f"{toml_string(k)} = {toml_value(v)}\n" for k, v in doc.items())


# ---------------------------------------------------------------- cheap page checks

SHOWN_NON_FINITE = re.compile(r"\b(?:NaN|Infinity|undefined|nan|inf)\b")


class PageText(HTMLParser):
    """The text a reader sees (script and style bodies apart)."""

    def __init__(self):
        super().__init__(convert_charrefs=True)
        self.skip, self.text = 0, []

    def handle_starttag(self, tag, attrs):
        self.skip += tag in ("script", "style")

    def handle_endtag(self, tag):
        self.skip -= tag in ("script", "style")

    def handle_data(self, data):
        if not self.skip:
            self.text.append(data)


def refuse_constant(name):
    raise ValueError(f"non-finite number {name} in JSON")


def page_problems(files: dict[str, bytes], own_texts: list[str]) -> list[str]:
    """Every file's problems; ``own_texts`` (the material's own name, notes ...) may say anything."""
    problems = []
    for path, data in sorted(files.items()):
        try:
            text = data.decode("utf-8")
        except UnicodeDecodeError:
            if path.endswith((".html", ".json", ".csv", ".js")):
                problems.append(f"{path}: not UTF-8")
            continue
        if path.endswith(".html"):
            parser = PageText()
            parser.feed(text)
            shown = "".join(parser.text)
            for own in own_texts:
                shown = shown.replace(own, "")
            for match in SHOWN_NON_FINITE.finditer(shown):
                problems.append(f"{path}: shows {match.group(0)!r} near {shown[max(0, match.start() - 60):match.end() + 20]!r}")
        elif path.endswith(".json"):
            try:
                json.loads(text, parse_constant=refuse_constant)
            except ValueError as exc:
                problems.append(f"{path}: {exc}")
        elif path.endswith(".csv"):
            for row in csv.reader(io.StringIO(text)):
                for cell in row:
                    try:
                        number = float(cell)
                    except ValueError:
                        continue
                    if not math.isfinite(number) and cell not in own_texts:
                        problems.append(f"{path}: non-finite cell {cell!r}")
    return problems


# ---------------------------------------------------------------- the property

@pytest.fixture(scope="module")
def shipped():
    dataset = load_dataset([DATA_DIR])
    reference = dataset.by_id("copper-annealed")
    return dataset, derive_material(reference), Renderer(TEMPLATES_DIR, __version__)


def run_check(folder: Path) -> tuple[int, list[str]]:
    out, err = io.StringIO(), io.StringIO()
    with contextlib.redirect_stdout(out), contextlib.redirect_stderr(err):
        code = main(["check", "--data", str(folder)])
    return code, err.getvalue().splitlines()


def own_texts(doc: dict) -> list[str]:
    """The texts of the material itself, which its pages show as they are."""
    texts = [doc.get(k) for k in ("name", "summary", "notes", "id")] + list(doc.get("aliases", []))
    for rec in doc.get("properties", {}).values():
        texts += [rec.get(k) for k in ("locator", "note", "value", "min", "max")]
    return sorted({t.strip() for t in texts if isinstance(t, str) and t.strip()}, key=len, reverse=True)


@settings(max_examples=DATA_EXAMPLES, **FUZZ_SETTINGS)
@given(doc=material())
def test_generated_material_is_refused_with_messages_or_builds(shipped, doc):
    dataset, reference_view, renderer = shipped
    with tempfile.TemporaryDirectory() as tmp:
        path = Path(tmp) / "fuzz.toml"
        path.write_text(toml_text(doc), encoding="utf-8")
        code, lines = run_check(Path(tmp))
        if code != 0:
            assert code == 1
            assert lines[-1].endswith("problem(s) found; nothing was built"), lines
            problems = lines[:-1]
            assert problems, lines
            assert len(problems) == len(set(problems)), f"a problem reported twice: {problems}"
            for line in problems:
                assert line.startswith(f"conductor-atlas: {path}: "), line
                assert len(line) > len(f"conductor-atlas: {path}: ") + 5, line
            event("refused by check")
            return
        loaded = load_dataset([DATA_DIR, Path(tmp)])
    new = next(m for m in loaded.materials if m.path.name == "fuzz.toml")
    view = derive_material(new)
    small = DataSet(materials=tuple(sorted([new, reference_view.material], key=lambda m: m.id)),
                    sources=dataset.sources)
    views = sorted([view, reference_view], key=lambda v: v.material.id)
    pages = renderer.render_material(small, view)
    pages.update(renderer.render_listings(small, views))
    files = {**pages.files, **search_index_files(small, views, pages.titles)}
    assert page_problems(files, own_texts(doc)) == []
    event("built")


def test_page_checks_catch_what_they_look_for():
    """The checks above can fail: a page showing NaN, JSON with Infinity, CSV with inf."""
    found = page_problems({"a.html": b"<p>R = NaN \xce\xa9</p>", "b.json": b'{"x": Infinity}',
                           "c.csv": b"t,rho\n20,inf\n", "d.html": b"<p>Name nan</p>"}, ["Name nan"])
    assert [p.split(":")[0] for p in found] == ["a.html", "b.json", "c.csv"]


# ---------------------------------------------------------------- serve: random request lines

@pytest.fixture(scope="module")
def tiny_site_server(tmp_path_factory):
    from conductor_atlas.serve import make_server
    folder = tmp_path_factory.mktemp("tiny-site")
    (folder / "index.html").write_text("<!doctype html><title>home</title>\n")
    (folder / "materials" / "x").mkdir(parents=True)
    (folder / "materials" / "x" / "index.html").write_text("<!doctype html><title>x</title>\n")
    (folder / "static").mkdir()
    (folder / "static" / "a.js").write_text("var a = 1;\n")
    server = make_server(folder, port=0, quiet=True)
    errors: list[str] = []
    server.handle_error = lambda request, address: errors.append(traceback.format_exc())
    thread = threading.Thread(target=server.serve_forever, daemon=True)
    thread.start()
    yield server.server_address[1], errors
    server.shutdown()
    server.server_close()


PATH_PIECES = st.sampled_from(["/", "/index.html", "/materials/x/", "/static/a.js", "%00", "%2e%2e/", "../", "%",
                               "%zz", "?q=1", "#f", "//", "\\", "%c0%af", "%ff", "~", "materials", "%2F", ";", " "])
REQUEST_LINE = st.one_of(
    st.builds(lambda method, pieces, version: (method + " /" + "".join(pieces) + version).encode("utf-8",
                                                                                               "surrogatepass"),
              mostly(st.sampled_from(["GET", "HEAD"]), st.sampled_from(["POST", "PUT", "OPTIONS", "get", "BREW", ""]), 4),
              st.lists(mostly(PATH_PIECES, st.text(max_size=5), 4), max_size=8),
              mostly(st.sampled_from([" HTTP/1.1", " HTTP/1.0"]),
                     st.sampled_from([" HTTP/0.9", " HTTP/2.0", " HTTP/1.1 extra", "", " FOO/1.0"]), 4)),
    st.binary(max_size=300).filter(lambda b: b"\n" not in b and b"\r" not in b),
)


@settings(max_examples=SERVE_EXAMPLES, **FUZZ_SETTINGS)
@given(line=REQUEST_LINE)
def test_serve_answers_any_request_line(tiny_site_server, line):
    port, errors = tiny_site_server
    errors.clear()
    line = line.replace(b"\r", b"").replace(b"\n", b"")[:2000]  # one line: the server reads up to a line break
    with socket.create_connection(("127.0.0.1", port), timeout=10) as conn:
        conn.sendall(line + b"\r\nHost: 127.0.0.1\r\nConnection: close\r\n\r\n")
        chunks = []
        try:
            while chunk := conn.recv(65536):
                chunks.append(chunk)
        except ConnectionResetError:
            pass
    answer = b"".join(chunks)
    assert errors == [], errors[-1]
    words = line.decode("iso-8859-1").split()  # the server's own reading (str.split: \x1c-\x1f are blanks too)
    if len(words) >= 3 and words[2] != "HTTP/0.9":
        # an HTTP/1.x answer; an HTTP/0.9 request ("GET /path", no version) gets a body only (RFC 1945 §4.1)
        status = re.match(rb"HTTP/1\.[01] (\d{3}) ", answer) or re.search(rb"<p>Error code: (\d{3})</p>", answer)
        assert status, (line, answer[:200])
        assert status.group(1) in {b"200", b"301", b"400", b"404", b"405", b"414", b"501", b"505"}, (line, answer[:200])
