"""search-index.json: one entry per material, table and page; every link resolves in the built site.

The file holds the index already prepared for search (core.search_prepare.prepare_index), read back here
with ``shipped_entries``; searching the parsed file must give what searching the entries gives.
"""

from __future__ import annotations

import html
import json
import re
import tomllib

import pint
import pytest

from conductor_atlas import __version__
from conductor_atlas.build import data_folders
from conductor_atlas.derive import derive
from conductor_atlas.load import load_dataset
from conductor_atlas.paths import DATA_DIR, TEMPLATES_DIR
from conductor_atlas.render import Renderer
from conductor_atlas.core.search import search, search_entries
from conductor_atlas.core.search_format import INDEX_FORMAT
from conductor_atlas.search_index_file import build_index, index_json, shipped_entries, shipped_index

UREG = pint.UnitRegistry()


@pytest.fixture(scope="module")
def shipped(built_site):
    return json.loads((built_site / "search-index.json").read_text(encoding="utf-8"))


@pytest.fixture(scope="module")
def built_entries(built_site):
    """The index entries of the built site, made again in memory from the data and its rendered pages."""
    return build_index(*rendered_titles())["entries"]


def rendered_titles():
    """(data set, views, titles by path) as the build renders them."""
    dataset = load_dataset(data_folders())
    views = derive(dataset)
    return dataset, views, Renderer(TEMPLATES_DIR, __version__).render_site(dataset, views).titles


@pytest.fixture(scope="module")
def site_index(shipped):
    return {"entries": shipped_entries(shipped)}


def target_exists(built_site, url):
    path, _, anchor = url.partition("#")
    page = built_site / path
    if not page.is_file():
        return False
    return not anchor or re.search(rf'\bid="{re.escape(anchor)}"', page.read_text(encoding="utf-8")) is not None


def test_one_entry_per_material_with_its_names(site_index):
    dataset = load_dataset(data_folders())
    materials = {e["id"]: e for e in site_index["entries"] if e["kind"] == "material"}
    assert sorted(materials) == sorted(m.id for m in dataset.materials)
    for m in dataset.materials:
        entry = materials[m.id]
        assert entry["title"] == m.name and entry["aliases"] == list(m.aliases)
        assert entry["url"] == f"materials/{m.id}/index.html"


def test_every_link_resolves(site_index, built_site):
    broken = [e["url"] for e in site_index["entries"] if not target_exists(built_site, e["url"])]
    assert broken == []
    ids = [e["id"] for e in site_index["entries"]]
    assert len(ids) == len(set(ids)), "entry ids are unique"


def test_tables_and_calculators_are_entries(site_index, built_site):
    kinds = {e["kind"] for e in site_index["entries"]}
    assert {"material", "table", "calculator"} <= kinds
    tables = [e for e in site_index["entries"] if e["kind"] == "table"]
    # every table section on every material page has an entry (the pages are the reference)
    on_pages = set()
    for page in (built_site / "materials").glob("*/index.html"):
        html = page.read_text(encoding="utf-8")
        for table_id in re.findall(r'<section id="([^"]+)" class="derived"', html):
            on_pages.add(f"{page.parent.name}/{table_id}")
    assert on_pages and on_pages == {e["id"] for e in tables}
    references = [e for e in site_index["entries"] if e["id"] == "references"]
    assert references and references[0]["title"] == "References"


def test_numbers_are_si_and_match_the_data_files(site_index):
    # copper.toml gives density in g/cm^3 and resistivity in its own unit: pint converts them here
    raw = tomllib.loads((DATA_DIR / "materials" / "copper.toml").read_text(encoding="utf-8"))
    copper = next(e for e in site_index["entries"] if e["id"] == "copper")
    for name in ("density", "resistivity", "mean_free_path"):
        text = raw["properties"][name]["value"]
        expected = UREG.Quantity(text).to_base_units().magnitude
        assert copper["props"][name] == pytest.approx(expected, rel=1e-12), name
    # %IACS is carried as a fraction: 100 %IACS = 1/58 Ω·mm²/m (IEC 60028) -> iacs_20 * rho_20 = 1.7241e-8 Ω·m
    assert copper["props"]["iacs_20"] * copper["props"]["rho_20"] == pytest.approx(1 / 58 * 1e-6, rel=1e-9)


def test_the_script_for_file_pages_holds_the_same_index(built_site, shipped):
    text = (built_site / "search-index.js").read_text(encoding="utf-8")
    head = "self.conductorAtlasSearchIndex = "
    line = [row for row in text.split("\n") if row.startswith(head)]
    assert len(line) == 1 and line[0].endswith(";")
    assert json.loads(line[0][len(head):-1]) == shipped


def test_index_is_repeatable_and_compact():
    dataset = load_dataset(data_folders())
    views = derive(dataset)
    first = index_json(shipped_index(build_index(dataset, views, {})))
    second = index_json(shipped_index(build_index(dataset, derive(dataset), {})))
    assert first == second
    assert b"\n" not in first[:-1] and b": " not in first[:200]


def test_the_file_needs_no_preparation(shipped):
    # the browser turns only the top-level object into a dict: everything below must be lists and scalars
    assert shipped["format"] == INDEX_FORMAT
    assert shipped["materials"] == len(load_dataset(data_folders()).materials)

    def dicts_below(value, where):
        if isinstance(value, dict):
            return [where]
        if isinstance(value, list):
            return [found for i, item in enumerate(value) for found in dicts_below(item, f"{where}[{i}]")]
        return []
    nested = [found for key, value in shipped.items() for found in dicts_below(value, key)]
    assert nested[:5] == []


@pytest.mark.parametrize("query", ["copper", "cooper", "C17200", "nickl chrom", "skin depth copper", "iacs > 90",
                                   "resistivity < 3 uohm*cm", "copper alloy, iacs > 50", "references", "zzzz"])
def test_searching_the_parsed_file_equals_searching_the_entries(shipped, built_entries, query):
    # what the browser does (search on the parsed JSON) against preparing the build's entries in memory:
    # JSON must carry every float, None and flag of the prepared index unchanged
    assert search(shipped, query, 8) == search_entries(built_entries, query, 8)


def test_the_titles_the_index_reads_are_the_titles_the_pages_show(built_site):
    # the index takes titles from the renderer, not from the HTML: each must be the page's <title>
    # (without " · Conductor Atlas"), so a search hit names the page it opens
    titles = rendered_titles()[2]
    html_pages = {p.relative_to(built_site).as_posix() for p in built_site.rglob("*.html")}
    assert {"compare/index.html", "calculators/resistance/index.html", "references/index.html"} <= set(titles)
    for path, title in titles.items():
        assert path in html_pages, path
        shown = re.search(r"<title>(.*?)</title>", (built_site / path).read_text(encoding="utf-8"), re.S).group(1)
        shown = html.unescape(shown)
        assert shown in (title, f"{title} · Conductor Atlas"), (path, shown, title)


# Filters whose unit for a bare number differs from the card's display unit, and why.
FILTER_UNIT_EXCEPTIONS = {
    "melting_point": "people type melting points in °C (the card shows K, like the sources' tables)",
}


def test_search_filters_show_the_display_units_of_the_schema():
    # one home for display units: schema.PROPERTIES[...].shown; the core cannot import the schema,
    # so its filter vocabulary is checked against it here
    from conductor_atlas.core.search_filters import FILTERS
    from conductor_atlas.schema import PROPERTIES
    property_of = {"rho_20": "resistivity", "iacs_20": "conductivity_iacs"}
    for key, _label, _words, _kind, _typed, shown in FILTERS:
        name = property_of.get(key, key)
        if name in FILTER_UNIT_EXCEPTIONS:
            continue
        assert shown == PROPERTIES[name].shown_unit, (key, shown, PROPERTIES[name].shown_unit)


@pytest.mark.parametrize("query, title", [
    ("C11000", "Standard annealed copper"), ("ETP", "Standard annealed copper"), ("Cu-ETP", "Standard annealed copper"),
    ("CW004A", "Standard annealed copper"), ("OF", "Oxygen-free copper"), ("Cu-OF", "Oxygen-free copper"),
    ("C10100", "Oxygen-free copper"), ("C10200", "Oxygen-free copper"), ("A91350", "Conductor aluminium 1350"),
    ("EC", "Conductor aluminium 1350"), ("6101-T6", "Aluminium alloy 6101"),
])
def test_designations_find_their_material_first(shipped, query, title):
    # the designations of open standards that practitioners type (ASTM B224 / UNS, EN 13601, ANSI H35.1,
    # ASTM B317), recorded as aliases with their sources in the data files
    outcome = search(shipped, query, 5)
    assert outcome["errors"] == {} or not outcome["errors"]
    assert outcome["results"][0]["title"].startswith(title), [r["title"] for r in outcome["results"]]


@pytest.mark.parametrize("query, wanted", [
    # what a shop user types for a job (the data files' `uses`, common practice, no source): the grades
    # the trade uses for it are among the first results, not materials that merely share letters
    ("busbar", ["Standard annealed copper", "Aluminium alloy 6101", "Conductor aluminium 1350 (hard-drawn)"]),
    ("bus bar", ["Standard annealed copper", "Aluminium alloy 6101"]),
    ("magnet wire", ["Standard annealed copper", "Oxygen-free copper"]),
    ("heating element", ["Nickel-chromium 80/20", "Iron-chromium-aluminium"]),
    ("shunt", ["Copper-manganese-nickel", "Copper-nickel 55/45"]),
    ("Pt100", ["Platinum for industrial resistance thermometers"]),
])
def test_a_use_finds_the_grades_used_for_it(shipped, query, wanted):
    titles = [r["title"] for r in search(shipped, query, 6)["results"]]
    for title in wanted:
        assert any(t.startswith(title) for t in titles), (title, titles)


def test_a_size_query_answers_with_the_size_first(shipped):
    # ASTM B258: 4/0 AWG is 0.4600 in across, 107.2 mm²; before, "4/0" listed Copper-nickel 55/45 first
    first = search(shipped, "4/0", 8)["results"][0]
    assert first["kind"] == "size" and first["title"] == "4/0 AWG: 107.2 mm², ø 11.68 mm"
