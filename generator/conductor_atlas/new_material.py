"""``conductor-atlas new-material ID [--dir DIR] [--class CLASS]``: write a commented material file.

The template passes validation only after the person fills in real values and a source: its
placeholders are deliberately invalid (an empty source key) so an unfinished file cannot slip into
a build.
"""

from __future__ import annotations

from pathlib import Path

from conductor_atlas.atlas_errors import AtlasError
from conductor_atlas.load import ID_PATTERN
from conductor_atlas.schema import CLASSES, PROPERTIES

TEMPLATE = '''# {material_id}: written by `conductor-atlas new-material`. Fill in every value from your source,
# then run `conductor-atlas check --data {folder}`. Format: DEVELOPERS.md, "Adding a material".
schema = 1
id = "{material_id}"
name = "{name}"
class = "{klass}"          # one of: {classes}
aliases = []               # trade names, UNS numbers, symbols; unique across all folders
summary = "One sentence: what it is and what it is used for."
notes = """
What it is used for, how it is specified, cautions (Markdown; raw HTML is shown as text).
"""

# Every value: a number and a unit that pint reads, its condition, the source key (a key of
# data/sources.toml or of a sources.toml in this folder), a locator (table, page, clause) and,
# where it applies, a note: "from memory", "common practice (no source)", "typical, not minimum".

[properties.resistivity]   # or [properties.conductivity_iacs] with value = "61 percent"
value = "0 uohm*cm"        # replace: e.g. "2.1 uohm*cm" (min = "...", max = "..." for a range)
temperature = "20 degC"
source = ""                # replace: e.g. "supplier-datasheet-2026"
locator = ""               # replace: e.g. "datasheet p. 2, table 'physical properties'"

[properties.temperature_coefficient]
value = "0 1/K"            # replace: e.g. "0.0039 1/K" at the temperature below
temperature = "20 degC"
valid_from = "-50 degC"    # span where the linear model holds, if the source says
valid_to = "150 degC"
source = ""
locator = ""

[properties.density]
value = "0 g/cm^3"
temperature = "20 degC"
source = ""
locator = ""

# Other properties you may add (name: unit): {others}

# A bibliography entry for your source, in DIR/sources.toml:
# [supplier-datasheet-2026]
# kind = "datasheet"
# title = "Alloy XYZ data sheet"
# publisher = "Supplier name"
# year = 2026
'''


def write_template(material_id: str, folder: Path, klass: str = "copper-alloy") -> Path:
    if not ID_PATTERN.match(material_id):
        raise AtlasError(f"\"{material_id}\" is not a valid id: use lowercase letters, digits and single hyphens, "
                         "e.g. \"shop-bronze-7\"")
    if klass not in CLASSES:
        raise AtlasError(f"unknown class \"{klass}\"; choose one of: {', '.join(CLASSES)}")
    path = folder / f"{material_id}.toml"
    others = ", ".join(f"{n} ({PROPERTIES[n].unit})" for n in PROPERTIES
                       if n not in ("resistivity", "temperature_coefficient", "density"))
    text = TEMPLATE.format(material_id=material_id, name=material_id.replace("-", " ").capitalize(),
                           klass=klass, classes=", ".join(CLASSES), folder=folder, others=others)
    try:
        folder.mkdir(parents=True, exist_ok=True)
        with open(path, "x", encoding="utf-8") as out:  # "x": never overwrite a file already there
            out.write(text)
    except FileExistsError as exc:
        raise AtlasError(f"{path} already exists; choose another id or edit that file") from exc
    except OSError as exc:  # a read-only folder, a full disk, a name too long for the file system
        raise AtlasError(f"cannot write {path} ({exc.strerror}); choose another id or --dir") from exc
    return path
