"""Stage 3: turn the data set and derived views into page bytes (HTML, CSV, JSON).

Returns a mapping "relative/path" -> bytes; writes nothing (the publish stage does).
Templates run under StrictUndefined with autoescaping; Markdown notes have raw HTML escaped.
"""

from __future__ import annotations

import json
import re
from dataclasses import dataclass
from pathlib import Path

import jinja2
import markdown
import markdown.extensions
import markdown.treeprocessors

from markupsafe import Markup

from conductor_atlas.compare_page import COLUMNS as COMPARE_COLUMNS, compare_rows, compare_table
from conductor_atlas.core.calculators import CALCULATOR_MODULES, CALCULATORS
from conductor_atlas.material_calculators import fitting_calculators, link_key
from conductor_atlas.core.constants import ZERO_CELSIUS
from conductor_atlas.core.lookup import TRADE_WORDS
from conductor_atlas.core.text_match import name_key
from conductor_atlas.derive import MaterialView, calc_catalogue
from conductor_atlas.material_charts import material_charts
from conductor_atlas.core.numfmt import format_number, format_fixed
from conductor_atlas.verification import EMPTY as EMPTY_RECORD, KIND_LABELS, KINDS as VERIFICATION_KINDS
from conductor_atlas.verification import statuses, summary as verification_summary
from conductor_atlas.edition import TOKEN as EDITION_TOKEN, changes as edition_changes, value_texts
from conductor_atlas.model import DataSet, Value
from conductor_atlas.schema import CLASSES, PROPERTIES

SITE_NAME = "Conductor Atlas"

# How a property is shown on the card: (scale to the shown unit, shown unit, significant digits)
CARD_UNITS = {
    "resistivity": (1e8, "µΩ·cm", 5),
    "conductivity_iacs": (1.0, "%IACS", 4),
    "temperature_coefficient": (1.0, "1/K", 4),
    "density": (1e-3, "g/cm³", 4),
    "molar_mass": (1e3, "g/mol", 7),
    "valence": (1.0, "", 3),
    "electron_density": (1.0, "m⁻³", 3),
    "debye_temperature": (1.0, "K", 4),
    "melting_point": (1.0, "K", 6),
    "thermal_conductivity": (1.0, "W/(m·K)", 4),
    "specific_heat": (1.0, "J/(kg·K)", 4),
    "relative_permeability": (1.0, "", 4),
    "curie_temperature": (1.0, "K", 5),
    "mean_free_path": (1e9, "nm", 3),
    "rho_lambda": (1.0, "Ω·m²", 3),
    "residual_resistivity_ratio": (1.0, "", 4),
    "tensile_strength": (1e-6, "MPa", 4),
    "cvd_a": (1.0, "1/K", 5),
    "cvd_b": (1.0, "1/K²", 4),
    "cvd_c": (1.0, "1/K⁴", 4),
}


SAFE_URL_SCHEMES = ("http", "https", "mailto")


# What a folder without pages of its own holds (folder_pages), by its top-level name
FOLDER_CONTENTS = {"static": "styles, scripts and icons", "js": "the calculators' scripts"}


def keep_units(text: str) -> str:
    """A no-break space after a digit ("1.5 mm²", "at 20 °C", "4/0 AWG"): a narrow or printed table
    never parts a number from its unit. For the pages only; CSV and JSON keep plain spaces."""
    return re.sub(r"(?<=\d) (?=\S)", "\u00a0", text)


def url_is_safe(url: str) -> bool:
    """True for a relative URL or an http(s)/mailto one; javascript:, data: and the like are not."""
    compact = "".join(ch for ch in url if ch > " ").lower()
    head = compact.split("/", 1)[0].split("?", 1)[0].split("#", 1)[0]
    if ":" not in head:
        return True
    return head.split(":", 1)[0] in SAFE_URL_SCHEMES


class InertLinks(markdown.treeprocessors.Treeprocessor):
    """After Markdown's own inline pass: a link to an unsafe URL becomes its text, an image its alt text
    (notes load nothing, and nothing from another origin)."""

    def run(self, root):
        for element in root.iter():
            if element.tag == "img":
                alt = element.get("alt", "")
                element.attrib.clear()
                element.tag = "span"
                element.text = alt
            elif element.tag == "a" and not url_is_safe(element.get("href", "")):
                element.attrib.clear()
                element.tag = "span"


class InertLinksExtension(markdown.extensions.Extension):
    """Raw HTML and entities stay text: Markdown's passes that keep them as markup are removed, so
    the serializer escapes ``<`` and ``&`` once, in text and code alike (escaping the source first
    escaped them twice inside code spans and blocks); unsafe links and images become text."""

    def extendMarkdown(self, md):  # noqa: N802 - the Markdown API's name
        md.preprocessors.deregister("html_block")
        md.inlinePatterns.deregister("html")
        md.inlinePatterns.deregister("entity")
        md.treeprocessors.register(InertLinks(md), "inert_links", 0)


def markdown_safe(text: str) -> str:
    """Markdown to HTML with any raw HTML or entity in the source shown as text, never as markup;
    links to javascript: (or any scheme but http, https, mailto) and images are shown as their text."""
    return markdown.markdown(text, output_format="html", extensions=[InertLinksExtension()])


def condition_text(t: float | None) -> str:
    if t is None:
        return ""
    return f"at {format_fixed(t - ZERO_CELSIUS, 0)} °C" if abs((t - ZERO_CELSIUS) - round(t - ZERO_CELSIUS)) < 1e-9 \
        else f"at {format_fixed(t, 2)} K"


@dataclass(frozen=True)
class CardRow:
    id: str
    label: str
    value: str
    unit: str
    condition: str
    source: str
    locator: str
    note: str
    status: str = ""        # how far the value is proven (conductor_atlas.verification)
    status_kind: str = ""


MEMORY_PHRASE = "from memory of the cited table"


def note_beside(status_kind: str, note: str) -> str:
    """A verified value's note without "from memory of the cited table" (the status says more)."""
    if status_kind != "verified" or MEMORY_PHRASE not in note:
        return note
    rest = note.replace(MEMORY_PHRASE, "").strip(" ;,")
    return rest[:1].upper() + rest[1:] if rest else ""


def card_rows(view: MaterialView, statuses: dict | None = None) -> list[CardRow]:
    statuses = statuses or {}
    rows = []
    for name in PROPERTIES:
        value: Value | None = view.material.get(name)
        if value is None:
            continue
        scale, unit, sig = CARD_UNITS[name]
        text = format_number(value.si * scale, sig)
        if value.low is not None and value.high is not None:
            text = f"{text} ({format_number(value.low * scale, sig)} – {format_number(value.high * scale, sig)})"
        status = statuses.get(name)
        kind = status.kind if status else ""
        rows.append(CardRow(id=f"prop-{name.replace('_', '-')}", label=PROPERTIES[name].label[:1].upper() + PROPERTIES[name].label[1:], value=text,
                            unit=unit, condition=condition_text(value.temperature), source=value.source,
                            locator=value.locator, note=note_beside(kind, value.note),
                            status=status.text if status else "", status_kind=kind))
    return rows


def source_with_locators(source, m) -> str:
    """"[key] citation; locator(s) used for this material" for a table's citation text."""
    locators = sorted({v.locator for v in m.properties.values() if v.source == source.key and v.locator})
    if m.table is not None and m.table.source == source.key and m.table.locator:
        locators = sorted(set(locators) | {m.table.locator})
    text = f"[{source.key}] {source.citation()}"
    return text + (" (" + "; ".join(locators) + ")" if locators else "")


def calc_spec(name: str, fixed: dict | None = None, datalist: str = "") -> dict:
    """What the calculator form macro needs: fields with label/hint/default, results, caution.

    ``fixed`` maps fields to values that become hidden inputs (the material on its own page).
    """
    module = CALCULATORS[name]
    fixed = fixed or {}
    fields = []
    for field in module.FIELDS:
        label, hint = module.FIELD_INFO[field]
        fields.append({"name": field, "label": label, "hint": hint,
                       "value": fixed.get(field, module.DEFAULTS.get(field, "")),
                       "hidden": field in fixed,
                       "list": datalist if field in ("material", "other") and datalist else ""})
    return {"name": name, "title": module.TITLE, "summary": module.SUMMARY, "fields": fields,
            "results": [list(r) for r in module.RESULT_LABELS], "caution": module.CAUTION}


def ordered_calculators() -> list[str]:
    """The calculators' names in the registry's order (everyday jobs first)."""
    return [module.NAME for module in CALCULATOR_MODULES]


def material_choices(views: list[MaterialView]) -> list[tuple[str, str]]:
    """(value, label) for the material datalist: every id, then every alias, each with the name of the
    material it gives; a trade word ("copper") with the grade it gives (lookup.TRADE_WORDS)."""
    names = {v.material.id: v.material.name for v in views}
    out = []
    for v in views:
        out.extend((label, names[v.material.id]) for label in [v.material.id, *v.material.aliases]
                   if name_key(label) not in TRADE_WORDS)
    out.extend((word, names[TRADE_WORDS[word][0]]) for word in TRADE_WORDS if TRADE_WORDS[word][0] in names)
    return out


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

    def page(self, template: str, path: str, **context) -> bytes:
        depth = path.count("/")
        root = "../" * depth
        context.setdefault("fmt", format_number)
        html = self.env.get_template(template).render(root=root, site_name=SITE_NAME, page_path=path,
                                                      version=self.version, edition=EDITION_TOKEN, **context)
        return html.encode("utf-8")

    def render_site(self, dataset: DataSet, views: list[MaterialView]) -> dict[str, bytes]:
        out: dict[str, bytes] = {}
        for view in views:
            out.update(self.render_material(dataset, view))
        out.update(self.render_listings(dataset, views))
        return out

    def render_material(self, dataset: DataSet, view: MaterialView) -> dict[str, bytes]:
        """The files of one material: its page and its tables as CSV and JSON (nothing else reads them)."""
        out: dict[str, bytes] = {}
        m = view.material
        base = f"materials/{m.id}"
        used = [dataset.sources[k] for k in m.source_keys()]
        value_statuses = statuses(dataset, m, dataset.verification or EMPTY_RECORD)
        cite_sources = {}
        for table in view.tables:
            for key in table.sources:
                if key not in cite_sources and key in dataset.sources:
                    cite_sources[key] = source_with_locators(dataset.sources[key], m)
        catalogue = calc_catalogue([view.calc], [m])
        charts = [{"id": c.id, "caption": c.caption, "svg": Markup(c.svg)} for c in material_charts(view)]
        out[f"{base}/index.html"] = self.page(
            "material.html", f"{base}/index.html", view=view, m=m, card=card_rows(view, value_statuses),
            table_status=value_statuses.get("resistivity_table"), cite_sources=cite_sources,
            notes_html=markdown_safe(m.notes), sources=used, title=m.name,
            calc_json=catalogue, charts=charts, more_calcs=fitting_calculators(m.id, catalogue), class_title=CLASSES[m.klass], calc=calc_spec("resistance", {"material": m.id}),
            material_key=link_key(m.id))
        for table in view.tables:
            out[f"{base}/{table.id}.csv"] = table.to_csv().encode("utf-8")
            out[f"{base}/{table.id}.json"] = table.to_json().encode("utf-8")
        return out

    def folder_pages(self, paths) -> dict[str, bytes]:
        """An index.html for every folder of the site that has none (static/, js/ ...): a URL trimmed
        to a folder shows a page that says what the folder holds, never a server's file listing."""
        folders = {path.rsplit("/", 1)[0] for path in paths if "/" in path}
        for folder in list(folders):
            while "/" in folder:
                folder = folder.rsplit("/", 1)[0]
                folders.add(folder)
        out: dict[str, bytes] = {}
        for folder in sorted(folders):
            path = f"{folder}/index.html"
            if path not in paths:
                what = FOLDER_CONTENTS.get(folder.split("/", 1)[0], "files the pages load")
                out[path] = self.page("folder.html", path, title=f"Folder {folder}/", what=what)
        return out

    def render_listings(self, dataset: DataSet, views: list[MaterialView]) -> dict[str, bytes]:
        """The pages that list or look up every material, and the pages with no material on them."""
        out: dict[str, bytes] = {}
        groups = []
        for klass, title in CLASSES.items():
            members = [v for v in views if v.material.klass == klass]
            if members:
                groups.append({"id": klass, "title": title, "views": members})
        out["index.html"] = self.page("index.html", "index.html", groups=groups, views=views,
                                      calcs=[calc_spec(name) for name in ordered_calculators()], title=SITE_NAME)
        out["materials/index.html"] = self.page("materials.html", "materials/index.html", groups=groups,
                                                title="Materials")
        out["search/index.html"] = self.page("search.html", "search/index.html", title="Search")
        full_catalogue = calc_catalogue([v.calc for v in views], [v.material for v in views], dataset.limits)
        choices = material_choices(views)
        calcs = [calc_spec(name, datalist="material-choices") for name in ordered_calculators()]
        out["calculators/index.html"] = self.page("calculators.html", "calculators/index.html", calcs=calcs,
                                                  title="Calculators")
        for spec in calcs:
            out[f"calculators/{spec['name']}/index.html"] = self.page(
                "calculator.html", f"calculators/{spec['name']}/index.html", calc=spec, calc_json=full_catalogue,
                choices=choices, title=spec["title"])
        rows = compare_rows(views)
        table = compare_table(rows)
        out["compare/all-materials.csv"] = table.to_csv().encode("utf-8")
        out["compare/all-materials.json"] = table.to_json().encode("utf-8")
        out["compare/index.html"] = self.page(
            "compare.html", "compare/index.html", rows=rows, columns=COMPARE_COLUMNS,
            title="Compare materials",
            calc=calc_spec("compare", datalist="material-choices") if "compare" in CALCULATORS else None,
            calc_json=full_catalogue, choices=choices)
        out["methods/index.html"] = self.page("methods.html", "methods/index.html", title="Methods")
        record = dataset.verification or EMPTY_RECORD
        rows_by_material, totals = verification_summary(dataset, record)
        names = {m.id: m.name for m in dataset.materials}
        out["verification/index.html"] = self.page(
            "verification.html", "verification/index.html", title="How far the values are proven",
            rows=[{"id": mid, "name": names[mid], "counts": counts, "total": sum(counts.values())}
                  for mid, counts in rows_by_material],
            totals=totals, total=sum(totals.values()), kinds=VERIFICATION_KINDS, kind_labels=KIND_LABELS,
            datasets=sorted(record.datasets.items()))
        previous = dataset.previous
        changed = edition_changes(previous, value_texts(dataset)) if previous is not None else None
        out["changes/index.html"] = self.page(
            "changes.html", "changes/index.html", title="What changed in the data",
            previous_edition=previous.edition if previous is not None else "", changed=changed)
        out["references/index.html"] = self.page("references.html", "references/index.html",
                                                 sources=list(dataset.sources.values()), title="References")
        out["materials.json"] = (json.dumps(
            {"data_edition": EDITION_TOKEN,
             "materials": [{"id": v.material.id, "name": v.material.name, "class": v.material.klass,
                            "aliases": list(v.material.aliases), "rho_20": v.rho_20, "iacs_20": v.iacs_20}
                           for v in views]}, ensure_ascii=False, indent=1) + "\n").encode("utf-8")
        return out
