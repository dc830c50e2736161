"""Stage 3: turn the data set and derived views into page bytes (HTML, CSV, JSON) with Jinja.

Returns a mapping "relative/path" -> bytes; writes nothing (the publish stage does).
Templates run under StrictUndefined with autoescaping. What a page shows is built by the page-model
modules before rendering: material_card (property card), calculator_forms (form specs),
markdown_notes (notes as safe HTML), material_charts (charts), compare_page (compare rows).
"""

from __future__ import annotations

import json
import re
from dataclasses import dataclass, field
from pathlib import Path

import jinja2
from markupsafe import Markup

from conductor_atlas.calculator_forms import calc_spec, material_choices, ordered_calculators
from conductor_atlas.compare_page import COLUMNS as COMPARE_COLUMNS, compare_rows, compare_table
from conductor_atlas.core.calculators import CALCULATORS
from conductor_atlas.core.numfmt import format_number
from conductor_atlas.derive import MaterialView, calc_catalogue
from conductor_atlas.edition import TOKEN as EDITION_TOKEN, changes as edition_changes, value_texts
from conductor_atlas.markdown_notes import markdown_safe
from conductor_atlas.material_calculators import fitting_calculators, link_key
from conductor_atlas.material_card import card_rows, source_with_locators
from conductor_atlas.material_charts import material_charts
from conductor_atlas.model import DataSet
from conductor_atlas.schema import CLASSES
from conductor_atlas.verification import EMPTY as EMPTY_RECORD, KIND_LABELS, KINDS as VERIFICATION_KINDS
from conductor_atlas.verification import statuses, summary as verification_summary

SITE_NAME = "Conductor Atlas"
# the calculator every material page carries, with the material filled in
MATERIAL_PAGE_CALCULATOR = "resistance"

# What a folder without pages of its own holds (folder_pages), by its top-level name
FOLDER_CONTENTS = {"static": "styles, scripts and icons", "js": "the calculators' scripts"}


def keep_units(text: str) -> str:
    """A no-break space after a digit ("1.5 mm²", "at 20 °C", "4/0 AWG"): a narrow or printed table
    never parts a number from its unit. For the pages only; CSV and JSON keep plain spaces."""
    return re.sub(r"(?<=\d) (?=\S)", "\u00a0", text)


# Elements whose text is shown (or run) as typed, so their lines keep their leading white space
AS_TYPED = re.compile(r"<(pre|textarea|script)\b.*?</\1>", re.S | re.I)
INDENT = re.compile(r"\n[ \t]+")


def drop_indentation(html: str) -> str:
    """The page without the templates' indentation: the spaces at the start of each line are
    white space a browser collapses and never shows (about 0.1 kB compressed on a material page),
    except inside <pre>, <textarea> and <script>, which are left as they are."""
    out, start = [], 0
    for kept in AS_TYPED.finditer(html):
        out.append(INDENT.sub("\n", html[start:kept.start()]))
        out.append(kept.group(0))
        start = kept.end()
    out.append(INDENT.sub("\n", html[start:]))
    return "".join(out)


@dataclass
class RenderedPages:
    """What a render call returns: every file's bytes by path, and each HTML page's title (as its
    <title> shows it, without the site name) by path, which the search index reads."""

    files: dict[str, bytes] = field(default_factory=dict)
    titles: dict[str, str] = field(default_factory=dict)

    def update(self, other: RenderedPages) -> None:
        self.files.update(other.files)
        self.titles.update(other.titles)


class Renderer:
    """Holds the Jinja environment; ``render_site`` produces every page."""

    def __init__(self, templates_dir: Path, version: str) -> None:
        self.env = jinja2.Environment(
            loader=jinja2.FileSystemLoader(str(templates_dir)),
            autoescape=jinja2.select_autoescape(["html"]),
            undefined=jinja2.StrictUndefined,
            trim_blocks=True,
            lstrip_blocks=True,
            keep_trailing_newline=True,
        )
        self.env.filters["keep_units"] = keep_units
        self.version = version

    def page(self, out: RenderedPages, template: str, path: str, title: str, **context) -> None:
        """Render ``template`` into ``out`` at ``path``, with its title beside the bytes."""
        depth = path.count("/")
        root = "../" * depth
        context.setdefault("fmt", format_number)
        html = self.env.get_template(template).render(root=root, site_name=SITE_NAME, page_path=path, title=title,
                                                      version=self.version, edition=EDITION_TOKEN, **context)
        out.files[path] = drop_indentation(html).encode("utf-8")
        out.titles[path] = title

    def render_site(self, dataset: DataSet, views: list[MaterialView]) -> RenderedPages:
        out = RenderedPages()
        for view in views:
            out.update(self.render_material(dataset, view))
        out.update(self.render_listings(dataset, views))
        return out

    def render_material(self, dataset: DataSet, view: MaterialView) -> RenderedPages:
        """The files of one material: its page and its tables as CSV and JSON (nothing else reads them)."""
        out = RenderedPages()
        m = view.material
        base = f"materials/{m.id}"
        value_statuses = statuses(dataset, m, dataset.verification or EMPTY_RECORD)
        cite_sources = {}
        for table in view.tables:
            for key in table.sources:
                if key not in cite_sources and key in dataset.sources:
                    cite_sources[key] = source_with_locators(dataset.sources[key], m)
        # the record's sources and those the derived tables cite (ASTM B258 for the AWG sizes, ...)
        used = [dataset.sources[k] for k in sorted(set(m.source_keys()) | set(cite_sources))]
        catalogue = calc_catalogue([view.calc], [m])
        charts = [{"id": c.id, "caption": c.caption, "svg": Markup(c.svg)} for c in material_charts(view)]
        self.page(
            out, "material.html", f"{base}/index.html", view=view, m=m, card=card_rows(view, value_statuses),
            table_status=value_statuses.get("resistivity_table"), cite_sources=cite_sources,
            notes_html=markdown_safe(m.notes), sources=used, title=m.name,
            calc_json=catalogue, charts=charts, more_calcs=fitting_calculators(m.id, catalogue),
            class_title=CLASSES[m.klass], calc=calc_spec(MATERIAL_PAGE_CALCULATOR, {"material": m.id}),
            material_key=link_key(m.id))
        for table in view.tables:
            out.files[f"{base}/{table.id}.csv"] = table.to_csv().encode("utf-8")
            out.files[f"{base}/{table.id}.json"] = table.to_json().encode("utf-8")
        return out

    def folder_pages(self, paths) -> dict[str, bytes]:
        """An index.html for every folder of the site that has none (static/, js/ ...): a URL trimmed
        to a folder shows a page that says what the folder holds, never a server's file listing."""
        folders = {path.rsplit("/", 1)[0] for path in paths if "/" in path}
        for folder in list(folders):
            while "/" in folder:
                folder = folder.rsplit("/", 1)[0]
                folders.add(folder)
        out = RenderedPages()
        for folder in sorted(folders):
            path = f"{folder}/index.html"
            if path not in paths:
                what = FOLDER_CONTENTS.get(folder.split("/", 1)[0], "files the pages load")
                self.page(out, "folder.html", path, title=f"Folder {folder}/", what=what)
        return out.files

    def render_listings(self, dataset: DataSet, views: list[MaterialView]) -> RenderedPages:
        """The pages that list or look up every material, and the pages with no material on them."""
        out = RenderedPages()
        groups = []
        for klass, title in CLASSES.items():
            members = [v for v in views if v.material.klass == klass]
            if members:
                groups.append({"id": klass, "title": title, "views": members})
        self.page(out, "index.html", "index.html", groups=groups, views=views,
                  calcs=[calc_spec(name) for name in ordered_calculators()], title=SITE_NAME)
        self.page(out, "materials.html", "materials/index.html", groups=groups, title="Materials")
        self.page(out, "search.html", "search/index.html", title="Search")
        full_catalogue = calc_catalogue([v.calc for v in views], [v.material for v in views], dataset.limits)
        choices = material_choices(views)
        calcs = [calc_spec(name, datalist="material-choices") for name in ordered_calculators()]
        self.page(out, "calculators.html", "calculators/index.html", calcs=calcs, title="Calculators")
        for spec in calcs:
            self.page(
                out, "calculator.html", f"calculators/{spec['name']}/index.html", calc=spec, calc_json=full_catalogue,
                choices=choices, title=spec["title"])
        rows = compare_rows(views)
        table = compare_table(rows)
        out.files["compare/all-materials.csv"] = table.to_csv().encode("utf-8")
        out.files["compare/all-materials.json"] = table.to_json().encode("utf-8")
        self.page(
            out, "compare.html", "compare/index.html", rows=rows, columns=COMPARE_COLUMNS,
            title="Compare materials",
            calc=calc_spec("compare", datalist="material-choices") if "compare" in CALCULATORS else None,
            calc_json=full_catalogue, choices=choices)
        self.page(out, "methods.html", "methods/index.html", title="Methods")
        record = dataset.verification or EMPTY_RECORD
        rows_by_material, totals = verification_summary(dataset, record)
        names = {m.id: m.name for m in dataset.materials}
        self.page(
            out, "verification.html", "verification/index.html", title="How far the values are proven",
            rows=[{"id": mid, "name": names[mid], "counts": counts, "total": sum(counts.values())}
                  for mid, counts in rows_by_material],
            totals=totals, total=sum(totals.values()), kinds=VERIFICATION_KINDS, kind_labels=KIND_LABELS,
            datasets=sorted(record.datasets.items()))
        previous = dataset.previous
        changed = edition_changes(previous, value_texts(dataset)) if previous is not None else None
        self.page(
            out, "changes.html", "changes/index.html", title="What changed in the data",
            previous_edition=previous.edition if previous is not None else "", changed=changed)
        self.page(out, "references.html", "references/index.html",
                  sources=list(dataset.sources.values()), title="References")
        out.files["materials.json"] = (json.dumps(
            {"data_edition": EDITION_TOKEN,
             "materials": [{"id": v.material.id, "name": v.material.name, "class": v.material.klass,
                            "aliases": list(v.material.aliases), "rho_20": v.rho_20, "iacs_20": v.iacs_20}
                           for v in views]}, ensure_ascii=False, indent=1) + "\n").encode("utf-8")
        return out
