"""Stage 1: read data/*.toml, parse every quantity with pint, validate, return a DataSet.

Reads files only; writes nothing. Every problem found in any file is collected as
"file: field: expected ..., found ..." and raised together once, as a DataError.
"""

from __future__ import annotations

import dataclasses
import math
import os
import re
from pathlib import Path
from types import MappingProxyType

from conductor_atlas.core.text_match import name_key
from conductor_atlas.atlas_errors import DataError
from conductor_atlas.data_fields import (Problems, convert, display_path, invisible_character, parse_quantity,
                                         parse_temperature, read_locator, read_toml, unreachable)
from conductor_atlas.model import DataSet, Layers, Material, ResistivityTable, Source, Value
from conductor_atlas.standards import read_standard, standard_files
from conductor_atlas.schema import (CLASSES, LAYER_KEYS, USE_LENGTH, USES_MAX, MAX_TABLE_POINTS, PROPERTIES, RECORD_KEYS,
                                    SCHEMA_VERSION, TABLE_KEYS, TABLE_RESISTIVITY_OHM_M, TABLE_TEMPERATURE_K,
                                    TOP_LEVEL_KEYS, YEARS)

ID_PATTERN = re.compile(r"^[a-z0-9]+(?:-[a-z0-9]+)*$")
SOURCE_KINDS = {"standard", "handbook", "paper", "textbook", "datasheet", "practice", "demo"}
# Pure non-magnetic metals must have ρ rising with T; magnetic ones may show kinks near Curie.
MAGNETIC = {"relative_permeability", "curie_temperature"}


def read_record(name: str, record: object, where: str, sources: set[str], problems: Problems) -> Value | None:
    """Validate one [properties.NAME] table into a Value."""
    spec = PROPERTIES.get(name)
    if spec is None:
        problems.add(where, f"unknown property; expected one of {', '.join(sorted(PROPERTIES))}")
        return None
    if not isinstance(record, dict):
        problems.add(where, "expected a table with value, source and locator")
        return None
    for key in sorted(set(record) - RECORD_KEYS):
        problems.add(f"{where}.{key}", f"unknown key; expected one of {', '.join(sorted(RECORD_KEYS))}")
    ok = True
    for key in ("value", "source", "locator"):
        if key not in record:
            problems.add(f"{where}.{key}", "is missing (every value needs value, source and locator)")
            ok = False
    if not ok:
        return None
    source = record["source"]
    if not isinstance(source, str):
        problems.add(f"{where}.source", f"expected a source key (a string naming an entry of sources.toml), found {source!r}")
        ok = False
    elif source not in sources:
        problems.add(f"{where}.source", f"unknown source key \"{source}\"; add it to data/sources.toml or to a sources.toml in the same --data folder")
        ok = False
    if read_locator(record, where, problems) is None:
        ok = False
    if "note" in record and not isinstance(record["note"], str):
        problems.add(f"{where}.note", f"expected text, found {record['note']!r}")
        ok = False
    value = parse_quantity(record["value"], spec.unit, f"{where}.value", problems)
    low = parse_quantity(record["min"], spec.unit, f"{where}.min", problems) if "min" in record else None
    high = parse_quantity(record["max"], spec.unit, f"{where}.max", problems) if "max" in record else None
    temperature = None
    if "temperature" in record:
        temperature = parse_temperature(record["temperature"], f"{where}.temperature", problems)
    elif spec.needs_temperature:
        problems.add(f"{where}.temperature", "is missing: this property depends on temperature")
        ok = False
    valid_from = parse_temperature(record["valid_from"], f"{where}.valid_from", problems) if "valid_from" in record else None
    valid_to = parse_temperature(record["valid_to"], f"{where}.valid_to", problems) if "valid_to" in record else None
    if value is None:
        return None
    if not spec.low <= value <= spec.high:
        problems.add(f"{where}.value", f"expected {spec.label} between {spec.low:g} and {spec.high:g} {spec.unit}, "
                     f"found \"{record['value']}\" = {value:g} {spec.unit}")
        ok = False
    if low is not None and high is not None and not low <= value <= high:
        problems.add(f"{where}.value", f"must lie between min and max, found {record.get('min')} ≤ {record['value']} ≤ {record.get('max')}")
        ok = False
    if valid_from is not None and valid_to is not None and valid_from >= valid_to:
        problems.add(f"{where}.valid_from", f"must be below valid_to, found {record['valid_from']} and {record['valid_to']}")
        ok = False
    if not ok:
        return None
    return Value(name=name, si=value, unit=spec.unit, text=record["value"], source=source,
                 locator=record["locator"].strip(), note=record.get("note", ""), temperature=temperature,
                 low=low, high=high, valid_from=valid_from, valid_to=valid_to)


def read_uses(raw: object, where: str, problems: Problems) -> tuple[str, ...]:
    """The file's `uses`: a list of short, visible texts (what the trade makes of the material)."""
    if not isinstance(raw, list) or not all(isinstance(u, str) and u.strip() for u in raw):
        problems.add(where, f"expected a list of short texts like [\"busbars\", \"magnet wire\"], found {raw!r}")
        return ()
    if len(raw) > USES_MAX:
        problems.add(where, f"has {len(raw)} entries; keep the {USES_MAX} a user would search by")
    for text in raw:
        if len(text) > USE_LENGTH:
            problems.add(where, f"\"{text[:USE_LENGTH]}…\" is over {USE_LENGTH} characters; a use is a few words "
                         "(put explanations in notes)")
        found = invisible_character(text)
        if found is not None:
            problems.add(where, f"\"{text}\" contains the invisible character {found}; type it without")
    return tuple(u.strip() for u in raw)


def read_table(table: object, where: str, sources: set[str], strict_rise: bool,
               problems: Problems) -> ResistivityTable | None:
    """Validate [resistivity_table]: units, source, strictly increasing T, positive ρ."""
    if not isinstance(table, dict):
        problems.add(where, "expected a table with temperature_unit, resistivity_unit, points")
        return None
    for key in sorted(set(table) - TABLE_KEYS):
        problems.add(f"{where}.{key}", f"unknown key; expected one of {', '.join(sorted(TABLE_KEYS))}")
    missing = [k for k in ("temperature_unit", "resistivity_unit", "source", "locator", "points") if k not in table]
    for key in missing:
        problems.add(f"{where}.{key}", "is missing")
    if missing:
        return None
    if not isinstance(table["source"], str):
        problems.add(f"{where}.source", f"expected a source key (a string naming an entry of sources.toml), "
                     f"found {table['source']!r}")
        return None
    if table["source"] not in sources:
        problems.add(f"{where}.source", f"unknown source key \"{table['source']}\"; add it to data/sources.toml or to a sources.toml in the same --data folder")
        return None
    if read_locator(table, where, problems) is None:
        return None
    points = table["points"]
    if not isinstance(points, list) or len(points) < 2:
        problems.add(f"{where}.points", "expected a list of at least two [temperature, resistivity] pairs")
        return None
    if len(points) > MAX_TABLE_POINTS:
        problems.add(f"{where}.points", f"holds {len(points)} points; a table may hold at most {MAX_TABLE_POINTS} "
                     f"(a page shows every point)")
        return None
    t_unit, r_unit = table["temperature_unit"], table["resistivity_unit"]
    try:
        convert(1.0, r_unit, "ohm * m")
    except Exception:
        problems.add(f"{where}.resistivity_unit", f"expected a resistivity unit such as \"uohm*cm\", found \"{r_unit}\"")
        return None
    temps: list[float] = []
    rhos: list[float] = []
    for i, pair in enumerate(points):
        here = f"{where}.points[{i}]"
        if (not isinstance(pair, list) or len(pair) != 2
                or not all(isinstance(x, (int, float)) and not isinstance(x, bool) for x in pair)):
            problems.add(here, f"expected [temperature, resistivity] as two numbers, found {pair!r}")
            return None
        try:
            t = convert(float(pair[0]), t_unit, "K")
        except Exception:
            problems.add(f"{where}.temperature_unit", f"expected a temperature unit such as \"K\" or \"degC\", found \"{t_unit}\"")
            return None
        rho = convert(float(pair[1]), r_unit, "ohm * m")
        if not (math.isfinite(t) and math.isfinite(rho)):
            problems.add(here, f"expected finite numbers, found {pair!r}")
            return None
        if t <= 0:
            problems.add(here, f"temperature {pair[0]} {t_unit} is at or below absolute zero")
            return None
        if rho <= 0:
            problems.add(here, f"resistivity must be positive, found {pair[1]} {r_unit}")
            return None
        if not TABLE_TEMPERATURE_K[0] <= t <= TABLE_TEMPERATURE_K[1]:
            in_kelvin = "" if t_unit == "K" else f" = {t:g} K"
            problems.add(here, f"expected a temperature between {TABLE_TEMPERATURE_K[0]:g} and "
                         f"{TABLE_TEMPERATURE_K[1]:g} K, found {pair[0]} {t_unit}{in_kelvin}")
            return None
        if not TABLE_RESISTIVITY_OHM_M[0] <= rho <= TABLE_RESISTIVITY_OHM_M[1]:
            problems.add(here, f"expected a resistivity between {TABLE_RESISTIVITY_OHM_M[0]:g} and "
                         f"{TABLE_RESISTIVITY_OHM_M[1]:g} ohm * m, found {pair[1]} {r_unit} = {rho:g} ohm * m")
            return None
        if temps and t <= temps[-1]:
            problems.add(here, f"temperatures must increase strictly, found {pair[0]} after "
                         f"{points[i - 1][0]} {t_unit}")
            return None
        if strict_rise and rhos and rho <= rhos[-1]:
            problems.add(here, f"resistivity of a pure non-magnetic metal must rise with temperature, found "
                         f"{pair[1]} after {points[i - 1][1]} {r_unit}")
            return None
        temps.append(t)
        rhos.append(rho)
    return ResistivityTable(tuple(temps), tuple(rhos), table["source"], table["locator"].strip(),
                            str(table.get("note", "")))


def read_material(path: Path, sources: set[str], problems: Problems) -> Material | None:
    """Validate one material file into a Material (None if it has problems, all reported)."""
    data = read_toml(path, problems)
    if data is None:
        return None
    where = display_path(path)
    before = len(problems.lines)
    for key in sorted(set(data) - TOP_LEVEL_KEYS):
        problems.add(f"{where}: {key}", f"unknown key; expected one of {', '.join(sorted(TOP_LEVEL_KEYS))}")
    if data.get("schema") != SCHEMA_VERSION:
        problems.add(f"{where}: schema", f"expected {SCHEMA_VERSION}, found {data.get('schema')!r}")
    for key in ("id", "name", "class", "summary"):
        if not isinstance(data.get(key), str) or not data.get(key, "").strip():
            problems.add(f"{where}: {key}", f"expected a non-empty string, found {data.get(key)!r}")
    for key in ("name", "summary"):
        text = data.get(key)
        found = invisible_character(text) if isinstance(text, str) else None
        if found is not None:
            problems.add(f"{where}: {key}", f"contains the invisible character {found}; type it without")
    material_id = data.get("id", "")
    if isinstance(material_id, str) and material_id and not ID_PATTERN.fullmatch(material_id):
        problems.add(f"{where}: id", f"expected a lowercase slug like \"copper-annealed\", found \"{material_id}\"")
    klass = data.get("class")
    if isinstance(klass, str) and klass not in CLASSES:
        problems.add(f"{where}: class", f"expected one of {', '.join(sorted(CLASSES))}, found \"{klass}\"")
    aliases = data.get("aliases", [])
    alias_sources: list[tuple[str, str, str]] = []
    if isinstance(aliases, list):
        plain = []
        for a in aliases:
            # a designation of an open standard carries its source: {name = "C11000", source = "...", locator = "..."}
            if isinstance(a, dict) and set(a) <= {"name", "source", "locator", "note"} and isinstance(a.get("name"), str):
                key = a.get("source")
                if key not in sources:
                    problems.add(f"{where}: aliases", f"\"{a['name']}\": source key {key!r} is not in sources.toml")
                alias_sources.append((a["name"].strip(), str(key), str(a.get("locator", ""))))
                plain.append(a["name"])
            else:
                plain.append(a)
        aliases = plain
    if not isinstance(aliases, list) or not all(isinstance(a, str) and a.strip() for a in aliases):
        problems.add(f"{where}: aliases", "expected a list of non-empty strings or {name, source, locator} tables, "
                     f"found {aliases!r}")
        aliases = []
    uses = read_uses(data.get("uses", []), f"{where}: uses", problems)
    notes = data.get("notes", "")
    if not isinstance(notes, str):
        problems.add(f"{where}: notes", "expected a Markdown string")
        notes = ""
    raw_props = data.get("properties", {})
    if not isinstance(raw_props, dict):
        problems.add(f"{where}: properties", "expected tables [properties.NAME]")
        raw_props = {}
    properties: dict[str, Value] = {}
    for name in sorted(raw_props):
        value = read_record(name, raw_props[name], f"{where}: properties.{name}", sources, problems)
        if value is not None:
            properties[name] = value
    melting = properties.get("melting_point")
    for name, value in properties.items():
        if melting is not None and value.temperature is not None and value.temperature >= melting.si:
            problems.add(f"{where}: properties.{name}.temperature", f"is at or above the melting point "
                         f"({melting.si:g} K): a solid's value needs a temperature below it, "
                         f"found \"{raw_props[name]['temperature']}\"")
    if "resistivity" not in raw_props and "conductivity_iacs" not in raw_props:
        problems.add(f"{where}: properties.resistivity", "is missing (give resistivity or conductivity_iacs)")
    table = None
    if "resistivity_table" in data:
        strict = klass == "pure-metal" and not (MAGNETIC & set(raw_props))
        table = read_table(data["resistivity_table"], f"{where}: resistivity_table", sources, strict, problems)
    base_id = data.get("temperature_base", "")
    if not isinstance(base_id, str) or (base_id and not ID_PATTERN.match(base_id)):
        problems.add(f"{where}: temperature_base", f"expected the id of the base metal, found {base_id!r}")
    layer_ids = data.get("clad_layers", [])
    if (not isinstance(layer_ids, list) or len(layer_ids) not in (0, 2)
            or not all(isinstance(i, str) and ID_PATTERN.match(i) for i in layer_ids)):
        problems.add(f"{where}: clad_layers", f"expected the ids of the outer layer and the core, "
                     f"e.g. [\"copper-annealed\", \"steel-low-carbon\"], found {layer_ids!r}")
    elif layer_ids and base_id:
        problems.add(f"{where}: clad_layers", "a material takes ρ(T) from its base metal (temperature_base) "
                     "or from its layers (clad_layers), not both")
    layers = read_layers(data["layers"], f"{where}: layers", sources, problems) if "layers" in data else None
    if len(problems.lines) > before:
        return None
    return Material(id=material_id, name=data["name"].strip(), klass=klass, aliases=tuple(a.strip() for a in aliases),
                    summary=data["summary"].strip(), notes=notes, properties=MappingProxyType(properties),
                    table=table, path=path, temperature_base_id=base_id, alias_sources=tuple(alias_sources),
                    clad_layer_ids=tuple(layer_ids), layers=layers, uses=uses)


def read_layers(table: object, where: str, sources: set[str], problems: Problems) -> Layers | None:
    """Validate [layers] of a clad round wire: core and cladding ids, cladding_share (0 < share < 1, by area),
    source and locator. That the ids exist is checked once every file is read (attach_layers)."""
    if not isinstance(table, dict):
        problems.add(where, "expected a table with core, cladding, cladding_share, source and locator")
        return None
    before = len(problems.lines)
    for key in sorted(set(table) - LAYER_KEYS):
        problems.add(f"{where}.{key}", f"unknown key; expected one of {', '.join(sorted(LAYER_KEYS))}")
    for key in ("core", "cladding"):
        value = table.get(key)
        if not isinstance(value, str) or not ID_PATTERN.fullmatch(value):
            problems.add(f"{where}.{key}", f"expected the id of another material, such as \"copper-annealed\", "
                         f"found {value!r}")
    share = parse_quantity(table.get("cladding_share"), "dimensionless", f"{where}.cladding_share", problems)
    if share is not None and not (0.0 < share < 1.0):
        problems.add(f"{where}.cladding_share", f"expected the cladding's share of the cross-section by area, "
                     f"between 0 and 1 (e.g. \"0.10\"), found {table.get('cladding_share')!r}")
    source = table.get("source")
    if source not in sources:
        problems.add(f"{where}.source", f"unknown source key {source!r}; add it to data/sources.toml")
    read_locator(table, where, problems)
    if len(problems.lines) > before:
        return None
    return Layers(table["core"], table["cladding"], share, source, table["locator"].strip(), str(table.get("note", "")))


def attach_layers(materials: list[Material], problems: Problems) -> list[Material]:
    """A clad wire's core and cladding must be other materials of the data set without layers of their own;
    they are attached to its Layers."""
    by_id = {m.id: m for m in materials}
    out = []
    for m in materials:
        if m.layers is not None:
            found = []
            for key, layer_id in (("core", m.layers.core_id), ("cladding", m.layers.cladding_id)):
                other = by_id.get(layer_id)
                if other is None or other.layers is not None or layer_id == m.id:
                    problems.add(f"{display_path(m.path)}: layers.{key}",
                                 f"expected the id of another material without layers, found \"{layer_id}\"")
                found.append(other)
            m = dataclasses.replace(m, layers=dataclasses.replace(m.layers, core=found[0], cladding=found[1]))
        out.append(m)
    return out


def attach_temperature_bases(materials: list[Material], problems: Problems) -> list[Material]:
    """Each material with a ``temperature_base`` gets that material attached (Matthiessen's rule):
    it must exist, have a ρ(T) table of its own and no base itself. Then each clad wire gets its two
    layers (``clad_layers``, with their own bases attached): they must exist and not be clad."""
    by_id = {m.id: m for m in materials}
    based = []
    for m in materials:
        if m.temperature_base_id:
            base = by_id.get(m.temperature_base_id)
            if base is None or base.table is None or base.temperature_base_id:
                problems.add(f"{display_path(m.path)}: temperature_base",
                             f"expected the id of a material with a sourced ρ(T) table and no base of its own, "
                             f"found \"{m.temperature_base_id}\"")
            else:
                m = dataclasses.replace(m, temperature_base=base)
        based.append(m)
    by_id = {m.id: m for m in based}
    out = []
    for m in based:
        if m.clad_layer_ids:
            layers = tuple(by_id.get(i) for i in m.clad_layer_ids)
            if any(layer is None or layer.clad_layer_ids or layer.id == m.id for layer in layers):
                problems.add(f"{display_path(m.path)}: clad_layers",
                             "expected the ids of two other materials that are not clad themselves, found "
                             + ", ".join(f"\"{i}\"" for i in m.clad_layer_ids))
            else:
                m = dataclasses.replace(m, clad_layers=layers)
        out.append(m)
    return out


def read_sources(path: Path, problems: Problems) -> dict[str, Source]:
    """Read a bibliography file: key -> Source."""
    data = read_toml(path, problems)
    if data is None:
        return {}
    where = display_path(path)
    allowed = {"kind", "title", "authors", "publisher", "edition", "year", "number", "doi", "note"}
    out: dict[str, Source] = {}
    for key, entry in data.items():
        if not ID_PATTERN.fullmatch(key):
            problems.add(f"{where}: {key}", "expected a source key that is a lowercase slug such as \"iec60028\" "
                         "or \"smith-2004\" (letters, digits, single hyphens)")
            continue
        if not isinstance(entry, dict):
            problems.add(f"{where}: {key}", "expected a table [key] with kind and title")
            continue
        for extra in sorted(set(entry) - allowed):
            problems.add(f"{where}: {key}.{extra}", f"unknown key; expected one of {', '.join(sorted(allowed))}")
        if not isinstance(entry.get("kind"), str) or entry["kind"] not in SOURCE_KINDS:
            problems.add(f"{where}: {key}.kind", f"expected one of {', '.join(sorted(SOURCE_KINDS))}, found {entry.get('kind')!r}")
            continue
        if not isinstance(entry.get("title"), str) or not entry["title"].strip():
            problems.add(f"{where}: {key}.title", "is missing")
            continue
        year = entry.get("year")
        if year is not None and (not isinstance(year, int) or isinstance(year, bool)):
            problems.add(f"{where}: {key}.year", f"expected a year as a number, found {year!r}")
            continue
        if year is not None and not YEARS[0] <= year <= YEARS[1]:
            problems.add(f"{where}: {key}.year", f"expected a year between {YEARS[0]} and {YEARS[1]}, found {year}")
            continue
        out[key] = Source(key=key, kind=entry["kind"], title=entry["title"].strip(),
                          **{k: str(entry[k]) for k in ("authors", "publisher", "edition", "number", "doi", "note")
                             if k in entry}, year=year)
    return out


def material_files(folder: Path) -> list[Path]:
    """The material files of a data folder: FOLDER/materials/*.toml, or FOLDER/*.toml."""
    sub = folder / "materials"
    base = sub if sub.is_dir() else folder
    return sorted(p for p in base.iterdir() if p.name.endswith(".toml") and p.name != "sources.toml")


def folder_problem(folder: Path) -> str | None:
    """Why ``folder`` is not a readable folder of material files, or None."""
    why = unreachable(folder)
    if why == "does not exist":
        return "is not a folder of material files (it does not exist)"
    if why is not None:
        return why
    if not folder.is_dir():
        return "is not a folder of material files"
    try:
        material_files(folder)
    except OSError as exc:
        return f"cannot be listed ({exc.strerror})"
    return None


def load_dataset(folders: list[Path]) -> DataSet:
    """Load and validate every folder (the first is the shipped data/), all problems at once.

    Each folder may hold sources.toml (merged; a key defined twice is an error) and material
    files. Ids and aliases must be unique across all folders, case-insensitively. Every material
    must also derive what the build derives from it (``derived_checks``), so what loads builds.
    """
    problems = Problems()
    sources: dict[str, Source] = {}
    source_origin: dict[str, Path] = {}
    readable = []
    for folder in folders:
        why = folder_problem(folder)
        if why is not None:
            problems.add(display_path(folder), why)
            continue
        readable.append(folder)
        bib = folder / "sources.toml"
        if os.path.lexists(bib):  # a broken link or a link loop is reported, not skipped
            for key, src in read_sources(bib, problems).items():
                if key in sources:
                    problems.add(f"{display_path(bib)}: {key}", f"source key also defined in {display_path(source_origin[key])}")
                    continue
                sources[key] = src
                source_origin[key] = bib
    if not sources and not problems.lines:
        problems.add(display_path(folders[0]), "has no sources.toml (the bibliography)")
    materials: list[Material] = []
    for folder in readable:
        for path in material_files(folder):
            m = read_material(path, set(sources), problems)
            if m is not None:
                materials.append(m)
    # ids, aliases and names share one key space, compared by the key the look-up uses (name_key:
    # case, space runs, invisible and full-width look-alikes folded), shipped files first: an
    # added folder can never take over what a shipped id, alias or name means
    names: dict[str, tuple[str, Path]] = {}
    names_label: dict[str, str] = {}
    field_of = {"id": "id", "alias": "aliases", "name": "name"}
    for m in materials:
        for label, kind in [(m.id, "id")] + [(a, "alias") for a in m.aliases] + [(m.name, "name")]:
            key = name_key(label)
            if not key:
                problems.add(f"{display_path(m.path)}: {field_of[kind]}",
                             f"\"{label}\" has no visible characters")
                continue
            if key in names:
                other_kind, other = names[key]
                where = display_path(m.path)
                if other == m.path:
                    if kind == "alias" and other_kind == "alias":
                        problems.add(f"{where}: aliases", f"\"{label}\" is listed twice")
                    continue  # a material's own name may repeat its alias
                problems.add(f"{where}: {field_of[kind]}",
                             f"\"{label}\" clashes with the {other_kind} of {display_path(other)}"
                             + (" (they differ only in case, spacing or invisible characters)"
                                if label.strip() != names_label[key].strip() else ""))
                if kind == "id":
                    break  # the same material twice: its id says it all
            else:
                names[key] = (kind, m.path)
                names_label[key] = label
    if not materials and not problems.lines:
        problems.add(display_path(folders[0]), "holds no material files")
    materials = attach_temperature_bases(materials, problems)
    materials = attach_layers(materials, problems)
    # what passes here builds: run what the build derives from each material (derived_checks)
    from conductor_atlas.derived_checks import material_problems  # imports derive, which imports numpy
    for m in materials:
        problems.lines.extend(material_problems(m, display_path(m.path)))
    limits = []
    material_ids = {m.id for m in materials}
    for folder in readable:
        for path in standard_files(folder, problems):
            limits.extend(read_standard(path, set(sources), material_ids, problems))
    if problems.lines:
        raise DataError(problems.lines)
    materials.sort(key=lambda m: m.id)
    return DataSet(materials=tuple(materials), sources=MappingProxyType(dict(sorted(sources.items()))),
                   limits=tuple(limits))
