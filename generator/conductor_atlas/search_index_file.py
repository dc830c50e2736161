"""Build step: the search index (search-index.json) the browser searches with core/search.py.

One entry per material (name, aliases, class, summary, numeric properties in SI and their text
as the property card shows it), one per derived table, and one per other page of the site
(calculators, compare, references ...), with the title the renderer returned beside its bytes. When the site has
no calculator pages, the calculator embedded in each material page gets an entry instead.

search-index.json holds these entries already prepared by ``core.search_prepare.prepare_index`` (lists of
words, postings and records, no per-entry objects), so the browser searches the parsed file as it is.
search-index.js is the same JSON as a classic script that hands it to the page
(``self.conductorAtlasSearchIndex = …``): a page opened from a file cannot fetch, but it can load a
script, so search works from a copied folder too. The service worker does not store it.

Pure: takes the data set, the derived views and the rendered pages' titles; returns bytes. Writes nothing.
"""

from __future__ import annotations

import json
from typing import Mapping, Sequence

from conductor_atlas.core.calculators import CALCULATORS
from conductor_atlas.core.numfmt import format_number
from conductor_atlas.core.search_format import E_ALIASES, E_ID, E_KIND, E_MATERIAL, E_TITLE, E_URL
from conductor_atlas.core.search_prepare import prepare_index
from conductor_atlas.derive import MaterialView
from conductor_atlas.model import DataSet
from conductor_atlas.render import MATERIAL_PAGE_CALCULATOR
from conductor_atlas.schema import CLASSES, PROPERTIES

INDEX_PATH = "search-index.json"
INDEX_SCRIPT_PATH = "search-index.js"     # the same index for pages opened from files
INDEX_SCRIPT_GLOBAL = "conductorAtlasSearchIndex"
# pages that are not entries of their own: the home page, the search page, material pages (from data)
SKIPPED_PAGES = ("index.html", "search/index.html")
# Properties kept out of "props": %IACS as stated is in percent (the index carries iacs_20 as a fraction).
NOT_PROPS = ("conductivity_iacs",)


def material_url(material_id: str) -> str:
    return f"materials/{material_id}/index.html"


def property_text(name: str, si: float) -> str:
    shown = PROPERTIES[name]
    text = format_number(si * shown.shown_scale, shown.digits)
    return f"{text} {shown.shown_unit}" if shown.shown_unit else text


def material_entry(view: MaterialView) -> dict:
    m = view.material
    props: dict[str, float] = {"rho_20": view.rho_20, "iacs_20": view.iacs_20 / 100.0}
    facts: dict[str, list[str]] = {
        "rho_20": ["resistivity at 20 °C", property_text("resistivity", view.rho_20)],
        "iacs_20": ["conductivity at 20 °C", f"{format_number(view.iacs_20, 4)} %IACS"],
    }
    keywords = ["resistivity", "conductivity", *m.uses]
    for name in PROPERTIES:
        value = m.get(name)
        if value is None:
            continue
        keywords.append(PROPERTIES[name].label)
        if name in NOT_PROPS:
            continue
        props[name] = value.si
        facts[name] = [PROPERTIES[name].label, property_text(name, value.si)]
    return {
        "id": m.id, "kind": "material", "title": m.name, "url": material_url(m.id),
        "aliases": list(m.aliases), "class_title": CLASSES.get(m.klass, m.klass), "summary": m.summary,
        "keywords": keywords, "props": props, "facts": facts,
    }


def table_entries(view: MaterialView) -> list[dict]:
    m = view.material
    out = []
    for table in view.tables:
        keywords = sorted({c.label for c in table.columns} | {c.unit for c in table.columns if c.unit})
        out.append({
            "id": f"{m.id}/{table.id}", "kind": "table", "title": f"{table.title} — {m.name}",
            "url": f"{material_url(m.id)}#{table.id}", "material": " ".join([m.name, *m.aliases]),
            "summary": table.validity, "keywords": ["table", *keywords],
        })
    return out


def page_entries(titles: Mapping[str, str]) -> list[dict]:
    """Calculator and other pages of the rendered site (everything but home, search and materials),
    each with the title the renderer gave it."""
    out = []
    for path in sorted(titles):
        if not path.endswith(".html") or path in SKIPPED_PAGES or path.startswith("materials/"):
            continue
        folder = path.split("/")[0]
        kind = "calculator" if folder == "calculators" else "page"
        entry_id = path[: -len("/index.html")] if path.endswith("/index.html") else path[: -len(".html")]
        out.append({"id": entry_id, "kind": kind, "title": titles[path] or path, "url": path,
                    "keywords": ["calculator"] if kind == "calculator" else []})
    return out


def embedded_calculator_entries(views: Sequence[MaterialView], titles: Mapping[str, str]) -> list[dict]:
    """The calculator section of each rendered material page, used while the site has no calculator pages."""
    out = []
    heading = CALCULATORS[MATERIAL_PAGE_CALCULATOR].TITLE
    for view in views:
        m = view.material
        if material_url(m.id) not in titles:
            continue
        out.append({
            "id": f"{m.id}/calculator", "kind": "calculator", "title": f"{heading} — {m.name}",
            "url": f"{material_url(m.id)}#calculator", "material": " ".join([m.name, *m.aliases]),
            "summary": f"Calculator on the {m.name} page, with the material preselected.",
            "keywords": ["calculator"],
        })
    return out


def build_index(dataset: DataSet, views: Sequence[MaterialView], titles: Mapping[str, str]) -> dict:
    """The whole index as plain data: {"materials": count, "entries": [entry dict]}. ``titles``: the
    rendered pages' titles by path (``render.RenderedPages.titles``)."""
    entries = [material_entry(v) for v in views]
    for view in views:
        entries.extend(table_entries(view))
    pages = page_entries(titles)
    entries.extend(pages)
    if not any(e["kind"] == "calculator" for e in pages):
        entries.extend(embedded_calculator_entries(views, titles))
    return {"materials": len(dataset.materials), "entries": entries}


def shipped_index(index: dict) -> dict:
    """What search-index.json holds: the entries prepared for search, and the number of materials."""
    return {**prepare_index(index["entries"]), "materials": index["materials"]}


def shipped_entries(shipped: dict) -> list[dict]:
    """The entries of a parsed search-index.json as dicts (id, kind, title, url, aliases, props): for checks."""
    out = []
    for record in shipped["entries"]:
        entry = {"id": record[E_ID], "kind": shipped["kinds"][record[E_KIND]], "title": record[E_TITLE],
                 "url": record[E_URL], "aliases": record[E_ALIASES], "props": {}}
        if record[E_MATERIAL] >= 0:
            for name, column in zip(shipped["properties"], shipped["values"]):
                if column[record[E_MATERIAL]] is not None:
                    entry["props"][name] = column[record[E_MATERIAL]]
        out.append(entry)
    return out


def index_json(index: dict) -> bytes:
    """Compact, repeatable JSON (sorted keys, no spaces), UTF-8."""
    return (json.dumps(index, ensure_ascii=False, sort_keys=True, separators=(",", ":")) + "\n").encode("utf-8")


def index_script(json_bytes: bytes) -> bytes:
    """search-index.js: a classic script that sets self.conductorAtlasSearchIndex to the index (JSON is
    a JS expression, U+2028/U+2029 included since ES2019)."""
    return (b"// Conductor Atlas search index, for pages opened from files (served pages fetch search-index.json).\n"
            b"self." + INDEX_SCRIPT_GLOBAL.encode("ascii") + b" = " + json_bytes.rstrip(b"\n") + b";\n")


def search_index_files(dataset: DataSet, views: Sequence[MaterialView], titles: Mapping[str, str]) -> dict[str, bytes]:
    """{"search-index.json": bytes, "search-index.js": bytes} for the publish stage."""
    data = index_json(shipped_index(build_index(dataset, views, titles)))
    return {INDEX_PATH: data, INDEX_SCRIPT_PATH: index_script(data)}
